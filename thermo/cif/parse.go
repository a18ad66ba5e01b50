package cif

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"slices"
	"sort"
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

// lattice builds the cell vectors: a along x, b in the xy plane, c making
// a right-handed set (the usual convention, as in International Tables for
// Crystallography Vol. B, §1.1).
func (rd *reader) lattice() ([3]crystal.Vec3, error) {
	tags := [6]string{"_cell_length_a", "_cell_length_b", "_cell_length_c", "_cell_angle_alpha", "_cell_angle_beta", "_cell_angle_gamma"}
	var p [6]float64
	for i, tag := range tags {
		x, _, err := rd.number(tag, ErrMissingCell)
		if err != nil {
			return [3]crystal.Vec3{}, err
		}
		line := rd.b.tagLine[tag]
		if i < 3 && !(x > 0 && x < crystal.MaxCellLength) {
			return [3]crystal.Vec3{}, rd.errf(line, tag, ErrBadValue, "cell length %g Å must be positive and below %g Å", x, crystal.MaxCellLength)
		}
		if i >= 3 && !(x > 0 && x < 180) {
			return [3]crystal.Vec3{}, rd.errf(line, tag, ErrBadValue, "cell angle %g° must lie strictly between 0 and 180", x)
		}
		p[i] = x
	}
	a, b, c := p[0], p[1], p[2]
	ca, cb, cg := cosDeg(p[3]), cosDeg(p[4]), cosDeg(p[5])
	sg := math.Sin(p[5] * math.Pi / 180)
	cx := cb
	cy := (ca - cb*cg) / sg
	cz2 := 1 - cx*cx - cy*cy
	if !(cz2 > 1e-10) {
		return [3]crystal.Vec3{}, rd.errf(rd.b.tagLine["_cell_angle_alpha"], "_cell_angle_alpha", ErrBadValue,
			"angles α=%g°, β=%g°, γ=%g° do not form a cell (the volume would be zero or imaginary)", p[3], p[4], p[5])
	}
	return [3]crystal.Vec3{
		{a, 0, 0},
		{b * cg, b * sg, 0},
		{c * cx, c * cy, c * math.Sqrt(cz2)},
	}, nil
}

// cosDeg is the cosine of an angle in degrees, exact at 90°, 60°, 120°.
func cosDeg(deg float64) float64 {
	switch deg {
	case 90:
		return 0
	case 60:
		return 0.5
	case 120:
		return -0.5
	}
	return math.Cos(deg * math.Pi / 180)
}

// symmetryTags are the data names that hold operations as xyz strings, new
// name first.
var symmetryTags = [...]string{"_space_group_symop_operation_xyz", "_symmetry_equiv_pos_as_xyz"}

// symops reads the symmetry operations; without any it uses the identity,
// unless the file names a space group other than P1.
func (rd *reader) symops() ([]Symop, error) {
	var cols []column
	for _, tag := range symmetryTags {
		c, _, err := rd.table(tag, tag)
		if err != nil {
			return nil, err
		}
		if c != nil {
			if cols != nil {
				return nil, rd.errf(rd.b.tagLine[tag], tag, ErrSyntax, "operations are given under both %s and %s; keep one list", symmetryTags[0], symmetryTags[1])
			}
			cols = c
		}
	}
	if cols == nil {
		for _, tag := range []string{"_space_group_name_h-m_alt", "_symmetry_space_group_name_h-m"} {
			if v, ok := rd.b.items[tag]; ok && !v.unknown() {
				sym := strings.ReplaceAll(v.text, " ", "")
				if sym != "P1" {
					return nil, rd.errf(v.line, tag, ErrBadSymop,
						"names space group %q but the file lists no symmetry operations; add a loop of %s (space groups are not generated from their symbols)", v.text, symmetryTags[0])
				}
			}
		}
		return []Symop{{Rot: [3][3]float64{{1, 0, 0}, {0, 1, 0}, {0, 0, 1}}}}, nil
	}
	var ops []Symop
	for _, v := range cols[0].vals {
		if v.unknown() {
			return nil, rd.errf(v.line, cols[0].tag, ErrBadSymop, "an operation is given as %q; every operation must be written out", v.text)
		}
		op, err := ParseSymop(v.text)
		if err != nil {
			return nil, &Error{File: rd.file, Line: v.line, Tag: cols[0].tag, Msg: err.Error(), Err: err}
		}
		ops = append(ops, op)
	}
	return ops, nil
}

