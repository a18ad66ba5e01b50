package diagram

import (
	"math"
	"strings"

	"github.com/charmbracelet/lipgloss"
)

// Level is one state of the system at an enthalpy.
type Level struct {
	// Label names the state, e.g. "Na⁺(g) + Cl⁻(g)".
	Label string
	// Energy is the enthalpy relative to the reference level, in the unit
	// the caller displays (only differences and order matter here).
	Energy float64
}

// Arrow is one step from level From to level To (indices into Levels).
type Arrow struct {
	From, To int
	// Tag is a short name for the step, used in the SVG and the text legend.
	Tag string
	// Value is the step's printed value, e.g. "+496" or "−787".
	Value string
	// Unknown marks the solved step: drawn heavier and marked SolvedMark.
	Unknown bool
	// Miss marks no step but the amount by which an over-determined cycle
	// fails to close: drawn dotted between the two ends, its Value worded.
	Miss bool
	// Name is the step in words ("first ionization energy of Na") and
	// Reading its value with the standard uncertainty ("+107.32 ± 0.18"),
	// for the SVG ("" falls back to Tag and Value); User marks a value the
	// user typed over the data's.
	Name, Reading string
	User          bool
}

// SolvedMark marks the solved step's value in the text drawing, in the
// step lists and in the solved line: a mark of its own, distinct from the
// help key "?" and from the charts' collision mark.
const SolvedMark = "∴"

// Diagram is a set of levels joined by arrows.
type Diagram struct {
	Title  string
	Unit   string
	Levels []Level
	Arrows []Arrow
	// Notes are lines printed under an exported drawing (SVG only).
	Notes []string
}

// Styles are the styles Render applies to each kind of cell.
type Styles struct {
	Rule, Arrow, Solved, Label, Axis lipgloss.Style
}

// Layout constants of the text rendering.
const (
	minAxisWidth  = 7 // "+1000 ┤"
	minSpacing    = 6
	maxSpacing    = 11
	minLabelWidth = 14
)

type cellClass uint8

const (
	clsBlank cellClass = iota
	clsRule
	clsArrow
	clsSolved
	clsLabel
	clsAxis
)

type grid struct {
	w, h  int
	runes [][]rune
	class [][]cellClass
}

func newGrid(w, h int) *grid {
	g := &grid{w: w, h: h, runes: make([][]rune, h), class: make([][]cellClass, h)}
	for y := range h {
		g.runes[y] = []rune(strings.Repeat(" ", w))
		g.class[y] = make([]cellClass, w)
	}
	return g
}

func (g *grid) set(x, y int, r rune, c cellClass) {
	if x < 0 || y < 0 || x >= g.w || y >= g.h {
		return
	}
	g.runes[y][x] = r
	g.class[y][x] = c
}

func (g *grid) free(x, y int) bool {
	return x >= 0 && y >= 0 && x < g.w && y < g.h && g.class[y][x] == clsBlank
}

// text writes s from column x on row y; it reports whether it fitted.
func (g *grid) text(x, y int, s string, c cellClass) {
	for i, r := range []rune(s) {
		g.set(x+i, y, r, c)
	}
}

// rangeFree reports whether columns [x, x+n) of row y are blank.
func (g *grid) rangeFree(x, y, n int) bool {
	if y < 0 || y >= g.h || x < 0 || x+n > g.w {
		return false
	}
	for i := range n {
		if g.class[y][x+i] != clsBlank {
			return false
		}
	}
	return true
}

// Geometry is where Render puts things; exported for tests and for the SVG.
type Geometry struct {
	// Columns[i] is the x position of Arrows[i].
	Columns []int
	// Rows[i] is the y position of Levels[i].
	Rows []int
	// LabelX is the first column of the level labels.
	LabelX int
	// AxisWidth is the width of the energy axis with its tick labels.
	AxisWidth int
}

// ticks returns the axis values for a span drawn in h rows.
func ticks(lo, hi float64, h int) []float64 {
	step := niceStep((hi - lo) / math.Max(1, float64(h)/4))
	var out []float64
	for v := math.Ceil(lo/step) * step; v <= hi+1e-9; v += step {
		out = append(out, v)
	}
	return out
}

