package data

// Lookups of ions: by symbol, charge or core; Shannon radii; hydration.

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"enthalpath/thermo/notation"
)

// Ion returns the ion written as symbol: "Na+", "Ca2+", "O2-", "SO4^2-",
// "SO4 2-", "SO42-", "NH4+", "Fe+3", "Cl^-". Digits before the sign are
// read as the charge or as part of the formula, whichever names a tabulated
// ion (the charge first).
//
// The Radii and Hydrations slices of the result are shared with the DB
// (capped, so appending copies): do not write to their elements. Ions
// returns deep copies.
func (db *DB) Ion(symbol string) (Ion, error) {
	if in, ok := db.FindIon(symbol); ok {
		return in, nil
	}
	return Ion{}, &NotFoundError{Kind: "ion", Query: symbol, Suggestions: db.suggestIons(strings.TrimSpace(symbol))}
}

// FindIon is Ion without the error: it reports whether the tables hold the
// ion and skips building suggestions, so a miss costs no more than a hit
// (a hypothetical compound looks up ions the tables do not hold).
func (db *DB) FindIon(symbol string) (Ion, bool) {
	if i, ok := db.ionIdx[symbol]; ok {
		return sharedIon(db.ions[i]), true
	}
	s := strings.TrimSpace(symbol)
	if i, ok := db.ionIdx[s]; ok {
		return sharedIon(db.ions[i]), true
	}
	if i, ok := db.folds().ions[notation.FoldIon(s)]; ok {
		return sharedIon(db.ions[i]), true
	}
	for _, cand := range notation.IonReadings(s) {
		if i, ok := db.ionKeyIdx[ionKey{cand.Core, cand.Charge}]; ok {
			return sharedIon(db.ions[i]), true
		}
	}
	return Ion{}, false
}

// IonByCharge returns the ion with the given core ("Fe", "SO4") and charge.
func (db *DB) IonByCharge(core string, charge int) (Ion, error) {
	if i, ok := db.ionKeyIdx[ionKey{strings.TrimSpace(core), charge}]; ok {
		return sharedIon(db.ions[i]), nil
	}
	q := notation.IonSymbol(core, charge, false)
	var sugg []string
	for _, ion := range db.ions {
		if ion.Core == core {
			sugg = append(sugg, ion.Symbol)
		}
	}
	if len(sugg) == 0 {
		sugg = db.suggestIons(q)
	}
	return Ion{}, &NotFoundError{Kind: "ion", Query: q, Suggestions: sugg}
}

// IonsOf returns copies of the ions whose core is core ("Fe" gives Fe2+
// and Fe3+; "SO4" gives SO4^2-), in table order, without copying the rest.
func (db *DB) IonsOf(core string) []Ion {
	var out []Ion
	for _, ion := range db.ions {
		if ion.Core == core {
			out = append(out, copyIon(ion))
		}
	}
	return out
}

// Ions returns every ion in table order (monatomic rows first).
func (db *DB) Ions() []Ion {
	out := make([]Ion, len(db.ions))
	for i, ion := range db.ions {
		out[i] = copyIon(ion)
	}
	return out
}

