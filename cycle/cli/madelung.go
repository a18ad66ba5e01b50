package cli

import (
	"errors"
	"fmt"
	"io"
	"math"
	"sort"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/data"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
	"enthalpath/thermo/valence"
)

const madelungSynopsis = `madelung NAME|FILE.cif [flags]
       enthalpath madelung --list [--json]

Computes the Madelung constant, the Ewald energy and the site potentials of a
built-in prototype (see --list) or of the structure in a CIF file. Flags may
come before or after the structure.

A CIF file without charges gets them assigned (charge balance with the data's
oxidation states, then bond-valence sums); --charges overrides. Partly
occupied sites carry their mean charge; a charged cell is summed with a
neutralising background.`

// maxListedSites is the largest cell whose site potentials the text output
// lists one by one; larger cells get one line per species (--json has all).
const maxListedSites = 64

func runMadelung(env Env, args []string) error {
	fs := NewFlagSet("madelung")
	var params, charges listFlag
	fs.Var(&params, "param", "prototype parameter `key=value` (repeatable, or comma-separated)")
	fs.Var(&charges, "charges", "ion charges `LABEL=Z,...`: slot labels (M, X, A, B) for a prototype; site labels, type symbols or elements for a CIF file")
	supercell := fs.String("supercell", "", "repeat the cell: `n` for n×n×n, or n1xn2xn3")
	accuracy := fs.Float64("accuracy", ewald.DefaultAccuracy, "relative accuracy of the Ewald sum")
	asJSON := fs.Bool("json", false, "print one JSON object")
	list := fs.Bool("list", false, "list the built-in prototypes with their parameters")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if *list {
		if len(pos) > 0 || len(params) > 0 || len(charges) > 0 || *supercell != "" {
			return Usagef("--list takes no structure and no other flags except --json")
		}
		return listPrototypes(env.Stdout, *asJSON)
	}
	if givenFlags(fs)["accuracy"] { // 0 would mean the library's default
		if err := cycle.CheckSetting(cycle.SettingAccuracy, *accuracy); err != nil {
			return boundUsage("accuracy", "give the relative accuracy of the Ewald sum", err)
		}
	}
	if len(pos) != 1 {
		fs.Usage()
		return Usagef("madelung: give exactly one prototype name or CIF file (got %d arguments); see --list", len(pos))
	}
	job, c, err := loadStructure(env, pos[0], params, charges, *supercell)
	if err != nil {
		return err
	}
	res, bg, sumErr := ewald.SumCharged(c, ewald.Options{Accuracy: *accuracy})
	var accErr *ewald.AccuracyError
	switch {
	case errors.As(sumErr, &accErr):
		fmt.Fprintf(env.Stderr, "enthalpath madelung: warning: %v\n", accErr)
	case errors.Is(sumErr, ewald.ErrBadOptions):
		return &UsageError{fmt.Errorf("--accuracy %g: %w", *accuracy, sumErr)}
	case sumErr != nil:
		return &UsageError{fmt.Errorf("%s: %w", pos[0], sumErr)}
	}
	mean, meanErr := c.MeanCationAnionDistance()
	warnings := geometryWarnings(c, res, meanErr)
	if bg.NetCharge != 0 {
		warnings = append(warnings, fmt.Sprintf("%s (net charge %+.6g e per cell, background term %.6g eV)", ewald.BackgroundConvention, bg.NetCharge, bg.EnergyEV))
	}
	if sf := job.file; sf != nil && sf.Assignment.Method == valence.PoorFit {
		warnings = append(warnings, "the assigned charges fit the bond-valence sums poorly; check them or give --charges")
	}
	for _, w := range warnings {
		fmt.Fprintf(env.Stderr, "enthalpath madelung: warning: %s\n", w)
	}
	if *asJSON {
		out := madelungJSON(job, c, res, mean, bg, sumErr == nil)
		out.Warnings = warnings
		return writeJSON(env.Stdout, out)
	}
	printMadelung(env.Stdout, job, c, res, mean, bg)
	return nil
}

// geometryWarnings says when a structure that can be summed is unlike any
// real solid: its nearest cation and anion closer than crystal.ShortestBond
// (wurtzite with u = 0.9 puts them 0.52 Å apart). The Madelung constant
// of such a cell is a number about point charges, not about a crystal.
func geometryWarnings(c *crystal.Crystal, r ewald.Result, meanErr error) []string {
	var out []string
	if meanErr != nil {
		out = append(out, meanErr.Error()+"; no mean bond length is given")
	}
	i, j := r.NearestPair[0], r.NearestPair[1]
	if i < 0 || j < 0 || !(r.NearestDistance < crystal.ShortestBond) {
		return out
	}
	return append(out, fmt.Sprintf("the nearest cation and anion (site %d %s and site %d %s) are %.3g Å apart, below %g Å, shorter than any real bond "+
		"(threshold: common practice, no source); the Madelung constant refers to that distance; check the parameters or the file",
		i+1, c.Sites[i].Species, j+1, c.Sites[j].Species, r.NearestDistance, crystal.ShortestBond))
}

