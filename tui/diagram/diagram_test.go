package diagram

import (
	"bytes"
	"encoding/xml"
	"io"
	"strings"
	"testing"
	"unicode/utf8"
)

// sampleNaCl is a Born–Haber cycle of NaCl with round numbers in kJ/mol:
// sublimation of Na +107, ionization of Na +496, ½ dissociation of Cl2 +121,
// attachment to Cl −349, formation −411 and the lattice step closing it,
// −786 (values as usually quoted in textbooks, from memory; they only need
// to be self-consistent for a drawing test).
func sampleNaCl() Diagram {
	return Diagram{
		Title: "NaCl", Unit: "kJ/mol",
		Levels: []Level{
			{"Na(s) + ½Cl₂(g)", 0},
			{"Na(g) + ½Cl₂(g)", 107},
			{"Na⁺(g) + ½Cl₂(g)", 603},
			{"Na⁺(g) + Cl(g)", 724},
			{"Na⁺(g) + Cl⁻(g)", 375},
			{"NaCl(s)", -411},
		},
		Arrows: []Arrow{
			{0, 1, "sub", "+107", false, false, "", "", false},
			{1, 2, "IE1", "+496", false, false, "", "", false},
			{2, 3, "diss", "+121", false, false, "", "", false},
			{3, 4, "att", "−349", false, false, "", "", false},
			{4, 5, "lattice", "−786", true, false, "", "", false},
			{0, 5, "formation", "−411", false, false, "", "", false},
		},
	}
}

func TestLayoutIsToScale(t *testing.T) {
	d := sampleNaCl()
	const h = 23
	geo := d.Layout(80, h)
	// The highest level is on the top row and the lowest on the bottom row.
	if geo.Rows[3] != 0 || geo.Rows[5] != h-1 {
		t.Fatalf("rows %v: want level 3 on row 0 and level 5 on row %d", geo.Rows, h-1)
	}
	// Row distance is proportional to energy difference within one row of
	// rounding: rows per kJ/mol = (h-1)/(724-(-411)).
	scale := float64(h-1) / (724 + 411)
	for i, l := range d.Levels {
		want := (724 - l.Energy) * scale
		if diff := float64(geo.Rows[i]) - want; diff > 0.5001 || diff < -0.5001 {
			t.Errorf("level %d (%s): row %d, want %.2f within rounding", i, l.Label, geo.Rows[i], want)
		}
	}
	// Arrow columns increase left to right and leave room for labels.
	for i := 1; i < len(geo.Columns); i++ {
		if geo.Columns[i]-geo.Columns[i-1] < minSpacing {
			t.Errorf("columns %v closer than %d", geo.Columns, minSpacing)
		}
	}
}

func TestRenderFitsAndMarksUnknown(t *testing.T) {
	d := sampleNaCl()
	for _, size := range [][2]int{{80, 18}, {120, 30}, {60, 12}} {
		out := d.Render(size[0], size[1], Styles{})
		lines := strings.Split(out, "\n")
		if len(lines) != size[1] {
			t.Errorf("%v: %d lines, want %d", size, len(lines), size[1])
		}
		for i, l := range lines {
			if n := utf8.RuneCountInString(l); n > size[0] {
				t.Errorf("%v: line %d is %d cells wide: %q", size, i, n, l)
			}
		}
		if !strings.Contains(out, "∴−786") {
			t.Errorf("%v: unknown step lacks its textual marker:\n%s", size, out)
		}
		if !strings.Contains(out, "▲") || !strings.Contains(out, "▼") {
			t.Errorf("%v: want both up and down arrow heads:\n%s", size, out)
		}
	}
	// Without room, it says so instead of drawing garbage.
	if out := d.Render(12, 3, Styles{}); !strings.Contains(out, "small") {
		t.Errorf("tiny render = %q", out)
	}
}

func TestSVGIsWellFormedAndLabelled(t *testing.T) {
	d := sampleNaCl()
	d.Levels[0].Label = `elements <standard> & "states"` // must be escaped
	var b bytes.Buffer
	if err := d.WriteSVG(&b); err != nil {
		t.Fatal(err)
	}
	dec := xml.NewDecoder(bytes.NewReader(b.Bytes()))
	var texts []string
	root := ""
	for {
		tok, err := dec.Token()
		if err == io.EOF {
			break
		}
		if err != nil {
			t.Fatalf("SVG is not well-formed: %v\n%s", err, b.String())
		}
		switch v := tok.(type) {
		case xml.StartElement:
			if root == "" {
				root = v.Name.Local
			}
		case xml.CharData:
			texts = append(texts, string(v))
		}
	}
	if root != "svg" {
		t.Fatalf("root element %q, want svg", root)
	}
	all := strings.Join(texts, " ")
	for _, want := range []string{"NaCl", "kJ/mol", "Na⁺(g) + Cl⁻(g)", "+496", "∴ −786 (solved)", `elements <standard> & "states"`} {
		if !strings.Contains(all, want) {
			t.Errorf("SVG text lacks %q", want)
		}
	}
}

func TestNiceStep(t *testing.T) {
	// Expected values by the 1-2-5 rule (common practice, no source).
	for _, c := range []struct{ raw, want float64 }{{0.3, 0.5}, {1, 1}, {1.2, 2}, {37, 50}, {180, 200}, {501, 1000}} {
		if got := niceStep(c.raw); got < c.want*0.999999 || got > c.want*1.000001 {
			t.Errorf("niceStep(%g) = %g, want %g", c.raw, got, c.want)
		}
	}
}

func TestWideTickLabelsAreWhole(t *testing.T) {
	d := Diagram{Levels: []Level{{"a", 0}, {"b", 12000}, {"c", -1700}},
		Arrows: []Arrow{{0, 1, "up", "+12000", false, false, "", "", false}, {1, 2, "down", "−13700", true, false, "", "", false}}}
	out := d.Render(80, 20, Styles{})
	if !strings.Contains(out, "+10000 ┤") {
		t.Errorf("tick +10000 cut:\n%s", out)
	}
}
