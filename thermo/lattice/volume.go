package lattice

import (
	"fmt"
	"math"

	"enthalpath/thermo"
	"enthalpath/thermo/notation"
)

// SI prefixes used to move between Å³, nm³ and cm³ (exact by definition).
const (
	metrePerNanometre  = 1e-9
	metrePerCentimetre = 1e-2
)

// GlasserJenkinsA is the electrostatic factor A = 121.39 kJ·mol⁻¹·nm of
// the high-range equation U = A·I·(2I/V_m)^{1/3} (L. Glasser and
// H. D. B. Jenkins, J. Am. Chem. Soc. 122, 632 (2000), abstract).
const GlasserJenkinsA = 121.39

// HighRangeThreshold is 5000 kJ/mol: above this magnitude Glasser and
// Jenkins (2000) recommend their high-range equation, below it the
// stoichiometry fits of Jenkins et al. (1999).
const HighRangeThreshold = 5000.0

// VolumeFit is one pair of constants of U_POT = 2I(α/V_m^{1/3} + β).
type VolumeFit struct {
	// Name says which salts the fit is for, e.g. "MX (1:1)".
	Name string
	// Alpha in kJ·mol⁻¹·nm and Beta in kJ/mol.
	Alpha, Beta float64
	// Source cites where the pair comes from, with "from memory" where so.
	Source string
}

const jrpg1999 = "H. D. B. Jenkins, H. K. Roobottom, J. Passmore, L. Glasser, Inorg. Chem. 38, 3609 (1999)"

// The published fits, never written after initialization (read them with
// VolumeFits or FitFor). Values recalled from the 1999 paper's table of
// coefficients (from memory: they agree with the figures in the project's
// brief, but the paper itself was not at hand to check the digits).
var (
	// fitMX11 is for 1:1 salts M⁺X⁻: α = 117.3, β = 51.9.
	fitMX11 = VolumeFit{Name: "MX (1:1)", Alpha: 117.3, Beta: 51.9, Source: jrpg1999 + ", from memory"}
	// fitMX2 is for 2:1 salts M²⁺(X⁻)₂: α = 133.5, β = 60.9.
	fitMX2 = VolumeFit{Name: "MX2 (2:1)", Alpha: 133.5, Beta: 60.9, Source: jrpg1999 + ", from memory"}
	// fitM2X is for 1:2 salts (M⁺)₂X²⁻: α = 165.3, β = −29.8.
	fitM2X = VolumeFit{Name: "M2X (1:2)", Alpha: 165.3, Beta: -29.8, Source: jrpg1999 + ", from memory"}
	// fitGeneral is the fit over salts of any stoichiometry, used when none
	// of the three above applies: α = 138.7, β = 27.6 (from memory; given
	// by Glasser & Jenkins 2000 for the lower range).
	fitGeneral = VolumeFit{Name: "general", Alpha: 138.7, Beta: 27.6,
		Source: "L. Glasser, H. D. B. Jenkins, J. Am. Chem. Soc. 122, 632 (2000), from memory"}
)

// VolumeFits returns the published fits in the order MX (1:1), MX2 (2:1),
// M2X (1:2), general (a fresh slice each call).
func VolumeFits() []VolumeFit { return []VolumeFit{fitMX11, fitMX2, fitM2X, fitGeneral} }

// FitFor returns the fit for the formula unit's stoichiometry: MX (1:1) for
// one cation and one anion of charge ±1, MX2 (2:1) for M²⁺ with two X⁻,
// M2X (1:2) for two M⁺ with X²⁻ (counts are reduced by their common factor
// first), and the general fit for anything else (2:2 and 3:3 salts, ternary
// salts, more than two ion kinds).
func FitFor(ions []IonKind) VolumeFit {
	if len(ions) != 2 {
		return fitGeneral
	}
	cat, an := ions[0], ions[1]
	if cat.Charge < 0 {
		cat, an = an, cat
	}
	if cat.Charge <= 0 || an.Charge >= 0 || cat.Count <= 0 || an.Count <= 0 {
		return fitGeneral
	}
	g := notation.GCD(cat.Count, an.Count)
	nc, na := cat.Count/g, an.Count/g
	zc, za := cat.Charge, -an.Charge
	switch {
	case nc == 1 && na == 1 && zc == 1 && za == 1:
		return fitMX11
	case nc == 1 && na == 2 && zc == 2 && za == 1:
		return fitMX2
	case nc == 2 && na == 1 && zc == 1 && za == 2:
		return fitM2X
	}
	return fitGeneral
}

