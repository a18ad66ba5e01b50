package bench

import "github.com/charmbracelet/bubbles/key"

// KeyMap is the bench's keys.
type KeyMap struct {
	Up, Down, Top, Bottom key.Binding
	Edit, Unknown, Reset  key.Binding
	Source, Assemble      key.Binding
	Pane, Export          key.Binding
	Lattice, Electrons    key.Binding
}

// DefaultKeyMap returns the bench's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:        key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "previous step")),
		Down:      key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "next step")),
		Top:       key.NewBinding(key.WithKeys("home", "g"), key.WithHelp("g/home", "first step")),
		Bottom:    key.NewBinding(key.WithKeys("end", "G"), key.WithHelp("G/end", "last step")),
		Edit:      key.NewBinding(key.WithKeys("e", "enter"), key.WithHelp("e", "type a value")),
		Unknown:   key.NewBinding(key.WithKeys("x"), key.WithHelp("x", "solve for it")),
		Reset:     key.NewBinding(key.WithKeys("r"), key.WithHelp("r", "reset to data")),
		Source:    key.NewBinding(key.WithKeys("s"), key.WithHelp("s", "source")),
		Assemble:  key.NewBinding(key.WithKeys("a"), key.WithHelp("a", "assemble step by step")),
		Pane:      key.NewBinding(key.WithKeys("v"), key.WithHelp("v", "steps ⇄ drawing (small window)")),
		Export:    key.NewBinding(key.WithKeys("d"), key.WithHelp("d", "export the drawing as SVG")),
		Lattice:   key.NewBinding(key.WithKeys("c"), key.WithHelp("c", "lattice ΔH_L ⇄ U")),
		Electrons: key.NewBinding(key.WithKeys("t"), key.WithHelp("t", "ionization 0 K ⇄ 298 K")),
	}
}
