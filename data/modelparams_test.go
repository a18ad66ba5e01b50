package data

import (
	"strings"
	"testing"
)

// memoryAllowList names every extended-model row typed from memory, with
// the reason it may stay so. A row marked memory=yes that is not listed
// here, or a listed row no longer marked, fails TestModelParamsMemoryListed.
var memoryAllowList = map[string]string{
	"salt:*":                               "Fumi–Tosi ρ and Mayer's C and D typed from memory; compared with a public digitised copy of the same tables (N. Jackson and G. Sivaraman's parameter file), no copy of the papers at hand",
	"ion:Li+ Na+ K+ Rb+ Cs+ F- Cl- Br- I-": "Fumi–Tosi basic radii and Pauling's free-ion polarizabilities typed from memory; the radii agree with the same public digitised copy",
	"ion:Be2+ Mg2+ Ca2+ Sr2+ Ba2+ O2- S2-": "Pauling's free-ion polarizabilities typed from memory, no copy of the paper at hand",
	"ion:Ag+ Cu+ Tl+":                      "polarizabilities of the d¹⁰ and Tl+ ions recalled with low confidence (each row's note says so): they only enter the covalency reading of these salts",
}

func allowed(kind, name string) bool {
	if _, ok := memoryAllowList[kind+":*"]; ok {
		return true
	}
	for k := range memoryAllowList {
		if rest, ok := strings.CutPrefix(k, kind+":"); ok && strings.Contains(" "+rest+" ", " "+name+" ") {
			return true
		}
	}
	return false
}

func TestModelParamsLoad(t *testing.T) {
	p, err := ExtendedModelParams()
	if err != nil {
		t.Fatal(err)
	}
	// Fumi and Tosi's first paper treats the 17 NaCl-type alkali halides.
	if n := len(p.Salts()); n != 17 {
		t.Errorf("%d salts with coefficients, want the 17 NaCl-type alkali halides", n)
	}
	db := mustLoad(t)
	used := map[string]bool{}
	for _, s := range p.Salts() {
		if _, err := db.Compound(s.Formula); err != nil {
			t.Errorf("salt %s is not a compound of the data: %v", s.Formula, err)
		}
		used[s.Rho.Source] = true
		for k := range 3 {
			used[s.C[k].Source], used[s.D[k].Source] = true, true
			if s.C[k].Unit != UnitC6Published || s.D[k].Unit != UnitC8Published {
				t.Errorf("%s: units %q %q", s.Formula, s.C[k].Unit, s.D[k].Unit)
			}
		}
		if s.Rho.Memory && !allowed("salt", s.Formula) {
			t.Errorf("salt %s is marked memory but not in memoryAllowList", s.Formula)
		}
	}
	for _, in := range p.IonParams() {
		if _, err := db.Ion(in.Ion); err != nil {
			t.Errorf("ion %s is not an ion of the data: %v", in.Ion, err)
		}
		for _, v := range []Value{in.BasicRadius, in.Polarizability, in.CrystalPolarizability} {
			if v.Known() {
				used[v.Source] = true
				if v.Memory && !allowed("ion", in.Ion) {
					t.Errorf("ion %s is marked memory but not in memoryAllowList", in.Ion)
				}
			}
		}
		if in.Polarizability.Known() && !(in.Electrons > 0) {
			t.Errorf("ion %s has α but no Slater–Kirkwood electron number", in.Ion)
		}
	}
	for _, s := range p.Sources() {
		if !used[s.Key] {
			t.Errorf("model source %q is cited by no row", s.Key)
		}
	}
}

// Spot values against the public digitised copy named in memoryAllowList
// (and the NaCl coefficients every molten-salt simulation of the
// Fumi–Tosi potential repeats): ρ(NaCl) 0.317 Å, σ(Na+) 1.170 Å, C+- 11.2,
// D−− 233.
func TestModelParamsNaCl(t *testing.T) {
	p, err := ExtendedModelParams()
	if err != nil {
		t.Fatal(err)
	}
	s, ok := p.Salt("NaCl")
	na, ok2 := p.Ion("Na+")
	if !ok || !ok2 {
		t.Fatal("NaCl or Na+ missing")
	}
	for _, c := range []struct {
		name      string
		got, want float64
	}{{"ρ", s.Rho.V, 0.317}, {"σ(Na+)", na.BasicRadius.V, 1.170}, {"C+-", s.C[PairCationAnion].V, 11.2}, {"D--", s.D[PairAnionAnion].V, 233}} {
		if c.got != c.want {
			t.Errorf("%s = %g, want %g", c.name, c.got, c.want)
		}
	}
}

// TestCrystalPolarizabilities holds model_crystal_polarizabilities.csv to
// the list in the abstract of J. R. Tessman, A. H. Kahn and W. Shockley,
// Phys. Rev. 92, 890 (1953): "The best values for the sodium D line in A3
// are Li+ 0.03, Na+ 0.41, K+ 1.33, Rb+ 1.98, Cs+ 3.34, F- 0.64, Cl- 2.96,
// Br- 4.16, I- 6.43, Ca++ 1.1, Sr++ 1.6, Ba++ 2.5, […] Ag+ 2.4, Cu+ 1.6"
// (the abstract as published; the ions of the list without a Slater–Kirkwood
// row in model_ions.csv, and those it gives as a range, are not kept).
// Every other ion of model_ions.csv has none.
func TestCrystalPolarizabilities(t *testing.T) {
	p, err := ExtendedModelParams()
	if err != nil {
		t.Fatal(err)
	}
	abstract := map[string]float64{"Li+": 0.03, "Na+": 0.41, "K+": 1.33, "Rb+": 1.98, "Cs+": 3.34, "F-": 0.64, "Cl-": 2.96,
		"Br-": 4.16, "I-": 6.43, "Ca2+": 1.1, "Sr2+": 1.6, "Ba2+": 2.5, "Ag+": 2.4, "Cu+": 1.6}
	for _, in := range p.IonParams() {
		want, listed := abstract[in.Ion]
		v := in.CrystalPolarizability
		switch {
		case listed && !v.Known():
			t.Errorf("%s: no polarizability in crystals, the abstract gives %g Å³", in.Ion, want)
		case !listed && v.Known():
			t.Errorf("%s: polarizability in crystals %g Å³, the abstract gives none", in.Ion, v.V)
		case listed && (v.V != want || v.Source != "tks1953" || v.Memory || v.Unit != "Å3"):
			t.Errorf("%s: %+v, want %g Å³ from tks1953, not from memory", in.Ion, v, want)
		}
	}
}
