package ewald

import "math"

// This file: the reciprocal-space sum of a small cell, on fixed-size arrays.

// smallSites is the largest cell (after reduction to its primitive cell)
// whose reciprocal sum runs on reciprocalSmall; smallOrder is the largest
// index |mₖ| along any reciprocal axis it accepts. At 1e-10 every built-in
// prototype but spinel and corundum (10 and 14 sites) qualifies: their
// primitive cells have 2 to 6 sites and |mₖ| ≤ 5. The tables then take
// 3·(2·smallOrder+1)·smallSites complex numbers (6.5 kB) on the stack,
// and the sum allocates nothing.
const (
	smallSites = 8
	smallOrder = 8
)

// reciprocalSmall is reciprocalSpace for a cell of at most smallSites
// sites and reciprocal indices of at most smallOrder; it reports false,
// and leaves phi alone, for any other cell. It visits the same half space
// of k-vectors as reciprocalSpace (m₀ > 0, or m₀ = 0 and m₁ > 0, or
// m₀ = m₁ = 0 and m₂ > 0) with the same weights, so the two agree up to
// the order of summation.
//
// It works on pairs rather than on structure factors:
// Re(S(k)·e^{−ik·rᵢ}) = Σⱼ qⱼ·cos(k·(rⱼ−rᵢ)), so with wₖ the weight of k,
// φᵢ = qᵢ·Σₖwₖ + Σ_{j≠i} qⱼ·Cᵢⱼ where Cᵢⱼ = Σₖ wₖ·cos(k·dᵢⱼ): per k-vector
// one product and one sum for each pair, which for the two to five sites
// of most primitive cells is less than a structure factor's. The phase of
// dᵢⱼ along each reciprocal axis goes by complex multiplication (along m₀
// and m₁ as recurrences, along m₂ from a table of its powers), and the
// Gaussian factor exp(−k²/4α²) by multiplication from three exponentials
// per plane of constant m₀: it is the product of the row's value at
// m₂ = 0 and of ratios that change by constant factors from one m₁, or
// m₂, to the next.
func (s *system) reciprocalSmall(alpha, kc float64, phi []float64) (int, bool) {
	n := len(s.q)
	b, mmax := s.reciprocalBox(kc)
	if n > smallSites || mmax[0] > smallOrder || mmax[1] > smallOrder || mmax[2] > smallOrder {
		return 0, false
	}
	M0, M1, M2 := mmax[0], mmax[1], mmax[2]
	// Per site and axis, e^{2πi·fₖ}; per pair i < j, the phase steps along
	// axes 0 and 1, the start of the m₁ loop e^{−2πi·M₁·d₁} and the powers
	// e^{2πi·m·d₂}, m = 0…M₂ (negative m by conjugation).
	var cs, sn [3][smallSites]float64
	for j := 0; j < n; j++ {
		for k := 0; k < 3; k++ {
			sn[k][j], cs[k][j] = math.Sincos(2 * math.Pi * s.frac[j][k])
		}
	}
	np := n * (n - 1) / 2
	var u0r, u0i, u1r, u1i, s1r, s1i, p0r, p0i, c [smallPairs]float64
	var t2r, t2i [smallOrder + 1][smallPairs]float64
	pp := 0
	for i := 0; i < n; i++ {
		for j := i + 1; j < n; j++ {
			// e^{2πi·(fⱼ−fᵢ)} = e^{2πi·fⱼ}·conj(e^{2πi·fᵢ}).
			u0r[pp], u0i[pp] = cs[0][j]*cs[0][i]+sn[0][j]*sn[0][i], sn[0][j]*cs[0][i]-cs[0][j]*sn[0][i]
			u1r[pp], u1i[pp] = cs[1][j]*cs[1][i]+sn[1][j]*sn[1][i], sn[1][j]*cs[1][i]-cs[1][j]*sn[1][i]
			u2r, u2i := cs[2][j]*cs[2][i]+sn[2][j]*sn[2][i], sn[2][j]*cs[2][i]-cs[2][j]*sn[2][i]
			re, im := 1.0, 0.0
			t2r[0][pp] = 1
			for m := 1; m <= M2; m++ {
				re, im = re*u2r-im*u2i, re*u2i+im*u2r
				t2r[m][pp], t2i[m][pp] = re, im
			}
			re, im = 1.0, 0.0
			for m := 1; m <= M1; m++ {
				re, im = re*u1r[pp]-im*u1i[pp], re*u1i[pp]+im*u1r[pp]
			}
			s1r[pp], s1i[pp] = re, -im
			p0r[pp] = 1
			pp++
		}
	}
	u0r2, u0i2, u1r2, u1i2 := u0r[:np:np], u0i[:np:np], u1r[:np:np], u1i[:np:np]
	p0r2, p0i2, c2 := p0r[:np:np], p0i[:np:np], c[:np:np]

	// The metric of the reciprocal basis: k² = Σ mₖmₗ·(bₖ·bₗ).
	g00, g01, g02 := b[0].Dot(b[0]), b[0].Dot(b[1]), b[0].Dot(b[2])
	g11, g12, g22 := b[1].Dot(b[1]), b[1].Dot(b[2]), b[2].Dot(b[2])
	c4 := 1 / (4 * alpha * alpha)
	kc2, inv22 := kc*kc, 1/g22
	e22 := math.Exp(-c4 * g22)
	e22sq, e11sq, x12 := e22*e22, math.Exp(-2*c4*g11), math.Exp(-2*c4*g12)
	wsum := 0.0
	count := 0
	for m0 := 0; m0 <= M0; m0++ {
		lo1 := -M1
		if m0 == 0 {
			lo1 = 0
		}
		// Along m₁ at m₂ = 0: the phase, the Gaussian factor rowG, its
		// ratio to the next m₁, and y = exp(−2c₄·g·b₂) for g = m₀b₀ + m₁b₁.
		var ar, ai [smallPairs]float64
		for p := range p0r2 {
			if lo1 == 0 {
				ar[p], ai[p] = p0r2[p], p0i2[p]
			} else {
				ar[p], ai[p] = p0r2[p]*s1r[p]-p0i2[p]*s1i[p], p0r2[p]*s1i[p]+p0i2[p]*s1r[p]
			}
		}
		f0, fl := float64(m0), float64(lo1)
		rowG := math.Exp(-c4 * (f0*(f0*g00+2*fl*g01) + fl*fl*g11))
		rowStep := math.Exp(-c4 * ((2*fl+1)*g11 + 2*f0*g01))
		y := math.Exp(-2 * c4 * (f0*g02 + fl*g12))
		for m1 := lo1; m1 <= M1; m1, rowG, rowStep, y = m1+1, rowG*rowStep, rowStep*e11sq, y*x12 {
			f1 := float64(m1)
			gb := f0*g02 + f1*g12
			gg := f0*(f0*g00+2*f1*g01) + f1*f1*g11
			disc := gb*gb - g22*(gg-kc2)
			lo2, hi2 := 1, 0
			if disc >= 0 {
				root := math.Sqrt(disc)
				lo2 = max(int(math.Ceil((-gb-root)*inv22)), -M2)
				hi2 = min(int(math.Floor((-gb+root)*inv22)), M2)
				if m0 == 0 && m1 == 0 {
					lo2 = max(lo2, 1)
				}
			}
			if lo2 <= hi2 {
				pr, pi := ar[:np:np], ai[:np:np] // the phase of the row at m₂ = 0
				// m₂ ≥ 0: exp(−c₄k²) rises from rowG by ratios y·e₂₂^(2m₂+1).
				if hi2 >= 0 {
					gauss, up := rowG, y*e22
					first := max(lo2, 0)
					for m := 0; m < first; m++ {
						gauss, up = gauss*up, up*e22sq
					}
					for m2 := first; m2 <= hi2; m2, gauss, up = m2+1, gauss*up, up*e22sq {
						fm := float64(m2)
						k2 := gg + fm*(2*gb+fm*g22)
						if k2 > kc2 || k2 <= 0 {
							continue
						}
						count++
						w := gauss / k2
						wsum += w
						tr, ti := t2r[m2][:np:np], t2i[m2][:np:np]
						for p := range c2 {
							c2[p] += w * (pr[p]*tr[p] - pi[p]*ti[p])
						}
					}
				}
				// m₂ < 0: ratios e₂₂^(1−2m₂)/y going down, phases conjugated.
				if lo2 < 0 {
					gauss, down := rowG, e22/y
					first := min(hi2, -1)
					for m := 0; m > first; m-- {
						gauss, down = gauss*down, down*e22sq
					}
					for m2 := first; m2 >= lo2; m2, gauss, down = m2-1, gauss*down, down*e22sq {
						fm := float64(m2)
						k2 := gg + fm*(2*gb+fm*g22)
						if k2 > kc2 || k2 <= 0 {
							continue
						}
						count++
						w := gauss / k2
						wsum += w
						tr, ti := t2r[-m2][:np:np], t2i[-m2][:np:np]
						for p := range c2 {
							c2[p] += w * (pr[p]*tr[p] + pi[p]*ti[p])
						}
					}
				}
			}
			for p := range u1r2 {
				ar[p], ai[p] = ar[p]*u1r2[p]-ai[p]*u1i2[p], ar[p]*u1i2[p]+ai[p]*u1r2[p]
			}
		}
		for p := range u0r2 {
			p0r2[p], p0i2[p] = p0r2[p]*u0r2[p]-p0i2[p]*u0i2[p], p0r2[p]*u0i2[p]+p0i2[p]*u0r2[p]
		}
	}
	pre := 8 * math.Pi / s.volume // both members of each ±k pair
	pp = 0
	for i := 0; i < n; i++ {
		phi[i] += pre * s.q[i] * wsum
		for j := i + 1; j < n; j++ {
			phi[i] += pre * s.q[j] * c[pp]
			phi[j] += pre * s.q[i] * c[pp]
			pp++
		}
	}
	return count, true
}
