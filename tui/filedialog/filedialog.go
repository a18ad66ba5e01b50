// Package filedialog asks for the names of cycle files: the save prompt
// (a proposed name, the cycle file extension added when missing, a file
// already there replaced only when enter is pressed again on its name)
// and the open prompt (the folder's cycle files and the recovery files to
// pick from). Inside a confined folder it shows paths as the names the
// user types (Name, Shown).
package filedialog

import (
	"cmp"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo/fileio"
	"enthalpath/tui/prompt"
	"enthalpath/tui/safepath"
	"enthalpath/tui/screen"
	"enthalpath/tui/theme"
)

// Folder is where a session's cycle files are named.
type Folder struct {
	// Root confines every name typed ("" means the current folder, not
	// confined).
	Root string
	// Resolve turns a typed name into a path, or says why not.
	Resolve func(name string) (string, error)
	// DB reads a file about to be replaced, to say what it holds.
	DB *data.DB
	// Styles and MaxInputLen shape the prompts.
	Styles      *theme.Styles
	MaxInputLen int
	// Recovery lists the recovery files the open prompt offers.
	Recovery func() []string
}

// Name is how a path is shown and pre-filled: inside a confined folder
// relative to it, the name the user types; else as is.
func (f Folder) Name(path string) string {
	if f.Root == "" {
		return path
	}
	rel, _ := safepath.Rel(f.Root, path)
	return rel
}

// Shown takes the confined folder's own path out of a text (an error of
// the file system names the whole path), leaving the names the user types.
func (f Folder) Shown(text string) string {
	if f.Root == "" {
		return text
	}
	roots := []string{filepath.Clean(f.Root)}
	if abs, err := filepath.Abs(f.Root); err == nil {
		roots = append(roots, abs)
	}
	if real, err := filepath.EvalSymlinks(f.Root); err == nil {
		if abs, err := filepath.Abs(real); err == nil {
			roots = append(roots, abs)
		}
	}
	for _, r := range roots {
		if r != string(filepath.Separator) && r != "." {
			text = strings.ReplaceAll(text, r+string(filepath.Separator), "")
		}
	}
	return text
}

// FileName is the one rule of Save and Open for a typed name: the cycle
// file extension is added when the name has none.
func FileName(name string) string {
	if name != "" && filepath.Ext(name) == "" {
		return name + cycle.FileExtension
	}
	return name
}

// safeStem keeps letters, digits and a few marks of a formula for a file name.
func safeStem(s string) string {
	var b strings.Builder
	for _, r := range s {
		if r < 128 && (r == '-' || r == '_' || r == '.' || (r >= '0' && r <= '9') || (r|0x20 >= 'a' && r|0x20 <= 'z')) {
			b.WriteRune(r)
		}
	}
	if b.Len() == 0 {
		return "cycle"
	}
	return b.String()
}

// Saved is what a save answers: the path written, or why not.
type Saved func(path string, err error) tea.Msg

// Save returns the prompt that asks where to save snapshot (current: the
// file it came from, proposed as the name) and whose answer saves it,
// answering with done.
func (f Folder) Save(snapshot *cycle.Cycle, current string, done Saved) *prompt.Model {
	replace := "" // an existing file the user said to replace
	where := "the current folder"
	if f.Root != "" {
		where = "your folder"
	}
	proposed := safeStem(snapshot.Formula) + cycle.FileExtension
	if current != "" {
		proposed = f.Name(current)
	}
	return prompt.New(f.Styles, "Save the "+snapshot.Formula+" cycle as", proposed,
		"A name in "+where+"; "+cycle.FileExtension+" is added when missing. Typing replaces the proposed name, ← → edit it. esc cancels.", f.MaxInputLen,
		func(name string) (tea.Cmd, error) {
			name = FileName(name)
			path, err := f.Resolve(name)
			if err != nil {
				return nil, err
			}
			var notRegular *fileio.NotRegularError
			if err := fileio.CheckReplaceable(path); errors.As(err, &notRegular) {
				// Worded with the name typed: the path may be the server's.
				return nil, fmt.Errorf("%s is %s, not a regular file; it is not replaced: choose another name", name, notRegular.Kind)
			} else if err != nil {
				return nil, errors.New(f.Shown(err.Error()))
			}
			if path != replace && path != current {
				if held, exists := f.holds(path); exists {
					// Asked in place: enter again on the same name replaces it.
					replace = path
					return nil, fmt.Errorf("%s already exists and holds %s; press enter again to replace it, or type another name", name, held)
				}
			}
			return func() tea.Msg {
				if dir := filepath.Dir(path); dir != "" {
					if err := os.MkdirAll(dir, 0o755); err != nil {
						return done("", err)
					}
				}
				return done(path, cycle.Save(path, snapshot))
			}, nil
		}, prompt.WithProposal())
}

