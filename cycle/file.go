package cycle

import (
	"bytes"
	"errors"
	"fmt"
	"io"
	"math"
	"regexp"
	"slices"
	"strconv"
	"strings"

	"github.com/BurntSushi/toml"

	"enthalpath/data"
	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/fileio"
)

// FileFormat is the name written in every cycle file, FileVersion its
// version; FileExtension is the usual file name ending.
const (
	FileFormat    = "enthalpath-cycle"
	FileVersion   = 1
	FileExtension = ".hesscycle"
)

// maxFileSteps bounds the [[step]] tables of a cycle file: more than any
// cycle has (the most ionizations, sub-steps and attachments together are
// under 30).
const maxFileSteps = 64

// MaxFileSize bounds what Unmarshal and Open read (1 MiB: a cycle file is a
// few kilobytes).
const MaxFileSize = 1 << 20

type fileDoc struct {
	Format   string `toml:"format"`
	Version  int    `toml:"version"`
	Note     string `toml:"note,omitempty"`
	Compound string `toml:"compound"`
	Cation   string `toml:"cation"`
	Anion    string `toml:"anion"`
	// AnionValue is "textbook" when the cycle uses the textbook value of a
	// multiply charged anion instead of the family-fitted one (the default).
	AnionValue string `toml:"anion_value,omitempty"`
	// Solve lists the unknown steps (normally one).
	Solve       []string      `toml:"solve"`
	Conventions fileConv      `toml:"conventions"`
	Models      fileModels    `toml:"models"`
	Steps       []fileStepDoc `toml:"step"`
}

// fileDocIn is fileDoc as read: steps as generic tables, so that a field
// of the wrong type is reported at its own line (the TOML decoder names only
// the last step's line for an array of tables).
type fileDocIn struct {
	Format      string           `toml:"format"`
	Version     int              `toml:"version"`
	Note        string           `toml:"note"`
	Compound    string           `toml:"compound"`
	Cation      string           `toml:"cation"`
	Anion       string           `toml:"anion"`
	AnionValue  string           `toml:"anion_value"`
	Solve       []string         `toml:"solve"`
	Conventions fileConv         `toml:"conventions"`
	Models      fileModels       `toml:"models"`
	Steps       []map[string]any `toml:"step"`
}

// stepFromTable converts one [[step]] table; the error names the field.
func stepFromTable(m map[string]any) (fileStepDoc, string, string) {
	var s fileStepDoc
	str := func(k string, dst *string) (string, string) {
		v, ok := m[k]
		if !ok {
			return "", ""
		}
		x, ok := v.(string)
		if !ok {
			return k, "must be a string"
		}
		*dst = x
		return "", ""
	}
	num := func(k string, dst *float64) (string, string) {
		v, ok := m[k]
		if !ok {
			return "", ""
		}
		switch x := v.(type) {
		case float64:
			*dst = x
		case int64:
			*dst = float64(x)
		default:
			return k, "must be a number"
		}
		return "", ""
	}
	flag := func(k string, dst *bool) (string, string) {
		v, ok := m[k]
		if !ok {
			return "", ""
		}
		x, ok := v.(bool)
		if !ok {
			return k, "must be true or false"
		}
		*dst = x
		return "", ""
	}
	known := map[string]bool{"key": true, "reaction": true, "value": true, "uncertainty": true, "multiplicity": true,
		"source": true, "source_key": true, "override": true, "memory": true, "derived": true, "unknown": true}
	for _, k := range sortedMapKeys(m) {
		if !known[k] {
			return s, k, "unknown field (a newer file version, or a typing error?)"
		}
	}
	for _, f := range []func() (string, string){
		func() (string, string) { return str("key", &s.Key) },
		func() (string, string) { return str("reaction", &s.Reaction) },
		func() (string, string) { return num("value", &s.Value) },
		func() (string, string) { return num("uncertainty", &s.Uncertainty) },
		func() (string, string) { return num("multiplicity", &s.Multiplicity) },
		func() (string, string) { return str("source", &s.Source) },
		func() (string, string) { return str("source_key", &s.SourceKey) },
		func() (string, string) { return flag("override", &s.Override) },
		func() (string, string) { return flag("memory", &s.Memory) },
		func() (string, string) { return flag("derived", &s.Derived) },
		func() (string, string) { return flag("unknown", &s.Unknown) },
	} {
		if k, why := f(); k != "" {
			return s, k, why
		}
	}
	return s, "", ""
}

