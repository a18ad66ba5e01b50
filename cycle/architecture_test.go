package cycle_test

import (
	"flag"
	"os"
	"os/exec"
	"path/filepath"
	"slices"
	"sort"
	"strings"
	"testing"
)

var redraw = flag.Bool("redraw", false, "rewrite the architecture picture in DEVELOPERS.md")

// The picture sits between these two lines of DEVELOPERS.md.
const (
	pictureBegin = "<!-- drawn by TestArchitecturePicture from the imports and cycle/layers_test.go: go test ./cycle -run ArchitecturePicture -redraw -->"
	pictureEnd   = "<!-- end of the drawn picture -->"
)

// short names a package as the picture does.
func short(pkg string) string {
	if pkg == "enthalpath" {
		return "enthalpath (main.go)"
	}
	return strings.TrimPrefix(pkg, "enthalpath/")
}

// drawArchitecture draws the layers top down, each with what it may
// import, its packages, and the layers its packages do import (so the
// picture changes when a layer gains an arrow or a package, not with each
// import inside the arrows).
func drawArchitecture(edges map[string][]string, pkgs []string) string {
	var b strings.Builder
	b.WriteString("```text\n")
	for _, l := range layers {
		var mine, uses []string
		for _, p := range pkgs {
			if layerOf(p).prefix != l.prefix {
				continue
			}
			mine = append(mine, short(p))
			for _, d := range edges[p] {
				if to := layerOf(d).prefix; to != l.prefix && !slices.Contains(uses, short(to)) {
					uses = append(uses, short(to))
				}
			}
		}
		sort.Strings(uses)
		var may string
		switch {
		case l.leaf:
			may = "a leaf: imports nothing of the project; every layer may import it"
		case len(l.may) == 0 && l.only:
			may = "may import only the leaves"
		case len(l.may) == 0:
			may = "may import only its own packages and the leaves"
		default:
			var names []string
			for _, m := range l.may {
				names = append(names, short(m))
			}
			may = "may import " + strings.Join(names, ", ") + " and the leaves"
		}
		name := short(l.prefix)
		switch {
		case strings.HasSuffix(l.prefix, "/*"):
			name += " (the physics packages below thermo)"
		case l.only:
			name += " (the root package alone: units, rounding)"
		}
		b.WriteString(name + ": " + may + "\n")
		b.WriteString(wrapPictureLine("    packages: "+strings.Join(mine, ", "), 100) + "\n")
		if len(uses) > 0 {
			b.WriteString(wrapPictureLine("    ─► "+strings.Join(uses, ", "), 100) + "\n")
		}
	}
	b.WriteString("```\n")
	return b.String()
}

// wrapPictureLine breaks a long line after a comma, indenting what follows.
func wrapPictureLine(line string, width int) string {
	var out []string
	indent := strings.Repeat(" ", 14)
	for len([]rune(line)) > width {
		cut := strings.LastIndex(string([]rune(line)[:width]), ", ")
		if cut < 0 {
			break
		}
		out = append(out, line[:cut+1])
		line = indent + line[cut+2:]
	}
	return strings.Join(append(out, line), "\n")
}

