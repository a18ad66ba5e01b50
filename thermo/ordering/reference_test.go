package ordering

import (
	"encoding/json"
	"math"
	"os"
	"testing"

	"enthalpath/thermo/crystal"
)

// referenceFile is written by testdata/gen_orderings.py with Debian's
// python3-pymatgen 2022.11.7 (EwaldSummation, acc_factor 14): the Li/vacancy
// case of lithiumVacancy, built there independently with
// Structure.from_spacegroup.
const referenceFile = "../../testdata/orderings_reference.json"

type reference struct {
	Pymatgen string `json:"pymatgen"`
	Small    struct {
		Orderings int `json:"orderings"`
		Levels    []struct {
			Energy   float64        `json:"energy_ev"`
			Count    int            `json:"count"`
			Direct   float64        `json:"direct_energy_ev"`
			Occupied []crystal.Vec3 `json:"occupied"`
		} `json:"levels"`
	} `json:"small"`
	Large struct {
		Sites []struct {
			Species string       `json:"species"`
			Frac    crystal.Vec3 `json:"frac"`
		} `json:"sites"`
		Phi    []float64 `json:"phi_upper_ev"`
		Random []struct {
			Energy   float64        `json:"energy_ev"`
			Occupied []crystal.Vec3 `json:"occupied"`
		} `json:"random_orderings"`
	} `json:"large"`
}

func readReference(t *testing.T) reference {
	t.Helper()
	b, err := os.ReadFile(referenceFile)
	if err != nil {
		t.Fatalf("reading %s (run testdata/regenerate.sh): %v", referenceFile, err)
	}
	var r reference
	if err := json.Unmarshal(b, &r); err != nil {
		t.Fatal(err)
	}
	return r
}

// samePlace reports whether fractional positions f and g coincide modulo
// the lattice.
func samePlace(f, g crystal.Vec3) bool {
	for k := range f {
		d := f[k] - g[k]
		if math.Abs(d-math.Round(d)) > 1e-6 {
			return false
		}
	}
	return true
}

// assignmentOf returns the assignment of p that puts Li on the mixed sites
// at the occupied positions.
func assignmentOf(t *testing.T, p *Problem, occupied []crystal.Vec3) []uint8 {
	t.Helper()
	x := make([]uint8, len(p.Mixed))
	for a := range x {
		x[a] = 1 // vacancy
	}
	for _, f := range occupied {
		found := false
		for a, i := range p.Mixed {
			if samePlace(p.Parent.Sites[i].Frac, f) {
				x[a], found = 0, true
			}
		}
		if !found {
			t.Fatalf("no mixed site at %v", f)
		}
	}
	return x
}

// TestEnumerationAgainstPymatgen: the ten lowest energy levels of the 12,870
// Li/vacancy orderings of the 2×2×1 cell, with the number of orderings on
// each, as pymatgen's EwaldSummation gives them (energies to 1e-8 relative;
// the distinct orderings of one level add their multiplicities).
func TestEnumerationAgainstPymatgen(t *testing.T) {
	ref := readReference(t)
	p := lithiumVacancy(t, 2, 2, 1)
	out, err := p.Search(SearchOptions{Method: Enumerate, Keep: 1 << 20})
	if err != nil {
		t.Fatal(err)
	}
	type level struct {
		e     float64
		count int
	}
	var levels []level
	for _, o := range out.Orderings {
		if n := len(levels); n > 0 && relDiff(o.EnergyEV, levels[n-1].e) <= 1e-9 {
			levels[n-1].count += o.Multiplicity
			continue
		}
		levels = append(levels, level{o.EnergyEV, o.Multiplicity})
	}
	if int(out.Total) != ref.Small.Orderings {
		t.Errorf("%g orderings, pymatgen's script %d", out.Total, ref.Small.Orderings)
	}
	for k, want := range ref.Small.Levels {
		if k >= len(levels) {
			t.Fatalf("only %d levels", len(levels))
		}
		got := levels[k]
		if relDiff(got.e, want.Energy) > 1e-8 || got.count != want.Count {
			t.Errorf("level %d: %.10f eV ×%d, pymatgen %.10f eV ×%d (%s)", k+1, got.e, got.count, want.Energy, want.Count, ref.Pymatgen)
		}
		// The level's first ordering, summed directly by pymatgen.
		if e := p.Energy(assignmentOf(t, p, want.Occupied)); relDiff(e, want.Direct) > 1e-8 {
			t.Errorf("level %d ordering: %.10f eV, pymatgen's EwaldSummation %.10f eV", k+1, e, want.Direct)
		}
	}
}

