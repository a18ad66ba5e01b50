package theme

import "github.com/charmbracelet/lipgloss"

// Palette entries. Light value first (dark text on a light background), dark
// value second.
var (
	colourAccent  = lipgloss.AdaptiveColor{Light: "#1f5f8b", Dark: "#7fc4ee"}
	colourMuted   = lipgloss.AdaptiveColor{Light: "#5c5c5c", Dark: "#a0a0a0"}
	colourSolved  = lipgloss.AdaptiveColor{Light: "#8a3b00", Dark: "#ffb86b"}
	colourError   = lipgloss.AdaptiveColor{Light: "#a00020", Dark: "#ff7a8a"}
	colourGood    = lipgloss.AdaptiveColor{Light: "#1d6b2f", Dark: "#8be39c"}
	colourWarn    = lipgloss.AdaptiveColor{Light: "#7a5a00", Dark: "#f0d264"}
	colourRule    = lipgloss.AdaptiveColor{Light: "#9a9a9a", Dark: "#606060"}
	colourSelectB = lipgloss.AdaptiveColor{Light: "#d9e8f5", Dark: "#23415a"}
)

// Styles is every style the workshop uses, all built from one renderer.
type Styles struct {
	r *lipgloss.Renderer

	// Header is the top bar; Tab and ActiveTab the screen names in it.
	Header    lipgloss.Style
	Tab       lipgloss.Style
	ActiveTab lipgloss.Style
	// Title is a panel or section title.
	Title lipgloss.Style
	// Text is plain body text; Muted is secondary text (sources, hints).
	Text  lipgloss.Style
	Muted lipgloss.Style
	// Selected is the highlighted row of a list or table (bold as well as
	// a background, so it still shows without colour).
	Selected lipgloss.Style
	// Solved marks the unknown (solved) term; always paired with the marker diagram.SolvedMark.
	Solved lipgloss.Style
	// Error and Warn are messages; they are always prefixed with a word.
	Error lipgloss.Style
	Warn  lipgloss.Style
	Good  lipgloss.Style
	// Accent is for numbers the user asked for (the solved value, totals).
	Accent lipgloss.Style
	// Rule draws level lines, axes and separators.
	Rule lipgloss.Style
	// Panel is a bordered box; Overlay is the help and dialog box.
	Panel   lipgloss.Style
	Overlay lipgloss.Style
	// HelpKey, HelpDesc and HelpSep style the help line and overlay.
	HelpKey  lipgloss.Style
	HelpDesc lipgloss.Style
	HelpSep  lipgloss.Style
	// Input is the prompt of a text input; InputText its text.
	Input     lipgloss.Style
	InputText lipgloss.Style
	Cursor    lipgloss.Style
}

// DefaultStyles returns the workshop's styles for renderer r. A nil r means
// the default renderer of lipgloss (only for local tools; the program itself
// always passes one).
func DefaultStyles(r *lipgloss.Renderer) *Styles {
	if r == nil {
		r = lipgloss.DefaultRenderer()
	}
	base := r.NewStyle()
	s := &Styles{r: r}
	s.Text = base
	s.Muted = base.Foreground(colourMuted)
	s.Header = base.Bold(true).Foreground(colourAccent)
	s.Tab = base.Foreground(colourMuted).Padding(0, 1)
	s.ActiveTab = base.Bold(true).Underline(true).Foreground(colourAccent).Padding(0, 1)
	s.Title = base.Bold(true).Foreground(colourAccent)
	s.Selected = base.Bold(true).Background(colourSelectB)
	s.Solved = base.Bold(true).Foreground(colourSolved)
	s.Error = base.Bold(true).Foreground(colourError)
	s.Warn = base.Foreground(colourWarn)
	s.Good = base.Foreground(colourGood)
	s.Accent = base.Bold(true).Foreground(colourAccent)
	s.Rule = base.Foreground(colourRule)
	s.Panel = base.Border(lipgloss.RoundedBorder()).BorderForeground(colourRule).Padding(0, 1)
	s.Overlay = base.Border(lipgloss.DoubleBorder()).BorderForeground(colourAccent).Padding(0, 1)
	s.HelpKey = base.Bold(true).Foreground(colourAccent)
	s.HelpDesc = base.Foreground(colourMuted)
	s.HelpSep = base.Foreground(colourRule)
	s.Input = base.Foreground(colourAccent)
	s.InputText = base
	s.Cursor = base.Reverse(true)
	return s
}

// Renderer returns the renderer the styles were built from, for styles a
// component has to build itself (they must come from the same renderer).
func (s *Styles) Renderer() *lipgloss.Renderer { return s.r }
