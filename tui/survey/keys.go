package survey

import (
	"github.com/charmbracelet/bubbles/key"

	"enthalpath/tui/nav"
)

// KeyMap is the survey's keys.
type KeyMap struct {
	Up, Down, PageUp, PageDown key.Binding
	First, Last                key.Binding
	Filter, Sort, Reverse      key.Binding
	Model, View, Open          key.Binding
	Scale                      key.Binding
	Done, Clear                key.Binding
}

// DefaultKeyMap returns the survey's keys.
func DefaultKeyMap() KeyMap {
	return KeyMap{
		Up:       nav.Up.Bind("previous compound"),
		Down:     nav.Down.Bind("next compound"),
		PageUp:   nav.PageUp.Bind("page up"),
		PageDown: nav.PageDown.Bind("page down"),
		First:    nav.First.Bind("first row"),
		Last:     nav.Last.Bind("last row"),
		Filter:   nav.New("filter", "/"),
		Sort:     nav.New("sort by the next column", "s"),
		Reverse:  nav.New("reverse the order", "S"),
		Model:    nav.New("next model for gap and chart", "m"),
		View:     nav.New("table → model vs cycle → gap by family", "p"),
		Open:     nav.Enter.Bind("open the compound's cycle"),
		Scale:    nav.New("log ⇄ linear axes", "l"),
		Done:     nav.Enter.Bind("keep the filter"),
		Clear:    nav.Esc.Bind("clear the filter"),
	}
}
