package tui_test

import (
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/tui"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// openEdited opens NaCl and types 500 ± 1 kJ/mol for the first ionization.
func openEdited(t *testing.T, u drive.Updater) {
	t.Helper()
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	keys(u, "g", "j", "e")
	drive.Run(u, drive.Text("500±1")...)
	keys(u, "enter")
}

func TestQuitAsksBeforeLosingChanges(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 80, 24)
	openEdited(t, u)
	if !m.Session().Dirty {
		t.Fatal("editing did not mark the session unsaved")
	}
	if msgs := drive.Run(u, drive.Key("q")); drive.Quit(msgs) {
		t.Fatal("q quit with unsaved changes")
	}
	if v := m.View(); !strings.Contains(v, "unsaved changes") || !strings.Contains(v, "keep a recovery file") {
		t.Fatalf("no question about unsaved changes:\n%s", v)
	}
	keys(u, "esc")
	if strings.Contains(m.View(), "unsaved changes.") {
		t.Fatal("esc did not go back to work")
	}
	keys(u, "q")
	msgs := drive.Run(u, drive.Key("k"))
	if !drive.Quit(msgs) {
		t.Fatal("k did not quit")
	}
	c, err := cycle.Open(db, filepath.Join(dir, "recovery.hesscycle"))
	if err != nil {
		t.Fatalf("recovery file: %v", err)
	}
	s, _ := c.Step("ionization-1")
	if math.Abs(s.Value-500) > 1e-9 || s.Source.Kind != cycle.SourceUser {
		t.Errorf("recovered ionization-1 = %+v, want the typed 500", *s)
	}
	if m.RecoveredTo() == "" {
		t.Error("RecoveredTo is empty after keeping a recovery file")
	}
}

func TestQuitWithoutChangesQuitsAtOnce(t *testing.T) {
	db := loadDB(t)
	_, u, dir := newRoot(t, db, 80, 24)
	drive.Run(u, screen.OpenMsg{Formula: "KCl"})
	if !drive.Quit(drive.Run(u, drive.Key("q"))) {
		t.Fatal("q did not quit a clean session")
	}
	if _, err := os.Stat(filepath.Join(dir, "recovery.hesscycle")); err == nil {
		t.Error("a recovery file was written for a clean session")
	}
}

func TestShutdownWritesRecovery(t *testing.T) {
	db := loadDB(t)
	_, u, dir := newRoot(t, db, 80, 24)
	openEdited(t, u)
	if !drive.Quit(drive.Run(u, tui.ShutdownMsg{Reason: "test"})) {
		t.Fatal("ShutdownMsg did not quit")
	}
	if _, err := cycle.Open(db, filepath.Join(dir, "recovery.hesscycle")); err != nil {
		t.Fatalf("no usable recovery file after shutdown: %v", err)
	}
}

// TestSuccessiveShutdownsKeepEveryFile: open NaCl, edit, shut down; then a
// new session with the same recovery path opens KBr, edits, shuts down:
// both files are there (the second once wrote over the first), and each
// session reports its own.
func TestSuccessiveShutdownsKeepEveryFile(t *testing.T) {
	db := loadDB(t)
	dir := t.TempDir()
	var got []string
	for _, formula := range []string{"NaCl", "KBr"} {
		m := tui.New(tui.Options{Renderer: drive.Renderer(), DB: db, FileRoot: dir, RecoveryPath: filepath.Join(dir, "recovery.hesscycle")}).(*tui.Model)
		u := drive.Model(m)
		drive.Run(u, tea.WindowSizeMsg{Width: 80, Height: 24})
		drive.Run(u, screen.OpenMsg{Formula: formula})
		keys(u, "g", "j", "e")
		drive.Run(u, drive.Text("500±1")...)
		keys(u, "enter")
		if !drive.Quit(drive.Run(u, tui.ShutdownMsg{Reason: "SIGTERM"})) {
			t.Fatal("ShutdownMsg did not quit")
		}
		// Asked again (the runner after a failure) it names the same file.
		again, err := m.WriteRecovery()
		if err != nil || again != m.RecoveredTo() {
			t.Errorf("%s: WriteRecovery again = %q, %v; want %q", formula, again, err, m.RecoveredTo())
		}
		got = append(got, m.RecoveredTo())
	}
	want := []string{filepath.Join(dir, "recovery.hesscycle"), filepath.Join(dir, "recovery-2.hesscycle")}
	for i, formula := range []string{"NaCl", "KBr"} {
		if got[i] != want[i] {
			t.Errorf("session %d kept its work in %q, want %q", i+1, got[i], want[i])
		}
		c, err := cycle.Open(db, want[i])
		if err != nil || c.Formula != formula {
			t.Errorf("%s: %v, %v; want the %s cycle", want[i], c, err, formula)
		}
	}
	if entries, _ := os.ReadDir(dir); len(entries) != 2 {
		t.Errorf("folder holds %d entries, want the 2 recovery files", len(entries))
	}
}

