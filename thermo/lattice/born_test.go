package lattice

import (
	"math"
	"math/rand"
	"testing"

	"enthalpath/thermo"
)

// Rock-salt Madelung constant 1.74756 (per formula unit, nearest-neighbour
// distance): Kittel, Introduction to Solid State Physics, and every
// handbook table (from memory; the project's Ewald tests check it to 1e-6).
const madelungRockSalt = 1.74756

// NaCl r₀ = 2.814 Å, the nearest-neighbour distance of the textbook worked
// examples (from memory).
var pairNaCl = IonPair{Madelung: madelungRockSalt, ZCation: 1, ZAnion: -1, R0: 2.814}

func TestBornLandeNaCl(t *testing.T) {
	tests := []struct {
		name     string
		p        IonPair
		n        float64
		want     float64
		abs      float64
		citation string
	}{
		// A standard textbook worked example: A = 1.74756, r₀ = 281 pm,
		// n = 8 gives about −755 kJ/mol (e.g. Housecroft & Sharpe, Inorganic
		// Chemistry, section on lattice energy; from memory, so ±3 kJ/mol).
		{"textbook NaCl", pairNaCl, 8, -755, 3, "Housecroft & Sharpe, from memory"},
		// Hand calculation from the published equation with N_A·e²/(4πε₀) =
		// 1389.3546 kJ·Å/mol (CODATA 2018): 1389.3546·1.74756/2.814·(7/8) = 754.97.
		{"hand NaCl", pairNaCl, 8, -754.97, 0.02, "hand calculation"},
		// Same with r₀ = 2.82 Å and n = 8: 1389.3546·1.74756/2.82·0.875 = 753.36
		// (hand calculation).
		{"hand NaCl 2.82", IonPair{madelungRockSalt, 1, -1, 2.82}, 8, -753.36, 0.02, "hand calculation"},
	}
	for _, tc := range tests {
		got, err := BornLande(tc.p, tc.n)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		checkNear(t, tc.name+" ("+tc.citation+")", got, tc.want, tc.abs, 0)
	}
}

func TestBornMayerNaCl(t *testing.T) {
	tests := []struct {
		name string
		p    IonPair
		rho  float64
		want float64
		abs  float64
	}{
		// Born–Mayer for NaCl with ρ = 0.345 Å: textbook figures lie between
		// −750 and −760 kJ/mol (common textbook result, from memory).
		{"textbook NaCl", pairNaCl, DefaultRho, -755, 5},
		// Hand calculation: 1389.3546·1.74756/2.814·(1 − 0.345/2.814) = 757.04.
		{"hand NaCl", pairNaCl, DefaultRho, -757.04, 0.02},
		// Hand calculation, r₀ = 2.82 Å: 755.65.
		{"hand NaCl 2.82", IonPair{madelungRockSalt, 1, -1, 2.82}, DefaultRho, -755.65, 0.02},
	}
	for _, tc := range tests {
		got, err := BornMayer(tc.p, tc.rho)
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		checkNear(t, tc.name, got, tc.want, tc.abs, 0)
	}
}

func TestBornExponent(t *testing.T) {
	tests := []struct {
		configs []string
		want    float64
	}{
		// Pauling, The Nature of the Chemical Bond: He 5, Ne 7, Ar 9, Kr 10, Xe 12.
		{[]string{"He"}, 5}, {[]string{"Ne"}, 7}, {[]string{"Ar"}, 9}, {[]string{"Kr"}, 10}, {[]string{"Xe"}, 12},
		// Pauling's mean for NaCl: (7 + 9)/2 = 8 (the n of the worked examples).
		{[]string{"Ne", "Ar"}, 8},
		// LiF: (5 + 7)/2 = 6; CsI: (12 + 12)/2 = 12.
		{[]string{"He", "Ne"}, 6}, {[]string{"Xe", "Xe"}, 12},
		// CaF₂ weighted by ion count: (9 + 2·7)/3 = 23/3 (the rule documented in doc.go).
		{[]string{"Ar", "Ne", "Ne"}, 23.0 / 3},
		// d¹⁰ ions listed with the noble gases by Pauling (from memory):
		// AgCl (10 + 9)/2 = 9.5; CuCl (9 + 9)/2 = 9.
		{[]string{"[Kr]4d10", "Ar"}, 9.5}, {[]string{"[Ar] 3d10", "ar"}, 9},
	}
	for _, tc := range tests {
		got, err := BornExponent(tc.configs...)
		if err != nil {
			t.Fatalf("%v: %v", tc.configs, err)
		}
		checkNear(t, "BornExponent", got, tc.want, 1e-12, 0)
	}
	_, err := BornExponent("Ne", "Rn")
	wantParamErr(t, "unknown config", err, "configs[1]", ErrUnknownName)
	_, err = BornExponent()
	wantParamErr(t, "no config", err, "configs", ErrNotPositive)
}

