// Package analysis answers the questions that bring a chemist to a
// Born–Haber cycle beyond one cycle: would a hypothetical compound be stable
// (Estimate), which oxidation state of a metal wins against a non-metal
// (Scan), how much heat a salt gives when it dissolves (Solution), what
// radius a complex ion behaves as (DeriveRadius), what gas-phase enthalpy
// an ion no measurement reaches has over its family of salts (FitIon), all
// of that for many formulas at once (Batch), and whether a compound
// survives its decompositions and up to what temperature (Stability).
//
// Every analysis is a cycle of package enthalpath/cycle solved in a
// particular direction; this package only chooses the direction, fills the
// inputs a hypothetical compound lacks and reports the numbers with their
// provenance. Energies are kJ/mol of the reaction as written; the lattice
// step goes from gaseous ions to the solid and is negative.
//
// # Shape
//
// An *Analyst holds the data (read only), one Madelung memo and the model
// spreads it has computed, so that one Analyst serves a whole batch or a
// whole interactive session; it is safe for concurrent use. It keeps no
// global state and touches no terminal or file (Batch reads and writes the
// streams it is given).
//
// # Radii of hypothetical ions
//
// A hypothetical ion (Mg⁺, Mg³⁺, Cl²⁻) has no Shannon radius. IonRadius then
// takes the six-coordinate radius of the ion of the same charge of the
// nearest element by atomic number that has one (the "neighbour rule": Mg⁺
// is given the radius of Na⁺, Mg³⁺ that of Al³⁺), the usual assumption of
// textbook estimates of MgCl and MgCl₃ (common practice, no source). The
// user can give any radius instead.
//
// # Model uncertainty
//
// The lattice step of an estimate comes from a model (by default the model
// the compound's covalency verdict is read against, cycle.DefaultModel), and
// the model is the largest uncertainty. Its standard uncertainty is the
// root-mean-square relative gap between that model and the cycle over the
// built-in compounds of the estimate's family (cycle.Validation.SigmaStats:
// the family when it has at least five compounds, else the alkali halides),
// computed from the data at first use, never typed in (Spread). The σ of an
// estimate is the root sum of squares of that model σ and the data
// uncertainties the cycle propagates. cycle.Validate gives every model's
// figures. Analyst.ModelSpread, the σ of the ion fit and of solution cycles,
// stays the RMS gap over the alkali and alkaline-earth halides.
//
// # Ion values fitted over a family
//
// FitIon solves each salt of an ion for the ion's unmeasured step with the
// lattice step from a model and combines the one-salt values by weighted
// least squares (weights 1/σ², σ from every other step and the model's
// measured scatter, ModelSpread); its standard error is the internal one
// times the Birge ratio when the salts scatter more than their σ say. A
// bias of the model common to the family is not in it: over the salts of
// ions whose value is measured (NO₃⁻, OH⁻, NH₄⁺ …) the fits over the ionic
// salts (IonicCounterIons) come out 1–3σ low, over every salt up to 5σ
// (TestFitIonAgainstMeasuredIonValues).
//
// # Entropy and Gibbs energies
//
// Stability is decided by Gibbs energies. A compound's standard data come
// from a Standards (measured ΔfH°, ΔfG°, S° of compounds, gases and
// elements; New reads the data set's): a known compound, ionic or
// molecular, enters with its measured values and is named as such; a
// hypothetical one gets its estimated ΔfH° and a volume-based S°
// (thermo/entropy; V_m from its cell or density, else from its ions' sphere
// volumes over PackingFraction), with an additive single-ion estimate
// beside it where its ions have contributions. Reactions (disproportionations,
// losses of the non-metal, gas-releasing decompositions) sum ΔrH° and ΔrS°
// and are judged by thermo/gibbs: ΔrG(T) with the heat capacities from
// NASA Glenn polynomials (DB.HeatCapacities) where every species has
// them, else neglected; a verdict only beyond 2σ of zero, and the
// temperature at which ΔrG crosses zero at the pressure of the gas given off.
package analysis
