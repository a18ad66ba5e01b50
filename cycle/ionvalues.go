package cycle

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo"
)

// AnionValue chooses where the gas-phase enthalpy of a multiply charged
// monatomic anion (O²⁻, S²⁻) comes from, the one value no measurement gives.
type AnionValue string

const (
	// AnionFitted (the default; the zero value means it too) takes the
	// ion's gas-phase enthalpy fitted over its family of salts
	// (data.DerivedIon): one step covers the electrons no measured electron
	// affinity accounts for.
	AnionFitted AnionValue = "fitted"
	// AnionTextbook takes the second electron affinity of the data's
	// affinity table (O⁻ → O²⁻ +844 kJ/mol, S⁻ → S²⁻ +532 kJ/mol: one
	// textbook's cycle-derived values) where it has one.
	AnionTextbook AnionValue = "textbook"
)

// AnionValueNames lists the choices in display order.
func AnionValueNames() []string { return []string{string(AnionFitted), string(AnionTextbook)} }

// ParseAnionValue reads "fitted" or "textbook".
func ParseAnionValue(s string) (AnionValue, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", string(AnionFitted):
		return AnionFitted, nil
	case string(AnionTextbook):
		return AnionTextbook, nil
	}
	return "", &AnionValueError{Text: s}
}

// AnionValueError reports a choice of anion value that is neither
// AnionFitted nor AnionTextbook.
type AnionValueError struct{ Text string }

func (e *AnionValueError) Error() string {
	return fmt.Sprintf("anion value %q: the choices are %s", e.Text, strings.Join(AnionValueNames(), " and "))
}

// Unwrap makes errors.Is(err, ErrBadSetting) hold.
func (e *AnionValueError) Unwrap() error { return ErrBadSetting }

// attachmentKey names the attachment step that adds electrons from..to
// ("attachment-2"; "attachment-1-3" for N(g) + 3e⁻ → N³⁻(g)).
func attachmentKey(from, to int) string {
	if from == to {
		return "attachment-" + strconv.Itoa(from)
	}
	return "attachment-" + strconv.Itoa(from) + "-" + strconv.Itoa(to)
}

// electrons is how many electrons an ionization or attachment step moves.
func (s *Step) electrons() float64 {
	if s.Electrons > 1 {
		return float64(s.Electrons)
	}
	return 1
}

// anionAttachments adds the attachment steps of a monatomic anion: the
// measured electron affinities, then either the textbook second affinity
// (AnionTextbook, where the data have one) or one step for the remaining
// electrons, valued from the ion's family-fitted gas-phase enthalpy when the
// data have one (missing otherwise, so that it can be solved).
func (b *builder) anionAttachments(p Part, el data.Element, route AnionValue) {
	n := -p.Ion.Charge
	count := float64(p.Count)
	measured := 0
	if el.ElectronAffinity.Known() && !el.ElectronAffinity.Derived {
		measured = 1
	}
	measured = min(measured, n)
	for j := 1; j <= measured; j++ {
		b.singleAttachment(p, el, j, &el.ElectronAffinity, thermo.EVToKJPerMol(DefaultAffinityUncertaintyEV))
	}
	if measured == n {
		return
	}
	k := measured + 1
	fit, hasFit := b.db.DerivedIon(p.Ion.Symbol)
	textbook := k == 2 && el.SecondAffinity.Known()
	if textbook && (route == AnionTextbook || !hasFit) {
		b.c.AnionValue = AnionTextbook
		b.singleAttachment(p, el, 2, &el.SecondAffinity, DefaultDerivedAttachment)
		if !hasFit && route != AnionTextbook {
			last := &b.steps[len(b.steps)-1]
			last.Source.Note = strings.TrimSpace("no family-fitted value of " + p.Ion.Symbol + " in the data: the textbook value is used. " + last.Source.Note)
		}
		for j := 3; j <= n; j++ {
			b.singleAttachment(p, el, j, nil, DefaultDerivedAttachment)
		}
		return
	}
	s := Step{Key: attachmentKey(k, n), Kind: KindAttachment, Side: SideAnion, Order: k, Electrons: n - k + 1, Multiplicity: count,
		Label:    "electron attachment enthalpy of " + el.Symbol + " to " + p.Ion.Symbol + " (no measured electron affinity)",
		Reaction: el.Symbol + chargeText(-(k - 1)) + "(g) + " + countPrefix(n-k+1) + "e⁻ → " + el.Symbol + chargeText(-n) + "(g)"}
	if k == n {
		s.Label = ordinal(k) + " electron attachment enthalpy of " + el.Symbol + " (no measured electron affinity)"
	}
	if !hasFit || !el.Atomization.Known() {
		s.Source = Source{Kind: SourceMissing}
		b.steps = append(b.steps, s)
		return
	}
	b.c.AnionValue = AnionFitted
	b.c.Fitted = append(b.c.Fitted, fit)
	// ΔfH°(Xⁿ⁻, g) = ΔfH°(X, g) + Σ attachment enthalpies at 298.15 K with a
	// thermal electron (−EAⱼ − 5/2·RT each); the step is stored at 0 K, as
	// the measured affinities are (+5/2·RT per electron it adds).
	h := freeElectronEnthalpy()
	base := fit.GasFormation.V - b.entry(el.Atomization, DefaultEnthalpy).Value
	for j := 1; j < k; j++ {
		base -= -thermo.EVToKJPerMol(el.ElectronAffinity.V) - h
	}
	e := Entry{Value: base + float64(n-k+1)*h, Uncertainty: fit.GasFormation.U, Source: fittedSource(b.db, fit)}
	s.Value, s.Uncertainty, s.Source = e.Value, e.Uncertainty, e.Source
	s.Reference = b.ref(e)
	b.steps = append(b.steps, s)
}

