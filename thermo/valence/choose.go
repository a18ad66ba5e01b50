package valence

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"
)

// option is one charge a group may take.
type option struct {
	low, high int
	frac      float64 // fraction of atoms in state high
	mean      float64
}

// cost orders choices: fewer mixed groups first, then the smaller misfit.
type cost struct {
	mixed  int
	misfit float64
}

func (a cost) less(b cost) bool {
	if a.mixed != b.mixed {
		return a.mixed < b.mixed
	}
	return a.misfit < b.misfit-1e-12
}

func (a cost) plus(b cost) cost { return cost{a.mixed + b.mixed, a.misfit + b.misfit} }

// misfit is n·(BVS − |q|)² for a group with a choice, 0 without a sum.
func misfit(g Group, q float64, choice bool) float64 {
	if !choice || math.IsNaN(g.Sum) {
		return 0
	}
	d := g.Sum - math.Abs(q)
	return g.Atoms * d * d
}

// consistent reports a charge within consistentWithin of the group's sum.
func consistent(g Group, q float64) bool {
	return math.IsNaN(g.Sum) || math.Abs(g.Sum-math.Abs(q)) < consistentWithin
}

// choose runs the steps of the package documentation on the free groups
// and writes their charges.
func choose(groups []Group, free []int, fixed float64, cand Candidates, role map[string]int) (Assignment, error) {
	states := map[string][]int{}
	var elements []string
	for _, gi := range free {
		el := groups[gi].Element
		if _, ok := states[el]; ok {
			continue
		}
		var st []int
		for _, q := range cand[el] {
			if sign(float64(q)) == role[el] && !slices.Contains(st, q) {
				st = append(st, q)
			}
		}
		if len(st) == 0 {
			return Assignment{}, &NoStatesError{Element: el}
		}
		sort.Ints(st)
		states[el] = st
		elements = append(elements, el)
	}

	// Step 1: one state per element.
	if a, ok, err := balance(groups, free, fixed, states, elements); ok || err != nil {
		return a, err
	}
	// Steps 2–4.
	for _, step := range []Method{PerSite, MixedValence, PoorFit} {
		opts := make([][]option, len(free))
		for k, gi := range free {
			g := groups[gi]
			st := states[g.Element]
			choice := len(st) > 1
			for j, q := range st {
				if step == PoorFit || !choice || consistent(g, float64(q)) {
					opts[k] = append(opts[k], option{low: q, high: q, mean: float64(q)})
				}
				if step == PerSite || j+1 == len(st) || st[j+1] != q+1 {
					continue
				}
				// Two adjacent states in the ratios the group's sites allow.
				m := len(g.members)
				for n := 1; n < m; n++ {
					f := float64(n) / float64(m)
					mean := float64(q) + f
					if step == PoorFit || consistent(g, mean) {
						opts[k] = append(opts[k], option{low: q, high: q + 1, frac: f, mean: mean})
					}
				}
			}
		}
		picks, ok := neutral(groups, free, fixed, opts)
		if !ok {
			continue
		}
		for k, gi := range free {
			o := opts[k][picks[k]]
			g := &groups[gi]
			g.Charge, g.Low, g.High, g.HighFraction = o.mean, o.low, o.high, o.frac
		}
		method := step
		if step == MixedValence && !anyMixed(groups) {
			method = PerSite
		}
		return Assignment{Method: method}, nil
	}
	if a, ok := elementMean(groups, free, fixed, states); ok {
		return a, nil
	}
	var st []string
	for _, el := range elements {
		var qs []string
		for _, q := range states[el] {
			qs = append(qs, fmt.Sprintf("%+d", q))
		}
		st = append(st, el+" "+strings.Join(qs, ", "))
	}
	return Assignment{}, &NoNeutralError{States: st, Fixed: fixed}
}

// elementMean is the last step: when exactly one element has several
// states, its atoms share the charge the rest of the cell leaves, if that
// mean lies between its lowest and highest state.
func elementMean(groups []Group, free []int, fixed float64, states map[string][]int) (Assignment, bool) {
	multi := ""
	for el, st := range states {
		if len(st) > 1 {
			if multi != "" {
				return Assignment{}, false
			}
			multi = el
		}
	}
	if multi == "" {
		return Assignment{}, false
	}
	st := states[multi]
	rest, atoms := fixed, 0.0
	for _, gi := range free {
		g := groups[gi]
		if g.Element == multi {
			atoms += g.Atoms
			continue
		}
		rest += g.Atoms * float64(states[g.Element][0])
	}
	q := -rest / atoms
	lo, hi := st[0], st[len(st)-1]
	if !(atoms > 0) || q < float64(lo)-1e-9 || q > float64(hi)+1e-9 {
		return Assignment{}, false
	}
	for _, gi := range free {
		g := &groups[gi]
		if g.Element == multi {
			g.Charge, g.Low, g.High = q, lo, hi
			g.HighFraction = (q - float64(lo)) / float64(hi-lo)
			continue
		}
		g.Charge = float64(states[g.Element][0])
		g.Low, g.High = states[g.Element][0], states[g.Element][0]
	}
	return Assignment{Method: ElementMean}, true
}

