package main

import (
	"fmt"
	"math"
	"slices"
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

var cationClass = func() map[string]string {
	m := map[string]string{}
	for cls, els := range map[string]string{
		"alkali":         "Li Na K Rb Cs Fr",
		"alkaline-earth": "Be Mg Ca Sr Ba Ra",
		"group-13":       "B Al Ga In Tl",
		"group-14":       "C Si Ge Sn Pb",
		"group-15":       "N P As Sb Bi",
		"group-16":       "S Se Te Po",
		"group-3":        "Sc Y",
		"lanthanide":     "La Ce Pr Nd Pm Sm Eu Gd Tb Dy Ho Er Tm Yb Lu",
		"actinide":       "Ac Th Pa U Np Pu",
		"hydrogen":       "H",
		"halogen":        "F Cl Br I At",
		"noble-gas":      "Xe Kr Rn",
	} {
		for _, e := range strings.Fields(els) {
			m[e] = cls
		}
	}
	return m
}()

var anionClass = map[string]string{"F": "halide", "Cl": "halide", "Br": "halide", "I": "halide", "O": "oxide",
	"S": "chalcogenide", "Se": "chalcogenide", "Te": "chalcogenide", "H": "hydride", "N": "nitride",
	"P": "pnictide", "As": "pnictide", "Sb": "pnictide", "C": "carbide", "Si": "silicide"}

// family names a new compound's family from its ions.
func (g *generator) family(p ionPair) string {
	if ch, ok := g.choices.get("family", p.anion.symbol); ok {
		return ch.value
	}
	if ch, ok := g.choices.get("family", p.cation.symbol); ok {
		return ch.value
	}
	if p.anion.polyatomic {
		return "salt of " + p.anion.symbol
	}
	if p.cation.polyatomic {
		var an string
		for e := range p.anion.comp {
			an = e
		}
		return g.cationName(p.cation) + " " + anionClass[an]
	}
	var el string
	for e := range p.cation.comp {
		el = e
	}
	cls, ok := cationClass[el]
	if !ok {
		cls = "transition-metal"
	}
	var an string
	for e := range p.anion.comp {
		an = e
	}
	return cls + " " + anionClass[an]
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

var compoundHeader = "formula,name,family,cation,cation_count,anion,anion_count,state,polymorph,molecular," +
	"formation_kj_per_mol,formation_uncertainty,formation_source,locator,gibbs_kj_per_mol,entropy_j_per_mol_k," +
	"structure,params,params_source,density_g_cm3,density_source,density_locator,lattice_kj_per_mol,lattice_convention,lattice_source,memory,note"

// compounds writes compounds.csv: every NBS compound (crystal, or liquid
// and gas for molecular ones) whose composition is a charge-balanced pair
// of ions of ions.csv, with the phase stable at 298.15 K, merged with the
// hand-kept fields of kept/compounds.csv (names, families, structures,
// cells, densities, handbook lattice energies).
func (g *generator) compounds() (*table, error) {
	ions, err := g.ions()
	if err != nil {
		return nil, err
	}
	g.cationCharges = map[string]int{}
	for _, ion := range ions {
		if ion.charge > 0 && !ion.polyatomic {
			for e := range ion.comp {
				g.cationCharges[e]++
			}
		}
	}
	els, _, err := keptRows(g.keptDir, "kept/elements.csv")
	if err != nil {
		return nil, err
	}
	g.elementNames = map[string]string{}
	for _, e := range els {
		g.elementNames[e["symbol"]] = e["name"]
	}
	keptList, _, err := keptRows(g.keptDir, "kept/compounds.csv")
	if err != nil {
		return nil, err
	}
	t := newTable(compoundHeader,
		"Generated by go run ./data/gen: do not edit. ΔfH°, ΔfG°, S° (298.15 K) from the NBS tables",
		"(data/sources/"+nbsFile+"), phase stable at 298.15 K (lowest ΔfG°) unless data/gen/choices.csv",
		"says otherwise; NASA Glenn's value of the same composition in alternatives.csv. Names, families,",
		"structures, cell parameters, densities and handbook lattice energies: data/gen/kept/compounds.csv.",
		"Liquids and gases, and crystals listed as molecular in choices.csv, have molecular=yes: their",
		"cation and anion are the formal ions of the composition.")
	byComp := map[string]int{}
	for i, k := range keptList {
		comp, _, ok := composition(k["formula"])
		if !ok {
			return nil, fmt.Errorf("kept/compounds.csv: %s does not parse", k["formula"])
		}
		byComp[compKey(comp, 0)] = i
	}
	type made struct {
		row  map[string]string
		kept int
	}
	var rows []made
	usedKept := map[int]bool{}
	done := map[string]bool{}
	for _, r := range g.nbs {
		f := r.Formula
		if done[f] || r.Solvent != "" || strings.ContainsAny(f, "·:") {
			continue
		}
		done[f] = true
		if ch, ok := g.choices.get("skip", f); ok {
			_ = ch
			continue
		}
		comp, charge, ok := composition(f)
		if !ok || charge != 0 {
			continue
		}
		phases := g.phaseRows(f)
		if len(phases) == 0 || gasOligomer(phases, comp) {
			continue
		}
		pairs := pairsFor(comp, ions)
		ki, isKept := byComp[compKey(comp, 0)]
		if isKept && usedKept[ki] {
			continue
		}
		var p ionPair
		switch {
		case isKept:
			k := keptList[ki]
			i := slices.IndexFunc(pairs, func(p ionPair) bool { return p.cation.symbol == k["cation"] && p.anion.symbol == k["anion"] })
			if i < 0 {
				g.warnf("kept compound %s: its ions %s, %s do not fit NBS %s", k["formula"], k["cation"], k["anion"], f)
				continue
			}
			p = pairs[i]
		case len(pairs) == 0:
			continue
		case !g.writtenWithIons(f, pairs):
			// An organic or other molecule whose atoms merely add up to
			// a pair of ions ((CH3)2NNH2 as NH4+ and C2^2-): left out.
			g.warnf("%s: no pair of ions written in the formula; left out", f)
			continue
		case len(pairs) > 1:
			ch, ok := g.choices.get("ions", f)
			if !ok {
				if q, unique := fewestPolyatomic(pairs); unique {
					p = q
					break
				}
				var opts []string
				for _, q := range pairs {
					opts = append(opts, q.cation.symbol+";"+q.anion.symbol)
				}
				g.warnf("%s fits several pairs of ions (%s): left out; choose one in choices.csv", f, strings.Join(opts, " | "))
				continue
			}
			i := slices.IndexFunc(pairs, func(p ionPair) bool { return p.cation.symbol+";"+p.anion.symbol == ch.value })
			if i < 0 {
				g.warnf("ions choice %s %s does not fit", f, ch.value)
				continue
			}
			p = pairs[i]
		default:
			p = pairs[0]
			if ch, ok := g.choices.get("ions", f); ok && ch.value != p.cation.symbol+";"+p.anion.symbol {
				g.warnf("ions choice %s %s does not fit", f, ch.value)
			}
		}
		ph, ok := g.stablePhase(f, phases)
		if !ok {
			continue
		}
		st := stateOf(ph.State)
		_, molecularChoice := g.choices.get("molecular", f)
		molecular := st != "cr" || molecularChoice
		row := map[string]string{"formula": f, "name": g.compoundName(p, ph), "family": g.family(p),
			"cation": p.cation.symbol, "cation_count": strconv.Itoa(p.m), "anion": p.anion.symbol, "anion_count": strconv.Itoa(p.n),
			"state": st, "polymorph": polymorphName(ph), "formation_kj_per_mol": ph.Original, "formation_source": keyNBS,
			"locator": locator(nbsFile, ph.Line), "gibbs_kj_per_mol": num(ph.G), "entropy_j_per_mol_k": num(ph.S)}
		if molecular {
			row["molecular"] = "yes"
		}
		var alts []alternative
		if s, ok := g.nasaPhase(comp, st); ok {
			alts = append(alts, nasaAlt(s))
		}
		u := spread(ph.H, 0, nbsUnit(ph), alts)
		row["formation_uncertainty"] = num(nonzero(u))
		m := made{row: row, kept: -1}
		if isKept {
			m.kept = ki
			usedKept[ki] = true
			g.mergeKept(row, keptList[ki], false)
		}
		g.addAlts("compound_formation", row["formula"], alts)
		rows = append(rows, m)
		if st == "cr" && !molecular {
			g.solids = append(g.solids, solid{formula: row["formula"], nbsFormula: f, row: ph})
		}
	}
	// Kept compounds the NBS tables do not list keep their hand-kept
	// formation enthalpy (memory).
	for i, k := range keptList {
		if usedKept[i] {
			continue
		}
		row := map[string]string{"formula": k["formula"]}
		g.mergeKept(row, k, true)
		g.warnf("kept compound %s: not in the NBS tables; its hand-kept formation enthalpy stays (memory)", k["formula"])
		rows = append(rows, made{row: row, kept: i})
	}
	// Kept compounds first, in their order, then the others in NBS order.
	slices.SortStableFunc(rows, func(a, b made) int {
		switch {
		case a.kept >= 0 && b.kept >= 0:
			return a.kept - b.kept
		case a.kept >= 0:
			return -1
		case b.kept >= 0:
			return 1
		}
		return 0
	})
	seen := map[string]bool{}
	for _, m := range rows {
		if seen[m.row["formula"]] {
			return nil, fmt.Errorf("compound %s written twice", m.row["formula"])
		}
		seen[m.row["formula"]] = true
		t.add(m.row)
	}
	return t, nil
}

// compoundName writes a name from the ions ("iron(III) chloride"), with
// the NBS mineral or polymorph name in parentheses where it gives one.
func (g *generator) compoundName(p ionPair, r nbsRow) string {
	name := g.cationName(p.cation) + " " + g.anionName(p.anion)
	if r.Name != "" {
		name += " (" + r.Name + ")"
	}
	return name
}

var monatomicAnionNames = map[string]string{"F": "fluoride", "Cl": "chloride", "Br": "bromide", "I": "iodide", "O": "oxide",
	"S": "sulfide", "Se": "selenide", "Te": "telluride", "H": "hydride", "N": "nitride", "P": "phosphide", "As": "arsenide",
	"Sb": "antimonide", "C": "carbide", "Si": "silicide"}

var romanNumerals = []string{"", "I", "II", "III", "IV", "V", "VI", "VII", "VIII"}

func (g *generator) cationName(c ionDef) string {
	if ch, ok := g.choices.get("ionname", c.symbol); ok {
		return ch.value
	}
	var el string
	for e := range c.comp {
		el = e
	}
	name := g.elementNames[el]
	if c.polyatomic || name == "" {
		return c.symbol
	}
	if g.cationCharges[el] > 1 && c.charge < len(romanNumerals) {
		name += "(" + romanNumerals[c.charge] + ")"
	}
	return name
}

func (g *generator) anionName(a ionDef) string {
	if ch, ok := g.choices.get("ionname", a.symbol); ok {
		return ch.value
	}
	if ch, ok := g.choices.get("family", a.symbol); ok && a.polyatomic {
		return ch.value
	}
	for e := range a.comp {
		if n, ok := monatomicAnionNames[e]; ok && !a.polyatomic {
			return n
		}
	}
	return a.symbol
}

// keptValueFields are the hand-kept values of kept/compounds.csv, by the
// name the memory column uses.
var keptValueFields = []struct{ memory, field string }{
	{"params", "params"}, {"density", "density_g_cm3"}, {"lattice", "lattice_kj_per_mol"},
}

// mergeKept copies the hand-kept fields into a generated row. With
// formation set it also copies the kept formation enthalpy (a compound the
// sources do not give). A density the CRC table gives replaces the kept
// one. The memory cell lists the kept values the row still carries.
func (g *generator) mergeKept(row, k map[string]string, formation bool) {
	for _, f := range []string{"name", "family", "cation", "cation_count", "anion", "anion_count", "structure", "params", "params_source",
		"density_g_cm3", "density_source", "lattice_kj_per_mol", "lattice_convention", "lattice_source", "note"} {
		if v := k[f]; v != "" || f == "note" {
			if f == "name" && v == "" {
				continue
			}
			row[f] = v
		}
	}
	if row["formula"] != k["formula"] {
		row["formula"] = k["formula"]
	}
	var mem []string
	if formation {
		for _, f := range []string{"formation_kj_per_mol", "formation_uncertainty", "formation_source", "state"} {
			row[f] = k[f]
		}
		if row["state"] == "" {
			row["state"] = "cr"
		}
		mem = append(mem, "formation")
	}
	sourced := g.addCRCDensity(row, k["formula"], row["name"])
	for _, kv := range keptValueFields {
		if kv.memory == "density" && sourced {
			continue
		}
		if k[kv.field] != "" && memoryNames(k["memory"], kv.memory) {
			mem = append(mem, kv.memory)
		}
	}
	row["memory"] = strings.Join(mem, ";")
}

// addCRCDensity writes the CRC table's density of the compound into the
// row, with its source and locator, and says whether it found one.
func (g *generator) addCRCDensity(row map[string]string, formula, name string) bool {
	d, loc, ok := g.crcDensity(formula, name)
	if ok {
		row["density_g_cm3"], row["density_source"], row["density_locator"] = d, keyCRCInorg, loc
	}
	return ok
}

// memoryNames reads a memory cell as the loader does: "yes" covers every
// value, else a ";"-separated list of value names.
func memoryNames(cell, name string) bool {
	switch strings.ToLower(strings.TrimSpace(cell)) {
	case "yes", "true":
		return true
	case "", "no", "false":
		return false
	}
	for _, p := range strings.Split(cell, ";") {
		if strings.TrimSpace(p) == name {
			return true
		}
	}
	return false
}

// ionValues writes ion_values.csv: ΔfH°(ion, g, 298.15 K) of each
// polyatomic ion from the sources in the order of preference of
// choices.csv (prefer, ion_gas_formation), the others in alternatives.csv;
// the hand-kept rows of kept/ion_values.csv (thermochemical radii,
// hydration enthalpies, and gas values no pinned source gives) follow.
func (g *generator) ionValues() (*table, error) {
	ions, err := g.ions()
	if err != nil {
		return nil, err
	}
	kept, _, err := keptRows(g.keptDir, "kept/ion_values.csv")
	if err != nil {
		return nil, err
	}
	t := newTable("ion,property,value,uncertainty,unit,scale,source,locator,memory,derived,note",
		"Generated by go run ./data/gen: do not edit. gas_formation: ΔfH°(ion, g, 298.15 K) in the thermal-electron",
		"convention of the NBS tables (ATcT values converted by z·6.197 kJ/mol, see data/gen); other rows from",
		"data/gen/kept/ion_values.csv.")
	pref := []string{keyATcT, keyNASA, keyNBS}
	if ch, ok := g.choices.get("prefer", "ion_gas_formation"); ok {
		pref = strings.Split(ch.value, ";")
	}
	generated := map[string]bool{}
	for _, ion := range ions {
		if !ion.polyatomic {
			continue
		}
		found := map[string]alternative{}
		if a, ok := g.atctFind(ion.comp, ion.charge); ok {
			found[keyATcT] = a
		}
		if s, ok := g.nasaFind(ion.comp, ion.charge, false); ok {
			found[keyNASA] = nasaAlt(s)
		}
		if r, ok := g.nbsFind(nbsIonSpelling(ion), "g"); ok {
			found[keyNBS] = alternative{v: r.H, source: keyNBS, locator: locator(nbsFile, r.Line), note: "NBS species " + r.Formula + "(g)"}
		}
		var best alternative
		var alts []alternative
		ok := false
		for _, k := range pref {
			a, has := found[k]
			if !has {
				continue
			}
			if !ok {
				best, ok = a, true
				continue
			}
			alts = append(alts, a)
		}
		if !ok {
			continue
		}
		unit := 0.1
		if best.source == keyNBS {
			unit = 0.01
		}
		u := spread(best.v, best.u, unit, alts)
		generated[ion.symbol] = true
		t.add(map[string]string{"ion": ion.symbol, "property": "gas_formation", "value": num(best.v), "uncertainty": num(nonzero(u)),
			"unit": "kJ/mol", "source": best.source, "locator": best.locator, "note": best.note})
		g.addAlts("ion_gas_formation", ion.symbol, alts)
	}
	hydrated, err := g.hydration(t, ions, kept)
	if err != nil {
		return nil, err
	}
	for _, k := range kept {
		if k["property"] == "gas_formation" && generated[k["ion"]] ||
			k["property"] == "hydration" && hydrated[k["ion"]] && !(k["ion"] == "H+" && k["scale"] == "absolute") {
			continue
		}
		t.add(k)
	}
	return t, nil
}

// hydration adds each ion's hydration enthalpy on the conventional scale
// (ΔhydH°(H⁺) = 0) from the NBS tables,
//
//	ΔhydH°conv(ion) = ΔfH°(ion, ao) − ΔfH°(ion, g) + z·ΔfH°(H⁺, g),
//
// with ΔfH°(ion, g) from the NBS gas row of a monatomic ion or the
// preferred gas_formation value of a polyatomic one. The absolute scale
// needs one more number, ΔhydH°(H⁺, absolute), kept by hand in
// kept/ion_values.csv; the loader derives the other ions' absolute values
// from it. Kept hydration rows of the ions written here are dropped, but
// for that H⁺ row. It returns the ions it wrote.
func (g *generator) hydration(t *table, ions []ionDef, kept []map[string]string) (map[string]bool, error) {
	hPlus, ok := g.nbsFind("H+", "g")
	if !ok {
		return nil, fmt.Errorf("no NBS row for H+(g)")
	}
	gas := map[string]float64{}
	for _, r := range t.rows {
		if r[1] == "gas_formation" {
			gas[r[0]], _ = strconv.ParseFloat(r[2], 64)
		}
	}
	out := map[string]bool{}
	for _, ion := range ions {
		spelling := nbsIonSpelling(ion)
		aq, ok := g.nbsFind(spelling, "ao")
		if !ok {
			continue
		}
		var gH float64
		gLoc := ""
		if ion.polyatomic {
			v, ok := gas[ion.symbol]
			if !ok {
				continue
			}
			gH, gLoc = v, "the gas_formation row of "+ion.symbol
		} else {
			r, ok := g.nbsFind(spelling, "g")
			if !ok {
				continue
			}
			gH, gLoc = r.H, locator(nbsFile, r.Line)
		}
		z := float64(ion.charge)
		conv := round6(aq.H - gH + z*hPlus.H)
		if ion.symbol == "H+" {
			conv = 0
		}
		out[ion.symbol] = true
		t.add(map[string]string{"ion": ion.symbol, "property": "hydration", "value": numDigits(conv, 2), "unit": "kJ/mol", "scale": "conventional",
			"source": keyNBS, "locator": locator(nbsFile, aq.Line) + "; " + locator(nbsFile, hPlus.Line), "derived": "yes",
			"note": fmt.Sprintf("ΔfH°(%s, ao) %s − ΔfH°(%s, g) %s (%s) %+g × ΔfH°(H+, g) %s (%s)", ion.symbol, aq.Original, ion.symbol, num(gH), gLoc, z, hPlus.Original, locator(nbsFile, hPlus.Line))})
	}
	return out, nil
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

// solid is a generated ionic crystal with its NBS formula and row.
type solid struct {
	formula, nbsFormula string
	row                 nbsRow
}

// solutionEnthalpies writes solution_enthalpies.csv: for every ionic
// crystal of compounds.csv whose NBS table lists it in the standard state
// of the aqueous solution at infinite dilution (state ai),
//
//	ΔsolH° = ΔfH°(salt, ai) − ΔfH°(salt, cr).
func (g *generator) solutionEnthalpies() (*table, error) {
	t := newTable("formula,solution_kj_per_mol,uncertainty,source,locator,memory,note",
		"Generated by go run ./data/gen from the NBS tables (data/sources/"+nbsFile+"): do not edit.",
		"Standard enthalpies of solution at infinite dilution, 298.15 K, kJ/mol of salt (positive: endothermic):",
		"ΔfH°(salt, ai) − ΔfH°(salt, cr), the crystal being the phase of compounds.csv.")
	for _, s := range g.solids {
		aq, ok := g.nbsFind(s.nbsFormula, "ai")
		if !ok {
			continue
		}
		d := max(aq.HDigits, s.row.HDigits)
		t.add(map[string]string{"formula": s.formula, "solution_kj_per_mol": numDigits(aq.H-s.row.H, d), "source": keyNBS,
			"locator": locator(nbsFile, aq.Line) + "; " + locator(nbsFile, s.row.Line),
			"note":    fmt.Sprintf("ΔfH°(%s, ai) %s − ΔfH°(%s, cr) %s%s", s.nbsFormula, aq.Original, s.nbsFormula, s.row.Original, slipNote(aq))})
	}
	return t, nil
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

// slipNote says that a value of the NBS file was corrected by a slip choice.
func slipNote(r nbsRow) string {
	if r.Corrected == "" {
		return ""
	}
	return fmt.Sprintf(" (the ai value corrected from the file's %s: a slip choice in data/gen/choices.csv)", r.Corrected)
}
