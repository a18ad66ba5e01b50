package cli

import (
	"strings"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
)

// command is one row of the command table, the one list that drives
// dispatch, the top-level usage, each command's help (`enthalpath help
// NAME` and `enthalpath NAME --help` print the same generated text) and
// the shell completion scripts.
//
// To add a command: write its run function in a file named after it
// (flags on NewFlagSet, parsed with ParseFlags), then add one row here.
// To add a flag to a command: declare it on the command's flag set; its
// help, its completion and the README check follow from that.
type command struct {
	name     string
	aliases  []string // other names it answers to, not listed
	synopsis string   // after "usage: enthalpath "; more forms on lines of their own
	summary  string   // one line, in the command list and atop its help
	about    string   // more about it, in its help only; may be ""
	run      func(env Env, args []string) error
	// terminal marks a command that draws on the terminal itself: it gets
	// the process's own streams, unwrapped, to see that they are one.
	terminal bool
}

// Interactive holds the commands that start the workshop: they live with
// the terminal UI (package tui/launch), which this package never imports,
// and main hands them in. A nil one answers that it is not built in.
type Interactive struct {
	Workshop func(env Env, args []string) error // "open", and no command at all
	Serve    func(env Env, args []string) error // "serve"
}

// WorkshopSynopsis and ServeSynopsis are the synopses of the interactive
// commands, for the usage errors their runners word.
const (
	WorkshopSynopsis = "open [FORMULA | FILE" + cycle.FileExtension + "]"
	ServeSynopsis    = "serve [FLAGS]"
)

// commandTable is the table, in the order the usage lists it.
func commandTable(in Interactive) []command {
	table := []command{
		{name: "open", aliases: []string{"tui"}, synopsis: WorkshopSynopsis,
			summary: "the interactive workshop, optionally on a compound's cycle or a cycle file (no command: on the shelf)",
			run:     interactive(in.Workshop), terminal: true},
		{name: "serve", synopsis: ServeSynopsis,
			summary: "serve the workshop over SSH",
			about: "Every user connects with ssh -t and a public key, and works in a folder of their own under\n" +
				"the state directory, named after the key. Without --authorized-keys any key is let in, and\n" +
				"only loopback addresses may be served.",
			run: interactive(in.Serve), terminal: true},
		{name: "madelung", synopsis: madelungSynopsis, about: madelungAbout, run: runMadelung,
			summary: "Madelung constant, Ewald energy and site potentials of a structure"},
		{name: "data", synopsis: dataSynopsis, run: runData,
			summary: "show an element, ion or compound with values, uncertainties and sources"},
		{name: "cycle", synopsis: cycleSynopsis, run: runCycle,
			summary: "build and solve a Born–Haber cycle"},
		{name: "compare", synopsis: compareSynopsis, run: runCompare,
			summary: "cycle lattice value against the ionic models, one row per compound"},
		{name: "estimate", synopsis: estimateSynopsis, run: runEstimate,
			summary: "formation enthalpy of a hypothetical compound from a model lattice energy"},
		{name: "scan", synopsis: scanSynopsis, run: runScan,
			summary: "formation enthalpies across oxidation states and their disproportionations"},
		{name: "stability", synopsis: stabilitySynopsis, run: runStability,
			summary: "decompositions with ΔrG(T), verdicts beyond 2σ, temperatures of gas loss"},
		{name: "solution", synopsis: solutionSynopsis, run: runSolution,
			summary: "enthalpy of solution cycle"},
		{name: "radius", synopsis: radiusSynopsis, run: runRadius,
			summary: "thermochemical radius derived from a cycle lattice energy"},
		{name: "ionfit", synopsis: ionfitSynopsis, run: runIonfit,
			summary: "gas-phase enthalpy of an ion fitted over its salts (SO4^2-, O2-, ...)"},
		{name: "batch", synopsis: batchSynopsis, run: runBatch,
			summary: "solve many formulas from a CSV file",
			about: "The input CSV has a header row; columns (only formula is required): " +
				strings.Join(analysis.BatchColumns(), ", ") +
				", and set:KEY for a step value (e.g. set:attachment-2 with 744±20). FILE - reads standard input."},
		{name: "orderings", synopsis: orderingsSynopsis, about: orderingsAbout, run: runOrderings,
			summary: "rank orderings of ions and vacancies on mixed sites by Ewald energy"},
		{name: "trust", synopsis: trustSynopsis, run: runTrust,
			summary: "how far each lattice model can be trusted: its gaps to the cycles of the built-in compounds, by family"},
		{name: "completion", synopsis: completionSynopsis, run: runCompletion,
			summary: "print a shell completion script: bash, zsh or fish"},
		{name: "version", synopsis: "version", run: runVersion,
			summary: "the version and commit this binary was built from (also --version)"},
		{name: "help", synopsis: "help [COMMAND]", // run below: it reads the table
			summary: "this list, or a command's flags (the same as COMMAND --help)"},
	}
	table[len(table)-1].run = func(env Env, args []string) error { return runHelp(env, table, args) }
	return table
}

// interactive is the run function of a command main hands in.
func interactive(run func(Env, []string) error) func(Env, []string) error {
	if run != nil {
		return run
	}
	return func(Env, []string) error {
		return Usagef("the workshop is not part of this build")
	}
}

// find returns the command called name (or one of its aliases).
func find(table []command, name string) (command, bool) {
	for _, c := range table {
		if c.name == name {
			return c, true
		}
		for _, a := range c.aliases {
			if a == name {
				return c, true
			}
		}
	}
	return command{}, false
}
