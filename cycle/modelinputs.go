package cycle

import (
	"fmt"
	"math"
	"slices"
	"strconv"
	"strings"

	"enthalpath/thermo/lattice"
)

// The models' shared inputs: ion kinds, radii at a coordination number,
// the structure (the compound's own, a file, or the radius-ratio rule), its
// Madelung constant and the cation–anion distance d₀.

func (c *Cycle) ionKinds() []lattice.IonKind {
	shape := func(s string) lattice.Shape {
		sh, err := lattice.ParseShape(s)
		if err != nil {
			return lattice.Monatomic
		}
		return sh
	}
	return []lattice.IonKind{
		{Charge: c.Cation.Ion.Charge, Count: c.Cation.Count, Shape: shape(c.Cation.Ion.Shape)},
		{Charge: c.Anion.Ion.Charge, Count: c.Anion.Count, Shape: shape(c.Anion.Ion.Shape)},
	}
}

// prototypeCN gives the coordination numbers (cation, anion) of the
// built-in prototypes.
func prototypeCN(name string) (int, int) {
	switch name {
	case "rock-salt", "nickel-arsenide":
		return 6, 6
	case "caesium-chloride":
		return 8, 8
	case "zinc-blende", "wurtzite":
		return 4, 4
	case "fluorite":
		return 8, 4
	case "antifluorite":
		return 4, 8
	case "rutile", "cadmium-chloride", "cadmium-iodide":
		return 6, 3
	case "corundum":
		return 6, 4
	}
	return 6, 6
}

// radius returns the radius of part p (Å) at coordination cn with the kind
// of the settings: a Shannon radius for a monatomic ion (the nearest CN the
// table has when cn is missing, said in from), the thermochemical radius for
// a polyatomic one.
func (c *Cycle) radius(p Part, cn int) (r float64, used int, from string, err error) {
	if p.Ion.Polyatomic || len(p.Ion.Radii) == 0 {
		if p.Ion.ThermochemicalRadius.Known() {
			kind := "thermochemical radius"
			if !p.Ion.Polyatomic {
				kind = "crystal radius, none in Shannon's table" // data/anion_radii.csv
			}
			return p.Ion.ThermochemicalRadius.V, 0, kind + " (" + p.Ion.ThermochemicalRadius.Source + ")", nil
		}
		return 0, 0, "", fmt.Errorf("no radius for %s in the data", p.Ion.Symbol)
	}
	best := -1
	for i, sr := range p.Ion.Radii {
		if sr.Spin == "LS" {
			continue // high-spin (or spin-free) radii unless only low-spin exist
		}
		if best < 0 || abs(sr.Coordination-cn) < abs(p.Ion.Radii[best].Coordination-cn) {
			best = i
		}
	}
	if best < 0 {
		best = 0
	}
	sr := p.Ion.Radii[best]
	v := sr.Ionic
	if c.Settings.Radius == RadiusCrystal {
		v = sr.Crystal
	}
	if !v.Known() {
		return 0, 0, "", fmt.Errorf("no Shannon %s radius for %s", c.Settings.Radius, p.Ion.Symbol)
	}
	from = "Shannon " + c.Settings.Radius.String() + " radius, CN " + sr.CN
	if sr.Coordination != cn {
		from += " (CN " + strconv.Itoa(cn) + " not tabulated)"
	}
	if sr.Substituted != "" {
		from += " (" + sr.Substituted + ")"
	}
	return v.V, sr.Coordination, from, nil
}

func abs(i int) int {
	if i < 0 {
		return -i
	}
	return i
}

// coordination returns the CNs the radii are taken at: the settings', else
// the structure's, else 6 (for Kapustinskii always 6 unless set).
func (c *Cycle) coordination(structureFree bool) (int, int) {
	cc, ac := 6, 6
	if !structureFree {
		if p := c.Settings.Structure.Prototype; p != "" && c.Settings.Structure.Cell == nil {
			cc, ac = prototypeCN(p)
		}
	}
	if c.Settings.CationCN > 0 {
		cc = c.Settings.CationCN
	}
	if c.Settings.AnionCN > 0 {
		ac = c.Settings.AnionCN
	}
	return cc, ac
}