// singleAttachment adds attachment step j from an electron affinity v (nil
// or unknown: missing).
func (b *builder) singleAttachment(p Part, el data.Element, j int, v *data.Value, def float64) {
	s := Step{Key: attachmentKey(j, j), Kind: KindAttachment, Side: SideAnion, Order: j, Multiplicity: float64(p.Count),
		Label:    ordinal(j) + " electron attachment enthalpy of " + el.Symbol + " (minus the " + ordinal(j) + " electron affinity)",
		Reaction: el.Symbol + chargeText(-(j - 1)) + "(g) + e⁻ → " + el.Symbol + chargeText(-j) + "(g)"}
	if v != nil && v.Known() {
		neg := *v // attachment enthalpy = −(electron affinity)
		neg.V = -neg.V
		v = &neg
	}
	b.add(s, v, def)
}

// fittedSource is the provenance of a family-fitted ion value.
func fittedSource(db *data.DB, fit data.DerivedIon) Source {
	s := Source{Kind: SourceData, Key: data.FamilyFitSource, Derived: true, Override: fit.GasFormation.Override,
		Note: fmt.Sprintf("family fit of ΔfH°(%s, g) = %s kJ/mol over %d salts (%s)", fit.Ion, pm(fit.GasFormation.V,
			fit.GasFormation.U), len(fit.Salts), fit.Model)}
	if src, err := db.Source(data.FamilyFitSource); err == nil {
		s.Citation = src.Citation
	}
	return s
}

// IonStep returns the key of the step that carries the part of side's
// gaseous ion no measurement gives: ion-formation-<side> for a polyatomic
// ion, the last attachment step of a monatomic anion. It reports false for
// a monatomic cation (ionization energies are measured).
func (c *Cycle) IonStep(side Side) (string, bool) {
	p := c.Cation
	if side == SideAnion {
		p = c.Anion
	}
	if p.Ion.Polyatomic {
		return "ion-formation-" + side.String(), true
	}
	if side != SideAnion {
		return "", false
	}
	key := ""
	for i := range c.Steps {
		if c.Steps[i].Kind == KindAttachment && c.Steps[i].Side == SideAnion {
			key = c.Steps[i].Key
		}
	}
	return key, key != ""
}

