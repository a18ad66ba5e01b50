package screen

import (
	"errors"
	"fmt"
	"math"
	"strconv"
	"strings"

	"enthalpath/cycle"
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

// maxDecimals bounds the decimals of a value printed with its
// uncertainty (Measured), so that it keeps to the step list's columns.
const maxDecimals = 4

// Measured prints kj and its standard uncertainty uncKJ in the context's
// unit, the value signed as Signed does: both to the decimal place of the
// uncertainty rounded to two significant figures (thermo.UncertaintyDecimals,
// the rule of GUM 7.2.6), at most maxDecimals; with no usable uncertainty
// (zero) to the unit's usual decimals. An uncertainty that maxDecimals
// would print as zero is bounded instead ("±<0.0001"): a nonzero
// uncertainty is never shown as none.
func (c *Context) Measured(kj, uncKJ float64) (value, unc string) {
	u := math.Abs(thermo.FromKJPerMol(uncKJ, c.Units))
	d, ok := thermo.UncertaintyDecimals(u)
	if !ok {
		d = decimals(c.Units)
	}
	d = min(d, maxDecimals)
	value = formatEnergy(kj, c.Units, d)
	if kj > 0 && !strings.HasPrefix(value, "0") {
		value = "+" + value
	}
	unc = "±" + formatEnergy(math.Abs(uncKJ), c.Units, d)
	if ok && strings.Trim(unc, "±0.") == "" {
		unc = "±<" + strconv.FormatFloat(math.Pow(10, -float64(d)), 'f', d, 64)
	}
	return value, unc
}

// SignedPM is Measured as one text: "+107.32 ±0.18".
func (c *Context) SignedPM(kj, uncKJ float64) string {
	v, u := c.Measured(kj, uncKJ)
	return v + " " + u
}

// FormatEnergy prints kj in unit u with the unit's usual decimals.
func FormatEnergy(kj float64, u thermo.Unit) string { return formatEnergy(kj, u, decimals(u)) }

// formatEnergy prints kj in unit u with d decimals and a true minus sign.
func formatEnergy(kj float64, u thermo.Unit, d int) string {
	v := thermo.FromKJPerMol(kj, u)
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return "—"
	}
	s := strconv.FormatFloat(v, 'f', d, 64)
	if strings.Trim(s, "-0.") == "" {
		s = strings.TrimPrefix(s, "-")
	}
	return strings.Replace(s, "-", "−", 1)
}

// ParseEnergy reads a number typed by the user in unit u, with an optional
// uncertainty after "±", "+-" or "+/-" and an optional unit (for example
// "-787.2 ± 2", "744+-20", "-188.1 kcal"), as the command line reads a
// step value (cycle.ParseQuantity), and returns both in kJ/mol. The error
// says what is wrong and where (1-based column).
func ParseEnergy(text string, u thermo.Unit) (kj, uncKJ float64, hasUnc bool, err error) {
	q, err := cycle.ParseQuantity(text, u, "the step")
	var ve *cycle.ValueError
	if !errors.As(err, &ve) {
		return q.Value, q.Uncertainty, q.HasUncertainty, err
	}
	reason := "not a number"
	switch {
	case ve.Problem == cycle.ValueTooLarge:
		return 0, 0, false, err // the session words it with the bound (session.ValueError)
	case ve.Part == "value" && ve.Problem == cycle.ValueMissing:
		reason = "type a number, e.g. -787.2 or 744±20"
	case ve.Part == "uncertainty" && ve.Problem == cycle.ValueNegative:
		reason = "the uncertainty must not be negative"
	case ve.Part == "uncertainty":
		reason = "the uncertainty after ± is not a number"
	}
	return 0, 0, false, &InputError{Text: text, Column: ve.Column, Reason: reason}
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
