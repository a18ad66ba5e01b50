package lattice

import (
	"errors"
	"math"
	"testing"
)

// near reports whether got is within abs or rel·|want| of want.
func near(got, want, abs, rel float64) bool {
	d := math.Abs(got - want)
	return d <= abs || d <= rel*math.Abs(want)
}

func checkNear(t *testing.T, what string, got, want, abs, rel float64) {
	t.Helper()
	if !near(got, want, abs, rel) {
		t.Errorf("%s = %.6g, want %.6g (abs %g, rel %g)", what, got, want, abs, rel)
	}
}

// wantParamErr checks that err is a *ParamError for param wrapping sentinel.
func wantParamErr(t *testing.T, what string, err error, param string, sentinel error) {
	t.Helper()
	if err == nil {
		t.Errorf("%s: no error, want %v on %s", what, sentinel, param)
		return
	}
	var pe *ParamError
	if !errors.As(err, &pe) {
		t.Errorf("%s: error %q is not a *ParamError", what, err)
		return
	}
	if !errors.Is(err, sentinel) {
		t.Errorf("%s: error %q does not wrap %v", what, err, sentinel)
	}
	if param != "" && pe.Param != param {
		t.Errorf("%s: error names %q, want %q (%v)", what, pe.Param, param, err)
	}
}

// Ions of a few formula units used across the tests.
var (
	ionsNaCl = []IonKind{{Charge: 1, Count: 1}, {Charge: -1, Count: 1}}
	ionsKCl  = ionsNaCl
	ionsCaF2 = []IonKind{{Charge: 2, Count: 1}, {Charge: -1, Count: 2}}
	ionsK2O  = []IonKind{{Charge: 1, Count: 2}, {Charge: -2, Count: 1}}
	ionsMgO  = []IonKind{{Charge: 2, Count: 1}, {Charge: -2, Count: 1}}
	ionsAl2O = []IonKind{{Charge: 3, Count: 2}, {Charge: -2, Count: 3}}
	ionsKNO3 = []IonKind{{Charge: 1, Count: 1}, {Charge: -1, Count: 1, Shape: Nonlinear}}
)
