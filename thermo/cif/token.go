package cif

import (
	"fmt"
	"strings"
	"unicode/utf8"
)

// tokenKind says what a token is in the CIF 1.1 grammar.
type tokenKind int

const (
	tokData    tokenKind = iota // data_NAME block header
	tokLoop                     // loop_
	tokTag                      // _data_name
	tokValue                    // a value: unquoted, quoted or text field
	tokSave                     // save_ or save_NAME (frames belong to dictionaries)
	tokGlobal                   // global_ (STAR, not allowed in CIF)
	tokStop                     // stop_ (STAR, not allowed in CIF)
	tokSkipped                  // values of a loop the reader does not use, counted but not kept
)

// token is one lexical element of a CIF file.
type token struct {
	kind tokenKind
	text string // the block name, tag, or the value's content without delimiters
	line int    // 1-based line where the token starts
	col  int    // 1-based column where the token starts
	// quoted is true for a value written in quotes or as a text field: such a
	// value is always a string, so '?' in quotes is not the "unknown" mark.
	quoted bool
	// count is the number of values a tokSkipped token stands for.
	count int
}

// readLoop reports whether the reader uses a loop holding tag (normalized):
// the values of every other loop are counted while tokenising, not kept,
// so that a file carrying large tables the reader ignores (reflections,
// anisotropic displacements) costs no memory for them.
func readLoop(tag string) bool {
	if strings.HasPrefix(tag, "_atom_site_aniso") {
		return false
	}
	for _, p := range [...]string{"_atom_site_", "_atom_type_", "_space_group_symop_", "_symmetry_equiv_pos_"} {
		if strings.HasPrefix(tag, p) {
			return true
		}
	}
	return false
}

// maxKeptTokens bounds the tokens kept from one file (values of the loops
// read and single items): an atom-site loop of maxSites rows of twenty
// columns fits.
const maxKeptTokens = 20*maxSites + 100000

// loopState follows the loop being tokenised: whether its values are kept,
// whether it is the atom-site loop, how many tags and values it has.
type loopState struct {
	open     bool // after loop_, until a token other than a tag or value
	inBody   bool // a value has been seen
	keep     bool
	atomSite bool
	tags     int
	values   int
}

