package cycle

import (
	"fmt"
	"math"
	"strconv"

	"enthalpath/thermo/ewald"
)

// ModelSetting names a number the user may give the models. Every front
// end (command line, workshop, cycle file) checks it against the one
// Bound here, so that ρ or n is refused or accepted alike everywhere.
type ModelSetting int

const (
	// SettingRho is the Born–Mayer range parameter ρ (Å).
	SettingRho ModelSetting = iota + 1
	// SettingBornExponent is the Born–Landé exponent n.
	SettingBornExponent
	// SettingCN is a coordination number of the radii (cation or anion).
	SettingCN
	// SettingD0 is a cation–anion distance d₀ of the user's (Å).
	SettingD0
	// SettingAccuracy is the Ewald sum's relative accuracy.
	SettingAccuracy
)

// Bound is the accepted range of a model setting: Min < v < Max, with
// either end included where said, and whole numbers only where Integer.
type Bound struct {
	Min, Max                 float64
	MinIncluded, MaxIncluded bool
	Integer                  bool
	// Unit is the unit the setting is given in ("Å"), or "".
	Unit string
	// Usual is the range met in practice, for advice ("0.30–0.40 Å").
	Usual string
}

// Bound returns the accepted range of s. The ends are common practice, no
// source, chosen wide around the published values so that nothing a
// chemist would try is refused, and narrow enough that the models stay
// defined: ρ up to 2 Å (the tabulated 0.345 Å, 0.30–0.40 in use); n above
// 1, where Born–Landé's factor 1 − 1/n vanishes, up to 30 (Pauling's
// values run 5–12); CN 1–16; d₀ above 0.5 Å and below 20 Å; an Ewald
// accuracy up to 1 %.
func (s ModelSetting) Bound() Bound {
	switch s {
	case SettingRho:
		return Bound{Min: 0, Max: 2, MaxIncluded: true, Unit: "Å", Usual: "usually 0.30–0.40 Å"}
	case SettingBornExponent:
		return Bound{Min: 1, Max: 30, MaxIncluded: true, Usual: "Pauling's values run 5–12"}
	case SettingCN:
		return Bound{Min: 1, Max: 16, MinIncluded: true, MaxIncluded: true, Integer: true, Usual: "usually 4, 6, 8 or 12"}
	case SettingD0:
		return Bound{Min: 0.5, Max: 20, Unit: "Å", Usual: "a cation–anion distance, usually 1.5–4 Å"}
	case SettingAccuracy:
		return Bound{Min: 0, Max: ewald.CoarsestAccuracy, MaxIncluded: true, Usual: "such as 1e-8"}
	}
	return Bound{Min: math.Inf(-1), Max: math.Inf(1)}
}

// String names the setting as a chemist writes it ("ρ", "n").
func (s ModelSetting) String() string {
	switch s {
	case SettingRho:
		return "ρ"
	case SettingBornExponent:
		return "n"
	case SettingCN:
		return "CN"
	case SettingD0:
		return "d₀"
	case SettingAccuracy:
		return "accuracy"
	}
	return "setting " + strconv.Itoa(int(s))
}

// Contains reports whether v is accepted.
func (b Bound) Contains(v float64) bool {
	if math.IsNaN(v) || b.Integer && v != math.Trunc(v) {
		return false
	}
	above := v > b.Min || b.MinIncluded && v == b.Min
	below := v < b.Max || b.MaxIncluded && v == b.Max
	return above && below
}

// Range writes the bound around a name: "0 < ρ ≤ 2 Å", "1 ≤ CN ≤ 16".
func (b Bound) Range(name string) string {
	lo, hi := " < ", " < "
	if b.MinIncluded {
		lo = " ≤ "
	}
	if b.MaxIncluded {
		hi = " ≤ "
	}
	s := formatBound(b.Min) + lo + name + hi + formatBound(b.Max)
	if b.Unit != "" {
		s += " " + b.Unit
	}
	return s
}

func formatBound(v float64) string { return strconv.FormatFloat(v, 'g', -1, 64) }

// BoundError reports a model setting outside its Bound. The front ends
// word it (naming their flag, field or screen row); Error gives the
// setting, the value and the bound only.
type BoundError struct {
	Setting ModelSetting
	Value   float64
	Bound   Bound
}

func (e *BoundError) Error() string {
	v := formatBound(e.Value)
	if e.Bound.Unit != "" {
		v += " " + e.Bound.Unit
	}
	return fmt.Sprintf("%s = %s is outside %s (%s)", e.Setting, v, e.Bound.Range(e.Setting.String()), e.Bound.Usual)
}

// CheckSetting returns a *BoundError when v is outside the bound of s.
func CheckSetting(s ModelSetting, v float64) error {
	if b := s.Bound(); !b.Contains(v) {
		return &BoundError{Setting: s, Value: v, Bound: b}
	}
	return nil
}
