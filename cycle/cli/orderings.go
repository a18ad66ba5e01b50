package cli

import (
	"errors"
	"fmt"
	"io"
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/cycle/cells"
)

const orderingsSynopsis = `orderings NAME|FILE.cif --site SEL=OCCUPANTS [--site ...] [flags]`

// orderingsAbout is the help's paragraph on what orderings does.
const orderingsAbout = `Ranks the orderings of ions and vacancies over mixed sites by their Ewald
(electrostatic) energy, conducting boundary conditions. The structure is a
built-in prototype (see madelung --list) or a CIF file, repeated by
--supercell. A CIF file's partly occupied and shared sites are mixed with
the occupancies and charges it gives (or that are assigned, as for
madelung); each --site chooses the sites whose label or species is SEL and
gives their occupants as SPECIES:CHARGE:FRACTION, comma-separated, with
"vac:FRACTION" for vacancies; one occupant without a fraction replaces the
ion. Example, Li/vacancy on the cation sites of rock salt:

  enthalpath orderings rock-salt --supercell 2x2x3 --site M=Li:+1:0.5,vac:0.5 --site X=O:-0.5

Few orderings are all enumerated; more are searched by simulated annealing,
which can miss the lowest.`

func runOrderings(env Env, args []string) error {
	fs := NewFlagSet("orderings")
	var params, charges, sites listFlag
	fs.Var(&sites, "site", "mixed or replaced sites `SEL=SPECIES:CHARGE:FRACTION,...` (repeatable; vac:FRACTION for vacancies)")
	fs.Var(&params, "param", "prototype parameter `key=value` (repeatable, or comma-separated)")
	fs.Var(&charges, "charges", "ion charges `LABEL=Z,...` for the parent structure, as for madelung")
	supercell := fs.String("supercell", "", "repeat the cell: `n` for n×n×n, or n1xn2xn3")
	keep := fs.Int("keep", cells.DefaultKeep, "list the `n` lowest distinct orderings")
	method := fs.String("method", "auto", "`auto`, enumerate or anneal")
	seed := fs.Int64("seed", 1, "random seed of the annealing")
	sweeps := fs.Int("sweeps", cells.DefaultSweeps, "annealing sweeps (mixed-site count of swaps each) per restart")
	restarts := fs.Int("restarts", cells.DefaultRestarts, "annealing restarts from random orderings")
	cifDir := fs.String("cif-dir", "", "write each listed ordering as a CIF file into `DIR`")
	accuracy := fs.Float64("accuracy", cells.DefaultAccuracy, "relative accuracy of the Ewald sums")
	asJSON := fs.Bool("json", false, "print one JSON object")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if len(pos) != 1 {
		fs.Usage()
		return Usagef("orderings: give exactly one prototype name or CIF file (got %d arguments)", len(pos))
	}
	if *keep < 1 || *sweeps < 1 || *restarts < 1 {
		return Usagef("--keep, --sweeps and --restarts must be positive")
	}
	if err := cycle.CheckSetting(cycle.SettingAccuracy, *accuracy); err != nil {
		return boundUsage("accuracy", "give the relative accuracy of the Ewald sums", err)
	}
	var m cells.OrderingMethod
	switch *method {
	case "auto":
	case "enumerate":
		m = cells.Enumerate
	case "anneal":
		m = cells.Anneal
	default:
		return Usagef("--method %q: want auto, enumerate or anneal", *method)
	}
	specs, err := parseSiteSpecs(sites)
	if err != nil {
		return err
	}
	_, c, err := loadStructure(env, pos[0], params, charges, *supercell)
	if err != nil {
		return err
	}
	specs = append(specs, cells.OccupancySpecs(c, specs)...)
	if len(specs) == 0 {
		return Usagef("orderings: %s has no partly occupied or shared site; give the mixed sites with --site, e.g. --site M=Li:+1:0.5,vac:0.5", pos[0])
	}
	p, err := cells.NewProblem(c, specs, *accuracy)
	if err != nil {
		return orderingError(err)
	}
	bar := newProgressBar(env.Stderr, 0, nil)
	var done, total float64
	bar.status = func() (float64, string) { return done / total, fmt.Sprintf("%.3g of %.3g", done, total) }
	progress := func(d, t float64) { done, total = d, t; bar.tick() }
	out, err := p.Search(cells.SearchOptions{Keep: *keep, Method: m, Seed: *seed, Sweeps: *sweeps, Restarts: *restarts, Progress: progress})
	bar.finish()
	if err != nil {
		return orderingError(err)
	}
	var files []string
	if *cifDir != "" {
		if files, err = writeOrderingCIFs(*cifDir, p, out); err != nil {
			return err
		}
	}
	if *asJSON {
		return writeJSON(env.Stdout, orderingsJSON(p, out, files, *seed))
	}
	printOrderings(env.Stdout, p, out, files, *seed, *sweeps, *restarts)
	return nil
}

