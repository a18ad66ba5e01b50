package shelf

import (
	"strings"
	"testing"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

func setup(t *testing.T) (*drive.Fixture, *Model, drive.Updater) {
	f := drive.NewFixture(t, t.TempDir())
	m := New(f.Ctx)
	m.SetSize(80, 21)
	return f, m, f.Screen(m)
}

func openOf(msgs []tea.Msg) (screen.OpenMsg, bool) {
	for _, m := range msgs {
		if o, ok := m.(screen.OpenMsg); ok {
			return o, true
		}
	}
	return screen.OpenMsg{}, false
}

func TestOpensOnTheInventedShortlist(t *testing.T) {
	f, m, _ := setup(t)
	got := m.Matches()
	if len(got) != len(f.DB.Compounds()) {
		t.Fatalf("%d rows, want every compound (%d)", len(got), len(f.DB.Compounds()))
	}
	// The shortlist comes first, in the invented study's order, and says so.
	for i, want := range Shortlist {
		if got[i] != want {
			t.Errorf("row %d = %s, want the shortlist's %s", i, got[i], want)
		}
	}
	v := m.View()
	if !strings.Contains(v, "invented scenario") || !strings.Contains(v, "★ KCl") {
		t.Errorf("the demo is not marked invented:\n%s", v)
	}
	// ΔfH° of KCl shown from the data, in kJ/mol.
	kcl, err := f.DB.Compound("KCl")
	if err != nil {
		t.Fatal(err)
	}
	if !strings.Contains(v, f.Ctx.Energy(kcl.Formation.V)) {
		t.Errorf("KCl's formation enthalpy %s not shown", f.Ctx.Energy(kcl.Formation.V))
	}
}

func TestFilterAsYouTypeAndOpen(t *testing.T) {
	_, m, u := setup(t)
	drive.Run(u, drive.Text("nacl")...)
	if m.Selected() != "NaCl" {
		t.Fatalf("typing nacl selects %q (matches %v), want NaCl first", m.Selected(), m.Matches())
	}
	for _, f := range m.Matches() {
		if !strings.Contains(strings.ToLower(f), "nacl") {
			t.Errorf("filter nacl shows %s", f)
		}
	}
	msgs := drive.Run(u, drive.Key("enter"))
	o, ok := openOf(msgs)
	if !ok || o.Formula != "NaCl" || o.Guided {
		t.Fatalf("enter sent %+v, want to open NaCl solved", o)
	}
	msgs = drive.Run(u, drive.Key("ctrl+g"))
	if o, ok := openOf(msgs); !ok || !o.Guided {
		t.Errorf("ctrl+g sent %+v, want the guided assembly", o)
	}
	// Words filter on name and family too.
	drive.Run(u, drive.Key("esc"))
	drive.Run(u, drive.Text("silver halide")...)
	for _, f := range m.Matches() {
		if !strings.HasPrefix(f, "Ag") {
			t.Errorf("silver halide shows %s", f)
		}
	}
	if len(m.Matches()) < 3 {
		t.Errorf("silver halide shows only %v", m.Matches())
	}
}

// A formula the data lack: with nothing on the shelf matching (SrAt: no
// compound of Sr and At), enter goes to the guided assembly of it. So it
// does when the filter still shows compounds containing it (MgCl shows
// MgCl2), as README's Shelf row promises ("a formula the data lack goes to
// the guided build"): no row is highlighted and a line says what enter
// does, until ↓ picks a row, which enter then opens; ctrl+g always
// assembles the formula as typed.
func TestUnknownFormulaGoesToTheAssembly(t *testing.T) {
	_, m, u := setup(t)
	drive.Run(u, drive.Text("SrAt")...)
	if len(m.Matches()) != 0 {
		t.Fatalf("SrAt matches %v", m.Matches())
	}
	if !strings.Contains(m.View(), "assembles a cycle for \"SrAt\"") {
		t.Errorf("no hint for a formula the data lack:\n%s", m.View())
	}
	o, ok := openOf(drive.Run(u, drive.Key("enter")))
	if !ok || o.Formula != "SrAt" || !o.Guided {
		t.Errorf("enter on SrAt sent %+v, want the guided assembly of SrAt", o)
	}

	_, m, u = setup(t)
	drive.Run(u, drive.Text("MgCl")...)
	if got := m.Matches(); len(got) == 0 || got[0] != "MgCl2" {
		t.Fatalf("MgCl shows %v, want MgCl2 (the data's magnesium chloride) among the rows", got)
	}
	v := m.View()
	if m.Selected() != "" || strings.Contains(v, "\n›") {
		t.Errorf("MgCl highlights %q; no row should be, enter assembles MgCl:\n%s", m.Selected(), v)
	}
	if !strings.Contains(v, "MgCl is not in the data: enter assembles it") {
		t.Errorf("the view does not say what enter does:\n%s", v)
	}
	if o, ok := openOf(drive.Run(u, drive.Key("enter"))); !ok || o.Formula != "MgCl" || !o.Guided {
		t.Errorf("enter on the typed MgCl sent %+v, want the guided assembly of MgCl", o)
	}
	drive.Run(u, drive.Key("down"))
	if m.Selected() != "MgCl2" {
		t.Fatalf("↓ after MgCl highlights %q, want the first row MgCl2", m.Selected())
	}
	if o, ok := openOf(drive.Run(u, drive.Key("enter"))); !ok || o.Formula != "MgCl2" || o.Guided {
		t.Errorf("enter with MgCl2 picked sent %+v, want MgCl2 opened", o)
	}
	if o, ok := openOf(drive.Run(u, drive.Key("ctrl+g"))); !ok || o.Formula != "MgCl" || !o.Guided {
		t.Errorf("ctrl+g on the typed MgCl sent %+v, want the guided assembly of MgCl", o)
	}
}

func TestMovementStaysInRange(t *testing.T) {
	_, m, u := setup(t)
	drive.Run(u, drive.Key("up"))
	if m.Selected() != Shortlist[0] {
		t.Errorf("up at the top moved to %s", m.Selected())
	}
	drive.Run(u, drive.Key("down"), drive.Key("ctrl+n"))
	if m.Selected() != Shortlist[2] {
		t.Errorf("two downs: %s, want %s", m.Selected(), Shortlist[2])
	}
	for i := 0; i < 100; i++ {
		drive.Run(u, drive.Key("pgdown"))
	}
	if got, all := m.Selected(), m.Matches(); got != all[len(all)-1] {
		t.Errorf("after many pages: %s, want the last %s", got, all[len(all)-1])
	}
	if !strings.Contains(m.View(), "› ") {
		t.Error("the highlighted row is scrolled out of view")
	}
}

func TestUserCompoundsAreMarked(t *testing.T) {
	f := drive.NewFixture(t, t.TempDir())
	// An overlay with one invented compound (a test fixture, not data) and
	// one override of a built-in value.
	db, err := f.DB.WithOverlay(strings.NewReader(`
[[compound]]
formula = "KBr2"
name = "invented test compound"
cation = "K+"
cation_count = 1
anion = "Br-"
anion_count = 2

[[compound]]
formula = "NaCl"
formation_kj_per_mol = -411.0
formation_uncertainty = 0.5
`), "user.toml")
	if err != nil {
		t.Fatal(err)
	}
	f.Ctx.DB = db
	m := New(f.Ctx)
	m.SetSize(100, 30)
	u := f.Screen(m)
	drive.Run(u, drive.Text("KBr2")...)
	if m.Selected() != "KBr2" {
		t.Fatalf("the user's compound is not on the shelf: %v", m.Matches())
	}
	drive.Run(u, drive.Key("esc"))
	drive.Run(u, drive.Text("sodium chloride")...)
	if v := m.View(); !strings.Contains(v, "›u NaCl") {
		t.Errorf("an overridden compound lacks its u marker:\n%s", v)
	}
}

// TestScenarioNoteIsWhole: the note that says what is invented and that
// the data are real reads whole at every supported width (at 80 it was cut
// before "data real, cited"), and the view keeps to the screen's height.
func TestScenarioNoteIsWhole(t *testing.T) {
	for _, size := range [][2]int{{80, 21}, {100, 27}, {120, 37}} {
		_, m, _ := setup(t)
		m.SetSize(size[0], size[1])
		v := m.View()
		if !strings.Contains(strings.Join(strings.Fields(v), " "), Scenario) {
			t.Errorf("%d columns: the scenario note is not whole:\n%s", size[0], v)
		}
		if n := len(strings.Split(v, "\n")); n > size[1] {
			t.Errorf("%d×%d: the view has %d lines", size[0], size[1], n)
		}
	}
}
