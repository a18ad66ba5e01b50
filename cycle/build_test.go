package cycle

import (
	"math"
	"strings"
	"testing"
)

// A hypothetical ion borrows the radii of the same-charge ion of the nearest
// element (the neighbour rule, common practice, no source): Mg⁺ takes Na⁺'s
// (Z 12 → 11, Shannon 1976 CN VI 1.02 Å), so Kapustinskii can fill the
// lattice step of MgCl, and the model inputs say where the radius came from.
func TestHypotheticalIonNeighbourRadius(t *testing.T) {
	c := build(t, "MgCl", Options{})
	if c.Cation.Ion.Symbol != "Mg+" || len(c.Cation.Ion.Radii) == 0 {
		t.Fatalf("cation %+v, want Mg+ with borrowed radii", c.Cation.Ion)
	}
	mr, err := EvaluateModel(c, ModelKapustinskii)
	if err != nil || !mr.OK() {
		t.Fatalf("kapustinskii for MgCl: %+v, %v", mr, err)
	}
	if math.Abs(mr.Inputs.CationRadius-1.02) > 1e-9 || !strings.Contains(mr.Inputs.RadiusFrom, "neighbour rule") {
		t.Errorf("cation radius %.3f from %q, want Na+'s 1.02 Å by the neighbour rule", mr.Inputs.CationRadius, mr.Inputs.RadiusFrom)
	}
}

// TestFormulaCountsAreDecimal: counts are decimal; a leading zero is
// refused rather than read as octal ("NaCl010" was 8 chlorine atoms and
// "Na09Cl" a "zero count") — no source needed, the decimal reading is the
// only chemical one. An ion charge with a leading zero is refused too.
func TestFormulaCountsAreDecimal(t *testing.T) {
	db := loadDB(t)
	for _, f := range []string{"NaCl010", "Na09Cl", "Na01Cl", "Mg02Cl"} {
		_, err := Build(db, f, Options{})
		if err == nil || !strings.Contains(err.Error(), "leading zero") {
			t.Errorf("Build(%q): %v; want a refusal of the leading zero", f, err)
		}
	}
	if _, err := Build(db, "Na0Cl", Options{}); err == nil || !strings.Contains(err.Error(), "zero count") {
		t.Errorf("Build(Na0Cl): %v; want a zero count", err)
	}
	if _, err := Build(db, "MgCl", Options{Cation: "Mg01+", Anion: "Cl-"}); err == nil {
		t.Errorf("Build(MgCl, Mg01+): accepted a charge with a leading zero")
	}
	// A count of 10 or more still reads in decimal: Cl₁₀ needs Na¹⁰⁺.
	c, err := Build(db, "NaCl10", Options{Cation: "Na10+", Anion: "Cl-"})
	if err != nil || c.Anion.Count != 10 || c.Cation.Ion.Charge != 10 {
		t.Errorf("Build(NaCl10, Na10+): %v; want 10 Cl⁻", err)
	}
}

// TestPolyatomicIonInBinaryFormula: a metal with a polyatomic ion, written
// with or without brackets, counts the ion as the atoms of its core over
// the atoms in one core (stoichiometry, no source needed): BaO₂ of Ba²⁺
// and peroxide O₂²⁻ is 1:1, Ba(N₃)₂ and BaN₆ of Ba²⁺ and azide N₃⁻ are
// 1:2. Before, BaO₂ and KN₃ were "impossible charge balance" and Ba(N₃)₂
// "unexpected '('".
func TestPolyatomicIonInBinaryFormula(t *testing.T) {
	db := loadDB(t)
	for _, tc := range []struct {
		formula, cation, anion string
		a, b                   int
	}{
		{"BaO2", "Ba2+", "O2^2-", 1, 1},
		{"Ba2O2", "Ba+", "O2^2-", 2, 1},
		{"Ba(O2)2", "Ba4+", "O2^2-", 1, 2},
		{"KN3", "K+", "N3^-", 1, 1},
		{"K(N3)2", "K2+", "N3^-", 1, 2},
		{"Ba(N3)2", "Ba2+", "N3^-", 1, 2},
		{"BaN6", "Ba2+", "N3^-", 1, 2},
		{"Ba(N3)2", "", "", 1, 2}, // the bracket names the anion: azide from the data
	} {
		c, err := Build(db, tc.formula, Options{Cation: tc.cation, Anion: tc.anion})
		if err != nil {
			t.Errorf("Build(%s, %s, %s): %v", tc.formula, tc.cation, tc.anion, err)
			continue
		}
		if c.Cation.Count != tc.a || c.Anion.Count != tc.b || c.Anion.Ion.Charge >= 0 {
			t.Errorf("Build(%s): %s ×%d, %s ×%d; want ×%d, ×%d", tc.formula, c.Cation.Ion.Symbol, c.Cation.Count, c.Anion.Ion.Symbol, c.Anion.Count, tc.a, tc.b)
		}
	}
	// Ba(N₃)₂ forms from 3 N₂: the formation reaction counts the atoms.
	c := build(t, "Ba(N3)2", Options{})
	if f, _ := c.Step("formation"); f == nil || !strings.Contains(f.Reaction, "3 N₂(g)") {
		t.Errorf("Ba(N3)2 formation reaction %q, want 3 N₂(g)", f.Reaction)
	}
	// Three O atoms are no whole number of peroxide ions; Ba(N3)2 with a
	// stray element is no binary compound.
	if _, err := Build(db, "BaO3", Options{Cation: "Ba2+", Anion: "O2^2-"}); err == nil {
		t.Errorf("BaO3 of Ba2+ and O2^2- accepted")
	}
	if _, err := Build(db, "Ba(N3)2Cl", Options{}); err == nil {
		t.Errorf("Ba(N3)2Cl accepted as a binary compound")
	}
}

