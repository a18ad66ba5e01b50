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

// smallPowers holds e^{2πi·m·f_jk} for every axis k, m in
// −smallOrder…smallOrder (stored at m+smallOrder) and site j.
type smallPowers struct {
	re, im [3][2*smallOrder + 1][smallSites]float64
}

// reciprocalSmall is reciprocalSpace for a cell of at most smallSites
// sites and reciprocal indices of at most smallOrder; it reports false,
// and leaves phi alone, for any other cell. It visits the same half space
// of k-vectors as reciprocalSpace (m₀ > 0, or m₀ = 0 and m₁ > 0, or
// m₀ = m₁ = 0 and m₂ > 0) with the same weights, so the two agree up to
// the order of summation.
func (s *system) reciprocalSmall(alpha, kc float64, phi []float64) (int, bool) {
	n := len(s.q)
	b, mmax := s.reciprocalBox(kc)
	if n > smallSites || mmax[0] > smallOrder || mmax[1] > smallOrder || mmax[2] > smallOrder {
		return 0, false
	}
	var pw smallPowers
	for k := 0; k < 3; k++ {
		for j := 0; j < n; j++ {
			// Powers by complex multiplication from one sine and cosine;
			// |m| ≤ smallOrder keeps the rounding of the recurrence near
			// smallOrder ulps.
			s1, c1 := math.Sincos(2 * math.Pi * s.frac[j][k])
			re, im := 1.0, 0.0
			pw.re[k][smallOrder][j] = 1
			for m := 1; m <= mmax[k]; m++ {
				re, im = re*c1-im*s1, re*s1+im*c1
				pw.re[k][smallOrder+m][j], pw.im[k][smallOrder+m][j] = re, im
				pw.re[k][smallOrder-m][j], pw.im[k][smallOrder-m][j] = re, -im
			}
		}
	}
	q := s.q[:n:n]
	var out, pRe, pIm, eRe, eIm [smallSites]float64
	kc2 := kc * kc
	inv4a2 := 1 / (4 * alpha * alpha)
	pre := 8 * math.Pi / s.volume // both members of each ±k pair
	// The metric of the reciprocal basis: k² = Σ mₖmₗ·(bₖ·bₗ) needs no
	// vector arithmetic per row.
	b00, b01, b02 := b[0].Dot(b[0]), b[0].Dot(b[1]), b[0].Dot(b[2])
	b11, b12 := b[1].Dot(b[1]), b[1].Dot(b[2])
	b2sq := b[2].Dot(b[2])
	stepRatio := math.Exp(-2 * b2sq * inv4a2)
	count := 0
	for m0 := 0; m0 <= mmax[0]; m0++ {
		lo1 := -mmax[1]
		if m0 == 0 {
			lo1 = 0
		}
		r0, i0 := &pw.re[0][smallOrder+m0], &pw.im[0][smallOrder+m0]
		for m1 := lo1; m1 <= mmax[1]; m1++ {
			// g = m₀b₀ + m₁b₁: gb = g·b₂ and gg = g·g.
			f0, f1 := float64(m0), float64(m1)
			gb := f0*b02 + f1*b12
			gg := f0*(f0*b00+2*f1*b01) + f1*f1*b11
			disc := gb*gb - b2sq*(gg-kc2)
			if disc < 0 {
				continue
			}
			root := math.Sqrt(disc)
			lo2 := max(int(math.Ceil((-gb-root)/b2sq)), -mmax[2])
			hi2 := min(int(math.Floor((-gb+root)/b2sq)), mmax[2])
			if m0 == 0 && m1 == 0 {
				lo2 = max(lo2, 1)
			}
			if lo2 > hi2 {
				continue
			}
			r1, i1 := &pw.re[1][smallOrder+m1], &pw.im[1][smallOrder+m1]
			for j := 0; j < n; j++ {
				pRe[j] = r0[j]*r1[j] - i0[j]*i1[j]
				pIm[j] = r0[j]*i1[j] + i0[j]*r1[j]
			}
			// exp(−k²/4α²) along the row by a multiplicative recurrence,
			// as in reciprocalSpace.
			gauss := math.Exp(-(gg + float64(lo2)*(2*gb+float64(lo2)*b2sq)) * inv4a2)
			step := math.Exp(-(2*gb + float64(2*lo2+1)*b2sq) * inv4a2)
			for m2 := lo2; m2 <= hi2; m2, gauss, step = m2+1, gauss*step, step*stepRatio {
				fm := float64(m2)
				k2 := gg + fm*(2*gb+fm*b2sq)
				if k2 > kc2 || k2 <= 0 {
					continue
				}
				count++
				w := pre * gauss / k2
				r2, i2 := &pw.re[2][smallOrder+m2], &pw.im[2][smallOrder+m2]
				var sRe, sIm float64
				for j := 0; j < n; j++ {
					er := pRe[j]*r2[j] - pIm[j]*i2[j]
					ei := pRe[j]*i2[j] + pIm[j]*r2[j]
					eRe[j], eIm[j] = er, ei
					sRe += q[j] * er
					sIm += q[j] * ei
				}
				sRe, sIm = w*sRe, w*sIm
				// Re(S·conj(e_j)) = sRe·eRe + sIm·eIm.
				for j := 0; j < n; j++ {
					out[j] += sRe*eRe[j] + sIm*eIm[j]
				}
			}
		}
	}
	for j := 0; j < n; j++ {
		phi[j] += out[j]
	}
	return count, true
}