func (e *evaluator) radiiUncached(in *ModelInputs, structureFree bool) error {
	c := e.c
	cc, ac := c.coordination(structureFree)
	rc, ucc, fc, err := c.radius(c.Cation, cc)
	if err != nil {
		return err
	}
	ra, uac, fa, err := c.radius(c.Anion, ac)
	if err != nil {
		return err
	}
	in.CationRadius, in.AnionRadius, in.CationCN, in.AnionCN = rc, ra, ucc, uac
	in.RadiusFrom = c.Cation.Ion.Symbol + ": " + fc + "; " + c.Anion.Ion.Symbol + ": " + fa
	return nil
}

// distance sets in.D0 by the settings: for the textbook models (actual
// false) DistanceAuto means the radii sum; for the ewald model the cell's
// nearest cation–anion distance.
func (e *evaluator) distance(in *ModelInputs, actual bool, geometric float64) error {
	c := e.c
	src := c.Settings.Distance
	if src == DistanceAuto {
		src = DistanceRadii
		if actual {
			src = DistanceGeometry
		}
	}
	switch src {
	case DistanceUser:
		if !(c.Settings.D0 > 0) {
			return &ModelError{Model: "d₀", Reason: "user d₀ must be a positive distance in Å"}
		}
		in.D0, in.D0From = c.Settings.D0, "set by the user"
		return nil
	case DistanceRadii:
		err := e.radii(in, false)
		if err == nil {
			in.D0 = in.CationRadius + in.AnionRadius
			in.D0From = "sum of radii (" + in.RadiusFrom + ")"
			return nil
		}
		if c.Settings.Distance == DistanceRadii {
			return err
		}
		// Automatic choice with a radius missing: fall back to the geometry.
	}
	if geometric > 0 {
		in.D0 = geometric
		in.D0From = "nearest cation–anion distance of " + in.Structure
		return nil
	}
	// A prototype with its default parameters gives the shape only (A);
	// its distance is the template crystal's, not the compound's. Take d₀
	// from the compound's own measured cell, else (automatic choice) from
	// the radii, as the textbook models do.
	shape := ""
	if in.Structure != "" {
		shape = "; " + in.Structure + "'s default cell gives the shape (A) only"
	}
	if d, own, err := e.ownCellDistance(); err != nil {
		return err
	} else if d > 0 {
		in.D0 = d
		in.D0From = "nearest cation–anion distance of " + c.Formula + "'s measured cell, " + own + shape
		return nil
	}
	if c.Settings.Distance == DistanceAuto && actual {
		if err := e.radii(in, false); err != nil {
			return err
		}
		in.D0 = in.CationRadius + in.AnionRadius
		in.D0From = "sum of radii (" + in.RadiusFrom + ")" + shape
		return nil
	}
	return &ModelError{Model: "d₀", Reason: "no measured cell to take d₀ from for " + c.Formula +
		"; choose a structure with parameters or a CIF file, or give d₀ in Å"}
}

// ownCellDistance returns the nearest cation–anion distance of the
// compound's own structure in the data when the data give its parameters
// (0 when they do not), with the structure described.
func (e *evaluator) ownCellDistance() (float64, string, error) {
	c := e.c
	if c.Compound.Structure == "" || len(c.Compound.Params) == 0 {
		return 0, "", nil
	}
	own := Structure{Prototype: c.Compound.Structure, Params: c.Compound.Params, FromData: true}
	mv, err := c.Memo().Madelung(own, c.Cation, c.Anion, c.Settings.Accuracy)
	if err != nil {
		return 0, "", err
	}
	return mv.NearestDistance, describeStructure(own), nil
}

// structureFits refuses a cell read from a file that does not hold the
// compound's ions (see cellFits); a prototype is checked when its ions are
// placed (Memo.Madelung). model names the model refused.
func (c *Cycle) structureFits(st Structure, model string) error {
	if st.Cell == nil {
		return nil
	}
	return cellFits(model, st.Name(), c.Formula, st.Cell, c.Cation, c.Anion)
}

