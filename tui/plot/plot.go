package plot

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"github.com/charmbracelet/lipgloss"
)

// Glyphs are the point markers, one per group in order; groups beyond the
// list reuse them.
const Glyphs = "ox+*#@%&=~"

// Crowded marks a cell holding points of two groups: a mark of its own,
// neither a group's glyph nor the help key "?" nor the solved-step mark.
const Crowded = '‡'

// Glyph returns the marker of group g.
func Glyph(g int) rune {
	r := []rune(Glyphs)
	if g < 0 {
		g = -g
	}
	return r[g%len(r)]
}

// Point is one datum of a scatter plot.
type Point struct {
	X, Y  float64
	Group int
}

// Styles are the styles of the chart's parts.
type Styles struct {
	Axis, Point, Guide, Label lipgloss.Style
}

// Scatter is a scatter plot of Y against X.
type Scatter struct {
	Points []Point
	// Groups names the groups for the legend, by index.
	Groups []string
	XLabel string
	YLabel string
	// Diagonal draws the line y = x (a model agreeing with the cycle).
	Diagonal bool
	// Zero keeps y = 0 in range and draws it (a reaction energy's sign).
	Zero bool
	// Log draws both axes on a logarithmic scale of |value| (for values
	// of one sign spanning decades, such as lattice energies, whose
	// crowded small end it spreads out); ticks keep the values' sign.
	Log bool
}

const yAxisWidth = 8

// Render draws the plot in h lines of at most w cells, legend included.
func (s Scatter) Render(w, h int, st Styles) string {
	legend := legendLines(s.Groups, w)
	ph := h - 2 - len(legend) // axis line and x label
	pw := w - yAxisWidth - 1
	if ph < 4 || pw < 10 {
		return pad("(plot needs more room)", w, h)
	}
	// On a log scale the points are drawn at log10|v|; sign is the sign
	// the tick labels carry back.
	sign := 1.0
	tr := func(v float64) float64 { return v }
	if s.Log {
		for _, p := range s.Points {
			if finite(p.X) && p.X != 0 {
				sign = math.Copysign(1, p.X)
				break
			}
		}
		tr = func(v float64) float64 {
			if v == 0 || math.Copysign(1, v) != sign {
				return math.NaN() // no place on this scale
			}
			return math.Log10(math.Abs(v))
		}
	}
	pts := make([]Point, 0, len(s.Points))
	xs, ys := make([]float64, 0, len(s.Points)), make([]float64, 0, len(s.Points))
	for _, p := range s.Points {
		p.X, p.Y = tr(p.X), tr(p.Y)
		pts = append(pts, p)
		if finite(p.X) && finite(p.Y) {
			xs, ys = append(xs, p.X), append(ys, p.Y)
		}
	}
	if len(xs) == 0 {
		return pad("(nothing to plot yet)", w, h)
	}
	xlo, xhi := bounds(xs)
	if s.Zero && !s.Log {
		ys = append(ys, 0)
	}
	ylo, yhi := bounds(ys)
	if s.Diagonal { // same range on both axes so y = x is the diagonal
		xlo, ylo = math.Min(xlo, ylo), math.Min(xlo, ylo)
		xhi, yhi = math.Max(xhi, yhi), math.Max(xhi, yhi)
	}
	// Round numbers at the ends and on the ticks: the range widens to
	// whole steps of 1, 2 or 5 × 10ⁿ (a log scale to whole decades or
	// their 2 and 5 marks).
	var yticks, xticks []float64
	if s.Log {
		xlo, xhi, xticks = logTicks(xlo, xhi)
		ylo, yhi, yticks = logTicks(ylo, yhi)
	} else {
		xlo, xhi, xticks = niceTicks(xlo, xhi, 4)
		ylo, yhi, yticks = niceTicks(ylo, yhi, max(2, ph/4))
	}
	label := func(v float64) string {
		if s.Log {
			return Tick(sign * math.Pow(10, v))
		}
		return Tick(v)
	}
	if s.Diagonal { // the widened ranges stay equal, so y = x stays the diagonal
		ylo, yhi = xlo, xhi
		yticks = xticks
	}
	col := func(x float64) int { return int(math.Round((x - xlo) / (xhi - xlo) * float64(pw-1))) }
	row := func(y float64) int { return int(math.Round((yhi - y) / (yhi - ylo) * float64(ph-1))) }
	cells := make([][]rune, ph)
	kinds := make([][]byte, ph) // 0 blank, 1 guide, 2 point
	for i := range cells {
		cells[i] = []rune(strings.Repeat(" ", pw))
		kinds[i] = make([]byte, pw)
	}
	if s.Diagonal {
		for x := 0; x < pw; x++ {
			v := xlo + (xhi-xlo)*float64(x)/float64(pw-1)
			if y := row(v); y >= 0 && y < ph {
				cells[y][x], kinds[y][x] = '.', 1
			}
		}
	}
	if y := row(0); s.Zero && !s.Log && y >= 0 && y < ph {
		for x := 0; x < pw; x++ {
			cells[y][x], kinds[y][x] = '-', 1
		}
	}
	for _, p := range pts {
		if !finite(p.X) || !finite(p.Y) {
			continue
		}
		x, y := col(p.X), row(p.Y)
		if x < 0 || x >= pw || y < 0 || y >= ph {
			continue
		}
		g := Glyph(p.Group)
		if kinds[y][x] == 2 && cells[y][x] != g {
			g = Crowded // two groups on one cell; the table has the numbers
		}
		cells[y][x], kinds[y][x] = g, 2
	}
	var b strings.Builder
	tickAt := map[int]string{}
	for _, v := range yticks {
		if y := row(v); y >= 0 && y < ph {
			if _, taken := tickAt[y]; !taken {
				tickAt[y] = label(v)
			}
		}
	}
	for y := range ph {
		mark := "│"
		if _, ok := tickAt[y]; ok {
			mark = "┤"
		}
		b.WriteString(st.Axis.Render(fmt.Sprintf("%*s %s", yAxisWidth-2, tickAt[y], mark)))
		b.WriteString(renderRow(cells[y], kinds[y], st))
		b.WriteByte('\n')
	}
	axis := []rune(strings.Repeat("─", pw))
	for _, v := range xticks {
		if x := col(v); x >= 0 && x < pw {
			axis[x] = '┬'
		}
	}
	b.WriteString(st.Axis.Render(strings.Repeat(" ", yAxisWidth-1) + "└" + string(axis)))
	b.WriteByte('\n')
	left, right := label(xlo), label(xhi)
	mid := " " + s.XLabel + " "
	if s.Log {
		mid = " " + s.XLabel + ", log scale "
	}
	gap := pw - len([]rune(left)) - len([]rune(right)) - len([]rune(mid))
	xl := left + strings.Repeat(" ", max(gap/2, 1)) + mid + strings.Repeat(" ", max(gap-gap/2, 1)) + right
	b.WriteString(st.Label.Render(strings.Repeat(" ", yAxisWidth) + truncate(xl, pw)))
	for _, l := range legend {
		b.WriteByte('\n')
		b.WriteString(st.Label.Render(l))
	}
	return b.String()
}

