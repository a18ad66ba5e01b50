package cycle

import "testing"

// The ion choice for a formula the tables do not hold, checked against the
// tables' own assignments of the real compounds: each ionic crystal whose
// formula is two elements (MgO, KO₂, BaO₂, NaN₃, Cs₂O …) is read again by
// pickIons from its formula alone, as if untabulated, and must come out as
// the ions its row names. Those rows follow the NBS tables' names
// ("barium peroxide", "potassium superoxide", "sodium azide"; NBS 1982,
// pinned copy in data/sources/nbs-tables-1982). The ion table holds each
// real compound's own ions, and the crystals that rank the readings
// include the compound itself, so this checks the ranking between
// readings (the plain one, the group anion, a charge the data lack), not
// the finding of an ion the data miss.
//
// Known misreadings, each with its reason; one that comes right fails the
// test until it is taken off the list:
var knownMisreadings = map[string]string{
	// Hg⁺ is in the data (the gaseous HgF, HgCl, HgI rows) and a group
	// cation (Hg₂²⁺) is not among an element's readings.
	"Hg2Cl2": "Hg+ Cl-",
	"Hg2Br2": "Hg+ Br-",
	"Hg2I2":  "Hg+ I-",
}

func TestPickIonsReadsRealCompoundsAsTheTablesDo(t *testing.T) {
	db := loadDB(t)
	var n, groups int
	for _, comp := range db.Compounds() {
		if comp.Molecular || comp.State != "cr" {
			continue
		}
		fm, parts, err := parseParts(comp.Formula)
		if err != nil || len(fm) != 2 || len(parts) != 2 || parts[0].bracketed || parts[1].bracketed {
			continue
		}
		cat, an, err := pickIons(db, comp.Formula, parts[0], parts[1], Options{})
		if err != nil {
			t.Errorf("%s (%s): %v", comp.Formula, comp.Name, err)
			continue
		}
		n++
		if an.Polyatomic {
			groups++
		}
		if want, ok := knownMisreadings[comp.Formula]; ok {
			if got := cat.Symbol + " " + an.Symbol; got != want {
				t.Errorf("%s: read as %s, no longer the listed misreading %s: take it off the list", comp.Formula, got, want)
			}
			continue
		}
		if cat.Symbol != comp.Cation || an.Symbol != comp.Anion {
			t.Errorf("%s (%s): read as %s with %s, the tables' row has %s with %s", comp.Formula, comp.Name, cat.Symbol, an.Symbol, comp.Cation, comp.Anion)
		}
	}
	t.Logf("%d binary ionic crystals, %d of them with a group anion", n, groups)
	if n < 100 || groups < 5 {
		t.Errorf("only %d binary crystals (%d with a group anion) checked", n, groups)
	}
}