func sortedMapKeys(m map[string]any) []string {
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	slices.Sort(keys)
	return keys
}

type fileConv struct {
	Lattice    string `toml:"lattice"`
	Ionization string `toml:"ionization"`
}

type fileModels struct {
	LatticeFrom  string             `toml:"lattice_from,omitempty"`
	Rho          float64            `toml:"rho,omitzero"`
	BornExponent float64            `toml:"born_exponent,omitzero"`
	Radius       string             `toml:"radius"`
	CationCN     int                `toml:"cation_cn,omitzero"`
	AnionCN      int                `toml:"anion_cn,omitzero"`
	D0           string             `toml:"d0"`
	Structure    string             `toml:"structure,omitempty"`
	Params       map[string]float64 `toml:"params,omitempty"`
	CIF          string             `toml:"cif,omitempty"`
	Accuracy     float64            `toml:"accuracy,omitzero"`
	Units        string             `toml:"units"`
	// Dispersion is the extended model's dispersion set, left out for the
	// default.
	Dispersion string `toml:"dispersion,omitempty"`
}

type fileStepDoc struct {
	Key          string  `toml:"key"`
	Reaction     string  `toml:"reaction"`
	Value        float64 `toml:"value"`
	Uncertainty  float64 `toml:"uncertainty"`
	Multiplicity float64 `toml:"multiplicity"`
	Source       string  `toml:"source"`
	SourceKey    string  `toml:"source_key,omitempty"`
	Override     bool    `toml:"override,omitempty"`
	Memory       bool    `toml:"memory,omitempty"`
	Derived      bool    `toml:"derived,omitempty"`
	Unknown      bool    `toml:"unknown,omitempty"`
}

// Marshal writes c as a cycle file (TOML, see the README section "Cycle
// files"): the compound and its ions, every step with its value,
// uncertainty, source and override flag, the unknown, the conventions and
// the model settings. The output is deterministic.
func Marshal(c *Cycle) ([]byte, error) {
	doc := fileDoc{Format: FileFormat, Version: FileVersion, Compound: c.Formula,
		Cation: c.Cation.Ion.Symbol, Anion: c.Anion.Ion.Symbol, Solve: c.Unknowns(), Note: c.Note}
	if doc.Solve == nil {
		doc.Solve = []string{}
	}
	doc.Conventions = fileConv{Lattice: c.Conventions.Lattice.String(), Ionization: c.Conventions.Ionization.String()}
	if c.AnionValue == AnionTextbook {
		doc.AnionValue = string(AnionTextbook)
	}
	st := c.Settings
	m := fileModels{LatticeFrom: st.LatticeFrom, Rho: st.Rho, BornExponent: st.BornExponent, Radius: st.Radius.String(),
		CationCN: st.CationCN, AnionCN: st.AnionCN, D0: st.Distance.String(), Accuracy: st.Accuracy, Units: st.Units.Key()}
	if st.Distance == DistanceUser {
		m.D0 = strconv.FormatFloat(st.D0, 'g', -1, 64)
	}
	if st.Dispersion != DispersionInCrystal {
		m.Dispersion = st.Dispersion.String()
	}
	if st.Structure.Cell != nil || st.Structure.CIF != "" {
		m.CIF = st.Structure.CIF
	} else if !sameStructure(st.Structure, c.Compound.Structure, c.Compound.Params) {
		m.Structure = st.Structure.Prototype
		m.Params = st.Structure.Params
		if m.Structure == "" && c.Compound.Structure != "" {
			m.Structure = "none"
		}
	}
	doc.Models = m
	for _, s := range c.Steps {
		doc.Steps = append(doc.Steps, fileStepDoc{Key: s.Key, Reaction: s.Reaction, Value: s.Value, Uncertainty: s.Uncertainty,
			Multiplicity: s.Multiplicity, Source: s.Source.Kind.String(), SourceKey: s.Source.Key, Override: s.Source.Override,
			Memory: s.Source.Memory, Derived: s.Source.Derived, Unknown: s.Unknown})
	}
	var buf bytes.Buffer
	buf.WriteString("# enthalpath cycle file: a Born–Haber cycle with its values, sources and settings.\n")
	buf.WriteString("# Energies in kJ/mol per reaction as written. Only steps with source = \"user\" are\n")
	buf.WriteString("# read back as values; the others are rebuilt from the data when the file is opened.\n")
	enc := toml.NewEncoder(&buf)
	enc.Indent = ""
	if err := enc.Encode(doc); err != nil {
		return nil, fmt.Errorf("cycle %s: encoding the cycle file: %w", c.Formula, err)
	}
	return buf.Bytes(), nil
}

