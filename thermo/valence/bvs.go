package valence

import (
	"math"

	"enthalpath/thermo/crystal"
)

// B is the bond-valence softness b in Å (Brown and Altermatt 1985).
const B = 0.37

// softness is the b and cut-off of one computation of sums: bonds count
// up to R_ij + extra.
type softness struct{ b, extra float64 }

// standard is B with a cut-off of b·ln 1000 beyond R_ij, so a bond left
// out has a valence below 0.001.
var standard = softness{B, B * math.Log(1000)}

// MaxSumSites bounds the cells whose bond-valence sums are computed: the
// pair search grows as the square of the sites.
const MaxSumSites = 5000

// maxImageWork bounds the periodic images examined for one cell's sums (a
// cell far smaller than its bonds would need millions per pair); beyond
// it the sums are not computed.
const maxImageWork = 5e7

// Element holds one element's bond-valence parameters in the scheme of
// O'Keeffe and Brese (1991).
type Element struct {
	R float64 // size parameter r, Å
	C float64 // electronegativity parameter c
}

// Params maps element symbols to their parameters.
type Params map[string]Element

// PairR returns R_ij of O'Keeffe and Brese (1991) for elements a and b.
func PairR(a, b Element) float64 {
	d := math.Sqrt(a.C) - math.Sqrt(b.C)
	return a.R + b.R - a.R*b.R*d*d/(a.C*a.R+b.C*b.R)
}

// species is one occupant of a site as the sums see it.
type species struct {
	site    int
	element string
	occ     float64
	role    int // +1 cation, −1 anion, 0 neither
}

// occupantsOf lists the species of every site, each with its role read
// from its element and charge; a site without occupants is one species
// named by its Species.
func occupantsOf(c *crystal.Crystal, role func(element string, charge float64) int) []species {
	var out []species
	for i, s := range c.Sites {
		if s.Occupants == nil {
			out = append(out, species{site: i, element: s.Species, occ: 1, role: role(s.Species, s.Charge)})
			continue
		}
		for _, o := range s.Occupants {
			out = append(out, species{site: i, element: o.Element, occ: o.Occupancy, role: role(o.Element, o.Charge)})
		}
	}
	return out
}

// speciesSums returns the bond-valence sum of each species (NaN where an
// element has no parameters or the species is neither cation nor anion).
func speciesSums(c *crystal.Crystal, sp []species, p Params, soft softness) []float64 {
	sums := make([]float64, len(sp))
	red := &crystal.Crystal{Lattice: crystal.ReduceBasis(c.Lattice)}
	recip := red.Reciprocal()
	frac := make([]crystal.Vec3, len(c.Sites))
	for i, s := range c.Sites {
		f := red.Fractional(c.Cartesian(s.Frac))
		for k := range f {
			f[k] -= math.Floor(f[k])
		}
		frac[i] = f
	}
	var bLen [3]float64
	for k := range recip {
		bLen[k] = recip[k].Norm()
	}
	for a := range sp {
		if _, ok := p[sp[a].element]; !ok || sp[a].role == 0 {
			sums[a] = math.NaN()
		}
	}
	work := 0.0
	for a := range sp {
		if math.IsNaN(sums[a]) || sp[a].role <= 0 {
			continue
		}
		pa := p[sp[a].element]
		for b := range sp {
			if math.IsNaN(sums[b]) || sp[b].role >= 0 {
				continue
			}
			r0 := PairR(pa, p[sp[b].element])
			rc := r0 + soft.extra
			df := frac[sp[b].site].Sub(frac[sp[a].site])
			v := 0.0
			var lo, hi [3]int
			box := 1.0
			for k := 0; k < 3; k++ {
				box *= 2*rc*bLen[k] + 1
			}
			if work += box; !(work <= maxImageWork) {
				for i := range sums {
					sums[i] = math.NaN()
				}
				return sums
			}
			for k := 0; k < 3; k++ {
				lo[k] = int(math.Ceil(-df[k] - rc*bLen[k]))
				hi[k] = int(math.Floor(-df[k] + rc*bLen[k]))
			}
			for n0 := lo[0]; n0 <= hi[0]; n0++ {
				for n1 := lo[1]; n1 <= hi[1]; n1++ {
					for n2 := lo[2]; n2 <= hi[2]; n2++ {
						d := red.Cartesian(crystal.Vec3{df[0] + float64(n0), df[1] + float64(n1), df[2] + float64(n2)}).Norm()
						if d < rc && d > 0 {
							v += math.Exp((r0 - d) / soft.b)
						}
					}
				}
			}
			sums[a] += v * sp[b].occ
			sums[b] += v * sp[a].occ
		}
	}
	return sums
}

// Sums returns the bond-valence sum of every site of c whose charges are
// set, in the order of the sites: for a site shared by several species the
// occupancy-weighted mean of theirs. A site is a cation where its charge is
// positive, an anion where negative; NaN marks a site with an element
// missing from p, a site of zero charge, and every site of a cell larger
// than MaxSumSites.
func Sums(c *crystal.Crystal, p Params) []float64 { return sums(c, p, standard) }

func sums(c *crystal.Crystal, p Params, soft softness) []float64 {
	out := make([]float64, len(c.Sites))
	if len(c.Sites) > MaxSumSites {
		for i := range out {
			out[i] = math.NaN()
		}
		return out
	}
	// Roles by the sign of each occupant's charge.
	sp := occupantsOf(c, func(_ string, charge float64) int { return sign(charge) })
	bvs := speciesSums(c, sp, p, soft)
	w := make([]float64, len(c.Sites))
	for a, s := range sp {
		out[s.site] += s.occ * bvs[a]
		w[s.site] += s.occ
	}
	for i := range out {
		out[i] /= w[i]
	}
	return out
}

func sign(q float64) int {
	switch {
	case q > 0:
		return 1
	case q < 0:
		return -1
	}
	return 0
}
