package ewald_test

import (
	"math"
	"testing"

	"enthalpath/thermo"
	"enthalpath/thermo/crystal"
	"enthalpath/thermo/ewald"
)

// wolfEnergy is an independent check of the Ewald sum: the damped, shifted
// pair sum of D. Wolf, P. Keblinski, S. R. Phillpot and J. Eggebrecht,
// J. Chem. Phys. 110, 8254 (1999), Eq. 5.13:
//
//	E = ½ Σᵢ Σ_{j,n; 0<r<Rc} qᵢqⱼ [erfc(αr)/r − erfc(αRc)/Rc]
//	    − [erfc(αRc)/(2Rc) + α/√π] Σᵢ qᵢ²
//
// a purely real-space sum over every image inside the sphere Rc, with each
// sphere made neutral by the shift. Its error has two parts: the damped
// tail, ∝ erfc(αRc), and the long-range remainder, ∝ exp(−k_min²/4α²) with
// k_min the shortest reciprocal vector. The caller picks α and Rc so both
// are far below 1e-6. It shares no code with package ewald. Returns eV per
// cell.
func wolfEnergy(c *crystal.Crystal, alpha, rc float64) float64 {
	var pos []crystal.Vec3
	for _, s := range c.Sites {
		pos = append(pos, c.Cartesian(s.Frac))
	}
	// Lattice images: a box certainly containing the sphere of radius
	// rc + cell diagonal around the origin.
	diag := c.Lattice[0].Norm() + c.Lattice[1].Norm() + c.Lattice[2].Norm()
	vol := c.Volume()
	var nmax [3]int
	for k := 0; k < 3; k++ {
		cross := c.Lattice[(k+1)%3].Cross(c.Lattice[(k+2)%3])
		height := vol / cross.Norm() // distance between lattice planes
		nmax[k] = int(math.Ceil((rc+diag)/height)) + 1
	}
	shift := math.Erfc(alpha*rc) / rc
	e := 0.0
	for n0 := -nmax[0]; n0 <= nmax[0]; n0++ {
		for n1 := -nmax[1]; n1 <= nmax[1]; n1++ {
			for n2 := -nmax[2]; n2 <= nmax[2]; n2++ {
				t := c.Lattice[0].Scale(float64(n0)).Add(c.Lattice[1].Scale(float64(n1))).Add(c.Lattice[2].Scale(float64(n2)))
				for i := range pos {
					for j := range pos {
						r := pos[j].Add(t).Sub(pos[i]).Norm()
						if r < 1e-9 || r >= rc {
							continue
						}
						e += 0.5 * c.Sites[i].Charge * c.Sites[j].Charge * (math.Erfc(alpha*r)/r - shift)
					}
				}
			}
		}
	}
	q2 := 0.0
	for _, s := range c.Sites {
		q2 += s.Charge * s.Charge
	}
	e -= (shift/2 + alpha/math.Sqrt(math.Pi)) * q2
	return e * thermo.CoulombEVAngstrom
}

// TestWolfAgreesWithEwald drives the Wolf sum to convergence (two settings
// that must agree with each other) and compares it with Ewald to 1e-6.
func TestWolfAgreesWithEwald(t *testing.T) {
	for _, name := range []string{"rock-salt", "caesium-chloride", "zinc-blende", "fluorite", "wurtzite", "rutile", "cadmium-iodide", "perovskite", "nickel-arsenide"} {
		c, err := crystal.Build(name, nil)
		if err != nil {
			t.Fatal(err)
		}
		// Shortest reciprocal vector length (with 2π).
		vol := c.Volume()
		kmin := math.Inf(1)
		for k := 0; k < 3; k++ {
			cross := c.Lattice[(k+1)%3].Cross(c.Lattice[(k+2)%3])
			kmin = math.Min(kmin, 2*math.Pi*cross.Norm()/vol)
		}
		// exp(−k_min²/4α²) ≤ e⁻²⁵ and erfc(αRc) ≤ erfc(5) ≈ 1.5e-12.
		alpha := kmin / 10
		e1 := wolfEnergy(c, alpha, 5/alpha)
		e2 := wolfEnergy(c, 0.85*alpha, 5.5/(0.85*alpha))
		if math.Abs(e1-e2) > 1e-8*math.Abs(e2) {
			t.Errorf("%s: Wolf sum not converged: %.10f vs %.10f", name, e1, e2)
		}
		r, err := ewald.Sum(c, ewald.Options{})
		if err != nil {
			t.Fatal(err)
		}
		if d := math.Abs(r.EnergyEV-e2) / math.Abs(e2); d > 1e-6 {
			t.Errorf("%s: Ewald %.10f eV, Wolf %.10f eV, relative difference %.2g", name, r.EnergyEV, e2, d)
		} else {
			t.Logf("%s: Ewald %.10f eV, Wolf %.10f eV, relative difference %.2g", name, r.EnergyEV, e2, d)
		}
	}
}
