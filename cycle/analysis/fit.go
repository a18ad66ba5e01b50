package analysis

import (
	"fmt"
	"math"
	"slices"
	"strings"

	"enthalpath/thermo/lattice"
)

// FitOptions say how an ion's radius is fitted over its salts.
type FitOptions struct {
	// CounterRadii (Å) replace, per counter-ion symbol ("K+", "Ca2+"), the
	// radius the data would give; the handbook method of Jenkins and
	// Roobottom takes Goldschmidt radii for metal ions, which the data do
	// not carry, so a user who follows it gives them here.
	CounterRadii map[string]float64
	// Only, when non-empty, limits the fit to these counter-ions.
	Only []string
}

// SaltRadius is one salt's part in a fitted radius: the radius that salt
// alone gives, or why it was left out.
type SaltRadius struct {
	Formula       string
	Counter       string
	CounterRadius Radius
	// Count of the fitted ion and of the counter-ion per formula unit, the
	// charges and ν that go into the Kapustinskii equation.
	Nu, ZCation, ZAnion int
	// LatticeEnergy U (negative, kJ/mol) and where it came from.
	LatticeEnergy float64
	LatticeFrom   string
	// Radius (Å) that reproduces LatticeEnergy alone (Kapustinskii with the
	// handbook constants); Residual (kJ/mol) is the fitted radius's
	// U_Kapustinskii − U for this salt.
	Radius, Residual float64
	// Skipped says why the salt is not in the fit ("" when it is).
	Skipped string
}

// FittedRadius is an ion's thermochemical radius fitted over every salt of
// it whose lattice energy the data give.
type FittedRadius struct {
	Ion string
	// Radius (Å) minimises Σ(U_Kapustinskii(r) − U)² over the salts used,
	// with the handbook constants (121.4 kJ·nm/mol, 0.0345 nm).
	Radius float64
	// Mean and SD (Å) of the one-salt radii; SE = SD/√n, the uncertainty of
	// the fitted radius if the salts scatter at random. With one salt there
	// is no spread: SD and SE are 0 and HasSpread is false.
	Mean, SD, SE float64
	HasSpread    bool
	// RMSResidual (kJ/mol) of the fit.
	RMSResidual float64
	// Salts holds every salt considered, used or skipped, by formula.
	Salts []SaltRadius
	// Tabulated is the data's radius of the ion, when it has one.
	Tabulated *Radius
	Notes     []string
}

// Used returns the salts in the fit.
func (f *FittedRadius) Used() []SaltRadius {
	return kept(f.Salts, func(s SaltRadius) string { return s.Skipped })
}

// noSalts is the error of a fit over a family with no usable salt: none in
// the data (with only, none with those counter-ions), or salts of which none
// has what lacking names (the first, and why it was left out, by of).
func noSalts[T any](ion string, only []string, salts []T, lacking string, of func(T) (formula, skipped string)) *InputError {
	reason := "no compound of the data contains it"
	if len(only) > 0 {
		reason = "no compound of the data pairs it with " + strings.Join(only, ", ")
	}
	if len(salts) > 0 {
		first, why := of(salts[0])
		reason = fmt.Sprintf("none of its %d %s (first: %s: %s)", len(salts), lacking, first, why)
	}
	return &InputError{Subject: ion, Field: "salts", Reason: reason}
}

// kept returns the items whose skipped reason is empty, in order.
func kept[T any](items []T, skipped func(T) string) []T {
	var out []T
	for _, it := range items {
		if skipped(it) == "" {
			out = append(out, it)
		}
	}
	return out
}

