package main

// Reading a composition as a charge-balanced pair of ions of ions.csv.

import (
	"fmt"
	"math"
	"strconv"
	"strings"

	"enthalpath/thermo/notation"
)

// ionDef is a row of data/tables/ions.csv (hand-kept: symbols, charges).
type ionDef struct {
	symbol     string
	core       string // as written in formulas: "NH4", "SO4", "Na"
	charge     int
	comp       map[string]float64
	polyatomic bool
}

func (g *generator) ions() ([]ionDef, error) {
	rows, _, err := keptRows(g.tablesDir, "ions.csv")
	if err != nil {
		return nil, err
	}
	var out []ionDef
	for _, r := range rows {
		q, err := strconv.Atoi(r["charge"])
		if err != nil {
			return nil, fmt.Errorf("ions.csv: %s: charge %q", r["symbol"], r["charge"])
		}
		comp, _, ok := composition(r["core"])
		if !ok {
			return nil, fmt.Errorf("ions.csv: %s: core %q", r["symbol"], r["core"])
		}
		out = append(out, ionDef{symbol: r["symbol"], core: r["core"], charge: q, comp: comp, polyatomic: r["polyatomic"] == "yes"})
	}
	return out, nil
}

// ionPair is a way of reading a composition as m cations and n anions.
type ionPair struct {
	cation, anion ionDef
	m, n          int
}

// pairsFor lists every (cation, anion) of the ion table whose charge-
// balanced combination has exactly the composition comp.
func pairsFor(comp map[string]float64, ions []ionDef) []ionPair {
	var out []ionPair
	for _, c := range ions {
		if c.charge <= 0 {
			continue
		}
		for _, a := range ions {
			if a.charge >= 0 {
				continue
			}
			za := -a.charge
			d := notation.GCD(c.charge, za)
			m0, n0 := za/d, c.charge/d
			// Find the multiple k from any element of the cation.
			k := 0
			for el, x := range c.comp {
				tot := comp[el]
				per := float64(m0)*x + float64(n0)*a.comp[el]
				if per == 0 {
					continue
				}
				kk := tot / per
				if kk != math.Trunc(kk) || kk < 1 {
					k = -1
					break
				}
				k = int(kk)
				break
			}
			if k < 1 {
				continue
			}
			m, n := k*m0, k*n0
			sum := map[string]float64{}
			for el, x := range c.comp {
				sum[el] += float64(m) * x
			}
			for el, x := range a.comp {
				sum[el] += float64(n) * x
			}
			if compKey(sum, 0) == compKey(comp, 0) {
				out = append(out, ionPair{c, a, m, n})
			}
		}
	}
	return out
}

// fewestPolyatomic picks, among several readings of a composition, the
// one with the fewest polyatomic ions, when only one has that fewest
// ("Ca2+ with O2-" over "Ca with O2^2-" readings that need a rarer ion).
func fewestPolyatomic(pairs []ionPair) (ionPair, bool) {
	count := func(p ionPair) int {
		n := 0
		if p.cation.polyatomic {
			n++
		}
		if p.anion.polyatomic {
			n++
		}
		return n
	}
	best, unique := 0, true
	for i := 1; i < len(pairs); i++ {
		switch c, b := count(pairs[i]), count(pairs[best]); {
		case c < b:
			best, unique = i, true
		case c == b:
			unique = false
		}
	}
	return pairs[best], unique
}

// writtenWithIons keeps the pairs of ions whose cores both appear in the
// formula as the NBS tables write it, and reports whether one is left
// ("NH4Cl" names NH4; "(CH3)2NNH2" names neither NH4 nor C2).
// A spelling choice gives an ion's other ways of being written ("CNS" for
// SCN⁻, "Fe2O4" for two FeO2⁻ of a spinel ferrite).
func (g *generator) writtenWithIons(f string, pairs []ionPair) bool {
	written := func(ion ionDef) bool {
		if strings.Contains(f, ion.core) {
			return true
		}
		if ch, ok := g.choices.get("spelling", ion.symbol); ok {
			for _, alt := range strings.Split(ch.value, ";") {
				if strings.Contains(f, alt) {
					return true
				}
			}
		}
		return false
	}
	for _, p := range pairs {
		if written(p.cation) && written(p.anion) {
			return true
		}
	}
	return false
}

// nbsIonSpelling writes an ion as the NBS tables do: "OH-", "SO42-", "NH4+".
func nbsIonSpelling(ion ionDef) string {
	core := ion.symbol
	if i := strings.IndexAny(core, "^+-"); i > 0 {
		core = core[:i]
	}
	// strip a charge digit written before the sign in our symbol ("Ca2+")
	sign := "+"
	z := ion.charge
	if z < 0 {
		sign, z = "-", -z
	}
	if strings.Contains(ion.symbol, "^") {
		core = ion.symbol[:strings.Index(ion.symbol, "^")]
	} else if z > 1 {
		core = strings.TrimSuffix(core, strconv.Itoa(z))
	}
	if z > 1 {
		return core + strconv.Itoa(z) + sign
	}
	return core + sign
}
