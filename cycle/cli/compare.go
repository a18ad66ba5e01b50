package cli

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
	"enthalpath/data"
	"enthalpath/thermo/notation"
)

const compareSynopsis = "compare FORMULA... | --all [--csv|--json] [model flags]"

// CompareRow is one compound of a comparison: its cycle lattice value and
// every model beside it, or the reason the cycle could not close.
type CompareRow struct {
	Formula, Family string
	// Lattice is the cycle's lattice step in the convention in force.
	Lattice     float64
	Uncertainty float64
	// Handbook is the data's lattice value as a step in the same
	// convention (NaN when absent).
	Handbook float64
	Models   []cycle.ModelResult
	// Reference is the model the verdict is read against (cycle.Result).
	Reference string
	// Circular lists the fitted ion values fitted to this very salt: its
	// verdicts are withheld.
	Circular []cycle.Circularity
	// Err is why the cycle could not be solved (the row has no numbers).
	Err error
}

// compareRows builds and solves the cycle of each formula (every compound
// when formulas is nil) with the same settings (analysis.Survey).
func compareRows(db *data.DB, formulas []string, mf *modelFlags, set map[string]bool) ([]CompareRow, error) {
	conv, err := mf.conventions()
	if err != nil {
		return nil, err
	}
	local := map[string]bool{}
	for k, v := range set {
		local[k] = v
	}
	local["lattice-as"], local["ionization-at"] = false, false
	entries, err := analysis.Survey(db, formulas, analysis.SurveyOptions{Conventions: conv,
		Prepare: func(c *cycle.Cycle) error { return mf.apply(c, local, false) }})
	if err != nil {
		return nil, err
	}
	rows := make([]CompareRow, 0, len(entries))
	for _, e := range entries {
		row := CompareRow{Formula: e.Formula, Handbook: math.NaN(), Lattice: math.NaN(), Uncertainty: math.NaN(), Err: e.Err}
		if e.Cycle != nil {
			row.Formula, row.Family = e.Cycle.Formula, e.Cycle.Family
		}
		if r := e.Result; r != nil {
			row.Lattice, row.Uncertainty, row.Models, row.Circular, row.Reference = r.Lattice.In(e.Cycle.Conventions.Lattice), r.Lattice.Uncertainty, r.Models, r.Circular, r.Reference
			if r.Handbook != nil {
				row.Handbook = r.Handbook.Value
			}
		}
		rows = append(rows, row)
	}
	return rows, nil
}

func runCompare(env Env, args []string) error {
	fs := NewFlagSet("compare")
	var mf modelFlags
	mf.register(fs)
	var all, asCSV, asJSON bool
	fs.BoolVar(&all, "all", false, "every built-in (and overlay) compound")
	fs.BoolVar(&asCSV, "csv", false, "print CSV")
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	set := givenFlags(fs)
	switch {
	case asCSV && asJSON:
		return Usagef("choose one of --csv and --json")
	case all && len(pos) > 0:
		return Usagef("give formulas or --all, not both")
	case !all && len(pos) == 0:
		return Usagef("no formula: usage: enthalpath %s", compareSynopsis)
	}
	if set["structure"] && len(pos) != 1 {
		return Usagef("--structure applies to one compound; compare each compound's own structure by leaving it out")
	}
	db, err := LoadData(env)
	if err != nil {
		return err
	}
	formulas := pos
	if all {
		formulas = nil // every compound
	}
	rows, err := compareRows(db, formulas, &mf, set)
	if err != nil {
		return err
	}
	unit := rowsUnit(&mf)
	conv, _ := mf.conventions()
	switch {
	case asCSV:
		err = writeCompareCSV(env.Stdout, rows, conv.Lattice.Symbol())
	case asJSON:
		err = writeCompareJSON(env.Stdout, rows, conv.Lattice.Symbol())
	default:
		writeCompareText(env.Stdout, rows, unit, conv.Lattice.Symbol())
	}
	if err != nil {
		return err
	}
	// A formula that names no compound is a usage error; a cycle that
	// cannot close is a result, reported in its row.
	for _, r := range rows {
		if errors.Is(r.Err, cycle.ErrUnknownCompound) || errors.Is(r.Err, cycle.ErrChargeBalance) {
			if strings.HasPrefix(r.Err.Error(), r.Formula) { // it names the formula already
				return &UsageError{r.Err}
			}
			return &UsageError{fmt.Errorf("%s: %w", notation.ShortInput(r.Formula), r.Err)}
		}
	}
	return nil
}

func rowsUnit(mf *modelFlags) (u thermoUnit) {
	u, _ = parseUnitOrKJ(mf.units)
	return u
}

