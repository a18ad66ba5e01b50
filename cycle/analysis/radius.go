package analysis

import (
	"fmt"
	"math"

	"enthalpath/cycle"
	"enthalpath/thermo/lattice"
)

// RadiusOptions say which radius to derive and from which lattice energy.
type RadiusOptions struct {
	// Ion is the ion whose radius is derived: the compound's cation or
	// anion, by symbol ("NO3-") or as "cation"/"anion".
	Ion string
	// LatticeEnergy, when non-zero, is the lattice energy U to reproduce
	// (kJ/mol; either sign is read as the energy of the solid relative to
	// the gaseous ions, so 685 and −685 both mean U = −685 for formation);
	// 0 means the Born–Haber cycle's, else the data's handbook value.
	LatticeEnergy float64
	// LatticeSource describes a given LatticeEnergy (a citation).
	LatticeSource string
	// CounterRadius (Å), when positive, replaces the other ion's radius.
	CounterRadius float64

	// kapustinskiiOnly stops after the Kapustinskii radii (a fit over
	// salts needs no volume or ρ, and ρ costs a Madelung sum per salt).
	kapustinskiiOnly bool
}

// DerivedRadius is the radius that makes the models reproduce a lattice
// energy, and the effective Born–Mayer ρ.
type DerivedRadius struct {
	Formula string
	// Ion is the ion whose radius was derived; Counter the other one, with
	// the radius used for it.
	Ion, Counter  string
	CounterRadius Radius
	// LatticeEnergy is U (negative, kJ/mol) reproduced; LatticeFrom says
	// where it came from.
	LatticeEnergy float64
	LatticeFrom   string
	// Kapustinskii is the radius (Å) with the 1956 constants (K = 1202.5
	// kJ·Å/mol, d = 0.345 Å); KapustinskiiHandbook with K = 1214 kJ·Å/mol
	// (121.4 kJ·nm/mol), the form Jenkins and co-workers use for
	// thermochemical radii. Err fields say why one is missing.
	Kapustinskii, KapustinskiiHandbook       float64
	KapustinskiiErr, KapustinskiiHandbookErr string
	// MolarVolume (nm³ per formula unit) is what the volume-based model
	// needs to reproduce U; IonVolume (nm³) is this ion's share after the
	// counter-ions' volumes (spheres of their radii) are taken off, and
	// VolumeRadius (Å) the radius of a sphere of that volume.
	MolarVolume, CounterVolume, IonVolume, VolumeRadius float64
	VolumeErr                                           string
	// EffectiveRho (Å) makes Born–Mayer with Madelung constant Madelung of
	// Structure and distance D0 (Å, D0From) reproduce U; DefaultRho is the
	// usual 0.345 Å for comparison.
	EffectiveRho, DefaultRho, Madelung, D0 float64
	Structure, D0From, RhoErr              string
	// RhoWarning, when not empty, says EffectiveRho lies outside
	// [RhoPhysicalMin, RhoPhysicalMax]: a number, but not a physical ρ.
	RhoWarning string
	// Tabulated is the data's radius of the ion, when it has one.
	Tabulated *Radius
	Notes     []string
}

