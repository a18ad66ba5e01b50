package modelpanel

import (
	"fmt"
	"slices"
	"strconv"
	"strings"

	"enthalpath/cycle"
)

// setting is one editable row: how to show it, parse a typed value, step
// through choices and go back to the default.
type setting struct {
	name string
	show func(s *cycle.Settings) string
	// parse applies typed text; nil for choice-only settings.
	parse func(c *cycle.Cycle, text string) error
	// choices, when set, are stepped through with ←/→ (text forms).
	choices func(c *cycle.Cycle) []string
	reset   func(c *cycle.Cycle)
	hint    string
	// file is true for the setting whose typed value may name a structure
	// file: such a value is read by a command (structurefile.go), not parse.
	file bool
}

// bounded reads a number typed for a model setting and checks it against
// the engine's one bound for it (cycle.CheckSetting), as the command line
// and cycle files do.
func bounded(ms cycle.ModelSetting, text string) (float64, error) {
	v, err := strconv.ParseFloat(strings.TrimSpace(text), 64)
	if err != nil {
		return 0, fmt.Errorf("%s: %q is not a number", ms, text)
	}
	if err := cycle.CheckSetting(ms, v); err != nil {
		return 0, err
	}
	return v, nil
}

func autoOr(v float64, unit string) string {
	if v == 0 {
		return "auto"
	}
	return strconv.FormatFloat(v, 'g', 6, 64) + unit
}

func settingsRows() []setting {
	return []setting{
		{
			name: "structure",
			show: func(s *cycle.Settings) string {
				n := s.Structure.Name()
				switch {
				case n == "":
					return "none (radius-ratio rule)"
				case s.Structure.FromData:
					return n + " (the compound's, from the data)"
				}
				return n
			},
			parse: func(c *cycle.Cycle, text string) error {
				text = strings.TrimSpace(text)
				if err := cycle.CheckPrototype(text); err != nil {
					return fmt.Errorf("%q is neither a prototype (%s) nor a .cif file", text, strings.Join(cycle.PrototypeNames(), ", "))
				}
				if err := cycle.PrototypeFits(c, text); err != nil {
					return err // refused when chosen, not three models failing later
				}
				st := cycle.Structure{Prototype: text}
				if text == c.Compound.Structure {
					st.Params, st.FromData = c.Compound.Params, true
				}
				c.Settings.Structure = st
				return nil
			},
			choices: func(c *cycle.Cycle) []string {
				// Only the prototypes that can hold the compound's ions.
				var out []string
				for _, n := range cycle.PrototypeNames() {
					if cycle.PrototypeFits(c, n) == nil {
						out = append(out, n)
					}
				}
				return out
			},
			reset: func(c *cycle.Cycle) {
				c.Settings.Structure = cycle.Structure{Prototype: c.Compound.Structure, Params: c.Compound.Params, FromData: c.Compound.Structure != ""}
			},
			hint: "a prototype name (←/→ steps through them) or the name of a .cif file",
			file: true,
		},
		{
			name: "ρ (Born–Mayer range)",
			show: func(s *cycle.Settings) string {
				if s.Rho == 0 {
					return "default 0.345 Å"
				}
				return autoOr(s.Rho, " Å")
			},
			parse: func(c *cycle.Cycle, text string) error {
				v, err := bounded(cycle.SettingRho, text)
				if err == nil {
					c.Settings.Rho = v
				}
				return err
			},
			reset: func(c *cycle.Cycle) { c.Settings.Rho = 0 },
			hint:  "in Å, typically 0.30–0.40",
		},
		{
			name: "Born exponent n",
			show: func(s *cycle.Settings) string {
				if s.BornExponent == 0 {
					return "auto (mean of Pauling's values for the ions)"
				}
				return autoOr(s.BornExponent, "")
			},
			parse: func(c *cycle.Cycle, text string) error {
				v, err := bounded(cycle.SettingBornExponent, text)
				if err == nil {
					c.Settings.BornExponent = v
				}
				return err
			},
			reset: func(c *cycle.Cycle) { c.Settings.BornExponent = 0 },
			hint:  "a number, usually 5–12",
		},
		{
			name: "radii",
			show: func(s *cycle.Settings) string { return s.Radius.String() + " (Shannon 1976)" },
			parse: func(c *cycle.Cycle, text string) error {
				k, err := cycle.ParseRadiusKind(text)
				if err == nil {
					c.Settings.Radius = k
				}
				return err
			},
			choices: func(*cycle.Cycle) []string { return []string{"ionic", "crystal"} },
			reset:   func(c *cycle.Cycle) { c.Settings.Radius = cycle.RadiusIonic },
			hint:    "ionic or crystal",
		},
		cnRow("cation CN", func(s *cycle.Settings) *int { return &s.CationCN }),
		cnRow("anion CN", func(s *cycle.Settings) *int { return &s.AnionCN }),
		{
			name: "d₀ source",
			show: func(s *cycle.Settings) string {
				if s.Distance == cycle.DistanceUser {
					return autoOr(s.D0, " Å") + " (yours)"
				}
				return s.Distance.String()
			},
			parse: func(c *cycle.Cycle, text string) error {
				d, v, err := cycle.ParseDistance(text)
				if err == nil {
					c.Settings.Distance, c.Settings.D0 = d, v
				}
				return err
			},
			choices: func(*cycle.Cycle) []string { return []string{"auto", "geometry", "radii"} },
			reset:   func(c *cycle.Cycle) { c.Settings.Distance, c.Settings.D0 = cycle.DistanceAuto, 0 },
			hint:    "auto, geometry, radii, or a distance in Å",
		},
		{
			name: "lattice step from",
			show: func(s *cycle.Settings) string {
				if s.LatticeFrom == "" {
					return "cycle (Hess's law gives it)"
				}
				return s.LatticeFrom + " model (another step is solved)"
			},
			parse: func(c *cycle.Cycle, text string) error {
				text = strings.TrimSpace(text)
				if text == "" || text == "cycle" {
					c.Settings.LatticeFrom = ""
					return nil
				}
				name, err := cycle.ParseModel(text)
				if err == nil {
					c.Settings.LatticeFrom = name
				}
				return err
			},
			choices: func(*cycle.Cycle) []string { return append([]string{"cycle"}, cycle.ModelNames()...) },
			reset:   func(c *cycle.Cycle) { c.Settings.LatticeFrom = "" },
			hint:    "cycle, or a model name: then mark another step unknown on the bench (x)",
		},
		{
			name: "dispersion (extended)",
			show: func(s *cycle.Settings) string {
				if s.Dispersion == cycle.DispersionMayer {
					return "mayer (Mayer 1933, Fumi–Tosi 1964)"
				}
				return "crystal (ions in crystals, TKS 1953)"
			},
			parse: func(c *cycle.Cycle, text string) error {
				d, err := cycle.ParseDispersionSet(text)
				if err == nil {
					c.Settings.Dispersion = d
				}
				return err
			},
			choices: func(*cycle.Cycle) []string { return cycle.DispersionSetNames() },
			reset:   func(c *cycle.Cycle) { c.Settings.Dispersion = cycle.DispersionInCrystal },
			hint:    "crystal or mayer",
		},
	}
}

