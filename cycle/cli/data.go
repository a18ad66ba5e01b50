package cli

import (
	"errors"
	"fmt"
	"io"
	"slices"
	"strconv"
	"strings"

	"enthalpath/data"
	"enthalpath/thermo/notation"
)

const dataSynopsis = `data QUERY [--kind element|ion|compound] [--json]
       enthalpath data --list elements|ions|compounds|sources [--json]
       enthalpath data --sources [--json]`

// runData shows one element, ion or compound with every value, its
// uncertainty, unit and source, or lists the keys of one table.
func runData(env Env, args []string) error {
	fs := NewFlagSet("data")
	var asJSON, sources bool
	var kind, list string
	fs.BoolVar(&asJSON, "json", false, "print JSON")
	fs.StringVar(&kind, "kind", "", "read QUERY as an `element`, ion or compound (default: an ion if it ends in a charge, else an element, else a compound)")
	fs.StringVar(&list, "list", "", "list every `TABLE` row key: elements, ions, compounds or sources")
	fs.BoolVar(&sources, "sources", false, "count the built-in rows citing each source, and the rows entered from memory, per table")
	pos, help, err := ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if sources {
		if len(pos) > 0 || list != "" {
			return Usagef("--sources takes no QUERY and no --list")
		}
		return dataSources(env.Stdout, asJSON)
	}
	if list == "" && len(pos) != 1 {
		return Usagef("give one QUERY (an element symbol, an ion such as Fe3+ or SO4^2-, or a formula): usage: enthalpath %s", dataSynopsis)
	}
	if list != "" && len(pos) > 0 {
		return Usagef("--list takes no QUERY")
	}
	db, err := LoadData(env)
	if err != nil {
		return err
	}
	if list != "" {
		return dataList(env.Stdout, db, list, asJSON)
	}
	q := pos[0]
	var rec any
	switch kind {
	case "element":
		e, err := db.Element(q)
		if err != nil {
			return &UsageError{err}
		}
		rec = e
	case "ion":
		ion, err := db.Ion(q)
		if err != nil {
			return &UsageError{err}
		}
		rec = ion
	case "compound":
		c, err := db.Compound(q)
		if err != nil {
			return &UsageError{err}
		}
		rec = c
	case "":
		if rec, err = dataFindAny(db, q); err != nil {
			return err
		}
	default:
		return Usagef("--kind %q: give element, ion or compound", kind)
	}
	if asJSON {
		return writeJSON(env.Stdout, dataJSON(db, rec))
	}
	dataPrint(env.Stdout, db, rec)
	return nil
}

// dataFindAny resolves a query: an ion when it ends in a charge, then an
// element, then a compound. A miss is a usage error with suggestions of
// every kind.
func dataFindAny(db *data.DB, q string) (any, error) {
	t := strings.TrimSpace(q)
	endsInCharge := strings.HasSuffix(t, "+") || strings.HasSuffix(t, "-") || strings.HasSuffix(t, "⁺") || strings.HasSuffix(t, "⁻")
	var errs []error
	if endsInCharge {
		ion, err := db.Ion(t)
		if err == nil {
			return ion, nil
		}
		errs = append(errs, err)
	} else {
		e, eerr := db.Element(t)
		if eerr == nil && e.Symbol == t {
			return e, nil
		}
		c, err := db.Compound(t)
		if err == nil {
			return c, nil
		}
		if eerr == nil {
			// Element lookups ignore case ("na" is Na), but a query that
			// reads as a formula of several elements ("HF", "CO", "SN")
			// means that compound, not the element its letters spell.
			if f, ferr := notation.ParseFormula(t); ferr == nil && len(f.Elements()) > 1 {
				var parts []string
				for _, g := range f.Groups {
					parts = append(parts, g.Text)
				}
				return nil, Usagef("%s reads as a compound of %s, which is not in the data; for the element %s (%s) ask for %q",
					notation.QuoteInput(q), strings.Join(parts, " and "), e.Symbol, e.Name, e.Symbol)
			}
			return e, nil
		}
		errs = append(errs, eerr, err)
	}
	var sugg []string
	for _, err := range errs {
		var nf *data.NotFoundError
		if errors.As(err, &nf) {
			for _, s := range nf.Suggestions {
				if !slices.Contains(sugg, s) {
					sugg = append(sugg, s)
				}
			}
		}
	}
	msg := "nothing called " + notation.QuoteInput(q) + " in the data"
	var fe *notation.FormulaError
	if _, ferr := notation.ParseFormula(t); errors.As(ferr, &fe) && !endsInCharge && len(t) > 2 {
		msg += " (read as a formula: " + fe.Detail() + ")"
	}
	if len(sugg) > 0 {
		msg += "; did you mean " + strings.Join(sugg, ", ") + "?"
	}
	return nil, Usagef("%s", msg)
}

