package data

import (
	"encoding/csv"
	"errors"
	"io"
	"io/fs"
	"slices"
	"strings"
	"testing"
)

// readAll reads every record of a text with its line, with csvText or with
// encoding/csv configured as eachCSV configures it (the reference: Go's
// standard library).
func readAll(text string, fast bool) (rows [][]string, lines []int, err error) {
	var src rowSource = &csvText{s: text, line: 1}
	if !fast {
		cr := csv.NewReader(strings.NewReader(text))
		cr.Comment = '#'
		cr.FieldsPerRecord = -1
		src = csvRows{cr}
	}
	for {
		row, err := src.Read()
		if errors.Is(err, io.EOF) {
			return rows, lines, nil
		}
		if err != nil {
			return rows, lines, err
		}
		rows = append(rows, slices.Clone(row))
		lines = append(lines, src.recordLine())
	}
}

// sameAsEncodingCSV fails unless csvText reads text as encoding/csv does:
// the same records on the same lines, or an error of the same kind on the
// same line.
func sameAsEncodingCSV(t *testing.T, name, text string) {
	t.Helper()
	fastRows, fastLines, fastErr := readAll(text, true)
	refRows, refLines, refErr := readAll(text, false)
	if (fastErr == nil) != (refErr == nil) {
		t.Fatalf("%s: csvText error %v, encoding/csv error %v", name, fastErr, refErr)
	}
	if refErr != nil {
		var a, b *csv.ParseError
		if !errors.As(fastErr, &a) || !errors.As(refErr, &b) || a.Err != b.Err || a.Line != b.Line {
			t.Fatalf("%s: csvText error %v, encoding/csv error %v", name, fastErr, refErr)
		}
		return
	}
	if !slices.EqualFunc(fastRows, refRows, slices.Equal) || !slices.Equal(fastLines, refLines) {
		t.Fatalf("%s: csvText read %q on lines %v, encoding/csv %q on lines %v", name, fastRows, fastLines, refRows, refLines)
	}
}

func TestCSVTextReadsAsEncodingCSV(t *testing.T) {
	cases := map[string]string{
		"plain":              "a,b,c\n1,2,3\n",
		"no final newline":   "a,b\n1,2",
		"trailing comma":     "a,b\n1,\n",
		"trailing comma EOF": "a,b\n1,",
		"comments, blanks":   "# one\n\na,b\n# two\n1,2\n\n\n3,4\n",
		"quoted":             "a,b\n\"x, y\",2\n",
		"doubled quote":      "a,b\n\"say \"\"hi\"\"\",2\n",
		"only doubled":       "a\n\"\"\"\"\n",
		"empty quoted":       "a,b\n\"\",2\n",
		"multi-line":         "a,b\n\"one\ntwo\",2\n3,4\n",
		"hash inside quotes": "a,b\n\"x\n# not a comment\",2\n",
		"bare quote":         "a,b\n1,x\"y\n",
		"unterminated":       "a,b\n1,\"open\n2,3\n",
		"junk after quote":   "a,b\n\"x\"y,2\n",
		"empty":              "",
		"only comments":      "# a\n# b\n",
		"unicode":            "\ufeffformula,note\nΔ,\"ΔfH° ± 0.3\"\n",
		"spaces":             "a, b\n 1 , 2 \n   \n",
	}
	for name, text := range cases {
		sameAsEncodingCSV(t, name, text)
	}
}

// Every embedded table reads the same with both readers.
func TestCSVTextReadsEveryTable(t *testing.T) {
	entries, err := fs.ReadDir(embedded, "tables")
	if err != nil {
		t.Fatal(err)
	}
	n := 0
	for _, e := range entries {
		raw, err := embedded.ReadFile("tables/" + e.Name())
		if err != nil {
			t.Fatal(err)
		}
		sameAsEncodingCSV(t, e.Name(), string(raw))
		n++
	}
	if n < 15 {
		t.Errorf("only %d tables compared", n)
	}
}

func FuzzCSVText(f *testing.F) {
	for _, s := range []string{"a,b\n1,2\n", "a\n\"x\"\"y\"\n", "# c\n\na,\"b\nc\"\n", "a,b\n1,x\"y\n", "\"", ",,\n,"} {
		f.Add(s)
	}
	f.Fuzz(func(t *testing.T, text string) {
		if strings.IndexByte(text, '\r') >= 0 {
			return // eachCSVText gives such texts to encoding/csv
		}
		sameAsEncodingCSV(t, "fuzz", text)
	})
}
