package crystal

import (
	"math"
	"strconv"
	"strings"
)

// Occupant is one species on a site read from a structure file: a site
// shared by several elements, partly vacant, or held by one element whose
// charge the file did not state. Occupants of a site are summed in the
// averaged-crystal approximation: the site carries the mean charge
// Σ occupancy·charge, and a vacancy contributes nothing.
//
// Occupant slices are shared between copies of a crystal (Clone,
// Supercell): replace a site's slice, never modify its elements in place.
type Occupant struct {
	// Label is the source's name of the species' site (a CIF
	// _atom_site_label), the key by which charges are given.
	Label string
	// Element is the element symbol.
	Element string
	// Occupancy is the fraction of the site this species holds, in (0, 1].
	Occupancy float64
	// Charge is the ion's charge in e, or 0 while ChargeKnown is false.
	Charge float64
	// ChargeKnown is false when the source gave no charge and none has
	// been assigned yet.
	ChargeKnown bool
}

// Averaged reports whether the site stands for a mean over several species
// or a vacancy: its charge is then an average, not an ion's.
func (s Site) Averaged() bool {
	if len(s.Occupants) > 1 {
		return true
	}
	return len(s.Occupants) == 1 && s.Occupants[0].Occupancy < 1-OccupancyTolerance
}

// OccupancyTolerance is the largest shortfall of a site's total occupancy
// below 1 that still counts as fully occupied.
const OccupancyTolerance = 1e-3

// MeanCharge returns Σ occupancy·charge of the occupants.
func MeanCharge(occ []Occupant) float64 {
	q := 0.0
	for _, o := range occ {
		q += o.Occupancy * o.Charge
	}
	return q
}

// Composition names a site's occupants, such as "Na0.5K0.5" or "Fe0.9";
// a site wholly held by one element gets that element's symbol.
func Composition(occ []Occupant) string {
	if len(occ) == 1 && math.Abs(occ[0].Occupancy-1) <= OccupancyTolerance {
		return occ[0].Element
	}
	var b strings.Builder
	for _, o := range occ {
		b.WriteString(o.Element)
		b.WriteString(strconv.FormatFloat(o.Occupancy, 'g', 4, 64))
	}
	return b.String()
}

// ElementCounts returns the number of atoms of each element in the cell,
// weighted by occupancy. Sites without occupants count once under their
// Species.
func (c *Crystal) ElementCounts() map[string]float64 {
	n := map[string]float64{}
	for _, s := range c.Sites {
		if s.Occupants == nil {
			n[s.Species]++
			continue
		}
		for _, o := range s.Occupants {
			n[o.Element] += o.Occupancy
		}
	}
	return n
}
