// Package assembly is the guided, step-by-step building of a cycle: the
// workshop proposes each step in order (atomization or sublimation, each
// ionization, vaporization and dissociation, each electron attachment,
// formation, lattice) with its value and source, and the user accepts it,
// types another value or makes it the unknown, while the drawing grows one
// arrow at a time. It is where a formula without data starts.
package assembly
