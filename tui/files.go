package tui

import (
	"errors"
	"strings"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/tui/screen"
	"enthalpath/tui/session"
	"enthalpath/tui/unsaved"
)

// openCmd builds or reads the cycle asked for, off the Update path.
func (m *Model) openCmd(req screen.OpenMsg) tea.Cmd {
	return session.Load(m.opts.DB, m.memo, m.ctx.ResolvePath, req)
}

func (m *Model) opened(msg session.LoadedMsg) tea.Cmd {
	kept := m.kept
	m.kept = ""
	if msg.Err != nil {
		m.status.Fail(strings.TrimSpace(kept + " " + session.Message(msg.Err)))
		return nil
	}
	solve := m.sess.Open(msg.Cycle, msg.Path)
	news := ""
	if msg.Path != "" {
		news = "Opened " + m.files.Name(msg.Path) + "."
	}
	m.status.Say(strings.TrimSpace(kept + " " + news))
	target := screen.Bench
	if msg.Guided {
		target = screen.Assembly
	}
	return tea.Batch(m.broadcast(session.OpenedMsg{}), solve, m.switchTo(target))
}

// quit asks before losing unsaved changes.
func (m *Model) quit() tea.Cmd {
	if m.sess.Dirty && m.sess.Cycle != nil {
		return m.ask(nil)
	}
	m.quitting = true
	return tea.Quit
}

// ask puts the unsaved-changes question, about quitting (open nil) or
// about opening open in place of the cycle.
func (m *Model) ask(open *screen.OpenMsg) tea.Cmd {
	m.question.Ask(m.sess.Cycle.Formula, open)
	m.showHelp = false
	return nil
}

// then finishes what the question was about: quit, or open the request.
func (m *Model) then(open *screen.OpenMsg) tea.Cmd {
	if open == nil {
		m.quitting = true
		return tea.Quit
	}
	return m.openCmd(*open)
}

// answer acts on a key while the unsaved-changes question is asked.
func (m *Model) answer(k tea.KeyMsg) tea.Cmd {
	a, open := m.question.Answer(k)
	switch a {
	case unsaved.Save:
		return m.askSave(open == nil, open)
	case unsaved.Keep:
		p, err := m.keepWork()
		if err != nil {
			m.status.Fail("could not keep a recovery file: " + err.Error())
			return nil
		}
		if open != nil {
			// Said once the open is done; the session goes on, so its end
			// is not in that file.
			m.kept = "The unsaved " + m.sess.Cycle.Formula + " cycle was kept in " + m.files.Name(p) + "."
			m.recovered = ""
		}
		return m.then(open)
	case unsaved.Discard:
		return m.then(open)
	}
	return nil
}

// askSave asks for a file name and saves; then quits or opens thenOpen.
func (m *Model) askSave(thenQuit bool, thenOpen *screen.OpenMsg) tea.Cmd {
	if m.sess.Cycle == nil {
		return screen.Fail(errors.New("nothing to save yet: open a compound from the shelf first"))
	}
	m.prompt.Open(m.files.Save(m.sess.Cycle.Clone(), m.sess.Path, func(path string, err error) tea.Msg {
		return savedMsg{path: path, err: err, thenQuit: thenQuit, thenOpen: thenOpen}
	}))
	return nil
}

func (m *Model) saved(msg savedMsg) tea.Cmd {
	if msg.err != nil {
		m.status.Fail("not saved: " + msg.err.Error())
		return nil
	}
	m.sess.Clean(msg.path)
	m.status.Say("Saved " + m.files.Name(msg.path) + ".")
	if msg.thenQuit {
		m.quitting = true
		return tea.Quit
	}
	if msg.thenOpen != nil {
		return m.openCmd(*msg.thenOpen)
	}
	return nil
}

// keepWork keeps unsaved work, for every way a session ends with it (the
// keep answer, a signal, a closed terminal or dropped connection, a server
// shutdown, a failure): see recovery.Keeper. The file written is the one
// RecoveredTo names; it returns "" when there is nothing to keep.
func (m *Model) keepWork() (string, error) {
	if !m.sess.Dirty {
		return "", nil
	}
	p, err := m.keeper.Keep(m.sess.Cycle)
	if p != "" {
		m.recovered = p
	}
	return p, err
}

// WriteRecovery keeps unsaved work in a recovery file, if there is any
// (see keepWork); the program's runner calls it when the program ends
// abnormally. Once the program has stopped it is safe to call.
func (m *Model) WriteRecovery() (string, error) { return m.keepWork() }

func (m *Model) shutdown(reason string) tea.Cmd {
	m.quitting = true
	if _, err := m.keepWork(); err != nil {
		m.status.Fail("shutdown (" + reason + "): could not write the recovery file: " + err.Error())
	}
	return tea.Quit
}

// recoverAndRepanic is deferred by Update and View: on a panic it writes the
// recovery file (RecoveredTo names it, for the runner), then panics on so
// that Bubble Tea restores the terminal and reports it.
func (m *Model) recoverAndRepanic() {
	if r := recover(); r != nil {
		_, _ = m.keepWork()
		panic(r)
	}
}

// RecoveredTo returns the recovery file that holds the work as the session
// ended (quit keeping it, shutdown, a failure), or "". The SSH server asks
// it rather than guessing from the folder.
func (m *Model) RecoveredTo() string { return m.recovered }
