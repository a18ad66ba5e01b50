package cycle

import "fmt"

// StepKind says what a step does.
type StepKind int

// The kinds of step, in the order they appear in a cycle.
const (
	// KindAtomization forms one gaseous atom from the element's standard
	// state (M(s) → M(g), ½Cl₂(g) → Cl(g)). When the data split it into
	// sub-steps it is a composite: its value is the sum of its sub-steps.
	KindAtomization StepKind = iota
	// KindVaporization is a liquid → gas sub-step of an atomization.
	KindVaporization
	// KindSublimation is a solid → gas sub-step of an atomization.
	KindSublimation
	// KindDissociation is a molecule → atoms sub-step of an atomization.
	KindDissociation
	// KindIonization removes one electron: M^(i−1)+(g) → M^i+(g) + e⁻.
	KindIonization
	// KindAttachment adds one electron: X^(j−1)−(g) + e⁻ → X^j−(g). Its
	// value is the attachment enthalpy, the negative of the electron affinity.
	KindAttachment
	// KindIonFormation forms a gaseous polyatomic ion from its elements.
	KindIonFormation
	// KindLattice goes from the gaseous ions to the solid (negative).
	KindLattice
	// KindFormation forms the solid from its elements in their standard states.
	KindFormation
)

var kindNames = [...]string{"atomization", "vaporization", "sublimation", "dissociation",
	"ionization", "attachment", "ion-formation", "lattice", "formation"}

// String returns the kind's lower-case name, as used in step keys.
func (k StepKind) String() string {
	if k >= 0 && int(k) < len(kindNames) {
		return kindNames[k]
	}
	return fmt.Sprintf("StepKind(%d)", int(k))
}

// Side says which part of the compound a step belongs to.
type Side int

// The sides of a cycle.
const (
	// SideCompound is the lattice and formation steps.
	SideCompound Side = iota
	// SideCation is the steps that make the gaseous cations.
	SideCation
	// SideAnion is the steps that make the gaseous anions.
	SideAnion
)

// String returns "compound", "cation" or "anion".
func (s Side) String() string {
	switch s {
	case SideCation:
		return "cation"
	case SideAnion:
		return "anion"
	}
	return "compound"
}

// SourceKind says where a step's value came from.
type SourceKind int

// The kinds of source.
const (
	// SourceData is a row of the built-in tables or of a user overlay file.
	SourceData SourceKind = iota
	// SourceUser is a value the user entered for this cycle (Set).
	SourceUser
	// SourceModel is a lattice model's value (Settings.LatticeFrom).
	SourceModel
	// SourceSolved is the value Hess's law gave for the unknown step.
	SourceSolved
	// SourceSum is a composite step whose value is the sum of its sub-steps.
	SourceSum
	// SourceMissing is a step the data have no value for: set it or solve it.
	SourceMissing
)

var sourceKindNames = [...]string{"data", "user", "model", "solved", "sum", "missing"}

// String returns the kind's lower-case name: data, user, model, solved, sum, missing.
func (k SourceKind) String() string {
	if k >= 0 && int(k) < len(sourceKindNames) {
		return sourceKindNames[k]
	}
	return fmt.Sprintf("SourceKind(%d)", int(k))
}

// Source is the provenance of a step's value.
type Source struct {
	Kind SourceKind
	// Key is the data source key (a key of the sources table), the model
	// name for SourceModel, "user" for SourceUser, or "".
	Key string
	// Citation is the full reference for a data source, or a description.
	Citation string
	// Memory marks a data value entered from memory, without the document at
	// hand: check it against Citation before relying on it.
	Memory bool
	// Derived marks a value that the data themselves derived from a cycle
	// rather than measured (the second electron affinities of O and S).
	Derived bool
	// Override marks a value that replaced the built-in one: a user overlay
	// row (Kind SourceData) or a value set for this cycle (Kind SourceUser).
	Override bool
	// DefaultUncertainty marks an uncertainty the source does not state;
	// the default of the step's kind (DefaultUncertainty) was used.
	DefaultUncertainty bool
	// Note is free text: a data row's note or an explanation.
	Note string
}

// Markers returns the short provenance markers of s in a fixed order, for
// tables: "memory", "derived", "override", "default-σ".
func (s Source) Markers() []string {
	var m []string
	if s.Memory {
		m = append(m, "memory")
	}
	if s.Derived {
		m = append(m, "derived")
	}
	if s.Override {
		m = append(m, "override")
	}
	if s.DefaultUncertainty {
		m = append(m, "default-σ")
	}
	return m
}

// Entry is a value with its uncertainty and provenance.
type Entry struct {
	// Value in kJ/mol per reaction as written, in the cycle's conventions.
	Value float64
	// Uncertainty is one standard uncertainty in kJ/mol.
	Uncertainty float64
	Source      Source
}

// Step is one reaction of the cycle.
type Step struct {
	// Key is the stable name of the step: "ionization-2", "lattice".
	Key string
	// Label is a short English description: "second ionization of Mg".
	Label string
	// Reaction is the reaction as written, with Unicode sub- and
	// superscripts: "O⁻(g) + e⁻ → O²⁻(g)".
	Reaction string
	Kind     StepKind
	Side     Side
	// Order is the stage of an ionization or attachment (1, 2, …), else 0:
	// the first electron the step moves.
	Order int
	// Electrons is how many electrons an attachment step adds when it
	// covers several (N(g) + 3e⁻ → N³⁻(g): 3); 0 means one.
	Electrons int
	// Value is ΔH (or ΔU for the lattice step under LatticeEnergy) in
	// kJ/mol per mole of Reaction as written, in the cycle's conventions.
	// It is meaningless while Unknown or when Source.Kind is SourceMissing.
	Value float64
	// Uncertainty is one standard uncertainty of Value in kJ/mol.
	Uncertainty float64
	// Multiplicity is how many times the reaction occurs per formula unit
	// (3 for the oxide ions of Al₂O₃, ½ for Cl₂(g) → 2Cl(g) in NaCl).
	Multiplicity float64
	Source       Source
	// Unknown marks the step Hess's law is to solve.
	Unknown bool
	// Parent is the key of the composite step this is a sub-step of, or "".
	Parent string
	// Composite marks a step with sub-steps (see Cycle.SubSteps).
	Composite bool
	// Reference is the value the data gave, to which Reset returns; nil when
	// the data have none.
	Reference *Entry
}

// Missing reports whether the step has no value and is not the unknown.
func (s *Step) Missing() bool { return !s.Unknown && s.Source.Kind == SourceMissing }

// Contribution returns Multiplicity·Value, the step's share of Hess's sum as shown.
func (s *Step) Contribution() float64 { return s.Multiplicity * s.Value }
