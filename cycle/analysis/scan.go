package analysis

import (
	"fmt"
	"math"
	"strings"

	"enthalpath/cycle"
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
	Notes        []string
}

// Disproportionation is one reaction between oxidation states, e.g.
// 2 MgCl → Mg + MgCl₂, with its enthalpy.
type Disproportionation struct {
	// Reaction as written in ASCII ("2 MgCl -> Mg + MgCl2").
	Reaction string
	// From is the oxidation state that disproportionates into Lower and Upper.
	From, Lower, Upper int
	// Enthalpy in kJ/mol of the reaction as written, with its σ (inputs
	// treated as independent).
	Enthalpy, Uncertainty float64
	// Favoured is true when the reaction is exothermic (the products win
	// on enthalpy).
	Favoured bool
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
	// Favoured is the formula with the most negative formation enthalpy per
	// mole of metal (always a stable state): the product of the metal
	// burning in excess non-metal, on enthalpy alone; "" when every state
	// is endothermic.
	Favoured string
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
			return nil, &InputError{Subject: nonmetal, Field: "non-metal", Reason: "the data have no anion of it; give one (e.g. --anion " + nonmetal + "-)", Err: err}
		}
	}
	an, err := a.db.Ion(anion)
	if err != nil {
		if core, z, ok := splitIon(anion); ok && core == nonmetal && z < 0 {
			an.Symbol, an.Core, an.Charge = anion, core, z
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
			return nil, &InputError{Subject: metal, Field: "--max-charge", Reason: fmt.Sprintf("the data have %d ionization energies of %s, so the charge cannot exceed %d", maxZ, metal, maxZ)}
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
	sc := &Scan{Metal: el.Symbol, NonMetal: nonmetal, Anion: an.Symbol, Model: model, Released: elementalForm(nonmetal)}
	w := -an.Charge
	for z := 1; z <= maxZ; z++ {
		g := gcdInt(z, w)
		mc, xc := w/g, z/g
		formula := el.Symbol + countText(mc) + an.Core + countText(xc)
		if an.Polyatomic && xc > 1 {
			formula = el.Symbol + countText(mc) + "(" + an.Core + ")" + countText(xc)
		}
		est, err := a.quickEstimate(formula, EstimateOptions{
			Charges: Charges{el.Symbol: z, an.Core: an.Charge}, Model: opt.Model, Structure: opt.Structure})
		if err != nil {
			sc.Skipped = append(sc.Skipped, fmt.Sprintf("%s (charge %+d): %v", formula, z, err))
			continue
		}
		sc.Spread = est.Spread
		cp := ScanCompound{Formula: est.Formula, Charge: z, MetalCount: mc,
			Estimate: est.Value, EstimateUncertainty: est.Uncertainty, Measured: est.Measured,
			Formation: est.Value, Uncertainty: est.Uncertainty, CationRadius: est.Cation.Radius}
		if est.Measured != nil {
			cp.Formation, cp.Uncertainty, cp.FromData = est.Measured.Value, est.Measured.Uncertainty, true
		}
		cp.PerMetal = cp.Formation / float64(mc)
		cp.PerMetalUncertainty = cp.Uncertainty / float64(mc)
		if est.Cation.Radius.Kind == "neighbour" {
			cp.Notes = append(cp.Notes, est.Cation.Radius.From)
		}
		// The same formula may be a real compound of other ions (KO2 is
		// potassium superoxide, not a K⁴⁺ oxide): say so, lest the row be
		// read as the real compound's.
		cation := el.Symbol + chargeSuffix(z)
		if real, ok := a.db.FindCompound(est.Formula); ok && (real.Cation != cation || real.Anion != an.Symbol) {
			cp.Notes = append([]string{fmt.Sprintf("%s in the data is %s (%s with %s); this row is the hypothetical compound of %s with %s, a different substance",
				real.Formula, real.Name, real.Cation, real.Anion, cation, an.Symbol)}, cp.Notes...)
		}
		sc.Compounds = append(sc.Compounds, cp)
	}
	if len(sc.Compounds) == 0 {
		return nil, &InputError{Subject: el.Symbol + "/" + nonmetal, Reason: "no oxidation state could be estimated: " + strings.Join(sc.Skipped, "; ")}
	}
	sc.disproportionations()
	sc.Notes = append(sc.Notes,
		"entropy is not included: these are enthalpies; a disproportionation that releases little heat may still be reversed by entropy",
		"each compound uses its measured formation enthalpy where the data have one, else the model estimate",
		"uncertainties of a reaction combine its compounds' σ as if independent (model errors of neighbouring states are in fact correlated)")
	return sc, nil
}

// disproportionations fills every reaction q → p + r with 0 ≤ p < q < r
// among the states (0 is the metal), the stability flags and Favoured.
func (sc *Scan) disproportionations() {
	type state struct {
		z        int
		h, u     float64 // per metal atom
		formula  string
		mc       int
		compound int // index in Compounds, −1 for the metal
	}
	states := []state{{z: 0, formula: sc.Metal, mc: 1, compound: -1}}
	for i, c := range sc.Compounds {
		states = append(states, state{z: c.Charge, h: c.PerMetal, u: c.PerMetalUncertainty, formula: c.Formula, mc: c.MetalCount, compound: i})
	}
	stable := make([]bool, len(states))
	for i := range stable {
		stable[i] = true
	}
	for q := 1; q < len(states); q++ {
		for p := 0; p < q; p++ {
			for r := q + 1; r < len(states); r++ {
				P, Q, R := states[p], states[q], states[r]
				// (R.z−P.z) metal atoms in state q → (R.z−Q.z) in p + (Q.z−P.z) in r.
				nq, np, nr := R.z-P.z, R.z-Q.z, Q.z-P.z
				dh := float64(np)*P.h + float64(nr)*R.h - float64(nq)*Q.h
				du := math.Sqrt(sq(float64(np)*P.u) + sq(float64(nr)*R.u) + sq(float64(nq)*Q.u))
				// Formula units: metal atoms / metal per formula, made whole.
				l := lcm(lcm(P.mc, Q.mc), R.mc)
				fq, fp, fr := nq*l/Q.mc, np*l/P.mc, nr*l/R.mc
				g := gcdInt(gcdInt(fq, fp), fr)
				fq, fp, fr = fq/g, fp/g, fr/g
				scale := float64(l) / float64(g)
				d := Disproportionation{
					Reaction: fmt.Sprintf("%s%s -> %s%s + %s%s", coef(fq), Q.formula, coef(fp), P.formula, coef(fr), R.formula),
					From:     Q.z, Lower: P.z, Upper: R.z,
					Enthalpy: dh * scale, Uncertainty: du * scale,
				}
				d.Favoured = d.Enthalpy < 0
				if d.Favoured {
					stable[q] = false
				}
				sc.Disproportionations = append(sc.Disproportionations, d)
			}
		}
	}
	best := 0.0
	for i := 1; i < len(states); i++ {
		c := &sc.Compounds[states[i].compound]
		c.Stable = stable[i]
		if c.PerMetal < best {
			best, sc.Favoured = c.PerMetal, c.Formula
		}
		low := 0.0
		for j := 0; j < i; j++ {
			if states[j].h < c.PerMetal && states[j].h <= low {
				low, c.LosesNonMetal, c.LowerState = states[j].h, true, states[j].formula
			}
		}
	}
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

func gcdInt(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	if a < 0 {
		return -a
	}
	return a
}

func lcm(a, b int) int { return a / gcdInt(a, b) * b }

// splitIon reads "Cl-", "O2-", "Cl2-" into core and charge.
func splitIon(s string) (string, int, bool) {
	i := 0
	for i < len(s) && (s[i] >= 'A' && s[i] <= 'Z' || s[i] >= 'a' && s[i] <= 'z') {
		i++
	}
	if i == 0 || i == len(s) {
		return "", 0, false
	}
	z, ok := parseCharge(strings.TrimPrefix(s[i:], "^"))
	return s[:i], z, ok
}

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
