package tui

import (
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/tui/prompt"
	"enthalpath/tui/screen"
)

// quit asks before losing unsaved changes.
func (m *Model) quit() tea.Cmd {
	if m.sess.Dirty && m.sess.Cycle != nil {
		m.confirming = true
		m.showHelp = false
		return nil
	}
	m.quitting = true
	return tea.Quit
}

func (m *Model) confirmKey(k tea.KeyMsg) tea.Cmd {
	c := m.Confirm
	switch {
	case key.Matches(k, c.Back):
		m.confirming = false
	case key.Matches(k, c.Save):
		m.confirming = false
		return m.askSave(true)
	case key.Matches(k, c.Keep) && m.opts.RecoveryPath != "":
		p, err := m.writeRecovery()
		if err != nil {
			m.confirming = false
			m.status, m.statusErr = "could not keep a recovery file: "+err.Error(), true
			return nil
		}
		m.recovered, m.quitting = p, true
		return tea.Quit
	case key.Matches(k, c.Discard):
		m.quitting = true
		return tea.Quit
	}
	return nil
}

func (m *Model) confirmView() string {
	st := m.ctx.Styles
	c := m.Confirm
	lines := []string{
		st.Title.Render("The " + m.sess.Cycle.Formula + " cycle has unsaved changes."),
		"",
		st.HelpKey.Render(c.Save.Help().Key) + "  " + c.Save.Help().Desc,
	}
	if m.opts.RecoveryPath != "" {
		lines = append(lines, st.HelpKey.Render(c.Keep.Help().Key)+"  "+c.Keep.Help().Desc+" ("+m.opts.RecoveryPath+")")
	}
	lines = append(lines,
		st.HelpKey.Render(c.Discard.Help().Key)+"  "+c.Discard.Help().Desc,
		st.HelpKey.Render(c.Back.Help().Key)+"  "+c.Back.Help().Desc)
	return strings.Join(lines, "\n")
}

// defaultFileName proposes a cycle file name for the session's compound.
func (m *Model) defaultFileName() string {
	if m.sess.Path != "" {
		if m.opts.FileRoot != "" {
			if rel, err := filepath.Rel(m.opts.FileRoot, m.sess.Path); err == nil {
				return rel
			}
		}
		return m.sess.Path
	}
	return safeStem(m.sess.Cycle.Formula) + cycle.FileExtension
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

func (m *Model) askSave(thenQuit bool) tea.Cmd {
	if m.sess.Cycle == nil {
		return screen.Fail(errors.New("nothing to save yet: open a compound from the shelf first"))
	}
	snapshot := m.sess.Cycle.Clone()
	where := "the current folder"
	if m.opts.FileRoot != "" {
		where = "your folder"
	}
	m.prompt.Open(prompt.New(m.ctx.Styles, "Save the "+snapshot.Formula+" cycle as", m.defaultFileName(),
		"A name in "+where+"; "+cycle.FileExtension+" is added when missing. esc cancels.", m.opts.MaxInputLen,
		func(name string) (tea.Cmd, error) {
			if name != "" && filepath.Ext(name) == "" {
				name += cycle.FileExtension
			}
			path, err := m.ctx.ResolvePath(name)
			if err != nil {
				return nil, err
			}
			return func() tea.Msg {
				if dir := filepath.Dir(path); dir != "" {
					if err := os.MkdirAll(dir, 0o755); err != nil {
						return savedMsg{err: err}
					}
				}
				return savedMsg{path: path, err: cycle.Save(path, snapshot), thenQuit: thenQuit}
			}, nil
		}))
	return nil
}

func (m *Model) saved(msg savedMsg) tea.Cmd {
	if msg.err != nil {
		m.status, m.statusErr = "not saved: "+msg.err.Error(), true
		return nil
	}
	m.sess.Clean(msg.path)
	m.status, m.statusErr = "Saved "+msg.path+".", false
	if msg.thenQuit {
		m.quitting = true
		return tea.Quit
	}
	return nil
}

func (m *Model) askOpen() tea.Cmd {
	initial := ""
	if p := m.opts.RecoveryPath; p != "" {
		if _, err := os.Stat(p); err == nil && m.opts.FileRoot == "" {
			initial = p
		}
	}
	m.prompt.Open(prompt.New(m.ctx.Styles, "Open a cycle file", initial,
		"The name of a "+cycle.FileExtension+" file. esc cancels.", m.opts.MaxInputLen,
		func(name string) (tea.Cmd, error) {
			path, err := m.ctx.ResolvePath(name)
			if err != nil {
				return nil, err
			}
			if _, err := os.Stat(path); err != nil {
				return nil, fmt.Errorf("%s: no such file", name)
			}
			return func() tea.Msg { return screen.OpenMsg{File: name} }, nil
		}))
	return nil
}

// writeRecovery writes the unsaved cycle to Options.RecoveryPath and
// returns the path ("" when there was nothing to write).
func (m *Model) writeRecovery() (string, error) {
	p := m.opts.RecoveryPath
	if p == "" || m.sess.Cycle == nil || !m.sess.Dirty {
		return "", nil
	}
	if err := os.MkdirAll(filepath.Dir(p), 0o700); err != nil {
		return "", err
	}
	if err := cycle.Save(p, m.sess.Cycle); err != nil {
		return "", err
	}
	return p, nil
}

// WriteRecovery writes unsaved work to the recovery file, if any; the
// program's runner calls it when the program ends abnormally.
func (m *Model) WriteRecovery() (string, error) { return m.writeRecovery() }

func (m *Model) shutdown(reason string) tea.Cmd {
	p, err := m.writeRecovery()
	m.quitting = true
	if err != nil {
		m.status = "shutdown (" + reason + "): could not write the recovery file: " + err.Error()
	}
	m.recovered = p
	return tea.Quit
}

// recoverAndRepanic is deferred by Update and View: on a panic it writes the
// recovery file, then panics on so that Bubble Tea restores the terminal
// and reports it.
func (m *Model) recoverAndRepanic() {
	if r := recover(); r != nil {
		if p, err := m.writeRecovery(); err == nil && p != "" {
			fmt.Fprintf(os.Stderr, "enthalpath: unsaved work kept in %s\n", p)
		}
		panic(r)
	}
}

// RecoveredTo returns the recovery file written when the session ended
// (quit keeping the work, or shutdown), or "".
func (m *Model) RecoveredTo() string { return m.recovered }
