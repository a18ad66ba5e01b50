package ewald

import (
	"math"

	"enthalpath/thermo/crystal"
)

// realSpace adds to phi[i] the screened sum Σⱼ Σₙ' qⱼ·erfc(α·r)/r over all
// images within rc (the term j = i, n = 0 left out). It returns the number
// of pair terms and the shortest cation–anion distance met, with its pair
// (−1, −1 when none lies within rc). With reps non-nil only the potentials
// of the listed sites are computed.
func (s *system) realSpace(alpha, rc float64, phi []float64, reps []int) (terms int, nearest float64, pair [2]int, overlap [2]int) {
	overlap = [2]int{-1, -1}
	n := len(s.q)
	nearest, pair = math.Inf(1), [2]int{-1, -1}
	rc2 := rc * rc
	a0, a1, a2 := s.lat[0], s.lat[1], s.lat[2]
	h := [3]float64{rc * s.recip[0].Norm(), rc * s.recip[1].Norm(), rc * s.recip[2].Norm()}
	a2sq := a2.Dot(a2)

	// sumImages visits every d = Cart(df + m) with 0 < |d| < rc and returns
	// Σ erfc(α|d|)/|d|, the count and the shortest |d|.
	sumImages := func(df crystal.Vec3, base crystal.Vec3, self bool) (sum float64, count int, shortest float64, overlap bool) {
		shortest = math.Inf(1)
		lo0, hi0 := int(math.Ceil(-df[0]-h[0])), int(math.Floor(-df[0]+h[0]))
		lo1, hi1 := int(math.Ceil(-df[1]-h[1])), int(math.Floor(-df[1]+h[1]))
		for m0 := lo0; m0 <= hi0; m0++ {
			v0 := base.Add(a0.Scale(float64(m0)))
			for m1 := lo1; m1 <= hi1; m1++ {
				v := v0.Add(a1.Scale(float64(m1)))
				// |v + m2·a2|² < rc²: solve the quadratic in m2.
				b := v.Dot(a2)
				disc := b*b - a2sq*(v.Dot(v)-rc2)
				if disc < 0 {
					continue
				}
				root := math.Sqrt(disc)
				lo2, hi2 := int(math.Ceil((-b-root)/a2sq)), int(math.Floor((-b+root)/a2sq))
				for m2 := lo2; m2 <= hi2; m2++ {
					// Direct, not incremental: the zero vector of a site's
					// own image must come out exactly zero.
					fm := float64(m2)
					w := crystal.Vec3{v[0] + fm*a2[0], v[1] + fm*a2[1], v[2] + fm*a2[2]}
					r2 := w.Dot(w)
					if r2 < rc2 {
						if r2 < coincident*coincident {
							// A site's own n = 0 image, or two sites at one place.
							overlap = overlap || !self
							continue
						}
						r := math.Sqrt(r2)
						sum += math.Erfc(alpha*r) / r
						count++
						if r < shortest {
							shortest = r
						}
					}
				}
			}
		}
		return sum, count, shortest, overlap
	}

	// Self images: the same for every site.
	selfSum, selfCount, _, _ := sumImages(crystal.Vec3{}, crystal.Vec3{}, true)
	pairTerm := func(i, j int) (sum float64, count int) {
		sum, count, shortest, close := sumImages(s.frac[j].Sub(s.frac[i]), s.pos[j].Sub(s.pos[i]), false)
		if close {
			overlap = [2]int{i, j}
		}
		if s.q[i]*s.q[j] < 0 && shortest < nearest {
			nearest = shortest
			if s.q[i] > 0 {
				pair = [2]int{i, j}
			} else {
				pair = [2]int{j, i}
			}
		}
		return sum, count
	}
	if reps != nil {
		// Translation-equivalent sites share one potential: sum from each
		// representative to every site and copy.
		for _, i := range reps {
			acc := s.q[i] * selfSum
			terms += selfCount
			for j := 0; j < n; j++ {
				if j == i {
					continue
				}
				sum, count := pairTerm(i, j)
				acc += s.q[j] * sum
				terms += count
			}
			phi[i] += acc
		}
		return terms, nearest, pair, overlap
	}
	for i := range phi {
		phi[i] += s.q[i] * selfSum
	}
	terms += selfCount * n
	for i := 0; i < n; i++ {
		qi := s.q[i]
		acc := 0.0
		for j := i + 1; j < n; j++ {
			sum, count := pairTerm(i, j)
			if count == 0 {
				continue
			}
			acc += s.q[j] * sum
			phi[j] += qi * sum
			terms += 2 * count
		}
		phi[i] += acc
	}
	return terms, nearest, pair, overlap
}