// loadStructure reads the structure flags that madelung and orderings
// share (--param, --charges, --supercell) and builds the crystal of target,
// a prototype name or a CIF file.
func loadStructure(env Env, target string, params, charges listFlag, supercell string) (madelungJob, *crystal.Crystal, error) {
	chargeMap, err := parseKeyValues("--charges", charges)
	if err != nil {
		return madelungJob{}, nil, err
	}
	paramMap, err := parseKeyValues("--param", params)
	if err != nil {
		return madelungJob{}, nil, err
	}
	n, err := parseSupercell(supercell)
	if err != nil {
		return madelungJob{}, nil, err
	}
	job := madelungJob{target: target, params: paramMap, charges: chargeMap, supercell: n}
	if isCIFPath(target) {
		if job.db, err = LoadData(env); err != nil {
			return job, nil, err
		}
	}
	c, err := job.crystal()
	return job, c, err
}

// madelungJob is what the command line asked for.
type madelungJob struct {
	target    string
	params    map[string]float64
	charges   map[string]float64
	supercell [3]int
	db        *data.DB
	prototype *crystal.Prototype // nil for a CIF file
	values    map[string]float64 // the prototype parameters used
	file      *cycle.StructureFile
}

func isCIFPath(s string) bool {
	return strings.HasSuffix(strings.ToLower(s), ".cif") || strings.ContainsRune(s, '/')
}

// crystal builds the structure: prototype with parameters and charges, or
// CIF file, then the supercell.
func (j *madelungJob) crystal() (*crystal.Crystal, error) {
	var c *crystal.Crystal
	if isCIFPath(j.target) {
		if len(j.params) > 0 {
			return nil, Usagef("%s: --param applies to prototypes only; a CIF file gives its own geometry", j.target)
		}
		sf, err := cycle.OpenStructureFile(j.db, j.target, j.charges, nil)
		var ae *cycle.AssignmentError
		if errors.As(err, &ae) {
			return nil, Usagef("%v (give them with --charges LABEL=Z,...)", err)
		}
		if err != nil {
			return nil, &UsageError{err}
		}
		j.file, c = sf, sf.Cell
	} else {
		p, err := crystal.LookupPrototype(j.target)
		if err != nil {
			return nil, &UsageError{fmt.Errorf("%w (or give a path ending in .cif)", err)}
		}
		j.prototype = &p
		c, err = crystal.Build(p.Name, j.params)
		if err != nil {
			return nil, &UsageError{err}
		}
		j.values = p.Defaults()
		for k, v := range j.params {
			j.values[k] = v
		}
		if len(j.charges) > 0 {
			ions := map[string]crystal.Ion{}
			for label, z := range j.charges {
				known := false
				for _, s := range p.Slots {
					known = known || s.Label == label
				}
				if !known {
					return nil, Usagef("--charges: %s has no slot %q (slots: %s)", p.Name, label, slotLabels(p))
				}
				ions[label] = crystal.Ion{Charge: z}
			}
			if c, err = c.WithIons(ions); err != nil {
				return nil, &UsageError{fmt.Errorf("--charges: %w", err)}
			}
		}
	}
	if n := j.supercell; n != [3]int{1, 1, 1} {
		var err error
		if c, err = c.Supercell(n[0], n[1], n[2]); err != nil {
			return nil, &UsageError{fmt.Errorf("--supercell: %w", err)}
		}
	}
	return c, nil
}

func slotLabels(p crystal.Prototype) string {
	var s []string
	for _, sl := range p.Slots {
		s = append(s, sl.Label)
	}
	return strings.Join(s, ", ")
}

