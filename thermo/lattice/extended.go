package lattice

import (
	"fmt"
	"math"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
)

// The extended ionic model: the point-charge energy of the real structure
// with short-range repulsion, dispersion and zero-point energy, per mole of
// formula units,
//
//	U(d) = −N_A·A·|z₊z₋|·e²/(4πε₀·d) + Σ_pairs B_ij·exp(−r_ij/ρ)
//	       − Σ_pairs C_ij/r_ij⁶ − Σ_pairs D_ij/r_ij⁸ + E_zp
//
// with every distance r_ij = d·u_ij scaled from the structure's shape (the
// Born–Mayer–Huggins form: M. L. Huggins and J. E. Mayer, J. Chem. Phys. 1,
// 643 (1933); J. E. Mayer, J. Chem. Phys. 1, 270 (1933); F. G. Fumi and
// M. P. Tosi, J. Phys. Chem. Solids 25, 31 (1964)). The repulsion is either
// tabulated (Tosi–Fumi: B_ij = c_ij·b·exp((σ_i+σ_j)/ρ), c_ij Pauling's
// factor) or fitted: one factor on the tabulated prefactors (or one
// prefactor on the cation–anion pairs) chosen so that the quasi-harmonic
// free energy at the Thermal temperature (the static energy without one) is
// least at the reference distance. A tabulated
// repulsion's energy is minimised in d at fixed shape; the zero-point
// energy is added at the distance it is reported for, and the lattice
// enthalpy at T adds the solid's heat content less the gaseous ions'.

// Dispersion sums run over pairs out to ExtendedCutoff times the nearest
// cation–anion distance, and a continuum tail completes them.
const ExtendedCutoff = 6.0

// ExtendedShortReach is how far beyond the nearest distance the repulsion
// is summed: 12ρ, where exp(−r/ρ) has fallen to 6e-6 of its contact value.
func ExtendedShortReach(rho float64) float64 { return 12 * rho }

// Repulsion describes the short-range term.
type Repulsion struct {
	// Rho is the range ρ in Å.
	Rho float64
	// Prefactor[k] is B for pairs of kind k (crystal.PairKind) in kJ/mol,
	// φ = B·exp(−r/ρ); when Fitted, only their ratios count.
	Prefactor [3]float64
	// Fitted: one factor on the prefactors (on the cation–anion pairs
	// alone when Prefactor is all zero), chosen so that the free energy at
	// the Thermal temperature is least at the reference distance D0 (the
	// static energy without a temperature, or when the quasi-harmonic fit
	// fails; ExtendedResult.RepulsionFit says which).
	Fitted bool
}

// ZeroPoint describes the zero-point term E_zp = (9/8)·ν·R·θ_D (Debye).
type ZeroPoint struct {
	// DebyeTemperature in K when known; 0: estimated from the model's own
	// curvature (see ExtendedTerms.DebyeTemperature).
	DebyeTemperature float64
	// MolarMass in g/mol per formula unit (the curvature route needs it).
	MolarMass float64
}

// Thermal describes the step from the model's 0 K energy to the lattice
// enthalpy at a temperature T: ΔH_L(T) = U(0 K) + [H(T) − H(0)]_solid −
// Σ_ions [H(T) − H(0)]_gas, each gaseous monatomic ion carrying 5/2·RT.
type Thermal struct {
	// Temperature in K; 0 leaves the thermal terms out.
	Temperature float64
	// HeatContent is the solid's measured H(T) − H(0) per formula unit in
	// kJ/mol; 0: the Debye heat content with the zero-point term's θ_D.
	HeatContent float64
}

// ExtendedInput is one salt in one structure.
type ExtendedInput struct {
	// Madelung is A referred to D0 (thermo/ewald's convention).
	Madelung        float64
	ZCation, ZAnion int
	// Ions is ν, the number of ions per formula unit.
	Ions int
	// D0 is the nearest cation–anion distance (Å) the Shells were taken at,
	// and VolumePerFormulaUnit the cell volume over Z there (Å³).
	D0, VolumePerFormulaUnit float64
	// Sums are crystal.PairSums of the structure at D0; Short must reach
	// at least ExtendedShortReach(ρ) beyond D0 for the repulsion.
	Sums crystal.PairSums
	// C6 and C8 are the dispersion coefficients per pair kind, kJ/mol·Å⁶
	// and kJ/mol·Å⁸ (positive: attraction −C/r⁶ − D/r⁸).
	C6, C8    [3]float64
	Repulsion Repulsion
	ZeroPoint ZeroPoint
	Thermal   Thermal
}