// asymSite is one row of the atom-site loop.
type asymSite struct {
	label   string
	typ     string // type symbol as written, or the label
	element string
	charge  float64
	known   bool // charge known
	frac    crystal.Vec3
	occ     float64 // occupancy, 1 unless the file says otherwise
	line    int
}

// oxidationNumbers reads the _atom_type_ loop: type symbol → charge.
func (rd *reader) oxidationNumbers() (map[string]float64, error) {
	cols, _, err := rd.table("_atom_type_symbol", "_atom_type_symbol", "_atom_type_oxidation_number")
	if err != nil || cols == nil || cols[1].vals == nil {
		return nil, err
	}
	out := map[string]float64{}
	for r, v := range cols[0].vals {
		ov := cols[1].vals[r]
		if ov.unknown() {
			continue
		}
		x, ok := parseNumber(ov.text)
		if !ok {
			return nil, rd.errf(ov.line, "_atom_type_oxidation_number", ErrBadValue, "cannot read %q as a number", clip(ov.text))
		}
		out[v.text] = x
	}
	return out, nil
}

// typeSymbol splits a type symbol such as "Fe3+" or "O2-" into its element
// and charge. A symbol without a charge gives hasCharge false.
func typeSymbol(s string) (el string, charge float64, hasCharge bool, err error) {
	n := 0
	for n < len(s) && isLetter(s[n]) {
		n++
	}
	if n == 0 || n > 2 || AtomicNumber(normalizeSymbol(s[:n])) == 0 {
		return "", 0, false, ErrUnknownElement
	}
	el = normalizeSymbol(s[:n])
	rest := s[n:]
	if rest == "" {
		return el, 0, false, nil
	}
	// "3+", "2-", "+", "-" and the reversed "+3", "-2".
	var digits, sign string
	switch {
	case rest[len(rest)-1] == '+' || rest[len(rest)-1] == '-':
		digits, sign = rest[:len(rest)-1], rest[len(rest)-1:]
	case rest[0] == '+' || rest[0] == '-':
		digits, sign = rest[1:], rest[:1]
	default:
		return el, 0, false, ErrBadValue
	}
	q := 1.0
	if digits != "" {
		x, ok := parseNumber(digits)
		if !ok || digits[0] == '+' || digits[0] == '-' || x > 20 {
			return el, 0, false, ErrBadValue
		}
		q = x
	}
	if sign == "-" {
		q = -q
	}
	return el, q, true, nil
}