func TestSaveThenOpen(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 80, 24)
	openEdited(t, u)
	keys(u, "ctrl+s")
	if v := m.View(); !strings.Contains(v, "Save the NaCl cycle as") || !strings.Contains(v, "NaCl"+cycle.FileExtension) {
		t.Fatalf("no save prompt with a proposed name:\n%s", v)
	}
	keys(u, "enter")
	path := filepath.Join(dir, "NaCl"+cycle.FileExtension)
	if _, err := os.Stat(path); err != nil {
		t.Fatalf("not saved: %v", err)
	}
	if m.Session().Dirty || m.Session().Path != path {
		t.Errorf("after saving: dirty=%v path=%q", m.Session().Dirty, m.Session().Path)
	}
	// Open another compound, then the saved file again.
	drive.Run(u, screen.OpenMsg{Formula: "KBr"})
	keys(u, "ctrl+o")
	drive.Run(u, drive.Text("NaCl"+cycle.FileExtension)...)
	keys(u, "enter")
	c := m.Session().Cycle
	if c == nil || c.Formula != "NaCl" {
		t.Fatalf("opened %v", c)
	}
	if s, _ := c.Step("ionization-1"); s.Value != 500 {
		t.Errorf("reopened ionization-1 = %v, want the saved 500", s.Value)
	}
	if m.Session().Dirty {
		t.Error("a freshly opened file is marked unsaved")
	}
}

func TestFileNamesStayInTheFileRoot(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 80, 24)
	openEdited(t, u)
	for _, bad := range []string{"../escape", "/etc/passwd", "a/../../b"} {
		keys(u, "ctrl+s", "ctrl+u") // ctrl+u clears the proposed name
		drive.Run(u, drive.Text(bad)...)
		keys(u, "enter")
		if v := m.View(); !strings.Contains(v, "not accepted") {
			t.Errorf("%q: no refusal shown in place:\n%s", bad, v)
		}
		keys(u, "esc")
	}
	entries, _ := os.ReadDir(filepath.Dir(dir))
	for _, e := range entries {
		if strings.HasPrefix(e.Name(), "escape") {
			t.Errorf("a file escaped the root: %s", e.Name())
		}
	}
}

func TestTooSmallWindowSaysSo(t *testing.T) {
	db := loadDB(t)
	m, u, _ := newRoot(t, db, 60, 20)
	v := m.View()
	if !strings.Contains(v, "60×20") || !strings.Contains(v, "at least 80×24") {
		t.Fatalf("small window:\n%s", v)
	}
	drive.Run(u, tea.WindowSizeMsg{Width: 80, Height: 24})
	if v := m.View(); strings.Contains(v, "at least") || !strings.Contains(v, "Shelf") {
		t.Errorf("at 80×24:\n%s", v)
	}
	// At exactly the minimum every line fits.
	for i, l := range strings.Split(m.View(), "\n") {
		if n := len([]rune(l)); n > 80 {
			t.Errorf("line %d is %d cells", i, n)
		}
	}
	if n := strings.Count(m.View(), "\n") + 1; n != 24 {
		t.Errorf("%d lines at 80×24", n)
	}
}

