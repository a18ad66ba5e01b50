package data

import (
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"slices"
	"strconv"
	"strings"
)

// record is one row of a table or one [[table]] entry of an overlay, with
// the position of each field for error messages.
type record struct {
	file string
	line int
	// cols maps a field name to its index in cells; CSV rows of one table
	// share it.
	cols  map[string]int
	cells []string
	// lines holds per-field lines where they differ from line (overlay keys).
	lines map[string]int
	// trimmed is set when every cell is already free of surrounding space.
	trimmed bool
	// shared holds the indexes of the columns every value of a row reads
	// (note, locator, memory, derived), found once per CSV table; nil for
	// overlay records, whose columns differ from record to record.
	shared *sharedColumns
}

// sharedColumns are the indexes of a table's row-wide columns, -1 where the
// table has none: Load reads them for every value, and a lookup by name for
// each costs a fifth of it.
type sharedColumns struct{ note, locator, memory, derived int }

func newSharedColumns(cols map[string]int) *sharedColumns {
	at := func(name string) int {
		if i, ok := cols[name]; ok {
			return i
		}
		return -1
	}
	return &sharedColumns{note: at("note"), locator: at("locator"), memory: at("memory"), derived: at("derived")}
}

// sharedStr returns the cell of a row-wide column by its index in shared,
// or by name for a record without shared columns.
func (r record) sharedStr(i func(*sharedColumns) int, field string) (string, bool) {
	if r.shared == nil {
		v, has := r.get(field)
		return strings.TrimSpace(v), has
	}
	k := i(r.shared)
	if k < 0 {
		return "", false
	}
	if k >= len(r.cells) {
		return "", true
	}
	return r.cells[k], true
}

// get returns the raw cell of field and whether the row has that column.
func (r record) get(field string) (string, bool) {
	i, ok := r.cols[field]
	if !ok || i >= len(r.cells) {
		return "", ok
	}
	return r.cells[i], true
}

// set stores a field (overlay records build their columns one by one).
func (r *record) set(field, value string) {
	if r.cols == nil {
		r.cols = map[string]int{}
	}
	if i, ok := r.cols[field]; ok {
		r.cells[i] = value
		return
	}
	r.cols[field] = len(r.cells)
	r.cells = append(r.cells, value)
}

func (r record) has(field string) bool { return r.str(field) != "" }

// str returns the cell of field, trimmed (readCSV trims cells as it reads
// them; overlay records are trimmed here).
func (r record) str(field string) string {
	v, _ := r.get(field)
	if r.trimmed {
		return v
	}
	return strings.TrimSpace(v)
}

func (r record) lineOf(field string) int {
	if l, ok := r.lines[field]; ok {
		return l
	}
	return r.line
}

func (r record) errorf(field, format string, args ...any) *TableError {
	return &TableError{File: r.file, Line: r.lineOf(field), Field: field, Err: fmt.Errorf(format, args...)}
}

// float reads a number; ok is false when the cell is empty.
func (r record) float(field string) (v float64, ok bool, err error) {
	s := r.str(field)
	if s == "" {
		return 0, false, nil
	}
	v, perr := strconv.ParseFloat(s, 64)
	if perr != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, false, r.errorf(field, "%q is not a number", s)
	}
	return v, true, nil
}

// integer reads a whole number; ok is false when the cell is empty.
func (r record) integer(field string) (v int, ok bool, err error) {
	s := r.str(field)
	if s == "" {
		return 0, false, nil
	}
	n, perr := strconv.Atoi(strings.TrimPrefix(s, "+"))
	if perr != nil {
		return 0, false, r.errorf(field, "%q is not a whole number", s)
	}
	return n, true, nil
}

func (r record) requiredInt(field string) (int, error) {
	v, ok, err := r.integer(field)
	if err != nil {
		return 0, err
	}
	if !ok {
		return 0, r.errorf(field, "missing value")
	}
	return v, nil
}

func (r record) requiredStr(field string) (string, error) {
	s := r.str(field)
	if s == "" {
		return "", r.errorf(field, "missing value")
	}
	return s, nil
}

// flag reads yes/no; empty is no.
func (r record) flag(field string) (bool, error) {
	switch strings.ToLower(r.str(field)) {
	case "", "no", "false", "0":
		return false, nil
	case "yes", "true", "1":
		return true, nil
	}
	return false, r.errorf(field, "%q is not yes or no", r.str(field))
}

