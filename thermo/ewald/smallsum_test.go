package ewald

import (
	"encoding/json"
	"errors"
	"math"
	"math/rand"
	"os"
	"slices"
	"testing"

	"enthalpath/thermo/crystal"
)

// randomSmallCell returns a neutral cell of n sites on a random lattice
// (triclinic, vectors of 3 to 7 Å, off-diagonal parts up to ±0.75 Å) with
// random positions and integer charges up to ±3.
func randomSmallCell(rng *rand.Rand, n int) *crystal.Crystal {
	return randomSmallCellPlaced(rng, n, nil)
}

// randomSmallCellPlaced is randomSmallCell with place, when not nil, given
// each site's drawn position (and the sites before it) to keep or replace.
func randomSmallCellPlaced(rng *rand.Rand, n int, place func(j int, before []crystal.Site, f crystal.Vec3) crystal.Vec3) *crystal.Crystal {
	c := &crystal.Crystal{Name: "random small cell", FormulaUnits: 1}
	for k := 0; k < 3; k++ {
		c.Lattice[k][k] = 3 + 4*rng.Float64()
		for d := 0; d < 3; d++ {
			if d != k {
				c.Lattice[k][d] = 1.5 * (rng.Float64() - 0.5)
			}
		}
	}
	total := 0.0
	for j := 0; j < n; j++ {
		q := float64(1 + rng.Intn(3))
		if j%2 == 1 {
			q = -q
		}
		if j == n-1 {
			q = -total
		}
		total += q
		f := crystal.Vec3{rng.Float64(), rng.Float64(), rng.Float64()}
		if place != nil {
			f = place(j, c.Sites, f)
		}
		c.Sites = append(c.Sites, crystal.Site{Species: "X", Charge: q, Frac: f})
	}
	return c
}

// checkSmallAgainstGeneral sums c by the small path (which must take it)
// and by the general path at 1e-12, and compares energies, potentials and
// the nearest cation–anion distance: the small path's energy must be
// within tol relative of the finer sum, its potentials within tol of the
// largest of them. The general path is checked against pymatgen in
// reference_test.go.
func checkSmallAgainstGeneral(t *testing.T, label string, c *crystal.Crystal, tol float64) {
	t.Helper()
	eps := DefaultAccuracy
	small, ok := sumSmall(c, eps, eps, 0)
	if !ok {
		t.Errorf("%s (%d sites): the small path declined", label, len(c.Sites))
		return
	}
	general, err := Sum(c, Options{Accuracy: 1e-12, general: true})
	var acc *AccuracyError
	if err != nil && !errors.As(err, &acc) {
		t.Errorf("%s: general path: %v", label, err)
		return
	}
	if d := relDiff(small.EnergyEV, general.EnergyEV); !(d <= tol) {
		t.Errorf("%s (%d sites): energy %.15g eV, general path at 1e-12 %.15g (relative difference %.3g)",
			label, len(c.Sites), small.EnergyEV, general.EnergyEV, d)
	}
	scale := 0.0
	for _, v := range general.SitePotentials {
		scale = math.Max(scale, math.Abs(v))
	}
	for i, v := range general.SitePotentials {
		if d := math.Abs(small.SitePotentials[i] - v); !(d <= tol*scale) {
			t.Errorf("%s, site %d: potential %.15g V, general path %.15g", label, i, small.SitePotentials[i], v)
		}
	}
	if d := relDiff(small.NearestDistance, general.NearestDistance); !(d <= 1e-12) {
		t.Errorf("%s: nearest cation–anion %.15g Å, general path %.15g", label, small.NearestDistance, general.NearestDistance)
	}
	if !(small.EstimatedError <= eps) {
		t.Errorf("%s: estimated error %.3g above %.3g", label, small.EstimatedError, eps)
	}
}

// TestSmallPathEqualsGeneral: on random triclinic neutral cells of 2 to
// smallSites sites, and on their random supercells up to smallFull sites
// (which the small path reduces back by its translation search), the
// small path at the default accuracy gives the energies and potentials of
// the general path at 1e-12 to 1e-10 relative, the accuracy it promises.
func TestSmallPathEqualsGeneral(t *testing.T) {
	rng := rand.New(rand.NewSource(1919))
	for trial := 0; trial < 150; trial++ {
		n := 2 + rng.Intn(smallSites-1)
		c := randomSmallCell(rng, n)
		checkSmallAgainstGeneral(t, "random cell", c, 1e-10)
		// A supercell along one or two axes, sites in a shuffled order.
		var mult [3]int
		for k := range mult {
			mult[k] = 1
		}
		for k := 0; k < 3 && n*mult[0]*mult[1]*mult[2]*2 <= smallFull; k++ {
			if rng.Intn(2) == 0 {
				mult[k] = 2
			}
		}
		if mult == [3]int{1, 1, 1} {
			continue
		}
		sc, err := c.Supercell(mult[0], mult[1], mult[2])
		if err != nil {
			t.Fatal(err)
		}
		rng.Shuffle(len(sc.Sites), func(i, j int) { sc.Sites[i], sc.Sites[j] = sc.Sites[j], sc.Sites[i] })
		var f [smallFull]crystal.Vec3
		var q [smallFull]float64
		for i, s := range sc.Sites {
			f[i], q[i] = wrapFrac(s.Frac), s.Charge
		}
		var gr smallGroup
		if !gr.find(f[:len(sc.Sites)], q[:len(sc.Sites)]) || gr.size != mult[0]*mult[1]*mult[2] {
			t.Errorf("trial %d: supercell %v of %d sites: %d translations found", trial, mult, n, gr.size)
		}
		checkSmallAgainstGeneral(t, "random supercell", sc, 1e-10)
	}
}

