package cycle

import (
	"errors"
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/thermo/notation"
)

// Options choose how Build makes a cycle.
type Options struct {
	// Cation and Anion, when set, are the ion symbols to use ("Mg+",
	// "Cl-"): needed for a formula whose ions the data cannot decide, or to
	// build a hypothetical compound with unusual charges. An ion the data
	// do not list is made from its symbol (monatomic, no radii).
	Cation, Anion string
	// Conventions the step values are built in (zero value: ΔH_L, 0 K).
	Conventions Conventions
	// Settings start from these (the compound's own structure is filled in
	// when Settings.Structure is empty).
	Settings Settings
	// Memo is the Madelung memo to use; nil makes a new one.
	Memo *Memo
	// AnionValue chooses the value of a multiply charged monatomic anion
	// (O²⁻, S²⁻): the family-fitted one (default) or the textbook one.
	AnionValue AnionValue
}

// Default uncertainties used where a source states none (common practice,
// no source): small against the uncertainties a cycle usually carries.
const (
	// DefaultIonizationUncertaintyEV for ionization energies (spectroscopic
	// values are far more precise; this only keeps the sum honest).
	DefaultIonizationUncertaintyEV = 0.001
	// DefaultAffinityUncertaintyEV for measured electron affinities.
	DefaultAffinityUncertaintyEV = 0.01
	// DefaultDerivedAttachment for cycle-derived attachment enthalpies
	// (O⁻ → O²⁻, S⁻ → S²⁻), which depend on the lattice energies used.
	DefaultDerivedAttachment = 40.0
	// DefaultEnthalpy for atomization, phase-change, dissociation and
	// formation enthalpies (kJ/mol).
	DefaultEnthalpy = 2.0
	// DefaultIonFormation for gaseous polyatomic-ion formation enthalpies.
	DefaultIonFormation = 10.0
	// DefaultLatticeRelative is the relative uncertainty of a handbook
	// lattice value that states none.
	DefaultLatticeRelative = 0.01
)

// Build assembles the cycle of formula from db: the compound's ions (from
// its data row, or for a formula not tabulated from the ions the data know
// for its elements and Options), every step with its value, uncertainty and
// source, and the lattice step marked unknown. Errors: *CompoundError (the
// formula cannot be read or split into one cation and one anion, with
// suggestions), *ChargeError (no charges that balance). A missing datum is
// not an error here: its step has Source.Kind SourceMissing and Solve names it.
func Build(db *data.DB, formula string, opt Options) (*Cycle, error) {
	if db == nil {
		return nil, &CompoundError{Formula: formula, Reason: "no data loaded"}
	}
	formula = strings.TrimSpace(formula)
	if formula == "" {
		return nil, &CompoundError{Formula: formula, Reason: "the formula is empty; give one such as NaCl"}
	}
	c := &Cycle{memo: opt.Memo, Settings: opt.Settings.clone(), db: db}
	if c.memo == nil {
		c.memo = NewMemo()
	}
	comp, tabulated := db.FindCompound(formula)
	if tabulated && opt.Cation == "" && opt.Anion == "" {
		c.Formula, c.Name, c.Family, c.Tabulated, c.Compound = comp.Formula, comp.Name, comp.Family, true, comp
		cat, err := db.Ion(comp.Cation)
		if err != nil {
			return nil, &CompoundError{Formula: formula, Reason: "its cation is not in the ion table", Err: err}
		}
		an, err := db.Ion(comp.Anion)
		if err != nil {
			return nil, &CompoundError{Formula: formula, Reason: "its anion is not in the ion table", Err: err}
		}
		c.Cation = Part{Ion: cat, Count: comp.CationCount}
		c.Anion = Part{Ion: an, Count: comp.AnionCount}
		if comp.CationCount*cat.Charge+comp.AnionCount*an.Charge != 0 {
			return nil, &ChargeError{Formula: formula, Detail: fmt.Sprintf("%d %s and %d %s do not balance", comp.CationCount, cat.Symbol, comp.AnionCount, an.Symbol)}
		}
	} else {
		if err := c.hypothetical(db, formula, opt); err != nil {
			return nil, err
		}
		if tabulated {
			c.Tabulated, c.Compound, c.Name, c.Family = true, comp, comp.Name, comp.Family
			if comp.Cation != c.Cation.Ion.Symbol || comp.Anion != c.Anion.Ion.Symbol {
				// Other ions than the data row's: the row's values do not apply.
				c.Tabulated, c.Compound = false, data.Compound{}
			}
		}
	}
	if c.Cation.Ion.Charge <= 0 || c.Anion.Ion.Charge >= 0 {
		return nil, &ChargeError{Formula: formula, Detail: fmt.Sprintf("%s must be a cation and %s an anion", c.Cation.Ion.Symbol, c.Anion.Ion.Symbol)}
	}
	c.MolarMass = molarMass(db, c.Cation, c.Anion)
	if c.Settings.Structure.Empty() && c.Compound.Structure != "" && !c.Settings.noStructure {
		c.Settings.Structure = Structure{Prototype: c.Compound.Structure, Params: cloneParams(c.Compound.Params), FromData: true}
	}
	// Room for each ionization and attachment, an atomization with one
	// sub-step per side, the lattice and the formation (more, as for Br₂(l),
	// only costs a reallocation).
	n := 6 + c.Cation.Ion.Charge - c.Anion.Ion.Charge
	b := builder{db: db, c: c, route: opt.AnionValue, steps: make([]Step, 0, n), refs: make([]Entry, 0, n)}
	b.side(SideCation)
	b.side(SideAnion)
	b.compoundSteps()
	c.Steps = b.steps
	// The data values are 0 K / ΔH_L; convert to the conventions asked for.
	c.Conventions = Conventions{}
	c.SetConventions(opt.Conventions)
	c.refreshComposites()
	return c, nil
}

