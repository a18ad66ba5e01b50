// Derivegen writes data/tables/derived_ions.csv: the gas-phase enthalpy of
// formation of every ion of the built-in salts that no measurement gives
// (O²⁻, S²⁻, Se²⁻, Te²⁻, N³⁻ and the polyatomic anions without a tabulated
// value: SO₄²⁻, CO₃²⁻, ClO₄⁻, PO₄³⁻ …), each fitted by weighted least
// squares over its salts (analysis.FitIon) from the tables without the
// derived file itself, so a run never feeds on the previous one.
//
// Usage, from the repository root:
//
//	go run ./cycle/analysis/derivegen [-out data/tables/derived_ions.csv] [-choices FILE]
//
// The lattice source of each ion is "auto" (volume-based where a salt has a
// measured density or cell, Kapustinskii where it has radii, else volume-based with V_m summed
// from the ion volumes fitted over the data's salts, analysis.IonVolumes), over the salts of the
// ionic counter-ions (analysis.IonicCounterIons: the s-block cations and
// NH₄⁺ for an anion, the halides for a cation; every salt when there is
// none), unless choices.csv, kept by hand beside this file with a reason
// per line, names another. The output
// is byte-for-byte reproducible; .ci/run regenerates it and fails on any
// difference.
package main

import (
	"bytes"
	_ "embed"
	"encoding/csv"
	"flag"
	"fmt"
	"io"
	"log"
	"os"
	"slices"
	"strconv"
	"strings"

	"enthalpath/cycle/analysis"
	"enthalpath/data"
)

//go:embed choices.csv
var builtinChoices []byte

func main() {
	log.SetFlags(0)
	log.SetPrefix("derivegen: ")
	out := flag.String("out", "data/tables/"+data.DerivedIonsFile, "file to write")
	choicesFile := flag.String("choices", "", "choices file (default: the choices.csv built in)")
	flag.Usage = func() {
		fmt.Fprintln(os.Stderr, "usage: go run ./cycle/analysis/derivegen [-out FILE] [-choices FILE]")
		flag.PrintDefaults()
	}
	flag.Parse()
	if flag.NArg() != 0 {
		flag.Usage()
		os.Exit(2)
	}
	choices := builtinChoices
	if *choicesFile != "" {
		b, err := os.ReadFile(*choicesFile)
		if err != nil {
			log.Fatal(err)
		}
		choices = b
	}
	db, err := data.LoadWithoutDerived()
	if err != nil {
		log.Fatal(err)
	}
	var buf bytes.Buffer
	if err := generate(&buf, db, choices, log.Printf); err != nil {
		log.Fatal(err)
	}
	if err := os.WriteFile(*out, buf.Bytes(), 0o644); err != nil {
		log.Fatal(err)
	}
}

// choice is one line of choices.csv: the lattice source, the counter-ions
// the fit is limited to (none: every salt) and why.
type choice struct {
	from   string
	only   []string
	reason string
}

func readChoices(b []byte) (map[string]choice, error) {
	r := csv.NewReader(bytes.NewReader(b))
	r.Comment = '#'
	rows, err := r.ReadAll()
	if err != nil {
		return nil, fmt.Errorf("choices: %w", err)
	}
	out := map[string]choice{}
	for i, row := range rows {
		if i == 0 {
			if !slices.Equal(row, []string{"ion", "from", "only", "reason"}) {
				return nil, fmt.Errorf("choices: header %q, want ion,from,only,reason", row)
			}
			continue
		}
		if len(row) != 4 || strings.TrimSpace(row[3]) == "" {
			return nil, fmt.Errorf("choices: row %d: want ion,from,only,reason with a reason", i+1)
		}
		var only []string
		for _, p := range strings.Split(row[2], ";") {
			if p = strings.TrimSpace(p); p != "" {
				only = append(only, p)
			}
		}
		out[row[0]] = choice{from: row[1], only: only, reason: row[3]}
	}
	return out, nil
}