// TestSmallPathPrototypes: every built-in prototype whose primitive cell
// has at most smallSites sites takes the small path and agrees with the
// general path to 1e-10; rutile, spinel and corundum (6, 10 and 14 sites
// in the primitive cell) do not take it.
func TestSmallPathPrototypes(t *testing.T) {
	for _, p := range crystal.Prototypes() {
		c, err := crystal.Build(p.Name, nil)
		if err != nil {
			t.Fatal(err)
		}
		if p.Name == "rutile" || p.Name == "spinel" || p.Name == "corundum" {
			if _, ok := sumSmall(c, DefaultAccuracy, DefaultAccuracy, 0); ok {
				t.Errorf("%s took the small path", p.Name)
			}
			continue
		}
		checkSmallAgainstGeneral(t, p.Name, c, 1e-10)
	}
}

// TestSmallPathAccuracy: on random small cells the small path at the
// default accuracy is within 1e-10 relative of the general path at 1e-12.
func TestSmallPathAccuracy(t *testing.T) {
	rng := rand.New(rand.NewSource(2026))
	for trial := 0; trial < 40; trial++ {
		c := randomSmallCell(rng, 2+rng.Intn(smallSites-1))
		r := sum(t, c, Options{})
		ref := sum(t, c, Options{Accuracy: 1e-12, general: true})
		if d := relDiff(r.EnergyEV, ref.EnergyEV); !(d <= DefaultAccuracy) {
			t.Errorf("trial %d (%d sites): %.15g eV, general at 1e-12 %.15g (relative difference %.3g)",
				trial, len(c.Sites), r.EnergyEV, ref.EnergyEV, d)
		}
	}
}

// TestSmallPathPymatgen: the prototypes of ewald_reference.json (pymatgen's
// EwaldSummation, see reference_test.go) that take the small path have
// pymatgen's energy to 1e-8 relative, the tolerance of reference_test.go.
func TestSmallPathPymatgen(t *testing.T) {
	b, err := os.ReadFile("../../testdata/ewald_reference.json")
	if err != nil {
		t.Fatal(err)
	}
	var ref struct {
		Prototypes []struct {
			Key       string             `json:"key"`
			Prototype string             `json:"prototype"`
			Params    map[string]float64 `json:"params"`
			Supercell []int              `json:"supercell"`
			Ions      map[string][2]any  `json:"ions"`
			EnergyEV  float64            `json:"energy_ev"`
		} `json:"prototypes"`
	}
	if err := json.Unmarshal(b, &ref); err != nil {
		t.Fatal(err)
	}
	taken := 0
	for _, rs := range ref.Prototypes {
		c, err := crystal.Build(rs.Prototype, rs.Params)
		if err != nil {
			t.Fatal(err)
		}
		ions := map[string]crystal.Ion{}
		for label, v := range rs.Ions {
			ions[label] = crystal.Ion{Species: v[0].(string), Charge: v[1].(float64)}
		}
		if c, err = c.WithIons(ions); err != nil {
			t.Fatal(err)
		}
		if len(rs.Supercell) == 3 {
			if c, err = c.Supercell(rs.Supercell[0], rs.Supercell[1], rs.Supercell[2]); err != nil {
				t.Fatal(err)
			}
		}
		r, ok := sumSmall(c, DefaultAccuracy, DefaultAccuracy, 0)
		if !ok {
			continue
		}
		taken++
		if d := relDiff(r.EnergyEV, rs.EnergyEV); !(d <= 1e-8) {
			t.Errorf("%s: small path %.12g eV, pymatgen %.12g (relative difference %.3g)", rs.Key, r.EnergyEV, rs.EnergyEV, d)
		}
	}
	if taken < 10 {
		t.Errorf("only %d pymatgen structures took the small path", taken)
	}
}

