package valence

import (
	"fmt"
	"math"
	"slices"
	"sort"
	"strings"

	"enthalpath/thermo/crystal"
)

// Candidates maps an element to the oxidation states it may take.
type Candidates map[string][]int

// Method says how the charges of a structure were settled.
type Method int

const (
	// Given: every charge came with the structure or from the caller.
	Given Method = iota
	// ChargeBalance: one combination of the elements' states is neutral.
	ChargeBalance
	// ChargeBalanceRanked: several are; the bond-valence sums chose.
	ChargeBalanceRanked
	// PerSite: one state per group of sites, chosen by bond-valence sums.
	PerSite
	// MixedValence: some groups hold two states, summed as their mean.
	MixedValence
	// PoorFit: the closest neutral choice, some group 0.5 or more from its
	// bond-valence sum.
	PoorFit
	// ElementMean: the one element with several states takes, on every
	// site, the mean charge that makes the cell neutral (a vacancy-bearing
	// or otherwise non-stoichiometric cell, such as Fe0.9O).
	ElementMean
)

// String says in words how the charges were settled.
func (m Method) String() string {
	switch m {
	case Given:
		return "given"
	case ChargeBalance:
		return "charge balance (the only neutral combination of the elements' oxidation states)"
	case ChargeBalanceRanked:
		return "charge balance, the bond-valence sums choosing among the neutral combinations"
	case PerSite:
		return "bond-valence sums (one oxidation state per site, each within 0.5 of its sum)"
	case MixedValence:
		return "mixed valence from bond-valence sums (sites holding two oxidation states carry their mean charge: averaged crystal)"
	case PoorFit:
		return "closest neutral fit to the bond-valence sums (poor: a site is 0.5 or more from its sum)"
	case ElementMean:
		return "mean charge from neutrality (the one element with several oxidation states carries, on every site, the mean charge the others leave: averaged crystal)"
	}
	return "unknown"
}

// Key is a short name of the method for machine-readable output.
func (m Method) Key() string {
	return [...]string{"given", "charge-balance", "charge-balance-ranked", "bond-valence", "mixed-valence", "poor-fit", "element-mean"}[m]
}

// Group is a set of sites of one element that received one charge.
type Group struct {
	Element string
	// Labels are the source's site labels in the group.
	Labels []string
	// Sites are the indices of the crystal's sites holding the group.
	Sites []int
	// Atoms is the occupancy-weighted number of the group's atoms in the
	// cell.
	Atoms float64
	// Sum is the mean bond-valence sum (NaN where it cannot be computed).
	Sum float64
	// Charge is the (mean) charge of one atom of the group.
	Charge float64
	// Low and High are the oxidation states held; equal unless mixed.
	Low, High int
	// HighFraction is the fraction of the group's atoms in state High.
	HighFraction float64
	// Given marks a charge that came with the structure or the caller.
	Given bool

	members []int           // indices of the group's species
	labeled map[string]bool // Labels as a set, while the group is built
}

// Mixed reports a group holding two oxidation states (or a mean between
// its element's lowest and highest).
func (g Group) Mixed() bool { return g.Low != g.High }

// Assignment is the outcome of Assign.
type Assignment struct {
	Method Method
	Groups []Group
	// Alternatives counts the neutral combinations charge balance found
	// (0 when a later step decided).
	Alternatives int
}

// NoStatesError reports an element whose charge is not given and for
// which no oxidation states are known.
type NoStatesError struct{ Element string }

func (e *NoStatesError) Error() string {
	return fmt.Sprintf("no oxidation states known for %s, and the structure gives its charge nowhere", e.Element)
}

// NoNeutralError reports a structure whose charges cannot be made neutral
// with the candidate states.
type NoNeutralError struct {
	// States lists the candidate states tried, per element ("Fe 2, 3").
	States []string
	// Fixed is the sum of the charges that were given, in e per cell.
	Fixed float64
}

