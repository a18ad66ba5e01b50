package analysis

import (
	"math"
	"strings"
	"testing"

	"enthalpath/thermo/gibbs"
)

// decomposition returns the crossing temperature of the gas-releasing
// decomposition of formula.
func decomposition(t *testing.T, a *Analyst, formula string, opt StabilityOptions) (float64, *Stability) {
	t.Helper()
	st, err := a.Stability(formula, opt)
	if err != nil {
		t.Fatalf("%s: %v", formula, err)
	}
	for _, r := range st.Reactions {
		if r.Kind == "decomposition" {
			if r.Crossing == nil {
				t.Fatalf("%s: %s has no crossing: %s", formula, r.Equation, r.NoCrossing)
			}
			return r.Crossing.Temperature, st
		}
	}
	t.Fatalf("%s: no decomposition among %d reactions; notes %q", formula, len(st.Reactions), st.Notes)
	return 0, nil
}

// Decomposition temperatures of the alkaline-earth carbonates at 1 bar CO₂
// from measured data (NBS fixture): the known order of thermal stability,
// Mg < Ca < Sr < Ba (fact of the trade), and CaCO₃ between 1050 and
// 1250 K (handbook value about 1170 K, 898 °C at 1 atm; from memory).
func TestCarbonateDecompositionMeasured(t *testing.T) {
	for name, a := range map[string]*Analyst{"NBS fixture": nbsAnalyst(t), "the data": testAnalyst(t)} {
		t.Run(name, func(t *testing.T) { carbonatesMeasured(t, a) })
	}
}

func carbonatesMeasured(t *testing.T, a *Analyst) {
	var prev float64
	for _, f := range []string{"MgCO3", "CaCO3", "SrCO3", "BaCO3"} {
		tk, st := decomposition(t, a, f, StabilityOptions{})
		t.Logf("%s: %.0f K (%s)", f, tk, st.Reactions[0].Equation)
		if !st.Compound.Known || st.Compound.Formation.Value == 0 {
			t.Errorf("%s: not read as the measured compound: %+v", f, st.Compound)
		}
		if tk <= prev {
			t.Errorf("%s decomposes at %.0f K, not above the previous carbonate's %.0f K", f, tk, prev)
		}
		if f == "CaCO3" && (tk < 1050 || tk > 1250) {
			t.Errorf("CaCO3 decomposes at %.0f K, want 1050–1250 K", tk)
		}
		prev = tk
	}
}

// At room temperature calcite is stable against CO₂ loss beyond 2σ (NBS
// values: ΔrG°(298.15) = −604.03 − 394.359 + 1128.79 = 130.4 kJ/mol).
func TestCalciteAtRoomTemperature(t *testing.T) {
	a := nbsAnalyst(t)
	st, err := a.Stability("CaCO3", StabilityOptions{})
	if err != nil {
		t.Fatal(err)
	}
	r := st.Reactions[0]
	if r.Verdict != gibbs.Disfavoured || !near(r.Gibbs, 130.4, 0.6) {
		t.Errorf("%s: ΔrG %.1f ± %.1f (%v), want 130.4 disfavoured", r.Equation, r.Gibbs, r.GibbsUncertainty, r.Verdict)
	}
	if r.Equation != "CaCO3 -> CaO + CO2(g)" {
		t.Errorf("equation %q", r.Equation)
	}
	if len(st.Curves) != 1 || len(st.Curves[0]) != DefaultCurvePoints {
		t.Errorf("curves %d", len(st.Curves))
	}
}

// scan Ti Cl names TiCl₄ as the molecular liquid it is, with its measured
// ΔfH° −804.2 and ΔfG° −737.2 kJ/mol (NBS 1982, line 7055 of the pinned
// copy), and never as the ionic solid of the estimate.
func TestScanTiClMolecular(t *testing.T) {
	for name, a := range map[string]*Analyst{"NBS fixture": nbsAnalyst(t), "the data": testAnalyst(t)} {
		t.Run(name, func(t *testing.T) { tiClMolecular(t, a) })
	}
}