// VolumeForm names the equation used.
type VolumeForm int

const (
	// FormAuto picks Form2000 when the high-range equation gives at least
	// HighRangeThreshold in magnitude, and Form1999 otherwise.
	FormAuto VolumeForm = iota
	// Form1999 is U_POT = 2I(α/V_m^{1/3} + β) (Jenkins et al. 1999).
	Form1999
	// Form2000 is U_POT = A·I·(2I/V_m)^{1/3} (Glasser & Jenkins 2000).
	Form2000
)

// String returns a short description of the form.
func (f VolumeForm) String() string {
	switch f {
	case FormAuto:
		return "auto"
	case Form1999:
		return "2I(α/Vm^(1/3)+β), Jenkins et al. 1999"
	case Form2000:
		return "A·I·(2I/Vm)^(1/3), Glasser & Jenkins 2000"
	}
	return fmt.Sprintf("VolumeForm(%d)", int(f))
}

// VolumeOptions choose the equation and, for Form1999, the fit.
type VolumeOptions struct {
	// Form is FormAuto unless set.
	Form VolumeForm
	// Fit overrides FitFor's choice when non-nil.
	Fit *VolumeFit
}

// VolumeEstimate is the result of the volume-based model.
type VolumeEstimate struct {
	// U is the lattice energy in kJ/mol (negative).
	U float64
	// Form is the equation actually used (never FormAuto).
	Form VolumeForm
	// Fit holds α, β and their source when Form is Form1999.
	Fit VolumeFit
	// IonicStrength is I = ½Σnᵢzᵢ².
	IonicStrength float64
}

// VolumeBased returns the Jenkins–Glasser volume-based lattice energy
// (negative, kJ/mol) for formula-unit volume vm in nm³ and the ions of one
// formula unit, choosing the equation as FormAuto says.
func VolumeBased(vm float64, ions []IonKind) (VolumeEstimate, error) {
	return VolumeBasedWith(vm, ions, VolumeOptions{})
}

// VolumeBasedWith is VolumeBased with the equation and fit chosen by opt.
func VolumeBasedWith(vm float64, ions []IonKind, opt VolumeOptions) (VolumeEstimate, error) {
	const fn = "VolumeBased"
	if err := checkPositive(fn, "vm", vm, "nm³ per formula unit"); err != nil {
		return VolumeEstimate{}, err
	}
	if err := checkIons(fn, ions, true); err != nil {
		return VolumeEstimate{}, err
	}
	fit, err := pickFit(fn, ions, opt)
	if err != nil {
		return VolumeEstimate{}, err
	}
	i := ionicStrength(ions)
	high := GlasserJenkinsA * i * math.Cbrt(2*i/vm)
	form := opt.Form
	if form == FormAuto {
		form = Form1999
		if high >= HighRangeThreshold {
			form = Form2000
		}
	}
	switch form {
	case Form2000:
		u, err := finiteResult(fn, -high)
		if err != nil {
			return VolumeEstimate{}, err
		}
		return VolumeEstimate{U: u, Form: Form2000, IonicStrength: i}, nil
	case Form1999:
		u := -2 * i * (fit.Alpha/math.Cbrt(vm) + fit.Beta)
		if !(u < 0) || u < -maxFinite {
			return VolumeEstimate{}, paramErr(fn, "vm", vm, ErrOutOfRange,
				"the %s fit gives no binding at this volume; the volume is far outside its range", fit.Name)
		}
		return VolumeEstimate{U: u, Form: Form1999, Fit: fit, IonicStrength: i}, nil
	}
	return VolumeEstimate{}, &ParamError{Func: fn, Param: "opt.Form", Value: form.String(), Err: ErrUnknownName,
		Hint: "use FormAuto, Form1999 or Form2000"}
}

func pickFit(fn string, ions []IonKind, opt VolumeOptions) (VolumeFit, error) {
	if opt.Fit == nil {
		return FitFor(ions), nil
	}
	f := *opt.Fit
	if err := checkPositive(fn, "opt.Fit.Alpha", f.Alpha, "kJ·mol⁻¹·nm"); err != nil {
		return VolumeFit{}, err
	}
	if math.IsNaN(f.Beta) || math.IsInf(f.Beta, 0) {
		return VolumeFit{}, paramErr(fn, "opt.Fit.Beta", f.Beta, ErrNotPositive, "give a finite β in kJ/mol")
	}
	return f, nil
}