// ExtendedTerms are the model's terms at one distance, kJ/mol per formula
// unit (Coulomb and dispersion negative, repulsion and zero-point positive).
type ExtendedTerms struct {
	// D is the nearest cation–anion distance in Å.
	D                                                      float64
	Coulomb, Repulsion, DipoleDipole, DipoleQuadrupole, ZP float64
	// DebyeTemperature is the θ_D of the zero-point term (K).
	DebyeTemperature float64
	// BulkModulus is the model's bulk modulus at D in GPa (the curvature
	// route's input).
	BulkModulus float64
	// HeatContent is the solid's H(T) − H(0) and IonsHeatContent the
	// gaseous ions' (5/2·RT each), kJ/mol per formula unit, at the
	// Thermal temperature (both 0 without one).
	HeatContent, IonsHeatContent float64
}

// Dispersion returns the C/r⁶ and D/r⁸ terms together.
func (t ExtendedTerms) Dispersion() float64 { return t.DipoleDipole + t.DipoleQuadrupole }

// Static returns the energy without the zero-point term.
func (t ExtendedTerms) Static() float64 {
	return t.Coulomb + t.Repulsion + t.DipoleDipole + t.DipoleQuadrupole
}

// Total returns the lattice energy U at 0 K (negative, kJ/mol).
func (t ExtendedTerms) Total() float64 { return t.Static() + t.ZP }

// ThermalStep returns ΔH_L(T) − U(0 K) for the step from gaseous ions to
// the solid: the solid's heat content less the ions'.
func (t ExtendedTerms) ThermalStep() float64 { return t.HeatContent - t.IonsHeatContent }

// Enthalpy returns the lattice enthalpy of the step from gaseous ions to
// the solid at the Thermal temperature (negative, kJ/mol).
func (t ExtendedTerms) Enthalpy() float64 { return t.Total() + t.ThermalStep() }

// ExtendedResult is the model at the minimum of U(d) and at D0.
type ExtendedResult struct {
	Minimum, AtD0 ExtendedTerms
	// FittedPrefactor is the cation–anion B (kJ/mol) when the repulsion was
	// fitted (the fitted factor times Prefactor's when those were given),
	// and RepulsionFit the condition it was fitted to.
	FittedPrefactor float64
	RepulsionFit    string
	// ZeroPointFrom says how θ_D was obtained, HeatContentFrom how the
	// solid's heat content was.
	ZeroPointFrom, HeatContentFrom string
}

// extendedCurve holds U(s) for s = d/D0 in closed form.
type extendedCurve struct {
	coul  float64 // Coulomb at s = 1 (negative)
	w6    float64 // Σ C6·S6 at s = 1 (positive)
	w8    float64
	rho   float64
	d0    float64
	reps  []repShell // repulsive shells
	scale float64    // factor on every repulsive prefactor (the thermal fit)
	input *ExtendedInput
}

type repShell struct {
	b float64 // Count·B, kJ/mol
	r float64 // distance at s = 1, Å
}

// energy returns the static terms and the first and second derivatives of
// their sum with respect to d (kJ/mol/Å, kJ/mol/Å²) at s.
func (c *extendedCurve) energy(s float64) (t ExtendedTerms, d1, d2 float64) {
	d0 := c.d0
	t.D = s * d0
	t.Coulomb = c.coul / s
	d1 += -t.Coulomb / (s * d0)
	d2 += 2 * t.Coulomb / (s * s * d0 * d0)
	for _, r := range c.reps {
		e := c.scale * r.b * math.Exp(-s*r.r/c.rho)
		t.Repulsion += e
		k := r.r / (c.rho * d0) // d/dd of the exponent
		d1 -= k * e
		d2 += k * k * e
	}
	s6 := math.Pow(s, 6)
	t.DipoleDipole = -c.w6 / s6
	d1 += -6 * t.DipoleDipole / (s * d0)
	d2 += 42 * t.DipoleDipole / (s * s * d0 * d0)
	s8 := s6 * s * s
	t.DipoleQuadrupole = -c.w8 / s8
	d1 += -8 * t.DipoleQuadrupole / (s * d0)
	d2 += 72 * t.DipoleQuadrupole / (s * s * d0 * d0)
	return t, d1, d2
}

