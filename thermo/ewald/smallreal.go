package ewald

import (
	"math"

	"enthalpath/thermo/crystal"
)

// This file: the real-space sum of a small cell from one walk over the
// lattice translations, and the splitting parameter of the small path.

// smallPairs is the number of pairs i < j of a cell of smallSites sites.
const smallPairs = smallSites * (smallSites - 1) / 2

// smallImageBox bounds the lattice translations one pair of realSmall may
// examine (the box of indices around its sphere); a cell needing more, a
// needle or a plate, is left to the general path.
const smallImageBox = 1e5

// sphere enumerates the lattice points of a small cell within the cut-off
// of a fractional position, row by row (fixed m₀, m₁; the range of m₁
// from the ellipse of the plane, that of m₂ from a quadratic), with every
// length from the metric gₖₗ = aₖ·aₗ of the reduced basis: scalar
// arithmetic only, and no per-pair image list.
type sphere struct {
	g00, g01, g02, g11, g12, g22 float64
	inv22, rc2, alpha            float64
	h0                           float64 // rc·|b₀|: half-width of the range of m₀
	// The plane w₀ = const within rc spans w₁ ∈ (−e₁·w₀ ± √(e₂·w₀² + e₃)):
	// the shortest vector over real w₂ is a quadratic form in w₀, w₁.
	e1, e2, e3 float64
}

func newSphere(lat [3]crystal.Vec3, alpha, rc float64, b0 float64) sphere {
	a0, a1, a2 := lat[0], lat[1], lat[2]
	sp := sphere{g00: a0.Dot(a0), g01: a0.Dot(a1), g02: a0.Dot(a2), g11: a1.Dot(a1), g12: a1.Dot(a2), g22: a2.Dot(a2),
		rc2: rc * rc, alpha: alpha, h0: rc * b0}
	sp.inv22 = 1 / sp.g22
	// min over w₂ of |w|² = A·w₁² + 2B·w₀w₁ + C·w₀²; |w| < rc for
	// w₁ = (−B·w₀ ± √(B²w₀² − A(C·w₀² − rc²)))/A.
	A, B, C := sp.g11-sp.g12*sp.g12*sp.inv22, sp.g01-sp.g02*sp.g12*sp.inv22, sp.g00-sp.g02*sp.g02*sp.inv22
	sp.e1, sp.e2, sp.e3 = B/A, (B*B-A*C)/(A*A), rc*rc/A
	return sp
}

// images returns Σ erfc(α|w|)/|w| over the vectors w = D + m (D and m
// fractional, m integral) with |w| < rc, their number and the shortest
// |w|, and whether one is shorter than coincident. With half, D is e/2
// for the integers e up to rounding (then −w runs over the same set as w)
// and only the w of the half space w₀ > 0, or w₀ = 0 and w₁ > 0, or
// w₀ = w₁ = 0 and w₂ > 0 are taken, each standing for ±w. The squared
// lengths go to the kernel (screenedPairs) in batches.
func (sp *sphere) images(D [3]float64, half bool, e [3]int) (sum float64, count int, shortest float64, overlap bool) {
	shortest2 := math.Inf(1)
	var batch, terms [32]float64
	nb := 0
	lo0, hi0 := int(math.Ceil(-D[0]-sp.h0)), int(math.Floor(-D[0]+sp.h0))
	if half {
		lo0 = max(lo0, (1-e[0])>>1) // 2m₀ + e₀ ≥ 0
	}
	for m0 := lo0; m0 <= hi0; m0++ {
		w0 := D[0] + float64(m0)
		span := sp.e2*w0*w0 + sp.e3
		if span < 0 {
			continue
		}
		span = math.Sqrt(span)
		lo1, hi1 := int(math.Ceil(-sp.e1*w0-span-D[1])), int(math.Floor(-sp.e1*w0+span-D[1]))
		zero0 := half && 2*m0+e[0] == 0
		if zero0 {
			lo1 = max(lo1, (1-e[1])>>1)
		}
		// For w = (w₀, w₁, D₂): |w + m₂e₂|² = ww + 2m₂·wb + m₂²·g₂₂ with
		// ww = a + w₁·(b + g₁₁w₁) and wb = c + g₁₂w₁.
		a := w0*(sp.g00*w0+2*sp.g02*D[2]) + sp.g22*D[2]*D[2]
		b := 2 * (sp.g01*w0 + sp.g12*D[2])
		c := sp.g02*w0 + sp.g22*D[2]
		for m1 := lo1; m1 <= hi1; m1++ {
			w1 := D[1] + float64(m1)
			wb := c + sp.g12*w1
			ww := a + w1*(b+sp.g11*w1)
			disc := wb*wb - sp.g22*(ww-sp.rc2)
			if disc < 0 {
				continue
			}
			root := math.Sqrt(disc)
			lo2, hi2 := int(math.Ceil((-wb-root)*sp.inv22)), int(math.Floor((-wb+root)*sp.inv22))
			if zero0 && 2*m1+e[1] == 0 {
				lo2 = max(lo2, (2-e[2])>>1) // 2m₂ + e₂ > 0
			}
			for m2 := lo2; m2 <= hi2; m2++ {
				fm := float64(m2)
				r2 := ww + fm*(2*wb+fm*sp.g22)
				if r2 >= sp.rc2 {
					continue
				}
				if r2 < coincident*coincident {
					overlap = true
					continue
				}
				if r2 < shortest2 {
					shortest2 = r2
				}
				batch[nb] = r2
				if nb++; nb == len(batch) {
					sum += sp.kernel(batch[:], terms[:])
					count += nb
					nb = 0
				}
			}
		}
	}
	sum += sp.kernel(batch[:nb], terms[:nb])
	count += nb
	shortest = math.Sqrt(shortest2)
	return sum, count, shortest, overlap
}

