package screen

import (
	"io/fs"
	"os"
	"path/filepath"
	"regexp"
	"strings"
	"testing"
)

// TestOneTruncation reads the workshop's source (tui/, tests aside) and
// fails on a cut made anywhere but here (Truncate, TruncateStart): a call
// of ansi's truncation or a local trunc function. Copies of it counted
// runes, not display cells, and drifted.
func TestOneTruncation(t *testing.T) {
	copyRe := regexp.MustCompile(`ansi\.Truncate|func trunc`)
	read := 0
	err := filepath.WalkDir("..", func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && (d.Name() == "testdata" || filepath.Base(path) == "screen") {
			return filepath.SkipDir
		}
		if d.IsDir() || !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
			return nil
		}
		b, err := os.ReadFile(path)
		if err != nil {
			return err
		}
		read++
		for i, line := range strings.Split(string(b), "\n") {
			if copyRe.MatchString(line) {
				t.Errorf("%s:%d: a cut of its own (%s): use screen.Truncate", path, i+1, strings.TrimSpace(line))
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if read < 30 {
		t.Fatalf("read only %d files of the workshop", read)
	}
}
