package ewald

import (
	"errors"
	"fmt"
	"math"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
)

// DefaultAccuracy is the relative accuracy used when Options.Accuracy is 0.
const DefaultAccuracy = 1e-10

// FinestAccuracy is the smallest relative accuracy Sum can promise in
// float64 arithmetic. A finer request is evaluated at this accuracy and
// returned with an *AccuracyError.
const FinestAccuracy = 1e-14

// CoarsestAccuracy is the largest relative accuracy Options accepts.
const CoarsestAccuracy = 1e-2

// Boundary describes the boundary condition of every sum.
const Boundary = "conducting (tin-foil): no surface dipole term"

// Convention is the definition of Result.MadelungConstant.
const Convention = "E_fu = −A·z₊·|z₋|·e²/(4πε₀·d), d the shortest cation–anion distance, z₊ and z₋ the charges of that nearest pair"

// maxTerms bounds the work of one sum (pair checks plus lattice-sum terms).
const maxTerms = 2e10

// Options controls Sum.
type Options struct {
	// Accuracy is the requested relative accuracy of the energy; 0 means
	// DefaultAccuracy. It must lie between 0 and CoarsestAccuracy.
	Accuracy float64

	// alpha, when positive, forces the splitting parameter (1/Å); only the
	// package's tests set it, to show the result does not depend on it.
	alpha float64
	// charged lets a cell with a net charge through to the sums; only
	// SumCharged sets it, and adds the background term (background.go).
	charged bool
	// general, set only by the package's tests, keeps a small cell off
	// the small-cell path (sumSmall) so the two can be compared.
	general bool
}

// Result is the outcome of an Ewald sum.
type Result struct {
	// EnergyEV is the electrostatic energy of one cell in eV.
	EnergyEV float64
	// EnergyPerFormulaUnitEV is EnergyEV divided by the formula units.
	EnergyPerFormulaUnitEV float64
	// EnergyKJPerMol is the energy per mole of formula units in kJ/mol.
	EnergyKJPerMol float64
	// SitePotentials holds, in the order of the crystal's sites, the
	// electrostatic potential in volt at each site due to all other charges
	// of the infinite crystal (the Madelung potential).
	// EnergyEV = ½ Σᵢ qᵢ·SitePotentials[i].
	SitePotentials []float64
	// NearestDistance is the shortest cation–anion distance d in Å.
	NearestDistance float64
	// NearestPair holds the site indices (cation, anion) of that distance.
	NearestPair [2]int
	// MadelungConstant is A in the convention stated by Convention.
	MadelungConstant float64
	// Convention is the sentence defining MadelungConstant.
	Convention string
	// Boundary is the boundary condition (always Boundary).
	Boundary string
	// Accuracy is the relative accuracy requested.
	Accuracy float64
	// EstimatedError is the estimated relative error of EnergyEV
	// (truncation of both sums and floating-point rounding).
	EstimatedError float64
	// Alpha is the splitting parameter in 1/Å.
	Alpha float64
	// RealCutoff is the real-space cut-off radius in Å.
	RealCutoff float64
	// RecipCutoff is the reciprocal-space cut-off |k| in 1/Å (k includes 2π).
	RecipCutoff float64
	// RealTerms counts the real-space pair terms evaluated.
	RealTerms int
	// RecipTerms counts the reciprocal vectors used (one of each ±k pair).
	RecipTerms int
}

