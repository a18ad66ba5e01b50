package tui_test

import (
	"strings"
	"testing"

	"github.com/charmbracelet/bubbles/key"
	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/data"
	"enthalpath/tui"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

func loadDB(t testing.TB) *data.DB {
	t.Helper()
	db, err := data.Load()
	if err != nil {
		t.Fatal(err)
	}
	return db
}

// newRoot returns the workshop at w×h with plain-text styles, files and
// recovery in a temporary folder.
func newRoot(t testing.TB, db *data.DB, w, h int) (*tui.Model, drive.Updater, string) {
	t.Helper()
	dir := t.TempDir()
	m := tui.New(tui.Options{Renderer: drive.Renderer(), DB: db, FileRoot: dir, RecoveryPath: dir + "/recovery.hesscycle"}).(*tui.Model)
	u := drive.Model(m)
	drive.RunCmd(u, m.Init())
	drive.Run(u, tea.WindowSizeMsg{Width: w, Height: h})
	return m, u, dir
}

func keys(u drive.Updater, names ...string) {
	for _, n := range names {
		drive.Run(u, drive.Key(n))
	}
}

// preps put each screen in a state where every key of its help has
// something to act on (a cursor away from the ends, a value to reset, a
// decided step to go back over, a filter to clear).
var preps = []struct {
	name string
	id   screen.ID
	prep func(t testing.TB, u drive.Updater)
}{
	{"shelf", screen.Shelf, func(t testing.TB, u drive.Updater) {
		drive.Run(u, drive.Text("a")...)
		keys(u, "down", "down")
	}},
	{"bench", screen.Bench, func(t testing.TB, u drive.Updater) {
		drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
		keys(u, "g", "j", "e")
		drive.Run(u, drive.Text("500")...)
		keys(u, "enter")
	}},
	{"assembly", screen.Assembly, func(t testing.TB, u drive.Updater) {
		drive.Run(u, screen.OpenMsg{Formula: "NaCl", Guided: true})
		keys(u, "y")
	}},
	{"models", screen.Models, func(t testing.TB, u drive.Updater) {
		drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
		keys(u, "4", "j", "j", "j", "l")
	}},
	{"survey", screen.Survey, func(t testing.TB, u drive.Updater) {
		keys(u, "tab", "tab", "tab", "tab", "j", "j")
	}},
	{"analyses", screen.Analyses, func(t testing.TB, u drive.Updater) {
		keys(u, "shift+tab", "j")
	}},
}

// TestEveryHelpKeyDoesSomething presses, on each screen, every key of every
// binding its full help lists (the screen's and the global ones) and checks
// the key had an observable effect: the screen changed or the program quit.
// Help text and key come from the same key.Binding, so the help cannot
// list a key that does nothing.
func TestEveryHelpKeyDoesSomething(t *testing.T) {
	db := loadDB(t)
	for _, p := range preps {
		t.Run(p.name, func(t *testing.T) {
			m, u, _ := newRoot(t, db, 100, 30)
			p.prep(t, u)
			if m.Active() != p.id {
				t.Fatalf("prep left screen %d active, want %d", m.Active(), p.id)
			}
			for _, group := range m.FullHelp() {
				for _, b := range group {
					h := b.Help()
					if h.Key == "" || h.Desc == "" {
						t.Errorf("binding %v has no help text", b.Keys())
					}
					for _, k := range b.Keys() {
						if k == string(rune('1'+p.id)) && key.Matches(drive.Key(k), m.Keys.GoTo) {
							continue // going to the screen already shown is rightly a no-op
						}
						m, u, _ := newRoot(t, db, 100, 30)
						p.prep(t, u)
						before := m.View()
						msgs := drive.Run(u, drive.Key(k))
						if after := m.View(); after == before && !drive.Quit(msgs) {
							t.Errorf("%s: key %q (%s: %s) changed nothing", p.name, k, h.Key, h.Desc)
						}
					}
				}
			}
		})
	}
}

// TestHelpKeysMeanWhatTheySay checks the effect of the keys whose help
// names a precise outcome.
func TestHelpKeysMeanWhatTheySay(t *testing.T) {
	db := loadDB(t)
	m, u, _ := newRoot(t, db, 100, 30)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	if m.Active() != screen.Bench {
		t.Fatalf("enter on a compound shows screen %d, want the bench", m.Active())
	}
	keys(u, "tab")
	if m.Active() != screen.Assembly {
		t.Errorf("tab: screen %d, want the next one", m.Active())
	}
	keys(u, "shift+tab", "3")
	if m.Active() != screen.Assembly {
		t.Errorf("3: screen %d, want the third", m.Active())
	}
	keys(u, "2", "u")
	if m.Context().Units.String() != "kcal/mol" || !strings.Contains(m.View(), "kcal/mol") {
		t.Errorf("u: units %v", m.Context().Units)
	}
	keys(u, "u", "u")
	if m.Context().Units.String() != "kJ/mol" {
		t.Errorf("u three times: units %v, want back to kJ/mol", m.Context().Units)
	}
	keys(u, "?")
	if v := m.View(); !strings.Contains(v, "Keys on the Bench screen") {
		t.Errorf("? did not open the key list:\n%s", v)
	}
	keys(u, "esc")
	if strings.Contains(m.View(), "Keys on the") {
		t.Error("esc did not close the key list")
	}
	// On the shelf, while the filter holds text, "?" is text and f1 opens
	// the list; the printable global keys are not listed then.
	keys(u, "1")
	drive.Run(u, drive.Text("Na?")...)
	if strings.Contains(m.View(), "Keys on the") {
		t.Error("? opened the key list while the shelf was typing")
	}
	keys(u, "f1")
	if !strings.Contains(m.View(), "Keys on the Shelf screen") {
		t.Error("f1 did not open the key list on the shelf")
	}
	for _, g := range m.FullHelp() {
		for _, b := range g {
			for _, k := range b.Keys() {
				if len([]rune(k)) == 1 && strings.Contains("qu123456?", k) {
					t.Errorf("the shelf's help lists the printable global key %q while the filter holds text", k)
				}
			}
		}
	}
	// With the filter empty, they act as README says: ? lists the keys,
	// 2 goes to the Bench, q quits (the README's rule, once broken: q and
	// the digits went into the filter).
	keys(u, "esc", "ctrl+u")
	for range 3 {
		keys(u, "backspace")
	}
	keys(u, "?")
	if !strings.Contains(m.View(), "Keys on the Shelf screen") {
		t.Errorf("? with an empty filter did not open the key list:\n%s", m.View())
	}
	keys(u, "esc", "2")
	if m.Active() != screen.Bench {
		t.Errorf("2 with an empty filter: screen %d, want the Bench", m.Active())
	}
	keys(u, "1")
	if msgs := drive.Run(u, drive.Key("q")); !drive.Quit(msgs) && !strings.Contains(m.View(), "unsaved changes") {
		t.Errorf("q with an empty filter neither quit nor asked about unsaved work:\n%s", m.View())
	}
}

// TestFastKeysAreTakenOneByOne: keys typed faster than the terminal is read
// arrive as one message; each must still act.
func TestFastKeysAreTakenOneByOne(t *testing.T) {
	db := loadDB(t)
	m, u, _ := newRoot(t, db, 100, 30)
	drive.Run(u, screen.OpenMsg{Formula: "NaCl"})
	drive.Run(u, tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune("gjjj")})
	type cursorer interface{ Cursor() int }
	if got := m.Screen(screen.Bench).(cursorer).Cursor(); got != 3 {
		t.Errorf("after g j j j in one message the cursor is on row %d, want 3", got)
	}
	// "e" starts typing: what follows in the same message is the value.
	drive.Run(u, tea.KeyMsg{Type: tea.KeyRunes, Runes: []rune("e250")})
	drive.Run(u, drive.Key("enter"))
	s := m.Session().Cycle.Steps[3]
	if s.Value != 250 {
		t.Errorf("step %s = %v after typing e250 enter fast, want 250", s.Key, s.Value)
	}
}