// Extended evaluates the extended ionic model: U(d) minimised at fixed
// shape (Newton's method on dU/dd from D0) and at D0, each with its
// zero-point energy. An input that gives no minimum between 0.5·D0 and
// 2·D0 (dispersion stronger than the repulsion can hold) is refused.
func Extended(in ExtendedInput) (ExtendedResult, error) {
	const fn = "Extended"
	var res ExtendedResult
	if err := (IonPair{Madelung: in.Madelung, ZCation: in.ZCation, ZAnion: in.ZAnion, R0: in.D0}).check(fn); err != nil {
		return res, err
	}
	if err := checkPositive(fn, "rho", in.Repulsion.Rho, "Å (the repulsion range)"); err != nil {
		return res, err
	}
	if err := checkPositive(fn, "VolumePerFormulaUnit", in.VolumePerFormulaUnit, "Å³"); err != nil {
		return res, err
	}
	if in.Ions <= 0 {
		return res, paramErr(fn, "Ions", float64(in.Ions), ErrNotPositive, "give the number of ions per formula unit")
	}
	c := &extendedCurve{rho: in.Repulsion.Rho, d0: in.D0, input: &in, scale: 1,
		coul: -thermo.CoulombKJPerMolAngstrom * in.Madelung * float64(abs(in.ZCation)*abs(in.ZAnion)) / in.D0}
	for k := range 3 {
		if in.C6[k] < 0 || in.C8[k] < 0 {
			return res, paramErr(fn, "C6", math.Min(in.C6[k], in.C8[k]), ErrOutOfRange, "dispersion coefficients are positive (the term is −C/r⁶)")
		}
		c.w6 += in.C6[k] * in.Sums.InvPow6[k]
		c.w8 += in.C8[k] * in.Sums.InvPow8[k]
	}
	reach := in.D0 + ExtendedShortReach(in.Repulsion.Rho)
	// The repulsive shells: the tabulated prefactors, or, for a fitted
	// repulsion without them, unit weights on the cation–anion pairs; a
	// fitted repulsion then scales them all by one factor.
	shaped := in.Repulsion.Prefactor != [3]float64{}
	for _, sh := range in.Sums.Short {
		b := in.Repulsion.Prefactor[sh.Kind]
		if !shaped && in.Repulsion.Fitted && sh.Kind == crystal.CationAnion {
			b = 1
		}
		if b > 0 && sh.Distance <= reach {
			c.reps = append(c.reps, repShell{b: sh.Count * b, r: sh.Distance})
		}
	}
	if len(c.reps) == 0 {
		if in.Repulsion.Fitted {
			return res, paramErr(fn, "Sums", float64(len(in.Sums.Short)), ErrNoSolution, "no pairs within reach to carry the fitted repulsion")
		}
		return res, paramErr(fn, "Prefactor", 0, ErrNotPositive, "give the repulsion prefactors (kJ/mol)")
	}
	if in.Repulsion.Fitted {
		num := (-c.coul + 6*c.w6 + 8*c.w8) / in.D0 // dU/dd of the attractive terms at D0 (kJ/mol/Å)
		den := 0.0
		for _, r := range c.reps {
			den += r.b * r.r / (in.Repulsion.Rho * in.D0) * math.Exp(-r.r/in.Repulsion.Rho)
		}
		if !(den > 0) || !(num > 0) {
			return res, paramErr(fn, "Sums", float64(len(in.Sums.Short)), ErrNoSolution, "no pairs within reach to carry the fitted repulsion")
		}
		f := num / den
		for i := range c.reps {
			c.reps[i].b *= f
		}
		res.FittedPrefactor = f
		if shaped {
			res.FittedPrefactor = f * in.Repulsion.Prefactor[crystal.CationAnion]
		}
	}
	if in.Repulsion.Fitted {
		res.RepulsionFit = "static energy is least at the reference distance"
		if in.Thermal.Temperature > 0 {
			if f, ok := c.thermalFit(); ok {
				c.scale = f
				res.FittedPrefactor *= f
				res.RepulsionFit = fmt.Sprintf("free energy at %g K is least at the reference distance (quasi-harmonic Debye solid: static energy + (9/8)·νRθ_D + νRT·[3·ln(1 − e^(−θ_D/T)) − D₃(θ_D/T)], θ_D(d) from the curvature)", in.Thermal.Temperature)
			}
		}
	}
	s := 1.0 // a fitted repulsion is least at D0 by construction
	if !in.Repulsion.Fitted {
		var err error
		if s, err = c.minimum(); err != nil {
			return res, err
		}
	}
	res.ZeroPointFrom = c.zeroPointFrom()
	res.HeatContentFrom = c.heatContentFrom()
	res.Minimum = c.withZeroPoint(s)
	res.AtD0 = c.withZeroPoint(1)
	for _, t := range []ExtendedTerms{res.Minimum, res.AtD0} {
		if _, err := finiteResult(fn, t.Total()); err != nil {
			return res, err
		}
	}
	return res, nil
}

