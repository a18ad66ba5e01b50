package analysis

import (
	"math"
	"strings"
	"testing"

	"enthalpath/thermo/gibbs"
)

// decompositionPair is one gas-releasing decomposition of the data whose
// solids are all measured: the reaction from measured data (NBS 1982 ΔfH°
// of the salts and gases, pinned copy in data/sources/nbs-tables-1982)
// beside the same reaction from the estimates alone.
type decompositionPair struct {
	Formula            string
	Measured, Estimate Reaction
}

// measuredDecompositions returns every such pair of the data.
func measuredDecompositions(t *testing.T, a *Analyst) []decompositionPair {
	t.Helper()
	var out []decompositionPair
	for _, c := range a.db.Compounds() {
		if _, ok := releaseOf(c.Anion, 0); !ok || c.Molecular || c.State != "cr" {
			continue
		}
		m, err := a.Stability(c.Formula, StabilityOptions{})
		if err != nil || len(m.Reactions) == 0 || m.Reactions[0].Kind != "decomposition" {
			continue
		}
		all := true
		for _, tm := range append(append([]Term{}, m.Reactions[0].Reactants...), m.Reactions[0].Products...) {
			all = all && tm.Thermo.Formation.Measured
		}
		if !all {
			continue
		}
		e, err := a.Stability(c.Formula, StabilityOptions{EstimateOnly: true})
		if err != nil || len(e.Reactions) == 0 || e.Reactions[0].Equation != m.Reactions[0].Equation {
			continue
		}
		out = append(out, decompositionPair{c.Formula, m.Reactions[0], e.Reactions[0]})
	}
	if len(out) < 100 {
		t.Fatalf("only %d decompositions of two measured salts", len(out))
	}
	return out
}

// The model's scatter about its family mean, salt against salt of the
// same cation, over the data's decompositions of two measured salts: its
// correlation (uncentred, as SameCationCorrelation enters the sum) must not
// fall below the constant the rule uses. The gap of each salt is the
// ReactionModel lattice step against the cycle closed with the salt's
// measured ΔfH° (NBS 1982); the family mean is the calibration's.
func TestSameCationCorrelationMeasured(t *testing.T) {
	a := testAnalyst(t)
	var sxy, sxx, syy float64
	n := 0
	for _, p := range measuredDecompositions(t, a) {
		var e []float64
		for _, tm := range append(append([]Term{}, p.Estimate.Reactants...), p.Estimate.Products...) {
			if tm.Thermo.State != "cr" {
				continue
			}
			est, _, err := a.quickEstimateCycle(tm.Thermo.Formula, EstimateOptions{Model: ReactionModel})
			if err != nil {
				t.Fatalf("%s: %v", tm.Thermo.Formula, err)
			}
			c, err := a.build(tm.Thermo.Formula, "", "")
			if err != nil {
				t.Fatal(err)
			}
			cyc, _, err := closeLattice(c)
			if err != nil {
				t.Fatalf("%s: %v", tm.Thermo.Formula, err)
			}
			g := (cyc - est.Lattice) / math.Abs(est.Lattice)
			e = append(e, g-est.Spread.MeanPercent/100)
		}
		if len(e) != 2 {
			continue
		}
		sxy += e[0] * e[1]
		sxx += e[0] * e[0]
		syy += e[1] * e[1]
		n++
	}
	rho := sxy / math.Sqrt(sxx*syy)
	t.Logf("correlation of the %s scatter between the two salts of %d decompositions: %.3f (the rule takes %.2f)", ReactionModel, n, rho, SameCationCorrelation)
	if n < 100 || rho < SameCationCorrelation {
		t.Errorf("measured correlation %.3f over %d pairs, below SameCationCorrelation %.2f", rho, n, SameCationCorrelation)
	}
}

