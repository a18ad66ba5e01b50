package data

import (
	"bytes"
	"errors"
	"sync"
)

// This file reads model_calibration.csv: the lattice models' gaps to the
// cycles of the built-in compounds, per model and family (count, mean, RMS,
// largest), from which the engine takes each model's σ, the verdict's
// thresholds and the verdict's model per family. The table is written by
// a generator outside this package (go run ./cycle/calibgen: data computes
// no physics) from the built-in tables, so it describes the data Load
// returns and nothing else.

// CalibrationFile is the table of the lattice models' validation.
const CalibrationFile = "model_calibration.csv"

// CalibrationRow is one model's gaps over one family of built-in
// compounds: 100·(cycle − model)/|model| averaged (MeanPercent) and as
// root mean square (RMSPercent) over N compounds; the largest |gap| is
// MaxPercent, for Worst. Family "all" is every family together.
type CalibrationRow struct {
	Model, Family                       string
	N                                   int
	MeanPercent, RMSPercent, MaxPercent float64
	Worst                               string
}

// Calibration is the built-in validation of the lattice models: Compounds
// is how many built-in compounds' cycles close, Rows the statistics in
// table order.
type Calibration struct {
	Compounds int
	Rows      []CalibrationRow
	// Text is the table as embedded, for a byte-for-byte comparison with a
	// live validation.
	Text []byte
}

var calibrationOnce = sync.OnceValues(loadCalibration)

// ModelCalibration returns the built-in calibration, read from the
// embedded table once (the result is shared and never changed).
func ModelCalibration() (*Calibration, error) { return calibrationOnce() }

// Calibrated reports whether the built-in calibration was computed from
// db's tables: true for the data Load returns and for those data with
// overlays on top (Overlays names them; the calibration does not see
// them), false for other tables (LoadFS, LoadWithoutDerived).
func (db *DB) Calibrated() bool { return db.builtIn }

var calibrationColumns = []string{"model", "family", "n", "mean_gap_percent", "rms_gap_percent", "largest_gap_percent",
	"largest_gap_compound", "sigma_percent", "sigma_over", "verdict_adequate_percent", "verdict_substantial_percent",
	"family_verdict_model", "compounds_closing"}

func loadCalibration() (*Calibration, error) {
	raw, err := embedded.ReadFile("tables/" + CalibrationFile)
	if err != nil {
		return nil, &TableError{File: CalibrationFile, Err: err}
	}
	recs, err := readCSV(CalibrationFile, bytes.NewReader(raw), calibrationColumns)
	if err != nil {
		return nil, err
	}
	cal := &Calibration{Text: raw}
	for _, r := range recs {
		row := CalibrationRow{Model: r.str("model"), Family: r.str("family"), Worst: r.str("largest_gap_compound")}
		if row.Model == "" || row.Family == "" {
			return nil, r.errorf("model", "a row needs a model and a family")
		}
		if row.N, err = r.requiredInt("n"); err != nil {
			return nil, err
		}
		for field, dst := range map[string]*float64{"mean_gap_percent": &row.MeanPercent, "rms_gap_percent": &row.RMSPercent,
			"largest_gap_percent": &row.MaxPercent} {
			x, ok, err := r.float(field)
			if err != nil {
				return nil, err
			}
			if !ok && row.N > 0 {
				return nil, r.errorf(field, "missing value for %d compounds", row.N)
			}
			*dst = x
		}
		n, err := r.requiredInt("compounds_closing")
		if err != nil {
			return nil, err
		}
		if cal.Compounds != 0 && n != cal.Compounds {
			return nil, r.errorf("compounds_closing", "%d, but an earlier row says %d", n, cal.Compounds)
		}
		cal.Compounds = n
		cal.Rows = append(cal.Rows, row)
	}
	if len(cal.Rows) == 0 {
		return nil, &TableError{File: CalibrationFile, Err: errors.New("no rows")}
	}
	return cal, nil
}
