package tui

import (
	"bytes"
	"errors"
	"io"
	"path/filepath"
	"strings"
	"testing"
	"time"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// faultyScreen panics on any key: it stands for a bug in a screen.
type faultyScreen struct{ screen.Screen }

func (faultyScreen) Update(msg tea.Msg) tea.Cmd {
	if _, ok := msg.(tea.KeyMsg); ok {
		panic("a screen's bug")
	}
	return nil
}
func (faultyScreen) Capturing() bool          { return false }
func (faultyScreen) ShortHelp() []key.Binding { return nil }

// TestPanicRestoresTerminalAndKeepsWork runs the real program on pipes,
// makes a screen panic after an unsaved change, and checks that Bubble Tea
// reports the panic (having restored the terminal: the cursor is shown
// again and the alternate screen left) and that the recovery file holds
// the change.
func TestPanicRestoresTerminalAndKeepsWork(t *testing.T) {
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	dir := t.TempDir()
	root := New(Options{Renderer: drive.Renderer(), DB: db, RecoveryPath: filepath.Join(dir, "rec.hesscycle")}).(*Model)
	u := drive.Model(root)
	drive.Run(u, tea.WindowSizeMsg{Width: 80, Height: 24}, screen.OpenMsg{Formula: "NaCl"})
	if root.sess.Cycle == nil {
		t.Fatal("NaCl did not open")
	}
	if _, err := root.sess.Change(func(c *cycle.Cycle) error { return c.Set("ionization-1", 499, 1) }); err != nil {
		t.Fatal(err)
	}
	root.screens[screen.Analyses] = faultyScreen{root.screens[screen.Analyses]}
	root.active = screen.Analyses

	in, inW := io.Pipe()
	var out bytes.Buffer
	p := tea.NewProgram(root, tea.WithInput(in), tea.WithOutput(&out), tea.WithAltScreen())
	done := make(chan error, 1)
	go func() { _, err := p.Run(); done <- err }()
	time.Sleep(100 * time.Millisecond)
	if _, err := inW.Write([]byte("j")); err != nil {
		t.Fatal(err)
	}
	var runErr error
	select {
	case runErr = <-done:
	case <-time.After(5 * time.Second):
		t.Fatalf("the program did not end after the panic; output %q", out.String())
	}
	if !errors.Is(runErr, tea.ErrProgramPanic) {
		t.Fatalf("Run returned %v, want ErrProgramPanic", runErr)
	}
	o := out.String()
	if !strings.Contains(o, "\x1b[?25h") || !strings.Contains(o, "\x1b[?1049l") {
		t.Errorf("terminal not restored: output lacks show-cursor or leave-alt-screen sequences")
	}
	c, err := cycle.Open(db, filepath.Join(dir, "rec.hesscycle"))
	if err != nil {
		t.Fatalf("recovery file after the panic: %v", err)
	}
	if s, _ := c.Step("ionization-1"); s.Value != 499 {
		t.Errorf("recovered ionization-1 = %v, want 499", s.Value)
	}
}
