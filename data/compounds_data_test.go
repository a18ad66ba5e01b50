package data

// Checks of the compound and ion-value tables (compounds.csv, the polyatomic
// rows of ions.csv, ion_values.csv, solution_enthalpies.csv). Each check says
// where its expectation comes from. The tables themselves were entered from
// memory (memory=yes); these tests catch slips in them by testing facts that
// must hold whatever the exact numbers: composition, charge balance, the
// definition of a tabulated Born–Fajans–Haber lattice energy and Hess's law
// for the solution cycle — and compare the formation enthalpies with an
// outside compilation (pymatgen); the disagreements kept on purpose are
// listed in tables/DISAGREEMENTS.md.

import (
	"encoding/csv"
	"encoding/json"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"slices"
	"sort"
	"strconv"
	"strings"
	"testing"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/notation"
)

func loadTables(t *testing.T) *DB {
	t.Helper()
	db, err := Load()
	if err != nil {
		t.Fatalf("Load: %v", err)
	}
	return db
}

func ionOf(t *testing.T, db *DB, sym string) Ion {
	t.Helper()
	ion, err := db.Ion(sym)
	if err != nil {
		t.Fatalf("ion %s: %v", sym, err)
	}
	return ion
}

// prototypeKeys lists the prototype names of thermo/crystal (prototypes.go)
// and the parameter keys each accepts, as agreed in data_schema.md.
// TestPrototypeListMatchesCrystal keeps it in step with thermo/crystal.
var prototypeKeys = map[string][]string{
	"rock-salt":        {"a"},
	"caesium-chloride": {"a"},
	"zinc-blende":      {"a"},
	"wurtzite":         {"a", "c", "u"},
	"fluorite":         {"a"},
	"antifluorite":     {"a"},
	"rutile":           {"a", "c", "x"},
	"cadmium-chloride": {"a", "c", "z"},
	"cadmium-iodide":   {"a", "c", "z"},
	"corundum":         {"a", "c", "z_cation", "x_anion"},
	"perovskite":       {"a"},
	"spinel":           {"a", "u"},
	"nickel-arsenide":  {"a", "c"},
}

func TestPrototypeListMatchesCrystal(t *testing.T) {
	names := crystal.PrototypeNames()
	if len(names) != len(prototypeKeys) {
		t.Errorf("thermo/crystal has %d prototypes %v, this test lists %d: update prototypeKeys", len(names), names, len(prototypeKeys))
	}
	for name, keys := range prototypeKeys {
		p, err := crystal.LookupPrototype(name)
		if err != nil {
			t.Errorf("%s: %v", name, err)
			continue
		}
		if got := p.Keys(); !slices.Equal(got, keys) {
			t.Errorf("%s: thermo/crystal keys %v, this test lists %v", name, got, keys)
		}
	}
}

// TestCompoundRowsComplete: every row names its compound, family, ions and
// counts and carries a formation enthalpy with a source that exists (issue 3:
// "every row has a source").
func TestCompoundRowsComplete(t *testing.T) {
	db := loadTables(t)
	if p := db.Problems(); len(p) > 0 {
		t.Errorf("loader problems: %v", p)
	}
	for _, c := range db.Compounds() {
		if c.Name == "" || c.Family == "" {
			t.Errorf("%s: name %q, family %q: both are required", c.Formula, c.Name, c.Family)
		}
		if c.Cation == "" || c.Anion == "" || c.CationCount < 1 || c.AnionCount < 1 {
			t.Errorf("%s: ions %s×%d, %s×%d incomplete", c.Formula, c.Cation, c.CationCount, c.Anion, c.AnionCount)
		}
		if !c.Formation.Known() || c.Formation.Unit != "kJ/mol" {
			t.Errorf("%s: no formation enthalpy in kJ/mol", c.Formula)
		}
		if c.Formation.U < 0 || math.IsNaN(c.Formation.V) {
			t.Errorf("%s: formation %g ± %g", c.Formula, c.Formation.V, c.Formation.U)
		}
		for field, key := range map[string]string{
			"formation": c.Formation.Source, "params": c.ParamsSource,
			"density": c.Density.Source, "lattice": c.HandbookLattice.Source,
		} {
			if key == "" {
				if field == "formation" || (field == "params" && len(c.Params) > 0) {
					t.Errorf("%s: %s value without a source", c.Formula, field)
				}
				continue
			}
			if _, err := db.Source(key); err != nil {
				t.Errorf("%s: %s source %q: %v", c.Formula, field, key, err)
			}
		}
		// A compound the volume-based model can use needs a cell or a density.
		if c.Structure == "" && !c.Density.Known() {
			t.Logf("%s: neither a prototype nor a density (no volume for the volume-based model)", c.Formula)
		}
	}
}

