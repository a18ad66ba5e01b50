package fileio

import "fmt"

// MaxTOMLNesting is the deepest nesting of arrays and inline tables that
// CheckTOMLNesting lets through: the files read here nest two or three
// deep, and a TOML decoder recurses once per level (a 1 MiB file of
// nested brackets took 7.6 s and 465 MB to refuse).
const MaxTOMLNesting = 8

// NestingError refuses a TOML text nested deeper than MaxTOMLNesting.
type NestingError struct {
	Line, Column int // where the limit was passed, from 1 (columns in bytes)
	Max          int
}

func (e *NestingError) Error() string {
	return fmt.Sprintf("line %d column %d: arrays or inline tables nested more than %d deep", e.Line, e.Column, e.Max)
}

// CheckTOMLNesting scans a TOML text, before it is decoded, for arrays and
// inline tables nested deeper than MaxTOMLNesting, skipping strings and
// comments. It does not check anything else: the decoder does.
func CheckTOMLNesting(b []byte) error {
	depth, line, col := 0, 1, 0
	for i := 0; i < len(b); i++ {
		c := b[i]
		col++
		switch c {
		case '\n':
			line, col = line+1, 0
		case '#':
			for i+1 < len(b) && b[i+1] != '\n' {
				i++
			}
		case '"', '\'':
			end := skipString(b, i)
			for _, d := range b[i:end] {
				if d == '\n' {
					line, col = line+1, 0
				} else {
					col++
				}
			}
			i = end - 1
		case '[', '{':
			if depth++; depth > MaxTOMLNesting {
				return &NestingError{Line: line, Column: col, Max: MaxTOMLNesting}
			}
		case ']', '}':
			depth = max(0, depth-1)
		}
	}
	return nil
}

// skipString returns the index just past the string that starts at b[i]
// (basic or literal, one line or three quotes), or len(b) if it is not
// closed.
func skipString(b []byte, i int) int {
	q := b[i]
	if i+2 < len(b) && b[i+1] == q && b[i+2] == q {
		for j := i + 3; j+2 < len(b); j++ {
			if q == '"' && b[j] == '\\' {
				j++
				continue
			}
			if b[j] == q && b[j+1] == q && b[j+2] == q {
				return j + 3
			}
		}
		return len(b)
	}
	for j := i + 1; j < len(b); j++ {
		switch {
		case q == '"' && b[j] == '\\':
			j++
		case b[j] == q:
			return j + 1
		case b[j] == '\n':
			return j // an unclosed one-line string: the decoder says so
		}
	}
	return len(b)
}
