package main

import (
	"bytes"
	"fmt"
	"os"
	"testing"

	"enthalpath/cycle"
	"enthalpath/data"
)

// TestTableEqualsLiveValidation: the committed calibration is what a live
// validation of the built-in data writes, byte for byte, both the file in
// the tree and the copy embedded in the program, so that the σ and the
// thresholds a verdict reads cannot drift from the data (the check
// against the outside world is the validation's: every gap is a cycle of
// cited values against a published model).
func TestTableEqualsLiveValidation(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	live := cycle.CalibrationText(cycle.Validate(db, cycle.NewMemo()))
	onDisk, err := os.ReadFile("../../data/tables/" + data.CalibrationFile)
	if err != nil {
		t.Fatal(err)
	}
	cal, err := data.ModelCalibration()
	if err != nil {
		t.Fatal(err)
	}
	for name, got := range map[string][]byte{"the file": onDisk, "the embedded table": cal.Text} {
		if !bytes.Equal(got, live) {
			t.Errorf("%s differs from a live validation: run go run ./cycle/calibgen\n%s", name, firstDifference(got, live))
		}
	}
}

// firstDifference quotes the first line where two texts differ.
func firstDifference(a, b []byte) string {
	al, bl := bytes.Split(a, []byte("\n")), bytes.Split(b, []byte("\n"))
	for i := range max(len(al), len(bl)) {
		var x, y []byte
		if i < len(al) {
			x = al[i]
		}
		if i < len(bl) {
			y = bl[i]
		}
		if !bytes.Equal(x, y) {
			return fmt.Sprintf("line %d:\n  table: %s\n  live:  %s", i+1, x, y)
		}
	}
	return "(same lines)"
}
