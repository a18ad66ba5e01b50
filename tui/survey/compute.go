package survey

import (
	"math"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
	"enthalpath/data"
)

// Row is one compound of the survey. Energies are kJ/mol, lattice steps
// negative, in the cycle's default lattice convention (ΔH_L).
type Row struct {
	Formula, Family string
	// Cycle is the lattice value from Hess's law (NaN when it failed) and
	// Err why it failed.
	Cycle float64
	Err   error
	// Models[i] is the value of cycle.ModelNames()[i] (NaN when not
	// available); Gaps[i] and GapPercents[i] its gap to the cycle.
	Models, Gaps, GapPercents []float64
	// Verdicts[i] is model i's verdict (Undetermined when not available).
	Verdicts []cycle.Character
}

// ComputedMsg carries the survey's rows.
type ComputedMsg struct{ Rows []Row }

// Compute returns the command that builds and solves every compound of db,
// sharing one Madelung memo.
func Compute(db *data.DB) tea.Cmd {
	return func() tea.Msg { return ComputedMsg{Rows: computeRows(db)} }
}

func computeRows(db *data.DB) []Row {
	entries, _ := analysis.Survey(db, nil, analysis.SurveyOptions{}) // no Prepare: no error
	names := cycle.ModelNames()
	rows := make([]Row, 0, len(entries))
	for _, e := range entries {
		r := Row{Formula: e.Formula, Cycle: math.NaN(), Err: e.Err}
		if e.Cycle != nil {
			r.Family = e.Cycle.Family
		}
		r.Models = nanSlice(len(names))
		r.Gaps = nanSlice(len(names))
		r.GapPercents = nanSlice(len(names))
		r.Verdicts = make([]cycle.Character, len(names))
		if res := e.Result; res != nil {
			r.Cycle = res.Lattice.In(res.Conventions.Lattice)
			for i, name := range names {
				if mr, ok := res.Model(name); ok && mr.OK() {
					r.Models[i], r.Gaps[i], r.GapPercents[i] = mr.Value, mr.Gap, mr.GapPercent
					r.Verdicts[i] = mr.Verdict.Character
				}
			}
		}
		rows = append(rows, r)
	}
	return rows
}

func nanSlice(n int) []float64 {
	s := make([]float64, n)
	for i := range s {
		s[i] = math.NaN()
	}
	return s
}
