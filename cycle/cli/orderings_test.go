package cli

import (
	"bytes"
	"encoding/json"
	"math"
	"strings"
	"testing"
	"time"

	"enthalpath/thermo/cif"
	"enthalpath/thermo/ewald"
)

func runOrderingsForTest(t *testing.T, args ...string) (code ExitCode, stdout, stderr string) {
	t.Helper()
	return runForTest(t, "orderings", args...)
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
		{[]string{"../../testdata/cif/real_NaCl_rocksalt_Fm-3m.cif", "--charges", "Na=1,Cl=-1"}, "no partly occupied"},
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

// TestOrderingsFromCIFOccupancy: a CIF file's shared site (Li⁺ and Fe³⁺
// half and half on the rock-salt cation site; invented test file) is
// ordered without --site, with the energies the prototype gets with the
// same occupants given by --site (1e-9 relative). A site's Li⁺/Fe³⁺ charge
// is 3 − 2s, s its Li/vacancy charge (1 or 0) in the same ordering, and
// every cation site sees the same potential from the anions, so the gaps
// between levels are 2² = 4 times those of the Li/vacancy case (geometry of
// the quadratic form); pymatgen's first gap there is
// −47.35847311324 − (−47.51109652717) eV (testdata/orderings_reference.json,
// python3-pymatgen 2022.11.7).
func TestOrderingsFromCIFOccupancy(t *testing.T) {
	run := func(args ...string) orderingsOutput {
		t.Helper()
		code, stdout, stderr := runOrderingsForTest(t, append(args, "--supercell", "2x2x1", "--keep", "2", "--json")...)
		if code != ExitOK {
			t.Fatalf("%v: exit %d: %s", args, code, stderr)
		}
		var out orderingsOutput
		if err := json.Unmarshal([]byte(stdout), &out); err != nil {
			t.Fatal(err)
		}
		return out
	}
	file := run("../../testdata/orderings/invented_tarnwick_LiFeO2_cation_disorder.cif")
	proto := run("rock-salt", "--site", "M=Li:+1:0.5,Fe:+3:0.5", "--site", "X=O:-2")
	for k := range proto.Orderings {
		a, b := file.Orderings[k], proto.Orderings[k]
		if math.Abs(a.EnergyEV-b.EnergyEV) > 1e-9*math.Abs(b.EnergyEV) || a.Multiplicity != b.Multiplicity {
			t.Errorf("rank %d: file %.10f eV ×%d, prototype %.10f eV ×%d", k+1, a.EnergyEV, a.Multiplicity, b.EnergyEV, b.Multiplicity)
		}
	}
	gap := file.Orderings[1].EnergyEV - file.Orderings[0].EnergyEV
	if want := 4 * (-47.35847311324 + 47.51109652717); math.Abs(gap-want) > 1e-8*618 {
		t.Errorf("first gap %.10f eV, 4× pymatgen's Li/vacancy gap %.10f eV", gap, want)
	}
}

// TestProgressWithStatus: a bar fed by a status function shows its share
// and text once it has run a second on a terminal.
func TestProgressWithStatus(t *testing.T) {
	var buf bytes.Buffer
	b := &progressBar{w: &buf, on: true, start: time.Now().Add(-2 * time.Second)}
	b.status = func() (float64, string) { return 0.25, "250 of 1e+03" }
	b.tick()
	b.finish()
	if !strings.Contains(buf.String(), " 25 %  250 of 1e+03") {
		t.Errorf("bar: %q", buf.String())
	}
}
