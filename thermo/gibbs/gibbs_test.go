package gibbs

import (
	"errors"
	"math"
	"testing"

	"enthalpath/thermo"
)

// NBS tables (Wagman et al. 1982, the pinned digitised copy
// shared/sources/nbs-tables-1982, lines named per value): ΔfH°, S° at 298.15 K.
// CaCO3 calcite line 9555: −1206.92 kJ/mol, 92.9 J/(mol·K); CaO line 9297:
// −635.09, 39.75; CO2(g) line 1675: −393.509, 213.74.
var calcite = Reaction{
	Enthalpy: -635.09 - 393.509 + 1206.92, EnthalpyUncertainty: 2,
	Entropy: 39.75 + 213.74 - 92.9, EntropyUncertainty: 1,
	GasMoles: 1,
}

func TestCalciteDecomposition(t *testing.T) {
	c, err := calcite.Zero(1)
	if err != nil {
		t.Fatal(err)
	}
	// ΔrH/ΔrS = 178.321/0.16059 = 1110.4 K (from the NBS values above);
	// handbooks give about 1170 K (898 °C) for 1 atm CO2 over calcite,
	// from memory: the Cp neglect explains the rest.
	if math.Abs(c.Temperature-1110.4) > 0.5 {
		t.Errorf("T* = %.2f K, want 1110.4", c.Temperature)
	}
	if c.Below {
		t.Errorf("calcite decomposes on heating, got Below")
	}
	// σ_T from σ_H = 2 kJ/mol and σ_S = 1 J/(mol·K): hypot(2/0.16059, 1110.4·0.001/0.16059) = 14.3 K.
	if math.Abs(c.Uncertainty-14.3) > 0.1 {
		t.Errorf("σ_T = %.2f K, want 14.3", c.Uncertainty)
	}
	g, _ := calcite.Gibbs(c.Temperature, 1)
	if math.Abs(g) > 1e-9 {
		t.Errorf("ΔrG at T* = %g, want 0", g)
	}
}

// A lower partial pressure of the gas given off lowers the crossing
// (Le Chatelier): property test over pressures.
func TestCrossingFallsWithPressure(t *testing.T) {
	prev := math.Inf(1)
	for _, p := range []float64{10, 1, 0.1, 1e-2, 1e-3, 3e-4} {
		c, err := calcite.Zero(p)
		if err != nil {
			t.Fatal(err)
		}
		if !(c.Temperature < prev) {
			t.Errorf("p = %g bar: T* = %.1f K not below %.1f K", p, c.Temperature, prev)
		}
		g, _ := calcite.Gibbs(c.Temperature, p)
		if math.Abs(g) > 1e-9 {
			t.Errorf("p = %g bar: ΔrG(T*) = %g", p, g)
		}
		prev = c.Temperature
	}
}

func TestNoCrossing(t *testing.T) {
	for _, tc := range []struct {
		r    Reaction
		sign int
	}{
		{Reaction{Enthalpy: -10, Entropy: 5}, -1},
		{Reaction{Enthalpy: 10, Entropy: -5}, 1},
		{Reaction{}, 0},
	} {
		_, err := tc.r.Zero(1)
		var nc *NoCrossingError
		if !errors.As(err, &nc) || nc.Sign != tc.sign {
			t.Errorf("%v: err %v, want sign %d", tc.r, err, tc.sign)
		}
	}
	// ΔrH < 0 and ΔrS < 0: goes below the crossing.
	c, err := Reaction{Enthalpy: -100, Entropy: -200}.Zero(1)
	if err != nil || !c.Below || math.Abs(c.Temperature-500) > 1e-9 {
		t.Errorf("got %+v, %v; want 500 K below", c, err)
	}
}