// FitRadius fits the thermochemical radius of ion over every compound of
// the data that contains it: each salt's lattice energy (its Born–Haber
// cycle from the data, else the data's handbook lattice value) and its
// counter-ion's radius give one Kapustinskii equation, and the radius that
// fits them all in the least-squares sense is returned with the spread of
// the one-salt radii. This is how thermochemical radii of polyatomic ions
// are obtained from families of salts; a radius that moves by more than a
// few hundredths of an ångström from salt to salt is not transferable.
func (a *Analyst) FitRadius(ion string, opt FitOptions) (*FittedRadius, error) {
	in, err := a.db.Ion(ion)
	if err != nil {
		return nil, &InputError{Subject: ion, Field: "--ion", Reason: "not an ion of the data", Err: err}
	}
	f := &FittedRadius{Ion: in.Symbol}
	if r, err := a.ionRadius(in); err == nil && r.Kind != "neighbour" {
		f.Tabulated = &r
	}
	// Counter-ions as the user typed them ("N3-", "Ca++"?) are looked up, so
	// a misspelt one is an error rather than a radius silently unused.
	radii := map[string]float64{}
	for sym, r := range opt.CounterRadii {
		ci, err := a.db.Ion(sym)
		if err != nil {
			return nil, &InputError{Subject: in.Symbol, Field: "counter radius of " + sym, Reason: "not an ion of the data", Err: err}
		}
		if !(r > 0) || math.IsInf(r, 0) {
			return nil, &InputError{Subject: in.Symbol, Field: "counter radius of " + sym, Reason: fmt.Sprintf("%v is not a positive radius in Å", r)}
		}
		radii[ci.Symbol] = r
	}
	var only []string
	for _, sym := range opt.Only {
		ci, err := a.db.Ion(sym)
		if err != nil {
			return nil, &InputError{Subject: in.Symbol, Field: "only " + sym, Reason: "not an ion of the data", Err: err}
		}
		only = append(only, ci.Symbol)
	}
	hb := lattice.KapustinskiiConstants{K: lattice.KapustinskiiKHandbook, D: lattice.KapustinskiiD}
	for _, c := range a.db.Compounds() {
		if c.Molecular {
			continue // a molecular compound's cycle describes no ionic solid
		}
		var counter string
		switch in.Symbol {
		case c.Cation:
			counter = c.Anion
		case c.Anion:
			counter = c.Cation
		default:
			continue
		}
		if len(only) > 0 && !slices.Contains(only, counter) {
			continue
		}
		s := SaltRadius{Formula: c.Formula, Counter: counter}
		ro := RadiusOptions{Ion: in.Symbol, CounterRadius: radii[counter], kapustinskiiOnly: true}
		d, err := a.DeriveRadius(c.Formula, ro)
		switch {
		case err != nil:
			s.Skipped = err.Error()
		case d.KapustinskiiHandbookErr != "":
			s.Skipped = d.KapustinskiiHandbookErr
		default:
			s.CounterRadius, s.LatticeEnergy, s.LatticeFrom, s.Radius = d.CounterRadius, d.LatticeEnergy, d.LatticeFrom, d.KapustinskiiHandbook
			s.Nu = c.CationCount + c.AnionCount
			zc, za := chargeOf(a, c.Cation), chargeOf(a, c.Anion)
			s.ZCation, s.ZAnion = zc, za
		}
		f.Salts = append(f.Salts, s)
	}
	used := f.Used()
	if len(used) == 0 {
		return f, noSalts(in.Symbol, only, f.Salts, "compounds has a usable lattice energy", func(s SaltRadius) (string, string) { return s.Formula, s.Skipped })
	}
	target := in.Charge > 0
	model := func(s SaltRadius, r float64) float64 {
		rc, ra := s.CounterRadius.Value, r
		if target {
			rc, ra = r, s.CounterRadius.Value
		}
		u, err := hb.Energy(s.Nu, s.ZCation, s.ZAnion, rc, ra)
		if err != nil {
			return math.Inf(1)
		}
		return u
	}
	cost := func(r float64) float64 {
		sum := 0.0
		for _, s := range used {
			d := model(s, r) - s.LatticeEnergy
			sum += d * d
		}
		return sum
	}
	// The one-salt radii bracket the least-squares radius: each term is
	// smallest at its own salt's radius and grows on both sides.
	lo, hi := used[0].Radius, used[0].Radius
	var sum float64
	for _, s := range used {
		lo, hi = min(lo, s.Radius), max(hi, s.Radius)
		sum += s.Radius
	}
	n := float64(len(used))
	f.Mean = sum / n
	if len(used) > 1 {
		var ss float64
		for _, s := range used {
			ss += (s.Radius - f.Mean) * (s.Radius - f.Mean)
		}
		f.SD = math.Sqrt(ss / (n - 1))
		f.SE = f.SD / math.Sqrt(n)
		f.HasSpread = true
	}
	f.Radius = goldenMin(cost, lo, hi, 1e-9)
	var rss float64
	for i := range f.Salts {
		s := &f.Salts[i]
		if s.Skipped != "" {
			continue
		}
		s.Residual = model(*s, f.Radius) - s.LatticeEnergy
		rss += s.Residual * s.Residual
	}
	f.RMSResidual = math.Sqrt(rss / n)
	var scales []string
	for _, s := range used {
		w := radiusKindWords[s.CounterRadius.Kind]
		if w == "" {
			w = s.CounterRadius.Kind
		}
		if !slices.Contains(scales, w) {
			scales = append(scales, w)
		}
	}
	f.Notes = append(f.Notes,
		"Kapustinskii with the handbook constants (121.4 kJ·nm/mol, 0.0345 nm), one equation per salt; least squares on U",
		"counter-ion radii: "+strings.Join(scales, "; "))
	if len(used) == 1 {
		f.Notes = append(f.Notes, "one salt only: no spread can be given")
	}
	return f, nil
}

