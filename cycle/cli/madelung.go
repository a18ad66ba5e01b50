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
	"enthalpath/cycle/cells"
	"enthalpath/data"
	"enthalpath/thermo/notation"
)

const madelungSynopsis = `madelung NAME|FILE.cif [flags]
       enthalpath madelung --list [--json]`

// madelungAbout is the help's paragraph on what madelung does.
const madelungAbout = `Computes the Madelung constant, the Ewald energy and the site potentials of a
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
	accuracy := fs.Float64("accuracy", cells.DefaultAccuracy, "relative accuracy of the Ewald sum")
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
	res, bg, sumErr := cells.SumCharged(c, *accuracy)
	var accErr *cells.AccuracyError
	switch {
	case errors.As(sumErr, &accErr):
		fmt.Fprintf(env.Stderr, "enthalpath madelung: warning: %v\n", accErr)
	case errors.Is(sumErr, cells.ErrBadOptions):
		return &UsageError{fmt.Errorf("--accuracy %g: %w", *accuracy, sumErr)}
	case sumErr != nil:
		return &UsageError{fmt.Errorf("%s: %w", pos[0], sumErr)}
	}
	mean, meanErr := c.MeanCationAnionDistance()
	warnings := geometryWarnings(c, res, meanErr)
	if bg.NetCharge != 0 {
		warnings = append(warnings, fmt.Sprintf("%s (net charge %+.6g e per cell, background term %.6g eV)", cells.BackgroundConvention, bg.NetCharge, bg.EnergyEV))
	}
	if sf := job.file; sf != nil && sf.Assignment.Method == cells.PoorFit {
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
// real solid: its nearest cation and anion closer than cells.ShortestBond
// (wurtzite with u = 0.9 puts them 0.52 Å apart). The Madelung constant
// of such a cell is a number about point charges, not about a crystal.
func geometryWarnings(c *cells.Crystal, r cells.EwaldResult, meanErr error) []string {
	var out []string
	if meanErr != nil {
		out = append(out, meanErr.Error()+"; no mean bond length is given")
	}
	i, j := r.NearestPair[0], r.NearestPair[1]
	if i < 0 || j < 0 || !(r.NearestDistance < cells.ShortestBond) {
		return out
	}
	return append(out, fmt.Sprintf("the nearest cation and anion (site %d %s and site %d %s) are %.3g Å apart, below %g Å, shorter than any real bond "+
		"(threshold: common practice, no source); the Madelung constant refers to that distance; check the parameters or the file",
		i+1, c.Sites[i].Species, j+1, c.Sites[j].Species, r.NearestDistance, cells.ShortestBond))
}

// loadStructure reads the structure flags that madelung and orderings
// share (--param, --charges, --supercell) and builds the crystal of target,
// a prototype name or a CIF file.
func loadStructure(env Env, target string, params, charges listFlag, supercell string) (madelungJob, *cells.Crystal, error) {
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
	prototype *cells.Prototype   // nil for a CIF file
	values    map[string]float64 // the prototype parameters used
	file      *cycle.StructureFile
}

func isCIFPath(s string) bool {
	return strings.HasSuffix(strings.ToLower(s), ".cif") || strings.ContainsRune(s, '/')
}

// crystal builds the structure: prototype with parameters and charges, or
// CIF file, then the supercell.
func (j *madelungJob) crystal() (*cells.Crystal, error) {
	var c *cells.Crystal
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
		p, err := cells.LookupPrototype(j.target)
		if err != nil {
			return nil, &UsageError{fmt.Errorf("%w (or give a path ending in .cif)", err)}
		}
		j.prototype = &p
		c, err = cells.Build(p.Name, j.params)
		if err != nil {
			return nil, &UsageError{err}
		}
		j.values = p.Defaults()
		for k, v := range j.params {
			j.values[k] = v
		}
		if len(j.charges) > 0 {
			ions := map[string]cells.Ion{}
			for label, z := range j.charges {
				known := false
				for _, s := range p.Slots {
					known = known || s.Label == label
				}
				if !known {
					return nil, Usagef("--charges: %s has no slot %q (slots: %s)", p.Name, label, slotLabels(p))
				}
				ions[label] = cells.Ion{Charge: z}
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

func slotLabels(p cells.Prototype) string {
	var s []string
	for _, sl := range p.Slots {
		s = append(s, sl.Label)
	}
	return strings.Join(s, ", ")
}

// parseKeyValues reads repeated or comma-separated key=value items
// (notation.ParseAssignments), worded for the flag that gave them.
func parseKeyValues(flagName string, items []string) (map[string]float64, error) {
	m := map[string]float64{}
	for _, item := range items {
		var ae *notation.AssignmentError
		if err := notation.ParseAssignments(item, ",", m); errors.As(err, &ae) {
			switch ae.Problem {
			case notation.GivenTwice:
				return nil, Usagef("%s: %s given twice", flagName, ae.Name)
			case notation.NotANumber:
				return nil, Usagef("%s %q: %q is not a number", flagName, ae.Item, ae.Value)
			default:
				return nil, Usagef("%s %q: want key=value", flagName, ae.Item)
			}
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
func (j *madelungJob) siteSums(c *cells.Crystal) []float64 {
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
func groupCharge(g cells.ChargeGroup) string {
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
	if a.Method == cells.ChargeBalanceRanked {
		fmt.Fprintf(w, "            %d neutral combinations; the one fitting the bond-valence sums best is used\n", a.Alternatives)
	}
	if a.Method != cells.GivenCharges {
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
	fmt.Fprintf(w, "  bond-valence sums: exp((R − d)/%.2f Å) over cation–anion bonds, R from %s\n", cells.BondValenceB, data.BondValenceSource)
}

func printMadelung(w io.Writer, job madelungJob, c *cells.Crystal, r cells.EwaldResult, mean float64, bg cells.Background) {
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
		fmt.Fprintf(w, "  warning: %s\n", cells.BackgroundConvention)
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

func cellParameters(c *cells.Crystal) (abc, angles [3]float64) {
	for k := 0; k < 3; k++ {
		abc[k] = c.Lattice[k].Norm()
		u, v := c.Lattice[(k+1)%3], c.Lattice[(k+2)%3]
		angles[k] = math.Acos(u.Dot(v)/(u.Norm()*v.Norm())) * 180 / math.Pi
	}
	return abc, angles
}

// ionSummary lists "Species charge ×count" in order of first appearance.
func ionSummary(c *cells.Crystal) string {
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