// memoryOf tells whether the value called name is marked as recalled: the
// memory cell is "yes" (all values of the row) or a ";"-separated list of
// value names.
func (r record) memoryOf(name string) (bool, error) {
	s, _ := r.sharedStr(memoryColumn, "memory")
	switch {
	case s == "" || strings.EqualFold(s, "no") || strings.EqualFold(s, "false"):
		return false, nil
	case strings.EqualFold(s, "yes") || strings.EqualFold(s, "true"):
		return true, nil
	}
	for part := range strings.SplitSeq(s, ";") { // no slice: Load reads every value's memory cell
		if strings.TrimSpace(part) == name {
			return true, nil
		}
	}
	return false, nil
}

// readCSV reads a table: "#" lines before the header are comments; rows may
// omit trailing empty cells but may not have more cells than the header.
func readCSV(file string, rd io.Reader, known []string) ([]record, error) {
	var out []record
	err := eachCSV(file, rd, known, func(r record) error {
		r.cells = slices.Clone(r.cells)
		out = append(out, r)
		return nil
	})
	return out, err
}

// eachCSV reads a table as readCSV does and hands each row to fn as soon
// as it is read. The record's cells slice is reused for the next row:
// fn may keep the strings, not the slice.
func eachCSV(file string, rd io.Reader, known []string, fn func(record) error) error {
	cr := csv.NewReader(rd)
	cr.Comment = '#'
	cr.FieldsPerRecord = -1
	cr.ReuseRecord = true
	return eachRow(file, csvRows{cr}, known, fn)
}

// eachCSVText is eachCSV over a text in memory: its cells are substrings of
// text (csvText), unless text holds a carriage return, which encoding/csv
// handles.
func eachCSVText(file, text string, known []string, fn func(record) error) error {
	if strings.IndexByte(text, '\r') >= 0 {
		return eachCSV(file, strings.NewReader(text), known, fn)
	}
	return eachRow(file, &csvText{s: text, line: 1}, known, fn)
}

// rowSource is a reader of CSV records: encoding/csv's or csvText.
type rowSource interface {
	Read() ([]string, error)
	recordLine() int
}

func eachRow(file string, cr rowSource, known []string, fn func(record) error) error {
	header, err := cr.Read()
	if err != nil {
		if errors.Is(err, io.EOF) {
			return &TableError{File: file, Err: errors.New("empty table: no header row")}
		}
		return csvError(file, err)
	}
	header = slices.Clone(header)
	cols := make(map[string]int, len(header))
	for i, h := range header {
		header[i] = strings.TrimSpace(strings.TrimPrefix(h, "\ufeff"))
		cols[header[i]] = i
		if known != nil && !contains(known, header[i]) {
			return &TableError{File: file, Line: 1, Field: header[i], Err: fmt.Errorf("unknown column (known: %s)", strings.Join(known, ", "))}
		}
	}
	shared := newSharedColumns(cols)
	for {
		row, err := cr.Read()
		if errors.Is(err, io.EOF) {
			return nil
		}
		if err != nil {
			return csvError(file, err)
		}
		line := cr.recordLine()
		if len(row) > len(header) {
			return &TableError{File: file, Line: line, Err: fmt.Errorf("%d cells but the header has %d", len(row), len(header))}
		}
		if len(row) == 1 && strings.TrimSpace(row[0]) == "" {
			continue
		}
		for i, c := range row {
			row[i] = strings.TrimSpace(c)
		}
		if err := fn(record{file: file, line: line, cols: cols, cells: row, trimmed: true, shared: shared}); err != nil {
			return err
		}
	}
}

func csvError(file string, err error) error {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		return &TableError{File: file, Line: pe.Line, Err: pe.Err}
	}
	return &TableError{File: file, Err: err}
}

func contains(list []string, s string) bool {
	for _, x := range list {
		if x == s {
			return true
		}
	}
	return false
}

func noteColumn(c *sharedColumns) int    { return c.note }
func locatorColumn(c *sharedColumns) int { return c.locator }
func memoryColumn(c *sharedColumns) int  { return c.memory }
func derivedColumn(c *sharedColumns) int { return c.derived }
