// Package cycle builds the Born–Haber cycle of an ionic solid from cited
// data, solves its one unknown step by Hess's law with a propagated
// uncertainty, and compares the cycle's lattice value with the ionic models.
//
// # Shape
//
// A *Cycle is a value: an ordered list of Steps plus the compound's ions,
// structure and model Settings. Build makes one from the data for a formula;
// Set, MarkUnknown, Reset and the Settings setters change it; Solve reads it
// and returns a Result without changing it. Nothing here keeps global state,
// touches a terminal or a file (except Save and Open, which the caller may
// avoid with Marshal and Unmarshal), so an interactive caller can hold one
// Cycle per session and call Solve on every keystroke. A *data.DB is only
// read and may be shared by many sessions. Clone makes an independent copy;
// clones share the Madelung memo, which is safe for concurrent use.
//
// # Steps and keys
//
// For M_aX_b(s) formed from its elements in their standard states the steps
// are, in order, with stable keys:
//
//	atomization-cation   M(std) → M(g)              ×a   (sub-steps where the data split it)
//	ionization-1 … -k    M^(i-1)+(g) → M^i+(g) + e⁻  ×a
//	atomization-anion    ½X₂(g) → X(g), S(s) → S(g)  ×b   (sub-steps: vaporization-anion,
//	                                                       sublimation-anion, dissociation-anion)
//	attachment-1 … -w    X(g) + e⁻ → X⁻(g)           ×b
//	lattice              aM^z+(g) + bX^w-(g) → MaXb(s)  ×1 (negative)
//	formation            aM(std) + bX(std) → MaXb(s)    ×1
//
// A polyatomic ion is formed in one step from its elements,
// ion-formation-cation or ion-formation-anion, with the gaseous ion's
// standard enthalpy of formation from the data. Sub-step keys on the cation
// side end in -cation (vaporization-cation, …).
//
// # Values, signs and multiplicities
//
// Every Step.Value is in kJ/mol per mole of the step's reaction as written
// for one atom or ion, in the conventions in force (Settings.Lattice,
// Settings.Ionization); Multiplicity multiplies it in Hess's sum. Ionization
// energies and electron affinities are stored in eV in the data and
// converted once with thermo.EVToKJPerMol. The attachment step's value is
// the attachment enthalpy, the negative of the electron affinity: the two
// words name different numbers and this package never mixes them. The
// lattice step goes from the gaseous ions to the solid and is negative.
//
// # Conventions
//
// Lattice: LatticeEnthalpy (ΔH_L, the default, what Hess's law at 298.15 K
// gives) or LatticeEnergy (U), related by Jenkins' correction
// ΔH_L = U + [a(n_M/2 − 2) + b(n_X/2 − 2)]RT with n = 3 for monatomic,
// 5 for linear and 6 for non-linear ions (H. D. B. Jenkins, J. Chem. Educ.
// 82, 950 (2005)).
//
// Ionization: Energies0K (the default: ionization energies and electron
// affinities as published, at 0 K) or Enthalpies298 (each ionization plus
// 5/2·RT, each attachment minus 5/2·RT, the heat content of the free
// electron). For a neutral salt the electrons released by the cations are
// exactly the electrons taken by the anions, so the 5/2·RT terms cancel and
// the lattice value is the same in both conventions; only the individual
// steps shown differ. Gaseous-ion formation enthalpies of polyatomic ions
// are taken as tabulated at 298.15 K (thermal electron counted); under
// Energies0K they are shifted by 5/2·RT per electron so that both sides of
// the cycle use the same electron convention.
//
// # Uncertainty
//
// Inputs are treated as independent: σ² = Σ (mᵢ·σᵢ)² over the known steps,
// and the solved step's σ is σ/m of that step. A value whose source states
// no uncertainty gets the default of its kind (DefaultUncertainty) and is
// flagged so (Source.DefaultUncertainty).
//
// # Models
//
// Compare evaluates the lattice models named by the ModelNames constants —
// born-lande, born-mayer, kapustinskii, volume, ewald and extended (its
// dispersion set chosen by Settings.Dispersion) — from the
// compound's structure, radii and settings, and reports each one's gap to
// the cycle and a verdict on covalent character from thermo/lattice.
package cycle
