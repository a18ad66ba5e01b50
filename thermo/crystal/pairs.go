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

// PairShells returns the pair shells of c out to cutoff Å, shortest
// first, and for each kind the pair density beyond the cutoff: Density[k]
// is the number of pairs of kind k per formula unit per Å³ of separation
// space, so that a continuum tail ∫_cutoff^∞ φ(r)·Density·4πr²dr completes a
// sum of a fast-decaying φ (the r⁻⁶ and r⁻⁸ dispersion sums). Distances
// that agree to 1e-6 Å form one shell. Sites of zero charge are skipped.
func (c *Crystal) PairShells(cutoff float64) (shells []PairShell, density [3]float64, err error) {
	if err := c.Validate(); err != nil {
		return nil, density, err
	}
	if !(cutoff > 0) || math.IsInf(cutoff, 0) {
		return nil, density, fmt.Errorf("crystal %q: pair cutoff %g Å must be a positive distance", c.Name, cutoff)
	}
	r := c.reduced()
	recip := r.Reciprocal()
	// Images n with |df + n| ≤ cutoff have |df_k + n_k| ≤ cutoff·|b_k|.
	var span [3]int
	for k := range span {
		span[k] = int(math.Ceil(cutoff*recip[k].Norm())) + 1
	}
	z := float64(c.FormulaUnits)
	type key struct {
		kind PairKind
		d    int64
	}
	acc := map[key]float64{}
	var nPos, nNeg float64
	for _, s := range r.Sites {
		switch {
		case s.Charge > 0:
			nPos++
		case s.Charge < 0:
			nNeg++
		}
	}
	const grain = 1e6 // distances rounded to 1e-6 Å
	for i, si := range r.Sites {
		if si.Charge == 0 {
			continue
		}
		for j, sj := range r.Sites {
			if sj.Charge == 0 {
				continue
			}
			kind := CationAnion
			switch {
			case si.Charge > 0 && sj.Charge > 0:
				kind = CationCation
			case si.Charge < 0 && sj.Charge < 0:
				kind = AnionAnion
			}
			df := sj.Frac.Sub(si.Frac)
			for n0 := -span[0]; n0 <= span[0]; n0++ {
				for n1 := -span[1]; n1 <= span[1]; n1++ {
					for n2 := -span[2]; n2 <= span[2]; n2++ {
						if i == j && n0 == 0 && n1 == 0 && n2 == 0 {
							continue
						}
						f := Vec3{df[0] + float64(n0), df[1] + float64(n1), df[2] + float64(n2)}
						d := r.Cartesian(f).Norm()
						if d > cutoff || d < 1e-9 {
							continue
						}
						// Each unordered pair is met twice in this ordered sum.
						acc[key{kind, int64(math.Round(d * grain))}] += 0.5 / z
					}
				}
			}
		}
	}
	shells = make([]PairShell, 0, len(acc))
	for k, n := range acc {
		shells = append(shells, PairShell{Kind: k.kind, Distance: float64(k.d) / grain, Count: n})
	}
	sort.Slice(shells, func(a, b int) bool {
		if shells[a].Distance != shells[b].Distance {
			return shells[a].Distance < shells[b].Distance
		}
		return shells[a].Kind < shells[b].Kind
	})
	v := c.Volume()
	// Pairs per formula unit: (centres per cell)·(partners per Å³)/Z, halved
	// for like pairs, which the sum over centres counts twice.
	density[CationCation] = 0.5 * nPos * nPos / v / z
	density[CationAnion] = nPos * nNeg / v / z
	density[AnionAnion] = 0.5 * nNeg * nNeg / v / z
	return shells, density, nil
}