// sameStructure reports whether st is the compound's own structure from the data.
func sameStructure(st Structure, proto string, params map[string]float64) bool {
	if st.Prototype != proto || len(st.Params) != len(params) {
		return false
	}
	for k, v := range params {
		if w, ok := st.Params[k]; !ok || w != v {
			return false
		}
	}
	return true
}

// Unmarshal reads a cycle file: it rebuilds the compound's cycle from db
// and applies the file's user values, unknowns, conventions and settings.
// A malformed file gives a *FileError with the line and field. A structure
// read from a CIF file is recorded by path only: the caller parses the CIF
// and sets Settings.Structure.Cell (this package reads no file but in Open).
func Unmarshal(db *data.DB, b []byte) (*Cycle, error) { return unmarshal(db, b, "") }

var lineInMessage = regexp.MustCompile(`line (\d+)`)
var lastKeyInMessage = regexp.MustCompile(`last key "([^"]*)"`)

func unmarshal(db *data.DB, b []byte, path string) (*Cycle, error) {
	fail := func(line int, field, reason string, err error) (*Cycle, error) {
		return nil, &FileError{Path: path, Line: line, Field: field, Reason: reason, Err: err}
	}
	if len(b) > MaxFileSize {
		return fail(0, "", fmt.Sprintf("file is %d bytes, more than the %d a cycle file may have", len(b), MaxFileSize), nil)
	}
	var nesting *fileio.NestingError
	if errors.As(fileio.CheckTOMLNesting(b), &nesting) {
		return fail(nesting.Line, "", fmt.Sprintf("arrays or inline tables nested more than %d deep", nesting.Max), nil)
	}
	text := string(b)
	var in fileDocIn
	md, err := toml.Decode(text, &in)
	if err != nil {
		var pe toml.ParseError
		if errors.As(err, &pe) {
			return fail(pe.Position.Line, pe.LastKey, pe.Message, nil)
		}
		line := 0
		if m := lineInMessage.FindStringSubmatch(err.Error()); m != nil {
			line, _ = strconv.Atoi(m[1])
		}
		field := ""
		if m := lastKeyInMessage.FindStringSubmatch(err.Error()); m != nil {
			field = m[1]
		}
		msg := err.Error()
		if i := strings.LastIndex(msg, "): "); i >= 0 {
			msg = msg[i+3:]
		}
		return fail(line, field, strings.TrimPrefix(msg, "toml: "), nil)
	}
	for _, k := range md.Undecoded() {
		if len(k) > 0 && k[0] == "step" {
			continue // checked per step below
		}
		return fail(findKeyLine(text, k), k.String(), "unknown field (a newer file version, or a typing error?)", nil)
	}
	doc := fileDoc{Format: in.Format, Version: in.Version, Note: in.Note, Compound: in.Compound, Cation: in.Cation,
		Anion: in.Anion, AnionValue: in.AnionValue, Solve: in.Solve, Conventions: in.Conventions, Models: in.Models}
	if len(in.Steps) > maxFileSteps {
		// Refused before any per-step work: 13,000 steps in 1 MiB once
		// took 111 s and 14.6 GB to read.
		return fail(findTableLine(text, "step", maxFileSteps, "key"), fmt.Sprintf("step[%d]", maxFileSteps+1),
			fmt.Sprintf("more than %d steps; a cycle has fewer", maxFileSteps), nil)
	}
	for i, m := range in.Steps {
		s, field, why := stepFromTable(m)
		if field != "" {
			return fail(findTableLine(text, "step", i, field), fmt.Sprintf("step[%d].%s", i+1, field), why, nil)
		}
		doc.Steps = append(doc.Steps, s)
	}
	lineOf := func(key ...string) int { return findKeyLine(text, toml.Key(key)) }
	if doc.Format != FileFormat {
		return fail(lineOf("format"), "format", fmt.Sprintf("is %q, expected %q: not an enthalpath cycle file", doc.Format, FileFormat), nil)
	}
	if doc.Version < 1 || doc.Version > FileVersion {
		return fail(lineOf("version"), "version", fmt.Sprintf("%d is not a version this program reads (1 to %d)", doc.Version, FileVersion), nil)
	}
	if strings.TrimSpace(doc.Compound) == "" {
		return fail(lineOf("compound"), "compound", "missing: give the compound's formula", nil)
	}
	var conv Conventions
	if doc.Conventions.Lattice != "" {
		if conv.Lattice, err = ParseLatticeConvention(doc.Conventions.Lattice); err != nil {
			return fail(lineOf("conventions", "lattice"), "conventions.lattice", err.Error(), nil)
		}
	}
	if doc.Conventions.Ionization != "" {
		if conv.Ionization, err = ParseIonizationConvention(doc.Conventions.Ionization); err != nil {
			return fail(lineOf("conventions", "ionization"), "conventions.ionization", err.Error(), nil)
		}
	}
	set, ferr := doc.Models.settings(text, path)
	if ferr != nil {
		return nil, ferr
	}
	opt := Options{Conventions: conv, Settings: set}
	if doc.AnionValue != "" {
		if opt.AnionValue, err = ParseAnionValue(doc.AnionValue); err != nil {
			return fail(lineOf("anion_value"), "anion_value", err.Error(), nil)
		}
	}
	c, err := Build(db, doc.Compound, opt)
	if err == nil && doc.Cation != "" && doc.Anion != "" && (c.Cation.Ion.Symbol != doc.Cation || c.Anion.Ion.Symbol != doc.Anion) {
		opt.Cation, opt.Anion = doc.Cation, doc.Anion
		c, err = Build(db, doc.Compound, opt)
	}
	if err != nil {
		return fail(lineOf("compound"), "compound", "cannot build the cycle", err)
	}
	c.Note = doc.Note
	// Unknowns: clear Build's default, then mark the file's.
	for i := range c.Steps {
		c.Steps[i].Unknown = false
		c.reset(i)
	}
	given := map[string]int{} // step key → its step[i] number
	for i, s := range doc.Steps {
		field := fmt.Sprintf("step[%d]", i+1)
		line := func() int { return findTableLine(text, "step", i, "key") } // only for a message: it scans the text
		if _, ok := c.Step(s.Key); !ok {
			return fail(line(), field+".key", fmt.Sprintf("no step %q in the cycle of %s (steps: %s)", s.Key, c.Formula, strings.Join(c.Keys(), ", ")), nil)
		}
		if first, twice := given[s.Key]; twice {
			return fail(line(), field+".key", fmt.Sprintf("step %q is given twice (first as step[%d])", s.Key, first), nil)
		}
		given[s.Key] = i + 1
		switch s.Source {
		case "user":
			if math.IsNaN(s.Value) || math.IsInf(s.Value, 0) {
				return fail(findTableLine(text, "step", i, "value"), field+".value", "not a finite number", nil)
			}
			if math.IsNaN(s.Uncertainty) || math.IsInf(s.Uncertainty, 0) || s.Uncertainty < 0 {
				return fail(findTableLine(text, "step", i, "uncertainty"), field+".uncertainty", "must be a finite number ≥ 0", nil)
			}
			if why := checkMagnitude("the value of step "+s.Key, s.Value); why != "" {
				return fail(findTableLine(text, "step", i, "value"), field+".value", why, nil)
			}
			if why := checkMagnitude("the uncertainty of step "+s.Key, s.Uncertainty); why != "" {
				return fail(findTableLine(text, "step", i, "uncertainty"), field+".uncertainty", why, nil)
			}
			if err := c.Set(s.Key, s.Value, s.Uncertainty); err != nil {
				return fail(line(), field, "cannot set the value", err)
			}
		case "data", "model", "solved", "sum", "missing", "":
		default:
			return fail(findTableLine(text, "step", i, "source"), field+".source",
				fmt.Sprintf("%q is not a source kind (data, user, model, solved, sum, missing)", s.Source), nil)
		}
		if s.Unknown {
			c.Steps[slices.IndexFunc(c.Steps, func(t Step) bool { return t.Key == s.Key })].Unknown = true
		}
	}
	for _, k := range doc.Solve {
		if err := c.MarkUnknown(k); err != nil {
			return fail(lineOf("solve"), "solve", err.Error(), nil)
		}
	}
	return c, nil
}

