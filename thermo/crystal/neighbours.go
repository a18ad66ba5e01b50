package crystal

import (
	"errors"
	"fmt"
	"math"
)

// MaxNeighbourVisits bounds the work of one neighbour search (periodic
// images of grid cells examined, summed over every centre): far above what
// any real crystal needs (a 10⁴-site cell takes about 10⁶), and reached
// quickly by a needle-shaped cell whose coordination shell would hold
// millions of images (a = b = 0.6 Å, c = 9999 Å).
const MaxNeighbourVisits = 1 << 24

// MaxShellSize is the most anions one cation's first coordination shell may
// hold; real crystals have at most a few dozen.
const MaxShellSize = 256

// ErrUnboundedShell reports a cell whose coordination shells cannot be
// found within MaxNeighbourVisits image visits or hold more than
// MaxShellSize anions: a cell far from any real solid.
var ErrUnboundedShell = errors.New("coordination shell not bounded")

// ShellError says which cation's shell could not be found, and why.
type ShellError struct {
	// Crystal names the structure; Site is the 0-based cation index.
	Crystal string
	Site    int
	Species string
	// Visits is the number of image visits when the search stopped, and
	// Members the anions counted in the shell by then.
	Visits, Members int
}

func (e *ShellError) Error() string {
	return fmt.Sprintf("crystal %q: the first coordination shell of site %d (%s) is not bounded (%d anions, %d periodic images examined): the cell is far from any real solid",
		e.Crystal, e.Site+1, e.Species, e.Members, e.Visits)
}

func (e *ShellError) Unwrap() error { return ErrUnboundedShell }

// neighbourGrid bins a subset of a cell's sites (the candidates) into a
// grid along the axes of a reduced basis, so that a search for the
// candidates within a radius R of a point costs the number of grid cells the
// sphere meets, not the number of sites or of lattice images.
type neighbourGrid struct {
	c      *Crystal // reduced basis, wrapped fractional coordinates
	bwidth [3]float64
	n      [3]int
	start  []int // start[b] … start[b+1]−1 index members of bin b
	member []int // site indices, bin by bin
	visits int   // grid-cell images examined so far
}

// newNeighbourGrid bins the sites of c (already reduced) for which keep is
// true, with about one candidate per bin.
func newNeighbourGrid(c *Crystal, keep func(Site) bool) *neighbourGrid {
	g := &neighbourGrid{c: c}
	var idx []int
	for i, s := range c.Sites {
		if keep(s) {
			idx = append(idx, i)
		}
	}
	recip := c.Reciprocal()
	edge := math.Cbrt(c.Volume() / float64(max(len(idx), 1)))
	for k := 0; k < 3; k++ {
		g.bwidth[k] = recip[k].Norm()
		g.n[k] = int(math.Max(1, math.Min(math.Floor(1/g.bwidth[k]/edge), 1024)))
	}
	// A cell clamped to one bin along a thin axis could otherwise get far
	// more bins than candidates along the others.
	limit := 2*len(idx) + 8
	for g.n[0]*g.n[1]*g.n[2] > limit {
		k := 0
		for m := 1; m < 3; m++ {
			if g.n[m] > g.n[k] {
				k = m
			}
		}
		g.n[k] = (g.n[k] + 1) / 2
	}
	total := g.n[0] * g.n[1] * g.n[2]
	count := make([]int, total+1)
	bins := make([]int, len(idx))
	for m, i := range idx {
		bins[m] = g.binOf(c.Sites[i].Frac)
		count[bins[m]+1]++
	}
	for b := 1; b <= total; b++ {
		count[b] += count[b-1]
	}
	g.start = append([]int(nil), count...)
	g.member = make([]int, len(idx))
	for m, i := range idx {
		g.member[count[bins[m]]] = i
		count[bins[m]]++
	}
	return g
}

func (g *neighbourGrid) binOf(f Vec3) int {
	b := 0
	for k := 0; k < 3; k++ {
		i := min(int(f[k]*float64(g.n[k])), g.n[k]-1)
		b = b*g.n[k] + i
	}
	return b
}

// within calls visit(j, d) for every candidate image at distance d ≤ r
// from fractional point f (wrapped into [0, 1)), the point's own position
// (d = 0) left out. It stops, returning false, when the visits would pass
// MaxNeighbourVisits.
func (g *neighbourGrid) within(f Vec3, r float64, visit func(j int, d float64)) bool {
	var lo, hi [3]int
	cells := 1.0
	for k := 0; k < 3; k++ {
		h := r * g.bwidth[k]
		lo[k] = int(math.Floor((f[k] - h) * float64(g.n[k])))
		hi[k] = int(math.Floor((f[k] + h) * float64(g.n[k])))
		cells *= float64(hi[k] - lo[k] + 1)
	}
	if cells > float64(MaxNeighbourVisits-g.visits) {
		return false
	}
	g.visits += int(cells)
	r2 := r * r
	lat := g.c.Lattice
	for t0 := lo[0]; t0 <= hi[0]; t0++ {
		b0, s0 := floorDivMod(t0, g.n[0])
		for t1 := lo[1]; t1 <= hi[1]; t1++ {
			b1, s1 := floorDivMod(t1, g.n[1])
			for t2 := lo[2]; t2 <= hi[2]; t2++ {
				b2, s2 := floorDivMod(t2, g.n[2])
				b := (b0*g.n[1]+b1)*g.n[2] + b2
				for _, j := range g.member[g.start[b]:g.start[b+1]] {
					fj := g.c.Sites[j].Frac
					df := Vec3{fj[0] + float64(s0) - f[0], fj[1] + float64(s1) - f[1], fj[2] + float64(s2) - f[2]}
					v := lat[0].Scale(df[0]).Add(lat[1].Scale(df[1])).Add(lat[2].Scale(df[2]))
					if d2 := v.Dot(v); d2 <= r2 && d2 > 0 {
						visit(j, math.Sqrt(d2))
					}
				}
			}
		}
	}
	return true
}

// floorDivMod returns t mod n in [0, n) and the floor of t/n.
func floorDivMod(t, n int) (mod, div int) {
	div = t / n
	if t%n < 0 {
		div--
	}
	return t - div*n, div
}
