package data

import (
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"strings"
)

// BondValenceSource is the citation of the bond-valence element parameters.
const BondValenceSource = "M. O'Keeffe and N. E. Brese, Atom sizes and bond lengths in molecules and crystals, J. Am. Chem. Soc. 113, 3226–3229 (1991)"

// BondValenceFile is the embedded table of bond-valence element parameters,
// generated from data/sources/bond-valence-1991/ (see its README).
const BondValenceFile = "bond_valence.csv"

// BondValenceParam is one element's bond-valence parameters in the scheme of
// O'Keeffe and Brese (1991): a size R in Å and an electronegativity-like C,
// from which the parameter of a cation–anion pair is estimated.
type BondValenceParam struct {
	Element string
	R       float64 // size parameter r, Å
	C       float64 // electronegativity parameter c (dimensionless)
	// Locator is where the value stands in the pinned source file.
	Locator string
}

// BondValenceParams reads the embedded table of bond-valence element
// parameters, keyed by element symbol. The table is small; callers that use
// it often keep the map.
func BondValenceParams() (map[string]BondValenceParam, error) {
	f, err := embedded.Open("tables/" + BondValenceFile)
	if err != nil {
		return nil, &TableError{File: BondValenceFile, Err: err}
	}
	defer f.Close()
	return readBondValence(f)
}

// readBondValence reads the table's CSV: '#' comment lines, then the header
// element,r_angstrom,c,source,locator.
func readBondValence(r io.Reader) (map[string]BondValenceParam, error) {
	cr := csv.NewReader(r)
	cr.Comment = '#'
	header, err := cr.Read()
	want := []string{"element", "r_angstrom", "c", "source", "locator"}
	if err != nil || strings.Join(header, ",") != strings.Join(want, ",") {
		return nil, &TableError{File: BondValenceFile, Err: fmt.Errorf("header must be %s", strings.Join(want, ","))}
	}
	out := map[string]BondValenceParam{}
	for {
		row, err := cr.Read()
		if err == io.EOF {
			return out, nil
		}
		if err != nil {
			return nil, &TableError{File: BondValenceFile, Err: err}
		}
		line, _ := cr.FieldPos(0)
		rv, errR := strconv.ParseFloat(row[1], 64)
		cv, errC := strconv.ParseFloat(row[2], 64)
		if errR != nil || errC != nil || !(rv > 0) || !(cv > 0) || row[3] == "" {
			return nil, &TableError{File: BondValenceFile, Line: line, Err: fmt.Errorf("%s: r and c must be positive numbers with a source", row[0])}
		}
		if _, dup := out[row[0]]; dup {
			return nil, &TableError{File: BondValenceFile, Line: line, Field: "element", Err: fmt.Errorf("%s appears twice", row[0])}
		}
		out[row[0]] = BondValenceParam{Element: row[0], R: rv, C: cv, Locator: row[4]}
	}
}
