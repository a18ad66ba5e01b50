package ewald

import (
	"encoding/json"
	"math"
	"os"
	"testing"

	"enthalpath/thermo/crystal"
)

// TestDisplacedAgainstPymatgen: the 216-ion rock-salt supercell with every
// ion moved at random, from testdata/ewald_reference.json (written by
// testdata/gen_ewald.py with Debian's python3-pymatgen EwaldSummation at
// acc_factor 14), summed on the general path of Sum with the splitting
// parameter Sum chooses and forced to the two real-space paths: one image
// per pair (cut-off 0.45 of the cell) and several (0.9 of the cell). The
// energy must agree with pymatgen's to the accuracy asked, 1e-10 relative,
// and every site potential to 1e-9 relative.
func TestDisplacedAgainstPymatgen(t *testing.T) {
	b, err := os.ReadFile("../../testdata/ewald_reference.json")
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Pymatgen  string `json:"pymatgen"`
		Displaced []struct {
			Key    string     `json:"key"`
			ABC    [3]float64 `json:"lattice_abc"`
			Angles [3]float64 `json:"lattice_angles"`
			Sites  []struct {
				Species string     `json:"species"`
				Charge  float64    `json:"charge"`
				Frac    [3]float64 `json:"frac"`
			} `json:"sites"`
			EnergyEV   float64   `json:"energy_ev"`
			Potentials []float64 `json:"site_potentials_volt"`
		} `json:"displaced"`
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	if len(ref.Displaced) == 0 {
		t.Fatal("no displaced structure in the reference file: run testdata/regenerate.sh")
	}
	for _, rs := range ref.Displaced {
		// The generator writes an orthogonal supercell: its lattice is the
		// diagonal of its lengths.
		if rs.Angles != [3]float64{90, 90, 90} {
			t.Fatalf("%s: angles %v; the test reads orthogonal cells only", rs.Key, rs.Angles)
		}
		c := &crystal.Crystal{Name: rs.Key, FormulaUnits: len(rs.Sites) / 2, Lattice: [3]crystal.Vec3{
			{rs.ABC[0], 0, 0}, {0, rs.ABC[1], 0}, {0, 0, rs.ABC[2]},
		}}
		for _, s := range rs.Sites {
			c.Sites = append(c.Sites, crystal.Site{Species: s.Species, Charge: s.Charge, Frac: s.Frac})
		}
		s := newSystem(c, false)
		p := math.Sqrt(-math.Log(DefaultAccuracy / 2))
		spacing := 1 / s.recip[0].Norm()
		for _, tc := range []struct {
			path  string
			alpha float64
		}{
			{"chosen", 0},
			{"one image", p / (0.45 * spacing)},
			{"several images", p / (0.9 * spacing)},
		} {
			r := sum(t, c, Options{alpha: tc.alpha})
			if tc.alpha > 0 && s.oneImage(r.RealCutoff) != (tc.path == "one image") {
				t.Fatalf("%s, %s: cut-off %.3f Å takes the other path", rs.Key, tc.path, r.RealCutoff)
			}
			t.Logf("%s, %s: α = %.4f, rc = %.2f Å, relative difference %.2g", rs.Key, tc.path, r.Alpha, r.RealCutoff, relDiff(r.EnergyEV, rs.EnergyEV))
			if d := relDiff(r.EnergyEV, rs.EnergyEV); d > DefaultAccuracy {
				t.Errorf("%s, %s: E = %.12f eV, pymatgen %.12f eV (relative %.2g)", rs.Key, tc.path, r.EnergyEV, rs.EnergyEV, d)
			}
			for i, want := range rs.Potentials {
				if got := r.SitePotentials[i]; math.Abs(got-want) > 1e-9*math.Abs(want) {
					t.Errorf("%s, %s: φ[%d] = %.12f V, pymatgen %.12f V", rs.Key, tc.path, i, got, want)
					break
				}
			}
		}
	}
}