// minimum finds s with dU/dd = 0 and d²U/dd² > 0 by Newton's method from
// s = 1, falling back to bisection on the bracket [0.5, 2].
func (c *extendedCurve) minimum() (float64, error) {
	lo, hi := 0.5, 2.0
	_, g1, _ := c.energy(lo)
	_, g2, _ := c.energy(hi)
	if !(g1 < 0 && g2 > 0) {
		return 0, &ParamError{Func: "Extended", Param: "D0", Value: fmt.Sprintf("%.4g", c.d0), Err: ErrNoSolution,
			Hint: "the energy has no minimum between half and twice this distance: the dispersion coefficients are too large for the repulsion"}
	}
	s := 1.0
	for range 60 {
		_, g, h := c.energy(s)
		if g < 0 {
			lo = s
		} else {
			hi = s
		}
		next := (lo + hi) / 2
		if h > 0 {
			next = s - g/(h*c.d0)
		}
		if !(next > lo && next < hi) {
			next = (lo + hi) / 2
		}
		if math.Abs(next-s) < 1e-12 {
			return next, nil
		}
		s = next
	}
	return s, nil
}

func (c *extendedCurve) zeroPointFrom() string {
	if c.input.ZeroPoint.DebyeTemperature > 0 {
		return fmt.Sprintf("Debye temperature %g K, E_zp = (9/8)·ν·R·θ_D", c.input.ZeroPoint.DebyeTemperature)
	}
	return "E_zp = (9/8)·ν·R·θ_D with θ_D from the model's curvature: bulk modulus B = d²·U''/(9·V), θ_D = (ħ/k)·√(B/ρ)·(6π²n)^⅓ (bulk sound speed for the Debye mean: common practice, no source)"
}

// debye returns θ_D at s (K; 0 when it cannot be had) and the bulk
// modulus there (GPa), from the tabulated θ_D or the static curvature.
func (c *extendedCurve) debye(s float64) (theta, bulkGPa float64) {
	_, _, d2 := c.energy(s)
	in := c.input
	d := s * c.d0
	vol := in.VolumePerFormulaUnit * s * s * s // Å³
	// B = V·d²U/dV² with V = v·d³: B = U''(d)/(9·v·d), v = V/d³.
	perFU := d2 * 1000 / thermo.Avogadro / (thermo.MetrePerAngstrom * thermo.MetrePerAngstrom) // J/m² per formula unit
	v := vol / (d * d * d)
	bulk := perFU / (9 * v * d * thermo.MetrePerAngstrom) // Pa
	theta = in.ZeroPoint.DebyeTemperature
	if !(theta > 0) && bulk > 0 && in.ZeroPoint.MolarMass > 0 {
		volM3 := vol * 1e-30
		density := in.ZeroPoint.MolarMass / 1000 / thermo.Avogadro / volM3 // kg/m³
		n := float64(in.Ions) / volM3
		theta = thermo.ReducedPlanck / thermo.Boltzmann * math.Sqrt(bulk/density) * math.Cbrt(6*math.Pi*math.Pi*n)
	}
	if !(theta > 0) {
		theta = 0
	}
	return theta, bulk / 1e9
}

// withZeroPoint returns the terms at s with the zero-point energy and the
// heat contents.
func (c *extendedCurve) withZeroPoint(s float64) ExtendedTerms {
	t, _, _ := c.energy(s)
	in := c.input
	theta, bulk := c.debye(s)
	t.BulkModulus = bulk
	if theta > 0 {
		t.DebyeTemperature = theta
		t.ZP = 9.0 / 8 * float64(in.Ions) * thermo.GasConstant * theta / 1000
	}
	if temp := in.Thermal.Temperature; temp > 0 {
		t.IonsHeatContent = float64(in.Ions) * 2.5 * thermo.RT(temp)
		switch {
		case in.Thermal.HeatContent > 0:
			t.HeatContent = in.Thermal.HeatContent
		case theta > 0:
			t.HeatContent = DebyeHeatContent(theta, temp, in.Ions)
		default:
			// No θ_D: the classical limit 3νRT of Dulong and Petit.
			t.HeatContent = 3 * float64(in.Ions) * thermo.RT(temp)
		}
	}
	return t
}

