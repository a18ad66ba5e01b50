package plot

import (
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
