// Package data holds enthalpath's reference data — elements, ions, Shannon
// radii, compounds and their citations — embedded from plain CSV tables, with
// an optional user overlay file, lookups by element, ion (charge and
// coordination) and compound formula, and the chemical formula parser.
//
// # Provenance
//
// Every number is a Value: value, uncertainty, unit, the key of its citation
// in the sources table, a locator into the vendored source file (file and
// line under data/sources), and flags for a value entered from memory
// (without the document at hand), derived from a thermochemical cycle, or
// replaced by a user overlay (the replaced built-in value travels along in
// Value.Replaced). The tables are written by the generator in data/gen from
// the pinned sources; other compilations' values of a quantity travel as
// Alternatives beside the preferred one.
//
// # Units and signs
//
// Values are stored in the unit the source published them in: ionization
// energies and electron affinities in eV per atom, enthalpies in kJ/mol,
// radii in Å. Conversion to kJ/mol happens once, in the consumer, through
// package thermo. An electron affinity is positive when attachment releases
// energy; the attachment enthalpy is its negative. A handbook lattice energy
// is stored positive, as tabulated (solid → gaseous ions).
//
// # Concurrency
//
// A *DB is never modified after it is built: WithOverlay returns a new DB and
// every lookup returns copies, so one DB may be shared between goroutines
// (one per SSH session).
//
// # Tables
//
// data/README.md documents the files, their columns, the overlay format and
// the rows held by each source.
package data
