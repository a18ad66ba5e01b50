package analyses

import (
	"fmt"
	"slices"
	"strings"
	"testing"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/internal/drive"
)

func setup(t *testing.T) (*drive.Fixture, *Model, drive.Updater) {
	t.Helper()
	f := drive.NewFixture(t, t.TempDir())
	m := New(f.Ctx, f.Session)
	m.SetSize(120, 37)
	return f, m, f.Screen(m)
}

func TestListsTheAnalyses(t *testing.T) {
	_, m, u := setup(t)
	v := m.View()
	for _, k := range kinds() {
		if !strings.Contains(v, k.name) || !strings.Contains(v, k.example) {
			t.Errorf("analysis %s not listed with its example", k.name)
		}
	}
	drive.Run(u, drive.Key("j"), drive.Key("j"))
	if m.Cursor() != 2 {
		t.Errorf("cursor %d after two downs", m.Cursor())
	}
	drive.Run(u, drive.Key("k"), drive.Key("k"), drive.Key("k"))
	if m.Cursor() != 0 {
		t.Errorf("cursor %d after three ups from 2", m.Cursor())
	}
}

// TestScanOfMagnesiumChlorides: MgCl is unstable with respect to
// disproportionation into Mg and MgCl₂, and MgCl₃ is strongly endothermic
// (the standard textbook result; e.g. Greenwood & Earnshaw, Chemistry of
// the Elements, from memory).
func TestScanOfMagnesiumChlorides(t *testing.T) {
	_, m, u := setup(t)
	drive.Run(u, drive.Key("j")) // scan, with its example Mg Cl 3
	drive.Run(u, drive.Key("r"))
	res, err := m.Result(1)
	if err != nil {
		t.Fatal(err)
	}
	s := res.(*analysis.Scan)
	var found bool
	for _, d := range s.Disproportionations {
		if strings.HasPrefix(d.Reaction, "2 MgCl ->") {
			found = true
			if !d.Favoured || d.Enthalpy >= 0 {
				t.Errorf("%s: %+.1f kJ/mol, want favoured (exothermic)", d.Reaction, d.Enthalpy)
			}
		}
	}
	if !found {
		t.Errorf("no disproportionation of MgCl in %+v", s.Disproportionations)
	}
	for _, c := range s.Compounds {
		if c.Formula == "MgCl3" && c.Formation < 200 {
			t.Errorf("MgCl3 ΔfH %.0f kJ/mol, want strongly endothermic", c.Formation)
		}
	}
	v := m.View()
	for _, want := range []string{"MgCl2", "2 MgCl -> Mg + MgCl2", "favoured"} {
		if !strings.Contains(v, want) {
			t.Errorf("scan view lacks %q:\n%s", want, v)
		}
	}
}

func TestTypedArgumentsAndTheirErrors(t *testing.T) {
	_, m, u := setup(t)
	example := m.Args(0)
	// estimate: replace the example with a bad model name; it is refused
	// on Enter, in place, and neither remembered nor run.
	drive.Run(u, drive.Key("e"), drive.Key("ctrl+u"))
	drive.Run(u, drive.Text("MgCl nosuchmodel")...)
	drive.Run(u, drive.Key("enter"))
	if editing, err := m.Editing(); !editing || err == nil || !strings.Contains(err.Error(), "model") {
		t.Errorf("bad model: editing=%v err=%v, want refused in place", editing, err)
	}
	if v := m.View(); !strings.Contains(v, "not accepted") || !strings.Contains(v, "nosuchmodel") {
		t.Errorf("the refusal is not shown:\n%s", v)
	}
	if res, err := m.Result(0); res != nil || err != nil || m.Args(0) != example {
		t.Errorf("refused arguments were applied: args %q, result %v, %v", m.Args(0), res, err)
	}
	drive.Run(u, drive.Key("esc"))
	if editing, _ := m.Editing(); editing || m.Args(0) != example {
		t.Errorf("esc: editing=%v, args %q, want closed with %q", editing, m.Args(0), example)
	}
	// Well-formed arguments the analysis cannot answer: accepted, run,
	// and the analysis's error is the result.
	drive.Run(u, drive.Key("e"), drive.Key("ctrl+u"))
	drive.Run(u, drive.Text("Zz2Q")...)
	drive.Run(u, drive.Key("enter"))
	if _, err := m.Result(0); err == nil || m.Args(0) != "Zz2Q" {
		t.Errorf("Zz2Q: args %q, err %v, want run and failed", m.Args(0), err)
	}
	if v := m.View(); !strings.Contains(v, "not done") {
		t.Errorf("the error is not shown:\n%s", v)
	}
	drive.Run(u, drive.Key("e"), drive.Key("ctrl+u"))
	drive.Run(u, drive.Text("CaF2")...)
	drive.Run(u, drive.Key("enter"))
	res, err := m.Result(0)
	if err != nil {
		t.Fatal(err)
	}
	e := res.(*analysis.Estimate)
	// CaF2 is tabulated: the estimate is set beside the data's −1219.6
	// kJ/mol (NBS tables, as in the data) and a Kapustinskii estimate
	// should land within its model σ plus 5 %.
	if e.Measured == nil {
		t.Fatal("no measured formation enthalpy beside the estimate")
	}
	if d := e.Value - e.Measured.Value; d*d > (e.Uncertainty+0.05*1220)*(e.Uncertainty+0.05*1220) {
		t.Errorf("estimate %.1f vs data %.1f: further than σ %.1f + 5 %%", e.Value, e.Measured.Value, e.Uncertainty)
	}
	if !strings.Contains(m.View(), "the data's value") {
		t.Errorf("the estimate view does not compare with the data:\n%s", m.View())
	}
	// Each analysis keeps its own arguments: the scan's are untouched, and
	// the editor reopens on the estimate's last accepted ones.
	drive.Run(u, drive.Key("j"), drive.Key("e"))
	if v := m.View(); !strings.Contains(v, "scan › "+m.Args(1)) || m.Args(1) != kinds()[1].example {
		t.Errorf("scan's arguments: %q\n%s", m.Args(1), v)
	}
	drive.Run(u, drive.Key("esc"), drive.Key("k"), drive.Key("e"))
	if v := m.View(); !strings.Contains(v, "estimate › CaF2") {
		t.Errorf("the estimate's editor does not reopen on CaF2:\n%s", v)
	}
}