// Ions returns the ions of the data's salts whose gas-phase enthalpy no
// table gives, in ion-table order.
func Ions(db *data.DB) []data.Ion {
	inSalts := map[string]bool{}
	for _, c := range db.Compounds() {
		inSalts[c.Cation], inSalts[c.Anion] = true, true
	}
	var out []data.Ion
	for _, in := range db.Ions() {
		if !inSalts[in.Symbol] {
			continue
		}
		el, err := db.Element(in.Core)
		measured := 0
		if err == nil && el.ElectronAffinity.Known() && !el.ElectronAffinity.Derived {
			measured = 1
		}
		switch {
		case in.Polyatomic && !in.GasFormation.Known():
			out = append(out, in)
		case !in.Polyatomic && in.Charge < 0 && -in.Charge > measured:
			out = append(out, in)
		}
	}
	return out
}

// generate writes the table to w; logf hears of each ion left without a
// value and why.
func generate(w io.Writer, db *data.DB, choiceText []byte, logf func(format string, args ...any)) error {
	choices, err := readChoices(choiceText)
	if err != nil {
		return err
	}
	a := analysis.New(db)
	cw := csv.NewWriter(w)
	fmt.Fprintln(w, "# Gas-phase ion enthalpies fitted over the built-in salts of each ion. Written by")
	fmt.Fprintln(w, "# go run ./cycle/analysis/derivegen (do not edit: .ci/run regenerates and compares).")
	fmt.Fprintln(w, "# gas_formation_kj_per_mol: dfH(ion, g, 298.15 K), thermal-electron convention of the NBS tables;")
	fmt.Fprintln(w, "# standard_error: the fit's (internal SE times the Birge ratio when that exceeds 1); model: the")
	fmt.Fprintln(w, "# lattice source per salt; salts: those fitted (by default those of the s-block cations and NH4+, or of the")
	fmt.Fprintln(w, "# halides for a cation); outside_2sigma: fitted salts more than 2 sigma off; skipped: salts of those")
	fmt.Fprintln(w, "# counter-ions left out for a missing input. Every value here is derived, none measured.")
	if err := cw.Write([]string{"ion", "gas_formation_kj_per_mol", "standard_error", "model", "salts", "outside_2sigma", "skipped", "derived", "note"}); err != nil {
		return err
	}
	used := map[string]bool{}
	for _, in := range Ions(db) {
		ch, ok := choices[in.Symbol]
		if !ok {
			ch = choice{from: analysis.FitAuto, reason: "the default rule: auto over the ionic salts"}
		}
		used[in.Symbol] = true
		f, err := a.FitIon(in.Symbol, analysis.IonFitOptions{From: ch.from, Only: ch.only, Ionic: true})
		if err != nil {
			logf("%s: no value: %v", in.Symbol, err)
			continue
		}
		var salts, skipped []string
		for _, s := range f.Salts {
			if s.Skipped == "" {
				salts = append(salts, s.Formula)
			} else {
				skipped = append(skipped, s.Formula)
			}
		}
		src := ch.from
		if len(ch.only) > 0 {
			src += " over the salts of " + strings.Join(ch.only, " ")
		} else {
			src += " over the ionic salts"
		}
		note := fmt.Sprintf("lattice source %s (%s); weighted least squares over %d salts, effective %.1f, chi2 %.2f, Birge ratio %s, internal SE %.1f kJ/mol",
			src, ch.reason, len(salts), f.EffectiveSalts, f.ChiSquared, birge(f), f.InternalSE)
		if err := cw.Write([]string{in.Symbol, strconv.FormatFloat(f.Value, 'f', 1, 64), strconv.FormatFloat(f.SE, 'f', 1, 64),
			f.Models(), strings.Join(salts, ";"), strings.Join(f.Outside(), ";"), strings.Join(skipped, ";"), "yes", note}); err != nil {
			return err
		}
	}
	for ion := range choices {
		if !used[ion] {
			return fmt.Errorf("choices: %s is not an ion to derive (its value is tabulated, or no salt has it)", ion)
		}
	}
	cw.Flush()
	return cw.Error()
}

func birge(f *analysis.IonFit) string {
	if f.EffectiveSalts <= 1+1e-9 {
		return "n/a (one salt)"
	}
	return strconv.FormatFloat(f.Birge, 'f', 2, 64)
}
