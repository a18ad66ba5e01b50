package crystal

import (
	"errors"
	"fmt"
	"math"
	"sort"
	"strings"
)

// Param is one adjustable parameter of a prototype.
type Param struct {
	// Key is the name used with Build and on the command line, e.g. "a".
	Key string
	// Doc says what the parameter is.
	Doc string
	// Unit is "Å" for a length and "" for a fractional coordinate.
	Unit string
	// Default is the value for the prototype's example compound.
	Default float64
}

// Slot is a placeholder ion species of a prototype. Build names the sites
// of a slot by its Label; WithIons renames them and sets their charges.
type Slot struct {
	// Label is the placeholder species: "M" and "X" for binaries, "A", "B"
	// and "X" for perovskite and spinel.
	Label string
	// Charge is the default charge in e (that of the example compound).
	Charge float64
	// Role is "cation" or "anion".
	Role string
}

// Prototype is a built-in structure type generated from its parameters.
type Prototype struct {
	// Name is the command-line name, e.g. "rock-salt".
	Name string
	// Description names the structure type and its setting.
	Description string
	// Example is the compound whose parameters and charges are the defaults.
	Example string
	// Params lists the parameters in the order they are usually quoted.
	Params []Param
	// Slots lists the placeholder species.
	Slots []Slot

	formulaUnits int
	build        func(p map[string]float64) (lattice [3]Vec3, sites []Site, err error)
}

// ErrUnknownPrototype reports a prototype name that is not built in.
var ErrUnknownPrototype = errors.New("unknown prototype")

// ErrBadParameter reports a prototype parameter that is unknown or unphysical.
var ErrBadParameter = errors.New("bad prototype parameter")

// MinimumSeparation is the smallest distance in Å between two ions that
// Build accepts; closer ions mean the parameters are unphysical.
const MinimumSeparation = 0.5

// MaxCellLength is the cell edge in Å that Build's lengths and the CIF
// reader's cell lengths must stay below, far beyond any real ionic cell
// (common practice, no source).
const MaxCellLength = 1e4

// ShortestBond is the cation–anion distance in Å below which a structure is
// unlike any real solid (real cation–anion bonds are longer): callers warn
// when the nearest cation–anion pair is closer. 1.0 Å is common practice,
// no source.
const ShortestBond = 1.0

const (
	roleCation = "cation"
	roleAnion  = "anion"
)

func binarySlots(zM, zX float64) []Slot {
	return []Slot{{"M", zM, roleCation}, {"X", zX, roleAnion}}
}

func length(key, doc string, def float64) Param { return Param{key, doc, "Å", def} }
func fraction(key, doc string, def float64) Param {
	return Param{key, doc, "", def}
}

// fcc lists the face-centring translations of a cubic F cell.
var fcc = []Vec3{{0, 0, 0}, {0, 0.5, 0.5}, {0.5, 0, 0.5}, {0.5, 0.5, 0}}

// rhombohedral lists the centring translations of the obverse hexagonal
// setting of an R lattice.
var rhombohedral = []Vec3{{0, 0, 0}, {2.0 / 3, 1.0 / 3, 1.0 / 3}, {1.0 / 3, 2.0 / 3, 2.0 / 3}}

func cubic(a float64) [3]Vec3 { return [3]Vec3{{a, 0, 0}, {0, a, 0}, {0, 0, a}} }

func tetragonal(a, c float64) [3]Vec3 { return [3]Vec3{{a, 0, 0}, {0, a, 0}, {0, 0, c}} }

// hexagonal returns a = (a,0,0), b = (−a/2, a√3/2, 0), c = (0,0,c): γ = 120°.
func hexagonal(a, c float64) [3]Vec3 {
	return [3]Vec3{{a, 0, 0}, {-a / 2, a * math.Sqrt(3) / 2, 0}, {0, 0, c}}
}

// place appends one site of species label at every position + every
// centring translation.
func place(sites []Site, label string, charge float64, centring []Vec3, positions ...Vec3) []Site {
	if centring == nil {
		centring = []Vec3{{0, 0, 0}}
	}
	for _, t := range centring {
		for _, p := range positions {
			sites = append(sites, Site{Label: label, Species: label, Charge: charge, Frac: wrap(p.Add(t))})
		}
	}
	return sites
}

// wrap maps fractional coordinates into [0, 1).
func wrap(f Vec3) Vec3 {
	for i := range f {
		f[i] -= math.Floor(f[i])
		if f[i] >= 1 { // −1e-17 − floor → 1 in floating point
			f[i] = 0
		}
	}
	return f
}

