package cli

import (
	"fmt"
	"html"
	"math"
	"strings"

	"enthalpath/cycle/analysis"
)

// svgPalette colours the curves in turn (chosen for contrast on white).
var svgPalette = [...]string{"#1f5fa8", "#b8461b", "#2e7d32", "#7b3fa0", "#8a6d00", "#00796b", "#c2185b", "#455a64"}

// stabilitySVG draws ΔrG(T) of every reaction with entropy, each with a
// band of ±2σ, the zero line and the crossings, as a standalone SVG.
func stabilitySVG(st *analysis.Stability) string {
	const w, h, left, right, top, bottom = 760.0, 480.0, 78.0, 24.0, 40.0, 120.0
	pw, ph := w-left-right, h-top-bottom
	lo, hi := 0.0, 0.0
	for _, c := range st.Curves {
		for _, p := range c {
			lo = math.Min(lo, p.Gibbs-2*p.Uncertainty)
			hi = math.Max(hi, p.Gibbs+2*p.Uncertainty)
		}
	}
	if hi-lo < 1 {
		lo, hi = lo-1, hi+1
	}
	step := niceStep((hi - lo) / 6)
	lo, hi = math.Floor(lo/step)*step, math.Ceil(hi/step)*step
	x := func(t float64) float64 { return left + (t-st.From)/(st.To-st.From)*pw }
	y := func(g float64) float64 { return top + (hi-g)/(hi-lo)*ph }
	var b strings.Builder
	fmt.Fprintf(&b, `<svg xmlns="http://www.w3.org/2000/svg" width="%g" height="%g" viewBox="0 0 %g %g" font-family="sans-serif" font-size="12">`+"\n", w, h, w, h)
	fmt.Fprintf(&b, `<rect width="%g" height="%g" fill="white"/>`+"\n", w, h)
	fmt.Fprintf(&b, `<text x="%g" y="22" font-size="14">%s: ΔrG(T), gases at %g bar, %s; bands ±2σ</text>`+"\n", left, html.EscapeString(st.Formula), st.Pressure, html.EscapeString(st.HeatCapacitySummary()))
	for g := lo; g <= hi+step/2; g += step {
		fmt.Fprintf(&b, `<line x1="%.1f" y1="%.1f" x2="%.1f" y2="%.1f" stroke="#e4e4e4"/>`+"\n", left, y(g), left+pw, y(g))
		fmt.Fprintf(&b, `<text x="%.1f" y="%.1f" text-anchor="end">%g</text>`+"\n", left-6, y(g)+4, g)
	}
	tstep := niceStep((st.To - st.From) / 8)
	for t := math.Ceil(st.From/tstep) * tstep; t <= st.To+tstep/1e6; t += tstep {
		fmt.Fprintf(&b, `<line x1="%.1f" y1="%.1f" x2="%.1f" y2="%.1f" stroke="#e4e4e4"/>`+"\n", x(t), top, x(t), top+ph)
		fmt.Fprintf(&b, `<text x="%.1f" y="%.1f" text-anchor="middle">%g</text>`+"\n", x(t), top+ph+16, t)
	}
	fmt.Fprintf(&b, `<line x1="%.1f" y1="%.1f" x2="%.1f" y2="%.1f" stroke="black" stroke-width="1.2"/>`+"\n", left, y(0), left+pw, y(0))
	fmt.Fprintf(&b, `<rect x="%g" y="%g" width="%g" height="%g" fill="none" stroke="black"/>`+"\n", left, top, pw, ph)
	fmt.Fprintf(&b, `<text x="%.1f" y="%.1f" text-anchor="middle">T / K</text>`+"\n", left+pw/2, top+ph+34)
	fmt.Fprintf(&b, `<text transform="translate(18 %.1f) rotate(-90)" text-anchor="middle">ΔrG / kJ mol⁻¹</text>`+"\n", top+ph/2)
	legend := top + ph + 56
	for i, r := range st.Reactions {
		c := st.Curves[i]
		col := svgPalette[i%len(svgPalette)]
		if len(c) == 0 {
			fmt.Fprintf(&b, `<text x="%g" y="%.1f" fill="%s">%s: no curve (an entropy is missing)</text>`+"\n", left, legend, col, html.EscapeString(arrow(r.Equation)))
			legend += 16
			continue
		}
		var band, line []string
		for _, p := range c {
			band = append(band, fmt.Sprintf("%.1f,%.1f", x(p.Temperature), y(p.Gibbs+2*p.Uncertainty)))
			line = append(line, fmt.Sprintf("%.1f,%.1f", x(p.Temperature), y(p.Gibbs)))
		}
		for j := len(c) - 1; j >= 0; j-- {
			band = append(band, fmt.Sprintf("%.1f,%.1f", x(c[j].Temperature), y(c[j].Gibbs-2*c[j].Uncertainty)))
		}
		fmt.Fprintf(&b, `<polygon points="%s" fill="%s" fill-opacity="0.15" stroke="none"/>`+"\n", strings.Join(band, " "), col)
		fmt.Fprintf(&b, `<polyline points="%s" fill="none" stroke="%s" stroke-width="2"/>`+"\n", strings.Join(line, " "), col)
		label := arrow(r.Equation)
		if r.Crossing != nil && r.Crossing.Temperature >= st.From && r.Crossing.Temperature <= st.To {
			fmt.Fprintf(&b, `<circle cx="%.1f" cy="%.1f" r="4" fill="%s"/>`+"\n", x(r.Crossing.Temperature), y(0), col)
			label += " — ΔrG = 0 at " + plusMinus(r.Crossing.Temperature, r.Crossing.Uncertainty) + " K"
		}
		if r.Estimated {
			label += " (uses estimates)"
		}
		fmt.Fprintf(&b, `<line x1="%g" y1="%.1f" x2="%g" y2="%.1f" stroke="%s" stroke-width="2"/>`+"\n", left, legend-4, left+18, legend-4, col)
		fmt.Fprintf(&b, `<text x="%g" y="%.1f">%s</text>`+"\n", left+24, legend, html.EscapeString(label))
		legend += 16
	}
	b.WriteString("</svg>\n")
	return b.String()
}

func arrow(eq string) string { return strings.ReplaceAll(eq, "->", "→") }

// niceStep rounds a raw axis step up to 1, 2 or 5 × 10ⁿ.
func niceStep(raw float64) float64 {
	if !(raw > 0) {
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