// Sum evaluates the Coulomb energy of the neutral periodic point-charge
// crystal c by Ewald summation with conducting boundary conditions, with
// the splitting parameter and both cut-offs chosen from opt.Accuracy.
//
// It returns an error wrapping crystal.ErrNotNeutral for a charged cell,
// ErrNoIons when there is no cation or no anion, ErrBadOptions for a bad
// accuracy, and a plain error for an empty or degenerate cell. When the
// accuracy cannot be reached it returns the Result computed and an
// *AccuracyError.
func Sum(c *crystal.Crystal, opt Options) (Result, error) {
	if c == nil {
		return Result{}, fmt.Errorf("Ewald sum: no crystal given")
	}
	if err := c.Validate(); err != nil && !(opt.charged && errors.Is(err, crystal.ErrNotNeutral)) {
		return Result{}, fmt.Errorf("Ewald sum: %w", err)
	}
	hasCation, hasAnion := false, false
	for i, s := range c.Sites {
		if math.IsNaN(s.Charge) || math.IsInf(s.Charge, 0) {
			return Result{}, fmt.Errorf("Ewald sum of %q: site %d (%s) has charge %g", c.Name, i+1, s.Species, s.Charge)
		}
		if bad := !isFinite(s.Frac[0]) || !isFinite(s.Frac[1]) || !isFinite(s.Frac[2]); bad {
			return Result{}, fmt.Errorf("Ewald sum of %q: site %d (%s) has position %v", c.Name, i+1, s.Species, s.Frac)
		}
		hasCation = hasCation || s.Charge > 0
		hasAnion = hasAnion || s.Charge < 0
	}
	if !hasCation || !hasAnion {
		return Result{}, fmt.Errorf("Ewald sum of %q: %w", c.Name, ErrNoIons)
	}
	for k, a := range c.Lattice {
		if !isFinite(a[0]) || !isFinite(a[1]) || !isFinite(a[2]) {
			return Result{}, fmt.Errorf("Ewald sum of %q: lattice vector %d is %v", c.Name, k+1, a)
		}
	}
	eps := opt.Accuracy
	if eps == 0 {
		eps = DefaultAccuracy
	}
	if math.IsNaN(eps) || eps < 0 || eps > CoarsestAccuracy {
		return Result{}, fmt.Errorf("relative accuracy %g must be greater than 0 and at most %g (default %g): %w",
			opt.Accuracy, CoarsestAccuracy, DefaultAccuracy, ErrBadOptions)
	}
	if math.IsNaN(opt.alpha) || opt.alpha < 0 || math.IsInf(opt.alpha, 0) {
		return Result{}, fmt.Errorf("Ewald sum: forced splitting parameter α = %g: %w", opt.alpha, ErrBadOptions)
	}
	target := math.Max(eps, FinestAccuracy)
	if !opt.general {
		if res, ok := sumSmall(c, eps, target, opt.alpha); ok {
			return res, nil
		}
	}

	full := newSystem(c, true)
	s := full
	if prim, ok := full.primitive(); ok {
		s = prim
	}
	// Both truncation errors fall as exp(−p²); start from exp(−p²) = target/2
	// and widen until the Kolafa–Perram estimates meet the target. On the
	// built-in prototypes the error measured against a 1e-13 sum stayed
	// below exp(−p²).
	p := math.Sqrt(-math.Log(target / 2))
	alpha := opt.alpha
	if alpha == 0 {
		alpha = s.chooseAlpha(p)
	}
	var res Result
	var parts partialSums
	var trunc float64
	for attempt := 0; ; attempt++ {
		rc, kc := p/alpha, 2*alpha*p
		if w := s.work(alpha, rc, kc); w > maxTerms {
			return Result{}, fmt.Errorf("Ewald sum of %q with %d sites needs about %.3g terms (limit %.3g): %w",
				c.Name, len(c.Sites), w, float64(maxTerms), ErrTooLarge)
		}
		parts = full.expand(s, s.evaluate(alpha, rc, kc))
		if i, j := parts.overlap[0], parts.overlap[1]; i >= 0 {
			return Result{}, fmt.Errorf("Ewald sum of %q: sites %d (%s) and %d (%s) sit at the same position (closer than %g Å)",
				c.Name, i+1, c.Sites[i].Species, j+1, c.Sites[j].Species, coincident)
		}
		// Relative truncation estimate of the cell actually summed (the
		// primitive one carries 1/g of the energy).
		trunc = s.truncationError(alpha, rc, kc) * float64(len(s.q)) / float64(len(full.q)) / math.Abs(parts.total())
		res = newResult(c, parts, alpha, rc, kc, eps, math.Max(trunc, math.Exp(-p*p)))
		if !(trunc > target) || attempt == 3 {
			break
		}
		p = math.Sqrt(p*p + math.Log(trunc/target) + 0.5)
	}
	if !(res.EstimatedError <= eps) {
		reason := "floating-point rounding limits the sum"
		switch {
		case eps < FinestAccuracy:
			reason = fmt.Sprintf("float64 arithmetic cannot promise better than %g", FinestAccuracy)
		case trunc > eps:
			reason = "the cut-offs could not be widened enough"
		}
		return res, &AccuracyError{Crystal: c.Name, Requested: eps, Estimated: res.EstimatedError, Reason: reason}
	}
	return res, nil
}