// DeriveRadius finds, for the compound formula and one of its ions, the
// radius that makes Kapustinskii (both constant sets) and the volume-based
// model reproduce the lattice energy, the way thermochemical radii of
// polyatomic ions are obtained, and the effective Born–Mayer ρ that closes
// the gap between the cycle and Born–Mayer.
func (a *Analyst) DeriveRadius(formula string, opt RadiusOptions) (*DerivedRadius, error) {
	c, err := a.build(formula, "", "")
	if err != nil {
		return nil, err
	}
	target, other := &c.Cation, &c.Anion
	switch opt.Ion {
	case "", "anion":
		target, other = &c.Anion, &c.Cation
		if opt.Ion == "" && !c.Anion.Ion.Polyatomic && c.Cation.Ion.Polyatomic {
			target, other = &c.Cation, &c.Anion
		}
	case "cation":
	default:
		in, err := a.db.Ion(opt.Ion)
		sym := opt.Ion
		if err == nil {
			sym = in.Symbol
		}
		switch sym {
		case c.Cation.Ion.Symbol:
		case c.Anion.Ion.Symbol:
			target, other = &c.Anion, &c.Cation
		default:
			return nil, &InputError{Subject: formula, Field: "--ion " + opt.Ion,
				Reason: fmt.Sprintf("not an ion of %s; its ions are %s and %s", c.Formula, c.Cation.Ion.Symbol, c.Anion.Ion.Symbol)}
		}
	}
	d := &DerivedRadius{Formula: c.Formula, Ion: target.Ion.Symbol, Counter: other.Ion.Symbol, DefaultRho: lattice.DefaultRho}
	if r, err := a.ionRadius(target.Ion); err == nil && r.Kind != "neighbour" {
		d.Tabulated = &r
	}
	// The other ion's radius.
	if opt.CounterRadius > 0 {
		d.CounterRadius = Radius{Value: opt.CounterRadius, Kind: "user", From: "radius of " + other.Ion.Symbol + " given by the user"}
	} else {
		r, err := a.ionRadius(other.Ion)
		if err != nil {
			return nil, &InputError{Subject: formula, Field: "radius of " + other.Ion.Symbol, Reason: "needed as the known radius; give it", Err: err}
		}
		d.CounterRadius = r
	}
	// The lattice energy U (negative).
	switch {
	case opt.LatticeEnergy != 0:
		d.LatticeEnergy = -math.Abs(opt.LatticeEnergy)
		d.LatticeFrom = "given: " + opt.LatticeSource
		if opt.LatticeSource == "" {
			d.LatticeFrom = "given by the user"
		}
	default:
		h, _, err := cycleLattice(c)
		for _, f := range c.Fitted {
			if err == nil && f.Ion == target.Ion.Symbol {
				// The ion's value came from a lattice model over its salts: a
				// radius from that cycle would return the model's own input.
				err = &InputError{Subject: formula, Field: "lattice energy", Reason: "the cycle uses the family-fitted gas-phase value of " + f.Ion +
					", itself from lattice models (" + f.Model + "): a radius from it would be circular"}
			}
		}
		if err == nil {
			d.LatticeEnergy = h + c.LatticeCorrection()
			d.LatticeFrom = fmt.Sprintf("Born–Haber cycle of %s from the data (ΔH_L %.1f kJ/mol converted to U by Jenkins' rule)", c.Formula, h)
		} else if s, ok := c.Step("lattice"); ok && s.Reference != nil {
			d.LatticeEnergy = s.Reference.Value + c.LatticeCorrection()
			d.LatticeFrom = fmt.Sprintf("handbook lattice value of %s (%s); the cycle could not be closed: %v", c.Formula, s.Reference.Source.Key, err)
		} else {
			return nil, &InputError{Subject: formula, Field: "lattice energy", Reason: "the cycle cannot be closed and the data have no handbook value; give U with --lattice VALUE", Err: err}
		}
	}
	u := d.LatticeEnergy
	nu := c.Cation.Count + c.Anion.Count
	zc, za := c.Cation.Ion.Charge, c.Anion.Ion.Charge
	known := d.CounterRadius.Value
	// Kapustinskii with one ion of each kind: r_target = s − r_other. With
	// several ions of a kind the equation still takes one radius of each.
	if r, err := lattice.Kapustinskii1956().Radius(u, nu, zc, za, known); err == nil {
		d.Kapustinskii = r
	} else {
		d.KapustinskiiErr = err.Error()
	}
	hb := lattice.KapustinskiiConstants{K: lattice.KapustinskiiKHandbook, D: lattice.KapustinskiiD}
	if r, err := hb.Radius(u, nu, zc, za, known); err == nil {
		d.KapustinskiiHandbook = r
	} else {
		d.KapustinskiiHandbookErr = err.Error()
	}
	if opt.kapustinskiiOnly {
		return d, nil
	}
	// Volume-based: ion volumes add up (Jenkins et al. 1999).
	ions := []lattice.IonKind{ionKind(c.Cation), ionKind(c.Anion)}
	ti := 1
	if target == &c.Cation {
		ti = 0
	}
	d.CounterVolume = sphereVolumeNM3(known)
	if vm, err := lattice.VolumeForEnergy(u, ions, lattice.VolumeOptions{}); err == nil {
		d.MolarVolume = vm
	}
	if v, err := lattice.DerivedIonVolume(u, ions, ti, float64(other.Count)*d.CounterVolume, lattice.VolumeOptions{}); err == nil {
		d.IonVolume = v
		d.VolumeRadius = math.Cbrt(3*v/(4*math.Pi)) * 10 // nm → Å
	} else {
		d.VolumeErr = err.Error()
	}
	// Effective Born–Mayer ρ: Madelung constant of the structure, d₀ from the
	// cell when measured, else the Kapustinskii (handbook) radius sum.
	d.effectiveRho(c, target, u)
	d.Notes = append(d.Notes,
		"Kapustinskii takes one radius per ion kind; the radius derived is the one that, with the counter-ion's, reproduces U",
		"counter-ion volume for the volume-based model: a sphere of its radius (common practice, no source)")
	return d, nil
}

