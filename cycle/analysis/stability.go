package analysis

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"enthalpath/cycle"
	"enthalpath/thermo"
	"enthalpath/thermo/gibbs"
	"enthalpath/thermo/notation"
)

// StabilityOptions choose a stability analysis.
type StabilityOptions struct {
	// Estimate chooses the ions, model and structure of the estimates.
	Estimate EstimateOptions
	// Temperature (K) of the verdicts, 0 meaning 298.15 K; Pressure (bar)
	// of every gas given off, 0 meaning 1 bar.
	Temperature, Pressure float64
	// From and To (K) bound the ΔrG(T) curves (0: 298.15 and 1600 K);
	// Points is how many temperatures they take (0: 27).
	From, To float64
	Points   int
	// EstimateOnly leaves out the measured data of the compound itself
	// (its ΔfH°, S°, ΔfG°) and of the solid it decomposes into, and uses
	// the estimates of both, their lattice steps from one model
	// (ReactionModel unless Estimate.Model names another); the gases keep
	// their measured values.
	EstimateOnly bool
}

// Curve range defaults.
const (
	DefaultCurveTo     = 1600.0
	DefaultCurvePoints = 27
)

// Stability is a compound's decompositions and disproportionations with
// ΔrH°, ΔrG(T) and honest verdicts.
type Stability struct {
	Formula string
	// Compound is the compound as compared: measured where the data hold
	// it (unless EstimateOnly), else the ionic estimate; Estimate is the
	// ionic estimate (nil when it could not be made, EstimateError why).
	Compound      Thermo
	Estimate      *Thermo
	EstimateError error
	Reactions     []Reaction
	// Curves holds ΔrG(T) of each reaction (same order; nil without entropy).
	Curves                [][]gibbs.Point
	Temperature, Pressure float64
	From, To              float64
	Notes                 []string
}

// gasRelease is the decomposition of an anion that gives off gases:
// per anion, Yield mol of the product anion and the gases.
type gasRelease struct {
	Product string
	Yield   float64
	Gases   []gasAmount
}

type gasAmount struct {
	Formula string
	Amount  float64
}

// releaseOf returns how the anion decomposes with a cation of charge z
// (the textbook decompositions; common practice, no source).
func releaseOf(anion string, z int) (gasRelease, bool) {
	switch anion {
	case "CO3^2-":
		return gasRelease{"O2-", 1, []gasAmount{{"CO2", 1}}}, true
	case "O2^2-":
		return gasRelease{"O2-", 1, []gasAmount{{"O2", 0.5}}}, true
	case "O2^-":
		return gasRelease{"O2^2-", 0.5, []gasAmount{{"O2", 0.5}}}, true
	case "SO4^2-":
		return gasRelease{"O2-", 1, []gasAmount{{"SO3", 1}}}, true
	case "OH-":
		return gasRelease{"O2-", 0.5, []gasAmount{{"H2O", 0.5}}}, true
	case "NO3-":
		if z == 1 {
			return gasRelease{"NO2-", 1, []gasAmount{{"O2", 0.5}}}, true
		}
		return gasRelease{"O2-", 0.5, []gasAmount{{"NO2", 1}, {"O2", 0.25}}}, true
	}
	return gasRelease{}, false
}