// parseKeyValues reads repeated or comma-separated key=value items.
func parseKeyValues(flagName string, items []string) (map[string]float64, error) {
	m := map[string]float64{}
	for _, item := range items {
		for _, part := range strings.Split(item, ",") {
			part = strings.TrimSpace(part)
			if part == "" {
				continue
			}
			k, v, ok := strings.Cut(part, "=")
			k = strings.TrimSpace(k)
			if !ok || k == "" {
				return nil, Usagef("%s %q: want key=value", flagName, part)
			}
			x, err := strconv.ParseFloat(strings.TrimSpace(strings.Replace(v, "−", "-", 1)), 64)
			if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
				return nil, Usagef("%s %q: %q is not a number", flagName, part, v)
			}
			if _, dup := m[k]; dup {
				return nil, Usagef("%s: %s given twice", flagName, k)
			}
			m[k] = x
		}
	}
	return m, nil
}

// parseSupercell reads "", "n" or "n1xn2xn3".
func parseSupercell(s string) ([3]int, error) {
	if s == "" {
		return [3]int{1, 1, 1}, nil
	}
	parts := strings.FieldsFunc(strings.ToLower(s), func(r rune) bool { return r == 'x' || r == '×' })
	if len(parts) != 1 && len(parts) != 3 {
		return [3]int{}, Usagef("--supercell %q: want n or n1xn2xn3", s)
	}
	var n [3]int
	for i, p := range parts {
		v, err := strconv.Atoi(strings.TrimSpace(p))
		if err != nil || v < 1 {
			return [3]int{}, Usagef("--supercell %q: %q is not a positive whole number", s, p)
		}
		n[i] = v
	}
	if len(parts) == 1 {
		n[1], n[2] = n[0], n[0]
	}
	return n, nil
}

func minus(s string) string { return strings.Replace(s, "-", "−", 1) }

// siteSums returns the bond-valence sum of every site of c (a supercell
// repeats the file's cell), or nil for a prototype.
func (j *madelungJob) siteSums(c *crystal.Crystal) []float64 {
	if j.file == nil {
		return nil
	}
	n := len(j.file.BondValenceSums)
	out := make([]float64, len(c.Sites))
	for i := range out {
		out[i] = j.file.BondValenceSums[i%n]
	}
	return out
}

// groupCharge writes a group's charge, with the two states of a mixed one.
func groupCharge(g valence.Group) string {
	q := minus(fmt.Sprintf("%+.4g", g.Charge))
	if g.Mixed() {
		lo, hi := 1-g.HighFraction, g.HighFraction
		q += fmt.Sprintf(" (%s%+d : %s%+d = %.4g : %.4g)", g.Element, g.Low, g.Element, g.High, lo, hi)
	}
	return q
}

// printCharges says how a CIF file's charges were settled, group by group,
// with the bond-valence sums and the averaging.
func printCharges(w io.Writer, sf *cycle.StructureFile, nSites int) {
	fmt.Fprintf(w, "formula     %s per formula unit (from the occupancies)\n", sf.Formula)
	a := sf.Assignment
	fmt.Fprintf(w, "charges     %s\n", a.Method)
	if a.Method == valence.ChargeBalanceRanked {
		fmt.Fprintf(w, "            %d neutral combinations; the one fitting the bond-valence sums best is used\n", a.Alternatives)
	}
	if a.Method != valence.Given {
		var offered []string
		els := make([]string, 0, len(sf.Candidates))
		for el := range sf.Candidates {
			els = append(els, el)
		}
		sort.Strings(els)
		for _, el := range els {
			var qs []string
			for _, q := range sf.Candidates[el] {
				qs = append(qs, minus(fmt.Sprintf("%+d", q)))
			}
			offered = append(offered, fmt.Sprintf("%s %s (%s)", el, strings.Join(qs, " "), sf.From[el]))
		}
		fmt.Fprintf(w, "            oxidation states offered: %s; --charges overrides\n", strings.Join(offered, ", "))
	}
	if sf.Averaged > 0 {
		fmt.Fprintf(w, "averaged    %d of %d sites carry a mean charge (shared or partly vacant sites, or two oxidation states on one site): the averaged crystal, not an ordered one\n", sf.Averaged, nSites)
	}
	t := table{head: []string{"element", "atoms", "labels", "charge", "bond-valence sum", "|sum − |charge||", "from"}, right: map[int]bool{1: true, 4: true, 5: true}}
	for _, g := range a.Groups {
		from := "assigned"
		if g.Given {
			from = "given"
		}
		sum, dev := "—", "—"
		if !math.IsNaN(g.Sum) {
			sum = fmt.Sprintf("%.3f", g.Sum)
			dev = fmt.Sprintf("%.3f", math.Abs(g.Sum-math.Abs(g.Charge)))
		}
		labels := strings.Join(g.Labels, " ")
		if len(g.Labels) > 6 {
			labels = strings.Join(g.Labels[:6], " ") + fmt.Sprintf(" … (%d)", len(g.Labels))
		}
		t.add(g.Element, strconv.FormatFloat(math.Round(g.Atoms*1e4)/1e4, 'f', -1, 64), labels, groupCharge(g), sum, dev, from)
	}
	t.write(w, "  ")
	fmt.Fprintf(w, "  bond-valence sums: exp((R − d)/%.2f Å) over cation–anion bonds, R from %s\n", valence.B, data.BondValenceSource)
}

