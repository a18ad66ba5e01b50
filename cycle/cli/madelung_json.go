package cli

import (
	"fmt"
	"io"
	"strings"

	"enthalpath/cycle/cells"
	"enthalpath/data"
)

// The JSON of "enthalpath madelung" and of its --list.

type madelungSite struct {
	Species   string     `json:"species"`
	Label     string     `json:"label,omitempty"`
	Charge    float64    `json:"charge"`
	Frac      [3]float64 `json:"fractional"`
	Potential float64    `json:"potential_volt"`
	// BondValenceSum is set for a CIF file (null where none is defined).
	BondValenceSum *jsonNumber `json:"bond_valence_sum,omitempty"`
	// Occupants list the species of a shared or partly vacant site.
	Occupants []madelungOccupant `json:"occupants,omitempty"`
}

type madelungOccupant struct {
	Element   string  `json:"element"`
	Label     string  `json:"label"`
	Occupancy float64 `json:"occupancy"`
	Charge    float64 `json:"charge"`
}

type madelungGroup struct {
	Element        string     `json:"element"`
	Labels         []string   `json:"labels"`
	Sites          []int      `json:"sites"`
	Atoms          float64    `json:"atoms"`
	Charge         float64    `json:"charge"`
	States         [2]int     `json:"oxidation_states"`
	HighFraction   float64    `json:"fraction_higher_state"`
	BondValenceSum jsonNumber `json:"bond_valence_sum"`
	Given          bool       `json:"given"`
}

type madelungCharges struct {
	Method         string            `json:"method"`
	Description    string            `json:"description"`
	Alternatives   int               `json:"neutral_combinations,omitempty"`
	Offered        map[string][]int  `json:"oxidation_states_offered,omitempty"`
	OfferedFrom    map[string]string `json:"oxidation_states_from,omitempty"`
	Groups         []madelungGroup   `json:"groups"`
	Formula        string            `json:"formula"`
	AveragedSites  int               `json:"averaged_sites"`
	BondValenceFit string            `json:"bond_valence_parameters"`
}

type madelungBackground struct {
	NetCharge      float64 `json:"net_charge"`
	EnergyEV       float64 `json:"energy_ev_per_cell"`
	PotentialShift float64 `json:"potential_shift_volt"`
	Convention     string  `json:"convention"`
}

type madelungStructure struct {
	Name         string             `json:"name"`
	Source       string             `json:"source"`
	Description  string             `json:"description,omitempty"`
	Parameters   map[string]float64 `json:"parameters,omitempty"`
	Supercell    [3]int             `json:"supercell"`
	Lattice      [3][3]float64      `json:"lattice_angstrom"`
	CellLengths  [3]float64         `json:"cell_lengths_angstrom"`
	CellAngles   [3]float64         `json:"cell_angles_degree"`
	Volume       float64            `json:"volume_angstrom3"`
	FormulaUnits int                `json:"formula_units"`
	Sites        []madelungSite     `json:"sites"`
}

type madelungAccuracy struct {
	Requested float64 `json:"requested"`
	Estimated float64 `json:"estimated"`
	Reached   bool    `json:"reached"`
}

type madelungEwald struct {
	Alpha       float64 `json:"alpha_per_angstrom"`
	RealCutoff  float64 `json:"real_cutoff_angstrom"`
	RecipCutoff float64 `json:"reciprocal_cutoff_per_angstrom"`
	RealTerms   int     `json:"real_terms"`
	RecipTerms  int     `json:"reciprocal_vectors"`
}

type madelungOutput struct {
	Structure         madelungStructure `json:"structure"`
	MadelungConstant  float64           `json:"madelung_constant"`
	Convention        string            `json:"convention"`
	NearestDistance   float64           `json:"nearest_distance_angstrom"`
	NearestPair       [2]int            `json:"nearest_pair_sites"`
	MeanDistance      jsonNumber        `json:"mean_cation_anion_distance_angstrom"`
	EnergyCell        float64           `json:"energy_ev_per_cell"`
	EnergyFormulaUnit float64           `json:"energy_ev_per_formula_unit"`
	EnergyKJPerMol    float64           `json:"energy_kj_per_mol"`
	FormulaUnits      int               `json:"formula_units"`
	SitePotentials    []float64         `json:"site_potentials_volt"`
	Boundary          string            `json:"boundary_condition"`
	Accuracy          madelungAccuracy  `json:"accuracy"`
	Ewald             madelungEwald     `json:"ewald"`
	// Charges say how a CIF file's charges were settled.
	Charges *madelungCharges `json:"charges,omitempty"`
	// Background is set for a charged cell.
	Background *madelungBackground `json:"background,omitempty"`
	// Warnings say what makes the structure unlike a real solid; absent
	// when nothing does.
	Warnings []string `json:"warnings,omitempty"`
}