func tiClMolecular(t *testing.T, a *Analyst) {
	sc, err := a.Scan("Ti", "Cl", ScanOptions{})
	if err != nil {
		t.Fatal(err)
	}
	var found bool
	for _, c := range sc.Compounds {
		if c.Formula != "TiCl4" {
			continue
		}
		found = true
		th := c.Thermo
		if !th.Known || !th.Molecular || th.State != "l" {
			t.Errorf("TiCl4 compared as %+v, want the measured molecular liquid", th)
		}
		if !near(th.Formation.Value, -804.2, 1e-9) || !near(th.Gibbs.Value, -737.2, 1e-9) || !th.Gibbs.Measured {
			t.Errorf("TiCl4: ΔfH° %v, ΔfG° %v", th.Formation, th.Gibbs)
		}
		if !c.FromData || c.Formation != -804.2 {
			t.Errorf("TiCl4 formation compared %.1f (from data %v)", c.Formation, c.FromData)
		}
		if c.Estimated.Known || c.Estimated.Molecular {
			t.Errorf("the ionic estimate is labelled as the real compound: %+v", c.Estimated)
		}
		if !near(c.Gibbs, -737.2, 1e-9) {
			t.Errorf("ΔfG(298.15 K) of TiCl4 %.1f, want the measured −737.2", c.Gibbs)
		}
		named := false
		for _, n := range c.Notes {
			if strings.Contains(n, "molecular liquid") && strings.Contains(n, "not of the real compound") {
				named = true
			}
		}
		if !named {
			t.Errorf("no note names TiCl4 a molecular liquid: %q", c.Notes)
		}
		// TiCl4 → TiCl3 + ½Cl2: ΔrH° = −720.9 + 804.2 = 83.3 kJ/mol (NBS): not a loss of Cl2.
		if c.LosesNonMetal {
			t.Errorf("TiCl4 said to give off Cl2 (forming %s)", c.LowerState)
		}
	}
	if !found {
		t.Fatal("no TiCl4 in the scan")
	}
}

// scan Cs F never calls 2 CsF₂ → CsF + CsF₃ favoured at −317 ± 474 kJ/mol:
// undecided or disfavoured (the 2σ rule).
func TestScanCsFNotFavoured(t *testing.T) {
	for _, a := range []*Analyst{testAnalyst(t), nbsAnalyst(t)} {
		sc, err := a.Scan("Cs", "F", ScanOptions{})
		if err != nil {
			t.Fatal(err)
		}
		n := 0
		for _, d := range sc.Disproportionations {
			if d.Reaction != "2 CsF2 -> CsF + CsF3" {
				continue
			}
			n++
			if d.Favoured || d.Energies.Verdict == gibbs.Favoured {
				t.Errorf("%s called favoured at %.0f ± %.0f (ΔrG %.0f ± %.0f)", d.Reaction, d.Enthalpy, d.Uncertainty, d.Energies.Gibbs, d.Energies.GibbsUncertainty)
			}
		}
		if n != 1 {
			t.Errorf("2 CsF2 -> CsF + CsF3 found %d times", n)
		}
		for _, c := range sc.Compounds {
			if (c.Formula == "CsF2" || c.Formula == "CsF3") && c.Stable && !c.Undecided && !c.LosesNonMetal {
				t.Errorf("%s neither undecided nor disfavoured", c.Formula)
			}
		}
	}
}

// estimatedCarbonates returns the decomposition temperatures of the four
// carbonates at 1 bar from the estimate alone: the carbonate and its oxide
// both estimated (ΔfH° from one lattice model, ReactionModel, with the
// data's family-fitted ΔfH°(CO₃²⁻, g) and ΔfH°(O²⁻, g); S° from the
// volume-based line, V_m from their densities or cells); CO₂ keeps its
// measured values (NBS 1982).
func estimatedCarbonates(t *testing.T) map[string]float64 {
	a := nbsAnalyst(t)
	out := map[string]float64{}
	for _, f := range []string{"MgCO3", "CaCO3", "SrCO3", "BaCO3"} {
		tk, st := decomposition(t, a, f, StabilityOptions{EstimateOnly: true})
		if st.Compound.Formation.Measured || st.Compound.Entropy.Measured {
			t.Fatalf("%s: measured values used: %+v", f, st.Compound)
		}
		for _, p := range st.Reactions[0].Products {
			if p.Thermo.State == "cr" && (p.Thermo.Formation.Measured || p.Thermo.Entropy.Measured) {
				t.Fatalf("%s: the oxide's measured values used: %+v", f, p.Thermo)
			}
		}
		out[f] = tk
	}
	return out
}