func cloneParams(p map[string]float64) map[string]float64 {
	if p == nil {
		return nil
	}
	d := make(map[string]float64, len(p))
	for k, v := range p {
		d[k] = v
	}
	return d
}

type builder struct {
	db    *data.DB
	c     *Cycle
	route AnionValue
	steps []Step
	// refs holds the steps' reference entries in one allocation. Should it
	// outgrow its capacity, append moves it and the pointers handed out
	// before keep the old array: each still points at its own entry.
	refs []Entry
}

// ref stores e among the cycle's reference entries and returns its address.
func (b *builder) ref(e Entry) *Entry {
	b.refs = append(b.refs, e)
	return &b.refs[len(b.refs)-1]
}

func (b *builder) source(v data.Value) Source {
	s := Source{Kind: SourceData, Key: v.Source, Memory: v.Memory, Derived: v.Derived, Override: v.Override, Note: v.Note}
	if src, err := b.db.Source(v.Source); err == nil {
		s.Citation = src.Citation
	}
	return s
}

// entry converts a data value to kJ/mol with its uncertainty, using def
// (kJ/mol) when the source states none.
func (b *builder) entry(v data.Value, def float64) Entry {
	val, unc := v.V, v.U
	if v.Unit == "eV" {
		val, unc = thermo.EVToKJPerMol(v.V), thermo.EVToKJPerMol(v.U)
	}
	e := Entry{Value: val, Uncertainty: math.Abs(unc), Source: b.source(v)}
	if !(e.Uncertainty > 0) {
		e.Uncertainty = def
		e.Source.DefaultUncertainty = true
	}
	return e
}

func (b *builder) add(s Step, v *data.Value, def float64) {
	if v != nil && v.Known() {
		e := b.entry(*v, def)
		s.Value, s.Uncertainty, s.Source = e.Value, e.Uncertainty, e.Source
		s.Reference = b.ref(e)
	} else if !s.Composite {
		s.Source = Source{Kind: SourceMissing}
	}
	b.steps = append(b.steps, s)
}

var ordinals = []string{"zeroth", "first", "second", "third", "fourth", "fifth", "sixth", "seventh", "eighth"}

func ordinal(i int) string {
	if i >= 0 && i < len(ordinals) {
		return ordinals[i]
	}
	return strconv.Itoa(i) + "th"
}