// sites reads the atom-site loop.
func (rd *reader) sites(opt Options) ([]asymSite, error) {
	cols, rows, err := rd.table("_atom_site_fract_x",
		"_atom_site_label", "_atom_site_type_symbol",
		"_atom_site_fract_x", "_atom_site_fract_y", "_atom_site_fract_z", "_atom_site_occupancy")
	if err != nil {
		return nil, err
	}
	if cols == nil {
		return nil, rd.errf(rd.b.line, "_atom_site_fract_x", ErrNoSites, "data_%s gives no fractional atom coordinates", rd.b.name)
	}
	for _, c := range cols[3:5] {
		if c.vals == nil {
			return nil, rd.errf(rd.b.tagLine["_atom_site_fract_x"], c.tag, ErrNoSites, "is missing beside _atom_site_fract_x")
		}
	}
	if cols[0].vals == nil && cols[1].vals == nil {
		return nil, rd.errf(rd.b.tagLine["_atom_site_fract_x"], "_atom_site_label", ErrNoSites, "atom sites need _atom_site_label or _atom_site_type_symbol")
	}
	oxi, err := rd.oxidationNumbers()
	if err != nil {
		return nil, err
	}
	var out []asymSite
	for r := 0; r < rows; r++ {
		s := asymSite{line: cols[2].vals[r].line}
		if cols[0].vals != nil {
			s.label = cols[0].vals[r].text
		}
		if cols[1].vals != nil && !cols[1].vals[r].unknown() {
			s.typ = cols[1].vals[r].text
			el, q, hasQ, err := typeSymbol(s.typ)
			switch {
			case errors.Is(err, ErrUnknownElement):
				return nil, rd.errf(cols[1].vals[r].line, "_atom_site_type_symbol", ErrUnknownElement,
					"%q (site %s) does not start with an element symbol", clip(s.typ), s.label)
			case err != nil:
				return nil, rd.errf(cols[1].vals[r].line, "_atom_site_type_symbol", ErrBadValue,
					"cannot read the charge in %q; write it as Fe3+ or O2-", clip(s.typ))
			}
			s.element, s.charge, s.known = el, q, hasQ
		} else {
			if s.label == "" || cols[0].vals[r].unknown() {
				return nil, rd.errf(s.line, "_atom_site_label", ErrUnknownElement, "site on this line has neither a type symbol nor a label")
			}
			el, _ := elementPrefix(s.label)
			if el == "" {
				return nil, rd.errf(cols[0].vals[r].line, "_atom_site_label", ErrUnknownElement,
					"label %q does not start with an element symbol, and there is no _atom_site_type_symbol; add one", clip(s.label))
			}
			s.typ = s.label
			s.element = el
		}
		if s.label == "" {
			s.label = s.typ
		}
		if q, ok := oxi[s.typ]; ok {
			s.charge, s.known = q, true
		} else if q, ok := oxi[s.element]; ok && cols[1].vals == nil {
			s.charge, s.known = q, true
		}
		for _, key := range []string{s.label, s.typ, s.element} {
			if q, ok := opt.Charges[key]; ok {
				s.charge, s.known = q, true
				break
			}
		}
		if math.IsNaN(s.charge) || math.IsInf(s.charge, 0) {
			return nil, rd.errf(s.line, "", ErrBadValue, "charge of site %s is not a finite number", s.label)
		}
		for k := 0; k < 3; k++ {
			v := cols[2+k].vals[r]
			x, ok := parseNumber(v.text)
			if !ok || math.Abs(x) > 1e6 {
				if v.unknown() {
					return nil, rd.errf(v.line, cols[2+k].tag, ErrBadValue, "site %s has coordinate %q (unknown); every coordinate must be given", s.label, v.text)
				}
				return nil, rd.errf(v.line, cols[2+k].tag, ErrBadValue, "cannot read %q as a number", clip(v.text))
			}
			s.frac[k] = x
		}
		s.occ = 1
		if oc := cols[5].vals; oc != nil && !oc[r].unknown() {
			x, ok := parseNumber(oc[r].text)
			if !ok {
				return nil, rd.errf(oc[r].line, "_atom_site_occupancy", ErrBadValue, "cannot read %q as a number", clip(oc[r].text))
			}
			if !(x > 0 && x <= 1+crystal.OccupancyTolerance) {
				return nil, rd.errf(oc[r].line, "_atom_site_occupancy", ErrBadValue,
					"site %s has occupancy %s; an occupancy must be greater than 0 and at most 1", s.label, oc[r].text)
			}
			if x > 1-crystal.OccupancyTolerance {
				x = 1
			}
			s.occ = x
		}
		out = append(out, s)
	}
	return out, nil
}

// crystal reads the whole block.
func (rd *reader) crystal(opt Options, tol float64) (*crystal.Crystal, error) {
	if !rd.b.has("_atom_site_fract_x") {
		return nil, rd.errf(rd.b.line, "_atom_site_fract_x", ErrNoSites, "data_%s gives no fractional atom coordinates", rd.b.name)
	}
	lat, err := rd.lattice()
	if err != nil {
		return nil, err
	}
	ops, err := rd.symops()
	if err != nil {
		return nil, err
	}
	asym, err := rd.sites(opt)
	if err != nil {
		return nil, err
	}
	if len(asym)*len(ops) > maxImages {
		return nil, rd.errf(0, "", ErrBadValue, "%d sites × %d operations is too many to expand (at most %d images, %d sites after merging, are read)", len(asym), len(ops), maxImages, maxSites)
	}
	c := &crystal.Crystal{Name: filepath.Base(rd.file), Lattice: lat}
	if rd.file == "" {
		c.Name = "data_" + rd.b.name
	}
	rd.asym = asym
	if err := expand(c, asym, ops, tol, rd); err != nil {
		return nil, err
	}
	z, err := rd.formulaUnits(c)
	if err != nil {
		return nil, err
	}
	c.FormulaUnits = z
	return c, nil
}

// chargesGiven reports the first atom-site row whose charge is given
// nowhere.
func (rd *reader) chargesGiven(c *crystal.Crystal) error {
	for _, s := range rd.asym {
		if !s.known {
			return rd.errf(s.line, "_atom_type_oxidation_number", ErrMissingCharge,
				"no charge for site %s (type %s): give it in an _atom_type_symbol/_atom_type_oxidation_number loop, as a charged type symbol such as %s2+, or as a charge given by site label, type symbol or element", s.label, s.typ, s.element)
		}
	}
	return nil
}

