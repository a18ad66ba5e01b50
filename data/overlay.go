package data

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"

	"github.com/BurntSushi/toml"

	"enthalpath/thermo/fileio"
)

// DefaultOverlayPath returns where the user's overlay file lives by
// default: os.UserConfigDir()/enthalpath/data.toml. The file need not exist.
func DefaultOverlayPath() (string, error) {
	dir, err := os.UserConfigDir()
	if err != nil {
		return "", err
	}
	return filepath.Join(dir, "enthalpath", "data.toml"), nil
}

// UserDataPath is the overlay a program run should read: explicit (the
// --data FILE of the command line) when given, else the default overlay
// when that file exists, else "" (the built-in data alone).
func UserDataPath(explicit string) string {
	if explicit != "" {
		return explicit
	}
	if p, err := DefaultOverlayPath(); err == nil {
		if _, err := os.Stat(p); err == nil {
			return p
		}
	}
	return ""
}

// MaxOverlaySize bounds a user data file, in bytes (1 MiB: some ten
// thousand rows, more than the built-in tables hold together).
const MaxOverlaySize = 1 << 20

// LoadWithUserFile loads the embedded tables and, if path is not empty, the
// overlay file at path on top of them. When the overlay cannot be read or is
// malformed it returns the built-in DB together with the error, so a caller
// may report the error and go on with the built-in data.
func LoadWithUserFile(path string) (*DB, error) {
	db, err := Load()
	if err != nil {
		return nil, err
	}
	if path == "" {
		return db, nil
	}
	raw, err := fileio.ReadFile(path, MaxOverlaySize)
	var tooLarge *fileio.TooLargeError
	if errors.As(err, &tooLarge) {
		return db, &TableError{File: path, Err: fmt.Errorf("the file is larger than the %s a data file may have", fileio.Size(MaxOverlaySize))}
	}
	if err != nil {
		return db, &TableError{File: path, Err: err}
	}
	withUser, err := db.WithOverlay(bytes.NewReader(raw), path)
	if err != nil {
		return db, err
	}
	return withUser, nil
}

// WithOverlay reads a TOML overlay from r (name is used in messages) and
// returns a new DB with its rows added or, where a row's key already exists,
// with the fields it gives replacing the built-in ones. The receiver is not
// changed. Every value from the overlay has Override set; a value that
// replaced a built-in one keeps it in Replaced. The error is a *TableError
// naming the line and field at fault.
//
// The overlay holds arrays of tables named after the data tables, with the
// same field names as the CSV columns: [[source]], [[element]],
// [[atomic_weight]],
// [[ionization]], [[affinity]], [[atomization_step]], [[born_exponent]],
// [[ion]], [[shannon]], [[ion_value]], [[compound]]. They are applied in
// that order whatever their order in the file. A value without a source
// gets the source "user".
func (db *DB) WithOverlay(r io.Reader, name string) (*DB, error) {
	raw, err := io.ReadAll(io.LimitReader(r, MaxOverlaySize+1))
	if err != nil {
		return nil, &TableError{File: name, Err: err}
	}
	if len(raw) > MaxOverlaySize {
		return nil, &TableError{File: name, Err: fmt.Errorf("the file is larger than the %s a data file may have", fileio.Size(MaxOverlaySize))}
	}
	var nesting *fileio.NestingError
	if errors.As(fileio.CheckTOMLNesting(raw), &nesting) {
		return nil, &TableError{File: name, Line: nesting.Line, Column: nesting.Column,
			Err: fmt.Errorf("arrays or inline tables nested more than %d deep", nesting.Max)}
	}
	var doc map[string]any
	if _, err := toml.Decode(string(raw), &doc); err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return nil, &TableError{File: name, Line: pe.Position.Line, Column: pe.Position.Col, Field: pe.LastKey, Err: errors.New(pe.Message)}
		}
		return nil, &TableError{File: name, Err: err}
	}
	lines := overlayKeyLines(string(raw))
	byTable := map[string][]record{}
	for key, val := range doc {
		file := ""
		for _, t := range tableOrder {
			if t.overlay == key {
				file = t.file
			}
		}
		if file == "" {
			return nil, &TableError{File: name, Line: firstLine(lines, key), Field: key, Err: fmt.Errorf("unknown table [[%s]] (known: %s)", key, strings.Join(overlayTables(), ", "))}
		}
		entries, ok := val.([]map[string]any)
		if !ok {
			return nil, &TableError{File: name, Line: firstLine(lines, key), Field: key, Err: fmt.Errorf("%s must be an array of tables, written [[%s]]", key, key)}
		}
		for i, entry := range entries {
			rec, err := overlayRecord(name, key, file, i, entry, lines)
			if err != nil {
				return nil, err
			}
			byTable[file] = append(byTable[file], rec)
		}
	}
	next := db.clone()
	b := &builder{db: next, overlay: true}
	for _, t := range tableOrder {
		for _, rec := range byTable[t.file] {
			if err := b.apply(t.file, rec); err != nil {
				return nil, err
			}
		}
	}
	b.finish()
	next.overlays = append(next.overlays, name)
	return next, nil
}

