package session

import (
	"errors"
	"os"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/tui/screen"
)

// Request reads what is named to open at the start: a cycle file (a name
// with the cycle file extension or a folder in it, or a regular file that
// is there), else a formula.
func Request(in string) screen.OpenMsg {
	if strings.HasSuffix(in, cycle.FileExtension) || strings.ContainsRune(in, '/') {
		return screen.OpenMsg{File: in}
	}
	if st, err := os.Stat(in); err == nil && st.Mode().IsRegular() {
		return screen.OpenMsg{File: in}
	}
	return screen.OpenMsg{Formula: in}
}

// LoadedMsg is the answer of Load: the cycle asked for, the file it was
// read from ("" when built from the data), whether it is to be assembled
// step by step, or why it could not be had.
type LoadedMsg struct {
	Cycle  *cycle.Cycle
	Path   string
	Guided bool
	Err    error
}

// Load returns the command that builds the cycle req asks for from db, or
// reads it from the file req names (resolved by resolve, a structure file
// it names read beside it), with memo for its Ewald sums. It runs off the
// Update path and answers with a LoadedMsg.
func Load(db *data.DB, memo *cycle.Memo, resolve func(string) (string, error), req screen.OpenMsg) tea.Cmd {
	return func() tea.Msg {
		if db == nil {
			return LoadedMsg{Err: errors.New("no data loaded")}
		}
		if req.File == "" {
			c, err := cycle.Build(db, req.Formula, cycle.Options{Memo: memo})
			return LoadedMsg{Cycle: c, Guided: req.Guided, Err: err}
		}
		path, err := resolve(req.File)
		if err != nil {
			return LoadedMsg{Err: err}
		}
		c, err := cycle.Open(db, path)
		if c != nil {
			c.SetMemo(memo)
			if err == nil {
				err = c.ReopenStructureFile(req.File, resolve)
			}
		}
		return LoadedMsg{Cycle: c, Path: path, Err: err}
	}
}