// wrap maps a fractional coordinate into [0,1).
func wrap(x float64) float64 {
	x -= math.Floor(x)
	if x >= 1 {
		x = 0
	}
	return x
}

// expand applies every operation to every asymmetric site and keeps one
// copy of each position. Two images of the same site closer than tol (Å,
// shortest periodic distance) are one site. Images of different rows that
// close share the site when both rows are partly occupied and their
// occupancies sum to at most 1 (a disordered site, summed as its mean
// charge); otherwise they are a collision, reported as an error. Sites are
// binned on a grid whose cells are at least tol wide in every direction, so
// each image is compared only with the sites in its own and the 26 adjacent
// grid cells.
func expand(c *crystal.Crystal, asym []asymSite, ops []Symop, tol float64, rd *reader) error {
	var owners [][]int // rows sharing each site
	g := newGrid(c, tol)
	for i, s := range asym {
		occupant := crystal.Occupant{Label: s.label, Element: s.element, Occupancy: s.occ, Charge: s.charge, ChargeKnown: s.known}
		for _, op := range ops {
			f := op.Apply(s.frac)
			for k := range f {
				f[k] = wrap(f[k])
			}
			j := g.find(c, f, tol)
			if j >= 0 {
				if slices.Contains(owners[j], i) {
					continue
				}
				site := &c.Sites[j]
				total := s.occ
				for _, o := range site.Occupants {
					total += o.Occupancy
				}
				if s.occ == 1 || total > 1+crystal.OccupancyTolerance {
					o := asym[owners[j][0]]
					return rd.errf(s.line, "_atom_site_label", ErrCollision,
						"an image of site %s falls within %g Å of site %s (line %d), and their occupancies sum to %g, more than 1; check the coordinates and occupancies", s.label, tol, o.label, o.line, total)
				}
				owners[j] = append(owners[j], i)
				site.Occupants = append(slices.Clone(site.Occupants), occupant)
				site.Species = crystal.Composition(site.Occupants)
				site.Charge = crystal.MeanCharge(site.Occupants)
				if site.Label != s.label {
					site.Label += "/" + s.label
				}
				continue
			}
			if len(c.Sites) >= maxSites {
				return rd.errf(0, "", ErrBadValue, "more than %d sites after symmetry expansion; that is beyond what this reader accepts", maxSites)
			}
			g.add(f, len(c.Sites))
			occ := []crystal.Occupant{occupant}
			c.Sites = append(c.Sites, crystal.Site{Label: s.label, Species: crystal.Composition(occ), Charge: crystal.MeanCharge(occ), Frac: f, Occupants: occ})
			owners = append(owners, []int{i})
		}
	}
	return nil
}

// grid bins sites by fractional position.
type grid struct {
	n    [3]int
	bins map[[3]int][]int
}

// maxBins bounds the grid divisions along one axis.
const maxBins = 1024

// newGrid divides each axis into cells at least tol wide: the spacing of
// the lattice planes normal to axis i is V/|a_j × a_k|.
func newGrid(c *crystal.Crystal, tol float64) *grid {
	g := &grid{bins: map[[3]int][]int{}}
	v := c.Volume()
	for i := 0; i < 3; i++ {
		cross := c.Lattice[(i+1)%3].Cross(c.Lattice[(i+2)%3]).Norm()
		n := 1
		if cross > 0 {
			if spacing := v / cross; spacing/tol < maxBins {
				n = int(spacing / tol)
			} else {
				n = maxBins
			}
		}
		if n < 1 {
			n = 1
		}
		g.n[i] = n
	}
	return g
}

func (g *grid) key(f crystal.Vec3) [3]int {
	var k [3]int
	for i := 0; i < 3; i++ {
		k[i] = int(f[i]*float64(g.n[i])) % g.n[i]
	}
	return k
}

func (g *grid) add(f crystal.Vec3, idx int) {
	k := g.key(f)
	g.bins[k] = append(g.bins[k], idx)
}

