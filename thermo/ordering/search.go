package ordering

import (
	"fmt"
	"math"
	"math/rand"
	"sort"
)

// Method names how a search visited the orderings.
type Method string

const (
	// Auto enumerates when the orderings number at most MaxEnumerated,
	// and anneals otherwise.
	Auto Method = ""
	// Enumerate visits every ordering.
	Enumerate Method = "enumeration"
	// Anneal runs simulated annealing.
	Anneal Method = "annealing"
)

// DefaultMaxEnumerated is the default SearchOptions.MaxEnumerated.
const DefaultMaxEnumerated = 5e6

// DefaultSweeps is the default number of annealing sweeps (M attempted
// swaps each) per restart; DefaultRestarts the number of restarts.
const (
	DefaultSweeps   = 1000
	DefaultRestarts = 16
	DefaultKeep     = 10
)

// SearchOptions controls Search.
type SearchOptions struct {
	// Keep is the number of lowest orderings listed (0: DefaultKeep).
	Keep   int
	Method Method
	// MaxEnumerated is the most orderings Auto enumerates (0:
	// DefaultMaxEnumerated); Enumerate refuses more than 100 times it.
	MaxEnumerated float64
	// Seed, Sweeps and Restarts drive annealing (0: defaults; Seed 0 is a
	// seed like any other).
	Seed     int64
	Sweeps   int
	Restarts int
	// Progress, when set, is called now and then with the work done and
	// the work planned (orderings visited, or swaps tried).
	Progress func(done, total float64)
}

// Ordering is one ordering of the mixed sites.
type Ordering struct {
	// Assignment[a] is the index, in its group's Occupants, of the
	// occupant of mixed site a.
	Assignment []uint8
	// EnergyEV is the electrostatic energy of the supercell in eV.
	EnergyEV float64
	// Multiplicity is the number of orderings symmetry-equivalent to this
	// one (1 when no symmetry was used).
	Multiplicity int
}

// Outcome is the result of a search.
type Outcome struct {
	Method Method
	// Orderings are the lowest distinct orderings found, lowest first.
	Orderings []Ordering
	// Total is the number of orderings (symmetry-equivalent ones counted
	// separately), as a float: it can pass 2⁶³.
	Total float64
	// Visited counts orderings enumerated or swaps tried.
	Visited int64
	// Operations is the number of symmetry operations used (1: none), and
	// TranslationsOnly says the point operations were left out.
	Operations       int
	TranslationsOnly bool
}

// Count returns the number of orderings, symmetry-equivalent ones counted
// separately: the product over groups of multinomial coefficients.
func (p *Problem) Count() float64 {
	total := 1.0
	for _, g := range p.Groups {
		n := 0
		for _, c := range g.Counts {
			for k := 1; k <= c; k++ {
				n++
				total *= float64(n) / float64(k)
			}
		}
	}
	return math.Round(total)
}

// Search finds the lowest-energy orderings.
func (p *Problem) Search(opt SearchOptions) (Outcome, error) {
	if opt.Keep <= 0 {
		opt.Keep = DefaultKeep
	}
	if opt.MaxEnumerated <= 0 {
		opt.MaxEnumerated = DefaultMaxEnumerated
	}
	if opt.Sweeps <= 0 {
		opt.Sweeps = DefaultSweeps
	}
	if opt.Restarts <= 0 {
		opt.Restarts = DefaultRestarts
	}
	out := Outcome{Total: p.Count(), Operations: p.symm.size()}
	if p.symm != nil {
		out.TranslationsOnly = p.symm.translationsOnly
	}
	method := opt.Method
	if method == Auto {
		method = Anneal
		if out.Total <= opt.MaxEnumerated {
			method = Enumerate
		}
	}
	keep := newKeeper(p, opt.Keep)
	switch method {
	case Enumerate:
		if out.Total > 100*opt.MaxEnumerated {
			return out, &SpecError{Reason: fmt.Sprintf("%.3g orderings are too many to enumerate (limit %.3g); anneal instead", out.Total, 100*opt.MaxEnumerated)}
		}
		out.Visited = p.enumerate(keep, opt.Progress, out.Total)
	case Anneal:
		out.Visited = p.anneal(keep, opt)
	default:
		return out, &SpecError{Reason: fmt.Sprintf("unknown search method %q", method)}
	}
	out.Method = method
	for _, e := range keep.list {
		// The energy afresh: annealing's running sum carries the rounding
		// of every accepted swap.
		out.Orderings = append(out.Orderings, Ordering{Assignment: e.x, EnergyEV: p.Energy(e.x), Multiplicity: e.mult})
	}
	return out, nil
}