// TestCompoundCounts: issue 3 asks for at least 150 binary ionic solids and
// 30 with polyatomic ions.
func TestCompoundCounts(t *testing.T) {
	db := loadTables(t)
	binary, poly := 0, 0
	families := map[string]int{}
	for _, c := range db.Compounds() {
		if ionOf(t, db, c.Cation).Polyatomic || ionOf(t, db, c.Anion).Polyatomic {
			poly++
		} else {
			binary++
		}
		families[c.Family]++
	}
	if binary < 150 {
		t.Errorf("%d binary compounds, want at least 150", binary)
	}
	if poly < 30 {
		t.Errorf("%d compounds with a polyatomic ion, want at least 30", poly)
	}
	t.Logf("%d binary, %d polyatomic; families %v", binary, poly, families)
}

// TestCompoundCompositionAndCharge: the formula must contain exactly the
// atoms of its ions times their counts, the cation must be positive, the
// anion negative, and the charges must balance (a neutral solid).
func TestCompoundCompositionAndCharge(t *testing.T) {
	db := loadTables(t)
	for _, c := range db.Compounds() {
		f, err := notation.ParseFormula(c.Formula)
		if err != nil {
			t.Errorf("%s: %v", c.Formula, err)
			continue
		}
		want := map[string]int{}
		for _, side := range []struct {
			sym string
			n   int
		}{{c.Cation, c.CationCount}, {c.Anion, c.AnionCount}} {
			ion := ionOf(t, db, side.sym)
			core, err := notation.ParseFormula(ion.Core)
			if err != nil {
				t.Errorf("%s: core %q of %s: %v", c.Formula, ion.Core, side.sym, err)
				continue
			}
			for el, k := range core.Composition() {
				want[el] += k * side.n
			}
		}
		if got := f.Composition(); !mapsEqual(got, want) {
			t.Errorf("%s: composition %v, but %s×%d + %s×%d gives %v", c.Formula, got, c.Cation, c.CationCount, c.Anion, c.AnionCount, want)
		}
		cat, an := ionOf(t, db, c.Cation), ionOf(t, db, c.Anion)
		if cat.Charge <= 0 || an.Charge >= 0 {
			t.Errorf("%s: cation %s charge %d, anion %s charge %d", c.Formula, c.Cation, cat.Charge, c.Anion, an.Charge)
		}
		if q := cat.Charge*c.CationCount + an.Charge*c.AnionCount; q != 0 {
			t.Errorf("%s: charges sum to %+d", c.Formula, q)
		}
		for _, el := range f.Elements() {
			if _, err := db.Element(el); err != nil {
				t.Errorf("%s: element %s: %v", c.Formula, el, err)
			}
		}
	}
}

func mapsEqual(a, b map[string]int) bool {
	if len(a) != len(b) {
		return false
	}
	for k, v := range a {
		if b[k] != v {
			return false
		}
	}
	return true
}

// cnForStructure gives the coordination numbers (cation, anion) of each
// prototype, as Shannon writes them: textbook crystal chemistry.
var cnForStructure = map[string][2]string{
	"rock-salt": {"VI", "VI"}, "caesium-chloride": {"VIII", "VIII"},
	"zinc-blende": {"IV", "IV"}, "wurtzite": {"IV", "IV"},
	"fluorite": {"VIII", "IV"}, "antifluorite": {"IV", "VIII"},
	"rutile": {"VI", "III"}, "cadmium-chloride": {"VI", "III"}, "cadmium-iodide": {"VI", "III"},
	"corundum": {"VI", "IV"}, "nickel-arsenide": {"VI", "VI"},
}

