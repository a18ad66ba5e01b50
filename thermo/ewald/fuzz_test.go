package ewald

import (
	"math"
	"testing"

	"enthalpath/thermo/crystal"
)

// FuzzSum feeds arbitrary cells of two to four ions to Sum: it must return
// a value or an error, never panic, and a returned energy of a neutral cell
// must be finite.
func FuzzSum(f *testing.F) {
	f.Add(5.64, 0.0, 0.0, 0.0, 5.64, 0.0, 0.0, 0.0, 5.64, 0.5, 0.5, 0.5, 0.25, 0.1, 0.9, uint8(2))
	f.Add(3.0, 0.0, 0.0, -1.5, 2.6, 0.0, 0.0, 0.0, 4.9, 0.333, 0.667, 0.375, 0.5, 0.5, 0.0, uint8(4))
	f.Add(1e-3, 0.0, 0.0, 0.0, 10.0, 0.0, 0.0, 0.0, 10.0, 0.5, 0.5, 0.5, 0.0, 0.0, 0.0, uint8(3))
	f.Fuzz(func(t *testing.T, a0, a1, a2, b0, b1, b2, c0, c1, c2, x, y, z, u, v, w float64, n uint8) {
		cr := &crystal.Crystal{
			Name:         "fuzz",
			Lattice:      [3]crystal.Vec3{{a0, a1, a2}, {b0, b1, b2}, {c0, c1, c2}},
			FormulaUnits: 1,
		}
		k := 2 + int(n%3)
		positions := []crystal.Vec3{{0, 0, 0}, {x, y, z}, {u, v, w}, {x, v, z}}
		for i := 0; i < k; i++ {
			q := 1.0
			if i%2 == 1 {
				q = -1
			}
			if k == 3 && i == 0 {
				q = 2 // +2, −1, −1
			}
			if k == 3 && i == 2 {
				q = -1
			}
			cr.Sites = append(cr.Sites, crystal.Site{Species: "S", Charge: q, Frac: positions[i]})
		}
		if c := cr.Volume(); !(c > 0.5) || c > 1e5 {
			return // keep each run fast; tiny and huge cells are covered by tests
		}
		r, err := Sum(cr, Options{Accuracy: 1e-6})
		if err == nil && (math.IsNaN(r.EnergyEV) || math.IsInf(r.EnergyEV, 0)) {
			t.Errorf("energy %g without an error", r.EnergyEV)
		}
	})
}