// madelungJSON builds the output; mean is NaN (JSON null) when there is no
// mean bond length (the warnings say why).
func madelungJSON(job madelungJob, c *cells.Crystal, r cells.EwaldResult, mean float64, bg cells.Background, reached bool) madelungOutput {
	abc, ang := cellParameters(c)
	st := madelungStructure{
		Name: c.Name, Source: "cif", Supercell: job.supercell,
		CellLengths: abc, CellAngles: ang, Volume: c.Volume(), FormulaUnits: c.FormulaUnits,
	}
	if p := job.prototype; p != nil {
		st.Source, st.Description, st.Parameters = "prototype", p.Description, job.values
	}
	for k := 0; k < 3; k++ {
		st.Lattice[k] = c.Lattice[k]
	}
	sums := job.siteSums(c)
	for k, s := range c.Sites {
		ms := madelungSite{Species: s.Species, Label: s.Label, Charge: s.Charge, Frac: s.Frac, Potential: r.SitePotentials[k]}
		if sums != nil {
			v := jsonNumber(sums[k])
			ms.BondValenceSum = &v
		}
		if s.Averaged() {
			for _, o := range s.Occupants {
				ms.Occupants = append(ms.Occupants, madelungOccupant{o.Element, o.Label, o.Occupancy, o.Charge})
			}
		}
		st.Sites = append(st.Sites, ms)
	}
	out := madelungOutput{
		Structure:         st,
		MadelungConstant:  r.MadelungConstant,
		Convention:        r.Convention,
		NearestDistance:   r.NearestDistance,
		NearestPair:       [2]int{r.NearestPair[0] + 1, r.NearestPair[1] + 1},
		MeanDistance:      jsonNumber(mean),
		EnergyCell:        r.EnergyEV,
		EnergyFormulaUnit: r.EnergyPerFormulaUnitEV,
		EnergyKJPerMol:    r.EnergyKJPerMol,
		FormulaUnits:      c.FormulaUnits,
		SitePotentials:    r.SitePotentials,
		Boundary:          r.Boundary,
		Accuracy:          madelungAccuracy{Requested: r.Accuracy, Estimated: r.EstimatedError, Reached: reached},
		Ewald: madelungEwald{Alpha: r.Alpha, RealCutoff: r.RealCutoff, RecipCutoff: r.RecipCutoff,
			RealTerms: r.RealTerms, RecipTerms: r.RecipTerms},
	}
	if bg.NetCharge != 0 {
		out.Background = &madelungBackground{bg.NetCharge, bg.EnergyEV, bg.PotentialShiftV, cells.BackgroundConvention}
	}
	if sf := job.file; sf != nil {
		ch := &madelungCharges{Method: sf.Assignment.Method.Key(), Description: sf.Assignment.Method.String(),
			Alternatives: sf.Assignment.Alternatives, Formula: sf.Formula, AveragedSites: sf.Averaged,
			BondValenceFit: fmt.Sprintf("exp((R - d)/%.2f), R from %s", cells.BondValenceB, data.BondValenceSource)}
		if sf.Assignment.Method != cells.GivenCharges {
			ch.Offered, ch.OfferedFrom = sf.Candidates, sf.From
		}
		for _, g := range sf.Assignment.Groups {
			sites := make([]int, len(g.Sites))
			for i, k := range g.Sites {
				sites[i] = k + 1
			}
			ch.Groups = append(ch.Groups, madelungGroup{Element: g.Element, Labels: g.Labels, Sites: sites, Atoms: g.Atoms,
				Charge: g.Charge, States: [2]int{g.Low, g.High}, HighFraction: g.HighFraction, BondValenceSum: jsonNumber(g.Sum), Given: g.Given})
		}
		out.Charges = ch
	}
	return out
}

type prototypeParamJSON struct {
	Key     string  `json:"key"`
	Doc     string  `json:"description"`
	Unit    string  `json:"unit"`
	Default float64 `json:"default"`
}

type prototypeSlotJSON struct {
	Label  string  `json:"label"`
	Role   string  `json:"role"`
	Charge float64 `json:"default_charge"`
}

type prototypeJSON struct {
	Name        string               `json:"name"`
	Description string               `json:"description"`
	Example     string               `json:"example"`
	Params      []prototypeParamJSON `json:"parameters"`
	Slots       []prototypeSlotJSON  `json:"slots"`
}

func listPrototypes(w io.Writer, asJSON bool) error {
	protos := cells.Prototypes()
	if asJSON {
		var out []prototypeJSON
		for _, p := range protos {
			pj := prototypeJSON{Name: p.Name, Description: p.Description, Example: p.Example}
			for _, q := range p.Params {
				pj.Params = append(pj.Params, prototypeParamJSON{q.Key, q.Doc, q.Unit, q.Default})
			}
			for _, s := range p.Slots {
				pj.Slots = append(pj.Slots, prototypeSlotJSON{s.Label, s.Role, s.Charge})
			}
			out = append(out, pj)
		}
		return writeJSON(w, map[string]any{"prototypes": out})
	}
	t := table{head: []string{"prototype", "example", "parameters (defaults)", "ions (default charges)"}}
	for _, p := range protos {
		var ps, ss []string
		for _, q := range p.Params {
			ps = append(ps, strings.TrimSpace(fmt.Sprintf("%s=%g %s", q.Key, q.Default, q.Unit)))
		}
		for _, s := range p.Slots {
			ss = append(ss, fmt.Sprintf("%s %s", s.Label, minus(fmt.Sprintf("%+g", s.Charge))))
		}
		t.add(p.Name, p.Example, strings.Join(ps, ", "), strings.Join(ss, ", "))
	}
	t.write(w, "")
	fmt.Fprintln(w, "\nparameters:")
	for _, p := range protos {
		for _, q := range p.Params {
			fmt.Fprintf(w, "  %-17s %-9s %s\n", p.Name, q.Key, q.Doc)
		}
	}
	fmt.Fprintln(w, "\nexample: enthalpath madelung wurtzite --param u=0.375 --charges M=2,X=-2")
	return nil
}
