package notation

import "testing"

// Ion symbols as chemists write them; the readings follow from the
// notation itself (no source needed): digits before a bare sign are the
// charge of a single element and a count in a group.
func TestParseIon(t *testing.T) {
	for _, tc := range []struct {
		in     string
		core   string
		charge int
		ok     bool
	}{
		{"Mg+", "Mg", 1, true},
		{"Mg2+", "Mg", 2, true},
		{"O2-", "O", -2, true},
		{"Fe+3", "Fe", 3, true},
		{"Fe^3+", "Fe", 3, true},
		{"Cl^-", "Cl", -1, true},
		{"Cl2-", "Cl", -2, true},
		{"O²⁻", "O", -2, true},
		{"O2^-", "O2", -1, true},  // superoxide
		{"O2^2-", "O2", -2, true}, // peroxide
		{"NO3-", "NO3", -1, true},
		{"NH4+", "NH4", 1, true},
		{"SO4^2-", "SO4", -2, true},
		{"SO4 2-", "SO4", -2, true},
		{"Fe03+", "", 0, false}, // a leading zero
		{"Na", "", 0, false},    // no charge
		{"Xx+", "", 0, false},   // no element
		{"", "", 0, false},
	} {
		got, ok := ParseIon(tc.in)
		if ok != tc.ok || got.Core != tc.core || got.Charge != tc.charge {
			t.Errorf("ParseIon(%q) = %+v, %v; want %s %d, %v", tc.in, got, ok, tc.core, tc.charge, tc.ok)
		}
	}
}

// Every ion ParseIon reads is written back by IonSymbol (caret for a
// polyatomic core) and read again the same: a round trip, no source needed.
func TestIonSymbolRoundTrip(t *testing.T) {
	for _, s := range []string{"Na+", "Ca2+", "Fe3+", "O2-", "N3-", "NH4+", "NO3-", "SO4^2-", "PO4^3-", "O2^2-"} {
		in, ok := ParseIon(s)
		if !ok {
			t.Fatalf("ParseIon(%q) refused", s)
		}
		poly := len(symbolsIn(in.Core)) > 1 || in.Core != symbolsIn(in.Core)[0]
		back, ok := ParseIon(IonSymbol(in.Core, in.Charge, poly))
		if !ok || back != in {
			t.Errorf("%q → %+v → %q → %+v", s, in, IonSymbol(in.Core, in.Charge, poly), back)
		}
	}
}

// Counts keeps the order of first appearance, which reactions written from
// a formula keep (Ba(N3)2: Ba, then N).
func TestCountsOrder(t *testing.T) {
	for in, want := range map[string][]ElementCount{
		"Ba(N3)2":   {{"Ba", 1}, {"N", 6}},
		"Sr[N3]2":   {{"Sr", 1}, {"N", 6}},
		"NaCl":      {{"Na", 1}, {"Cl", 1}},
		"Ca3(PO4)2": {{"Ca", 3}, {"P", 2}, {"O", 8}},
		"K2SO4":     {{"K", 2}, {"S", 1}, {"O", 4}},
		"Ca(OH)2":   {{"Ca", 1}, {"O", 2}, {"H", 2}},
	} {
		f, err := ParseFormula(in)
		if err != nil {
			t.Fatal(err)
		}
		got := f.Counts()
		if len(got) != len(want) {
			t.Errorf("%s: %v, want %v", in, got, want)
			continue
		}
		for i := range got {
			if got[i] != want[i] {
				t.Errorf("%s: %v, want %v", in, got, want)
				break
			}
		}
	}
}

// GCD on signed integers (Euclid; no source needed).
func TestGCD(t *testing.T) {
	for _, tc := range [][3]int{{12, 18, 6}, {-4, 6, 2}, {3, -9, 3}, {7, 0, 7}, {0, 0, 0}, {1, 1, 1}} {
		if got := GCD(tc[0], tc[1]); got != tc[2] {
			t.Errorf("GCD(%d, %d) = %d, want %d", tc[0], tc[1], got, tc[2])
		}
	}
}
