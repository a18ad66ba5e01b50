package ordering

import (
	"fmt"
	"math"
	"strings"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
)

// Occupant is one ion (or the vacancy) that may sit on a mixed site.
type Occupant struct {
	// Species is the ion's symbol; empty for a vacancy.
	Species string
	// Charge in e (0 for a vacancy).
	Charge float64
	// Fraction of the group's sites it occupies, in (0, 1].
	Fraction float64
}

// Vacant reports whether o is the vacancy.
func (o Occupant) Vacant() bool { return o.Species == "" }

// SiteSpec chooses the sites of the parent whose label or species is Match
// and says what occupies them: one occupant (Fraction 1) replaces the ion;
// several make a mixed group.
type SiteSpec struct {
	Match     string
	Occupants []Occupant
}

// Group is a set of mixed sites sharing one list of occupants.
type Group struct {
	Match     string
	Occupants []Occupant
	// Counts[k] is the number of sites occupant k takes.
	Counts []int
	// Positions are the group's indices among the mixed sites.
	Positions []int
}

// Problem is a supercell with mixed sites, ready to be searched.
type Problem struct {
	// Parent is the cell with every site; mixed sites keep the parent's
	// species and charge, which are not used.
	Parent *crystal.Crystal
	Groups []Group
	// Mixed[a] is the parent index of mixed site a; GroupOf[a] its group.
	Mixed   []int
	GroupOf []int

	charge  []float64 // charge of the parent's fixed sites (0 on mixed ones)
	phi     []float64 // M×M pair potentials between mixed sites, eV/e²
	fixedV  []float64 // potential of the fixed ions at each mixed site, V
	offset  float64   // E₀ − E_var(reference) so that E = offset + E_var
	symm    *symmetry // nil when the group was too large to use
	options Options
}

// Options controls NewProblem.
type Options struct {
	// Accuracy is the relative accuracy of the Ewald sums (0: ewald's
	// default 1e-10).
	Accuracy float64
	// MaxSymmetry bounds |G|·M, the size of the permutation table of the
	// symmetry operations (0: DefaultMaxSymmetry); above it only the
	// translations are used, and above that none.
	MaxSymmetry int
}

// DefaultMaxSymmetry is the default Options.MaxSymmetry (2²⁴ entries, 64 MB).
const DefaultMaxSymmetry = 1 << 24

// fractionTolerance is how far fraction·sites may lie from a whole number.
const fractionTolerance = 1e-6

