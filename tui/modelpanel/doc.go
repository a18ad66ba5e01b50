// Package modelpanel is the screen that sets the cycle's lattice value
// beside every ionic model: each model's value, the gap as a bar and in
// kJ/mol and percent, the verdict on covalent character with its
// thresholds, the Ewald Madelung constant of the chosen structure, and the
// models' settings (structure or CIF file, ρ, Born exponent, radii and CN,
// d₀ source), each editable in place.
package modelpanel
