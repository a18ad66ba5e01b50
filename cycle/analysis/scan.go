package analysis

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/thermo/gibbs"
	"enthalpath/thermo/notation"
)

// ScanOptions choose the oxidation states and the model of a scan.
type ScanOptions struct {
	// MaxCharge caps the metal's charge; 0 means as far as the data's
	// ionization energies go (at most DefaultMaxCharge).
	MaxCharge int
	// Anion is the non-metal's ion ("O2-"); "" means the data's monatomic
	// anion of the non-metal (the most charged when there are several).
	Anion string
	// Model and Structure as in EstimateOptions.
	Model, Structure string
	// Temperature (K) of the Gibbs energies and verdicts; 0 means 298.15 K.
	Temperature float64
	// Pressure (bar) of the non-metal given off; 0 means 1 bar.
	Pressure float64
}

// conditions returns the temperature and pressure with their defaults.
func conditions(t, p float64) (float64, float64) {
	if t == 0 {
		t = thermo.StandardTemperature
	}
	if p == 0 {
		p = gibbs.StandardPressure
	}
	return t, p
}

// checkConditions refuses a temperature or pressure that is not positive and finite.
func checkConditions(subject string, t, p float64) error {
	if !(t > 0) || math.IsInf(t, 0) {
		return &InputError{Subject: subject, Field: "temperature", Reason: fmt.Sprintf("%g K is not a positive temperature", t)}
	}
	if !(p > 0) || math.IsInf(p, 0) {
		return &InputError{Subject: subject, Field: "pressure", Reason: fmt.Sprintf("%g bar is not a positive pressure", p)}
	}
	return nil
}

// DefaultMaxCharge is the highest charge a scan tries unless told.
const DefaultMaxCharge = 4

// ScanCompound is one oxidation state of a scan.
type ScanCompound struct {
	Formula string
	// Charge is the metal's oxidation state; MetalCount the metal atoms per
	// formula unit.
	Charge, MetalCount int
	// Estimate is the model estimate of the formation enthalpy (kJ/mol of
	// formula units) with its σ.
	Estimate, EstimateUncertainty float64
	// Measured is the data's formation enthalpy, when tabulated.
	Measured *cycle.Entry
	// Formation is the value the scan compares: Measured when there is
	// one, else Estimate; Uncertainty its σ; FromData says which.
	Formation, Uncertainty float64
	FromData               bool
	// PerMetal is Formation per mole of metal atoms, PerMetalUncertainty its σ.
	PerMetal, PerMetalUncertainty float64
	// Stable reports whether no disproportionation of this state is
	// exothermic (the state lies on the lower convex hull of PerMetal
	// against charge, the metal counted as charge 0 at 0 kJ/mol).
	Stable bool
	// LosesNonMetal reports that a lower state (or the metal) has a more
	// negative formation enthalpy per mole of metal, so this compound would
	// give off non-metal to form it (MgCl₃ → MgCl₂ + ½Cl₂); LowerState names it.
	LosesNonMetal bool
	LowerState    string
	// CationRadius is the radius used for the cation (Å) and where it came from.
	CationRadius Radius
	// Thermo is the compound the scan compares: the real compound's
	// measured data when the data hold it (ionic or molecular), else the
	// ionic estimate; Estimated is always the ionic estimate.
	Thermo, Estimated Thermo
	// Gibbs is ΔfG at the scan's temperature (NaN when an entropy is
	// missing), PerMetalGibbs the same per mole of metal, with σ.
	Gibbs, GibbsUncertainty, PerMetalGibbs, PerMetalGibbsUncertainty float64
	// Releases are the reactions giving off the non-metal to form a lower
	// state (MgCl₃ → MgCl₂ + ½Cl₂).
	Releases []Reaction
	// Undecided: some reaction of this compound lies within 2σ of zero.
	Undecided bool
	Notes     []string
}

// Disproportionation is one reaction between oxidation states, e.g.
// 2 MgCl → Mg + MgCl₂, with its enthalpy.
type Disproportionation struct {
	// Reaction as written in ASCII without states ("2 MgCl -> Mg + MgCl2");
	// Energies.Equation adds the states of liquids and gases.
	Reaction string
	// From is the oxidation state that disproportionates into Lower and Upper.
	From, Lower, Upper int
	// Enthalpy in kJ/mol of the reaction as written, with its σ (inputs
	// treated as independent).
	Enthalpy, Uncertainty float64
	// Favoured is true when the reaction is favoured beyond 2σ (on ΔrG at
	// the scan's temperature, on ΔrH° where an entropy is missing).
	Favoured bool
	// Energies holds ΔrH°, ΔrS°, ΔrG and the verdicts.
	Energies Reaction
}

