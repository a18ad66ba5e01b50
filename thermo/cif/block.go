package cif

import (
	"fmt"
	"strings"
)

// value is one value of a data item with where it was written.
type value struct {
	text   string
	line   int
	quoted bool
}

// unknown reports the CIF marks '?' (value unknown) and '.' (inapplicable),
// which only count as such when not quoted.
func (v value) unknown() bool { return !v.quoted && (v.text == "?" || v.text == ".") }

// loop is a table: the tags of its columns and its rows of values.
type loop struct {
	tags []string // lower-case tags
	rows [][]value
	line int // line of loop_
}

// block is one data block: its single items and its loops. Tags are stored
// in lower case (CIF data names are case-insensitive) with '.' written as
// '_', so the DDLm spelling _space_group_symop.operation_xyz reads as
// _space_group_symop_operation_xyz.
type block struct {
	name    string
	line    int
	items   map[string]value // single-valued items
	loops   []*loop
	inLoop  map[string]*loop  // tag → the loop holding it
	tagLine map[string]int    // tag → line where it was written
	spelled map[string]string // tag → the spelling the file used
}

// normalizeTag writes a data name the way blocks store it.
func normalizeTag(t string) string {
	return strings.ReplaceAll(strings.ToLower(t), ".", "_")
}

// has reports whether tag is present, as an item or a loop column.
func (b *block) has(tag string) bool {
	_, ok := b.items[tag]
	return ok || b.inLoop[tag] != nil
}

// parseBlocks groups the tokens of a file into data blocks.
func parseBlocks(toks []token, file string) ([]*block, error) {
	var blocks []*block
	var cur *block
	seen := map[string]int{} // lower-case block name → line
	syntaxErr := func(l int, tag, msg string, args ...any) error {
		return &Error{File: file, Line: l, Tag: tag, Msg: fmt.Sprintf(msg, args...), Err: ErrSyntax}
	}
	addTag := func(t token) error {
		tag := normalizeTag(t.text)
		if l, dup := cur.tagLine[tag]; dup {
			return syntaxErr(t.line, t.text, "appears twice in data_%s (first on line %d); a block may hold each data name once", cur.name, l)
		}
		cur.tagLine[tag] = t.line
		cur.spelled[tag] = t.text
		return nil
	}
	for i := 0; i < len(toks); {
		t := toks[i]
		switch t.kind {
		case tokData:
			if l, dup := seen[strings.ToLower(t.text)]; dup {
				return nil, syntaxErr(t.line, "", "block data_%s appears twice (first on line %d)", t.text, l)
			}
			seen[strings.ToLower(t.text)] = t.line
			cur = &block{name: t.text, line: t.line, items: map[string]value{}, inLoop: map[string]*loop{}, tagLine: map[string]int{}, spelled: map[string]string{}}
			blocks = append(blocks, cur)
			i++
			continue
		case tokGlobal, tokStop:
			return nil, syntaxErr(t.line, "", "%q is a STAR word that CIF does not allow", t.text)
		case tokSave:
			return nil, syntaxErr(t.line, "", "save frames (save_%s) belong to dictionaries and are not read here", t.text)
		}
		if cur == nil {
			return nil, syntaxErr(t.line, "", "%q comes before the first data_ block header", t.text)
		}
		switch t.kind {
		case tokTag:
			if err := addTag(t); err != nil {
				return nil, err
			}
			if i+1 >= len(toks) || toks[i+1].kind != tokValue {
				return nil, syntaxErr(t.line, t.text, "has no value; write ? if it is unknown")
			}
			v := toks[i+1]
			cur.items[normalizeTag(t.text)] = value{text: v.text, line: v.line, quoted: v.quoted}
			i += 2
		case tokValue, tokSkipped:
			return nil, syntaxErr(t.line, "", "value %q at column %d belongs to no data name", clip(t.text), t.col)
		case tokLoop:
			lp := &loop{line: t.line}
			i++
			for i < len(toks) && toks[i].kind == tokTag {
				if err := addTag(toks[i]); err != nil {
					return nil, err
				}
				lp.tags = append(lp.tags, normalizeTag(toks[i].text))
				i++
			}
			if len(lp.tags) == 0 {
				return nil, &Error{File: file, Line: t.line, Msg: "loop_ is not followed by any data name", Err: ErrMalformedLoop}
			}
			var vals []value
			skipped, last := 0, 0
			for i < len(toks) && (toks[i].kind == tokValue || toks[i].kind == tokSkipped) {
				if toks[i].kind == tokSkipped {
					skipped += toks[i].count
				} else {
					vals = append(vals, value{text: toks[i].text, line: toks[i].line, quoted: toks[i].quoted})
				}
				last = toks[i].line
				i++
			}
			if n := len(vals) + skipped; n > 0 && n%len(lp.tags) != 0 {
				return nil, &Error{File: file, Line: t.line, Tag: lp.tags[0], Err: ErrMalformedLoop,
					Msg: fmt.Sprintf("loop_ has %d data names but %d values, not a multiple of %d (%d full rows and %d left over, the last on line %d); check for a missing value or an unquoted value with spaces",
						len(lp.tags), n, len(lp.tags), n/len(lp.tags), n%len(lp.tags), last)}
			}
			if len(vals)+skipped == 0 {
				return nil, &Error{File: file, Line: t.line, Tag: lp.tags[0], Msg: "loop_ has data names but no values", Err: ErrMalformedLoop}
			}
			for r := 0; r < len(vals); r += len(lp.tags) {
				lp.rows = append(lp.rows, vals[r:r+len(lp.tags)])
			}
			for _, tag := range lp.tags {
				cur.inLoop[tag] = lp
			}
			cur.loops = append(cur.loops, lp)
		}
	}
	if len(blocks) == 0 {
		return nil, &Error{File: file, Msg: "no data_ block found; is this a CIF file?", Err: ErrSyntax}
	}
	return blocks, nil
}

// clip shortens a value for an error message.
func clip(s string) string {
	if len(s) > 40 {
		return s[:37] + "..."
	}
	return s
}

// lineOr returns the line of loop_, or alt when lp is nil.
func (lp *loop) lineOr(alt int) int {
	if lp == nil {
		return alt
	}
	return lp.line
}
