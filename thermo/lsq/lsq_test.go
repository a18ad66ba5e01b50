package lsq

import (
	"errors"
	"math"
	"testing"
)

// Systems solved by hand: [[4,2],[2,3]]·x = [2,1] has x = (0.5, 0);
// [[4,2,0],[2,5,1],[0,1,2]]·x = [6,8,3] has x = (1, 1, 1).
func TestSolveSPD(t *testing.T) {
	for _, tc := range []struct {
		m, b, want []float64
	}{
		{[]float64{4, 2, 2, 3}, []float64{2, 1}, []float64{0.5, 0}},
		{[]float64{4, 2, 0, 2, 5, 1, 0, 1, 2}, []float64{6, 8, 3}, []float64{1, 1, 1}},
	} {
		x, err := SolveSPD(tc.m, tc.b, len(tc.b))
		if err != nil {
			t.Fatal(err)
		}
		for i := range x {
			if math.Abs(x[i]-tc.want[i]) > 1e-12 {
				t.Errorf("%v: x = %v, want %v", tc.m, x, tc.want)
			}
		}
	}
	if _, err := SolveSPD([]float64{1, 2, 2, 1}, []float64{1, 1}, 2); !errors.Is(err, ErrNotPositiveDefinite) {
		t.Errorf("an indefinite matrix: %v", err)
	}
}
