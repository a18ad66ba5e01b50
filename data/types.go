package data

// This file holds the record types every table shares. The loader (load.go),
// lookups (db.go) and formula parser (formula.go) build on them.
// Fields may be added; do not rename or remove without updating cycle/ and tui/.

// Value is one tabulated number with its provenance.
type Value struct {
	// V is the value in Unit.
	V float64
	// U is the standard uncertainty in Unit; 0 means "not stated".
	U float64
	// Unit is the unit as stored: "eV", "kJ/mol", "Å", "g/cm3", "nm3".
	Unit string
	// Source is the key of the citation in the sources table, or "user" for
	// a value from the user's overlay file.
	Source string
	// Memory marks a value entered from memory, without the document at hand.
	Memory bool
	// Derived marks a value derived from a thermochemical cycle rather than
	// measured directly (the second electron affinities of O and S).
	Derived bool
	// Override marks a value that a user overlay replaced; Replaced then
	// holds the built-in value it replaced.
	Override bool
	Replaced *Value
	// Note is free text from the row.
	Note string
	// Locator points into the cited source: a vendored file and line
	// ("nbs-tables-1982/NBS_Tables_with_ErratumValues.csv:10843") or the
	// species' name there. Empty for values with no machine-readable source.
	Locator string
}

// Known reports whether the value was given (a zero Value is "absent").
func (v *Value) Known() bool { return v != nil && v.Unit != "" }

// Element is a chemical element with the data a Born–Haber cycle needs.
type Element struct {
	Symbol string
	Name   string
	Z      int
	// StandardState is the reference state at 298.15 K and 1 bar written as
	// a species, for example "Na(s)", "Cl2(g)", "Br2(l)", "S(s)", "C(s,graphite)".
	StandardState string
	// Atomization is ΔfH°(X, g, 298.15 K): the enthalpy to form one mole of
	// gaseous atoms from the standard state, in kJ/mol.
	Atomization Value
	// Ionization holds the successive ionization energies (0 K, eV):
	// Ionization[0] is the first.
	Ionization []Value
	// ElectronAffinity is the first electron affinity in eV (positive when
	// attachment releases energy); absent for elements without one.
	ElectronAffinity Value
	// SecondAffinity is the second electron affinity in eV for O and S
	// (negative: X⁻ + e⁻ → X²⁻ absorbs energy); cycle-derived, Derived=true.
	SecondAffinity Value
	// AtomicMass is the conventional standard atomic weight in g/mol
	// (atomic_weights.csv); absent for an element without one (Tc).
	AtomicMass Value
	// StandardEntropy is S°(298.15 K) of the element in its standard state,
	// J/(mol·K).
	StandardEntropy Value
	// AtomizationAlternatives are other compilations' values of
	// Atomization (kJ/mol), each with its own source and locator.
	AtomizationAlternatives []Value
}

// AtomizationStep is one sub-step on the way from an element's standard
// state to gaseous atoms: a vaporization, sublimation or dissociation.
type AtomizationStep struct {
	// Kind is "vaporization", "sublimation" or "dissociation".
	Kind string
	// Reaction as written, e.g. "Br2(l) → Br2(g)" or "Cl2(g) → 2 Cl(g)".
	Reaction string
	// AtomsProduced is the number of gaseous atoms per reaction as written
	// once the path is complete (dissociation of X2: 2); for a phase change
	// of X2 it is 2 too (it serves two atoms), for S(s)→S(g) it is 1.
	AtomsProduced int
	// Enthalpy is ΔH° at 298.15 K per mole of the reaction as written (kJ/mol).
	Enthalpy Value
	// Element is the element symbol; Order the step's place in the path (1 first).
	Element string
	Order   int
}

// ShannonRadius is one row of Shannon's 1976 table.
type ShannonRadius struct {
	// CN is the coordination number as Shannon wrote it: "IV", "VI", "IVSQ", "VIII" ...
	CN string
	// Coordination is CN as an integer (4 for "IVSQ").
	Coordination int
	// Spin is "HS", "LS" or "".
	Spin string
	// Crystal and Ionic are the crystal and effective ionic radii in Å.
	Crystal Value
	Ionic   Value
	// Core and Charge name the ion ("Fe", 3).
	Core   string
	Charge int
	// Substituted is empty for an exact match; otherwise it says which row
	// the lookup returned in place of the one asked for, for example
	// "CN VIII not tabulated for Na+; nearest CN VI used". Radius sets it.
	Substituted string
}