// freeEnergy returns the Helmholtz energy per formula unit at s and the
// Thermal temperature T of the quasi-harmonic Debye solid, kJ/mol:
//
//	F = U_static + (9/8)·νRθ_D + νRT·[3·ln(1 − e^(−θ_D/T)) − D₃(θ_D/T)]
//
// with θ_D(s) from the curvature (NaN without one).
func (c *extendedCurve) freeEnergy(s float64) float64 {
	t, _, _ := c.energy(s)
	theta, _ := c.debye(s)
	temp := c.input.Thermal.Temperature
	if !(theta > 0) || !(temp > 0) {
		return math.NaN()
	}
	x := theta / temp
	nu := float64(c.input.Ions)
	vib := 9.0/8*nu*thermo.GasConstant*theta/1000 + nu*thermo.RT(temp)*(3*math.Log(-math.Expm1(-x))-DebyeFunction(x))
	return t.Static() + vib
}

// thermalFit returns the factor on the statically fitted repulsion that
// makes the free energy at the Thermal temperature, not the static energy,
// least at the reference distance: a distance measured at room temperature
// is where the thermal pressure of the lattice vibrations balances the
// static forces (the quasi-harmonic Debye–Grüneisen picture), so the
// static minimum lies inside it. The secant method on dF/dd at D0, from
// the static fit (factor 1); false when it does not converge or leaves
// (0.2, 1.5).
func (c *extendedCurve) thermalFit() (float64, bool) {
	const h = 1e-5
	slope := func(f float64) float64 {
		c.scale = f
		defer func() { c.scale = 1 }()
		return (c.freeEnergy(1+h) - c.freeEnergy(1-h)) / (2 * h * c.d0)
	}
	f0, f1 := 1.0, 0.95
	g0, g1 := slope(f0), slope(f1)
	for range 40 {
		if math.IsNaN(g0) || math.IsNaN(g1) || g1 == g0 {
			return 1, false
		}
		f2 := f1 - g1*(f1-f0)/(g1-g0)
		if !(f2 > 0.2 && f2 < 1.5) {
			return 1, false
		}
		if math.Abs(f2-f1) < 1e-10 {
			return f2, true
		}
		f0, g0 = f1, g1
		f1, g1 = f2, slope(f2)
	}
	return 1, false
}

func (c *extendedCurve) heatContentFrom() string {
	th := c.input.Thermal
	switch {
	case !(th.Temperature > 0):
		return ""
	case th.HeatContent > 0:
		return fmt.Sprintf("measured H(%g K) − H(0) of the solid, %g kJ/mol; gaseous ions 5/2·RT each", th.Temperature, th.HeatContent)
	}
	return fmt.Sprintf("Debye heat content of the solid, 3νRT·D₃(θ_D/T) at %g K with the zero-point term's θ_D (P. Debye, Ann. Phys. 344, 789 (1912)); gaseous ions 5/2·RT each", th.Temperature)
}

// PaulingFactor returns c_ij = 1 + z_i/n_i + z_j/n_j, Pauling's weight of
// the repulsion between ions of charges z and outer-shell electron counts n
// (L. Pauling, Z. Kristallogr. 67, 377 (1928); as used by Fumi and Tosi
// 1964).
func PaulingFactor(zi, ni, zj, nj int) float64 {
	if ni <= 0 || nj <= 0 {
		return math.NaN()
	}
	return 1 + float64(zi)/float64(ni) + float64(zj)/float64(nj)
}

// SlaterKirkwood returns the dipole–dipole dispersion coefficient C (kJ/mol·Å⁶)
// of two ions from their polarizabilities α (Å³) and effective electron
// numbers N (J. C. Slater and J. G. Kirkwood, Phys. Rev. 37, 682 (1931)):
//
//	C = (3/2)·α_i·α_j / (√(α_i/N_i) + √(α_j/N_j))   in atomic units.
func SlaterKirkwood(alphaI, nI, alphaJ, nJ float64) (float64, error) {
	const fn = "SlaterKirkwood"
	for _, p := range []struct {
		name string
		v    float64
	}{{"alphaI", alphaI}, {"nI", nI}, {"alphaJ", alphaJ}, {"nJ", nJ}} {
		if err := checkPositive(fn, p.name, p.v, ""); err != nil {
			return 0, err
		}
	}
	a3 := thermo.BohrAngstrom * thermo.BohrAngstrom * thermo.BohrAngstrom
	ai, aj := alphaI/a3, alphaJ/a3 // a₀³
	c := 1.5 * ai * aj / (math.Sqrt(ai/nI) + math.Sqrt(aj/nJ))
	return thermo.HartreeBohrPowerToKJPerMol(c, 6), nil
}