// NewProblem applies specs to c (already the supercell to order) and
// evaluates the pair potentials and the symmetry of the parent. Errors are
// *SpecError for a specification that matches no site, fractions that do
// not sum to 1 or do not give whole numbers of sites, or a cell that is
// not neutral; errors of the Ewald sum are returned as they come.
func NewProblem(c *crystal.Crystal, specs []SiteSpec, opt Options) (*Problem, error) {
	if c == nil || len(c.Sites) == 0 {
		return nil, &SpecError{Reason: "no structure"}
	}
	p := &Problem{Parent: c.Clone(), options: opt, charge: make([]float64, len(c.Sites))}
	for i, s := range c.Sites {
		p.charge[i] = s.Charge
	}
	taken := make([]int, len(c.Sites)) // spec index + 1
	for k, sp := range specs {
		var sites []int
		for i, s := range c.Sites {
			if s.Label == sp.Match || s.Species == sp.Match {
				if taken[i] != 0 {
					return nil, &SpecError{Match: sp.Match, Reason: fmt.Sprintf("site %d is already chosen by %q", i+1, specs[taken[i]-1].Match)}
				}
				taken[i] = k + 1
				sites = append(sites, i)
			}
		}
		if len(sites) == 0 {
			return nil, &SpecError{Match: sp.Match, Reason: "no site has this label or species (present: " + strings.Join(c.SpeciesList(), ", ") + ")"}
		}
		if err := checkOccupants(sp); err != nil {
			return nil, err
		}
		if len(sp.Occupants) == 1 {
			o := sp.Occupants[0]
			if o.Vacant() {
				return nil, &SpecError{Match: sp.Match, Reason: "a site cannot be only vacant; leave it out of the structure"}
			}
			for _, i := range sites {
				p.Parent.Sites[i].Species, p.Parent.Sites[i].Charge = o.Species, o.Charge
				p.charge[i] = o.Charge
			}
			continue
		}
		g := Group{Match: sp.Match, Occupants: append([]Occupant(nil), sp.Occupants...)}
		left := len(sites)
		for j, o := range sp.Occupants {
			x := o.Fraction * float64(len(sites))
			n := int(math.Round(x))
			if math.Abs(x-float64(n)) > fractionTolerance*float64(len(sites)) || n < 1 {
				return nil, &SpecError{Match: sp.Match, Reason: fmt.Sprintf("%s × %d sites = %.6g is not a positive whole number of sites; choose a supercell that makes it one",
					occupantName(o), len(sites), x)}
			}
			if j == len(sp.Occupants)-1 {
				n = left
			}
			g.Counts = append(g.Counts, n)
			left -= n
		}
		for _, i := range sites {
			g.Positions = append(g.Positions, len(p.Mixed))
			p.Mixed = append(p.Mixed, i)
			p.GroupOf = append(p.GroupOf, len(p.Groups))
			p.charge[i] = 0
		}
		p.Groups = append(p.Groups, g)
	}
	if len(p.Mixed) == 0 {
		return nil, &SpecError{Reason: "no mixed site: give a site with two or more occupants"}
	}
	total := 0.0
	for i, q := range p.charge {
		if taken[i] == 0 || len(specs[taken[i]-1].Occupants) == 1 {
			total += q
		}
	}
	for _, g := range p.Groups {
		for k, o := range g.Occupants {
			total += float64(g.Counts[k]) * o.Charge
		}
	}
	if math.Abs(total) > crystal.NeutralityTolerance {
		return nil, &SpecError{Reason: fmt.Sprintf("the cell with these occupants holds %+.6g e; the charges must sum to zero: %v", total, crystal.ErrNotNeutral)}
	}
	p.symm = findSymmetry(p, opt.MaxSymmetry)
	if err := p.evaluate(); err != nil {
		return nil, err
	}
	return p, nil
}

func occupantName(o Occupant) string {
	if o.Vacant() {
		return "vacancy"
	}
	return fmt.Sprintf("%s%+g", o.Species, o.Charge)
}

func checkOccupants(sp SiteSpec) error {
	if len(sp.Occupants) == 0 {
		return &SpecError{Match: sp.Match, Reason: "no occupant given"}
	}
	sum := 0.0
	for k, o := range sp.Occupants {
		if !(o.Fraction > 0 && o.Fraction <= 1) {
			return &SpecError{Match: sp.Match, Reason: fmt.Sprintf("fraction %g of %s must lie in (0, 1]", o.Fraction, occupantName(o))}
		}
		if math.IsNaN(o.Charge) || math.IsInf(o.Charge, 0) || o.Vacant() && o.Charge != 0 {
			return &SpecError{Match: sp.Match, Reason: fmt.Sprintf("charge %g of %s is not allowed", o.Charge, occupantName(o))}
		}
		for _, prev := range sp.Occupants[:k] {
			if prev.Species == o.Species && prev.Charge == o.Charge {
				return &SpecError{Match: sp.Match, Reason: occupantName(o) + " given twice"}
			}
		}
		sum += o.Fraction
	}
	if math.Abs(sum-1) > fractionTolerance {
		return &SpecError{Match: sp.Match, Reason: fmt.Sprintf("the fractions sum to %.6g, not 1", sum)}
	}
	return nil
}

// evaluate fills phi, fixedV and offset.
func (p *Problem) evaluate() error {
	m, n := len(p.Mixed), len(p.Parent.Sites)
	// Φ and Vᶠ do not change under a lattice translation of the parent,
	// which moves every site by the same vector: Φ[t(a)][t(b)] = Φ[a][b].
	// So only one mixed site per translation orbit needs its row summed;
	// the others are filled by the translations.
	translations := p.symm.translationPerms()
	if len(translations) == 0 {
		translations = [][]int32{identity(m)}
	}
	reps := orbitRepresentatives(m, translations)
	rows := make([]int, len(reps))
	for r, a := range reps {
		rows[r] = p.Mixed[a]
	}
	pairs, err := ewald.PairPotentials(p.Parent, rows, ewald.Options{Accuracy: p.options.Accuracy})
	if err != nil {
		return err
	}
	p.phi = make([]float64, m*m)
	p.fixedV = make([]float64, m)
	for r, a0 := range reps {
		v := 0.0
		for j := 0; j < n; j++ {
			v += p.charge[j] * pairs.At(r, j)
		}
		for _, t := range translations {
			a := int(t[a0])
			p.fixedV[a] = v
			row := p.phi[a*m : (a+1)*m]
			for b, j := range p.Mixed {
				row[t[b]] = pairs.At(r, j)
			}
		}
	}
	ref := p.first()
	res, err := ewald.Sum(p.Crystal(ref), ewald.Options{Accuracy: p.options.Accuracy})
	if err != nil {
		return err
	}
	p.offset = res.EnergyEV - p.variable(ref)
	return nil
}

