package cycle

import (
	"fmt"
	"strings"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
)

// LatticeConvention says whether the lattice step is an enthalpy or an energy.
type LatticeConvention int

const (
	// LatticeEnthalpy is ΔH_L at 298.15 K, what Hess's law gives (default).
	LatticeEnthalpy LatticeConvention = iota
	// LatticeEnergy is the lattice energy U (the models' quantity).
	LatticeEnergy
)

// String returns "enthalpy" or "energy".
func (c LatticeConvention) String() string {
	if c == LatticeEnergy {
		return "energy"
	}
	return "enthalpy"
}

// Symbol returns "ΔH_L" or "U".
func (c LatticeConvention) Symbol() string {
	if c == LatticeEnergy {
		return "U"
	}
	return "ΔH_L"
}

// ParseLatticeConvention reads "enthalpy" (or "dh", "h") or "energy" (or "u").
func ParseLatticeConvention(s string) (LatticeConvention, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "enthalpy", "dh", "h", "dhl":
		return LatticeEnthalpy, nil
	case "energy", "u":
		return LatticeEnergy, nil
	}
	return 0, fmt.Errorf("unknown lattice convention %q: use enthalpy (ΔH_L) or energy (U)", s)
}

// IonizationConvention says how ionization and attachment steps are counted.
type IonizationConvention int

const (
	// Energies0K uses ionization energies and electron affinities as
	// published, at 0 K (default).
	Energies0K IonizationConvention = iota
	// Enthalpies298 adds 5/2·RT per electron released and subtracts it per
	// electron attached: the enthalpies at 298.15 K with a thermal electron.
	Enthalpies298
)

// String returns "0K" or "298K".
func (c IonizationConvention) String() string {
	if c == Enthalpies298 {
		return "298K"
	}
	return "0K"
}

// ParseIonizationConvention reads "0k" (or "energy") or "298k" (or "enthalpy").
func ParseIonizationConvention(s string) (IonizationConvention, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "0k", "0", "energy", "energies":
		return Energies0K, nil
	case "298k", "298", "298.15k", "enthalpy", "enthalpies":
		return Enthalpies298, nil
	}
	return 0, fmt.Errorf("unknown ionization convention %q: use 0k (energies) or 298k (enthalpies)", s)
}

// Conventions are the conventions the step values are in.
type Conventions struct {
	Lattice    LatticeConvention
	Ionization IonizationConvention
}

// String describes the conventions in words, for output.
func (c Conventions) String() string {
	lat := "lattice enthalpy ΔH_L at 298.15 K"
	if c.Lattice == LatticeEnergy {
		lat = "lattice energy U"
	}
	ion := "ionization energies and electron affinities at 0 K"
	if c.Ionization == Enthalpies298 {
		ion = "ionization and attachment enthalpies at 298.15 K (±5/2·RT per electron)"
	}
	return lat + "; " + ion
}

// RadiusKind chooses between Shannon's two radius sets.
type RadiusKind int

const (
	// RadiusIonic is Shannon's effective ionic radius (default).
	RadiusIonic RadiusKind = iota
	// RadiusCrystal is Shannon's crystal radius (ionic +0.14 Å for cations,
	// −0.14 Å for anions).
	RadiusCrystal
)

// String returns "ionic" or "crystal".
func (k RadiusKind) String() string {
	if k == RadiusCrystal {
		return "crystal"
	}
	return "ionic"
}

// ParseRadiusKind reads "ionic" or "crystal".
func ParseRadiusKind(s string) (RadiusKind, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "ionic", "effective":
		return RadiusIonic, nil
	case "crystal":
		return RadiusCrystal, nil
	}
	return 0, fmt.Errorf("unknown radius kind %q: use ionic or crystal", s)
}

// DistanceSource says where the cation–anion distance d₀ comes from.
type DistanceSource int

const (
	// DistanceAuto takes d₀ from the structure's geometry when the compound
	// has a cell (prototype with parameters, or CIF), else from the radii.
	DistanceAuto DistanceSource = iota
	// DistanceGeometry is the nearest cation–anion distance of the cell.
	DistanceGeometry
	// DistanceRadii is the sum of the Shannon radii (Settings.Radius, CN).
	DistanceRadii
	// DistanceUser is Settings.D0.
	DistanceUser
)