// Scan is the outcome of an oxidation-state scan.
type Scan struct {
	Metal, NonMetal, Anion string
	// Released is the non-metal as it is given off (Cl2, O2, N2, S): the
	// element in its standard form, for verdicts such as MgCl3 → MgCl2 + ½Cl2.
	Released            string
	Model               string
	Spread              Spread
	Compounds           []ScanCompound
	Disproportionations []Disproportionation
	// Favoured is the formula with the most negative ΔfG per mole of metal
	// at the scan's temperature (ΔfH° when an entropy is missing): the
	// product of the metal burning in excess non-metal; "" when every
	// state is endothermic. FavouredTie names a state within 2σ of it
	// ("" when the lead is beyond 2σ).
	Favoured, FavouredTie string
	// Temperature (K) and Pressure (bar) of the Gibbs energies; Gibbs is
	// false when some entropy was missing and the verdicts are on enthalpy.
	Temperature, Pressure float64
	Gibbs                 bool
	// Skipped lists charges that could not be estimated, with the reason.
	Skipped []string
	Notes   []string
}

// Scan estimates the compounds of metal with nonmetal for each charge of
// the metal from 1 to the maximum, and every disproportionation between
// them (the metal itself counted as the state 0).
func (a *Analyst) Scan(metal, nonmetal string, opt ScanOptions) (*Scan, error) {
	el, err := a.db.Element(metal)
	if err != nil {
		return nil, &InputError{Subject: metal, Field: "metal", Reason: "not an element of the data", Err: err}
	}
	if _, err := a.db.Element(nonmetal); err != nil {
		return nil, &InputError{Subject: nonmetal, Field: "non-metal", Reason: "not an element of the data", Err: err}
	}
	anion := opt.Anion
	if anion == "" {
		if anion, err = a.dataIon(nonmetal, false); err != nil {
			return nil, &InputError{Subject: nonmetal, Field: "non-metal", Reason: "the data have no anion of it; give one with its charge (e.g. " + nonmetal + "-)", Err: err}
		}
	}
	an, err := a.db.Ion(anion)
	if err != nil {
		if in, ok := notation.ParseIon(anion); ok && in.Core == nonmetal && in.Charge < 0 {
			an.Symbol, an.Core, an.Charge = anion, in.Core, in.Charge
		} else {
			return nil, &InputError{Subject: anion, Field: "anion", Reason: "not an anion of " + nonmetal, Err: err}
		}
	}
	if an.Charge >= 0 {
		return nil, &InputError{Subject: anion, Field: "anion", Reason: "is not an anion"}
	}
	maxZ := len(el.Ionization)
	if opt.MaxCharge > 0 {
		if opt.MaxCharge > maxZ {
			return nil, &InputError{Subject: metal, Field: FieldMaxCharge, Reason: fmt.Sprintf("the data have %d ionization energies of %s, so the charge cannot exceed %d", maxZ, metal, maxZ)}
		}
		maxZ = opt.MaxCharge
	} else if maxZ > DefaultMaxCharge {
		maxZ = DefaultMaxCharge
	}
	if maxZ < 1 {
		return nil, &InputError{Subject: metal, Field: "metal", Reason: "the data have no ionization energy of it"}
	}
	model := opt.Model
	if model == "" {
		model = DefaultModel
	}
	temp, pres := conditions(opt.Temperature, opt.Pressure)
	if err := checkConditions(el.Symbol+"/"+nonmetal, temp, pres); err != nil {
		return nil, err
	}
	sc := &Scan{Metal: el.Symbol, NonMetal: nonmetal, Anion: an.Symbol, Model: model, Released: elementalForm(nonmetal),
		Temperature: temp, Pressure: pres, Gibbs: true}
	w := -an.Charge
	for z := 1; z <= maxZ; z++ {
		g := notation.GCD(z, w)
		mc, xc := w/g, z/g
		formula := el.Symbol + countText(mc) + an.Core + countText(xc)
		if an.Polyatomic && xc > 1 {
			formula = el.Symbol + countText(mc) + "(" + an.Core + ")" + countText(xc)
		}
		est, c, err := a.quickEstimateCycle(formula, EstimateOptions{
			Charges: Charges{el.Symbol: z, an.Core: an.Charge}, Model: opt.Model, Structure: opt.Structure})
		if err != nil {
			sc.Skipped = append(sc.Skipped, fmt.Sprintf("%s (charge %+d): %v", formula, z, err))
			continue
		}
		sc.Spread = est.Spread
		switch {
		case sc.Model == cycle.ModelAuto || z == 1:
			sc.Model = est.Model // the model auto chose, when every compound shares it
		case sc.Model != est.Model && model == cycle.ModelAuto:
			sc.Model = "auto (each compound's verdict model)"
		}
		cp := ScanCompound{Formula: est.Formula, Charge: z, MetalCount: mc,
			Estimate: est.Value, EstimateUncertainty: est.Uncertainty, Measured: est.Measured,
			Formation: est.Value, Uncertainty: est.Uncertainty, CationRadius: est.Cation.Radius, Stable: true}
		cp.Estimated = a.estimatedThermo(est, c)
		cp.Thermo = cp.Estimated
		if est.Measured != nil {
			cp.Formation, cp.Uncertainty, cp.FromData = est.Measured.Value, est.Measured.Uncertainty, true
		}
		if est.Cation.Radius.Kind == "neighbour" {
			cp.Notes = append(cp.Notes, est.Cation.Radius.From)
		}
		// The same formula may be a real compound of other ions (KO2 is
		// potassium superoxide, not a K⁴⁺ oxide): say so, lest the row be
		// read as the real compound's.
		cation := el.Symbol + notation.ChargeSuffix(z, false)
		other := false
		if real, ok := a.db.FindCompound(est.Formula); ok && (real.Cation != cation || real.Anion != an.Symbol) {
			other = true
			cp.Notes = append([]string{fmt.Sprintf("%s in the data is %s (%s with %s); this row is the hypothetical compound of %s with %s, a different substance",
				real.Formula, real.Name, real.Cation, real.Anion, cation, an.Symbol)}, cp.Notes...)
		} else if !ok && !an.Polyatomic && a.groupAnionFits(an.Core, xc) {
			// Not in the data, but the formula alone reads otherwise (MgO₂
			// as magnesium peroxide, Mg²⁺ with O₂²⁻): only a group anion
			// of the element can make it so.
			if read, err := a.build(est.Formula, "", ""); err == nil && (read.Cation.Ion.Symbol != cation || read.Anion.Ion.Symbol != an.Symbol) {
				cp.Notes = append([]string{fmt.Sprintf("%s as written reads as %s with %s (the estimate and stability analyses take that reading); this row is the hypothetical compound of %s with %s, a different substance",
					est.Formula, read.Cation.Ion.Symbol, read.Anion.Ion.Symbol, cation, an.Symbol)}, cp.Notes...)
			}
		}
		if known, ok := a.knownThermo(est.Formula); ok && !other && known.Formation.Known() {
			// The real compound enters with its measured values, ionic or not.
			cp.Thermo = known
			cp.Formation, cp.Uncertainty, cp.FromData = known.Formation.Value, known.Formation.Uncertainty, true
			if known.Molecular {
				cp.Notes = append(cp.Notes, fmt.Sprintf("%s is a molecular %s, not an ionic solid: its measured values enter here; the ionic estimate, ΔfH° %.1f ± %.1f kJ/mol, is of a hypothetical ionic %s and not of the real compound",
					known.Formula, stateWord(known.State), cp.Estimate, cp.EstimateUncertainty, known.Formula))
			}
		}
		cp.PerMetal = cp.Formation / float64(mc)
		cp.PerMetalUncertainty = cp.Uncertainty / float64(mc)
		cp.Gibbs, cp.GibbsUncertainty = cp.Thermo.GibbsAt(temp)
		cp.PerMetalGibbs, cp.PerMetalGibbsUncertainty = cp.Gibbs/float64(mc), cp.GibbsUncertainty/float64(mc)
		if math.IsNaN(cp.Gibbs) {
			sc.Gibbs = false
		}
		sc.Compounds = append(sc.Compounds, cp)
	}
	if len(sc.Compounds) == 0 {
		return nil, &InputError{Subject: el.Symbol + "/" + nonmetal, Reason: "no oxidation state could be estimated: " + strings.Join(sc.Skipped, "; ")}
	}
	sc.disproportionations(a)
	sc.releases(a, an.Core == nonmetal)
	sc.favoured()
	if sc.Gibbs {
		sc.Notes = append(sc.Notes, fmt.Sprintf("Gibbs energies at %s K with the heat capacities neglected (ΔrH° and ΔrS° kept at their 298.15 K values) unless every species of a reaction, or a measured compound and its elements, have NASA Glenn polynomials; a gas given off at %g bar", formatKelvin(sc.Temperature), sc.Pressure))
	} else {
		sc.Notes = append(sc.Notes, "entropy is not included: a standard entropy is missing, so these verdicts are on enthalpies; a disproportionation that releases little heat may still be reversed by entropy")
	}
	sc.Notes = append(sc.Notes,
		fmt.Sprintf("a reaction is called favoured or disfavoured only when it lies more than %g σ from zero; otherwise it is undecided within the data", gibbs.Coverage),
		"each compound uses its measured values where the data have them (ionic or molecular), else the ionic estimate (entropy from the volume-based line)")
	if sc.correlated() {
		sc.Notes = append(sc.Notes, "σ of a reaction between estimates: a datum two estimates share counts once, the lattice model's family bias is one error for all of them, and its scatter about that bias is independent between oxidation states (different cations)")
	} else {
		sc.Notes = append(sc.Notes, "uncertainties of a reaction combine its compounds' σ as independent")
	}
	return sc, nil
}

