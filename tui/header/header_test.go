package header

import (
	"io"
	"strings"
	"testing"

	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"enthalpath/tui/theme"
)

// TestRightSideAlwaysShows: the compound, its mark and the unit stay
// whole; the tabs close up, then keep only numbers, as the width shrinks.
func TestRightSideAlwaysShows(t *testing.T) {
	r := lipgloss.NewRenderer(io.Discard)
	r.SetColorProfile(termenv.Ascii)
	st := theme.DefaultStyles(r)
	l := Line{Titles: []string{"Shelf", "Bench", "Assembly", "Models", "Survey", "Analyses"}, Active: 1,
		Compound: "Ca3(PO4)2", Unsaved: true, Unit: "kcal/mol"}
	right := "Ca3(PO4)2 (unsaved) · kcal/mol"
	for _, w := range []int{120, 80, 60, 56} {
		v := l.View(st, w)
		if lipgloss.Width(v) > w || !strings.HasSuffix(v, right) || !strings.Contains(v, "[2 Bench]") {
			t.Errorf("at %d: %q", w, v)
		}
	}
	if v := l.View(st, 56); strings.Contains(v, "Shelf") || !strings.Contains(v, "1") {
		t.Errorf("at 56 the other tabs keep their names: %q", v)
	}
	if v := l.View(st, 20); lipgloss.Width(v) > 20 || strings.Contains(v, "Bench") {
		t.Errorf("at 20: %q wider than the window, or tabs over the compound", v)
	}
}
