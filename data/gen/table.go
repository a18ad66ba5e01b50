package main

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
)

var nanValue = math.NaN()

// table is one output file: comment lines, a header and rows of cells.
type table struct {
	comments []string
	header   []string
	rows     [][]string
}

func newTable(header string, comments ...string) *table {
	return &table{header: strings.Split(header, ","), comments: comments}
}

// add appends a row given as column → cell; unknown columns panic (a
// programming error of the generator).
func (t *table) add(cells map[string]string) {
	row := make([]string, len(t.header))
	n := 0
	for i, h := range t.header {
		if v, ok := cells[h]; ok {
			row[i] = v
			n++
		}
	}
	if n != len(cells) {
		panic(fmt.Sprintf("table %v: row has a column outside the header: %v", t.header, cells))
	}
	t.rows = append(t.rows, row)
}

func (t *table) bytes() []byte {
	var buf bytes.Buffer
	for _, c := range t.comments {
		buf.WriteString("# " + c + "\n")
	}
	w := csv.NewWriter(&buf)
	_ = w.Write(t.header)
	for _, r := range t.rows {
		_ = w.Write(r)
	}
	w.Flush()
	return buf.Bytes()
}

// num writes a number with no more digits than it needs.
func num(x float64) string {
	if math.IsNaN(x) {
		return ""
	}
	return strconv.FormatFloat(x, 'f', -1, 64)
}

// numDigits writes x with d digits after the point (NBS values as printed).
func numDigits(x float64, d int) string {
	if math.IsNaN(x) {
		return ""
	}
	return strconv.FormatFloat(x, 'f', d, 64)
}

// round6 removes binary noise from a converted value (J → kJ, pm → Å).
func round6(x float64) float64 { return math.Round(x*1e6) / 1e6 }

// keptRows reads a hand-kept CSV of data/gen (comments start with #).
func keptRows(dir, name string) ([]map[string]string, []int, error) {
	f, err := os.Open(filepath.Join(dir, name))
	if err != nil {
		return nil, nil, err
	}
	defer f.Close()
	cr := csv.NewReader(f)
	cr.Comment = '#'
	cr.FieldsPerRecord = -1
	header, err := cr.Read()
	if err != nil {
		return nil, nil, fmt.Errorf("%s: %w", name, err)
	}
	var out []map[string]string
	var lines []int
	for {
		rec, err := cr.Read()
		if err != nil {
			if err.Error() == "EOF" {
				break
			}
			return nil, nil, fmt.Errorf("%s: %w", name, err)
		}
		line, _ := cr.FieldPos(0)
		m := map[string]string{}
		for i, h := range header {
			if i < len(rec) {
				m[h] = rec[i]
			}
		}
		out = append(out, m)
		lines = append(lines, line)
	}
	return out, lines, nil
}
