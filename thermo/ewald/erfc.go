package ewald

import "math"

//go:generate /usr/bin/python3 erfc_gen.py

// Range of screenedTable: [screenedLower, screenedUpper) in steps of 1/16.
const (
	screenedLower = 0.5
	screenedUpper = screenedLower + float64(len(screenedTable))/16
)

// screened returns the screened Coulomb kernel erfc(x)/x for x > 0, so that
// a real-space Ewald term erfc(α·r)/r is α·screened(α·r): on
// [screenedLower, screenedUpper) a piecewise polynomial of screenedTable
// (no exponential, no division; relative error below 1e-14 against
// math.Erfc(x)/x, see TestScreened), elsewhere math.Erfc(x)/x.
func screened(x float64) float64 {
	u := (x - screenedLower) * 16
	if !(u >= 0 && x < screenedUpper) {
		return math.Erfc(x) / x
	}
	k := int(u)
	t := (u-float64(k))*2 - 1 // centre of the interval at t = 0
	c := &screenedTable[k]
	// Even and odd halves as two independent Horner chains in t².
	v := t * t
	even := ((((c[10]*v+c[8])*v+c[6])*v+c[4])*v+c[2])*v + c[0]
	odd := ((((c[11]*v+c[9])*v+c[7])*v+c[5])*v+c[3])*v + c[1]
	return even + t*odd
}