func anyMixed(groups []Group) bool {
	for _, g := range groups {
		if g.Mixed() {
			return true
		}
	}
	return false
}

// balance is step 1: every combination of one state per element; ok is
// false when none is neutral.
func balance(groups []Group, free []int, fixed float64, states map[string][]int, elements []string) (Assignment, bool, error) {
	atoms := map[string]float64{}
	for _, gi := range free {
		atoms[groups[gi].Element] += groups[gi].Atoms
	}
	total := 1
	for _, el := range elements {
		total *= len(states[el])
		if total > maxCombinations {
			return Assignment{}, false, nil
		}
	}
	type solution struct {
		pick map[string]int
		fit  float64
	}
	var found []solution
	idx := make([]int, len(elements))
	for {
		q := fixed
		for k, el := range elements {
			q += atoms[el] * float64(states[el][idx[k]])
		}
		if math.Abs(q) < 1e-6 {
			pick := map[string]int{}
			fit := 0.0
			for k, el := range elements {
				pick[el] = states[el][idx[k]]
			}
			for _, gi := range free {
				g := groups[gi]
				fit += misfit(g, float64(pick[g.Element]), len(states[g.Element]) > 1)
			}
			found = append(found, solution{pick, fit})
		}
		k := 0
		for ; k < len(elements); k++ {
			idx[k]++
			if idx[k] < len(states[elements[k]]) {
				break
			}
			idx[k] = 0
		}
		if k == len(elements) {
			break
		}
	}
	if len(found) == 0 {
		return Assignment{}, false, nil
	}
	method := ChargeBalance
	if len(found) > 1 {
		method = ChargeBalanceRanked
		sums := true
		for _, gi := range free {
			sums = sums && !math.IsNaN(groups[gi].Sum)
		}
		if !sums {
			var opts []string
			for _, s := range found {
				var parts []string
				for _, el := range elements {
					parts = append(parts, fmt.Sprintf("%s%+d", el, s.pick[el]))
				}
				opts = append(opts, strings.Join(parts, " "))
			}
			return Assignment{}, false, &AmbiguousError{Options: opts}
		}
		sort.SliceStable(found, func(a, b int) bool { return found[a].fit < found[b].fit })
	}
	for _, gi := range free {
		g := &groups[gi]
		q := found[0].pick[g.Element]
		g.Charge, g.Low, g.High = float64(q), q, q
	}
	return Assignment{Method: method, Alternatives: len(found)}, true, nil
}

// maxStates bounds the running charges one step of neutral keeps; a cell
// with more choices than that is not settled by that step.
const maxStates = 200000

// neutral picks one option per free group so that the cell is neutral at
// the least cost, by dynamic programming over the running charge (in units
// of 1e-6 e). Ties go to the first option listed.
func neutral(groups []Group, free []int, fixed float64, opts [][]option) ([]int, bool) {
	const unit = 1e6
	key := func(q float64) int64 { return int64(math.Round(q * unit)) }
	type entry struct {
		c      cost
		choice int
		prev   int64
	}
	layers := make([]map[int64]entry, len(free)+1)
	layers[0] = map[int64]entry{key(fixed): {}}
	for k, gi := range free {
		g := groups[gi]
		choice := len(opts[k]) > 1
		next := map[int64]entry{}
		// Keys in order, so that ties resolve the same way on every run.
		qs := make([]int64, 0, len(layers[k]))
		for q := range layers[k] {
			qs = append(qs, q)
		}
		slices.Sort(qs)
		if len(qs)*len(opts[k]) > maxStates*10 {
			return nil, false
		}
		for _, q := range qs {
			e := layers[k][q]
			for j, o := range opts[k] {
				mixed := 0
				if o.low != o.high {
					mixed = 1
				}
				c := e.c.plus(cost{mixed, misfit(g, o.mean, choice)})
				nq := q + key(o.mean*g.Atoms)
				if old, ok := next[nq]; !ok || c.less(old.c) {
					next[nq] = entry{c: c, choice: j, prev: q}
				}
			}
		}
		if len(next) > maxStates {
			return nil, false
		}
		layers[k+1] = next
	}
	// Neutral within rounding: the sum of many rounded terms.
	tol := int64(len(free) + 1)
	best, found := int64(0), false
	for q := -tol; q <= tol; q++ {
		if e, ok := layers[len(free)][q]; ok && (!found || e.c.less(layers[len(free)][best].c)) {
			best, found = q, true
		}
	}
	if !found {
		return nil, false
	}
	picks := make([]int, len(free))
	q := best
	for k := len(free); k > 0; k-- {
		e := layers[k][q]
		picks[k-1] = e.choice
		q = e.prev
	}
	return picks, true
}