// TestBracketKindsBuildAlike: one formula reader serves Build, so square
// and curly brackets name a polyatomic ion as round ones do — Sr[N3]2
// builds as Sr(N3)2 and Ca[OH]2 as Ca(OH)2 (stoichiometry, no source
// needed: the same atoms and the same ions). Before, Sr[N3]2 was
// "unexpected '['" with a suggestion of Sr(NO3)2.
func TestBracketKindsBuildAlike(t *testing.T) {
	db := loadDB(t)
	for _, tc := range []struct{ written, round string }{
		{"Sr[N3]2", "Sr(N3)2"},
		{"Sr{N3}2", "Sr(N3)2"},
		{"Ca[OH]2", "Ca(OH)2"},
		{"Ba[N3]2", "Ba(N3)2"},
	} {
		got, err := Build(db, tc.written, Options{})
		if err != nil {
			t.Errorf("Build(%s): %v", tc.written, err)
			continue
		}
		want, err := Build(db, tc.round, Options{})
		if err != nil {
			t.Fatalf("Build(%s): %v", tc.round, err)
		}
		if got.Cation.Ion.Symbol != want.Cation.Ion.Symbol || got.Anion.Ion.Symbol != want.Anion.Ion.Symbol ||
			got.Cation.Count != want.Cation.Count || got.Anion.Count != want.Anion.Count || len(got.Steps) != len(want.Steps) {
			t.Errorf("Build(%s) = %s×%d %s×%d (%d steps); Build(%s) = %s×%d %s×%d (%d steps)", tc.written,
				got.Cation.Ion.Symbol, got.Cation.Count, got.Anion.Ion.Symbol, got.Anion.Count, len(got.Steps), tc.round,
				want.Cation.Ion.Symbol, want.Cation.Count, want.Anion.Ion.Symbol, want.Anion.Count, len(want.Steps))
		}
		if got.Anion.Ion.Charge != -1 || got.Anion.Count != 2 {
			t.Errorf("Build(%s): anion %s ×%d, want a singly charged anion ×2", tc.written, got.Anion.Ion.Symbol, got.Anion.Count)
		}
	}
}

// TestBuildMessagesForUsers: the refusals of a formula name what the user
// can give (a cation and an anion with charges), not the fields of Options
// ("for example Anion Au-", "the cation and anion options" before).
func TestBuildMessagesForUsers(t *testing.T) {
	db := loadDB(t)
	for _, f := range []string{"Na2Q", "AuNe", "NaClO4K"} {
		_, err := Build(db, f, Options{})
		if err == nil {
			t.Errorf("Build(%s) accepted", f)
			continue
		}
		msg := err.Error()
		for _, internal := range []string{"Anion ", "Cation ", "options", "Options"} {
			if strings.Contains(msg, internal) {
				t.Errorf("Build(%s): %q says %q", f, msg, internal)
			}
		}
	}
}

// TestUnreadableFormulaMessages: a formula that is not one is refused with
// the reader's own account (whole characters, hydrates named), no byte of a
// multi-byte character is quoted, and a huge input is quoted shortened.
func TestUnreadableFormulaMessages(t *testing.T) {
	db := loadDB(t)
	cases := []struct{ formula, want string }{
		{"CuSO4·5H2O", "hydrates"},
		{"NaＣl", "'Ｃ'"},
		{"Ba(N3", "'('"},
	}
	for _, tc := range cases {
		_, err := Build(db, tc.formula, Options{})
		if err == nil || !strings.Contains(err.Error(), tc.want) || strings.ContainsAny(err.Error(), "Âï") {
			t.Errorf("Build(%q): %v; want it to say %s, with no stray byte", tc.formula, err, tc.want)
		}
	}
	long := strings.Repeat("Na", 5000)
	if _, err := Build(db, long, Options{}); err == nil || len(err.Error()) > 400 {
		t.Errorf("Build(10,000-character formula): error of %d bytes; want it quoted shortened", len(err.Error()))
	}
}

// FuzzBuildFormula: any text given as a formula is either refused with an
// error or built into a cycle with both ions present in positive counts;
// it never panics (the formula reader takes brackets, nesting, subscripts
// and polyatomic cores, each a place for an index slip).
func FuzzBuildFormula(f *testing.F) {
	for _, s := range []string{"NaCl", "MgCl", "Ba(N3)2", "BaO2", "K(N3)", "Ca3(PO4)2", "((Na))Cl", "Na₂O", "NaCl010", "Ba(N3", "CuSO4·5H2O", "NaＣl", ")(", "Mg(OH)2", "Al2O3", ""} {
		f.Add(s)
	}
	db := loadDB(f)
	f.Fuzz(func(t *testing.T, formula string) {
		if len(formula) > 200 {
			return
		}
		c, err := Build(db, formula, Options{})
		if err != nil {
			return
		}
		if c.Formula == "" || c.Cation.Count <= 0 || c.Anion.Count <= 0 || c.Cation.Ion.Charge <= 0 || c.Anion.Ion.Charge >= 0 {
			t.Fatalf("Build(%q) = %q with %d %s and %d %s", formula, c.Formula, c.Cation.Count, c.Cation.Ion.Symbol, c.Anion.Count, c.Anion.Ion.Symbol)
		}
	})
}
