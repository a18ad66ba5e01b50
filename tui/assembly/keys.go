package assembly

import "github.com/charmbracelet/bubbles/key"

// KeyMap is the assembly's keys.
type KeyMap struct {
	Accept, Type, Unknown, Back, Bench key.Binding
}

// DefaultKeyMap returns the assembly's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Accept:  key.NewBinding(key.WithKeys("y", "enter"), key.WithHelp("y/enter", "accept the proposal")),
		Type:    key.NewBinding(key.WithKeys("e"), key.WithHelp("e", "type another value")),
		Unknown: key.NewBinding(key.WithKeys("x"), key.WithHelp("x", "make this the unknown")),
		Back:    key.NewBinding(key.WithKeys("b", "backspace"), key.WithHelp("b", "back one step")),
		Bench:   key.NewBinding(key.WithKeys("w"), key.WithHelp("w", "to the bench")),
	}
}

// onward is Accept once every step is decided: its keys go on to the bench.
func (k KeyMap) onward() key.Binding {
	b := k.Accept
	b.SetHelp(b.Help().Key, "on to the bench")
	return b
}