// TestAnnealingAgainstPymatgen: on the 96-site cell (2×2×3, 48 cation
// sites, 3.2·10¹³ orderings) the ten lowest orderings found by annealing
// (seed 1, default schedule) have pymatgen's energies (from its pair
// potentials, 1e-8 relative) in the same order, the lowest being the
// ordering other seeds find too; three random orderings summed directly by
// pymatgen agree as well.
func TestAnnealingAgainstPymatgen(t *testing.T) {
	ref := readReference(t)
	p := lithiumVacancy(t, 2, 2, 3)
	n := len(ref.Large.Sites)
	if n != len(p.Parent.Sites) {
		t.Fatalf("%d sites, reference %d", len(p.Parent.Sites), n)
	}
	// index[i] is the reference site at our site i.
	index := make([]int, n)
	for i, s := range p.Parent.Sites {
		index[i] = -1
		for j, r := range ref.Large.Sites {
			if samePlace(s.Frac, r.Frac) {
				index[i] = j
			}
		}
		if index[i] < 0 {
			t.Fatalf("site %d at %v has no reference site", i+1, s.Frac)
		}
	}
	phi := make([]float64, n*n)
	k := 0
	for i := 0; i < n; i++ {
		for j := i; j < n; j++ {
			phi[i*n+j], phi[j*n+i] = ref.Large.Phi[k], ref.Large.Phi[k]
			k++
		}
	}
	pymatgenEnergy := func(x []uint8) float64 {
		q := make([]float64, n)
		for i, s := range p.Parent.Sites {
			q[index[i]] = s.Charge
		}
		for a, i := range p.Mixed {
			q[index[i]] = p.chargeOf(a, x)
		}
		e := 0.0
		for i := 0; i < n; i++ {
			for j := 0; j < n; j++ {
				e += 0.5 * q[i] * q[j] * phi[i*n+j]
			}
		}
		return e
	}
	for _, r := range ref.Large.Random {
		x := assignmentOf(t, p, r.Occupied)
		if e := p.Energy(x); relDiff(e, r.Energy) > 1e-8 {
			t.Errorf("random ordering: %.10f eV, pymatgen's EwaldSummation %.10f eV", e, r.Energy)
		}
		if e := pymatgenEnergy(x); relDiff(e, r.Energy) > 1e-9 {
			t.Errorf("random ordering: %.10f eV from pymatgen's pair potentials, %.10f eV summed directly", e, r.Energy)
		}
	}
	out, err := p.Search(SearchOptions{Method: Anneal, Seed: 1})
	if err != nil {
		t.Fatal(err)
	}
	if len(out.Orderings) != DefaultKeep {
		t.Fatalf("%d orderings listed", len(out.Orderings))
	}
	prev := math.Inf(-1)
	for k, o := range out.Orderings {
		e := pymatgenEnergy(o.Assignment)
		if relDiff(o.EnergyEV, e) > 1e-8 {
			t.Errorf("rank %d: %.10f eV, pymatgen %.10f eV", k+1, o.EnergyEV, e)
		}
		if e < prev-1e-9*math.Abs(e) {
			t.Errorf("rank %d: pymatgen's energy %.10f eV lies below rank %d's %.10f eV", k+1, e, k, prev)
		}
		prev = e
	}
	// Other seeds find the same lowest ordering (same energy, same
	// multiplicity).
	for _, seed := range []int64{2, 3} {
		o, err := p.Search(SearchOptions{Method: Anneal, Seed: seed, Keep: 1})
		if err != nil {
			t.Fatal(err)
		}
		if relDiff(o.Orderings[0].EnergyEV, out.Orderings[0].EnergyEV) > 1e-12 || string(o.Orderings[0].Assignment) != string(out.Orderings[0].Assignment) {
			t.Errorf("seed %d: lowest %.10f eV, seed 1 %.10f eV", seed, o.Orderings[0].EnergyEV, out.Orderings[0].EnergyEV)
		}
	}
}