func isFinite(x float64) bool { return !math.IsNaN(x) && !math.IsInf(x, 0) }

// system holds the wrapped geometry of one crystal.
type system struct {
	c      *crystal.Crystal
	lat    [3]crystal.Vec3
	recip  [3]crystal.Vec3 // without 2π
	volume float64
	frac   []crystal.Vec3 // wrapped into [0,1)
	pos    []crystal.Vec3 // Cartesian, Å
	q      []float64
	q2     float64 // Σ q²

	// Internal translations (see orbits): rep[i] is the representative of
	// site i's orbit, reps lists the representatives (nil when g = 1).
	rep        []int
	reps       []int
	g          int
	generators []crystal.Vec3

	// origin[i] is the index in the caller's crystal of site i (nil: the
	// same index), for the primitive cell of a larger one.
	origin []int
}

// newSystem wraps c; with detect it also looks for internal translations.
func newSystem(c *crystal.Crystal, detect bool) *system {
	// Work in a reduced basis of the lattice: the image searches of both
	// sums are then compact even for a skewed cell.
	lat := crystal.ReduceBasis(c.Lattice)
	red := crystal.Crystal{Lattice: lat}
	s := &system{c: c, lat: lat, recip: red.Reciprocal(), volume: c.Volume()}
	n := len(c.Sites)
	vecs := make([]crystal.Vec3, 2*n) // one allocation for both lists
	s.frac, s.pos = vecs[:n:n], vecs[n:]
	s.q = make([]float64, n)
	for i, site := range c.Sites {
		// Wrapped first: a coordinate far outside [0, 1) on long lattice
		// vectors would otherwise lose digits in the Cartesian position.
		r := c.Cartesian(wrapFrac(site.Frac))
		f := crystal.Vec3{s.recip[0].Dot(r), s.recip[1].Dot(r), s.recip[2].Dot(r)}
		for k := range f {
			f[k] -= math.Floor(f[k])
			if f[k] >= 1 {
				f[k] = 0
			}
		}
		s.frac[i] = f
		s.pos[i] = lat[0].Scale(f[0]).Add(lat[1].Scale(f[1])).Add(lat[2].Scale(f[2]))
		s.q[i] = site.Charge
		s.q2 += site.Charge * site.Charge
	}
	if detect {
		s.rep, s.g, s.generators = s.orbits()
	} else {
		s.rep, s.g = make([]int, n), 1
		for i := range s.rep {
			s.rep[i] = i
		}
	}
	if s.g > 1 {
		s.reps = make([]int, 0, n/s.g)
		for i, r := range s.rep {
			if r == i {
				s.reps = append(s.reps, i)
			}
		}
	}
	return s
}

// realToRecipCost is the cost of one real-space pair term (the kernel from
// its table, a square root, the pair loop and the image search) relative to
// one site-by-k-vector term of the reciprocal sum, and kVectorOverhead the
// cost of one k-vector's own set-up (its Gaussian factor, its row of
// phases) in the same unit. BenchmarkTermCost measures both. After the
// two-pass real-space rows and the mirror-pair reciprocal rows, instruction
// counts per sum (valgrind --tool=cachegrind, displaced rock salt at 1e-10,
// December 2026) were least at 6 among 4, 6 and 9 for 4,096 ions (1.36G
// against 1.42G at 9) and within 1 % of each other at 64 and 512 ions;
// cachegrind's split gives about 49 instructions per pair checked and 70
// per pair within the cut-off in real space, 21 per site-term in
// reciprocal space.
const (
	realToRecipCost = 6.0
	kVectorOverhead = 6.0
)