// The σ of ΔrH° from the estimates alone, against the measured ΔrH° of the
// same decompositions (NBS 1982 through the data): at least 95 % of the
// errors lie within 2σ (the rule's own coverage; the correlation was
// measured over these pairs, so this is an in-sample check), σ is smaller
// than the independent sum for most pairs, and every verdict the
// estimates reach agrees with the verdict from measured data.
func TestEstimateOnlySigmaAgainstMeasured(t *testing.T) {
	a := testAnalyst(t)
	pairs := measuredDecompositions(t, a)
	var covered, tighter, decided, decidedBefore int
	var s2new, s2old float64
	for _, p := range pairs {
		e, m := p.Estimate, p.Measured
		d := e.Standard.Enthalpy - m.Standard.Enthalpy
		u := e.Standard.EnthalpyUncertainty
		var old2 float64
		for _, tm := range e.Reactants {
			old2 += sq(tm.Coefficient * tm.Thermo.Formation.Uncertainty)
		}
		for _, tm := range e.Products {
			old2 += sq(tm.Coefficient * tm.Thermo.Formation.Uncertainty)
		}
		s2new += u * u
		s2old += old2
		if math.Abs(d) <= gibbs.Coverage*u {
			covered++
		}
		if u < math.Sqrt(old2) {
			tighter++
		}
		if !e.Correlated {
			t.Errorf("%s: the estimates' σ not combined by the rule", e.Equation)
		}
		if e.EntropyKnown && gibbs.Judge(e.Gibbs, math.Hypot(math.Sqrt(old2), e.Temperature*e.Standard.EntropyUncertainty/1000)) != gibbs.Undecided {
			decidedBefore++
		}
		if e.Verdict == gibbs.Undecided {
			continue
		}
		decided++
		if m.Verdict != gibbs.Undecided && m.Verdict != e.Verdict {
			t.Errorf("%s: %v from the estimates (ΔrG %.0f ± %.0f), %v from measured data (ΔrG %.0f ± %.0f)",
				e.Equation, e.Verdict, e.Gibbs, e.GibbsUncertainty, m.Verdict, m.Gibbs, m.GibbsUncertainty)
		}
	}
	n := len(pairs)
	t.Logf("%d decompositions: %d within 2σ; σ tighter than independent for %d; RMS σ %.0f (independent %.0f) kJ/mol; %d verdicts reached (%d with independent σ)",
		n, covered, tighter, math.Sqrt(s2new/float64(n)), math.Sqrt(s2old/float64(n)), decided, decidedBefore)
	if float64(covered) < 0.95*float64(n) {
		t.Errorf("only %d of %d measured ΔrH° within 2σ of the estimate", covered, n)
	}
	if float64(tighter) < 0.9*float64(n) {
		t.Errorf("σ tighter than the independent sum for only %d of %d", tighter, n)
	}
}

// A clear case: K₂SO₄ → K₂O + SO₃(g) from the estimates alone is
// disfavoured at 298.15 K, as it is from measured data (NBS 1982:
// ΔfH° K₂SO₄ −1437.79, K₂O −361.5, SO₃(g) −395.72 kJ/mol, so ΔrH° =
// +680.6), its ΔrH° beyond 2σ of zero with the rule's σ.
func TestClearCaseDecidedFromEstimates(t *testing.T) {
	a := testAnalyst(t)
	m, err := a.Stability("K2SO4", StabilityOptions{})
	if err != nil {
		t.Fatal(err)
	}
	e, err := a.Stability("K2SO4", StabilityOptions{EstimateOnly: true})
	if err != nil {
		t.Fatal(err)
	}
	mr, er := m.Reactions[0], e.Reactions[0]
	if mr.Equation != "K2SO4 -> K2O + SO3(g)" || er.Equation != mr.Equation {
		t.Fatalf("reactions %q, %q", mr.Equation, er.Equation)
	}
	if !near(mr.Standard.Enthalpy, -395.72-361.5+1437.79, 0.05) || mr.Verdict != gibbs.Disfavoured {
		t.Errorf("measured: ΔrH° %.2f (%v), want +680.6 disfavoured", mr.Standard.Enthalpy, mr.Verdict)
	}
	if er.Verdict != gibbs.Disfavoured || er.EnthalpyVerdict != gibbs.Disfavoured {
		t.Errorf("estimates: ΔrH° %.0f ± %.0f, ΔrG %.0f ± %.0f: %v, want disfavoured", er.Standard.Enthalpy, er.Standard.EnthalpyUncertainty, er.Gibbs, er.GibbsUncertainty, er.Verdict)
	}
	t.Logf("%s: estimates %.0f ± %.0f kJ/mol, measured %.1f", er.Equation, er.Standard.Enthalpy, er.Standard.EnthalpyUncertainty, mr.Standard.Enthalpy)
}

