package survey

import (
	"math"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo/lattice"
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
	Verdicts []lattice.Character
}

// ComputedMsg carries the survey's rows.
type ComputedMsg struct{ Rows []Row }

// Compute returns the command that builds and solves every compound of db,
// sharing one Madelung memo.
func Compute(db *data.DB) tea.Cmd {
	return func() tea.Msg { return ComputedMsg{Rows: computeRows(db)} }
}

func computeRows(db *data.DB) []Row {
	if db == nil {
		return nil
	}
	memo := cycle.NewMemo()
	names := cycle.ModelNames()
	var rows []Row
	for _, comp := range db.Compounds() {
		r := Row{Formula: comp.Formula, Family: comp.Family, Cycle: math.NaN()}
		r.Models = nanSlice(len(names))
		r.Gaps = nanSlice(len(names))
		r.GapPercents = nanSlice(len(names))
		r.Verdicts = make([]lattice.Character, len(names))
		res, err := solveOne(db, comp.Formula, memo)
		if err != nil {
			r.Err = err
			rows = append(rows, r)
			continue
		}
		r.Cycle = res.Lattice.In(res.Conventions.Lattice)
		for i, name := range names {
			if mr, ok := res.Model(name); ok && mr.OK() {
				r.Models[i], r.Gaps[i], r.GapPercents[i] = mr.Value, mr.Gap, mr.GapPercent
				r.Verdicts[i] = mr.Verdict.Character
			}
		}
		rows = append(rows, r)
	}
	return rows
}

func solveOne(db *data.DB, formula string, memo *cycle.Memo) (res *cycle.Result, err error) {
	defer func() {
		if r := recover(); r != nil {
			err = &panicError{formula: formula, value: r}
		}
	}()
	c, err := cycle.Build(db, formula, cycle.Options{Memo: memo})
	if err != nil {
		return nil, err
	}
	return cycle.Solve(c)
}

type panicError struct {
	formula string
	value   any
}

func (e *panicError) Error() string { return e.formula + ": internal error while solving" }

func nanSlice(n int) []float64 {
	s := make([]float64, n)
	for i := range s {
		s[i] = math.NaN()
	}
	return s
}
