package tui_test

import (
	"bytes"
	"fmt"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/exp/golden"
	"github.com/charmbracelet/x/exp/teatest"

	"enthalpath/tui"
	"enthalpath/tui/internal/drive"
)

// The golden files under testdata/TestGolden hold the main screens as plain
// text (colour profile pinned to ASCII) at 80×24 and 120×40. They are
// produced by driving the real program with teatest; regenerate them with
//
//	go test ./tui -run TestGolden -update
//
// after a deliberate change of layout or data, and read the diff.
func TestGolden(t *testing.T) {
	db := loadDB(t)
	flows := []struct {
		name    string
		initial string
		keys    []string
		text    string
		// waitFor is text the final screen must show before it is taken.
		waitFor string
	}{
		{name: "shelf", waitFor: "compounds ·"},
		{name: "shelf-filtered", text: "bromide", waitFor: fmt.Sprintf("of %d", len(db.Compounds()))},
		{name: "bench-NaCl", initial: "NaCl", waitFor: "∴ solved"},
		// The solved lattice step given a value: the cycle is
		// over-determined; the closure residual is shown as a number and
		// drawn as the miss between the path's end and the one solid level.
		{name: "bench-NaCl-overdetermined", initial: "NaCl", keys: []string{"e", "type:-780", "enter"}, waitFor: "over-determined"},
		{name: "bench-CaF2-source", initial: "CaF2", keys: []string{"g", "j", "s"}, waitFor: "citation:"},
		{name: "assembly-KCl", initial: "KCl", keys: []string{"a", "wait:Assembling", "y", "y", "y"}, waitFor: "step 4 of"},
		{name: "models-MgO", initial: "MgO", keys: []string{"4"}, waitFor: "Ewald Madelung"},
		{name: "survey", keys: []string{"tab", "tab", "tab", "tab"}, waitFor: "sorted by"},
		// The chart of model against cycle: round ticks, axes that reach
		// every point; l puts both on a log scale for the crowded end.
		{name: "survey-chart", keys: []string{"tab", "tab", "tab", "tab", "wait:sorted by", "p"}, waitFor: "against the cycle"},
		{name: "survey-chart-log", keys: []string{"tab", "tab", "tab", "tab", "wait:sorted by", "p", "wait:against the cycle", "l"}, waitFor: "log scale"},
		{name: "help-bench", initial: "NaCl", keys: []string{"?"}, waitFor: "Keys on the Bench"},
		// The scan's own result line: "disproportionations" is in the
		// static description too, so waiting for it could snapshot the
		// screen while the scan was still running.
		{name: "analyses-scan", keys: []string{"shift+tab", "wait:Analyses beyond", "j", "r"}, waitFor: "Mg with Cl (Cl-), lattice from"},
	}
	for _, size := range [][2]int{{80, 24}, {120, 40}} {
		for _, f := range flows {
			t.Run(fmt.Sprintf("%s-%dx%d", f.name, size[0], size[1]), func(t *testing.T) {
				m := tui.New(tui.Options{Renderer: drive.Renderer(), DB: db, FileRoot: t.TempDir(), Initial: f.initial})
				tm := teatest.NewTestModel(t, m, teatest.WithInitialTermSize(size[0], size[1]))
				if f.initial != "" && f.waitFor != "∴ solved" {
					waitText(t, tm, "∴ solved")
				}
				if f.text != "" {
					tm.Type(f.text)
				}
				for _, k := range f.keys {
					if text, ok := strings.CutPrefix(k, "wait:"); ok {
						waitText(t, tm, text) // the key before switched screens through a command
						continue
					}
					if text, ok := strings.CutPrefix(k, "type:"); ok {
						tm.Type(text)
						continue
					}
					tm.Send(drive.Key(k))
				}
				waitText(t, tm, f.waitFor)
				if err := tm.Quit(); err != nil {
					t.Fatal(err)
				}
				final := tm.FinalModel(t, teatest.WithFinalTimeout(5*time.Second))
				view := final.View()
				if !strings.Contains(view, f.waitFor) {
					t.Fatalf("final view lacks %q:\n%s", f.waitFor, view)
				}
				golden.RequireEqual(t, []byte(view))
			})
		}
	}
}

// waitText waits until the program's output contains text.
func waitText(t *testing.T, tm *teatest.TestModel, text string) {
	t.Helper()
	teatest.WaitFor(t, tm.Output(), func(b []byte) bool { return bytes.Contains(b, []byte(text)) },
		teatest.WithDuration(10*time.Second), teatest.WithCheckInterval(5*time.Millisecond))
}

var _ tea.Model = (*tui.Model)(nil)
