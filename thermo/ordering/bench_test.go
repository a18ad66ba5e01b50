package ordering

import "testing"

// BenchmarkMillionSwaps: 10⁶ attempted swaps (each an O(1) energy change,
// accepted ones an O(M) update) of simulated annealing on the Li/vacancy
// problem of a 96-site cell (2×2×3 conventional rock salt, 48 mixed
// sites); target under 2 s per operation.
func BenchmarkMillionSwaps(b *testing.B) {
	p := lithiumVacancy(b, 2, 2, 3)
	b.ReportAllocs()
	b.ResetTimer()
	var out Outcome
	for i := 0; i < b.N; i++ {
		var err error
		out, err = p.Search(SearchOptions{Method: Anneal, Restarts: 1, Sweeps: 1000000 / 48, Seed: int64(i)})
		if err != nil {
			b.Fatal(err)
		}
	}
	b.ReportMetric(float64(out.Visited), "swaps/op")
}

// BenchmarkSetup96: pair potentials, symmetry (768 operations) and the
// reference Ewald sum of the 96-site problem.
func BenchmarkSetup96(b *testing.B) {
	b.ReportAllocs()
	for i := 0; i < b.N; i++ {
		lithiumVacancy(b, 2, 2, 3)
	}
}