// coincident is the distance in Å below which two sites count as one
// position, for which the Coulomb energy is infinite.
const coincident = 1e-6

// reciprocalSpace adds to phi[i] the reciprocal-space potential
// (4π/V)·Σ_{k≠0} exp(−k²/4α²)/k²·Re(S(k)·e^{−ik·rᵢ}), S(k) = Σⱼ qⱼe^{ik·rⱼ},
// over |k| ≤ kc, and returns the number of ±k pairs used. Each e^{ik·r} is
// built from per-site powers of e^{2πi·fₐ}, by multiplication only. With
// reps non-nil only the potentials of the listed sites are computed.
func (s *system) reciprocalSpace(alpha, kc float64, phi []float64, reps []int) int {
	n := len(s.q)
	var b [3]crystal.Vec3
	var mmax [3]int
	for k := 0; k < 3; k++ {
		b[k] = s.recip[k].Scale(2 * math.Pi)
		// |m_k| = |k·a_k|/2π ≤ kc·|a_k|/2π.
		mmax[k] = int(math.Floor(kc * s.lat[k].Norm() / (2 * math.Pi)))
	}
	// pow[k][(m+M)*n + j] = e^{2πi·m·f_jk} as (re, im).
	var powRe, powIm [3][]float64
	for k := 0; k < 3; k++ {
		width := 2*mmax[k] + 1
		powRe[k] = make([]float64, width*n)
		powIm[k] = make([]float64, width*n)
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
	pRe, pIm := make([]float64, n), make([]float64, n)
	eRe, eIm := make([]float64, n), make([]float64, n)
	b2sq := b[2].Dot(b[2])
	stepRatio := math.Exp(-2 * b2sq * inv4a2)
	count := 0
	M0, M1, M2 := mmax[0], mmax[1], mmax[2]
	for m0 := 0; m0 <= M0; m0++ {
		lo1 := -M1
		if m0 == 0 {
			lo1 = 0
		}
		for m1 := lo1; m1 <= M1; m1++ {
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
			// Along the row k = g + m2·b3, k² = |g|² + 2·m2·g·b3 + m2²·|b3|², so
			// exp(−k²/4α²) follows from one exponential by multiplication.
			gg := g.Dot(g)
			k2lo := gg + float64(lo2)*(2*gb+float64(lo2)*b2sq)
			gauss := math.Exp(-k2lo * inv4a2)
			step := math.Exp(-(2*gb + float64(2*lo2+1)*b2sq) * inv4a2)
			for m2 := lo2; m2 <= hi2; m2, gauss, step = m2+1, gauss*step, step*stepRatio {
				fm := float64(m2)
				k2 := gg + fm*(2*gb+fm*b2sq)
				if k2 > kc2 || k2 <= 0 {
					continue
				}
				count++
				w := pre * gauss / k2
				r2, i2 := powRe[2][(M2+m2)*n:(M2+m2+1)*n], powIm[2][(M2+m2)*n:(M2+m2+1)*n]
				sRe, sIm := 0.0, 0.0
				for j := 0; j < n; j++ {
					er := pRe[j]*r2[j] - pIm[j]*i2[j]
					ei := pRe[j]*i2[j] + pIm[j]*r2[j]
					eRe[j], eIm[j] = er, ei
					sRe += s.q[j] * er
					sIm += s.q[j] * ei
				}
				sRe, sIm = w*sRe, w*sIm
				// Re(S·conj(e_j)) = sRe·eRe + sIm·eIm.
				if reps == nil {
					for j := 0; j < n; j++ {
						phi[j] += sRe*eRe[j] + sIm*eIm[j]
					}
				} else {
					for _, j := range reps {
						phi[j] += sRe*eRe[j] + sIm*eIm[j]
					}
				}
			}
		}
	}
	return count
}