func TestSolutionAndRadiusRun(t *testing.T) {
	_, m, u := setup(t)
	drive.Run(u, drive.Key("j"), drive.Key("j"), drive.Key("r"))
	if _, err := m.Result(2); err != nil {
		t.Errorf("solution NaCl: %v", err)
	} else if !strings.Contains(m.View(), "hydration scale") {
		t.Errorf("solution view lacks the hydration scale:\n%s", m.View())
	}
	drive.Run(u, drive.Key("j"), drive.Key("r"))
	if _, err := m.Result(3); err != nil {
		t.Errorf("radius NH4Cl: %v", err)
	} else if !strings.Contains(m.View(), "effective Born–Mayer ρ") {
		t.Errorf("radius view:\n%s", m.View())
	}
}

// TestRadiusFitRuns: the fit over salts runs with given counter-ion radii,
// uses them and says so, lists every salt it used, and refuses a malformed
// radius list in place.
func TestRadiusFitRuns(t *testing.T) {
	_, m, u := setup(t)
	drive.Run(u, drive.Key("j"), drive.Key("j"), drive.Key("j"), drive.Key("j"), drive.Key("e"), drive.Key("ctrl+u"))
	drive.Run(u, drive.Text("NO3- K+=1.33,Na+=0.98")...)
	drive.Run(u, drive.Key("enter"))
	res, err := m.Result(4)
	if err != nil {
		t.Fatalf("radius fit %s: %v", m.Args(4), err)
	}
	f := res.(*analysis.FittedRadius)
	v := m.View()
	drive.Run(u, drive.Key("f")) // the list is longer than the screen: page down once
	v += m.View()
	for _, s := range f.Used() {
		if !strings.Contains(v, s.Formula) {
			t.Errorf("salt %s used but not shown:\n%s", s.Formula, v)
		}
		if s.Counter == "K+" && s.CounterRadius.Value != 1.33 {
			t.Errorf("K+ at %.3f Å, not the given 1.33", s.CounterRadius.Value)
		}
	}
	if !strings.Contains(v, "K+ 1.33 Å") || !strings.Contains(v, "as given") {
		t.Errorf("the view does not say which counter-radii were given:\n%s", v)
	}
	if len(f.Used()) < 2 || !strings.Contains(v, "fitted over") {
		t.Errorf("fit of NO3-: %d salts\n%s", len(f.Used()), v)
	}
	drive.Run(u, drive.Key("e"), drive.Key("ctrl+u"))
	drive.Run(u, drive.Text("NO3- K+=big")...)
	drive.Run(u, drive.Key("enter"))
	if editing, err := m.Editing(); !editing || err == nil || !strings.Contains(err.Error(), "K+") {
		t.Errorf("bad radius list: editing=%v err=%v, want refused naming K+", editing, err)
	}
}

// TestTallResultScrolls: a result taller than the screen is shown through a
// window that says where it is, the scroll keys move it and stop at the
// ends, and they are offered in the help only when they would move it.
func TestTallResultScrolls(t *testing.T) {
	_, m, u := setup(t)
	const height = 18 // one line per analysis (seven) above the result window
	m.SetSize(80, height)
	drive.Run(u, drive.Key("j"), drive.Key("r")) // the scan: taller than the screen
	first := m.View()
	if !strings.Contains(first, "lines 1–") || len(strings.Split(first, "\n")) > height {
		t.Fatalf("no window on a tall result, or taller than the screen:\n%s", first)
	}
	helpHas := func(k string) bool {
		for _, g := range m.FullHelp() {
			for _, b := range g {
				if b.Help().Key == k {
					return true
				}
			}
		}
		return false
	}
	if !helpHas(m.KeyMap.More.Help().Key) || helpHas(m.KeyMap.Back.Help().Key) {
		t.Errorf("at the top the help should offer down only")
	}
	for range 20 {
		drive.Run(u, drive.Key("pgdown"))
	}
	bottom := m.View()
	if bottom == first || !strings.Contains(bottom, "entropy") {
		t.Errorf("pgdown did not reach the end of the result:\n%s", bottom)
	}
	if helpHas(m.KeyMap.More.Help().Key) || !helpHas(m.KeyMap.Back.Help().Key) {
		t.Errorf("at the bottom the help should offer up only")
	}
	for range 20 {
		drive.Run(u, drive.Key("pgup"))
	}
	if m.View() != first {
		t.Errorf("pgup did not come back to the top:\n%s", m.View())
	}
}

