// Package crystal is the periodic point-charge model of an ionic solid:
// lattice vectors, sites with species, charge and fractional coordinates,
// and the number of formula units in the cell. It also builds the built-in
// structure prototypes from their parameters and makes supercells.
//
// Lengths are in ångström; charges are in units of the elementary charge.
// Lattice vectors are the rows of Lattice: Lattice[0] is a, and so on; a
// site's Cartesian position is Σᵢ Frac[i]·Lattice[i].
//
// # Prototypes
//
// Build makes a prototype from its parameters (Prototype.Params; missing
// ones take the defaults of the example compound, whose sources are cited
// beside them in prototypes.go). Sites carry placeholder species, the slot
// labels "M" (cation) and "X" (anion), or "A", "B", "X" for perovskite and
// spinel, with the example compound's charges; WithIons renames them and
// sets other charges, keeping the cell neutral. The settings:
//
//   - rock-salt, zinc-blende, fluorite, antifluorite, spinel: conventional
//     face-centred cubic cells (spinel in origin choice 2 of Fd-3m);
//     caesium-chloride and perovskite: primitive cubic cells.
//   - wurtzite, cadmium-iodide, nickel-arsenide: primitive hexagonal cells
//     with a = (a, 0, 0), b = (−a/2, a√3/2, 0), c = (0, 0, c).
//   - cadmium-chloride and corundum: the triple hexagonal cell of their
//     rhombohedral lattices (obverse setting).
//   - rutile: the tetragonal cell.
//
// # Distances
//
// NearestCationAnion is the shortest distance between a positive and a
// negative site over all periodic images, the d of a Madelung constant;
// MeanCationAnionDistance averages the first coordination shell of every
// cation, the distance some published constants are referred to.
package crystal
