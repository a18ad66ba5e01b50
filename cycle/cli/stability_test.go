package cli

import (
	"encoding/csv"
	"encoding/json"
	"encoding/xml"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

func TestStabilityUsageErrors(t *testing.T) {
	for _, args := range [][]string{
		{},
		{"MgCl3", "MgCl2"},
		{"MgCl3", "--temperature", "0"},
		{"MgCl3", "--temperature", "-5"},
		{"MgCl3", "--pressure", "0"},
		{"MgCl3", "--from", "900", "--to", "400"},
		{"MgCl3", "--points", "1"},
		{"MgCl3", "--json", "--csv"},
		{"Qq2"},
	} {
		_, errs, code := runAnalysisCmd(t, "", "stability", args...)
		if code != ExitUsage || errs == "" {
			t.Errorf("stability %q: exit %d, stderr %q; want a usage error", args, code, errs)
		}
	}
}

// The JSON, CSV and SVG outputs agree on the reactions and curves of one run.
func TestStabilityOutputs(t *testing.T) {
	svg := filepath.Join(t.TempDir(), "curves.svg")
	out, errs, code := runAnalysisCmd(t, "", "stability", "MgCl3", "--points", "5", "--json", "--svg", svg)
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var j struct {
		Formula      string  `json:"formula"`
		TemperatureK float64 `json:"temperature_k"`
		HeatCap      string  `json:"heat_capacities"`
		Reactions    []struct {
			Reaction string   `json:"reaction"`
			Verdict  string   `json:"verdict"`
			KJ       *float64 `json:"enthalpy_kj_per_mol"`
			Curve    []struct {
				T float64 `json:"temperature_k"`
			} `json:"curve"`
		} `json:"reactions"`
	}
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatal(err)
	}
	if j.Formula != "MgCl3" || j.TemperatureK != 298.15 || j.HeatCap != "neglected" || len(j.Reactions) == 0 {
		t.Fatalf("JSON %+v", j)
	}
	seen := map[string]bool{}
	for _, r := range j.Reactions {
		seen[r.Reaction] = true
		switch r.Verdict {
		case "favoured", "disfavoured", "undecided within the data":
		default:
			t.Errorf("%s: verdict %q", r.Reaction, r.Verdict)
		}
	}
	// MgCl3 -> MgCl2 + ½ Cl2(g) is among them (loss of the non-metal).
	if !seen["MgCl3 -> MgCl2 + ½ Cl2(g)"] {
		t.Errorf("no loss of Cl2 among %v", seen)
	}
	b, err := os.ReadFile(svg)
	if err != nil {
		t.Fatal(err)
	}
	var doc struct {
		XMLName xml.Name
	}
	if err := xml.Unmarshal(b, &doc); err != nil || doc.XMLName.Local != "svg" {
		t.Errorf("SVG does not parse as svg: %v (%s)", err, doc.XMLName.Local)
	}
	if !strings.Contains(string(b), "heat capacities neglected") {
		t.Errorf("SVG does not say the heat capacities are neglected")
	}
	out, errs, code = runAnalysisCmd(t, "", "stability", "MgCl3", "--points", "5", "--csv")
	if code != ExitOK {
		t.Fatalf("csv: exit %d: %s", code, errs)
	}
	rows, err := csv.NewReader(strings.NewReader(out)).ReadAll()
	if err != nil || len(rows) < 1 || rows[0][0] != "reaction" || rows[0][2] != "temperature_k" {
		t.Fatalf("CSV %v %v", rows, err)
	}
	n := 0
	for _, r := range j.Reactions {
		n += len(r.Curve)
	}
	if len(rows)-1 != n {
		t.Errorf("CSV has %d rows, JSON %d curve points", len(rows)-1, n)
	}
}

func TestScanTemperatureFlag(t *testing.T) {
	out, errs, code := runAnalysisCmd(t, "", "scan", "Mg", "Cl", "--max-charge", "3", "--temperature", "800", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var j struct {
		T float64 `json:"temperature_k"`
	}
	if err := json.Unmarshal([]byte(out), &j); err != nil || j.T != 800 {
		t.Errorf("temperature %v, %v", j.T, err)
	}
	if _, _, code := runAnalysisCmd(t, "", "scan", "Mg", "Cl", "--pressure", "-1"); code != ExitUsage {
		t.Errorf("--pressure -1: exit %d", code)
	}
}
