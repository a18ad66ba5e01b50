package crystal

import (
	"errors"
	"math"
	"strings"
	"testing"
)

// TestPrototypeComposition checks the number of sites, formula units and
// neutrality of every prototype against its formula (the site counts follow
// from the Wyckoff multiplicities in International Tables for
// Crystallography, vol. A, for each space group named in Description).
func TestPrototypeComposition(t *testing.T) {
	tests := []struct {
		name  string
		z     int            // formula units per cell
		count map[string]int // sites per slot label
	}{
		{"rock-salt", 4, map[string]int{"M": 4, "X": 4}},
		{"caesium-chloride", 1, map[string]int{"M": 1, "X": 1}},
		{"zinc-blende", 4, map[string]int{"M": 4, "X": 4}},
		{"wurtzite", 2, map[string]int{"M": 2, "X": 2}},
		{"fluorite", 4, map[string]int{"M": 4, "X": 8}},
		{"antifluorite", 4, map[string]int{"M": 8, "X": 4}},
		{"rutile", 2, map[string]int{"M": 2, "X": 4}},
		{"cadmium-chloride", 3, map[string]int{"M": 3, "X": 6}},
		{"cadmium-iodide", 1, map[string]int{"M": 1, "X": 2}},
		{"corundum", 6, map[string]int{"M": 12, "X": 18}},
		{"perovskite", 1, map[string]int{"A": 1, "B": 1, "X": 3}},
		{"spinel", 8, map[string]int{"A": 8, "B": 16, "X": 32}},
		{"nickel-arsenide", 2, map[string]int{"M": 2, "X": 2}},
	}
	if len(tests) != len(Prototypes()) {
		t.Errorf("%d prototypes, %d tested", len(Prototypes()), len(tests))
	}
	for _, tt := range tests {
		c, err := Build(tt.name, nil)
		if err != nil {
			t.Fatalf("Build(%q): %v", tt.name, err)
		}
		if err := c.Validate(); err != nil {
			t.Errorf("%s: %v", tt.name, err)
		}
		if c.FormulaUnits != tt.z {
			t.Errorf("%s: Z = %d, want %d", tt.name, c.FormulaUnits, tt.z)
		}
		got := map[string]int{}
		for _, s := range c.Sites {
			got[s.Species]++
		}
		for k, n := range tt.count {
			if got[k] != n {
				t.Errorf("%s: %d %s sites, want %d", tt.name, got[k], k, n)
			}
		}
		// No two sites may coincide (a wrong Wyckoff list often doubles one).
		if d, i, j := c.ShortestSeparation(); d < 1 {
			t.Errorf("%s: sites %d and %d only %.3g Å apart", tt.name, i, j, d)
		}
		p, _ := LookupPrototype(tt.name)
		for _, sl := range p.Slots {
			for _, s := range c.Sites {
				if s.Species == sl.Label && s.Charge != sl.Charge {
					t.Errorf("%s: site %s charge %g, slot says %g", tt.name, s.Species, s.Charge, sl.Charge)
				}
			}
		}
	}
}

