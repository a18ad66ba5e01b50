package ewald

import (
	"math"
	"math/rand"
	"testing"

	"enthalpath/thermo/crystal"
)

// TestReciprocalSmallEqualsGeneral: on random neutral cells of 2 to
// structureSites sites (random lattice shapes, positions and charges,
// several splitting parameters), the small-cell reciprocal sum by
// structure factors gives the same potentials as the general one to 1e-12
// of the largest of them, and so does the one on pairs (reciprocalPairs)
// on cells of up to smallSites sites, also where sites lie half a lattice
// vector apart (the sign shortcut of halfPairs). The reference is the
// package's general path, itself checked against pymatgen in
// reference_test.go.
func TestReciprocalSmallEqualsGeneral(t *testing.T) {
	t.Run("structure factors", func(t *testing.T) {
		checkReciprocalSmall(t, structureSites, false, (*system).reciprocalSmall)
	})
	t.Run("pairs", func(t *testing.T) {
		checkReciprocalSmall(t, smallSites, false, (*system).reciprocalPairs)
	})
	t.Run("pairs half a lattice vector apart", func(t *testing.T) {
		checkReciprocalSmall(t, smallSites, true, (*system).reciprocalPairs)
	})
}

// checkReciprocalSmall compares small with the general path on 300 random
// cells; with halves, most sites after the first lie half a lattice vector
// (e/2, e in {0, 1}³ but 0) from an earlier site.
func checkReciprocalSmall(t *testing.T, maxSites int, halves bool, small func(*system, float64, float64, []float64) (int, bool)) {
	rng := rand.New(rand.NewSource(19))
	checked := 0
	for trial := 0; trial < 300; trial++ {
		n := 2 + rng.Intn(maxSites-1)
		var place func(int, []crystal.Site, crystal.Vec3) crystal.Vec3
		if halves {
			place = func(j int, before []crystal.Site, f crystal.Vec3) crystal.Vec3 {
				if j > 0 && rng.Intn(4) > 0 {
					e := 1 + rng.Intn(7)
					f = before[rng.Intn(j)].Frac.Add(crystal.Vec3{0.5 * float64(e&1), 0.5 * float64(e>>1&1), 0.5 * float64(e>>2)})
				}
				return f
			}
		}
		c := randomSmallCellPlaced(rng, n, place)
		s := newSystem(c, false)
		alpha := s.balancedAlpha() * (0.7 + 0.6*rng.Float64())
		p := math.Sqrt(-math.Log(DefaultAccuracy / 2))
		kc := 2 * alpha * p
		got := make([]float64, n)
		count, ok := small(s, alpha, kc, got)
		if !ok {
			continue // indices beyond smallOrder: the general path only
		}
		general := make([]float64, n)
		want := s.reciprocalGeneral(alpha, kc, general)
		if count != want {
			t.Errorf("trial %d (%d sites): %d k-vectors, general path %d", trial, n, count, want)
		}
		scale := 0.0
		for _, v := range general {
			scale = math.Max(scale, math.Abs(v))
		}
		for j := range general {
			if d := math.Abs(got[j] - general[j]); !(d <= 1e-12*scale) {
				t.Errorf("trial %d (%d sites), site %d: small path %.17g, general %.17g (difference %.3g of %.3g)",
					trial, n, j, got[j], general[j], d, scale)
			}
		}
		checked++
	}
	if checked < 200 {
		t.Errorf("only %d of 300 random cells took the small-cell path", checked)
	}
}

// TestReciprocalSmallDeclines: a cell of more than structureSites sites is
// left to the general path, with phi untouched.
func TestReciprocalSmallDeclines(t *testing.T) {
	c := rockSaltSupercell(t, 2, 0.02) // 64 ions, no internal translations
	s := newSystem(c, false)
	phi := make([]float64, len(s.q))
	if _, ok := s.reciprocalSmall(s.balancedAlpha(), 5, phi); ok {
		t.Fatalf("a %d-site cell took the small-cell path", len(s.q))
	}
	for j, v := range phi {
		if v != 0 {
			t.Fatalf("phi[%d] = %g after a declined small-cell sum", j, v)
		}
	}
}
