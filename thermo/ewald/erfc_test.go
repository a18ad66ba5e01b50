package ewald

import (
	"math"
	"math/rand"
	"testing"
)

// TestScreened compares the tabulated kernel erfc(x)/x with the standard
// library's math.Erfc (itself accurate to about 1 ulp; the reference here is
// a general-purpose library, not the project), inside the table, at its
// edges and outside it.
func TestScreened(t *testing.T) {
	rng := rand.New(rand.NewSource(1))
	worst, at := 0.0, 0.0
	check := func(x float64) {
		want := math.Erfc(x) / x
		if d := math.Abs(screened(x)-want) / want; d > worst {
			worst, at = d, x
		}
	}
	for i := 0; i < 200000; i++ {
		check(0.01 + rng.Float64()*7.5)
	}
	for _, x := range []float64{1e-3, 0.49999, 0.5, 0.5625, 1, 2.5, screenedUpper - 1e-12, screenedUpper, 10} {
		check(x)
	}
	if worst > 1e-14 {
		t.Errorf("largest relative error of erfc(x)/x against math.Erfc(x)/x: %.3g at x = %g", worst, at)
	}
	t.Logf("largest relative error %.3g at x = %g", worst, at)
}

func BenchmarkScreened(b *testing.B) {
	xs := make([]float64, 1024)
	for i := range xs {
		xs[i] = 0.5 + 4.5*float64(i)/1024
	}
	b.Run("table", func(b *testing.B) {
		s := 0.0
		for i := 0; i < b.N; i++ {
			s += screened(xs[i&1023])
		}
		_ = s
	})
	b.Run("math", func(b *testing.B) {
		s := 0.0
		for i := 0; i < b.N; i++ {
			x := xs[i&1023]
			s += math.Erfc(x) / x
		}
		_ = s
	})
}
