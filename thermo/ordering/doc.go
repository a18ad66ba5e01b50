// Package ordering ranks the orderings of ions (and vacancies) over the
// sites of a partially occupied or mixed sublattice by their electrostatic
// energy: Li/vacancy on the octahedral sites of a cathode, Fe²⁺/Fe³⁺ on the
// octahedral sites of a spinel, several cations on one site of a
// high-entropy oxide.
//
// # Model
//
// A Problem is a supercell whose sites are either fixed (one ion) or mixed
// (one of a Group's occupants, in fixed numbers). The energy of an ordering
// is the Ewald energy of the point charges it places, with conducting
// boundary conditions (package ewald), a vacancy carrying no charge. With
// the Ewald pair potentials Φ between the mixed sites and every site
// (ewald.PairPotentials) it is
//
//	E(q) = E₀ + Σₐ qₐ·Vᶠₐ + ½·Σₐ_b qₐ·q_b·Φₐ_b
//
// over the mixed sites a, b, where Vᶠ is the potential of the fixed ions
// and E₀ their own energy. Swapping the occupants of mixed sites x and y
// (charges changing by +d and −d) changes the energy by
//
//	ΔE = d·(Vₓ − V_y) + ½·d²·(Φₓₓ + Φ_yy − 2·Φₓ_y),
//
// with V the total potential at each mixed site: one evaluation costs O(1)
// and an accepted swap updates V in O(M) for M mixed sites. E₀ is fixed by
// one ewald.Sum of the first ordering, so the energies listed are absolute
// (eV per supercell). Φ and Vᶠ do not change under the lattice translations
// of the parent, so one row of Φ is summed per translation orbit of mixed
// sites (one row for a supercell of a cell with one mixed site) and the
// others are copied.
//
// # Search
//
// Orderings related by a symmetry operation of the disordered parent (a
// lattice rotation with a translation that maps every fixed ion onto one
// of its own kind and every mixed site onto a site of its group) have equal
// energies and are one ordering; the number of orderings it stands for is
// its multiplicity. When the orderings number at most
// SearchOptions.MaxEnumerated, all are visited (depth-first, the energy
// built site by site); otherwise simulated annealing with Metropolis swaps
// and a geometric temperature schedule, from seeded random starts, keeps
// the lowest orderings it meets. Annealing can miss the lowest ordering; the
// enumeration cannot. Runs with the same seed give the same result.
package ordering
