package main

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"sort"
	"strconv"
	"strings"
)

// Paths of the vendored source files, relative to the sources folder; a
// locator is one of these, a colon and a line number.
const (
	nbsFile           = "nbs-tables-1982/NBS_Tables_with_ErratumValues.csv"
	nasaFile          = "nasa-cea-thermo/thermo.inp"
	atctFile          = "atct-1.112/ATcT_1.112_gas.tsv"
	asdFile           = "nist-asd-ionization/ionization_energies_nist_asd.csv"
	affinityFile      = "electron-affinities/electron_affinities.csv"
	shannonFile       = "shannon-radii/shannon_radii.csv"
	asePeriodicFile   = "atomic-weights/ase_data_init.py"
	nistPeriodicFile  = "atomic-weights/periodictable_mass.py"
	nistCompoundsFile = "nist-compounds/nist_compounds_xraylib.csv"
)

func locator(file string, line int) string { return fmt.Sprintf("%s:%d", file, line) }

// nbsRow is one line of the digitised NBS tables. Absent numbers are NaN.
type nbsRow struct {
	Line      int
	Table     string // element of the NBS table the row is printed in
	Formula   string
	Solvent   string
	Name      string
	Desc      string  // "State Description": polymorph or mineral name
	State     string  // cr, cr2, l, g, ai, ao …
	Mass      float64 // molar mass, g/mol
	H0        float64
	H         float64 // ΔfH°(298.15 K), kJ/mol
	G         float64 // ΔfG°(298.15 K), kJ/mol
	S         float64 // S°(298.15 K), J/(mol·K)
	HDigits   int     // digits after the decimal point of H as printed
	Original  string  // the H cell as printed (after a slip choice: as corrected)
	Corrected string  // the H cell as the file prints it, where a slip choice corrected it
}

// latin1 decodes ISO-8859-1 bytes (the NBS file's encoding) to UTF-8.
func latin1(b []byte) string {
	var sb strings.Builder
	sb.Grow(len(b))
	for _, c := range b {
		sb.WriteRune(rune(c))
	}
	return sb.String()
}

// nbsNumber reads a number as printed in the NBS file: decimal comma or
// point, "-" or empty for absent, a trailing point allowed ("364.").
func nbsNumber(s string) (v float64, digits int, ok bool) {
	// A trailing "*" marks a value with a footnote in the printed tables.
	s = strings.TrimSuffix(strings.TrimSpace(strings.ReplaceAll(s, ",", ".")), "*")
	if s == "" || s == "-" {
		return nanValue, 0, false
	}
	x, err := strconv.ParseFloat(s, 64)
	if err != nil {
		return nanValue, 0, false
	}
	if i := strings.IndexByte(s, '.'); i >= 0 {
		digits = len(s) - i - 1
	}
	return x, digits, true
}

func readNBS(dir string) ([]nbsRow, error) {
	raw, err := os.ReadFile(filepath.Join(dir, nbsFile))
	if err != nil {
		return nil, err
	}
	cr := csv.NewReader(strings.NewReader(latin1(raw)))
	cr.Comma = ';'
	cr.LazyQuotes = true
	cr.FieldsPerRecord = -1
	var out []nbsRow
	table := ""
	for {
		rec, err := cr.Read()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			return nil, fmt.Errorf("%s: %w", nbsFile, err)
		}
		line, _ := cr.FieldPos(0)
		if len(rec) == 0 {
			continue
		}
		if t, ok := strings.CutPrefix(rec[0], "Table "); ok {
			if _, el, ok := strings.Cut(t, ":"); ok {
				table = strings.TrimSpace(el)
			}
			continue
		}
		if len(rec) < 11 {
			continue
		}
		r := nbsRow{Line: line, Table: table, Formula: strings.TrimSpace(rec[0]), Solvent: strings.TrimSpace(rec[1]),
			Name: strings.TrimSpace(rec[2]), Desc: strings.TrimSpace(rec[3]), State: strings.TrimSpace(rec[4]),
		}
		r.Mass, _, _ = nbsNumber(rec[5])
		r.H0, _, _ = nbsNumber(rec[6])
		r.H, r.HDigits, _ = nbsNumber(rec[7])
		r.Original = numDigits(r.H, r.HDigits)
		r.G, _, _ = nbsNumber(rec[8])
		r.S, _, _ = nbsNumber(rec[10])
		out = append(out, r)
	}
	return out, nil
}

