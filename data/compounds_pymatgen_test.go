package data

// The compounds' formation enthalpies against pymatgen's experimental file,
// with the disagreements kept on purpose.

import (
	"encoding/json"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"testing"

	"enthalpath/thermo/notation"
)

// pymatgenAccepted lists the formation enthalpies that differ from
// pymatgen's experimental file by more than the tolerance, each kept on
// purpose; the reasons are in data/tables/DISAGREEMENTS.md.
var pymatgenAccepted = map[string]string{
	"CaH2":    "NBS 1982 −186.2 (the table held −181.5 before it was generated); pymatgen −173.7",
	"CaS":     "NBS 1982 −482.4",
	"HfO2":    "NBS 1982 −1144.7; JANAF about −1117.6",
	"CuCl2":   "NBS 1982 −220.1",
	"CrCl3":   "NBS 1982 −556.5",
	"AlBr3":   "NBS 1982 −527.2",
	"CdS":     "NBS 1982 −161.9",
	"CdTe":    "NBS 1982 −92.5",
	"Sr(OH)2": "NBS 1982 −959.0",
	"MgCO3":   "NBS 1982 −1095.8",
	"MnCO3":   "NBS 1982 −894.1",
	"Li2SO4":  "NBS 1982 −1436.49",
	"K2SO4":   "NBS 1982 −1437.79",
	"MgSO4":   "NBS 1982 −1284.9",
	"NaClO3":  "NBS 1982 −365.77",
	"KClO3":   "NBS 1982 −397.73",
	"K2CrO4":  "NBS 1982 −1403.7",
}

// compoundFormationRef is the part of testdata/pymatgen_formation.json this
// test reads.
type compoundFormationRef struct {
	Compounds map[string]struct {
		KJ  *float64 `json:"formation_kj_per_mol"`
		UKJ *float64 `json:"uncertainty_kj_per_mol"`
	} `json:"compounds"`
}

// TestFormationAgainstPymatgen compares every formation enthalpy with the
// experimental value pymatgen ships (testdata/pymatgen_formation.json,
// written by testdata/gen_data.py from Debian's python3-pymatgen), per
// formula unit (matched by reduced composition), within the larger of the
// two stated uncertainties or 8 kJ/mol (issue 3).
func TestFormationAgainstPymatgen(t *testing.T) {
	raw, err := os.ReadFile("../testdata/pymatgen_formation.json")
	if err != nil {
		t.Fatalf("reference file: %v (run testdata/regenerate.sh)", err)
	}
	var ref compoundFormationRef
	if err := json.Unmarshal(raw, &ref); err != nil {
		t.Fatalf("reference file: %v", err)
	}
	type entry struct {
		formula string
		atoms   int
		kj, u   float64
	}
	byKey := map[string][]entry{}
	for formula, v := range ref.Compounds {
		if v.KJ == nil {
			continue
		}
		f, err := notation.ParseFormula(formula)
		if err != nil {
			continue
		}
		e := entry{formula: formula, atoms: f.Atoms(), kj: *v.KJ}
		if v.UKJ != nil {
			e.u = *v.UKJ
		}
		k := reducedKey(f.Composition())
		byKey[k] = append(byKey[k], e)
	}
	db := loadTables(t)
	hand := handKeptCompounds(t)
	var missing, newDisagree []string
	compared, newCompared := 0, 0
	for _, c := range db.Compounds() {
		f, err := notation.ParseFormula(c.Formula)
		if err != nil {
			t.Fatal(err)
		}
		refs := byKey[reducedKey(f.Composition())]
		if !hand[c.Formula] {
			// Compounds added from the NBS tables: their disagreements
			// with pymatgen are counted and listed, and must stay few.
			if len(refs) == 0 || c.Molecular {
				continue
			}
			newCompared++
			for _, e := range refs {
				scale := float64(f.Atoms()) / float64(e.atoms)
				if math.Abs(c.Formation.V-e.kj*scale) > math.Max(8, math.Max(c.Formation.U, e.u*scale)) {
					newDisagree = append(newDisagree, fmt.Sprintf("%s (NBS %.1f, pymatgen %.1f)", c.Formula, c.Formation.V, e.kj*scale))
					break
				}
			}
			continue
		}
		if len(refs) == 0 {
			missing = append(missing, c.Formula)
			continue
		}
		compared++
		disagree := false
		for _, e := range refs {
			scale := float64(f.Atoms()) / float64(e.atoms)
			theirs, theirU := e.kj*scale, e.u*scale
			tol := math.Max(8, math.Max(c.Formation.U, theirU))
			if math.Abs(c.Formation.V-theirs) > tol {
				disagree = true
				if _, ok := pymatgenAccepted[c.Formula]; !ok {
					t.Errorf("%s: ours %.2f kJ/mol (%s), pymatgen %s %.2f ± %.1f: differ by %+.1f, tolerance %.1f; re-check the value, or list it in tables/DISAGREEMENTS.md and pymatgenAccepted with the reason",
						c.Formula, c.Formation.V, c.Formation.Source, e.formula, theirs, theirU, c.Formation.V-theirs, tol)
				}
			}
		}
		if _, ok := pymatgenAccepted[c.Formula]; ok && !disagree {
			t.Errorf("%s is listed as an accepted disagreement but agrees with pymatgen: remove it from pymatgenAccepted and tables/DISAGREEMENTS.md", c.Formula)
		}
	}
	for f := range pymatgenAccepted {
		if _, err := db.Compound(f); err != nil {
			t.Errorf("accepted disagreement %s is not in compounds.csv", f)
		}
	}
	if compared < 200 {
		t.Errorf("only %d compounds found in the pymatgen file, want at least 200", compared)
	}
	// Of the compounds added from the NBS tables, 102 of 405 (25 %) differed
	// from pymatgen beyond the tolerance when they were added (other
	// polymorphs, later evaluations; the list is logged); more than 30 %
	// would mean a fault of the generator (a wrong phase or reading).
	t.Logf("added compounds: %d compared with pymatgen, %d differ beyond the tolerance: %s", newCompared, len(newDisagree), strings.Join(newDisagree, ", "))
	if newCompared < 300 || float64(len(newDisagree)) > 0.3*float64(newCompared) {
		t.Errorf("added compounds: %d of %d differ from pymatgen beyond the tolerance (at most 30 %% allowed)", len(newDisagree), newCompared)
	}
	sort.Strings(missing)
	t.Logf("%d compared; not in pymatgen's file: %s", compared, strings.Join(missing, " "))
}

// handKeptCompounds reads the formulas of data/gen/kept/compounds.csv:
// the compounds the tables held before they were generated, compared with
// pymatgen one by one.
func handKeptCompounds(t *testing.T) map[string]bool {
	t.Helper()
	f, err := os.Open(filepath.Join("gen", "kept", "compounds.csv"))
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	recs, err := readCSV("kept/compounds.csv", f, nil)
	if err != nil {
		t.Fatal(err)
	}
	out := map[string]bool{}
	for _, r := range recs {
		out[r.str("formula")] = true
	}
	return out
}

// reducedKey writes a composition divided by the greatest common divisor
// of its counts, elements sorted: "Ca1F2" for CaF2 and Ca2F4.
func reducedKey(comp map[string]int) string {
	g := 0
	for _, n := range comp {
		g = gcd(g, n)
	}
	els := make([]string, 0, len(comp))
	for el := range comp {
		els = append(els, el)
	}
	sort.Strings(els)
	var b strings.Builder
	for _, el := range els {
		b.WriteString(el + strconv.Itoa(comp[el]/g))
	}
	return b.String()
}

func gcd(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}
