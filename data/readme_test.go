package data

import (
	"flag"
	"fmt"
	"os"
	"slices"
	"strings"
	"testing"
)

var update = flag.Bool("update", false, "rewrite the generated part of data/README.md")

const (
	readmeFile  = "README.md"
	readmeBegin = "<!-- generated:begin -->"
	readmeEnd   = "<!-- generated:end -->"
)

// readmeCounts renders the rows per source and per memory flag from the
// embedded tables (Census), and the accepted pymatgen disagreements.
func readmeCounts(t *testing.T) string {
	census, err := Census()
	if err != nil {
		t.Fatal(err)
	}
	bySource := map[string]map[string]int{}
	memory := map[string][2]int{} // table → {rows marked memory, rows}
	for _, c := range census {
		memory[c.File] = [2]int{c.Memory, c.Rows}
		for key, n := range c.BySource {
			if bySource[key] == nil {
				bySource[key] = map[string]int{}
			}
			bySource[key][strings.TrimSuffix(c.File, ".csv")] += n
		}
	}
	var b strings.Builder
	b.WriteString("Rows citing each source (a compound row citing several counts under each):\n\n")
	b.WriteString("| source | rows | by table |\n| --- | ---: | --- |\n")
	for _, key := range slices.Sorted(mapKeysOf(bySource)) {
		total := 0
		var parts []string
		for _, tbl := range slices.Sorted(mapKeysOf(bySource[key])) {
			total += bySource[key][tbl]
			parts = append(parts, fmt.Sprintf("%s %d", tbl, bySource[key][tbl]))
		}
		fmt.Fprintf(&b, "| `%s` | %d | %s |\n", key, total, strings.Join(parts, ", "))
	}
	b.WriteString("\nRows marked `memory` (recalled without the document at hand):\n\n")
	b.WriteString("| table | memory rows | rows |\n| --- | ---: | ---: |\n")
	var sumM, sumR int
	for _, c := range census {
		name := c.File
		m, ok := memory[name]
		if !ok {
			continue
		}
		sumM += m[0]
		sumR += m[1]
		fmt.Fprintf(&b, "| `%s` | %d | %d |\n", name, m[0], m[1])
	}
	fmt.Fprintf(&b, "| all | %d | %d |\n", sumM, sumR)
	b.WriteString("\nAccepted disagreements with pymatgen (from the tests' allow-lists):\n\n")
	b.WriteString("| value | reason |\n| --- | --- |\n")
	for _, key := range slices.Sorted(mapKeysOf(acceptedDisagreements)) {
		fmt.Fprintf(&b, "| %s | %s |\n", key, acceptedDisagreements[key])
	}
	for _, key := range slices.Sorted(mapKeysOf(pymatgenAccepted)) {
		fmt.Fprintf(&b, "| formation %s | %s |\n", key, pymatgenAccepted[key])
	}
	b.WriteString("\nThe formation-enthalpy rows are discussed in tables/DISAGREEMENTS.md (allow-list: pymatgenAccepted in compounds_data_test.go).\n")
	return b.String()
}

func mapKeysOf[V any](m map[string]V) func(func(string) bool) {
	return func(yield func(string) bool) {
		for k := range m {
			if !yield(k) {
				return
			}
		}
	}
}

// TestReadmeCounts fails when the counts in data/README.md drift from the
// tables; -update rewrites them.
func TestReadmeCounts(t *testing.T) {
	raw, err := os.ReadFile(readmeFile)
	if err != nil {
		t.Fatal(err)
	}
	text := string(raw)
	i, j := strings.Index(text, readmeBegin), strings.Index(text, readmeEnd)
	if i < 0 || j < i {
		t.Fatalf("%s lacks the %s … %s markers", readmeFile, readmeBegin, readmeEnd)
	}
	want := readmeBegin + "\n" + readmeCounts(t) + readmeEnd
	got := text[i : j+len(readmeEnd)]
	if got == want {
		return
	}
	if *update {
		if err := os.WriteFile(readmeFile, []byte(text[:i]+want+text[j+len(readmeEnd):]), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	t.Errorf("%s: the generated counts are out of date; run: go test ./data/ -run TestReadmeCounts -update", readmeFile)
}

// The overlay example in README.md loads and does what the text says.
func TestReadmeOverlayExample(t *testing.T) {
	raw, err := os.ReadFile(readmeFile)
	if err != nil {
		t.Fatal(err)
	}
	text := string(raw)
	i := strings.Index(text, "```toml\n")
	j := strings.Index(text[i+1:], "\n```")
	if i < 0 || j < 0 {
		t.Fatal("README.md has no ```toml block")
	}
	example := text[i+len("```toml\n") : i+1+j]
	db, err := mustLoad(t).WithOverlay(strings.NewReader(example), "README example")
	if err != nil {
		t.Fatal(err)
	}
	if na, _ := db.Element("Na"); !na.Atomization.Override || na.Atomization.Source != "notebook-7" {
		t.Errorf("Na after the example: %+v", na.Atomization)
	}
	if r, err := db.Radius("Cs", 1, "VII", ""); err != nil || r.Substituted != "" || !r.Ionic.Override {
		t.Errorf("Cs+ VII after the example: %+v %v", r, err)
	}
	if c, err := db.Compound("CsAuCl4"); err != nil || !c.Formation.Override || c.Density.Source != "notebook-7" {
		t.Errorf("CsAuCl4 after the example: %+v %v", c, err)
	}
}