func overlayTables() []string {
	var out []string
	for _, t := range tableOrder {
		out = append(out, "[["+t.overlay+"]]")
	}
	return out
}

// overlayRecord turns one [[table]] entry into a record of strings, as a CSV
// row would be.
func overlayRecord(name, table, file string, index int, entry map[string]any, lines map[string][]map[string]int) (record, error) {
	var keyLine map[string]int
	if l := lines[table]; index < len(l) {
		keyLine = l[index]
	}
	rec := record{file: name, line: keyLine[""], lines: map[string]int{}}
	known := tableColumns[file]
	for _, k := range slices.Sorted(mapKeys(entry)) {
		v := entry[k]
		if l, ok := keyLine[k]; ok {
			rec.lines[k] = l
		}
		if !contains(known, k) {
			return rec, &TableError{File: name, Line: rec.lineOf(k), Field: k, Err: fmt.Errorf("unknown field in [[%s]] (fields: %s)", table, strings.Join(known, ", "))}
		}
		switch x := v.(type) {
		case string:
			rec.set(k, x)
		case int64:
			rec.set(k, strconv.FormatInt(x, 10))
		case float64:
			rec.set(k, strconv.FormatFloat(x, 'g', -1, 64))
		case bool:
			rec.set(k, map[bool]string{true: "yes", false: "no"}[x])
		default:
			return rec, &TableError{File: name, Line: rec.lineOf(k), Field: k, Err: fmt.Errorf("expected a number, string or true/false, got %T", v)}
		}
	}
	return rec, nil
}

func mapKeys(m map[string]any) func(func(string) bool) {
	return func(yield func(string) bool) {
		for k := range m {
			if !yield(k) {
				return
			}
		}
	}
}

func firstLine(lines map[string][]map[string]int, table string) int {
	if l := lines[table]; len(l) > 0 {
		return l[0][""]
	}
	return 0
}

// overlayKeyLines finds, for each [[table]] entry in order, the line of its
// header (key "") and of each of its keys. It reads plain "key = value"
// lines; a value spread over several lines is found by its first line.
func overlayKeyLines(text string) map[string][]map[string]int {
	out := map[string][]map[string]int{}
	var cur map[string]int
	inMultiline := false
	for i, line := range strings.Split(text, "\n") {
		t := strings.TrimSpace(line)
		if inMultiline {
			if strings.Count(t, `"""`)%2 == 1 || strings.Count(t, `'''`)%2 == 1 {
				inMultiline = false
			}
			continue
		}
		switch {
		case t == "" || strings.HasPrefix(t, "#"):
		case strings.HasPrefix(t, "[["):
			end := strings.Index(t, "]]")
			if end < 0 {
				continue
			}
			name := strings.Trim(strings.TrimSpace(t[2:end]), `"'`)
			cur = map[string]int{"": i + 1}
			out[name] = append(out[name], cur)
		case strings.HasPrefix(t, "["):
			cur = nil
			end := strings.Index(t, "]")
			if end > 0 {
				name := strings.TrimSpace(t[1:end])
				out[name] = append(out[name], map[string]int{"": i + 1})
			}
		case cur != nil:
			k, rest, ok := strings.Cut(t, "=")
			if !ok {
				continue
			}
			k = strings.Trim(strings.TrimSpace(k), `"'`)
			if _, dup := cur[k]; !dup {
				cur[k] = i + 1
			}
			if strings.Count(rest, `"""`)%2 == 1 || strings.Count(rest, `'''`)%2 == 1 {
				inMultiline = true
			}
		}
	}
	return out
}
