package cycle

import (
	"fmt"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo/notation"
)

// Choosing a formula's ions: the data's cation and anion whose charges
// balance its counts, or a hypothetical monatomic ion with the charge the
// counts imply, radii lent by the neighbour rule.

func countText(n int) string {
	if n == 1 {
		return ""
	}
	return strconv.Itoa(n)
}

// pickIons chooses, for a formula of two parts (elements, or a bracketed
// group for a polyatomic ion: "Ba(N3)2"), the ions in this order of
// likelihood: a cation and an anion of the data whose charges balance its
// counts (the data's ions are those of real compounds, so their charges
// are the element's known oxidation states), or a cation of the data with
// a homonuclear group anion of the data that the counts allow (MgO₂ is
// Mg²⁺ with peroxide O₂²⁻, not Mg⁴⁺ with O²⁻), the first of these whose
// cation the data's crystals show with the same anion element, the plain
// anion before the group one; only then a cation with the charge the
// counts imply that the data do not have (a hypothetical ion, MgCl of Mg⁺).
// The ranking is common practice, no source.
func pickIons(db *data.DB, formula string, p1, p2 formulaPart, opt Options) (data.Ion, data.Ion, error) {
	first, second := p1.core, p2.core
	nFirst, nSecond := p1.count, p2.count
	var cations, anions []data.Ion
	for _, in := range db.IonsOf(first) {
		if in.Polyatomic == p1.bracketed && in.Charge > 0 {
			cations = append(cations, in)
		}
	}
	for _, in := range db.IonsOf(second) {
		if in.Polyatomic == p2.bracketed && in.Charge < 0 {
			anions = append(anions, in)
		}
	}
	if opt.Anion != "" {
		a, err := db.Ion(opt.Anion)
		if err != nil {
			return data.Ion{}, data.Ion{}, &CompoundError{Formula: formula, Reason: "unknown anion", Err: err}
		}
		anions = []data.Ion{a}
	}
	if opt.Cation != "" {
		a, err := db.Ion(opt.Cation)
		if err != nil {
			return data.Ion{}, data.Ion{}, &CompoundError{Formula: formula, Reason: "unknown cation", Err: err}
		}
		cations = []data.Ion{a}
	}
	if len(anions) == 0 && p2.bracketed {
		return data.Ion{}, data.Ion{}, &CompoundError{Formula: formula, Reason: fmt.Sprintf("the data have no anion %s; give the ions with their charges", second)}
	}
	if len(anions) == 0 {
		if !notation.IsElementSymbol(second) {
			return data.Ion{}, data.Ion{}, &CompoundError{Formula: formula, Reason: fmt.Sprintf("%q is not an element", second)}
		}
		return data.Ion{}, data.Ion{}, &ChargeError{Formula: formula, Detail: fmt.Sprintf("the data have no anion of %s; write the metal first, or give the cation and the anion with their charges (for example %s-)", second, second)}
	}
	var readings []ionReading
	for _, an := range anions {
		for _, ca := range cations {
			if nFirst*ca.Charge+nSecond*an.Charge == 0 {
				readings = append(readings, ionReading{ca, an})
			}
		}
	}
	if opt.Anion == "" && !p2.bracketed {
		// The second reading: a homonuclear group anion of the element
		// (O₂²⁻ of BaO₂, O₂⁻ of KO₂, S₂²⁻ of FeS₂, N₃⁻ of NaN₃, C₂²⁻ of
		// CaC₂) with a cation of the data, before any charge the data do
		// not know.
		readings = append(readings, groupAnionReadings(db, cations, second, nFirst, nSecond)...)
	}
	if len(readings) > 0 {
		r := likeliest(db, readings, second)
		return r.cation, r.anion, nil
	}
	if p1.bracketed {
		return data.Ion{}, data.Ion{}, &ChargeError{Formula: formula, Detail: fmt.Sprintf("no cation %s in the data balances %s; give the ions with their charges", first, anions[0].Symbol)}
	}
	an := anions[0]
	num := -nSecond * an.Charge
	if num%nFirst != 0 {
		return data.Ion{}, data.Ion{}, &ChargeError{Formula: formula, Detail: fmt.Sprintf("%d %s ions carry %d negative charges, which %d %s atoms cannot balance with a whole charge each",
			nSecond, an.Symbol, num, nFirst, first)}
	}
	z := num / nFirst
	if el, err := db.Element(first); err != nil || len(el.Ionization) < z {
		return data.Ion{}, data.Ion{}, &ChargeError{Formula: formula, Detail: fmt.Sprintf("%s would need the charge %+d, beyond the ionization energies in the data", first, z)}
	}
	sym := fmt.Sprintf("%s%s+", first, countText(z))
	return hypotheticalIon(db, sym, first, z), an, nil
}

