package ewald

import (
	"math"
	"math/bits"

	"enthalpath/thermo/crystal"
)

// This file: Sum for a small cell, on fixed-size arrays from the
// translation search to the result. The only allocation is the returned
// Result.SitePotentials.

// smallFull is the largest cell, as given, that sumSmall accepts; its
// primitive cell must have at most smallSites sites (smallcell.go). The
// conventional cells of the built-in prototypes but spinel and corundum
// qualify.
const smallFull = 16

// smallSkew bounds |aₖ|⁶/V² for the lattice vectors aₖ of a cell on the
// small path: no vector longer than 100 times the cube root of the volume.
const smallSkew = 1e12

// smallGenerators bounds the generators of the translation group of a
// cell of smallFull sites: each generator at least doubles the group.
const smallGenerators = 4

// smallGroup holds the internal translations of a small cell (fractional
// vectors that map every site onto a site of equal charge) by generators,
// each with the permutation of the sites it makes, and the orbits of the
// sites under them. A translation is named by the image of site 0 under
// it, so the group has as many elements as the orbit of site 0.
type smallGroup struct {
	gens  [smallGenerators]crystal.Vec3
	perms [smallGenerators][smallFull]uint8
	nGen  int
	size  int    // number of translations g, the identity included
	zero  uint32 // the orbit of site 0, as a set of bits
}

// find fills gr with the translations of the cell of wrapped fractional
// positions f and charges q, and reports false when they do not act as a
// group of translations should (possible only with sites closer than
// translationTolerance, or more generators than a cell of smallFull sites
// can need).
func (gr *smallGroup) find(f []crystal.Vec3, q []float64) bool {
	n := len(f)
	gr.nGen = 0
	// like[i]: the sites of the charge of site i, as a set of bits.
	var like [smallFull]uint32
	for i := 0; i < n; i++ {
		if like[i] != 0 {
			continue
		}
		set := uint32(0)
		for j := i; j < n; j++ {
			if q[j] == q[i] {
				set |= 1 << j
			}
		}
		for o := set; o != 0; o &= o - 1 {
			like[bits.TrailingZeros32(o)] = set
		}
	}
	reached := uint32(1) // the orbit of site 0 under the generators found
	for c := 1; c < n; c++ {
		if q[c] != q[0] || reached&(1<<c) != 0 {
			continue
		}
		if gr.nGen == smallGenerators {
			return false
		}
		t := f[c].Sub(f[0])
		if !mapsSites(f, like[:n], t, &gr.perms[gr.nGen]) {
			continue
		}
		gr.gens[gr.nGen] = t
		gr.nGen++
		reached = gr.orbit(0, n)
	}
	gr.size, gr.zero = bits.OnesCount32(reached), reached
	return n%gr.size == 0
}

// orbit returns the sites reached from site i by the generators, as a set
// of bits.
func (gr *smallGroup) orbit(i, n int) uint32 {
	set, todo := uint32(1)<<i, uint32(1)<<i
	for todo != 0 {
		j := bits.TrailingZeros32(todo)
		todo &^= 1 << j
		for k := 0; k < gr.nGen; k++ {
			if to := uint32(1) << gr.perms[k][j]; set&to == 0 {
				set |= to
				todo |= to
			}
		}
	}
	return set
}

