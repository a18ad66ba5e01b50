package cli

import (
	"encoding/csv"
	"encoding/json"
	"encoding/xml"
	"math"
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
	if j.Formula != "MgCl3" || j.TemperatureK != 298.15 || j.HeatCap != "heat capacities neglected" || len(j.Reactions) == 0 {
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

// stability CaCO3 --json on the built-in data: the decomposition to CaO and
// CO₂ with the heat capacities of NASA Glenn's polynomials (all three species
// have them) crosses zero near 898 °C = 1171 K at 1 bar CO₂ (handbook
// decomposition temperature of calcite, from memory; within 25 K), above
// ΔrH°/ΔrS° = 178.32/0.16059 = 1110 K with Cp neglected (NBS 1982 values of
// the three species, as the data hold them), and at 0.1 bar lower.
func TestStabilityCalciteJSON(t *testing.T) {
	zero := func(args ...string) float64 {
		out, errs, code := runAnalysisCmd(t, "", "stability", append([]string{"CaCO3", "--json"}, args...)...)
		if code != ExitOK {
			t.Fatalf("exit %d: %s", code, errs)
		}
		var j struct {
			Compound struct {
				Known bool `json:"in_data"`
			} `json:"compound"`
			Reactions []struct {
				Reaction string   `json:"reaction"`
				Zero     *float64 `json:"gibbs_zero_k"`
				Above    *bool    `json:"goes_above_zero_temperature"`
				HeatCap  string   `json:"heat_capacities"`
			} `json:"reactions"`
		}
		if err := json.Unmarshal([]byte(out), &j); err != nil {
			t.Fatal(err)
		}
		if !j.Compound.Known || len(j.Reactions) != 1 || j.Reactions[0].Reaction != "CaCO3 -> CaO + CO2(g)" || j.Reactions[0].Zero == nil || !*j.Reactions[0].Above ||
			!strings.Contains(j.Reactions[0].HeatCap, "NASA Glenn polynomials of CaCO3(cr), CaO(cr), CO2(g)") {
			t.Fatalf("JSON %s", out)
		}
		return *j.Reactions[0].Zero
	}
	if t1 := zero(); math.Abs(t1-1171) > 25 || t1 <= 1110 {
		t.Errorf("ΔrG = 0 at %.1f K at 1 bar, want 1171 ± 25 K and above the 1110 K of Cp neglected", t1)
	}
	if t01 := zero("--pressure", "0.1"); !(t01 < 1100) {
		t.Errorf("at 0.1 bar CO2: %.1f K, want below the 1 bar value", t01)
	}
}

// scan Ti Cl names TiCl₄ a molecular liquid with its measured ΔfH° −804.2
// and ΔfG° −737.2 kJ/mol (NBS 1982, line 7055 of the pinned copy), and the
// text says its ionic estimate is not the real compound; scan Cs F never
// calls 2 CsF₂ → CsF + CsF₃ (−317 ± 474 kJ/mol) favoured.
func TestScanNamesKnownAndUndecided(t *testing.T) {
	var ti struct {
		Compounds []struct {
			Formula  string `json:"formula"`
			Compared struct {
				Known     bool   `json:"in_data"`
				Molecular bool   `json:"molecular"`
				State     string `json:"state"`
				H         struct {
					Value float64 `json:"value"`
				} `json:"formation_kj_per_mol"`
				G struct {
					Value float64 `json:"value"`
				} `json:"gibbs_formation_298_kj_per_mol"`
			} `json:"compared"`
		} `json:"compounds"`
	}
	out := analysisJSON(t, &ti, "scan", "Ti", "Cl", "--json")
	found := false
	for _, c := range ti.Compounds {
		if c.Formula == "TiCl4" {
			found = true
			k := c.Compared
			if !k.Known || !k.Molecular || k.State != "l" || k.H.Value != -804.2 || k.G.Value != -737.2 {
				t.Errorf("TiCl4 compared as %+v", k)
			}
		}
	}
	if !found {
		t.Errorf("no TiCl4 in %s", out)
	}
	text, _, _ := runAnalysisCmd(t, "", "scan", "Ti", "Cl")
	if !strings.Contains(text, "molecular liquid") || !strings.Contains(text, "not the real compound") {
		t.Errorf("the text does not name TiCl4 a molecular liquid:\n%s", text)
	}
	var cs struct {
		Disproportionations []struct {
			Reaction string `json:"reaction"`
			Favoured bool   `json:"favoured"`
			Energies struct {
				Verdict string `json:"verdict"`
			} `json:"energies"`
		} `json:"disproportionations"`
	}
	out = analysisJSON(t, &cs, "scan", "Cs", "F", "--json")
	n := 0
	for _, d := range cs.Disproportionations {
		if d.Reaction == "2 CsF2 -> CsF + CsF3" {
			n++
			if d.Favoured || d.Energies.Verdict == "favoured" {
				t.Errorf("%s called favoured", d.Reaction)
			}
		}
	}
	if n != 1 {
		t.Errorf("2 CsF2 -> CsF + CsF3 found %d times", n)
	}
}

// stability MgO --estimate-only --json: the estimate's volume-based S°
// carries the volume line's domain verdict; MgO (calorimetric θ_D about
// 946 K, from memory) is outside θ_D ≤ 2·298.15 K.
func TestStabilityEntropyDomainJSON(t *testing.T) {
	out, errs, code := runAnalysisCmd(t, "", "stability", "MgO", "--estimate-only", "--json")
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	var j struct {
		Compound struct {
			Domain *struct {
				Judged  bool    `json:"judged"`
				Inside  bool    `json:"inside"`
				Debye   float64 `json:"debye_temperature_k"`
				Verdict string  `json:"verdict"`
			} `json:"volume_entropy_domain"`
		} `json:"compound"`
	}
	if err := json.Unmarshal([]byte(out), &j); err != nil {
		t.Fatal(err)
	}
	d := j.Compound.Domain
	if d == nil || !d.Judged || d.Inside || !(d.Debye > 596.3) || !strings.Contains(d.Verdict, "OUTSIDE") {
		t.Fatalf("MgO's estimate: domain %+v\n%s", d, out)
	}
}

// stability MgO2 --estimate-only --json reads magnesium peroxide (a real
// compound: Mg²⁺ with O₂²⁻, common knowledge) and its one decomposition
// into MgO and O₂, marked as combining the estimates' σ by the correlation
// rule (uncertainty_correlated); the keys of before are kept.
func TestStabilityPeroxideEstimateJSON(t *testing.T) {
	var j struct {
		Reactions []struct {
			Reaction   string   `json:"reaction"`
			Enthalpy   float64  `json:"enthalpy_kj_per_mol"`
			Sigma      float64  `json:"enthalpy_uncertainty_kj_per_mol"`
			Estimated  bool     `json:"uses_estimates"`
			Correlated *bool    `json:"uncertainty_correlated"`
			Gibbs      *float64 `json:"gibbs_kj_per_mol"`
		} `json:"reactions"`
		Notes []string `json:"notes"`
	}
	out := analysisJSON(t, &j, "stability", "MgO2", "--estimate-only", "--json")
	if len(j.Reactions) != 1 {
		t.Fatalf("JSON %s", out)
	}
	r := j.Reactions[0]
	if r.Reaction != "MgO2 -> MgO + ½ O2(g)" || !r.Estimated || r.Correlated == nil || !*r.Correlated || r.Gibbs == nil || !(r.Sigma > 0) {
		t.Errorf("reaction %+v", r)
	}
	if !strings.Contains(strings.Join(j.Notes, "\n"), "correlated at 0.5 between salts of the same cation") {
		t.Errorf("no note states the rule: %q", j.Notes)
	}
}

// analysisJSON runs an analysis command that must succeed and reads its
// JSON into v; it returns the output for messages.
func analysisJSON(t *testing.T, v any, name string, args ...string) string {
	t.Helper()
	out, errs, code := runAnalysisCmd(t, "", name, args...)
	if code != ExitOK {
		t.Fatalf("exit %d: %s", code, errs)
	}
	if err := json.Unmarshal([]byte(out), v); err != nil {
		t.Fatal(err)
	}
	return out
}
