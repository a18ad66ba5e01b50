package analysis

import (
	"errors"
	"fmt"
	"maps"
	"math"
	"slices"
	"sort"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/thermo/lsq"
	"enthalpath/thermo/notation"
)

// Ion volumes (this file): the formula-unit volume of an ionic solid is
// close to the sum of volumes of its ions, V_m ≈ Σ nᵢVᵢ (Jenkins,
// Roobottom, Passmore and Glasser, Inorg. Chem. 38, 3609 (1999), the basis
// of volume-based thermodynamics). The published ion volumes are not among
// the pinned sources, so the volumes here are fitted by least squares over
// the salts of the data whose molar volume is measured (a density or a
// cell), in three kinds of parameter:
//
//   - a monatomic ion's own volume. Salt volumes fix only sums of a
//     cation's and an anion's, so each monatomic cation is held near the
//     sphere of its Shannon ionic radius, (4/3)πr³ (Jenkins et al. took
//     cation volumes from radii likewise), with a prior of
//     IonVolumeCationPrior of that volume;
//   - for a polyatomic ion, its ligand atoms (the element it holds most of,
//     ties going to the one earlier in ligandOrder: O of SO₄²⁻, Cl of
//     PtCl₆²⁻, H of NH₄⁺): one volume per element, shared by every ion whose
//     ligand that element is;
//   - its other atoms (S of SO₄²⁻, Pt of PtCl₆²⁻): one volume for every
//     central atom, as those sit inside the ligands' shell.
//
// So an ion none of whose salts has a measured volume (MoO₄²⁻, C₂O₄²⁻,
// PtCl₄²⁻ …) still gets one from its atoms, and a salt without a density
// gets V_m = Σ nᵢVᵢ, stated with the fit's relative scatter over the
// measured salts.

// IonVolumeCationPrior is the relative standard deviation of the prior that
// holds a monatomic cation's volume near the sphere of its Shannon radius
// (our choice: loose enough for the salts to move it, tight enough to fix
// the split between cation and anion).
const IonVolumeCationPrior = 1.0

// ligandOrder breaks ties for the ligand of a polyatomic ion: the more
// electronegative element first (Pauling's order, from memory).
var ligandOrder = []string{"F", "O", "Cl", "N", "Br", "I", "S", "Se", "C", "Te", "H"}

// centreKey is the one parameter shared by every central atom.
const centreKey = "centre"

// IonVolumes is the fit of ion volumes over the data's salts with a
// measured molar volume.
type IonVolumes struct {
	// Params holds the fitted parameters in nm³: "Na+" (a monatomic ion),
	// "ligand O" (an O atom as the ligand of a polyatomic ion), "centre".
	Params map[string]float64
	// Salts is the number of salts with a measured V_m fitted;
	// RelativeRMS the RMS of (fitted − measured)/measured over them, the
	// relative standard uncertainty an estimated V_m is given.
	Salts       int
	RelativeRMS float64
}

// ionVolumeTerms returns the parameters an ion's volume is the sum of, with
// their counts, and whether the ion can be written so.
func ionVolumeTerms(in data.Ion) (map[string]float64, bool) {
	if !in.Polyatomic {
		return map[string]float64{in.Symbol: 1}, true
	}
	fm, err := notation.ParseFormula(in.Core)
	if err != nil {
		return nil, false
	}
	counts := fm.Counts()
	if len(counts) == 0 {
		return nil, false
	}
	lig := counts[0]
	for _, ec := range counts[1:] {
		if ec.Count > lig.Count || ec.Count == lig.Count && rank(ec.Symbol) < rank(lig.Symbol) {
			lig = ec
		}
	}
	terms := map[string]float64{"ligand " + lig.Symbol: float64(lig.Count)}
	for _, ec := range counts {
		if ec.Symbol != lig.Symbol {
			terms[centreKey] += float64(ec.Count)
		}
	}
	return terms, true
}

func rank(el string) int {
	if i := slices.Index(ligandOrder, el); i >= 0 {
		return i
	}
	return len(ligandOrder)
}

// cationPrior is the sphere of a monatomic cation's Shannon ionic radius
// at the coordination nearest 6 (nm³).
func cationPrior(in data.Ion) (float64, bool) {
	best := -1
	for i, r := range in.Radii {
		if !r.Ionic.Known() || r.Spin == "LS" {
			continue
		}
		if best < 0 || absInt(r.Coordination-6) < absInt(in.Radii[best].Coordination-6) {
			best = i
		}
	}
	if best < 0 {
		return 0, false
	}
	r := in.Radii[best].Ionic.V / 10 // Å → nm
	return 4 * math.Pi / 3 * r * r * r, true
}

