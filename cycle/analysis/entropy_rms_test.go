package analysis

import (
	"math"
	"slices"
	"testing"

	"enthalpath/thermo/entropy"
)

// entropyErrors returns, for every ionic crystal of the data with a
// measured S° (NBS 1982) and a formula-unit volume of its own (cell or
// density), the relative error of the volume-based estimate (Jenkins &
// Glasser, Inorg. Chem. 42, 8702 (2003): S° = 1360·V_m + 15 J/(mol·K) for
// ionic salts; constants as the paper's abstract gives them, checked
// against its indexed abstract at core.ac.uk/display/1356412). Every such
// salt counts, whether or not the program can estimate its ΔfH°.
func entropyErrors(t *testing.T) (map[string]float64, []string) {
	rel, names, _ := entropyErrorsByDomain(t)
	return rel, names
}

// entropySalt is one salt of entropyErrorsByDomain: its domain verdict
// and the relative error of the Debye lattice entropy where judged.
type entropySalt struct {
	domain   EntropyDomain
	debyeRel float64
}

// entropyErrorsByDomain is entropyErrors with each salt's domain verdict
// (EntropyDomain: θ_D/T ≤ 2 at 298.15 K, θ_D from the extended model).
func entropyErrorsByDomain(t *testing.T) (map[string]float64, []string, map[string]entropySalt) {
	a := testAnalyst(t)
	rel := map[string]float64{}
	salts := map[string]entropySalt{}
	var names []string
	for _, cp := range a.DB().Compounds() {
		st, ok := a.standards.Compound(cp.Formula)
		if !ok || st.Molecular || st.State != "cr" || !st.Entropy.Known() {
			continue
		}
		c, err := a.build(cp.Formula, "", "")
		if err != nil {
			continue
		}
		v := a.volume(c, 0, 0, 0, 0) // no radii: a volume of the compound's own or none
		if !v.Measured {
			continue
		}
		s, err := entropy.FromVolume(v.Value, entropy.Salt)
		if err != nil {
			continue
		}
		rel[cp.Formula] = (s - st.Entropy.V) / st.Entropy.V
		names = append(names, cp.Formula)
		d := entropyDomain(c, v.Value)
		salts[cp.Formula] = entropySalt{domain: d, debyeRel: (d.DebyeEntropy - st.Entropy.V) / st.Entropy.V}
	}
	if len(rel) < 100 {
		t.Fatalf("only %d salts with a measured S° and a volume of their own", len(rel))
	}
	return rel, names, salts
}

func rmsOf(rel map[string]float64) float64 {
	var s2 float64
	for _, r := range rel {
		s2 += r * r
	}
	return math.Sqrt(s2 / float64(len(rel)))
}

// TestEntropyScatterCovered: the σ given to a volume-based estimate is not
// below the RMS relative error over the data (measured when written: 23.6 %
// over 166 salts, median 13.6 %; 22.3 % over 236, median 11.4 %, once every
// salt with a volume of its own counted), and the median error stays below 20 %
// (our own check of the typical salt; common practice, no source).
func TestEntropyScatterCovered(t *testing.T) {
	rel, _ := entropyErrors(t)
	rms := rmsOf(rel)
	var abs []float64
	for _, r := range rel {
		abs = append(abs, math.Abs(r))
	}
	slices.Sort(abs)
	median := abs[len(abs)/2]
	t.Logf("volume-based S° over %d salts: RMS relative error %.1f %%, median %.1f %%", len(rel), 100*rms, 100*median)
	if EntropyRelativeUncertainty < rms {
		failUnlessDensityLoss(t, "entropy RMS", "EntropyRelativeUncertainty %.2f below the measured RMS %.3f", EntropyRelativeUncertainty, rms)
	}
	if median >= 0.20 {
		t.Errorf("median relative error %.1f %% ≥ 20 %%", 100*median)
	}
}

