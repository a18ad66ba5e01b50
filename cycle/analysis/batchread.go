package analysis

// The batch's input: the CSV reader of batch rows (batch.go runs them).

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"errors"
	"fmt"
	"io"
	"math"
	"strconv"
	"strings"
	"unicode"
	"unicode/utf8"

	"enthalpath/cycle"
	"enthalpath/thermo"
)

// Batch input columns (a header row names them; order is free; only
// formula is required). A column "set:KEY" gives step KEY a value
// ("744±20", kJ/mol per reaction as written), as a step value is given.
const (
	ColFormula      = "formula"
	ColCharges      = "charges"
	ColModel        = "model"
	ColStructure    = "structure"
	ColCationRadius = "cation_radius"
	ColAnionRadius  = "anion_radius"
	colSetPrefix    = "set:"
)

// BatchColumns lists the recognized input columns (besides set:KEY).
func BatchColumns() []string {
	return []string{ColFormula, ColCharges, ColModel, ColStructure, ColCationRadius, ColAnionRadius}
}

// MaxBatchLine is the longest input line (bytes) a batch accepts, so that
// memory stays bounded whatever the file holds.
const MaxBatchLine = 64 << 10

// BatchRow is one input row: the formula and its estimate options.
type BatchRow struct {
	// Line is the 1-based line of the row in the input.
	Line    int
	Formula string
	Options EstimateOptions
	// cells is the row's cells joined by NUL (a byte no accepted cell
	// holds): rows with the same cells have the same result.
	cells string
}

// BatchReader reads batch rows from CSV one at a time (streaming: memory
// does not grow with the file).
type BatchReader struct {
	r      *csv.Reader
	header []string
	col    map[string]int
	sets   []int // columns set:KEY
	// read holds the rows read so far by their cells (at most
	// rowMemoSize), so that a repeated row is not read again; cells is
	// the scratch its keys are built in.
	read     map[string]BatchRow
	readSize int
	readHits int // rows found in read
	cells    []byte
}

// NewBatchReader reads the header row from r. Lines starting with '#' are
// comments. Errors are *CSVError with the line and column.
func NewBatchReader(r io.Reader) (*BatchReader, error) {
	cr := csv.NewReader(&lineLimiter{r: bufio.NewReader(r)})
	cr.Comment = '#'
	cr.FieldsPerRecord = -1
	cr.TrimLeadingSpace = true
	cr.ReuseRecord = true
	head, err := cr.Read()
	if err == io.EOF {
		return nil, &CSVError{Line: 1, Reason: "empty file: the first line must name the columns, e.g. formula,charges,model"}
	}
	if err != nil {
		return nil, csvErr(err, nil)
	}
	br := &BatchReader{r: cr, col: map[string]int{}, read: map[string]BatchRow{}, readSize: rowMemoSize}
	for i, h := range head {
		h = strings.ToLower(strings.TrimSpace(strings.TrimPrefix(h, "\ufeff")))
		br.header = append(br.header, h)
		if _, dup := br.col[h]; dup {
			return nil, &CSVError{Line: 1, Column: h, Reason: "column named twice"}
		}
		br.col[h] = i
		switch {
		case strings.HasPrefix(h, colSetPrefix):
			if strings.TrimSpace(h[len(colSetPrefix):]) == "" {
				return nil, &CSVError{Line: 1, Column: h, Reason: "set: needs a step key, e.g. set:attachment-2"}
			}
			br.sets = append(br.sets, i)
		case isBatchColumn(h):
		default:
			return nil, &CSVError{Line: 1, Column: h, Reason: "unknown column; use " + strings.Join(BatchColumns(), ", ") + " or set:KEY"}
		}
	}
	if _, ok := br.col[ColFormula]; !ok {
		return nil, &CSVError{Line: 1, Column: ColFormula, Reason: "no formula column in the header"}
	}
	return br, nil
}

func isBatchColumn(h string) bool {
	for _, c := range BatchColumns() {
		if c == h {
			return true
		}
	}
	return false
}

// Next returns the next row, or io.EOF after the last. A malformed row is a
// *CSVError naming its line and column; the reader can go on after it.
// Rows with the same cells share their Options' charges and step values:
// read them, do not change them.
func (br *BatchReader) Next() (BatchRow, error) {
	rec, err := br.r.Read()
	if err == io.EOF {
		return BatchRow{}, io.EOF
	}
	if err != nil {
		return BatchRow{}, csvErr(err, br.header)
	}
	line, _ := br.r.FieldPos(0)
	if len(rec) != len(br.header) {
		return BatchRow{Line: line}, &CSVError{Line: line, Reason: fmt.Sprintf("%d columns where the header has %d", len(rec), len(br.header))}
	}
	br.cells = br.cells[:0]
	for i, v := range rec {
		if i > 0 {
			br.cells = append(br.cells, 0)
		}
		br.cells = append(br.cells, v...)
	}
	if seen, ok := br.read[string(br.cells)]; ok { // not a copy: no allocation
		br.readHits++
		seen.Line = line
		return seen, nil
	}
	return br.parse(rec, line)
}

