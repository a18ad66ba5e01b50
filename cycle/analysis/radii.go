package analysis

import (
	"fmt"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo/notation"
)

// Radius is the radius an analysis used for one ion, with where it came from.
type Radius struct {
	// Value in Å (0 when none).
	Value float64
	// From says where it came from in words.
	From string
	// Kind is "shannon", "thermochemical", "neighbour" or "user".
	Kind string
}

// IonRadius returns the radius of ion for the Kapustinskii and Born models:
// the thermochemical radius of a polyatomic ion; Shannon's CN VI effective
// ionic radius of a monatomic ion (the nearest CN when VI is not
// tabulated); for an ion with no Shannon radius, the CN VI radius of the
// ion of the same charge of the nearest element by atomic number that has
// one (the neighbour rule of the package comment; ties go to the lighter
// element).
func IonRadius(db *data.DB, ion data.Ion) (Radius, error) {
	if ion.Polyatomic {
		if ion.ThermochemicalRadius.Known() {
			return Radius{Value: ion.ThermochemicalRadius.V, Kind: "thermochemical",
				From: fmt.Sprintf("thermochemical radius of %s (%s)", ion.Symbol, ion.ThermochemicalRadius.Source)}, nil
		}
		return Radius{}, fmt.Errorf("no thermochemical radius of %s in the data; give one (Å)", ion.Symbol)
	}
	if r, err := db.Radius(ion.Core, ion.Charge, "VI", ""); err == nil && r.Ionic.Known() {
		from := fmt.Sprintf("Shannon ionic radius of %s, CN %s", ion.Symbol, r.CN)
		if r.Substituted != "" {
			from += " (" + r.Substituted + ")"
		}
		return Radius{Value: r.Ionic.V, Kind: "shannon", From: from}, nil
	}
	if _, err := db.Element(ion.Core); err != nil {
		return Radius{}, fmt.Errorf("no radius for %s: %q is not an element of the data", ion.Symbol, ion.Core)
	}
	donor := cycle.NeighbourDonor(db, ion.Core, ion.Charge)
	best, err := db.Radius(donor, ion.Charge, "VI", "")
	if donor == "" || err != nil || !best.Ionic.Known() {
		return Radius{}, fmt.Errorf("no radius for %s and no element has a Shannon radius for charge %+d; give one (Å)", ion.Symbol, ion.Charge)
	}
	return Radius{Value: best.Ionic.V, Kind: "neighbour",
		From: fmt.Sprintf("no radius for %s in the data: the Shannon CN %s radius of %s%s used (neighbour rule, common practice, no source)",
			ion.Symbol, best.CN, donor, notation.ChargeSuffix(ion.Charge, false))}, nil
}

// useRadius makes p's ion carry radius r (Å) alone, so that every model of
// package cycle uses it at any coordination.
func useRadius(ion *data.Ion, r Radius) {
	v := data.Value{V: r.Value, Unit: "Å", Source: r.Kind, Note: r.From}
	if ion.Polyatomic {
		ion.ThermochemicalRadius = v
		return
	}
	ion.Radii = []data.ShannonRadius{{CN: "VI", Coordination: 6, Ionic: v, Crystal: v, Core: ion.Core, Charge: ion.Charge}}
}

// ParseRadii reads ion radii written "K+=1.33,Na+=0.98" (Å; ";" separates
// too). A radius must be a number above 0 and at most 10 Å; an ion given
// twice is refused. Errors give the 1-based column of the fault.
func ParseRadii(text string) (map[string]float64, error) {
	out := map[string]float64{}
	col := 1
	for _, part := range strings.Split(strings.ReplaceAll(text, ";", ","), ",") {
		p := strings.TrimSpace(part)
		eq := strings.LastIndexByte(p, '=')
		if eq <= 0 {
			return nil, fmt.Errorf("radii %q: %q at column %d is not ION=Å (e.g. K+=1.33)", text, p, col)
		}
		sym, num := strings.TrimSpace(p[:eq]), strings.TrimSpace(p[eq+1:])
		v, err := strconv.ParseFloat(num, 64)
		if err != nil || !(v > 0) || v > 10 {
			return nil, fmt.Errorf("radii %q: the radius of %s at column %d is %q, not a positive number of Å (at most 10)", text, sym, col+eq+1, num)
		}
		if _, dup := out[sym]; dup {
			return nil, fmt.Errorf("radii %q: %s is given twice", text, sym)
		}
		out[sym] = v
		col += len(part) + 1
	}
	return out, nil
}

