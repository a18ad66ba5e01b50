package notation

import (
	"errors"
	"maps"
	"strconv"
	"strings"
	"testing"
)

// Formula compositions by atom counting (no source needed: the formulas
// define them).
func TestParseFormula(t *testing.T) {
	cases := []struct {
		in     string
		comp   map[string]int
		charge int
		str    string
		hill   string
		groups []string // Text×Count of the top-level groups
	}{
		{"NaCl", map[string]int{"Na": 1, "Cl": 1}, 0, "NaCl", "ClNa", []string{"Na1", "Cl1"}},
		{"Mg(OH)2", map[string]int{"Mg": 1, "O": 2, "H": 2}, 0, "Mg(OH)2", "H2MgO2", []string{"Mg1", "(OH)2"}},
		{"Ca3(PO4)2", map[string]int{"Ca": 3, "P": 2, "O": 8}, 0, "Ca3(PO4)2", "Ca3O8P2", []string{"Ca3", "(PO4)2"}},
		{"K4[Fe(CN)6]", map[string]int{"K": 4, "Fe": 1, "C": 6, "N": 6}, 0, "K4(Fe(CN)6)", "C6FeK4N6", []string{"K4", "(Fe(CN)6)1"}},
		{"(NH4)2SO4", map[string]int{"N": 2, "H": 8, "S": 1, "O": 4}, 0, "(NH4)2SO4", "H8N2O4S", []string{"(NH4)2", "S1", "O4"}},
		{"SO4^2-", map[string]int{"S": 1, "O": 4}, -2, "SO4^2-", "O4S^2-", nil},
		{"SO4 2-", map[string]int{"S": 1, "O": 4}, -2, "SO4^2-", "O4S^2-", nil},
		{"SO₄²⁻", map[string]int{"S": 1, "O": 4}, -2, "SO4^2-", "O4S^2-", nil},
		{"NH4+", map[string]int{"N": 1, "H": 4}, 1, "NH4+", "H4N+", nil},
		{"NO3-", map[string]int{"N": 1, "O": 3}, -1, "NO3-", "NO3-", nil},
		{"Fe3+", map[string]int{"Fe": 1}, 3, "Fe3+", "Fe3+", nil},
		{"Fe+3", map[string]int{"Fe": 1}, 3, "Fe3+", "Fe3+", nil},
		{"Fe++", map[string]int{"Fe": 1}, 2, "Fe2+", "Fe2+", nil},
		{"O2-", map[string]int{"O": 1}, -2, "O2-", "O2-", nil},
		{"O2^-", map[string]int{"O": 2}, -1, "O2^-", "O2^-", nil},
		{"O2^2-", map[string]int{"O": 2}, -2, "O2^2-", "O2^2-", nil},
		{"Cl-", map[string]int{"Cl": 1}, -1, "Cl-", "Cl-", nil},
		{" Na Cl ", map[string]int{"Na": 1, "Cl": 1}, 0, "NaCl", "ClNa", nil},
		{"CH3COONa", map[string]int{"C": 2, "H": 3, "O": 2, "Na": 1}, 0, "CH3COONa", "C2H3NaO2", nil},
		{"Al2O3", map[string]int{"Al": 2, "O": 3}, 0, "Al2O3", "Al2O3", nil},
	}
	for _, c := range cases {
		f, err := ParseFormula(c.in)
		if err != nil {
			t.Errorf("ParseFormula(%q): %v", c.in, err)
			continue
		}
		if !maps.Equal(f.Composition(), c.comp) || f.Charge != c.charge {
			t.Errorf("ParseFormula(%q) = %v charge %d; want %v charge %d", c.in, f.Composition(), f.Charge, c.comp, c.charge)
		}
		if f.String() != c.str || f.Hill() != c.hill {
			t.Errorf("ParseFormula(%q): String %q Hill %q; want %q %q", c.in, f.String(), f.Hill(), c.str, c.hill)
		}
		if c.groups != nil {
			var got []string
			for _, g := range f.Groups {
				s := g.Text
				if g.Bracketed {
					s = "(" + s + ")"
				}
				got = append(got, s+strconv.Itoa(g.Count))
			}
			if strings.Join(got, " ") != strings.Join(c.groups, " ") {
				t.Errorf("ParseFormula(%q) groups %v; want %v", c.in, got, c.groups)
			}
		}
	}
}

