package analyses

import (
	"strings"
	"testing"

	"enthalpath/tui/internal/drive"
)

func TestListsTheAnalyses(t *testing.T) {
	f := drive.NewFixture(t, t.TempDir())
	m := New(f.Ctx, f.Session)
	m.SetSize(80, 21)
	u := f.Screen(m)
	v := m.View()
	for _, a := range list() {
		if !strings.Contains(v, a.name) {
			t.Errorf("analysis %s not listed", a.name)
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
