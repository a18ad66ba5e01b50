// Package recovery keeps a session's unsaved cycle in a recovery file and
// finds those earlier sessions left. One writer (Keeper.Keep) serves every
// way a session ends with unsaved work; it writes the configured path or,
// when any file is there, the first free name of its series
// (recovery-2.hesscycle, …), never over an earlier file.
package recovery

import (
	"bytes"
	"fmt"
	"os"
	"path/filepath"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/thermo/fileio"
)

// Keeper writes recovery files for one session. The zero Keeper (no Path)
// keeps nothing.
type Keeper struct {
	// Path is the recovery file's name; "" disables recovery.
	Path string
	// last is the file Keep wrote last and what it holds.
	last struct {
		path    string
		content []byte
	}
}

// Enabled reports whether the keeper has a path to write.
func (k *Keeper) Enabled() bool { return k.Path != "" }

// Keep writes c to Path, or to the first free name of its series, never
// over an earlier file (fileio.WriteNew). Asked again with the same cycle
// (a failure keeps once in the model and once more from its runner) it
// returns the file already written. It returns "" when there is no path or
// no cycle.
func (k *Keeper) Keep(c *cycle.Cycle) (string, error) {
	if k.Path == "" || c == nil {
		return "", nil
	}
	b, err := cycle.Marshal(c)
	if err != nil {
		return "", err
	}
	if k.last.path != "" && bytes.Equal(b, k.last.content) {
		return k.last.path, nil
	}
	if err := os.MkdirAll(filepath.Dir(k.Path), 0o700); err != nil {
		return "", err
	}
	written, err := fileio.WriteNew(k.Path, 0o600, b)
	if err != nil {
		return "", err
	}
	k.last.path, k.last.content = written, b
	return written, nil
}

// Files returns the recovery files there are (Path and its numbered
// neighbours Path-2, Path-3, …), the newest first.
func (k *Keeper) Files() []string { return fileio.Series(k.Path) }

// Next is the file Keep would write now ("" without a path).
func (k *Keeper) Next() string {
	if k.Path == "" {
		return ""
	}
	return fileio.NextFree(k.Path)
}

// NoticeMsg announces the recovery files found at the start.
type NoticeMsg struct{ Text string }

// Notice returns the command that looks for recovery files and announces
// them, with the key that opens them (openKey) and each named as name
// shows it; nil without a path.
func (k *Keeper) Notice(openKey string, name func(string) string) tea.Cmd {
	if k.Path == "" {
		return nil
	}
	path := k.Path
	return func() tea.Msg {
		files := fileio.Series(path)
		switch len(files) {
		case 0:
			return nil
		case 1:
			// The key first and the name last: a long local path cut at
			// the window's edge is whole in the ctrl+o prompt.
			return NoticeMsg{Text: "A recovery file from an earlier session (" + openKey + " opens it): " + name(files[0])}
		}
		return NoticeMsg{Text: fmt.Sprintf("%d recovery files from earlier sessions (%s opens the newest): %s",
			len(files), openKey, name(files[0]))}
	}
}