func printMadelung(w io.Writer, job madelungJob, c *crystal.Crystal, r ewald.Result, mean float64, bg ewald.Background) {
	if p := job.prototype; p != nil {
		fmt.Fprintf(w, "structure   %s: %s (example %s)\n", p.Name, p.Description, p.Example)
		var ps []string
		for _, q := range p.Params {
			ps = append(ps, strings.TrimSpace(fmt.Sprintf("%s = %g %s", q.Key, job.values[q.Key], q.Unit)))
		}
		fmt.Fprintf(w, "parameters  %s\n", strings.Join(ps, ", "))
	} else {
		fmt.Fprintf(w, "structure   %s (CIF file)\n", c.Name)
	}
	abc, ang := cellParameters(c)
	fmt.Fprintf(w, "cell        a = %.5f, b = %.5f, c = %.5f Å; α = %.3f°, β = %.3f°, γ = %.3f°\n",
		abc[0], abc[1], abc[2], ang[0], ang[1], ang[2])
	fmt.Fprintf(w, "            V = %.4f Å³, %d sites, Z = %d formula units\n", c.Volume(), len(c.Sites), c.FormulaUnits)
	fmt.Fprintf(w, "ions        %s\n", ionSummary(c))
	if job.file != nil {
		printCharges(w, job.file, len(job.file.Cell.Sites))
	}
	fmt.Fprintln(w)

	i, j := r.NearestPair[0], r.NearestPair[1]
	fmt.Fprintf(w, "shortest cation–anion distance  d = %.6f Å  (site %d %s and site %d %s)\n",
		r.NearestDistance, i+1, c.Sites[i].Species, j+1, c.Sites[j].Species)
	if !math.IsNaN(mean) {
		fmt.Fprintf(w, "mean cation–anion bond length      %.6f Å\n", mean)
	}
	fmt.Fprintf(w, "Madelung constant               A = %.10f\n", r.MadelungConstant)
	fmt.Fprintf(w, "  convention: %s (z₊ = %g, z₋ = %s)\n\n", r.Convention, c.Sites[i].Charge, minus(fmt.Sprintf("%g", c.Sites[j].Charge)))

	t := table{head: []string{"Coulomb energy", "eV", "kJ/mol"}, right: map[int]bool{1: true, 2: true}}
	t.add("per cell", minus(fmt.Sprintf("%.8f", r.EnergyEV)), "")
	t.add("per formula unit", minus(fmt.Sprintf("%.8f", r.EnergyPerFormulaUnitEV)), minus(fmt.Sprintf("%.4f", r.EnergyKJPerMol)))
	t.write(w, "")
	fmt.Fprintf(w, "  boundary condition: %s\n", r.Boundary)
	if bg.NetCharge != 0 {
		fmt.Fprintf(w, "  charged cell: net charge %s e; neutralising background term %s eV per cell, included above\n",
			minus(fmt.Sprintf("%+.6g", bg.NetCharge)), minus(fmt.Sprintf("%.8f", bg.EnergyEV)))
		fmt.Fprintf(w, "  warning: %s\n", ewald.BackgroundConvention)
	}
	fmt.Fprintf(w, "  accuracy: requested %.3g, estimated %.2g (α = %.4f Å⁻¹, real cut-off %.3f Å, reciprocal cut-off %.3f Å⁻¹, %d + %d terms)\n\n",
		r.Accuracy, r.EstimatedError, r.Alpha, r.RealCutoff, r.RecipCutoff, r.RealTerms, r.RecipTerms)

	sums := job.siteSums(c)
	if len(c.Sites) <= maxListedSites {
		st := table{head: []string{"site", "species", "charge", "x", "y", "z", "potential / V"}, right: map[int]bool{0: true, 2: true, 3: true, 4: true, 5: true, 6: true, 7: true}}
		if sums != nil {
			st.head = append(st.head, "bond-valence sum")
		}
		for k, s := range c.Sites {
			row := []string{strconv.Itoa(k + 1), s.Species, minus(fmt.Sprintf("%+.4g", s.Charge)),
				fmt.Sprintf("%.5f", s.Frac[0]), fmt.Sprintf("%.5f", s.Frac[1]), fmt.Sprintf("%.5f", s.Frac[2]),
				minus(fmt.Sprintf("%.6f", r.SitePotentials[k]))}
			if sums != nil {
				row = append(row, bvsText(sums[k]))
			}
			st.add(row...)
		}
		fmt.Fprintln(w, "site potentials (Madelung potential at each ion from all other ions)")
		st.write(w, "  ")
		return
	}
	st := table{head: []string{"species", "charge", "sites", "lowest / V", "highest / V"}, right: map[int]bool{1: true, 2: true, 3: true, 4: true, 5: true}}
	if sums != nil {
		st.head = append(st.head, "bond-valence sums")
	}
	type group struct {
		charge       float64
		n            int
		lo, hi       float64
		sumLo, sumHi float64
		position     int
	}
	groups := map[string]*group{}
	var order []string
	for k, s := range c.Sites {
		key := s.Species + "|" + strconv.FormatFloat(s.Charge, 'g', -1, 64)
		g, ok := groups[key]
		if !ok {
			g = &group{charge: s.Charge, lo: math.Inf(1), hi: math.Inf(-1), sumLo: math.Inf(1), sumHi: math.Inf(-1), position: k}
			groups[key] = g
			order = append(order, key)
		}
		g.n++
		g.lo = math.Min(g.lo, r.SitePotentials[k])
		g.hi = math.Max(g.hi, r.SitePotentials[k])
		if sums != nil && !math.IsNaN(sums[k]) {
			g.sumLo, g.sumHi = math.Min(g.sumLo, sums[k]), math.Max(g.sumHi, sums[k])
		}
	}
	sort.SliceStable(order, func(a, b int) bool { return groups[order[a]].position < groups[order[b]].position })
	for _, key := range order {
		g := groups[key]
		sp, _, _ := strings.Cut(key, "|")
		row := []string{sp, minus(fmt.Sprintf("%+.4g", g.charge)), strconv.Itoa(g.n), minus(fmt.Sprintf("%.6f", g.lo)), minus(fmt.Sprintf("%.6f", g.hi))}
		if sums != nil {
			row = append(row, "—")
			if g.sumLo <= g.sumHi {
				row[len(row)-1] = fmt.Sprintf("%.3f–%.3f", g.sumLo, g.sumHi)
			}
		}
		st.add(row...)
	}
	fmt.Fprintf(w, "site potentials by species (%d sites; --json lists every site)\n", len(c.Sites))
	st.write(w, "  ")
}

