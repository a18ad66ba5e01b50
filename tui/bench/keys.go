package bench

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

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
		Up:        nav.Up.Bind("previous step"),
		Down:      nav.Down.Bind("next step"),
		Top:       nav.First.Bind("first step"),
		Bottom:    nav.Last.Bind("last step"),
		Edit:      nav.Enter.Bind("type a value", "e"),
		Unknown:   nav.New("solve for it", "x"),
		Reset:     nav.New("reset to data", "r"),
		Source:    nav.New("source", "s"),
		Assemble:  nav.New("assemble step by step", "a"),
		Pane:      nav.New("steps ⇄ drawing (small window)", "v"),
		Export:    nav.New("export the drawing as SVG", "d"),
		Lattice:   nav.New("lattice ΔH_L ⇄ U", "c"),
		Electrons: nav.New("ionization 0 K ⇄ 298 K", "t"),
	}
}
