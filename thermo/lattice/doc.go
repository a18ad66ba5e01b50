// Package lattice evaluates the ionic lattice-energy models — Born–Landé,
// Born–Mayer, Kapustinskii and the Jenkins–Glasser volume-based equations —
// converts between lattice energy U and lattice enthalpy ΔH_L, inverts the
// models for derived radii, volumes, ρ and n, and judges the gap between a
// cycle value and a model.
//
// The package holds formulas only: no table of compounds, ions or radii.
// Physical constants and units come from package enthalpath/thermo.
//
// # Sign and units
//
// Every model returns the lattice energy of the step from gaseous ions to
// the solid, per mole of formula units, in kJ/mol: a NEGATIVE number. NaCl
// by Born–Landé is about −755 kJ/mol. Tabulated lattice energies are
// usually printed positive, for the dissociation solid → gaseous ions;
// negate them before passing them here. Functions that take a lattice
// energy (the inverses, the U ↔ ΔH_L conversions, Judge) expect the
// negative, formation-direction value and refuse a positive one (Judge
// answers Undetermined).
//
// Lengths (r₀, radii, ρ, d) are in ångström; the volume-based equations
// take the formula-unit volume V_m in nm³ (MolarVolumeFromCell and
// MolarVolumeFromDensity make it); temperatures are in kelvin.
//
// # Models
//
// Born–Landé (M. Born and A. Landé, Verh. Dtsch. Phys. Ges. 20, 210
// (1918)):
//
//	U = −N_A·A·|z₊z₋|·e²/(4πε₀·r₀)·(1 − 1/n)
//
// Born–Mayer (M. Born and J. E. Mayer, Z. Phys. 75, 1 (1932)):
//
//	U = −N_A·A·|z₊z₋|·e²/(4πε₀·r₀)·(1 − ρ/r₀),  ρ = 0.345 Å by default
//
// In both, A is the Madelung constant per formula unit referred to the
// shortest cation–anion distance r₀, the convention of thermo/ewald
// (E_fu = −A·|z₊z₋|·e²/(4πε₀·r₀)); fluorite is 2.51939 in it, not the
// 5.03878 of the convention that folds in the charge product.
//
// Born exponents are Pauling's (L. Pauling, The Nature of the Chemical
// Bond, 3rd ed., Cornell University Press, 1960): He 5, Ne 7, Ar 9, Kr 10,
// Xe 12, the d¹⁰ ions Cu⁺, Ag⁺, Au⁺ taking 9, 10, 12 (from memory). For a
// formula unit BornExponent averages over its ions, each ion counted once:
// Pauling's cation–anion mean for a 1:1 salt, (n_M + 2n_X)/3 for MX₂.
//
// Kapustinskii, 1956 form (A. F. Kapustinskii, Q. Rev. Chem. Soc. 10, 283
// (1956)):
//
//	U = −K·ν·|z₊z₋|/(r₊+r₋)·(1 − d/(r₊+r₋)),  K = 1202.5 kJ·Å/mol, d = 0.345 Å
//
// with ν ions per formula unit. K and d were fitted with Goldschmidt- and
// Pauling-type radii; with Shannon's effective ionic radii (R. D. Shannon,
// Acta Cryst. A32, 751 (1976)) use the six-coordinate values whatever the
// real coordination (common practice, no source). The CRC Handbook's
// "Lattice Energies" section (H. D. B. Jenkins and H. K. Roobottom) states
// the equation with 121.4 kJ·nm/mol (KapustinskiiKHandbook) and
// thermochemical radii; KapustinskiiConstants selects either.
//
// Volume-based thermodynamics, lower range (H. D. B. Jenkins,
// H. K. Roobottom, J. Passmore and L. Glasser, Inorg. Chem. 38, 3609
// (1999)):
//
//	U_POT = 2I·(α/V_m^{1/3} + β),  I = ½Σnᵢzᵢ²
//
// with α (kJ·mol⁻¹·nm) and β (kJ/mol) fitted per stoichiometry: MX (1:1)
// 117.3, 51.9; MX₂ (2:1) 133.5, 60.9; M₂X (1:2) 165.3, −29.8; and a general
// fit 138.7, 27.6 for other salts (all from memory; see VolumeFits).
// High range (L. Glasser and H. D. B. Jenkins, J. Am. Chem. Soc. 122, 632
// (2000)):
//
//	U_POT = A·I·(2I/V_m)^{1/3},  A = 121.39 kJ·mol⁻¹·nm
//
// which its authors give for 5000 < U_POT/(kJ/mol) ≤ 70 000, to within
// ±7 %. VolumeBased uses the high-range equation when it gives at least
// 5000 kJ/mol in magnitude and the stoichiometry fit otherwise;
// VolumeOptions forces either.
//
// Extended ionic model (Extended; Born–Mayer–Huggins form, M. L. Huggins
// and J. E. Mayer, J. Chem. Phys. 1, 643 (1933); F. G. Fumi and M. P. Tosi,
// J. Phys. Chem. Solids 25, 31 (1964)):
//
//	U(d) = −N_A·A·|z₊z₋|·e²/(4πε₀·d) + Σ B_ij·exp(−r_ij/ρ) − Σ C_ij/r_ij⁶ − Σ D_ij/r_ij⁸ + E_zp
//
// summed over the pairs of the real structure (thermo/crystal.PairSums) with
// every distance scaled from its shape, minimised in d; the repulsion
// tabulated (B_ij = c_ij·b·exp((σ_i+σ_j)/ρ), Pauling's factors c_ij) or
// fitted (one factor on the tabulated B_ij, or one B on the cation–anion
// pairs) so the free energy at 298.15 K of the quasi-harmonic Debye solid
// is least at a reference distance measured at that temperature; C by
// Slater–Kirkwood (J. C. Slater and J. G. Kirkwood, Phys. Rev. 37, 682
// (1931)) where no table gives it; E_zp = (9/8)·ν·R·θ_D with θ_D given or
// estimated from the model's own bulk modulus. The lattice enthalpy at T
// is U + 3νRT·D₃(θ_D/T) − ν·(5/2)RT (DebyeHeatContent; P. Debye, Ann. Phys.
// 344, 789 (1912)), not Jenkins' classical rule.
//
// # Inverses
//
// For derived quantities (thermochemical radii, effective parameters):
// KapustinskiiRadiusSum and KapustinskiiRadius (the larger, physical root
// of the quadratic), VolumeForEnergy and DerivedIonVolume (with additive
// ion volumes), EffectiveRho and EffectiveBornExponent (the ρ or n that
// makes Born–Mayer or Born–Landé reproduce a cycle value).
//
// # Lattice energy and lattice enthalpy
//
// The models give the lattice potential energy U_POT. The lattice
// enthalpy at temperature T follows H. D. B. Jenkins, J. Chem. Educ. 82,
// 950 (2005), for the dissociation M_pX_q(s) → p M(g) + q X(g):
//
//	ΔH_L = U_POT + [p(n_M/2 − 2) + q(n_X/2 − 2)]·RT
//
// with n = 3 for monatomic, 5 for linear and 6 for non-linear polyatomic
// ions (Shape). In the formation direction used here the correction
// changes sign: ΔH = U − Σ count·(n/2 − 2)·RT, so NaCl's lattice enthalpy
// is U + RT. Convention GasWork offers the common shortcut
// ΔH = ΔU + Δn·RT instead (NaCl: ΔH = U − 2RT in the formation direction).
// The two differ by 3RT for NaCl because the first counts the solid's
// heat content and the second does not; always say which one a number is in.
//
// # Covalent character
//
// Judge compares a cycle lattice value with a model value: gap = cycle −
// model, in kJ/mol and in percent of |model|, against two thresholds: below
// the first the ionic model is adequate; a cycle more negative than the
// model by more shows some covalent character, beyond the second
// substantial covalent character. Judge uses 10 % and 15 % (common
// practice, no source: VerdictBasis); JudgeAgainst takes thresholds set
// elsewhere (package cycle sets them from a validation of each model) with
// their basis. A model that binds more than the cycle by the first
// threshold is flagged as such, not as covalency.
//
// # Errors
//
// Bad inputs (non-positive radius, volume or distance, ρ ≥ r₀, n ≤ 1, a
// zero charge, an unbalanced formula unit, an inverse with no physical
// root) return a *ParamError naming the function and the parameter; it
// wraps one of the sentinel errors (ErrNotPositive, ErrOutOfRange, ...).
// No function panics.
package lattice
