package ewald

import (
	"cmp"
	"math"
	"slices"

	"enthalpath/thermo/crystal"
)

// This file: the real-space sum (images of each pair within the cut-off).

// imageSum holds what the real-space sum needs for one pair of sites. Its
// axes are the lattice axes reordered so that the widest index range is
// the innermost loop, solved as a quadratic.
type imageSum struct {
	alpha, rc2 float64
	perm       [3]int // perm[i] is the lattice axis of loop i
	a          [3]crystal.Vec3
	h          [3]float64 // rc·|bₖ|: half-width of the index range per loop
	a2sq       float64
	box        bool // few images per pair: test every index in the box
}

func newImageSum(s *system, alpha, rc float64) imageSum {
	im := imageSum{alpha: alpha, rc2: rc * rc, perm: [3]int{0, 1, 2}}
	var h [3]float64
	for k := 0; k < 3; k++ {
		h[k] = rc * s.recip[k].Norm()
	}
	// Sort the three axes by h, widest last.
	for i := 0; i < 3; i++ {
		for j := i + 1; j < 3; j++ {
			if h[im.perm[j]] < h[im.perm[i]] {
				im.perm[i], im.perm[j] = im.perm[j], im.perm[i]
			}
		}
	}
	for i, k := range im.perm {
		im.a[i], im.h[i] = s.lat[k], h[k]
	}
	im.a2sq = im.a[2].Dot(im.a[2])
	im.box = im.h[0] < 1 && im.h[1] < 1 && im.h[2] < 1
	return im
}

// boxSize bounds the number of images examined per pair.
func (im imageSum) boxSize() float64 {
	return (2*im.h[0] + 2) * (2*im.h[1] + 2) * (2*im.h[2] + 2)
}

// sum visits every d = base + Σ mₖaₖ with |d| < rc, where base is the
// Cartesian form of the fractional difference df, and returns
// Σ erfc(α|d|)/|d|, the number of terms and the shortest |d|. A |d| below
// coincident is skipped; unless self (a site and its own images) it also
// reports an overlap.
func (im *imageSum) sum(dfLattice, base crystal.Vec3, self bool) (sum float64, count int, shortest float64, overlap bool) {
	shortest = math.Inf(1)
	df := crystal.Vec3{dfLattice[im.perm[0]], dfLattice[im.perm[1]], dfLattice[im.perm[2]]}
	a0, a1, a2 := im.a[0], im.a[1], im.a[2]
	lo0, hi0 := int(math.Ceil(-df[0]-im.h[0])), int(math.Floor(-df[0]+im.h[0]))
	lo1, hi1 := int(math.Ceil(-df[1]-im.h[1])), int(math.Floor(-df[1]+im.h[1]))
	lo2b, hi2b := int(math.Ceil(-df[2]-im.h[2])), int(math.Floor(-df[2]+im.h[2]))
	for m0 := lo0; m0 <= hi0; m0++ {
		f0 := float64(m0)
		v0 := crystal.Vec3{base[0] + f0*a0[0], base[1] + f0*a0[1], base[2] + f0*a0[2]}
		for m1 := lo1; m1 <= hi1; m1++ {
			f1 := float64(m1)
			v := crystal.Vec3{v0[0] + f1*a1[0], v0[1] + f1*a1[1], v0[2] + f1*a1[2]}
			lo2, hi2 := lo2b, hi2b
			if !im.box {
				// |v + m2·a2|² < rc²: solve the quadratic in m2.
				b := v.Dot(a2)
				disc := b*b - im.a2sq*(v.Dot(v)-im.rc2)
				if disc < 0 {
					continue
				}
				root := math.Sqrt(disc)
				lo2, hi2 = int(math.Ceil((-b-root)/im.a2sq)), int(math.Floor((-b+root)/im.a2sq))
			}
			for m2 := lo2; m2 <= hi2; m2++ {
				// Direct, not incremental: a site's own n = 0 image must
				// come out exactly zero.
				fm := float64(m2)
				w0, w1, w2 := v[0]+fm*a2[0], v[1]+fm*a2[1], v[2]+fm*a2[2]
				r2 := w0*w0 + w1*w1 + w2*w2
				if r2 >= im.rc2 {
					continue
				}
				if r2 < coincident*coincident {
					overlap = overlap || !self
					continue
				}
				r := math.Sqrt(r2)
				sum += im.alpha * screened(im.alpha*r)
				count++
				if r < shortest {
					shortest = r
				}
			}
		}
	}
	return sum, count, shortest, overlap
}