// TestConventionKeys: c and t switch the conventions the bench says they
// switch, and for a neutral salt the lattice value from Hess's law does
// not depend on the ionization convention (the 5/2·RT terms cancel; see
// the cycle package comment, after Jenkins, J. Chem. Educ. 82, 950 (2005)).
func TestConventionKeys(t *testing.T) {
	db := loadDB(t)
	m, u, _ := newRoot(t, db, 100, 30)
	drive.Run(u, screen.OpenMsg{Formula: "KCl"})
	before := m.Session().Solved().Lattice
	keys(u, "t")
	c := m.Session().Cycle
	if c.Conventions.Ionization.String() != "298K" {
		t.Fatalf("t: ionization convention %v", c.Conventions.Ionization)
	}
	after := m.Session().Solved().Lattice
	if d := after.Enthalpy - before.Enthalpy; d*d > 1e-12 {
		t.Errorf("lattice ΔH_L moved by %g kJ/mol with the ionization convention", d)
	}
	keys(u, "c")
	if c.Conventions.Lattice.Symbol() != "U" || !strings.Contains(m.View(), "U, ionization at 298K") {
		t.Errorf("c: lattice convention %v", c.Conventions.Lattice)
	}
	if got := m.Session().Solved().Solved.Value; (got-after.Energy)*(got-after.Energy) > 1e-12 {
		t.Errorf("under U the solved lattice step is %v, want U = %v", got, after.Energy)
	}
}