func (e *NoNeutralError) Error() string {
	return fmt.Sprintf("no neutral assignment of the oxidation states (%s) to the sites (given charges sum to %+g e per cell)", strings.Join(e.States, "; "), e.Fixed)
}

// AmbiguousError reports several neutral combinations and no bond-valence
// sums to choose among them.
type AmbiguousError struct {
	// Options lists the neutral combinations, each as "Fe+2 Ti+4".
	Options []string
}

func (e *AmbiguousError) Error() string {
	return fmt.Sprintf("%d neutral combinations of oxidation states (%s) and no bond-valence sums to choose among them", len(e.Options), strings.Join(e.Options, ", "))
}

// consistentWithin is the largest |BVS − |q|| a group with a choice may
// have in steps 2 and 3 (half a valence unit: nearer another state).
const consistentWithin = 0.5

// sameSum is how close two bond-valence sums must be for their sites to be
// one group.
const sameSum = 0.01

// maxCombinations bounds step 1's enumeration of per-element states.
const maxCombinations = 100000

// Assign returns a copy of c with a charge on every occupant whose
// ChargeKnown is false (sites without Occupants are taken as given), and how
// they were chosen. cand gives each element's possible states; p the
// bond-valence parameters. See the package documentation for the steps.
func Assign(c *crystal.Crystal, cand Candidates, p Params) (*crystal.Crystal, Assignment, error) {
	sp := speciesOf(c)
	role, err := roles(sp, cand)
	if err != nil {
		return nil, Assignment{}, err
	}
	sums := make([]float64, len(sp))
	if len(c.Sites) <= MaxSumSites {
		plain := make([]species, len(sp))
		for i, s := range sp {
			plain[i] = species{site: s.site, element: s.element, occ: s.occ, role: role[s.element]}
		}
		sums = speciesSums(c, plain, p, standard)
	} else {
		for i := range sums {
			sums[i] = math.NaN()
		}
	}
	groups := makeGroups(sp, sums)
	fixed := 0.0
	var free []int
	for gi, g := range groups {
		if g.Given {
			fixed += g.Atoms * g.Charge
			continue
		}
		free = append(free, gi)
	}
	a := Assignment{Method: Given}
	if len(free) > 0 {
		a, err = choose(groups, free, fixed, cand, role)
		if err != nil {
			return nil, Assignment{}, err
		}
	}
	a.Groups = groups
	return apply(c, sp, groups), a, nil
}

// occupant is one species of the cell with where it came from.
type occupant struct {
	site    int
	index   int // index in the site's Occupants, −1 for a site without
	label   string
	element string
	occ     float64
	charge  float64
	known   bool
}

func speciesOf(c *crystal.Crystal) []occupant {
	var out []occupant
	for i, s := range c.Sites {
		if s.Occupants == nil {
			out = append(out, occupant{site: i, index: -1, label: s.Label, element: s.Species, occ: 1, charge: s.Charge, known: true})
			continue
		}
		for k, o := range s.Occupants {
			out = append(out, occupant{site: i, index: k, label: o.Label, element: o.Element, occ: o.Occupancy, charge: o.Charge, known: o.ChargeKnown})
		}
	}
	return out
}

// roles decides which elements are cations (+1) and anions (−1): by the
// sign of a given charge, else of the candidate states; an element whose
// states have both signs is an anion only when no other element is.
func roles(sp []occupant, cand Candidates) (map[string]int, error) {
	role := map[string]int{}
	var both []string
	anion := false
	for _, s := range sp {
		if _, done := role[s.element]; done {
			continue
		}
		if s.known {
			role[s.element] = sign(s.charge)
			anion = anion || s.charge < 0
			continue
		}
		st := cand[s.element]
		if len(st) == 0 {
			return nil, &NoStatesError{Element: s.element}
		}
		pos, neg := slices.Max(st) > 0, slices.Min(st) < 0
		switch {
		case pos && neg:
			role[s.element] = 0
			both = append(both, s.element)
		case neg:
			role[s.element] = -1
			anion = true
		default:
			role[s.element] = 1
		}
	}
	for _, el := range both {
		role[el] = 1
		if !anion {
			role[el] = -1
		}
	}
	return role, nil
}