// TestNearestDistance compares NearestCationAnion with the textbook
// geometry of each structure (analytic formulas, common practice, no
// source): rock salt a/2, CsCl a√3/2, zinc blende and fluorite a√3/4,
// perovskite a/2 (B–X), ideal wurtzite u·c, NiAs √(a²/3 + c²/16), rutile
// min(√2·x·a, √(2a²(½−x)² + c²/4)).
func TestNearestDistance(t *testing.T) {
	a, c, x := 4.5937, 2.9587, 0.30479
	rutile := math.Min(math.Sqrt2*x*a, math.Sqrt(2*a*a*(0.5-x)*(0.5-x)+c*c/4))
	tests := []struct {
		name   string
		params map[string]float64
		want   float64
	}{
		{"rock-salt", map[string]float64{"a": 5}, 2.5},
		{"caesium-chloride", map[string]float64{"a": 4}, 2 * math.Sqrt(3)},
		{"zinc-blende", map[string]float64{"a": 4}, math.Sqrt(3)},
		{"fluorite", map[string]float64{"a": 4}, math.Sqrt(3)},
		{"antifluorite", map[string]float64{"a": 4}, math.Sqrt(3)},
		{"perovskite", map[string]float64{"a": 4}, 2},
		{"wurtzite", map[string]float64{"a": 3, "c": 3 * math.Sqrt(8.0/3), "u": 0.375}, 0.375 * 3 * math.Sqrt(8.0/3)},
		{"nickel-arsenide", map[string]float64{"a": 3.4, "c": 5.6}, math.Sqrt(3.4*3.4/3 + 5.6*5.6/16)},
		{"rutile", nil, rutile},
	}
	for _, tt := range tests {
		cr, err := Build(tt.name, tt.params)
		if err != nil {
			t.Fatal(err)
		}
		d, i, j := cr.NearestCationAnion()
		if math.Abs(d-tt.want) > 1e-12 {
			t.Errorf("%s: d = %.12f, want %.12f", tt.name, d, tt.want)
		}
		if !(cr.Sites[i].Charge > 0 && cr.Sites[j].Charge < 0) {
			t.Errorf("%s: pair %d,%d is not cation, anion", tt.name, i, j)
		}
	}
	// Rutile's mean bond (4 equatorial + 2 apical per Ti).
	cr, _ := Build("rutile", nil)
	ap := math.Sqrt2 * x * a
	eq := math.Sqrt(2*a*a*(0.5-x)*(0.5-x) + c*c/4)
	if got, err := cr.MeanCationAnionDistance(); err != nil || math.Abs(got-(2*ap+4*eq)/6) > 1e-12 {
		t.Errorf("rutile mean distance %.12f (%v), want %.12f", got, err, (2*ap+4*eq)/6)
	}
}

// TestNearestDistanceSkewedCell: a sheared but equivalent lattice basis of
// CsCl (c → c + 3a + 2b) must give the same distance.
func TestNearestDistanceSkewedCell(t *testing.T) {
	c, _ := Build("caesium-chloride", map[string]float64{"a": 4})
	sk := c.Clone()
	sk.Lattice[2] = c.Lattice[2].Add(c.Lattice[0].Scale(3)).Add(c.Lattice[1].Scale(2))
	for k := range sk.Sites {
		r := c.Cartesian(c.Sites[k].Frac)
		sk.Sites[k].Frac = sk.Fractional(r)
	}
	d, _, _ := sk.NearestCationAnion()
	if math.Abs(d-2*math.Sqrt(3)) > 1e-12 {
		t.Errorf("skewed cell: d = %.12f, want %.12f", d, 2*math.Sqrt(3))
	}
}

func TestBuildErrors(t *testing.T) {
	tests := []struct {
		name    string
		params  map[string]float64
		mention string
	}{
		{"halite", nil, "rock-salt"}, // unknown names list the valid ones
		{"rock-salt", map[string]float64{"b": 3}, `"b"`},
		{"rock-salt", map[string]float64{"a": -1}, "positive"},
		{"rock-salt", map[string]float64{"a": math.NaN()}, "finite"},
		// The CIF reader's cap on cell lengths holds for prototypes too.
		{"rock-salt", map[string]float64{"a": 1e5}, "below 10000 Å"},
		{"wurtzite", map[string]float64{"c": 1e4}, "below 10000 Å"},
		{"wurtzite", map[string]float64{"u": 1.2}, "u"},
		{"rutile", map[string]float64{"x": 0}, "x"},
		{"corundum", map[string]float64{"z_cation": 0.7}, "z_cation"},
		// Ions 0.25 Å apart: the first M (0,0,0) and the first X (½,0,0),
		// numbered from 1 as the madelung command's site table numbers them.
		{"rock-salt", map[string]float64{"a": 0.5}, "sites 1 (M) and 5 (X) 0.25 Å apart"},
	}
	for _, tt := range tests {
		_, err := Build(tt.name, tt.params)
		if err == nil {
			t.Errorf("Build(%q, %v): no error", tt.name, tt.params)
			continue
		}
		if !strings.Contains(err.Error(), tt.mention) {
			t.Errorf("Build(%q, %v): %q does not mention %s", tt.name, tt.params, err, tt.mention)
		}
		if !errors.Is(err, ErrBadParameter) && !errors.Is(err, ErrUnknownPrototype) {
			t.Errorf("Build(%q, %v): %v is neither ErrBadParameter nor ErrUnknownPrototype", tt.name, tt.params, err)
		}
	}
}

