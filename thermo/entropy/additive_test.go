package entropy

import (
	"errors"
	"math"
	"math/rand/v2"
	"testing"
)

// Property test: entropies built exactly from known contributions (seeded
// random θ, random salts with mixed stoichiometries that fix every θ) are
// recovered, and the residual is zero.
func TestFitIonsRecovers(t *testing.T) {
	rng := rand.New(rand.NewPCG(16, 2003))
	cations := []string{"A+", "B+", "C2+", "D2+", "E3+"}
	anions := []string{"X-", "Y-", "Z2-"}
	theta := map[string]float64{}
	for _, ion := range append(append([]string{}, cations...), anions...) {
		theta[ion] = 10 + 60*rng.Float64()
	}
	charge := map[string]int{"A+": 1, "B+": 1, "C2+": 2, "D2+": 2, "E3+": 3, "X-": 1, "Y-": 1, "Z2-": 2}
	var samples []Sample
	for _, c := range cations {
		for _, a := range anions {
			// neutral formula: n_c·z_c = n_a·z_a
			zc, za := charge[c], charge[a]
			g := gcd(zc, za)
			nc, na := za/g, zc/g
			samples = append(samples, Sample{Name: c + a, Ions: map[string]int{c: nc, a: na},
				Entropy: float64(nc)*theta[c] + float64(na)*theta[a]})
		}
	}
	fit, err := FitIons(samples, 2)
	if err != nil {
		t.Fatal(err)
	}
	if fit.RMS > 1e-6 {
		t.Errorf("RMS residual %g on exact data", fit.RMS)
	}
	for _, s := range samples {
		got, ok := fit.Estimate(s.Ions)
		if !ok || math.Abs(got-s.Entropy) > 1e-6 {
			t.Errorf("%s: %g, want %g", s.Name, got, s.Entropy)
		}
	}
	if _, ok := fit.Estimate(map[string]int{"Q+": 1}); ok {
		t.Errorf("an ion never fitted was estimated")
	}
	if _, err := FitIons(samples[:1], 1); !errors.Is(err, ErrTooFewSamples) {
		t.Errorf("one sample: %v", err)
	}
}

func gcd(a, b int) int {
	for b != 0 {
		a, b = b, a%b
	}
	return a
}
