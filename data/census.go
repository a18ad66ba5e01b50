package data

import (
	"io/fs"
	"slices"
	"strings"
)

// TableCensus counts the rows of one built-in table: all of them, those
// marked memory (a memory cell that is not empty, "no" or "false"), and
// the values citing each source key.
type TableCensus struct {
	File     string
	Rows     int
	Memory   int
	BySource map[string]int
}

// sourceColumns are the columns that hold a source key.
var sourceColumns = []string{"source", "formation_source", "params_source", "density_source", "lattice_source", "entropy_source",
	"rho_source", "dispersion_source", "radius_source", "polarizability_source"}

// censusModelTables are the extended model's coefficient tables
// (modelparams.go), counted after the tables of TableFiles.
var censusModelTables = []string{"model_sources.csv", "model_salts.csv", "model_ions.csv", "model_crystal_polarizabilities.csv"}

// Census counts the rows of every built-in table, in reading order, then
// the extended model's coefficient tables. A row citing several sources
// counts once under each.
func Census() ([]TableCensus, error) {
	sub, err := fs.Sub(embedded, "tables")
	if err != nil {
		return nil, err
	}
	var out []TableCensus
	for _, name := range append(TableFiles(), censusModelTables...) {
		raw, err := fs.ReadFile(sub, name)
		if err != nil {
			continue
		}
		c := TableCensus{File: name, BySource: map[string]int{}}
		err = eachCSV(name, strings.NewReader(string(raw)), nil, func(r record) error {
			c.Rows++
			switch strings.ToLower(r.str("memory")) {
			case "", "no", "false":
			default:
				c.Memory++
			}
			var seen []string
			for _, col := range sourceColumns {
				if key := r.str(col); key != "" && !slices.Contains(seen, key) {
					seen = append(seen, key)
					c.BySource[key]++
				}
			}
			return nil
		})
		if err != nil {
			return nil, err
		}
		out = append(out, c)
	}
	return out, nil
}