// Properties of the rule: one estimate beside measured species keeps its
// own σ; a datum that enters both sides alike cancels; the scatter of two
// salts of one cation is correlated, of two cations not; an uncalibrated
// salt keeps its whole model σ.
func TestEnthalpySigmaRule(t *testing.T) {
	budget := func(cation string, sigma, mean, rms float64, inputs ...InputShare) *Thermo {
		in2 := 0.0
		for _, s := range inputs {
			in2 += s.Sigma * s.Sigma
		}
		return &Thermo{Formation: Quantity{Uncertainty: math.Sqrt(in2 + sigma*sigma)},
			Budget: &ErrorBudget{Inputs: inputs, Model: "m", Cation: cation, ModelSigma: sigma, MeanFraction: mean, RMSFraction: rms, Calibrated: true}}
	}
	gas := &Thermo{Formation: Quantity{Uncertainty: 3}}
	ie := InputShare{"M(g) → M⁺(g) + e⁻ = 500 ± 2", 2}
	one := budget("M+", 100, -0.03, 0.05, ie)
	if u, corr := enthalpySigma([]float64{-1, 1}, []*Thermo{one, gas}); !near(u, math.Hypot(one.Formation.Uncertainty, 3), 1e-9) || corr {
		t.Errorf("one estimate: σ %.3f (correlated %v), want %.3f", u, corr, math.Hypot(one.Formation.Uncertainty, 3))
	}
	// Same cation, same family, same lattice σ: bias cancels, scatter
	// correlated, the shared datum cancels.
	a, b := budget("M+", 100, -0.03, 0.05, ie), budget("M+", 100, -0.03, 0.05, ie)
	s := 100 * math.Sqrt(1-0.36)
	want := math.Sqrt(2*s*s - 2*SameCationCorrelation*s*s)
	if u, corr := enthalpySigma([]float64{-1, 1}, []*Thermo{a, b}); !near(u, want, 1e-9) || !corr {
		t.Errorf("same cation: σ %.3f, want %.3f", u, want)
	}
	c := budget("N+", 100, -0.03, 0.05)
	if u, _ := enthalpySigma([]float64{-1, 1}, []*Thermo{a, c}); !near(u, math.Sqrt(2*s*s+4), 1e-9) {
		t.Errorf("two cations: σ %.3f, want %.3f", u, math.Sqrt(2*s*s+4))
	}
	a.Budget.Calibrated = false
	if u, _ := enthalpySigma([]float64{-1, 1}, []*Thermo{a, b}); !near(u, math.Sqrt(100*100+sq(100*0.6)+s*s), 1e-9) {
		t.Errorf("uncalibrated: σ %.3f", u)
	}
}

// Each estimated ΔfH° carries a budget whose parts add up to its σ.
func TestBudgetAddsUpToTheEstimate(t *testing.T) {
	a := testAnalyst(t)
	for _, f := range []string{"BaO2", "BaO", "CaCO3", "MgCl3", "KO2"} {
		est, c, err := a.quickEstimateCycle(f, EstimateOptions{Model: ReactionModel})
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		th := a.estimatedThermo(est, c)
		b := th.Budget
		v := b.ModelSigma * b.ModelSigma
		for _, in := range b.Inputs {
			v += in.Sigma * in.Sigma
		}
		if !near(math.Sqrt(v), th.Formation.Uncertainty, 1e-6) {
			t.Errorf("%s: budget %.4f, estimate σ %.4f", f, math.Sqrt(v), th.Formation.Uncertainty)
		}
		if b.Calibrated != (f != "MgCl3") {
			t.Errorf("%s: calibrated %v", f, b.Calibrated)
		}
	}
}