// keeper holds the lowest distinct orderings offered, by variable energy.
type keeper struct {
	p       *Problem
	size    int
	list    []kept
	canon   []uint8
	scratch []uint8
}

type kept struct {
	e     float64
	x     []uint8 // canonical form
	mult  int
	order int // insertion order, for a deterministic tie-break
}

func newKeeper(p *Problem, size int) *keeper {
	m := len(p.Mixed)
	return &keeper{p: p, size: size, canon: make([]uint8, m), scratch: make([]uint8, m)}
}

// sameEnergy is the relative tolerance within which two energies count as
// equal (rounding of the sums, far below the Ewald accuracy).
const sameEnergy = 1e-11

// worse reports whether energy e cannot enter the list.
func (k *keeper) worse(e float64) bool {
	if len(k.list) < k.size {
		return false
	}
	last := k.list[len(k.list)-1].e
	return e > last+sameEnergy*(math.Abs(last)+math.Abs(k.p.offset))
}

// offer considers ordering x of variable energy e.
func (k *keeper) offer(x []uint8, e float64) {
	if k.worse(e) {
		return
	}
	stab := k.p.symm.canonical(x, k.canon, k.scratch)
	tol := sameEnergy * (math.Abs(e) + math.Abs(k.p.offset))
	for _, q := range k.list {
		if k.p.symm == nil {
			// Without symmetry, equal energies stand for equivalent orderings.
			if math.Abs(q.e-e) <= tol {
				return
			}
		} else if string(q.x) == string(k.canon) {
			return
		}
	}
	entry := kept{e: e, x: append([]uint8(nil), k.canon...), mult: k.p.symm.size() / stab}
	at := sort.Search(len(k.list), func(i int) bool {
		q := k.list[i]
		if math.Abs(q.e-e) > tol {
			return q.e > e
		}
		return compare(q.x, entry.x) > 0
	})
	k.list = append(k.list, kept{})
	copy(k.list[at+1:], k.list[at:])
	k.list[at] = entry
	if len(k.list) > k.size {
		k.list = k.list[:k.size]
	}
}

// progressEvery is how many steps pass between Progress calls.
const progressEvery = 1 << 16

// enumerate visits every ordering depth-first, site by site, with the
// energy built incrementally: placing charge q on site a adds
// q·(Vᶠₐ + ½qΦₐₐ + Σ_{b placed} q_bΦₐ_b).
func (p *Problem) enumerate(keep *keeper, progress func(done, total float64), total float64) int64 {
	m := len(p.Mixed)
	x := make([]uint8, m)
	// partial[a] = Σ_{b placed} q_b·Φₐ_b, one slice per depth so that
	// backtracking needs no undo.
	partial := make([][]float64, m+1)
	for d := range partial {
		partial[d] = make([]float64, m)
	}
	left := make([][]int, len(p.Groups))
	for g := range p.Groups {
		left[g] = append([]int(nil), p.Groups[g].Counts...)
	}
	var visited int64
	var walk func(a int, e float64)
	walk = func(a int, e float64) {
		if a == m {
			visited++
			keep.offer(x, e)
			if progress != nil && visited%progressEvery == 0 {
				progress(float64(visited), total)
			}
			return
		}
		g := p.GroupOf[a]
		row := p.phi[a*m : (a+1)*m]
		for k, o := range p.Groups[g].Occupants {
			if left[g][k] == 0 {
				continue
			}
			left[g][k]--
			x[a] = uint8(k)
			q := o.Charge
			de := q * (p.fixedV[a] + 0.5*q*row[a] + partial[a][a])
			next := partial[a+1]
			copy(next[a+1:], partial[a][a+1:])
			if q != 0 {
				for b := a + 1; b < m; b++ {
					next[b] += q * row[b]
				}
			}
			walk(a+1, e+de)
			left[g][k]++
		}
	}
	walk(0, 0)
	if progress != nil {
		progress(float64(visited), total)
	}
	return visited
}

