package ewald

import (
	"math"

	"enthalpath/thermo/crystal"
)

// This file: the reciprocal-space sums of small cells, on fixed-size arrays.

// smallSites is the largest cell (after reduction to its primitive cell)
// whose sums run on the small path (realSmall, reciprocalPairs): with more
// sites the pairs cost more per k-vector than structure factors (rutile,
// 6 sites, 15 pairs: 169k instructions against 128k on the general path);
// smallOrder is the largest index |mₖ| along any reciprocal axis it
// accepts. At 1e-10 every built-in prototype but rutile, spinel and
// corundum (6, 10 and 14 sites) qualifies: their primitive cells have 2 to
// 5 sites. The per-pair arrays then take about 1 kB on the stack, and the
// sums allocate nothing.
const (
	smallSites = 5
	smallOrder = 8
)

// structureSites is the largest cell whose reciprocal sum on the general
// path runs on reciprocalSmall (structure factors on stack arrays).
const structureSites = 8

// reciprocalPairs is reciprocalSpace for the small path (sumSmall): a
// cell of at most smallSites sites and reciprocal indices of at most
// smallOrder; it reports false, and leaves phi alone, for any other cell.
// It visits the same half space of k-vectors as reciprocalSpace (m₀ > 0,
// or m₀ = 0 and m₁ > 0, or m₀ = m₁ = 0 and m₂ > 0) with the same weights,
// so the two agree up to the order of summation.
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
func (s *system) reciprocalPairs(alpha, kc float64, phi []float64) (int, bool) {
	n := len(s.q)
	b, mmax := s.reciprocalBox(kc)
	if n > smallSites || mmax[0] > smallOrder || mmax[1] > smallOrder || mmax[2] > smallOrder {
		return 0, false
	}
	M0, M1, M2 := mmax[0], mmax[1], mmax[2]
	// Pairs half a lattice vector apart (2d = e integral, as the two sites
	// of rock salt's primitive cell) have cos(k·d) = (−1)^(m·e) exactly:
	// they need no phases, only each row's sum of weights or its
	// alternating sum, with the sign of m·e at the row's start. The other
	// pairs (np of them) carry phases.
	var pi, pj [smallPairs]int
	var half halfPairs
	np := 0
	for i := 0; i < n; i++ {
		for j := i + 1; j < n; j++ {
			D := s.frac[j].Sub(s.frac[i])
			if sameModulo(2*D[0]) && sameModulo(2*D[1]) && sameModulo(2*D[2]) {
				half.add(i, j, D)
				continue
			}
			pi[np], pj[np] = i, j
			np++
		}
	}
	// Per pair i < j, the phase steps e^{2πi·dₖ} of d = fⱼ − fᵢ along each
	// axis, e^{2πi·fⱼ}·conj(e^{2πi·fᵢ}) from one sine and cosine per site
	// and axis.
	var ph smallPhases
	if np > 0 {
		var cs, sn [3][smallSites]float64
		for j := 0; j < n; j++ {
			for k := 0; k < 3; k++ {
				sn[k][j], cs[k][j] = math.Sincos(2 * math.Pi * s.frac[j][k])
			}
		}
		for pp := 0; pp < np; pp++ {
			i, j := pi[pp], pj[pp]
			for k := 0; k < 3; k++ {
				ph.ur[k][pp] = cs[k][j]*cs[k][i] + sn[k][j]*sn[k][i]
				ph.ui[k][pp] = sn[k][j]*cs[k][i] - cs[k][j]*sn[k][i]
			}
			ph.p0r[pp] = 1
		}
	}

	// The metric of the reciprocal basis, k² = Σ mₖmₗ·gₖₗ, and the
	// exponentials every Gaussian factor is a product of.
	g00, g01, g02 := b[0].Dot(b[0]), b[0].Dot(b[1]), b[0].Dot(b[2])
	g11, g12, g22 := b[1].Dot(b[1]), b[1].Dot(b[2]), b[2].Dot(b[2])
	c4 := 1 / (4 * alpha * alpha)
	kc2, inv22 := kc*kc, 1/g22
	e00, e11, e22 := math.Exp(-c4*g00), math.Exp(-c4*g11), math.Exp(-c4*g22)
	x01, x02, x12 := math.Exp(-2*c4*g01), math.Exp(-2*c4*g02), math.Exp(-2*c4*g12)
	e11sq, e22sq, ix12 := e11*e11, e22*e22, 1/x12
	ie22sq := 1 / e22sq
	// The extent in m₁ of the plane m₀ within kc: the quadratic in m₁ of
	// the shortest k over real m₂.
	ea, eb, ec := g11-g12*g12*inv22, g01-g02*g12*inv22, g00-g02*g02*inv22
	iea := 1 / ea

	wsum, count := 0.0, 0
	u0r, u0i, u1r, u1i := ph.ur[0][:np:np], ph.ui[0][:np:np], ph.ur[1][:np:np], ph.ui[1][:np:np]
	p0r, p0i := ph.p0r[:np:np], ph.p0i[:np:np]
	var wrow [2*smallOrder + 1]float64 // the weights of one row
	c := ph.c[:np:np]
	// At m₁ = 0 of plane m₀: exp(−c₄m₀²g₀₀) (plane), its ratio to the next
	// plane, x₀₁^m₀ and x₀₂^m₀.
	plane, planeStep, x01m, x02m := 1.0, e00, 1.0, 1.0
	for m0 := 0; m0 <= M0; m0, plane, planeStep, x01m, x02m = m0+1, plane*planeStep, planeStep*e00*e00, x01m*x01, x02m*x02 {
		f0 := float64(m0)
		disc1 := eb*eb*f0*f0 - ea*(ec*f0*f0-kc2)
		if disc1 >= 0 {
			root := math.Sqrt(disc1)
			lo1 := max(int(math.Ceil((-eb*f0-root)*iea)), -M1)
			hi1 := min(int(math.Floor((-eb*f0+root)*iea)), M1)
			if m0 == 0 {
				lo1 = max(lo1, 0)
			}
			if lo1 <= hi1 {
				// Row values at m₁ = lo1, m₂ = 0: rowG = exp(−c₄|g|²) for
				// g = m₀b₀ + m₁b₁, its ratio to the next m₁ and
				// y = exp(−2c₄·g·b₂); the phases, pair by pair.
				rowG, rowStep, y := plane, e11*x01m, x02m
				down := e11 / x01m
				ph.start(np, lo1)
				ar, ai := ph.ar[:np:np], ph.ai[:np:np]
				for m := 0; m < lo1; m++ {
					rowG, rowStep, y = rowG*rowStep, rowStep*e11sq, y*x12
				}
				for m := 0; m > lo1; m-- {
					rowG, down, rowStep, y = rowG*down, down*e11sq, rowStep/e11sq, y*ix12
				}
				// g·b₂ = gbA + m₁g₁₂ and |g|² = ggA + m₁(ggB + m₁g₁₁).
				gbA, ggA, ggB := f0*g02, f0*f0*g00, 2*f0*g01
				for m1 := lo1; m1 <= hi1; m1, rowG, rowStep, y = m1+1, rowG*rowStep, rowStep*e11sq, y*x12 {
					f1 := float64(m1)
					gb := gbA + f1*g12
					gg := ggA + f1*(ggB+f1*g11)
					lo2, hi2 := 1, 0
					if disc := gb*gb - g22*(gg-kc2); disc >= 0 {
						root := math.Sqrt(disc)
						lo2 = max(int(math.Ceil((-gb-root)*inv22)), -M2)
						hi2 = min(int(math.Floor((-gb+root)*inv22)), M2)
						if m0 == 0 && m1 == 0 {
							lo2 = max(lo2, 1)
						}
					}
					if lo2 <= hi2 {
						// The weights of the row: exp(−c₄k²) from rowG by the
						// ratios up = y·e₂₂^(2m₂+1) to the next m₂ (down =
						// e₂₂^(1−2m₂)/y to the one before), each changing by
						// e₂₂² per step. A k-vector beyond kc by rounding
						// keeps its place with weight 0.
						gauss, up, down := rowG, y*e22, e22/y
						for m := 0; m < lo2; m++ {
							gauss, up = gauss*up, up*e22sq
						}
						for m := 0; m > lo2; m-- {
							gauss, down, up = gauss*down, down*e22sq, up*ie22sq
						}
						weights := wrow[:hi2-lo2+1]
						fm, tgb := float64(lo2), 2*gb
						rowSum, rowAlt, sign := 0.0, 0.0, 1.0
						for k := range weights {
							w := 0.0
							if k2 := gg + fm*(tgb+fm*g22); k2 <= kc2 && k2 > 0 {
								w = gauss / k2
								count++
							}
							weights[k] = w
							rowSum += w
							rowAlt += sign * w
							gauss, up, fm, sign = gauss*up, up*e22sq, fm+1, -sign
						}
						wsum += rowSum
						half.row(m0, m1, lo2, rowSum, rowAlt)
						// Each pair's phase from m₂ = 0 to lo2, then along the
						// row by e^{2πi·d₂}.
						for p := 0; p < np; p++ {
							br, bi, ur, ui := ph.ar[p], ph.ai[p], ph.ur[2][p], ph.ui[2][p]
							for m := 0; m < lo2; m++ {
								br, bi = br*ur-bi*ui, br*ui+bi*ur
							}
							for m := 0; m > lo2; m-- {
								br, bi = br*ur+bi*ui, bi*ur-br*ui
							}
							sum := 0.0
							for _, w := range weights {
								sum += w * br
								br, bi = br*ur-bi*ui, br*ui+bi*ur
							}
							c[p] += sum
						}
					}
					for p := range ar {
						ar[p], ai[p] = ar[p]*u1r[p]-ai[p]*u1i[p], ar[p]*u1i[p]+ai[p]*u1r[p]
					}
				}
			}
		}
		for p := range p0r {
			p0r[p], p0i[p] = p0r[p]*u0r[p]-p0i[p]*u0i[p], p0r[p]*u0i[p]+p0i[p]*u0r[p]
		}
	}
	pre := 8 * math.Pi / s.volume // both members of each ±k pair
	for i := 0; i < n; i++ {
		phi[i] += pre * s.q[i] * wsum
	}
	for pp := 0; pp < np; pp++ {
		i, j := pi[pp], pj[pp]
		phi[i] += pre * s.q[j] * ph.c[pp]
		phi[j] += pre * s.q[i] * ph.c[pp]
	}
	for h := 0; h < half.n; h++ {
		i, j := half.i[h], half.j[h]
		phi[i] += pre * s.q[j] * half.c[h]
		phi[j] += pre * s.q[i] * half.c[h]
	}
	return count, true
}