// tokenize splits a CIF 1.1 file into tokens, following the syntax of
// Hall, Allen & Brown (1991) as revised for CIF 1.1: '#' starts a comment
// where a token could start; a quoted string ends at its opening quote
// character followed by white space or the end of the line (so 'a dog's
// life' is one value); a text field runs from a line starting with ';' to the
// next line starting with ';'. Reserved words are case-insensitive.
func tokenize(src string, file string) ([]token, error) {
	var toks []token
	var lp loopState
	// emit adds a token, following the loop it belongs to: values of a loop
	// the reader does not use are folded into one tokSkipped token, and the
	// atom-site loop is refused as soon as it has more rows than the reader
	// accepts sites.
	emit := func(t token) error {
		switch {
		case t.kind == tokValue && lp.open:
			lp.inBody = true
			lp.values++
			if lp.atomSite && lp.tags > 0 && lp.values > maxSites*lp.tags {
				return &Error{File: file, Line: t.line, Tag: "_atom_site_fract_x", Err: ErrBadValue,
					Msg: fmt.Sprintf("the atom-site loop has more than %d rows; that is beyond what this reader accepts", maxSites)}
			}
			if !lp.keep {
				if n := len(toks); n > 0 && toks[n-1].kind == tokSkipped {
					toks[n-1].count++
					toks[n-1].line = t.line
				} else {
					toks = append(toks, token{kind: tokSkipped, line: t.line, col: t.col, count: 1})
				}
				return nil
			}
		case t.kind == tokTag && lp.open && !lp.inBody:
			tag := normalizeTag(t.text)
			lp.tags++
			lp.keep = lp.keep || readLoop(tag)
			lp.atomSite = lp.atomSite || tag == "_atom_site_fract_x"
		case t.kind == tokLoop:
			lp = loopState{open: true}
		default:
			lp = loopState{}
		}
		if len(toks) >= maxKeptTokens {
			return &Error{File: file, Line: t.line, Err: ErrBadValue,
				Msg: fmt.Sprintf("more than %d data values to read; that is beyond what this reader accepts", maxKeptTokens)}
		}
		toks = append(toks, t)
		return nil
	}
	line, col := 1, 1
	i := 0
	n := len(src)
	atLineStart := true
	syntaxErr := func(l int, msg string, args ...any) error {
		return &Error{File: file, Line: l, Msg: fmt.Sprintf(msg, args...), Err: ErrSyntax}
	}
	for i < n {
		c := src[i]
		switch {
		case c == '\n':
			i++
			line++
			col = 1
			atLineStart = true
			continue
		case c == '\r':
			// A lone CR or a CRLF pair ends a line.
			i++
			if i < n && src[i] == '\n' {
				i++
			}
			line++
			col = 1
			atLineStart = true
			continue
		case c == ' ' || c == '\t':
			i++
			col++
			atLineStart = false
			continue
		case c == '#':
			for i < n && src[i] != '\n' && src[i] != '\r' {
				i++
			}
			continue
		case c == ';' && atLineStart:
			startLine := line
			// The field's content starts after the ';' and ends before the
			// newline that precedes the closing ';'.
			j := i + 1
			var b strings.Builder
			closed := false
			for j < n {
				k := j
				for k < n && src[k] != '\n' && src[k] != '\r' {
					k++
				}
				b.WriteString(src[j:k])
				if k >= n {
					j = k
					break
				}
				// consume the line end
				if src[k] == '\r' && k+1 < n && src[k+1] == '\n' {
					k++
				}
				k++
				line++
				if k < n && src[k] == ';' {
					j = k + 1
					closed = true
					break
				}
				b.WriteByte('\n')
				j = k
			}
			if !closed {
				return nil, syntaxErr(startLine, "text field opened with ';' is never closed (a line starting with ';' must end it)")
			}
			if err := emit(token{kind: tokValue, text: b.String(), line: startLine, col: 1, quoted: true}); err != nil {
				return nil, err
			}
			col = 2
			i = j
			atLineStart = false
			continue
		case c == '\'' || c == '"':
			q := c
			j := i + 1
			for {
				if j >= n || src[j] == '\n' || src[j] == '\r' {
					return nil, syntaxErr(line, "quoted value starting at column %d has no closing %c on its line", col, q)
				}
				if src[j] == q && (j+1 >= n || isBlank(src[j+1])) {
					break
				}
				j++
			}
			if err := emit(token{kind: tokValue, text: src[i+1 : j], line: line, col: col, quoted: true}); err != nil {
				return nil, err
			}
			col += utf8.RuneCountInString(src[i : j+1]) // columns count characters, not bytes
			i = j + 1
			atLineStart = false
			continue
		}
		// An unquoted word: everything up to white space.
		j := i
		for j < n && !isBlank(src[j]) {
			j++
		}
		word := src[i:j]
		t := token{text: word, line: line, col: col}
		lower := strings.ToLower(word)
		switch {
		case strings.HasPrefix(lower, "data_"):
			t.kind = tokData
			t.text = word[5:]
			if t.text == "" {
				return nil, syntaxErr(line, "data_ needs a block name (as in data_rutile)")
			}
		case lower == "loop_":
			t.kind = tokLoop
		case strings.HasPrefix(lower, "save_"):
			t.kind = tokSave
			t.text = word[5:]
		case lower == "global_":
			t.kind = tokGlobal
		case lower == "stop_":
			t.kind = tokStop
		case word[0] == '_':
			t.kind = tokTag
		case word[0] == '[' || word[0] == ']':
			return nil, syntaxErr(line, "value %q at column %d starts with %q, which CIF 1.1 reserves; put the value in quotes", word, col, word[:1])
		default:
			t.kind = tokValue
		}
		if err := emit(t); err != nil {
			return nil, err
		}
		col += utf8.RuneCountInString(word)
		i = j
		atLineStart = false
	}
	return toks, nil
}

// isBlank reports CIF white space (space, tab, line ends).
func isBlank(c byte) bool { return c == ' ' || c == '\t' || c == '\n' || c == '\r' }