// Open returns the prompt that asks for a cycle file to open, proposing
// the newest recovery file and listing the folder's cycle files; its
// answer is a screen.OpenMsg.
func (f Folder) Open() *prompt.Model {
	initial := ""
	if files := f.recoveryFiles(); len(files) > 0 {
		initial = f.Name(files[0]) // in a confined folder, the name to type
	}
	files := f.List()
	hint := "The name of a " + cycle.FileExtension + " file (added when missing). esc cancels."
	if len(files) == 0 {
		hint = "No " + cycle.FileExtension + " file in this folder yet; type a name. esc cancels."
	}
	return prompt.New(f.Styles, "Open a cycle file", initial, hint, f.MaxInputLen,
		func(name string) (tea.Cmd, error) {
			name = FileName(name)
			path, err := f.Resolve(name)
			if err != nil {
				return nil, err
			}
			if _, err := os.Stat(path); err != nil {
				return nil, fmt.Errorf("%s: no such file", name)
			}
			return func() tea.Msg { return screen.OpenMsg{File: name} }, nil
		}, prompt.WithProposal(), prompt.WithChoices(files))
}

func (f Folder) recoveryFiles() []string {
	if f.Recovery == nil {
		return nil
	}
	return f.Recovery()
}

// maxListed bounds the cycle files Open lists (the newest are kept).
const maxListed = 200

// List returns the cycle files Open offers, as names to type: those in
// the folder (Root, else the current folder), then the recovery files,
// each group newest first.
func (f Folder) List() []string {
	dir := f.Root
	if dir == "" {
		dir = "."
	}
	type file struct {
		name string
		mod  int64
	}
	var files []file
	entries, _ := os.ReadDir(dir) // an unreadable folder lists nothing
	for _, e := range entries {
		if !e.Type().IsRegular() || filepath.Ext(e.Name()) != cycle.FileExtension || strings.HasPrefix(e.Name(), ".") {
			continue
		}
		info, err := e.Info()
		if err != nil {
			continue
		}
		files = append(files, file{e.Name(), info.ModTime().UnixNano()})
	}
	slices.SortStableFunc(files, func(a, b file) int { return cmp.Compare(b.mod, a.mod) })
	var out []string
	for _, fl := range files[:min(len(files), maxListed)] {
		out = append(out, fl.name)
	}
	for _, p := range f.recoveryFiles() {
		if n := f.Name(p); n != "" && !slices.Contains(out, n) {
			out = append(out, n)
		}
	}
	return out
}

// holds reports whether a file is at path and says what it holds: "the
// MgO cycle", or that it is not a cycle file this program reads.
func (f Folder) holds(path string) (string, bool) {
	st, err := os.Stat(path)
	if errors.Is(err, os.ErrNotExist) {
		return "", false
	}
	if err == nil && st.IsDir() {
		return "a folder", true
	}
	if f.DB != nil {
		if c, err := cycle.Open(f.DB, path); err == nil {
			return "the " + c.Formula + " cycle", true
		}
	}
	return "something that is not a cycle file this program reads", true
}