// kernel returns Σ erfc(α·rₘ)/rₘ over the squared distances d2.
func (sp *sphere) kernel(d2, e []float64) float64 {
	screenedPairs(sp.alpha, d2, e)
	sum := 0.0
	for _, v := range e {
		sum += v
	}
	return sum
}

// realSmall adds to phi[i] the screened sum Σⱼ Σₙ' qⱼ·erfc(α·r)/r over all
// images within rc, for a cell of at most smallSites sites: each pair
// i < j once (its images found by sphere.images), a site's own images
// once for every site and on half the translations (t and −t are at the
// same distance). It returns the number of ordered pair-image terms, the
// shortest cation–anion distance met and its pair (cation, anion; −1, −1
// when none lies within rc), and false, with phi untouched, for a cell
// too large or too skewed for it or with two sites at one position.
func (s *system) realSmall(alpha, rc float64, phi []float64) (terms int, nearest float64, pair [2]int, ok bool) {
	n := len(s.q)
	nearest, pair = math.Inf(1), [2]int{-1, -1}
	sp := newSphere(s.lat, alpha, rc, s.recip[0].Norm())
	h1, h2 := rc*s.recip[1].Norm(), rc*s.recip[2].Norm()
	if box := (2*sp.h0 + 2) * (2*h1 + 2) * (2*h2 + 2); n > smallSites || !(box <= smallImageBox) {
		return 0, nearest, pair, false
	}
	var sum, shortest [smallPairs]float64
	var count [smallPairs]int
	p := 0
	for i := 0; i < n; i++ {
		for j := i + 1; j < n; j++ {
			D := [3]float64{s.frac[j][0] - s.frac[i][0], s.frac[j][1] - s.frac[i][1], s.frac[j][2] - s.frac[i][2]}
			// A pair half a lattice vector apart (2D integral) has its
			// images in ± pairs: half of them suffice.
			half := sameModulo(2*D[0]) && sameModulo(2*D[1]) && sameModulo(2*D[2])
			var e [3]int
			if half {
				e = [3]int{int(math.Round(2 * D[0])), int(math.Round(2 * D[1])), int(math.Round(2 * D[2]))}
				if (e[0]|e[1]|e[2])&1 == 0 {
					return 0, nearest, pair, false // D integral: one position
				}
			}
			var overlap bool
			sum[p], count[p], shortest[p], overlap = sp.images(D, half, e)
			if overlap {
				return 0, nearest, pair, false
			}
			if half {
				sum[p], count[p] = 2*sum[p], 2*count[p]
			}
			p++
		}
	}
	selfSum, selfCount, _, _ := sp.images([3]float64{}, true, [3]int{})
	self := 2 * selfSum
	terms = 2 * n * selfCount
	p = 0
	for i := 0; i < n; i++ {
		qi := s.q[i]
		phi[i] += qi * self
		for j := i + 1; j < n; j++ {
			e := sum[p]
			phi[i] += s.q[j] * e
			phi[j] += qi * e
			terms += 2 * count[p]
			if qi*s.q[j] < 0 && shortest[p] < nearest {
				nearest = shortest[p]
				if qi > 0 {
					pair = [2]int{i, j}
				} else {
					pair = [2]int{j, i}
				}
			}
			p++
		}
	}
	return terms, nearest, pair, true
}

// Costs of the small path in instructions (valgrind --tool=cachegrind on
// BenchmarkSmallTermCost: the primitive cells of rock salt, fluorite,
// wurtzite and perovskite at 1e-10): smallRealCost per real-space term as
// Result.RealTerms counts them (42, 54, 65 and 37: the mean), and
// smallVectorCost + smallPairCost per pair of sites for each k-vector of
// the half space (153, 233, 362 and 563 for 1, 3, 6 and 10 pairs: the
// least-squares line, within 5 %). Rows, planes and set-up are spread
// over the terms they serve.
const (
	smallRealCost   = 50.0
	smallVectorCost = 100.0
	smallPairCost   = 46.0
)

// smallAlpha returns the splitting parameter that balances the cost of
// the two sums of the small path for a cell of n sites and volume V. The
// real sum has about n²·(4π/3)·rc³/V terms and the reciprocal sum
// (4π/3)·kc³·V/(16π³) k-vectors in its half space; with rc = p/α and
// kc = 2αp their costs c_r·(terms) and c_k·(vectors) add to least at
// α⁶ = 2π³·(c_r/c_k)·n²/V², whatever p (the balance of J. Kolafa and
// J. W. Perram, Mol. Simul. 9, 351 (1992), with the small path's costs).
func smallAlpha(n int, volume float64) float64 {
	fn := float64(n)
	perVector := smallVectorCost + smallPairCost*fn*(fn-1)/2
	a6 := 2 * math.Pi * math.Pi * math.Pi * smallRealCost / perVector * fn * fn / (volume * volume)
	return math.Sqrt(math.Cbrt(a6))
}