// Radius returns the Shannon radius of ion core^charge at coordination cn
// ("VI", "IVSQ", or a number such as "6") and spin ("HS", "LS" or "").
//
// Matching rules, in order:
//   - CN: the row with exactly that CN string; for a number, the row with
//     that coordination (a plain "IV" before "IVSQ"/"IVPY"); if none, the
//     nearest tabulated coordination (ties go to the lower one) and the
//     result's Substituted field says so. An empty cn means VI.
//   - Spin: the row with that spin; a spin-less row matches any asked spin;
//     with spin "" and both spins tabulated, high spin is used (and said so).
func (db *DB) Radius(core string, charge int, cn string, spin string) (ShannonRadius, error) {
	list := db.radii[ionKey{core, charge}]
	// Fast path: the row exactly as asked.
	for _, r := range list {
		if r.CN == cn && r.Spin == spin {
			return r, nil
		}
	}
	core = strings.TrimSpace(core)
	list = db.radii[ionKey{core, charge}]
	sym := notation.IonSymbol(core, charge, false)
	if len(list) == 0 {
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: sym, Detail: "no Shannon radii tabulated for this ion", Suggestions: db.ionsWithRadii(core)}
	}
	cn = strings.ToUpper(strings.TrimSpace(cn))
	if cn == "" {
		cn = "VI"
	}
	want, isNum := 0, false
	if n, err := strconv.Atoi(cn); err == nil {
		want, isNum = n, true
	} else if n, ok := romanCN(cn); ok {
		want = n
	} else {
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: sym + " CN " + cn, Detail: "not a coordination number (II … XIV, IVSQ, IVPY or a number)"}
	}
	spin = strings.ToUpper(strings.TrimSpace(spin))
	if spin != "" && spin != "HS" && spin != "LS" {
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: sym + " spin " + spin, Detail: "spin is HS, LS or empty"}
	}
	// Candidate rows at the chosen CN.
	var at []ShannonRadius
	if !isNum {
		for _, r := range list {
			if r.CN == cn {
				at = append(at, r)
			}
		}
	}
	if len(at) == 0 {
		target, bestD := 0, -1
		for _, r := range list {
			d := abs(r.Coordination - want)
			if bestD < 0 || d < bestD || (d == bestD && r.Coordination < target) {
				bestD, target = d, r.Coordination
			}
		}
		var same []ShannonRadius
		for _, r := range list {
			if r.Coordination == target {
				same = append(same, r)
			}
		}
		spelling := same[0].CN
		for _, r := range same {
			if isPlainCN(r.CN) {
				spelling = r.CN
				break
			}
		}
		for _, r := range same {
			if r.CN == spelling {
				at = append(at, r)
			}
		}
	}
	var note []string
	if len(at) > 0 && (at[0].Coordination != want || (!isNum && at[0].CN != cn)) {
		note = append(note, fmt.Sprintf("CN %s not tabulated for %s; nearest CN %s used", cn, sym, at[0].CN))
	}
	pick := -1
	for i, r := range at {
		if r.Spin == spin {
			pick = i
			break
		}
	}
	if pick < 0 {
		for i, r := range at {
			if r.Spin == "" {
				pick = i
				break
			}
		}
	}
	if pick < 0 && spin == "" {
		for i, r := range at {
			if r.Spin == "HS" {
				pick = i
				note = append(note, "spin not given: high spin used")
				break
			}
		}
	}
	if pick < 0 {
		var have []string
		for _, r := range at {
			have = append(have, r.CN+" "+r.Spin)
		}
		return ShannonRadius{}, &NotFoundError{Kind: "radius", Query: fmt.Sprintf("%s CN %s %s", sym, cn, spin), Detail: "tabulated at this CN: " + strings.Join(have, ", ")}
	}
	r := at[pick]
	r.Substituted = strings.Join(note, "; ")
	return r, nil
}

func isPlainCN(cn string) bool { return cn != "IVSQ" && cn != "IVPY" }

func abs(x int) int {
	if x < 0 {
		return -x
	}
	return x
}

// Radii returns every Shannon row of ion core^charge, sorted by coordination.
func (db *DB) Radii(core string, charge int) []ShannonRadius {
	return slices.Clone(db.radii[ionKey{core, charge}])
}

func (db *DB) ionsWithRadii(core string) []string {
	var out []string
	for k := range db.radii {
		if k.core == core {
			out = append(out, notation.IonSymbol(k.core, k.charge, false))
		}
	}
	slices.Sort(out)
	return out
}

// Hydration returns the standard hydration enthalpy of an ion (kJ/mol) and
// its scale ("conventional", H+ = 0, or "absolute"): the first tabulated one.
func (db *DB) Hydration(ion string) (Value, string, error) {
	x, err := db.Ion(ion)
	if err != nil {
		return Value{}, "", err
	}
	if len(x.Hydrations) == 0 {
		return Value{}, "", &NotFoundError{Kind: "hydration", Query: x.Symbol, Detail: "no hydration enthalpy tabulated", Suggestions: db.ionsWithHydration()}
	}
	return x.Hydrations[0].Value, x.Hydrations[0].Scale, nil
}

// HydrationOnScale returns the hydration enthalpy of an ion on the named
// scale ("conventional" or "absolute").
func (db *DB) HydrationOnScale(ion, scale string) (Value, error) {
	x, err := db.Ion(ion)
	if err != nil {
		return Value{}, err
	}
	for _, h := range x.Hydrations {
		if h.Scale == scale {
			return h.Value, nil
		}
	}
	return Value{}, &NotFoundError{Kind: "hydration", Query: x.Symbol + " (" + scale + ")", Detail: "not tabulated on this scale"}
}

func (db *DB) ionsWithHydration() []string {
	var out []string
	for _, ion := range db.ions {
		if len(ion.Hydrations) > 0 && len(out) < 5 {
			out = append(out, ion.Symbol)
		}
	}
	return out
}
