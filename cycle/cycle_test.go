package cycle

import (
	"errors"
	"math"
	"sort"
	"strings"
	"sync"
	"testing"

	"enthalpath/data"
	"enthalpath/thermo"
)

var (
	dbOnce sync.Once
	testDB *data.DB
	dbErr  error
)

func loadDB(t testing.TB) *data.DB {
	t.Helper()
	dbOnce.Do(func() { testDB, dbErr = data.Load() })
	if dbErr != nil {
		t.Fatalf("data.Load: %v", dbErr)
	}
	return testDB
}

func build(t testing.TB, formula string, opt Options) *Cycle {
	t.Helper()
	c, err := Build(loadDB(t), formula, opt)
	if err != nil {
		t.Fatalf("Build(%s): %v", formula, err)
	}
	return c
}

func solve(t testing.TB, c *Cycle) *Result {
	t.Helper()
	r, err := Solve(c)
	if err != nil {
		t.Fatalf("Solve(%s): %v", c.Formula, err)
	}
	return r
}

func near(a, b, tol float64) bool { return math.Abs(a-b) <= tol }

// The NaCl cycle from NBS/CODATA-consistent data gives a lattice enthalpy
// of −787 kJ/mol (ΔH_L = +787 kJ/mol for NaCl(s) → Na⁺(g) + Cl⁻(g)): the
// worked Born–Haber example in P. Atkins and J. de Paula, Physical
// Chemistry (9th ed., Oxford, 2010), section 2.8 and Table 2.8 (from
// memory), and C. E. Housecroft and A. G. Sharpe, Inorganic Chemistry
// (4th ed., Pearson, 2012), chapter 6 (from memory). Tolerance 3 kJ/mol,
// about the combined uncertainty of the inputs.
func TestNaClLatticeEnthalpy(t *testing.T) {
	r := solve(t, build(t, "NaCl", Options{}))
	const want, tol = -787.0, 3.0 // Atkins / Housecroft & Sharpe, from memory
	if r.Solved.Key != "lattice" || !near(r.Solved.Value, want, tol) {
		t.Errorf("NaCl lattice step = %s %.2f, want %.0f ± %.0f kJ/mol", r.Solved.Key, r.Solved.Value, want, tol)
	}
	if r.Solved.Uncertainty <= 0 || r.Solved.Uncertainty > 10 {
		t.Errorf("NaCl lattice uncertainty = %.2f kJ/mol, want a few kJ/mol", r.Solved.Uncertainty)
	}
	// The steps are the textbook ones, in order.
	want5 := []string{"atomization-cation", "ionization-1", "atomization-anion", "dissociation-anion", "attachment-1", "lattice", "formation"}
	if got := strings.Join(build(t, "NaCl", Options{}).Keys(), " "); got != strings.Join(want5, " ") {
		t.Errorf("NaCl steps = %s, want %s", got, strings.Join(want5, " "))
	}
}

// With the lattice step from Born–Mayer, MgO gives the second attachment
// enthalpy of oxygen (O⁻ + e⁻ → O²⁻) in the published range +750 to +850
// kJ/mol: Housecroft & Sharpe, Inorganic Chemistry (4th ed., 2012),
// discussion of the Born–Haber cycle of MgO (+798 kJ/mol quoted there, from
// memory); the range is the one the issue states.
func TestMgOSecondAttachmentFromBornMayer(t *testing.T) {
	for _, model := range []string{ModelBornMayer, ModelEwald} {
		c := build(t, "MgO", Options{})
		c.Settings.LatticeFrom = model
		if err := c.SolveFor("attachment-2"); err != nil {
			t.Fatal(err)
		}
		r := solve(t, c)
		if r.Solved.Key != "attachment-2" || r.Solved.Value < 750 || r.Solved.Value > 850 {
			t.Errorf("%s: MgO attachment-2 = %.1f kJ/mol, want within +750…+850 (Housecroft & Sharpe, from memory)", model, r.Solved.Value)
		}
		if l, _ := r.Step("lattice"); l.Source.Kind != SourceModel || l.Source.Key != model {
			t.Errorf("%s: lattice step source = %+v, want the model", model, l.Source)
		}
	}
}

