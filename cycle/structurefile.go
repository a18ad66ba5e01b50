package cycle

import (
	"errors"
	"fmt"
	"io"
	"math"
	"path/filepath"
	"sort"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo/cif"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/valence"
)

// StructureFile is a CIF file read for the engine: the point-charge cell
// with every charge settled, how the charges were settled, and each site's
// bond-valence sum. Sites shared by several species or partly vacant carry
// their mean charge (the averaged crystal).
type StructureFile struct {
	// Cell is the unit cell with its charges; it may be charged (see
	// Charge), which a cycle's Madelung constant refuses.
	Cell *crystal.Crystal
	// Assignment says how missing charges were chosen; Method is
	// valence.Given when the file and the caller gave them all.
	Assignment valence.Assignment
	// Candidates are the oxidation states offered per element, and From
	// says where they came from ("the compound's ions", "the data's ions").
	Candidates valence.Candidates
	From       map[string]string
	// BondValenceSums holds each site's bond-valence sum (NaN where none).
	BondValenceSums []float64
	// Averaged counts the sites whose charge is a mean: several species,
	// a vacancy, or two oxidation states.
	Averaged int
	// Formula is the cell's content per formula unit from the occupancies,
	// such as "K0.5Na0.5Cl".
	Formula string
	// Charge is the cell's net charge in e.
	Charge float64
}

// AssignmentError reports a structure file whose charges could not be settled;
// Err is a *valence.NoStatesError, *valence.NoNeutralError or
// *valence.AmbiguousError.
type AssignmentError struct {
	File string
	Err  error
}

func (e *AssignmentError) Error() string {
	return fmt.Sprintf("%s: cannot assign charges: %v", e.File, e.Err)
}

func (e *AssignmentError) Unwrap() error { return e.Err }

// ForeignElementError reports a structure file, read for a compound, that
// holds an element without a charge in the file and not in the compound.
type ForeignElementError struct {
	File, Element, Compound string
}

func (e *ForeignElementError) Error() string {
	return fmt.Sprintf("%s holds %s, which is not an element of %s, and gives it no charge; choose a structure file of %s", e.File, e.Element, e.Compound, e.Compound)
}

// OpenStructureFile reads the CIF file at path (a regular file within
// cif.MaxFileSize); see ReadStructureFile.
func OpenStructureFile(db *data.DB, path string, charges map[string]float64, ions []Part) (*StructureFile, error) {
	cell, err := cif.ReadFile(path, cif.Options{Charges: charges})
	if err != nil {
		return nil, err
	}
	return settleCharges(db, cell, path, ions)
}

// ReadStructureFile reads a CIF file from r (name for messages). charges
// override the file's, by site label, type symbol or element (as
// cif.Options.Charges). A species still without a charge gets one from
// valence.Assign, offered the charges of ions (the open compound's, by
// element) or else the monatomic ions the data list for its element.
func ReadStructureFile(db *data.DB, r io.Reader, name string, charges map[string]float64, ions []Part) (*StructureFile, error) {
	cell, err := cif.Read(r, name, cif.Options{Charges: charges})
	if err != nil {
		return nil, err
	}
	return settleCharges(db, cell, name, ions)
}

// settleCharges assigns the charges a cell read from a file lacks.
func settleCharges(db *data.DB, cell *crystal.Crystal, name string, ions []Part) (*StructureFile, error) {
	sf := &StructureFile{Candidates: valence.Candidates{}, From: map[string]string{}}
	for _, p := range ions {
		if !p.Ion.Polyatomic && p.Ion.Core != "" {
			sf.Candidates[p.Ion.Core] = []int{p.Ion.Charge}
			sf.From[p.Ion.Core] = "the compound's ions"
		}
	}
	for el := range cell.ElementCounts() {
		if _, ok := sf.Candidates[el]; ok || db == nil {
			continue
		}
		for _, ion := range db.IonsOf(el) {
			if !ion.Polyatomic {
				sf.Candidates[el] = append(sf.Candidates[el], ion.Charge)
			}
		}
		sf.From[el] = "the data's ions"
	}
	params, err := bondValenceParams()
	if err != nil {
		return nil, err
	}
	cell, sf.Assignment, err = valence.Assign(cell, sf.Candidates, params)
	if err != nil {
		return nil, &AssignmentError{File: name, Err: err}
	}
	sf.Cell = cell
	sf.BondValenceSums = valence.Sums(cell, params)
	averaged := make([]bool, len(cell.Sites))
	for i, s := range cell.Sites {
		averaged[i] = s.Averaged()
	}
	for _, g := range sf.Assignment.Groups {
		for _, i := range g.Sites {
			averaged[i] = averaged[i] || g.Mixed()
		}
	}
	for _, a := range averaged {
		if a {
			sf.Averaged++
		}
	}
	sf.Formula = FormulaOf(cell)
	sf.Charge = cell.TotalCharge()
	return sf, nil
}

