package cycle_test

import (
	"go/ast"
	"go/parser"
	"go/token"
	"io/fs"
	"path/filepath"
	"regexp"
	"strconv"
	"strings"
	"testing"
)

// flagOrScreen matches what only a front end may say: a command-line flag
// ("--set", "--born-n") or a screen of the workshop ("the Models screen",
// "press e").
var flagOrScreen = regexp.MustCompile(`(?i)(^|[^-\w])--[a-z]|\bscreen\b|\bworkshop\b|\bpress [a-z0-9]\b`)

// TestEngineSpeaksNoFrontEnd: no string literal of the engine (cycle and
// cycle/analysis, their tests and generator commands aside) names a flag
// or a screen. The engine's errors carry fields (a step key, a setting, a
// bound, a remedy); cycle/cli words them for the command line and
// tui/session for the workshop.
func TestEngineSpeaksNoFrontEnd(t *testing.T) {
	fset := token.NewFileSet()
	n := 0
	err := filepath.WalkDir(".", func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() && (path == "cli" || path == "testdata" || strings.HasSuffix(path, "derivegen")) {
			return filepath.SkipDir
		}
		if d.IsDir() || !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
			return nil
		}
		f, err := parser.ParseFile(fset, path, nil, parser.SkipObjectResolution)
		if err != nil {
			return err
		}
		n++
		ast.Inspect(f, func(node ast.Node) bool {
			lit, ok := node.(*ast.BasicLit)
			if !ok || lit.Kind != token.STRING {
				return true
			}
			s, err := strconv.Unquote(lit.Value)
			if err != nil {
				s = lit.Value
			}
			if flagOrScreen.MatchString(s) {
				t.Errorf("%s: %q names a flag or a screen; give the error a field and let the front ends word it", fset.Position(lit.Pos()), s)
			}
			return true
		})
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if n < 20 {
		t.Fatalf("scanned %d files; the walk missed the engine", n)
	}
}