func orderingError(err error) error {
	if errors.Is(err, cells.ErrSpec) || errors.Is(err, cells.ErrTooLarge) {
		return &UsageError{err}
	}
	return err
}

// parseSiteSpecs reads --site SEL=SPECIES:CHARGE:FRACTION,...
func parseSiteSpecs(items []string) ([]cells.SiteSpec, error) {
	var specs []cells.SiteSpec
	for _, item := range items {
		sel, rest, ok := strings.Cut(item, "=")
		sel = strings.TrimSpace(sel)
		if !ok || sel == "" || strings.TrimSpace(rest) == "" {
			return nil, Usagef("--site %q: want SEL=SPECIES:CHARGE:FRACTION,... (e.g. M=Li:+1:0.5,vac:0.5)", item)
		}
		spec := cells.SiteSpec{Match: sel}
		parts := strings.Split(rest, ",")
		for _, part := range parts {
			f := strings.Split(strings.TrimSpace(part), ":")
			bad := func(why string) error {
				return Usagef("--site %q: occupant %q: %s", item, part, why)
			}
			var o cells.Occupant
			switch {
			case strings.EqualFold(f[0], "vac") && len(f) == 2:
				x, err := parseFraction(f[1])
				if err != nil {
					return nil, bad(err.Error())
				}
				o.Fraction = x
			case len(f) == 2 || len(f) == 3:
				if f[0] == "" || strings.EqualFold(f[0], "vac") {
					return nil, bad("want SPECIES:CHARGE:FRACTION or vac:FRACTION")
				}
				q, err := strconv.ParseFloat(strings.Replace(f[1], "−", "-", 1), 64)
				if err != nil || math.IsNaN(q) || math.IsInf(q, 0) {
					return nil, bad(fmt.Sprintf("charge %q is not a number", f[1]))
				}
				o.Species, o.Charge, o.Fraction = f[0], q, 1
				if len(f) == 3 {
					if o.Fraction, err = parseFraction(f[2]); err != nil {
						return nil, bad(err.Error())
					}
				} else if len(parts) > 1 {
					return nil, bad("give the fraction of each occupant of a mixed site")
				}
			default:
				return nil, bad("want SPECIES:CHARGE:FRACTION or vac:FRACTION")
			}
			spec.Occupants = append(spec.Occupants, o)
		}
		specs = append(specs, spec)
	}
	return specs, nil
}

// parseFraction reads "0.5" or "1/3".
func parseFraction(s string) (float64, error) {
	num, den, isRatio := strings.Cut(s, "/")
	x, err := strconv.ParseFloat(strings.TrimSpace(num), 64)
	if err == nil && isRatio {
		var d float64
		if d, err = strconv.ParseFloat(strings.TrimSpace(den), 64); err == nil {
			x /= d
		}
	}
	if err != nil || !(x > 0 && x <= 1) {
		return 0, fmt.Errorf("fraction %q is not a number in (0, 1]", s)
	}
	return x, nil
}

// writeOrderingCIFs writes ordering-NN.cif files into dir and returns their
// paths.
func writeOrderingCIFs(dir string, p *cells.Problem, out cells.Outcome) ([]string, error) {
	if err := os.MkdirAll(dir, 0o755); err != nil {
		return nil, Usagef("--cif-dir %s: %v", dir, err)
	}
	var files []string
	for k, o := range out.Orderings {
		name := filepath.Join(dir, fmt.Sprintf("ordering-%02d.cif", k+1))
		f, err := os.Create(name)
		if err != nil {
			return nil, Usagef("--cif-dir: %v", err)
		}
		comment := []string{
			fmt.Sprintf("enthalpath orderings: rank %d of %s, Ewald energy %.10f eV per cell (conducting boundary), multiplicity %d",
				k+1, p.Parent.Name, o.EnergyEV, o.Multiplicity),
		}
		err = cells.WriteCIF(f, p.Crystal(o.Assignment), comment)
		if cerr := f.Close(); err == nil {
			err = cerr
		}
		if err != nil {
			return nil, fmt.Errorf("writing %s: %w", name, err)
		}
		files = append(files, name)
	}
	return files, nil
}

func occupantLabel(o cells.Occupant) string {
	if o.Vacant() {
		return "vacancy"
	}
	return o.Species + minus(fmt.Sprintf("%+g", o.Charge))
}

