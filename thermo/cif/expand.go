package cif

import (
	"fmt"
	"math"
	"path/filepath"
	"slices"
	"sort"
	"strings"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/notation"
)

// This file: the full cell from the asymmetric unit (symmetry images merged
// on a grid), its neutrality and its formula units.

// crystal reads the whole block.
func (rd *reader) crystal(opt Options, tol float64) (*crystal.Crystal, error) {
	if !rd.b.has("_atom_site_fract_x") {
		return nil, rd.errf(rd.b.line, "_atom_site_fract_x", ErrNoSites, "data_%s gives no fractional atom coordinates", rd.b.name)
	}
	lat, err := rd.lattice()
	if err != nil {
		return nil, err
	}
	ops, err := rd.symops()
	if err != nil {
		return nil, err
	}
	asym, err := rd.sites(opt)
	if err != nil {
		return nil, err
	}
	if len(asym)*len(ops) > maxImages {
		return nil, rd.errf(0, "", ErrBadValue, "%d sites × %d operations is too many to expand (at most %d images, %d sites after merging, are read)", len(asym), len(ops), maxImages, maxSites)
	}
	c := &crystal.Crystal{Name: filepath.Base(rd.file), Lattice: lat}
	if rd.file == "" {
		c.Name = "data_" + rd.b.name
	}
	rd.asym = asym
	if err := expand(c, asym, ops, tol, rd); err != nil {
		return nil, err
	}
	z, err := rd.formulaUnits(c)
	if err != nil {
		return nil, err
	}
	c.FormulaUnits = z
	return c, nil
}

// chargesGiven reports the first atom-site row whose charge is given
// nowhere.
func (rd *reader) chargesGiven(c *crystal.Crystal) error {
	for _, s := range rd.asym {
		if !s.known {
			return rd.errf(s.line, "_atom_type_oxidation_number", ErrMissingCharge,
				"no charge for site %s (type %s): give it in an _atom_type_symbol/_atom_type_oxidation_number loop, as a charged type symbol such as %s2+, or as a charge given by site label, type symbol or element", s.label, s.typ, s.element)
		}
	}
	return nil
}

// wrap maps a fractional coordinate into [0,1).
func wrap(x float64) float64 {
	x -= math.Floor(x)
	if x >= 1 {
		x = 0
	}
	return x
}

// expand applies every operation to every asymmetric site and keeps one
// copy of each position. Two images of the same site closer than tol (Å,
// shortest periodic distance) are one site. Images of different rows that
// close share the site when both rows are partly occupied and their
// occupancies sum to at most 1 (a disordered site, summed as its mean
// charge); otherwise they are a collision, reported as an error. Sites are
// binned on a grid whose cells are at least tol wide in every direction, so
// each image is compared only with the sites in its own and the 26 adjacent
// grid cells.
func expand(c *crystal.Crystal, asym []asymSite, ops []Symop, tol float64, rd *reader) error {
	var owners [][]int // rows sharing each site
	g := newGrid(c, tol)
	for i, s := range asym {
		occupant := crystal.Occupant{Label: s.label, Element: s.element, Occupancy: s.occ, Charge: s.charge, ChargeKnown: s.known}
		for _, op := range ops {
			f := op.Apply(s.frac)
			for k := range f {
				f[k] = wrap(f[k])
			}
			j := g.find(c, f, tol)
			if j >= 0 {
				if slices.Contains(owners[j], i) {
					continue
				}
				site := &c.Sites[j]
				total := s.occ
				for _, o := range site.Occupants {
					total += o.Occupancy
				}
				if s.occ == 1 || total > 1+crystal.OccupancyTolerance {
					o := asym[owners[j][0]]
					return rd.errf(s.line, "_atom_site_label", ErrCollision,
						"an image of site %s falls within %g Å of site %s (line %d), and their occupancies sum to %g, more than 1; check the coordinates and occupancies", s.label, tol, o.label, o.line, total)
				}
				owners[j] = append(owners[j], i)
				site.Occupants = append(slices.Clone(site.Occupants), occupant)
				site.Species = crystal.Composition(site.Occupants)
				site.Charge = crystal.MeanCharge(site.Occupants)
				if site.Label != s.label {
					site.Label += "/" + s.label
				}
				continue
			}
			if len(c.Sites) >= maxSites {
				return rd.errf(0, "", ErrBadValue, "more than %d sites after symmetry expansion; that is beyond what this reader accepts", maxSites)
			}
			g.add(f, len(c.Sites))
			occ := []crystal.Occupant{occupant}
			c.Sites = append(c.Sites, crystal.Site{Label: s.label, Species: crystal.Composition(occ), Charge: crystal.MeanCharge(occ), Frac: f, Occupants: occ})
			owners = append(owners, []int{i})
		}
	}
	return nil
}

// grid bins sites by fractional position.
type grid struct {
	n    [3]int
	bins map[[3]int][]int
}

// maxBins bounds the grid divisions along one axis.
const maxBins = 1024