// VolumeForEnergy returns the formula-unit volume (nm³) for which the
// volume-based model gives the lattice energy u (negative, kJ/mol): the
// inverse of VolumeBasedWith. With FormAuto it uses Form2000 when
// |u| ≥ HighRangeThreshold and Form1999 otherwise; the forward FormAuto
// decides on the high-range value instead, so very near the threshold the
// two may pick different equations (pass an explicit Form to avoid that).
// For Form1999 it fails with ErrNoSolution when |u|/(2I) ≤ β.
func VolumeForEnergy(u float64, ions []IonKind, opt VolumeOptions) (float64, error) {
	const fn = "VolumeForEnergy"
	if err := checkLattice(fn, u); err != nil {
		return 0, err
	}
	if err := checkIons(fn, ions, true); err != nil {
		return 0, err
	}
	fit, err := pickFit(fn, ions, opt)
	if err != nil {
		return 0, err
	}
	i := ionicStrength(ions)
	m := -u
	form := opt.Form
	if form == FormAuto {
		form = Form1999
		if m >= HighRangeThreshold {
			form = Form2000
		}
	}
	switch form {
	case Form2000:
		r := GlasserJenkinsA * i / m
		return finiteResult(fn, 2*i*r*r*r)
	case Form1999:
		den := m/(2*i) - fit.Beta
		if !(den > 0) {
			return 0, paramErr(fn, "u", u, ErrNoSolution,
				"|u|/(2I) must exceed β = %g kJ/mol of the %s fit", fit.Beta, fit.Name)
		}
		c := fit.Alpha / den
		return finiteResult(fn, c*c*c)
	}
	return 0, &ParamError{Func: fn, Param: "opt.Form", Value: form.String(), Err: ErrUnknownName,
		Hint: "use FormAuto, Form1999 or Form2000"}
}

// MolarVolumeFromDensity returns the formula-unit volume V_m = M/(ρ·N_A)
// in nm³, from the molar mass M of one formula unit (g/mol) and the
// density ρ (g/cm³).
func MolarVolumeFromDensity(molarMass, density float64) (float64, error) {
	const fn = "MolarVolumeFromDensity"
	if err := checkPositive(fn, "molarMass", molarMass, "g/mol"); err != nil {
		return 0, err
	}
	if err := checkPositive(fn, "density", density, "g/cm³"); err != nil {
		return 0, err
	}
	cm3 := molarMass / (density * thermo.Avogadro)
	return finiteResult(fn, cm3*cube(metrePerCentimetre/metrePerNanometre))
}

// MolarVolumeFromCell returns V_m = V_cell/Z in nm³ from the cell volume in
// Å³ and the number of formula units Z in the cell.
func MolarVolumeFromCell(cellVolume float64, z int) (float64, error) {
	const fn = "MolarVolumeFromCell"
	if err := checkPositive(fn, "cellVolume", cellVolume, "Å³"); err != nil {
		return 0, err
	}
	if z <= 0 {
		return 0, paramErr(fn, "z", float64(z), ErrNotPositive, "give the number of formula units in the cell (≥ 1)")
	}
	return finiteResult(fn, cellVolume/float64(z)*cube(thermo.MetrePerAngstrom/metrePerNanometre))
}

func cube(x float64) float64 { return x * x * x }

// DerivedIonVolume returns the volume (nm³) of one ion of kind
// ions[unknown] for which the volume-based model reproduces the lattice
// energy u (negative, kJ/mol), assuming that ion volumes add up to V_m
// (Jenkins et al. 1999): V_ion = (V_m(u) − known)/ions[unknown].Count,
// where known is the summed volume (nm³) of all the other ions of the
// formula unit. It fails with ErrNoSolution when the other ions already
// fill V_m.
func DerivedIonVolume(u float64, ions []IonKind, unknown int, known float64, opt VolumeOptions) (float64, error) {
	const fn = "DerivedIonVolume"
	if unknown < 0 || unknown >= len(ions) {
		return 0, paramErr(fn, "unknown", float64(unknown), ErrOutOfRange, "give the index of the ion kind to solve for (0 to %d)", len(ions)-1)
	}
	if !(known >= 0) || known > maxFinite {
		return 0, paramErr(fn, "known", known, ErrNotPositive, "give the summed volume of the other ions in nm³ (0 or more)")
	}
	vm, err := VolumeForEnergy(u, ions, opt)
	if err != nil {
		return 0, err
	}
	if !(vm > known) {
		return 0, paramErr(fn, "known", known, ErrNoSolution,
			"the other ions' volume is not less than V_m = %.5f nm³ that reproduces u", vm)
	}
	return (vm - known) / float64(ions[unknown].Count), nil
}