func TestCurve(t *testing.T) {
	pts := calcite.Curve(300, 1500, 5, 1)
	if len(pts) != 5 || pts[0].Temperature != 300 || pts[4].Temperature != 1500 {
		t.Fatalf("curve %+v", pts)
	}
	for i := 1; i < len(pts); i++ {
		// ΔrS > 0: ΔrG falls with T, by ΔrS·ΔT exactly (Cp neglected).
		want := -(pts[i].Temperature - pts[i-1].Temperature) * calcite.Entropy / 1000
		if d := pts[i].Gibbs - pts[i-1].Gibbs; math.Abs(d-want) > 1e-9 {
			t.Errorf("step %d: ΔG changed by %g, want %g", i, d, want)
		}
		if pts[i].Uncertainty < pts[i-1].Uncertainty {
			t.Errorf("σ falls with T at step %d", i)
		}
	}
	if got := calcite.Curve(400, 900, 1, 1); len(got) != 1 || got[0].Temperature != 400 {
		t.Errorf("n=1: %+v", got)
	}
}

// The 2σ rule of the issue: −317 ± 474 (the CsF₂ disproportionation the
// scan once called favoured) is undecided.
func TestJudge(t *testing.T) {
	for _, tc := range []struct {
		v, s float64
		want Verdict
	}{
		{-317, 474, Undecided},
		{-317, 150, Favoured},
		{-317, 160, Undecided},
		{317, 150, Disfavoured},
		{0, 0, Undecided},
		{-1, 0, Favoured},
		{math.NaN(), 1, Undecided},
		{-5, math.NaN(), Undecided},
	} {
		if got := Judge(tc.v, tc.s); got != tc.want {
			t.Errorf("Judge(%g, %g) = %v, want %v", tc.v, tc.s, got, tc.want)
		}
	}
	if Undecided.String() != "undecided within the data" {
		t.Errorf("wording %q", Undecided)
	}
}

// With a constant ΔrCp the Kirchhoff relations are exact:
// ΔrH(T) = ΔrH° + ΔCp(T − T°), ΔrS(T) = ΔrS° + ΔCp·ln(T/T°) (any
// thermodynamics text). A chain with a₃ alone (Cp = a₃R, b₁ and b₂ free)
// must give them, and Zero must find the root of the exact ΔrG(T).
func TestHeatCapacityConstantCp(t *testing.T) {
	const r = thermo.GasConstant
	flat := func(a3, b1, b2 float64) Chain {
		return Chain{{TLow: 200, THigh: 6000, A: [7]float64{0, 0, a3}, B1: b1, B2: b2}}
	}
	// Product Cp 5R, reactant Cp 3R: ΔCp = 2R (one mole each).
	rx := Reaction{Enthalpy: 150, Entropy: 140, GasMoles: 1,
		HeatCapacity: []Species{{Coefficient: -1, Chain: flat(3, -100, 7)}, {Coefficient: 1, Chain: flat(5, 250, -3)}}}
	t0 := thermo.StandardTemperature
	exact := func(temp float64) float64 {
		dcp := 2 * r
		return rx.Enthalpy + dcp*(temp-t0)/1000 - temp*(rx.Entropy+dcp*math.Log(temp/t0))/1000
	}
	for _, temp := range []float64{298.15, 500, 1000, 2500} {
		if g, _ := rx.Gibbs(temp, 1); math.Abs(g-exact(temp)) > 1e-9 {
			t.Errorf("ΔrG(%g K) = %.9f, exact %.9f", temp, g, exact(temp))
		}
	}
	c, err := rx.Zero(1)
	if err != nil {
		t.Fatal(err)
	}
	if math.Abs(exact(c.Temperature)) > 1e-6 || c.Below {
		t.Errorf("crossing %.6f K: exact ΔrG there %.3g", c.Temperature, exact(c.Temperature))
	}
	// Beyond the chains' range (6000 K) no crossing: the error names the range.
	rx.Enthalpy = 5000
	var nc *NoCrossingError
	if _, err := rx.Zero(1); !errors.As(err, &nc) || nc.Hi != 6000 || nc.Sign != 1 {
		t.Errorf("no crossing within the range: %v", err)
	}
}
