package tui

import (
	"bytes"
	"cmp"
	"errors"
	"fmt"
	"os"
	"path/filepath"
	"slices"
	"strings"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
	"github.com/charmbracelet/x/ansi"

	"enthalpath/cycle"
	"enthalpath/thermo/fileio"
	"enthalpath/tui/prompt"
	"enthalpath/tui/safepath"
	"enthalpath/tui/screen"
)

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
	m.confirming, m.pending = true, open
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

// pendingName is what the question's keys do after their part: "quit", or
// "open MgO".
func (m *Model) pendingName() string {
	switch {
	case m.pending == nil:
		return "quit"
	case m.pending.File != "":
		return "open " + m.pending.File
	case m.pending.Guided:
		return "assemble " + m.pending.Formula
	}
	return "open " + m.pending.Formula
}

// confirmBindings are the question's keys with help that says what
// follows (quitting or the open asked for); the keep key only with a
// recovery file to keep.
func (m *Model) confirmBindings() []key.Binding {
	c := m.Confirm
	then := m.pendingName()
	with := func(b key.Binding, desc string) key.Binding {
		b.SetHelp(b.Help().Key, desc)
		return b
	}
	out := []key.Binding{with(c.Save, c.Save.Help().Desc+", then "+then)}
	if m.opts.RecoveryPath != "" {
		out = append(out, with(c.Keep, c.Keep.Help().Desc+", then "+then))
	}
	return append(out, with(c.Discard, c.Discard.Help().Desc+", then "+then), c.Back)
}

// confirmKeys are the question's keys as declared (the keep key only with
// a recovery file to keep).
func (m *Model) confirmKeys() []key.Binding {
	c := m.Confirm
	out := []key.Binding{c.Save}
	if m.opts.RecoveryPath != "" {
		out = append(out, c.Keep)
	}
	return append(out, c.Discard, c.Back)
}

func (m *Model) confirmKey(k tea.KeyMsg) tea.Cmd {
	c := m.Confirm
	open := m.pending
	switch {
	case key.Matches(k, c.Back):
		m.confirming, m.pending = false, nil
	case key.Matches(k, c.Save):
		m.confirming, m.pending = false, nil
		return m.askSave(open == nil, open)
	case key.Matches(k, c.Keep) && m.opts.RecoveryPath != "":
		m.confirming, m.pending = false, nil
		formula := m.sess.Cycle.Formula
		p, err := m.keepWork()
		if err != nil {
			m.status, m.statusErr = "could not keep a recovery file: "+err.Error(), true
			return nil
		}
		if open == nil {
			m.recovered = p
		} else {
			m.kept = "The unsaved " + formula + " cycle was kept in " + m.name(p) + "." // said once the open is done
		}
		return m.then(open)
	case key.Matches(k, c.Discard):
		m.confirming, m.pending = false, nil
		return m.then(open)
	}
	return nil
}

// smallQuestion is the unsaved-changes question as a window smaller than
// 80×24 draws it: whole when it fits, else a line per key, else nothing.
// The question's keys act only when it is drawn (esc, back to work, always
// does): a key must never discard work the user could not see asked about.
func (m *Model) smallQuestion() []string {
	long := []string{"The " + m.sess.Cycle.Formula + " cycle has unsaved changes."}
	for _, b := range m.confirmBindings() {
		long = append(long, b.Help().Key+"  "+b.Help().Desc)
	}
	short := []string{"Unsaved changes:"}
	for _, b := range m.confirmKeys() {
		short = append(short, b.Help().Key+" "+b.Help().Desc)
	}
	for _, lines := range [][]string{long, short} {
		fits := len(lines) <= m.height
		for _, l := range lines {
			fits = fits && lipgloss.Width(l) <= m.width
		}
		if fits {
			return lines
		}
	}
	return nil
}

func (m *Model) confirmView() string {
	st := m.ctx.Styles
	inner := max(20, m.width-6) // the box's border and padding take 4, the margin 2
	fit := func(s string) string { return ansi.Truncate(s, inner, "…") }
	title := "The " + m.sess.Cycle.Formula + " cycle has unsaved changes."
	lines := []string{fit(st.Title.Render(title))}
	if m.pending != nil {
		lines = append(lines, fit(st.Muted.Render("To "+m.pendingName()+", it must close first.")))
	}
	lines = append(lines, "")
	for _, b := range m.confirmBindings() {
		lines = append(lines, fit(st.HelpKey.Render(b.Help().Key)+"  "+b.Help().Desc))
		if slices.Equal(b.Keys(), m.Confirm.Keep.Keys()) {
			// The path on a line of its own, its start cut when too long.
			p := m.name(m.recoveryTarget())
			if r := []rune(p); len(r) > inner-5 {
				p = "…" + string(r[len(r)-(inner-6):])
			}
			lines = append(lines, "   "+st.Muted.Render(p))
		}
	}
	return strings.Join(lines, "\n")
}