// realPart is one chunk's share of the real-space sum, with the scratch of
// one row: the pairs (i, i+1+within[m]) found within the cut-off at the
// squared distances dist2[m], and their terms.
type realPart struct {
	phi     []float64
	terms   int
	nearest float64
	pair    [2]int
	overlap [2]int
	within  []int32
	dist2   []float64
	term    []float64
}

func (p *realPart) pairTerm(s *system, im *imageSum, i, j int) (float64, int) {
	sum, count, shortest, close := im.sum(s.frac[j].Sub(s.frac[i]), s.pos[j].Sub(s.pos[i]), false)
	if close && p.overlap[0] < 0 {
		p.overlap = [2]int{i, j}
	}
	if s.q[i]*s.q[j] < 0 && shortest < p.nearest {
		p.nearest = shortest
		if s.q[i] > 0 {
			p.pair = [2]int{i, j}
		} else {
			p.pair = [2]int{j, i}
		}
	}
	return sum, count
}

// realSpace adds to phi[i] the screened sum Σⱼ Σₙ' qⱼ·erfc(α·r)/r over all
// images within rc (the term j = i, n = 0 left out). It returns the number
// of pair terms and the shortest cation–anion distance met, with its pair
// (−1, −1 when none lies within rc), and a pair of coincident sites if any.
func (s *system) realSpace(alpha, rc float64, phi []float64) (terms int, nearest float64, pair [2]int, overlap [2]int) {
	n := len(s.q)
	chunks := chunksFor(n)
	parts := make([]realPart, chunks)
	s.realSpacePairs(alpha, rc, parts)
	nearest, pair, overlap = math.Inf(1), [2]int{-1, -1}, [2]int{-1, -1}
	for c := range parts {
		p := &parts[c]
		for i, v := range p.phi {
			phi[i] += v
		}
		terms += p.terms
		if p.nearest < nearest {
			nearest, pair = p.nearest, p.pair
		}
		if overlap[0] < 0 && p.overlap[0] >= 0 {
			overlap = p.overlap
		}
	}
	return terms, nearest, pair, overlap
}

// realSpacePairs is realSpace over every pair of sites, each with all its
// images within rc.
func (s *system) realSpacePairs(alpha, rc float64, parts []realPart) {
	n := len(s.q)
	chunks := len(parts)
	minImage := s.oneImage(rc)
	if !minImage && n < listedImages {
		s.realSpaceSearched(alpha, rc, parts)
		return
	}
	fixed := s.fixedPositions()
	var tl translationList
	var selfSum float64
	var selfCount int
	if !minImage {
		tl = s.translationsWithin(rc)
		// Self images: the same for every site.
		selfSum, selfCount = tl.selfSum(alpha, rc)
	}
	forChunks(n, func(c int) {
		p := parts[c].reset(n)
		p.room(0, n)
		if minImage {
			for i := c; i < n; i += chunks {
				s.minImageRow(fixed, i, alpha, rc*rc, p)
			}
			return
		}
		for i := c; i < n; i += chunks {
			p.phi[i] += s.q[i] * selfSum
			p.terms += selfCount
			s.imagesRow(fixed, i, alpha, rc, &tl, p)
		}
	})
}

// fixedFrac is a fractional position in units of 2⁻⁶⁴ of the cell: the
// difference of two, taken as a signed 64-bit integer, wraps to the
// nearest image exactly (−½ ≤ Δf < ½) and converts to float64 with one
// rounding, as accurate as the difference of float64 coordinates and with
// no rounding step per axis.
type fixedFrac [3]uint64

