package ewald

import (
	"fmt"
	"math/rand"
	"testing"

	"enthalpath/thermo/crystal"
)

// rockSaltSupercell returns the n×n×n supercell of the conventional rock-salt
// cell (8n³ ions); with jitter > 0 every ion is displaced at random by up to
// ±jitter/2 in each fractional coordinate of the original cell, which
// removes all internal translations (the general, unsymmetric case).
func rockSaltSupercell(b testing.TB, n int, jitter float64) *crystal.Crystal {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		b.Fatal(err)
	}
	if c, err = c.Supercell(n, n, n); err != nil {
		b.Fatal(err)
	}
	rng := rand.New(rand.NewSource(int64(n)))
	for k := range c.Sites {
		for d := 0; d < 3; d++ {
			c.Sites[k].Frac[d] += jitter * (rng.Float64() - 0.5) / float64(n)
		}
	}
	return c
}

func benchSum(b *testing.B, c *crystal.Crystal, opt Options) {
	b.Helper()
	b.ReportAllocs()
	var r Result
	var err error
	for i := 0; i < b.N; i++ {
		r, err = Sum(c, opt)
	}
	if err != nil {
		b.Fatal(err)
	}
	b.ReportMetric(float64(len(c.Sites)), "ions")
	b.ReportMetric(r.EstimatedError/1e-12, "est-rel-err/1e-12")
}

// BenchmarkRockSalt: conventional 8-ion cell at the default accuracy 1e-10
// (target ≤ 50 µs per evaluation).
func BenchmarkRockSalt(b *testing.B) {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		b.Fatal(err)
	}
	benchSum(b, c, Options{})
}

// BenchmarkPrototypes: every built-in prototype at 1e-10.
func BenchmarkPrototypes(b *testing.B) {
	for _, p := range crystal.Prototypes() {
		c, err := crystal.Build(p.Name, nil)
		if err != nil {
			b.Fatal(err)
		}
		b.Run(p.Name, func(b *testing.B) { benchSum(b, c, Options{}) })
	}
}

// BenchmarkSupercell1000: 1,000 ions (5×5×5 rock salt) at 1e-10, perfect
// (internal translations exploited) and displaced (none to exploit);
// target ≤ 100 ms.
func BenchmarkSupercell1000(b *testing.B) {
	b.Run("perfect", func(b *testing.B) { benchSum(b, rockSaltSupercell(b, 5, 0), Options{}) })
	b.Run("displaced", func(b *testing.B) { benchSum(b, rockSaltSupercell(b, 5, 0.02), Options{}) })
}

// BenchmarkScaling: displaced rock-salt supercells from 64 to 4,096 ions at
// 1e-10; the balanced Ewald sum should grow about as N^1.5.
func BenchmarkScaling(b *testing.B) {
	for _, n := range []int{2, 3, 4, 5, 6, 8} {
		c := rockSaltSupercell(b, n, 0.02)
		b.Run(fmt.Sprintf("N=%d", len(c.Sites)), func(b *testing.B) { benchSum(b, c, Options{}) })
	}
}
