package analysis

import (
	"errors"
	"math"
	"slices"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo"
)

// measuredAnalyst works on the tables without derived_ions.csv, as the
// generator does, so that no fit feeds on an earlier one.
func measuredAnalyst(t testing.TB) *Analyst {
	t.Helper()
	db, err := data.LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	return New(db)
}

// overlaid returns an Analyst on the measured tables with a TOML overlay.
func overlaid(t *testing.T, toml string) *Analyst {
	t.Helper()
	db, err := data.LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	db, err = db.WithOverlay(strings.NewReader(toml), "test overlay")
	if err != nil {
		t.Fatal(err)
	}
	return New(db)
}

// sc2so43 is an overlay adding an invented scandium sulfate (invented
// test values, not data: the tables have no Sc₂(SO₄)₃) with the formation
// lines given.
func sc2so43(formation string) string {
	return `
[[compound]]
formula = "Sc2(SO4)3"
name = "scandium sulfate (invented test values)"
family = "sulfate"
cation = "Sc3+"
cation_count = 2
anion = "SO4^2-"
anion_count = 3
density_g_cm3 = 2.58
` + formation + "\n"
}

// A fit over one salt is that salt's own cycle: ΔfH°(O²⁻, g) =
// ΔfH°(MgO) − ΔfH°(Mg²⁺, g) − ΔH_L(model), summed here by hand from the
// data's values (eV converted once with thermo's factor) and the model's
// lattice value, independently of the fit's code path (identity).
func TestFitIonOneSaltIsItsOwnCycle(t *testing.T) {
	a := measuredAnalyst(t)
	f, err := a.FitIon("O2-", IonFitOptions{From: cycle.ModelKapustinskii, Only: []string{"Mg2+"}})
	if err != nil {
		t.Fatal(err)
	}
	if len(f.Used()) != 1 || f.Used()[0].Formula != "MgO" {
		t.Fatalf("salts used: %+v", f.Used())
	}
	db := a.DB()
	mg, _ := db.Element("Mg")
	mgo, _ := db.Compound("MgO")
	c, err := cycle.Build(db, "MgO", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	m, err := cycle.EvaluateModel(c, cycle.ModelKapustinskii)
	if err != nil {
		t.Fatal(err)
	}
	h := 2.5 * thermo.RT(thermo.StandardTemperature) // the thermal electron of the NBS convention
	cation := mg.Atomization.V + thermo.EVToKJPerMol(mg.Ionization[0].V+mg.Ionization[1].V) + 2*h
	want := mgo.Formation.V - cation - m.Value
	if !near(f.Value, want, 1e-6) {
		t.Errorf("one-salt fit %.6f, own cycle by hand %.6f", f.Value, want)
	}
	if s := f.Used()[0]; !near(f.SE, s.Uncertainty, 1e-9) || f.Birge != 0 {
		t.Errorf("one salt: SE %.3f should be the salt's σ %.3f with no Birge ratio (got %.3f)", f.SE, s.Uncertainty, f.Birge)
	}
}

// A salt with a huge uncertainty carries no weight: adding one (an
// invented scandium sulfate, formation ±10⁵ kJ/mol) leaves the fit as it was.
func TestFitIonHugeUncertaintyCarriesNoWeight(t *testing.T) {
	base, err := measuredAnalyst(t).FitIon("SO4^2-", IonFitOptions{})
	if err != nil {
		t.Fatal(err)
	}
	a := overlaid(t, sc2so43("formation_kj_per_mol = -3900\nformation_uncertainty = 100000"))
	f, err := a.FitIon("SO4^2-", IonFitOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if len(f.Used()) != len(base.Used())+1 {
		t.Fatalf("the invented salt is not in the fit: %d vs %d salts", len(f.Used()), len(base.Used()))
	}
	if !near(f.Value, base.Value, 1e-3) || !near(f.SE, base.SE, 1e-3) {
		t.Errorf("fit moved: %.4f ± %.4f → %.4f ± %.4f", base.Value, base.SE, f.Value, f.SE)
	}
}

// A salt missing a datum (an invented sulfate without a formation
// enthalpy) is left out and named; the fit over the rest is unchanged.
func TestFitIonFitsOverTheRest(t *testing.T) {
	base, err := measuredAnalyst(t).FitIon("SO4^2-", IonFitOptions{})
	if err != nil {
		t.Fatal(err)
	}
	a := overlaid(t, sc2so43(""))
	f, err := a.FitIon("SO4^2-", IonFitOptions{})
	if err != nil {
		t.Fatal(err)
	}
	i := slices.IndexFunc(f.Salts, func(s SaltIonValue) bool { return s.Formula == "Sc2(SO4)3" })
	if i < 0 || !strings.Contains(f.Salts[i].Skipped, "formation") {
		t.Fatalf("Sc2(SO4)3 should be left out for its formation enthalpy: %+v", f.Salts)
	}
	if !near(f.Value, base.Value, 1e-9) || !near(f.SE, base.SE, 1e-9) {
		t.Errorf("fit moved: %.4f → %.4f", base.Value, f.Value)
	}
	if !slices.ContainsFunc(f.Notes, func(n string) bool { return strings.Contains(n, "over the rest") && strings.Contains(n, "Sc2(SO4)3") }) {
		t.Errorf("the notes do not say the fit is over the rest: %q", f.Notes)
	}
}

// The weighted mean, its internal standard error and the Birge ratio on
// a hand-made set (arithmetic of weighted least squares; values chosen so
// that the sums are exact).
func TestFitIonCombine(t *testing.T) {
	f := &IonFit{Salts: []SaltIonValue{
		{Value: 10, Uncertainty: 1},
		{Value: 20, Uncertainty: 2},
		{Value: 99, Uncertainty: 1, Skipped: "left out"},
	}}
	f.combine()
	// w = 1, 1/4: mean = (10 + 5)/1.25 = 12; internal SE = 1/√1.25.
	if !near(f.Value, 12, 1e-12) || !near(f.InternalSE, 1/math.Sqrt(1.25), 1e-12) {
		t.Errorf("mean %.6f ± %.6f, want 12 ± %.6f", f.Value, f.InternalSE, 1/math.Sqrt(1.25))
	}
	// χ² = (−2)² + (8/2)² = 20; n_eff = 1.25²/1.0625; Birge = √(20/(n_eff−1)).
	neff := 1.25 * 1.25 / 1.0625
	if !near(f.ChiSquared, 20, 1e-12) || !near(f.EffectiveSalts, neff, 1e-12) || !near(f.Birge, math.Sqrt(20/(neff-1)), 1e-12) {
		t.Errorf("χ² %.4f n_eff %.4f Birge %.4f", f.ChiSquared, f.EffectiveSalts, f.Birge)
	}
	if !near(f.SE, f.InternalSE*f.Birge, 1e-12) || !f.Salts[1].Outside || f.Salts[0].Outside {
		t.Errorf("SE %.4f, outside %v %v", f.SE, f.Salts[0].Outside, f.Salts[1].Outside)
	}
}

func TestFitIonErrors(t *testing.T) {
	a := measuredAnalyst(t)
	for _, tc := range []struct {
		ion  string
		opt  IonFitOptions
		want string
	}{
		{"Qq-", IonFitOptions{}, "not an ion"},
		{"Na+", IonFitOptions{}, "measured"},
		{"SO4^2-", IonFitOptions{From: "quantum"}, "quantum"},
		{"SO4^2-", IonFitOptions{From: FitHandbook}, "no handbook lattice energy"},
		{"SO4^2-", IonFitOptions{Only: []string{"F-"}}, "no compound"},
	} {
		_, err := a.FitIon(tc.ion, tc.opt)
		if !errors.Is(err, ErrBadInput) || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s %+v: %v, want a bad-input error naming %q", tc.ion, tc.opt, err, tc.want)
		}
	}
}

// The family fit against gas-phase ion enthalpies that do not come from a
// lattice model: ions whose value the data carry from spectroscopy or a
// cycle of gas-phase data (each row's source in ion_values.csv). Fitted
// with the generator's rule (auto over the ionic salts, IonicCounterIons),
// each must agree within 3σ (σ: the fit's standard error with the
// published uncertainty); over every salt (logged) the fits land up to 5σ
// low. Most come out low: the point-charge models miss the dispersion
// binding (the data's alkali and alkaline-earth halides bind 5.6 % more than
// Kapustinskii, TestModelSpreadComputed), so a model lattice enthalpy is too
// weak and the ion's value it implies too low; the bias is common to a
// family, which a weighted mean cannot average out.
func TestFitIonAgainstMeasuredIonValues(t *testing.T) {
	a := measuredAnalyst(t)
	for _, ion := range []string{"NO3-", "N3^-", "CN-", "OH-", "O2^-", "NH4+", "BF4-"} {
		in, err := a.DB().Ion(ion)
		if err != nil || !in.GasFormation.Known() {
			t.Fatalf("%s: no tabulated gas-phase value: %v", ion, err)
		}
		pub := in.GasFormation
		f, err := a.FitIon(ion, IonFitOptions{Ionic: true})
		if err != nil {
			t.Fatalf("%s: %v", ion, err)
		}
		z := (f.Value - pub.V) / math.Hypot(f.SE, pub.U)
		all, err := a.FitIon(ion, IonFitOptions{})
		if err != nil {
			t.Fatalf("%s over every salt: %v", ion, err)
		}
		t.Logf("%-6s ionic salts %8.1f ± %5.1f (%2d, %s), every salt %8.1f ± %5.1f (%2d); data %8.1f ± %5.1f (%s); z = %+.1f, every salt %+.1f",
			ion, f.Value, f.SE, len(f.Used()), f.Models(), all.Value, all.SE, len(all.Used()), pub.V, pub.U, pub.Source, z, (all.Value-pub.V)/math.Hypot(all.SE, pub.U))
		if math.Abs(z) > 3 {
			failUnlessDensityLoss(t, "ionfit "+ion, "%s: fit %.1f ± %.1f against %.1f ± %.1f (%s): %+.1fσ", ion, f.Value, f.SE, pub.V, pub.U, pub.Source, z)
		}
	}
}

// Published gas-phase values of ions only a fit gives, from memory (the
// thermochemical table of the handbook section on lattice energies,
// Jenkins and Roobottom, not at hand: every figure here is recalled and
// marked so), against the built-in derived values: agreement within 2σ of
// the derived value, or 3σ where the difference is explained.
func TestDerivedAgainstPublishedFromMemory(t *testing.T) {
	db := testAnalyst(t).DB()
	for _, tc := range []struct {
		ion       string
		published float64
		// explained, where set, is why up to 3σ is accepted.
		explained string
	}{
		// SO₄²⁻ −735 kJ/mol, from memory; the data's own Marcus (1987)
		// hydration with NBS ΔfH°(SO₄²⁻, aq) = −909.27 implies −741 too.
		{"SO4^2-", -735, ""},
		// O²⁻ +904, from memory and not firmly: the handbook's MgO…BaO
		// lattice energies in the data imply 833 ± 17 (ionfit O2- --from
		// handbook), which the derived value also meets.
		{"O2-", 904, ""},
		// CO₃²⁻ −321, from memory. The difference is the lattice
		// energies', not the fit's: −321 needs ΔH_L(CaCO₃) ≈ −2811 and
		// ΔH_L(MgCO₃) ≈ −3123 kJ/mol from the NBS formation enthalpies,
		// 7–9 % weaker than every point-charge model here gives from the
		// same salts (CaCO₃: volume −3036, Kapustinskii −3032), and no
		// choice of salts, model or weights comes near it: alkali
		// carbonates alone −172, alkaline-earth alone −174, Kapustinskii
		// −192, volume −196, Born–Mayer −240 (ionfit CO3^2- --from …
		// --only …, December 2026). The same models meet the handbook's
		// oxide lattice energies (O²⁻ below), so the gap is specific to the
		// carbonates' published lattice energies, or to the recollection.
		{"CO3^2-", -321, "model difference: the published value rests on carbonate lattice energies 7–9 % weaker than the point-charge models give (see the comment)"},
	} {
		d, ok := db.DerivedIon(tc.ion)
		if !ok {
			t.Fatalf("%s: no derived value", tc.ion)
		}
		z := (d.GasFormation.V - tc.published) / d.GasFormation.U
		t.Logf("%-7s derived %7.1f ± %5.1f (%s, %d salts), published %7.1f from memory: %+.1fσ", tc.ion, d.GasFormation.V, d.GasFormation.U, d.Model, len(d.Salts), tc.published, z)
		if bound := map[bool]float64{true: 2, false: 3}[tc.explained == ""]; math.Abs(z) > bound {
			failUnlessDensityLoss(t, "derived "+tc.ion, "%s: derived %.1f ± %.1f, published %.1f (from memory): %+.1fσ, beyond %gσ %s", tc.ion, d.GasFormation.V, d.GasFormation.U, tc.published, z, bound, tc.explained)
		}
	}
}

// The derived O²⁻ value against the one the handbook's lattice energies of
// MgO, CaO, SrO and BaO imply (compounds.csv, crc-lattice: Jenkins and
// Roobottom's section of the CRC Handbook, the published route): within
// their combined standard errors.
func TestDerivedOxideAgainstHandbookRoute(t *testing.T) {
	d, ok := testAnalyst(t).DB().DerivedIon("O2-")
	if !ok {
		t.Fatal("no derived O2-")
	}
	h, err := measuredAnalyst(t).FitIon("O2-", IonFitOptions{From: FitHandbook})
	if err != nil {
		t.Fatal(err)
	}
	z := (d.GasFormation.V - h.Value) / math.Hypot(d.GasFormation.U, h.SE)
	t.Logf("O2-: derived %.1f ± %.1f (%s), from the handbook lattice energies %.1f ± %.1f over %d oxides: %+.1fσ", d.GasFormation.V, d.GasFormation.U, d.Model, h.Value, h.SE, len(h.Used()), z)
	if len(h.Used()) != 4 || math.Abs(z) > 2 {
		t.Errorf("O2-: derived %.1f ± %.1f against %.1f ± %.1f from %d handbook values: %+.1fσ", d.GasFormation.V, d.GasFormation.U, h.Value, h.SE, len(h.Used()), z)
	}
}

// Every built-in salt of the families whose ion no measurement gives
// closes its cycle unless its counter-ion lacks a value; and every crystal
// that does not close lacks the value of an ion the family fit could not
// derive either (no salt of it has a radius or a density for a lattice
// model): the generator left nothing derivable out. The share that closes
// is logged with the reasons of the rest.
func TestFamiliesClose(t *testing.T) {
	db := testAnalyst(t).DB()
	fit := measuredAnalyst(t)
	families := []string{"SO4^2-", "CO3^2-", "NO3-", "ClO4-", "PO4^3-", "CrO4^2-", "O2-", "S2-", "Se2-", "Te2-", "N3-", "O2^2-"}
	crystals, closed := 0, 0
	reasons, tried := map[string]int{}, map[string]bool{}
	for _, comp := range db.Compounds() {
		if comp.Molecular || comp.State != "" && comp.State != "cr" {
			continue
		}
		crystals++
		c, err := cycle.Build(db, comp.Formula, cycle.Options{})
		if err == nil {
			_, err = cycle.Solve(c)
		}
		if err == nil {
			closed++
			continue
		}
		var me *cycle.MissingError
		if !errors.As(err, &me) {
			t.Errorf("%s: %v", comp.Formula, err)
			continue
		}
		s, _ := c.Step(me.Key)
		ion := c.Cation.Ion.Symbol
		if s.Side == cycle.SideAnion {
			ion = c.Anion.Ion.Symbol
		}
		reasons[ion]++
		for _, fam := range families {
			if in, _ := db.Ion(fam); comp.Anion == in.Symbol && ion == in.Symbol {
				t.Errorf("%s (%s): its own ion has no value: %v", comp.Formula, fam, err)
			}
		}
		if key, ok := c.IonStep(s.Side); !ok || key != me.Key {
			continue // a missing datum of another kind (a formation enthalpy …)
		}
		if _, ok := db.DerivedIon(ion); !ok && !tried[ion] {
			tried[ion] = true
			if _, ferr := fit.FitIon(ion, IonFitOptions{}); ferr == nil {
				t.Errorf("%s: %s could be fitted but derived_ions.csv has no value: regenerate it", comp.Formula, ion)
			}
		}
	}
	t.Logf("%d of %d crystalline, non-molecular built-in compounds close (%.1f %%); the rest lack, by ion: %v",
		closed, crystals, 100*float64(closed)/float64(crystals), reasons)
	// The target: at least 95 % of the built-in ionic solids close.
	if float64(closed) < 0.95*float64(crystals) {
		t.Errorf("%d of %d close (%.1f %%), under the 95 %% target", closed, crystals, 100*float64(closed)/float64(crystals))
	}
}

// With the default (derived) O²⁻ value the cycles of MgO, CaO, SrO and BaO
// land within 2 % of the handbook lattice energies the data carry
// (compounds.csv, crc-lattice: Jenkins and Roobottom's section of the CRC
// Handbook), the criterion for the default.
func TestAlkalineEarthOxidesWithinTwoPercentOfHandbook(t *testing.T) {
	db := testAnalyst(t).DB()
	for _, f := range []string{"MgO", "CaO", "SrO", "BaO"} {
		c, err := cycle.Build(db, f, cycle.Options{})
		if err != nil {
			t.Fatal(err)
		}
		r, err := cycle.Solve(c)
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		if r.Handbook == nil {
			t.Fatalf("%s: no handbook lattice value", f)
		}
		h := r.Handbook
		t.Logf("%s: handbook %.1f kJ/mol, cycle − handbook %+.1f kJ/mol (%+.2f %%), cycle σ %.1f", f, h.Value, h.Difference, h.Percent, r.Lattice.Uncertainty)
		if math.Abs(h.Percent) > 2 || !near(h.Percent, 100*h.Difference/math.Abs(h.Value), 1e-9) {
			t.Errorf("%s: cycle − handbook %+.1f kJ/mol (%+.2f %%): beyond 2 %%", f, h.Difference, h.Percent)
		}
	}
}