// handbookExceptions are the compounds whose cycle lattice value differs
// from the data's handbook value by more than the stated tolerance, each
// with its reason. The tolerance: within the combined standard uncertainty
// (the cycle's and the handbook's where it states one), or 2 % of the
// handbook value, whichever is larger.
var handbookExceptions = map[string]string{
	// Empty since the O²⁻ value is fitted over the s-block oxides
	// (derived_ions.csv): with the textbook +844 kJ/mol for O⁻ → O²⁻,
	// MgO, CaO, SrO and BaO were exceptions, 2.6–4 % off the handbook.
}

// For every built-in compound with a handbook lattice energy whose cycle
// closes, the cycle value agrees with it within the stated uncertainties or
// 2 % (the criterion); exceptions are listed above with reasons.
func TestCycleAgreesWithHandbook(t *testing.T) {
	db := loadDB(t)
	checked := 0
	for _, comp := range db.Compounds() {
		if !comp.HandbookLattice.Known() {
			continue
		}
		c, err := Build(db, comp.Formula, Options{})
		if err != nil {
			t.Errorf("%s: %v", comp.Formula, err)
			continue
		}
		r, err := Solve(c)
		if err != nil {
			t.Logf("%s: cycle does not close (%v); not compared", comp.Formula, err)
			continue
		}
		h := r.Handbook
		if h == nil {
			t.Errorf("%s: handbook lattice value not carried into the result", comp.Formula)
			continue
		}
		checked++
		tol := math.Max(math.Hypot(r.Lattice.Uncertainty, h.Uncertainty), 0.02*math.Abs(h.Value))
		ok := math.Abs(h.Difference) <= tol
		reason, isException := handbookExceptions[comp.Formula]
		switch {
		case !ok && !isException:
			t.Errorf("%s: cycle %.1f vs handbook %.1f kJ/mol (%s, %s): difference %.1f exceeds %.1f",
				comp.Formula, r.Lattice.In(c.Conventions.Lattice), h.Value, h.Convention.Symbol(), h.Source.Key, h.Difference, tol)
		case !ok:
			t.Logf("exception %s: difference %.1f kJ/mol (%.1f %%): %s", comp.Formula, h.Difference, h.Percent, reason)
		case isException:
			t.Logf("%s is listed as an exception but now agrees (difference %.1f kJ/mol)", comp.Formula, h.Difference)
		}
	}
	if checked < 20 {
		t.Errorf("only %d compounds compared with a handbook value; the data should have more", checked)
	}
}

// Silver and copper(I) halides show a clearly larger gap between cycle
// and ionic model than the alkali halides (a fact of the trade; common
// practice, no source): the mean gap with the structure's own Ewald
// Madelung constant is at least twice the alkali halides' mean.
func TestCovalentGapCoinageHalides(t *testing.T) {
	db := loadDB(t)
	memo := NewMemo()
	mean := map[string][]float64{}
	for _, comp := range db.Compounds() {
		fam := comp.Family
		if fam != "alkali halide" && fam != "silver halide" && fam != "copper(I) halide" {
			continue
		}
		c, err := Build(db, comp.Formula, Options{Memo: memo})
		if err != nil {
			t.Fatal(err)
		}
		r, err := Solve(c)
		if err != nil {
			t.Logf("%s: %v", comp.Formula, err)
			continue
		}
		m, _ := r.Model(ModelEwald)
		if m.Err != nil {
			t.Logf("%s: %v", comp.Formula, m.Err)
			continue
		}
		key := "alkali"
		if fam != "alkali halide" {
			key = "coinage"
		}
		mean[key] = append(mean[key], -m.GapPercent)
	}
	avg := func(xs []float64) float64 {
		s := 0.0
		for _, x := range xs {
			s += x
		}
		return s / float64(len(xs))
	}
	if len(mean["alkali"]) < 10 || len(mean["coinage"]) < 4 {
		t.Fatalf("too few compounds: %d alkali, %d silver/copper(I) halides", len(mean["alkali"]), len(mean["coinage"]))
	}
	a, g := avg(mean["alkali"]), avg(mean["coinage"])
	t.Logf("mean extra binding beyond the ewald model: alkali halides %.1f %%, silver and copper(I) halides %.1f %%", a, g)
	if !(g > 2*a) {
		t.Errorf("silver/copper(I) halide gap %.1f %% is not clearly larger than the alkali halides' %.1f %%", g, a)
	}
}

