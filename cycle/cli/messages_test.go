package cli

import (
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// TestMessagesNameNoGoCode: what a user reads names what they typed and
// what to do, never a Go function, parameter or field of the code that
// refused it (QA report: "ParseFormula(…)", "ewald.Sum:", "BornExponent:
// configs[0]", "Options.Charges").
func TestMessagesNameNoGoCode(t *testing.T) {
	// A rock-salt cell whose sites have no charges, one of them of an
	// element the data give no oxidation states for (Xe), so no charge can
	// be assigned.
	unchargedCIF := filepath.Join(t.TempDir(), "uncharged.cif")
	os.WriteFile(unchargedCIF, []byte("data_x\n_cell_length_a 5.64\n_cell_length_b 5.64\n_cell_length_c 5.64\n"+
		"_cell_angle_alpha 90\n_cell_angle_beta 90\n_cell_angle_gamma 90\n"+
		"loop_\n_atom_site_label\n_atom_site_type_symbol\n_atom_site_fract_x\n_atom_site_fract_y\n_atom_site_fract_z\n"+
		"Na1 Na 0 0 0\nXe1 Xe 0.5 0.5 0.5\n"), 0o644)
	cases := []struct {
		name   string
		args   []string
		want   string   // what the message must say
		banned []string // Go names it must not show
	}{
		{"data", []string{"xyz"}, "capital letter", []string{"ParseFormula"}},
		{"madelung", []string{"rock-salt", "--accuracy", "0.5"}, "--accuracy 0.5", []string{"ewald.Sum", "0 means"}},
		{"estimate", []string{"MgCl", "--model", "born-lande"}, "electron configuration", []string{"BornExponent:", "configs["}},
		{"madelung", []string{unchargedCIF}, "--charges", []string{"Options.Charges"}},
	}
	for _, c := range cases {
		_, errs, code := run(t, c.name, c.args...)
		if code == ExitOK {
			t.Errorf("%s %v: exit 0, want an error", c.name, c.args)
			continue
		}
		if !strings.Contains(errs, c.want) {
			t.Errorf("%s %v: stderr %q lacks %q", c.name, c.args, errs, c.want)
		}
		for _, b := range c.banned {
			if strings.Contains(errs, b) {
				t.Errorf("%s %v: stderr %q shows the Go name %q", c.name, c.args, errs, b)
			}
		}
	}
}

// TestLongInputShortenedInMessages: a formula or query quoted in a message
// of this package is cut to its first characters, "…" and its length (QA
// report: a 100 kB formula was echoed whole on stderr).
func TestLongInputShortenedInMessages(t *testing.T) {
	long := strings.Repeat("Na", 50000) + "q"
	cases := []struct {
		name string
		args []string
	}{
		{"data", []string{long}},
		{"cycle", []string{"NaCl", long}}, // one formula at a time
		{"radius", []string{"--ion", "Na+", "--all-salts", long}},
	}
	for _, c := range cases {
		_, errs, code := run(t, c.name, c.args...)
		if code != ExitUsage {
			t.Errorf("%s: exit %d, want %d: %.300s", c.name, code, ExitUsage, errs)
		}
		if len(errs) > 1000 || !strings.Contains(errs, "characters)") {
			t.Errorf("%s: %d bytes on stderr, want the input shortened: %.300s", c.name, len(errs), errs)
		}
	}
}

// TestBornExponentPrintedToThreeFigures: the mean Born exponent of MgCl₂,
// (7 + 2·9)/3 from Pauling's values for the Ne and Ar cores (Pauling, The
// Nature of the Chemical Bond, from memory), prints as 8.33, not with the
// sixteen digits of a float64.
func TestBornExponentPrintedToThreeFigures(t *testing.T) {
	out, errs, code := run(t, "cycle", "MgCl2")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	flat := strings.Join(strings.Fields(out), " ")
	if !strings.Contains(flat, "n = 8.33 (") || strings.Contains(flat, "8.3333") {
		t.Errorf("model inputs lack \"n = 8.33 (\" or show more digits:\n%s", out)
	}
}

// TestExplicitZeroRefused: a flag whose default is written 0 in the code
// refuses a 0 the user typed, where 0 is no value the quantity can take,
// and says what it needs (QA report: --rho 0, --born-n 0 and --max-charge 0
// were accepted and ignored while negative values were refused).
func TestExplicitZeroRefused(t *testing.T) {
	cases := []struct {
		name string
		args []string
		want string
	}{
		{"cycle", []string{"NaCl", "--rho", "0"}, "--rho 0: give the Born–Mayer range"},
		{"cycle", []string{"NaCl", "--born-n", "0"}, "--born-n 0: give the Born exponent (1 < n ≤ 30"},
		{"cycle", []string{"NaCl", "--cn-cation", "0"}, "--cn-cation 0: give a whole coordination number (1 ≤ CN ≤ 16"},
		{"cycle", []string{"NaCl", "--accuracy", "0"}, "--accuracy 0: give the relative accuracy of the Ewald sum (0 < accuracy ≤ 0.01"},
		{"compare", []string{"NaCl", "--rho", "0"}, "--rho 0"},
		{"scan", []string{"Mg", "Cl", "--max-charge", "0"}, "--max-charge 0: give the highest metal charge to try, 1 or more"},
		{"estimate", []string{"MgCl", "--cation-radius", "0"}, "--cation-radius 0: give the radius in Å"},
		{"radius", []string{"NaNO3", "--ion", "NO3-", "--counter-radius", "0"}, "--counter-radius 0: give the radius in Å"},
		{"radius", []string{"NaNO3", "--ion", "NO3-", "--lattice", "0"}, "--lattice 0: give the lattice energy"},
		{"madelung", []string{"rock-salt", "--accuracy", "0"}, "--accuracy 0: give the relative accuracy of the Ewald sum (0 < accuracy ≤ 0.01"},
	}
	for _, c := range cases {
		_, errs, code := run(t, c.name, c.args...)
		if code != ExitUsage || !strings.Contains(errs, c.want) {
			t.Errorf("%s %v: exit %d, stderr %q; want exit %d and %q", c.name, c.args, code, errs, ExitUsage, c.want)
		}
	}
	// Left out, the same flags still mean their defaults.
	for _, c := range [][]string{{"cycle", "NaCl"}, {"scan", "Mg", "Cl"}, {"madelung", "rock-salt"}} {
		if _, errs, code := run(t, c[0], c[1:]...); code != ExitOK {
			t.Errorf("%v: exit %d: %s", c, code, errs)
		}
	}
}
