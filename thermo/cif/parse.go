package cif

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"strings"

	"enthalpath/thermo/crystal"
	"enthalpath/thermo/fileio"
)

// Options adjust how a CIF file becomes a crystal.
type Options struct {
	// Charges gives ion charges (in e) by atom-site label ("Na1"), by type
	// symbol ("Na1+") or by element ("Na"), tried in that order. A charge
	// given here overrides the file's oxidation numbers.
	Charges map[string]float64
	// MergeTolerance is the distance in Å within which two symmetry images
	// are the same position. 0 means DefaultMergeTolerance.
	MergeTolerance float64
	// Block names the data block to read (without "data_"). Empty means the
	// first block that has atom sites.
	Block string
}

// DefaultMergeTolerance is the merge distance used when
// Options.MergeTolerance is 0, in Å.
const DefaultMergeTolerance = 1e-3

// MaxMergeTolerance bounds Options.MergeTolerance, in Å: a larger distance
// would merge distinct atoms in real structures.
const MaxMergeTolerance = 0.5

// OccupancyTolerance is the largest |occupancy − 1| read as a full site.
const OccupancyTolerance = 1e-3

// maxSites and maxImages bound the number of sites after symmetry
// expansion and the number of images computed, so that a hostile file
// cannot exhaust memory or time.
const (
	maxSites  = 50000
	maxImages = 1000000
)

// MaxFileSize bounds the CIF files ParseFile reads, in bytes (2 MiB: a
// cell of 40,000 sites written with its coordinates takes 1.5 MiB; a file
// that also carries its structure factors may need them taken out first).
// At 2 MiB the costliest file to read (a loop of one-character values)
// peaks near 230 MB; at 4 MiB it took 450 MB.
const MaxFileSize = 2 << 20

// ParseFile reads the CIF file at path; see Parse. It reads regular files
// only (not a device, pipe or folder) of at most MaxFileSize bytes.
func ParseFile(path string, opt Options) (*crystal.Crystal, error) {
	b, err := readFile(path)
	if err != nil {
		return nil, err
	}
	return Parse(bytes.NewReader(b), path, opt)
}

// ReadFile reads the CIF file at path, as ParseFile does; see Read.
func ReadFile(path string, opt Options) (*crystal.Crystal, error) {
	b, err := readFile(path)
	if err != nil {
		return nil, err
	}
	return Read(bytes.NewReader(b), path, opt)
}

// readFile reads a regular file of at most MaxFileSize bytes.
func readFile(path string) ([]byte, error) {
	b, err := fileio.ReadFile(path, MaxFileSize)
	var tooLarge *fileio.TooLargeError
	var notRegular *fileio.NotRegularError
	switch {
	case errors.As(err, &tooLarge):
		return nil, &Error{File: path, Msg: fmt.Sprintf("the file is larger than the %s a CIF file may have here; remove loops the structure does not need (structure factors, for one)", fileio.Size(MaxFileSize)), Err: err}
	case errors.As(err, &notRegular):
		return nil, &Error{File: path, Msg: "it is " + notRegular.Kind + ", not a regular file; give a CIF file", Err: err}
	case err != nil:
		return nil, err
	}
	return b, nil
}

// Parse reads a CIF 1.1 file from r and returns the full unit cell as a
// point-charge crystal: the cell from the _cell_ items, the atom sites
// expanded by the symmetry operations, wrapped into [0,1) and merged within
// the tolerance, each with its charge. name is used in error messages and
// (its last path element) as the crystal's name. Every site must have a
// charge and the cell must be neutral. Every problem is returned as *Error;
// see the package documentation for what is read and what is refused.
func Parse(r io.Reader, name string, opt Options) (*crystal.Crystal, error) {
	rd, c, err := read(r, name, opt)
	if err != nil {
		return nil, err
	}
	if err := rd.chargesGiven(c); err != nil {
		return nil, err
	}
	if err := rd.neutral(c); err != nil {
		return nil, err
	}
	if err := c.Validate(); err != nil {
		return nil, rd.errf(0, "", errors.Unwrap(err), "%s", err.Error())
	}
	return c, nil
}

// Read is Parse without the last two demands: a site whose charge the file
// (and opt.Charges) does not give is returned with Charge 0 and its
// occupants' ChargeKnown false, and a cell whose charges do not sum to zero
// is returned as it is. Every site carries its Occupants. Package valence
// assigns the missing charges.
func Read(r io.Reader, name string, opt Options) (*crystal.Crystal, error) {
	_, c, err := read(r, name, opt)
	return c, err
}