// Strip is a strip chart: one row per group, each value a glyph at its x.
type Strip struct {
	Groups []string
	// Values[g] are the values of group g.
	Values [][]float64
	XLabel string
	// Zero draws a vertical guide at x = 0.
	Zero bool
}

// Render draws the strip chart in h lines of at most w cells.
func (s Strip) Render(w, h int, st Styles) string {
	labelW := 0
	for _, g := range s.Groups {
		labelW = max(labelW, len([]rune(g)))
	}
	labelW = min(labelW, max(8, w/4))
	pw := w - labelW - 3
	if pw < 10 || h < len(s.Groups)+2 || len(s.Groups) == 0 {
		return pad("(chart needs more room)", w, h)
	}
	var all []float64
	for _, vs := range s.Values {
		for _, v := range vs {
			if finite(v) {
				all = append(all, v)
			}
		}
	}
	if len(all) == 0 {
		return pad("(nothing to plot yet)", w, h)
	}
	lo, hi := bounds(all)
	if s.Zero {
		lo, hi = math.Min(lo, 0), math.Max(hi, 0)
	}
	col := func(x float64) int { return int(math.Round((x - lo) / (hi - lo) * float64(pw-1))) }
	var b strings.Builder
	for g, name := range s.Groups {
		cells := []rune(strings.Repeat(" ", pw))
		kinds := make([]byte, pw)
		if s.Zero {
			cells[col(0)], kinds[col(0)] = '┊', 1
		}
		if g < len(s.Values) {
			for _, v := range s.Values[g] {
				if finite(v) {
					x := col(v)
					cells[x], kinds[x] = Glyph(g), 2
				}
			}
		}
		b.WriteString(st.Label.Render(fmt.Sprintf("%-*s ", labelW, truncate(name, labelW))))
		b.WriteString(st.Axis.Render("│ "))
		b.WriteString(renderRow(cells, kinds, st))
		b.WriteByte('\n')
	}
	b.WriteString(st.Axis.Render(strings.Repeat(" ", labelW+1) + "└" + strings.Repeat("─", pw+1)))
	b.WriteByte('\n')
	left, right := Tick(lo), Tick(hi)
	mid := " " + s.XLabel + " "
	gap := pw - len([]rune(left)) - len([]rune(right)) - len([]rune(mid))
	xl := left + strings.Repeat(" ", max(gap/2, 1)) + mid + strings.Repeat(" ", max(gap-gap/2, 1)) + right
	b.WriteString(st.Label.Render(strings.Repeat(" ", labelW+3) + truncate(xl, pw)))
	lines := strings.Count(b.String(), "\n") + 1
	for ; lines < h; lines++ {
		b.WriteByte('\n')
	}
	return b.String()
}

