package cli

import (
	"flag"
	"strings"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
	"enthalpath/thermo"
)

// analysisSetup parses flags for one of the analysis commands and loads
// the data. It returns the positionals, or (nil, nil, nil) for --help.
func analysisSetup(env Env, fs *flag.FlagSet, args []string) ([]string, *analysis.Analyst, error) {
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return nil, nil, err
	}
	db, err := LoadData(env)
	if err != nil {
		return nil, nil, err
	}
	return pos, analysis.New(db), nil
}

// parseSets reads --set values (kJ/mol unless a unit is written).
func parseSets(sets []string) ([]cycle.Setting, error) {
	var out []cycle.Setting
	for _, s := range sets {
		st, err := cycle.ParseSetting(s, thermo.KJPerMol)
		if err != nil {
			return nil, &UsageError{err}
		}
		out = append(out, st)
	}
	return out, nil
}

// inputError marks an analysis error as bad input (exit 2): every error an
// analysis returns is about what it was asked.
func inputError(err error) error {
	if err == nil {
		return nil
	}
	return &UsageError{err}
}

// jsonNum makes a jsonNumber pointer (nil stays nil in the output).
func jsonNum(v float64) jsonNumber { return jsonNumber(v) }

func markers(s cycle.Source) string {
	m := s.Markers()
	if len(m) == 0 {
		return ""
	}
	return " [" + strings.Join(m, ", ") + "]"
}

// sourceWords describes a step's source briefly.
func sourceWords(s cycle.Source) string {
	switch s.Kind {
	case cycle.SourceData:
		return s.Key + markers(s)
	case cycle.SourceModel:
		return "model " + s.Key
	case cycle.SourceSolved:
		if s.Key != "" {
			return "solved by the " + s.Key // a term another cycle gives
		}
		return "solved"
	case cycle.SourceUser:
		return "user"
	case cycle.SourceSum:
		return "sum of sub-steps"
	}
	return s.Kind.String()
}