// fixedUnit is the fractional length of one unit of a fixedFrac.
const fixedUnit = 0x1p-64

// fixedPositions returns the sites' fractional positions (in [0, 1)) as
// fixedFrac.
func (s *system) fixedPositions() []fixedFrac {
	out := make([]fixedFrac, len(s.frac))
	for i, f := range s.frac {
		for k := range f {
			out[i][k] = uint64(f[k] * 0x1p64)
		}
	}
	return out
}

// oneImage reports whether the cut-off rc is below half of every distance
// between lattice planes: then |Δfₖ + mₖ| ≤ rc·|bₖ| < ½ leaves each pair
// one image within rc, the one of the rounded fractional difference (and a
// site none of itself).
func (s *system) oneImage(rc float64) bool {
	for k := 0; k < 3; k++ {
		if !(rc*s.recip[k].Norm() < 0.5) {
			return false
		}
	}
	return true
}

// roundingShift is 1.5·2⁵²: for |x| < 2⁵¹, (x + roundingShift) −
// roundingShift is x rounded to the nearest integer (ties to even) in two
// additions, as float64 addition rounds at the unit place there. Go does
// not reassociate floating-point arithmetic, so the two stay.
const roundingShift = 0x1.8p52

// listedImages is the smallest cell whose real-space images are found from
// a sorted list of lattice translations (translationList); a smaller cell
// has too few pairs to pay for the list, and each of its pairs searches the
// box of images around it (imageSum).
const listedImages = 16

func (p *realPart) reset(n int) *realPart {
	p.nearest, p.pair, p.overlap = math.Inf(1), [2]int{-1, -1}, [2]int{-1, -1}
	p.phi = make([]float64, n)
	return p
}

// room makes the row scratch hold at least size pairs, keeping the first
// kept.
func (p *realPart) room(kept, size int) {
	if size <= len(p.within) {
		return
	}
	size = max(size, 2*len(p.within))
	p.within = append(p.within[:kept], make([]int32, size-kept)...)
	p.dist2 = append(p.dist2[:kept], make([]float64, size-kept)...)
	p.term = make([]float64, size)
}

// addRow adds the kept pairs of row i (p.within[:kept], p.dist2[:kept]) to
// p: their terms to the potentials of both sites, their count, the
// shortest cation–anion distance and a coincident pair if any.
func (p *realPart) addRow(s *system, i int, alpha float64, kept int) {
	within, dist2 := p.within[:kept], p.dist2[:kept]
	qi := s.q[i]
	q := s.q[i+1:]
	term := p.term[:kept]
	screenedPairs(alpha, dist2, term)
	acc := 0.0
	phi := p.phi[i+1:]
	// The shortest cation–anion distance on r²: a new minimum is rare, so
	// the branch is predicted, and the charges and a coincident pair are
	// only looked at then.
	best := p.nearest * p.nearest
	for m, k := range within {
		e := term[m]
		acc += q[k] * e
		phi[k] += qi * e
		if r2 := dist2[m]; r2 < best {
			if r2 < coincident*coincident && p.overlap[0] < 0 {
				p.overlap = [2]int{i, i + 1 + int(k)}
			}
			if qi*q[k] < 0 {
				best = r2
				if qi > 0 {
					p.pair = [2]int{i, i + 1 + int(k)}
				} else {
					p.pair = [2]int{i + 1 + int(k), i}
				}
			}
		}
	}
	p.nearest = math.Sqrt(best)
	p.phi[i] += acc
	p.terms += 2 * kept
}