// MgO₂, which the tables do not hold, is read as magnesium peroxide (Mg²⁺
// with O₂²⁻; a real compound, common knowledge) and decomposes into MgO, a
// built-in compound, and O₂: no partner at a charge the data do not know.
func TestMagnesiumPeroxideFromEstimates(t *testing.T) {
	a := testAnalyst(t)
	est, err := a.Estimate("MgO2", EstimateOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if est.Cation.Symbol != "Mg2+" || est.Anion.Symbol != "O2^2-" {
		t.Errorf("MgO2 read as %s with %s, want Mg2+ with O2^2-", est.Cation.Symbol, est.Anion.Symbol)
	}
	st, err := a.Stability("MgO2", StabilityOptions{EstimateOnly: true})
	if err != nil {
		t.Fatal(err)
	}
	if len(st.Reactions) != 1 || st.Reactions[0].Equation != "MgO2 -> MgO + ½ O2(g)" {
		for _, r := range st.Reactions {
			t.Logf("%s", r.Equation)
		}
		t.Fatalf("%d reactions, want MgO2 -> MgO + ½ O2(g) alone", len(st.Reactions))
	}
	r := st.Reactions[0]
	for _, p := range r.Products {
		if p.Thermo.State == "cr" {
			if _, ok := a.db.FindCompound(p.Thermo.Formula); !ok {
				t.Errorf("product %s is not a built-in compound", p.Thermo.Formula)
			}
		}
	}
	if math.Abs(st.Compound.Formation.Value) > 2000 {
		t.Errorf("ΔfH°(MgO2) %.0f kJ/mol: not a peroxide's order of magnitude", st.Compound.Formation.Value)
	}
	t.Logf("MgO2: ΔfH° %.0f ± %.0f; %s ΔrH° %.0f ± %.0f, ΔrG %.0f ± %.0f (%v)", st.Compound.Formation.Value, st.Compound.Formation.Uncertainty,
		r.Equation, r.Standard.Enthalpy, r.Standard.EnthalpyUncertainty, r.Gibbs, r.GibbsUncertainty, r.Verdict)
}

// A scan of Mg with O2- still has its Mg⁴⁺ oxide row, written MgO2, and
// says that the formula alone reads as the peroxide, a different substance.
func TestScanRowNamesTheOtherReading(t *testing.T) {
	sc, err := testAnalyst(t).Scan("Mg", "O", ScanOptions{})
	if err != nil {
		t.Fatal(err)
	}
	for _, c := range sc.Compounds {
		if c.Formula != "MgO2" {
			continue
		}
		if c.Charge != 4 || len(c.Notes) == 0 || !strings.Contains(c.Notes[0], "reads as Mg2+ with O2^2-") {
			t.Errorf("MgO2 row (charge %+d): notes %q", c.Charge, c.Notes)
		}
		return
	}
	t.Fatal("no MgO2 row in the scan of Mg with O")
}

// The real peroxides and superoxides from the estimates alone, against
// their NBS 1982 ΔfH° (pinned copy, through the data): each estimate
// within 2σ of the measured value, the decomposition's ΔrH° within 2σ of
// the measured one, and no verdict against the measured data's.
func TestPeroxidesAndSuperoxidesAgainstNBS(t *testing.T) {
	a := testAnalyst(t)
	for _, f := range []string{"Li2O2", "Na2O2", "K2O2", "Rb2O2", "CaO2", "SrO2", "BaO2", "NaO2", "KO2", "RbO2"} {
		m, err := a.Stability(f, StabilityOptions{})
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		e, err := a.Stability(f, StabilityOptions{EstimateOnly: true})
		if err != nil {
			t.Fatalf("%s: %v", f, err)
		}
		if !m.Compound.Formation.Measured || e.Compound.Formation.Measured {
			t.Fatalf("%s: measured %v / estimate %v", f, m.Compound.Formation, e.Compound.Formation)
		}
		me, ee := m.Compound.Formation, e.Compound.Formation
		if math.Abs(ee.Value-me.Value) > gibbs.Coverage*ee.Uncertainty {
			t.Errorf("%s: ΔfH° %.0f ± %.0f from the estimate, NBS %.1f", f, ee.Value, ee.Uncertainty, me.Value)
		}
		mr, er := m.Reactions[0], e.Reactions[0]
		if er.Equation != mr.Equation || math.Abs(er.Standard.Enthalpy-mr.Standard.Enthalpy) > gibbs.Coverage*er.Standard.EnthalpyUncertainty {
			t.Errorf("%s: %s ΔrH° %.0f ± %.0f from the estimates, %.1f measured (%s)", f, er.Equation, er.Standard.Enthalpy, er.Standard.EnthalpyUncertainty, mr.Standard.Enthalpy, mr.Equation)
		}
		if er.Verdict != gibbs.Undecided && mr.Verdict != gibbs.Undecided && er.Verdict != mr.Verdict {
			t.Errorf("%s: %v from the estimates, %v from measured data", er.Equation, er.Verdict, mr.Verdict)
		}
		t.Logf("%-6s ΔfH° est %6.0f ± %3.0f, NBS %7.1f; %-26s ΔrH° est %5.0f ± %3.0f, meas %6.1f; verdicts %v / %v", f, ee.Value, ee.Uncertainty, me.Value,
			er.Equation, er.Standard.Enthalpy, er.Standard.EnthalpyUncertainty, mr.Standard.Enthalpy, er.Verdict, mr.Verdict)
	}
}