// TestCompoundStructures: structure names are prototypes of thermo/crystal,
// params use only that prototype's keys, the cell they give builds and has
// the compound's cation:anion ratio (a necessary fact). As a
// check on the cell parameters themselves (entered from memory), the
// shortest cation–anion distance of the built cell must lie within 20 % of
// the sum of the Shannon ionic radii at the structure's coordination
// numbers (rule of thumb for ionic solids; common practice, no source).
func TestCompoundStructures(t *testing.T) {
	db := loadTables(t)
	checked := 0
	for _, c := range db.Compounds() {
		if c.Structure == "" {
			if len(c.Params) > 0 {
				t.Errorf("%s: params %v without a structure", c.Formula, c.Params)
			}
			continue
		}
		keys, ok := prototypeKeys[c.Structure]
		if !ok {
			t.Errorf("%s: structure %q is not a prototype name", c.Formula, c.Structure)
			continue
		}
		for k := range c.Params {
			if !slices.Contains(keys, k) {
				t.Errorf("%s: parameter %q is not one of %s's %v", c.Formula, k, c.Structure, keys)
			}
		}
		if len(c.Params) == 0 {
			if !c.Density.Known() {
				t.Errorf("%s: structure %s without cell parameters or a density: no volume", c.Formula, c.Structure)
			}
			continue
		}
		if _, ok := c.Params["a"]; !ok {
			t.Errorf("%s: params %v lack the lattice parameter a", c.Formula, c.Params)
		}
		cell, err := crystal.Build(c.Structure, c.Params)
		if err != nil {
			t.Errorf("%s: %v", c.Formula, err)
			continue
		}
		// The prototype's stoichiometry must be the compound's.
		nCat, nAn := 0, 0
		for _, site := range cell.Sites {
			switch {
			case site.Charge > 0:
				nCat++
			case site.Charge < 0:
				nAn++
			}
		}
		if nCat*c.AnionCount != nAn*c.CationCount {
			t.Errorf("%s: %s has cation:anion sites %d:%d, the formula %d:%d", c.Formula, c.Structure, nCat, nAn, c.CationCount, c.AnionCount)
		}
		cat, an := ionOf(t, db, c.Cation), ionOf(t, db, c.Anion)
		if cat.Polyatomic || an.Polyatomic {
			continue
		}
		cn := cnForStructure[c.Structure]
		rc, err1 := db.Radius(cat.Core, cat.Charge, cn[0], "")
		ra, err2 := db.Radius(an.Core, an.Charge, cn[1], "")
		if err1 != nil || err2 != nil {
			t.Logf("%s: no Shannon radius to compare (%v; %v)", c.Formula, err1, err2)
			continue
		}
		d, _, _ := cell.NearestCationAnion()
		sum := rc.Ionic.V + ra.Ionic.V
		if math.Abs(d-sum) > 0.20*sum {
			t.Errorf("%s (%s %v): shortest cation–anion distance %.3f Å, Shannon radii give %.3f Å (%s %s + %s %s)",
				c.Formula, c.Structure, c.Params, d, sum, c.Cation, rc.CN, c.Anion, ra.CN)
		}
		checked++
	}
	// 93 cells have two monatomic ions with Shannon radii in the data (the
	// hydrides lack an H⁻ radius); fewer means rows or radii went missing.
	if checked < 90 {
		t.Errorf("only %d cells compared with Shannon radii, want at least 90", checked)
	}
}