// realSpaceSearched is realSpacePairs for a small cell: each pair searches
// the box of images around it.
func (s *system) realSpaceSearched(alpha, rc float64, parts []realPart) {
	n := len(s.q)
	chunks := len(parts)
	imv := newImageSum(s, alpha, rc)
	im := &imv
	// Self images: the same for every site.
	selfSum, selfCount, _, _ := im.sum(crystal.Vec3{}, crystal.Vec3{}, true)
	forChunks(n, func(c int) {
		p := parts[c].reset(n)
		for i := c; i < n; i += chunks {
			qi := s.q[i]
			acc := qi * selfSum
			p.terms += selfCount
			for j := i + 1; j < n; j++ {
				sum, count := p.pairTerm(s, im, i, j)
				if count == 0 {
					continue
				}
				acc += s.q[j] * sum
				p.phi[j] += qi * sum
				p.terms += 2 * count
			}
			p.phi[i] += acc
		}
	})
}

// translationList holds the lattice vectors t with |t| < rc + reach, where
// reach bounds the length of a difference of two positions reduced to the
// nearest image (fractional parts in [−½, ½]): every image of a pair within
// the cut-off is d + t for one of them. They are in order of length, so
// that the loop over them for a pair d can stop at |t| ≥ rc + |d|.
type translationList struct {
	x, y, z []float64
	norm    []float64
}

// translationsWithin lists the lattice translations the real-space sum
// with cut-off rc needs (see translationList).
func (s *system) translationsWithin(rc float64) translationList {
	reach := 0.0
	for _, sg := range [4][3]float64{{1, 1, 1}, {1, 1, -1}, {1, -1, 1}, {-1, 1, 1}} {
		v := s.lat[0].Scale(sg[0] / 2).Add(s.lat[1].Scale(sg[1] / 2)).Add(s.lat[2].Scale(sg[2] / 2))
		reach = math.Max(reach, v.Norm())
	}
	limit := rc + reach
	limit2 := limit * limit
	a0, a1, a2 := s.lat[0], s.lat[1], s.lat[2]
	a2sq := a2.Dot(a2)
	m0 := int(math.Ceil(limit * s.recip[0].Norm()))
	m1 := int(math.Ceil(limit * s.recip[1].Norm()))
	type entry struct {
		x, y, z, r float64
	}
	list := make([]entry, 0, int(4*math.Pi/3*limit*limit2/s.volume)+16)
	for i := -m0; i <= m0; i++ {
		for j := -m1; j <= m1; j++ {
			fi, fj := float64(i), float64(j)
			v := crystal.Vec3{fi*a0[0] + fj*a1[0], fi*a0[1] + fj*a1[1], fi*a0[2] + fj*a1[2]}
			// |v + k·a2|² < limit²: a quadratic in k.
			b := v.Dot(a2)
			disc := b*b - a2sq*(v.Dot(v)-limit2)
			if disc < 0 {
				continue
			}
			root := math.Sqrt(disc)
			for k := int(math.Ceil((-b - root) / a2sq)); k <= int(math.Floor((-b+root)/a2sq)); k++ {
				fk := float64(k)
				x, y, z := v[0]+fk*a2[0], v[1]+fk*a2[1], v[2]+fk*a2[2]
				if r2 := x*x + y*y + z*z; r2 < limit2 {
					list = append(list, entry{x, y, z, math.Sqrt(r2)})
				}
			}
		}
	}
	// pdqsort is deterministic: the order, and so the order of summation,
	// depends on the lattice only.
	slices.SortFunc(list, func(a, b entry) int { return cmp.Compare(a.r, b.r) })
	buf := make([]float64, 4*len(list))
	tl := translationList{x: buf[:len(list)], y: buf[len(list) : 2*len(list)], z: buf[2*len(list) : 3*len(list)], norm: buf[3*len(list):]}
	for k, e := range list {
		tl.x[k], tl.y[k], tl.z[k], tl.norm[k] = e.x, e.y, e.z, e.r
	}
	return tl
}

// selfSum returns Σ_{t≠0, |t|<rc} erfc(α|t|)/|t| and the number of terms:
// a site's interaction with its own images.
func (tl *translationList) selfSum(alpha, rc float64) (sum float64, count int) {
	for k := 1; k < len(tl.norm) && tl.norm[k] < rc; k++ {
		sum += alpha * screened(alpha*tl.norm[k])
		count++
	}
	return sum, count
}