func (d *DerivedRadius) effectiveRho(c *cycle.Cycle, target *cycle.Part, u float64) {
	// d₀ must not come from the derived radius: Born–Mayer with rock salt's
	// Madelung constant and the Kapustinskii radius sum reproduces U with
	// ρ = 0.345 Å by construction. Use the measured cell, else the data's
	// own radii of both ions.
	model := cycle.ModelBornMayer
	if c.Settings.Structure.Measured() {
		model = cycle.ModelEwald
	} else if d.Tabulated == nil {
		d.RhoErr = "no d₀ independent of the derived radius (no measured cell and no tabulated radius of " + target.Ion.Symbol + ")"
		return
	}
	w := c.Clone()
	if d.CounterRadius.Kind == "user" {
		p := &w.Cation
		if target == &c.Cation {
			p = &w.Anion
		}
		useRadius(&p.Ion, d.CounterRadius)
	}
	m, err := cycle.EvaluateModel(w, model)
	if err != nil {
		d.RhoErr = err.Error()
		return
	}
	d.Madelung, d.D0, d.Structure, d.D0From = m.Inputs.Madelung, m.Inputs.D0, m.Inputs.Structure, m.Inputs.D0From
	rho, err := lattice.EffectiveRho(u, lattice.IonPair{Madelung: m.Inputs.Madelung, ZCation: c.Cation.Ion.Charge, ZAnion: c.Anion.Ion.Charge, R0: m.Inputs.D0})
	if err != nil {
		d.RhoErr = err.Error()
		return
	}
	d.EffectiveRho = rho
	if rho < RhoPhysicalMin || rho > RhoPhysicalMax {
		d.RhoWarning = fmt.Sprintf("the effective ρ %.3f Å is outside %.2f–%.2f Å, the range taken as physical for the Born–Mayer repulsion (%s): "+
			"no repulsion alone closes this gap, so read it as covalency, polarization or a wrong structure, not as a ρ",
			rho, RhoPhysicalMin, RhoPhysicalMax, RhoRangeSource)
	}
}

// The range of the Born–Mayer repulsion parameter ρ taken as physical. Born
// and Mayer's 0.345 Å and the values fitted to the compressibilities of the
// alkali halides (about 0.29–0.36 Å, from memory) lie well inside it.
const (
	RhoPhysicalMin = 0.20 // Å
	RhoPhysicalMax = 0.50 // Å
	RhoRangeSource = "common practice, no source"
)

func ionKind(p cycle.Part) lattice.IonKind {
	sh, err := lattice.ParseShape(p.Ion.Shape)
	if err != nil {
		sh = lattice.Monatomic
	}
	return lattice.IonKind{Charge: p.Ion.Charge, Count: p.Count, Shape: sh}
}

// sphereVolumeNM3 returns 4/3·π·r³ in nm³ for r in Å.
func sphereVolumeNM3(rAngstrom float64) float64 {
	r := rAngstrom / 10
	return 4 * math.Pi / 3 * r * r * r
}