// newGrid divides each axis into cells at least tol wide: the spacing of
// the lattice planes normal to axis i is V/|a_j × a_k|.
func newGrid(c *crystal.Crystal, tol float64) *grid {
	g := &grid{bins: map[[3]int][]int{}}
	v := c.Volume()
	for i := 0; i < 3; i++ {
		cross := c.Lattice[(i+1)%3].Cross(c.Lattice[(i+2)%3]).Norm()
		n := 1
		if cross > 0 {
			if spacing := v / cross; spacing/tol < maxBins {
				n = int(spacing / tol)
			} else {
				n = maxBins
			}
		}
		if n < 1 {
			n = 1
		}
		g.n[i] = n
	}
	return g
}

func (g *grid) key(f crystal.Vec3) [3]int {
	var k [3]int
	for i := 0; i < 3; i++ {
		k[i] = int(f[i]*float64(g.n[i])) % g.n[i]
	}
	return k
}

func (g *grid) add(f crystal.Vec3, idx int) {
	k := g.key(f)
	g.bins[k] = append(g.bins[k], idx)
}

// find returns the index of a site within tol of f, or -1.
func (g *grid) find(c *crystal.Crystal, f crystal.Vec3, tol float64) int {
	k := g.key(f)
	for d0 := -1; d0 <= 1; d0++ {
		for d1 := -1; d1 <= 1; d1++ {
			for d2 := -1; d2 <= 1; d2++ {
				kk := [3]int{(k[0] + d0 + g.n[0]) % g.n[0], (k[1] + d1 + g.n[1]) % g.n[1], (k[2] + d2 + g.n[2]) % g.n[2]}
				for _, j := range g.bins[kk] {
					if periodicDistance(c, c.Sites[j].Frac, f) < tol {
						return j
					}
				}
			}
		}
	}
	return -1
}

// periodicDistance is the distance in Å between fractional positions f and
// g, taking the image that rounds their difference to the nearest lattice
// vector. That image is the nearest whenever the distance is small against
// the cell's plane spacings, which is the only case the merge step asks
// about (MaxMergeTolerance).
func periodicDistance(c *crystal.Crystal, f, g crystal.Vec3) float64 {
	var d crystal.Vec3
	for k := 0; k < 3; k++ {
		x := f[k] - g[k]
		d[k] = x - math.Round(x)
	}
	return c.Cartesian(d).Norm()
}

// neutral reports a charged cell with the charges per element.
func (rd *reader) neutral(c *crystal.Crystal) error {
	q := c.TotalCharge()
	if math.Abs(q) <= crystal.NeutralityTolerance {
		return nil
	}
	type sum struct {
		n int
		q float64
	}
	byKey := map[string]*sum{}
	var keys []string
	for _, s := range c.Sites {
		k := s.Label
		if byKey[k] == nil {
			byKey[k] = &sum{}
			keys = append(keys, k)
		}
		byKey[k].n++
		byKey[k].q = s.Charge
	}
	var parts []string
	for _, k := range keys {
		parts = append(parts, fmt.Sprintf("%d × %s %+g", byKey[k].n, k, byKey[k].q))
	}
	tag := "_atom_type_oxidation_number"
	line := rd.b.tagLine[tag]
	if line == 0 {
		tag = "_atom_site_fract_x"
		line = rd.b.inLoop[tag].lineOr(rd.b.tagLine[tag])
	}
	return rd.errf(line, tag, ErrNotNeutral,
		"the cell is not neutral: its charges sum to %+.6g e (%s); correct the oxidation numbers, or give charges by site label, type symbol or element", q, strings.Join(parts, ", "))
}

// formulaUnits returns Z from _cell_formula_units_Z, or else the greatest
// common divisor of the element counts in the cell (so Na4Cl4 gives 4 and
// Ti2O4 gives 2). Counts are weighted by occupancy; where they are not whole
// numbers and the file gives no Z, Z is 1. A given Z must divide every count
// of an ordered cell.
func (rd *reader) formulaUnits(c *crystal.Crystal) (int, error) {
	counts := map[string]int{}
	whole := true
	for el, n := range c.ElementCounts() {
		counts[el] = int(math.Round(n))
		whole = whole && math.Abs(n-math.Round(n)) < 1e-6 && counts[el] > 0
	}
	g := 0
	for _, n := range counts {
		g = notation.GCD(g, n)
	}
	if !whole || g == 0 {
		g = 1
	}
	zf, ok, err := rd.number("_cell_formula_units_z", nil)
	if err != nil {
		return 0, err
	}
	if !ok {
		return g, nil
	}
	z := int(math.Round(zf))
	line := rd.b.tagLine["_cell_formula_units_z"]
	if math.Abs(zf-float64(z)) > 1e-9 || z <= 0 {
		return 0, rd.errf(line, "_cell_formula_units_Z", ErrBadValue, "Z = %g must be a positive whole number", zf)
	}
	if whole && !rd.disordered() && g%z != 0 {
		var els []string
		for el := range counts {
			els = append(els, el)
		}
		sort.Strings(els)
		var parts []string
		for _, el := range els {
			parts = append(parts, fmt.Sprintf("%s %d", el, counts[el]))
		}
		return 0, rd.errf(line, "_cell_formula_units_Z", ErrBadValue,
			"Z = %d does not divide the cell content after symmetry expansion (%s); check that every symmetry operation is listed", z, strings.Join(parts, ", "))
	}
	return z, nil
}

// disordered reports a file with a partly occupied site.
func (rd *reader) disordered() bool {
	for _, s := range rd.asym {
		if s.occ < 1 {
			return true
		}
	}
	return false
}
