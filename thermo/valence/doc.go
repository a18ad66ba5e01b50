// Package valence reads oxidation states from a crystal's geometry: bond-
// valence sums per site, and the assignment of charges to the sites of a
// structure file that gives none.
//
// # Bond valence
//
// The valence of a bond of length d between a cation i and an anion j is
// v = exp((R_ij − d)/b), with b = 0.37 Å (I. D. Brown and D. Altermatt,
// Acta Cryst. B41, 244–247 (1985)), and a site's bond-valence sum is the
// sum of v over its bonds. R_ij comes from the element parameters r and c
// of M. O'Keeffe and N. E. Brese, J. Am. Chem. Soc. 113, 3226–3229 (1991):
//
//	R_ij = r_i + r_j − r_i·r_j·(√c_i − √c_j)² / (c_i·r_i + c_j·r_j)
//
// (the caller passes the parameters; package data carries them). Every
// cation–anion pair closer than R_ij + b·ln 1000 is a bond, so each bond
// left out has a valence below 0.001. Sites shared by several species
// (partial occupancy) count each neighbour's bonds weighted by its
// occupancy. The sum is a magnitude: it is compared with |charge|.
//
// # Assignment
//
// Assign gives a charge to every species whose charge is not known, in
// this order, stopping at the first step that succeeds:
//
//  1. Charge balance: one oxidation state per element from its candidate
//     states, and the combinations that make the cell neutral. One
//     combination settles it; several are ranked by the bond-valence fit.
//  2. Bond-valence sums: one state per group of sites (sites of one element
//     whose bond-valence sums agree within 0.01, which are the
//     crystallographically equivalent ones in practice), the neutral choice
//     whose every group lies within 0.5 of its sum, fitting best.
//  3. Mixed valence: as 2, but a group may hold two adjacent states in a
//     ratio its site count allows, summed as their mean charge (the
//     averaged crystal; magnetite's octahedral iron is Fe²⁺/Fe³⁺ 1:1,
//     mean 2.5). The fewest mixed groups win, then the best fit.
//  4. The best fit without the 0.5 limit, marked poor.
//  5. When one element alone has several states, the mean charge that
//     makes the cell neutral on all its sites, if it lies between its
//     lowest and highest state (a vacancy-bearing cell such as Fe0.9O,
//     whose iron carries 2.22).
//
// The fit is Σ n_g·(BVS_g − |q_g|)² over groups with a choice (n_g atoms
// in the group); groups with one candidate have no choice and are not held
// to the 0.5 limit.
package valence
