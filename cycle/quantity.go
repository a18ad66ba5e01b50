package cycle

import (
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"enthalpath/thermo"
)

// Quantity is an energy typed by a user: a value and, when one was
// written, its uncertainty, both converted to kJ/mol.
type Quantity struct {
	Value, Uncertainty float64
	// HasUncertainty is false when no ±UNC was written.
	HasUncertainty bool
}

// uncertaintySeparators are the ways a user writes "plus or minus".
var uncertaintySeparators = [...]string{"±", "+/-", "+-"}

// unitSuffixes are the units a typed energy may end with, longest first.
var unitSuffixes = [...]struct {
	suffix string
	unit   thermo.Unit
}{{"kcal/mol", thermo.KcalPerMol}, {"kj/mol", thermo.KJPerMol}, {"kcal", thermo.KcalPerMol}, {"kj", thermo.KJPerMol}, {"ev", thermo.EVPerFormulaUnit}}

// ParseQuantity reads an energy as every front end takes it: "VALUE" or
// "VALUE±UNC" (also "+-" and "+/-"), with an optional unit after the
// numbers (kj, kj/mol, kcal, kcal/mol, ev, any case; "-188.1kcal",
// "-3.6±0.01 eV"); without one the numbers are in unit def. A leading
// Unicode minus (−) is accepted; hexadecimal, inf and NaN are not. Each
// number must lie within ±MaxStepMagnitude kJ/mol; what names the
// quantity in that message ("step lattice"). Errors are *ValueError with
// the 1-based column of the fault in text.
func ParseQuantity(text string, def thermo.Unit, what string) (Quantity, error) {
	bad := func(col int, part string, problem ValueProblem, reason string) (Quantity, error) {
		return Quantity{}, &ValueError{Text: text, Column: col, Part: part, Problem: problem, Reason: reason}
	}
	if !utf8.ValidString(text) {
		return bad(1, "", ValueNotUTF8, "not valid UTF-8")
	}
	unit := def
	body := strings.TrimSpace(text)
	lower := strings.ToLower(body)
	for _, u := range unitSuffixes {
		if strings.HasSuffix(lower, u.suffix) {
			unit = u.unit
			body = strings.TrimSpace(body[:len(body)-len(u.suffix)])
			break
		}
	}
	valText, uncText, sep := body, "", ""
	for _, s := range uncertaintySeparators {
		if i := strings.Index(body, s); i >= 0 {
			valText, uncText, sep = body[:i], body[i+len(s):], s
			break
		}
	}
	valText = strings.TrimSpace(valText)
	valCol := leading(text) + 1
	if valText == "" {
		return bad(valCol, "value", ValueMissing, "missing value")
	}
	v, err := parseNumber(valText)
	if err != nil {
		return bad(valCol, "value", ValueNotANumber, "value "+strconv.Quote(valText)+" is not a number")
	}
	q := Quantity{Value: thermo.ToKJPerMol(v, unit)}
	if why := checkTyped("the value of "+what, v, unit); why != "" {
		return bad(valCol, "value", ValueTooLarge, why)
	}
	if sep == "" {
		return q, nil
	}
	start := strings.Index(text, sep) + len(sep)
	uc := utf8.RuneCountInString(text[:start]) + leading(text[start:]) + 1
	uncText = strings.TrimSpace(uncText)
	if uncText == "" {
		return bad(uc, "uncertainty", ValueMissing, "missing uncertainty after ±")
	}
	u, err := parseNumber(uncText)
	if err != nil {
		return bad(uc, "uncertainty", ValueNotANumber, "uncertainty "+strconv.Quote(uncText)+" is not a number")
	}
	if u < 0 {
		return bad(uc, "uncertainty", ValueNegative, "uncertainty must not be negative")
	}
	q.Uncertainty, q.HasUncertainty = math.Abs(thermo.ToKJPerMol(u, unit)), true
	if why := checkTyped("the uncertainty of "+what, u, unit); why != "" {
		return bad(uc, "uncertainty", ValueTooLarge, why)
	}
	return q, nil
}