// groupAnionFits reports whether the data hold a homonuclear group anion
// of element el (el₂, el₃, …) whose atom count divides n.
func (a *Analyst) groupAnionFits(el string, n int) bool {
	for k := 2; k <= n; k++ {
		if n%k != 0 {
			continue
		}
		for _, in := range a.db.IonsOf(el + strconv.Itoa(k)) {
			if in.Polyatomic && in.Charge < 0 {
				return true
			}
		}
	}
	return false
}

// correlated reports whether some reaction of the scan combined the σ of
// two or more estimates (correlation.go).
func (sc *Scan) correlated() bool {
	for _, d := range sc.Disproportionations {
		if d.Energies.Correlated {
			return true
		}
	}
	for _, c := range sc.Compounds {
		for _, r := range c.Releases {
			if r.Correlated {
				return true
			}
		}
	}
	return false
}

// formatKelvin writes a temperature without needless decimals.
func formatKelvin(t float64) string { return strconv.FormatFloat(t, 'f', -1, 64) }

// scanState is one oxidation state of a scan; the metal is state 0.
type scanState struct {
	z, mc    int
	th       Thermo
	compound int // index in Compounds, −1 for the metal
}

func (sc *Scan) states(a *Analyst) []scanState {
	states := []scanState{{z: 0, mc: 1, th: a.elementThermo(sc.Metal, 1), compound: -1}}
	states[0].th.Formula = sc.Metal
	for i, c := range sc.Compounds {
		states = append(states, scanState{z: c.Charge, mc: c.MetalCount, th: c.Thermo, compound: i})
	}
	return states
}