// Uncertainty propagation against a hand calculation (CaF₂ with every
// step set by hand): σ² = 1² + 0.5² + 0.5² + (1·2)² + (2·1)² + 3² = 18.5,
// so σ = √18.5 = 4.30116 kJ/mol; the value is −1220 − (178 + 590 + 1145 +
// 159 − 2·328) = −2636 kJ/mol. Solving for attachment-1 (×2) instead
// divides the root sum of squares by 2.
func TestUncertaintyPropagationByHand(t *testing.T) {
	c := build(t, "CaF2", Options{})
	for _, s := range []struct {
		key    string
		v, unc float64
	}{
		{"atomization-cation", 178, 1}, {"ionization-1", 590, 0.5}, {"ionization-2", 1145, 0.5},
		{"dissociation-anion", 159, 2}, {"attachment-1", -328, 1}, {"formation", -1220, 3},
	} {
		if err := c.Set(s.key, s.v, s.unc); err != nil {
			t.Fatal(err)
		}
	}
	if m, _ := c.Step("dissociation-anion"); m.Multiplicity != 1 {
		t.Fatalf("CaF2 dissociation multiplicity = %g, want 1 (one F₂ for two F)", m.Multiplicity)
	}
	if err := c.SolveFor("lattice"); err != nil {
		t.Fatal(err)
	}
	r := solve(t, c)
	if !near(r.Solved.Value, -2636, 1e-9) || !near(r.Solved.Uncertainty, math.Sqrt(18.5), 1e-9) {
		t.Errorf("lattice = %.6f ± %.6f, want −2636 ± %.6f (hand calculation)", r.Solved.Value, r.Solved.Uncertainty, math.Sqrt(18.5))
	}
	// Now fix the lattice and solve for attachment-1: its value is
	// (−1220 − 178 − 590 − 1145 − 159 + 2636)/2 = −328, σ = √(1 + .25 + .25
	// + 4 + 9 + 5²)/2 with the lattice at ±5.
	if err := c.Set("lattice", -2636, 5); err != nil {
		t.Fatal(err)
	}
	if err := c.SolveFor("attachment-1"); err != nil {
		t.Fatal(err)
	}
	r = solve(t, c)
	wantU := math.Sqrt(1+0.25+0.25+4+9+25) / 2
	if !near(r.Solved.Value, -328, 1e-9) || !near(r.Solved.Uncertainty, wantU, 1e-9) {
		t.Errorf("attachment-1 = %.6f ± %.6f, want −328 ± %.6f (hand calculation)", r.Solved.Value, r.Solved.Uncertainty, wantU)
	}
}

