package modelpanel

import (
	"fmt"
	"math"
	"strconv"

	"enthalpath/tui/screen"
)

// maxSiteGroups bounds the lines the per-site summary takes.
const maxSiteGroups = 6

// siteLines summarises the sites of a structure read from a CIF file: per
// species and charge, how many sites, the range of their Madelung
// potentials (from the Ewald sum the solve already made, never computed
// here) and of their bond-valence sums. Nothing for a prototype.
func (m *Model) siteLines() []string {
	st := m.ctx.Styles
	c := m.sess.Cycle
	if c == nil || c.Settings.Structure.Cell == nil {
		return nil
	}
	s := c.Settings.Structure
	mv, ok := c.Memo().Remembered(s, c.Cation, c.Anion, c.Settings.Accuracy)
	if !ok || len(mv.SitePotentials) != len(s.Cell.Sites) {
		return []string{st.Muted.Render("Sites: potentials appear once the Ewald sum is done")}
	}
	type group struct {
		species      string
		charge       float64
		n            int
		lo, hi       float64
		sumLo, sumHi float64
	}
	var groups []*group
	index := map[string]*group{}
	for i, site := range s.Cell.Sites {
		key := site.Species + "|" + strconv.FormatFloat(site.Charge, 'g', -1, 64)
		g := index[key]
		if g == nil {
			g = &group{species: site.Species, charge: site.Charge, lo: math.Inf(1), hi: math.Inf(-1), sumLo: math.Inf(1), sumHi: math.Inf(-1)}
			index[key] = g
			groups = append(groups, g)
		}
		g.n++
		g.lo, g.hi = math.Min(g.lo, mv.SitePotentials[i]), math.Max(g.hi, mv.SitePotentials[i])
		if i < len(s.BondValenceSums) && !math.IsNaN(s.BondValenceSums[i]) {
			g.sumLo, g.sumHi = math.Min(g.sumLo, s.BondValenceSums[i]), math.Max(g.sumHi, s.BondValenceSums[i])
		}
	}
	lines := []string{st.Title.Render(screen.Truncate(fmt.Sprintf("Sites of %s: Madelung potential and bond-valence sum", s.Name()), m.w))}
	for k, g := range groups {
		if k == maxSiteGroups {
			lines = append(lines, st.Muted.Render(fmt.Sprintf("  … %d more kinds of site (enthalpath madelung FILE lists every site)", len(groups)-k)))
			break
		}
		pot := fmt.Sprintf("%.3f V", g.lo)
		if g.hi-g.lo > 5e-4 {
			pot = fmt.Sprintf("%.3f … %.3f V", g.lo, g.hi)
		}
		sum := "—"
		if g.sumLo <= g.sumHi {
			sum = fmt.Sprintf("%.2f", g.sumLo)
			if g.sumHi-g.sumLo > 5e-3 {
				sum = fmt.Sprintf("%.2f … %.2f", g.sumLo, g.sumHi)
			}
		}
		lines = append(lines, screen.Truncate(fmt.Sprintf("  %-10s %+6.3g ×%-4d φ %-22s BVS %s", g.species, g.charge, g.n, pot, sum), m.w))
	}
	return lines
}