func absInt(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// measuredMolarVolume returns a salt's V_m (nm³) from its density or cell.
func (a *Analyst) measuredMolarVolume(comp data.Compound) (float64, bool) {
	if comp.Molecular || comp.State != "" && comp.State != "cr" || !comp.Density.Known() && len(comp.Params) == 0 {
		return 0, false
	}
	c, err := a.build(comp.Formula, "", "")
	if err != nil {
		return 0, false
	}
	m, err := cycle.EvaluateModel(c, cycle.ModelVolume)
	if err != nil || !(m.Inputs.MolarVolume > 0) {
		return 0, false
	}
	return m.Inputs.MolarVolume, true
}

// IonVolumes fits the ion volumes over the data's salts (once per Analyst).
func (a *Analyst) IonVolumes() (*IonVolumes, error) {
	a.volumesOnce.Do(func() { a.volumes, a.volumesErr = a.fitIonVolumes() })
	return a.volumes, a.volumesErr
}

type volumeRow struct {
	terms map[string]float64
	vm    float64
}

func (a *Analyst) fitIonVolumes() (*IonVolumes, error) {
	var rows []volumeRow
	priors := map[string]float64{}
	for _, comp := range a.db.Compounds() {
		if !slices.Contains(IonicCounterIons(true), comp.Cation) && !slices.Contains(IonicCounterIons(false), comp.Anion) {
			continue
		}
		vm, ok := a.measuredMolarVolume(comp)
		if !ok {
			continue
		}
		terms := map[string]float64{}
		good := true
		for _, part := range []struct {
			sym string
			n   int
		}{{comp.Cation, comp.CationCount}, {comp.Anion, comp.AnionCount}} {
			in, err := a.db.Ion(part.sym)
			if err != nil {
				good = false
				break
			}
			t, ok := ionVolumeTerms(in)
			if !ok {
				good = false
				break
			}
			for k, x := range t {
				terms[k] += float64(part.n) * x
			}
			if !in.Polyatomic && in.Charge > 0 {
				if p, ok := cationPrior(in); ok {
					priors[in.Symbol] = p
				}
			}
		}
		if good {
			rows = append(rows, volumeRow{terms, vm})
		}
	}
	if len(rows) == 0 {
		return nil, errors.New("ion volumes: no salt of the data has a measured molar volume")
	}
	keys := map[string]int{}
	var names []string
	for _, r := range rows {
		for k := range r.terms {
			if _, ok := keys[k]; !ok {
				keys[k] = 0
				names = append(names, k)
			}
		}
	}
	sort.Strings(names)
	for i, k := range names {
		keys[k] = i
	}
	n := len(names)
	// Normal equations of the weighted least squares, each salt weighted
	// by 1/V_m² (relative residuals), each prior by 1/(fraction·V₀)².
	ata := make([]float64, n*n)
	atb := make([]float64, n)
	for _, r := range rows {
		w := 1 / (r.vm * r.vm)
		for ki, xi := range r.terms {
			i := keys[ki]
			atb[i] += w * xi * r.vm
			for kj, xj := range r.terms {
				ata[i*n+keys[kj]] += w * xi * xj
			}
		}
	}
	for k, v0 := range priors {
		i := keys[k]
		w := 1 / sq(IonVolumeCationPrior*v0)
		ata[i*n+i] += w
		atb[i] += w * v0
	}
	// A faint ridge keeps a parameter no salt separates from another
	// solvable; it moves none that the salts determine.
	for i := range n {
		ata[i*n+i] += 1e-6 * (ata[i*n+i] + 1)
	}
	x, err := lsq.SolveSPD(ata, atb, n)
	if err != nil {
		return nil, fmt.Errorf("ion volumes: %w", err)
	}
	f := &IonVolumes{Params: map[string]float64{}, Salts: len(rows)}
	for k, i := range keys {
		f.Params[k] = x[i]
	}
	var ss float64
	for _, r := range rows {
		ss += sq((f.sum(r.terms) - r.vm) / r.vm)
	}
	f.RelativeRMS = math.Sqrt(ss / float64(len(rows)))
	return f, nil
}

// sum is Σ count·volume over terms, in key order so that the result does
// not depend on map order to the last bit (the generator's output must
// reproduce byte for byte).
func (f *IonVolumes) sum(terms map[string]float64) float64 {
	v := 0.0
	for _, k := range slices.Sorted(maps.Keys(terms)) {
		v += terms[k] * f.Params[k]
	}
	return v
}

// IonVolumeBorrowed is the relative standard uncertainty given to a ligand
// volume borrowed for an element that no measured salt shows as a ligand
// (our choice).
const IonVolumeBorrowed = 0.5

// Ion returns an ion's volume (nm³), the part of it that is borrowed rather
// than fitted (nm³, to be given IonVolumeBorrowed), and whether the fit
// gives one. A monatomic cation the fit did not meet takes the sphere of
// its Shannon radius (borrowed). A ligand element no measured salt shows as
// a ligand takes, in this order, the fitted volume of its monatomic anion
// (I of I₃⁻ that of I⁻), of its monatomic cation (Hg of Hg₂²⁺), or the mean
// of the fitted ligand atoms: the rule of this file, no source.
func (f *IonVolumes) Ion(db *data.DB, in data.Ion) (v, borrowed float64, ok bool) {
	terms, ok := ionVolumeTerms(in)
	if !ok {
		return 0, 0, false
	}
	for _, k := range slices.Sorted(maps.Keys(terms)) {
		n := terms[k]
		if p, ok := f.Params[k]; ok {
			v += n * p
			continue
		}
		if !in.Polyatomic {
			if in.Charge <= 0 {
				return 0, 0, false
			}
			p, ok := cationPrior(in)
			return p, p, ok
		}
		p, ok := f.ligandStandIn(db, strings.TrimPrefix(k, "ligand "))
		if !ok {
			return 0, 0, false
		}
		v += n * p
		borrowed += n * p
	}
	return v, borrowed, v > 0
}

// ligandStandIn is the volume a ligand atom of element el borrows.
func (f *IonVolumes) ligandStandIn(db *data.DB, el string) (float64, bool) {
	for _, anion := range []bool{true, false} {
		for _, in := range db.IonsOf(el) {
			if in.Polyatomic || (in.Charge < 0) != anion {
				continue
			}
			if p, ok := f.Params[in.Symbol]; ok && p > 0 {
				return p, true
			}
		}
	}
	var sum float64
	var n int
	for _, k := range slices.Sorted(maps.Keys(f.Params)) {
		if strings.HasPrefix(k, "ligand ") {
			sum += f.Params[k]
			n++
		}
	}
	return sum / float64(n), n > 0
}

// Salt returns the estimated V_m (nm³) of a salt of nc cations and na
// anions with its standard uncertainty: the fit's relative RMS, and
// IonVolumeBorrowed of any borrowed part.
func (f *IonVolumes) Salt(db *data.DB, cation data.Ion, nc int, anion data.Ion, na int) (v, u float64, ok bool) {
	vc, bc, okc := f.Ion(db, cation)
	va, ba, oka := f.Ion(db, anion)
	if !okc || !oka {
		return 0, 0, false
	}
	v = float64(nc)*vc + float64(na)*va
	b := float64(nc)*bc + float64(na)*ba
	return v, math.Hypot(f.RelativeRMS*v, IonVolumeBorrowed*b), v > 0
}

// densityFromVolume is the density (g/cm³) a molar volume V_m (nm³ per
// formula unit) and a molar mass (g/mol) imply.
func densityFromVolume(molarMass, vm float64) float64 {
	return molarMass / (vm * 1e-21 * thermo.Avogadro)
}

// estimatedVolumeModel evaluates the volume-based model for a cycle whose
// salt has no measured volume, with V_m summed from the fitted ion volumes;
// it returns the model's result and the relative uncertainty of that V_m.
func (a *Analyst) estimatedVolumeModel(c *cycle.Cycle) (cycle.ModelResult, float64, error) {
	f, err := a.IonVolumes()
	if err != nil {
		return cycle.ModelResult{}, 0, err
	}
	vm, u, ok := f.Salt(a.db, c.Cation.Ion, c.Cation.Count, c.Anion.Ion, c.Anion.Count)
	if !ok || !(c.MolarMass > 0) {
		return cycle.ModelResult{}, 0, fmt.Errorf("no volume for %s or %s from the ion volumes fitted over the data's salts", c.Cation.Ion.Symbol, c.Anion.Ion.Symbol)
	}
	// The model reads V_m from a density: give it the one this V_m implies.
	c.Compound.Density = data.Value{V: densityFromVolume(c.MolarMass, vm), Unit: "g/cm³", Derived: true,
		Source: fmt.Sprintf("V_m %.4f nm³ summed from ion volumes fitted over %d salts", vm, f.Salts)}
	m, err := cycle.EvaluateModel(c, cycle.ModelVolume)
	return m, u / vm, err
}
