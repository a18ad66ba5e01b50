// Package crystal is the periodic point-charge model of an ionic solid:
// lattice vectors, sites with species, charge and fractional coordinates,
// and the number of formula units in the cell. It also builds the built-in
// structure prototypes from their parameters and makes supercells.
//
// Lengths are in ångström; charges are in units of the elementary charge.
// Lattice vectors are the rows of Lattice: Lattice[0] is a, and so on; a
// site's Cartesian position is Σᵢ Frac[i]·Lattice[i].
package crystal
