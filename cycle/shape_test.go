package cycle

import (
	"math"
	"testing"

	"enthalpath/data"
	"enthalpath/thermo/crystal"
)

// shapeTolerance: a sum scaled from its shape's canonical cell and the
// direct sum of the structure evaluate the same terms at lengths that
// differ by one rounding of each length ratio and of each scaling, in a
// different order of rounding; 1e-12 relative is our own bound, four
// orders above double rounding and four below the sums' 1e-8 accuracy.
const shapeTolerance = 1e-12

// sameSum reports the first field of got that differs from want by more
// than shapeTolerance relative, or "".
func sameSum(got, want MadelungValue) string {
	rel := func(a, b float64) bool {
		return math.Abs(a-b) <= shapeTolerance*math.Max(math.Abs(a), math.Abs(b))
	}
	switch {
	case !rel(got.A, want.A):
		return "A"
	case !rel(got.NearestDistance, want.NearestDistance):
		return "nearest distance"
	case !rel(got.EnergyKJPerMol, want.EnergyKJPerMol):
		return "energy"
	case !rel(got.Volume, want.Volume):
		return "volume"
	case got.FormulaUnits != want.FormulaUnits || len(got.SitePotentials) != len(want.SitePotentials):
		return "cell"
	}
	for i := range got.SitePotentials {
		if !rel(got.SitePotentials[i], want.SitePotentials[i]) {
			return "site potential"
		}
	}
	return ""
}

// TestShapeSumsEveryCompound: for every built-in compound with a
// structure (its measured cell from data/tables/compounds.csv), the Memo's
// sum, scaled from a canonical cell shared with the other compounds of the
// same shape, agrees with the direct Ewald sum of its own cell to
// shapeTolerance; compounds of one shape share one sum (47 rock-salt
// compounds in the tables: fewer shapes than compounds).
func TestShapeSumsEveryCompound(t *testing.T) {
	db := loadDB(t)
	memo := NewMemo()
	compounds := 0
	for _, comp := range db.Compounds() {
		if comp.Structure == "" {
			continue
		}
		c, err := Build(db, comp.Formula, Options{Memo: NewMemo()})
		if err != nil {
			continue // not a binary salt of the data's ions
		}
		st := c.Settings.Structure
		want, wantErr := sumStructure(st, c.Cation, c.Anion, DefaultAccuracy)
		got, gotErr := memo.Madelung(st, c.Cation, c.Anion, 0)
		if (wantErr == nil) != (gotErr == nil) {
			t.Errorf("%s: direct error %v, by shape %v", comp.Formula, wantErr, gotErr)
			continue
		}
		if wantErr != nil {
			continue
		}
		compounds++
		if f := sameSum(got, want); f != "" {
			t.Errorf("%s (%s %v): %s by shape differs from the direct sum: %+v against %+v", comp.Formula, st.Prototype, st.Params, f, got, want)
		}
	}
	if compounds < 50 {
		t.Fatalf("only %d compounds summed", compounds)
	}
	if len(memo.shapes) >= compounds {
		t.Errorf("%d shapes for %d compounds: no sum was shared", len(memo.shapes), compounds)
	}
	t.Logf("%d compounds, %d shapes", compounds, len(memo.shapes))
}

// TestShapeSumsEveryPrototype: every binary prototype at its default
// parameters, and at its lengths times 1.37 and times 0.61 (the same shape
// at another size, summed from the shared canonical cell), agrees with the
// direct sum to shapeTolerance; a prototype whose slots are not a cation
// and an anion fails the same way both ways.
func TestShapeSumsEveryPrototype(t *testing.T) {
	for _, p := range crystal.Prototypes() {
		memo := NewMemo()
		var cation, anion Part
		for _, s := range p.Slots {
			part := Part{Ion: data.Ion{Symbol: s.Label, Core: s.Label, Charge: int(s.Charge)}, Count: 1}
			switch s.Label {
			case "M":
				cation = part
			case "X":
				anion = part
			}
		}
		for _, factor := range []float64{1, 1.37, 0.61} {
			params := p.Defaults()
			for _, q := range p.Params {
				if q.Unit == "Å" {
					params[q.Key] *= factor
				}
			}
			st := Structure{Prototype: p.Name, Params: params}
			want, wantErr := sumStructure(st, cation, anion, DefaultAccuracy)
			got, gotErr := memo.Madelung(st, cation, anion, 0)
			if (wantErr == nil) != (gotErr == nil) || (wantErr != nil && wantErr.Error() != gotErr.Error()) {
				t.Errorf("%s ×%g: direct error %v, by shape %v", p.Name, factor, wantErr, gotErr)
				continue
			}
			if wantErr != nil {
				continue
			}
			if f := sameSum(got, want); f != "" {
				t.Errorf("%s ×%g: %s by shape differs from the direct sum: %+v against %+v", p.Name, factor, f, got, want)
			}
		}
	}
}

// TestShapeSumsOrderFree: a structure's sum does not depend on which
// structure of its shape was summed first (the batch's output may not
// depend on which worker meets a row first): bit-identical either way.
func TestShapeSumsOrderFree(t *testing.T) {
	ion := func(sym string, q int) Part { return Part{Ion: data.Ion{Symbol: sym, Core: sym, Charge: q}, Count: 1} }
	// LiF a = 4.0173 Å and NaCl a = 5.6402 Å (the tables' and the
	// prototype's cells).
	lif := Structure{Prototype: "rock-salt", Params: map[string]float64{"a": 4.0173}}
	nacl := Structure{Prototype: "rock-salt", Params: map[string]float64{"a": 5.6402}}
	alone, err := NewMemo().Madelung(nacl, ion("Na", 1), ion("Cl", -1), 0)
	if err != nil {
		t.Fatal(err)
	}
	m := NewMemo()
	if _, err := m.Madelung(lif, ion("Li", 1), ion("F", -1), 0); err != nil {
		t.Fatal(err)
	}
	after, err := m.Madelung(nacl, ion("Na", 1), ion("Cl", -1), 0)
	if err != nil {
		t.Fatal(err)
	}
	if len(m.shapes) != 1 {
		t.Errorf("%d shapes, want LiF and NaCl to share 1", len(m.shapes))
	}
	if alone.A != after.A || alone.EnergyKJPerMol != after.EnergyKJPerMol || alone.NearestDistance != after.NearestDistance || alone.Volume != after.Volume {
		t.Errorf("NaCl alone %+v, after LiF %+v", alone, after)
	}
	// Published: rock salt A = 1.747565 referred to the nearest distance
	// (Johnson and Templeton, J. Chem. Phys. 34, 2004 (1961); from memory).
	if math.Abs(after.A-1.747565) > 1e-6 {
		t.Errorf("rock salt A = %.8f, want 1.747565", after.A)
	}
}
