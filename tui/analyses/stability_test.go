package analyses

import (
	"strings"
	"testing"

	"enthalpath/cycle/analysis"
	"enthalpath/tui/internal/drive"
)

func kindIndex(t *testing.T, name string) int {
	t.Helper()
	for i, k := range kinds() {
		if k.name == name {
			return i
		}
	}
	t.Fatalf("no analysis %q", name)
	return -1
}

// openStability selects the stability analysis and opens its input,
// emptied; it returns the screen, its updater and the analysis's index.
func openStability(t *testing.T) (*Model, drive.Updater, int) {
	t.Helper()
	_, m, u := setup(t)
	i := kindIndex(t, "stability")
	for range i {
		drive.Run(u, drive.Key("j"))
	}
	drive.Run(u, drive.Key("e"), drive.Key("ctrl+u"))
	return m, u, i
}

// The stability analysis runs in the screen's job (off Update), shows the
// reactions with their verdicts and draws ΔrG(T); a temperature that is
// not a positive number is refused in place.
func TestStabilityView(t *testing.T) {
	m, u, i := openStability(t)
	drive.Run(u, drive.Text("MgCl3 -4")...)
	drive.Run(u, drive.Key("enter"))
	if editing, err := m.Editing(); !editing || err == nil {
		t.Fatalf("temperature -4 accepted: editing=%v err=%v", editing, err)
	}
	drive.Run(u, drive.Key("ctrl+u"))
	drive.Run(u, drive.Text("MgCl3 600")...)
	drive.Run(u, drive.Key("enter"))
	res, err := m.Result(i)
	if err != nil {
		t.Fatal(err)
	}
	st := res.(*analysis.Stability)
	if st.Temperature != 600 || len(st.Reactions) == 0 {
		t.Fatalf("stability %+v", st)
	}
	v := m.View()
	for _, want := range []string{"MgCl3 → MgCl2 + ½ Cl2(g)", "favoured", "T (K)", "heat capacities neglected"} {
		if !strings.Contains(v, want) {
			t.Errorf("view lacks %q:\n%s", want, v)
		}
	}
}

// The stability view says when the compound's volume-based S° lies outside
// the line's domain: MgO₂ as an ionic estimate is a light, stiff lattice
// (θ_D far above 2·298 K, as MgO's calorimetric 946 K is; from memory).
func TestStabilityViewEntropyDomain(t *testing.T) {
	m, u, i := openStability(t)
	drive.Run(u, drive.Text("MgO2 298")...)
	drive.Run(u, drive.Key("enter"))
	res, err := m.Result(i)
	if err != nil {
		t.Fatal(err)
	}
	st := res.(*analysis.Stability)
	if d := st.Compound.EntropyDomain; d == nil || !d.Judged || d.Inside {
		t.Fatalf("MgO2's domain %+v", d)
	}
	if v := m.View(); !strings.Contains(v, "S°: OUTSIDE the line's domain") {
		t.Errorf("view does not say the domain:\n%s", v)
	}
}
