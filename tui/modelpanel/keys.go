package modelpanel

import "github.com/charmbracelet/bubbles/key"

// KeyMap is the model panel's keys.
type KeyMap struct {
	Up, Down, Edit, Next, Prev, Default key.Binding
}

// DefaultKeyMap returns the model panel's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:      key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "previous setting")),
		Down:    key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "next setting")),
		Edit:    key.NewBinding(key.WithKeys("e", "enter"), key.WithHelp("e/enter", "change the setting")),
		Next:    key.NewBinding(key.WithKeys("right", "l"), key.WithHelp("→/l", "next choice")),
		Prev:    key.NewBinding(key.WithKeys("left", "h"), key.WithHelp("←/h", "previous choice")),
		Default: key.NewBinding(key.WithKeys("r"), key.WithHelp("r", "back to the default")),
	}
}