// TestOpeningAnotherAsksFirst: opening another compound over unsaved work
// (from the shelf or with ctrl+o) puts the quit key's question, and each
// answer does what it says before the switch.
func TestOpeningAnotherAsksFirst(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 80, 24)
	openEdited(t, u)
	keys(u, "1")
	drive.Run(u, drive.Text("MgO")...)
	keys(u, "enter")
	if c := m.Session().Cycle; c.Formula != "NaCl" || !m.Session().Dirty {
		t.Fatalf("enter on MgO over unsaved NaCl opened %s without asking", c.Formula)
	}
	v := m.View()
	if !strings.Contains(v, "The NaCl cycle has unsaved changes") || !strings.Contains(v, "then open MgO") {
		t.Fatalf("no question before opening MgO:\n%s", v)
	}
	if _, err := os.Stat(filepath.Join(dir, "recovery.hesscycle")); err == nil {
		t.Fatal("a recovery file was written before the question was answered")
	}
	// At 80 columns every line of the question stays inside its box.
	for _, l := range strings.Split(v, "\n") {
		if strings.Contains(l, "║") && strings.Count(l, "║") != 2 {
			t.Errorf("a line of the question is cut or wrapped at 80 columns: %q", l)
		}
	}
	keys(u, "esc")
	if c := m.Session().Cycle; c.Formula != "NaCl" || !m.Session().Dirty {
		t.Fatalf("esc: the session holds %s (dirty %v), want the unsaved NaCl", c.Formula, m.Session().Dirty)
	}
	// k keeps the work, then opens MgO.
	keys(u, "enter", "k")
	if c := m.Session().Cycle; c.Formula != "MgO" || m.Session().Dirty {
		t.Fatalf("k: the session holds %s (dirty %v), want a clean MgO", c.Formula, m.Session().Dirty)
	}
	if v := m.View(); !strings.Contains(v, "The unsaved NaCl cycle was kept in") {
		t.Errorf("k: the status does not say where the work went:\n%s", v)
	}
	// Edit MgO and keep it the same way: the first recovery file stays.
	keys(u, "g", "j", "e")
	drive.Run(u, drive.Text("600")...)
	keys(u, "enter", "1", "ctrl+u")
	drive.Run(u, drive.Text("KCl")...)
	keys(u, "enter", "k")
	first, err := cycle.Open(db, filepath.Join(dir, "recovery.hesscycle"))
	if err != nil || first.Formula != "NaCl" {
		t.Fatalf("first recovery file: %v, %v; want the NaCl kept first", first, err)
	}
	second, err := cycle.Open(db, filepath.Join(dir, "recovery-2.hesscycle"))
	if err != nil || second.Formula != "MgO" {
		t.Fatalf("second recovery file: %v, %v; want the MgO kept second", second, err)
	}
	// ctrl+o over unsaved work asks too; s saves, then opens.
	keys(u, "g", "j", "e")
	drive.Run(u, drive.Text("450")...)
	keys(u, "enter", "ctrl+o", "ctrl+u")
	drive.Run(u, drive.Text("recovery.hesscycle")...)
	keys(u, "enter")
	if v := m.View(); m.Session().Cycle.Formula != "KCl" || !strings.Contains(v, "then open recovery.hesscycle") {
		t.Fatalf("ctrl+o over unsaved KCl did not ask:\n%s", v)
	}
	keys(u, "s", "enter")
	if _, err := cycle.Open(db, filepath.Join(dir, "KCl"+cycle.FileExtension)); err != nil {
		t.Fatalf("s did not save KCl: %v", err)
	}
	if c := m.Session().Cycle; c.Formula != "NaCl" {
		t.Fatalf("after saving, %s is open; want the NaCl of recovery.hesscycle", c.Formula)
	}
	// x discards and opens.
	keys(u, "g", "j", "e")
	drive.Run(u, drive.Text("510")...)
	keys(u, "enter", "1", "ctrl+u")
	drive.Run(u, drive.Text("MgO")...)
	keys(u, "enter", "x")
	if c := m.Session().Cycle; c.Formula != "MgO" || m.Session().Dirty {
		t.Fatalf("x: the session holds %s (dirty %v), want a clean MgO", c.Formula, m.Session().Dirty)
	}
	if _, err := os.Stat(filepath.Join(dir, "recovery-3.hesscycle")); err == nil {
		t.Error("x wrote a recovery file")
	}
}

