package analysis

import (
	"math"
	"testing"
)

// The fitted volumes of the common oxoanions against the ion volumes of
// Jenkins, Roobottom, Passmore and Glasser, Inorg. Chem. 38, 3609 (1999),
// Table 4, from memory (the paper is not among the pinned sources). The
// fit here is cruder (one volume for every O ligand, one for every central
// atom), and the 1999 split between cation and anion differs (theirs takes
// cation volumes from radii alone): 30 % is the bound, our choice; the
// differences are logged. At least 80 salts: 93 have a cell or a density
// from a pinned source since the CRC density table left the data (204
// before); the bound guards against the fit running on a handful.
func TestIonVolumesAgainstJenkins1999FromMemory(t *testing.T) {
	a := measuredAnalyst(t)
	f, err := a.IonVolumes()
	if err != nil {
		t.Fatal(err)
	}
	t.Logf("%d salts with a measured V_m, relative RMS %.3f", f.Salts, f.RelativeRMS)
	if f.Salts < 80 || !(f.RelativeRMS > 0) || f.RelativeRMS > 0.25 {
		t.Errorf("fit over %d salts, relative RMS %.3f: want at least 80 salts and an RMS under 25 %%", f.Salts, f.RelativeRMS)
	}
	for _, tc := range []struct {
		ion       string
		published float64 // nm³, Jenkins et al. 1999, from memory
	}{
		{"SO4^2-", 0.091},
		{"CO3^2-", 0.061},
		{"NO3-", 0.064},
		{"ClO4-", 0.082},
	} {
		in, err := a.DB().Ion(tc.ion)
		if err != nil {
			t.Fatal(err)
		}
		v, borrowed, ok := f.Ion(a.DB(), in)
		if !ok || borrowed != 0 {
			t.Errorf("%s: no fitted volume (ok %v, borrowed %g)", tc.ion, ok, borrowed)
			continue
		}
		rel := (v - tc.published) / tc.published
		t.Logf("%-7s fitted %.4f nm³, Jenkins 1999 %.3f (from memory): %+.0f %%", tc.ion, v, tc.published, 100*rel)
		if math.Abs(rel) > 0.30 {
			t.Errorf("%s: fitted %.4f nm³, Jenkins 1999 %.3f nm³ (from memory): %+.0f %%, beyond 30 %%", tc.ion, v, tc.published, 100*rel)
		}
	}
}

// An ion none of whose salts has a measured volume or a radius (MoO₄²⁻)
// is fitted with volumes summed from the ion volumes, every salt of it;
// an ion whose salts have densities or radii (CO₃²⁻) never is.
func TestFitIonFallsBackToIonVolumes(t *testing.T) {
	a := measuredAnalyst(t)
	mo, err := a.FitIon("MoO4^2-", IonFitOptions{Ionic: true})
	if err != nil {
		t.Fatal(err)
	}
	if len(mo.Used()) < 5 || mo.Models() != FitEstimatedVolume {
		t.Errorf("MoO4^2-: %d salts from %q, want at least 5, all %q", len(mo.Used()), mo.Models(), FitEstimatedVolume)
	}
	for _, s := range mo.Used() {
		// The lattice step's σ carries a third of the volume's relative
		// uncertainty on top of the model's own scatter.
		if s.LatticeUncertainty < math.Abs(s.Lattice)*0.05 {
			t.Errorf("%s: lattice %.0f ± %.0f: the estimated volume's uncertainty is missing", s.Formula, s.Lattice, s.LatticeUncertainty)
		}
	}
	co, err := a.FitIon("CO3^2-", IonFitOptions{Ionic: true})
	if err != nil {
		t.Fatal(err)
	}
	for _, s := range co.Used() {
		if s.LatticeFrom == FitEstimatedVolume {
			t.Errorf("CO3^2-: %s took an estimated volume though it has a density or radii", s.Formula)
		}
	}
}
