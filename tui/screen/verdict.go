package screen

import (
	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle"
)

// verdictWords are the covalency verdicts from the longest wording to the
// shortest; the last is a code of at most VerdictCodeWidth cells, which
// VerdictLegend explains.
var verdictWords = map[cycle.Character][]string{
	cycle.IonicAdequate:       {"ionic model adequate", "ionic"},
	cycle.SomeCovalent:        {"some covalent character", "some covalency", "cov+"},
	cycle.SubstantialCovalent: {"substantial covalent character", "substantial covalency", "cov++"},
	cycle.ModelOverbinds:      {"model binds more than the cycle: check the model's inputs", "model binds more: check its inputs", "model binds more", "model+"},
	cycle.Undetermined:        {"undetermined", "—"},
}

// VerdictCodeWidth is the width of the shortest verdict words.
const VerdictCodeWidth = 6

// Verdict returns the longest wording of c that fits width cells, and
// whether it is a code that needs VerdictLegend to be read. Below
// VerdictCodeWidth the code is returned anyway.
func Verdict(c cycle.Character, width int) (string, bool) {
	words := verdictWords[c]
	if len(words) == 0 {
		return c.String(), false
	}
	for i, w := range words {
		if ansi.StringWidth(w) <= width {
			return w, i == len(words)-1 && i > 0 && c != cycle.IonicAdequate && c != cycle.Undetermined
		}
	}
	return words[len(words)-1], c != cycle.IonicAdequate && c != cycle.Undetermined
}

// VerdictLegend explains the verdict codes.
const VerdictLegend = "cov+ cycle binds 10–15 % more · cov++ over 15 % · model+ model binds ≥10 % more: check its inputs"