func read(r io.Reader, name string, opt Options) (*reader, *crystal.Crystal, error) {
	// One buffer of the input's size where it is known, and no copy of it
	// into a string.
	var src strings.Builder
	if l, ok := r.(interface{ Len() int }); ok {
		src.Grow(l.Len())
	}
	if _, err := io.Copy(&src, r); err != nil {
		return nil, nil, &Error{File: name, Msg: "cannot read: " + err.Error(), Err: err}
	}
	toks, err := tokenize(src.String(), name)
	if err != nil {
		return nil, nil, err
	}
	blocks, err := parseBlocks(toks, name)
	if err != nil {
		return nil, nil, err
	}
	b, err := chooseBlock(blocks, name, opt.Block)
	if err != nil {
		return nil, nil, err
	}
	tol := opt.MergeTolerance
	if tol == 0 {
		tol = DefaultMergeTolerance
	}
	if !(tol > 0 && tol <= MaxMergeTolerance) {
		return nil, nil, &Error{File: name, Msg: fmt.Sprintf("merge tolerance %g Å is outside (0, %g] Å", tol, MaxMergeTolerance), Err: ErrBadValue}
	}
	rd := &reader{file: name, b: b}
	c, err := rd.crystal(opt, tol)
	return rd, c, err
}

// chooseBlock picks the named block, or the first with atom sites.
func chooseBlock(blocks []*block, file, want string) (*block, error) {
	if want != "" {
		var names []string
		for _, b := range blocks {
			if strings.EqualFold(b.name, want) {
				return b, nil
			}
			names = append(names, "data_"+b.name)
		}
		return nil, &Error{File: file, Msg: fmt.Sprintf("no block data_%s; the file has %s", want, strings.Join(names, ", ")), Err: ErrNoSites}
	}
	for _, b := range blocks {
		if b.has("_atom_site_fract_x") {
			return b, nil
		}
	}
	return nil, &Error{File: file, Line: blocks[0].line, Tag: "_atom_site_fract_x",
		Msg: fmt.Sprintf("no data block gives fractional atom coordinates (%d block(s) read); Cartesian-only files are not read", len(blocks)), Err: ErrNoSites}
}

// reader turns one block into a crystal.
type reader struct {
	file string
	b    *block
	asym []asymSite // the atom-site rows, once read
}

func (rd *reader) errf(line int, tag string, kind error, msg string, args ...any) *Error {
	if sp, ok := rd.b.spelled[normalizeTag(tag)]; ok {
		tag = sp
	}
	return &Error{File: rd.file, Line: line, Tag: tag, Msg: fmt.Sprintf(msg, args...), Err: kind}
}

// number reads the single item tag as a number. required says whether a
// missing or unknown value is an error (of kind missing).
func (rd *reader) number(tag string, missing error) (float64, bool, error) {
	v, ok := rd.b.items[tag]
	if !ok {
		if lp := rd.b.inLoop[tag]; lp != nil {
			if len(lp.rows) != 1 {
				return 0, false, rd.errf(lp.line, tag, ErrBadValue, "is looped with %d values; it takes one", len(lp.rows))
			}
			v = lp.rows[0][indexOf(lp.tags, tag)]
		} else {
			if missing != nil {
				return 0, false, rd.errf(rd.b.line, tag, missing, "is missing from data_%s", rd.b.name)
			}
			return 0, false, nil
		}
	}
	if v.unknown() {
		if missing != nil {
			return 0, false, rd.errf(v.line, tag, missing, "is given as %q (unknown); the cell must be known", v.text)
		}
		return 0, false, nil
	}
	x, ok := parseNumber(v.text)
	if !ok {
		return 0, false, rd.errf(v.line, tag, ErrBadValue, "cannot read %q as a number", clip(v.text))
	}
	return x, true, nil
}

func indexOf(list []string, s string) int {
	for i, t := range list {
		if t == s {
			return i
		}
	}
	return -1
}

// column is one requested column of a table.
type column struct {
	tag  string
	vals []value // nil when the tag is absent
}

// table returns the columns tags of one loop (or of single items, read as a
// one-row table). key is the tag that must be present; the others may be
// absent. All present tags must be in the same loop.
func (rd *reader) table(key string, tags ...string) ([]column, int, error) {
	cols := make([]column, len(tags))
	lp := rd.b.inLoop[key]
	rows := 1
	line := 0
	if lp != nil {
		rows = len(lp.rows)
		line = lp.line
	} else if v, ok := rd.b.items[key]; ok {
		line = v.line
	} else {
		return nil, 0, nil
	}
	for i, tag := range tags {
		cols[i].tag = tag
		if lp != nil {
			if j := indexOf(lp.tags, tag); j >= 0 {
				cols[i].vals = make([]value, rows)
				for r := range lp.rows {
					cols[i].vals[r] = lp.rows[r][j]
				}
				continue
			}
		} else if v, ok := rd.b.items[tag]; ok {
			cols[i].vals = []value{v}
			continue
		}
		if rd.b.has(tag) {
			where := rd.b.tagLine[tag]
			return nil, 0, rd.errf(where, tag, ErrMalformedLoop, "must be in the same loop as %s (line %d)", key, line)
		}
	}
	return cols, rows, nil
}
