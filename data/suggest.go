package data

import (
	"sort"
	"strings"

	"enthalpath/thermo/notation"
)

// suggest returns up to n candidates closest to q by edit distance (case
// folded), closest first, keeping only reasonably close ones.
func suggest(q string, candidates []string, n int) []string {
	type scored struct {
		s string
		d int
	}
	lq := strings.ToLower(q)
	var all []scored
	for _, c := range candidates {
		lc := strings.ToLower(c)
		d := editDistance(lq, lc)
		if strings.HasPrefix(lc, lq) && lq != "" {
			d = min(d, 1)
		}
		limit := max(2, len([]rune(q))/2)
		if d <= limit {
			all = append(all, scored{c, d})
		}
	}
	sort.SliceStable(all, func(i, j int) bool { return all[i].d < all[j].d })
	var out []string
	seen := map[string]bool{}
	for _, s := range all {
		if len(out) == n {
			break
		}
		if !seen[s.s] {
			seen[s.s] = true
			out = append(out, s.s)
		}
	}
	return out
}

// editDistance is the Levenshtein distance between a and b (runes).
func editDistance(a, b string) int {
	ra, rb := []rune(a), []rune(b)
	if len(ra) > 64 || len(rb) > 64 {
		return 64
	}
	prev := make([]int, len(rb)+1)
	cur := make([]int, len(rb)+1)
	for j := range prev {
		prev[j] = j
	}
	for i := 1; i <= len(ra); i++ {
		cur[0] = i
		for j := 1; j <= len(rb); j++ {
			cost := 1
			if ra[i-1] == rb[j-1] {
				cost = 0
			}
			cur[j] = min(prev[j]+1, cur[j-1]+1, prev[j-1]+cost)
		}
		prev, cur = cur, prev
	}
	return prev[len(rb)]
}

func (db *DB) suggestElements(q string) []string {
	var cands []string
	for _, e := range db.elements {
		cands = append(cands, e.Symbol)
	}
	out := suggest(q, cands, 4)
	var names []string
	for _, e := range db.elements {
		if e.Name != "" {
			names = append(names, e.Name)
		}
	}
	for _, nm := range suggest(q, names, 2) {
		if i, ok := db.folds().elements[strings.ToLower(nm)]; ok {
			out = appendNew(out, db.elements[i].Symbol)
		}
	}
	return out
}

func (db *DB) suggestIons(q string) []string {
	var cands []string
	for _, ion := range db.ions {
		cands = append(cands, ion.Symbol)
	}
	out := suggest(q, cands, 4)
	// Same core, other charges.
	core := strings.TrimRight(strings.TrimRight(notation.FoldIon(q), "+-"), "0123456789")
	for _, ion := range db.ions {
		if ion.Core == core && len(out) < 6 {
			out = appendNew(out, ion.Symbol)
		}
	}
	return out
}

func (db *DB) suggestCompounds(q string) []string {
	var cands []string
	for _, c := range db.compounds {
		cands = append(cands, c.Formula)
	}
	out := suggest(q, cands, 4)
	// Compounds sharing the elements of q, compared through the composition
	// keys built at load: a miss must stay cheap (batch runs look up
	// thousands of formulas the tables do not hold).
	if f, err := notation.ParseFormula(q); err == nil {
		want := elementSet(f.Hill())
		keys := db.compositions().keys
		for _, c := range db.compounds {
			if len(out) >= 6 {
				break
			}
			key, ok := keys[c.Formula]
			if !ok {
				continue
			}
			if elementSet(key) == want {
				out = appendNew(out, c.Formula)
			}
		}
	}
	return out
}

// elementSet turns a composition key (a Hill formula) into the list of its
// elements by dropping the counts: "CaF2" → "CaF". Element symbols start
// with the only capital letter they hold, so the result is unambiguous.
func elementSet(hill string) string {
	return strings.Map(func(r rune) rune {
		if r >= '0' && r <= '9' {
			return -1
		}
		return r
	}, hill)
}

func appendNew(list []string, s string) []string {
	for _, x := range list {
		if x == s {
			return list
		}
	}
	return append(list, s)
}
