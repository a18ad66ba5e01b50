package lattice

import (
	"fmt"
	"strings"
)

// Shape is the geometry of a gaseous ion, which fixes the number of
// translational and rotational degrees of freedom used in the U ↔ ΔH_L
// conversion (Jenkins 2005).
type Shape int

const (
	// Monatomic ions (Na⁺, Cl⁻, O²⁻): 3 degrees of freedom.
	Monatomic Shape = iota
	// Linear polyatomic ions (CN⁻, N₃⁻, HF₂⁻): 5 degrees of freedom.
	Linear
	// Nonlinear polyatomic ions (NO₃⁻, SO₄²⁻, NH₄⁺): 6 degrees of freedom.
	Nonlinear
)

// DegreesOfFreedom returns n of Jenkins (2005): 3, 5 or 6; 0 for an
// unknown shape.
func (s Shape) DegreesOfFreedom() int {
	switch s {
	case Monatomic:
		return 3
	case Linear:
		return 5
	case Nonlinear:
		return 6
	}
	return 0
}

// String returns "monatomic", "linear" or "nonlinear", the words data.Ion.Shape uses.
func (s Shape) String() string {
	switch s {
	case Monatomic:
		return "monatomic"
	case Linear:
		return "linear"
	case Nonlinear:
		return "nonlinear"
	}
	return fmt.Sprintf("Shape(%d)", int(s))
}

// ParseShape reads "monatomic", "linear" or "nonlinear" (case-insensitive;
// "non-linear" and the empty string, read as monatomic, are accepted).
func ParseShape(s string) (Shape, error) {
	switch strings.ToLower(strings.TrimSpace(s)) {
	case "", "monatomic", "atom", "atomic":
		return Monatomic, nil
	case "linear":
		return Linear, nil
	case "nonlinear", "non-linear", "non linear":
		return Nonlinear, nil
	}
	return 0, &ParamError{Func: "ParseShape", Param: "shape", Value: fmt.Sprintf("%q", s),
		Err: ErrUnknownName, Hint: "use monatomic, linear or nonlinear"}
}

// IonKind is one kind of ion in a formula unit: Al₂O₃ is
// {Charge: 3, Count: 2} and {Charge: -2, Count: 3}.
type IonKind struct {
	// Charge in units of e; positive for cations, negative for anions.
	Charge int
	// Count is the number of such ions per formula unit (> 0).
	Count int
	// Shape of the gaseous ion (the zero value is Monatomic).
	Shape Shape
}

// checkIons validates a list of ion kinds; with neutral it also requires
// Σ Count·Charge = 0.
func checkIons(fn string, ions []IonKind, neutral bool) error {
	if len(ions) == 0 {
		return &ParamError{Func: fn, Param: "ions", Err: ErrNotPositive,
			Hint: "give at least one ion kind (charge, count, shape)"}
	}
	sum := 0
	for i, ion := range ions {
		if ion.Count <= 0 {
			return &ParamError{Func: fn, Param: fmt.Sprintf("ions[%d].Count", i), Value: fmt.Sprint(ion.Count),
				Err: ErrNotPositive, Hint: "give the number of these ions per formula unit (≥ 1)"}
		}
		if ion.Charge == 0 {
			return &ParamError{Func: fn, Param: fmt.Sprintf("ions[%d].Charge", i), Value: "0",
				Err: ErrZeroCharge, Hint: "an ion needs a non-zero charge"}
		}
		if ion.Shape.DegreesOfFreedom() == 0 {
			return &ParamError{Func: fn, Param: fmt.Sprintf("ions[%d].Shape", i), Value: ion.Shape.String(),
				Err: ErrUnknownName, Hint: "use Monatomic, Linear or Nonlinear"}
		}
		sum += ion.Count * ion.Charge
	}
	if neutral && sum != 0 {
		return &ParamError{Func: fn, Param: "ions", Value: fmt.Sprintf("net charge %+d", sum),
			Err: ErrNotNeutral, Hint: "counts × charges must sum to zero for one formula unit"}
	}
	return nil
}

// IonicStrength returns I = ½ Σ nᵢ zᵢ² over the ions of one formula unit
// (Jenkins et al. 1999; Glasser & Jenkins 2000): 1 for NaCl, 3 for CaF₂,
// 4 for MgO, 15 for Al₂O₃. Neutrality is not required here.
func IonicStrength(ions []IonKind) (float64, error) {
	if err := checkIons("IonicStrength", ions, false); err != nil {
		return 0, err
	}
	return ionicStrength(ions), nil
}

func ionicStrength(ions []IonKind) float64 {
	s := 0
	for _, ion := range ions {
		s += ion.Count * ion.Charge * ion.Charge
	}
	return float64(s) / 2
}

// IonCount returns ν, the number of ions in one formula unit.
func IonCount(ions []IonKind) int {
	n := 0
	for _, ion := range ions {
		n += ion.Count
	}
	return n
}
