package ewald

import "math"

//go:generate /usr/bin/python3 erfc_gen.py

// erfcxUpper is the end of the range covered by erfcxTable.
const erfcxUpper = 0.25 * float64(len(erfcxTable))

// erfc returns the complementary error function for x ≥ 0 with one
// exponential: erfc(x) = exp(−x²)·erfcx(x), erfcx from the piecewise
// polynomials of erfcxTable (relative error below 1e-14 against math.Erfc;
// see TestFastErfc). Outside [0, erfcxUpper) it is math.Erfc.
func erfc(x float64) float64 {
	if !(x >= 0 && x < erfcxUpper) {
		return math.Erfc(x)
	}
	k := int(x * 4)
	t := (x-0.25*float64(k))*8 - 1 // centre of [k/4, (k+1)/4] is k/4 + 1/8
	c := &erfcxTable[k]
	// Even and odd halves as two independent Horner chains in t².
	u := t * t
	even := ((((c[10]*u+c[8])*u+c[6])*u+c[4])*u+c[2])*u + c[0]
	odd := ((((c[11]*u+c[9])*u+c[7])*u+c[5])*u+c[3])*u + c[1]
	return math.Exp(-x*x) * (even + t*odd)
}
