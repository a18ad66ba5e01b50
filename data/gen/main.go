// Command gen writes enthalpath's reference tables (data/tables/*.csv) from
// the pinned source files vendored under data/sources/ and the hand-kept
// files of data/gen/ (choices.csv: which phase, which source is preferred,
// the exceptions, each with its reason; kept/: the fields no machine-readable
// source gives, such as names, cell parameters and Born exponents).
//
// Usage, from the repository's root:
//
//	go run ./data/gen            # rewrite data/tables
//	go run ./data/gen -check     # fail if a table differs from what it would write
//	go run ./data/gen -v         # also print the notes (formulas left out, and why)
//
// Every generated row carries its source key and a locator (file:line in
// data/sources, or the species' name there). Unit and electron-convention
// conversions happen here, once:
//   - NASA Glenn ΔfH° in J/mol and ATcT in J/mol are divided by 1000;
//   - Shannon radii in pm are divided by 100 (Å);
//   - ATcT gives gaseous ions in the stationary-electron convention; the
//     tables use the thermal-electron convention of the NBS tables and of
//     NASA Glenn/JANAF, so an ATcT value for an ion of charge z is raised by
//     z·5/2·R·T = z·6.197 kJ/mol (an anion's is lowered).
//
// Where several compilations give a value, the preferred one (choices.csv)
// is written to the table and the others to alternatives.csv. When an
// alternative differs from the preferred value by more than the combined
// stated uncertainties (an unstated NBS uncertainty counts as one unit of
// the last printed digit), the preferred value's uncertainty is raised to
// the largest such difference, so the stated uncertainty covers the spread
// of the compilations.
//
// The generator reads no physics: it does not import package cycle or the
// models of package thermo.
package main

import (
	"bytes"
	"flag"
	"fmt"
	"log"
	"os"
	"path/filepath"
	"sort"
)

func main() {
	log.SetFlags(0)
	log.SetPrefix("gen: ")
	sources := flag.String("sources", "data/sources", "folder of the vendored source files")
	kept := flag.String("kept", "data/gen", "folder of choices.csv and kept/")
	out := flag.String("out", "data/tables", "folder the tables are written to")
	check := flag.Bool("check", false, "write nothing; fail when a table differs from what would be written")
	verbose := flag.Bool("v", false, "print the notes: formulas left out, kept rows without a source row")
	flag.Parse()

	g, err := newGenerator(*sources, *kept, *out)
	if err != nil {
		log.Fatal(err)
	}
	tables, err := g.run()
	if err != nil {
		log.Fatal(err)
	}
	names := make([]string, 0, len(tables))
	for n := range tables {
		names = append(names, n)
	}
	sort.Strings(names)
	differ := 0
	for _, name := range names {
		path := filepath.Join(*out, name)
		if *check {
			old, err := os.ReadFile(path)
			if err != nil || !bytes.Equal(old, tables[name]) {
				fmt.Fprintf(os.Stderr, "%s differs from what the generator writes\n", path)
				differ++
			}
			continue
		}
		if err := os.WriteFile(path, tables[name], 0o644); err != nil {
			log.Fatal(err)
		}
	}
	if differ > 0 {
		log.Fatalf("%d tables differ: run go run ./data/gen and commit the result", differ)
	}
	if *verbose {
		for _, w := range g.warnings {
			fmt.Fprintln(os.Stderr, "note:", w)
		}
	} else if len(g.warnings) > 0 {
		fmt.Fprintf(os.Stderr, "gen: %d notes (formulas left out, kept rows without a source row): -v prints them\n", len(g.warnings))
	}
}