// TestResultsAreNotCut: at the widths the workshop supports, every
// analysis, run on its example, shows its result rows whole (what does not
// fit continues below: the result scrolls), and the highlighted
// analysis's description reads whole though the list cuts it.
func TestResultsAreNotCut(t *testing.T) {
	for _, w := range []int{80, 100, 120} {
		_, m, u := setup(t)
		m.SetSize(w, 200) // tall enough to show every line at once
		for i, k := range kinds() {
			drive.Run(u, drive.Key("r"))
			v := m.View()
			if !strings.Contains(strings.Join(strings.Fields(v), " "), k.name+": "+k.what) &&
				!strings.Contains(v, k.what) {
				t.Errorf("%d columns: the description of %s is not shown whole:\n%s", w, k.name, v)
			}
			for _, l := range strings.Split(v, "\n") {
				l = strings.TrimRight(l, " ")
				listRow := false
				for _, kk := range kinds() {
					if strings.HasPrefix(l, "  "+kk.name+" ") || strings.HasPrefix(l, "› "+kk.name+" ") {
						listRow = true
					}
				}
				if !listRow && strings.HasSuffix(l, "…") {
					t.Errorf("%d columns, %s: a line is cut: %q", w, k.name, l)
				}
			}
			if i < len(kinds())-1 {
				drive.Run(u, drive.Key("j"))
			}
		}
	}
}

// TestRadiusFitDefaultsToTheDataRadii: the workshop's radius fit, run on
// its example as offered, uses the data's counter-radii as the command
// line does (analysis.FitRadius with no radii, what `radius --all-salts`
// calls) and says so; it once came pre-filled with K+=1.33,Na+=0.98
// (Goldschmidt's) and gave another radius than the command line, silently.
func TestRadiusFitDefaultsToTheDataRadii(t *testing.T) {
	f, m, u := setup(t)
	drive.Run(u, drive.Key("j"), drive.Key("j"), drive.Key("j"), drive.Key("j"), drive.Key("r"))
	res, err := m.Result(4)
	if err != nil {
		t.Fatalf("radius fit %s: %v", m.Args(4), err)
	}
	got := res.(*analysis.FittedRadius)
	want, err := analysis.New(f.DB).FitRadius("NO3-", analysis.FitOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if got.Radius != want.Radius {
		t.Errorf("workshop fit %.4f Å, command line's %.4f Å", got.Radius, want.Radius)
	}
	if v := m.View(); !strings.Contains(v, "counter-ion radii: the data's") {
		t.Errorf("the view does not say the counter-radii are the data's:\n%s", v)
	}
}

// TestIonFitRunsOffTheUpdatePath: the ion fit runs in a command; until its
// result arrives the screen says it is running, then shows the fitted
// value with its standard error and the salts outside 2σ.
func TestIonFitRunsOffTheUpdatePath(t *testing.T) {
	_, m, u := setup(t)
	i := slices.IndexFunc(kinds(), func(k kind) bool { return k.name == "ion fit" })
	for range i {
		drive.Run(u, drive.Key("j"))
	}
	if m.kinds[m.Cursor()].name != "ion fit" {
		t.Fatalf("cursor on %q", m.kinds[m.Cursor()].name)
	}
	cmd := u(drive.Key("r")) // the command is returned, not yet run
	if cmd == nil || !strings.Contains(m.View(), "running…") {
		t.Fatalf("no command, or no running state shown:\n%s", m.View())
	}
	drive.RunCmd(u, cmd)
	res, err := m.Result(i)
	if err != nil {
		t.Fatal(err)
	}
	f := res.(*analysis.IonFit)
	v := m.View()
	for _, w := range []string{"ΔfH°(SO4^2-, g)", fmt.Sprintf("over %d of %d salts", len(f.Used()), len(f.Salts)), "lattice enthalpies from"} {
		if !strings.Contains(v, w) {
			t.Errorf("ion fit view lacks %q:\n%s", w, v)
		}
	}
	if out := f.Outside(); len(out) > 0 {
		for range 40 {
			drive.Run(u, drive.Key("pgdown"))
		}
		if v := m.View(); !strings.Contains(v, "outside 2σ: "+strings.Join(out, ", ")) {
			t.Errorf("the end of the result does not name the salts outside 2σ (%v):\n%s", out, v)
		}
	}
}