// first is the ordering that fills each group's sites in order.
func (p *Problem) first() []uint8 {
	a := make([]uint8, len(p.Mixed))
	for _, g := range p.Groups {
		at := 0
		for k, n := range g.Counts {
			for ; n > 0; n-- {
				a[g.Positions[at]] = uint8(k)
				at++
			}
		}
	}
	return a
}

// chargeOf returns the charge mixed site a carries in assignment x.
func (p *Problem) chargeOf(a int, x []uint8) float64 {
	return p.Groups[p.GroupOf[a]].Occupants[x[a]].Charge
}

// variable is E_var = Σ qₐVᶠₐ + ½ Σ qₐq_bΦₐ_b.
func (p *Problem) variable(x []uint8) float64 {
	m := len(p.Mixed)
	e := 0.0
	for a := 0; a < m; a++ {
		qa := p.chargeOf(a, x)
		if qa == 0 {
			continue
		}
		inner := 0.0
		for b := 0; b < m; b++ {
			inner += p.chargeOf(b, x) * p.phi[a*m+b]
		}
		e += qa * (p.fixedV[a] + 0.5*inner)
	}
	return e
}

// Energy returns the energy in eV per supercell of assignment x (x[a] is
// the index of the occupant of mixed site a in its group).
func (p *Problem) Energy(x []uint8) float64 { return p.offset + p.variable(x) }

// Crystal returns the ordered structure of assignment x: mixed sites get
// their occupant's species and charge, vacant ones are left out.
func (p *Problem) Crystal(x []uint8) *crystal.Crystal {
	c := &crystal.Crystal{Name: p.Parent.Name + " ordered", Lattice: p.Parent.Lattice, FormulaUnits: p.Parent.FormulaUnits}
	mixedAt := make([]int, len(p.Parent.Sites))
	for i := range mixedAt {
		mixedAt[i] = -1
	}
	for a, i := range p.Mixed {
		mixedAt[i] = a
	}
	for i, s := range p.Parent.Sites {
		if a := mixedAt[i]; a >= 0 {
			o := p.Groups[p.GroupOf[a]].Occupants[x[a]]
			if o.Vacant() {
				continue
			}
			s.Species, s.Charge = o.Species, o.Charge
		}
		c.Sites = append(c.Sites, s)
	}
	return c
}

// OccupancySpecs returns a SiteSpec for every kind of partly occupied or
// shared site of c (crystal.Site.Averaged, as a structure file gives
// them): the sites whose Species (their composition) is the same form one
// group, with each occupant's element, charge and occupancy, and the
// vacancy taking what the occupancies leave. Sites matched by a selector
// in skip are left out (the caller's own specifications come first).
func OccupancySpecs(c *crystal.Crystal, skip []SiteSpec) []SiteSpec {
	var out []SiteSpec
	seen := map[string]bool{}
	for _, s := range c.Sites {
		if !s.Averaged() || seen[s.Species] {
			continue
		}
		chosen := false
		for _, sp := range skip {
			chosen = chosen || sp.Match == s.Species || sp.Match == s.Label
		}
		if chosen {
			continue
		}
		seen[s.Species] = true
		spec := SiteSpec{Match: s.Species}
		left := 1.0
		for _, o := range s.Occupants {
			spec.Occupants = append(spec.Occupants, Occupant{Species: o.Element, Charge: o.Charge, Fraction: o.Occupancy})
			left -= o.Occupancy
		}
		if left > crystal.OccupancyTolerance {
			spec.Occupants = append(spec.Occupants, Occupant{Fraction: left})
		}
		out = append(out, spec)
	}
	return out
}