// halfPairs holds the pairs of sites of a small cell half a lattice vector
// apart: their sites, the parities e mod 2 of 2d, and the accumulated
// Σₖ wₖ·cos(k·dᵢⱼ) = Σₖ wₖ·(−1)^(m·e).
type halfPairs struct {
	i, j [smallPairs]int
	e    [smallPairs][3]int
	c    [smallPairs]float64
	n    int
}

// add records the pair i, j whose difference D is half a lattice vector.
func (h *halfPairs) add(i, j int, D crystal.Vec3) {
	for k := range D {
		h.e[h.n][k] = int(math.Round(2*D[k])) & 1
	}
	h.i[h.n], h.j[h.n] = i, j
	h.n++
}

// row adds a row of k-vectors (m₀, m₁, m₂ from lo2 on) with the sum and
// the alternating sum of its weights: along m₂ the sign (−1)^(m·e) stays
// when e₂ is even and alternates when it is odd.
func (h *halfPairs) row(m0, m1, lo2 int, sum, alt float64) {
	for p := 0; p < h.n; p++ {
		e := &h.e[p]
		v := sum
		if e[2] != 0 {
			v = alt
		}
		if (m0*e[0]+m1*e[1]+lo2*e[2])&1 != 0 {
			v = -v
		}
		h.c[p] += v
	}
}

