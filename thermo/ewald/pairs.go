package ewald

import (
	"fmt"
	"math"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
)

// Pairs holds the Ewald pair potentials Φᵢⱼ between chosen sites of a cell
// (the rows) and every site (the columns): the energy of any neutral
// assignment of charges q to the sites is
//
//	E = ½ Σᵢⱼ qᵢ·qⱼ·Φᵢⱼ,
//
// with Φᵢⱼ = k·[Σₙ' erfc(α|rⱼ−rᵢ+n|)/|rⱼ−rᵢ+n| + (4π/V)·Σ_{k≠0}
// exp(−k²/4α²)/k²·cos(k·(rⱼ−rᵢ)) − δᵢⱼ·2α/√π], the bilinear form of Sum's
// formula (see the package documentation). It is what a search over
// orderings of charges on fixed sites needs: one evaluation of Φ, then any
// ordering's energy, or the change of a swap, from sums of its entries.
// The charges of the crystal's sites are not used.
type Pairs struct {
	// Rows are the site indices of the rows, in the order asked for.
	Rows []int
	// Sites is the number of columns (every site of the cell).
	Sites int
	// Phi holds Φ in eV per e², row by row: Phi[r*Sites+j] is Φ between
	// site Rows[r] and site j.
	Phi []float64
	// Alpha, RealCutoff and RecipCutoff are the splitting parameter (1/Å)
	// and the cut-offs (Å, 1/Å with 2π) used.
	Alpha, RealCutoff, RecipCutoff float64
}

// At returns Φ between site Rows[r] and site j.
func (p *Pairs) At(r, j int) float64 { return p.Phi[r*p.Sites+j] }

// PairPotentials evaluates the pair potentials between the sites rows of c
// and all its sites, with the splitting parameter and cut-offs Sum would
// choose for c at opt.Accuracy (the energies formed from them agree with
// Sum's to that relative accuracy for charges of similar magnitudes on
// every site). Two sites at one position are an error.
func PairPotentials(c *crystal.Crystal, rows []int, opt Options) (*Pairs, error) {
	if c == nil || len(c.Sites) == 0 {
		return nil, fmt.Errorf("Ewald pair potentials: no sites")
	}
	if v := c.Volume(); !(v > 1e-6) || math.IsInf(v, 0) {
		return nil, fmt.Errorf("Ewald pair potentials of %q: degenerate cell (volume %g Å³)", c.Name, v)
	}
	for _, r := range rows {
		if r < 0 || r >= len(c.Sites) {
			return nil, fmt.Errorf("Ewald pair potentials of %q: no site %d", c.Name, r+1)
		}
	}
	eps := opt.Accuracy
	if eps == 0 {
		eps = DefaultAccuracy
	}
	if math.IsNaN(eps) || eps < 0 || eps > CoarsestAccuracy {
		return nil, fmt.Errorf("relative accuracy %g must be greater than 0 and at most %g (default %g): %w",
			opt.Accuracy, CoarsestAccuracy, DefaultAccuracy, ErrBadOptions)
	}
	s := newSystem(c, false)
	for i := range s.q {
		s.q[i] = 1 // unit charges: the Kolafa–Perram estimate with Q = N
	}
	s.q2 = float64(len(s.q))
	p := math.Sqrt(-math.Log(math.Max(eps, FinestAccuracy) / 2))
	alpha := opt.alpha
	if alpha == 0 {
		alpha = s.chooseAlpha(p)
	}
	rc, kc := p/alpha, 2*alpha*p
	n := len(s.q)
	if w := s.work(alpha, rc, kc) * float64(len(rows)+1) / float64(n+1); w > maxTerms {
		return nil, fmt.Errorf("Ewald pair potentials of %q with %d sites need about %.3g terms (limit %.3g): %w",
			c.Name, n, w, float64(maxTerms), ErrTooLarge)
	}
	out := &Pairs{Rows: append([]int(nil), rows...), Sites: n, Phi: make([]float64, len(rows)*n),
		Alpha: alpha, RealCutoff: rc, RecipCutoff: kc}
	imv := newImageSum(s, alpha, rc)
	im := &imv
	selfSum, _, _, _ := im.sum(crystal.Vec3{}, crystal.Vec3{}, true)
	self := selfSum - 2*alpha/math.Sqrt(math.Pi)
	for r, i := range rows {
		row := out.Phi[r*n : (r+1)*n]
		for j := 0; j < n; j++ {
			if j == i {
				row[j] = self
				continue
			}
			sum, _, _, overlap := im.sum(s.frac[j].Sub(s.frac[i]), s.pos[j].Sub(s.pos[i]), false)
			if overlap {
				return nil, fmt.Errorf("Ewald pair potentials of %q: sites %d (%s) and %d (%s) sit at the same position (closer than %g Å)",
					c.Name, i+1, c.Sites[i].Species, j+1, c.Sites[j].Species, coincident)
			}
			row[j] = sum
		}
	}
	s.pairReciprocal(alpha, kc, rows, out.Phi)
	for k := range out.Phi {
		out.Phi[k] *= thermo.CoulombEVAngstrom
	}
	return out, nil
}

// pairReciprocal adds (4π/V)·Σ_{k≠0} exp(−k²/4α²)/k²·cos(k·(rⱼ−rᵢ)) to
// phi[r·N+j] for i = rows[r], over |k| ≤ kc (each ±k pair once, doubled).
func (s *system) pairReciprocal(alpha, kc float64, rows []int, phi []float64) {
	n := len(s.q)
	b, mmax := s.reciprocalBox(kc)
	cosK, sinK := make([]float64, n), make([]float64, n)
	pre := 8 * math.Pi / s.volume
	inv4a2 := 1 / (4 * alpha * alpha)
	for m0 := 0; m0 <= mmax[0]; m0++ {
		for m1 := -mmax[1]; m1 <= mmax[1]; m1++ {
			for m2 := -mmax[2]; m2 <= mmax[2]; m2++ {
				if m0 == 0 && (m1 < 0 || m1 == 0 && m2 <= 0) {
					continue // one of each ±k pair, and not k = 0
				}
				k := b[0].Scale(float64(m0)).Add(b[1].Scale(float64(m1))).Add(b[2].Scale(float64(m2)))
				k2 := k.Dot(k)
				if k2 > kc*kc {
					continue
				}
				w := pre * math.Exp(-k2*inv4a2) / k2
				for j := 0; j < n; j++ {
					sinK[j], cosK[j] = math.Sincos(k.Dot(s.pos[j]))
				}
				for r, i := range rows {
					ci, si := w*cosK[i], w*sinK[i]
					row := phi[r*n : (r+1)*n]
					for j := range row {
						row[j] += ci*cosK[j] + si*sinK[j]
					}
				}
			}
		}
	}
}
