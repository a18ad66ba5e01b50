package cycle_test

import (
	"go/parser"
	"go/token"
	"io/fs"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
	"testing"
)

// The arrows of DEVELOPERS.md § Architecture, as rules on import paths of
// this module. Each rule names the layer a package belongs to (the longest
// matching prefix) and the layers it may import. The picture in
// DEVELOPERS.md is drawn from these rules and the imports themselves
// (TestArchitecturePicture), top layer first.
//
//	front ends (main, tui, cycle/cli) → cycle → thermo, data
//	front ends import thermo's vocabulary (the root package: units,
//	rounding) but none of its physics packages; data imports nothing of
//	the project's physics; nothing imports tui; the engine never imports
//	its command line.
type layer struct {
	// prefix is the import path of the layer's packages and those below
	// it; ending in "/*", only those strictly below it.
	prefix string
	may    []string // other layers (their prefixes) it may import
	// only marks a layer of the one package prefix, not those below it.
	only bool
	// leaf marks a package of no physics and no data that imports nothing
	// of the project, which every layer may import.
	leaf bool
}

var layers = []layer{
	// main wires the front ends together; a front end itself, it imports no
	// physics package either.
	{prefix: "enthalpath", may: []string{"enthalpath/tui/launch", "enthalpath/tui", "enthalpath/cycle/cli", "enthalpath/cycle", "enthalpath/thermo", "enthalpath/data"}},
	// The workshop's runners answer to the command line's table (its Env,
	// usage errors, help and exit codes); cycle/cli never imports them.
	{prefix: "enthalpath/tui/launch", may: []string{"enthalpath/tui", "enthalpath/cycle/cli", "enthalpath/cycle", "enthalpath/thermo", "enthalpath/data"}},
	// The front ends reach physics through the engine (cycle, cycle/analysis,
	// cycle/cells); of thermo they import only its vocabulary and the leaves.
	{prefix: "enthalpath/tui", may: []string{"enthalpath/cycle", "enthalpath/thermo", "enthalpath/data"}},
	{prefix: "enthalpath/cycle/cli", may: []string{"enthalpath/cycle", "enthalpath/thermo", "enthalpath/data"}},
	{prefix: "enthalpath/cycle", may: []string{"enthalpath/thermo/*", "enthalpath/thermo", "enthalpath/data"}},
	{prefix: "enthalpath/data", may: nil},
	// thermo's physics packages: crystal, cif, ewald, lattice, valence,
	// ordering, entropy, gibbs, lsq.
	{prefix: "enthalpath/thermo/*", may: []string{"enthalpath/thermo"}},
	// thermo's vocabulary: CODATA constants, energy units, the rounding of
	// a value with its uncertainty; what a front end needs to print.
	{prefix: "enthalpath/thermo", may: nil, only: true},
	// Reading and writing the files a user names (size caps, regular files
	// only, atomic saves): the CIF reader and the data overlay need it, so
	// it sits at the bottom, importing nothing of the project.
	{prefix: "enthalpath/thermo/fileio", leaf: true},
	// Chemical notation (formulas, ion symbols, charges, the periodic
	// table): the data tables, the engine, the CIF reader and the front
	// ends read a formula the same way, so it too is a leaf.
	{prefix: "enthalpath/thermo/notation", leaf: true},
}

// knownCrossings are imports that break an arrow today, each with its reason;
// the test fails on any other crossing, and on an entry here that no longer
// occurs (so the list only shrinks).
var knownCrossings = map[string]string{}

// holds says whether pkg belongs to l, leaving aside longer prefixes.
func (l layer) holds(pkg string) bool {
	if below, ok := strings.CutSuffix(l.prefix, "/*"); ok {
		return strings.HasPrefix(pkg, below+"/")
	}
	return pkg == l.prefix || (!l.only && strings.HasPrefix(pkg, l.prefix+"/"))
}

// layerOf returns the rule for a package: the layer with the longest prefix
// that holds it.
func layerOf(pkg string) layer {
	best := layer{prefix: "\x00"}
	for _, l := range layers {
		if l.holds(pkg) && (best.prefix == "\x00" || len(l.prefix) > len(best.prefix)) {
			best = l
		}
	}
	return best
}

func allowed(from, to string) bool {
	lf, lt := layerOf(from), layerOf(to)
	if lf.prefix == lt.prefix || lt.leaf {
		return true
	}
	for _, p := range lf.may {
		if p == lt.prefix {
			return true
		}
	}
	return false
}

// moduleImports reads the import lines of every non-test Go file of the
// module below root and returns "from -> to" edges between its packages.
func moduleImports(t *testing.T, root string) map[string][]string {
	t.Helper()
	edges := map[string][]string{}
	fset := token.NewFileSet()
	err := filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() {
			name := d.Name()
			if path != root && (strings.HasPrefix(name, ".") || name == "testdata" || name == "vendor") {
				return filepath.SkipDir
			}
			return nil
		}
		if !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
			return nil
		}
		f, err := parser.ParseFile(fset, path, nil, parser.ImportsOnly)
		if err != nil {
			return err
		}
		rel, err := filepath.Rel(root, filepath.Dir(path))
		if err != nil {
			return err
		}
		pkg := "enthalpath"
		if rel != "." {
			pkg += "/" + filepath.ToSlash(rel)
		}
		for _, imp := range f.Imports {
			to, err := strconv.Unquote(imp.Path.Value)
			if err != nil {
				return err
			}
			if to == "enthalpath" || strings.HasPrefix(to, "enthalpath/") {
				edges[pkg] = append(edges[pkg], to)
			}
		}
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	return edges
}

