package cycle

import (
	"errors"
	"fmt"
	"strings"

	"enthalpath/thermo/notation"
)

// Sentinel errors; the typed errors below wrap them so errors.Is works.
var (
	// ErrNothingToSolve: no step is unknown.
	ErrNothingToSolve = errors.New("nothing to solve")
	// ErrTooManyUnknowns: more than one step is unknown.
	ErrTooManyUnknowns = errors.New("more than one unknown")
	// ErrMissingDatum: a step needs a value the data do not have.
	ErrMissingDatum = errors.New("missing datum")
	// ErrChargeBalance: the ions' charges cannot make a neutral formula.
	ErrChargeBalance = errors.New("impossible charge balance")
	// ErrUnknownStep: no step has the key.
	ErrUnknownStep = errors.New("unknown step")
	// ErrUnknownCompound: the formula cannot be made into a cycle.
	ErrUnknownCompound = errors.New("unknown compound")
	// ErrUnknownModel: the model name is not one of ModelNames.
	ErrUnknownModel = errors.New("unknown lattice model")
	// ErrModel: a model could not be evaluated (missing radius, structure …).
	ErrModel = errors.New("model not available")
	// ErrBadSetting: a KEY=VALUE[±UNC] setting could not be read.
	ErrBadSetting = errors.New("bad setting")
	// ErrBadFile: a cycle file could not be read.
	ErrBadFile = errors.New("bad cycle file")
)

// UnknownsError reports zero or several unknown steps.
type UnknownsError struct {
	// Keys are the steps marked unknown (empty for ErrNothingToSolve).
	Keys []string
}

func (e *UnknownsError) Error() string {
	if len(e.Keys) == 0 {
		return "nothing to solve: mark one step unknown (usually lattice)"
	}
	return fmt.Sprintf("%d unknowns (%s): exactly one step can be solved; give a value to all but one",
		len(e.Keys), strings.Join(e.Keys, ", "))
}

func (e *UnknownsError) Unwrap() error {
	if len(e.Keys) == 0 {
		return ErrNothingToSolve
	}
	return ErrTooManyUnknowns
}

// MissingError reports a step without a value that is not the unknown.
type MissingError struct {
	// Key is the step; What names the missing datum in words ("first
	// electron affinity of Xe").
	Key, What string
	// Kind is the step's kind; Ion the symbol of the gaseous ion the step
	// helps make ("MoO4^2-", "As3-"), "" for a step of the compound.
	Kind StepKind
	Ion  string
}

// MissingDatum returns the *MissingError for step s of c, which has no value.
func (c *Cycle) MissingDatum(s *Step) *MissingError {
	e := &MissingError{Key: s.Key, What: s.Label, Kind: s.Kind}
	switch s.Side {
	case SideCation:
		e.Ion = c.Cation.Ion.Symbol
	case SideAnion:
		e.Ion = c.Anion.Ion.Symbol
	}
	return e
}

func (e *MissingError) Error() string {
	return fmt.Sprintf("no %s in the data; give step %s a value (kJ/mol per reaction as written) or solve for it",
		e.What, e.Key)
}

func (e *MissingError) Unwrap() error { return ErrMissingDatum }

// StepError reports a key that names no step of the cycle.
type StepError struct {
	Key string
	// Valid lists the cycle's step keys.
	Valid []string
}

func (e *StepError) Error() string {
	return fmt.Sprintf("no step %q in this cycle; the steps are: %s", e.Key, strings.Join(e.Valid, ", "))
}

func (e *StepError) Unwrap() error { return ErrUnknownStep }

// ChargeError reports ions whose charges cannot balance in the formula.
type ChargeError struct {
	Formula string
	Detail  string
}

func (e *ChargeError) Error() string {
	return fmt.Sprintf("%s: impossible charge balance: %s", notation.ShortInput(e.Formula), e.Detail)
}

func (e *ChargeError) Unwrap() error { return ErrChargeBalance }

// CompoundError reports a formula that cannot be built, with suggestions.
type CompoundError struct {
	Formula string
	// Reason says what is wrong; Err is the underlying error if any.
	Reason string
	Err    error
	// Suggestions are tabulated formulas close to the one asked for.
	Suggestions []string
}

func (e *CompoundError) Error() string {
	msg := e.Reason
	if e.Formula != "" {
		msg = fmt.Sprintf("%s: %s", notation.ShortInput(e.Formula), e.Reason)
	}
	if e.Err != nil {
		msg += ": " + e.Err.Error()
	}
	if len(e.Suggestions) > 0 {
		msg += "; did you mean " + strings.Join(e.Suggestions, ", ") + "?"
	}
	return msg
}

func (e *CompoundError) Unwrap() []error {
	if e.Err != nil {
		return []error{ErrUnknownCompound, e.Err}
	}
	return []error{ErrUnknownCompound}
}

// ModelError reports a model that cannot be evaluated, or an unknown name.
type ModelError struct {
	Model  string
	Reason string
	// Remedy is the setting that would let the model run, for a front
	// end to name its own way of giving it (RemedyNone: none).
	Remedy Remedy
	Err    error
}

// Remedy is a setting the user can give so that a model runs.
type Remedy int

