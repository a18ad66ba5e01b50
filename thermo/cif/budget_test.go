package cif_test

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/cif"
)

// hostileCIFs are CIF files of the largest size read (just under
// cif.MaxFileSize), each built to cost the reader most in one way. The
// geometry of a cell (thermo/crystal) is not timed here: these stop at
// reading, tokenising, symmetry and the site limit.
func hostileCIFs() map[string]string {
	limit := cif.MaxFileSize - 1024
	fill := func(prefix, unit string) string {
		return prefix + strings.Repeat(unit, (limit-len(prefix))/len(unit))
	}
	var sites strings.Builder
	sites.WriteString(header + sitesCsCl)
	for i := 0; sites.Len() < limit-64; i++ {
		fmt.Fprintf(&sites, "Cs%d %.5f 0 0\n", i, float64(i%99991)/99991)
	}
	return map[string]string{
		"one-char-tokens":  fill(header+"loop_\n_x_y\n", "1 "),
		"comments":         fill(header, "#\n"),
		"one-text-field":   header + "_note\n;" + strings.Repeat("a", limit-len(header)-16) + "\n;\n",
		"sites-over-limit": sites.String(),
	}
}

// BenchmarkHostileCIF: the time (ns/op) and allocation (B/op, an upper
// bound on the memory held) of ParseFile on each hostile CIF, read or
// refused. The budget is 5 s and 500 MB.
func BenchmarkHostileCIF(b *testing.B) {
	dir := b.TempDir()
	for name, text := range hostileCIFs() {
		path := filepath.Join(dir, name+".cif")
		if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
			b.Fatal(err)
		}
		b.Run(name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				cif.ParseFile(path, cif.Options{})
			}
		})
	}
}

// TestFileSizeCap: a CIF file one byte over cif.MaxFileSize is refused
// before it is parsed, and says the limit.
func TestFileSizeCap(t *testing.T) {
	path := filepath.Join(t.TempDir(), "big.cif")
	if err := os.WriteFile(path, []byte(strings.Repeat("#", cif.MaxFileSize+1)), 0o644); err != nil {
		t.Fatal(err)
	}
	_, err := cif.ParseFile(path, cif.Options{})
	if err == nil || !strings.Contains(err.Error(), "larger than the 2 MiB") {
		t.Fatalf("err = %v, want the 2 MiB limit", err)
	}
}