func printOrderings(w io.Writer, p *cells.Problem, out cells.Outcome, files []string, seed int64, sweeps, restarts int) {
	fmt.Fprintf(w, "structure   %s, %d sites, %d of them mixed\n", p.Parent.Name, len(p.Parent.Sites), len(p.Mixed))
	for _, g := range p.Groups {
		var occ []string
		for k, o := range g.Occupants {
			occ = append(occ, fmt.Sprintf("%s ×%d", occupantLabel(o), g.Counts[k]))
		}
		fmt.Fprintf(w, "  %s: %s on %d sites\n", g.Match, strings.Join(occ, ", "), len(g.Positions))
	}
	sym := fmt.Sprintf("%d symmetry operations of the disordered cell", out.Operations)
	if out.TranslationsOnly {
		sym += " (translations only: the full group was too large)"
	} else if out.Operations == 1 {
		sym = "no symmetry used: orderings of equal energy are listed once"
	}
	fmt.Fprintf(w, "orderings   %.6g in all, counting symmetry-equivalent ones; %s\n", out.Total, sym)
	switch out.Method {
	case cells.Enumerate:
		fmt.Fprintf(w, "search      enumeration of all %d orderings\n", out.Visited)
	default:
		fmt.Fprintf(w, "search      simulated annealing, %d restarts × %d sweeps, seed %d: %d swaps tried\n", restarts, sweeps, seed, out.Visited)
		fmt.Fprintln(w, "            annealing can miss the lowest ordering: compare runs with other seeds")
	}
	fmt.Fprintf(w, "energy      Ewald, point charges, %s; eV per cell\n\n", cells.Boundary)
	head := []string{"rank", "energy / eV", "above lowest / meV", "multiplicity"}
	if files != nil {
		head = append(head, "file")
	}
	t := table{head: head, right: map[int]bool{0: true, 1: true, 2: true, 3: true}}
	for k, o := range out.Orderings {
		row := []string{strconv.Itoa(k + 1), minus(fmt.Sprintf("%.8f", o.EnergyEV)),
			fmt.Sprintf("%.3f", 1000*(o.EnergyEV-out.Orderings[0].EnergyEV)), strconv.Itoa(o.Multiplicity)}
		if files != nil {
			row = append(row, files[k])
		}
		t.add(row...)
	}
	t.write(w, "")
}

type orderingSiteJSON struct {
	Site    int     `json:"site"`
	Species string  `json:"species,omitempty"`
	Charge  float64 `json:"charge"`
	Vacant  bool    `json:"vacant,omitempty"`
}

type orderingJSON struct {
	Rank         int                `json:"rank"`
	EnergyEV     float64            `json:"energy_ev_per_cell"`
	AboveMeV     float64            `json:"above_lowest_mev"`
	Multiplicity int                `json:"multiplicity"`
	File         string             `json:"file,omitempty"`
	Sites        []orderingSiteJSON `json:"mixed_sites"`
}

type orderingGroupJSON struct {
	Sites     string         `json:"sites"`
	Occupants map[string]int `json:"occupants"`
	Count     int            `json:"site_count"`
}

type orderingsOutput struct {
	Structure    string              `json:"structure"`
	SiteCount    int                 `json:"site_count"`
	Groups       []orderingGroupJSON `json:"groups"`
	Total        float64             `json:"orderings_total"`
	Operations   int                 `json:"symmetry_operations"`
	Method       string              `json:"method"`
	Seed         *int64              `json:"seed,omitempty"`
	Visited      int64               `json:"visited"`
	Boundary     string              `json:"boundary_condition"`
	Orderings    []orderingJSON      `json:"orderings"`
	Translations bool                `json:"translations_only,omitempty"`
}

func orderingsJSON(p *cells.Problem, out cells.Outcome, files []string, seed int64) orderingsOutput {
	o := orderingsOutput{Structure: p.Parent.Name, SiteCount: len(p.Parent.Sites), Total: out.Total, Operations: out.Operations,
		Method: string(out.Method), Visited: out.Visited, Boundary: cells.Boundary, Translations: out.TranslationsOnly}
	if out.Method == cells.Anneal {
		o.Seed = &seed
	}
	for _, g := range p.Groups {
		gj := orderingGroupJSON{Sites: g.Match, Occupants: map[string]int{}, Count: len(g.Positions)}
		for k, oc := range g.Occupants {
			gj.Occupants[occupantLabel(oc)] = g.Counts[k]
		}
		o.Groups = append(o.Groups, gj)
	}
	for k, ord := range out.Orderings {
		oj := orderingJSON{Rank: k + 1, EnergyEV: ord.EnergyEV, AboveMeV: 1000 * (ord.EnergyEV - out.Orderings[0].EnergyEV), Multiplicity: ord.Multiplicity}
		if files != nil {
			oj.File = files[k]
		}
		for a, i := range p.Mixed {
			oc := p.Groups[p.GroupOf[a]].Occupants[ord.Assignment[a]]
			oj.Sites = append(oj.Sites, orderingSiteJSON{Site: i + 1, Species: oc.Species, Charge: oc.Charge, Vacant: oc.Vacant()})
		}
		o.Orderings = append(o.Orderings, oj)
	}
	return o
}