func (b *builder) side(side Side) {
	p, suffix := b.c.Cation, "cation"
	if side == SideAnion {
		p, suffix = b.c.Anion, "anion"
	}
	count := float64(p.Count)
	if p.Ion.Polyatomic {
		s := Step{Key: "ion-formation-" + suffix, Kind: KindIonFormation, Side: side, Multiplicity: count,
			Label:    "standard enthalpy of formation of gaseous " + p.Ion.Symbol,
			Reaction: ionFormationReaction(b.db, p.Ion)}
		v := &p.Ion.GasFormation
		if !v.Known() {
			if fit, ok := b.db.DerivedIon(p.Ion.Symbol); ok {
				b.c.Fitted = append(b.c.Fitted, fit)
				v = &fit.GasFormation
			}
		}
		b.add(s, v, DefaultIonFormation)
		if last := &b.steps[len(b.steps)-1]; v.Source == data.FamilyFitSource && last.Reference != nil {
			fit := b.c.Fitted[len(b.c.Fitted)-1]
			last.Source = fittedSource(b.db, fit)
			last.Reference.Source = last.Source
		}
		// The tabulated value counts the thermal electron (298.15 K
		// convention); the cycle is built in the 0 K convention.
		last := &b.steps[len(b.steps)-1]
		if d := b.c.shift(last, Conventions{}); last.Reference != nil {
			last.Value += d
			last.Reference.Value += d
		}
		return
	}
	el, err := b.db.Element(p.Ion.Core)
	if err != nil {
		el = data.Element{Symbol: p.Ion.Core}
	}
	b.atomization(side, suffix, el, count)
	if side == SideCation {
		for i := 1; i <= p.Ion.Charge; i++ {
			s := Step{Key: "ionization-" + strconv.Itoa(i), Kind: KindIonization, Side: side, Order: i, Multiplicity: count,
				Label:    ordinal(i) + " ionization energy of " + el.Symbol,
				Reaction: el.Symbol + chargeText(i-1) + "(g) → " + el.Symbol + chargeText(i) + "(g) + e⁻"}
			var v *data.Value
			if i <= len(el.Ionization) {
				v = &el.Ionization[i-1]
			}
			b.add(s, v, thermo.EVToKJPerMol(DefaultIonizationUncertaintyEV))
		}
		return
	}
	b.anionAttachments(p, el, b.route)
}

// atomization adds atomization-<suffix> and its sub-steps.
func (b *builder) atomization(side Side, suffix string, el data.Element, count float64) {
	state := el.StandardState
	formula, atoms, phase := splitState(state, el.Symbol)
	if phase == "(g)" && atoms == 1 {
		return // a monatomic gas is already gaseous atoms
	}
	reaction := coefficient(1/float64(atoms)) + subscriptDigits(formula) + phase + " → " + el.Symbol + "(g)"
	s := Step{Key: "atomization-" + suffix, Kind: KindAtomization, Side: side, Multiplicity: count,
		Label: "atomization of " + el.Symbol + " (ΔfH° of the gaseous atom)", Reaction: reaction}
	subs := b.db.AtomizationSteps(el.Symbol)
	if len(subs) == 0 || (len(subs) == 1 && subs[0].AtomsProduced == 1) {
		b.add(s, &el.Atomization, DefaultEnthalpy)
		return
	}
	s.Composite = true
	s.Source = Source{Kind: SourceSum, Citation: "sum of its sub-steps"}
	if el.Atomization.Known() {
		e := b.entry(el.Atomization, DefaultEnthalpy)
		s.Reference = b.ref(e)
		s.Value, s.Uncertainty = e.Value, e.Uncertainty
	}
	b.steps = append(b.steps, s)
	seen := map[string]int{}
	for _, sub := range subs {
		key := sub.Kind + "-" + suffix
		if seen[key]++; seen[key] > 1 {
			key = sub.Kind + "-" + strconv.Itoa(seen[key]) + "-" + suffix
		}
		atomsBy := sub.AtomsProduced
		if atomsBy <= 0 {
			atomsBy = 1
		}
		kind := KindSublimation
		switch sub.Kind {
		case "vaporization":
			kind = KindVaporization
		case "dissociation":
			kind = KindDissociation
		}
		ss := Step{Key: key, Kind: kind, Side: side, Multiplicity: count / float64(atomsBy), Parent: s.Key,
			Label:    sub.Kind + " of " + el.Symbol + " (sub-step of its atomization)",
			Reaction: prettyReaction(sub.Reaction)}
		v := sub.Enthalpy
		b.add(ss, &v, DefaultEnthalpy)
	}
}

func (b *builder) compoundSteps() {
	c := b.c
	solid := subscriptDigits(c.Formula) + "(s)"
	lat := Step{Key: "lattice", Kind: KindLattice, Side: SideCompound, Multiplicity: 1, Unknown: true,
		Label: "lattice step of " + c.Formula + " (gaseous ions → solid)",
		Reaction: countPrefix(c.Cation.Count) + subscriptDigits(c.Cation.Ion.Core) + chargeText(c.Cation.Ion.Charge) + "(g) + " +
			countPrefix(c.Anion.Count) + subscriptDigits(c.Anion.Ion.Core) + chargeText(c.Anion.Ion.Charge) + "(g) → " + solid}
	if h := c.Compound.HandbookLattice; h.Known() && h.V > 0 {
		e := b.entry(h, DefaultLatticeRelative*h.V)
		e.Value = -h.V // tabulated for the dissociation; the step is the reverse
		if c.Compound.LatticeConvention == "U" {
			// Stored as ΔH_L (the base); SetConventions shifts it back for U.
			e.Value -= c.LatticeCorrection()
		}
		e.Source.Note = strings.TrimSpace("handbook lattice value (" + c.Compound.LatticeConvention + "), used when another step is solved. " + e.Source.Note)
		lat.Reference = b.ref(e)
		lat.Value, lat.Uncertainty, lat.Source = e.Value, e.Uncertainty, e.Source
	} else {
		lat.Source = Source{Kind: SourceMissing}
	}
	b.steps = append(b.steps, lat)
	f := Step{Key: "formation", Kind: KindFormation, Side: SideCompound, Multiplicity: 1,
		Label:    "standard enthalpy of formation of " + c.Formula,
		Reaction: formationReaction(b.db, c) + " → " + solid}
	b.add(f, &c.Compound.Formation, DefaultEnthalpy)
}

