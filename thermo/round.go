package thermo

import (
	"math"
	"strconv"
)

// UncertaintyDecimals returns the number of decimals with which a value
// and its standard uncertainty u are printed: u rounded to two significant
// figures, and the value to the same decimal place. This is the rule of
// JCGM 100:2008 (GUM), 7.2.6: the uncertainty at most two significant
// digits, the estimate rounded to match. Whole-number uncertainties (u ≥ 10)
// keep the value's units digit (0 decimals) rather than rounding it to tens.
// ok is false when u gives no precision (zero, negative, NaN, infinite);
// the caller then uses its own default.
func UncertaintyDecimals(u float64) (decimals int, ok bool) {
	if !(u > 0) || math.IsInf(u, 0) {
		return 0, false
	}
	// Round u to two significant figures first: 0.0996 becomes 0.10, two
	// decimals, not 0.100.
	e := math.Floor(math.Log10(u))
	scale := math.Pow(10, e-1)
	u2 := math.Round(u/scale) * scale
	e = math.Floor(math.Log10(u2) + 1e-12)
	d := 1 - int(e)
	return min(max(d, 0), 15), true
}

// FormatWithUncertainty writes v and u with UncertaintyDecimals(u)
// decimals each; with no usable u, v is written with fallback decimals and
// the uncertainty is "". Signs are ASCII: a front end that prints "−"
// replaces them.
func FormatWithUncertainty(v, u float64, fallback int) (value, uncertainty string) {
	d, ok := UncertaintyDecimals(u)
	if !ok {
		return strconv.FormatFloat(v, 'f', fallback, 64), ""
	}
	return strconv.FormatFloat(v, 'f', d, 64), strconv.FormatFloat(u, 'f', d, 64)
}