// U and ΔH_L differ by Jenkins' correction (H. D. B. Jenkins, J. Chem.
// Educ. 82, 950 (2005)): ΔH_L = U + [a(n_M/2 − 2) + b(n_X/2 − 2)]RT, which
// is −RT for NaCl, −1.5RT for CaF₂ and +0.5RT for NH₄Cl's (NH₄⁺ non-linear,
// n = 6; Cl⁻, n = 3): 0.5·(6/2−2)... = +1 − 0.5 = +0.5 RT.
func TestLatticeConventionsDifferByJenkinsTerm(t *testing.T) {
	rt := thermo.RT(thermo.StandardTemperature)
	for _, tc := range []struct {
		formula string
		k       float64 // ΔH_L − U in units of RT, dissociation direction (Jenkins 2005)
	}{{"NaCl", -1}, {"CaF2", -1.5}, {"NH4Cl", 0.5}, {"Al2O3", -2.5}} {
		h := build(t, tc.formula, Options{})
		u := build(t, tc.formula, Options{Conventions: Conventions{Lattice: LatticeEnergy}})
		if !near(h.LatticeCorrection(), tc.k*rt, 1e-9) {
			t.Errorf("%s: ΔH_L − U = %.4f, want %.1f·RT = %.4f kJ/mol", tc.formula, h.LatticeCorrection(), tc.k, tc.k*rt)
		}
		rh, err1 := Solve(h)
		ru, err2 := Solve(u)
		if err1 != nil || err2 != nil {
			t.Logf("%s: %v %v", tc.formula, err1, err2)
			continue
		}
		// The lattice step (ions → solid) as an energy is −U = −ΔH_L + k·RT.
		if !near(ru.Solved.Value-rh.Solved.Value, tc.k*rt, 1e-9) {
			t.Errorf("%s: step as U %.4f minus step as ΔH_L %.4f = %.4f, want %.4f", tc.formula, ru.Solved.Value, rh.Solved.Value,
				ru.Solved.Value-rh.Solved.Value, tc.k*rt)
		}
		if !near(rh.Lattice.Energy, ru.Lattice.Energy, 1e-9) || !near(rh.Lattice.Enthalpy, ru.Lattice.Enthalpy, 1e-9) {
			t.Errorf("%s: both results should carry the same lattice values", tc.formula)
		}
	}
}

// The 5/2·RT terms cancel for a neutral salt: 0 K energies and 298 K
// enthalpies give the same lattice value for every built-in compound whose
// cycle closes, while the individual ionization steps differ by 5/2·RT
// (property over the whole table; the physics is in the package comment).
func TestIonizationConventionsCancel(t *testing.T) {
	db := loadDB(t)
	h := 2.5 * thermo.RT(thermo.StandardTemperature)
	n := 0
	for _, comp := range db.Compounds() {
		a, err := Build(db, comp.Formula, Options{})
		if err != nil {
			continue
		}
		b, _ := Build(db, comp.Formula, Options{Conventions: Conventions{Ionization: Enthalpies298}})
		ra, err := Solve(a)
		if err != nil {
			continue
		}
		rb, err := Solve(b)
		if err != nil {
			t.Errorf("%s: solves at 0 K but not at 298 K: %v", comp.Formula, err)
			continue
		}
		n++
		if !near(ra.Solved.Value, rb.Solved.Value, 1e-8) {
			t.Errorf("%s: lattice %.6f (0 K) vs %.6f (298 K)", comp.Formula, ra.Solved.Value, rb.Solved.Value)
		}
		for _, s := range ra.Steps {
			o, _ := rb.Step(s.Key)
			var want float64
			switch s.Kind {
			case KindIonization:
				want = h
			case KindAttachment:
				want = -h * float64(max(1, s.Electrons)) // N(g) + 3e⁻ → N³⁻(g) carries three
			default:
				continue
			}
			if s.Source.Kind != SourceMissing && !near(o.Value-s.Value, want, 1e-9) {
				t.Errorf("%s %s: 298 K − 0 K = %.4f, want %.4f", comp.Formula, s.Key, o.Value-s.Value, want)
			}
		}
	}
	if n < 20 {
		t.Errorf("only %d compounds checked", n)
	}
}

// SetConventions there and back returns every value (property test).
func TestSetConventionsRoundTrip(t *testing.T) {
	c := build(t, "NH4Cl", Options{})
	before := c.Clone()
	c.SetConventions(Conventions{Lattice: LatticeEnergy, Ionization: Enthalpies298})
	c.SetConventions(Conventions{})
	for i := range c.Steps {
		if !near(c.Steps[i].Value, before.Steps[i].Value, 1e-9) {
			t.Errorf("%s: %.6f after the round trip, %.6f before", c.Steps[i].Key, c.Steps[i].Value, before.Steps[i].Value)
		}
	}
}

