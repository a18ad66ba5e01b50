package lattice

import (
	"fmt"
	"strings"

	"enthalpath/thermo"
)

// DefaultRho is the Born–Mayer repulsion range ρ = 0.345 Å (Born & Mayer
// 1932), the value used unless the user sets another.
const DefaultRho = 0.345

// IonPair is the electrostatic input shared by Born–Landé and Born–Mayer: a
// Madelung constant, the two ion charges and the closest cation–anion
// distance.
type IonPair struct {
	// Madelung is A in the per-formula-unit convention
	// E_fu = −A·|z₊·z₋|·e²/(4πε₀·R0), the convention thermo/ewald reports:
	// rock salt 1.74756, caesium chloride 1.76267, fluorite 2.51939 (per
	// CaF₂ with z₊|z₋| = 2, referred to the Ca–F distance).
	Madelung float64
	// ZCation and ZAnion are the ion charges in units of e; only their
	// magnitudes are used, so the anion may be given as −1 or 1.
	ZCation, ZAnion int
	// R0 is the shortest cation–anion distance in Å.
	R0 float64
}

func (p IonPair) check(fn string) error {
	if err := checkPositive(fn, "Madelung", p.Madelung, "(dimensionless, e.g. 1.74756 for rock salt)"); err != nil {
		return err
	}
	if p.ZCation == 0 {
		return &ParamError{Func: fn, Param: "ZCation", Value: "0", Err: ErrZeroCharge, Hint: "give the cation charge, e.g. 1 for Na⁺"}
	}
	if p.ZAnion == 0 {
		return &ParamError{Func: fn, Param: "ZAnion", Value: "0", Err: ErrZeroCharge, Hint: "give the anion charge, e.g. -1 for Cl⁻"}
	}
	return checkPositive(fn, "R0", p.R0, "Å (the shortest cation–anion distance)")
}

func (p IonPair) chargeProduct() float64 { return float64(abs(p.ZCation) * abs(p.ZAnion)) }

// Coulomb returns the Madelung (point-charge) energy per mole of formula
// units, −N_A·A·|z₊z₋|·e²/(4πε₀·r₀), in kJ/mol: the limit of Born–Mayer as
// ρ → 0 and of Born–Landé as n → ∞.
func Coulomb(p IonPair) (float64, error) {
	if err := p.check("Coulomb"); err != nil {
		return 0, err
	}
	return finiteResult("Coulomb", coulomb(p))
}

func coulomb(p IonPair) float64 {
	return -thermo.CoulombKJPerMolAngstrom * p.Madelung * p.chargeProduct() / p.R0
}

// BornLande returns the Born–Landé lattice energy in kJ/mol (negative):
//
//	U = −N_A·A·|z₊z₋|·e²/(4πε₀·r₀)·(1 − 1/n)
//
// with n the Born exponent (n > 1; see BornExponent). M. Born and A. Landé,
// Verh. Dtsch. Phys. Ges. 20, 210 (1918).
func BornLande(p IonPair, n float64) (float64, error) {
	if err := p.check("BornLande"); err != nil {
		return 0, err
	}
	if !(n > 1) || n > maxFinite {
		return 0, paramErr("BornLande", "n", n, ErrOutOfRange, "the Born exponent must be greater than 1 (Pauling's values are 5 to 12)")
	}
	return finiteResult("BornLande", coulomb(p)*(1-1/n))
}

// BornMayer returns the Born–Mayer lattice energy in kJ/mol (negative):
//
//	U = −N_A·A·|z₊z₋|·e²/(4πε₀·r₀)·(1 − ρ/r₀)
//
// with the repulsion range ρ in Å (0 < ρ < r₀; DefaultRho = 0.345 Å).
// M. Born and J. E. Mayer, Z. Phys. 75, 1 (1932).
func BornMayer(p IonPair, rho float64) (float64, error) {
	if err := p.check("BornMayer"); err != nil {
		return 0, err
	}
	if !positive(rho) {
		return 0, paramErr("BornMayer", "rho", rho, ErrNotPositive, "give the repulsion range in Å (default %g)", DefaultRho)
	}
	if rho >= p.R0 {
		return 0, paramErr("BornMayer", "rho", rho, ErrOutOfRange, "must be less than r0 = %s Å", fmtFloat(p.R0))
	}
	return finiteResult("BornMayer", coulomb(p)*(1-rho/p.R0))
}

// EffectiveRho returns the ρ (Å) for which BornMayer(p, ρ) equals u, the
// lattice energy (negative, kJ/mol) from a cycle: ρ = r₀·(1 − u/U_C) with
// U_C the Coulomb energy. It fails with ErrNoSolution when |u| ≥ |U_C|
// (no positive ρ can close the gap: the extra binding is beyond any
// Born–Mayer repulsion).
func EffectiveRho(u float64, p IonPair) (float64, error) {
	if err := p.check("EffectiveRho"); err != nil {
		return 0, err
	}
	if err := checkLattice("EffectiveRho", u); err != nil {
		return 0, err
	}
	ratio := u / coulomb(p)
	if !(ratio < 1) {
		return 0, paramErr("EffectiveRho", "u", u, ErrNoSolution,
			"|u| is at or beyond the Coulomb energy %.1f kJ/mol, so no positive ρ reproduces it", coulomb(p))
	}
	return finiteResult("EffectiveRho", p.R0*(1-ratio))
}

