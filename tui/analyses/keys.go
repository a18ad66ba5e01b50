package analyses

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

// KeyMap is the analyses screen's keys.
type KeyMap struct {
	Up, Down, Edit, Run key.Binding
	// More and Back scroll a result taller than the screen.
	More, Back key.Binding
}

// DefaultKeyMap returns the analyses screen's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:   nav.Up.Bind("previous analysis"),
		Down: nav.Down.Bind("next analysis"),
		Edit: nav.Enter.Bind("type its arguments", "e"),
		Run:  nav.New("run it again", "r"),
		More: nav.PageDown.Bind("scroll the result down", "f"),
		Back: nav.PageUp.Bind("scroll the result up", "b"),
	}
}