var radiusKindWords = map[string]string{
	"user":           "given by the user",
	"shannon":        "Shannon CN VI ionic radii from the data",
	"thermochemical": "thermochemical radii from the data",
	"neighbour":      "the neighbour rule (no radius in the data)",
}

func chargeOf(a *Analyst, symbol string) int {
	in, err := a.db.Ion(symbol)
	if err != nil {
		return 0
	}
	return in.Charge
}

// goldenMin returns the minimum of a unimodal f on [lo, hi] by golden-section
// search, to within tol.
func goldenMin(f func(float64) float64, lo, hi, tol float64) float64 {
	if hi-lo <= tol {
		return (lo + hi) / 2
	}
	g := (math.Sqrt(5) - 1) / 2
	c, d := hi-g*(hi-lo), lo+g*(hi-lo)
	fc, fd := f(c), f(d)
	for hi-lo > tol {
		if fc < fd {
			hi, d, fd = d, c, fc
			c = hi - g*(hi-lo)
			fc = f(c)
		} else {
			lo, c, fc = c, d, fd
			d = lo + g*(hi-lo)
			fd = f(d)
		}
	}
	return (lo + hi) / 2
}

// CounterRadiiFrom says in words where the counter-ion radii of the salts
// used came from: the ones the caller gave (FitOptions.CounterRadii) and
// the kinds of the data's radii for the rest, so that a fit never hides
// which radii it stands on (a fit with other counter-radii gives another
// radius).
func (f *FittedRadius) CounterRadiiFrom() string {
	var given []string
	kinds := map[string]bool{}
	var order []string
	for _, s := range f.Used() {
		if s.CounterRadius.Kind == "user" {
			g := fmt.Sprintf("%s %.2f Å", s.Counter, s.CounterRadius.Value)
			if !slices.Contains(given, g) {
				given = append(given, g)
			}
			continue
		}
		if k := s.CounterRadius.Kind; !kinds[k] {
			kinds[k] = true
			order = append(order, counterKindWords(k))
		}
	}
	var parts []string
	if len(given) > 0 {
		parts = append(parts, strings.Join(given, ", ")+" as given")
	}
	if len(order) > 0 {
		what := "the data's"
		if len(given) > 0 {
			what = "the others the data's"
		}
		parts = append(parts, what+" ("+strings.Join(order, ", ")+")")
	}
	if len(parts) == 0 {
		return "counter-ion radii: none used"
	}
	return "counter-ion radii: " + strings.Join(parts, "; ")
}

func counterKindWords(kind string) string {
	switch kind {
	case "shannon":
		return "Shannon ionic radii"
	case "thermochemical":
		return "thermochemical radii"
	case "neighbour":
		return "a neighbouring coordination's Shannon radius"
	}
	return kind
}
