// Package hessdiagram turns the steps of a Born–Haber cycle into the levels
// and arrows of an energy diagram (package diagram): it walks the terms of
// Hess's sum in order from the elements, names each level by the species
// present, and adds the formation step as the arrow that closes the cycle.
package hessdiagram
