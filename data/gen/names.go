package main

// Names and families of generated compounds, written from their ions.

import (
	"strings"
)

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
