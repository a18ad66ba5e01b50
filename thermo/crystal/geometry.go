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
// cation or an anion it returns NaN.
func (c *Crystal) MeanCationAnionDistance() float64 {
	c = c.reduced()
	recip := c.Reciprocal()
	sum, n := 0.0, 0
	for _, sp := range c.Sites {
		if !(sp.Charge > 0) {
			continue
		}
		var ds []float64
		nearest := math.Inf(1)
		for _, sq := range c.Sites {
			if !(sq.Charge < 0) {
				continue
			}
			ds = append(ds, c.shellDistances(sq.Frac.Sub(sp.Frac), recip)...)
		}
		for _, d := range ds {
			nearest = math.Min(nearest, d)
		}
		for _, d := range ds {
			if d <= nearest*(1+CoordinationShellTolerance) {
				sum += d
				n++
			}
		}
	}
	if n == 0 {
		return math.NaN()
	}
	return sum / float64(n)
}

// shellDistances lists the distances of every image of df within 1 +
// CoordinationShellTolerance times its shortest image distance.
func (c *Crystal) shellDistances(df Vec3, recip [3]Vec3) []float64 {
	r := c.periodicDistance(df, recip, false) * (1 + CoordinationShellTolerance)
	for k := range df {
		df[k] -= math.Round(df[k])
	}
	var lo, hi [3]int
	for k := 0; k < 3; k++ {
		h := r * recip[k].Norm()
		lo[k] = int(math.Ceil(-df[k] - h))
		hi[k] = int(math.Floor(-df[k] + h))
	}
	var out []float64
	for n0 := lo[0]; n0 <= hi[0]; n0++ {
		for n1 := lo[1]; n1 <= hi[1]; n1++ {
			for n2 := lo[2]; n2 <= hi[2]; n2++ {
				f := Vec3{df[0] + float64(n0), df[1] + float64(n1), df[2] + float64(n2)}
				if d := c.Cartesian(f).Norm(); d <= r {
					out = append(out, d)
				}
			}
		}
	}
	return out
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
