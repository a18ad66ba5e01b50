package data

import (
	"encoding/csv"
	"io"
	"strings"
)

// csvText reads the records of a CSV text held in memory as encoding/csv
// does with Comment '#', FieldsPerRecord -1 and strict quotes, but hands
// out cells that are substrings of the text: no allocation per record
// except for a cell with a doubled quote. Load reads the embedded tables
// with it (encoding/csv copies every record once more). Texts with a
// carriage return go to encoding/csv (eachCSVText), so every line here
// ends in "\n" alone.
type csvText struct {
	s     string
	pos   int
	line  int // line of the next unread byte, from 1
	start int // line the last record started on
	cells []string
}

// Read returns the next record, io.EOF after the last, or a
// *csv.ParseError with encoding/csv's error values (csv.ErrQuote,
// csv.ErrBareQuote) and the line where the fault stands. The slice is
// reused by the next call.
func (c *csvText) Read() ([]string, error) {
	// Blank lines and comment lines between records are skipped.
	for c.pos < len(c.s) && (c.s[c.pos] == '\n' || c.s[c.pos] == '#') {
		if c.s[c.pos] == '#' {
			end := strings.IndexByte(c.s[c.pos:], '\n')
			if end < 0 {
				c.pos = len(c.s)
				break
			}
			c.pos += end
		}
		c.pos++
		c.line++
	}
	if c.pos >= len(c.s) {
		return nil, io.EOF
	}
	c.start = c.line
	c.cells = c.cells[:0]
	for {
		var cell string
		if c.s[c.pos] == '"' { // c.pos < len(c.s) here: a record or a cell after ',' has begun
			var err error
			if cell, err = c.quoted(); err != nil {
				return nil, err
			}
		} else {
			j := c.pos
			for j < len(c.s) && c.s[j] != ',' && c.s[j] != '\n' {
				j++
			}
			cell = c.s[c.pos:j]
			if strings.IndexByte(cell, '"') >= 0 {
				return nil, c.fault(csv.ErrBareQuote)
			}
			c.pos = j
		}
		c.cells = append(c.cells, cell)
		switch {
		case c.pos >= len(c.s):
			return c.cells, nil
		case c.s[c.pos] == ',':
			c.pos++
			if c.pos >= len(c.s) { // a last empty cell at the end of the text
				c.cells = append(c.cells, "")
				return c.cells, nil
			}
		default: // '\n'
			c.pos++
			c.line++
			return c.cells, nil
		}
	}
}

// quoted reads a quoted cell starting at c.pos (its opening quote); a
// doubled quote stands for one. The cell may span lines.
func (c *csvText) quoted() (string, error) {
	c.pos++
	from := c.pos
	var joined []byte // the cell so far, once a doubled quote is met
	for {
		i := strings.IndexByte(c.s[c.pos:], '"')
		if i < 0 {
			// Unterminated: encoding/csv names the last line read (a
			// final newline opens no line).
			c.line += strings.Count(strings.TrimSuffix(c.s[c.pos:], "\n"), "\n")
			c.pos = len(c.s)
			return "", c.fault(csv.ErrQuote)
		}
		c.line += strings.Count(c.s[c.pos:c.pos+i], "\n")
		c.pos += i + 1
		if c.pos < len(c.s) && c.s[c.pos] == '"' {
			joined = append(joined, c.s[from:c.pos]...) // up to and with one quote
			c.pos++
			from = c.pos
			continue
		}
		cell := c.s[from : c.pos-1]
		if joined != nil {
			cell = string(append(joined, cell...))
		}
		if c.pos < len(c.s) && c.s[c.pos] != ',' && c.s[c.pos] != '\n' {
			return "", c.fault(csv.ErrQuote)
		}
		return cell, nil
	}
}

func (c *csvText) fault(err error) error {
	return &csv.ParseError{StartLine: c.start, Line: c.line, Column: 1, Err: err}
}

// recordLine is the line the last record read started on.
func (c *csvText) recordLine() int { return c.start }

// csvRows adapts encoding/csv's reader to the rows eachRow reads.
type csvRows struct{ *csv.Reader }

func (c csvRows) recordLine() int { line, _ := c.FieldPos(0); return line }
