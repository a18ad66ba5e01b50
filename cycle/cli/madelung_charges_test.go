package cli

import (
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

const oxidationDir = "../../testdata/oxidation/"

// TestMadelungAssignsCharges: a CIF written by pymatgen without charges
// (testdata/gen_oxidation.py) is summed with assigned charges; the text
// states the method and the bond-valence sums, and --json carries both.
// Expected: Fe3O4 as the inverse spinel (fact of the trade), its energy
// pymatgen's EwaldSummation with those charges (oxidation_reference.json,
// 1e-8 relative).
func TestMadelungAssignsCharges(t *testing.T) {
	code, out, errs := runMadelungForTest(t, oxidationDir+"real_Fe3O4_magnetite_sym.cif")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, want := range []string{"mixed valence", "Fe+2 : Fe+3 = 0.5 : 0.5", "averaged    16 of 56 sites", "bond-valence sum", "formula     Fe3O4"} {
		if !strings.Contains(out, want) {
			t.Errorf("text lacks %q:\n%s", want, out)
		}
	}
	code, out, errs = runMadelungForTest(t, oxidationDir+"real_Fe3O4_magnetite_sym.cif", "--json")
	if code != ExitOK {
		t.Fatalf("--json: exit %d: %s", code, errs)
	}
	var m struct {
		Energy  float64 `json:"energy_ev_per_cell"`
		Charges struct {
			Method string `json:"method"`
			Groups []struct {
				Element string  `json:"element"`
				Charge  float64 `json:"charge"`
				States  [2]int  `json:"oxidation_states"`
			} `json:"groups"`
		} `json:"charges"`
		Structure struct {
			Sites []struct {
				BVS *float64 `json:"bond_valence_sum"`
			} `json:"sites"`
		} `json:"structure"`
	}
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	ref := referenceEnergy(t, "real_Fe3O4_magnetite_sym.cif")
	if rel := math.Abs(m.Energy-ref) / math.Abs(ref); !(rel < 1e-8) {
		t.Errorf("energy %.12g eV, pymatgen %.12g eV", m.Energy, ref)
	}
	if m.Charges.Method != "mixed-valence" || len(m.Charges.Groups) != 3 {
		t.Errorf("charges %+v", m.Charges)
	}
	if len(m.Structure.Sites) != 56 || m.Structure.Sites[0].BVS == nil || !(*m.Structure.Sites[0].BVS > 2 && *m.Structure.Sites[0].BVS < 3.2) {
		t.Errorf("per-site bond-valence sums missing or off: %d sites", len(m.Structure.Sites))
	}
}

func referenceEnergy(t *testing.T, file string) float64 {
	t.Helper()
	b, err := os.ReadFile("../../testdata/oxidation_reference.json")
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Files map[string]struct {
			Energy float64 `json:"energy_ev"`
		} `json:"files"`
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	return ref.Files[file].Energy
}

// TestMadelungSharedSite: the Na 0.5 / K 0.5 site is summed as its mean
// charge and the output names the averaging.
func TestMadelungSharedSite(t *testing.T) {
	code, out, errs := runMadelungForTest(t, oxidationDir+"invented_tarnwick_NaKCl_mixed_site_P1.cif")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	for _, want := range []string{"averaged    4 of 8 sites carry a mean charge", "K0.5Na0.5", "charge balance"} {
		if !strings.Contains(out, want) {
			t.Errorf("text lacks %q:\n%s", want, out)
		}
	}
}

// TestMadelungChargedCell: --charges that leave the cell charged give a
// sum with the background term and a warning about the convention; the
// energy is pymatgen's for the same charges (its charged-cell energy is
// the same term; the CsCl-type case of oxidation_reference.json has
// Cs +2, Cl −1 at a = 4.123 Å).
func TestMadelungChargedCell(t *testing.T) {
	cifText := "data_x\n_cell_length_a 4.123\n_cell_length_b 4.123\n_cell_length_c 4.123\n_cell_angle_alpha 90\n_cell_angle_beta 90\n_cell_angle_gamma 90\n" +
		"loop_\n_atom_site_label\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\nCs1 0 0 0\nCl1 0.5 0.5 0.5\n"
	path := filepath.Join(t.TempDir(), "charged.cif")
	if err := os.WriteFile(path, []byte(cifText), 0o644); err != nil {
		t.Fatal(err)
	}
	code, out, errs := runMadelungForTest(t, path, "--charges", "Cs=2,Cl=-1", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if !strings.Contains(errs, "neutralising background") {
		t.Errorf("no warning on stderr: %q", errs)
	}
	var m struct {
		Energy     float64 `json:"energy_ev_per_cell"`
		Background *struct {
			NetCharge float64 `json:"net_charge"`
		} `json:"background"`
	}
	if err := json.Unmarshal([]byte(out), &m); err != nil {
		t.Fatal(err)
	}
	const pymatgen = -19.1717213737 // oxidation_reference.json, "CsCl-type, Cs+2 Cl-1"
	if m.Background == nil || m.Background.NetCharge != 1 || math.Abs(m.Energy-pymatgen) > 1e-8*math.Abs(pymatgen) {
		t.Errorf("energy %.12g eV (pymatgen %.12g), background %+v", m.Energy, pymatgen, m.Background)
	}
}