// TestStatusNamesOnlyHelpKeysThatWork: the idle status line names the keys
// that open the key list, and on the Shelf, where ? is text while the
// filter holds some, only f1.
func TestStatusNamesOnlyHelpKeysThatWork(t *testing.T) {
	db := loadDB(t)
	m, u, _ := newRoot(t, db, 100, 30)
	drive.Run(u, drive.Text("Na")...)
	v := m.View()
	if strings.Contains(v, "? or f1") || !strings.Contains(v, "f1 lists every key") {
		t.Errorf("the Shelf's status names ? (text there) or no help key:\n%s", v)
	}
	keys(u, "tab")
	if v := m.View(); !strings.Contains(v, "? or f1 lists every key") {
		t.Errorf("the Bench's status does not name ? and f1:\n%s", v)
	}
}

// lastLine is the help line of a view.
func lastLine(v string) string {
	lines := strings.Split(strings.TrimRight(v, "\n"), "\n")
	return lines[len(lines)-1]
}

// TestFooterFollowsWhatIsShown: the help line lists the question's keys
// while it is asked, no screen key that has nothing to act on before a
// cycle is open, and an error in the status line goes with the next key.
func TestFooterFollowsWhatIsShown(t *testing.T) {
	db := loadDB(t)
	m, u, _ := newRoot(t, db, 120, 40)
	for _, id := range []screen.ID{screen.Bench, screen.Assembly, screen.Models} {
		keys(u, "tab") // from the Shelf, where digits are text
		if m.Active() != id {
			t.Fatalf("tab: screen %d, want %d", m.Active(), id)
		}
		for _, b := range m.Screen(id).ShortHelp() {
			t.Errorf("screen %s with no cycle lists %s (%s)", m.Screen(id).Title(), b.Help().Key, b.Help().Desc)
		}
		if foot := lastLine(m.View()); !strings.Contains(foot, "go to screen") {
			t.Errorf("screen %s with no cycle: help line %q, want the screen keys that work", m.Screen(id).Title(), foot)
		}
	}
	keys(u, "ctrl+s")
	if v := m.View(); !strings.Contains(v, "error: nothing to save") {
		t.Fatalf("no error for ctrl+s without a cycle:\n%s", v)
	}
	keys(u, "tab")
	if v := m.View(); strings.Contains(v, "nothing to save") {
		t.Errorf("the error stayed after the next key:\n%s", v)
	}
	openEdited(t, u)
	keys(u, "q")
	foot := lastLine(m.View())
	if !strings.Contains(foot, "save, then quit") || strings.Contains(foot, "type a value") {
		t.Errorf("the quit question's help line is %q, want its own keys", foot)
	}
	keys(u, "s")
	if foot := lastLine(m.View()); !strings.Contains(foot, "esc") || strings.Contains(foot, "type a value") {
		t.Errorf("the save prompt's help line is %q, want its keys", foot)
	}
}