// axisWidthFor is the width the tick labels need, plus " ┤".
func axisWidthFor(lo, hi float64, h int) int {
	w := minAxisWidth
	for _, v := range ticks(lo, hi, h) {
		w = max(w, len([]rune(FormatTick(v)))+2)
	}
	return w
}

// Layout computes the text geometry for a w×h box.
func (d Diagram) Layout(w, h int) Geometry {
	n := len(d.Arrows)
	g := Geometry{Columns: make([]int, n), Rows: make([]int, len(d.Levels))}
	lo, hi := d.span()
	axisWidth := axisWidthFor(lo, hi, h)
	g.AxisWidth = axisWidth
	// The labels keep their whole width when the arrows can close up for
	// it (at 80 columns they were cut: "Na⁺(g) + ½Cl₂(…").
	labelNeed := minLabelWidth
	for _, l := range d.Levels {
		labelNeed = max(labelNeed, len([]rune(l.Label))+3)
	}
	labelNeed = min(labelNeed, w/2)
	spacing := maxSpacing
	if n > 0 {
		spacing = (w - axisWidth - labelNeed - 2) / n
	}
	spacing = max(minSpacing, min(maxSpacing, spacing))
	for i := range n {
		g.Columns[i] = axisWidth + 2 + i*spacing
	}
	g.LabelX = axisWidth + 2 + n*spacing
	for i, l := range d.Levels {
		g.Rows[i] = rowOf(l.Energy, lo, hi, h)
	}
	return g
}

func (d Diagram) span() (lo, hi float64) {
	lo, hi = math.Inf(1), math.Inf(-1)
	for _, l := range d.Levels {
		if math.IsNaN(l.Energy) || math.IsInf(l.Energy, 0) {
			continue
		}
		lo, hi = math.Min(lo, l.Energy), math.Max(hi, l.Energy)
	}
	if lo > hi { // no finite level
		return -1, 1
	}
	if hi-lo < 1e-9 {
		lo, hi = lo-1, hi+1
	}
	return lo, hi
}

func rowOf(e, lo, hi float64, h int) int {
	if math.IsNaN(e) || math.IsInf(e, 0) {
		return h - 1
	}
	f := (hi - e) / (hi - lo)
	return int(math.Round(f * float64(h-1)))
}

// Render draws the diagram into exactly h lines of at most w cells.
func (d Diagram) Render(w, h int, st Styles) string {
	if w < minAxisWidth+minSpacing+4 || h < 4 {
		return fit("(too small)", w, h)
	}
	if len(d.Levels) == 0 {
		return fit("(no steps yet)", w, h)
	}
	geo := d.Layout(w, h)
	g := newGrid(w, h)
	lo, hi := d.span()
	d.drawAxis(g, lo, hi, geo.AxisWidth)

	// Level lines: from the leftmost to the rightmost arrow that touches it.
	for i := range d.Levels {
		left, right := -1, -1
		for a, ar := range d.Arrows {
			if ar.From == i || ar.To == i {
				x := geo.Columns[a]
				if left < 0 || x < left {
					left = x
				}
				if x > right {
					right = x
				}
			}
		}
		if left < 0 {
			left, right = geo.AxisWidth+1, geo.AxisWidth+3
		}
		for x := left - 2; x <= right+2; x++ {
			if g.free(x, geo.Rows[i]) {
				g.set(x, geo.Rows[i], '─', clsRule)
			}
		}
	}
	// Arrows.
	for a, ar := range d.Arrows {
		if !d.validArrow(ar) {
			continue
		}
		x := geo.Columns[a]
		y0, y1 := geo.Rows[ar.From], geo.Rows[ar.To]
		cls, shaft := clsArrow, '│'
		switch {
		case ar.Unknown:
			cls, shaft = clsSolved, '┃'
		case ar.Miss:
			cls, shaft = clsSolved, '┊'
		}
		switch {
		case y1 < y0: // up
			for y := y1 + 1; y < y0; y++ {
				g.set(x, y, shaft, cls)
			}
			g.set(x, y1, '▲', cls)
		case y1 > y0: // down
			for y := y0 + 1; y < y1; y++ {
				g.set(x, y, shaft, cls)
			}
			g.set(x, y1, '▼', cls)
		default:
			g.set(x, y0, '◆', cls)
		}
	}
	// Values beside each arrow, at its middle or the nearest free row.
	for a, ar := range d.Arrows {
		if !d.validArrow(ar) {
			continue
		}
		label := ar.Value
		cls := clsLabel
		switch {
		case ar.Unknown:
			label, cls = SolvedMark+label, clsSolved
		case ar.Miss:
			cls = clsSolved
		}
		x := geo.Columns[a] + 1
		y0, y1 := geo.Rows[ar.From], geo.Rows[ar.To]
		mid := (y0 + y1) / 2
		n := len([]rune(label))
		for _, dy := range []int{0, -1, 1, -2, 2, -3, 3} {
			if g.rangeFree(x, mid+dy, n) {
				g.text(x, mid+dy, label, cls)
				break
			}
		}
	}
	// Level labels in the right-hand column, with a dotted leader.
	labelW := w - geo.LabelX - 2
	for i, l := range d.Levels {
		if l.Label == "" {
			continue // the open end of an over-determined path: no state of its own
		}
		y := geo.Rows[i]
		text := truncate(l.Label, labelW)
		for _, dy := range []int{0, -1, 1, -2, 2} {
			if !g.rangeFree(geo.LabelX+2, y+dy, len([]rune(text))) {
				continue
			}
			if dy == 0 {
				for x := geo.LabelX + 1; x > 0 && g.free(x, y); x-- {
					g.set(x, y, '·', clsRule)
				}
			}
			g.text(geo.LabelX+2, y+dy, text, clsLabel)
			break
		}
	}
	return g.render(st)
}

