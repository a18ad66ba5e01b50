package cli

import (
	"errors"
	"flag"
	"maps"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo"
)

// modelFlags are the settings shared by cycle and compare.
type modelFlags struct {
	structure, units, radii, d0, latticeAs, ionAt, dispersion string
	params                                                    listFlag
	rho, bornN, accuracy                                      float64
	cnCation, cnAnion                                         int
}

func (m *modelFlags) register(fs *flag.FlagSet) {
	fs.StringVar(&m.structure, "structure", "", "structure for the Madelung constant: a prototype name ("+strings.Join(cycle.PrototypeNames(), ", ")+") or a CIF file")
	fs.Var(&m.params, "param", "prototype parameter `KEY=VALUE` (a, c in Å; u, x, z fractional); repeatable")
	fs.StringVar(&m.units, "units", "kj", "energy unit of printed output and of --set values: kj, kcal or ev (JSON stays in kJ/mol, as its keys say)")
	fs.Float64Var(&m.rho, "rho", 0, "Born–Mayer range parameter ρ in Å (default 0.345)")
	fs.Float64Var(&m.bornN, "born-n", 0, "Born exponent n for Born–Landé (default: mean of Pauling's values)")
	fs.StringVar(&m.radii, "radii", "ionic", "Shannon radius set: ionic or crystal")
	fs.IntVar(&m.cnCation, "cn-cation", 0, "coordination number of the cation radius (default: the structure's)")
	fs.IntVar(&m.cnAnion, "cn-anion", 0, "coordination number of the anion radius (default: the structure's)")
	fs.StringVar(&m.d0, "d0", "auto", "cation–anion distance: auto, geometry, radii, or a distance in Å")
	fs.StringVar(&m.latticeAs, "lattice-as", "enthalpy", "lattice convention: enthalpy (ΔH_L at 298.15 K) or energy (U)")
	fs.StringVar(&m.ionAt, "ionization-at", "0k", "ionization convention: 0k (energies as published) or 298k (enthalpies, ±5/2·RT per electron)")
	fs.Float64Var(&m.accuracy, "accuracy", 0, "relative accuracy of the Ewald sums (default 1e-8)")
	fs.StringVar(&m.dispersion, "dispersion", "crystal", "the extended model's dispersion: crystal (Slater–Kirkwood from polarizabilities of ions in crystals, Fumi–Tosi repulsion refitted to the measured distance) or mayer (Mayer 1933 with Fumi–Tosi 1964 as published)")
}

// conventions reads the convention flags.
func (m *modelFlags) conventions() (cycle.Conventions, error) {
	var conv cycle.Conventions
	var err error
	if conv.Lattice, err = cycle.ParseLatticeConvention(m.latticeAs); err != nil {
		return conv, Usagef("--lattice-as: %v", err)
	}
	if conv.Ionization, err = cycle.ParseIonizationConvention(m.ionAt); err != nil {
		return conv, Usagef("--ionization-at: %v", err)
	}
	return conv, nil
}

