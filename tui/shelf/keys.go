package shelf

import "github.com/charmbracelet/bubbles/key"

// KeyMap is the shelf's keys. Printable keys always go to the filter line,
// so movement uses the arrows and ctrl keys.
type KeyMap struct {
	Up, Down, PageUp, PageDown key.Binding
	Open, Assemble, Clear      key.Binding
}

// DefaultKeyMap returns the shelf's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:       key.NewBinding(key.WithKeys("up", "ctrl+p"), key.WithHelp("↑/ctrl+p", "previous compound")),
		Down:     key.NewBinding(key.WithKeys("down", "ctrl+n"), key.WithHelp("↓/ctrl+n", "next compound")),
		PageUp:   key.NewBinding(key.WithKeys("pgup"), key.WithHelp("pgup", "page up")),
		PageDown: key.NewBinding(key.WithKeys("pgdown"), key.WithHelp("pgdn", "page down")),
		Open:     key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "open, lattice solved")),
		Assemble: key.NewBinding(key.WithKeys("ctrl+g"), key.WithHelp("ctrl+g", "assemble step by step")),
		Clear:    key.NewBinding(key.WithKeys("esc"), key.WithHelp("esc", "clear the filter")),
	}
}
