package ewald

import "math"

//go:generate /usr/bin/python3 erfc_gen.py

// Range of screenedTable: [screenedLower, screenedUpper), in
// screenedSteps intervals per unit of x.
const (
	screenedLower = 0.5
	screenedUpper = screenedLower + float64(len(screenedTable))/screenedSteps
	// screenedFirst is the index, in steps of 1/screenedSteps from x = 0,
	// of the table's first interval.
	screenedFirst = int(screenedLower * screenedSteps)
)

// screened returns the screened Coulomb kernel erfc(x)/x for x > 0, so that
// a real-space Ewald term erfc(α·r)/r is α·screened(α·r): on
// [screenedLower, screenedUpper) a piecewise polynomial of screenedTable
// (no exponential, no division; relative error below 1e-14 against
// math.Erfc(x)/x, see TestScreened), elsewhere math.Erfc(x)/x.
func screened(x float64) float64 {
	w := x * screenedSteps
	k := int(w) - screenedFirst
	// One unsigned comparison rejects both sides (and x < 0, NaN).
	if !(w >= 0) || uint(k) >= uint(len(screenedTable)) {
		return math.Erfc(x) / x
	}
	return screenedPiece(&screenedTable[k], 2*(w-float64(k+screenedFirst))-1)
}

// screenedPiece evaluates one interval's polynomial at t ∈ [−1, 1]: even
// and odd halves as two independent Horner chains in t².
func screenedPiece(c *[9]float64, t float64) float64 {
	v := t * t
	even := (((c[8]*v+c[6])*v+c[4])*v+c[2])*v + c[0]
	odd := (((c[7]*v+c[5])*v+c[3])*v + c[1])
	return even + t*odd
}

// screenedPairs sets e[m] = erfc(α·rₘ)/rₘ for rₘ = √d2[m], the real-space
// Ewald terms of a list of squared distances, in one loop with no call per
// term (screenedPiece is inlined), so the constants stay in registers and
// successive terms overlap. A distance whose α·r falls outside the table
// takes math.Erfc (and r = 0 gives +Inf). Here x = α·r ≥ 0, so the one
// unsigned comparison is the whole range check.
func screenedPairs(alpha float64, d2, e []float64) {
	e = e[:len(d2)]
	for m, r2 := range d2 {
		x := alpha * math.Sqrt(r2)
		w := x * screenedSteps
		k := int(w) - screenedFirst
		if uint(k) >= uint(len(screenedTable)) {
			e[m] = alpha * (math.Erfc(x) / x)
			continue
		}
		e[m] = alpha * screenedPiece(&screenedTable[k], 2*(w-float64(k+screenedFirst))-1)
	}
}