// bvsText writes a bond-valence sum, or a dash where there is none.
func bvsText(x float64) string {
	if math.IsNaN(x) {
		return "—"
	}
	return fmt.Sprintf("%.3f", x)
}

func cellParameters(c *crystal.Crystal) (abc, angles [3]float64) {
	for k := 0; k < 3; k++ {
		abc[k] = c.Lattice[k].Norm()
		u, v := c.Lattice[(k+1)%3], c.Lattice[(k+2)%3]
		angles[k] = math.Acos(u.Dot(v)/(u.Norm()*v.Norm())) * 180 / math.Pi
	}
	return abc, angles
}

// ionSummary lists "Species charge ×count" in order of first appearance.
func ionSummary(c *crystal.Crystal) string {
	type key struct {
		sp string
		q  float64
	}
	count := map[key]int{}
	var order []key
	for _, s := range c.Sites {
		k := key{s.Species, s.Charge}
		if count[k] == 0 {
			order = append(order, k)
		}
		count[k]++
	}
	var parts []string
	for _, k := range order {
		parts = append(parts, fmt.Sprintf("%s %s ×%d", k.sp, minus(fmt.Sprintf("%+g", k.q)), count[k]))
	}
	return strings.Join(parts, ", ")
}

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
func madelungJSON(job madelungJob, c *crystal.Crystal, r ewald.Result, mean float64, bg ewald.Background, reached bool) madelungOutput {
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
		out.Background = &madelungBackground{bg.NetCharge, bg.EnergyEV, bg.PotentialShiftV, ewald.BackgroundConvention}
	}
	if sf := job.file; sf != nil {
		ch := &madelungCharges{Method: sf.Assignment.Method.Key(), Description: sf.Assignment.Method.String(),
			Alternatives: sf.Assignment.Alternatives, Formula: sf.Formula, AveragedSites: sf.Averaged,
			BondValenceFit: fmt.Sprintf("exp((R - d)/%.2f), R from %s", valence.B, data.BondValenceSource)}
		if sf.Assignment.Method != valence.Given {
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
	protos := crystal.Prototypes()
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
