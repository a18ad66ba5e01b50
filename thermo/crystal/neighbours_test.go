package crystal

import (
	"errors"
	"fmt"
	"math"
	"runtime"
	"testing"
)

// bruteMeanDistance is the definition of MeanCationAnionDistance evaluated
// by walking every lattice image in a box wide enough for the shell (the
// walk the grid search replaced): a reference for small cells only.
func bruteMeanDistance(c *Crystal) float64 {
	r := c.reduced()
	sum, n := 0.0, 0
	for _, sp := range r.Sites {
		if !(sp.Charge > 0) {
			continue
		}
		var ds []float64
		for _, sq := range r.Sites {
			if !(sq.Charge < 0) {
				continue
			}
			df := sq.Frac.Sub(sp.Frac)
			const m = 3
			for n0 := -m; n0 <= m; n0++ {
				for n1 := -m; n1 <= m; n1++ {
					for n2 := -m; n2 <= m; n2++ {
						f := Vec3{df[0] + float64(n0), df[1] + float64(n1), df[2] + float64(n2)}
						ds = append(ds, r.Cartesian(f).Norm())
					}
				}
			}
		}
		nearest := math.Inf(1)
		for _, d := range ds {
			nearest = math.Min(nearest, d)
		}
		for _, d := range ds {
			if d <= nearest*(1+CoordinationShellTolerance) {
				sum += d
				n++
			}
		}
	}
	return sum / float64(n)
}

// TestMeanDistanceAgainstImageWalk: the grid search gives the shell mean
// of an exhaustive image walk (±3 cells, far more than any prototype's shell
// needs) for every prototype, on its cell and on supercells, where the
// mean must not change (a supercell has the same bonds).
func TestMeanDistanceAgainstImageWalk(t *testing.T) {
	for _, p := range Prototypes() {
		c, err := Build(p.Name, nil)
		if err != nil {
			t.Fatal(err)
		}
		want := bruteMeanDistance(c)
		for _, n := range [][3]int{{1, 1, 1}, {2, 2, 2}, {3, 1, 2}} {
			s, err := c.Supercell(n[0], n[1], n[2])
			if err != nil {
				t.Fatal(err)
			}
			got, err := s.MeanCationAnionDistance()
			if err != nil || math.Abs(got-want) > 1e-12*want {
				t.Errorf("%s %v: mean distance %.15f (%v), image walk on the cell %.15f", p.Name, n, got, err, want)
			}
		}
	}
}

// TestMeanDistanceWorkGrowsWithSites: the grid-cell images examined per
// cation stay the same from the cell to a 4,096-ion supercell (the walk it
// replaced grew with the number of sites squared).
func TestMeanDistanceWorkGrowsWithSites(t *testing.T) {
	c, err := Build("rock-salt", nil)
	if err != nil {
		t.Fatal(err)
	}
	var perCation []float64
	for _, n := range []int{1, 2, 4, 8} {
		s, err := c.Supercell(n, n, n)
		if err != nil {
			t.Fatal(err)
		}
		_, visits, err := s.meanCationAnionDistance()
		if err != nil {
			t.Fatal(err)
		}
		perCation = append(perCation, float64(visits)/float64(len(s.Sites)/2))
	}
	for k, v := range perCation {
		// 125 = 5³ grid cells around each cation: a bound, common practice
		// for a grid of about one candidate per cell, no source.
		if v > 125 {
			t.Errorf("supercell %d: %.1f grid-cell images per cation (all: %v)", k, v, perCation)
		}
	}
}

// TestHostileNeedleCell: a = b = 0.6 Å, c = 9999 Å with a cation and an
// anion half a cell apart along c puts about 7·10⁷ anion images in the
// first shell. It must be refused with a *ShellError within
// MaxNeighbourVisits grid-cell images and little memory (the image walk
// it replaced took 69–90 s and 4.7 GB).
func TestHostileNeedleCell(t *testing.T) {
	for _, anion := range []Vec3{{0.5, 0.5, 0.5}, {0, 0, 0.5}, {0.5, 0, 0.25}} {
		c := &Crystal{Name: "needle", FormulaUnits: 1,
			Lattice: [3]Vec3{{0.6, 0, 0}, {0, 0.6, 0}, {0, 0, 9999}},
			Sites:   []Site{{Species: "Na", Charge: 1}, {Species: "Cl", Charge: -1, Frac: anion}}}
		var before, after runtime.MemStats
		runtime.GC()
		runtime.ReadMemStats(&before)
		mean, visits, err := c.meanCationAnionDistance()
		runtime.ReadMemStats(&after)
		t.Logf("anion at %v: %d grid-cell images, %d bytes: %v", anion, visits, after.TotalAlloc-before.TotalAlloc, err)
		var se *ShellError
		if !errors.As(err, &se) || !errors.Is(err, ErrUnboundedShell) || !math.IsNaN(mean) {
			t.Errorf("anion at %v: mean %g, error %v; want NaN and a *ShellError", anion, mean, err)
		}
		if visits > MaxNeighbourVisits {
			t.Errorf("anion at %v: %d grid-cell images examined, bound %d", anion, visits, MaxNeighbourVisits)
		}
		// 1 MiB: the grid, the cell and a shell buffer are a few kB.
		if alloc := after.TotalAlloc - before.TotalAlloc; alloc > 1<<20 {
			t.Errorf("anion at %v: allocated %d bytes", anion, alloc)
		}
	}
}

func BenchmarkMeanDistance(b *testing.B) {
	c, err := Build("rock-salt", nil)
	if err != nil {
		b.Fatal(err)
	}
	for _, n := range []int{1, 4, 8} {
		s, _ := c.Supercell(n, n, n)
		b.Run(fmt.Sprintf("N=%d", len(s.Sites)), func(b *testing.B) {
			b.ReportAllocs()
			for i := 0; i < b.N; i++ {
				if _, err := s.MeanCationAnionDistance(); err != nil {
					b.Fatal(err)
				}
			}
		})
	}
}
