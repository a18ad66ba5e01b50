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
		eRe, eIm := work[3*n:4*n:4*n], work[4*n:5*n:5*n]
		fRe, fIm := work[5*n:6*n:6*n], work[6*n:]
		ks := make([]rowVector, 0, 2*M2+1)
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
				r0, i0 := powRe[0][(M0+m0)*n:(M0+m0+1)*n], powIm[0][(M0+m0)*n:(M0+m0+1)*n]
				r1, i1 := powRe[1][(M1+m1)*n:(M1+m1+1)*n], powIm[1][(M1+m1)*n:(M1+m1+1)*n]
				for j := 0; j < n; j++ {
					pRe[j] = r0[j]*r1[j] - i0[j]*i1[j]
					pIm[j] = r0[j]*i1[j] + i0[j]*r1[j]
				}
				// Along the row k = g + m2·b3, k² = |g|² + 2·m2·g·b3 + m2²·|b3|²,
				// so exp(−k²/4α²) follows from one exponential by
				// multiplication.
				gg := g.Dot(g)
				k2lo := gg + float64(lo2)*(2*gb+float64(lo2)*b2sq)
				gauss := math.Exp(-k2lo * inv4a2)
				step := math.Exp(-(2*gb + float64(2*lo2+1)*b2sq) * inv4a2)
				row := ks[:0]
				for m2 := lo2; m2 <= hi2; m2, gauss, step = m2+1, gauss*step, step*stepRatio {
					fm := float64(m2)
					k2 := gg + fm*(2*gb+fm*b2sq)
					if k2 > kc2 || k2 <= 0 {
						continue
					}
					row = append(row, rowVector{m2, pre * gauss / k2})
				}
				part.count += len(row)
				// Two k-vectors of the row at a time: the phases of the
				// row and the potentials are read once for both.
				for k := 0; k < len(row); k += 2 {
					a := row[k]
					ra, ia := powRe[2][(M2+a.m2)*n:(M2+a.m2+1)*n], powIm[2][(M2+a.m2)*n:(M2+a.m2+1)*n]
					if k+1 == len(row) {
						sRe, sIm := structureFactor(s.q, pRe, pIm, ra, ia, eRe, eIm)
						sRe, sIm = a.w*sRe, a.w*sIm
						// Re(S·conj(e_j)) = sRe·eRe + sIm·eIm.
						for j, er := range eRe {
							out[j] += sRe*er + sIm*eIm[j]
						}
						break
					}
					b := row[k+1]
					rb, ib := powRe[2][(M2+b.m2)*n:(M2+b.m2+1)*n], powIm[2][(M2+b.m2)*n:(M2+b.m2+1)*n]
					saRe, saIm, sbRe, sbIm := structureFactors(s.q, pRe, pIm, ra, ia, rb, ib, eRe, eIm, fRe, fIm)
					saRe, saIm, sbRe, sbIm = a.w*saRe, a.w*saIm, b.w*sbRe, b.w*sbIm
					fRe, fIm := fRe[:len(eRe)], fIm[:len(eRe)]
					for j, er := range eRe {
						out[j] += (saRe*er + saIm*eIm[j]) + (sbRe*fRe[j] + sbIm*fIm[j])
					}
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

// rowVector is one k-vector of a row of the reciprocal sum: its last index
// and its weight (8π/V)·exp(−k²/4α²)/k².
type rowVector struct {
	m2 int
	w  float64
}

// structureFactors is structureFactor for two k-vectors that share the
// first factor p: e_j = p_j·r_j, f_j = p_j·s_j, and the sums Σ q_j·e_j and
// Σ q_j·f_j.
func structureFactors(q, pRe, pIm, rRe, rIm, sRe, sIm, eRe, eIm, fRe, fIm []float64) (aRe, aIm, bRe, bIm float64) {
	n := len(q)
	pRe, pIm, rRe, rIm, sRe, sIm = pRe[:n], pIm[:n], rRe[:n], rIm[:n], sRe[:n], sIm[:n]
	eRe, eIm, fRe, fIm = eRe[:n], eIm[:n], fRe[:n], fIm[:n]
	// Four independent sums: no chain of dependent additions limits the
	// loop.
	for j, qj := range q {
		pr, pi := pRe[j], pIm[j]
		er, ei := pr*rRe[j]-pi*rIm[j], pr*rIm[j]+pi*rRe[j]
		fr, fi := pr*sRe[j]-pi*sIm[j], pr*sIm[j]+pi*sRe[j]
		eRe[j], eIm[j], fRe[j], fIm[j] = er, ei, fr, fi
		aRe += qj * er
		aIm += qj * ei
		bRe += qj * fr
		bIm += qj * fi
	}
	return aRe, aIm, bRe, bIm
}

// structureFactor sets e_j = p_j·r_j (complex, as real and imaginary
// parts) and returns S = Σ q_j·e_j. Four partial sums of each part break the
// chain of dependent additions, so the loop runs at the speed of its
// multiplications; the order of summation is fixed, so the result does not
// depend on anything but the inputs.
func structureFactor(q, pRe, pIm, rRe, rIm, eRe, eIm []float64) (sRe, sIm float64) {
	n := len(q)
	pRe, pIm, rRe, rIm, eRe, eIm = pRe[:n], pIm[:n], rRe[:n], rIm[:n], eRe[:n], eIm[:n]
	var a0, a1, a2, a3, b0, b1, b2, b3 float64
	j := 0
	for ; j+4 <= n; j += 4 {
		e0r, e0i := pRe[j]*rRe[j]-pIm[j]*rIm[j], pRe[j]*rIm[j]+pIm[j]*rRe[j]
		e1r, e1i := pRe[j+1]*rRe[j+1]-pIm[j+1]*rIm[j+1], pRe[j+1]*rIm[j+1]+pIm[j+1]*rRe[j+1]
		e2r, e2i := pRe[j+2]*rRe[j+2]-pIm[j+2]*rIm[j+2], pRe[j+2]*rIm[j+2]+pIm[j+2]*rRe[j+2]
		e3r, e3i := pRe[j+3]*rRe[j+3]-pIm[j+3]*rIm[j+3], pRe[j+3]*rIm[j+3]+pIm[j+3]*rRe[j+3]
		eRe[j], eRe[j+1], eRe[j+2], eRe[j+3] = e0r, e1r, e2r, e3r
		eIm[j], eIm[j+1], eIm[j+2], eIm[j+3] = e0i, e1i, e2i, e3i
		a0 += q[j] * e0r
		b0 += q[j] * e0i
		a1 += q[j+1] * e1r
		b1 += q[j+1] * e1i
		a2 += q[j+2] * e2r
		b2 += q[j+2] * e2i
		a3 += q[j+3] * e3r
		b3 += q[j+3] * e3i
	}
	for ; j < n; j++ {
		er, ei := pRe[j]*rRe[j]-pIm[j]*rIm[j], pRe[j]*rIm[j]+pIm[j]*rRe[j]
		eRe[j], eIm[j] = er, ei
		a0 += q[j] * er
		b0 += q[j] * ei
	}
	return (a0 + a1) + (a2 + a3), (b0 + b1) + (b2 + b3)
}
