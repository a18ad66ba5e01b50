package analysis

import (
	"errors"
	"math"
	"strings"
	"testing"

	"enthalpath/thermo/lattice"
)

// TestFitRadiusIsLeastSquares: the fitted radius is the minimum of the sum
// of squared misfits (properties of least squares, no outside source): it
// lies within the one-salt radii, the normal equation Σ misfit·∂U/∂r = 0
// holds there, and moving it either way makes the sum larger.
func TestFitRadiusIsLeastSquares(t *testing.T) {
	a := testAnalyst(t)
	hb := lattice.KapustinskiiConstants{K: lattice.KapustinskiiKHandbook, D: lattice.KapustinskiiD}
	for _, ion := range []string{"NO3-", "OH-", "O2^-", "NH4+", "N3^-"} {
		f, err := a.FitRadius(ion, FitOptions{})
		if err != nil {
			t.Fatalf("%s: %v", ion, err)
		}
		used := f.Used()
		if len(used) < 2 {
			t.Fatalf("%s: %d salts used; the test needs two or more", ion, len(used))
		}
		energy := func(s SaltRadius, r float64) float64 {
			rc, ra := s.CounterRadius.Value, r
			if strings.HasSuffix(ion, "+") {
				rc, ra = r, s.CounterRadius.Value
			}
			u, err := hb.Energy(s.Nu, s.ZCation, s.ZAnion, rc, ra)
			if err != nil {
				t.Fatalf("%s %s: %v", ion, s.Formula, err)
			}
			return u
		}
		cost := func(r float64) (sum, grad float64) {
			const h = 1e-6
			for _, s := range used {
				d := energy(s, r) - s.LatticeEnergy
				sum += d * d
				grad += d * (energy(s, r+h) - energy(s, r-h)) / (2 * h)
			}
			return sum, grad
		}
		lo, hi := used[0].Radius, used[0].Radius
		for _, s := range used {
			lo, hi = min(lo, s.Radius), max(hi, s.Radius)
			if !near(energy(s, s.Radius), s.LatticeEnergy, 1e-6) {
				t.Errorf("%s %s: the one-salt radius %.4f Å gives U = %.3f, not the salt's %.3f", ion, s.Formula, s.Radius, energy(s, s.Radius), s.LatticeEnergy)
			}
		}
		if f.Radius < lo || f.Radius > hi {
			t.Errorf("%s: fitted %.4f Å outside the one-salt radii [%.4f, %.4f]", ion, f.Radius, lo, hi)
		}
		c0, g := cost(f.Radius)
		// |∂S/∂r| relative to the scale of S/r: zero at the minimum.
		if rel := g * f.Radius / max(c0, 1); rel > 1e-3 || rel < -1e-3 {
			t.Errorf("%s: normal equation not met at r = %.5f Å: Σ misfit·∂U/∂r = %.3g (S = %.3g)", ion, f.Radius, g, c0)
		}
		for _, dr := range []float64{-0.01, 0.01} {
			if c, _ := cost(f.Radius + dr); !(c > c0) {
				t.Errorf("%s: S(r%+.2f) = %.4g not above S(r) = %.4g", ion, dr, c, c0)
			}
		}
		if !f.HasSpread || f.SD <= 0 || !near(f.SE, f.SD/math.Sqrt(float64(len(used))), 1e-12) {
			t.Errorf("%s: SD %.4f, SE %.4f over %d salts", ion, f.SD, f.SE, len(used))
		}
	}
}

// TestFitRadiusOneSalt: limited to one counter-ion, the fit is that salt's
// own derived radius (an identity with DeriveRadius), and a given counter
// radius is used.
func TestFitRadiusOneSalt(t *testing.T) {
	a := testAnalyst(t)
	f, err := a.FitRadius("NO3-", FitOptions{Only: []string{"K+"}, CounterRadii: map[string]float64{"K+": 1.33}})
	if err != nil {
		t.Fatal(err)
	}
	d, err := a.DeriveRadius("KNO3", RadiusOptions{Ion: "NO3-", CounterRadius: 1.33})
	if err != nil {
		t.Fatal(err)
	}
	if u := f.Used(); len(u) != 1 || u[0].Formula != "KNO3" || u[0].CounterRadius.Value != 1.33 {
		t.Fatalf("used %+v, want KNO3 alone with K+ at 1.33 Å", u)
	}
	if !near(f.Radius, d.KapustinskiiHandbook, 1e-7) || f.SD != 0 || f.HasSpread {
		t.Errorf("fit over KNO3 alone: %.6f Å (SD %.3g), DeriveRadius %.6f Å", f.Radius, f.SD, d.KapustinskiiHandbook)
	}
}

// TestFitRadiusErrors: refusals name the ion and what is wrong.
func TestFitRadiusErrors(t *testing.T) {
	a := testAnalyst(t)
	cases := []struct {
		ion  string
		opt  FitOptions
		want []string
	}{
		{"Qq-", FitOptions{}, []string{"Qq-", "not an ion"}},
		{"ClO4-", FitOptions{}, []string{"ClO4-", "none of its", "family-fitted", "circular"}},
		{"NO3-", FitOptions{CounterRadii: map[string]float64{"Kx+": 1.3}}, []string{"Kx+", "not an ion"}},
		{"NO3-", FitOptions{CounterRadii: map[string]float64{"K+": -1}}, []string{"K+", "positive"}},
		{"NO3-", FitOptions{Only: []string{"F-"}}, []string{"NO3-", "no compound"}},
	}
	for _, tc := range cases {
		_, err := a.FitRadius(tc.ion, tc.opt)
		if err == nil || !errors.Is(err, ErrBadInput) {
			t.Errorf("%s %+v: error %v, want a bad-input error", tc.ion, tc.opt, err)
			continue
		}
		for _, w := range tc.want {
			if !strings.Contains(err.Error(), w) {
				t.Errorf("%s %+v: %q does not name %q", tc.ion, tc.opt, err, w)
			}
		}
	}
}