// TestHandbookLatticeMatchesCycle: the handbook column we store (the CRC
// table's Born–Fajans–Haber-cycle column, crc-lattice) is by definition the
// cycle value: ΔH_L = Σ ΔfH(gaseous ions) − ΔfH(solid), turned into U_POT by
// the relation printed with that table, ΔH_L = U_POT + [a(n_M/2 − 2) +
// b(n_X/2 − 2)]RT with n = 3 for monatomic ions. For halides and hydrides
// with monatomic ions every input is in our tables: ΔfH(M^z+, g) =
// atomization + Σ IE, ΔfH(X⁻, g) = atomization − EA (the 5/2·RT terms of the
// ions and electrons cancel for a neutral salt). Agreement within 1 %
// (the handbook used its own auxiliary data, which differ from ours by a
// few kJ/mol; our tolerance, no source) shows the recalled lattice energy,
// formation enthalpy and element data belong together.
func TestHandbookLatticeMatchesCycle(t *testing.T) {
	db := loadTables(t)
	rt := thermo.RT(298.15)
	compared, worst, worstName := 0, 0.0, ""
	for _, c := range db.Compounds() {
		if !c.HandbookLattice.Known() {
			continue
		}
		if !(c.HandbookLattice.V > 0) || (c.LatticeConvention != "U" && c.LatticeConvention != "dH") {
			t.Errorf("%s: handbook lattice %g (%q): must be positive, convention U or dH", c.Formula, c.HandbookLattice.V, c.LatticeConvention)
			continue
		}
		cat, an := ionOf(t, db, c.Cation), ionOf(t, db, c.Anion)
		if cat.Polyatomic || an.Polyatomic || an.Charge != -1 {
			continue // needs a second electron affinity or a gaseous-ion enthalpy
		}
		m, err := db.Element(cat.Core)
		if err != nil {
			t.Fatal(err)
		}
		x, err := db.Element(an.Core)
		if err != nil {
			t.Fatal(err)
		}
		if len(m.Ionization) < cat.Charge || !x.ElectronAffinity.Known() {
			t.Errorf("%s: element data incomplete for the cycle", c.Formula)
			continue
		}
		gasCation := m.Atomization.V
		for i := 0; i < cat.Charge; i++ {
			gasCation += thermo.EVToKJPerMol(m.Ionization[i].V)
		}
		gasAnion := x.Atomization.V - thermo.EVToKJPerMol(x.ElectronAffinity.V)
		dHL := float64(c.CationCount)*gasCation + float64(c.AnionCount)*gasAnion - c.Formation.V
		want := dHL
		if c.LatticeConvention == "U" {
			want = dHL - float64(c.CationCount+c.AnionCount)*(1.5-2)*rt
		}
		if dev := math.Abs(c.HandbookLattice.V-want) / want; dev > worst {
			worst, worstName = dev, c.Formula
		}
		if math.Abs(c.HandbookLattice.V-want) > 0.010*want {
			t.Errorf("%s: handbook %s = %.0f kJ/mol, cycle from our tables gives %.1f (%.1f %%)",
				c.Formula, c.LatticeConvention, c.HandbookLattice.V, want, 100*(c.HandbookLattice.V-want)/want)
		}
		compared++
	}
	if compared < 30 {
		t.Errorf("only %d handbook lattice energies compared with the cycle, want at least 30", compared)
	}
	t.Logf("%d compared; largest deviation %.2f %% (%s)", compared, 100*worst, worstName)
}

// TestAlkaliHalideTrends: for the alkali halides the lattice energy falls
// from Li to Cs at fixed halide and from F to I at fixed metal, and the
// formation enthalpy is least negative for the iodide (textbook trends;
// common practice, no source).
func TestAlkaliHalideTrends(t *testing.T) {
	db := loadTables(t)
	metals := []string{"Li", "Na", "K", "Rb", "Cs"}
	halogens := []string{"F", "Cl", "Br", "I"}
	get := func(m, x string) Compound {
		c, err := db.Compound(m + x)
		if err != nil {
			t.Fatalf("%s%s: %v", m, x, err)
		}
		return c
	}
	for _, x := range halogens {
		for i := 1; i < len(metals); i++ {
			a, b := get(metals[i-1], x), get(metals[i], x)
			if a.HandbookLattice.Known() && b.HandbookLattice.Known() && !(a.HandbookLattice.V > b.HandbookLattice.V) {
				t.Errorf("lattice energy %s %.0f ≤ %s %.0f", a.Formula, a.HandbookLattice.V, b.Formula, b.HandbookLattice.V)
			}
		}
	}
	for _, m := range metals {
		for i := 1; i < len(halogens); i++ {
			a, b := get(m, halogens[i-1]), get(m, halogens[i])
			if a.HandbookLattice.Known() && b.HandbookLattice.Known() && !(a.HandbookLattice.V > b.HandbookLattice.V) {
				t.Errorf("lattice energy %s %.0f ≤ %s %.0f", a.Formula, a.HandbookLattice.V, b.Formula, b.HandbookLattice.V)
			}
			if !(a.Formation.V < b.Formation.V) {
				t.Errorf("formation %s %.1f not below %s %.1f", a.Formula, a.Formation.V, b.Formula, b.Formation.V)
			}
		}
	}
}

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

