package ewald

import (
	"math"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/notation"
)

// primitive returns the system of the primitive cell of s: the lattice
// spanned by s's lattice vectors and its internal translations, holding one
// site of each translation orbit (s.reps, in order). The energy of s is g
// times the energy of that cell and every site of an orbit has the
// potential of its representative, so summing the small cell is exact. It
// returns false when s has no internal translations or the basis cannot be
// found reliably, and the caller sums s itself.
func (s *system) primitive() (*system, bool) {
	if s.g < 2 || len(s.generators) == 0 {
		return nil, false
	}
	lat, ok := primitiveLattice(s.lat, s.generators, s.g, s.volume)
	if !ok {
		return nil, false
	}
	prim := &crystal.Crystal{Name: s.c.Name + " (primitive)", Lattice: lat, FormulaUnits: 1, Sites: make([]crystal.Site, 0, len(s.reps))}
	for _, r := range s.reps {
		site := s.c.Sites[r]
		site.Frac = prim.Fractional(s.pos[r])
		prim.Sites = append(prim.Sites, site)
	}
	p := newSystem(prim, false)
	p.origin = s.reps
	return p, true
}

// primitiveLattice returns a reduced basis of the lattice spanned by the
// vectors of lat and the translations generators (fractional coordinates
// in lat), of which there are g in all (the identity included). It
// reports false when the basis cannot be found reliably: a generator
// without a denominator up to g, or a cell whose volume is not volume/g.
func primitiveLattice(lat [3]crystal.Vec3, generators []crystal.Vec3, g int, volume float64) ([3]crystal.Vec3, bool) {
	// Common denominator D of the generators' fractional coordinates: the
	// order of any translation divides g.
	den := int64(1)
	for _, t := range generators {
		d, ok := denominator(t, int64(g))
		if !ok {
			return lat, false
		}
		den = den / notation.GCD(den, d) * d
	}
	// Room for the generators of any group a cell can hold (each at least
	// doubles the group) without an allocation.
	var room [3 + 24][3]int64
	cols := room[:3]
	cols[0], cols[1], cols[2] = [3]int64{den, 0, 0}, [3]int64{0, den, 0}, [3]int64{0, 0, den}
	for _, t := range generators {
		var c [3]int64
		for k := range t {
			c[k] = int64(math.Round(t[k] * float64(den)))
		}
		cols = append(cols, c)
	}
	basis, ok := hermiteBasis(cols)
	if !ok {
		return lat, false
	}
	var prim [3]crystal.Vec3
	for i := 0; i < 3; i++ {
		for k := 0; k < 3; k++ {
			prim[i] = prim[i].Add(lat[k].Scale(float64(basis[i][k]) / float64(den)))
		}
	}
	prim = crystal.ReduceBasis(prim)
	if v := math.Abs(prim[0].Dot(prim[1].Cross(prim[2]))); math.Abs(v*float64(g)-volume) > 1e-9*volume {
		return lat, false
	}
	return prim, true
}

// denominator returns the smallest d ≤ limit with d·t integral.
func denominator(t crystal.Vec3, limit int64) (int64, bool) {
	for d := int64(1); d <= limit; d++ {
		ok := true
		for k := range t {
			x := t[k] * float64(d)
			if math.Abs(x-math.Round(x)) > 1e-6 {
				ok = false
				break
			}
		}
		if ok {
			return d, true
		}
	}
	return 0, false
}

// hermiteBasis returns three integer vectors spanning the same lattice as
// cols (which must have rank 3), by column operations that keep the lattice
// (Euclid's algorithm on each coordinate in turn: a Hermite normal form).
func hermiteBasis(cols [][3]int64) ([3][3]int64, bool) {
	for r := 0; r < 3; r++ {
		for {
			best := -1
			for j := r; j < len(cols); j++ {
				if cols[j][r] != 0 && (best < 0 || abs64(cols[j][r]) < abs64(cols[best][r])) {
					best = j
				}
			}
			if best < 0 {
				return [3][3]int64{}, false
			}
			cols[r], cols[best] = cols[best], cols[r]
			done := true
			for j := r + 1; j < len(cols); j++ {
				if q := cols[j][r] / cols[r][r]; q != 0 {
					for k := 0; k < 3; k++ {
						cols[j][k] -= q * cols[r][k]
					}
				}
				if cols[j][r] != 0 {
					done = false
				}
			}
			if done {
				break
			}
		}
	}
	return [3][3]int64{cols[0], cols[1], cols[2]}, true
}

func abs64(x int64) int64 {
	if x < 0 {
		return -x
	}
	return x
}
