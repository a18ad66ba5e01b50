package cli

import (
	"regexp"
	"strings"
	"testing"
)

// TestPlusMinusOneRule: every "value ± uncertainty" the commands print
// follows one rule (JCGM 100:2008, GUM 7.2.6): the uncertainty to at most
// two significant figures, the value with as many decimals as it. The
// output once mixed "495.8 ± 2.4e-05", "1.843 ± 0.0083" and
// "6.113 ± 0.001". The data command keeps every published digit on top
// (tested separately below).
func TestPlusMinusOneRule(t *testing.T) {
	pm := regexp.MustCompile(`([−-]?[0-9]+(?:\.([0-9]+))?) ± ([0-9][0-9.e+-]*)`)
	for _, args := range [][]string{
		{"cycle", "NaCl"},
		{"cycle", "CaF2", "--units", "ev"},
		{"cycle", "MgO", "--units", "kcal"},
		{"cycle", "MgO", "--lattice-from", "born-mayer", "--solve", "attachment-2"},
		{"estimate", "MgCl", "--charges", "Mg=+1,Cl=-1"},
		{"solution", "NaCl"},
		{"stability", "CaCO3"},
		{"ionfit", "SO4^2-"},
	} {
		var out, errs strings.Builder
		if code := Run(Env{Stdout: &out, Stderr: &errs, Stdin: strings.NewReader("")}, args[0], args[1:]); code != ExitOK {
			t.Fatalf("%v: exit %d: %s", args, code, errs.String())
		}
		found := 0
		for _, m := range pm.FindAllStringSubmatch(out.String(), -1) {
			found++
			value, unc := m[2], m[3]
			if strings.ContainsAny(unc, "e") {
				t.Errorf("%v: %q: uncertainty in exponent form", args, m[0])
				continue
			}
			_, uncDec, _ := strings.Cut(unc, ".")
			if len(value) != len(uncDec) {
				t.Errorf("%v: %q: value has %d decimals, uncertainty %d", args, m[0], len(value), len(uncDec))
			}
			if sig := strings.TrimLeft(strings.ReplaceAll(unc, ".", ""), "0"); len(sig) > 2 && uncDec != "" {
				t.Errorf("%v: %q: uncertainty with more than two significant figures", args, m[0])
			}
		}
		if found == 0 {
			t.Errorf("%v: no value ± uncertainty printed:\n%s", args, out.String())
		}
	}
}

// TestDataKeepsPublishedDigits: the data command pads a published value
// to its uncertainty's place and never cuts a published digit. Values:
// Na third ionization energy 71.62 ± 0.0012 eV (NIST ASD as compiled in
// mendeleev, data/tables), NaCl ΔfH° −411.153 ± 0.107 kJ/mol (NBS 1982,
// data/sources/nbs-tables-1982 line 10930).
func TestDataKeepsPublishedDigits(t *testing.T) {
	for query, want := range map[string]string{"Na": "71.6200 ± 0.0012", "NaCl": "-411.153 ± 0.107"} {
		code, out, errs := runDataCmd(t, "", query)
		if code != ExitOK || !strings.Contains(out, want) {
			t.Errorf("data %s: exit %d, lacks %q:\n%s%s", query, code, want, out, errs)
		}
	}
}