func (m fileModels) settings(text, path string) (Settings, *FileError) {
	var s Settings
	var err error
	bad := func(key, reason string) (Settings, *FileError) {
		return Settings{}, &FileError{Path: path, Line: findKeyLine(text, toml.Key{"models", key}), Field: "models." + key, Reason: reason}
	}
	if m.LatticeFrom != "" {
		if s.LatticeFrom, err = ParseModel(m.LatticeFrom); err != nil {
			return bad("lattice_from", err.Error())
		}
	}
	// 0 (the key absent) stands for the default; anything else is checked
	// against the one bound every front end uses.
	for _, f := range []struct {
		key     string
		setting ModelSetting
		v       float64
	}{{"rho", SettingRho, m.Rho}, {"born_exponent", SettingBornExponent, m.BornExponent},
		{"cation_cn", SettingCN, float64(m.CationCN)}, {"anion_cn", SettingCN, float64(m.AnionCN)},
		{"accuracy", SettingAccuracy, m.Accuracy}} {
		if f.v != 0 || math.IsNaN(f.v) {
			if err := CheckSetting(f.setting, f.v); err != nil {
				return bad(f.key, err.Error()+"; leave the key out for the default")
			}
		}
	}
	s.Rho = m.Rho
	s.BornExponent = m.BornExponent
	if m.Radius != "" {
		if s.Radius, err = ParseRadiusKind(m.Radius); err != nil {
			return bad("radius", err.Error())
		}
	}
	if s.Dispersion, err = ParseDispersionSet(m.Dispersion); err != nil {
		return bad("dispersion", err.Error())
	}
	s.CationCN, s.AnionCN = m.CationCN, m.AnionCN
	if m.D0 != "" {
		if s.Distance, s.D0, err = ParseDistance(m.D0); err != nil {
			return bad("d0", err.Error())
		}
	}
	switch m.Structure {
	case "":
	case "none":
		s.noStructure = true
	default:
		if _, err := crystal.LookupPrototype(m.Structure); err != nil {
			return bad("structure", err.Error())
		}
		s.Structure = Structure{Prototype: m.Structure, Params: m.Params}
	}
	if m.CIF != "" {
		s.Structure = Structure{CIF: m.CIF}
	}
	s.Accuracy = m.Accuracy
	if m.Units != "" {
		if s.Units, err = thermo.ParseUnit(m.Units); err != nil {
			return bad("units", err.Error())
		}
	}
	return s, nil
}

