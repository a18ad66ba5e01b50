package screen

import (
	"github.com/charmbracelet/bubbles/help"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/tui/theme"
)

// Context is what every screen shares. The root model owns it and is the
// only writer (of Units, on the units key); screens read it.
type Context struct {
	Styles *theme.Styles
	// Units is the unit every energy is printed in.
	Units thermo.Unit
	// DB is the data (built-in tables plus the user overlay), read-only.
	DB *data.DB
	// MaxInputLen bounds every text input, in characters.
	MaxInputLen int
	// ResolvePath turns a file name typed by the user into a path, refusing
	// names outside the allowed folder; it returns an error that says why.
	ResolvePath func(name string) (string, error)
}

// Screen is one page of the workshop. Screens are pointers and update in
// place; Update returns only the command to run.
type Screen interface {
	help.KeyMap
	// Init returns the screen's first command, run when it is created.
	Init() tea.Cmd
	// Update handles a message the root model passes on.
	Update(msg tea.Msg) tea.Cmd
	// View renders the screen in exactly the size last given to SetSize.
	View() string
	// SetSize gives the screen its body size in cells.
	SetSize(width, height int)
	// Title is the screen's name in the header.
	Title() string
	// Capturing reports whether a text input has the focus, so the root
	// model must leave printable keys (and q, ?, u …) to the screen.
	Capturing() bool
}

// ID names a screen, in header order.
type ID int

// The workshop's screens.
const (
	Shelf ID = iota
	Bench
	Assembly
	Models
	Survey
	Analyses
)

// OpenMsg asks the root model to open a compound's cycle: from the data
// with the lattice step solved, or, with Guided, through the step-by-step
// assembly. File, when set, opens a saved cycle file instead.
type OpenMsg struct {
	Formula string
	Guided  bool
	File    string
}

// SwitchMsg asks the root model to show another screen.
type SwitchMsg struct{ To ID }

// StatusMsg puts a line in the status bar; Err marks it as an error.
type StatusMsg struct {
	Text string
	Err  bool
}

// Status returns a command that reports text in the status bar.
func Status(text string) tea.Cmd {
	return func() tea.Msg { return StatusMsg{Text: text} }
}

// Fail returns a command that reports err in the status bar.
func Fail(err error) tea.Cmd {
	return func() tea.Msg { return StatusMsg{Text: err.Error(), Err: true} }
}

// Switch returns a command that shows screen id.
func Switch(id ID) tea.Cmd { return func() tea.Msg { return SwitchMsg{To: id} } }

// UnitsMsg tells every screen the display unit changed (Context.Units).
type UnitsMsg struct{}

// ShownMsg tells a screen it has just become the visible one.
type ShownMsg struct{}