// TestSmallPathCharged: a charged small cell (the charged cells of
// oxidation_reference.json that fit, and random ones) has on the small path
// the general path's total with its neutralising background, although the
// two choose different splitting parameters and so different background
// terms (the general path summed at 1e-12).
func TestSmallPathCharged(t *testing.T) {
	rng := rand.New(rand.NewSource(7))
	for trial := 0; trial < 30; trial++ {
		c := randomSmallCell(rng, 2+rng.Intn(smallSites-1))
		c.Sites[0].Charge += 1
		r, _, err := SumCharged(c, Options{})
		if err != nil {
			t.Fatal(err)
		}
		g, _, err := SumCharged(c, Options{Accuracy: 1e-12, general: true})
		var acc *AccuracyError
		if err != nil && !errors.As(err, &acc) {
			t.Fatal(err)
		}
		if r.Alpha == g.Alpha {
			t.Errorf("trial %d: both paths chose α = %g: not a check of the background", trial, r.Alpha)
		}
		// 1e-9: on cell 18 of this seed both paths at the default 1e-10
		// miss the 1e-12 sum by more than 1e-10 (general 1.2e-10, small
		// 1.7e-10; both estimate 5e-11), so the estimate, not the path,
		// limits this check.
		if d := relDiff(r.EnergyEV, g.EnergyEV); !(d <= 1e-9) {
			t.Errorf("trial %d: charged cell %.15g eV, general path %.15g (relative difference %.3g)", trial, r.EnergyEV, g.EnergyEV, d)
		}
	}
}

// TestSmallPathDeclines: the small path leaves to the general path a cell
// with two ions at one position, a cell too large, and a needle-shaped
// cell whose reciprocal indices pass smallOrder.
func TestSmallPathDeclines(t *testing.T) {
	c := randomSmallCell(rand.New(rand.NewSource(3)), 4)
	c.Sites[2].Frac = c.Sites[1].Frac.Add(crystal.Vec3{1, 0, 0})
	if _, ok := sumSmall(c, DefaultAccuracy, DefaultAccuracy, 0); ok {
		t.Error("a cell with two ions at one position took the small path")
	}
	if _, ok := sumSmall(rockSaltSupercell(t, 2, 0.02), DefaultAccuracy, DefaultAccuracy, 0); ok {
		t.Error("a 64-ion cell took the small path")
	}
	needle := randomSmallCell(rand.New(rand.NewSource(4)), 2)
	needle.Lattice[2] = crystal.Vec3{0, 0, 60}
	if _, ok := sumSmall(needle, DefaultAccuracy, DefaultAccuracy, 0); ok {
		t.Error("a needle of 60 Å took the small path")
	}
	checkDeclinedSumStillWorks := func(c *crystal.Crystal) {
		r := sum(t, c, Options{})
		g := sum(t, c, Options{general: true})
		if r.EnergyEV != g.EnergyEV {
			t.Errorf("declined cell: Sum %.15g, general path %.15g", r.EnergyEV, g.EnergyEV)
		}
	}
	checkDeclinedSumStillWorks(needle)
}

// FuzzSmallPath: arbitrary cells of two to four ions, and their supercells
// along one axis with the sites in reverse order, summed on the small path
// and on the general path: never a panic, and where both give an energy
// without an error they agree to 1e-8 relative (each promises 1e-10).
func FuzzSmallPath(f *testing.F) {
	f.Add(5.64, 0.0, 0.0, 0.0, 5.64, 0.0, 0.0, 0.0, 5.64, 0.5, 0.5, 0.5, 0.25, 0.1, 0.9, uint8(2))
	f.Add(3.0, 0.0, 0.0, -1.5, 2.6, 0.0, 0.0, 0.0, 4.9, 0.333, 0.667, 0.375, 0.5, 0.5, 0.0, uint8(4))
	f.Add(4.0, 0.0, 0.0, 0.0, 4.0, 0.0, 0.0, 0.0, 4.0, 0.5, 0.5, 0.5, 0.5, 0.0, 0.0, uint8(7))
	f.Fuzz(func(t *testing.T, a0, a1, a2, b0, b1, b2, c0, c1, c2, x, y, z, u, v, w float64, n uint8) {
		cr := &crystal.Crystal{
			Name:         "fuzz",
			Lattice:      [3]crystal.Vec3{{a0, a1, a2}, {b0, b1, b2}, {c0, c1, c2}},
			FormulaUnits: 1,
		}
		k := 2 + int(n%3)
		positions := []crystal.Vec3{{0, 0, 0}, {x, y, z}, {u, v, w}, {x, v, z}}
		charges := map[int][]float64{2: {1, -1}, 3: {2, -1, -1}, 4: {1, -1, 1, -1}}[k]
		for i := 0; i < k; i++ {
			cr.Sites = append(cr.Sites, crystal.Site{Species: "S", Charge: charges[i], Frac: positions[i]})
		}
		if c := cr.Volume(); !(c > 0.5) || c > 1e4 {
			return // keep each run fast
		}
		if axis := int(n/3) % 4; axis < 3 {
			mult := [3]int{1, 1, 1}
			mult[axis] = 2
			sc, err := cr.Supercell(mult[0], mult[1], mult[2])
			if err != nil {
				return
			}
			slices.Reverse(sc.Sites)
			cr = sc
		}
		small, errSmall := Sum(cr, Options{})
		general, errGeneral := Sum(cr, Options{general: true})
		if errSmall != nil || errGeneral != nil {
			return
		}
		if d := relDiff(small.EnergyEV, general.EnergyEV); !(d <= 1e-8) && math.Abs(general.EnergyEV) > 1e-6 {
			t.Errorf("%d sites: energy %.15g eV, general path %.15g (relative difference %.3g)",
				len(cr.Sites), small.EnergyEV, general.EnergyEV, d)
		}
	})
}