// apply puts the flags that were given (set) into c's settings; with all
// true every flag is applied (a fresh cycle).
func (m *modelFlags) apply(c *cycle.Cycle, set map[string]bool, all bool) error {
	given := func(n string) bool { return all || set[n] }
	s := &c.Settings
	var err error
	if given("units") {
		if s.Units, err = thermo.ParseUnit(m.units); err != nil {
			return Usagef("--units: %v", err)
		}
	}
	// A flag given explicitly is checked even at 0, the value that stands
	// for "the default" only while the flag is left out.
	if given("rho") {
		if err := cycle.CheckSetting(cycle.SettingRho, m.rho); err != nil {
			return boundUsage("rho", "give the Born–Mayer range in Å", err)
		}
		s.Rho = m.rho
	}
	if given("born-n") {
		if err := cycle.CheckSetting(cycle.SettingBornExponent, m.bornN); err != nil {
			return boundUsage("born-n", "give the Born exponent", err)
		}
		s.BornExponent = m.bornN
	}
	if given("radii") {
		if s.Radius, err = cycle.ParseRadiusKind(m.radii); err != nil {
			return Usagef("--radii: %v", err)
		}
	}
	for _, cn := range []struct {
		name string
		v    int
		dst  *int
	}{{"cn-cation", m.cnCation, &s.CationCN}, {"cn-anion", m.cnAnion, &s.AnionCN}} {
		if given(cn.name) {
			if err := cycle.CheckSetting(cycle.SettingCN, float64(cn.v)); err != nil {
				return boundUsage(cn.name, "give a whole coordination number", err)
			}
			*cn.dst = cn.v
		}
	}
	if given("dispersion") {
		if s.Dispersion, err = cycle.ParseDispersionSet(m.dispersion); err != nil {
			return Usagef("--dispersion: %v", err)
		}
	}
	if given("d0") {
		if s.Distance, s.D0, err = cycle.ParseDistance(m.d0); err != nil {
			return Usagef("--d0: %v", err)
		}
	}
	if given("accuracy") {
		if err := cycle.CheckSetting(cycle.SettingAccuracy, m.accuracy); err != nil {
			return boundUsage("accuracy", "give the relative accuracy of the Ewald sum", err)
		}
		s.Accuracy = m.accuracy
	}
	if given("lattice-as") || given("ionization-at") {
		conv, err := m.conventions()
		if err != nil {
			return err
		}
		if !given("lattice-as") {
			conv.Lattice = c.Conventions.Lattice
		}
		if !given("ionization-at") {
			conv.Ionization = c.Conventions.Ionization
		}
		c.SetConventions(conv)
	}
	if given("structure") && m.structure != "" || given("param") && len(m.params) > 0 {
		st, err := m.structureFor(c)
		if err != nil {
			return err
		}
		s.Structure = st
	}
	return nil
}

// structureFor reads --structure and --param for cycle c.
func (m *modelFlags) structureFor(c *cycle.Cycle) (cycle.Structure, error) {
	name := m.structure
	if name == "" {
		name = c.Settings.Structure.Prototype
		if name == "" {
			return cycle.Structure{}, Usagef("--param needs a prototype: give --structure NAME")
		}
	}
	if strings.HasSuffix(strings.ToLower(name), ".cif") {
		if len(m.params) > 0 {
			return cycle.Structure{}, Usagef("--param applies to a prototype, not to the CIF file %s", name)
		}
		st, err := c.ReadStructureFile(name, name)
		if err != nil {
			return cycle.Structure{}, Usagef("--structure: %v", err)
		}
		return st, nil
	}
	if err := cycle.CheckPrototype(name); err != nil {
		return cycle.Structure{}, Usagef("--structure: %v (or give a .cif file)", err)
	}
	params := map[string]float64{}
	if name == c.Compound.Structure {
		for k, v := range c.Compound.Params {
			params[k] = v
		}
	}
	given, err := parseKeyValues("--param", m.params)
	if err != nil {
		return cycle.Structure{}, err
	}
	maps.Copy(params, given)
	if err := cycle.CheckPrototypeParams(name, params); err != nil {
		return cycle.Structure{}, Usagef("--structure %s: %v", name, err)
	}
	st := cycle.Structure{Prototype: name, Params: params}
	if len(params) == 0 {
		st.Params = nil
	}
	return st, nil
}

// boundUsage words a model setting refused by the engine's bound for the
// command line: the flag and the value as typed, what to give, the bound
// and the usual values, and how to get the default.
func boundUsage(flag, advice string, err error) error {
	var be *cycle.BoundError
	if !errors.As(err, &be) {
		return Usagef("--%s: %v", flag, err)
	}
	return Usagef("--%s %s: %s (%s; %s); leave the flag out for the default", flag, strconv.FormatFloat(be.Value, 'g', -1, 64),
		advice, be.Bound.Range(be.Setting.String()), be.Bound.Usual)
}
