package diagram

import (
	"bytes"
	"encoding/xml"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
)

// SVG geometry, in user units (px).
const (
	svgMarginTop   = 56.0
	svgMarginBot   = 36.0
	svgNoteLine    = 16.0 // one line of notes under the drawing
	svgAxisX       = 72.0
	svgSpacing     = 92.0
	svgLabelGap    = 28.0
	svgLabelWidth  = 230.0
	svgPlotHeight  = 520.0
	svgLevelExtend = 26.0
)

// WriteSVG writes the diagram as a standalone, well-formed SVG 1.1 document:
// levels as lines labelled with their state and energy, arrows with
// arrowheads, values with their uncertainties and the steps in words, the
// unknown step dashed, in its own colour and marked with SolvedMark and
// "(solved)" so it reads in greyscale too, a value the user typed marked
// "*" and "(your value)".
func (d Diagram) WriteSVG(w io.Writer) error {
	var b bytes.Buffer
	n := len(d.Arrows)
	width := svgAxisX + 40 + float64(max(n, 1))*svgSpacing + svgLabelGap + svgLabelWidth
	height := svgMarginTop + svgPlotHeight + svgMarginBot + svgNoteLine*float64(len(d.Notes))
	lo, hi := d.span()
	y := func(e float64) float64 {
		if math.IsNaN(e) || math.IsInf(e, 0) {
			return svgMarginTop + svgPlotHeight
		}
		return svgMarginTop + (hi-e)/(hi-lo)*svgPlotHeight
	}
	col := func(i int) float64 { return svgAxisX + 40 + float64(i)*svgSpacing }

	fmt.Fprintf(&b, `<?xml version="1.0" encoding="UTF-8"?>`+"\n")
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="%s" height="%s" viewBox="0 0 %s %s" font-family="sans-serif" font-size="13">`+"\n",
		num(width), num(height), num(width), num(height))
	b.WriteString(`<defs>` +
		`<marker id="head" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="8" markerHeight="8" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="#1f3f5f"/></marker>` +
		`<marker id="head-solved" viewBox="0 0 10 10" refX="9" refY="5" markerWidth="8" markerHeight="8" orient="auto-start-reverse"><path d="M0,0 L10,5 L0,10 z" fill="#b04a00"/></marker>` +
		"</defs>\n")
	fmt.Fprintf(&b, `<rect x="0" y="0" width="%s" height="%s" fill="#ffffff"/>`+"\n", num(width), num(height))
	fmt.Fprintf(&b, `<text x="%s" y="24" font-size="16" font-weight="bold">%s</text>`+"\n", num(svgAxisX), esc(d.Title))
	fmt.Fprintf(&b, `<text x="%s" y="42" fill="#555555">enthalpy / %s (to scale)</text>`+"\n", num(svgAxisX), esc(d.Unit))

	// Axis with ticks.
	fmt.Fprintf(&b, `<g id="axis" stroke="#777777"><line x1="%s" y1="%s" x2="%s" y2="%s"/>`,
		num(svgAxisX), num(svgMarginTop), num(svgAxisX), num(svgMarginTop+svgPlotHeight))
	step := niceStep((hi - lo) / 8)
	var ticks []string
	for v := math.Ceil(lo/step) * step; v <= hi+1e-9; v += step {
		fmt.Fprintf(&b, `<line x1="%s" y1="%s" x2="%s" y2="%s"/>`, num(svgAxisX-5), num(y(v)), num(svgAxisX), num(y(v)))
		ticks = append(ticks, fmt.Sprintf(`<text x="%s" y="%s" text-anchor="end" stroke="none" fill="#555555">%s</text>`,
			num(svgAxisX-8), num(y(v)+4), esc(FormatTick(v))))
	}
	b.WriteString("</g>\n<g id=\"ticks\">" + strings.Join(ticks, "") + "</g>\n")

	// Levels.
	b.WriteString(`<g id="levels">` + "\n")
	for i, l := range d.Levels {
		left, right := math.Inf(1), math.Inf(-1)
		for a, ar := range d.Arrows {
			if ar.From == i || ar.To == i {
				left, right = math.Min(left, col(a)), math.Max(right, col(a))
			}
		}
		if math.IsInf(left, 0) {
			left, right = col(0), col(0)
		}
		ly := y(l.Energy)
		labelX := col(n) + svgLabelGap
		fmt.Fprintf(&b, `<line x1="%s" y1="%s" x2="%s" y2="%s" stroke="#222222" stroke-width="2"/>`,
			num(left-svgLevelExtend), num(ly), num(right+svgLevelExtend), num(ly))
		fmt.Fprintf(&b, `<line x1="%s" y1="%s" x2="%s" y2="%s" stroke="#bbbbbb" stroke-dasharray="2,3"/>`,
			num(right+svgLevelExtend), num(ly), num(labelX-4), num(ly))
		fmt.Fprintf(&b, `<text x="%s" y="%s">%s <tspan fill="#555555">(%s)</tspan></text>`+"\n",
			num(labelX), num(ly+4), esc(l.Label), esc(FormatTick(round1(l.Energy))))
	}
	b.WriteString("</g>\n<g id=\"steps\">\n")
	for a, ar := range d.Arrows {
		if !d.validArrow(ar) {
			continue
		}
		x := col(a)
		y0, y1 := y(d.Levels[ar.From].Energy), y(d.Levels[ar.To].Energy)
		colour, marker, dash, label := "#1f3f5f", "head", "", ar.Value
		if ar.Reading != "" {
			label = ar.Reading
		}
		switch {
		case ar.Unknown:
			colour, marker, dash, label = "#b04a00", "head-solved", ` stroke-dasharray="6,4"`, SolvedMark+" "+label+" (solved)"
		case ar.Miss:
			colour, marker, dash = "#b04a00", "head-solved", ` stroke-dasharray="2,3"`
		case ar.User:
			label = "* " + label + " (your value)"
		}
		fmt.Fprintf(&b, `<line x1="%s" y1="%s" x2="%s" y2="%s" stroke="%s" stroke-width="2"%s marker-end="url(#%s)"/>`,
			num(x), num(y0), num(x), num(y1), colour, dash, marker)
		mid := (y0 + y1) / 2
		fmt.Fprintf(&b, `<text x="%s" y="%s" fill="%s" font-weight="bold">%s</text>`, num(x+6), num(mid), colour, esc(label))
		name := ar.Name
		if name == "" {
			name = ar.Tag
		}
		// The step in words, on short lines under the value.
		fmt.Fprintf(&b, `<text x="%s" y="%s" fill="#555555" font-size="11">`, num(x+6), num(mid+14))
		dy := 0.0
		for _, line := range wrapWords(name, svgNameChars) {
			fmt.Fprintf(&b, `<tspan x="%s" dy="%s">%s</tspan>`, num(x+6), num(dy), esc(line))
			dy = 13
		}
		b.WriteString("</text>\n")
	}
	if d.hasUser() {
		fmt.Fprintf(&b, `<text x="%s" y="%s" fill="#555555">* your value, typed over the data's</text>`+"\n", num(svgAxisX), num(height-12))
	}
	b.WriteString("</g>\n")
	for i, n := range d.Notes {
		fmt.Fprintf(&b, `<text x="%s" y="%s" fill="#555555" font-size="11">%s</text>`+"\n", num(svgAxisX),
			num(svgMarginTop+svgPlotHeight+svgMarginBot+svgNoteLine*float64(i)), esc(n))
	}
	b.WriteString("</svg>\n")
	_, err := w.Write(b.Bytes())
	return err
}

// svgNameChars is the longest line of a step's name under its arrow.
const svgNameChars = 16

// wrapWords breaks s into lines of at most n runes at spaces (a longer
// word stands alone).
func wrapWords(s string, n int) []string {
	var lines []string
	line := ""
	for _, w := range strings.Fields(s) {
		switch {
		case line == "":
			line = w
		case len([]rune(line))+1+len([]rune(w)) <= n:
			line += " " + w
		default:
			lines = append(lines, line)
			line = w
		}
	}
	if line != "" {
		lines = append(lines, line)
	}
	return lines
}

// hasUser reports whether an arrow carries a value the user typed.
func (d Diagram) hasUser() bool {
	for _, a := range d.Arrows {
		if a.User {
			return true
		}
	}
	return false
}

func round1(v float64) float64 { return math.Round(v*10) / 10 }

func num(v float64) string { return strconv.FormatFloat(v, 'f', 1, 64) }

func esc(s string) string {
	var b strings.Builder
	_ = xml.EscapeText(&b, []byte(s))
	return b.String()
}

func trimFloat(v float64, prec int) string {
	s := strconv.FormatFloat(v, 'f', prec, 64)
	if v > 0 {
		s = "+" + s
	}
	return strings.Replace(s, "-", "−", 1)
}
