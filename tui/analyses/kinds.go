package analyses

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
)

// kind is one analysis: its name, what it answers, the arguments it reads
// (one line, words separated by spaces) and how to run it.
type kind struct {
	name, what, syntax, example string
	// prepare reads the arguments and returns the run, or what is wrong
	// with them; it is quick, so typed arguments are checked on Enter.
	prepare func(args []string) (job, error)
}

// job is one run of an analysis with its arguments read.
type job func(a *analysis.Analyst) (any, error)

func usage(k kind, format string, v ...any) error {
	return fmt.Errorf("%s: %s; write %s, e.g. %s", k.name, fmt.Sprintf(format, v...), k.syntax, k.example)
}

func kinds() []kind {
	var ks []kind
	ks = []kind{
		{
			name: "estimate", what: "formation enthalpy of a hypothetical compound from a model lattice energy",
			syntax: "FORMULA [CHARGES] [MODEL]", example: "MgCl Mg=+1,Cl=-1 kapustinskii",
			prepare: func(args []string) (job, error) {
				k := ks[0]
				if len(args) < 1 || len(args) > 3 {
					return nil, usage(k, "give a formula, then optionally charges and a model")
				}
				var opt analysis.EstimateOptions
				for _, w := range args[1:] {
					if strings.Contains(w, "=") {
						ch, err := analysis.ParseCharges(w, args[0])
						if err != nil {
							return nil, err
						}
						opt.Charges = ch
						continue
					}
					m, err := cycle.ParseModel(w)
					if err != nil {
						return nil, usage(k, "%q is neither charges (M=+2,X=-1) nor a model (%s)", w, strings.Join(analysis.EstimateModels(), ", "))
					}
					opt.Model = m
				}
				return func(a *analysis.Analyst) (any, error) { return a.Estimate(args[0], opt) }, nil
			},
		},
		{
			name: "scan", what: "formation enthalpies across oxidation states, and their disproportionations",
			syntax: "METAL NONMETAL [MAX-CHARGE]", example: "Mg Cl 3",
			prepare: func(args []string) (job, error) {
				k := ks[1]
				if len(args) < 2 || len(args) > 3 {
					return nil, usage(k, "give a metal and a non-metal")
				}
				var opt analysis.ScanOptions
				if len(args) == 3 {
					n, err := strconv.Atoi(args[2])
					if err != nil || n < 1 || n > 8 {
						return nil, usage(k, "the maximum charge %q is not a whole number from 1 to 8", args[2])
					}
					opt.MaxCharge = n
				}
				return func(a *analysis.Analyst) (any, error) { return a.Scan(args[0], args[1], opt) }, nil
			},
		},
		{
			name: "solution", what: "enthalpy of solution from the lattice and the ions' hydration enthalpies",
			syntax: "FORMULA [UNKNOWN]", example: "NaCl dissolution",
			prepare: func(args []string) (job, error) {
				k := ks[2]
				if len(args) < 1 || len(args) > 2 {
					return nil, usage(k, "give a formula and optionally the term to solve")
				}
				var opt analysis.SolutionOptions
				if len(args) == 2 {
					ok := false
					for _, key := range analysis.SolutionKeys() {
						ok = ok || key == args[1]
					}
					if !ok {
						return nil, usage(k, "%q is not a term; the terms are %s", args[1], strings.Join(analysis.SolutionKeys(), ", "))
					}
					opt.Solve = args[1]
				}
				return func(a *analysis.Analyst) (any, error) { return a.Solution(args[0], opt) }, nil
			},
		},
		{
			name: "radius", what: "thermochemical radius of an ion that reproduces the cycle's lattice energy",
			syntax: "FORMULA [ION]", example: "NH4Cl cation",
			prepare: func(args []string) (job, error) {
				k := ks[3]
				if len(args) < 1 || len(args) > 2 {
					return nil, usage(k, "give a formula and optionally the ion (cation, anion or its symbol)")
				}
				opt := analysis.RadiusOptions{Ion: "anion"}
				if len(args) == 2 {
					opt.Ion = args[1]
				}
				return func(a *analysis.Analyst) (any, error) { return a.DeriveRadius(args[0], opt) }, nil
			},
		},
		{
			name: "radius fit", what: "thermochemical radius of an ion fitted over every salt of it whose cycle closes",
			syntax: "ION [COUNTER=Å,...]", example: "NO3-",
			prepare: func(args []string) (job, error) {
				k := ks[4]
				if len(args) < 1 || len(args) > 2 {
					return nil, usage(k, "give an ion and optionally counter-ion radii")
				}
				var opt analysis.FitOptions
				if len(args) == 2 {
					radii, err := analysis.ParseRadii(args[1])
					if err != nil {
						return nil, usage(k, "%v", err)
					}
					opt.CounterRadii = radii
				}
				return func(a *analysis.Analyst) (any, error) { return a.FitRadius(args[0], opt) }, nil
			},
		},
		ionFitKind(),
	}
	at := len(ks)
	ks = append(ks, stabilityKind(func() kind { return ks[at] }))
	return ks
}

// ionFitKind fits an ion's gas-phase enthalpy over its salts.
func ionFitKind() kind {
	k := kind{name: "ion fit", what: "gas-phase enthalpy of an ion fitted over every salt of it (weighted least squares)",
		syntax: "ION [SOURCE] [ionic | COUNTER,...]", example: "SO4^2- auto ionic"}
	k.prepare = func(args []string) (job, error) {
		if len(args) < 1 || len(args) > 3 {
			return nil, usage(k, "give an ion, optionally the lattice source (%s) and counter-ions", strings.Join(analysis.IonFitSources(), ", "))
		}
		var opt analysis.IonFitOptions
		for _, w := range args[1:] {
			switch {
			case slices.Contains(analysis.IonFitSources(), strings.ToLower(w)):
				opt.From = w
			case strings.EqualFold(w, "ionic"):
				opt.Ionic = true
			case strings.ContainsAny(w, "+-"):
				opt.Only = append(opt.Only, strings.Split(w, ",")...)
			default:
				return nil, usage(k, "%q is neither a lattice source (%s), ionic, nor counter-ions (K+,Na+)", w, strings.Join(analysis.IonFitSources(), ", "))
			}
		}
		return func(a *analysis.Analyst) (any, error) { return a.FitIon(args[0], opt) }, nil
	}
	return k
}
