// Command bench times ewald.Sum on structures given as JSON, for
// testdata/bench_ewald.py, which times pymatgen's EwaldSummation on the same
// structures and prints the ratio.
//
// Usage:
//
//	go run ./thermo/ewald/bench -in structures.json [-accuracy 1e-12] [-min-time 0.2s]
//	go run ./thermo/ewald/bench -emit-prototypes
//
// The input is a JSON array of objects with "name", "lattice" (three rows,
// Å), "frac" (fractional positions), "charges" and "formula_units". The
// output, on stdout, is a JSON array with, per structure, the median wall
// time of one sum in seconds over several timed batches, the energy in eV
// per cell and the estimated relative error. With -emit-prototypes it
// prints every built-in prototype (default parameters) in the input format,
// with the slot labels in "species", so that the script can hand pymatgen
// exactly the structures this package builds.
package main

import (
	"encoding/json"
	"errors"
	"flag"
	"fmt"
	"os"
	"sort"
	"time"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
)

type input struct {
	Name         string        `json:"name"`
	Species      []string      `json:"species,omitempty"`
	Lattice      [3][3]float64 `json:"lattice"`
	Frac         [][3]float64  `json:"frac"`
	Charges      []float64     `json:"charges"`
	FormulaUnits int           `json:"formula_units"`
}

type output struct {
	Name           string  `json:"name"`
	Sites          int     `json:"sites"`
	Seconds        float64 `json:"seconds_per_sum"`
	Runs           int     `json:"runs"`
	EnergyEV       float64 `json:"energy_ev"`
	EstimatedError float64 `json:"estimated_relative_error"`
}

func main() {
	in := flag.String("in", "", "JSON file of structures")
	accuracy := flag.Float64("accuracy", 1e-12, "relative accuracy")
	minTime := flag.Duration("min-time", 200*time.Millisecond, "time per batch; 0 computes without timing")
	emit := flag.Bool("emit-prototypes", false, "print the built-in prototypes as input records and exit")
	flag.Parse()
	if *emit {
		if err := emitPrototypes(); err != nil {
			fmt.Fprintln(os.Stderr, "bench:", err)
			os.Exit(1)
		}
		return
	}
	if err := run(*in, *accuracy, *minTime); err != nil {
		fmt.Fprintln(os.Stderr, "bench:", err)
		os.Exit(1)
	}
}

func run(path string, accuracy float64, minTime time.Duration) error {
	b, err := os.ReadFile(path)
	if err != nil {
		return err
	}
	var structures []input
	if err := json.Unmarshal(b, &structures); err != nil {
		return fmt.Errorf("%s: %w", path, err)
	}
	var out []output
	for _, s := range structures {
		c := &crystal.Crystal{Name: s.Name, FormulaUnits: s.FormulaUnits}
		for k := 0; k < 3; k++ {
			c.Lattice[k] = s.Lattice[k]
		}
		if len(s.Frac) != len(s.Charges) {
			return fmt.Errorf("%s: %d positions, %d charges", s.Name, len(s.Frac), len(s.Charges))
		}
		for i := range s.Frac {
			c.Sites = append(c.Sites, crystal.Site{Species: fmt.Sprint(i), Charge: s.Charges[i], Frac: s.Frac[i]})
		}
		opt := ewald.Options{Accuracy: accuracy}
		r, err := ewald.Sum(c, opt)
		var accErr *ewald.AccuracyError
		if err != nil && !errors.As(err, &accErr) { // a value beside an AccuracyError is usable
			return fmt.Errorf("%s: %w", s.Name, err)
		}
		if minTime <= 0 {
			out = append(out, output{Name: s.Name, Sites: len(c.Sites), EnergyEV: r.EnergyEV, EstimatedError: r.EstimatedError})
			continue
		}
		// Batches of n sums lasting at least minTime; the median batch.
		n := 1
		for {
			t0 := time.Now()
			for i := 0; i < n; i++ {
				ewald.Sum(c, opt)
			}
			if time.Since(t0) >= minTime/5 || n > 1<<20 {
				break
			}
			n *= 2
		}
		var per []float64
		total := 0
		for batch := 0; batch < 5; batch++ {
			t0 := time.Now()
			for i := 0; i < n; i++ {
				ewald.Sum(c, opt)
			}
			per = append(per, time.Since(t0).Seconds()/float64(n))
			total += n
		}
		sort.Float64s(per)
		out = append(out, output{Name: s.Name, Sites: len(c.Sites), Seconds: per[len(per)/2], Runs: total,
			EnergyEV: r.EnergyEV, EstimatedError: r.EstimatedError})
	}
	enc := json.NewEncoder(os.Stdout)
	enc.SetIndent("", " ")
	return enc.Encode(out)
}

func emitPrototypes() error {
	var out []input
	for _, p := range crystal.Prototypes() {
		c, err := crystal.Build(p.Name, nil)
		if err != nil {
			return err
		}
		rec := input{Name: p.Name, FormulaUnits: c.FormulaUnits}
		for k := 0; k < 3; k++ {
			rec.Lattice[k] = c.Lattice[k]
		}
		for _, s := range c.Sites {
			rec.Species = append(rec.Species, s.Species)
			rec.Frac = append(rec.Frac, s.Frac)
			rec.Charges = append(rec.Charges, s.Charge)
		}
		out = append(out, rec)
	}
	enc := json.NewEncoder(os.Stdout)
	return enc.Encode(out)
}