// name is how a path is shown and pre-filled: inside a confined folder
// (Options.FileRoot) relative to it, the name the user types; else as is.
func (m *Model) name(path string) string {
	if m.opts.FileRoot == "" {
		return path
	}
	rel, _ := safepath.Rel(m.opts.FileRoot, path)
	return rel
}

// shown takes the confined folder's own path out of a text (an error of
// the file system names the whole path), leaving the names the user types.
func (m *Model) shown(text string) string {
	root := m.opts.FileRoot
	if root == "" {
		return text
	}
	roots := []string{filepath.Clean(root)}
	if abs, err := filepath.Abs(root); err == nil {
		roots = append(roots, abs)
	}
	if real, err := filepath.EvalSymlinks(root); err == nil {
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

// defaultFileName proposes a cycle file name for the session's compound.
func (m *Model) defaultFileName() string {
	if m.sess.Path != "" {
		return m.name(m.sess.Path)
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

// askSave asks for a file name and saves; then quits or opens thenOpen.
func (m *Model) askSave(thenQuit bool, thenOpen *screen.OpenMsg) tea.Cmd {
	if m.sess.Cycle == nil {
		return screen.Fail(errors.New("nothing to save yet: open a compound from the shelf first"))
	}
	snapshot := m.sess.Cycle.Clone()
	replace := "" // an existing file the user said to replace
	where := "the current folder"
	if m.opts.FileRoot != "" {
		where = "your folder"
	}
	m.prompt.Open(prompt.New(m.ctx.Styles, "Save the "+snapshot.Formula+" cycle as", m.defaultFileName(),
		"A name in "+where+"; "+cycle.FileExtension+" is added when missing. Typing replaces the proposed name, ← → edit it. esc cancels.", m.opts.MaxInputLen,
		func(name string) (tea.Cmd, error) {
			name = cycleFileName(name)
			path, err := m.ctx.ResolvePath(name)
			if err != nil {
				return nil, err
			}
			var notRegular *fileio.NotRegularError
			if err := fileio.CheckReplaceable(path); errors.As(err, &notRegular) {
				// Worded with the name typed: the path may be the server's.
				return nil, fmt.Errorf("%s is %s, not a regular file; it is not replaced: choose another name", name, notRegular.Kind)
			} else if err != nil {
				return nil, errors.New(m.shown(err.Error()))
			}
			if path != replace && path != m.sess.Path {
				if held, exists := m.holds(path); exists {
					// Asked in place: enter again on the same name replaces it.
					replace = path
					return nil, fmt.Errorf("%s already exists and holds %s; press enter again to replace it, or type another name", name, held)
				}
			}
			return func() tea.Msg {
				if dir := filepath.Dir(path); dir != "" {
					if err := os.MkdirAll(dir, 0o755); err != nil {
						return savedMsg{err: err}
					}
				}
				return savedMsg{path: path, err: cycle.Save(path, snapshot), thenQuit: thenQuit, thenOpen: thenOpen}
			}, nil
		}, prompt.WithProposal()))
	return nil
}

// cycleFileName is the one rule of Save and Open for a typed name: the
// cycle file extension is added when the name has none.
func cycleFileName(name string) string {
	if name != "" && filepath.Ext(name) == "" {
		return name + cycle.FileExtension
	}
	return name
}

// maxListed bounds the cycle files Open lists (the newest are kept).
const maxListed = 200

// cycleFiles lists the cycle files Open offers, as names to type: those in
// the user's folder (Options.FileRoot, else the current folder), then the
// recovery files, each group newest first.
func (m *Model) cycleFiles() []string {
	dir := m.opts.FileRoot
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
	for _, f := range files[:min(len(files), maxListed)] {
		out = append(out, f.name)
	}
	for _, p := range recoveryFiles(m.opts.RecoveryPath) {
		if n := m.name(p); n != "" && !slices.Contains(out, n) {
			out = append(out, n)
		}
	}
	return out
}

// holds reports whether a file is at path and says what it holds: "the
// MgO cycle", or that it is not a cycle file this program reads.
func (m *Model) holds(path string) (string, bool) {
	st, err := os.Stat(path)
	if errors.Is(err, os.ErrNotExist) {
		return "", false
	}
	if err == nil && st.IsDir() {
		return "a folder", true
	}
	if m.opts.DB != nil {
		if c, err := cycle.Open(m.opts.DB, path); err == nil {
			return "the " + c.Formula + " cycle", true
		}
	}
	return "something that is not a cycle file this program reads", true
}

func (m *Model) saved(msg savedMsg) tea.Cmd {
	if msg.err != nil {
		m.status, m.statusErr = "not saved: "+msg.err.Error(), true
		return nil
	}
	m.sess.Clean(msg.path)
	m.status, m.statusErr = "Saved "+m.name(msg.path)+".", false
	if msg.thenQuit {
		m.quitting = true
		return tea.Quit
	}
	if msg.thenOpen != nil {
		return m.openCmd(*msg.thenOpen)
	}
	return nil
}

func (m *Model) askOpen() tea.Cmd {
	initial := ""
	if files := recoveryFiles(m.opts.RecoveryPath); len(files) > 0 {
		initial = m.name(files[0]) // in a confined folder, the name to type
	}
	files := m.cycleFiles()
	hint := "The name of a " + cycle.FileExtension + " file (added when missing). esc cancels."
	if len(files) == 0 {
		hint = "No " + cycle.FileExtension + " file in this folder yet; type a name. esc cancels."
	}
	m.prompt.Open(prompt.New(m.ctx.Styles, "Open a cycle file", initial, hint, m.opts.MaxInputLen,
		func(name string) (tea.Cmd, error) {
			name = cycleFileName(name)
			path, err := m.ctx.ResolvePath(name)
			if err != nil {
				return nil, err
			}
			if _, err := os.Stat(path); err != nil {
				return nil, fmt.Errorf("%s: no such file", name)
			}
			return func() tea.Msg { return screen.OpenMsg{File: name} }, nil
		}, prompt.WithProposal(), prompt.WithChoices(files)))
	return nil
}

// keepWork is the one writer of recovery files, for every way a session
// ends with unsaved work (the keep answer, a signal, a closed terminal or
// dropped connection, a server shutdown, a failure): it writes the unsaved
// cycle to Options.RecoveryPath, or when any file is there to the first
// free name of its series (recovery-2.hesscycle, …), never over an earlier
// file (fileio.WriteNew). Asked again with the same unsaved work (a failure
// saves once in the model and once more from its runner) it returns the
// file already written. It returns "" when there is nothing to keep.
func (m *Model) keepWork() (string, error) {
	p := m.opts.RecoveryPath
	if p == "" || m.sess.Cycle == nil || !m.sess.Dirty {
		return "", nil
	}
	b, err := cycle.Marshal(m.sess.Cycle)
	if err != nil {
		return "", err
	}
	if m.lastKept.path != "" && bytes.Equal(b, m.lastKept.content) {
		return m.lastKept.path, nil
	}
	if err := os.MkdirAll(filepath.Dir(p), 0o700); err != nil {
		return "", err
	}
	written, err := fileio.WriteNew(p, 0o600, b)
	if err != nil {
		return "", err
	}
	m.lastKept.path, m.lastKept.content = written, b
	return written, nil
}

// recoveryFiles returns the recovery files there are for path p (p itself
// and its numbered neighbours p-2, p-3, …), the newest first.
func recoveryFiles(p string) []string { return fileio.Series(p) }

// recoveryTarget is the file the keep answer would write now.
func (m *Model) recoveryTarget() string {
	if m.opts.RecoveryPath == "" {
		return ""
	}
	return fileio.NextFree(m.opts.RecoveryPath)
}

// WriteRecovery keeps unsaved work in a recovery file, if there is any
// (see keepWork); the program's runner calls it when the program ends
// abnormally. Once the program has stopped it is safe to call.
func (m *Model) WriteRecovery() (string, error) {
	p, err := m.keepWork()
	if p != "" {
		m.recovered = p
	}
	return p, err
}

func (m *Model) shutdown(reason string) tea.Cmd {
	p, err := m.keepWork()
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
		// The runner says where (it asks RecoveredTo, or WriteRecovery,
		// which returns this same file).
		if p, err := m.keepWork(); err == nil && p != "" {
			m.recovered = p
		}
		panic(r)
	}
}

// RecoveredTo returns the recovery file that holds the work as the session
// ended (quit keeping it, shutdown, a failure), or "". The SSH server asks
// it rather than guessing from the folder.
func (m *Model) RecoveredTo() string { return m.recovered }