// basis returns a reduced basis of the lattice of the cell lat with its g
// translations (f holds the wrapped fractional positions the translations
// were found on) when three of the translations and lattice vectors span
// it: any three vectors of that lattice whose cell has 1/g of the volume
// do (a sublattice of index one). It tries the translations first; it
// reports false when no three of them span it, and the caller takes
// primitiveLattice, which always can (but costs integer divisions).
func (gr *smallGroup) basis(lat [3]crystal.Vec3, f []crystal.Vec3, g int) ([3]crystal.Vec3, bool) {
	var cand [smallFull + 2]crystal.Vec3
	k := 0
	for o := gr.zero &^ 1; o != 0; o &= o - 1 {
		t := f[bits.TrailingZeros32(o)].Sub(f[0])
		for d := range t {
			t[d] -= (t[d] + roundingShift) - roundingShift // into [−½, ½]
		}
		cand[k] = t
		k++
	}
	cand[k], cand[k+1], cand[k+2] = crystal.Vec3{1, 0, 0}, crystal.Vec3{0, 1, 0}, crystal.Vec3{0, 0, 1}
	k += 3
	want := 1 / float64(g)
	for i := 0; i < k; i++ {
		for j := i + 1; j < k; j++ {
			cross := cand[i].Cross(cand[j])
			for l := j + 1; l < k; l++ {
				if math.Abs(math.Abs(cross.Dot(cand[l]))-want) > 1e-9*want {
					continue
				}
				var out [3]crystal.Vec3
				for r, v := range [3]crystal.Vec3{cand[i], cand[j], cand[l]} {
					out[r] = lat[0].Scale(v[0]).Add(lat[1].Scale(v[1])).Add(lat[2].Scale(v[2]))
				}
				return crystal.ReduceBasis(out), true
			}
		}
	}
	return lat, false
}

// mapsSites reports whether the fractional translation t, not a lattice
// vector, maps every site onto a distinct site of equal charge (like[i]:
// the sites of the charge of site i, as a set of bits), and sets p[i] to
// the image of site i. It stops at the first site without an image.
func mapsSites(f []crystal.Vec3, like []uint32, t crystal.Vec3, p *[smallFull]uint8) bool {
	if sameModulo(t[0]) && sameModulo(t[1]) && sameModulo(t[2]) {
		return false
	}
	var used uint32
	for i := range f {
		x, y, z := f[i][0]+t[0], f[i][1]+t[1], f[i][2]+t[2]
		found := false
		for o := like[i] &^ used; o != 0; o &= o - 1 {
			j := bits.TrailingZeros32(o)
			if !sameModulo(x-f[j][0]) || !sameModulo(y-f[j][1]) || !sameModulo(z-f[j][2]) {
				continue
			}
			used |= 1 << j
			p[i] = uint8(j)
			found = true
			break
		}
		if !found {
			return false
		}
	}
	return true
}

// smallArrays backs the primitive cell of a small cell and the potentials.
type smallArrays struct {
	frac            [smallSites]crystal.Vec3
	q               [smallSites]float64
	phiReal, phiRec [smallSites]float64
	phiFull         [smallFull]float64
	origin          [smallSites]int // index in the caller's cell of each primitive site
}

