package crystal

import (
	"fmt"
	"math"
	"sort"
	"strings"
)

// Ion names the species and charge that replace a placeholder.
type Ion struct {
	// Species is the new species symbol, e.g. "Mg". Empty keeps the old one.
	Species string
	// Charge is the ion's charge in e.
	Charge float64
}

// MaxSites is the largest number of sites Supercell will make.
const MaxSites = 1 << 20

// WithIons returns a copy of c in which every site whose species is a key of
// m (a prototype's slot label such as "M", or a species such as "Na") gets
// that Ion's species and charge. A key that matches no site, a non-finite
// charge, or a result that is not neutral is an error; c is not changed.
func (c *Crystal) WithIons(m map[string]Ion) (*Crystal, error) {
	d := c.Clone()
	keys := make([]string, 0, len(m))
	for k := range m {
		keys = append(keys, k)
	}
	sort.Strings(keys)
	present := map[string]bool{}
	for _, s := range c.Sites {
		present[s.Species] = true
	}
	for _, k := range keys {
		if !present[k] {
			return nil, fmt.Errorf("crystal %q: no site has species %q (species present: %s)", c.Name, k, strings.Join(c.SpeciesList(), ", "))
		}
		if q := m[k].Charge; math.IsNaN(q) || math.IsInf(q, 0) {
			return nil, fmt.Errorf("crystal %q: charge %g for %q is not a finite number", c.Name, q, k)
		}
	}
	for i, s := range c.Sites {
		ion, ok := m[s.Species]
		if !ok {
			continue
		}
		if ion.Species != "" {
			d.Sites[i].Species = ion.Species
		}
		d.Sites[i].Charge = ion.Charge
	}
	if q := d.TotalCharge(); math.Abs(q) > NeutralityTolerance {
		return nil, fmt.Errorf("crystal %q: with charges %s the cell holds %+.6g e: %w", c.Name, formatIons(keys, m), q, ErrNotNeutral)
	}
	return d, nil
}

func formatIons(keys []string, m map[string]Ion) string {
	var parts []string
	for _, k := range keys {
		parts = append(parts, fmt.Sprintf("%s=%+g", k, m[k].Charge))
	}
	return strings.Join(parts, ",")
}

// SpeciesList returns the distinct species in order of first appearance.
func (c *Crystal) SpeciesList() []string {
	seen := map[string]bool{}
	var out []string
	for _, s := range c.Sites {
		if !seen[s.Species] {
			seen[s.Species] = true
			out = append(out, s.Species)
		}
	}
	return out
}

// Supercell returns the n1 × n2 × n3 supercell of c: lattice vectors
// multiplied by n1, n2 and n3, sites repeated, formula units multiplied by
// n1·n2·n3. Each factor must be at least 1 and the result must hold at most
// MaxSites sites.
func (c *Crystal) Supercell(n1, n2, n3 int) (*Crystal, error) {
	if n1 < 1 || n2 < 1 || n3 < 1 {
		return nil, fmt.Errorf("crystal %q: supercell %d×%d×%d: each factor must be at least 1", c.Name, n1, n2, n3)
	}
	total := len(c.Sites)
	for _, n := range []int{n1, n2, n3} {
		if total > MaxSites/n {
			return nil, fmt.Errorf("crystal %q: supercell %d×%d×%d would hold more than %d sites", c.Name, n1, n2, n3, MaxSites)
		}
		total *= n
	}
	n := [3]int{n1, n2, n3}
	d := &Crystal{Name: c.Name, FormulaUnits: c.FormulaUnits * n1 * n2 * n3}
	if n1*n2*n3 > 1 {
		d.Name = fmt.Sprintf("%s %d×%d×%d", c.Name, n1, n2, n3)
	}
	for k := 0; k < 3; k++ {
		d.Lattice[k] = c.Lattice[k].Scale(float64(n[k]))
	}
	d.Sites = make([]Site, 0, total)
	for i := 0; i < n1; i++ {
		for j := 0; j < n2; j++ {
			for k := 0; k < n3; k++ {
				for _, s := range c.Sites {
					s.Frac = Vec3{
						(s.Frac[0] + float64(i)) / float64(n1),
						(s.Frac[1] + float64(j)) / float64(n2),
						(s.Frac[2] + float64(k)) / float64(n3),
					}
					d.Sites = append(d.Sites, s)
				}
			}
		}
	}
	return d, nil
}