// Prototypes returns the built-in prototypes in a fixed order. Default
// parameters are measured values of each example compound; the comments give
// their sources (values marked "from memory" were recalled, not looked up).
func Prototypes() []Prototype {
	return []Prototype{
		{
			Name: "rock-salt", Description: "rock salt (B1, Fm-3m), conventional cubic cell", Example: "NaCl",
			// NaCl a = 5.6402 Å at room temperature (from memory; the usual
			// X-ray value quoted in handbook tables).
			Params: []Param{length("a", "cubic lattice parameter", 5.6402)},
			Slots:  binarySlots(1, -1), formulaUnits: 4,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "M", 1, fcc, Vec3{0, 0, 0})
				s = place(s, "X", -1, fcc, Vec3{0.5, 0, 0})
				return cubic(p["a"]), s, nil
			},
		},
		{
			Name: "caesium-chloride", Description: "caesium chloride (B2, Pm-3m), primitive cubic cell", Example: "CsCl",
			// CsCl a = 4.123 Å (from memory; Wyckoff, Crystal Structures, vol. 1).
			Params: []Param{length("a", "cubic lattice parameter", 4.123)},
			Slots:  binarySlots(1, -1), formulaUnits: 1,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "M", 1, nil, Vec3{0, 0, 0})
				s = place(s, "X", -1, nil, Vec3{0.5, 0.5, 0.5})
				return cubic(p["a"]), s, nil
			},
		},
		{
			Name: "zinc-blende", Description: "zinc blende / sphalerite (B3, F-43m), conventional cubic cell", Example: "ZnS",
			// Sphalerite ZnS a = 5.4093 Å (from memory).
			Params: []Param{length("a", "cubic lattice parameter", 5.4093)},
			Slots:  binarySlots(2, -2), formulaUnits: 4,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "M", 2, fcc, Vec3{0, 0, 0})
				s = place(s, "X", -2, fcc, Vec3{0.25, 0.25, 0.25})
				return cubic(p["a"]), s, nil
			},
		},
		{
			Name: "wurtzite", Description: "wurtzite (B4, P6_3mc), hexagonal cell", Example: "ZnO",
			// ZnO a = 3.2496 Å, c = 5.2042 Å, u = 0.3819 (from memory; neutron
			// powder data of E. H. Kisi and M. M. Elcombe, Acta Cryst. C45,
			// 1867 (1989)). Ideal: c/a = √(8/3), u = 3/8.
			Params: []Param{
				length("a", "hexagonal lattice parameter a", 3.2496),
				length("c", "hexagonal lattice parameter c", 5.2042),
				fraction("u", "anion z coordinate (M at z = 0); ideal 3/8", 0.3819),
			},
			Slots: binarySlots(2, -2), formulaUnits: 2,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				u := p["u"]
				if err := open01("u", u); err != nil {
					return [3]Vec3{}, nil, err
				}
				s := place(nil, "M", 2, nil, Vec3{1.0 / 3, 2.0 / 3, 0}, Vec3{2.0 / 3, 1.0 / 3, 0.5})
				s = place(s, "X", -2, nil, Vec3{1.0 / 3, 2.0 / 3, u}, Vec3{2.0 / 3, 1.0 / 3, 0.5 + u})
				return hexagonal(p["a"], p["c"]), s, nil
			},
		},
		{
			Name: "fluorite", Description: "fluorite (C1, Fm-3m), conventional cubic cell", Example: "CaF2",
			// CaF2 a = 5.4626 Å (from memory).
			Params: []Param{length("a", "cubic lattice parameter", 5.4626)},
			Slots:  binarySlots(2, -1), formulaUnits: 4,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "M", 2, fcc, Vec3{0, 0, 0})
				s = place(s, "X", -1, fcc, Vec3{0.25, 0.25, 0.25}, Vec3{0.75, 0.75, 0.75})
				return cubic(p["a"]), s, nil
			},
		},
		{
			Name: "antifluorite", Description: "antifluorite (Fm-3m, anions on the face-centred sites), conventional cubic cell", Example: "Li2O",
			// Li2O a = 4.6114 Å at room temperature (from memory).
			Params: []Param{length("a", "cubic lattice parameter", 4.6114)},
			Slots:  binarySlots(1, -2), formulaUnits: 4,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "M", 1, fcc, Vec3{0.25, 0.25, 0.25}, Vec3{0.75, 0.75, 0.75})
				s = place(s, "X", -2, fcc, Vec3{0, 0, 0})
				return cubic(p["a"]), s, nil
			},
		},
		{
			Name: "rutile", Description: "rutile (C4, P4_2/mnm), tetragonal cell", Example: "TiO2",
			// TiO2 a = 4.5937 Å, c = 2.9587 Å, x = 0.30479 (from memory; J. K.
			// Burdett et al., J. Am. Chem. Soc. 109, 3639 (1987)).
			Params: []Param{
				length("a", "tetragonal lattice parameter a", 4.5937),
				length("c", "tetragonal lattice parameter c", 2.9587),
				fraction("x", "anion coordinate (x, x, 0)", 0.30479),
			},
			Slots: binarySlots(4, -2), formulaUnits: 2,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				x := p["x"]
				if err := open("x", x, 0, 0.5); err != nil {
					return [3]Vec3{}, nil, err
				}
				s := place(nil, "M", 4, nil, Vec3{0, 0, 0}, Vec3{0.5, 0.5, 0.5})
				s = place(s, "X", -2, nil, Vec3{x, x, 0}, Vec3{1 - x, 1 - x, 0},
					Vec3{0.5 + x, 0.5 - x, 0.5}, Vec3{0.5 - x, 0.5 + x, 0.5})
				return tetragonal(p["a"], p["c"]), s, nil
			},
		},
		{
			Name: "cadmium-chloride", Description: "cadmium chloride (C19, R-3m), hexagonal setting, three layers per cell", Example: "CdCl2",
			// CdCl2 a = 3.846 Å, c = 17.49 Å (from memory, approximate;
			// Wyckoff, Crystal Structures, vol. 1); Cl z = 1/4 is the ideal
			// close-packed value, the measured one is close to it (from memory).
			Params: []Param{
				length("a", "hexagonal lattice parameter a", 3.846),
				length("c", "hexagonal lattice parameter c", 17.49),
				fraction("z", "anion coordinate (0, 0, ±z); ideal 1/4", 0.25),
			},
			Slots: binarySlots(2, -1), formulaUnits: 3,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				z := p["z"]
				if err := open("z", z, 0, 0.5); err != nil {
					return [3]Vec3{}, nil, err
				}
				s := place(nil, "M", 2, rhombohedral, Vec3{0, 0, 0})
				s = place(s, "X", -1, rhombohedral, Vec3{0, 0, z}, Vec3{0, 0, -z})
				return hexagonal(p["a"], p["c"]), s, nil
			},
		},
		{
			Name: "cadmium-iodide", Description: "cadmium iodide (C6, P-3m1), hexagonal cell, one layer per cell", Example: "CdI2",
			// CdI2 a = 4.24 Å, c = 6.84 Å (from memory, approximate; Wyckoff,
			// Crystal Structures, vol. 1); I z = 1/4 is the ideal hexagonal
			// close-packed value, the measured one is close to it (from memory).
			Params: []Param{
				length("a", "hexagonal lattice parameter a", 4.24),
				length("c", "hexagonal lattice parameter c", 6.84),
				fraction("z", "anion coordinate (1/3, 2/3, z); ideal 1/4", 0.25),
			},
			Slots: binarySlots(2, -1), formulaUnits: 1,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				z := p["z"]
				if err := open("z", z, 0, 0.5); err != nil {
					return [3]Vec3{}, nil, err
				}
				s := place(nil, "M", 2, nil, Vec3{0, 0, 0})
				s = place(s, "X", -1, nil, Vec3{1.0 / 3, 2.0 / 3, z}, Vec3{2.0 / 3, 1.0 / 3, -z})
				return hexagonal(p["a"], p["c"]), s, nil
			},
		},
		{
			Name: "corundum", Description: "corundum (D5_1, R-3c), hexagonal setting", Example: "Al2O3",
			// α-Al2O3 a = 4.7602 Å, c = 12.9933 Å, Al z = 0.35216, O x = 0.30624
			// (from memory; R. E. Newnham and Y. M. de Haan, Z. Kristallogr.
			// 117, 235 (1962), and later refinements agree to these digits).
			Params: []Param{
				length("a", "hexagonal lattice parameter a", 4.7602),
				length("c", "hexagonal lattice parameter c", 12.9933),
				fraction("z_cation", "cation coordinate (0, 0, z)", 0.35216),
				fraction("x_anion", "anion coordinate (x, 0, 1/4)", 0.30624),
			},
			Slots: binarySlots(3, -2), formulaUnits: 6,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				z, x := p["z_cation"], p["x_anion"]
				if err := open("z_cation", z, 0, 0.5); err != nil {
					return [3]Vec3{}, nil, err
				}
				if err := open("x_anion", x, 0, 1); err != nil {
					return [3]Vec3{}, nil, err
				}
				// Wyckoff 12c and 18e of R-3c (No. 167), hexagonal axes.
				s := place(nil, "M", 3, rhombohedral,
					Vec3{0, 0, z}, Vec3{0, 0, 0.5 - z}, Vec3{0, 0, -z}, Vec3{0, 0, 0.5 + z})
				s = place(s, "X", -2, rhombohedral,
					Vec3{x, 0, 0.25}, Vec3{0, x, 0.25}, Vec3{-x, -x, 0.25},
					Vec3{-x, 0, 0.75}, Vec3{0, -x, 0.75}, Vec3{x, x, 0.75})
				return hexagonal(p["a"], p["c"]), s, nil
			},
		},
		{
			Name: "perovskite", Description: "cubic perovskite (E2_1, Pm-3m), A at the corner, B at the body centre", Example: "SrTiO3",
			// SrTiO3 a = 3.905 Å at room temperature (from memory).
			Params: []Param{length("a", "cubic lattice parameter", 3.905)},
			Slots:  []Slot{{"A", 2, roleCation}, {"B", 4, roleCation}, {"X", -2, roleAnion}},
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "A", 2, nil, Vec3{0, 0, 0})
				s = place(s, "B", 4, nil, Vec3{0.5, 0.5, 0.5})
				s = place(s, "X", -2, nil, Vec3{0.5, 0.5, 0}, Vec3{0.5, 0, 0.5}, Vec3{0, 0.5, 0.5})
				return cubic(p["a"]), s, nil
			},
			formulaUnits: 1,
		},
		{
			Name: "spinel", Description: "normal spinel (H1_1, Fd-3m, origin choice 2), A tetrahedral, B octahedral", Example: "MgAl2O4",
			// MgAl2O4 a = 8.0832 Å, u = 0.2624 in origin choice 2 (0.3874 in
			// origin choice 1) (from memory).
			Params: []Param{
				length("a", "cubic lattice parameter", 8.0832),
				fraction("u", "anion coordinate (u, u, u), origin at -3m; ideal 1/4", 0.2624),
			},
			Slots: []Slot{{"A", 2, roleCation}, {"B", 3, roleCation}, {"X", -2, roleAnion}},
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				u := p["u"]
				if err := open("u", u, 0, 0.5); err != nil {
					return [3]Vec3{}, nil, err
				}
				// Wyckoff 8a, 16d and 32e of Fd-3m (No. 227), origin choice 2.
				s := place(nil, "A", 2, fcc, Vec3{1.0 / 8, 1.0 / 8, 1.0 / 8}, Vec3{7.0 / 8, 3.0 / 8, 3.0 / 8})
				s = place(s, "B", 3, fcc, Vec3{0.5, 0.5, 0.5}, Vec3{0.25, 0.75, 0}, Vec3{0.75, 0, 0.25}, Vec3{0, 0.25, 0.75})
				s = place(s, "X", -2, fcc,
					Vec3{u, u, u}, Vec3{-u, -u, -u},
					Vec3{-u + 0.25, u, -u + 0.25}, Vec3{-u, u + 0.25, u + 0.25},
					Vec3{-u + 0.75, -u + 0.75, u}, Vec3{u + 0.25, -u + 0.5, u + 0.75},
					Vec3{u, -u + 0.75, -u + 0.75}, Vec3{u + 0.25, u + 0.25, -u})
				return cubic(p["a"]), s, nil
			},
			formulaUnits: 8,
		},
		{
			Name: "nickel-arsenide", Description: "nickel arsenide (B8_1, P6_3/mmc), hexagonal cell", Example: "FeS (NiAs-type subcell)",
			// FeS in its NiAs-type subcell: a = 3.446 Å, c = 5.877 Å (from
			// memory, approximate: the troilite supercell √3a × 2c divided back).
			Params: []Param{
				length("a", "hexagonal lattice parameter a", 3.446),
				length("c", "hexagonal lattice parameter c", 5.877),
			},
			Slots: binarySlots(2, -2), formulaUnits: 2,
			build: func(p map[string]float64) ([3]Vec3, []Site, error) {
				s := place(nil, "M", 2, nil, Vec3{0, 0, 0}, Vec3{0, 0, 0.5})
				s = place(s, "X", -2, nil, Vec3{1.0 / 3, 2.0 / 3, 0.25}, Vec3{2.0 / 3, 1.0 / 3, 0.75})
				return hexagonal(p["a"], p["c"]), s, nil
			},
		},
	}
}

