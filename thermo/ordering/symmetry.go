package ordering

import (
	"math"
	"strconv"

	"enthalpath/thermo/crystal"
)

// symmetry holds the operations of the disordered parent as permutations
// of the mixed sites: perm[g][a] is the image of mixed site a under g.
type symmetry struct {
	perm [][]int32
	// translationsOnly is set when the point operations were left out to
	// keep the table within Options.MaxSymmetry.
	translationsOnly bool
}

// positionTolerance is the largest fractional mismatch (in the reduced
// basis) accepted when an operation maps a site onto another.
const positionTolerance = 1e-5

// siteIndex finds a site of a given kind at a fractional position: a hash
// of positions rounded to a grid of positionTolerance, with the neighbouring
// grid points tried when the rounding falls the other way.
type siteIndex struct {
	frac []crystal.Vec3
	kind []int
	at   map[[3]int64][]int
}

const gridPerUnit = 1 / positionTolerance

func gridKey(f crystal.Vec3) [3]int64 {
	var k [3]int64
	for d := range f {
		k[d] = int64(math.Round(f[d]*gridPerUnit)) % int64(gridPerUnit)
	}
	return k
}

func wrap(f crystal.Vec3) crystal.Vec3 {
	for d := range f {
		f[d] -= math.Floor(f[d])
	}
	return f
}

func newSiteIndex(frac []crystal.Vec3, kind []int) *siteIndex {
	x := &siteIndex{frac: frac, kind: kind, at: make(map[[3]int64][]int, len(frac))}
	for i, f := range frac {
		k := gridKey(f)
		x.at[k] = append(x.at[k], i)
	}
	return x
}

// find returns the site of kind k at f (any lattice image), or −1.
func (x *siteIndex) find(f crystal.Vec3, k int) int {
	f = wrap(f)
	key := gridKey(f)
	if i := x.match(x.at[key], f, k); i >= 0 {
		return i
	}
	// The rounding may have put the site on a neighbouring grid point.
	g := int64(gridPerUnit)
	for d0 := int64(-1); d0 <= 1; d0++ {
		for d1 := int64(-1); d1 <= 1; d1++ {
			for d2 := int64(-1); d2 <= 1; d2++ {
				if d0 == 0 && d1 == 0 && d2 == 0 {
					continue
				}
				kk := [3]int64{(key[0] + d0 + g) % g, (key[1] + d1 + g) % g, (key[2] + d2 + g) % g}
				if i := x.match(x.at[kk], f, k); i >= 0 {
					return i
				}
			}
		}
	}
	return -1
}

// match returns the site among candidates of kind k at f, or −1.
func (x *siteIndex) match(candidates []int, f crystal.Vec3, k int) int {
	for _, i := range candidates {
		if x.kind[i] != k {
			continue
		}
		ok := true
		for d := 0; d < 3 && ok; d++ {
			e := f[d] - x.frac[i][d]
			ok = math.Abs(e-math.Round(e)) <= positionTolerance
		}
		if ok {
			return i
		}
	}
	return -1
}