// Charges maps element symbols (or a polyatomic core such as SO4) to ion
// charges, as read by ParseCharges.
type Charges map[string]int

// ParseCharges reads "Mg=+1,Cl=-1" or "Mg=+1;Cl=-1" (or "M=+2,X=-1", where M
// stands for the first element of formula and X for the second). Spaces are allowed; a
// charge is a signed integer ("+2", "-1", "2"), or "2+", "1-".
func ParseCharges(text, formula string) (Charges, error) {
	out := Charges{}
	first, second := firstTwoSymbols(formula)
	col := 1
	// ";" separates too, so that charges fit in a CSV cell unquoted.
	for _, part := range strings.Split(strings.ReplaceAll(text, ";", ","), ",") {
		p := strings.TrimSpace(part)
		if p == "" {
			return nil, &ChargesError{Text: text, Column: col, Reason: "empty entry"}
		}
		eq := strings.IndexByte(p, '=')
		if eq <= 0 {
			return nil, &ChargesError{Text: text, Column: col, Reason: fmt.Sprintf("%q is not SYMBOL=CHARGE", p)}
		}
		sym := strings.TrimSpace(p[:eq])
		switch sym {
		case "M":
			sym = first
		case "X":
			sym = second
		}
		if sym == "" {
			return nil, &ChargesError{Text: text, Column: col, Reason: fmt.Sprintf("the formula %q has no element for %s", formula, strings.TrimSpace(p[:eq]))}
		}
		z, ok := parseCharge(strings.TrimSpace(p[eq+1:]))
		if !ok {
			return nil, &ChargesError{Text: text, Column: col + eq + 1, Reason: fmt.Sprintf("%q is not a non-zero whole charge such as +2 or -1", strings.TrimSpace(p[eq+1:]))}
		}
		if _, dup := out[sym]; dup {
			return nil, &ChargesError{Text: text, Column: col, Reason: "charge of " + sym + " given twice"}
		}
		out[sym] = z
		col += len(part) + 1
	}
	return out, nil
}

func parseCharge(s string) (int, bool) {
	if s == "" || len(s) > 4 {
		return 0, false
	}
	sign := 1
	switch {
	case s[0] == '+' || s[0] == '-':
		if s[0] == '-' {
			sign = -1
		}
		s = s[1:]
	case s[len(s)-1] == '+' || s[len(s)-1] == '-':
		if s[len(s)-1] == '-' {
			sign = -1
		}
		s = s[:len(s)-1]
	}
	if s == "" {
		s = "1"
	}
	n := 0
	for _, r := range s {
		if r < '0' || r > '9' {
			return 0, false
		}
		n = n*10 + int(r-'0')
	}
	if n == 0 {
		return 0, false
	}
	return sign * n, true
}

// firstTwoSymbols returns the first two distinct element symbols of a
// formula as written ("MgCl2" → Mg, Cl).
func firstTwoSymbols(f string) (string, string) {
	var syms []string
	for i := 0; i < len(f); i++ {
		if f[i] < 'A' || f[i] > 'Z' {
			continue
		}
		j := i + 1
		for j < len(f) && f[j] >= 'a' && f[j] <= 'z' {
			j++
		}
		s := f[i:j]
		if len(syms) == 0 || (syms[0] != s && len(syms) < 2) {
			syms = append(syms, s)
		}
	}
	for len(syms) < 2 {
		syms = append(syms, "")
	}
	return syms[0], syms[1]
}
