package data

import (
	"maps"
	"slices"
	"sync"
)

// The extended ionic model's coefficient tables: model_sources.csv,
// model_salts.csv (per salt: repulsion range ρ, dispersion C and D) and
// model_ions.csv (per ion: basic radius σ, Pauling's outer-electron count,
// free-ion polarizability) and model_crystal_polarizabilities.csv (per ion:
// the polarizability in crystals of Tessman, Kahn and Shockley). They are read apart from the main tables, values as
// published with their sources; the physics lives in thermo/lattice.

// Pair kinds of the per-salt dispersion coefficients, in table order.
const (
	PairCationCation = iota
	PairCationAnion
	PairAnionAnion
)

// SaltModelParams are one salt's extended-model coefficients.
type SaltModelParams struct {
	Formula string
	// Rho is the repulsion range ρ in Å (Unit "Å"); unknown when absent.
	Rho Value
	// C and D are the dispersion coefficients per pair kind (PairCationCation
	// …), as published: C in 1e-60 erg·cm⁶ (Unit "1e-60 erg cm6"), D in
	// 1e-76 erg·cm⁸ (Unit "1e-76 erg cm8").
	C, D [3]Value
}

// IonModelParams are one ion's extended-model inputs.
type IonModelParams struct {
	Ion string
	// BasicRadius is the repulsion radius σ in Å (Unit "Å").
	BasicRadius Value
	// OuterElectrons is Pauling's n of the repulsion factor (0: not given).
	OuterElectrons int
	// Polarizability is α in Å³ (Unit "Å3"); Electrons the Slater–Kirkwood
	// effective electron number N (0: not given).
	Polarizability Value
	Electrons      float64
	// CrystalPolarizability is α of the ion in crystals in Å³ (Unit "Å3"),
	// from model_crystal_polarizabilities.csv; unknown when absent.
	CrystalPolarizability Value
}

// ModelParams holds the extended model's tables.
type ModelParams struct {
	sources []Source
	salts   map[string]SaltModelParams
	ions    map[string]IonModelParams
}

// Units of the dispersion coefficients as stored.
const (
	UnitC6Published = "1e-60 erg cm6"
	UnitC8Published = "1e-76 erg cm8"
)

var modelParamsOnce = sync.OnceValues(loadModelParams)

// ExtendedModelParams returns the extended model's tables, read from the
// embedded files once (the result is shared and never changed).
func ExtendedModelParams() (*ModelParams, error) { return modelParamsOnce() }

// Salt returns the coefficients of the salt with this formula.
func (p *ModelParams) Salt(formula string) (SaltModelParams, bool) {
	s, ok := p.salts[formula]
	return s, ok
}

// Ion returns the inputs of the ion with this symbol ("Na+", "O2-").
func (p *ModelParams) Ion(symbol string) (IonModelParams, bool) {
	s, ok := p.ions[symbol]
	return s, ok
}

// Source returns the citation of a key of model_sources.csv.
func (p *ModelParams) Source(key string) (Source, bool) {
	i := slices.IndexFunc(p.sources, func(s Source) bool { return s.Key == key })
	if i < 0 {
		return Source{}, false
	}
	return p.sources[i], true
}

// Sources lists the citations of the extended model's tables.
func (p *ModelParams) Sources() []Source { return slices.Clone(p.sources) }

// Salts lists the salts with coefficients, sorted by formula.
func (p *ModelParams) Salts() []SaltModelParams { return valuesByKey(p.salts) }

// IonParams lists the ions with inputs, sorted by symbol.
func (p *ModelParams) IonParams() []IonModelParams { return valuesByKey(p.ions) }

func valuesByKey[V any](m map[string]V) []V {
	keys := slices.Sorted(maps.Keys(m))
	out := make([]V, len(keys))
	for i, k := range keys {
		out[i] = m[k]
	}
	return out
}

var modelTableColumns = map[string][]string{
	"model_sources.csv": {"key", "citation"},
	"model_salts.csv": {"formula", "rho_angstrom", "rho_source", "c_pp", "c_pm", "c_mm", "d_pp", "d_pm", "d_mm",
		"dispersion_source", "memory", "note"},
	"model_ions.csv": {"ion", "basic_radius_angstrom", "radius_source", "outer_electrons", "polarizability_a3",
		"polarizability_source", "sk_electrons", "memory", "note"},
	"model_crystal_polarizabilities.csv": {"ion", "polarizability_a3", "polarizability_source", "locator", "memory", "note"},
}

