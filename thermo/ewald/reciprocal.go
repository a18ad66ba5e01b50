package ewald

import (
	"math"

	"enthalpath/thermo/crystal"
)

// This file: the reciprocal-space sum (structure factors over k-vectors).

// reciprocalBox returns the reciprocal lattice vectors with 2π and the
// largest |mₖ| of a vector Σ mₖbₖ within kc: |mₖ| = |k·aₖ|/2π ≤ kc·|aₖ|/2π.
func (s *system) reciprocalBox(kc float64) (b [3]crystal.Vec3, mmax [3]int) {
	for k := 0; k < 3; k++ {
		b[k] = s.recip[k].Scale(2 * math.Pi)
		mmax[k] = int(math.Floor(kc * s.lat[k].Norm() / (2 * math.Pi)))
	}
	return b, mmax
}

// reciprocalSpace adds to phi[i] the reciprocal-space potential
// (4π/V)·Σ_{k≠0} exp(−k²/4α²)/k²·Re(S(k)·e^{−ik·rᵢ}), S(k) = Σⱼ qⱼe^{ik·rⱼ},
// over |k| ≤ kc, and returns the number of ±k pairs used. Each e^{ik·r} is
// built from per-site powers of e^{2πi·fₐ}, by multiplication only. A small
// cell takes reciprocalSmall (smallcell.go), every other one
// reciprocalGeneral.
func (s *system) reciprocalSpace(alpha, kc float64, phi []float64) int {
	if count, ok := s.reciprocalSmall(alpha, kc, phi); ok {
		return count
	}
	return s.reciprocalGeneral(alpha, kc, phi)
}

