package cli

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
	"enthalpath/thermo/ewald"
)

func runOrderingsForTest(t *testing.T, args ...string) (code int, stdout, stderr string) {
	t.Helper()
	var out, errb bytes.Buffer
	code = Run(Env{Stdout: &out, Stderr: &errb, Stdin: strings.NewReader("")}, "orderings", args)
	return code, out.String(), errb.String()
}

// TestOrderingsCommand: the Li/vacancy case of 16 rock-salt cation sites
// (enumerated): the lowest energy is pymatgen's (−47.51109652717 eV per
// cell, testdata/orderings_reference.json, python3-pymatgen 2022.11.7,
// 1e-8 relative), and every CIF file written reads back, with our reader,
// to a structure whose Ewald sum is the energy listed.
func TestOrderingsCommand(t *testing.T) {
	dir := t.TempDir()
	code, stdout, stderr := runOrderingsForTest(t, "rock-salt", "--supercell", "2x2x1", "--site", "M=Li:+1:0.5,vac:0.5",
		"--site", "X=O:-0.5", "--keep", "3", "--json", "--cif-dir", dir)
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, stderr)
	}
	var out orderingsOutput
	if err := json.Unmarshal([]byte(stdout), &out); err != nil {
		t.Fatal(err)
	}
	if out.Method != "enumeration" || out.Total != 12870 || len(out.Orderings) != 3 {
		t.Fatalf("method %s, total %g, %d orderings", out.Method, out.Total, len(out.Orderings))
	}
	if e := out.Orderings[0].EnergyEV; math.Abs(e+47.51109652717) > 1e-8*47.5 {
		t.Errorf("lowest %.11f eV, pymatgen −47.51109652717 eV", e)
	}
	for k, o := range out.Orderings {
		name := o.File
		c, err := cif.ParseFile(name, cif.Options{})
		if err != nil {
			t.Fatal(err)
		}
		r, err := ewald.Sum(c, ewald.Options{})
		if err != nil {
			t.Fatal(err)
		}
		if math.Abs(r.EnergyEV-o.EnergyEV) > 1e-9*math.Abs(o.EnergyEV) {
			t.Errorf("rank %d: file sums to %.10f eV, listed %.10f eV", k+1, r.EnergyEV, o.EnergyEV)
		}
	}
}

func TestOrderingsUsageErrors(t *testing.T) {
	tests := []struct {
		args    []string
		mention string
	}{
		{[]string{"rock-salt"}, "--site"},
		{[]string{"rock-salt", "--site", "M"}, "SEL="},
		{[]string{"rock-salt", "--site", "Q=Li:+1:0.5,vac:0.5"}, `"Q"`},
		{[]string{"rock-salt", "--site", "M=Li:+1:0.3,vac:0.7"}, "whole number"},
		{[]string{"rock-salt", "--site", "M=Li:+1:0.5,vac:0.4"}, "sum to"},
		{[]string{"rock-salt", "--site", "M=Li:+1:0.5,vac:0.5"}, "sum to zero"},
		{[]string{"rock-salt", "--site", "M=Li:x:0.5,vac:0.5"}, "not a number"},
		{[]string{"rock-salt", "--site", "M=Li:+1:0.5,vac:0.5", "--site", "X=O:-0.5", "--method", "guess"}, "--method"},
		{[]string{"rock-salt", "--site", "M=Li:+1:0.5,vac:0.5", "--site", "X=O:-0.5", "--keep", "0"}, "positive"},
	}
	for _, tt := range tests {
		code, _, errs := runOrderingsForTest(t, tt.args...)
		if code != ExitUsage || !strings.Contains(errs, tt.mention) {
			t.Errorf("%v: exit %d, stderr %q; want exit %d mentioning %s", tt.args, code, errs, ExitUsage, tt.mention)
		}
	}
}
