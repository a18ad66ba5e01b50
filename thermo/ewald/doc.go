// Package ewald computes the electrostatic (Madelung) energy, the site
// potentials and the Madelung constant of a neutral periodic arrangement of
// point charges by Ewald summation.
//
// # Formula
//
// For a cell of volume V holding charges qᵢ at rᵢ, the potential at site i
// due to every other charge of the infinite, neutral crystal is split with a
// Gaussian screening of width 1/α (P. P. Ewald, "Die Berechnung optischer und
// elektrostatischer Gitterpotentiale", Ann. Phys. 369, 253–287 (1921)):
//
//	φᵢ = k·[ Σⱼ Σₙ' qⱼ·erfc(α·|rⱼ−rᵢ+n|)/|rⱼ−rᵢ+n|                 (real space)
//	      + (4π/V)·Σ_{k≠0} exp(−k²/4α²)/k² · Re(S(k)·e^{−ik·rᵢ})     (reciprocal space)
//	      − 2α·qᵢ/√π ]                                              (self term)
//
// with S(k) = Σⱼ qⱼ·e^{ik·rⱼ}, n running over lattice vectors (the prime
// leaves out j = i at n = 0), k over reciprocal lattice vectors (2π
// included) and k = e²/(4πε₀) = thermo.CoulombEVAngstrom eV·Å. The cell
// energy is E = ½·Σᵢ qᵢ·φᵢ.
//
// # Conventions
//
//   - Boundary condition: conducting ("tin-foil") surroundings, so no
//     surface-dipole term is added. Published Madelung constants use this
//     convention (it equals the limit of neutral, dipole-free shells).
//   - The cell must be neutral (|Σq| ≤ crystal.NeutralityTolerance); no
//     neutralising background is ever added.
//   - Site potentials are in volt, energies in eV per cell and per formula
//     unit, and kJ per mole of formula units.
//   - The Madelung constant A is defined by
//     E_fu = −A·z₊·|z₋|·e²/(4πε₀·d), where E_fu is the energy per formula
//     unit, d the shortest cation–anion distance and z₊, z₋ the charges of
//     the ions of that shortest pair. Rock salt gives A = 1.747565; fluorite,
//     with z₊·|z₋| = 2, gives 2.51939. Tables that refer A to another
//     distance or charge product differ by the ratio of those; the energy
//     per formula unit does not depend on the convention.
//
// # Algorithm
//
// The accuracy ε (relative, default 1e-10) fixes p with exp(−p²) = ε/2; the
// real-space cut-off is rc = p/α and the reciprocal one kc = 2αp, so both
// neglected tails fall as exp(−p²). The splitting parameter balances the
// cost of the two sums, α⁶ ∝ N/V², which makes the total work grow as N^1.5.
// The error is then checked with the estimates of J. Kolafa and J. W.
// Perram, "Cutoff errors in the Ewald summation formulae for point charge
// systems", Mol. Simul. 9, 351–368 (1992), and p is widened if they exceed ε.
// A request finer than float64 rounding allows returns its value together
// with an *AccuracyError.
//
// The real-space sum visits, for each pair, only the lattice images inside
// the cut-off sphere (bounds from the distances between lattice planes and
// a quadratic in the last index); erfc costs one exponential (piecewise
// polynomial fits of exp(x²)·erfc(x), relative error below 1e-14). The
// reciprocal sum builds e^{ik·r} from per-site powers of e^{2πi·f} by
// multiplication, and the Gaussian factor along each row of k by a
// multiplicative recurrence. A cell with internal lattice translations (a
// centred cell, a perfect supercell) is summed on its primitive cell, found
// from those translations, and the result scaled back. Large cells
// are summed on several goroutines in a fixed number of chunks reduced in a
// fixed order, so results do not depend on the number of processors.
//
// The pair loop visits all N²/2 pairs (there are no cell lists): up to
// about 10⁴ ions the balanced real-space cut-off is close to half the cell,
// where a grid of bins at least rc wide would hold every pair anyway. When
// the cut-off is below half of every distance between lattice planes (a
// few thousand ions and up) each pair has at most one image within it,
// found by rounding the fractional difference, with no image search; below
// that, the images of each pair are searched in the box the cut-off
// bounds. The splitting parameter is set from measured costs
// (BenchmarkTermCost, see balancedAlpha), and raised a little when that
// brings the cut-off under half the plane spacings (chooseAlpha). The translation search that
// finds the primitive cell scans the sites of a small cell and bisects a
// sorted list in a large one; no hash map is built. Set-up and sums
// allocate a few slices per call (about 40 allocations for the 8-ion rock
// salt; see BenchmarkRockSalt).
//
// PairPotentials gives the Ewald interaction Φᵢⱼ of unit charges on chosen
// sites with every site, the bilinear form of the same sum, for searches
// over orderings of charges on fixed sites (package thermo/ordering).
package ewald