// Attachment enthalpy = −electron affinity: Cl's first electron affinity
// is 3.612725 eV in the data (Rienstra-Kiracofe et al. 2002, as tabulated),
// so attachment-1 of NaCl is −3.612725 eV × 96.485 kJ/mol/eV ≈ −348.6.
func TestAttachmentIsMinusAffinity(t *testing.T) {
	db := loadDB(t)
	cl, err := db.Element("Cl")
	if err != nil {
		t.Fatal(err)
	}
	c := build(t, "NaCl", Options{})
	s, _ := c.Step("attachment-1")
	if want := -thermo.EVToKJPerMol(cl.ElectronAffinity.V); !near(s.Value, want, 1e-9) || s.Value >= 0 {
		t.Errorf("attachment-1 = %.4f, want −EA = %.4f kJ/mol (negative)", s.Value, want)
	}
	if !strings.Contains(s.Label, "attachment") || !strings.Contains(s.Label, "minus") {
		t.Errorf("label %q should name the attachment enthalpy as minus the affinity", s.Label)
	}
	// The second attachment of O is positive (it absorbs energy) and flagged derived.
	o, _ := build(t, "MgO", Options{}).Step("attachment-2")
	if o.Value <= 0 || !o.Source.Derived {
		t.Errorf("MgO attachment-2 = %.1f (derived %v), want a positive, derived value", o.Value, o.Source.Derived)
	}
}

// Composite atomization: the sub-steps of Br (vaporization and
// dissociation) sum to the atomization enthalpy; setting a sub-step
// changes the sum, setting the composite takes the sub-steps out.
func TestCompositeAtomization(t *testing.T) {
	c := build(t, "NaBr", Options{})
	p, _ := c.Step("atomization-anion")
	v, _ := c.Step("vaporization-anion")
	d, _ := c.Step("dissociation-anion")
	if !p.Composite || v.Parent != "atomization-anion" || d.Parent != "atomization-anion" {
		t.Fatalf("NaBr atomization-anion should be a composite of vaporization and dissociation")
	}
	// ΔfH°(Br, g) = 111.87 kJ/mol (CODATA key values 1989, from memory).
	if !near(p.Value, 111.87, 0.1) || !near(v.Multiplicity*v.Value+d.Multiplicity*d.Value, p.Value, 1e-9) {
		t.Errorf("atomization-anion = %.3f, want the sub-steps' sum ≈ 111.87", p.Value)
	}
	r0 := solve(t, c).Solved.Value
	if err := c.Set("dissociation-anion", d.Value+10, 0.3); err != nil {
		t.Fatal(err)
	}
	if p, _ := c.Step("atomization-anion"); !near(p.Value, 111.87+5, 0.1) {
		t.Errorf("after +10 on Br₂ dissociation (×½) the atomization should rise by 5, got %.3f", p.Value)
	}
	if r1 := solve(t, c).Solved.Value; !near(r1, r0-5, 1e-9) {
		t.Errorf("lattice %.3f, want %.3f (5 kJ/mol more exothermic)", r1, r0-5)
	}
	if err := c.Set("atomization-anion", 100, 1); err != nil {
		t.Fatal(err)
	}
	if r2 := solve(t, c).Solved.Value; !near(r2, r0+11.87, 0.1) {
		t.Errorf("with atomization-anion set to 100 the lattice is %.3f, want %.3f", r2, r0+11.87)
	}
	if err := c.Reset("atomization-anion"); err != nil {
		t.Fatal(err)
	}
	if r3 := solve(t, c).Solved.Value; !near(r3, r0-5, 1e-9) {
		t.Errorf("after Reset the composite should sum its sub-steps again: %.3f, want %.3f", r3, r0-5)
	}
}