func renderRow(cells []rune, kinds []byte, st Styles) string {
	var b strings.Builder
	for x := 0; x < len(cells); {
		k := kinds[x]
		j := x
		for j < len(cells) && kinds[j] == k {
			j++
		}
		seg := string(cells[x:j])
		switch k {
		case 1:
			seg = st.Guide.Render(seg)
		case 2:
			seg = st.Point.Render(seg)
		}
		b.WriteString(seg)
		x = j
	}
	return strings.TrimRight(b.String(), " ")
}

func legendLines(groups []string, w int) []string {
	var lines []string
	cur := ""
	for g, name := range groups {
		item := string(Glyph(g)) + " " + name
		if cur != "" && len([]rune(cur))+3+len([]rune(item)) > w {
			lines = append(lines, cur)
			cur = ""
		}
		if cur != "" {
			cur += "   "
		}
		cur += item
	}
	if cur != "" {
		lines = append(lines, cur)
	}
	return lines
}

// niceTicks widens [lo, hi] to whole steps of 1, 2 or 5 × 10ⁿ, chosen for
// about n intervals, and returns the ticks on those steps.
func niceTicks(lo, hi float64, n int) (nlo, nhi float64, ticks []float64) {
	step := niceStep((hi - lo) / float64(max(n, 1)))
	nlo, nhi = math.Floor(lo/step+1e-9)*step, math.Ceil(hi/step-1e-9)*step
	for v := nlo; v <= nhi+step/2; v += step {
		ticks = append(ticks, math.Round(v/step)*step)
	}
	return nlo, nhi, ticks
}

// niceStep rounds raw up to 1, 2 or 5 times a power of ten.
func niceStep(raw float64) float64 {
	if !(raw > 0) || math.IsInf(raw, 0) {
		return 1
	}
	p := math.Pow(10, math.Floor(math.Log10(raw)))
	for _, m := range []float64{1, 2, 5, 10} {
		if m*p >= raw*(1-1e-12) {
			return m * p
		}
	}
	return 10 * p
}

// logTicks widens [lo, hi] (log10 of |value|) to the 1, 2, 5 marks of the
// decades around it and returns those marks inside.
func logTicks(lo, hi float64) (nlo, nhi float64, ticks []float64) {
	var marks []float64
	for d := math.Floor(lo) - 1; d <= math.Ceil(hi)+1; d++ {
		for _, m := range []float64{1, 2, 5} {
			marks = append(marks, d+math.Log10(m))
		}
	}
	nlo, nhi = lo, hi
	for i := len(marks) - 1; i >= 0; i-- {
		if marks[i] <= lo+1e-9 {
			nlo = marks[i]
			break
		}
	}
	for _, v := range marks {
		if v >= hi-1e-9 {
			nhi = v
			break
		}
	}
	for _, v := range marks {
		if v >= nlo-1e-9 && v <= nhi+1e-9 {
			ticks = append(ticks, v)
		}
	}
	return nlo, nhi, ticks
}

func bounds(v []float64) (lo, hi float64) {
	lo, hi = v[0], v[0]
	for _, x := range v {
		lo, hi = math.Min(lo, x), math.Max(hi, x)
	}
	if hi-lo < 1e-9 {
		return lo - 1, hi + 1
	}
	m := (hi - lo) * 0.04
	return lo - m, hi + m
}

func finite(v float64) bool { return !math.IsNaN(v) && !math.IsInf(v, 0) }

// Tick prints an axis value with three significant figures at most.
func Tick(v float64) string {
	a := math.Abs(v)
	if a < 1e-9 {
		return "0"
	}
	prec := 0
	switch {
	case a < 1:
		prec = 2
	case a < 10:
		prec = 1
	}
	s := strconv.FormatFloat(v, 'f', prec, 64)
	return strings.Replace(s, "-", "−", 1)
}

func truncate(s string, n int) string {
	r := []rune(s)
	if len(r) <= n {
		return s
	}
	if n <= 1 {
		return string(r[:max(n, 0)])
	}
	return string(r[:n-1]) + "…"
}

func pad(msg string, w, h int) string {
	lines := make([]string, max(h, 1))
	lines[0] = truncate(msg, w)
	return strings.Join(lines, "\n")
}
