package shelf

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

// KeyMap is the shelf's keys. Printable keys always go to the filter line,
// so movement uses the arrows and ctrl keys (nav's typing variants).
type KeyMap struct {
	Up, Down, PageUp, PageDown key.Binding
	Open, Assemble, Clear      key.Binding
}

// DefaultKeyMap returns the shelf's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:       nav.Up.TypingBind("previous compound"),
		Down:     nav.Down.TypingBind("next compound"),
		PageUp:   nav.PageUp.TypingBind("page up"),
		PageDown: nav.PageDown.TypingBind("page down"),
		Open:     nav.Enter.TypingBind("open, lattice solved"),
		Assemble: nav.New("assemble step by step", "ctrl+g"),
		Clear:    nav.Esc.TypingBind("clear the filter"),
	}
}