// makeGroups puts the species into groups: given charges by element and
// charge; the others by element and bond-valence sum (within sameSum).
func makeGroups(sp []occupant, sums []float64) []Group {
	type member struct {
		i   int
		sum float64
	}
	byKey := map[string][]member{}
	var keys []string
	for i, s := range sp {
		k := s.element + "?"
		if s.known {
			k = fmt.Sprintf("%s%+g", s.element, s.charge)
		}
		if _, ok := byKey[k]; !ok {
			keys = append(keys, k)
		}
		byKey[k] = append(byKey[k], member{i, sums[i]})
	}
	var groups []Group
	for _, k := range keys {
		ms := byKey[k]
		if !strings.HasSuffix(k, "?") {
			groups = append(groups, newGroup(sp, sums, ms[0].i, true))
			for _, m := range ms[1:] {
				groups[len(groups)-1].add(sp, sums, m.i)
			}
			continue
		}
		sort.SliceStable(ms, func(a, b int) bool { return ms[a].sum < ms[b].sum })
		start := len(groups)
		for j, m := range ms {
			if j > 0 && !(math.Abs(m.sum-ms[j-1].sum) <= sameSum) && !(math.IsNaN(m.sum) && math.IsNaN(ms[j-1].sum)) {
				groups = append(groups, newGroup(sp, sums, m.i, false))
				continue
			}
			if j == 0 {
				groups = append(groups, newGroup(sp, sums, m.i, false))
				continue
			}
			groups[len(groups)-1].add(sp, sums, m.i)
		}
		// Within an element, order groups by their first site.
		sub := groups[start:]
		sort.SliceStable(sub, func(a, b int) bool { return sub[a].Sites[0] < sub[b].Sites[0] })
	}
	for gi := range groups {
		g := &groups[gi]
		g.Sum /= g.Atoms
		g.labeled = nil
	}
	return groups
}

func newGroup(sp []occupant, sums []float64, i int, given bool) Group {
	s := sp[i]
	g := Group{Element: s.element, Given: given}
	if given {
		q := int(math.Round(s.charge))
		g.Charge, g.Low, g.High = s.charge, q, q
	}
	g.add(sp, sums, i)
	return g
}

// add puts species i into g; Sum accumulates occupancy-weighted sums until
// makeGroups divides by Atoms.
func (g *Group) add(sp []occupant, sums []float64, i int) {
	s := sp[i]
	if g.labeled == nil {
		g.labeled = map[string]bool{}
	}
	if !g.labeled[s.label] {
		g.labeled[s.label] = true
		g.Labels = append(g.Labels, s.label)
	}
	if n := len(g.Sites); n == 0 || g.Sites[n-1] != s.site {
		g.Sites = append(g.Sites, s.site)
	}
	g.members = append(g.members, i)
	g.Atoms += s.occ
	g.Sum += s.occ * sums[i]
}

// apply writes the groups' charges into a copy of c.
func apply(c *crystal.Crystal, sp []occupant, groups []Group) *crystal.Crystal {
	d := c.Clone()
	cloned := make([]bool, len(d.Sites))
	for _, g := range groups {
		if g.Given {
			continue
		}
		for _, m := range g.members {
			s := sp[m]
			site := &d.Sites[s.site]
			if !cloned[s.site] {
				site.Occupants = slices.Clone(site.Occupants)
				cloned[s.site] = true
			}
			site.Occupants[s.index].Charge = g.Charge
			site.Occupants[s.index].ChargeKnown = true
		}
	}
	for i := range d.Sites {
		if cloned[i] {
			d.Sites[i].Charge = crystal.MeanCharge(d.Sites[i].Occupants)
		}
	}
	return d
}