// balancedAlpha returns the splitting parameter that balances the cost of
// the two sums for a cut-off product p fixed by the accuracy. With
// rc = p/α and kc = 2αp the real sum costs ∝ c_r·N²·rc³/V and the
// reciprocal sum ∝ (c₀ + c₁·N)·kc³·V/(8π³), so their sum is least for
// α⁶ = (c_r/c₁)·N²/(N + c₀/c₁)·π³/V² (compare the choice of J. Kolafa and
// J. W. Perram, Mol. Simul. 9, 351 (1992), and the N^(1/6) scaling in
// their Eq. 33); the total work then grows as N^1.5.
func (s *system) balancedAlpha() float64 {
	n := float64(len(s.q))
	return math.Pow(realToRecipCost*n*n/(n+kVectorOverhead)*math.Pi*math.Pi*math.Pi/(s.volume*s.volume), 1.0/6)
}

// oneImageStretch is how far above the balanced value α may be raised to
// bring the real-space cut-off below half of every plane spacing, where each
// pair has one image and needs no image search (realSpacePairs). Chosen from
// instruction counts per sum of BenchmarkScaling (cachegrind, rock salt
// displaced, 1e-10): raising α to the one-image value saved 22 % at 1,000
// ions (a raise by 1.29), 37 % at 1,728 (1.18) and half at 4,096, and cost
// 4 % at 512 ions (1.45) and 44 % at 216 (1.68).
const oneImageStretch = 1.4

// chooseAlpha returns the balanced splitting parameter for cut-off product
// p, raised to the one-image cut-off when that is close (oneImageStretch).
func (s *system) chooseAlpha(p float64) float64 {
	alpha := s.balancedAlpha()
	spacing := math.Inf(1)
	for k := 0; k < 3; k++ {
		spacing = math.Min(spacing, 1/s.recip[k].Norm())
	}
	// rc = p/α just below spacing/2.
	if one := p / (0.499 * spacing); one > alpha && one <= oneImageStretch*alpha {
		return one
	}
	return alpha
}

// work bounds the number of steps of a sum with cut-offs rc and kc: images
// examined in real space (the index box around each pair), table entries
// and terms in reciprocal space. It guards against cells so large or so
// needle-shaped that the sum would not finish.
func (s *system) work(alpha, rc, kc float64) float64 {
	n := float64(len(s.q))
	real := (n*n/2 + n) * newImageSum(s, alpha, rc).boxSize()
	table := 0.0
	for k := 0; k < 3; k++ {
		table += n * (2*kc*s.lat[k].Norm()/(2*math.Pi) + 1)
	}
	recip := n * (4 * math.Pi / 3 * kc * kc * kc * s.volume / (16 * math.Pi * math.Pi * math.Pi))
	return real + recip + table
}

// truncationError is the Kolafa–Perram (1992) estimate, in e²/Å, of the
// energy error from cutting the real sum at rc and the reciprocal sum at kc:
//
//	δE_r ≈ Q·√(rc/(2V))·exp(−α²rc²)/(α·rc)²
//	δE_k ≈ Q·(α/π²)·K^(−3/2)·V^(−1/2)·exp(−(πK/α)²),  K = kc/(2π)
//
// with Q = Σ qᵢ².
func (s *system) truncationError(alpha, rc, kc float64) float64 {
	return kolafaPerram(s.q2, s.volume, alpha, rc, kc)
}

// kolafaPerram is truncationError for Q = q2 and cell volume V.
func kolafaPerram(q2, volume, alpha, rc, kc float64) float64 {
	ar := alpha * rc
	dr := q2 * math.Sqrt(rc/(2*volume)) * math.Exp(-ar*ar) / (ar * ar)
	kk := kc / (2 * math.Pi)
	x := math.Pi * kk / alpha
	dk := q2 * alpha / (math.Pi * math.Pi) / (kk * math.Sqrt(kk*volume)) * math.Exp(-x*x)
	return dr + dk
}