func TestWithIons(t *testing.T) {
	c, _ := Build("fluorite", nil)
	d, err := c.WithIons(map[string]Ion{"M": {"Sr", 2}, "X": {"Cl", -1}})
	if err != nil {
		t.Fatal(err)
	}
	if d.Sites[0].Species != "Sr" || c.Sites[0].Species != "M" {
		t.Errorf("rename: got %q, original %q", d.Sites[0].Species, c.Sites[0].Species)
	}
	if _, err := c.WithIons(map[string]Ion{"M": {"Y", 3}}); !errors.Is(err, ErrNotNeutral) {
		t.Errorf("Y3+ with F−: got %v, want ErrNotNeutral", err)
	}
	if _, err := c.WithIons(map[string]Ion{"Q": {"Y", 3}}); err == nil || !strings.Contains(err.Error(), `"Q"`) {
		t.Errorf("unknown label: got %v", err)
	}
	// Perovskite A3+ B3+ (as in LaAlO3) stays neutral with O2−.
	p, _ := Build("perovskite", nil)
	if _, err := p.WithIons(map[string]Ion{"A": {"La", 3}, "B": {"Al", 3}}); err != nil {
		t.Errorf("LaAlO3 charges: %v", err)
	}
}

func TestSupercell(t *testing.T) {
	c, _ := Build("rutile", nil)
	s, err := c.Supercell(2, 1, 3)
	if err != nil {
		t.Fatal(err)
	}
	if len(s.Sites) != 6*len(c.Sites) || s.FormulaUnits != 6*c.FormulaUnits {
		t.Errorf("supercell: %d sites, Z = %d", len(s.Sites), s.FormulaUnits)
	}
	if math.Abs(s.Volume()-6*c.Volume()) > 1e-9 {
		t.Errorf("volume %g, want %g", s.Volume(), 6*c.Volume())
	}
	d1, _, _ := c.NearestCationAnion()
	d2, _, _ := s.NearestCationAnion()
	if math.Abs(d1-d2) > 1e-12 {
		t.Errorf("nearest distance changed: %g vs %g", d1, d2)
	}
	for _, n := range [][3]int{{0, 1, 1}, {1, -2, 1}, {MaxSites, 2, 1}} {
		if _, err := c.Supercell(n[0], n[1], n[2]); err == nil {
			t.Errorf("Supercell%v: no error", n)
		}
	}
}

func TestLookupPrototype(t *testing.T) {
	for _, p := range Prototypes() {
		q, err := LookupPrototype(p.Name)
		if err != nil || q.Name != p.Name {
			t.Errorf("LookupPrototype(%q): %v", p.Name, err)
		}
		if p.Description == "" || p.Example == "" || len(p.Params) == 0 || len(p.Slots) < 2 {
			t.Errorf("%s: incomplete description", p.Name)
		}
		for _, s := range p.Slots {
			if (s.Role == "cation") != (s.Charge > 0) || (s.Role != "cation" && s.Role != "anion") {
				t.Errorf("%s: slot %+v", p.Name, s)
			}
		}
	}
}
