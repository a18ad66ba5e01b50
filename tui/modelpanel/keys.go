package modelpanel

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

// KeyMap is the model panel's keys.
type KeyMap struct {
	Up, Down, Edit, Next, Prev, Default key.Binding
}

// DefaultKeyMap returns the model panel's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:      nav.Up.Bind("previous setting"),
		Down:    nav.Down.Bind("next setting"),
		Edit:    nav.Enter.Bind("change the setting", "e"),
		Next:    nav.Right.Bind("next choice"),
		Prev:    nav.Left.Bind("previous choice"),
		Default: nav.New("back to the default", "r"),
	}
}