func cnRow(name string, field func(s *cycle.Settings) *int) setting {
	return setting{
		name: name,
		show: func(s *cycle.Settings) string {
			if *field(s) == 0 {
				return "auto (from the structure)"
			}
			return strconv.Itoa(*field(s))
		},
		parse: func(c *cycle.Cycle, text string) error {
			v, err := strconv.Atoi(strings.TrimSpace(text))
			if err != nil {
				return fmt.Errorf("%s: %q is not a coordination number (a whole number)", name, text)
			}
			if err := cycle.CheckSetting(cycle.SettingCN, float64(v)); err != nil {
				return fmt.Errorf("%s: %w", name, err)
			}
			*field(&c.Settings) = v
			return nil
		},
		choices: func(*cycle.Cycle) []string { return []string{"4", "6", "8", "12"} },
		reset:   func(c *cycle.Cycle) { *field(&c.Settings) = 0 },
		hint:    "an integer, e.g. 4, 6 or 8",
	}
}

// step moves a choice setting d places from its current value.
func step(s setting, c *cycle.Cycle, d int) error {
	if s.choices == nil {
		return fmt.Errorf("%s has no list of choices: press e to type a value", s.name)
	}
	ch := s.choices(c)
	cur := s.show(&c.Settings)
	i := slices.IndexFunc(ch, func(x string) bool { return strings.HasPrefix(cur, x) })
	if i < 0 {
		i = 0
		if d < 0 {
			i = len(ch) - 1
		}
	} else {
		i = (i + d + len(ch)) % len(ch)
	}
	return s.parse(c, ch[i])
}
