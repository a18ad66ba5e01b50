package tui_test

import (
	"testing"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/muesli/termenv"

	"enthalpath/data"
	"enthalpath/tui"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/screen"
)

// Speed figures (issue 6): View() at 120×40 under 1 ms, a keystroke's
// Update+View under 2 ms, first frame under 150 ms. Benchmarks only; run
//
//	go test ./tui -run '^$' -bench . -benchmem -count 5

func openAt(b *testing.B, w, h int, formula string, goTo ...string) (*tui.Model, drive.Updater) {
	db := loadDB(b)
	m, u, _ := newRoot(b, db, w, h)
	if formula != "" {
		drive.Run(u, screen.OpenMsg{Formula: formula})
	}
	keys(u, goTo...)
	return m, u
}

func benchView(b *testing.B, formula string, goTo ...string) {
	m, _ := openAt(b, 120, 40, formula, goTo...)
	b.ReportAllocs()
	for b.Loop() {
		_ = m.View()
	}
}

func BenchmarkView120x40Shelf(b *testing.B)    { benchView(b, "") }
func BenchmarkView120x40Bench(b *testing.B)    { benchView(b, "CaF2") }
func BenchmarkView120x40Models(b *testing.B)   { benchView(b, "CaF2", "4") }
func BenchmarkView120x40Survey(b *testing.B)   { benchView(b, "", "tab", "tab", "tab", "tab") }
func BenchmarkView120x40Help(b *testing.B)     { benchView(b, "CaF2", "?") }
func BenchmarkView120x40Chart(b *testing.B)    { benchView(b, "", "tab", "tab", "tab", "tab", "p") }
func BenchmarkView120x40Assembly(b *testing.B) { benchView(b, "CaF2", "a", "y", "y") }

// BenchmarkKeystrokeBenchMove is one cursor move on the bench and the
// frame that follows.
func BenchmarkKeystrokeBenchMove(b *testing.B) {
	m, _ := openAt(b, 120, 40, "CaF2")
	j, k := drive.Key("j"), drive.Key("k")
	b.ReportAllocs()
	i := 0
	for b.Loop() {
		msg := j
		if i%2 == 1 {
			msg = k
		}
		i++
		m.Update(msg)
		_ = m.View()
	}
}

// BenchmarkKeystrokeShelfFilter is one character typed into the shelf's
// filter (and erased) with the frames that follow.
func BenchmarkKeystrokeShelfFilter(b *testing.B) {
	m, _ := openAt(b, 120, 40, "")
	a, bs := drive.Key("a"), drive.Key("backspace")
	b.ReportAllocs()
	i := 0
	for b.Loop() {
		msg := a
		if i%2 == 1 {
			msg = bs
		}
		i++
		m.Update(msg)
		_ = m.View()
	}
}

// BenchmarkKeystrokeResolve is a keystroke that changes the cycle (the
// lattice convention switch): Update, the solve command, its answer and the
// frame, all in line.
func BenchmarkKeystrokeResolve(b *testing.B) {
	m, u := openAt(b, 120, 40, "CaF2")
	c := drive.Key("c")
	b.ReportAllocs()
	for b.Loop() {
		drive.Run(u, c)
		_ = m.View()
	}
}

// BenchmarkFirstFrame is start-up inside the process: loading the data,
// building the model, its first commands and the first frame at 120×40.
func BenchmarkFirstFrame(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		db, err := data.Load()
		if err != nil {
			b.Fatal(err)
		}
		m := tui.New(tui.Options{Renderer: drive.Renderer(), DB: db})
		u := drive.Model(m)
		drive.RunCmd(u, m.Init())
		u(tea.WindowSizeMsg{Width: 120, Height: 40})
		_ = m.View()
	}
}

// BenchmarkView120x40BenchTrueColour is the bench's frame with colours
// (a 24-bit terminal), where every styled run carries escape sequences.
func BenchmarkView120x40BenchTrueColour(b *testing.B) {
	db := loadDB(b)
	r := drive.Renderer()
	r.SetColorProfile(termenv.TrueColor)
	m := tui.New(tui.Options{Renderer: r, DB: db}).(*tui.Model)
	u := drive.Model(m)
	drive.Run(u, tea.WindowSizeMsg{Width: 120, Height: 40}, screen.OpenMsg{Formula: "CaF2"})
	b.ReportAllocs()
	for b.Loop() {
		_ = m.View()
	}
}
