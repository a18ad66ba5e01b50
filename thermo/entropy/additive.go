package entropy

import (
	"errors"
	"fmt"
	"math"
	"slices"

	"enthalpath/thermo/lsq"
)

// Sample is one compound with a measured entropy: its ions with their
// counts per formula unit and S° in J/(mol·K).
type Sample struct {
	Name    string
	Ions    map[string]int
	Entropy float64
}

// Additive holds single-ion entropy contributions θ fitted by least
// squares, S° ≈ Σ nᵢ·θᵢ (the method of Glasser & Jenkins 2009).
type Additive struct {
	// Theta is θ per ion, J/(mol·K); Uses counts the samples of each ion.
	Theta map[string]float64
	Uses  map[string]int
	// Samples is how many compounds entered; RMS the root-mean-square
	// residual S° − Σnθ over them (J/(mol·K)); RMSRelative the RMS of the
	// residual over S°.
	Samples          int
	RMS, RMSRelative float64
}

// ErrTooFewSamples: fewer samples than ions to fit.
var ErrTooFewSamples = errors.New("too few compounds with a measured entropy for the ions")

// ridge is the relative Tikhonov term that picks one solution where the
// samples leave a combination of ions free (only 1:1 salts of a set of
// ions fix θ₊ + θ₋, not each): the smallest-norm θ.
const ridge = 1e-9

// FitIons fits θ to the samples. Ions seen in fewer than minUses samples
// are left out with the samples that contain them.
func FitIons(samples []Sample, minUses int) (*Additive, error) {
	uses := map[string]int{}
	for _, s := range samples {
		for ion := range s.Ions {
			uses[ion]++
		}
	}
	var kept []Sample
	for _, s := range samples {
		ok := s.Entropy > 0
		for ion, n := range s.Ions {
			ok = ok && uses[ion] >= minUses && n > 0
		}
		if ok {
			kept = append(kept, s)
		}
	}
	kc := map[string]bool{}
	for _, s := range kept {
		for ion := range s.Ions {
			kc[ion] = true
		}
	}
	var ions []string
	for ion := range kc {
		ions = append(ions, ion)
	}
	slices.Sort(ions)
	idx := make(map[string]int, len(ions))
	for i, ion := range ions {
		idx[ion] = i
	}
	p := len(ions)
	if len(kept) <= p || p == 0 {
		return nil, fmt.Errorf("%w: %d compounds for %d ions", ErrTooFewSamples, len(kept), p)
	}
	// Normal equations AᵀA θ = Aᵀs.
	ata := make([]float64, p*p)
	atb := make([]float64, p)
	for _, s := range kept {
		for a, na := range s.Ions {
			i := idx[a]
			atb[i] += float64(na) * s.Entropy
			for b, nb := range s.Ions {
				ata[i*p+idx[b]] += float64(na * nb)
			}
		}
	}
	trace := 0.0
	for i := 0; i < p; i++ {
		trace += ata[i*p+i]
	}
	for i := 0; i < p; i++ {
		ata[i*p+i] += ridge * trace / float64(p)
	}
	theta, err := lsq.SolveSPD(ata, atb, p)
	if err != nil {
		return nil, err
	}
	out := &Additive{Theta: map[string]float64{}, Uses: map[string]int{}, Samples: len(kept)}
	for i, ion := range ions {
		out.Theta[ion], out.Uses[ion] = theta[i], uses[ion]
	}
	var r2, rr2 float64
	for _, s := range kept {
		est, _ := out.Estimate(s.Ions)
		r2 += sq(s.Entropy - est)
		rr2 += sq((s.Entropy - est) / s.Entropy)
	}
	out.RMS = math.Sqrt(r2 / float64(len(kept)))
	out.RMSRelative = math.Sqrt(rr2 / float64(len(kept)))
	return out, nil
}

// Estimate returns Σ nᵢ·θᵢ for the ions, and false when one of them was
// not fitted.
func (a *Additive) Estimate(ions map[string]int) (float64, bool) {
	s := 0.0
	for ion, n := range ions {
		th, ok := a.Theta[ion]
		if !ok {
			return 0, false
		}
		s += float64(n) * th
	}
	return s, true
}

func sq(x float64) float64 { return x * x }
