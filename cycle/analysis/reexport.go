package analysis

import "enthalpath/thermo/gibbs"

// CurveVerdict is the 2σ verdict (gibbs.Judge) on one point of a
// stability curve, for a front end that prints the curves without
// importing thermo's physics (DEVELOPERS.md § Architecture).
func CurveVerdict(p gibbs.Point) gibbs.Verdict { return gibbs.Judge(p.Gibbs, p.Uncertainty) }
