package ewald

import (
	"math"
	"math/rand"
	"testing"
)

// TestFastErfc compares the one-exponential erfc with the standard
// library's math.Erfc (itself accurate to about 1 ulp; the reference here is
// a general-purpose library, not the project).
func TestFastErfc(t *testing.T) {
	rng := rand.New(rand.NewSource(1))
	worst := 0.0
	for i := 0; i < 200000; i++ {
		x := rng.Float64() * 7
		want := math.Erfc(x)
		got := erfc(x)
		if d := math.Abs(got-want) / want; d > worst {
			worst = d
		}
	}
	for _, x := range []float64{0, 0.5, 1, 2.5, 6.49999, 6.5, 10} {
		if d := math.Abs(erfc(x)-math.Erfc(x)) / math.Erfc(x); d > worst {
			worst = d
		}
	}
	if worst > 1e-14 {
		t.Errorf("largest relative error of erfc against math.Erfc: %.3g", worst)
	}
	t.Logf("largest relative error %.3g", worst)
}

func BenchmarkErfc(b *testing.B) {
	xs := make([]float64, 1024)
	for i := range xs {
		xs[i] = 0.5 + 4.5*float64(i)/1024
	}
	b.Run("fast", func(b *testing.B) {
		s := 0.0
		for i := 0; i < b.N; i++ {
			s += erfc(xs[i&1023])
		}
		_ = s
	})
	b.Run("math", func(b *testing.B) {
		s := 0.0
		for i := 0; i < b.N; i++ {
			s += math.Erfc(xs[i&1023])
		}
		_ = s
	})
}
