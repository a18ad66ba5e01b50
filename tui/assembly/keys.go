package assembly

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

// KeyMap is the assembly's keys.
type KeyMap struct {
	Accept, Type, Unknown, Back, Bench key.Binding
}

// DefaultKeyMap returns the assembly's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Accept:  nav.Enter.Bind("accept the proposal", "y"),
		Type:    nav.New("type another value", "e"),
		Unknown: nav.New("make this the unknown", "x"),
		Back:    nav.New("back one step", "b", "backspace"),
		Bench:   nav.New("to the bench", "w"),
	}
}

// onward is Accept once every step is decided: its keys go on to the bench.
func (k KeyMap) onward() key.Binding {
	b := k.Accept
	b.SetHelp(b.Help().Key, "on to the bench")
	return b
}