// find returns the index of a site within tol of f, or -1.
func (g *grid) find(c *crystal.Crystal, f crystal.Vec3, tol float64) int {
	k := g.key(f)
	for d0 := -1; d0 <= 1; d0++ {
		for d1 := -1; d1 <= 1; d1++ {
			for d2 := -1; d2 <= 1; d2++ {
				kk := [3]int{(k[0] + d0 + g.n[0]) % g.n[0], (k[1] + d1 + g.n[1]) % g.n[1], (k[2] + d2 + g.n[2]) % g.n[2]}
				for _, j := range g.bins[kk] {
					if periodicDistance(c, c.Sites[j].Frac, f) < tol {
						return j
					}
				}
			}
		}
	}
	return -1
}

// periodicDistance is the distance in Å between fractional positions f and
// g, taking the image that rounds their difference to the nearest lattice
// vector. That image is the nearest whenever the distance is small against
// the cell's plane spacings, which is the only case the merge step asks
// about (MaxMergeTolerance).
func periodicDistance(c *crystal.Crystal, f, g crystal.Vec3) float64 {
	var d crystal.Vec3
	for k := 0; k < 3; k++ {
		x := f[k] - g[k]
		d[k] = x - math.Round(x)
	}
	return c.Cartesian(d).Norm()
}

// neutral reports a charged cell with the charges per element.
func (rd *reader) neutral(c *crystal.Crystal) error {
	q := c.TotalCharge()
	if math.Abs(q) <= crystal.NeutralityTolerance {
		return nil
	}
	type sum struct {
		n int
		q float64
	}
	byKey := map[string]*sum{}
	var keys []string
	for _, s := range c.Sites {
		k := s.Label
		if byKey[k] == nil {
			byKey[k] = &sum{}
			keys = append(keys, k)
		}
		byKey[k].n++
		byKey[k].q = s.Charge
	}
	var parts []string
	for _, k := range keys {
		parts = append(parts, fmt.Sprintf("%d × %s %+g", byKey[k].n, k, byKey[k].q))
	}
	tag := "_atom_type_oxidation_number"
	line := rd.b.tagLine[tag]
	if line == 0 {
		tag = "_atom_site_fract_x"
		line = rd.b.inLoop[tag].lineOr(rd.b.tagLine[tag])
	}
	return rd.errf(line, tag, ErrNotNeutral,
		"the cell is not neutral: its charges sum to %+.6g e (%s); correct the oxidation numbers, or give charges by site label, type symbol or element", q, strings.Join(parts, ", "))
}

// formulaUnits returns Z from _cell_formula_units_Z, or else the greatest
// common divisor of the element counts in the cell (so Na4Cl4 gives 4 and
// Ti2O4 gives 2). Counts are weighted by occupancy; where they are not whole
// numbers and the file gives no Z, Z is 1. A given Z must divide every count
// of an ordered cell.
func (rd *reader) formulaUnits(c *crystal.Crystal) (int, error) {
	counts := map[string]int{}
	whole := true
	for el, n := range c.ElementCounts() {
		counts[el] = int(math.Round(n))
		whole = whole && math.Abs(n-math.Round(n)) < 1e-6 && counts[el] > 0
	}
	g := 0
	for _, n := range counts {
		g = gcd(g, n)
	}
	if !whole || g == 0 {
		g = 1
	}
	zf, ok, err := rd.number("_cell_formula_units_z", nil)
	if err != nil {
		return 0, err
	}
	if !ok {
		return g, nil
	}
	z := int(math.Round(zf))
	line := rd.b.tagLine["_cell_formula_units_z"]
	if math.Abs(zf-float64(z)) > 1e-9 || z <= 0 {
		return 0, rd.errf(line, "_cell_formula_units_Z", ErrBadValue, "Z = %g must be a positive whole number", zf)
	}
	if whole && !rd.disordered() && g%z != 0 {
		var els []string
		for el := range counts {
			els = append(els, el)
		}
		sort.Strings(els)
		var parts []string
		for _, el := range els {
			parts = append(parts, fmt.Sprintf("%s %d", el, counts[el]))
		}
		return 0, rd.errf(line, "_cell_formula_units_Z", ErrBadValue,
			"Z = %d does not divide the cell content after symmetry expansion (%s); check that every symmetry operation is listed", z, strings.Join(parts, ", "))
	}
	return z, nil
}

// disordered reports a file with a partly occupied site.
func (rd *reader) disordered() bool {
	for _, s := range rd.asym {
		if s.occ < 1 {
			return true
		}
	}
	return false
}

func gcd(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}