// reciprocalGeneral is reciprocalSpace for a cell of any size, on tables
// sized to the cell and in chunks that may run in parallel.
func (s *system) reciprocalGeneral(alpha, kc float64, phi []float64) int {
	n := len(s.q)
	b, mmax := s.reciprocalBox(kc)
	// pow[k][(m+M)*n + j] = e^{2πi·m·f_jk} as (re, im).
	var powRe, powIm [3][]float64
	size := 0
	for k := 0; k < 3; k++ {
		size += 2 * (2*mmax[k] + 1) * n
	}
	buf := make([]float64, size) // one allocation for the six tables
	for k := 0; k < 3; k++ {
		width := 2*mmax[k] + 1
		powRe[k], buf = buf[:width*n:width*n], buf[width*n:]
		powIm[k], buf = buf[:width*n:width*n], buf[width*n:]
		M := mmax[k]
		for j := 0; j < n; j++ {
			s1, c1 := math.Sincos(2 * math.Pi * s.frac[j][k])
			powRe[k][M*n+j], powIm[k][M*n+j] = 1, 0
			re, im := 1.0, 0.0
			for m := 1; m <= M; m++ {
				re, im = re*c1-im*s1, re*s1+im*c1
				// Resynchronise now and then to keep rounding from growing.
				if m%16 == 0 {
					im, re = math.Sincos(2 * math.Pi * float64(m) * s.frac[j][k])
				}
				powRe[k][(M+m)*n+j], powIm[k][(M+m)*n+j] = re, im
				powRe[k][(M-m)*n+j], powIm[k][(M-m)*n+j] = re, -im
			}
		}
	}
	kc2 := kc * kc
	inv4a2 := 1 / (4 * alpha * alpha)
	pre := 8 * math.Pi / s.volume // both members of each ±k pair
	b2sq := b[2].Dot(b[2])
	stepRatio := math.Exp(-2 * b2sq * inv4a2)
	M0, M1, M2 := mmax[0], mmax[1], mmax[2]

	type recipPart struct {
		phi   []float64
		count int
	}
	chunks := chunksFor(n)
	parts := make([]recipPart, chunks)
	forChunks(n, func(c int) {
		part := &parts[c]
		work := make([]float64, 7*n) // the chunk's potentials and six rows
		part.phi = work[:n:n]
		out := part.phi
		pRe, pIm := work[n:2*n:2*n], work[2*n:3*n:3*n]
		qpRe, qpIm := work[3*n:4*n:4*n], work[4*n:5*n:5*n]
		u, v := work[5*n:6*n:6*n], work[6*n:]
		// weight[M2+m2] is the weight of k-vector m2 of the current row (0
		// outside the sphere); pairs lists the row's |m2| with either sign
		// inside, two at a time.
		weight := make([]float64, 2*M2+1)
		pairs := make([]mirrorPair, 0, M2+1)
		rowIndex := -1
		for m0 := 0; m0 <= M0; m0++ {
			lo1 := -M1
			if m0 == 0 {
				lo1 = 0
			}
			for m1 := lo1; m1 <= M1; m1++ {
				// Rows (m0, m1) are dealt to the chunks in turn.
				if rowIndex++; rowIndex%chunks != c {
					continue
				}
				g := b[0].Scale(float64(m0)).Add(b[1].Scale(float64(m1)))
				gb := g.Dot(b[2])
				disc := gb*gb - b2sq*(g.Dot(g)-kc2)
				if disc < 0 {
					continue
				}
				root := math.Sqrt(disc)
				lo2 := max(int(math.Ceil((-gb-root)/b2sq)), -M2)
				hi2 := min(int(math.Floor((-gb+root)/b2sq)), M2)
				if m0 == 0 && m1 == 0 {
					lo2 = max(lo2, 1)
				}
				if lo2 > hi2 {
					continue
				}
				// Along the row k = g + m2·b3, k² = |g|² + 2·m2·g·b3 + m2²·|b3|²,
				// so exp(−k²/4α²) follows from one exponential by
				// multiplication.
				gg := g.Dot(g)
				k2lo := gg + float64(lo2)*(2*gb+float64(lo2)*b2sq)
				gauss := math.Exp(-k2lo * inv4a2)
				step := math.Exp(-(2*gb + float64(2*lo2+1)*b2sq) * inv4a2)
				clear(weight)
				vectors := 0
				for m2 := lo2; m2 <= hi2; m2, gauss, step = m2+1, gauss*step, step*stepRatio {
					fm := float64(m2)
					k2 := gg + fm*(2*gb+fm*b2sq)
					if k2 > kc2 || k2 <= 0 {
						continue
					}
					weight[M2+m2] = pre * gauss / k2
					vectors++
				}
				part.count += vectors
				pairs = pairs[:0]
				for m := 0; m <= max(hi2, -lo2); m++ {
					wp, wm := weight[M2+m], weight[M2-m]
					if m == 0 {
						wm = 0
					}
					if wp != 0 || wm != 0 {
						pairs = append(pairs, mirrorPair{m, wp, wm})
					}
				}
				r0, i0 := powRe[0][(M0+m0)*n:(M0+m0+1)*n], powIm[0][(M0+m0)*n:(M0+m0+1)*n]
				r1, i1 := powRe[1][(M1+m1)*n:(M1+m1+1)*n], powIm[1][(M1+m1)*n:(M1+m1+1)*n]
				for j, q := range s.q {
					re := r0[j]*r1[j] - i0[j]*i1[j]
					im := r0[j]*i1[j] + i0[j]*r1[j]
					pRe[j], pIm[j] = re, im
					qpRe[j], qpIm[j] = q*re, q*im
				}
				clear(u)
				clear(v)
				// Two entries at a time: the row's phases and the
				// potentials are read once for both.
				for k := 0; k < len(pairs); k += 2 {
					a := &pairs[k]
					za, zai := powRe[2][(M2+a.m)*n:(M2+a.m+1)*n], powIm[2][(M2+a.m)*n:(M2+a.m+1)*n]
					b := a // a lone last entry is taken with weights 0
					if k+1 < len(pairs) {
						b = &pairs[k+1]
					}
					zb, zbi := powRe[2][(M2+b.m)*n:(M2+b.m+1)*n], powIm[2][(M2+b.m)*n:(M2+b.m+1)*n]
					fa := mirrorSums(qpRe, qpIm, za, zai, zb, zbi)
					ca := a.coefficients(fa[0])
					cb := [4]float64{}
					if b != a {
						cb = b.coefficients(fa[1])
					}
					mirrorPotentials(u, v, za, zai, zb, zbi, ca, cb)
				}
				for j := range out {
					out[j] += pRe[j]*u[j] + pIm[j]*v[j]
				}
			}
		}
	})
	count := 0
	for c := range parts {
		for i, v := range parts[c].phi {
			phi[i] += v
		}
		count += parts[c].count
	}
	return count
}