// TestIonValues: issue 3 asks for thermochemical radii of at least 25
// polyatomic ions and hydration enthalpies of at least 40 ions. Radii must
// be physically sized (1–4 Å; the published polyatomic radii span about
// 1.3–3.5 Å, our bound, no source), absolute hydration enthalpies negative
// (every ion is more stable in water than in vacuum), and where an ion has
// both scales they must differ by exactly z·ΔhydH°(H+, absolute), the
// definition of the conventional scale (to the 0.1 kJ/mol rounding of the
// table).
func TestIonValues(t *testing.T) {
	db := loadTables(t)
	hAbs, err := db.HydrationOnScale("H+", "absolute")
	if err != nil {
		t.Fatalf("H+ absolute hydration: %v", err)
	}
	radii, hydrated := 0, 0
	for _, ion := range db.Ions() {
		if r := ion.ThermochemicalRadius; r.Known() {
			// A monatomic ion carries one only in place of Shannon radii it
			// lacks (anion_radii.csv: P³⁻, As³⁻ …).
			if !ion.Polyatomic && (len(ion.Radii) > 0 || ion.Charge > 0) {
				t.Errorf("%s: thermochemical radius on a monatomic ion with Shannon radii, or a cation", ion.Symbol)
			}
			if r.V < 1 || r.V > 4 {
				t.Errorf("%s: thermochemical radius %g Å outside 1–4 Å", ion.Symbol, r.V)
			}
			if _, err := db.Source(r.Source); err != nil {
				t.Errorf("%s radius: %v", ion.Symbol, err)
			}
			radii++
		}
		if len(ion.Hydrations) == 0 {
			continue
		}
		hydrated++
		var conv, abs *Value
		for i := range ion.Hydrations {
			h := &ion.Hydrations[i]
			if _, err := db.Source(h.Value.Source); err != nil {
				t.Errorf("%s hydration: %v", ion.Symbol, err)
			}
			switch h.Scale {
			case "conventional":
				conv = &h.Value
			case "absolute":
				abs = &h.Value
			}
		}
		if abs != nil && !(abs.V < 0) {
			t.Errorf("%s: absolute hydration enthalpy %g kJ/mol is not negative", ion.Symbol, abs.V)
		}
		if conv != nil && abs != nil && ion.Symbol != "H+" {
			want := conv.V + float64(ion.Charge)*hAbs.V
			if math.Abs(abs.V-want) > 0.11 {
				t.Errorf("%s: absolute %g, conventional %g + z·(%g) = %g", ion.Symbol, abs.V, conv.V, hAbs.V, want)
			}
		}
	}
	if radii < 25 {
		t.Errorf("%d thermochemical radii, want at least 25", radii)
	}
	if hydrated < 40 {
		t.Errorf("%d ions with a hydration enthalpy, want at least 40", hydrated)
	}
}

type solutionRow struct {
	formula, source, memory, note string
	value                         float64
	line                          int
}

func readSolutionTable(t *testing.T) []solutionRow {
	t.Helper()
	f, err := os.Open("tables/solution_enthalpies.csv")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	raw, err := io.ReadAll(f)
	if err != nil {
		t.Fatal(err)
	}
	var body []string
	skipped := 0
	for _, l := range strings.Split(string(raw), "\n") {
		if len(body) == 0 && strings.HasPrefix(l, "#") {
			skipped++
			continue
		}
		body = append(body, l)
	}
	recs, err := csv.NewReader(strings.NewReader(strings.Join(body, "\n"))).ReadAll()
	if err != nil {
		t.Fatalf("solution_enthalpies.csv: %v", err)
	}
	want := []string{"formula", "solution_kj_per_mol", "uncertainty", "source", "locator", "memory", "note"}
	if len(recs) == 0 || !slices.Equal(recs[0], want) {
		t.Fatalf("solution_enthalpies.csv: header %v, want %v", recs[0], want)
	}
	var out []solutionRow
	for i, r := range recs[1:] {
		line := skipped + i + 2
		v, err := strconv.ParseFloat(r[1], 64)
		if err != nil {
			t.Errorf("solution_enthalpies.csv line %d: %v", line, err)
			continue
		}
		out = append(out, solutionRow{formula: r[0], value: v, source: r[3], memory: r[4], note: r[5], line: line})
	}
	return out
}

// solutionCheckedBefore are the salts whose enthalpies of solution the
// tables held before they were generated from the NBS tables; their
// cycles close within 5 kJ/mol.
var solutionCheckedBefore = map[string]bool{
	"LiF": true, "LiCl": true, "NaF": true, "NaCl": true, "NaBr": true, "NaI": true, "KF": true, "KCl": true,
	"KBr": true, "KI": true, "CsCl": true, "NaOH": true, "KOH": true, "NaNO3": true, "KNO3": true, "AgNO3": true,
	"NH4NO3": true, "NH4Cl": true, "KClO4": true, "MgCl2": true, "CaCl2": true, "Na2SO4": true,
}

