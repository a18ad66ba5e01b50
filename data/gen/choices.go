package main

import (
	"encoding/csv"
	"fmt"
	"os"
	"strings"
)

// choices is data/gen/choices.csv: one decision per line with its reason.
//
//	kind,key,value,reason
//
// Kinds:
//   - prefer: key a quantity (ion_gas_formation), value the source keys in
//     order of preference separated by ";".
//   - phase: key a formula, value the NBS state code (cr, cr2, l …) to take
//     instead of the most stable phase.
//   - ions: key a formula, value "cation;anion" where the composition fits
//     several pairs of ions.
//   - molecular: key a formula of a crystalline compound known to be
//     molecular (liquids and gases are molecular without a line here).
//   - skip: key a formula left out of compounds.csv.
//   - family: key an ion symbol, value the family name of its salts.
//   - onestep: key an element whose atomization is written as one step
//     from its standard state.
//   - ionname: key an ion symbol, value its name in compound names.
//   - noweight: key an element given no atomic weight (no stable isotope).
//   - slip: key "formula|state" of an NBS row, value "printed;corrected":
//     the digitised file prints the ΔfH° cell wrongly (a decimal point
//     moved); the generator fails if the file no longer prints it so.
//   - radiusslip: key "symbol|charge|CN|spin" of a Shannon row, value
//     "column;printed;corrected" in pm: a radius the vendored copy prints
//     wrongly; the generator fails if the copy no longer prints it so.
//   - spelling: key an ion symbol, value other ways the NBS tables write
//     it in a formula, separated by ";" (a formula must name both its
//     ions, or it is read as a molecule and left out).
//   - hydrationcompare: key an ion symbol, value another (recalled)
//     hydration enthalpy, written after the computed one's note.
//   - aqmedium: key an ion symbol, value the solvent cell of an NBS ao
//     row measured in a medium (NBS gives the ion at no infinite
//     dilution): the hydration enthalpy is computed from that row, and its
//     note says so; the generator fails if the file no longer prints it.
type choices struct {
	byKind map[string]map[string]choice
}

type choice struct {
	value, reason string
	line          int
}

func readChoices(path string) (*choices, error) {
	f, err := os.Open(path)
	if err != nil {
		return nil, err
	}
	defer f.Close()
	cr := csv.NewReader(f)
	cr.Comment = '#'
	cr.FieldsPerRecord = 4
	c := &choices{byKind: map[string]map[string]choice{}}
	first := true
	for {
		rec, err := cr.Read()
		if err != nil {
			if err.Error() == "EOF" {
				break
			}
			return nil, fmt.Errorf("%s: %w", path, err)
		}
		if first {
			first = false
			continue
		}
		line, _ := cr.FieldPos(0)
		kind, key := strings.TrimSpace(rec[0]), strings.TrimSpace(rec[1])
		if strings.TrimSpace(rec[3]) == "" {
			return nil, fmt.Errorf("%s:%d: a choice needs its reason", path, line)
		}
		if c.byKind[kind] == nil {
			c.byKind[kind] = map[string]choice{}
		}
		if _, dup := c.byKind[kind][key]; dup {
			return nil, fmt.Errorf("%s:%d: %s %s chosen twice", path, line, kind, key)
		}
		c.byKind[kind][key] = choice{value: strings.TrimSpace(rec[2]), reason: strings.TrimSpace(rec[3]), line: line}
	}
	return c, nil
}

func (c *choices) get(kind, key string) (choice, bool) {
	ch, ok := c.byKind[kind][key]
	return ch, ok
}