const (
	RemedyNone Remedy = iota
	// RemedyBornExponent: give the Born exponent n.
	RemedyBornExponent
	// RemedyStructure: choose a structure (a prototype or a CIF file).
	RemedyStructure
	// RemedyStructureWithCell: choose a structure with cell parameters or
	// a CIF file.
	RemedyStructureWithCell
	// RemedyReadCIF: give the CIF file of the structure again.
	RemedyReadCIF
)

// String is the remedy in neutral words, as Error appends it.
func (r Remedy) String() string {
	switch r {
	case RemedyBornExponent:
		return "give the Born exponent n"
	case RemedyStructure:
		return "choose a structure (a prototype or a CIF file)"
	case RemedyStructureWithCell:
		return "choose a structure with cell parameters, or a CIF file"
	case RemedyReadCIF:
		return "give the CIF file again"
	}
	return ""
}

func (e *ModelError) Error() string {
	msg := fmt.Sprintf("model %s: %s", e.Model, e.Reason)
	if e.Remedy != RemedyNone {
		msg += "; " + e.Remedy.String()
	}
	if e.Err != nil {
		msg += ": " + e.Err.Error()
	}
	return msg
}

func (e *ModelError) Unwrap() []error {
	base := ErrModel
	if !isModelName(e.Model) {
		base = ErrUnknownModel
	}
	if e.Err != nil {
		return []error{base, e.Err}
	}
	return []error{base}
}

// SettingError reports a KEY=VALUE[±UNC] text that cannot be read; Column
// is the 1-based column (in characters) of the fault.
type SettingError struct {
	Text   string
	Column int
	Reason string
}

func (e *SettingError) Error() string {
	return fmt.Sprintf("setting %s: %s at column %d (write KEY=VALUE or KEY=VALUE±UNC, e.g. attachment-2=744±20)",
		notation.QuoteInput(e.Text), e.Reason, e.Column)
}

func (e *SettingError) Unwrap() error { return ErrBadSetting }

// ValueError reports an energy typed as VALUE[±UNC][UNIT] that cannot be
// read (see ParseQuantity); Column is the 1-based column (in characters)
// of the fault. Part and Problem say what is wrong for a front end that
// words it itself; Reason is the engine's own account.
type ValueError struct {
	Text   string
	Column int
	// Part is "value" or "uncertainty"; "" for the text as a whole.
	Part    string
	Problem ValueProblem
	Reason  string
}

// ValueProblem is what is wrong with a typed energy.
type ValueProblem int

const (
	// ValueNotUTF8: the text is not valid UTF-8.
	ValueNotUTF8 ValueProblem = iota + 1
	// ValueMissing: no number where one is needed.
	ValueMissing
	// ValueNotANumber: the part is no finite decimal number.
	ValueNotANumber
	// ValueNegative: a negative uncertainty.
	ValueNegative
	// ValueTooLarge: beyond ±MaxStepMagnitude kJ/mol.
	ValueTooLarge
)

func (e *ValueError) Error() string {
	return fmt.Sprintf("value %s: %s at column %d", notation.QuoteInput(e.Text), e.Reason, e.Column)
}

// FileError reports a fault in a cycle file, with the line and field.
type FileError struct {
	// Path is the file name, or "" for bytes given to Unmarshal.
	Path string
	// Line is the 1-based line, 0 when unknown.
	Line int
	// Field is the TOML key path at fault ("steps[3].value"), or "".
	Field  string
	Reason string
	Err    error
}

func (e *FileError) Error() string {
	var b strings.Builder
	if e.Path != "" {
		b.WriteString(e.Path)
	} else {
		b.WriteString("cycle file")
	}
	if e.Line > 0 {
		fmt.Fprintf(&b, ":%d", e.Line)
	}
	if e.Field != "" {
		fmt.Fprintf(&b, ": field %s", e.Field)
	}
	b.WriteString(": ")
	b.WriteString(e.Reason)
	if e.Err != nil {
		b.WriteString(": ")
		b.WriteString(e.Err.Error())
	}
	return b.String()
}

func (e *FileError) Unwrap() []error {
	if e.Err != nil {
		return []error{ErrBadFile, e.Err}
	}
	return []error{ErrBadFile}
}

// PrototypeFitError reports a prototype whose sites cannot hold the
// compound's ions: species other than one cation (M) and one anion (X), or
// another cation-to-anion ratio.
type PrototypeFitError struct {
	Prototype, Formula string
	// Species are the prototype's site species; Cations and Anions its
	// counts of M and X per cell, Want the compound's cations and anions
	// per formula unit.
	Species                 []string
	Cations, Anions         int
	WantCations, WantAnions int
}

func (e *PrototypeFitError) Error() string {
	if e.Cations == 0 || e.Anions == 0 || len(e.Species) != 2 {
		return fmt.Sprintf("the %s prototype does not fit %s: its sites hold %s, not one cation (M) and one anion (X)",
			e.Prototype, e.Formula, strings.Join(e.Species, ", "))
	}
	return fmt.Sprintf("the %s prototype does not fit %s: it holds cations and anions %d:%d, %s needs %d:%d",
		e.Prototype, e.Formula, e.Cations, e.Anions, e.Formula, e.WantCations, e.WantAnions)
}
