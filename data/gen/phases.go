package main

// The phase of a compound: the NBS rows that may be it, the one stable at
// 298.15 K, its polymorph name, and NASA Glenn's species of the same phase.

import (
	"math"
	"strings"

	"enthalpath/thermo/notation"
)

// phaseRows are the NBS rows of one formula that may be the compound's
// phase: pure crystal, liquid or gas with a 298.15 K ΔfH°.
func (g *generator) phaseRows(formula string) []nbsRow {
	var out []nbsRow
	for _, i := range g.nbsIdx[formula] {
		r := g.nbs[i]
		if r.Solvent != "" || math.IsNaN(r.H) {
			continue
		}
		if strings.HasPrefix(r.State, "cr") || r.State == "l" || r.State == "g" {
			out = append(out, r)
		}
	}
	return out
}

// stablePhase picks the row of the phase stable at 298.15 K: the lowest
// ΔfG° among the rows that give one; without ΔfG°, the first crystal row,
// else the liquid, else the gas. A phase choice overrides it.
func (g *generator) stablePhase(formula string, rows []nbsRow) (nbsRow, bool) {
	if ch, ok := g.choices.get("phase", formula); ok {
		for _, r := range rows {
			if r.State == ch.value {
				return r, true
			}
		}
		g.warnf("phase choice %s %s: no such NBS row", formula, ch.value)
	}
	best := -1
	for i, r := range rows {
		if !math.IsNaN(r.G) && (best < 0 || r.G < rows[best].G) {
			best = i
		}
	}
	if best >= 0 {
		// A crystal row without ΔfG° may still be the stable one when the
		// row with ΔfG° is a liquid or gas and the crystal's ΔfH° is lower.
		if rows[best].State == "l" || rows[best].State == "g" {
			for _, r := range rows {
				if strings.HasPrefix(r.State, "cr") && math.IsNaN(r.G) && r.H < rows[best].H-40 {
					return r, true
				}
			}
		}
		return rows[best], true
	}
	for _, st := range []string{"cr", "l", "g"} {
		for _, r := range rows {
			if strings.HasPrefix(r.State, st) {
				return r, true
			}
		}
	}
	return nbsRow{}, false
}

func stateOf(nbsState string) string {
	if strings.HasPrefix(nbsState, "cr") {
		return "cr"
	}
	return nbsState
}

// polymorphName cleans the NBS state description into a polymorph name.
// The digitised file lost the Greek letters (printed "?").
func polymorphName(r nbsRow) string {
	d := strings.TrimSpace(strings.Trim(strings.TrimSpace(r.Desc), "?. "))
	if strings.Contains(d, "constraint") || strings.Contains(d, "Introduction") {
		d = ""
	}
	if d == "" && r.State != "cr" && strings.HasPrefix(r.State, "cr") {
		d = "NBS form " + r.State
	}
	return d
}

// gasOligomer reports a gas-only formula whose atom counts share a factor
// (Al2Cl6, Li2F2, (BeO)3): a gaseous oligomer, not a compound of its own.
func gasOligomer(phases []nbsRow, comp map[string]float64) bool {
	for _, r := range phases {
		if r.State != "g" {
			return false
		}
	}
	d := 0
	for _, n := range comp {
		d = notation.GCD(d, int(n))
	}
	return d > 1
}

// nasaPhase finds NASA Glenn's species of a composition in the phase of
// an NBS state (cr: a condensed phase other than the liquid; l: the liquid).
func (g *generator) nasaPhase(comp map[string]float64, state string) (nasaSpecies, bool) {
	if state == "g" {
		return g.nasaFind(comp, 0, false)
	}
	if state == "cr" {
		return g.nasaFind(comp, 0, true)
	}
	key := compKey(comp, 0)
	for _, s := range g.nasa {
		if s.Condensed && strings.HasSuffix(s.Name, "(L)") && compKey(s.Comp, s.Charge) == key {
			return s, true
		}
	}
	return nasaSpecies{}, false
}