// ParseDistance reads a d₀ setting: auto, geometry, radii, or a distance in Å.
func ParseDistance(s string) (DistanceSource, float64, error) {
	t := strings.TrimSpace(strings.TrimSuffix(strings.TrimSpace(s), "Å"))
	if v, err := parseNumber(t); err == nil {
		if err := CheckSetting(SettingD0, v); err != nil {
			return 0, 0, err
		}
		return DistanceUser, v, nil
	}
	d, err := ParseDistanceSource(s)
	if d == DistanceUser && err == nil {
		return 0, 0, fmt.Errorf("give d₀ as a distance in Å, e.g. 2.81")
	}
	return d, 0, err
}

// findKeyLine returns the 1-based line of key (a dotted path outside arrays
// of tables), or 0.
func findKeyLine(text string, key toml.Key) int {
	table, want := "", key[len(key)-1]
	if len(key) > 1 {
		table = strings.Join(key[:len(key)-1], ".")
	}
	cur := ""
	for i, line := range strings.Split(text, "\n") {
		t := strings.TrimSpace(line)
		if strings.HasPrefix(t, "[") {
			cur = strings.Trim(t, "[] ")
			continue
		}
		if cur == table && keyOfLine(t) == want {
			return i + 1
		}
	}
	return 0
}