// uniqueSorted returns each package's imports sorted, once each, and every
// package of the module (those with no import of the project too).
func uniqueSorted(edges map[string][]string, root string, t *testing.T) (map[string][]string, []string) {
	t.Helper()
	out := map[string][]string{}
	for from, tos := range edges {
		s := slices.Clone(tos)
		sort.Strings(s)
		out[from] = slices.Compact(s)
	}
	var pkgs []string
	err := filepath.WalkDir(root, func(path string, d os.DirEntry, err error) error {
		if err != nil {
			return err
		}
		name := d.Name()
		if d.IsDir() && path != root && (strings.HasPrefix(name, ".") || name == "testdata" || name == "vendor") {
			return filepath.SkipDir
		}
		if !d.IsDir() && strings.HasSuffix(name, ".go") && !strings.HasSuffix(name, "_test.go") {
			rel, _ := filepath.Rel(root, filepath.Dir(path))
			pkg := "enthalpath"
			if rel != "." {
				pkg += "/" + filepath.ToSlash(rel)
			}
			if !slices.Contains(pkgs, pkg) {
				pkgs = append(pkgs, pkg)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	sort.Strings(pkgs)
	return out, pkgs
}

// TestArchitecturePicture: the picture in DEVELOPERS.md § Architecture is
// the one drawn from the imports of every package and the rules of
// layers_test.go. -redraw rewrites it.
func TestArchitecturePicture(t *testing.T) {
	root, err := filepath.Abs("..")
	if err != nil {
		t.Fatal(err)
	}
	edges, pkgs := uniqueSorted(moduleImports(t, root), root, t)
	picture := drawArchitecture(edges, pkgs)
	path := filepath.Join(root, "DEVELOPERS.md")
	doc, err := os.ReadFile(path)
	if err != nil {
		t.Fatal(err)
	}
	text := string(doc)
	i, j := strings.Index(text, pictureBegin+"\n"), strings.Index(text, pictureEnd)
	if i < 0 || j < i {
		t.Fatalf("DEVELOPERS.md lacks the lines\n%s\n%s\naround its picture", pictureBegin, pictureEnd)
	}
	i += len(pictureBegin) + 1
	if text[i:j] == picture {
		return
	}
	if *redraw {
		if err := os.WriteFile(path, []byte(text[:i]+picture+text[j:]), 0o644); err != nil {
			t.Fatal(err)
		}
		return
	}
	t.Errorf("DEVELOPERS.md's picture is not the one drawn from the imports; run go test ./cycle -run ArchitecturePicture -redraw. Drawn:\n%s", picture)
}

// TestImportsAreGoLists: the imports the layer test reads from the source
// files are the ones `go list -f '{{.ImportPath}} {{.Imports}}' ./...`
// reports (the Go toolchain as the outside reference).
func TestImportsAreGoLists(t *testing.T) {
	if testing.Short() {
		t.Skip("runs go list")
	}
	goTool, err := exec.LookPath("go")
	if err != nil {
		t.Skip("no go tool on PATH")
	}
	root, err := filepath.Abs("..")
	if err != nil {
		t.Fatal(err)
	}
	cmd := exec.Command(goTool, "list", "-f", "{{.ImportPath}} {{join .Imports \" \"}}", "./...")
	cmd.Dir = root
	out, err := cmd.Output()
	if err != nil {
		t.Fatalf("go list: %v", err)
	}
	listed := map[string][]string{}
	for _, line := range strings.Split(strings.TrimSpace(string(out)), "\n") {
		fields := strings.Fields(line)
		for _, imp := range fields[1:] {
			if imp == "enthalpath" || strings.HasPrefix(imp, "enthalpath/") {
				listed[fields[0]] = append(listed[fields[0]], imp)
			}
		}
	}
	parsed, _ := uniqueSorted(moduleImports(t, root), root, t)
	for pkg := range listed {
		sort.Strings(listed[pkg])
	}
	for pkg, imps := range parsed {
		if !slices.Equal(imps, listed[pkg]) {
			t.Errorf("%s: the source files import %v, go list says %v", pkg, imps, listed[pkg])
		}
	}
	for pkg := range listed {
		if _, ok := parsed[pkg]; !ok {
			t.Errorf("%s: go list has imports %v the source files do not", pkg, listed[pkg])
		}
	}
}

// TestRootHoldsOnlyMainGo: main.go is the only Go file at the top of the
// module (issue 13: the command line lives in cycle/cli, the workshop's
// runners in tui/launch).
func TestRootHoldsOnlyMainGo(t *testing.T) {
	files, err := filepath.Glob(filepath.Join("..", "*.go"))
	if err != nil {
		t.Fatal(err)
	}
	for _, f := range files {
		if filepath.Base(f) != "main.go" {
			t.Errorf("%s: a Go file at the root beside main.go; it belongs under cycle/cli, tui/launch or another package", filepath.Base(f))
		}
	}
}