// imagesRow adds the real-space terms of the pairs (i, j > i) at all their
// images within the cut-off to p: the difference reduced to the nearest
// image, d, plus each listed translation t with |t| < rc + |d|.
func (s *system) imagesRow(fixed []fixedFrac, i int, alpha, rc float64, tl *translationList, p *realPart) {
	// The lattice vectors in units of a fixedFrac.
	a0, a1, a2 := s.lat[0].Scale(fixedUnit), s.lat[1].Scale(fixedUnit), s.lat[2].Scale(fixedUnit)
	fi := fixed[i]
	rc2 := rc * rc
	tx, ty, tz, tn := tl.x, tl.y, tl.z, tl.norm
	tx, ty, tz = tx[:len(tn)], ty[:len(tn)], tz[:len(tn)]
	kept := 0
	rest := fixed[i+1:]
	for k := range rest {
		fj := &rest[k]
		d0 := float64(int64(fj[0] - fi[0]))
		d1 := float64(int64(fj[1] - fi[1]))
		d2 := float64(int64(fj[2] - fi[2]))
		x := d0*a0[0] + d1*a1[0] + d2*a2[0]
		y := d0*a0[1] + d1*a1[1] + d2*a2[1]
		z := d0*a0[2] + d1*a1[2] + d2*a2[2]
		limit := rc + math.Sqrt(x*x+y*y+z*z)
		p.room(kept, kept+len(tn))
		within, dist2 := p.within, p.dist2
		for t, tr := range tn {
			if tr >= limit {
				break
			}
			wx, wy, wz := x+tx[t], y+ty[t], z+tz[t]
			r2 := wx*wx + wy*wy + wz*wz
			// Written always, kept by moving on (see minImageRow).
			within[kept], dist2[kept] = int32(k), r2
			step := 0
			if r2 < rc2 {
				step = 1
			}
			kept += step
		}
	}
	p.addRow(s, i, alpha, kept)
}

// minImageRow adds the real-space terms of the pairs (i, j > i) at their
// one image within the cut-off (see realSpacePairs) to p. The first pass
// computes every r² and keeps the pairs within the cut-off without a
// branch on the comparison (in a large cell about half the pairs fall on
// either side, in runs too short to predict); addRow then evaluates the
// kernel on the kept pairs only.
func (s *system) minImageRow(fixed []fixedFrac, i int, alpha, rc2 float64, p *realPart) {
	// |Σ dₖaₖ|² from the metric tensor gₖₗ = aₖ·aₗ of the (reduced) basis,
	// in units of a fixedFrac: 9 multiplications instead of 12.
	a0, a1, a2 := s.lat[0].Scale(fixedUnit), s.lat[1].Scale(fixedUnit), s.lat[2].Scale(fixedUnit)
	g00, g11, g22 := a0.Dot(a0), a1.Dot(a1), a2.Dot(a2)
	h01, h02, h12 := 2*a0.Dot(a1), 2*a0.Dot(a2), 2*a1.Dot(a2)
	fi := fixed[i]
	rest := fixed[i+1:]
	within, dist2 := p.within[:len(rest)], p.dist2[:len(rest)]
	kept := 0
	for k := range rest {
		fj := &rest[k]
		// The nearest image by wrapping (fixedFrac).
		d0 := float64(int64(fj[0] - fi[0]))
		d1 := float64(int64(fj[1] - fi[1]))
		d2 := float64(int64(fj[2] - fi[2]))
		r2 := d0*(g00*d0+h01*d1+h02*d2) + d1*(g11*d1+h12*d2) + g22*d2*d2
		// Written always, kept by moving on: a conditional set, no jump.
		within[kept], dist2[kept] = int32(k), r2
		step := 0
		if r2 < rc2 {
			step = 1
		}
		kept += step
	}
	p.addRow(s, i, alpha, kept)
}
