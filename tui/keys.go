package tui

import "github.com/charmbracelet/bubbles/key"

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
		NextScreen: key.NewBinding(key.WithKeys("tab"), key.WithHelp("tab", "next screen")),
		PrevScreen: key.NewBinding(key.WithKeys("shift+tab"), key.WithHelp("shift+tab", "previous screen")),
		GoTo:       key.NewBinding(key.WithKeys("1", "2", "3", "4", "5", "6"), key.WithHelp("1…6", "go to screen by number")),
		Units:      key.NewBinding(key.WithKeys("u"), key.WithHelp("u", "units kJ/mol → kcal/mol → eV")),
		Help:       key.NewBinding(key.WithKeys("?", "f1"), key.WithHelp("?/f1", "all keys")),
		Save:       key.NewBinding(key.WithKeys("ctrl+s"), key.WithHelp("ctrl+s", "save the cycle file")),
		Open:       key.NewBinding(key.WithKeys("ctrl+o"), key.WithHelp("ctrl+o", "open a cycle file")),
		Quit:       key.NewBinding(key.WithKeys("q"), key.WithHelp("q", "quit")),
		ForceQuit:  key.NewBinding(key.WithKeys("ctrl+c"), key.WithHelp("ctrl+c", "quit (asks if unsaved)")),
	}
}

// ConfirmKeys are the keys of the unsaved-changes question, asked before
// quitting or opening another cycle; the question adds to each what
// follows ("…, then quit", "…, then open MgO").
type ConfirmKeys struct {
	Save, Keep, Discard, Back key.Binding
}

// DefaultConfirmKeys returns the keys of the unsaved-changes question.
func DefaultConfirmKeys() ConfirmKeys {
	return ConfirmKeys{
		Save:    key.NewBinding(key.WithKeys("s"), key.WithHelp("s", "save")),
		Keep:    key.NewBinding(key.WithKeys("k"), key.WithHelp("k", "keep a recovery file")),
		Discard: key.NewBinding(key.WithKeys("x"), key.WithHelp("x", "discard the changes")),
		Back:    key.NewBinding(key.WithKeys("esc"), key.WithHelp("esc", "back to work")),
	}
}
