package cycle

import (
	"math"
	"strings"
	"testing"

	"enthalpath/data"
)

// TestBuiltinCalibrationStandsForTheLiveValidation: a solve over the
// built-in data reads its σ, thresholds and verdict model from the table
// (cycle/calibgen), and they are those of a live validation of the same
// data to the table's rounding (1e-6 percentage points per statistic).
// The byte-for-byte check of the table is cycle/calibgen's test; this one
// checks that what the engine rebuilds from the table reads the same.
func TestBuiltinCalibrationStandsForTheLiveValidation(t *testing.T) {
	db := loadDB(t)
	fromTable := NewMemo().Validation(db)
	if !fromTable.Builtin {
		t.Fatal("the built-in data are validated live, not read from " + data.CalibrationFile)
	}
	live := Validate(db, NewMemo())
	if fromTable.Compounds != live.Compounds {
		t.Errorf("table counts %d closing compounds, live %d", fromTable.Compounds, live.Compounds)
	}
	noExtended := func(m string) bool { return m != ModelExtended }
	for _, name := range ModelNames() {
		thT, basisT := fromTable.Thresholds(name)
		thL, basisL := live.Thresholds(name)
		if math.Abs(thT.Adequate-thL.Adequate) > 1e-3 || math.Abs(thT.Substantial-thL.Substantial) > 1e-3 || basisT != basisL {
			t.Errorf("%s thresholds: table %v (%s), live %v (%s)", name, thT, basisT, thL, basisL)
		}
		for _, fam := range ValidationFamilies() {
			sT, whyT := fromTable.Sigma(name, fam)
			sL, whyL := live.Sigma(name, fam)
			if math.Abs(sT-sL) > 1e-6 || whyT != whyL {
				t.Errorf("%s σ over %s: table %g (%s), live %g (%s)", name, fam, sT, whyT, sL, whyL)
			}
			if mT, _ := fromTable.Reference(fam, noExtended); mT != func() string { m, _ := live.Reference(fam, noExtended); return m }() {
				t.Errorf("%s: the table judges against %s, a live validation otherwise", fam, mT)
			}
		}
	}
}

// TestOverlayKeepsTheBuiltinCalibration: data with an overlay keep the
// built-in calibration and every σ and threshold says so, naming the
// overlay; tables other than the built-in ones (here without the derived
// ion values) are validated live.
func TestOverlayKeepsTheBuiltinCalibration(t *testing.T) {
	db, err := loadDB(t).WithOverlay(strings.NewReader("[[compound]]\nformula = \"NaCl\"\nformation_kj_per_mol = -420.0\n"), "mine.toml")
	if err != nil {
		t.Fatal(err)
	}
	v := NewMemo().Validation(db)
	if !v.Builtin {
		t.Fatal("an overlay on the built-in data is validated live")
	}
	_, basis := v.Thresholds(ModelExtended)
	_, why := v.Sigma(ModelEwald, FamilyOxides)
	for _, s := range []string{basis, why} {
		if !strings.Contains(s, "not on the data overlay mine.toml") {
			t.Errorf("basis %q does not say the overlay is not in the calibration", s)
		}
	}
	measured, err := data.LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	if NewMemo().Validation(measured).Builtin {
		t.Error("tables without the derived ion values read the built-in calibration, which was computed with them")
	}
}
