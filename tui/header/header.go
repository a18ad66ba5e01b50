// Package header draws the workshop's top line: the screen tabs on the
// left, and on the right the open compound, its unsaved mark and the
// energy unit. The right side always shows: when the tabs with their
// names leave no room they close up, and then the screens not shown keep
// only their numbers (the active one its name).
package header

import (
	"fmt"
	"strings"

	"github.com/charmbracelet/lipgloss"

	"enthalpath/tui/theme"
)

// Line is what the header shows.
type Line struct {
	// Titles are the screens' names in order, Active the one shown.
	Titles []string
	Active int
	// Compound is the open cycle's formula ("" for none), Unsaved its
	// mark, Unit the energy unit.
	Compound string
	Unsaved  bool
	Unit     string
}

// View draws l in width cells.
func (l Line) View(st *theme.Styles, width int) string {
	right := l.Unit
	if l.Compound != "" {
		name := l.Compound
		if l.Unsaved {
			name += " (unsaved)"
		}
		right = name + " · " + right
	}
	right = st.Header.Render(right)
	var left string
	for level := range 3 {
		left = l.tabs(st, level)
		if lipgloss.Width(left)+lipgloss.Width(right)+1 <= width {
			break
		}
	}
	gap := width - lipgloss.Width(left) - lipgloss.Width(right)
	if gap < 1 {
		return st.Renderer().NewStyle().MaxWidth(width).Render(right)
	}
	return left + strings.Repeat(" ", gap) + right
}

// tabs draws the screen tabs: at level 0 spaced with every name, at 1
// closed up, at 2 closed up with the active screen's name and the other
// screens' numbers.
func (l Line) tabs(st *theme.Styles, level int) string {
	tab, active := st.Tab, st.ActiveTab
	if level > 0 {
		tab, active = tab.UnsetPadding(), active.UnsetPadding()
	}
	var tabs []string
	for i, t := range l.Titles {
		label := fmt.Sprintf("%d %s", i+1, t)
		if i == l.Active {
			tabs = append(tabs, active.Render("["+label+"]"))
			continue
		}
		if level == 2 {
			label = fmt.Sprint(i + 1)
		}
		tabs = append(tabs, tab.Render(" "+label+" "))
	}
	return strings.Join(tabs, "")
}