func TestBornErrors(t *testing.T) {
	good := pairNaCl
	tests := []struct {
		name     string
		call     func() error
		param    string
		sentinel error
	}{
		{"zero r0", func() error { p := good; p.R0 = 0; _, err := BornMayer(p, DefaultRho); return err }, "R0", ErrNotPositive},
		{"negative r0", func() error { p := good; p.R0 = -2; _, err := BornLande(p, 8); return err }, "R0", ErrNotPositive},
		{"NaN r0", func() error { p := good; p.R0 = math.NaN(); _, err := Coulomb(p); return err }, "R0", ErrNotPositive},
		{"zero cation", func() error { p := good; p.ZCation = 0; _, err := BornMayer(p, DefaultRho); return err }, "ZCation", ErrZeroCharge},
		{"zero anion", func() error { p := good; p.ZAnion = 0; _, err := BornLande(p, 8); return err }, "ZAnion", ErrZeroCharge},
		{"zero Madelung", func() error { p := good; p.Madelung = 0; _, err := BornLande(p, 8); return err }, "Madelung", ErrNotPositive},
		{"n = 1", func() error { _, err := BornLande(good, 1); return err }, "n", ErrOutOfRange},
		{"n < 1", func() error { _, err := BornLande(good, 0.5); return err }, "n", ErrOutOfRange},
		{"n NaN", func() error { _, err := BornLande(good, math.NaN()); return err }, "n", ErrOutOfRange},
		{"rho = r0", func() error { _, err := BornMayer(good, good.R0); return err }, "rho", ErrOutOfRange},
		{"rho > r0", func() error { _, err := BornMayer(good, 3); return err }, "rho", ErrOutOfRange},
		{"rho <= 0", func() error { _, err := BornMayer(good, 0); return err }, "rho", ErrNotPositive},
		{"eff rho positive u", func() error { _, err := EffectiveRho(700, good); return err }, "u", ErrOutOfRange},
		{"eff rho beyond Coulomb", func() error { _, err := EffectiveRho(-900, good); return err }, "u", ErrNoSolution},
		{"eff n beyond Coulomb", func() error { _, err := EffectiveBornExponent(-900, good); return err }, "u", ErrNoSolution},
	}
	for _, tc := range tests {
		wantParamErr(t, tc.name, tc.call(), tc.param, tc.sentinel)
	}
}

// As ρ → 0 Born–Mayer tends to the Coulomb (Madelung) energy, and so does
// Born–Landé as n → ∞ (both follow from the equations).
func TestCoulombLimits(t *testing.T) {
	c, err := Coulomb(pairNaCl)
	if err != nil {
		t.Fatal(err)
	}
	// Hand calculation: −1389.3546·1.74756/2.814 = −862.82 kJ/mol.
	checkNear(t, "Coulomb NaCl", c, -862.82, 0.02, 0)
	prev := math.Inf(1)
	for _, rho := range []float64{0.3, 0.1, 1e-2, 1e-4, 1e-8} {
		u, err := BornMayer(pairNaCl, rho)
		if err != nil {
			t.Fatal(err)
		}
		d := math.Abs(u - c)
		if d >= prev {
			t.Errorf("ρ = %g: |U − U_C| = %g did not shrink (previous %g)", rho, d, prev)
		}
		prev = d
	}
	if prev > 1e-5 {
		t.Errorf("ρ = 1e-8: Born–Mayer is %g from the Coulomb energy", prev)
	}
	u, _ := BornLande(pairNaCl, 1e12)
	checkNear(t, "Born–Landé n → ∞", u, c, 1e-6, 0)
}