// IonEnthalpy returns ΔfH°(ion, g, 298.15 K) of side's ion per ion, in the
// thermal-electron convention of the NBS tables, from the steps of a solved
// cycle r of c: the atomization and attachments of a monatomic anion, or
// the ion-formation step of a polyatomic ion, at their 298.15 K values.
// The uncertainty is that of side's unmeasured step (IonStep), the part
// that carries the cycle's other uncertainties when that step was solved.
func (c *Cycle) IonEnthalpy(r *Result, side Side) (value, uncertainty float64) {
	w := *c
	w.Steps = r.Steps
	p := c.Cation
	if side == SideAnion {
		p = c.Anion
	}
	key, _ := c.IonStep(side)
	for i := range w.Steps {
		s := &w.Steps[i]
		if s.Side != side || !w.inSum(i) {
			continue
		}
		value += s.Multiplicity / float64(p.Count) * (s.Value - w.shift(s, r.Conventions))
		if s.Key == key {
			uncertainty = s.Uncertainty * s.Multiplicity / float64(p.Count)
		}
	}
	return value, uncertainty
}

// Circularity says that a cycle's comparison with the lattice models is not
// independent: it uses an ion value fitted to this very salt with a model.
type Circularity struct {
	// Ion is the fitted ion, Model the model of its fit, Salts the number
	// of salts in the fit.
	Ion, Model string
	Salts      int
}

// circularity returns the fitted ion values c uses that were fitted to c's
// own compound.
func (c *Cycle) circularity() []Circularity {
	var out []Circularity
	if !c.Tabulated {
		return nil
	}
	for _, f := range c.Fitted {
		if f.InFit(c.Formula) {
			out = append(out, Circularity{Ion: f.Ion, Model: f.Model, Salts: len(f.Salts)})
		}
	}
	return out
}

// AnionValueEffect is how much the choice of a multiply charged anion's
// value moves a cycle's result.
type AnionValueEffect struct {
	// InForce is the choice the cycle uses; Other the alternative.
	InForce, Other AnionValue
	// Step is the key of the step the choice sets, and InForceValue,
	// OtherValue its value under each (kJ/mol per reaction as written).
	Step                     string
	InForceValue, OtherValue float64
	// Shift is (solved value with Other) − (solved value with InForce) of
	// the solved step, kJ/mol; Solved names it.
	Solved string
	Shift  float64
}

// AnionValueChoice compares c (solved as r) with the same cycle built with
// the other anion value. It returns nil when c's anion has no choice (a
// measured anion, a polyatomic one, or only one of the two values known).
func AnionValueChoice(db *data.DB, c *Cycle, r *Result) *AnionValueEffect {
	if c.AnionValue == "" || c.Anion.Ion.Polyatomic {
		return nil
	}
	other := AnionTextbook
	if c.AnionValue == AnionTextbook {
		other = AnionFitted
	}
	d := c.Clone()
	// Rebuild the anion side with the other choice, keeping everything else.
	alt, err := Build(db, c.Formula, Options{Cation: c.Cation.Ion.Symbol, Anion: c.Anion.Ion.Symbol, AnionValue: other,
		Conventions: c.Conventions, Settings: c.Settings, Memo: c.Memo()})
	if err != nil || alt.AnionValue != other {
		return nil
	}
	key, _ := alt.IonStep(SideAnion)
	as, ok1 := alt.Step(key)
	cs, ok2 := c.Step(key)
	if !ok1 || !ok2 || as.Source.Kind == SourceMissing || cs.Source.Kind == SourceMissing {
		return nil
	}
	eff := &AnionValueEffect{InForce: c.AnionValue, Other: other, Step: key, InForceValue: cs.Value, OtherValue: as.Value, Solved: r.Solved.Key}
	// Same cycle, the one step changed: solve it again.
	if r.Solved.Key == key {
		return eff // the step itself is solved: the choice does not enter
	}
	if err := d.setReference(key, as); err != nil {
		return nil
	}
	r2, err := Solve(d)
	if err != nil {
		return nil
	}
	eff.Shift = r2.Solved.Value - r.Solved.Value
	if math.IsNaN(eff.Shift) {
		return nil
	}
	return eff
}

// setReference gives step key the value and provenance of s, as if built so.
func (c *Cycle) setReference(key string, s *Step) error {
	i, err := c.index(key)
	if err != nil {
		return err
	}
	t := &c.Steps[i]
	if t.Unknown {
		return nil
	}
	t.Value, t.Uncertainty, t.Source = s.Value, s.Uncertainty, s.Source
	return nil
}

// pm writes "v ± u" by the one rule of thermo.UncertaintyDecimals.
func pm(v, u float64) string {
	value, unc := thermo.FormatWithUncertainty(v, u, 1)
	if unc == "" {
		return value
	}
	return value + " ± " + unc
}