// bondValenceParams converts the data's table for package valence.
func bondValenceParams() (valence.Params, error) {
	t, err := data.BondValenceParams()
	if err != nil {
		return nil, err
	}
	p := make(valence.Params, len(t))
	for el, v := range t {
		p[el] = valence.Element{R: v.R, C: v.C}
	}
	return p, nil
}

// FormulaOf writes the cell's content per formula unit from the
// occupancy-weighted element counts: elements of positive mean charge
// first, then alphabetically ("K0.5Na0.5Cl", "Fe3O4").
func FormulaOf(c *crystal.Crystal) string {
	counts := c.ElementCounts()
	charge := map[string]float64{}
	for _, s := range c.Sites {
		if s.Occupants == nil {
			charge[s.Species] += s.Charge
			continue
		}
		for _, o := range s.Occupants {
			charge[o.Element] += o.Occupancy * o.Charge
		}
	}
	els := make([]string, 0, len(counts))
	for el := range counts {
		els = append(els, el)
	}
	sort.Slice(els, func(i, j int) bool {
		pi, pj := charge[els[i]] > 0, charge[els[j]] > 0
		if pi != pj {
			return pi
		}
		return els[i] < els[j]
	})
	z := float64(max(c.FormulaUnits, 1))
	var b strings.Builder
	for _, el := range els {
		b.WriteString(el)
		if n := counts[el] / z; math.Abs(n-1) > 1e-9 {
			b.WriteString(strconv.FormatFloat(math.Round(n*1e4)/1e4, 'g', -1, 64))
		}
	}
	return b.String()
}

// Structure returns the file's cell as a cycle's structure, recorded under
// name (the path as the user gave it).
func (sf *StructureFile) Structure(name string) Structure {
	return Structure{CIF: name, Cell: sf.Cell, BondValenceSums: sf.BondValenceSums}
}

// LoadStructureFile reads the CIF file at path for c, charges the file
// does not give assigned from the compound's ions only (so a file of
// another compound is refused), and makes it c's structure, recorded under
// name. A cycle file names its CIF by path only; this reads it.
func (c *Cycle) LoadStructureFile(path, name string) error {
	st, err := c.ReadStructureFile(path, name)
	if err != nil {
		return err
	}
	c.Settings.Structure = st
	return nil
}

// ReopenStructureFile reads the CIF file a cycle file names, when the
// cycle as opened holds the file's name but not its cell: the name is taken
// relative to the cycle file's folder unless it is absolute, and the path is
// passed through resolve (nil takes it as it is; the workshop confines it to
// the user's folder). It does nothing when the cycle names no CIF file or
// already holds its cell. The one home of that rule for every front end.
func (c *Cycle) ReopenStructureFile(cycleFile string, resolve func(string) (string, error)) error {
	st := c.Settings.Structure
	if st.CIF == "" || st.Cell != nil {
		return nil
	}
	p := st.CIF
	if !filepath.IsAbs(p) {
		p = filepath.Join(filepath.Dir(cycleFile), p)
	}
	if resolve != nil {
		var err error
		if p, err = resolve(p); err != nil {
			return err
		}
	}
	return c.LoadStructureFile(p, st.CIF)
}

// ReadStructureFile is LoadStructureFile without making the structure c's:
// it returns it, for a caller that checks it with other settings first.
func (c *Cycle) ReadStructureFile(path, name string) (Structure, error) {
	sf, err := OpenStructureFile(nil, path, nil, []Part{c.Cation, c.Anion})
	var ns *valence.NoStatesError
	if errors.As(err, &ns) {
		return Structure{}, &ForeignElementError{File: name, Element: ns.Element, Compound: c.Formula}
	}
	if err != nil {
		return Structure{}, err
	}
	return sf.Structure(name), nil
}
