package cycle_test

import (
	"bytes"
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// maxFileLines is the length past which a Go file must say at its top why
// it is not split (issue 13: "no file over ~600 lines without a reason
// stated at its top"; the number is the project's choice, no source).
const maxFileLines = 600

// longFileReason is the phrase a long file's first comment carries with
// its reason, e.g. "// Over 600 lines: one table of cases read top to bottom."
const longFileReason = "Over 600 lines:"

// generated is the line that marks a generated Go file ("go help generate").
var generated = regexp.MustCompile(`(?m)^// Code generated .* DO NOT EDIT\.$`)

func TestNoLongFileWithoutReason(t *testing.T) {
	root, err := filepath.Abs("..")
	if err != nil {
		t.Fatal(err)
	}
	err = filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() {
			if path != root && (strings.HasPrefix(d.Name(), ".") || d.Name() == "testdata") {
				return filepath.SkipDir
			}
			return nil
		}
		if !strings.HasSuffix(path, ".go") {
			return nil
		}
		text, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		lines := bytes.Count(text, []byte("\n"))
		if lines <= maxFileLines {
			return nil
		}
		rel, _ := filepath.Rel(root, path)
		rel = filepath.ToSlash(rel)
		head := string(text[:min(len(text), 2000)])
		switch {
		case generated.MatchString(head):
			// A generated file (the Go convention, "go help generate") is
			// as long as what it holds.
		case strings.Contains(head, longFileReason):
		default:
			t.Errorf("%s: %d lines, over %d without a reason at its top (%q): split it by concern", rel, lines, maxFileLines, longFileReason)
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
}