// Stability analyses formula: its gas-releasing decomposition (carbonate,
// peroxide, superoxide, sulfate, hydroxide, nitrate), and for a binary
// compound the disproportionations and losses of the non-metal among the
// metal's oxidation states.
func (a *Analyst) Stability(formula string, opt StabilityOptions) (*Stability, error) {
	temp, pres := conditions(opt.Temperature, opt.Pressure)
	if err := checkConditions(formula, temp, pres); err != nil {
		return nil, err
	}
	from, to, n := opt.From, opt.To, opt.Points
	if from == 0 {
		from = thermo.StandardTemperature
	}
	if to == 0 {
		to = math.Max(DefaultCurveTo, from+100)
	}
	if n == 0 {
		n = DefaultCurvePoints
	}
	if !(from > 0) || !(to > from) || math.IsInf(to, 0) || n < 2 || n > 10000 {
		return nil, &InputError{Subject: formula, Field: "temperature range", Reason: fmt.Sprintf("%g to %g K in %d points: give 0 < from < to and 2 to 10000 points", from, to, n)}
	}
	st := &Stability{Temperature: temp, Pressure: pres, From: from, To: to}
	if opt.EstimateOnly {
		if m := strings.ToLower(strings.TrimSpace(opt.Estimate.Model)); m == "" || m == cycle.ModelAuto {
			opt.Estimate.Model = ReactionModel
		}
		st.Notes = append(st.Notes, fmt.Sprintf("estimates alone: the compound and the solid it decomposes into are both estimated, their lattice steps from the %s model, so that the model's bias and the cation's data cancel in ΔrH and in its σ; the gases keep their measured values", opt.Estimate.Model))
	}
	c, err := a.cycleOf(formula, opt.Estimate.Charges)
	if err != nil {
		return nil, err
	}
	st.Formula = c.Formula
	est, ec, estErr := a.quickEstimateCycle(formula, opt.Estimate)
	if estErr == nil {
		e := a.estimatedThermo(est, ec)
		st.Estimate = &e
	} else {
		st.EstimateError = estErr
	}
	known, isKnown := a.knownThermo(formula)
	switch {
	case isKnown && !opt.EstimateOnly:
		st.Compound = known
		st.Formula = known.Formula
		if known.Molecular {
			st.Notes = append(st.Notes, fmt.Sprintf("%s is a molecular %s in the data, not an ionic solid: its measured values are used; an ionic estimate of it describes a hypothetical ionic solid, not the real compound", known.Formula, stateWord(known.State)))
		}
	case st.Estimate != nil:
		st.Compound = *st.Estimate
		if isKnown {
			st.Notes = append(st.Notes, "the measured values of "+known.Formula+" are left out as asked: its ΔfH° and S° here are estimates")
		}
	default:
		return nil, estErr
	}
	add := a.additiveEntropy(c)
	st.Compound.AdditiveEntropy = add
	if st.Estimate != nil {
		st.Estimate.AdditiveEntropy = add
	}
	a.gasReleases(st, c, opt)
	if !c.Anion.Ion.Polyatomic && !c.Cation.Ion.Polyatomic {
		a.stateReactions(st, c, opt)
	}
	for _, r := range st.Reactions {
		st.Curves = append(st.Curves, r.Curve(from, to, n))
	}
	if len(st.Reactions) == 0 {
		st.Notes = append(st.Notes, "no decomposition or disproportionation of "+st.Formula+" is known to the program: it builds those of carbonates, peroxides, superoxides, sulfates, hydroxides, nitrates and of binary compounds between oxidation states")
	}
	if slices.ContainsFunc(st.Reactions, func(r Reaction) bool { return r.Correlated }) {
		st.Notes = append(st.Notes, correlationNote())
	}
	st.Notes = append(st.Notes, heatCapacityNotes(st.Reactions)...)
	st.Notes = append(st.Notes,
		fmt.Sprintf("ΔrG(T): where every species of a reaction has NASA Glenn polynomials (McBride, Zehe & Gordon, NASA/TP-2002-211556; the source's phase changes included, Cp held at its last value beyond a species' last interval), ΔrH and ΔrS follow them; otherwise the heat capacities are neglected and ΔrH°, ΔrS° keep their 298.15 K values; gases given off at %g bar", pres),
		fmt.Sprintf("a reaction is called favoured or disfavoured only when ΔrG lies more than %g σ from zero; otherwise it is undecided within the data", gibbs.Coverage))
	return st, nil
}

