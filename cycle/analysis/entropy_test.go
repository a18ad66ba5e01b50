package analysis

import (
	"math"
	"testing"

	"enthalpath/thermo/entropy"
)

// TestPackingFraction measures Σ(4π/3)r³/V_m over the data's compounds
// whose V_m comes from their own cell or density (radii as the estimates
// take them: Shannon CN VI, thermochemical for polyatomic ions) and checks
// PackingFraction and PackingRelativeUncertainty against the figures:
// the constant within 0.03 of the mean, the stated σ not below the RMS
// relative scatter. Common practice, no source: the constant is the data's.
func TestPackingFraction(t *testing.T) {
	var fr []float64
	for _, o := range ownVolumes(t, testAnalyst(t)) {
		rc, ra := o.est.Cation.Radius.Value, o.est.Anion.Radius.Value
		if !(rc > 0 && ra > 0) {
			continue
		}
		spheres := float64(o.est.Cation.Count)*entropy.SphereVolume(rc) + float64(o.est.Anion.Count)*entropy.SphereVolume(ra)
		fr = append(fr, spheres/o.volume.Value)
	}
	if len(fr) < 50 {
		t.Fatalf("only %d compounds with a measured volume and radii", len(fr))
	}
	var sum, sum2 float64
	for _, f := range fr {
		sum += f
	}
	mean := sum / float64(len(fr))
	for _, f := range fr {
		sum2 += sq(f/mean - 1)
	}
	rms := math.Sqrt(sum2 / float64(len(fr)))
	t.Logf("packing fraction over %d compounds: mean %.3f, RMS relative scatter %.1f %%", len(fr), mean, 100*rms)
	if math.Abs(PackingFraction-mean) > 0.03 {
		t.Errorf("PackingFraction %.2f, the data's mean %.3f", PackingFraction, mean)
	}
	if PackingRelativeUncertainty < rms {
		t.Errorf("PackingRelativeUncertainty %.2f below the scatter %.3f", PackingRelativeUncertainty, rms)
	}
}

// ownVolume is a compound of the data whose formula-unit volume comes from
// its own cell or density, with its estimate (for the radii).
type ownVolume struct {
	formula string
	est     *Estimate
	volume  Quantity
}

func ownVolumes(t *testing.T, a *Analyst) []ownVolume {
	t.Helper()
	var out []ownVolume
	for _, cp := range a.DB().Compounds() {
		est, c, err := a.quickEstimateCycle(cp.Formula, EstimateOptions{})
		if err != nil || c == nil {
			continue
		}
		if v := a.formulaVolume(est, c); v.Measured {
			out = append(out, ownVolume{cp.Formula, est, v})
		}
	}
	return out
}
