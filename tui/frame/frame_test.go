package frame

import "testing"

// TestWindow: the body is the window less three rows; a size below the
// least one is too small once known (80×24: the workshop's least size,
// our own choice, in tui.MinWidth and MinHeight).
func TestWindow(t *testing.T) {
	cases := []struct {
		w, h         int
		known, small bool
		bodyW, bodyH int
		overlayWidth int
	}{
		{0, 0, false, false, 1, 1, 20},
		{80, 24, true, false, 80, 21, 74},
		{79, 24, true, true, 79, 21, 73},
		{120, 23, true, true, 120, 20, 114},
		{10, 2, true, true, 10, 1, 20},
	}
	for _, c := range cases {
		w := Window{Width: c.w, Height: c.h, MinWidth: 80, MinHeight: 24}
		bw, bh := w.Body()
		if w.Known() != c.known || w.TooSmall() != c.small || bw != c.bodyW || bh != c.bodyH || w.OverlayWidth() != c.overlayWidth {
			t.Errorf("%d×%d: known %v small %v body %d×%d overlay %d", c.w, c.h, w.Known(), w.TooSmall(), bw, bh, w.OverlayWidth())
		}
	}
}
