// Package cells is the engine's side of the commands about one crystal
// structure rather than a cycle (madelung, orderings): the built-in
// prototypes, the Ewald sum of a cell with its neutralising background, the
// orderings of ions and vacancies over mixed sites, and the CIF writer,
// with the types a front end prints. A front end reaches thermo's physics
// through this package and never imports it (DEVELOPERS.md § Architecture:
// front ends may import thermo's vocabulary, not its physics packages).
//
// The names are those of the physics packages they come from (aliases of
// their types, their constants and sentinel errors), so that reading a
// front end leads straight to the package that does the work.
package cells

import (
	"io"

	"enthalpath/thermo/cif"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
	"enthalpath/thermo/ordering"
	"enthalpath/thermo/valence"
)

// Structures (thermo/crystal).
type (
	// Crystal is a periodic cell of point charges.
	Crystal = crystal.Crystal
	// Prototype is a built-in structure type with its parameters and slots.
	Prototype = crystal.Prototype
	// Ion is the charge given to a prototype's slot.
	Ion = crystal.Ion
)

// ShortestBond (Å) is the shortest cation–anion distance of any real solid
// (crystal.ShortestBond).
const ShortestBond = crystal.ShortestBond

// Prototypes lists the built-in prototypes.
func Prototypes() []Prototype { return crystal.Prototypes() }

// LookupPrototype returns the built-in prototype of that name.
func LookupPrototype(name string) (Prototype, error) { return crystal.LookupPrototype(name) }

// Build returns the cell of prototype name with the parameters params
// (defaults for those not given).
func Build(name string, params map[string]float64) (*Crystal, error) {
	return crystal.Build(name, params)
}

// The Ewald sum (thermo/ewald).
type (
	// EwaldResult is the energy, Madelung constant and site potentials of a cell.
	EwaldResult = ewald.Result
	// Background is the neutralising background's part of a charged cell.
	Background = ewald.Background
	// AccuracyError reports a sum that did not reach the asked accuracy.
	AccuracyError = ewald.AccuracyError
)

const (
	// DefaultAccuracy is the relative accuracy of a sum unless asked otherwise.
	DefaultAccuracy = ewald.DefaultAccuracy
	// Boundary names the boundary condition of every sum.
	Boundary = ewald.Boundary
	// BackgroundConvention is the warning every result of a charged cell carries.
	BackgroundConvention = ewald.BackgroundConvention
)

// The Ewald sum's sentinel errors.
var (
	ErrBadOptions = ewald.ErrBadOptions
	ErrTooLarge   = ewald.ErrTooLarge
)

// SumCharged is the Ewald sum of c to the relative accuracy asked (0: the
// default), with a neutralising background when c carries a net charge
// (ewald.SumCharged).
func SumCharged(c *Crystal, accuracy float64) (EwaldResult, Background, error) {
	return ewald.SumCharged(c, ewald.Options{Accuracy: accuracy})
}

// Charges assigned to a structure file (thermo/valence).
type (
	// ChargeGroup is one element's sites and the charge they were given.
	ChargeGroup = valence.Group
)

const (
	// GivenCharges: every charge came with the structure or from the caller.
	GivenCharges = valence.Given
	// ChargeBalanceRanked: several neutral choices; the bond-valence sums chose.
	ChargeBalanceRanked = valence.ChargeBalanceRanked
	// PoorFit: the closest neutral choice fits the bond-valence sums poorly.
	PoorFit = valence.PoorFit
	// BondValenceB (Å) is the softness b of exp((R − d)/b).
	BondValenceB = valence.B
)

// Orderings over mixed sites (thermo/ordering).
type (
	// OrderingMethod is enumeration or annealing.
	OrderingMethod = ordering.Method
	// SiteSpec chooses mixed sites and their occupants.
	SiteSpec = ordering.SiteSpec
	// Occupant is a species with its charge and fraction, or a vacancy.
	Occupant = ordering.Occupant
	// Problem is a set-up search over the orderings of one cell.
	Problem = ordering.Problem
	// Outcome is the lowest orderings found.
	Outcome = ordering.Outcome
	// SearchOptions set the search.
	SearchOptions = ordering.SearchOptions
)

const (
	Enumerate       = ordering.Enumerate
	Anneal          = ordering.Anneal
	DefaultKeep     = ordering.DefaultKeep
	DefaultSweeps   = ordering.DefaultSweeps
	DefaultRestarts = ordering.DefaultRestarts
)

// ErrSpec is the sentinel of a refused site specification.
var ErrSpec = ordering.ErrSpec

// OccupancySpecs returns the specifications of the partly occupied or
// shared sites of c that skip does not already choose.
func OccupancySpecs(c *Crystal, skip []SiteSpec) []SiteSpec { return ordering.OccupancySpecs(c, skip) }

// NewProblem sets up the search over the orderings of c's mixed sites,
// Ewald sums to the relative accuracy asked (0: the default).
func NewProblem(c *Crystal, specs []SiteSpec, accuracy float64) (*Problem, error) {
	return ordering.NewProblem(c, specs, ordering.Options{Accuracy: accuracy})
}

// WriteCIF writes c as a CIF file with the comment lines given.
func WriteCIF(w io.Writer, c *Crystal, comment []string) error { return cif.Write(w, c, comment) }
