package crystal

import (
	"errors"
	"fmt"
	"math"
)

// Vec3 is a vector in three dimensions.
type Vec3 [3]float64

// Add returns v+w.
func (v Vec3) Add(w Vec3) Vec3 { return Vec3{v[0] + w[0], v[1] + w[1], v[2] + w[2]} }

// Sub returns v−w.
func (v Vec3) Sub(w Vec3) Vec3 { return Vec3{v[0] - w[0], v[1] - w[1], v[2] - w[2]} }

// Scale returns s·v.
func (v Vec3) Scale(s float64) Vec3 { return Vec3{s * v[0], s * v[1], s * v[2]} }

// Dot returns v·w.
func (v Vec3) Dot(w Vec3) float64 { return v[0]*w[0] + v[1]*w[1] + v[2]*w[2] }

// Cross returns v×w.
func (v Vec3) Cross(w Vec3) Vec3 {
	return Vec3{v[1]*w[2] - v[2]*w[1], v[2]*w[0] - v[0]*w[2], v[0]*w[1] - v[1]*w[0]}
}

// Norm returns |v|.
func (v Vec3) Norm() float64 { return math.Sqrt(v.Dot(v)) }

// Site is one ion in the cell.
type Site struct {
	// Label names the site as its source did (a CIF label such as "Na1"), or
	// is empty.
	Label string
	// Species is the element or ion-group symbol, for example "Na" or "SO4".
	Species string
	// Charge is the ion's charge in units of e.
	Charge float64
	// Frac is the fractional position in the cell.
	Frac Vec3
	// Occupants are the species a structure file put on this site, with
	// their occupancies (see Occupant); nil for a prototype's site. When
	// set, Charge is their mean charge and Species their Composition.
	Occupants []Occupant
}

// Crystal is a periodic arrangement of point charges.
type Crystal struct {
	// Name says what the structure is: a prototype name or a file name.
	Name string
	// Lattice holds the cell vectors a, b, c as rows, in Å.
	Lattice [3]Vec3
	// Sites are the ions of one cell.
	Sites []Site
	// FormulaUnits is the number of formula units in the cell (Z).
	FormulaUnits int
}

// ErrNotNeutral reports a cell whose charges do not sum to zero.
var ErrNotNeutral = errors.New("cell is not charge-neutral")

// NeutralityTolerance is the largest |Σq| (in e) accepted as neutral.
const NeutralityTolerance = 1e-6

// Volume returns the cell volume in Å³ (always positive).
func (c *Crystal) Volume() float64 {
	return math.Abs(c.Lattice[0].Dot(c.Lattice[1].Cross(c.Lattice[2])))
}

// Cartesian returns the Cartesian position in Å of fractional coordinates f.
func (c *Crystal) Cartesian(f Vec3) Vec3 {
	var r Vec3
	for i := 0; i < 3; i++ {
		r = r.Add(c.Lattice[i].Scale(f[i]))
	}
	return r
}

// TotalCharge returns the sum of the site charges.
func (c *Crystal) TotalCharge() float64 {
	q := 0.0
	for _, s := range c.Sites {
		q += s.Charge
	}
	return q
}

// Validate reports a cell that cannot be summed: no sites, a degenerate
// lattice, non-positive formula units or a net charge.
func (c *Crystal) Validate() error {
	if len(c.Sites) == 0 {
		return fmt.Errorf("crystal %q: no sites", c.Name)
	}
	if v := c.Volume(); !(v > 1e-6) || math.IsInf(v, 0) {
		return fmt.Errorf("crystal %q: degenerate cell (volume %g Å³)", c.Name, v)
	}
	if c.FormulaUnits <= 0 {
		return fmt.Errorf("crystal %q: formula units per cell is %d, must be positive", c.Name, c.FormulaUnits)
	}
	if q := c.TotalCharge(); math.Abs(q) > NeutralityTolerance {
		return fmt.Errorf("crystal %q: charges sum to %+.6g e: %w", c.Name, q, ErrNotNeutral)
	}
	return nil
}

// Clone returns a deep copy of c.
func (c *Crystal) Clone() *Crystal {
	d := *c
	d.Sites = append([]Site(nil), c.Sites...)
	return &d
}