// TestSaveAsksBeforeReplacingAFile: saving under the name of an existing
// file says what the file holds and replaces it only on a second enter.
func TestSaveAsksBeforeReplacingAFile(t *testing.T) {
	db := loadDB(t)
	m, u, dir := newRoot(t, db, 80, 24)
	openEdited(t, u)
	keys(u, "ctrl+s", "enter") // NaCl.hesscycle, a new file: no question
	nacl := filepath.Join(dir, "NaCl"+cycle.FileExtension)
	if _, err := os.Stat(nacl); err != nil {
		t.Fatalf("NaCl not saved: %v", err)
	}
	drive.Run(u, screen.OpenMsg{Formula: "MgO"})
	keys(u, "ctrl+s", "ctrl+u")
	drive.Run(u, drive.Text("NaCl")...)
	keys(u, "enter")
	if c, err := cycle.Open(db, nacl); err != nil || c.Formula != "NaCl" {
		t.Fatalf("after one enter NaCl.hesscycle holds %v (%v); it was replaced without asking", c, err)
	}
	if v := m.View(); !strings.Contains(v, "holds the NaCl cycle") || !strings.Contains(v, "enter again") {
		t.Fatalf("no question naming what the file holds:\n%s", v)
	}
	keys(u, "enter")
	if c, err := cycle.Open(db, nacl); err != nil || c.Formula != "MgO" {
		t.Fatalf("after a second enter NaCl.hesscycle holds %v (%v), want MgO", c, err)
	}
	// Saving again to the file the cycle is in does not ask.
	keys(u, "ctrl+s", "enter")
	if v := m.View(); strings.Contains(v, "already exists") {
		t.Errorf("saving to the cycle's own file asked:\n%s", v)
	}
}

// TestEveryRecoveryFileIsAnnounced: with numbered recovery files beside the
// first, the start says how many there are and names the newest.
func TestEveryRecoveryFileIsAnnounced(t *testing.T) {
	db := loadDB(t)
	dir := t.TempDir()
	for i, f := range []string{"NaCl", "MgO"} {
		c, err := cycle.Build(db, f, cycle.Options{})
		if err != nil {
			t.Fatal(err)
		}
		name := filepath.Join(dir, "recovery.hesscycle")
		if i > 0 {
			name = filepath.Join(dir, "recovery-2.hesscycle")
		}
		if err := cycle.Save(name, c); err != nil {
			t.Fatal(err)
		}
		when := time.Now().Add(time.Duration(i-2) * time.Hour)
		if err := os.Chtimes(name, when, when); err != nil {
			t.Fatal(err)
		}
	}
	m := tui.New(tui.Options{Renderer: drive.Renderer(), DB: db, FileRoot: dir, RecoveryPath: dir + "/recovery.hesscycle"}).(*tui.Model)
	u := drive.Model(m)
	drive.Run(u, tea.WindowSizeMsg{Width: 120, Height: 40})
	drive.RunCmd(u, m.Init())
	if v := m.View(); !strings.Contains(v, "2 recovery files") || !strings.Contains(v, "recovery-2.hesscycle") {
		t.Errorf("the start does not announce both recovery files and the newest:\n%s", v)
	}
}

// TestSmallWindowQuestionDrawnBeforeItActs: in a window smaller than 80×24
// the unsaved-changes question is drawn before any of its answers acts;
// where it cannot be drawn at all, discard does nothing (esc then x once
// discarded the work unseen and exited 0 with no recovery file).
func TestSmallWindowQuestionDrawnBeforeItActs(t *testing.T) {
	db := loadDB(t)
	for _, tc := range []struct {
		w, h  int
		shown bool
	}{
		{60, 10, true}, // the whole question fits
		{30, 5, true},  // a line per key
		{20, 3, false}, // nothing fits: not drawn
	} {
		t.Run(fmt.Sprintf("%dx%d", tc.w, tc.h), func(t *testing.T) {
			m, u, _ := newRoot(t, db, 80, 24)
			openEdited(t, u)
			drive.Run(u, tea.WindowSizeMsg{Width: tc.w, Height: tc.h})
			if drive.Quit(drive.Run(u, drive.Key("esc"))) {
				t.Fatal("esc quit")
			}
			v := m.View()
			if tc.shown != (strings.Contains(v, "nsaved changes") && strings.Contains(v, "discard the changes")) {
				t.Fatalf("question shown = %v, want %v:\n%s", !tc.shown, tc.shown, v)
			}
			quit := drive.Quit(drive.Run(u, drive.Key("x")))
			if quit != tc.shown {
				t.Fatalf("x quit = %v with the question shown = %v:\n%s", quit, tc.shown, v)
			}
			if !tc.shown {
				if !m.Session().Dirty {
					t.Error("the unseen question discarded the work")
				}
				keys(u, "esc")
				drive.Run(u, tea.WindowSizeMsg{Width: 80, Height: 24})
				if strings.Contains(m.View(), "unsaved changes.") {
					t.Error("esc did not go back to work")
				}
			}
		})
	}
}