// smallPhases holds, per pair of sites, the phase steps along the three
// reciprocal axes (ur, ui), the phase at the current m₀ and m₂ = 0 (p0),
// at the start of the current row (ar, ai) and the accumulated Σₖ wₖ·cos(k·dᵢⱼ) (c).
type smallPhases struct {
	ur, ui   [3][smallPairs]float64
	p0r, p0i [smallPairs]float64
	ar, ai   [smallPairs]float64
	c        [smallPairs]float64
}

// start sets the row phases to those of m₁ = m1 in the current plane.
func (ph *smallPhases) start(np, m1 int) {
	for p := 0; p < np; p++ {
		re, im := ph.p0r[p], ph.p0i[p]
		ur, ui := ph.ur[1][p], ph.ui[1][p]
		if m1 < 0 {
			ui = -ui
		}
		for m := 0; m < m1 || m < -m1; m++ {
			re, im = re*ur-im*ui, re*ui+im*ur
		}
		ph.ar[p], ph.ai[p] = re, im
	}
}

// smallPowers holds e^{2πi·m·f_jk} for every axis k, m in
// −smallOrder…smallOrder (stored at m+smallOrder) and site j.
type smallPowers struct {
	re, im [3][2*smallOrder + 1][structureSites]float64
}

// reciprocalSmall is reciprocalSpace for a cell of at most structureSites
// sites and reciprocal indices of at most smallOrder, on structure factors
// (its cost per k-vector grows as the sites, that of reciprocalPairs as
// the pairs: it serves the cells of 6 to 8 sites on the general path); it reports false,
// and leaves phi alone, for any other cell. It visits the same half space
// of k-vectors as reciprocalSpace (m₀ > 0, or m₀ = 0 and m₁ > 0, or
// m₀ = m₁ = 0 and m₂ > 0) with the same weights, so the two agree up to
// the order of summation.
func (s *system) reciprocalSmall(alpha, kc float64, phi []float64) (int, bool) {
	n := len(s.q)
	b, mmax := s.reciprocalBox(kc)
	if n > structureSites || mmax[0] > smallOrder || mmax[1] > smallOrder || mmax[2] > smallOrder {
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
	var out, pRe, pIm, eRe, eIm [structureSites]float64
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
