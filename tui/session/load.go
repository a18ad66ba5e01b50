package session

import (
	"errors"
	"path/filepath"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/tui/screen"
)

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
			if st := c.Settings.Structure; err == nil && st.CIF != "" && st.Cell == nil {
				var p string
				if p, err = resolve(filepath.Join(filepath.Dir(req.File), st.CIF)); err == nil {
					err = c.LoadStructureFile(p, st.CIF)
				}
			}
		}
		return LoadedMsg{Cycle: c, Path: path, Err: err}
	}
}
