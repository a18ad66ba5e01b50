package analyses

import "github.com/charmbracelet/bubbles/key"

// KeyMap is the analyses screen's keys.
type KeyMap struct {
	Up, Down, Edit, Run key.Binding
	// More and Back scroll a result taller than the screen.
	More, Back key.Binding
}

// DefaultKeyMap returns the analyses screen's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:   key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "previous analysis")),
		Down: key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "next analysis")),
		Edit: key.NewBinding(key.WithKeys("e", "enter"), key.WithHelp("e/enter", "type its arguments")),
		Run:  key.NewBinding(key.WithKeys("r"), key.WithHelp("r", "run it again")),
		More: key.NewBinding(key.WithKeys("pgdown", "f"), key.WithHelp("pgdn/f", "scroll the result down")),
		Back: key.NewBinding(key.WithKeys("pgup", "b"), key.WithHelp("pgup/b", "scroll the result up")),
	}
}
