package hessdiagram

import (
	"math"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo"
)

func solved(t *testing.T, formula string) *cycle.Result {
	t.Helper()
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	c, err := cycle.Build(db, formula, cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	res, err := cycle.Solve(c)
	if err != nil {
		t.Fatal(err)
	}
	return res
}

// TestLevelsCloseTheCycle: by Hess's law the path elements → ions → solid
// ends where the formation arrow ends, so a solved cycle needs no extra
// level, and each level is the running sum of the steps before it.
func TestLevelsCloseTheCycle(t *testing.T) {
	for _, f := range []string{"NaCl", "CaF2", "Al2O3", "MgO", "KBr"} {
		t.Run(f, func(t *testing.T) {
			res := solved(t, f)
			d := Build(f, res.Steps, Options{Units: thermo.KJPerMol, Limit: -1, Solved: true})
			terms := Terms(res.Steps)
			if len(d.Levels) != len(terms)+1 {
				t.Fatalf("%d levels for %d terms: the cycle did not close", len(d.Levels), len(terms))
			}
			sum := 0.0
			for i, idx := range terms {
				sum += res.Steps[idx].Contribution()
				if math.Abs(d.Levels[i+1].Energy-sum) > 1e-9 {
					t.Errorf("level %d = %v, want running sum %v", i+1, d.Levels[i+1].Energy, sum)
				}
			}
			var formation float64
			for _, s := range res.Steps {
				if s.Kind == cycle.KindFormation {
					formation = s.Contribution()
				}
			}
			// Under ΔH_L with 0 K ionization energies the 5/2·RT terms cancel
			// for a neutral salt (cycle package comment), so the path closes
			// on ΔfH° within rounding.
			if math.Abs(sum-formation) > 0.5 {
				t.Errorf("path ends at %.2f, formation is %.2f", sum, formation)
			}
			if d.Arrows[0].Tag != "formation" || d.Arrows[0].To != len(d.Levels)-1 {
				t.Errorf("the closing arrow %+v does not end on the solid", d.Arrows[0])
			}
			unknown := 0
			for _, a := range d.Arrows {
				if a.Unknown {
					unknown++
					if a.Tag != "lattice" {
						t.Errorf("unknown arrow %s, want lattice", a.Tag)
					}
				}
			}
			if unknown != 1 {
				t.Errorf("%d unknown arrows, want 1", unknown)
			}
		})
	}
}

func TestLevelNamesFollowTheSpecies(t *testing.T) {
	res := solved(t, "CaF2")
	d := Build("CaF2", res.Steps, Options{Units: thermo.KJPerMol, Limit: -1, Solved: true})
	var labels []string
	for _, l := range d.Levels {
		labels = append(labels, l.Label)
	}
	all := strings.Join(labels, " | ")
	for _, want := range []string{"Ca(s) + F₂(g)", "Ca(g) + F₂(g)", "Ca²⁺(g) + F₂(g)", "Ca²⁺(g) + 2 F(g)", "Ca²⁺(g) + 2 F⁻(g)", "CaF₂(s)"} {
		if !strings.Contains(all, want) {
			t.Errorf("no level %q in %s", want, all)
		}
	}
}

func TestLimitGrowsOneArrowAtATime(t *testing.T) {
	res := solved(t, "NaCl")
	n := len(Terms(res.Steps))
	for k := 0; k < n; k++ {
		d := Build("NaCl", res.Steps, Options{Units: thermo.KJPerMol, Limit: k})
		if len(d.Arrows) != k || len(d.Levels) != k+1 {
			t.Errorf("limit %d: %d arrows, %d levels", k, len(d.Arrows), len(d.Levels))
		}
	}
}

func TestUnitsScaleTheLevels(t *testing.T) {
	res := solved(t, "NaCl")
	kj := Build("NaCl", res.Steps, Options{Units: thermo.KJPerMol, Limit: -1, Solved: true})
	ev := Build("NaCl", res.Steps, Options{Units: thermo.EVPerFormulaUnit, Limit: -1, Solved: true})
	for i := range kj.Levels {
		// 1 eV per formula unit = 96.485 kJ/mol (CODATA 2018 via thermo).
		if math.Abs(ev.Levels[i].Energy*thermo.KJPerMolPerEV-kj.Levels[i].Energy) > 1e-9 {
			t.Errorf("level %d: %v eV vs %v kJ/mol", i, ev.Levels[i].Energy, kj.Levels[i].Energy)
		}
	}
	if ev.Unit != "eV" {
		t.Errorf("unit %q", ev.Unit)
	}
}

// TestClosesUnderU: with the lattice step in U, ForCycle draws the lattice
// arrow as ΔH_L (U plus Jenkins' correction, +RT for NaCl: J. Chem. Educ.
// 82, 950 (2005)), so the path ends on the formation level by Hess's law
// and no extra level is needed; the title names both values (NaCl:
// ΔH_L ≈ −787 kJ/mol, U ≈ −790, textbook values, from memory).
func TestClosesUnderU(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	c, err := cycle.Build(db, "NaCl", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	conv := c.Conventions
	conv.Lattice = cycle.LatticeEnergy
	c.SetConventions(conv)
	res, err := cycle.Solve(c)
	if err != nil {
		t.Fatal(err)
	}
	d := Build("NaCl", res.Steps, ForCycle(c, Options{Units: thermo.KJPerMol, Limit: -1, Solved: true}))
	if n := len(Terms(res.Steps)); len(d.Levels) != n+1 {
		t.Errorf("%d levels for %d terms: the drawing under U does not close", len(d.Levels), n)
	}
	if !strings.Contains(d.Title, "ΔH_L −787") || !strings.Contains(d.Title, "U −790") {
		t.Errorf("title %q does not name ΔH_L and U", d.Title)
	}
}

// TestOverDeterminedDrawsTheMiss: the solved lattice step given a value of
// its own (−780 kJ/mol for NaCl, where Hess's law gives about −787) leaves
// no unknown. The drawing then shows the solid once (it showed a second
// level "NaCl(s) (from ΔfH°)"), and the miss as an arrow between the
// path's end and it, worded with the closure residual of cycle.Residual.
func TestOverDeterminedDrawsTheMiss(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	c, err := cycle.Build(db, "NaCl", cycle.Options{})
	if err != nil {
		t.Fatal(err)
	}
	if err := c.Set("lattice", -780, 8); err != nil {
		t.Fatal(err)
	}
	d := Build("NaCl", c.Steps, Options{Units: thermo.KJPerMol, Limit: -1})
	solids, misses := 0, 0
	for _, l := range d.Levels {
		if strings.Contains(l.Label, "NaCl(s)") {
			solids++
		}
	}
	r, _ := cycle.Residual(c)
	for _, a := range d.Arrows {
		if a.Miss {
			misses++
			if want := "miss " + signed(r, thermo.KJPerMol); a.Value != want {
				t.Errorf("the miss reads %q, want %q", a.Value, want)
			}
			if e := d.Levels[a.To].Energy - d.Levels[a.From].Energy; math.Abs(e-r) > 1e-9 {
				t.Errorf("the miss spans %.3f kJ/mol, the residual is %.3f", e, r)
			}
		}
	}
	if solids != 1 || misses != 1 {
		t.Errorf("%d levels of the solid and %d misses, want one of each: %+v", solids, misses, d.Levels)
	}
}
