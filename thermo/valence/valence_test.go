package valence

import (
	"encoding/csv"
	"encoding/json"
	"math"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"testing"

	"enthalpath/thermo/cif"
	"enthalpath/thermo/crystal"
)

// loadParams reads the project's generated table of O'Keeffe–Brese (1991)
// element parameters (data/tables/bond_valence.csv, from the pinned copy of
// pymatgen's bvparam_1991.yaml).
func loadParams(t testing.TB) Params {
	t.Helper()
	f, err := os.Open("../../data/tables/bond_valence.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	r := csv.NewReader(f)
	r.Comment = '#'
	rows, err := r.ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	p := Params{}
	for _, row := range rows[1:] {
		rv, _ := strconv.ParseFloat(row[1], 64)
		cv, _ := strconv.ParseFloat(row[2], 64)
		p[row[0]] = Element{R: rv, C: cv}
	}
	return p
}

// TestSumsAgainstPymatgen: with pymatgen's softness b = 0.31 Å and every
// bond within reach, the sums equal pymatgen's calculate_bv_sum_unordered
// (python3-pymatgen 2022.11.7, testdata/gen_oxidation.py) on the files it
// wrote, so R_ij, the bonds found and the occupancy weights agree.
func TestSumsAgainstPymatgen(t *testing.T) {
	b, err := os.ReadFile("../../testdata/oxidation_reference.json")
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Files map[string]struct {
			Sums []float64 `json:"pymatgen_bv_sums_b031"`
		} `json:"files"`
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	// Signs only matter: cations positive, anions negative.
	signs := map[string]float64{"Na": 1, "K": 1, "Ca": 1, "Mg": 1, "Al": 1, "Ti": 1, "Fe": 1, "Cl": -1, "F": -1, "O": -1}
	p := loadParams(t)
	names := make([]string, 0, len(ref.Files))
	for n := range ref.Files {
		names = append(names, n)
	}
	sort.Strings(names)
	for _, name := range names {
		if filepath.Ext(name) != ".cif" || !hasSuffix(name, "_P1.cif") {
			continue // site order is pymatgen's only in the P1 files
		}
		c, err := cif.ReadFile(filepath.Join("../../testdata/oxidation", name), cif.Options{Charges: signs})
		if err != nil {
			t.Fatal(err)
		}
		got := sums(c, p, softness{0.31, 8})
		want := ref.Files[name].Sums
		if len(got) != len(want) {
			t.Fatalf("%s: %d sums, pymatgen %d", name, len(got), len(want))
		}
		for i := range got {
			if math.Abs(got[i]-want[i]) > 1e-6*want[i] {
				t.Errorf("%s site %d: sum %.9g, pymatgen %.9g", name, i+1, got[i], want[i])
			}
		}
	}
}

func hasSuffix(s, suf string) bool { return len(s) >= len(suf) && s[len(s)-len(suf):] == suf }

// TestPairR: properties of the formula of O'Keeffe and Brese (1991), no
// source needed: it is symmetric, and R_ii = 2·r_i for one element.
func TestPairR(t *testing.T) {
	p := loadParams(t)
	for _, pair := range [][2]string{{"Na", "Cl"}, {"Fe", "O"}, {"Ti", "O"}} {
		a, b := p[pair[0]], p[pair[1]]
		if r1, r2 := PairR(a, b), PairR(b, a); math.Abs(r1-r2) > 1e-15 || !(r1 > 1 && r1 < 3) {
			t.Errorf("%v: R = %g and %g", pair, r1, r2)
		}
		if r := PairR(a, a); math.Abs(r-2*a.R) > 1e-15 {
			t.Errorf("%s: R_ii = %g, want 2r = %g", pair[0], r, 2*a.R)
		}
	}
}

// rockSalt builds a rock-salt cell of a Å whose sites carry no charges.
func rockSalt(cat, an string, a float64) *crystal.Crystal {
	c, _ := crystal.Build("rock-salt", map[string]float64{"a": a})
	for i := range c.Sites {
		el := an
		if c.Sites[i].Charge > 0 {
			el = cat
		}
		c.Sites[i].Species, c.Sites[i].Charge = el, 0
		c.Sites[i].Occupants = []crystal.Occupant{{Label: el + "1", Element: el, Occupancy: 1}}
	}
	return c
}

// TestAssignSteps: the step that settles each case (rules of the method in
// the package documentation; the oxidation states are the usual ones,
// common practice, no source).
func TestAssignSteps(t *testing.T) {
	p := loadParams(t)
	tests := []struct {
		name   string
		c      *crystal.Crystal
		cand   Candidates
		method Method
		want   map[string]float64
	}{
		{"one neutral combination", rockSalt("Na", "Cl", 5.64), Candidates{"Na": {1}, "Cl": {-1}}, ChargeBalance, map[string]float64{"Na": 1, "Cl": -1}},
		// FeO with Fe 2 or 3 and O −2: only Fe2+ balances.
		{"multivalent element balanced", rockSalt("Fe", "O", 4.30), Candidates{"Fe": {2, 3}, "O": {-2}}, ChargeBalance, map[string]float64{"Fe": 2, "O": -2}},
		// MnO with invented candidates Mn +1/+2 and O −1/−2: Mn+ O− and
		// Mn2+ O2− both balance; the sums (about 2 per site at d = 2.22 Å)
		// choose the second.
		{"two neutral combinations ranked", rockSalt("Mn", "O", 4.44), Candidates{"Mn": {1, 2}, "O": {-2, -1}}, ChargeBalanceRanked, map[string]float64{"Mn": 2, "O": -2}},
	}
	for _, tt := range tests {
		got, a, err := Assign(tt.c, tt.cand, p)
		if err != nil {
			t.Errorf("%s: %v", tt.name, err)
			continue
		}
		if a.Method != tt.method {
			t.Errorf("%s: method %v, want %v", tt.name, a.Method, tt.method)
		}
		for _, s := range got.Sites {
			if s.Charge != tt.want[s.Occupants[0].Element] {
				t.Errorf("%s: %s charge %g, want %g", tt.name, s.Species, s.Charge, tt.want[s.Occupants[0].Element])
				break
			}
		}
		if q := got.TotalCharge(); math.Abs(q) > 1e-9 {
			t.Errorf("%s: net charge %g", tt.name, q)
		}
	}
	// No neutral choice, and an element without states.
	if _, _, err := Assign(rockSalt("Na", "O", 4.8), Candidates{"Na": {1}, "O": {-2}}, p); err == nil {
		t.Error("NaO (rock salt) with Na+ and O2−: no error")
	}
	if _, _, err := Assign(rockSalt("Na", "Xe", 4.8), Candidates{"Na": {1}}, p); err == nil {
		t.Error("no states for Xe: no error")
	}
}

// TestAssignVacancyMean: rock-salt FeO with its iron site 0.9 occupied
// (wüstite-like, invented numbers) cannot be balanced by Fe2+/Fe3+ in
// ratios of its four sites; its iron carries the mean 8/3.6 = 2.222 that
// makes the cell neutral (arithmetic, no source).
func TestAssignVacancyMean(t *testing.T) {
	c := rockSalt("Fe", "O", 4.30)
	for i := range c.Sites {
		if c.Sites[i].Occupants[0].Element == "Fe" {
			c.Sites[i].Occupants = []crystal.Occupant{{Label: "Fe1", Element: "Fe", Occupancy: 0.9}}
		}
	}
	got, a, err := Assign(c, Candidates{"Fe": {2, 3}, "O": {-2}}, loadParams(t))
	if err != nil {
		t.Fatal(err)
	}
	if a.Method != ElementMean {
		t.Errorf("method %v, want the element mean", a.Method)
	}
	for _, s := range got.Sites {
		if o := s.Occupants[0]; o.Element == "Fe" && math.Abs(o.Charge-8/3.6) > 1e-12 {
			t.Errorf("Fe charge %.6g, want %.6g", o.Charge, 8/3.6)
		}
	}
	if q := got.TotalCharge(); math.Abs(q) > 1e-9 {
		t.Errorf("net charge %g", q)
	}
}