// disproportionations fills every reaction q → p + r with 0 ≤ p < q < r
// among the states (0 is the metal) and the stability flags.
func (sc *Scan) disproportionations(a *Analyst) {
	states := sc.states(a)
	for q := 1; q < len(states); q++ {
		for p := 0; p < q; p++ {
			for r := q + 1; r < len(states); r++ {
				P, Q, R := states[p], states[q], states[r]
				// (R.z−P.z) metal atoms in state q → (R.z−Q.z) in p + (Q.z−P.z) in r;
				// formula units: metal atoms / metal per formula, made whole.
				nq, np, nr := R.z-P.z, R.z-Q.z, Q.z-P.z
				l := lcm(lcm(P.mc, Q.mc), R.mc)
				fq, fp, fr := nq*l/Q.mc, np*l/P.mc, nr*l/R.mc
				g := notation.GCD(notation.GCD(fq, fp), fr)
				fq, fp, fr = fq/g, fp/g, fr/g
				rx := newReaction("disproportionation",
					[]Term{{Coefficient: float64(fq), Thermo: Q.th}},
					[]Term{{Coefficient: float64(fp), Thermo: P.th}, {Coefficient: float64(fr), Thermo: R.th}},
					sc.Temperature, sc.Pressure)
				d := Disproportionation{Reaction: fmt.Sprintf("%s%s -> %s%s + %s%s", coef(fq), Q.th.Formula, coef(fp), P.th.Formula, coef(fr), R.th.Formula),
					From: Q.z, Lower: P.z, Upper: R.z,
					Enthalpy: rx.Standard.Enthalpy, Uncertainty: rx.Standard.EnthalpyUncertainty,
					Favoured: rx.Verdict == gibbs.Favoured, Energies: rx}
				c := &sc.Compounds[Q.compound]
				if d.Favoured {
					c.Stable = false
				}
				if rx.Verdict == gibbs.Undecided {
					c.Undecided = true
				}
				sc.Disproportionations = append(sc.Disproportionations, d)
			}
		}
	}
}