// findTableLine returns the line of field in the n-th (0-based) [[name]]
// table, or of the table header when the field is absent.
func findTableLine(text, name string, n int, field string) int {
	count, header := -1, 0
	for i, line := range strings.Split(text, "\n") {
		t := strings.TrimSpace(line)
		if strings.HasPrefix(t, "[") {
			if count == n {
				return header
			}
			if strings.Trim(t, "[] ") == name && strings.HasPrefix(t, "[[") {
				count++
				header = i + 1
			}
			continue
		}
		if count == n && keyOfLine(t) == field {
			return i + 1
		}
	}
	if count == n {
		return header
	}
	return 0
}

func keyOfLine(t string) string {
	k, _, ok := strings.Cut(t, "=")
	if !ok {
		return ""
	}
	return strings.Trim(strings.TrimSpace(k), `"`)
}

// Save writes c to path atomically (fileio.WriteAtomic): a synced
// temporary file in the same folder renamed over path, so a crash never
// leaves a truncated file. A file replaced keeps its permission bits; a new
// one is 0644. Anything at path that is not a regular file (a symbolic
// link, a device, a folder) is refused and left alone.
func Save(path string, c *Cycle) error {
	b, err := Marshal(c)
	if err != nil {
		return err
	}
	return fileio.WriteAtomic(path, 0o644, func(w io.Writer) error {
		_, err := w.Write(b)
		return err
	})
}

// Open reads the cycle file at path (see Unmarshal). It reads regular files
// only, and at most MaxFileSize bytes of them.
func Open(db *data.DB, path string) (*Cycle, error) {
	b, err := fileio.ReadFile(path, MaxFileSize)
	var tooLarge *fileio.TooLargeError
	var notRegular *fileio.NotRegularError
	switch {
	case errors.As(err, &tooLarge):
		return nil, &FileError{Path: path, Reason: fmt.Sprintf("the file is larger than the %s a cycle file may have", fileio.Size(MaxFileSize))}
	case errors.As(err, &notRegular):
		return nil, &FileError{Path: path, Reason: "cannot open: it is " + notRegular.Kind + ", not a regular file"}
	case err != nil:
		return nil, &FileError{Path: path, Reason: "cannot open", Err: err}
	}
	return unmarshal(db, b, path)
}
