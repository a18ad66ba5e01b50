package crystal

import "math"

// Reciprocal returns the reciprocal lattice vectors b₁, b₂, b₃ without the
// factor 2π, as rows: bᵢ·aⱼ = δᵢⱼ. The distance between neighbouring lattice
// planes (h k l) = eᵢ is 1/|bᵢ|.
func (c *Crystal) Reciprocal() [3]Vec3 {
	a := c.Lattice
	v := a[0].Dot(a[1].Cross(a[2]))
	return [3]Vec3{
		a[1].Cross(a[2]).Scale(1 / v),
		a[2].Cross(a[0]).Scale(1 / v),
		a[0].Cross(a[1]).Scale(1 / v),
	}
}

// Fractional returns the fractional coordinates of Cartesian position r.
func (c *Crystal) Fractional(r Vec3) Vec3 {
	b := c.Reciprocal()
	return Vec3{b[0].Dot(r), b[1].Dot(r), b[2].Dot(r)}
}

// ReduceBasis returns a basis of the same lattice with shorter, more
// nearly orthogonal vectors: it subtracts integer multiples of one vector
// from another while that shortens it (pairwise Lagrange–Gauss reduction),
// then orders the vectors by length. Searches over periodic images need far
// fewer candidates in a reduced basis.
func ReduceBasis(b [3]Vec3) [3]Vec3 {
	for iter := 0; iter < 1000; iter++ {
		changed := false
		for i := 0; i < 3; i++ {
			for j := 0; j < 3; j++ {
				if i == j {
					continue
				}
				bb := b[j].Dot(b[j])
				if !(bb > 0) {
					return b
				}
				mu := b[i].Dot(b[j]) / bb
				if math.Abs(mu) > 0.5+1e-9 && !math.IsInf(mu, 0) {
					b[i] = b[i].Sub(b[j].Scale(math.Round(mu)))
					changed = true
				}
			}
		}
		if !changed {
			break
		}
	}
	for i := 0; i < 3; i++ {
		for j := i + 1; j < 3; j++ {
			if b[j].Norm() < b[i].Norm() {
				b[i], b[j] = b[j], b[i]
			}
		}
	}
	return b
}

// periodicDistance returns the shortest |df + n| over integer vectors n,
// in Å, where df is a difference of fractional coordinates. With
// skipZero, the n that makes df + n zero is left out (a site's distance to
// its own images).
func (c *Crystal) periodicDistance(df Vec3, recip [3]Vec3, skipZero bool) float64 {
	for k := range df {
		df[k] -= math.Round(df[k])
	}
	best := math.Inf(1)
	if !(skipZero && df == (Vec3{})) {
		best = c.Cartesian(df).Norm()
	}
	if math.IsInf(best, 1) {
		// Self-image distance: start from the shortest lattice vector row.
		for _, a := range c.Lattice {
			best = math.Min(best, a.Norm())
		}
	}
	// Every image closer than best has |df_k + n_k| ≤ best·|b_k|. The axis
	// with the widest range is not searched: along it |d|² is a convex
	// quadratic, so only the two integers around its minimum can win.
	long := 0
	var h [3]float64
	for k := 0; k < 3; k++ {
		h[k] = best * recip[k].Norm()
		if h[k] > h[long] {
			long = k
		}
	}
	p, q := (long+1)%3, (long+2)%3
	aL := c.Lattice[long]
	aL2 := aL.Dot(aL)
	for np := int(math.Ceil(-df[p] - h[p])); np <= int(math.Floor(-df[p]+h[p])); np++ {
		for nq := int(math.Ceil(-df[q] - h[q])); nq <= int(math.Floor(-df[q]+h[q])); nq++ {
			var f Vec3
			f[p], f[q], f[long] = df[p]+float64(np), df[q]+float64(nq), df[long]
			v := c.Cartesian(f)
			t := math.Floor(-v.Dot(aL) / aL2)
			for _, m := range [2]float64{t, t + 1} {
				if skipZero && np == 0 && nq == 0 && df == (Vec3{}) && m == 0 {
					continue
				}
				if d := v.Add(aL.Scale(m)).Norm(); d < best {
					best = d
				}
			}
		}
	}
	return best
}

// ShortestSeparation returns the shortest distance in Å between any two
// sites, or between a site and its own periodic image, with the indices of
// the pair (i ≤ j). It returns +Inf for a cell without sites.
func (c *Crystal) ShortestSeparation() (d float64, i, j int) {
	c = c.reduced()
	recip := c.Reciprocal()
	d, i, j = math.Inf(1), -1, -1
	for p := range c.Sites {
		for q := p; q < len(c.Sites); q++ {
			df := c.Sites[q].Frac.Sub(c.Sites[p].Frac)
			if r := c.periodicDistance(df, recip, p == q); r < d {
				d, i, j = r, p, q
			}
		}
	}
	return d, i, j
}