// EffectiveBornExponent returns the n for which BornLande(p, n) equals u
// (negative, kJ/mol): n = 1/(1 − u/U_C). It fails with ErrNoSolution when
// |u| ≥ |U_C|.
func EffectiveBornExponent(u float64, p IonPair) (float64, error) {
	if err := p.check("EffectiveBornExponent"); err != nil {
		return 0, err
	}
	if err := checkLattice("EffectiveBornExponent", u); err != nil {
		return 0, err
	}
	ratio := u / coulomb(p)
	if !(ratio < 1) {
		return 0, paramErr("EffectiveBornExponent", "u", u, ErrNoSolution,
			"|u| is at or beyond the Coulomb energy %.1f kJ/mol, so no finite n reproduces it", coulomb(p))
	}
	return finiteResult("EffectiveBornExponent", 1/(1-ratio))
}

// paulingExponents are the Born exponents of L. Pauling, The Nature of the
// Chemical Bond (3rd ed., Cornell University Press, 1960), for ions of
// noble-gas configuration, and for the d¹⁰ ions that follow them (Cu⁺, Ag⁺,
// Au⁺ type), which Pauling lists with Ar, Kr and Xe (from memory).
// Keys are normalized: lower case, no brackets or spaces.
var paulingExponents = map[string]float64{
	"he":         5,
	"ne":         7,
	"ar":         9,
	"kr":         10,
	"xe":         12,
	"ar3d10":     9,  // Cu⁺, Zn²⁺, Ga³⁺
	"kr4d10":     10, // Ag⁺, Cd²⁺, In³⁺
	"xe4f145d10": 12, // Au⁺, Hg²⁺, Tl³⁺
}

// PaulingExponent returns Pauling's Born exponent for one ion's
// configuration: "He" 5, "Ne" 7, "Ar" 9, "Kr" 10, "Xe" 12, and the d¹⁰
// configurations "[Ar]3d10" 9, "[Kr]4d10" 10, "[Xe]4f14 5d10" 12
// (case, brackets and spaces are ignored).
func PaulingExponent(config string) (float64, error) {
	n, ok, key := paulingLookup(config)
	if !ok && key == "" {
		return 0, &ParamError{Func: "PaulingExponent", Param: "config", Err: ErrUnknownName,
			Hint: `none given (an ion without a noble-gas or d10 core has no Pauling exponent); give n yourself`}
	}
	if !ok {
		return 0, &ParamError{Func: "PaulingExponent", Param: "config", Value: fmt.Sprintf("%q", config), Err: ErrUnknownName,
			Hint: `use He, Ne, Ar, Kr, Xe, [Ar]3d10, [Kr]4d10 or [Xe]4f14 5d10, or give n yourself`}
	}
	return n, nil
}

// paulingLookup finds config in paulingExponents with case, brackets and
// spaces ignored, without allocating for a short ASCII configuration (a
// batch asks it for every row); it returns the key it looked up.
func paulingLookup(config string) (float64, bool, string) {
	var buf [32]byte
	k := buf[:0]
	for i := 0; i < len(config); i++ {
		b := config[i]
		switch {
		case b >= 0x80 || len(k) == len(buf):
			key := strings.NewReplacer("[", "", "]", "", " ", "", "\t", "").Replace(strings.ToLower(config))
			n, ok := paulingExponents[key]
			return n, ok, key
		case b == '[' || b == ']' || b == ' ' || b == '\t':
		case 'A' <= b && b <= 'Z':
			k = append(k, b+'a'-'A')
		default:
			k = append(k, b)
		}
	}
	if n, ok := paulingExponents[string(k)]; ok {
		return n, true, ""
	}
	return 0, false, string(k)
}

// BornExponent returns the Born exponent for a formula unit: pass one
// configuration per ion of the formula unit (CaF₂: "Ar", "Ne", "Ne") and it
// returns their mean, so each ion kind is weighted by its count. For a 1:1
// salt this is Pauling's average of the cation and anion values (NaCl:
// (7+9)/2 = 8); for MX₂ it is (n_M + 2·n_X)/3.
func BornExponent(configs ...string) (float64, error) {
	if len(configs) == 0 {
		return 0, &ParamError{Func: "BornExponent", Param: "configs", Err: ErrNotPositive,
			Hint: "give one noble-gas configuration per ion of the formula unit"}
	}
	sum := 0.0
	for i, c := range configs {
		n, err := PaulingExponent(c)
		if err != nil {
			var pe *ParamError
			if asParam(err, &pe) {
				pe.Func, pe.Param = "BornExponent", fmt.Sprintf("configs[%d]", i)
			}
			return 0, err
		}
		sum += n
	}
	return sum / float64(len(configs)), nil
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}
