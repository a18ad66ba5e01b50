package tui

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

// KeyMap is the workshop's global keys. Screens have their own; the root
// only acts on a printable global key when the screen is not typing.
type KeyMap struct {
	NextScreen, PrevScreen, GoTo key.Binding
	Units, Help                  key.Binding
	Save, Open                   key.Binding
	Quit, ForceQuit              key.Binding
}

// DefaultKeyMap returns the global keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		NextScreen: nav.NextScreen.Bind("next screen"),
		PrevScreen: nav.PrevScreen.Bind("previous screen"),
		GoTo:       nav.New("go to screen by number", "1", "2", "3", "4", "5", "6"),
		Units:      nav.New("units kJ/mol → kcal/mol → eV", "u"),
		Help:       nav.Help.Bind("all keys"),
		Save:       nav.New("save the cycle file", "ctrl+s"),
		Open:       nav.New("open a cycle file", "ctrl+o"),
		Quit:       nav.Quit.Bind("quit"),
		ForceQuit:  nav.ForceQuit.Bind("quit (asks if unsaved)"),
	}
}
