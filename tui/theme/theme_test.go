package theme

import (
	"io"
	"strings"
	"testing"

	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"
)

func renderer(p termenv.Profile, dark bool) *lipgloss.Renderer {
	r := lipgloss.NewRenderer(io.Discard)
	r.SetColorProfile(p)
	r.SetHasDarkBackground(dark)
	return r
}

// TestProfiles: plain ASCII (what NO_COLOR selects through termenv) gives
// no escape sequences at all; 256 colours and true colour do; a light and
// a dark background get different shades of the same style.
func TestProfiles(t *testing.T) {
	plain := DefaultStyles(renderer(termenv.Ascii, true)).Solved.Render("?−787.2")
	if plain != "?−787.2" {
		t.Errorf("ASCII profile rendered %q", plain)
	}
	for _, p := range []termenv.Profile{termenv.ANSI256, termenv.TrueColor} {
		dark := DefaultStyles(renderer(p, true)).Solved.Render("x")
		light := DefaultStyles(renderer(p, false)).Solved.Render("x")
		if !strings.Contains(dark, "\x1b[") {
			t.Errorf("profile %v: no escape sequence in %q", p, dark)
		}
		if dark == light {
			t.Errorf("profile %v: the same shade on light and dark backgrounds", p)
		}
	}
	// The selection must show without colour too: it is bold.
	if !DefaultStyles(renderer(termenv.Ascii, true)).Selected.GetBold() {
		t.Error("the selected row is not bold")
	}
}

// TestStylesUseTheirRenderer: two sessions with different profiles do not
// share styles (no package-level styles from the global renderer).
func TestStylesUseTheirRenderer(t *testing.T) {
	a := DefaultStyles(renderer(termenv.Ascii, true))
	b := DefaultStyles(renderer(termenv.TrueColor, true))
	if a.Renderer() == b.Renderer() {
		t.Fatal("styles share a renderer")
	}
	if a.Accent.Render("x") == b.Accent.Render("x") {
		t.Error("ASCII and true-colour sessions render alike")
	}
}