// String returns "auto", "geometry", "radii" or "user".
func (d DistanceSource) String() string {
	switch d {
	case DistanceGeometry:
		return "geometry"
	case DistanceRadii:
		return "radii"
	case DistanceUser:
		return "user"
	}
	return "auto"
}

// ParseDistanceSource reads "auto", "geometry", "radii" or "user".
func ParseDistanceSource(s string) (DistanceSource, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "auto", "":
		return DistanceAuto, nil
	case "geometry", "cell":
		return DistanceGeometry, nil
	case "radii", "radius":
		return DistanceRadii, nil
	case "user":
		return DistanceUser, nil
	}
	return 0, fmt.Errorf("unknown d₀ source %q: use auto, geometry, radii or a distance in Å", s)
}

// Structure is the arrangement the Madelung constant is computed for.
type Structure struct {
	// Prototype is a thermo/crystal prototype name ("rock-salt"), or "".
	Prototype string
	// Params are the prototype's parameters (a, c in Å; u, x, z fractional).
	Params map[string]float64
	// CIF is the path of a CIF file the structure was read from, as given
	// (kept for the record and the cycle file; Cell holds the parsed cell).
	CIF string
	// Cell is a parsed cell (from a CIF file); it takes precedence over
	// Prototype. The caller parses the file (see thermo/cif) so this package
	// reads no files. Nil for a prototype.
	Cell *crystal.Crystal
	// BondValenceSums are the bond-valence sums of Cell's sites (from
	// StructureFile), or nil.
	BondValenceSums []float64
	// FromData marks the compound's own structure from the data.
	FromData bool
}

// Empty reports whether no structure is chosen.
func (s Structure) Empty() bool { return s.Prototype == "" && s.Cell == nil && s.CIF == "" }

// Measured reports whether the structure's geometry is the compound's own
// (a CIF, or prototype parameters from the data or the user) rather than a
// prototype's default cell, which gives the shape only.
func (s Structure) Measured() bool { return s.Cell != nil || (s.Prototype != "" && len(s.Params) > 0) }

// Name returns the prototype name, the CIF path, or "".
func (s Structure) Name() string {
	if s.Cell != nil {
		if s.CIF != "" {
			return s.CIF
		}
		return s.Cell.Name
	}
	return s.Prototype
}

func (s Structure) clone() Structure { return s.cloneInto(nil) }

// cloneInto is clone with the parameters copied into params' storage.
func (s Structure) cloneInto(params map[string]float64) Structure {
	d := s
	d.Params = cloneInto(params, s.Params)
	if s.Cell != nil {
		d.Cell = s.Cell.Clone()
	}
	return d
}

// Settings are the user's choices for the models and the output. The zero
// value is the default everywhere (ρ, Born exponent and CN from the data and
// the structure; ionic radii; d₀ automatic; kJ/mol).
type Settings struct {
	// LatticeFrom, when a model name, fills the lattice step from that model
	// and another step is solved.
	LatticeFrom string
	// Rho is the Born–Mayer range parameter ρ in Å; 0 means the default of
	// thermo/lattice (0.345 Å).
	Rho float64
	// BornExponent overrides the Born–Landé exponent n; 0 means the mean of
	// Pauling's values for the ions' noble-gas configurations.
	BornExponent float64
	// Radius chooses ionic or crystal radii.
	Radius RadiusKind
	// CationCN and AnionCN are the coordination numbers of the radii; 0
	// means from the structure (6 when there is none).
	CationCN, AnionCN int
	// Distance chooses d₀; D0 is the value in Å for DistanceUser.
	Distance DistanceSource
	D0       float64
	// Structure for the Madelung constant; the compound's own from the data
	// unless the user chose another.
	Structure Structure
	// Accuracy is the Ewald sum's relative accuracy; 0 means 1e-8.
	Accuracy float64
	// Units is the unit values are printed in (and --set values read in).
	Units thermo.Unit
	// Dispersion chooses the extended model's dispersion coefficients
	// (DispersionInCrystal by default).
	Dispersion DispersionSet

	// noStructure keeps Build from filling in the compound's own structure
	// (a cycle file that chose none).
	noStructure bool
}

func (s Settings) clone() Settings {
	d := s
	d.Structure = s.Structure.clone()
	return d
}