// cycleOf builds the cycle of formula with the ions the charges choose
// (the data's when none are given): it names the ions of the compound.
func (a *Analyst) cycleOf(formula string, ch Charges) (*cycle.Cycle, error) {
	var cation, anion string
	if len(ch) > 0 {
		var err error
		if cation, anion, err = a.ionsFromCharges(formula, ch); err != nil {
			return nil, err
		}
	}
	return a.build(formula, cation, anion)
}

// ReactionModel is the lattice model of every salt of an estimate-only
// stability analysis unless another is asked. One model for the compound and
// the solid it decomposes into makes the model's systematic error and the
// cation's gas-phase data cancel in ΔrH; the per-compound default
// (cycle.ModelAuto) would take the extended model for an oxide and the
// volume-based one for its carbonate, whose errors do not cancel.
// Kapustinskii takes simple and polyatomic ions alike from their radii, and
// the data's ΔfH°(O²⁻, g) is fitted with it (derivegen/choices.csv).
const ReactionModel = cycle.ModelKapustinskii

// speciesThermo returns the compound's measured data, else its estimate;
// the compound of the analysis itself is st.Compound. With estimateOnly the
// estimate is taken even for a compound the data hold.
func (a *Analyst) speciesThermo(st *Stability, formula string, opt EstimateOptions, estimateOnly bool) (Thermo, error) {
	if formula == st.Formula {
		return st.Compound, nil
	}
	if t, ok := a.knownThermo(formula); ok && t.Formation.Known() && !estimateOnly {
		return t, nil
	}
	est, c, err := a.quickEstimateCycle(formula, opt)
	if err != nil {
		return Thermo{}, err
	}
	return a.estimatedThermo(est, c), nil
}

// gasReleases adds the decomposition of the compound's anion giving off gas.
func (a *Analyst) gasReleases(st *Stability, c *cycle.Cycle, sopt StabilityOptions) {
	opt := sopt.Estimate
	rel, ok := releaseOf(c.Anion.Ion.Symbol, c.Cation.Ion.Charge)
	if !ok {
		return
	}
	// f formula units → g·(M_{nM/g} Y_{nY/g}) + gases, with nY whole.
	f := 1
	for ; f <= 4; f++ {
		if y := float64(c.Anion.Count*f) * rel.Yield; y == math.Trunc(y) {
			break
		}
	}
	nM, nY := c.Cation.Count*f, int(float64(c.Anion.Count*f)*rel.Yield)
	g := notation.GCD(nM, nY)
	product, ok := a.db.FindIon(rel.Product)
	if !ok {
		st.Notes = append(st.Notes, "the data have no ion "+rel.Product+": the decomposition of "+st.Formula+" is left out")
		return
	}
	pf := compoundFormula(c.Cation.Ion.Core, nM/g, product.Core, product.Polyatomic, nY/g)
	charges := Charges{c.Cation.Ion.Core: c.Cation.Ion.Charge, product.Core: product.Charge}
	pt, err := a.speciesThermo(st, pf, EstimateOptions{Charges: charges, Model: opt.Model, Structure: opt.Structure}, sopt.EstimateOnly)
	if err != nil {
		st.Notes = append(st.Notes, fmt.Sprintf("the decomposition of %s into %s is left out: %v", st.Formula, pf, err))
		return
	}
	products := []Term{{Coefficient: float64(g), Thermo: pt}}
	for _, gas := range rel.Gases {
		gt, ok := a.gasThermo(gas.Formula)
		if !ok {
			st.Notes = append(st.Notes, fmt.Sprintf("the decomposition of %s is left out: the data have no gaseous %s", st.Formula, gas.Formula))
			return
		}
		products = append(products, Term{Coefficient: gas.Amount * float64(c.Anion.Count*f), Thermo: gt, Released: true})
	}
	r := newReaction("decomposition", []Term{{Coefficient: float64(f), Thermo: st.Compound}}, products, st.Temperature, st.Pressure)
	if len(rel.Gases) > 1 {
		r.Released = "gases"
		st.Notes = append(st.Notes, fmt.Sprintf("%s: each gas given off is taken at %g bar", r.Equation, st.Pressure))
	}
	st.Reactions = append(st.Reactions, r)
}