// parse reads the cells of a row not read before.
func (br *BatchReader) parse(rec []string, line int) (BatchRow, error) {
	row := BatchRow{Line: line}
	cell := func(name string) string {
		if i, ok := br.col[name]; ok {
			return strings.TrimSpace(rec[i])
		}
		return ""
	}
	bad := func(name, reason string, err error) (BatchRow, error) {
		return row, &CSVError{Line: line, Column: name, Reason: reason, Err: err}
	}
	for i, v := range rec {
		// A control character (a NUL, for one) would be copied into the
		// output's formula cell: the row is refused before it is echoed.
		if j := strings.IndexFunc(v, func(r rune) bool { return unicode.IsControl(r) && r != '\t' }); j >= 0 {
			r, _ := utf8.DecodeRuneInString(v[j:])
			return bad(br.header[i], fmt.Sprintf("control character U+%04X in the cell; remove it", r), nil)
		}
	}
	row.cells = string(br.cells)
	row.Formula = cell(ColFormula)
	if row.Formula == "" {
		return bad(ColFormula, "empty formula", nil)
	}
	if s := cell(ColCharges); s != "" {
		ch, err := ParseCharges(s, row.Formula)
		if err != nil {
			return bad(ColCharges, "cannot read the charges", err)
		}
		row.Options.Charges = ch
	}
	if s := cell(ColModel); s != "" && !strings.EqualFold(strings.TrimSpace(s), cycle.ModelAuto) {
		m, err := cycle.ParseModel(s)
		if err != nil {
			return bad(ColModel, "unknown model", err)
		}
		row.Options.Model = m
	}
	row.Options.Structure = cell(ColStructure)
	for _, rc := range []struct {
		name string
		dst  *float64
	}{{ColCationRadius, &row.Options.CationRadius}, {ColAnionRadius, &row.Options.AnionRadius}} {
		s := cell(rc.name)
		if s == "" {
			continue
		}
		v, err := strconv.ParseFloat(s, 64)
		if err != nil || !(v > 0) || math.IsInf(v, 0) {
			return bad(rc.name, fmt.Sprintf("%q is not a positive radius in Å", s), nil)
		}
		*rc.dst = v
	}
	for _, i := range br.sets {
		s := strings.TrimSpace(rec[i])
		if s == "" {
			continue
		}
		key := strings.TrimSpace(br.header[i][len(colSetPrefix):])
		st, err := cycle.ParseSetting(key+"="+s, thermo.KJPerMol)
		if err != nil {
			return bad(br.header[i], "cannot read the value", err)
		}
		row.Options.Sets = append(row.Options.Sets, st)
	}
	if worthRemembering(len(br.read), br.readHits, br.readSize) {
		br.read[row.cells] = row
	}
	return row, nil
}

func csvErr(err error, header []string) error {
	var pe *csv.ParseError
	if errors.As(err, &pe) {
		return &CSVError{Line: pe.Line, Reason: fmt.Sprintf("malformed CSV at byte %d of the line", pe.Column), Err: pe.Err}
	}
	var le *lineTooLong
	if errors.As(err, &le) {
		return &CSVError{Line: le.line, Reason: fmt.Sprintf("line longer than %d bytes", MaxBatchLine)}
	}
	return &CSVError{Reason: "cannot read the input", Err: err}
}

// lineLimiter passes bytes through but fails on a line longer than
// MaxBatchLine, so that a file without newlines cannot fill memory.
type lineLimiter struct {
	r    *bufio.Reader
	run  int
	line int
}

type lineTooLong struct{ line int }

func (e *lineTooLong) Error() string { return fmt.Sprintf("line %d too long", e.line) }

func (l *lineLimiter) Read(p []byte) (int, error) {
	n, err := l.r.Read(p)
	for i := 0; i < n; {
		j := bytes.IndexByte(p[i:n], '\n')
		run := j // the bytes of the line in p[i:n]
		if j < 0 {
			run = n - i
		}
		if l.run+run > MaxBatchLine {
			return i + MaxBatchLine - l.run, &lineTooLong{line: l.line + 1}
		}
		if j < 0 {
			l.run += run
			break
		}
		l.run = 0
		l.line++
		i += j + 1
	}
	return n, err
}