// releases fills, for each compound, the reactions giving off the
// non-metal to form each lower compound (monatomic anions only).
func (sc *Scan) releases(a *Analyst, monatomic bool) {
	if !monatomic {
		return
	}
	atoms := 1
	if sc.Released != sc.NonMetal {
		atoms = 2
	}
	gas := a.elementThermo(sc.NonMetal, atoms)
	released := gasElement(sc.NonMetal)
	if released {
		gas.State = "g"
	}
	states := sc.states(a)
	for q := 2; q < len(states); q++ {
		Q := states[q]
		c := &sc.Compounds[Q.compound]
		best := math.Inf(1)
		for p := 1; p < q; p++ {
			P := states[p]
			l := lcm(P.mc, Q.mc)
			fq, fp := l/Q.mc, l/P.mc
			// non-metal atoms given off: l metal atoms × (z_q − z_p)/|z_anion|.
			x := float64(l*(Q.z-P.z)) / float64(sc.anionCharge()) / float64(atoms)
			rx := newReaction("loss of "+sc.Released,
				[]Term{{Coefficient: float64(fq), Thermo: Q.th}},
				[]Term{{Coefficient: float64(fp), Thermo: P.th}, {Coefficient: x, Thermo: gas, Released: released}},
				sc.Temperature, sc.Pressure)
			c.Releases = append(c.Releases, rx)
			if rx.Verdict == gibbs.Undecided {
				c.Undecided = true
			}
			per := rx.Gibbs / float64(fq)
			if !rx.EntropyKnown {
				per = rx.Standard.Enthalpy / float64(fq)
			}
			if rx.Verdict == gibbs.Favoured && per < best {
				best, c.LosesNonMetal, c.LowerState = per, true, P.th.Formula
			}
		}
	}
}

// anionCharge is |z| of the scan's anion.
func (sc *Scan) anionCharge() int {
	in, ok := notation.ParseIon(sc.Anion)
	z := in.Charge
	if !ok || z == 0 {
		return 1
	}
	if z < 0 {
		return -z
	}
	return z
}

// favoured sets Favoured (most negative ΔfG, or ΔfH°, per metal) and
// FavouredTie (the runner-up when within 2σ of it).
func (sc *Scan) favoured() {
	per := func(c ScanCompound) (float64, float64) {
		if sc.Gibbs {
			return c.PerMetalGibbs, c.PerMetalGibbsUncertainty
		}
		return c.PerMetal, c.PerMetalUncertainty
	}
	best, bv := -1, 0.0
	for i, c := range sc.Compounds {
		if v, _ := per(c); v < bv {
			best, bv = i, v
		}
	}
	if best < 0 {
		return
	}
	sc.Favoured = sc.Compounds[best].Formula
	_, bu := per(sc.Compounds[best])
	tie, tieGap := "", math.Inf(1)
	for i, c := range sc.Compounds {
		if i == best {
			continue
		}
		v, u := per(c)
		gap := v - bv
		if gibbs.Judge(-gap, math.Hypot(u, bu)) != gibbs.Favoured && gap < tieGap {
			tie, tieGap = c.Formula, gap
		}
	}
	sc.FavouredTie = tie
}

// gasElement reports whether the element's standard state at 298.15 K is a gas.
func gasElement(symbol string) bool {
	switch symbol {
	case "H", "N", "O", "F", "Cl", "He", "Ne", "Ar", "Kr", "Xe", "Rn":
		return true
	}
	return false
}

func coef(n int) string {
	if n == 1 {
		return ""
	}
	return fmt.Sprintf("%d ", n)
}

func countText(n int) string {
	if n == 1 {
		return ""
	}
	return fmt.Sprint(n)
}

func lcm(a, b int) int { return a / notation.GCD(a, b) * b }

// elementalForm returns the element as it is given off in its standard
// state: the diatomic gases and halogens as X2, every other element as its
// symbol.
func elementalForm(symbol string) string {
	switch symbol {
	case "H", "N", "O", "F", "Cl", "Br", "I":
		return symbol + "2"
	}
	return symbol
}
