// Calibgen writes data/tables/model_calibration.csv: every lattice model
// against the cycles of the built-in compounds that close, per family
// (cycle.Validate, written by cycle.WriteCalibration). The engine reads
// each model's σ, the verdict's thresholds and the verdict's model per
// family from it instead of validating every compound on each run. The
// output is byte-for-byte reproducible; .ci/run regenerates it and fails
// on any difference, and a test compares it with a live validation.
//
// Usage, from the repository root:
//
//	go run ./cycle/calibgen [-out data/tables/model_calibration.csv]
//
// Run it after go run ./cycle/analysis/derivegen: the calibration is of
// the tables with their derived ion values.
package main

import (
	"flag"
	"fmt"
	"log"
	"os"

	"enthalpath/cycle"
	"enthalpath/data"
)

func main() {
	log.SetFlags(0)
	log.SetPrefix("calibgen: ")
	out := flag.String("out", "data/tables/"+data.CalibrationFile, "file to write")
	flag.Usage = func() {
		fmt.Fprintln(os.Stderr, "usage: go run ./cycle/calibgen [-out FILE]")
		flag.PrintDefaults()
	}
	flag.Parse()
	if flag.NArg() != 0 {
		flag.Usage()
		os.Exit(2)
	}
	db, err := data.Load()
	if err != nil {
		log.Fatal(err)
	}
	if err := os.WriteFile(*out, cycle.CalibrationText(cycle.Validate(db, cycle.NewMemo())), 0o644); err != nil {
		log.Fatal(err)
	}
}
