package lattice

import (
	"math"
	"math/rand"
	"testing"
)

// Room-temperature lattice parameters (Å; cubic cells with Z = 4 unless
// stated), from memory of the usual handbook/ICSD figures: NaCl 5.6402,
// KCl 6.2931, CaF₂ 5.4626, K₂O 6.436; corundum Al₂O₃ a = 4.7589,
// c = 12.991, Z = 6 (hexagonal cell, V = (√3/2)a²c = 254.79 Å³).
func cubicVm(t *testing.T, a float64) float64 {
	t.Helper()
	v, err := MolarVolumeFromCell(a*a*a, 4)
	if err != nil {
		t.Fatal(err)
	}
	return v
}

func TestVolumeBased(t *testing.T) {
	vmCorundum, err := MolarVolumeFromCell(math.Sqrt(3)/2*4.7589*4.7589*12.991, 6)
	if err != nil {
		t.Fatal(err)
	}
	tests := []struct {
		name     string
		vm       float64
		ions     []IonKind
		form     VolumeForm
		fit      string
		want     float64
		abs, rel float64
		source   string
	}{
		// Hand calculations from the published equations:
		// NaCl: V_m = 0.044856 nm³, 2·(117.3/0.35537 + 51.9) = 764.07.
		{"NaCl hand", cubicVm(t, 5.6402), ionsNaCl, Form1999, "MX (1:1)", -764.07, 0.05, 0, "hand"},
		// CaF₂: V_m = 0.040749 nm³, I = 3: 6·(133.5/0.34413 + 60.9) = 2693.06.
		{"CaF2 hand", cubicVm(t, 5.4626), ionsCaF2, Form1999, "MX2 (2:1)", -2693.06, 0.1, 0, "hand"},
		// K₂O: V_m = 0.066649 nm³, I = 3: 6·(165.3/0.40547 − 29.8) = 2267.42.
		{"K2O hand", cubicVm(t, 6.436), ionsK2O, Form1999, "M2X (1:2)", -2267.42, 0.1, 0, "hand"},
		// Al₂O₃: V_m = 0.042465 nm³, I = 15: 121.39·15·(30/0.042465)^{1/3} = 16216.96.
		{"Al2O3 hand", vmCorundum, ionsAl2O, Form2000, "", -16216.96, 0.5, 0, "hand"},
		// Against the CRC handbook's U_POT ("Lattice Energies", Jenkins &
		// Roobottom; from memory): NaCl 786, KCl 715, CaF₂ 2651, K₂O 2238.
		// Tolerance 4 %: the 1999 fits scatter by a few percent for simple
		// salts (from memory of the paper's discussion). Not asserted: Li₂O
		// (2799) and Na₂O (2481), which the M2X fit overestimates by 16 % and
		// 7 %.
		{"NaCl vs handbook", cubicVm(t, 5.6402), ionsNaCl, FormAuto, "MX (1:1)", -786, 0, 0.04, "CRC 786"},
		{"KCl vs handbook", cubicVm(t, 6.2931), ionsKCl, FormAuto, "MX (1:1)", -715, 0, 0.04, "CRC 715"},
		{"CaF2 vs handbook", cubicVm(t, 5.4626), ionsCaF2, FormAuto, "MX2 (2:1)", -2651, 0, 0.04, "CRC 2651"},
		{"K2O vs handbook", cubicVm(t, 6.436), ionsK2O, FormAuto, "M2X (1:2)", -2238, 0, 0.04, "CRC 2238"},
		// High range: the authors give ±7 % (Glasser & Jenkins 2000,
		// abstract); Al₂O₃ handbook U_POT 15916 (CRC, from memory).
		{"Al2O3 vs handbook", vmCorundum, ionsAl2O, FormAuto, "", -15916, 0, 0.07, "CRC 15916"},
	}
	for _, tc := range tests {
		est, err := VolumeBasedWith(tc.vm, tc.ions, VolumeOptions{Form: tc.form})
		if err != nil {
			t.Fatalf("%s: %v", tc.name, err)
		}
		checkNear(t, tc.name+" ("+tc.source+")", est.U, tc.want, tc.abs, tc.rel)
		if est.Fit.Name != tc.fit {
			t.Errorf("%s: fit %q, want %q", tc.name, est.Fit.Name, tc.fit)
		}
		if tc.form == FormAuto {
			want := Form1999
			if tc.fit == "" {
				want = Form2000
			}
			if est.Form != want {
				t.Errorf("%s: auto chose %v, want %v", tc.name, est.Form, want)
			}
		}
	}
}