// Scale laws: U ∝ |z₊z₋| and U ∝ 1/r₀ at fixed ρ/r₀ or n.
func TestBornScaleLaws(t *testing.T) {
	rng := rand.New(rand.NewSource(20261201))
	for range 200 {
		p := IonPair{Madelung: 1 + 2*rng.Float64(), ZCation: 1 + rng.Intn(4), ZAnion: -(1 + rng.Intn(3)), R0: 1.5 + 2.5*rng.Float64()}
		n := 5 + 7*rng.Float64()
		u1, err := BornLande(p, n)
		if err != nil {
			t.Fatal(err)
		}
		q := p
		q.ZCation *= 2
		u2, _ := BornLande(q, n)
		checkNear(t, "Born–Landé doubled z₊", u2, 2*u1, 0, 1e-12)
		q = p
		q.ZAnion *= 3
		u3, _ := BornLande(q, n)
		checkNear(t, "Born–Landé tripled z₋", u3, 3*u1, 0, 1e-12)
		// Born–Mayer at fixed ρ/r₀: doubling r₀ and ρ halves U.
		rho := p.R0 * 0.2 * rng.Float64()
		b1, _ := BornMayer(p, rho)
		q = p
		q.R0 *= 2
		b2, _ := BornMayer(q, 2*rho)
		checkNear(t, "Born–Mayer doubled r₀", b2, b1/2, 0, 1e-12)
		// Anion sign does not matter.
		q = p
		q.ZAnion = -p.ZAnion
		b3, _ := BornMayer(q, rho)
		checkNear(t, "anion sign", b3, b1, 0, 1e-15)
	}
}

// EffectiveRho and EffectiveBornExponent invert the models (round trip,
// seeded random inputs).
func TestEffectiveParametersRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewSource(7))
	for range 500 {
		p := IonPair{Madelung: 1.5 + rng.Float64(), ZCation: 1 + rng.Intn(3), ZAnion: -(1 + rng.Intn(2)), R0: 1.6 + 2*rng.Float64()}
		rho := 0.05 + 0.6*rng.Float64()
		u, err := BornMayer(p, rho)
		if err != nil {
			t.Fatal(err)
		}
		back, err := EffectiveRho(u, p)
		if err != nil {
			t.Fatalf("EffectiveRho(%g, %+v): %v", u, p, err)
		}
		checkNear(t, "ρ round trip", back, rho, 1e-12, 1e-10)
		n := 1.5 + 12*rng.Float64()
		u, _ = BornLande(p, n)
		nb, err := EffectiveBornExponent(u, p)
		if err != nil {
			t.Fatal(err)
		}
		checkNear(t, "n round trip", nb, n, 1e-10, 1e-10)
	}
}

// With K = N_A·e²/(4πε₀)·A/ν and d = ρ, the Kapustinskii equation for a
// 1:1 rock-salt pair is Born–Mayer exactly (the derivation of the
// equation, Kapustinskii 1956).
func TestKapustinskiiIsBornMayerForRockSalt(t *testing.T) {
	c := KapustinskiiConstants{K: thermo.CoulombKJPerMolAngstrom * madelungRockSalt / 2, D: DefaultRho}
	for _, r := range [][2]float64{{1.02, 1.81}, {0.76, 1.33}, {1.67, 2.20}} {
		k, err := c.Energy(2, 1, -1, r[0], r[1])
		if err != nil {
			t.Fatal(err)
		}
		b, _ := BornMayer(IonPair{madelungRockSalt, 1, -1, r[0] + r[1]}, DefaultRho)
		checkNear(t, "Kapustinskii vs Born–Mayer", k, b, 0, 1e-13)
	}
}

// Pauling's exponents by configuration, read whatever the case, brackets
// and spaces (L. Pauling, The Nature of the Chemical Bond, 3rd ed., 1960,
// ch. 13: He 5, Ne 7, Ar and Cu⁺ 9, Kr and Ag⁺ 10, Xe and Au⁺ 12; from
// memory), and a configuration longer than the lookup's short buffer.
func TestPaulingExponentSpellings(t *testing.T) {
	for _, tc := range []struct {
		config string
		want   float64
	}{
		{"He", 5}, {"ne", 7}, {"NE", 7}, {"[Ar]", 9}, {" kr ", 10}, {"Xe", 12},
		{"[Ar]3d10", 9}, {"[ar] 3D10", 9}, {"[Kr]4d10", 10}, {"[Xe]4f14 5d10", 12}, {"[xe]\t4f14\t5d10", 12},
		{"[Xe]      4f14                  5d10", 12},
	} {
		got, err := PaulingExponent(tc.config)
		if err != nil || got != tc.want {
			t.Errorf("PaulingExponent(%q) = %g, %v; want %g", tc.config, got, err, tc.want)
		}
	}
	for _, bad := range []string{"", "Rn", "[Ar]3d9", "Ñe"} {
		if _, err := PaulingExponent(bad); err == nil {
			t.Errorf("PaulingExponent(%q) gave no error", bad)
		}
	}
}
