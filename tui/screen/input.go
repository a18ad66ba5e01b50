package screen

import (
	"github.com/charmbracelet/bubbles/cursor"
	"github.com/charmbracelet/bubbles/textinput"

	"enthalpath/tui/theme"
)

// NewInput returns a text input styled from st, bounded to limit
// characters, with a steady cursor: a blinking one would redraw the screen
// twice a second for nothing (and cost bandwidth over SSH).
func NewInput(st *theme.Styles, limit int) textinput.Model {
	ti := textinput.New()
	ti.PromptStyle = st.Input
	ti.TextStyle = st.InputText
	ti.PlaceholderStyle = st.Muted
	ti.CompletionStyle = st.Muted
	ti.Cursor.Style = st.Cursor
	ti.Cursor.TextStyle = st.InputText
	ti.Cursor.SetMode(cursor.CursorStatic)
	ti.CharLimit = max(limit, 1)
	return ti
}