// nasaSpecies is one species of NASA Glenn's thermo.inp: its name (with
// phase in parentheses for condensed species), reference code and
// ΔfH°(298.15 K) converted from J/mol to kJ/mol.
type nasaSpecies struct {
	Line    int
	Name    string
	RefCode string
	H       float64 // kJ/mol
	Comment string
	// Comp is the composition from the species' element fields (symbols
	// as usually spelled: "Cl", not NASA's "CL"); Charge from its electron
	// field; Condensed is true for a condensed phase, whose name ends in
	// its phase in parentheses ("(cr)", "(L)", "(a)").
	Comp      map[string]float64
	Charge    int
	Condensed bool
}

// compKey writes a composition and charge as one comparable string.
func compKey(comp map[string]float64, charge int) string {
	keys := make([]string, 0, len(comp))
	for k := range comp {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	var sb strings.Builder
	for _, k := range keys {
		fmt.Fprintf(&sb, "%s%g", k, comp[k])
	}
	fmt.Fprintf(&sb, "q%d", charge)
	return sb.String()
}

func readNASA(dir string) ([]nasaSpecies, error) {
	lines, err := readLines(filepath.Join(dir, nasaFile))
	if err != nil {
		return nil, err
	}
	var out []nasaSpecies
	for i := 0; i+1 < len(lines); i++ {
		head, next := lines[i], lines[i+1]
		if head == "" || head[0] == ' ' || head[0] == '!' || len(next) < 80 || strings.HasPrefix(head, "thermo") || strings.HasPrefix(head, "END") {
			continue
		}
		// Second line: intervals (cols 1–2), reference code (4–9), …,
		// molecular weight (53–65), ΔfH°(298.15 K) in J/mol (66–80).
		if _, err := strconv.Atoi(strings.TrimSpace(next[0:2])); err != nil {
			continue
		}
		h, err := strconv.ParseFloat(strings.TrimSpace(next[65:80]), 64)
		if err != nil {
			continue
		}
		name := strings.TrimSpace(head[:min(18, len(head))])
		comment := ""
		if len(head) > 18 {
			comment = strings.TrimSpace(head[18:])
		}
		sp := nasaSpecies{Line: i + 1, Name: name, RefCode: strings.TrimSpace(next[3:9]), H: h / 1000, Comment: comment,
			Comp: map[string]float64{}, Condensed: strings.TrimSpace(next[50:52]) != "0"}
		for k := 0; k < 5; k++ {
			sym := strings.TrimSpace(next[10+8*k : 12+8*k])
			n, err := strconv.ParseFloat(strings.TrimSpace(next[12+8*k:18+8*k]), 64)
			if sym == "" || err != nil || n == 0 {
				continue
			}
			if sym == "E" {
				sp.Charge = -int(n)
				continue
			}
			sp.Comp[sym[:1]+strings.ToLower(sym[1:])] += n
		}
		out = append(out, sp)
	}
	return out, nil
}

// atctSpecies is one gas-phase species of ATcT 1.112: ΔfH°(298.15 K) and
// its uncertainty converted from J/mol to kJ/mol, ions as ATcT gives them
// (stationary electron).
type atctSpecies struct {
	Line    int
	Formula string // "[OH]- (g)"
	Name    string
	H, U    float64
}

func readATcT(dir string) (map[string]atctSpecies, error) {
	raw, err := os.ReadFile(filepath.Join(dir, atctFile))
	if err != nil {
		return nil, err
	}
	out := map[string]atctSpecies{}
	for i, line := range strings.Split(string(raw), "\n") {
		cells := strings.Split(strings.TrimRight(line, "\r"), "\t")
		if i == 0 || len(cells) < 6 {
			continue
		}
		h, err1 := strconv.ParseFloat(cells[4], 64)
		u, err2 := strconv.ParseFloat(cells[5], 64)
		if err1 != nil || err2 != nil {
			continue
		}
		key := strings.TrimSpace(cells[2])
		if _, dup := out[key]; dup {
			continue
		}
		out[key] = atctSpecies{Line: i + 1, Formula: key, Name: cells[1], H: h / 1000, U: u / 1000}
	}
	return out, nil
}

// csvFile reads a comma-separated vendored file with a header; each row
// comes with its line number.
type csvRow struct {
	Line  int
	Cells map[string]string
}

func readCSVFile(dir, file string) ([]csvRow, error) {
	f, err := os.Open(filepath.Join(dir, file))
	if err != nil {
		return nil, err
	}
	defer f.Close()
	cr := csv.NewReader(f)
	header, err := cr.Read()
	if err != nil {
		return nil, fmt.Errorf("%s: %w", file, err)
	}
	var out []csvRow
	for {
		rec, err := cr.Read()
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			return nil, fmt.Errorf("%s: %w", file, err)
		}
		line, _ := cr.FieldPos(0)
		m := make(map[string]string, len(header))
		for i, h := range header {
			if i < len(rec) {
				m[h] = rec[i]
			}
		}
		out = append(out, csvRow{Line: line, Cells: m})
	}
	return out, nil
}