// mirrorPair is the k-vectors m2 = +m and m2 = −m of one row of the
// reciprocal sum, with their weights (8π/V)·exp(−k²/4α²)/k² (0 for a
// vector outside the sphere, and for −m when m = 0). With p = e^{i(g·r)}
// the row's phase of a site and z = e^{im·b₃·r}, the two phases are p·z
// and p·z̄: both follow from the four products A = Re p·Re z, B = Im p·Im z,
// C = Re p·Im z, D = Im p·Re z (p·z = (A − B, C + D), p·z̄ = (A + B, D − C)),
// so the pair costs what one vector does, and rows of a nearly orthogonal
// cell are nearly symmetric in m2.
type mirrorPair struct {
	m           int
	plus, minus float64
}

// coefficients turns the charge-weighted sums f = (ΣqA, ΣqB, ΣqC, ΣqD) of
// the pair into the factors (a, b, c, d) of its potential at a site,
// Σ± w±·Re(S±·conj(phase±)) = Re p·(a·Re z + b·Im z) + Im p·(c·Im z + d·Re z).
func (mp *mirrorPair) coefficients(f [4]float64) [4]float64 {
	plusRe, plusIm := mp.plus*(f[0]-f[1]), mp.plus*(f[2]+f[3])
	minusRe, minusIm := mp.minus*(f[0]+f[1]), mp.minus*(f[3]-f[2])
	return [4]float64{plusRe + minusRe, plusIm - minusIm, minusRe - plusRe, plusIm + minusIm}
}

// mirrorSums returns, for two rows of z (za, zb), the charge-weighted
// products ΣqA, ΣqB, ΣqC, ΣqD of mirrorPair, from qp = q·p: eight
// independent sums, so no chain of dependent additions limits the loop;
// the order of summation is fixed.
func mirrorSums(qpRe, qpIm, zaRe, zaIm, zbRe, zbIm []float64) (f [2][4]float64) {
	n := len(qpRe)
	qpIm, zaRe, zaIm, zbRe, zbIm = qpIm[:n], zaRe[:n], zaIm[:n], zbRe[:n], zbIm[:n]
	var a0, a1, a2, a3, b0, b1, b2, b3 float64
	for j, x := range qpRe {
		y := qpIm[j]
		// Each phase read where it is used, so that few values are live
		// at once and the eight sums stay in registers.
		ar := zaRe[j]
		a0 += x * ar
		a3 += y * ar
		ai := zaIm[j]
		a1 += y * ai
		a2 += x * ai
		br := zbRe[j]
		b0 += x * br
		b3 += y * br
		bi := zbIm[j]
		b1 += y * bi
		b2 += x * bi
	}
	return [2][4]float64{{a0, a1, a2, a3}, {b0, b1, b2, b3}}
}

// mirrorPotentials adds the potential factors of two mirror pairs with
// coefficients ca, cb (mirrorPair.coefficients) to u (the factor of Re p)
// and v (that of Im p).
func mirrorPotentials(u, v, zaRe, zaIm, zbRe, zbIm []float64, ca, cb [4]float64) {
	n := len(u)
	v, zaRe, zaIm, zbRe, zbIm = v[:n], zaRe[:n], zaIm[:n], zbRe[:n], zbIm[:n]
	a0, a1, a2, a3 := ca[0], ca[1], ca[2], ca[3]
	b0, b1, b2, b3 := cb[0], cb[1], cb[2], cb[3]
	for j := range u {
		ar, ai := zaRe[j], zaIm[j]
		uj, vj := a0*ar+a1*ai, a2*ai+a3*ar
		br, bi := zbRe[j], zbIm[j]
		u[j] += uj + (b0*br + b1*bi)
		v[j] += vj + (b2*bi + b3*br)
	}
}
