// Package frame lays the workshop's window out: the header, the body, the
// status line and the help line in their rows; an overlay (a prompt, a
// question, the key list) boxed in the middle of the body; and, in a
// window below the least size, one message in its place.
package frame

import (
	"fmt"

	"github.com/charmbracelet/lipgloss"

	"enthalpath/tui/theme"
)

// Window is the terminal's size and the least size the workshop lays out
// in. A zero size is not known yet.
type Window struct {
	Width, Height       int
	MinWidth, MinHeight int
}

// Known reports whether the size has been given.
func (w Window) Known() bool { return w.Width > 0 && w.Height > 0 }

// TooSmall reports whether a known size is below the least one.
func (w Window) TooSmall() bool {
	return w.Known() && (w.Width < w.MinWidth || w.Height < w.MinHeight)
}

// Body is the body's size: the window less the header, status and help
// rows (at least 1×1).
func (w Window) Body() (int, int) { return max(w.Width, 1), max(w.Height-3, 1) }

// OverlayWidth is the width inside an overlay's box: its border and
// padding take 4 cells, its margin 2 (at least 20).
func (w Window) OverlayWidth() int { return max(20, w.Width-6) }

// Overlay boxes content in st.Overlay in the middle of the body.
func (w Window) Overlay(st *theme.Styles, content string) string {
	bw, bh := w.Body()
	return st.Renderer().Place(bw, bh, lipgloss.Center, lipgloss.Center, st.Overlay.Render(content))
}

// Compose stacks the rows, the body cut to its size.
func (w Window) Compose(st *theme.Styles, header, body, status, help string) string {
	bw, bh := w.Body()
	body = st.Renderer().NewStyle().Width(bw).Height(bh).MaxHeight(bh).MaxWidth(bw).Render(body)
	return lipgloss.JoinVertical(lipgloss.Left, header, body, status, help)
}

// Small draws text in a window below the least size: in its width, cut to
// its height.
func (w Window) Small(st *theme.Styles, text string) string {
	return st.Renderer().NewStyle().Width(w.Width).MaxHeight(w.Height).Render(text)
}

// TooSmallText says the window is too small and how to leave (quitKey).
func (w Window) TooSmallText(quitKey string) string {
	return fmt.Sprintf("The window is %d×%d; the workshop needs at least %d×%d.\nEnlarge the window, or press %s to quit.",
		w.Width, w.Height, w.MinWidth, w.MinHeight, quitKey)
}