// From the estimate alone the carbonates keep the order Mg < Ca < Sr < Ba.
func TestCarbonateOrderFromEstimate(t *testing.T) {
	got := estimatedCarbonates(t)
	prev := 0.0
	for _, f := range []string{"MgCO3", "CaCO3", "SrCO3", "BaCO3"} {
		t.Logf("%s: %.0f K from the estimate", f, got[f])
		if got[f] <= prev {
			t.Errorf("%s at %.0f K is not above the previous carbonate's %.0f K", f, got[f], prev)
		}
		prev = got[f]
	}
}

// Each estimated decomposition temperature within 250 K of the
// measured-data one (the bound). Measured when written: 778, 1296,
// 1509, 1757 K against 578, 1157, 1457, 1828 K from measured data with the
// heat capacities (+200, +139, +52, −71 K); the estimates neglect Cp and
// take Kapustinskii, while the data's ΔfH°(CO₃²⁻, g) is fitted over the
// per-compound default models (mostly the volume-based one). With a value
// of −321 kJ/mol (recalled, the one that goes with Jenkins' thermochemical
// radius) and the oxides measured, the estimates came out 1300 K too high.
func TestCarbonateTemperaturesFromEstimate(t *testing.T) {
	got := estimatedCarbonates(t)
	a := nbsAnalyst(t)
	for _, f := range []string{"MgCO3", "CaCO3", "SrCO3", "BaCO3"} {
		want, _ := decomposition(t, a, f, StabilityOptions{})
		if math.Abs(got[f]-want) > 250 {
			failUnlessDensityLoss(t, "carbonate "+f, "%s: %.0f K from the estimate, %.0f K from measured data", f, got[f], want)
		}
	}
}

// The additive estimate beside the volume-based one: over the NBS fixture's
// oxides and carbonates the single-ion contributions reproduce calcite's
// S° = 92.9 J/(mol·K) (NBS line 9555) within twice their RMS residual.
func TestAdditiveEntropyBeside(t *testing.T) {
	a := nbsAnalyst(t)
	st, err := a.Stability("CaCO3", StabilityOptions{})
	if err != nil {
		t.Fatal(err)
	}
	q := st.Compound.AdditiveEntropy
	if !q.Known() || q.Measured {
		t.Fatalf("no additive estimate: %+v", q)
	}
	if math.Abs(q.Value-92.9) > 2*q.Uncertainty+1e-9 {
		t.Errorf("additive S°(CaCO3) %.1f ± %.1f, NBS 92.9", q.Value, q.Uncertainty)
	}
	t.Logf("additive S°(CaCO3) = %.1f ± %.1f J/(mol·K): %s", q.Value, q.Uncertainty, q.Basis)
}

// A compound with a measured ΔfH° but no S° (BaO₂: NBS 1982 gives ΔfH°
// −634.3 kJ/mol and no S°, line 10042 of the pinned copy) keeps its
// measured ΔfH° and takes S° from the volume-based line, so its loss of
// O₂ has a crossing; the reaction is marked as using estimates.
func TestMeasuredEnthalpyEstimatedEntropy(t *testing.T) {
	a := testAnalyst(t)
	st, err := a.Stability("BaO2", StabilityOptions{})
	if err != nil {
		t.Fatal(err)
	}
	c := st.Compound
	if !c.Formation.Measured || !near(c.Formation.Value, -634.3, 1e-9) {
		t.Errorf("ΔfH° %+v", c.Formation)
	}
	if !c.Entropy.Known() || c.Entropy.Measured || !strings.Contains(c.Entropy.Basis, "volume-based") {
		t.Errorf("S° %+v", c.Entropy)
	}
	if len(st.Reactions) != 1 || st.Reactions[0].Crossing == nil || !st.Reactions[0].Estimated {
		t.Fatalf("reactions %+v", st.Reactions)
	}
	t.Logf("%s: ΔrG = 0 at %.0f ± %.0f K", st.Reactions[0].Equation, st.Reactions[0].Crossing.Temperature, st.Reactions[0].Crossing.Uncertainty)
}