// TestSolutionCycle: the enthalpy of solution at infinite dilution must
// equal Σ ν[ΔfH(ion, g) + ΔhydH°(ion, conventional)] − ΔfH(salt, cr), Hess's
// law for the solution cycle (the z·ΔfH(H+, g) terms of the conventional
// scale cancel for a neutral salt). Gaseous ions come from the element
// tables (atomization + ionization energies, or − electron affinity; the
// 5/2·RT terms cancel) or from a gas_formation row. Issue 5 asks the
// solution cycle to reproduce handbook enthalpies of solution within
// 5 kJ/mol; the same tolerance here checks that the tables fit together.
func TestSolutionCycle(t *testing.T) {
	db := loadTables(t)
	rows := readSolutionTable(t)
	var off []string
	if len(rows) < 8 {
		t.Errorf("%d enthalpies of solution, want at least 8", len(rows))
	}
	// The gas_formation rows follow the NBS tables' convention for gaseous
	// ions (ΔfH(H+, g) = 1536.202 kJ/mol: the ion and the free electron each
	// carry 5/2·RT), so the ions built here from the element tables get the
	// same ±z·5/2·RT; for a salt of two monatomic ions the terms cancel.
	rt52 := 2.5 * thermo.RT(298.15)
	gas := func(ion Ion) (float64, bool) {
		if ion.GasFormation.Known() {
			return ion.GasFormation.V, true
		}
		if ion.Polyatomic {
			return 0, false
		}
		el, err := db.Element(ion.Core)
		if err != nil {
			return 0, false
		}
		v := el.Atomization.V
		switch {
		case ion.Charge > 0 && len(el.Ionization) >= ion.Charge:
			for i := 0; i < ion.Charge; i++ {
				v += thermo.EVToKJPerMol(el.Ionization[i].V)
			}
			v += float64(ion.Charge) * rt52
		case ion.Charge == -1 && el.ElectronAffinity.Known():
			v -= thermo.EVToKJPerMol(el.ElectronAffinity.V) + rt52
		default:
			return 0, false
		}
		return v, true
	}
	checked := 0
	for _, r := range rows {
		if _, err := db.Source(r.source); err != nil {
			t.Errorf("line %d %s: %v", r.line, r.formula, err)
		}
		c, err := db.Compound(r.formula)
		if err != nil {
			t.Errorf("line %d: %s is not in compounds.csv: %v", r.line, r.formula, err)
			continue
		}
		sum, ok := -c.Formation.V, true
		for _, side := range []struct {
			sym string
			n   int
		}{{c.Cation, c.CationCount}, {c.Anion, c.AnionCount}} {
			ion := ionOf(t, db, side.sym)
			g, okG := gas(ion)
			h, err := db.HydrationOnScale(side.sym, "conventional")
			if !okG || err != nil {
				ok = false
				break
			}
			sum += float64(side.n) * (g + h.V)
		}
		if !ok {
			t.Logf("%s: no gaseous-ion enthalpy or hydration enthalpy for one of its ions; not checked", r.formula)
			continue
		}
		checked++
		if solutionCheckedBefore[r.formula] {
			if math.Abs(sum-r.value) > 5 {
				t.Errorf("%s: solution cycle gives %.2f kJ/mol, table %.2f", r.formula, sum, r.value)
			}
			continue
		}
		if math.Abs(sum-r.value) > 5 {
			off = append(off, fmt.Sprintf("%s %+.1f", r.formula, sum-r.value))
		}
	}
	if checked < 8 {
		t.Errorf("only %d enthalpies of solution checked by the cycle, want at least 8", checked)
	}
	// The other salts: the gaseous ions built here from NIST ASD ionization
	// energies and CRC affinities differ from the NBS tables' own gaseous
	// ions, by up to about 25 kJ/mol for the trivalent lanthanides; when the
	// table was generated 12 of 170 checked rows differed by more than
	// 5 kJ/mol (logged). More than a fifth would mean a fault.
	t.Logf("solution cycles off by more than 5 kJ/mol: %d of %d: %s", len(off), checked, strings.Join(off, ", "))
	if float64(len(off)) > 0.2*float64(checked) {
		t.Errorf("%d of %d solution cycles differ from the table by more than 5 kJ/mol", len(off), checked)
	}
}
