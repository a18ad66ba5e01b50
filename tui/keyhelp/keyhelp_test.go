package keyhelp

import (
	"io"
	"strings"
	"testing"

	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/lipgloss"
	"github.com/muesli/termenv"

	"enthalpath/tui/nav"
	"enthalpath/tui/theme"
)

func styles() *theme.Styles {
	r := lipgloss.NewRenderer(io.Discard)
	r.SetColorProfile(termenv.Ascii)
	return theme.DefaultStyles(r)
}

// fake is a screen with keys, typing or not.
type fake struct {
	keys   []key.Binding
	typing bool
}

func (f fake) ShortHelp() []key.Binding  { return f.keys }
func (f fake) FullHelp() [][]key.Binding { return [][]key.Binding{f.keys} }
func (f fake) Capturing() bool           { return f.typing }

// TestLineKeepsTheEnd: when the line is too narrow the screen's last keys
// give way and the global keys at its end stay (the rule of the package).
func TestLineKeepsTheEnd(t *testing.T) {
	m := New(styles())
	m.SetWidth(60)
	own := []key.Binding{nav.New("type a value", "e"), nav.New("solve for it", "x"), nav.New("reset to data", "r"), nav.New("source", "s")}
	end := []key.Binding{nav.Help.Bind("all keys"), nav.Quit.Bind("quit")}
	line := m.Line(own, end)
	if lipgloss.Width(line) > 60 || !strings.HasSuffix(strings.TrimRight(line, " "), "q quit") || !strings.HasPrefix(line, "e type a value") {
		t.Errorf("line %q", line)
	}
	if strings.Contains(line, "source") {
		t.Errorf("the last screen key did not give way: %q", line)
	}
}

// TestGlobalsWhileTyping: while the screen types, the printable global keys
// leave the line and the key list, and the control stand-ins stay.
func TestGlobalsWhileTyping(t *testing.T) {
	help, quit, force := nav.Help.Bind("all keys"), nav.Quit.Bind("quit"), nav.ForceQuit.Bind("quit")
	g := Globals{End: []key.Binding{help, quit}, EndTyping: []key.Binding{help, force},
		Groups: [][]key.Binding{{nav.New("units", "u"), help, quit, force}}, Idle: nav.New("go to", "1", "2", "3")}
	_, end := g.Short(fake{typing: true})
	var names []string
	for _, b := range end {
		names = append(names, b.Help().Key)
	}
	if strings.Join(names, " ") != "f1 ctrl+c" {
		t.Errorf("line's end while typing: %q", names)
	}
	full := g.Full(fake{typing: true})
	for _, b := range full[len(full)-1] {
		for _, k := range b.Keys() {
			if len([]rune(k)) == 1 {
				t.Errorf("printable key %q listed while typing", k)
			}
		}
	}
	if own, _ := g.Short(fake{}); len(own) != 1 || own[0].Help().Key != "1…3" {
		t.Errorf("a screen without keys: %v", own)
	}
}
