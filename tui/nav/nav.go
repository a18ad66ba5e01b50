// Package nav declares the workshop's shared keys once: moving (up, down,
// left, right, a page, the first and last row), enter and esc, switching
// screens, the key list and quitting. A screen takes a shared key with its
// own description (nav.Up.Bind("previous step")) and declares the keys of
// its own work with New; both write the binding's help label from its
// keys (Label), so the help line and the key list can never name a key
// that does not act, or leave out one that does.
//
// While a screen is typing (a filter line, a value), its printable keys
// are text: TypingBind gives a shared key without its letters (and with
// the control keys that stand in for them), WithoutPrintable strips them
// from any binding.
package nav

import (
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
)

// Key is one of the shared keys.
type Key int

// The shared keys.
const (
	Up Key = iota
	Down
	Left
	Right
	PageUp
	PageDown
	First
	Last
	Enter
	Esc
	NextScreen
	PrevScreen
	Help
	Quit
	ForceQuit
	numKeys
)

// Keys returns every shared key.
func Keys() []Key {
	out := make([]Key, numKeys)
	for i := range out {
		out[i] = Key(i)
	}
	return out
}

// Names returns the key names k is pressed with, as key.Binding matches
// them.
func (k Key) Names() []string {
	switch k {
	case Up:
		return []string{"up", "k"}
	case Down:
		return []string{"down", "j"}
	case Left:
		return []string{"left", "h"}
	case Right:
		return []string{"right", "l"}
	case PageUp:
		return []string{"pgup"}
	case PageDown:
		return []string{"pgdown"}
	case First:
		return []string{"home", "g"}
	case Last:
		return []string{"end", "G"}
	case Enter:
		return []string{"enter"}
	case Esc:
		return []string{"esc"}
	case NextScreen:
		return []string{"tab"}
	case PrevScreen:
		return []string{"shift+tab"}
	case Help:
		return []string{"?", "f1"}
	case Quit:
		return []string{"q"}
	case ForceQuit:
		return []string{"ctrl+c"}
	}
	return nil
}

// typingNames are k's names while the screen is typing: the letters go,
// and ctrl+p and ctrl+n stand in for the vertical moves.
func (k Key) typingNames() []string {
	names := nonPrintable(k.Names())
	switch k {
	case Up:
		names = append(names, "ctrl+p")
	case Down:
		names = append(names, "ctrl+n")
	}
	return names
}

// Bind returns k for one screen, described as desc; own are keys of the
// screen's own that do the same there (an "e" beside enter), listed first.
func (k Key) Bind(desc string, own ...string) key.Binding {
	return New(desc, append(slices.Clip(own), k.Names()...)...)
}

// TypingBind is Bind for a screen whose printable keys are text: k
// without its letters, with the control keys that stand in for them.
func (k Key) TypingBind(desc string, own ...string) key.Binding {
	return New(desc, append(slices.Clip(own), k.typingNames()...)...)
}

// New returns a binding of the given key names described as desc, its
// help label written from the names (Label).
func New(desc string, names ...string) key.Binding {
	return key.NewBinding(key.WithKeys(names...), key.WithHelp(Label(names), desc))
}

// Label is how the help shows key names: joined with "/", arrows as
// arrows, pgdown as pgdn, and a run of three or more consecutive digits
// as its ends ("1…6").
func Label(names []string) string {
	var parts []string
	for i := 0; i < len(names); i++ {
		j := i
		for j+1 < len(names) && isDigit(names[j]) && isDigit(names[j+1]) && names[j+1][0] == names[j][0]+1 {
			j++
		}
		if j-i >= 2 {
			parts = append(parts, names[i]+"…"+names[j])
			i = j
			continue
		}
		parts = append(parts, shown(names[i]))
	}
	return strings.Join(parts, "/")
}

func isDigit(s string) bool { return len(s) == 1 && s[0] >= '0' && s[0] <= '9' }

func shown(name string) string {
	switch name {
	case "up":
		return "↑"
	case "down":
		return "↓"
	case "left":
		return "←"
	case "right":
		return "→"
	case "pgdown":
		return "pgdn"
	}
	return name
}

// Printable reports whether k is text (a character or space).
func Printable(k tea.KeyMsg) bool { return k.Type == tea.KeyRunes || k.Type == tea.KeySpace }

// WithoutPrintable returns b reduced to its non-printable keys, its help
// label written anew, and false when none is left.
func WithoutPrintable(b key.Binding) (key.Binding, bool) {
	names := nonPrintable(b.Keys())
	if len(names) == 0 {
		return b, false
	}
	if len(names) == len(b.Keys()) {
		return b, true
	}
	return New(b.Help().Desc, names...), true
}

// nonPrintable keeps the names of keys that are not text: those longer
// than one character, but space.
func nonPrintable(names []string) []string {
	var out []string
	for _, s := range names {
		if len([]rune(s)) > 1 && s != "space" {
			out = append(out, s)
		}
	}
	return out
}
