package cycle

import "testing"

// BenchmarkSolve is one Solve of the NaCl cycle with all five models, the
// Ewald sum coming from the memo (as on every keystroke after the first).
func BenchmarkSolve(b *testing.B) {
	c := build(b, "NaCl", Options{})
	if _, err := Solve(c); err != nil { // fills the memo
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := Solve(c); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkSolveWithModelLattice fills the lattice from a model and solves
// the formation enthalpy (the hypothetical-compound path).
func BenchmarkSolveWithModelLattice(b *testing.B) {
	c := build(b, "MgCl", Options{})
	c.Settings.LatticeFrom = ModelBornMayer
	c.Settings.Structure = Structure{Prototype: "rock-salt", Params: map[string]float64{"a": 5.1}}
	c.Settings.Distance = DistanceGeometry
	c.SolveFor("formation")
	if _, err := Solve(c); err != nil {
		b.Fatal(err)
	}
	b.ReportAllocs()
	b.ResetTimer()
	for i := 0; i < b.N; i++ {
		if _, err := Solve(c); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuild is Build of the NaCl cycle from the loaded data.
func BenchmarkBuild(b *testing.B) {
	db := loadDB(b)
	memo := NewMemo()
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		if _, err := Build(db, "NaCl", Options{Memo: memo}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkBuildHypothetical is Build of MgCl with the ions given (Mg⁺ is
// not in the data): the path of every oxidation state of a scan.
func BenchmarkBuildHypothetical(b *testing.B) {
	db := loadDB(b)
	memo := NewMemo()
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Build(db, "MgCl", Options{Cation: "Mg+", Anion: "Cl-", Memo: memo}); err != nil {
			b.Fatal(err)
		}
	}
}

// BenchmarkClone is one Clone of the NaCl cycle (an Analyst hands out a
// clone of each cycle it remembers).
func BenchmarkClone(b *testing.B) {
	c := build(b, "NaCl", Options{})
	b.ReportAllocs()
	for b.Loop() {
		_ = c.Clone()
	}
}
