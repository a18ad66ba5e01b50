package screen

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"enthalpath/thermo"
)

// decimals is how many decimals an energy in unit u is printed with.
func decimals(u thermo.Unit) int {
	if u == thermo.EVPerFormulaUnit {
		return 3
	}
	return 1
}

// Energy prints kj (kJ/mol) in the context's unit, without the unit, with
// a true minus sign.
func (c *Context) Energy(kj float64) string {
	return FormatEnergy(kj, c.Units)
}

// Signed is Energy with an explicit "+" on positive values (step values).
func (c *Context) Signed(kj float64) string {
	s := FormatEnergy(kj, c.Units)
	if kj > 0 && !strings.HasPrefix(s, "0") {
		s = "+" + s
	}
	return s
}

// Uncertainty prints an uncertainty in the context's unit ("±2.0").
func (c *Context) Uncertainty(kj float64) string {
	return "±" + FormatEnergy(math.Abs(kj), c.Units)
}

// FormatEnergy prints kj in unit u with the unit's usual decimals.
func FormatEnergy(kj float64, u thermo.Unit) string {
	v := thermo.FromKJPerMol(kj, u)
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	s := strconv.FormatFloat(v, 'f', decimals(u), 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return strings.Replace(s, "-", "−", 1)
}

// ParseEnergy reads a number typed by the user in unit u, with an optional
// uncertainty after "±" or "+-" (for example "-787.2 ± 2", "744+-20"), and
// returns both in kJ/mol. The minus sign may be "-" or "−". The error says
// what is wrong and where (1-based column).
func ParseEnergy(text string, u thermo.Unit) (kj, uncKJ float64, hasUnc bool, err error) {
	s := strings.ReplaceAll(text, "−", "-")
	s = strings.ReplaceAll(s, "+/-", "±")
	s = strings.ReplaceAll(s, "+-", "±")
	valuePart, uncPart, hasUnc := strings.Cut(s, "±")
	vs := strings.TrimSpace(valuePart)
	if vs == "" {
		return 0, 0, false, &InputError{Text: text, Column: 1, Reason: "type a number, e.g. -787.2 or 744±20"}
	}
	v, perr := strconv.ParseFloat(vs, 64)
	if perr != nil || math.IsNaN(v) || math.IsInf(v, 0) {
		return 0, 0, false, &InputError{Text: text, Column: firstBad(text, 0), Reason: "not a number"}
	}
	var unc float64
	if hasUnc {
		us := strings.TrimSpace(uncPart)
		unc, perr = strconv.ParseFloat(us, 64)
		col := strings.IndexAny(text, "±+") // column of the uncertainty
		if perr != nil || math.IsNaN(unc) || math.IsInf(unc, 0) {
			return 0, 0, false, &InputError{Text: text, Column: len([]rune(text[:max(col, 0)])) + 2, Reason: "the uncertainty after ± is not a number"}
		}
		if unc < 0 {
			return 0, 0, false, &InputError{Text: text, Column: len([]rune(text[:max(col, 0)])) + 2, Reason: "the uncertainty must not be negative"}
		}
	}
	return thermo.ToKJPerMol(v, u), thermo.ToKJPerMol(unc, u), hasUnc, nil
}

// ParseValue reads a step value typed in the context's unit, as
// ParseEnergy does; without "±" the uncertainty is keep (kJ/mol).
func (c *Context) ParseValue(text string, keep float64) (kj, uncKJ float64, err error) {
	kj, uncKJ, hasUnc, err := ParseEnergy(text, c.Units)
	if err == nil && !hasUnc {
		uncKJ = keep
	}
	return kj, uncKJ, err
}

// firstBad returns the 1-based column of the first character that cannot be
// part of a number.
func firstBad(text string, from int) int {
	for i, r := range []rune(text) {
		if i < from {
			continue
		}
		if !strings.ContainsRune("0123456789.-−+eE ", r) {
			return i + 1
		}
	}
	return 1
}

// InputError is text the user typed that cannot be accepted.
type InputError struct {
	Text   string
	Column int
	Reason string
}

func (e *InputError) Error() string {
	return strconv.Quote(e.Text) + ": " + e.Reason + " (column " + strconv.Itoa(e.Column) + ")"
}

// Multiplicity is a step's multiplicity as a table cell: "" for 1, ×½ for
// one half, ×2, ×3 … for whole numbers, else ×0.333….
func Multiplicity(v float64) string {
	switch {
	case v == 1:
		return ""
	case v == 0.5:
		return "×½"
	case v == float64(int(v)):
		return fmt.Sprintf("×%d", int(v))
	}
	return fmt.Sprintf("×%g", v)
}
