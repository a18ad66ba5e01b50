package cli

import (
	"fmt"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
)

// TestEngineErrorsWordedForTheCommandLine: the engine's errors name no
// flag (cycle's TestEngineSpeaksNoFrontEnd); the command line adds its
// own from their fields, also when the error is wrapped.
func TestEngineErrorsWordedForTheCommandLine(t *testing.T) {
	for _, tc := range []struct {
		err  error
		want string
	}{
		{&cycle.MissingError{Key: "attachment-1", What: "first electron affinity of Xe"}, "--set attachment-1=VALUE, or --solve attachment-1"},
		{&cycle.UnknownsError{}, "--solve lattice"},
		{&cycle.UnknownsError{Keys: []string{"lattice", "formation"}}, "--set KEY=VALUE"},
		{&cycle.ModelError{Model: cycle.ModelBornLande, Reason: "no Pauling Born exponent", Remedy: cycle.RemedyBornExponent}, "--born-n N"},
		{&cycle.ModelError{Model: cycle.ModelEwald, Reason: "no structure", Remedy: cycle.RemedyStructure}, "--structure"},
		{&analysis.InputError{Subject: "Mg", Field: analysis.FieldMaxCharge, Reason: "too high"}, "--max-charge Mg: too high"},
		{&analysis.InputError{Subject: "NaCl", Field: analysis.FieldStepValue, Key: "dissolution", Reason: "no value"}, "--set dissolution NaCl: no value"},
		{fmt.Errorf("NaCl: %w", &analysis.InputError{Subject: "NaCl", Field: analysis.FieldUnknownStep, Key: "heat", Reason: "no term"}), "NaCl: --solve heat NaCl: no term"},
	} {
		if got := commandLineText(tc.err); !strings.Contains(got, tc.want) {
			t.Errorf("%v → %q, want it to contain %q", tc.err, got, tc.want)
		}
	}
	// End to end: a scan beyond the data's ionization energies names the flag.
	_, errs, code := run(t, "scan", "Mg", "Cl", "--max-charge", "9")
	if code != ExitUsage && code != ExitInternal || !strings.Contains(errs, "--max-charge") {
		t.Errorf("scan --max-charge 9: exit %d, %q; want the flag named", code, errs)
	}
}
