package data

import (
	"fmt"
	"os"
	"path/filepath"
	"strings"
	"testing"

	"enthalpath/thermo/fileio"
)

// hostileOverlays are user data files of the largest size read (just under
// MaxOverlaySize), each built to cost the reader most in one way.
func hostileOverlays() map[string]string {
	fill := func(unit string) string {
		return strings.Repeat(unit, (MaxOverlaySize-64)/len(unit))
	}
	var deep strings.Builder
	for i := 0; deep.Len() < MaxOverlaySize-128; i++ {
		fmt.Fprintf(&deep, "a%d = %s%s\n", i, strings.Repeat("[", fileio.MaxTOMLNesting), strings.Repeat("]", fileio.MaxTOMLNesting))
	}
	var rows strings.Builder
	for i := 0; rows.Len() < MaxOverlaySize-256; i++ {
		fmt.Fprintf(&rows, "[[source]]\nkey = \"s%d\"\ncitation = \"Invented test entry %d\"\n", i, i)
	}
	return map[string]string{
		"nesting-at-the-limit":   deep.String(),
		"nesting-past-the-limit": "a = " + strings.Repeat("[", MaxOverlaySize/2-8) + "\n",
		"one-long-string":        "x = \"" + strings.Repeat("a", MaxOverlaySize-16) + "\"\n",
		"many-valid-rows":        rows.String(),
		"many-short-keys":        "[[compound]]\n" + fill("k=1\n"),
	}
}

// BenchmarkHostileOverlay: the time (ns/op) and allocation (B/op, an upper
// bound on the memory held) of loading the data with each hostile overlay,
// read or refused. The budget is 5 s and 500 MB.
func BenchmarkHostileOverlay(b *testing.B) {
	dir := b.TempDir()
	for name, text := range hostileOverlays() {
		path := filepath.Join(dir, name+".toml")
		if err := os.WriteFile(path, []byte(text), 0o644); err != nil {
			b.Fatal(err)
		}
		b.Run(name, func(b *testing.B) {
			b.ReportAllocs()
			for b.Loop() {
				LoadWithUserFile(path)
			}
		})
	}
}