// anneal runs opt.Restarts annealing runs of opt.Sweeps·M attempted swaps
// each, from random orderings, with the temperature falling geometrically
// from the mean |ΔE| of random swaps to a thousandth of it.
func (p *Problem) anneal(keep *keeper, opt SearchOptions) int64 {
	m := len(p.Mixed)
	rng := rand.New(rand.NewSource(opt.Seed))
	steps := int64(opt.Sweeps) * int64(m)
	total := float64(steps) * float64(opt.Restarts)
	var visited int64
	s := newSwapper(p)
	for r := 0; r < opt.Restarts; r++ {
		s.randomise(rng)
		keep.offer(s.x, s.e)
		t0 := s.typicalChange(rng, 256)
		if t0 == 0 {
			break // every swap changes nothing: one ordering
		}
		cool := math.Pow(1e-3, 1/float64(steps))
		t := t0
		for step := int64(0); step < steps; step++ {
			a, b, ok := s.pick(rng)
			if !ok {
				break
			}
			de := s.delta(a, b)
			if de <= 0 || rng.Float64() < math.Exp(-de/t) {
				s.apply(a, b, de)
				if !keep.worse(s.e) {
					keep.offer(s.x, s.e)
				}
			}
			t *= cool
			visited++
			if opt.Progress != nil && visited%progressEvery == 0 {
				opt.Progress(float64(visited), total)
			}
		}
	}
	if opt.Progress != nil {
		opt.Progress(float64(visited), total)
	}
	return visited
}

// swapper holds one ordering with the potential at every mixed site, for
// O(1) swap energies and O(M) updates.
type swapper struct {
	p *Problem
	x []uint8
	q []float64 // charge on each mixed site
	v []float64 // Vᶠₐ + Σ_b Φₐ_b·q_b
	e float64   // variable energy
	// swappable lists the groups with two or more occupants and their
	// positions.
	groups [][]int
}

func newSwapper(p *Problem) *swapper {
	m := len(p.Mixed)
	s := &swapper{p: p, x: make([]uint8, m), q: make([]float64, m), v: make([]float64, m)}
	for _, g := range p.Groups {
		if len(g.Counts) > 1 {
			s.groups = append(s.groups, g.Positions)
		}
	}
	return s
}

// randomise sets a random ordering (each group's occupants shuffled).
func (s *swapper) randomise(rng *rand.Rand) {
	p := s.p
	copy(s.x, p.first())
	for _, g := range p.Groups {
		pos := g.Positions
		rng.Shuffle(len(pos), func(i, j int) { s.x[pos[i]], s.x[pos[j]] = s.x[pos[j]], s.x[pos[i]] })
	}
	m := len(p.Mixed)
	for a := range s.q {
		s.q[a] = p.chargeOf(a, s.x)
	}
	for a := 0; a < m; a++ {
		v := p.fixedV[a]
		for b, qb := range s.q {
			v += p.phi[a*m+b] * qb
		}
		s.v[a] = v
	}
	s.e = p.variable(s.x)
}

// pick chooses two sites of one group holding different occupants.
func (s *swapper) pick(rng *rand.Rand) (a, b int, ok bool) {
	if len(s.groups) == 0 {
		return 0, 0, false
	}
	for try := 0; try < 64; try++ {
		pos := s.groups[rng.Intn(len(s.groups))]
		a, b = pos[rng.Intn(len(pos))], pos[rng.Intn(len(pos))]
		if s.x[a] != s.x[b] {
			return a, b, true
		}
	}
	return 0, 0, false
}

// delta is the energy change of swapping the occupants of a and b.
func (s *swapper) delta(a, b int) float64 {
	m := len(s.q)
	d := s.q[b] - s.q[a]
	phi := s.p.phi
	return d*(s.v[a]-s.v[b]) + 0.5*d*d*(phi[a*m+a]+phi[b*m+b]-2*phi[a*m+b])
}

// apply swaps the occupants of a and b, whose energy change is de.
func (s *swapper) apply(a, b int, de float64) {
	m := len(s.q)
	d := s.q[b] - s.q[a]
	rowA, rowB := s.p.phi[a*m:(a+1)*m], s.p.phi[b*m:(b+1)*m]
	for c := range s.v {
		s.v[c] += d * (rowA[c] - rowB[c])
	}
	s.x[a], s.x[b] = s.x[b], s.x[a]
	s.q[a], s.q[b] = s.q[b], s.q[a]
	s.e += de
}

// typicalChange is the mean |ΔE| of n random swaps (none applied).
func (s *swapper) typicalChange(rng *rand.Rand, n int) float64 {
	sum, k := 0.0, 0
	for i := 0; i < n; i++ {
		a, b, ok := s.pick(rng)
		if !ok {
			break
		}
		sum += math.Abs(s.delta(a, b))
		k++
	}
	if k == 0 {
		return 0
	}
	return sum / float64(k)
}
