package plot

import (
	"math"
	"regexp"
	"strconv"
	"strings"
	"testing"
	"unicode/utf8"
)

func TestScatterPlacesPointsAndFits(t *testing.T) {
	s := Scatter{
		Points:   []Point{{-1000, -1000, 0}, {-700, -650, 1}, {-900, -860, 0}},
		Groups:   []string{"alkali halide", "silver halide"},
		XLabel:   "cycle",
		Diagonal: true,
	}
	out := s.Render(60, 16, Styles{})
	lines := strings.Split(out, "\n")
	if len(lines) != 16 {
		t.Fatalf("%d lines, want 16:\n%s", len(lines), out)
	}
	for i, l := range lines {
		if n := utf8.RuneCountInString(l); n > 60 {
			t.Errorf("line %d is %d cells: %q", i, n, l)
		}
	}
	if !strings.Contains(out, "o alkali halide") || !strings.Contains(out, "x silver halide") {
		t.Errorf("legend missing:\n%s", out)
	}
	if strings.Count(out, "o") < 3 { // two points + legend
		t.Errorf("points missing:\n%s", out)
	}
}

func TestScatterOrder(t *testing.T) {
	// A point with the larger y must be drawn on an earlier (higher) row.
	s := Scatter{Points: []Point{{0, 0, 0}, {1, 10, 1}}, Groups: []string{"a", "b"}}
	lines := strings.Split(s.Render(40, 12, Styles{}), "\n")
	rowOf := func(g rune) int {
		for i, l := range lines[:len(lines)-3] {
			if strings.ContainsRune(l[yAxisWidth:], g) {
				return i
			}
		}
		return -1
	}
	if ro, rx := rowOf('o'), rowOf('x'); !(rx >= 0 && ro > rx) {
		t.Errorf("rows o=%d x=%d, want x above o:\n%s", ro, rx, strings.Join(lines, "\n"))
	}
}

func TestStripOneRowPerGroup(t *testing.T) {
	s := Strip{Groups: []string{"alkali halide", "copper halide"}, Values: [][]float64{{1, 2, 3}, {10, 12}}, XLabel: "gap %", Zero: true}
	out := s.Render(70, 8, Styles{})
	lines := strings.Split(out, "\n")
	if len(lines) != 8 {
		t.Fatalf("%d lines, want 8", len(lines))
	}
	if !strings.HasPrefix(lines[0], "alkali halide") || !strings.Contains(lines[0], "o") {
		t.Errorf("row 0 = %q", lines[0])
	}
	if !strings.HasPrefix(lines[1], "copper halide") || !strings.Contains(lines[1], "x") {
		t.Errorf("row 1 = %q", lines[1])
	}
	// Copper values are larger, so their glyphs are further right.
	if strings.IndexRune(lines[1], 'x') <= strings.LastIndex(lines[0], "o") {
		t.Errorf("copper glyphs not right of alkali glyphs:\n%s", out)
	}
}

// Zero keeps y = 0 in range though every point is positive, and draws it
// on the row between the points' rows and the bottom.
func TestScatterZeroLine(t *testing.T) {
	s := Scatter{Points: []Point{{300, 130, 0}, {1500, 60, 0}}, Groups: []string{"a"}, Zero: true}
	lines := strings.Split(s.Render(50, 14, Styles{}), "\n")
	zero, point := -1, -1
	for i, l := range lines {
		body := []rune(l)
		if len(body) <= yAxisWidth {
			continue
		}
		rest := string(body[yAxisWidth:])
		if strings.Count(rest, "-") > 30 && zero < 0 {
			zero = i
		}
		if strings.ContainsRune(rest, 'o') && point < 0 && !strings.Contains(l, "o a") {
			point = i
		}
	}
	if zero < 0 || point < 0 || zero <= point {
		t.Errorf("zero line at row %d, first point at row %d:\n%s", zero, point, strings.Join(lines, "\n"))
	}
	if s.Zero = false; strings.Count(s.Render(50, 14, Styles{}), "-") > 10 {
		t.Errorf("a zero line drawn without Zero")
	}
}

// TestScatterTicksAreRound: the axis ends and every tick are whole steps of
// 1, 2 or 5 × 10ⁿ (they read −3758 and −7524), the axes reach every point,
// and a log scale labels the 1, 2, 5 marks of each decade with the values'
// sign (common practice for chart axes, no source).
func TestScatterTicksAreRound(t *testing.T) {
	pts := []Point{{X: -3758, Y: -3600}, {X: -7524, Y: -7300}, {X: -690, Y: -700}, {X: -15100, Y: -14800}}
	round := regexp.MustCompile(`^(0|−?[1-9][0-9]?0*)$`) // at most two significant figures
	for _, log := range []bool{false, true} {
		out := Scatter{Points: pts, Diagonal: true, XLabel: "x", Log: log}.Render(80, 20, Styles{})
		lines := strings.Split(out, "\n")
		ticks := 0
		for _, l := range lines {
			if label := strings.TrimSpace(strings.SplitN(l, "┤", 2)[0]); strings.Contains(l, "┤") {
				if !round.MatchString(label) {
					t.Errorf("log=%v: tick %q is not a round number:\n%s", log, label, out)
				}
				ticks++
			}
		}
		if ticks < 2 {
			t.Errorf("log=%v: %d ticks:\n%s", log, ticks, out)
		}
		var xl string
		for _, l := range lines {
			if strings.Contains(l, " x") {
				xl = l
			}
		}
		f := strings.Fields(strings.ReplaceAll(xl, "−", "-"))
		lo, _ := strconv.ParseFloat(f[0], 64)
		hi, _ := strconv.ParseFloat(f[len(f)-1], 64)
		small, big := math.Min(math.Abs(lo), math.Abs(hi)), math.Max(math.Abs(lo), math.Abs(hi))
		if small > 690 || big < 15100 || !round.MatchString(strings.ReplaceAll(f[0], "-", "−")) {
			t.Errorf("log=%v: x axis %v … %v does not reach the points or is not round: %q", log, lo, hi, xl)
		}
	}
}