// entropyByDomain splits the salts of entropyErrorsByDomain by their
// domain verdict, logs each group's RMS and, outside the domain, the Debye
// lattice entropy's RMS beside the line's on the same salts.
func entropyByDomain(t *testing.T) (inside, outside map[string]float64) {
	rel, names, salts := entropyErrorsByDomain(t)
	inside, outside = map[string]float64{}, map[string]float64{}
	unjudged, debye := map[string]float64{}, map[string]float64{}
	from := map[string]int{}
	for _, n := range names {
		d := salts[n].domain
		from[d.DebyeFrom]++
		switch {
		case !d.Judged:
			unjudged[n] = rel[n]
		case d.Inside:
			inside[n] = rel[n]
		default:
			outside[n] = rel[n]
			debye[n] = salts[n].debyeRel
			t.Logf("outside: %-10s θ_D %4.0f K  line %+4.0f %%  Debye %+4.0f %%", n, d.DebyeTemperature, 100*rel[n], 100*salts[n].debyeRel)
		}
	}
	report := func(what string, m map[string]float64) {
		if len(m) == 0 {
			t.Logf("%s: no salts", what)
			return
		}
		t.Logf("%s: %d salts, RMS relative error %.1f %%", what, len(m), 100*rmsOf(m))
	}
	for f, k := range from {
		t.Logf("%d salts with %q", k, f)
	}
	report("volume line, full set", rel)
	report("volume line, inside the domain (θ_D ≤ 2T)", inside)
	report("volume line, outside the domain (θ_D > 2T)", outside)
	report("volume line, domain not judged (no θ_D)", unjudged)
	report("Debye lattice entropy, outside the domain", debye)
	return inside, outside
}

// TestEntropyEstimateRMS holds the bound inside the volume line's
// domain: RMS relative error below 20 % over at least 100 salts, against
// the measured S° of NBS 1982, with the constants of Jenkins & Glasser
// (Inorg. Chem. 42, 8702 (2003), abstract). The domain was set a priori,
// before any residual was looked at (thermo/entropy.MaxReducedDebye:
// θ_D/T ≤ 2 at 298.15 K; one half of θ_D as the edge of the classical
// regime is common practice, no source), θ_D from the extended model's
// curvature where it sums the structure, else from the Born–Mayer
// curvature of the volume-based lattice energy
// (entropy.DebyeTemperatureFromVolume). The salts it puts outside must
// miss by more than those inside (the criterion's physical reason: frozen
// vibrations), and the σ given outside the domain must cover their RMS.
//
// Measured when written: 16.1 % over 193 salts inside, 39.6 % over 43
// outside, 22.3 % over all 236; θ_D from the extended model for 49 salts,
// from the volume-based lattice energy for 187 (the extended model's θ_D
// runs high against calorimetric values recalled from memory: NaCl 375
// against 321 K, KCl 293 against 235 K, MgO 999 against 946 K). The Debye lattice entropy outside the domain misses by 42.1 %,
// every one of them low (θ_D from the bulk sound speed is too high and a
// polyatomic ion's internal modes are left out): it is shown beside the
// line, never in its place.
func TestEntropyEstimateRMS(t *testing.T) {
	inside, outside := entropyByDomain(t)
	if len(inside) < 100 {
		failUnlessDensityLoss(t, "entropy inside", "only %d salts inside the domain, the issue asks for at least 100", len(inside))
	}
	if rms := rmsOf(inside); rms >= 0.20 {
		t.Errorf("inside the domain: RMS relative error %.1f %% over %d salts ≥ 20 %%", 100*rms, len(inside))
	}
	if len(outside) == 0 || rmsOf(outside) <= rmsOf(inside) {
		t.Errorf("outside the domain RMS %.3f over %d salts not above inside %.3f: the criterion does not separate", rmsOf(outside), len(outside), rmsOf(inside))
	}
	if EntropyOutsideRelativeUncertainty < rmsOf(outside) {
		failUnlessDensityLoss(t, "entropy outside RMS", "EntropyOutsideRelativeUncertainty %.2f below the measured RMS outside the domain %.3f", EntropyOutsideRelativeUncertainty, rmsOf(outside))
	}
}

func TestAdditiveOverData(t *testing.T) {
	a := testAnalyst(t)
	fit, err := a.AdditiveEntropies()
	if err != nil {
		t.Fatal(err)
	}
	rel, _ := entropyErrors(t)
	t.Logf("additive S°: %d compounds, %d ions, RMS %.1f J/(mol·K), RMS relative %.1f %%", fit.Samples, len(fit.Theta), fit.RMS, 100*fit.RMSRelative)
	if fit.Samples < 100 {
		t.Errorf("fitted over %d compounds", fit.Samples)
	}
	if fit.RMSRelative >= rmsOf(rel) {
		t.Errorf("additive RMS %.3f not below the volume-based %.3f", fit.RMSRelative, rmsOf(rel))
	}
}