// Every failure mode has its own typed error naming what to do, in the
// engine's words (each front end names its own flag or key: cycle/cli's
// TestEngineErrorsWordedForTheCommandLine).
func TestErrors(t *testing.T) {
	db := loadDB(t)
	c := build(t, "NaCl", Options{})
	c.Steps[5].Unknown = false // lattice
	if _, err := Solve(c); !errors.Is(err, ErrNothingToSolve) || !strings.Contains(err.Error(), "mark one step unknown") {
		t.Errorf("zero unknowns: %v", err)
	}
	c = build(t, "NaCl", Options{})
	c.MarkUnknown("formation")
	if _, err := Solve(c); !errors.Is(err, ErrTooManyUnknowns) || !strings.Contains(err.Error(), "lattice, formation") {
		t.Errorf("two unknowns: %v", err)
	}
	// Without the family-fitted ion values nothing gives N³⁻(g).
	measured, err := data.LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	if c, err = Build(measured, "Li3N", Options{}); err != nil {
		t.Fatal(err)
	}
	_, err = Solve(c)
	var me *MissingError
	if !errors.As(err, &me) || me.Key != "attachment-1-3" || !strings.Contains(err.Error(), "give step attachment-1-3 a value") {
		t.Errorf("missing datum: %v", err)
	}
	if _, err := Build(db, "NaCl", Options{Cation: "Mg2+", Anion: "Cl-"}); !errors.Is(err, ErrChargeBalance) {
		t.Errorf("charge balance: %v", err)
	}
	// Two Na for three Cl⁻ would need Na^1.5+.
	if _, err := Build(db, "Na2Cl3", Options{}); !errors.Is(err, ErrChargeBalance) || !strings.Contains(err.Error(), "whole charge") {
		t.Errorf("Na2Cl3: %v", err)
	}
	c = build(t, "NaCl", Options{})
	if err := c.Set("ionisation-1", 1, 0); !errors.Is(err, ErrUnknownStep) || !strings.Contains(err.Error(), "ionization-1") {
		t.Errorf("unknown step: %v", err)
	}
	_, err = Build(db, "NaQ", Options{})
	if !errors.Is(err, ErrUnknownCompound) || !strings.Contains(err.Error(), "NaQ") {
		t.Errorf("unknown formula: %v", err)
	}
	_, err = Build(db, "Xx2O", Options{})
	if !errors.Is(err, ErrUnknownCompound) {
		t.Errorf("unknown element: %v", err)
	}
	c = build(t, "NaCl", Options{})
	c.Settings.LatticeFrom = "born-landé"
	if _, err := Solve(c); !errors.Is(err, ErrUnknownModel) || !strings.Contains(err.Error(), "born-lande") {
		t.Errorf("unknown model: %v", err)
	}
	c = build(t, "NaCl", Options{})
	c.Settings.LatticeFrom = ModelBornMayer // lattice was the only unknown
	if _, err := Solve(c); !errors.Is(err, ErrNothingToSolve) {
		t.Errorf("model lattice with nothing else unknown: %v", err)
	}
	if err := c.Set("formation", math.NaN(), 1); err == nil {
		t.Errorf("Set accepted NaN")
	}
}

// A hypothetical compound (MgCl, Mg⁺ not in the ion table) builds with its
// formation enthalpy missing; from a model lattice it is solved.
func TestHypotheticalCompound(t *testing.T) {
	c := build(t, "MgCl", Options{})
	if c.Tabulated || c.Cation.Ion.Charge != 1 || c.Anion.Ion.Symbol != "Cl-" {
		t.Fatalf("MgCl ions: %+v %+v", c.Cation.Ion, c.Anion.Ion)
	}
	c.Settings.LatticeFrom = ModelKapustinskii
	c.Cation.Ion.Radii = nil // Mg⁺ has no tabulated radius
	if _, err := Solve(c); err == nil {
		t.Errorf("Kapustinskii without a radius for Mg⁺ should fail")
	}
	c = build(t, "MgCl", Options{})
	c.Settings.LatticeFrom = ModelBornMayer
	c.Settings.Structure = Structure{Prototype: "rock-salt", Params: map[string]float64{"a": 5.0}}
	c.Settings.Distance = DistanceGeometry
	if err := c.SolveFor("formation"); err != nil {
		t.Fatal(err)
	}
	r := solve(t, c)
	if r.Solved.Key != "formation" || math.IsNaN(r.Solved.Value) {
		t.Errorf("MgCl formation: %+v", r.Solved)
	}
}

// Clone is independent of the original.
func TestCloneIndependent(t *testing.T) {
	c := build(t, "MgO", Options{})
	d := c.Clone()
	d.Set("formation", -1, 1)
	d.Settings.Structure.Params["a"] = 9
	if s, _ := c.Step("formation"); s.Value == -1 {
		t.Errorf("Set on a clone changed the original")
	}
	if c.Settings.Structure.Params["a"] == 9 {
		t.Errorf("clone shares its structure parameters")
	}
}