// NearestCationAnion returns the shortest distance in Å between a site of
// positive charge and a site of negative charge over all periodic images,
// with the indices i (cation) and j (anion). Without a cation or an anion it
// returns +Inf, −1, −1.
func (c *Crystal) NearestCationAnion() (d float64, i, j int) {
	c = c.reduced()
	recip := c.Reciprocal()
	d, i, j = math.Inf(1), -1, -1
	for p, sp := range c.Sites {
		if !(sp.Charge > 0) {
			continue
		}
		for q, sq := range c.Sites {
			if !(sq.Charge < 0) {
				continue
			}
			if r := c.periodicDistance(sq.Frac.Sub(sp.Frac), recip, false); r < d {
				d, i, j = r, p, q
			}
		}
	}
	return d, i, j
}

// CoordinationShellTolerance is the relative widening of a cation's
// nearest cation–anion distance that still counts as its first shell in
// MeanCationAnionDistance.
const CoordinationShellTolerance = 0.15

// MeanCationAnionDistance returns the mean cation–anion bond length in Å:
// the average, over every bond from a cation to an anion of its first
// coordination shell (anions within 1 + CoordinationShellTolerance times
// that cation's nearest anion distance), of the bond length. It is the
// distance some published Madelung constants are referred to. Without a
// cation or an anion it returns NaN and no error.
//
// The anions are found by a grid search around each cation, so the work
// grows with the number of sites times the size of a shell, never with the
// number of periodic images a shell spans. A cell whose shells cannot be
// found within MaxNeighbourVisits grid-cell images, or hold more than
// MaxShellSize anions, returns NaN and a *ShellError.
func (c *Crystal) MeanCationAnionDistance() (float64, error) {
	mean, _, err := c.meanCationAnionDistance()
	return mean, err
}

// meanCationAnionDistance is MeanCationAnionDistance that also returns the
// grid-cell images examined.
func (c *Crystal) meanCationAnionDistance() (mean float64, visits int, err error) {
	r := c.reduced()
	grid := newNeighbourGrid(r, func(s Site) bool { return s.Charge < 0 })
	if len(grid.member) == 0 {
		return math.NaN(), 0, nil
	}
	first := math.Cbrt(r.Volume() / float64(len(grid.member)))
	sum, n := 0.0, 0
	var ds []float64
	for i, s := range r.Sites {
		if !(s.Charge > 0) {
			continue
		}
		nearest, radius := math.Inf(1), first
		for {
			ds = ds[:0]
			ok := grid.within(s.Frac, radius, func(_ int, d float64) {
				if len(ds) < 4*MaxShellSize {
					ds = append(ds, d)
				}
				nearest = math.Min(nearest, d)
			})
			if !ok || len(ds) == 4*MaxShellSize {
				return math.NaN(), grid.visits, &ShellError{Crystal: c.Name, Site: i, Species: s.Species, Visits: grid.visits, Members: len(ds)}
			}
			if shell := nearest * (1 + CoordinationShellTolerance); shell <= radius {
				break
			} else if !math.IsInf(nearest, 1) {
				radius = shell
			} else {
				radius *= 2
			}
		}
		members := 0
		for _, d := range ds {
			if d <= nearest*(1+CoordinationShellTolerance) {
				sum += d
				members++
			}
		}
		if members > MaxShellSize {
			return math.NaN(), grid.visits, &ShellError{Crystal: c.Name, Site: i, Species: s.Species, Visits: grid.visits, Members: members}
		}
		n += members
	}
	if n == 0 {
		return math.NaN(), grid.visits, nil
	}
	return sum / float64(n), grid.visits, nil
}

// reduced returns c described in a reduced basis of its lattice (same
// sites, same order, fractional coordinates re-expressed and wrapped), for
// the image searches. A degenerate lattice is returned unchanged.
func (c *Crystal) reduced() *Crystal {
	if !(c.Volume() > 0) {
		return c
	}
	r := c.Clone()
	r.Lattice = ReduceBasis(c.Lattice)
	for k, s := range c.Sites {
		f := r.Fractional(c.Cartesian(s.Frac))
		for d := range f {
			f[d] -= math.Floor(f[d])
		}
		r.Sites[k].Frac = f
	}
	return r
}