func readModelTable(name string) ([]record, error) {
	f, err := embedded.Open("tables/" + name)
	if err != nil {
		return nil, &TableError{File: name, Err: err}
	}
	defer f.Close()
	return readCSV(name, f, modelTableColumns[name])
}

func loadModelParams() (*ModelParams, error) {
	p := &ModelParams{salts: map[string]SaltModelParams{}, ions: map[string]IonModelParams{}}
	recs, err := readModelTable("model_sources.csv")
	if err != nil {
		return nil, err
	}
	for _, r := range recs {
		if r.str("key") == "" || r.str("citation") == "" {
			return nil, r.errorf("key", "a source needs a key and a citation")
		}
		p.sources = append(p.sources, Source{Key: r.str("key"), Citation: r.str("citation")})
	}
	// value reads one sourced number; the source must be in model_sources.csv.
	value := func(r record, field, srcField, unit string) (Value, error) {
		x, ok, err := r.float(field)
		if err != nil || !ok {
			return Value{}, err
		}
		mem, err := r.flag("memory")
		if err != nil {
			return Value{}, err
		}
		v := Value{V: x, Unit: unit, Source: r.str(srcField), Memory: mem, Note: r.str("note")}
		if _, known := p.Source(v.Source); !known {
			return Value{}, r.errorf(srcField, "unknown source key %q (add it to model_sources.csv)", v.Source)
		}
		if !(x > 0) {
			return Value{}, r.errorf(field, "%g: must be positive", x)
		}
		return v, nil
	}
	if recs, err = readModelTable("model_salts.csv"); err != nil {
		return nil, err
	}
	for _, r := range recs {
		s := SaltModelParams{Formula: r.str("formula")}
		if s.Rho, err = value(r, "rho_angstrom", "rho_source", "Å"); err != nil {
			return nil, err
		}
		for k, suffix := range []string{"pp", "pm", "mm"} {
			if s.C[k], err = value(r, "c_"+suffix, "dispersion_source", UnitC6Published); err != nil {
				return nil, err
			}
			if s.D[k], err = value(r, "d_"+suffix, "dispersion_source", UnitC8Published); err != nil {
				return nil, err
			}
		}
		if _, dup := p.salts[s.Formula]; dup || s.Formula == "" {
			return nil, r.errorf("formula", "%q is empty or repeated", s.Formula)
		}
		p.salts[s.Formula] = s
	}
	if recs, err = readModelTable("model_ions.csv"); err != nil {
		return nil, err
	}
	for _, r := range recs {
		in := IonModelParams{Ion: r.str("ion")}
		if in.BasicRadius, err = value(r, "basic_radius_angstrom", "radius_source", "Å"); err != nil {
			return nil, err
		}
		if in.Polarizability, err = value(r, "polarizability_a3", "polarizability_source", "Å3"); err != nil {
			return nil, err
		}
		n, _, err := r.float("outer_electrons")
		if err != nil {
			return nil, err
		}
		in.OuterElectrons = int(n)
		if in.Electrons, _, err = r.float("sk_electrons"); err != nil {
			return nil, err
		}
		if float64(in.OuterElectrons) != n || n < 0 || in.Electrons < 0 {
			return nil, r.errorf("outer_electrons", "electron counts are whole, non-negative numbers")
		}
		if _, dup := p.ions[in.Ion]; dup || in.Ion == "" {
			return nil, r.errorf("ion", "%q is empty or repeated", in.Ion)
		}
		p.ions[in.Ion] = in
	}
	if recs, err = readModelTable("model_crystal_polarizabilities.csv"); err != nil {
		return nil, err
	}
	for _, r := range recs {
		in, ok := p.ions[r.str("ion")]
		if !ok {
			return nil, r.errorf("ion", "%q has no row in model_ions.csv (its Slater–Kirkwood electron number)", r.str("ion"))
		}
		if in.CrystalPolarizability.Known() {
			return nil, r.errorf("ion", "%q is repeated", in.Ion)
		}
		if in.CrystalPolarizability, err = value(r, "polarizability_a3", "polarizability_source", "Å3"); err != nil {
			return nil, err
		}
		if !in.CrystalPolarizability.Known() {
			return nil, r.errorf("polarizability_a3", "a row needs its polarizability")
		}
		in.CrystalPolarizability.Locator = r.str("locator")
		p.ions[in.Ion] = in
	}
	return p, nil
}
