package cycle

import (
	"reflect"
	"testing"
)

// DefaultModel evaluates only the models its choice needs; its choice, why
// and value must be those of ReferenceModel over every model evaluated
// (EvaluateModels), for every built-in compound and for formulas the data
// do not tabulate (the invented screening list of the batch benchmark,
// demo data), with and without the validation.
func TestDefaultModelAsReferenceOverAll(t *testing.T) {
	db := loadDB(t)
	var formulas []string
	for _, comp := range db.Compounds() {
		formulas = append(formulas, comp.Formula)
	}
	formulas = append(formulas, "LiS", "ScI3", "CuO", "ZnF2", "AlBr3", "FeS", "CoO", "NiI2", "CsO", "BaS")
	checked := 0
	for _, f := range formulas {
		c, err := Build(db, f, Options{})
		if err != nil {
			continue
		}
		for _, withValidation := range []bool{true, false} {
			d := c.Clone()
			if !withValidation {
				d.db = nil
			}
			ms := EvaluateModels(d)
			wantName, wantWhy := ReferenceModel(d, ms)
			got, why, err := DefaultModel(d)
			if wantName == "" {
				if err == nil {
					t.Errorf("%s: DefaultModel gave %s where no model evaluates", f, got.Model)
				}
				continue
			}
			if err != nil {
				t.Errorf("%s: DefaultModel: %v, want %s", f, err, wantName)
				continue
			}
			want := *findModel(ms, wantName)
			// Gaps are NaN here (no cycle value), which DeepEqual never equates.
			got.Gap, got.GapPercent, want.Gap, want.GapPercent = 0, 0, 0, 0
			if got.Model != wantName || why != wantWhy || !reflect.DeepEqual(got, want) {
				t.Errorf("%s (validation %v): DefaultModel %s %g ± %g (%q), over all %s %g ± %g (%q)",
					f, withValidation, got.Model, got.Value, got.Uncertainty, why, want.Model, want.Value, want.Uncertainty, wantWhy)
			}
			checked++
		}
	}
	if checked < 100 {
		t.Fatalf("only %d cycles checked", checked)
	}
}
