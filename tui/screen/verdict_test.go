package screen

import (
	"strings"
	"testing"

	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle"
)

// TestVerdictFitsAndIsExplained: every verdict has a wording that fits a
// column of VerdictCodeWidth, a wider column gets the words of
// thermo/lattice unchanged, and every code is explained by the legend.
func TestVerdictFitsAndIsExplained(t *testing.T) {
	for _, c := range []cycle.Character{cycle.Undetermined, cycle.IonicAdequate, cycle.SomeCovalent, cycle.SubstantialCovalent, cycle.ModelOverbinds} {
		if w, _ := Verdict(c, 200); w != c.String() {
			t.Errorf("%v at width 200: %q, want lattice's %q", c, w, c.String())
		}
		w, code := Verdict(c, VerdictCodeWidth)
		if ansi.StringWidth(w) > VerdictCodeWidth {
			t.Errorf("%v: %q is wider than %d", c, w, VerdictCodeWidth)
		}
		if code && !strings.Contains(VerdictLegend, w+" ") {
			t.Errorf("%v: the code %q is not in the legend", c, w)
		}
	}
}
