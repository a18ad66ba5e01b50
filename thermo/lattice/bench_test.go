package lattice

import (
	"math"
	"math/rand"
	"testing"
)

var sink float64

func BenchmarkBornLande(b *testing.B) {
	for b.Loop() {
		u, _ := BornLande(pairNaCl, 8)
		sink += u
	}
}

func BenchmarkBornMayer(b *testing.B) {
	for b.Loop() {
		u, _ := BornMayer(pairNaCl, DefaultRho)
		sink += u
	}
}

func BenchmarkKapustinskii(b *testing.B) {
	for b.Loop() {
		u, _ := Kapustinskii(3, 2, -1, 1.00, 1.33)
		sink += u
	}
}

func BenchmarkVolumeBased(b *testing.B) {
	for b.Loop() {
		e, _ := VolumeBased(0.04075, ionsCaF2)
		sink += e.U
	}
}

func BenchmarkKapustinskiiRadiusSum(b *testing.B) {
	for b.Loop() {
		s, _ := KapustinskiiRadiusSum(-2651, 3, 2, -1)
		sink += s
	}
}

func BenchmarkEnthalpyFromEnergy(b *testing.B) {
	for b.Loop() {
		h, _ := EnthalpyFromEnergy(-786, 298.15, ionsKNO3)
		sink += h
	}
}

func BenchmarkJudge(b *testing.B) {
	for b.Loop() {
		sink += Judge(-915, -718).Gap
	}
}

// No public function panics on any input, finite or not (seeded random
// inputs including NaN, ±Inf, zero and negative values).
func TestNoPanic(t *testing.T) {
	rng := rand.New(rand.NewSource(42))
	specials := []float64{0, -1, 1, math.NaN(), math.Inf(1), math.Inf(-1), 1e-300, 1e300, -786}
	f := func() float64 {
		if rng.Intn(3) == 0 {
			return specials[rng.Intn(len(specials))]
		}
		return (rng.Float64() - 0.5) * 10
	}
	i := func() int { return rng.Intn(9) - 4 }
	for range 20000 {
		p := IonPair{Madelung: f(), ZCation: i(), ZAnion: i(), R0: f()}
		ions := []IonKind{{Charge: i(), Count: i(), Shape: Shape(i())}, {Charge: i(), Count: i(), Shape: Shape(i())}}
		finite := func(name string, v float64, err error) {
			if err == nil && (math.IsNaN(v) || math.IsInf(v, 0)) {
				t.Fatalf("%s returned %g without an error (pair %+v, ions %+v)", name, v, p, ions)
			}
		}
		v, err := Coulomb(p)
		finite("Coulomb", v, err)
		v, err = BornLande(p, f())
		finite("BornLande", v, err)
		v, err = BornMayer(p, f())
		finite("BornMayer", v, err)
		v, err = EffectiveRho(f(), p)
		finite("EffectiveRho", v, err)
		v, err = EffectiveBornExponent(f(), p)
		finite("EffectiveBornExponent", v, err)
		v, err = Kapustinskii(i(), i(), i(), f(), f())
		finite("Kapustinskii", v, err)
		v, err = KapustinskiiRadiusSum(f(), i(), i(), i())
		finite("KapustinskiiRadiusSum", v, err)
		v, err = KapustinskiiRadius(f(), i(), i(), i(), f())
		finite("KapustinskiiRadius", v, err)
		v, err = KapustinskiiConstants{K: f(), D: f()}.Energy(i(), i(), i(), f(), f())
		finite("Energy", v, err)
		e, err := VolumeBasedWith(f(), ions, VolumeOptions{Form: VolumeForm(i())})
		finite("VolumeBasedWith", e.U, err)
		v, err = VolumeForEnergy(f(), ions, VolumeOptions{Form: VolumeForm(i())})
		finite("VolumeForEnergy", v, err)
		v, err = MolarVolumeFromDensity(f(), f())
		finite("MolarVolumeFromDensity", v, err)
		v, err = MolarVolumeFromCell(f(), i())
		finite("MolarVolumeFromCell", v, err)
		v, err = IonicStrength(ions)
		finite("IonicStrength", v, err)
		v, err = Convention(i()).EnthalpyFromEnergy(f(), f(), ions)
		finite("EnthalpyFromEnergy", v, err)
		_ = JudgeWith(f(), f(), Thresholds{f(), f()})
	}
}