func TestFitFor(t *testing.T) {
	tests := []struct {
		ions []IonKind
		want string
	}{
		{ionsNaCl, "MX (1:1)"},
		{ionsKNO3, "MX (1:1)"},
		{[]IonKind{{Charge: -1, Count: 1}, {Charge: 1, Count: 1}}, "MX (1:1)"}, // order does not matter
		{ionsCaF2, "MX2 (2:1)"},
		{[]IonKind{{Charge: 2, Count: 2}, {Charge: -1, Count: 4}}, "MX2 (2:1)"}, // counts reduced
		{ionsK2O, "M2X (1:2)"},
		{ionsMgO, "general"},
		{ionsAl2O, "general"},
		{[]IonKind{{Charge: 1, Count: 1}, {Charge: 3, Count: 1}, {Charge: -2, Count: 2}}, "general"},
	}
	for _, tc := range tests {
		if got := FitFor(tc.ions).Name; got != tc.want {
			t.Errorf("FitFor(%v) = %q, want %q", tc.ions, got, tc.want)
		}
	}
	if n := len(VolumeFits()); n != 4 {
		t.Errorf("VolumeFits: %d fits, want 4", n)
	}
	for _, f := range VolumeFits() {
		if f.Source == "" {
			t.Errorf("fit %q has no source", f.Name)
		}
	}
}

func TestIonicStrength(t *testing.T) {
	// I = ½Σnᵢzᵢ² (Jenkins et al. 1999): NaCl 1, CaF₂ 3, MgO 4, Al₂O₃ 15
	// (hand arithmetic).
	for _, tc := range []struct {
		ions []IonKind
		want float64
	}{{ionsNaCl, 1}, {ionsCaF2, 3}, {ionsK2O, 3}, {ionsMgO, 4}, {ionsAl2O, 15}} {
		got, err := IonicStrength(tc.ions)
		if err != nil {
			t.Fatal(err)
		}
		checkNear(t, "I", got, tc.want, 1e-15, 0)
	}
}

// Density route and cell route agree: NaCl M = 58.443 g/mol, ρ = 2.165
// g/cm³ (CRC Handbook, from memory) against a = 5.6402 Å; the two handbook
// figures agree to about 0.1 %.
func TestMolarVolume(t *testing.T) {
	byDensity, err := MolarVolumeFromDensity(58.443, 2.165)
	if err != nil {
		t.Fatal(err)
	}
	checkNear(t, "V_m NaCl density vs cell", byDensity, cubicVm(t, 5.6402), 0, 0.003)
	// Unit check by hand: 1000 Å³ per cell with Z = 4 is 0.25 nm³ per formula unit.
	v, _ := MolarVolumeFromCell(1000, 4)
	checkNear(t, "Å³ → nm³", v, 0.25, 1e-15, 0)

	_, err = MolarVolumeFromDensity(58.443, 0)
	wantParamErr(t, "zero density", err, "density", ErrNotPositive)
	_, err = MolarVolumeFromDensity(-1, 2)
	wantParamErr(t, "negative mass", err, "molarMass", ErrNotPositive)
	_, err = MolarVolumeFromCell(100, 0)
	wantParamErr(t, "Z = 0", err, "z", ErrNotPositive)
	_, err = MolarVolumeFromCell(0, 4)
	wantParamErr(t, "zero cell", err, "cellVolume", ErrNotPositive)
}

