package ewald

import (
	"fmt"
	"math"
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
// on the small path (target ≤ 5 µs per evaluation).
func BenchmarkRockSalt(b *testing.B) {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		b.Fatal(err)
	}
	benchSum(b, c, Options{})
}

// BenchmarkRockSaltGeneral: the same cell kept on the general path, for the
// ratio of the two paths measured in one run.
func BenchmarkRockSaltGeneral(b *testing.B) {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		b.Fatal(err)
	}
	benchSum(b, c, Options{general: true})
}

// BenchmarkSmallTermCost is the calibration of smallAlpha: on the primitive
// cells of rock salt, fluorite, wurtzite and perovskite (2, 3, 4 and 5
// sites) at the α the small path chooses and 1e-10, it times the two sums
// of the small path separately and reports the cost of one real-space term
// as Result.RealTerms counts them (ns/real-term) and of one k-vector of the
// half space (ns/k-vector). Under valgrind --tool=cachegrind with a fixed
// -test.benchtime the same runs give instructions per term.
func BenchmarkSmallTermCost(b *testing.B) {
	for _, name := range []string{"rock-salt", "fluorite", "wurtzite", "perovskite"} {
		c, err := crystal.Build(name, nil)
		if err != nil {
			b.Fatal(err)
		}
		full := newSystem(c, true)
		s := full
		if prim, ok := full.primitive(); ok {
			s = prim
		}
		n := len(s.q)
		alpha := smallAlpha(n, s.volume)
		p := math.Sqrt(-math.Log(DefaultAccuracy / 2))
		rc, kc := p/alpha, 2*alpha*p
		phi := make([]float64, n)
		b.Run(fmt.Sprintf("%s/real/N=%d", name, n), func(b *testing.B) {
			terms := 0
			for i := 0; i < b.N; i++ {
				terms, _, _, _ = s.realSmall(alpha, rc, phi)
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(terms), "ns/real-term")
		})
		b.Run(fmt.Sprintf("%s/recip/N=%d", name, n), func(b *testing.B) {
			vectors := 0
			for i := 0; i < b.N; i++ {
				vectors, _ = s.reciprocalPairs(alpha, kc, phi)
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(vectors), "ns/k-vector")
		})
	}
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

// BenchmarkTermCost is the calibration of the splitting parameter (see
// realToRecipCost): it times the two sums of Sum separately at the α Sum
// chooses at 1e-10, on a 2-ion cell (caesium chloride) and on displaced
// rock-salt supercells of 216, 1,000 and 4,096 ions, and reports the cost of
// one real-space term (ns/real-term: one ordered pair-image within the
// cut-off, with its share of the distance checks, the kernel and the
// potentials) and of the reciprocal sum per k-vector (ns/k-vector) and per
// k-vector and site (ns/recip-site-term). The reciprocal cost is c₀ + c₁·N
// per k-vector: c₁ from the large cells, c₀ from the 2-ion one. The name
// says which real-space path ran: one image per pair (min-image), the
// sorted list of translations (listed) or the image box of each pair
// (searched).
func BenchmarkTermCost(b *testing.B) {
	cells := []*crystal.Crystal{}
	cs, err := crystal.Build("caesium-chloride", nil)
	if err != nil {
		b.Fatal(err)
	}
	cells = append(cells, cs)
	for _, n := range []int{3, 5, 8} {
		cells = append(cells, rockSaltSupercell(b, n, 0.02))
	}
	for _, c := range cells {
		s := newSystem(c, false)
		p := math.Sqrt(-math.Log(DefaultAccuracy / 2))
		alpha := s.chooseAlpha(p)
		rc, kc := p/alpha, 2*alpha*p
		path := "listed"
		switch {
		case s.oneImage(rc):
			path = "min-image"
		case len(s.q) < listedImages:
			path = "searched"
		}
		phi := make([]float64, len(s.q))
		b.Run(fmt.Sprintf("real/N=%d/%s", len(s.q), path), func(b *testing.B) {
			terms := 0
			for i := 0; i < b.N; i++ {
				terms, _, _, _ = s.realSpace(alpha, rc, phi)
			}
			b.ReportMetric(float64(b.Elapsed().Nanoseconds())/float64(b.N)/float64(terms), "ns/real-term")
		})
		b.Run(fmt.Sprintf("recip/N=%d", len(s.q)), func(b *testing.B) {
			vectors := 0
			for i := 0; i < b.N; i++ {
				vectors = s.reciprocalSpace(alpha, kc, phi)
			}
			perVector := float64(b.Elapsed().Nanoseconds()) / float64(b.N) / float64(vectors)
			b.ReportMetric(perVector, "ns/k-vector")
			b.ReportMetric(perVector/float64(len(s.q)), "ns/recip-site-term")
		})
	}
}
