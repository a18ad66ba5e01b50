package lattice

import (
	"errors"
	"fmt"
	"strconv"
	"strings"
)

// Sentinel errors. Every error a function of this package returns wraps one
// of them inside a *ParamError, so callers can test the kind with errors.Is
// and read the parameter at fault with errors.As.
var (
	// ErrNotPositive: a length, volume, count or exponent that must be > 0
	// (or a finite number) was not.
	ErrNotPositive = errors.New("must be positive and finite")
	// ErrZeroCharge: an ion charge was zero, or had the wrong sign.
	ErrZeroCharge = errors.New("ion charge is zero or has the wrong sign")
	// ErrOutOfRange: a parameter lies outside the model's domain
	// (ρ ≥ r₀, n ≤ 1, a lattice energy that is not negative).
	ErrOutOfRange = errors.New("outside the model's domain")
	// ErrNoSolution: an inverse problem has no physical root.
	ErrNoSolution = errors.New("no physical solution")
	// ErrNotNeutral: the ions of a formula unit do not balance.
	ErrNotNeutral = errors.New("ions of the formula unit do not balance")
	// ErrUnknownName: a name (electron configuration, shape) is not known.
	ErrUnknownName = errors.New("unknown name")
)

// ParamError reports one bad input: the function, the parameter, the value
// received and what to do about it. It unwraps to one of the sentinels above.
type ParamError struct {
	// Func is the function that refused the input, e.g. "BornMayer".
	Func string
	// Param names the parameter at fault, e.g. "rho" or "ions[1].Charge".
	Param string
	// Value is the offending value as text.
	Value string
	// Hint says what is wrong and what to supply instead.
	Hint string
	// Err is the sentinel the error wraps.
	Err error
}

// Error reads like `Born–Mayer range ρ = 3.1: must be less than r0 = 2.814
// Å`: the quantity in words, its value and what to do. Func and Param, the
// Go names, stay in the fields for callers; a user reading the message
// gave a quantity, not a function argument.
func (e *ParamError) Error() string {
	what := paramWords(e.Func, e.Param)
	if e.Value == "" {
		return fmt.Sprintf("%s: %s", what, e.Hint)
	}
	return fmt.Sprintf("%s = %s: %s", what, e.Value, e.Hint)
}

// paramWords names a parameter as a user knows it: "rho" is the Born–Mayer
// range ρ, "ions[1].Charge" the charge of the second ion kind, "configs[0]"
// the electron configuration of the first ion. A name without an entry is
// returned as it is.
func paramWords(fn, param string) string {
	if param == "known" { // the other ion(s) of an inverse problem
		switch fn {
		case "KapustinskiiRadius":
			return "radius of the other ion"
		case "DerivedIonVolume":
			return "summed volume of the other ions"
		}
	}
	if base, rest, ok := strings.Cut(param, "["); ok {
		idx, field, _ := strings.Cut(rest, "]")
		i, err := strconv.Atoi(idx)
		if err != nil {
			return param
		}
		nth := ordinal(i + 1)
		switch base + field {
		case "configs":
			return "electron configuration of the " + nth + " ion"
		case "ions.Count":
			return "count of the " + nth + " ion kind"
		case "ions.Charge":
			return "charge of the " + nth + " ion kind"
		case "ions.Shape":
			return "shape of the " + nth + " ion kind"
		}
		return param
	}
	if w, ok := paramNames[param]; ok {
		return w
	}
	return param
}

var paramNames = map[string]string{
	"Madelung":      "Madelung constant",
	"ZCation":       "cation charge",
	"zCation":       "cation charge",
	"ZAnion":        "anion charge",
	"zAnion":        "anion charge",
	"R0":            "cation–anion distance r₀",
	"n":             "Born exponent n",
	"rho":           "Born–Mayer range ρ",
	"u":             "lattice energy U",
	"h":             "lattice enthalpy ΔH_L",
	"t":             "temperature",
	"config":        "electron configuration",
	"configs":       "electron configurations",
	"shape":         "ion shape",
	"ions":          "ions of the formula unit",
	"convention":    "lattice convention",
	"result":        "result",
	"nu":            "number of ions per formula unit ν",
	"rCation":       "cation radius",
	"rAnion":        "anion radius",
	"K":             "Kapustinskii constant K",
	"D":             "Kapustinskii constant d",
	"known":         "known quantity",
	"vm":            "molar volume V_m",
	"opt.Form":      "volume-based form",
	"opt.Fit.Alpha": "fit constant α",
	"opt.Fit.Beta":  "fit constant β",
	"molarMass":     "molar mass",
	"density":       "density",
	"cellVolume":    "cell volume",
	"z":             "formula units per cell Z",
	"unknown":       "ion kind to solve for",
}

func ordinal(n int) string {
	switch n {
	case 1:
		return "first"
	case 2:
		return "second"
	case 3:
		return "third"
	case 4:
		return "fourth"
	}
	return "#" + strconv.Itoa(n)
}

// Unwrap returns the sentinel.
func (e *ParamError) Unwrap() error { return e.Err }

func paramErr(fn, param string, v float64, sentinel error, hint string, args ...any) error {
	return &ParamError{Func: fn, Param: param, Value: fmtFloat(v), Err: sentinel, Hint: fmt.Sprintf(hint, args...)}
}

func fmtFloat(v float64) string { return strconv.FormatFloat(v, 'g', 6, 64) }

// positive reports whether v is a finite number greater than zero (false for NaN).
func positive(v float64) bool { return v > 0 && v <= maxFinite }

const maxFinite = 1.7976931348623157e308

func checkPositive(fn, param string, v float64, unit string) error {
	if !positive(v) {
		return paramErr(fn, param, v, ErrNotPositive, "give a positive, finite value in %s", unit)
	}
	return nil
}

// checkLattice checks that u is a usable lattice energy: finite and negative
// (gaseous ions → solid).
func checkLattice(fn string, u float64) error { return checkLatticeParam(fn, "u", u) }

func checkLatticeParam(fn, param string, u float64) error {
	if !(u < 0) || u < -maxFinite {
		return paramErr(fn, param, u, ErrOutOfRange,
			"a lattice energy (gaseous ions → solid) must be negative and finite, in kJ/mol; negate a tabulated dissociation value")
	}
	return nil
}

func asParam(err error, target **ParamError) bool { return errors.As(err, target) }

// finiteResult returns v, or an ErrOutOfRange error when the inputs drove
// the result to ±Inf or NaN (extreme but individually valid inputs).
func finiteResult(fn string, v float64) (float64, error) {
	if v != v || v > maxFinite || v < -maxFinite {
		return 0, &ParamError{Func: fn, Param: "result", Value: fmtFloat(v), Err: ErrOutOfRange,
			Hint: "the inputs are so extreme that the result is not a finite number; check their units"}
	}
	return v, nil
}