// ionReading is one way of reading a formula as a cation and an anion.
type ionReading struct{ cation, anion data.Ion }

// groupAnionReadings returns the readings with a homonuclear group anion
// of element el (core el₂, el₃, …) that the data hold and that, with one of
// the data's cations, balances nFirst cations and nSecond atoms of el;
// group anions of two atoms first.
func groupAnionReadings(db *data.DB, cations []data.Ion, el string, nFirst, nSecond int) []ionReading {
	var out []ionReading
	for k := 2; k <= nSecond; k++ {
		if nSecond%k != 0 {
			continue
		}
		for _, an := range db.IonsOf(el + strconv.Itoa(k)) {
			if !an.Polyatomic || an.Charge >= 0 {
				continue
			}
			for _, ca := range cations {
				if nFirst*ca.Charge+nSecond/k*an.Charge == 0 {
					out = append(out, ionReading{ca, an})
				}
			}
		}
	}
	return out
}

// likeliest returns the first reading whose cation the data's ionic
// crystals show with an anion of element el or with oxide, the anion a
// high charge is most often held against (so FeS₂ is Fe²⁺ with S₂²⁻: the
// data show Fe⁴⁺ only in FeSi; SnS₂ is Sn⁴⁺ with S²⁻ as SnO₂ is Sn⁴⁺
// oxide), else the first reading. Common practice, no source.
func likeliest(db *data.DB, readings []ionReading, el string) ionReading {
	if len(readings) == 1 {
		return readings[0]
	}
	seen := crystalPartners(db)
	for _, r := range readings {
		if p := seen[r.cation.Symbol]; p[el] || p["O"] {
			return r
		}
	}
	return readings[0]
}

// crystalPartnersKey is the key of crystalPartners among the values
// derived from a data set (data.DB.Computed).
const crystalPartnersKey = "cycle.crystalPartners"

// crystalPartners returns, for each cation symbol, the elements of the
// monatomic and homonuclear anions it forms ionic crystals with in the
// data (Fe²⁺: O, S, Cl, …), once per data set.
func crystalPartners(db *data.DB) map[string]map[string]bool {
	return db.Computed(crystalPartnersKey, func() any {
		out := map[string]map[string]bool{}
		for _, c := range db.Compounds() {
			if c.Molecular || c.State != "cr" {
				continue
			}
			an, ok := db.FindIon(c.Anion)
			if !ok {
				continue
			}
			el := strings.TrimRight(an.Core, "0123456789")
			if !notation.IsElementSymbol(el) {
				continue
			}
			if out[c.Cation] == nil {
				out[c.Cation] = map[string]bool{}
			}
			out[c.Cation][el] = true
		}
		return out
	}).(map[string]map[string]bool)
}

// NeighbourDonor returns the element whose ion of charge z lends its
// Shannon radii to an ion of element core that has none (the neighbour
// rule, common practice, no source): the nearest element by atomic number
// with radii for that charge, ties going to the lighter one. It returns ""
// when core is not an element of the data or no element qualifies.
func NeighbourDonor(db *data.DB, core string, z int) string {
	if _, err := db.Element(core); err != nil {
		return ""
	}
	// Walk outwards from core's Z, the lighter neighbour first: a batch of
	// hypothetical compounds calls this for every row, so no table copies.
	at := notation.AtomicNumber(core)
	for d := 1; d < 119; d++ {
		for _, zz := range [2]int{at - d, at + d} {
			if sym := notation.SymbolOfZ(zz); sym != "" && len(db.Radii(sym, z)) > 0 {
				return sym
			}
		}
	}
	return ""
}

// hypotheticalIon is a monatomic ion the data do not have (Mg⁺ of MgCl).
// Its radii, for the models, are those of the ion of the same charge of the
// nearest element by atomic number that has Shannon radii (ties to the
// lighter element): the neighbour rule, common practice, no source. Each
// borrowed radius says so in Substituted, which the model inputs print.
func hypotheticalIon(db *data.DB, sym, core string, z int) data.Ion {
	in := data.Ion{Symbol: sym, Core: core, Charge: z, Shape: "monatomic", Note: "hypothetical ion, not in the data"}
	donor := NeighbourDonor(db, core, z)
	if donor == "" {
		return in
	}
	why := "no radius for " + sym + " in the data: that of " + ionText(donor, z) + " by the neighbour rule, common practice, no source"
	for _, r := range db.Radii(donor, z) {
		r.Substituted = why
		in.Radii = append(in.Radii, r)
	}
	return in
}