func (d Diagram) validArrow(ar Arrow) bool {
	return ar.From >= 0 && ar.To >= 0 && ar.From < len(d.Levels) && ar.To < len(d.Levels)
}

func (d Diagram) drawAxis(g *grid, lo, hi float64, axisWidth int) {
	for y := range g.h {
		g.set(axisWidth-1, y, '│', clsAxis)
	}
	for _, v := range ticks(lo, hi, g.h) {
		y := rowOf(v, lo, hi, g.h)
		label := FormatTick(v)
		g.text(axisWidth-2-len([]rune(label)), y, label, clsAxis)
		g.set(axisWidth-1, y, '┤', clsAxis)
	}
}

// niceStep rounds raw up to 1, 2 or 5 times a power of ten.
func niceStep(raw float64) float64 {
	if raw <= 0 || math.IsNaN(raw) || math.IsInf(raw, 0) {
		return 1
	}
	p := math.Pow(10, math.Floor(math.Log10(raw)))
	for _, m := range []float64{1, 2, 5, 10} {
		if m*p >= raw {
			return m * p
		}
	}
	return 10 * p
}

// FormatTick prints an axis value compactly: integers when the step allows,
// else one or two decimals.
func FormatTick(v float64) string {
	if math.Abs(v) < 1e-9 {
		return "0"
	}
	s := ""
	switch {
	case math.Abs(v-math.Round(v)) < 1e-6:
		s = trimFloat(v, 0)
	case math.Abs(v*10-math.Round(v*10)) < 1e-6:
		s = trimFloat(v, 1)
	default:
		s = trimFloat(v, 2)
	}
	return s
}

func (g *grid) render(st Styles) string {
	var b strings.Builder
	for y := range g.h {
		row := g.runes[y]
		cls := g.class[y]
		end := len(row)
		for end > 0 && cls[end-1] == clsBlank {
			end--
		}
		for x := 0; x < end; {
			c := cls[x]
			j := x
			for j < end && cls[j] == c {
				j++
			}
			b.WriteString(st.style(c).Render(string(row[x:j])))
			x = j
		}
		if y < g.h-1 {
			b.WriteByte('\n')
		}
	}
	return b.String()
}

func (st Styles) style(c cellClass) lipgloss.Style {
	switch c {
	case clsRule:
		return st.Rule
	case clsArrow:
		return st.Arrow
	case clsSolved:
		return st.Solved
	case clsLabel:
		return st.Label
	case clsAxis:
		return st.Axis
	}
	return lipgloss.Style{}
}

func truncate(s string, n int) string {
	r := []rune(s)
	if n <= 0 {
		return ""
	}
	if len(r) <= n {
		return s
	}
	if n == 1 {
		return "…"
	}
	return string(r[:n-1]) + "…"
}

func fit(msg string, w, h int) string {
	lines := make([]string, max(h, 1))
	lines[0] = truncate(msg, w)
	return strings.Join(lines, "\n")
}