// stateReactions adds the disproportionations and losses of the non-metal
// in which the compound decomposes, from a scan of the metal's states.
func (a *Analyst) stateReactions(st *Stability, c *cycle.Cycle, opt StabilityOptions) {
	z := c.Cation.Ion.Charge
	sc, err := a.Scan(c.Cation.Ion.Core, c.Anion.Ion.Core, ScanOptions{MaxCharge: z + 1, Anion: c.Anion.Ion.Symbol,
		Model: opt.Estimate.Model, Structure: opt.Estimate.Structure, Temperature: st.Temperature, Pressure: st.Pressure})
	if err != nil {
		if z+1 > 1 {
			sc, err = a.Scan(c.Cation.Ion.Core, c.Anion.Ion.Core, ScanOptions{MaxCharge: z, Anion: c.Anion.Ion.Symbol,
				Model: opt.Estimate.Model, Structure: opt.Estimate.Structure, Temperature: st.Temperature, Pressure: st.Pressure})
		}
		if err != nil {
			st.Notes = append(st.Notes, "no scan of the oxidation states: "+err.Error())
			return
		}
	}
	// Products: the metal and the compounds of the charges the data know
	// for the element (its ions); a state beyond them (Mg⁴⁺ of MgCl₄) is no
	// product a practitioner would weigh.
	known := a.knownCharges(c.Cation.Ion.Core)
	product := map[string]bool{sc.Metal: true}
	var left []string
	for _, cp := range sc.Compounds {
		if known[cp.Charge] {
			product[cp.Formula] = true
		} else if cp.Charge != z {
			left = append(left, cp.Formula)
		}
	}
	for _, d := range sc.Disproportionations {
		if d.From == z && productsAmong(d.Energies, product) {
			st.Reactions = append(st.Reactions, d.Energies)
		}
	}
	for _, cp := range sc.Compounds {
		if cp.Charge != z {
			continue
		}
		for _, r := range cp.Releases {
			if productsAmong(r, product) {
				st.Reactions = append(st.Reactions, r)
			}
		}
	}
	if len(left) > 0 {
		st.Notes = append(st.Notes, fmt.Sprintf("products are %s and its compounds at the charges the data know for it (%s); %s, at charges the data do not know, are not taken as products",
			sc.Metal, chargeList(known), strings.Join(left, ", ")))
	}
}

// knownCharges returns the charges of the element's monatomic cations in
// the data: the oxidation states its real compounds show.
func (a *Analyst) knownCharges(el string) map[int]bool {
	out := map[int]bool{}
	for _, in := range a.db.IonsOf(el) {
		if !in.Polyatomic && in.Charge > 0 {
			out[in.Charge] = true
		}
	}
	return out
}

// chargeList writes charges in increasing order ("+1, +2"; "none").
func chargeList(ch map[int]bool) string {
	var zs []int
	for z := range ch {
		zs = append(zs, z)
	}
	if len(zs) == 0 {
		return "none"
	}
	slices.Sort(zs)
	parts := make([]string, len(zs))
	for i, z := range zs {
		parts[i] = fmt.Sprintf("%+d", z)
	}
	return strings.Join(parts, ", ")
}

// productsAmong reports whether every solid product of r is among the
// allowed formulas (gases given off are always allowed).
func productsAmong(r Reaction, allowed map[string]bool) bool {
	for _, p := range r.Products {
		if !p.Released && p.Thermo.State != "g" && !allowed[p.Thermo.Formula] {
			return false
		}
	}
	return true
}

// compoundFormula writes M_m X_x with counts of 1 left out and a
// polyatomic anion in brackets when counted.
func compoundFormula(metal string, m int, anion string, polyatomic bool, x int) string {
	if polyatomic && x > 1 {
		return metal + countText(m) + "(" + anion + ")" + countText(x)
	}
	return metal + countText(m) + anion + countText(x)
}