// madelung finds the Madelung constant: the Ewald sum of the chosen
// structure with the compound's ions; with no structure (textbook models
// only) the prototype the radius-ratio rule suggests, with its default
// parameters.
func (e *evaluator) madelungUncached(in *ModelInputs, actual bool) (MadelungValue, error) {
	c := e.c
	st := c.Settings.Structure
	guessed := false
	if st.Empty() {
		if actual {
			return MadelungValue{}, &ModelError{Model: ModelEwald, Reason: "no structure for " + c.Formula, Remedy: RemedyStructure}
		}
		p, why, err := e.ratioRule()
		if err != nil {
			return MadelungValue{}, err
		}
		st = Structure{Prototype: p}
		in.MadelungFrom = why
		guessed = true
	}
	if err := c.structureFits(st, ModelEwald); err != nil {
		return MadelungValue{}, err
	}
	mv, err := c.Memo().Madelung(st, c.Cation, c.Anion, c.Settings.Accuracy)
	if err != nil {
		return MadelungValue{}, err
	}
	in.Madelung = mv.A
	in.Structure = st.Name()
	if !guessed {
		in.MadelungFrom = "Ewald sum (conducting boundary) of " + describeStructure(st)
	} else {
		in.MadelungFrom += "; A by Ewald sum of its default cell"
	}
	if guessed || (st.Cell == nil && len(st.Params) == 0) {
		mv.NearestDistance = 0 // the default cell's distance is not this compound's
	}
	return mv, nil
}

func describeStructure(st Structure) string {
	if st.Cell != nil {
		return st.Name()
	}
	if len(st.Params) == 0 {
		return st.Prototype + " (default parameters)"
	}
	return st.Prototype + " (" + formatParams(st.Params) + ")"
}

func formatParams(p map[string]float64) string {
	keys := make([]string, 0, len(p))
	for k := range p {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	parts := make([]string, len(keys))
	for i, k := range keys {
		parts[i] = k + "=" + strconv.FormatFloat(p[k], 'g', -1, 64)
	}
	return strings.Join(parts, ", ")
}

// ratioRule picks a prototype from the stoichiometry and the radius ratio
// r₊/r₋ (CN VI radii): the radius-ratio rule of Pauling (common practice,
// no source for the exact cut-offs 0.414 and 0.732).
func (e *evaluator) ratioRule() (string, string, error) {
	pick, ratio, err := e.ratioPick()
	if err != nil {
		return "", "", err
	}
	why := "no structure in the data: " + pick + " guessed by the radius-ratio rule"
	if !math.IsNaN(ratio) {
		why += " (r₊/r₋ = " + strconv.FormatFloat(ratio, 'f', 3, 64) + ")"
	}
	return pick, why, nil
}

// ratioPick is ratioRule's prototype and the radius ratio it read (NaN
// without radii), without the words.
func (e *evaluator) ratioPick() (string, float64, error) {
	c := e.c
	a, b := c.Cation.Count, c.Anion.Count
	var in ModelInputs
	ratio := math.NaN()
	if err := e.radii(&in, true); err == nil {
		ratio = in.CationRadius / in.AnionRadius
	}
	pick := ""
	switch {
	case a == 1 && b == 1:
		switch {
		case ratio >= 0.732:
			pick = "caesium-chloride"
		case ratio >= 0.414 || math.IsNaN(ratio):
			pick = "rock-salt"
		default:
			pick = "zinc-blende"
		}
	case a == 1 && b == 2:
		pick = "rutile"
		if ratio >= 0.732 || math.IsNaN(ratio) {
			pick = "fluorite"
		}
	case a == 2 && b == 1:
		pick = "antifluorite"
	case a == 2 && b == 3:
		pick = "corundum"
	}
	if pick == "" {
		return "", ratio, &ModelError{Model: "Madelung", Reason: fmt.Sprintf("no structure for %s and no prototype fits a %d:%d formula; choose a CIF file", c.Formula, a, b)}
	}
	return pick, ratio, nil
}