// sumSmall is Sum for a cell of at most smallFull sites whose primitive
// cell has at most smallSites sites and whose sums fit the fixed-size
// arrays, at the first attempt's cut-offs. It reports false, having
// changed nothing, for any other cell, for two sites at one position, and
// when the accuracy needs wider cut-offs: Sum then takes the general
// path, which words every error.
func sumSmall(c *crystal.Crystal, eps, target, forcedAlpha float64) (Result, bool) {
	n := len(c.Sites)
	if n < 2 || n > smallFull {
		return Result{}, false
	}
	var f [smallFull]crystal.Vec3
	var q [smallFull]float64
	for i, site := range c.Sites {
		f[i] = wrapFrac(site.Frac)
		q[i] = site.Charge
	}
	var gr smallGroup
	if !gr.find(f[:n], q[:n]) {
		return Result{}, false
	}
	g := gr.size
	if n/g > smallSites {
		return Result{}, false
	}
	volume := c.Volume()
	// A lattice given by vectors far longer than the cell is wide (a needle
	// or a skewed basis of a compact cell) loses digits in the positions
	// and translations computed from them here; the general path works in
	// its reduced basis throughout.
	for _, a := range c.Lattice {
		if d2 := a.Dot(a); d2*d2*d2 > smallSkew*volume*volume {
			return Result{}, false
		}
	}
	var lat [3]crystal.Vec3
	if g > 1 {
		var ok bool
		if lat, ok = gr.basis(c.Lattice, f[:n], g); !ok {
			if lat, ok = primitiveLattice(c.Lattice, gr.gens[:gr.nGen], g, volume); !ok {
				return Result{}, false
			}
		}
	} else {
		lat = crystal.ReduceBasis(c.Lattice)
	}

	// The primitive cell: one site of each orbit (the lowest index), in
	// the reduced basis lat. rep[i] is the primitive site of site i.
	var a smallArrays
	var rep [smallFull]int
	sub := system{lat: lat, volume: volume / float64(g)}
	sub.recip = (&crystal.Crystal{Lattice: lat}).Reciprocal()
	m := 0
	var done uint32
	for i := 0; i < n; i++ {
		if done&(1<<i) != 0 {
			continue
		}
		orbit := uint32(1) << i
		if i == 0 {
			orbit = gr.zero // found with the group
		} else if g > 1 {
			orbit = gr.orbit(i, n)
		}
		if bits.OnesCount32(orbit) != g || m == smallSites {
			return Result{}, false
		}
		done |= orbit
		for o := orbit; o != 0; o &= o - 1 {
			rep[bits.TrailingZeros32(o)] = m
		}
		r := c.Cartesian(f[i])
		a.frac[m] = wrapFrac(crystal.Vec3{sub.recip[0].Dot(r), sub.recip[1].Dot(r), sub.recip[2].Dot(r)})
		a.q[m] = q[i]
		a.origin[m] = i
		sub.q2 += q[i] * q[i]
		m++
	}
	sub.frac, sub.q = a.frac[:m], a.q[:m]

	p := math.Sqrt(-math.Log(target / 2))
	alpha := forcedAlpha
	if alpha == 0 {
		alpha = smallAlpha(m, sub.volume)
	}
	rc, kc := p/alpha, 2*alpha*p
	realTerms, nearest, pair, ok := sub.realSmall(alpha, rc, a.phiReal[:m])
	if !ok {
		return Result{}, false
	}
	recipTerms, ok := sub.reciprocalPairs(alpha, kc, a.phiRec[:m])
	if !ok {
		return Result{}, false
	}

	ps := partialSums{phi: a.phiFull[:n], nearest: nearest, pair: [2]int{-1, -1}, overlap: [2]int{-1, -1},
		realTerms: realTerms, recipTerms: recipTerms}
	if pair[0] >= 0 {
		ps.pair = [2]int{a.origin[pair[0]], a.origin[pair[1]]}
	}
	selfFactor := 2 * alpha / math.Sqrt(math.Pi)
	var phi [smallSites]float64
	for k := 0; k < m; k++ {
		qk, re, rk := a.q[k], a.phiReal[k], a.phiRec[k]
		self := -selfFactor * qk
		phi[k] = re + rk + self
		ps.real += 0.5 * qk * re
		ps.recip += 0.5 * qk * rk
		ps.self += 0.5 * qk * self
		ps.magnitude += 0.5 * math.Abs(qk) * (math.Abs(re) + math.Abs(rk) + math.Abs(self))
	}
	trunc := kolafaPerram(sub.q2, sub.volume, alpha, rc, kc) / math.Abs(ps.total())
	if trunc > target {
		return Result{}, false
	}
	fg := float64(g)
	ps.real, ps.recip, ps.self, ps.magnitude = fg*ps.real, fg*ps.recip, fg*ps.self, fg*ps.magnitude
	for i := 0; i < n; i++ {
		a.phiFull[i] = phi[rep[i]]
	}
	res := newResult(c, ps, alpha, rc, kc, eps, math.Max(trunc, math.Exp(-p*p)))
	if !(res.EstimatedError <= eps) {
		return Result{}, false
	}
	return res, true
}
