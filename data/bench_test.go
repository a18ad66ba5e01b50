package data

import (
	"testing"

	"enthalpath/thermo/notation"
)

// go test -run XXX -bench . -benchmem ./data/
func BenchmarkLoad(b *testing.B) {
	b.ReportAllocs()
	for b.Loop() {
		if _, err := Load(); err != nil {
			b.Fatal(err)
		}
	}
}

func BenchmarkLookup(b *testing.B) {
	db := mustLoad(b)
	b.Run("Element", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := db.Element("Fe"); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("Ion", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := db.Ion("Ca2+"); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("IonSpaced", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := db.Ion("Fe+3"); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("Radius", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := db.Radius("Fe", 2, "VI", "HS"); err != nil {
				b.Fatal(err)
			}
		}
	})
	b.Run("Compound", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := db.Compound("NaCl"); err != nil {
				b.Skip(err)
			}
		}
	})
	b.Run("ParseFormula", func(b *testing.B) {
		b.ReportAllocs()
		for b.Loop() {
			if _, err := notation.ParseFormula("Ca3(PO4)2"); err != nil {
				b.Fatal(err)
			}
		}
	})
}