// hypothetical finds the ions of a formula that is not tabulated (or whose
// ions the options override).
func (c *Cycle) hypothetical(db *data.DB, formula string, opt Options) error {
	comp, parts, err := parseParts(formula)
	// Suggestions only when an error is returned: building them for every
	// formula the tables lack would dominate a batch run.
	suggestions := func() []string { return db.SuggestCompounds(formula) }
	if err != nil {
		// Not a formula at all (a hydrate, a full-width letter, a stray
		// character): the formula reader says what and where, with its
		// hint, and no tabulated compound is a useful suggestion.
		var fe *notation.FormulaError
		if errors.As(err, &fe) {
			return &CompoundError{Formula: formula, Reason: "not a formula: " + fe.Detail()}
		}
		reason := "not in the data and not a simple binary formula MₐXᵦ; give its cation and anion with their charges (for example Mg2+ and Cl-)"
		if opt.Cation != "" && opt.Anion != "" {
			reason = "cannot read the formula"
		}
		return &CompoundError{Formula: formula, Reason: reason, Err: err, Suggestions: suggestions()}
	}
	ion := func(sym string) (data.Ion, error) {
		if in, ok := db.FindIon(sym); ok {
			return in, nil
		}
		read, ok := notation.ParseIon(sym)
		core, z := read.Core, read.Charge
		if !ok {
			return data.Ion{}, &CompoundError{Formula: formula, Reason: fmt.Sprintf("cannot read ion %q (write it like Mg+ or O2-)", sym)}
		}
		if !notation.IsElementSymbol(core) {
			return data.Ion{}, &CompoundError{Formula: formula, Reason: fmt.Sprintf("ion %q is not in the data and %q is not an element", sym, core)}
		}
		return hypotheticalIon(db, sym, core, z), nil
	}
	var cat, an data.Ion
	switch {
	case opt.Cation != "" && opt.Anion != "":
		if cat, err = ion(opt.Cation); err != nil {
			return err
		}
		if an, err = ion(opt.Anion); err != nil {
			return err
		}
	default:
		bracketed := slices.ContainsFunc(parts, func(p formulaPart) bool { return p.bracketed })
		switch {
		case bracketed && len(parts) != 2:
			return &CompoundError{Formula: formula, Reason: fmt.Sprintf("not in the data, and %d parts where a compound of one cation and one anion has 2", len(parts)), Suggestions: suggestions()}
		case bracketed:
		case len(comp) != 2:
			return &CompoundError{Formula: formula, Reason: fmt.Sprintf("not in the data, and %d elements where a binary compound has 2", len(comp)), Suggestions: suggestions()}
		default:
			parts = []formulaPart{{core: comp[0].Symbol, count: comp[0].Count}, {core: comp[1].Symbol, count: comp[1].Count}}
		}
		cat, an, err = pickIons(db, formula, parts[0], parts[1], opt)
		if err != nil {
			return err
		}
	}
	if cat.Charge <= 0 || an.Charge >= 0 {
		return &ChargeError{Formula: formula, Detail: fmt.Sprintf("%s must be a cation and %s an anion", cat.Symbol, an.Symbol)}
	}
	g := notation.GCD(cat.Charge, -an.Charge)
	a, bb := -an.Charge/g, cat.Charge/g
	if comp != nil {
		ca, cb, ok := ionCounts(comp, cat.Core, an.Core)
		if !ok || ca*cat.Charge+cb*an.Charge != 0 {
			return &ChargeError{Formula: formula, Detail: fmt.Sprintf("%s and %s cannot make %s (they balance as %s%s)",
				cat.Symbol, an.Symbol, formula, partText(cat.Core, a), partText(an.Core, bb))}
		}
		a, bb = ca, cb
	}
	c.Formula = formula
	c.Cation = Part{Ion: cat, Count: a}
	c.Anion = Part{Ion: an, Count: bb}
	return nil
}
