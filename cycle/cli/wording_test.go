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

// TestMissingDatumSaysWhatSuppliesIt: compare's reason column words a
// missing datum with what the user can supply: the flags, the data-file
// table that holds it, and for an ion's gas-phase enthalpy the command that
// derives one (the engine's MissingError names none of them).
func TestMissingDatumSaysWhatSuppliesIt(t *testing.T) {
	for _, tc := range []struct {
		err  *cycle.MissingError
		want []string
	}{
		{&cycle.MissingError{Key: "ion-formation-anion", What: "standard enthalpy of formation of gaseous MoO4^2-", Kind: cycle.KindIonFormation, Ion: "MoO4^2-"},
			[]string{"--set ion-formation-anion=VALUE", "--data FILE", `[[derived_ion]] ion = "MoO4^2-"`, "enthalpath ionfit 'MoO4^2-'"}},
		{&cycle.MissingError{Key: "attachment-2-3", What: "electron attachment enthalpy of As to As3-", Kind: cycle.KindAttachment, Ion: "As3-"},
			[]string{"--solve attachment-2-3", "[[derived_ion]]", "ionfit 'As3-'"}},
		{&cycle.MissingError{Key: "attachment-1", What: "first electron affinity of Xe", Kind: cycle.KindAttachment, Ion: "Xe-"},
			[]string{"--set attachment-1=VALUE", "[[affinity]]"}},
		{&cycle.MissingError{Key: "formation", What: "standard enthalpy of formation of XY", Kind: cycle.KindFormation},
			[]string{"--solve formation", "[[compound]]"}},
	} {
		status, reason := compareStatus(fmt.Errorf("row: %w", tc.err))
		if status != "missing-datum" {
			t.Errorf("%v: status %q", tc.err, status)
		}
		for _, w := range tc.want {
			if !strings.Contains(reason, w) {
				t.Errorf("%v: reason %q lacks %q", tc.err, reason, w)
			}
		}
	}
}
