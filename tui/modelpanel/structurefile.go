package modelpanel

import (
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
)

// A structure typed as a file name is read, and charges the file does not
// state are assigned from the compound's ions (so a plain structure file
// works too), in a command: parsing a CIF and assigning its charges is too
// slow for the Update path. The panel says it is reading meanwhile; a file
// refused comes back to the prompt with the reason.

// structureReadMsg is the answer of the command readStructure returns.
type structureReadMsg struct {
	c    *cycle.Cycle // the cycle the file was read for
	row  setting
	text string // the name as typed
	st   cycle.Structure
	err  error
}

// isStructureFile reports whether text typed for the structure names a file.
func isStructureFile(text string) bool {
	return strings.HasSuffix(strings.ToLower(strings.TrimSpace(text)), ".cif")
}

// readStructure returns the command that reads the file text names for
// row, off the Update path, and marks the panel as reading it; a name that
// cannot be resolved is refused at once.
func (m *Model) readStructure(row setting, text string) (tea.Cmd, error) {
	text = strings.TrimSpace(text)
	path, err := m.ctx.ResolvePath(text)
	if err != nil {
		return nil, err
	}
	c := m.sess.Cycle
	snapshot := c.Clone()
	m.reading = text
	return func() tea.Msg {
		st, err := snapshot.ReadStructureFile(path, text)
		return structureReadMsg{c: c, row: row, text: text, st: st, err: err}
	}, nil
}

// structureRead makes a structure read the cycle's, or reopens the prompt
// with the file's refusal. An answer for a name no longer awaited, or for
// a cycle no longer open, is dropped.
func (m *Model) structureRead(msg structureReadMsg) tea.Cmd {
	if msg.text != m.reading {
		return nil
	}
	m.reading = ""
	if msg.c != m.sess.Cycle {
		return nil
	}
	if msg.err == nil {
		cmd, err := m.sess.Change(func(c *cycle.Cycle) error { c.Settings.Structure = msg.st; return nil })
		if err == nil {
			return tea.Batch(cmd, screen.Status(msg.row.name+": "+msg.row.show(&m.sess.Cycle.Settings)+"."))
		}
		msg.err = err
	}
	m.openEdit(msg.row, msg.text, prompt.WithRefusal(msg.err))
	return nil
}