func TestParseFormulaErrors(t *testing.T) {
	// Columns count characters from 1, as everywhere in the program; 0 is
	// the whole input. The positions are read off the inputs themselves.
	cases := []struct {
		in     string
		column int
		msg    string
	}{
		{"Na2Q", 4, `unknown element "Q"`},
		{"Xy2", 1, `unknown element "Xy"`},
		{"CuSO4·5H2O", 6, "hydrates and adducts are not supported: '·' joins two parts at column 6; enter the salt alone (CuSO4)"},
		{"CuSO4.5H2O", 6, "hydrates and adducts are not supported: '.' joins two parts at column 6; enter the salt alone (CuSO4)"},
		{"NaCl·NH3", 5, "enter the salt alone (NaCl)"},
		{"(Cu·5H2O)SO4", 4, "enter the salt alone and treat"}, // "(Cu" is no formula to suggest
		// One column per character, however many bytes it takes.
		{"NaＣl", 3, "full-width character 'Ｃ' at column 3; type the ASCII 'C': NaCl"},
		{"SO₄²⁻·", 6, "hydrates and adducts"},
		{"Naé", 3, "unexpected character 'é' (U+00E9)"},
		{"Mg(OH2", 3, "unclosed '('"},
		{"Mg(OH]2", 6, "does not close '(' opened at column 3"},
		{"MgOH)2", 5, "unmatched ')'"},
		{"nacl", 1, "capital letter"},
		{"2NaCl", 1, "cannot start with a number"},
		{"Na0Cl", 3, "zero count"},
		{"", 0, "empty formula"},
		{"Na+Cl", 4, "unexpected character"},
		{"()", 1, "empty brackets"},
		{"Na$", 3, "unexpected character"},
		{"SO4^2", 4, "without a sign"},
	}
	for _, c := range cases {
		_, err := ParseFormula(c.in)
		var fe *FormulaError
		if !errors.As(err, &fe) {
			t.Errorf("ParseFormula(%q): want *FormulaError, got %v", c.in, err)
			continue
		}
		if fe.Column != c.column || !strings.Contains(fe.Detail(), c.msg) || fe.Input != c.in {
			t.Errorf("ParseFormula(%q) = %v; want column %d and %q", c.in, err, c.column, c.msg)
		}
	}
	// The message names what the user typed, not a Go function (no
	// "ParseFormula(" in text a user reads).
	_, err := ParseFormula("Na2Q")
	if got, want := err.Error(), `formula "Na2Q": unknown element "Q" at column 4`; got != want {
		t.Errorf("error text %q, want %q", got, want)
	}
}

// FuzzParseFormula: no input panics; a parsed formula prints to a string
// that parses back to the same composition and charge.
func FuzzParseFormula(f *testing.F) {
	for _, s := range []string{"NaCl", "Mg(OH)2", "Ca3(PO4)2", "SO4^2-", "SO4 2-", "NH4+", "Fe3+", "O2-",
		"CuSO4·5H2O", "K4[Fe(CN)6]", "SO₄²⁻", "Fe+3", "Fe++", "((((H))))", "Na2Q", "", "(", "^", "9", "H999999"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, s string) {
		fm, err := ParseFormula(s)
		if err != nil {
			var fe *FormulaError
			if !errors.As(err, &fe) {
				t.Fatalf("error of type %T", err)
			}
			if fe.Column < 0 || fe.Column > len([]rune(s)) {
				t.Fatalf("column %d beyond input %q", fe.Column, s)
			}
			return
		}
		for _, text := range []string{fm.String(), fm.Hill()} {
			back, err := ParseFormula(text)
			if err != nil {
				t.Fatalf("%q → %q does not parse: %v", s, text, err)
			}
			if !maps.Equal(back.Composition(), fm.Composition()) || back.Charge != fm.Charge {
				t.Fatalf("%q → %q → %v %d, want %v %d", s, text, back.Composition(), back.Charge, fm.Composition(), fm.Charge)
			}
		}
	})
}

// TestErrorsQuoteLongInputShortened: a message quotes at most MaxQuoted
// characters of what was typed, then "…" and the length (QA report: a
// 100 kB formula came back whole on stderr).
func TestErrorsQuoteLongInputShortened(t *testing.T) {
	long := strings.Repeat("Na", 50000) + "q"
	_, err := ParseFormula(long)
	if err == nil {
		t.Fatal("no error")
	}
	msg := err.Error()
	want := `formula "` + strings.Repeat("Na", 20) + `"… (100001 characters): `
	if !strings.HasPrefix(msg, want) || len(msg) > 200 {
		t.Errorf("message of %d bytes %.200q; want it to start %q and stay short", len(msg), msg, want)
	}
	// Counted in characters, not bytes: 41 "é" are too long, 40 are not.
	if got := QuoteInput(strings.Repeat("é", 40)); got != strconv.Quote(strings.Repeat("é", 40)) {
		t.Errorf("40 characters shortened: %s", got)
	}
	if got, want := QuoteInput(strings.Repeat("é", 41)), strconv.Quote(strings.Repeat("é", 40))+"… (41 characters)"; got != want {
		t.Errorf("QuoteInput(41 × é) = %s, want %s", got, want)
	}
}
