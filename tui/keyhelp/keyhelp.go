// Package keyhelp draws the workshop's key help from the bindings
// themselves: the help line under the screen, whose screen keys give way
// at the end so that the key-list and quit keys stay, and the key list
// laid out in columns that start a new band below where the next would
// not fit, so every key shows.
package keyhelp

import (
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/help"
	"github.com/charmbracelet/bubbles/key"
	"github.com/charmbracelet/lipgloss"

	"enthalpath/tui/nav"
	"enthalpath/tui/theme"
)

// Model draws key help in the styles it was built with.
type Model struct {
	help   help.Model
	styles *theme.Styles
}

// New returns key help drawn in st.
func New(st *theme.Styles) *Model {
	h := help.New()
	h.ShortSeparator = " · "
	h.Styles = help.Styles{
		Ellipsis: st.HelpSep, ShortKey: st.HelpKey, ShortDesc: st.HelpDesc, ShortSeparator: st.HelpSep,
		FullKey: st.HelpKey, FullDesc: st.HelpDesc, FullSeparator: st.HelpSep,
	}
	return &Model{help: h, styles: st}
}

// SetWidth sets the width of the help line.
func (m *Model) SetWidth(w int) { m.help.Width = w }

// width is the line's width, as bubbles' help reads it.
func (m *Model) width() int { return m.help.Width }

// fits reports whether b fits the line whole.
func (m *Model) fits(b []key.Binding) bool {
	wide := m.help
	wide.Width = 0 // unbounded, to see whether it all fits
	return lipgloss.Width(wide.ShortHelpView(b)) <= m.width()
}

// Line draws a screen's keys then the global ones: when not all fit, the
// screen's last keys give way (but one), so the globals at the end stay.
func (m *Model) Line(screenKeys, globals []key.Binding) string {
	screenKeys = slices.Clip(screenKeys)
	for len(screenKeys) > 1 && !m.fits(append(screenKeys, globals...)) {
		screenKeys = screenKeys[:len(screenKeys)-1]
	}
	return m.clip(m.help.ShortHelpView(append(screenKeys, globals...)))
}

// Answers draws keys that must all show (a question's answers): described
// when they fit, else with their declared, shorter help (bare).
func (m *Model) Answers(described, bare []key.Binding) string {
	if m.fits(described) {
		return m.clip(m.help.ShortHelpView(described))
	}
	return m.clip(m.help.ShortHelpView(bare))
}

// Plain draws b as bubbles' help does, cut at the width.
func (m *Model) Plain(b []key.Binding) string { return m.clip(m.help.ShortHelpView(b)) }

func (m *Model) clip(line string) string {
	return m.styles.Renderer().NewStyle().MaxWidth(m.width()).Render(line)
}

// Overlay draws the key list: title, the groups in columns within width,
// then note wrapped to width.
func (m *Model) Overlay(title string, groups [][]key.Binding, note string, width int) string {
	st := m.styles
	return title + "\n" + m.columns(groups, width) + "\n" + st.Muted.Width(width).Render(note)
}

// columns lays the groups out as columns, starting a new band of columns
// below when the next would not fit in width.
func (m *Model) columns(groups [][]key.Binding, width int) string {
	st := m.styles
	var bands, band []string
	used := 0
	for _, g := range groups {
		kw := 0
		for _, b := range g {
			if b.Enabled() {
				kw = max(kw, lipgloss.Width(b.Help().Key))
			}
		}
		var lines []string
		for _, b := range g {
			if !b.Enabled() {
				continue
			}
			h := b.Help()
			lines = append(lines, st.HelpKey.Render(h.Key+strings.Repeat(" ", kw-lipgloss.Width(h.Key)))+" "+st.HelpDesc.Render(h.Desc))
		}
		if len(lines) == 0 {
			continue
		}
		col := strings.Join(lines, "\n")
		w := lipgloss.Width(col) + 3
		if used > 0 && used+w > width {
			bands = append(bands, lipgloss.JoinHorizontal(lipgloss.Top, band...))
			band, used = nil, 0
		}
		band = append(band, st.Renderer().NewStyle().PaddingRight(3).Render(col))
		used += w
	}
	if len(band) > 0 {
		bands = append(bands, lipgloss.JoinHorizontal(lipgloss.Top, band...))
	}
	return strings.Join(bands, "\n")
}

// Screen is what the help reads of the screen shown: its keys, and
// whether it is typing (its printable keys are then text).
type Screen interface {
	help.KeyMap
	Capturing() bool
}

// Globals are the keys that act on every screen.
type Globals struct {
	// End closes the help line (the key list, quit); EndTyping closes it
	// while the screen is typing, reduced to the keys that are not text.
	End, EndTyping []key.Binding
	// Groups follow the screen's own in the key list.
	Groups [][]key.Binding
	// Idle stands in the help line for a screen with no key of its own yet.
	Idle key.Binding
}

// Short returns the help line's keys for s: its own (or Idle), then the
// global ones that still act — while s is typing, those that are not text.
func (g Globals) Short(s Screen) (own, globals []key.Binding) {
	own = slices.Clip(s.ShortHelp())
	if len(own) == 0 && !s.Capturing() {
		own = []key.Binding{g.Idle}
	}
	if s.Capturing() {
		return own, g.acting(s, g.EndTyping)
	}
	return own, g.End
}

// Full returns the key list for s: its groups, then the global groups,
// each reduced to what still acts while s is typing.
func (g Globals) Full(s Screen) [][]key.Binding {
	groups := slices.Clip(s.FullHelp())
	for _, gr := range g.Groups {
		groups = append(groups, g.acting(s, gr))
	}
	return groups
}

// acting is b, reduced while s is typing to the keys that are not text.
func (g Globals) acting(s Screen, b []key.Binding) []key.Binding {
	if !s.Capturing() {
		return b
	}
	var out []key.Binding
	for _, k := range b {
		if nk, ok := nav.WithoutPrintable(k); ok {
			out = append(out, nk)
		}
	}
	return out
}
