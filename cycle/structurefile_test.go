package cycle

import (
	"encoding/json"
	"errors"
	"math"
	"os"
	"path/filepath"
	"sort"
	"strings"
	"testing"

	"enthalpath/thermo/ewald"
	"enthalpath/thermo/valence"
)

// oxidationReference is written by testdata/gen_oxidation.py with Debian's
// python3-pymatgen: CIF files written by its CifWriter without oxidation
// states, the charges its BVAnalyzer assigns (for Fe3O4 the inverse spinel
// instead, fact of the trade), and EwaldSummation's energy with them
// (acc_factor 14).
const oxidationReference = "../testdata/oxidation_reference.json"

type oxidationFile struct {
	Sites   int       `json:"sites"`
	Charges []float64 `json:"charges"`
	Energy  float64   `json:"energy_ev"`
	Rule    string    `json:"rule"`
}

func oxidationFiles(t *testing.T) map[string]oxidationFile {
	t.Helper()
	b, err := os.ReadFile(oxidationReference)
	if err != nil {
		t.Fatalf("reading %s (run testdata/regenerate.sh): %v", oxidationReference, err)
	}
	var ref struct {
		Library string                   `json:"library"`
		Files   map[string]oxidationFile `json:"files"`
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	if !strings.HasPrefix(ref.Library, "python3-pymatgen ") || len(ref.Files) < 7 {
		t.Fatalf("%s: library %q, %d files", oxidationReference, ref.Library, len(ref.Files))
	}
	return ref.Files
}

// TestStructureFilesWithoutCharges: every file gets charges assigned, and
// its Ewald energy equals pymatgen's with the expected charges to 1e-8
// relative; for the P1 files (same site order as pymatgen reads them) the
// charges agree site by site.
func TestStructureFilesWithoutCharges(t *testing.T) {
	db := loadDB(t)
	files := oxidationFiles(t)
	names := make([]string, 0, len(files))
	for n := range files {
		names = append(names, n)
	}
	sort.Strings(names)
	for _, name := range names {
		want := files[name]
		t.Run(name, func(t *testing.T) {
			sf, err := OpenStructureFile(db, filepath.Join("../testdata/oxidation", name), nil, nil)
			if err != nil {
				t.Fatal(err)
			}
			if len(sf.Cell.Sites) != want.Sites {
				t.Fatalf("%d sites, pymatgen reads %d", len(sf.Cell.Sites), want.Sites)
			}
			if strings.HasSuffix(name, "_P1.cif") {
				for i, s := range sf.Cell.Sites {
					if math.Abs(s.Charge-want.Charges[i]) > 1e-9 {
						t.Errorf("site %d %s: charge %+g, want %+g (%s)", i+1, s.Species, s.Charge, want.Charges[i], want.Rule)
					}
				}
			}
			r, _, err := ewald.SumCharged(sf.Cell, ewald.Options{Accuracy: 1e-12})
			if err != nil {
				t.Fatal(err)
			}
			if rel := math.Abs(r.EnergyEV-want.Energy) / math.Abs(want.Energy); !(rel < 1e-8) {
				t.Errorf("energy %.12g eV, pymatgen %.12g eV (relative %.2g); method %v", r.EnergyEV, want.Energy, rel, sf.Assignment.Method)
			}
		})
	}
}

// TestMagnetiteInverseSpinel: Fe3O4 from a CIF without charges gets the
// inverse spinel (fact of the trade): tetrahedral Fe3+, octahedral
// Fe2+/Fe3+ 1:1 summed as +2.5, the assignment stated as mixed valence.
func TestMagnetiteInverseSpinel(t *testing.T) {
	db := loadDB(t)
	for _, name := range []string{"real_Fe3O4_magnetite_sym.cif", "real_Fe3O4_magnetite_P1.cif"} {
		sf, err := OpenStructureFile(db, filepath.Join("../testdata/oxidation", name), nil, nil)
		if err != nil {
			t.Fatal(err)
		}
		if sf.Assignment.Method != valence.MixedValence {
			t.Errorf("%s: method %v, want mixed valence", name, sf.Assignment.Method)
		}
		n := map[float64]int{}
		for _, g := range sf.Assignment.Groups {
			if g.Element == "Fe" {
				n[g.Charge] += len(g.Sites)
				if g.Mixed() && (g.Low != 2 || g.High != 3 || g.HighFraction != 0.5) {
					t.Errorf("%s: mixed group %+v, want Fe2+/Fe3+ 1:1", name, g)
				}
			}
		}
		if n[3] != 8 || n[2.5] != 16 {
			t.Errorf("%s: Fe sites by charge %v, want 8 at +3 and 16 at +2.5", name, n)
		}
		if sf.Averaged != 16 || sf.Formula != "Fe3O4" {
			t.Errorf("%s: %d averaged sites, formula %s; want 16, Fe3O4", name, sf.Averaged, sf.Formula)
		}
	}
}

// TestSharedSiteAveraged: the Na 0.5 / K 0.5 site is one site of mean
// charge +1, named as averaged, and the formula comes from the occupancies (the file gives Z = 2, formula KNaCl2).
func TestSharedSiteAveraged(t *testing.T) {
	sf, err := OpenStructureFile(loadDB(t), "../testdata/oxidation/invented_tarnwick_NaKCl_mixed_site_P1.cif", nil, nil)
	if err != nil {
		t.Fatal(err)
	}
	if sf.Averaged != 4 || sf.Formula != "KNaCl2" || sf.Cell.Sites[0].Species != "K0.5Na0.5" {
		t.Errorf("averaged %d, formula %s, first site %s", sf.Averaged, sf.Formula, sf.Cell.Sites[0].Species)
	}
	if sf.Assignment.Method != valence.ChargeBalance {
		t.Errorf("method %v, want charge balance", sf.Assignment.Method)
	}
}

// TestStructureFileCompoundIons: the open compound's ions are the only
// candidates, so a file of another valence is refused (FeO's Fe2+ cannot
// balance Fe3O4).
func TestStructureFileCompoundIons(t *testing.T) {
	db := loadDB(t)
	c, err := Build(db, "FeO", Options{})
	if err != nil {
		t.Skip("FeO not in the data:", err)
	}
	_, err = OpenStructureFile(db, "../testdata/oxidation/real_Fe3O4_magnetite_sym.cif", nil, []Part{c.Cation, c.Anion})
	var ae *AssignmentError
	var nn *valence.NoNeutralError
	if !errors.As(err, &ae) || !errors.As(err, &nn) {
		t.Fatalf("err = %v, want an AssignmentError with NoNeutralError", err)
	}
	sf, err := OpenStructureFile(db, "../testdata/oxidation/real_TiO2_rutile_sym.cif", map[string]float64{"Ti": 4, "O": -2}, nil)
	if err != nil || sf.Assignment.Method != valence.Given {
		t.Fatalf("charges given: %v, method %v", err, sf)
	}
}

// A cycle file names its CIF by a path relative to its own folder; the one
// reopening rule reads it from there, passes the joined path through the
// front end's resolver, and leaves a cycle without a CIF alone. The
// structure is checked against pymatgen's CifWriter file of NaCl
// (testdata/oxidation, written by testdata/gen_oxidation.py).
func TestReopenStructureFileBesideTheCycleFile(t *testing.T) {
	db := loadDB(t)
	dir := t.TempDir()
	cif, err := os.ReadFile("../testdata/oxidation/real_NaCl_rock_salt_P1.cif")
	if err != nil {
		t.Fatal(err)
	}
	if err := os.MkdirAll(filepath.Join(dir, "cells"), 0o755); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(dir, "cells", "nacl.cif"), cif, 0o644); err != nil {
		t.Fatal(err)
	}
	c, err := Build(db, "NaCl", Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := c.ReopenStructureFile(filepath.Join(dir, "n.hesscycle"), nil); err != nil || c.Settings.Structure.Cell != nil {
		t.Fatalf("no CIF named: err %v, cell %v; want nothing done", err, c.Settings.Structure.Cell)
	}
	c.Settings.Structure = Structure{CIF: filepath.Join("cells", "nacl.cif")}
	var asked string
	resolve := func(p string) (string, error) { asked = p; return p, nil }
	if err := c.ReopenStructureFile(filepath.Join(dir, "n.hesscycle"), resolve); err != nil {
		t.Fatal(err)
	}
	if want := filepath.Join(dir, "cells", "nacl.cif"); asked != want {
		t.Errorf("resolver asked for %q, want %q (beside the cycle file)", asked, want)
	}
	if st := c.Settings.Structure; st.Cell == nil || st.CIF != filepath.Join("cells", "nacl.cif") {
		t.Errorf("structure %+v: want the file's cell, recorded under the name the cycle file gave", st)
	}
	refused := errors.New("outside the folder")
	c.Settings.Structure = Structure{CIF: "../elsewhere.cif"}
	if err := c.ReopenStructureFile(filepath.Join(dir, "n.hesscycle"), func(string) (string, error) { return "", refused }); !errors.Is(err, refused) {
		t.Errorf("err = %v, want the resolver's refusal", err)
	}
}