// crossings lists the edges that break an arrow, sorted.
func crossings(edges map[string][]string) []string {
	seen := map[string]bool{}
	var out []string
	for from, tos := range edges {
		for _, to := range tos {
			e := from + " -> " + to
			if !allowed(from, to) && !seen[e] {
				seen[e] = true
				out = append(out, e)
			}
		}
	}
	sort.Strings(out)
	return out
}

func TestImportsFollowTheArrows(t *testing.T) {
	root, err := filepath.Abs("..")
	if err != nil {
		t.Fatal(err)
	}
	if _, err := os.Stat(filepath.Join(root, "go.mod")); err != nil {
		t.Fatalf("module root not found above cycle/: %v", err)
	}
	found := crossings(moduleImports(t, root))
	occurs := map[string]bool{}
	for _, e := range found {
		occurs[e] = true
		if _, ok := knownCrossings[e]; !ok {
			t.Errorf("import against the arrows of DEVELOPERS.md: %s", e)
		}
	}
	for e, why := range knownCrossings {
		if !occurs[e] {
			t.Errorf("known crossing %q (%s) no longer occurs: remove it from knownCrossings", e, why)
		}
	}
}

// The rule table itself, on made-up edges: each arrow the card forbids is
// reported, each it allows is not.
func TestArrowRules(t *testing.T) {
	cases := []struct {
		from, to string
		ok       bool
	}{
		{"enthalpath/cycle", "enthalpath/thermo/ewald", true},
		{"enthalpath/cycle/analysis", "enthalpath/data", true},
		{"enthalpath/cycle", "enthalpath/cycle/cli", false},          // the engine never imports its command line
		{"enthalpath/cycle/analysis", "enthalpath/cycle/cli", false}, // nor does any part of it
		{"enthalpath/cycle", "enthalpath/tui", false},                // nothing imports tui
		{"enthalpath/cycle/cli", "enthalpath/tui/screen", false},
		{"enthalpath/thermo/ewald", "enthalpath/data", false}, // physics knows no tables
		{"enthalpath/thermo/lattice", "enthalpath/cycle", false},
		{"enthalpath/data", "enthalpath/cycle", false},
		{"enthalpath/data/gen", "enthalpath/thermo", false}, // data holds no physics
		{"enthalpath/tui/bench", "enthalpath/cycle", true},
		{"enthalpath/tui/bench", "enthalpath/tui/screen", true},
		{"enthalpath/tui/bench", "enthalpath/cycle/cli", false},
		{"enthalpath/cycle/cli", "enthalpath/cycle/analysis", true},
		{"enthalpath/tui/launch", "enthalpath/cycle/cli", true}, // the runners answer to the command table
		{"enthalpath/tui/launch", "enthalpath/tui", true},
		{"enthalpath/cycle/cli", "enthalpath/tui/launch", false},
		{"enthalpath", "enthalpath/tui", true},
		{"enthalpath", "enthalpath/cycle/cli", true},
		{"enthalpath/data", "enthalpath/thermo/fileio", true}, // the leaf every layer may use
		{"enthalpath/thermo/cif", "enthalpath/thermo/fileio", true},
		{"enthalpath/thermo/fileio", "enthalpath/thermo", false}, // and it uses nothing of the project
		{"enthalpath/thermo/fileio", "enthalpath/data", false},
		// Front ends import thermo's vocabulary, never its physics.
		{"enthalpath/tui/survey", "enthalpath/thermo", true},
		{"enthalpath/cycle/cli", "enthalpath/thermo", true},
		{"enthalpath/cycle/cli", "enthalpath/thermo/notation", true},
		{"enthalpath/tui/modelpanel", "enthalpath/thermo/crystal", false},
		{"enthalpath/tui/screen", "enthalpath/thermo/lattice", false},
		{"enthalpath/cycle/cli", "enthalpath/thermo/ewald", false},
		{"enthalpath/cycle/cli", "enthalpath/thermo/gibbs", false},
		{"enthalpath/tui/launch", "enthalpath/thermo/cif", false},
		{"enthalpath", "enthalpath/thermo/ewald", false}, // main is a front end too
		{"enthalpath", "enthalpath/thermo", true},
		{"enthalpath/cycle/cells", "enthalpath/thermo/ordering", true},
		{"enthalpath/cycle/analysis", "enthalpath/thermo/gibbs", true},
		{"enthalpath/thermo/lattice", "enthalpath/thermo", true},  // physics uses the units
		{"enthalpath/thermo", "enthalpath/thermo/lattice", false}, // the vocabulary holds no physics
		{"enthalpath/thermo/lattice", "enthalpath/thermo/crystal", true},
		{"enthalpath/data", "enthalpath/thermo/crystal", false},
	}
	for _, c := range cases {
		if got := allowed(c.from, c.to); got != c.ok {
			t.Errorf("allowed(%s -> %s) = %v, want %v", c.from, c.to, got, c.ok)
		}
	}
}