// ---- text output ----

func dataMapKeys[V any](m map[string]V) func(func(string) bool) {
	return func(yield func(string) bool) {
		for k := range m {
			if !yield(k) {
				return
			}
		}
	}
}

// ---- lists ----

func dataList(w io.Writer, db *data.DB, what string, asJSON bool) error {
	var keys []string
	switch what {
	case "elements":
		for _, e := range db.Elements() {
			keys = append(keys, e.Symbol)
		}
	case "ions":
		for _, i := range db.Ions() {
			keys = append(keys, i.Symbol)
		}
	case "compounds":
		for _, c := range db.Compounds() {
			keys = append(keys, c.Formula)
		}
	case "sources":
		if asJSON {
			out := []map[string]string{}
			for _, s := range db.Sources() {
				out = append(out, map[string]string{"key": s.Key, "citation": s.Citation})
			}
			return writeJSON(w, out)
		}
		for _, s := range db.Sources() {
			fmt.Fprintf(w, "%-16s %s\n", s.Key, hangingWrap(s.Citation, 78-17, 17))
		}
		return nil
	default:
		return Usagef("--list %q: give elements, ions, compounds or sources", what)
	}
	if asJSON {
		return writeJSON(w, keys)
	}
	fmt.Fprintln(w, wrapText(strings.Join(keys, " "), 78, ""))
	return nil
}

// dataSources prints data.Census: rows per source key and memory rows per
// table of the built-in data.
func dataSources(w io.Writer, asJSON bool) error {
	census, err := data.Census()
	if err != nil {
		return err
	}
	bySource := map[string]int{}
	for _, c := range census {
		for k, n := range c.BySource {
			bySource[k] += n
		}
	}
	if asJSON {
		type tableJSON struct {
			File     string         `json:"file"`
			Rows     int            `json:"rows"`
			Memory   int            `json:"memory_rows"`
			BySource map[string]int `json:"rows_by_source"`
		}
		var tables []tableJSON
		for _, c := range census {
			tables = append(tables, tableJSON{c.File, c.Rows, c.Memory, c.BySource})
		}
		return writeJSON(w, map[string]any{"tables": tables, "rows_by_source": bySource})
	}
	fmt.Fprintln(w, "Built-in rows citing each source (a row citing several counts under each)")
	t := table{head: []string{"source", "rows"}, right: map[int]bool{1: true}}
	for _, k := range slices.Sorted(dataMapKeys(bySource)) {
		t.add(k, strconv.Itoa(bySource[k]))
	}
	t.write(w, "  ")
	fmt.Fprintln(w, "\nRows per table, and those entered from memory (without the cited document at hand)")
	t = table{head: []string{"table", "rows", "memory"}, right: map[int]bool{1: true, 2: true}}
	var rows, mem int
	for _, c := range census {
		t.add(c.File, strconv.Itoa(c.Rows), strconv.Itoa(c.Memory))
		rows += c.Rows
		mem += c.Memory
	}
	t.add("all", strconv.Itoa(rows), strconv.Itoa(mem))
	t.write(w, "  ")
	return nil
}

// ---- JSON ----
