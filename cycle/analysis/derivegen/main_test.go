package main

import (
	"bytes"
	"os"
	"testing"

	"enthalpath/data"
)

// The committed derived_ions.csv is what the generator writes from the
// committed tables (the same check .ci/run makes with git diff).
func TestCommittedTableIsCurrent(t *testing.T) {
	db, err := data.LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	var buf bytes.Buffer
	if err := generate(&buf, db, builtinChoices, t.Logf); err != nil {
		t.Fatal(err)
	}
	committed, err := os.ReadFile("../../../data/tables/" + data.DerivedIonsFile)
	if err != nil {
		t.Fatal(err)
	}
	if !bytes.Equal(buf.Bytes(), committed) {
		t.Error("data/tables/derived_ions.csv is not what the generator writes from the current tables: run go run ./cycle/analysis/derivegen")
	}
}

func TestChoicesRefused(t *testing.T) {
	db, err := data.LoadWithoutDerived()
	if err != nil {
		t.Fatal(err)
	}
	for _, bad := range []string{
		"ion,model,reason\n",                          // wrong header
		"ion,from,only,reason\nO2-,kapustinskii,,\n",  // no reason
		"ion,from,only,reason\nCl-,volume,,because\n", // Cl⁻ is measured
	} {
		if err := generate(&bytes.Buffer{}, db, []byte(bad), t.Logf); err == nil {
			t.Errorf("choices %q accepted", bad)
		}
	}
}

// BenchmarkGenerate is the generator's whole run after loading: every ion.
func BenchmarkGenerate(b *testing.B) {
	db, err := data.LoadWithoutDerived()
	if err != nil {
		b.Fatal(err)
	}
	for b.Loop() {
		if err := generate(&bytes.Buffer{}, db, builtinChoices, func(string, ...any) {}); err != nil {
			b.Fatal(err)
		}
	}
}