func TestVolumeErrors(t *testing.T) {
	tests := []struct {
		name     string
		call     func() error
		param    string
		sentinel error
	}{
		{"vm 0", func() error { _, err := VolumeBased(0, ionsNaCl); return err }, "vm", ErrNotPositive},
		{"vm NaN", func() error { _, err := VolumeBased(math.NaN(), ionsNaCl); return err }, "vm", ErrNotPositive},
		{"no ions", func() error { _, err := VolumeBased(0.04, nil); return err }, "ions", ErrNotPositive},
		{"not neutral", func() error { _, err := VolumeBased(0.04, []IonKind{{1, 1, 0}, {-2, 1, 0}}); return err }, "ions", ErrNotNeutral},
		{"zero charge", func() error { _, err := VolumeBased(0.04, []IonKind{{0, 1, 0}}); return err }, "ions[0].Charge", ErrZeroCharge},
		{"zero count", func() error { _, err := VolumeBased(0.04, []IonKind{{1, 1, 0}, {-1, 0, 0}}); return err }, "ions[1].Count", ErrNotPositive},
		{"bad shape", func() error { _, err := VolumeBased(0.04, []IonKind{{1, 1, 7}, {-1, 1, 0}}); return err }, "ions[0].Shape", ErrUnknownName},
		{"bad form", func() error {
			_, err := VolumeBasedWith(0.04, ionsNaCl, VolumeOptions{Form: 9})
			return err
		}, "opt.Form", ErrUnknownName},
		{"bad fit", func() error {
			_, err := VolumeBasedWith(0.04, ionsNaCl, VolumeOptions{Fit: &VolumeFit{Alpha: -1}})
			return err
		}, "opt.Fit.Alpha", ErrNotPositive},
		// 2I·β = 2·51.9 = 103.8 kJ/mol is the 1:1 fit's infinite-volume limit.
		{"inverse below β", func() error {
			_, err := VolumeForEnergy(-100, ionsNaCl, VolumeOptions{Form: Form1999})
			return err
		}, "u", ErrNoSolution},
		{"inverse positive u", func() error { _, err := VolumeForEnergy(786, ionsNaCl, VolumeOptions{}); return err }, "u", ErrOutOfRange},
	}
	for _, tc := range tests {
		wantParamErr(t, tc.name, tc.call(), tc.param, tc.sentinel)
	}
}

// VolumeForEnergy inverts VolumeBasedWith for each form and fit (seeded
// random volumes), and FormAuto round-trips away from the threshold.
func TestVolumeForEnergyRoundTrip(t *testing.T) {
	rng := rand.New(rand.NewSource(1999))
	salts := [][]IonKind{ionsNaCl, ionsCaF2, ionsK2O, ionsMgO, ionsAl2O}
	for range 400 {
		ions := salts[rng.Intn(len(salts))]
		vm := 0.01 + 0.3*rng.Float64()
		for _, form := range []VolumeForm{Form1999, Form2000, FormAuto} {
			est, err := VolumeBasedWith(vm, ions, VolumeOptions{Form: form})
			if err != nil {
				t.Fatal(err)
			}
			if form == FormAuto && math.Abs(-est.U-HighRangeThreshold) < 2000 {
				continue // the two auto rules may disagree near the switch
			}
			back, err := VolumeForEnergy(est.U, ions, VolumeOptions{Form: form})
			if err != nil {
				t.Fatalf("VolumeForEnergy(%g, %v, %v): %v", est.U, ions, form, err)
			}
			checkNear(t, "V_m round trip", back, vm, 1e-14, 1e-10)
		}
	}
}

// U ∝ V_m^{-1/3} in the high-range form: eight times the volume, half the
// energy (follows from the equation).
func TestVolumeScaleLaw(t *testing.T) {
	a, _ := VolumeBasedWith(0.04, ionsAl2O, VolumeOptions{Form: Form2000})
	b, _ := VolumeBasedWith(0.32, ionsAl2O, VolumeOptions{Form: Form2000})
	checkNear(t, "U(8V)/U(V)", b.U/a.U, 0.5, 1e-14, 0)
}

// DerivedIonVolume: the volume model's V_m minus the known ions, per ion
// of the unknown kind (volume additivity, Jenkins et al. 1999); checked by
// a round trip: split a random V_m, rebuild U, recover the part.
func TestDerivedIonVolume(t *testing.T) {
	rng := rand.New(rand.NewSource(3609))
	for range 300 {
		ions := []IonKind{ionsCaF2[0], ionsCaF2[1]}
		vCat := 0.002 + 0.01*rng.Float64()
		vAn := 0.005 + 0.03*rng.Float64()
		vm := vCat + 2*vAn
		est, err := VolumeBasedWith(vm, ions, VolumeOptions{Form: Form1999})
		if err != nil {
			t.Fatal(err)
		}
		got, err := DerivedIonVolume(est.U, ions, 1, vCat, VolumeOptions{Form: Form1999})
		if err != nil {
			t.Fatal(err)
		}
		checkNear(t, "anion volume", got, vAn, 1e-14, 1e-9)
	}
	_, err := DerivedIonVolume(-2651, ionsCaF2, 2, 0.01, VolumeOptions{})
	wantParamErr(t, "bad index", err, "unknown", ErrOutOfRange)
	_, err = DerivedIonVolume(-2651, ionsCaF2, 1, 1, VolumeOptions{})
	wantParamErr(t, "known too big", err, "known", ErrNoSolution)
	_, err = DerivedIonVolume(-2651, ionsCaF2, 1, math.NaN(), VolumeOptions{})
	wantParamErr(t, "known NaN", err, "known", ErrNotPositive)
}
