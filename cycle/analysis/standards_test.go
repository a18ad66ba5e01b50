package analysis

import (
	"math"
	"strings"
	"testing"

	"enthalpath/data"
)

// nbsFixture is a Standards of measured values typed from the NBS tables
// (Wagman et al., J. Phys. Chem. Ref. Data 11, Suppl. 2 (1982)), read in the
// pinned digitised copy shared/sources/nbs-tables-1982 (line numbers of
// NBS_Tables_with_ErratumValues.csv after conversion to UTF-8 given per
// row). NBS states no uncertainties: the fixture gives every ΔfH° and ΔfG°
// 1 kJ/mol and every S° 1 J/(mol·K) (common practice, no source).
type nbsFixture struct{}

type nbsRow struct {
	name, state string
	molecular   bool
	h, g, s     float64 // ΔfH°, ΔfG° kJ/mol; S° J/(mol·K)
}

var nbsCompounds = map[string]nbsRow{
	"MgO":   {"magnesium oxide (periclase)", "cr", false, -601.70, -569.43, 26.94}, // line 8963
	"CaO":   {"calcium oxide", "cr", false, -635.09, -604.03, 39.75},               // line 9297
	"SrO":   {"strontium oxide", "cr", false, -592.0, -561.9, 54.4},                // line 9739
	"BaO":   {"barium oxide", "cr", false, -553.5, -525.1, 70.42},                  // line 10039
	"MgCO3": {"magnesite", "cr", false, -1095.8, -1012.1, 65.7},                    // line 9185
	"CaCO3": {"calcite", "cr", false, -1206.92, -1128.79, 92.9},                    // line 9555
	"SrCO3": {"strontianite", "cr", false, -1220.1, -1140.1, 97.1},                 // line 9935
	"BaCO3": {"witherite", "cr", false, -1216.3, -1137.6, 112.1},                   // line 10242
	"TiCl2": {"titanium dichloride", "cr", false, -513.8, -464.4, 87.4},            // line 7051
	"TiCl3": {"titanium trichloride", "cr", false, -720.9, -653.5, 139.7},          // line 7052
	"TiCl4": {"titanium tetrachloride", "l", true, -804.2, -737.2, 252.34},         // line 7055
	"CsF":   {"caesium fluoride", "cr", false, -553.5, -525.5, 92.80},              // line 14141
	"NaNO3": {"sodium nitrate", "cr", false, -467.85, -367.00, 116.52},             // line 11388
	"NaNO2": {"sodium nitrite", "cr", false, -358.65, -284.55, 103.8},              // line 11368
	"CaF2":  {"calcium fluoride", "cr", false, -1219.6, -1167.3, 68.87},            // line 9311
}

var nbsGases = map[string]nbsRow{
	"CO2": {"carbon dioxide", "g", true, -393.509, -394.359, 213.74}, // line 1675
	"O2":  {"oxygen", "g", true, 0, 0, 205.138},                      // line 20
	"NO2": {"nitrogen dioxide", "g", true, 33.18, 51.31, 240.06},     // line 864
	"SO3": {"sulfur trioxide", "g", true, -395.72, -371.06, 256.76},  // line 592
	"H2O": {"water", "g", true, -241.818, -228.572, 188.825},         // line 47
}

// S° of the elements in their standard states per mole of atoms.
var nbsElements = map[string]float64{
	"O":  205.138 / 2, // O2(g), line 20
	"F":  202.78 / 2,  // F2(g), line 125
	"Cl": 223.066 / 2, // Cl2(g), line 180
	"C":  5.740,       // graphite, line 1661
	"N":  191.61 / 2,  // N2(g), line 857
	"Mg": 32.68,       // line 8948
	"Ca": 41.42,       // line 9286
	"Sr": 52.3,        // line 9728
	"Ba": 62.8,        // line 10033
	"Ti": 30.63,       // line 7025
	"Cs": 85.23,       // line 14108
	"Na": 51.21,       // line 10816
}

func nbsValue(v float64, unit string) data.Value {
	return data.Value{V: v, U: 1, Unit: unit, Source: "nbs1982"}
}

func (r nbsRow) standard(formula string) Standard {
	return Standard{Formula: formula, Name: r.name, State: r.state, Molecular: r.molecular, Source: "nbs1982",
		Formation: nbsValue(r.h, "kJ/mol"), Gibbs: nbsValue(r.g, "kJ/mol"), Entropy: nbsValue(r.s, "J/(mol K)")}
}

func (nbsFixture) Compound(f string) (Standard, bool) {
	r, ok := nbsCompounds[strings.TrimSpace(f)]
	return r.standard(f), ok
}

func (nbsFixture) Gas(f string) (Standard, bool) {
	r, ok := nbsGases[f]
	return r.standard(f), ok
}

func (nbsFixture) ElementEntropy(el string) (data.Value, bool) {
	s, ok := nbsElements[el]
	return nbsValue(s, "J/(mol K)"), ok
}

// nbsAnalyst is an Analyst over the built-in data whose standard data are
// the NBS fixture.
func nbsAnalyst(t testing.TB) *Analyst {
	t.Helper()
	return New(testAnalyst(t).DB(), WithStandards(nbsFixture{}))
}

// The fixture was typed from the pinned NBS file; the built-in tables are
// generated from the same file by data/gen and read through dbStandards,
// the Standards every command uses. Every fixture value must equal what
// dbStandards gives (to the NBS file's printed rounding), so a typing slip
// in the fixture, or a wrong per-atom division of an element's S°, cannot
// pass unseen. Source: NBS 1982 (Wagman et al.), the pinned digitised copy,
// through both routes.
func TestNBSFixtureIsTheGeneratedTable(t *testing.T) {
	tables := dbStandards{testAnalyst(t).DB()}
	const tol = 0.006 // the NBS file prints at most two decimals of kJ/mol
	near := func(what string, got data.Value, want float64) {
		t.Helper()
		if got.Source != "nbs1982" || math.Abs(got.V-want) > tol {
			t.Errorf("%s: tables %.3f (%s), fixture %.3f", what, got.V, got.Source, want)
		}
	}
	same := func(f string, got Standard, ok bool, r nbsRow) {
		t.Helper()
		if !ok {
			t.Errorf("%s not in the tables", f)
			return
		}
		near(f+" ΔfH°", got.Formation, r.h)
		near(f+" ΔfG°", got.Gibbs, r.g)
		near(f+" S°", got.Entropy, r.s)
		if got.Molecular != r.molecular || got.State != r.state {
			t.Errorf("%s: tables molecular %v state %q, fixture %v %q", f, got.Molecular, got.State, r.molecular, r.state)
		}
	}
	for f, r := range nbsCompounds {
		got, ok := tables.Compound(f)
		same(f, got, ok, r)
	}
	for f, r := range nbsGases {
		got, ok := tables.Gas(f)
		got.Molecular = true // a gas is molecular; the Standard of a gas does not say it
		same(f+"(g)", got, ok, r)
	}
	for sym, want := range nbsElements {
		v, ok := tables.ElementEntropy(sym)
		if !ok {
			t.Errorf("%s: no S° in the tables", sym)
			continue
		}
		near(sym+" S° per atom", v, want)
	}
}