// The Madelung constants from the memo are those of the prototypes:
// rock salt 1.74756, fluorite 2.51939 (per formula unit, referred to the
// nearest distance; Y. Sakamoto, J. Chem. Phys. 28, 164 (1958), from
// memory), whatever the compound's charges.
func TestMadelungThroughMemo(t *testing.T) {
	for _, tc := range []struct {
		formula string
		want    float64
	}{{"NaCl", 1.74756}, {"MgO", 1.74756}, {"CaF2", 2.51939}} {
		r := solve(t, build(t, tc.formula, Options{}))
		m, _ := r.Model(ModelEwald)
		if m.Err != nil || !near(m.Inputs.Madelung, tc.want, 5e-5) {
			t.Errorf("%s: ewald A = %.6f (%v), want %.5f", tc.formula, m.Inputs.Madelung, m.Err, tc.want)
		}
	}
	memo := NewMemo()
	c := build(t, "NaCl", Options{Memo: memo})
	solve(t, c)
	n := memo.Len()
	c.Settings.Rho = 0.3
	solve(t, c)
	if memo.Len() != n {
		t.Errorf("changing ρ summed again: memo %d → %d", n, memo.Len())
	}
}

// The text of reactions uses Unicode sub- and superscripts.
func TestReactionText(t *testing.T) {
	c := build(t, "Al2O3", Options{})
	want := map[string]string{
		"ionization-3": "Al²⁺(g) → Al³⁺(g) + e⁻",
		"attachment-2": "O⁻(g) + e⁻ → O²⁻(g)",
		"lattice":      "2 Al³⁺(g) + 3 O²⁻(g) → Al₂O₃(s)",
		"formation":    "2 Al(s) + 3/2 O₂(g) → Al₂O₃(s)",
	}
	for k, w := range want {
		if s, _ := c.Step(k); s.Reaction != w {
			t.Errorf("%s: %q, want %q", k, s.Reaction, w)
		}
	}
	if s, _ := c.Step("attachment-2"); s.Multiplicity != 3 {
		t.Errorf("Al2O3 attachment-2 multiplicity %g, want 3", s.Multiplicity)
	}
	keys := c.Keys()
	sort.Strings(keys)
	if strings.Join(keys, ",") == "" {
		t.Errorf("no keys")
	}
}

// CloneInto over a scratch cycle that held another compound gives the
// cycle Clone gives (the solved formation enthalpy of each, NIST-JANAF and
// CODATA values through the built-in data), and leaves the original
// independent of the copy.
func TestCloneIntoReusesScratch(t *testing.T) {
	scratch := new(Cycle)
	for _, f := range []string{"MgO", "NaCl", "CaF2", "MgO"} {
		c := build(t, f, Options{})
		d := c.CloneInto(scratch)
		if d != scratch {
			t.Fatalf("%s: CloneInto returned another cycle", f)
		}
		want := solve(t, c.Clone()).Solved
		got := solve(t, d).Solved
		if got.Key != want.Key || got.Value != want.Value || got.Uncertainty != want.Uncertainty {
			t.Errorf("%s: solved %s %g ± %g into the scratch, %s %g ± %g from Clone", f, got.Key, got.Value, got.Uncertainty, want.Key, want.Value, want.Uncertainty)
		}
		d.Set("formation", -1, 1)
		if d.Settings.Structure.Params != nil {
			d.Settings.Structure.Params["a"] = 99
		}
		for i := range d.Steps {
			if r := d.Steps[i].Reference; r != nil {
				r.Value = 12345
			}
		}
		if s, _ := c.Step("formation"); s.Value == -1 || (s.Reference != nil && s.Reference.Value == 12345) {
			t.Errorf("%s: a change to the scratch copy changed the original", f)
		}
		if c.Settings.Structure.Params["a"] == 99 {
			t.Errorf("%s: the scratch copy shares its structure parameters", f)
		}
	}
}
