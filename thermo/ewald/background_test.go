package ewald

import (
	"encoding/json"
	"math"
	"os"
	"testing"

	"enthalpath/thermo/crystal"
)

// oxidationReference is written by testdata/gen_oxidation.py with Debian's
// python3-pymatgen (EwaldSummation, acc_factor 14): its "charged_cells"
// give total energies that include pymatgen's charged-cell term.
const oxidationReference = "../../testdata/oxidation_reference.json"

type chargedCase struct {
	Lattice    [3][3]float64 `json:"lattice"`
	Species    []string      `json:"species"`
	Charges    []float64     `json:"charges"`
	Frac       [][3]float64  `json:"frac"`
	EnergyEV   float64       `json:"energy_ev"`
	Background float64       `json:"charged_cell_energy_ev"`
}

func chargedCases(t *testing.T) map[string]chargedCase {
	t.Helper()
	b, err := os.ReadFile(oxidationReference)
	if err != nil {
		t.Fatalf("reading %s (run testdata/regenerate.sh): %v", oxidationReference, err)
	}
	var ref struct {
		Library string                 `json:"library"`
		Charged map[string]chargedCase `json:"charged_cells"`
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	if ref.Library == "" || len(ref.Charged) == 0 {
		t.Fatalf("%s: no library version or no charged cells", oxidationReference)
	}
	return ref.Charged
}

func (cc chargedCase) crystal(name string) *crystal.Crystal {
	c := &crystal.Crystal{Name: name, FormulaUnits: 1}
	for k := 0; k < 3; k++ {
		c.Lattice[k] = cc.Lattice[k]
	}
	for i, el := range cc.Species {
		c.Sites = append(c.Sites, crystal.Site{Species: el, Charge: cc.Charges[i], Frac: cc.Frac[i]})
	}
	return c
}

// TestSumChargedAgainstPymatgen: the energy with the background term equals
// pymatgen's EwaldSummation total energy (which includes its charged-cell
// energy) to 1e-8 relative.
func TestSumChargedAgainstPymatgen(t *testing.T) {
	for name, cc := range chargedCases(t) {
		r, bg, err := SumCharged(cc.crystal(name), Options{Accuracy: 1e-12})
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		if rel := math.Abs(r.EnergyEV-cc.EnergyEV) / math.Abs(cc.EnergyEV); !(rel < 1e-8) {
			t.Errorf("%s: energy %.12g eV, pymatgen %.12g eV (relative %.2g)", name, r.EnergyEV, cc.EnergyEV, rel)
		}
		if bg.NetCharge == 0 || bg.EnergyEV >= 0 {
			t.Errorf("%s: background %+v, want a net charge and a negative term", name, bg)
		}
		// ½ Σ q φ still gives the energy with the shifted potentials.
		e := 0.0
		for i, q := range cc.Charges {
			e += 0.5 * q * r.SitePotentials[i]
		}
		if math.Abs(e-r.EnergyEV) > 1e-9*math.Abs(r.EnergyEV) {
			t.Errorf("%s: ½Σqφ = %.12g, energy %.12g", name, e, r.EnergyEV)
		}
	}
}

// TestSumChargedIndependentOfAlpha: with the background term the energy
// does not depend on the splitting parameter (without it, it would by
// −πQ²/(2Vα²)): a property of the method, no source needed.
func TestSumChargedIndependentOfAlpha(t *testing.T) {
	for name, cc := range chargedCases(t) {
		var first float64
		for i, alpha := range []float64{0.4, 0.7, 1.1} {
			r, _, err := SumCharged(cc.crystal(name), Options{Accuracy: 1e-12, alpha: alpha})
			if err != nil {
				t.Fatalf("%s α=%g: %v", name, alpha, err)
			}
			if i == 0 {
				first = r.EnergyEV
				continue
			}
			if math.Abs(r.EnergyEV-first) > 1e-9*math.Abs(first) {
				t.Errorf("%s: α=%g gives %.12g eV, α=0.4 gives %.12g eV", name, alpha, r.EnergyEV, first)
			}
		}
	}
}

// TestSumChargedNeutralIsSum: a neutral cell gives Sum's result and no
// background.
func TestSumChargedNeutralIsSum(t *testing.T) {
	c, err := crystal.Build("rock-salt", nil)
	if err != nil {
		t.Fatal(err)
	}
	r1, bg, err := SumCharged(c, Options{})
	if err != nil {
		t.Fatal(err)
	}
	r2, _ := Sum(c, Options{})
	if r1.EnergyEV != r2.EnergyEV || bg != (Background{}) {
		t.Errorf("neutral: %g vs %g, background %+v", r1.EnergyEV, r2.EnergyEV, bg)
	}
	if _, err := Sum(cc0(), Options{}); err == nil {
		t.Error("Sum accepted a charged cell")
	}
}

func cc0() *crystal.Crystal {
	return &crystal.Crystal{Name: "charged", FormulaUnits: 1, Lattice: [3]crystal.Vec3{{4, 0, 0}, {0, 4, 0}, {0, 0, 4}},
		Sites: []crystal.Site{{Species: "Cs", Charge: 2}, {Species: "Cl", Charge: -1, Frac: crystal.Vec3{0.5, 0.5, 0.5}}}}
}