// findSymmetry returns the operations of p's disordered parent: integer
// matrices R on fractional coordinates of a reduced basis that keep the
// metric (entries −1…1, enough for a reduced basis), each with the
// translations t that map every site onto one of its kind. It returns nil
// when even the translations alone would pass maxTable entries.
func findSymmetry(p *Problem, maxTable int) *symmetry {
	if maxTable <= 0 {
		maxTable = DefaultMaxSymmetry
	}
	c := p.Parent
	lat := crystal.ReduceBasis(c.Lattice)
	red := &crystal.Crystal{Lattice: lat}
	n := len(c.Sites)
	frac := make([]crystal.Vec3, n)
	for i, s := range c.Sites {
		frac[i] = wrap(red.Fractional(c.Cartesian(s.Frac)))
	}
	// Kinds: mixed sites by group, fixed ones by species and charge.
	kind := make([]int, n)
	names := map[string]int{}
	mixedAt := make([]int, n)
	for i := range mixedAt {
		mixedAt[i] = -1
	}
	for a, i := range p.Mixed {
		mixedAt[i] = a
	}
	for i, s := range c.Sites {
		key := s.Species + "\x00" + strconv.FormatFloat(s.Charge, 'g', -1, 64)
		if a := mixedAt[i]; a >= 0 {
			key = "\x01" + strconv.Itoa(p.GroupOf[a])
		}
		if _, ok := names[key]; !ok {
			names[key] = len(names)
		}
		kind[i] = names[key]
	}
	index := newSiteIndex(frac, kind)
	rotations := latticeRotations(lat)
	// Anchor: a site of the rarest kind, so that few translations are tried.
	count := make([]int, len(names))
	for _, k := range kind {
		count[k]++
	}
	anchor := 0
	for i := range kind {
		if count[kind[i]] < count[kind[anchor]] {
			anchor = i
		}
	}
	m := len(p.Mixed)
	// try returns the permutation of the mixed sites made by f ↦ R·f + t,
	// or false when some site does not land on a site of its kind.
	try := func(R [3][3]int, t crystal.Vec3) ([]int32, bool) {
		perm := make([]int32, m)
		for i := 0; i < n; i++ {
			img := index.find(apply(R, frac[i]).Add(t), kind[i])
			if img < 0 {
				return nil, false
			}
			if a := mixedAt[i]; a >= 0 {
				perm[a] = int32(mixedAt[img])
			}
		}
		return perm, true
	}
	// The pure translations first (rotations[0] is the identity).
	var translations [][]int32
	for j := 0; j < n; j++ {
		if kind[j] != kind[anchor] {
			continue
		}
		if perm, ok := try(rotations[0], frac[j].Sub(frac[anchor])); ok {
			translations = append(translations, perm)
		}
	}
	if len(translations)*m > maxTable {
		return nil
	}
	// The operations with rotation R, if any, are the translations
	// composed with one of them: find that one, then compose.
	perms := append([][]int32(nil), translations...)
	for _, R := range rotations[1:] {
		ra := apply(R, frac[anchor])
		for j := 0; j < n; j++ {
			if kind[j] != kind[anchor] {
				continue
			}
			first, ok := try(R, frac[j].Sub(ra))
			if !ok {
				continue
			}
			if (len(perms)+len(translations))*m > maxTable {
				return &symmetry{perm: translations, translationsOnly: true}
			}
			for _, t := range translations {
				perm := make([]int32, m)
				for a, b := range first {
					perm[a] = t[b]
				}
				perms = append(perms, perm)
			}
			break
		}
	}
	return &symmetry{perm: perms}
}

// apply returns R·f.
func apply(R [3][3]int, f crystal.Vec3) crystal.Vec3 {
	var out crystal.Vec3
	for i := 0; i < 3; i++ {
		out[i] = float64(R[i][0])*f[0] + float64(R[i][1])*f[1] + float64(R[i][2])*f[2]
	}
	return out
}

// latticeRotations lists the integer matrices R (entries −1, 0, 1) with
// Rᵀ·G·R = G for the metric G of the lattice (rows lat), the identity first:
// the point operations of the lattice in fractional coordinates.
func latticeRotations(lat [3]crystal.Vec3) [][3][3]int {
	var G [3][3]float64
	scale := 0.0
	for i := 0; i < 3; i++ {
		for j := 0; j < 3; j++ {
			G[i][j] = lat[i].Dot(lat[j])
		}
		scale = math.Max(scale, G[i][i])
	}
	out := [][3][3]int{{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}}
	var R [3][3]int
	for code := 0; code < 19683; code++ {
		x := code
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				R[i][j] = x%3 - 1
				x /= 3
			}
		}
		if R == out[0] {
			continue
		}
		det := R[0][0]*(R[1][1]*R[2][2]-R[1][2]*R[2][1]) - R[0][1]*(R[1][0]*R[2][2]-R[1][2]*R[2][0]) + R[0][2]*(R[1][0]*R[2][1]-R[1][1]*R[2][0])
		if det != 1 && det != -1 {
			continue
		}
		// f' = R·f; the metric of the images, (R·eᵢ)ᵀG(R·eⱼ), must equal G.
		ok := true
		for i := 0; i < 3 && ok; i++ {
			for j := 0; j < 3 && ok; j++ {
				g := 0.0
				for k := 0; k < 3; k++ {
					for l := 0; l < 3; l++ {
						g += float64(R[k][i]*R[l][j]) * G[k][l]
					}
				}
				ok = math.Abs(g-G[i][j]) <= 1e-6*scale
			}
		}
		if ok {
			out = append(out, R)
		}
	}
	return out
}

// size is the number of operations (1 when there is no table).
func (s *symmetry) size() int {
	if s == nil {
		return 1
	}
	return len(s.perm)
}

// canonical writes into dst the least, in lexicographic order, of the
// images of x under every operation (x itself without a table), and
// returns the number of operations that leave x unchanged.
func (s *symmetry) canonical(x, dst, scratch []uint8) (stabiliser int) {
	copy(dst, x)
	if s == nil {
		return 1
	}
	for _, perm := range s.perm {
		for a, b := range perm {
			scratch[b] = x[a]
		}
		cmp := compare(scratch, dst)
		if cmp < 0 {
			copy(dst, scratch)
		}
		if string(scratch) == string(x) {
			stabiliser++
		}
	}
	return stabiliser
}

func compare(a, b []uint8) int {
	for i := range a {
		if a[i] != b[i] {
			if a[i] < b[i] {
				return -1
			}
			return 1
		}
	}
	return 0
}
