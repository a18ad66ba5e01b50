package survey

import "github.com/charmbracelet/bubbles/key"

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
		Up:       key.NewBinding(key.WithKeys("up", "k"), key.WithHelp("↑/k", "previous compound")),
		Down:     key.NewBinding(key.WithKeys("down", "j"), key.WithHelp("↓/j", "next compound")),
		PageUp:   key.NewBinding(key.WithKeys("pgup"), key.WithHelp("pgup", "page up")),
		PageDown: key.NewBinding(key.WithKeys("pgdown"), key.WithHelp("pgdn", "page down")),
		First:    key.NewBinding(key.WithKeys("home", "g"), key.WithHelp("home/g", "first row")),
		Last:     key.NewBinding(key.WithKeys("end", "G"), key.WithHelp("end/G", "last row")),
		Filter:   key.NewBinding(key.WithKeys("/"), key.WithHelp("/", "filter")),
		Sort:     key.NewBinding(key.WithKeys("s"), key.WithHelp("s", "sort by the next column")),
		Reverse:  key.NewBinding(key.WithKeys("S"), key.WithHelp("S", "reverse the order")),
		Model:    key.NewBinding(key.WithKeys("m"), key.WithHelp("m", "next model for gap and chart")),
		View:     key.NewBinding(key.WithKeys("p"), key.WithHelp("p", "table → model vs cycle → gap by family")),
		Open:     key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "open the compound's cycle")),
		Scale:    key.NewBinding(key.WithKeys("l"), key.WithHelp("l", "log ⇄ linear axes")),
		Done:     key.NewBinding(key.WithKeys("enter"), key.WithHelp("enter", "keep the filter")),
		Clear:    key.NewBinding(key.WithKeys("esc"), key.WithHelp("esc", "clear the filter")),
	}
}