// partialSums holds the three parts of the energy in e²/Å (before the
// Coulomb constant) and the per-site potentials in e/Å.
type partialSums struct {
	real, recip, self float64
	phi               []float64
	nearest           float64
	pair              [2]int
	overlap           [2]int // two sites at one position, or (−1, −1)
	realTerms         int
	recipTerms        int
	magnitude         float64 // Σ of the absolute values of all terms, for rounding
}

func (p partialSums) total() float64 { return p.real + p.recip + p.self }

// expand turns the partial sums of sub, the primitive cell of s (or s
// itself), into those of s: energies times the number of primitive cells,
// potentials copied to every site of an orbit, site indices mapped back.
func (s *system) expand(sub *system, ps partialSums) partialSums {
	if sub == s {
		return ps
	}
	f := float64(s.g)
	out := ps
	out.real, out.recip, out.self, out.magnitude = f*ps.real, f*ps.recip, f*ps.self, f*ps.magnitude
	// place[o] is the index in the primitive cell of representative o.
	place := make([]int, len(s.q))
	for k, o := range sub.origin {
		place[o] = k
	}
	out.phi = make([]float64, len(s.q))
	for i, r := range s.rep {
		out.phi[i] = ps.phi[place[r]]
	}
	mapPair := func(p [2]int) [2]int {
		if p[0] < 0 {
			return p
		}
		return [2]int{sub.origin[p[0]], sub.origin[p[1]]}
	}
	out.pair, out.overlap = mapPair(ps.pair), mapPair(ps.overlap)
	return out
}

func (s *system) evaluate(alpha, rc, kc float64) partialSums {
	n := len(s.q)
	ps := partialSums{phi: make([]float64, n), nearest: math.Inf(1), pair: [2]int{-1, -1}}
	phiReal := make([]float64, n)
	ps.realTerms, ps.nearest, ps.pair, ps.overlap = s.realSpace(alpha, rc, phiReal)
	phiRecip := make([]float64, n)
	ps.recipTerms = s.reciprocalSpace(alpha, kc, phiRecip)
	selfFactor := 2 * alpha / math.Sqrt(math.Pi)
	for i, q := range s.q {
		self := -selfFactor * q
		ps.phi[i] = phiReal[i] + phiRecip[i] + self
		ps.real += 0.5 * q * phiReal[i]
		ps.recip += 0.5 * q * phiRecip[i]
		ps.self += 0.5 * q * self
		ps.magnitude += 0.5 * math.Abs(q) * (math.Abs(phiReal[i]) + math.Abs(phiRecip[i]) + math.Abs(self))
	}
	return ps
}

// newResult converts the partial sums of crystal c into a Result;
// truncation is the relative truncation error estimated for them.
func newResult(c *crystal.Crystal, ps partialSums, alpha, rc, kc, eps, truncation float64) Result {
	ke := thermo.CoulombEVAngstrom
	r := Result{
		EnergyEV:       ke * ps.total(),
		SitePotentials: make([]float64, len(ps.phi)),
		Convention:     Convention,
		Boundary:       Boundary,
		Accuracy:       eps,
		Alpha:          alpha,
		RealCutoff:     rc,
		RecipCutoff:    kc,
		RealTerms:      ps.realTerms,
		RecipTerms:     ps.recipTerms,
	}
	for i, phi := range ps.phi {
		r.SitePotentials[i] = ke * phi
	}
	r.EnergyPerFormulaUnitEV = r.EnergyEV / float64(c.FormulaUnits)
	r.EnergyKJPerMol = thermo.EVToKJPerMol(r.EnergyPerFormulaUnitEV)
	d, i, j := ps.nearest, ps.pair[0], ps.pair[1]
	if i < 0 {
		d, i, j = c.NearestCationAnion()
	}
	r.NearestDistance, r.NearestPair = d, [2]int{i, j}
	zz := c.Sites[i].Charge * -c.Sites[j].Charge
	r.MadelungConstant = -r.EnergyPerFormulaUnitEV * d / (zz * ke)
	total := math.Abs(ps.total())
	terms := float64(ps.realTerms + ps.recipTerms*len(ps.phi) + len(ps.phi))
	rounding := 4 * 0x1p-53 * math.Sqrt(terms) * ps.magnitude / total
	r.EstimatedError = truncation + rounding
	return r
}
