package crystal

import (
	"fmt"
	"math"
	"sort"
)

// PairKind says which ions a pair joins, by the sign of their charges.
type PairKind int

const (
	// CationCation pairs two positive sites.
	CationCation PairKind = iota
	// CationAnion pairs a positive with a negative site.
	CationAnion
	// AnionAnion pairs two negative sites.
	AnionAnion
)

// String names the kind: "+ +", "+ −", "− −".
func (k PairKind) String() string {
	switch k {
	case CationCation:
		return "+ +"
	case CationAnion:
		return "+ −"
	case AnionAnion:
		return "− −"
	}
	return "?"
}

// PairShell is every pair of one kind at one distance, counted per
// formula unit: Σ over the shells of Count·φ(Distance) is the lattice sum
// of a pair potential φ per formula unit (each unordered pair once).
type PairShell struct {
	Kind     PairKind
	Distance float64 // Å
	Count    float64 // pairs per formula unit
}

// PairSums are the lattice sums of a structure that a pair potential
// needs, per formula unit (each unordered pair once).
type PairSums struct {
	// Short are the pair shells out to the short cutoff, shortest first.
	Short []PairShell
	// InvPow6 and InvPow8 are Σ count/r⁶ (Å⁻⁶) and Σ count/r⁸ (Å⁻⁸) per
	// kind over every pair out to the cutoff, completed by the continuum
	// tail ∫_cutoff^∞ r⁻ᵖ·n·4πr²dr, n the pair density of the kind.
	InvPow6, InvPow8 [3]float64
}

// PairSums returns the r⁻⁶ and r⁻⁸ sums of c out to cutoff Å (with their
// tails) and the shells out to short Å. Distances that agree to 1e-6 Å
// form one shell. Sites of zero charge are skipped.
func (c *Crystal) PairSums(cutoff, short float64) (PairSums, error) {
	var out PairSums
	if err := c.Validate(); err != nil {
		return out, err
	}
	if !(cutoff > 0) || math.IsInf(cutoff, 0) || !(short >= 0) || short > cutoff {
		return out, fmt.Errorf("crystal %q: pair cutoffs %g and %g Å must be positive, the short one not beyond the other", c.Name, cutoff, short)
	}
	r := c.reduced()
	recip := r.Reciprocal()
	var span [3]int
	for k := range span {
		span[k] = int(math.Ceil(cutoff*recip[k].Norm())) + 1
	}
	type site struct {
		pos  Vec3
		sign int
	}
	sites := make([]site, 0, len(r.Sites))
	var nPos, nNeg float64
	for _, s := range r.Sites {
		switch {
		case s.Charge > 0:
			sites = append(sites, site{r.Cartesian(s.Frac), 1})
			nPos++
		case s.Charge < 0:
			sites = append(sites, site{r.Cartesian(s.Frac), -1})
			nNeg++
		}
	}
	var shifts []Vec3
	for n0 := -span[0]; n0 <= span[0]; n0++ {
		for n1 := -span[1]; n1 <= span[1]; n1++ {
			for n2 := -span[2]; n2 <= span[2]; n2++ {
				shifts = append(shifts, r.Cartesian(Vec3{float64(n0), float64(n1), float64(n2)}))
			}
		}
	}
	z := float64(c.FormulaUnits)
	w := 0.5 / z // each unordered pair is met twice in the ordered sum
	cut2, short2 := cutoff*cutoff, short*short
	const grain = 1e6 // shells: distances rounded to 1e-6 Å
	type key struct {
		kind PairKind
		d    int64
	}
	acc := map[key]float64{}
	for _, si := range sites {
		for _, sj := range sites {
			kind := CationAnion
			switch {
			case si.sign > 0 && sj.sign > 0:
				kind = CationCation
			case si.sign < 0 && sj.sign < 0:
				kind = AnionAnion
			}
			d0 := sj.pos.Sub(si.pos)
			var s6, s8 float64
			for _, t := range shifts {
				x, y, zz := d0[0]+t[0], d0[1]+t[1], d0[2]+t[2]
				d2 := x*x + y*y + zz*zz
				if d2 > cut2 || d2 < 1e-18 {
					continue
				}
				inv2 := 1 / d2
				inv6 := inv2 * inv2 * inv2
				s6 += inv6
				s8 += inv6 * inv2
				if d2 <= short2 {
					acc[key{kind, int64(math.Round(math.Sqrt(d2) * grain))}] += w
				}
			}
			out.InvPow6[kind] += w * s6
			out.InvPow8[kind] += w * s8
		}
	}
	out.Short = make([]PairShell, 0, len(acc))
	for k, n := range acc {
		out.Short = append(out.Short, PairShell{Kind: k.kind, Distance: float64(k.d) / grain, Count: n})
	}
	sort.Slice(out.Short, func(a, b int) bool {
		if out.Short[a].Distance != out.Short[b].Distance {
			return out.Short[a].Distance < out.Short[b].Distance
		}
		return out.Short[a].Kind < out.Short[b].Kind
	})
	// Pairs per formula unit per Å³: (centres per cell)·(partners per Å³)/Z,
	// halved for like pairs, which the sum over centres counts twice.
	v := c.Volume()
	density := [3]float64{0.5 * nPos * nPos / v / z, nPos * nNeg / v / z, 0.5 * nNeg * nNeg / v / z}
	for k := range density {
		out.InvPow6[k] += 4 * math.Pi * density[k] / (3 * cutoff * cutoff * cutoff)
		out.InvPow8[k] += 4 * math.Pi * density[k] / (5 * math.Pow(cutoff, 5))
	}
	return out, nil
}