func writeCompareText(w io.Writer, rows []CompareRow, u thermoUnit, conv string) {
	head := []string{"compound", "family", "cycle " + conv}
	for _, m := range cycle.ModelNames() {
		head = append(head, m)
	}
	head = append(head, "verdict (read against)")
	t := table{head: head, right: map[int]bool{2: true, 3: true, 4: true, 5: true, 6: true, 7: true}}
	var failed []CompareRow
	for _, r := range rows {
		if r.Err != nil {
			failed = append(failed, r)
			continue
		}
		cells := []string{r.Formula, r.Family, energyPM(r.Lattice, r.Uncertainty, u)}
		for _, name := range cycle.ModelNames() {
			cells = append(cells, modelCell(r.Models, name))
		}
		cells = append(cells, headlineVerdict(r))
		t.add(cells...)
	}
	fmt.Fprintf(w, "cycle lattice step (%s, %s) against the ionic models: each model column is the gap cycle − model in percent of |model|\n\n", conv, u)
	t.write(w, "")
	fmt.Fprintf(w, "\nverdict %s\n", cycle.VerdictThresholds())
	if len(failed) > 0 {
		fmt.Fprintf(w, "\n%d compound(s) whose cycle does not close:\n", len(failed))
		for _, r := range failed {
			fmt.Fprintf(w, "  %-10s %s\n", notation.ShortInput(r.Formula), wrapText(commandLineText(r.Err), 100, strings.Repeat(" ", 13)))
		}
	}
}

func modelCell(ms []cycle.ModelResult, name string) string {
	for _, m := range ms {
		if m.Model == name {
			if m.Err != nil {
				return "—"
			}
			return percent(m.GapPercent)
		}
	}
	return "—"
}

// headlineVerdict is the verdict of the row's reference model.
func headlineVerdict(r CompareRow) string {
	for _, m := range r.Models {
		if m.Model == r.Reference && m.Err == nil {
			return rowVerdict(r, m) + " (" + m.Model + ")"
		}
	}
	return "no model available"
}

func num(v float64) string {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return ""
	}
	return strconv.FormatFloat(math.Round(v*1000)/1000, 'f', -1, 64)
}

func writeCompareCSV(w io.Writer, rows []CompareRow, conv string) error {
	cw := csv.NewWriter(w)
	head := []string{"formula", "family", "convention", "cycle_kj_per_mol", "uncertainty_kj_per_mol", "handbook_kj_per_mol"}
	for _, m := range cycle.ModelNames() {
		head = append(head, m+"_kj_per_mol", m+"_gap_kj_per_mol", m+"_gap_percent", m+"_verdict")
	}
	head = append(head, "status", "reason")
	if err := cw.Write(head); err != nil {
		return err
	}
	for _, r := range rows {
		rec := []string{r.Formula, r.Family, conv, num(r.Lattice), num(r.Uncertainty), num(r.Handbook)}
		for _, name := range cycle.ModelNames() {
			var m *cycle.ModelResult
			for i := range r.Models {
				if r.Models[i].Model == name {
					m = &r.Models[i]
				}
			}
			if m == nil || m.Err != nil {
				rec = append(rec, "", "", "", "")
				continue
			}
			rec = append(rec, num(m.Value), num(m.Gap), num(m.GapPercent), rowVerdict(r, *m))
		}
		status, reason := compareStatus(r.Err)
		rec = append(rec, status, reason)
		if err := cw.Write(rec); err != nil {
			return err
		}
	}
	cw.Flush()
	return cw.Error()
}

// compareStatus gives a row's short status code for the CSV status
// column and its sentence for the reason column: "ok"; "missing-datum" when
// a datum of the cycle is not in the data (the reason names it and the
// step); "not-closed" for any other cause.
func compareStatus(err error) (status, reason string) {
	switch {
	case err == nil:
		return "ok", ""
	case errors.Is(err, cycle.ErrMissingDatum):
		return "missing-datum", commandLineText(err)
	}
	return "not-closed", commandLineText(err)
}

type compareJSONRow struct {
	Formula     string      `json:"formula"`
	Family      string      `json:"family,omitempty"`
	Convention  string      `json:"convention"`
	Lattice     jsonNumber  `json:"cycle_kj_per_mol"`
	Uncertainty jsonNumber  `json:"uncertainty_kj_per_mol"`
	Handbook    jsonNumber  `json:"handbook_kj_per_mol"`
	Models      []modelJSON `json:"models"`
	Error       string      `json:"error,omitempty"`
}

func writeCompareJSON(w io.Writer, rows []CompareRow, conv string) error {
	out := struct {
		VerdictThresholds string           `json:"verdict_thresholds"`
		Compounds         []compareJSONRow `json:"compounds"`
	}{VerdictThresholds: cycle.VerdictThresholds(), Compounds: []compareJSONRow{}}
	for _, r := range rows {
		j := compareJSONRow{Formula: r.Formula, Family: r.Family, Convention: conv, Lattice: jsonNumber(r.Lattice),
			Uncertainty: jsonNumber(r.Uncertainty), Handbook: jsonNumber(r.Handbook), Models: []modelJSON{}}
		if r.Err != nil {
			j.Error = commandLineText(r.Err)
		}
		for _, m := range r.Models {
			mj := modelJSONOf(m)
			if m.Err == nil {
				mj.Verdict = rowVerdict(r, m)
			}
			j.Models = append(j.Models, mj)
		}
		out.Compounds = append(out.Compounds, j)
	}
	return writeJSON(w, out)
}

// rowVerdict is a model's verdict for a row, or why none is given.
func rowVerdict(r CompareRow, m cycle.ModelResult) string {
	return verdictText(&cycle.Result{Circular: r.Circular}, m)
}