// Ion is a monatomic or polyatomic ion.
type Ion struct {
	// Symbol is the ion written with its charge, for example "Na+", "O2-",
	// "SO4^2-", "NH4+".
	Symbol string
	// Core is the element symbol or group formula without charge ("Na", "SO4").
	Core string
	// Charge in units of e.
	Charge int
	// Polyatomic is true for a group ion.
	Polyatomic bool
	// Shape is "monatomic", "linear" or "nonlinear" (for the n·RT terms).
	Shape string
	// Radii are Shannon radii by coordination (monatomic ions).
	Radii []ShannonRadius
	// ThermochemicalRadius in Å (polyatomic ions; Jenkins et al.).
	ThermochemicalRadius Value
	// GasFormation is ΔfH°(ion, g, 298.15 K) in kJ/mol (thermal-electron
	// convention of the NBS tables; see data/README.md).
	GasFormation Value
	// GasFormationAlternatives are other compilations' values of
	// GasFormation, converted to the same convention.
	GasFormationAlternatives []Value
	// BornConfig is the noble-gas (or pseudo noble-gas) configuration for
	// Pauling's Born exponent, a row of born_exponents.csv: "He", "Ne", "Ar",
	// "Kr", "Xe", or for the d¹⁰ ions "[Ar]3d10" (Cu⁺, Zn²⁺), "[Kr]4d10"
	// (Ag⁺, Cd²⁺), "[Xe]4f14 5d10" (Au⁺, Hg²⁺).
	BornConfig string
	// Hydration is the standard hydration enthalpy in kJ/mol on the scale
	// named in HydrationScale.
	Hydration      Value
	HydrationScale string
	// Hydrations holds every tabulated hydration enthalpy with its scale
	// (Hydration is the first of them).
	Hydrations []ScaledValue
	// BornExponent is Pauling's Born exponent n for BornConfig (absent when
	// BornConfig is empty).
	BornExponent Value
	// Note is free text from the ion row.
	Note string
}

// ScaledValue is a value on a named scale ("conventional" or "absolute"
// for hydration enthalpies).
type ScaledValue struct {
	Scale string
	Value Value
	// derivedScale marks a value the loader derived from the ion's value
	// on the other scale (see builder.otherHydrationScales).
	derivedScale bool
}

// Compound is a tabulated solid.
type Compound struct {
	// Formula as conventionally written: "NaCl", "CaF2", "Mg(OH)2", "NH4Cl".
	Formula string
	Name    string
	// Family groups compounds for comparison: "alkali halide", "silver halide" ...
	Family string
	// Cation and Anion are ion symbols (keys into the ion table) with counts
	// per formula unit: Al2O3 → Cation "Al3+" ×2, Anion "O2-" ×3.
	Cation      string
	CationCount int
	Anion       string
	AnionCount  int
	// Formation is ΔfH°(298.15 K) of the compound in State, kJ/mol.
	Formation Value
	// GibbsFormation is ΔfG°(298.15 K) in kJ/mol; Entropy is S°(298.15 K)
	// in J/(mol·K). Absent where the source gives none.
	GibbsFormation Value
	Entropy        Value
	// Alternatives are other compilations' values of Formation (kJ/mol),
	// each with its source and locator.
	Alternatives []Value
	// State is the phase the values refer to: "cr" (crystal), "l" or "g".
	// Empty in rows written before states were recorded: read it as "cr".
	State string
	// Polymorph names the crystal form where the source distinguishes
	// several ("calcite", "rutile", "alpha"); empty otherwise.
	Polymorph string
	// Molecular marks a known non-ionic (molecular) compound: TiCl4(l),
	// SF6(g), PCl5(cr). Its Cation and Anion are the formal ions of its
	// composition; a Born–Haber cycle through them describes no real solid.
	Molecular bool
	// Structure is a prototype name of thermo/crystal, or "" when none fits.
	Structure string
	// Params are the prototype's parameters (a, c, u, x ... in Å or fractional).
	Params map[string]float64
	// ParamsSource is the source key of Params.
	ParamsSource string
	// Density in g/cm³ (for the volume-based model when no cell is given).
	Density Value
	// HandbookLattice is a published lattice energy (kJ/mol, positive as
	// tabulated for the dissociation solid → gaseous ions); its Note says
	// which convention (U or ΔH_L) the source used.
	HandbookLattice Value
	// LatticeConvention is "U" (lattice energy) or "dH" (lattice enthalpy)
	// for HandbookLattice, as the source tabulated it.
	LatticeConvention string
	// ParamsMemory marks Params entered from memory; ParamsOverride marks
	// Params set by a user overlay.
	ParamsMemory   bool
	ParamsOverride bool
	// Note is free text from the compound row.
	Note string
}

// Species is a substance in a given state from the thermochemical tables:
// gases such as CO2(g), O2(g), H2O(g), liquids, and elements in their
// standard states. Formula carries the state: "CO2(g)", "H2O(l)".
type Species struct {
	Formula string
	Name    string
	// Formation is ΔfH°(298.15 K), GibbsFormation ΔfG°(298.15 K), both
	// kJ/mol; Entropy is S°(298.15 K) in J/(mol·K).
	Formation      Value
	GibbsFormation Value
	Entropy        Value
	// Alternatives are other compilations' values of Formation.
	Alternatives []Value
}

// Source is one citation.
type Source struct {
	Key      string
	Citation string
}
