package cycle

import (
	"fmt"
	"math"
	"strconv"
	"strings"
	"unicode/utf8"

	"enthalpath/thermo"
)

// MaxStepMagnitude bounds a step value or uncertainty given by the user,
// in kJ/mol (common practice, no source): a thousand times the lattice
// enthalpy of a highly charged oxide, and small enough that no sum of a
// cycle's steps can overflow.
const MaxStepMagnitude = 1e6

// checkMagnitude refuses a value beyond ±MaxStepMagnitude kJ/mol; what
// names it ("the value of step lattice").
func checkMagnitude(what string, kj float64) string {
	if math.Abs(kj) <= MaxStepMagnitude {
		return ""
	}
	return fmt.Sprintf("%s, %.4g kJ/mol, is beyond the accepted ±%g kJ/mol", what, kj, float64(MaxStepMagnitude))
}

// checkTyped is checkMagnitude for a number typed in unit u: the message
// quotes it as typed, since its conversion may not be finite (1e307 eV is
// beyond any float in kJ/mol).
func checkTyped(what string, typed float64, u thermo.Unit) string {
	kj := thermo.ToKJPerMol(typed, u)
	if math.Abs(kj) <= MaxStepMagnitude {
		return ""
	}
	if u == thermo.KJPerMol {
		return checkMagnitude(what, kj)
	}
	return fmt.Sprintf("%s, %.4g %s, is beyond the accepted ±%g kJ/mol (±%.4g %s)", what, typed, u,
		float64(MaxStepMagnitude), thermo.FromKJPerMol(MaxStepMagnitude, u), u)
}

// Setting is one KEY=VALUE[±UNC] entry, as given to --set.
type Setting struct {
	// Key is the step key.
	Key string
	// Value and Uncertainty are in kJ/mol (converted from the unit given).
	Value, Uncertainty float64
	// HasUncertainty is false when no ±UNC was written; Apply then keeps
	// the step's uncertainty, as the workshop does (write ±0 for an exact
	// value).
	HasUncertainty bool
}

// ParseSetting reads "KEY=VALUE", "KEY=VALUE±UNC" or "KEY=VALUE+-UNC",
// with an optional unit after the number (kj, kcal, ev: "lattice=-188.1kcal",
// "attachment-1=-3.6±0.01 ev"); without one the value is in unit def. Spaces
// around the parts are allowed. The key is not checked against a cycle (Set
// does that).
func ParseSetting(text string, def thermo.Unit) (Setting, error) {
	bad := func(col int, reason string) (Setting, error) {
		return Setting{}, &SettingError{Text: text, Column: col, Reason: reason}
	}
	if !utf8.ValidString(text) {
		return bad(1, "not valid UTF-8")
	}
	eq := strings.IndexByte(text, '=')
	if eq < 0 {
		return bad(utf8.RuneCountInString(text)+1, "missing '='")
	}
	key := strings.TrimSpace(text[:eq])
	if key == "" {
		return bad(1, "missing step key before '='")
	}
	for i, r := range key {
		if !(r >= 'a' && r <= 'z' || r >= '0' && r <= '9' || r == '-' || r >= 'A' && r <= 'Z') {
			return bad(utf8.RuneCountInString(text[:i])+1, "a step key has only letters, digits and '-'")
		}
	}
	rest := text[eq+1:]
	q, err := ParseQuantity(rest, def, "step "+key)
	if ve, ok := err.(*ValueError); ok {
		reason := ve.Reason
		if ve.Part == "value" && ve.Problem == ValueMissing {
			reason = "missing value after '='"
		}
		return bad(utf8.RuneCountInString(text[:eq+1])+ve.Column, reason)
	}
	return Setting{Key: key, Value: q.Value, Uncertainty: q.Uncertainty, HasUncertainty: q.HasUncertainty}, nil
}

func leading(s string) int {
	return utf8.RuneCountInString(s) - utf8.RuneCountInString(strings.TrimLeft(s, " \t"))
}

// parseNumber reads a finite decimal number; a Unicode minus sign (−) is
// accepted for a leading '-'.
func parseNumber(s string) (float64, error) {
	s = strings.Replace(s, "−", "-", 1)
	if strings.ContainsAny(s, " \t_") {
		return 0, strconv.ErrSyntax
	}
	low := strings.ToLower(s)
	if strings.Contains(low, "inf") || strings.Contains(low, "nan") || strings.HasPrefix(low, "0x") || strings.HasPrefix(low, "-0x") || strings.HasPrefix(low, "+0x") {
		return 0, strconv.ErrSyntax
	}
	v, err := strconv.ParseFloat(s, 64)
	if err != nil || math.IsInf(v, 0) || math.IsNaN(v) {
		return 0, strconv.ErrSyntax
	}
	return v, nil
}

// Apply sets the setting's step on c (see Cycle.Set); without ±UNC the
// value replaces the step's and its uncertainty stays (±0 makes it exact).
func (s Setting) Apply(c *Cycle) error {
	u := s.Uncertainty
	if !s.HasUncertainty {
		if st, ok := c.Step(s.Key); ok {
			u = st.Uncertainty
		}
	}
	return c.Set(s.Key, s.Value, u)
}