// PrototypeNames returns the built-in prototype names in order.
func PrototypeNames() []string {
	var names []string
	for _, p := range Prototypes() {
		names = append(names, p.Name)
	}
	return names
}

// LookupPrototype returns the prototype called name.
func LookupPrototype(name string) (Prototype, error) {
	for _, p := range Prototypes() {
		if p.Name == name {
			return p, nil
		}
	}
	return Prototype{}, fmt.Errorf("prototype %q: %w; valid names: %s", name, ErrUnknownPrototype,
		strings.Join(PrototypeNames(), ", "))
}

// Keys returns the prototype's parameter keys in order.
func (p Prototype) Keys() []string {
	var k []string
	for _, q := range p.Params {
		k = append(k, q.Key)
	}
	return k
}

// Defaults returns the default parameter values keyed by Key.
func (p Prototype) Defaults() map[string]float64 {
	m := make(map[string]float64, len(p.Params))
	for _, q := range p.Params {
		m[q.Key] = q.Default
	}
	return m
}

// Build makes the prototype called name with the given parameters. Keys
// missing from params take their defaults; an unknown key, a non-finite or
// non-positive length or one of MaxCellLength or more, a fractional
// parameter outside its range, or parameters that put two ions closer than
// MinimumSeparation are errors.
// Sites carry the slot labels as species ("M", "X", …) and the default
// charges; use WithIons to name them.
func Build(name string, params map[string]float64) (*Crystal, error) {
	p, err := LookupPrototype(name)
	if err != nil {
		return nil, err
	}
	values := p.Defaults()
	keys := make([]string, 0, len(params))
	for k := range params {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	for _, k := range keys {
		v := params[k]
		if _, ok := values[k]; !ok {
			return nil, fmt.Errorf("prototype %s: unknown parameter %q (valid: %s): %w",
				name, k, strings.Join(p.Keys(), ", "), ErrBadParameter)
		}
		if math.IsNaN(v) || math.IsInf(v, 0) {
			return nil, fmt.Errorf("prototype %s: parameter %s = %g is not a finite number: %w", name, k, v, ErrBadParameter)
		}
		values[k] = v
	}
	for _, q := range p.Params {
		if q.Unit == "Å" && !(values[q.Key] > 0) {
			return nil, fmt.Errorf("prototype %s: length %s = %g Å must be positive: %w", name, q.Key, values[q.Key], ErrBadParameter)
		}
		if q.Unit == "Å" && !(values[q.Key] < MaxCellLength) {
			return nil, fmt.Errorf("prototype %s: length %s = %g Å must be below %g Å, as a CIF file's cell lengths: %w",
				name, q.Key, values[q.Key], MaxCellLength, ErrBadParameter)
		}
	}
	lat, sites, err := p.build(values)
	if err != nil {
		return nil, fmt.Errorf("prototype %s: %w", name, err)
	}
	c := &Crystal{Name: name, Lattice: lat, Sites: sites, FormulaUnits: p.formulaUnits}
	if d, i, j := c.ShortestSeparation(); d < MinimumSeparation {
		return nil, fmt.Errorf("prototype %s: parameters %s put sites %d (%s) and %d (%s) %.3g Å apart (minimum %.2g Å): %w",
			name, formatParams(p, values), i+1, sites[i].Species, j+1, sites[j].Species, d, MinimumSeparation, ErrBadParameter)
	}
	return c, nil
}

func formatParams(p Prototype, v map[string]float64) string {
	var parts []string
	for _, q := range p.Params {
		parts = append(parts, fmt.Sprintf("%s=%g", q.Key, v[q.Key]))
	}
	return strings.Join(parts, " ")
}

func open01(key string, v float64) error { return open(key, v, 0, 1) }

// open checks lo < v < hi for a fractional parameter.
func open(key string, v, lo, hi float64) error {
	if !(v > lo && v < hi) {
		return fmt.Errorf("fractional parameter %s = %g must lie strictly between %g and %g: %w", key, v, lo, hi, ErrBadParameter)
	}
	return nil
}
