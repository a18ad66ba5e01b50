package cycle

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/fileio"
)

// hostileCycleFiles are cycle files of the largest size read (just under
// MaxFileSize), each built to cost the reader most in one way.
func hostileCycleFiles() map[string]string {
	head := "format = \"enthalpath-cycle\"\nversion = 1\ncompound = \"NaCl\"\n"
	var steps, deep strings.Builder
	steps.WriteString(head)
	for i := 0; steps.Len() < MaxFileSize-256; i++ {
		fmt.Fprintf(&steps, "[[step]]\nkey = \"ionization-1\"\nvalue = %d.5\nuncertainty = 1.0\nsource = \"user\"\n", i%500)
	}
	deep.WriteString(head + "[models.params]\n")
	for i := 0; deep.Len() < MaxFileSize-128; i++ {
		fmt.Fprintf(&deep, "p%d = %s%s\n", i, strings.Repeat("[", fileio.MaxTOMLNesting), strings.Repeat("]", fileio.MaxTOMLNesting))
	}
	return map[string]string{
		"many-steps":             steps.String(),
		"nesting-at-the-limit":   deep.String(),
		"nesting-past-the-limit": head + "note = " + strings.Repeat("[", MaxFileSize/2-64) + "\n",
		"one-long-note":          head + "note = \"" + strings.Repeat("a", MaxFileSize-128) + "\"\n",
	}
}

// BenchmarkHostileCycleFile: the time (ns/op) and allocation (B/op, an
// upper bound on the memory held) of opening each hostile cycle file, read
// or refused. The budget is 5 s and 500 MB.
func BenchmarkHostileCycleFile(b *testing.B) {
	db := loadDB(b)
	dir := b.TempDir()
	for name, text := range hostileCycleFiles() {
		path := filepath.Join(dir, name+FileExtension)
		if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
			b.Fatal(err)
		}
		b.Run(name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				Open(db, path)
			}
		})
	}
}
