package nav

import (
	"go/ast"
	"go/parser"
	"go/token"
	"io/fs"
	"path/filepath"
	"strconv"
	"strings"
	"testing"
)

// TestKeysDeclaredOnce reads every Go file of the workshop (tui/, tests
// aside) and fails when a key binding is declared anywhere but here
// (key.NewBinding, key.WithKeys, key.WithHelp, SetKeys), when a help
// label is rewritten (SetHelp with another key text than the binding's
// own), when a screen's own key (New) is one of the shared named keys
// (arrows, pages, home, end, enter, esc, tab, ?, q …), or when a package
// that moves with a shared key takes one of its letters for another job
// (k beside nav.Up).
func TestKeysDeclaredOnce(t *testing.T) {
	named := map[string]Key{}     // shared names that are not letters: reserved everywhere
	letters := map[string][]Key{} // shared letters: reserved where their key is used
	for _, k := range Keys() {
		for _, n := range k.Names() {
			if len(n) == 1 && (n[0]|0x20 >= 'a' && n[0]|0x20 <= 'z') {
				letters[n] = append(letters[n], k)
			} else {
				named[n] = k
			}
		}
	}
	byName := map[string]Key{}
	for _, k := range Keys() {
		byName[keyName(k)] = k
	}
	root := ".."
	type pkgUse struct {
		uses map[Key]bool
		own  []ownKey
	}
	pkgs := map[string]*pkgUse{}
	fset := token.NewFileSet()
	err := filepath.WalkDir(root, func(path string, d fs.DirEntry, err error) error {
		if err != nil {
			return err
		}
		if d.IsDir() {
			if d.Name() == "testdata" || path == filepath.Join(root, "nav") {
				return filepath.SkipDir
			}
			return nil
		}
		if !strings.HasSuffix(path, ".go") || strings.HasSuffix(path, "_test.go") {
			return nil
		}
		f, err := parser.ParseFile(fset, path, nil, 0)
		if err != nil {
			return err
		}
		dir := filepath.Dir(path)
		if pkgs[dir] == nil {
			pkgs[dir] = &pkgUse{uses: map[Key]bool{}}
		}
		p := pkgs[dir]
		ast.Inspect(f, func(n ast.Node) bool {
			switch n := n.(type) {
			case *ast.SelectorExpr:
				if x, ok := n.X.(*ast.Ident); ok && x.Name == "nav" {
					if k, ok := byName[n.Sel.Name]; ok {
						p.uses[k] = true
					}
				}
			case *ast.CallExpr:
				sel, ok := n.Fun.(*ast.SelectorExpr)
				if !ok {
					return true
				}
				x, _ := sel.X.(*ast.Ident)
				pos := fset.Position(n.Pos())
				switch {
				case x != nil && x.Name == "key" && (sel.Sel.Name == "NewBinding" || sel.Sel.Name == "WithKeys" || sel.Sel.Name == "WithHelp"):
					t.Errorf("%s: key.%s: declare keys through package nav", pos, sel.Sel.Name)
				case sel.Sel.Name == "SetKeys":
					t.Errorf("%s: SetKeys: declare keys through package nav", pos)
				case sel.Sel.Name == "SetHelp" && len(n.Args) == 2 && !isOwnLabel(n.Args[0]):
					t.Errorf("%s: SetHelp rewrites a help label: the label is written from the keys", pos)
				case x != nil && x.Name == "nav" && sel.Sel.Name == "New":
					for _, a := range n.Args[1:] {
						if lit, ok := a.(*ast.BasicLit); ok && lit.Kind == token.STRING {
							s, _ := strconv.Unquote(lit.Value)
							p.own = append(p.own, ownKey{s, pos})
						}
					}
				}
			}
			return true
		})
		return nil
	})
	if err != nil {
		t.Fatal(err)
	}
	if len(pkgs) < 8 {
		t.Fatalf("read only %d packages of the workshop: is the test run from tui/nav?", len(pkgs))
	}
	for dir, p := range pkgs {
		for _, o := range p.own {
			if k, ok := named[o.name]; ok {
				t.Errorf("%s: %q is the shared key %s: use nav.%s.Bind", o.pos, o.name, keyName(k), keyName(k))
			}
			for _, k := range letters[o.name] {
				if p.uses[k] {
					t.Errorf("%s: %s moves with nav.%s and takes its %q for another job", o.pos, dir, keyName(k), o.name)
				}
			}
		}
	}
}

type ownKey struct {
	name string
	pos  token.Position
}

// isOwnLabel reports whether e is b.Help().Key for some b: a SetHelp that
// changes only the description.
func isOwnLabel(e ast.Expr) bool {
	sel, ok := e.(*ast.SelectorExpr)
	if !ok || sel.Sel.Name != "Key" {
		return false
	}
	call, ok := sel.X.(*ast.CallExpr)
	if !ok {
		return false
	}
	h, ok := call.Fun.(*ast.SelectorExpr)
	return ok && h.Sel.Name == "Help"
}

// keyName is the Go name of k in this package.
func keyName(k Key) string {
	return [...]string{"Up", "Down", "Left", "Right", "PageUp", "PageDown", "First", "Last", "Enter", "Esc",
		"NextScreen", "PrevScreen", "Help", "Quit", "ForceQuit"}[k]
}
