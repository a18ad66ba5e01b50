package entropy

import (
	"fmt"
	"math"
)

// Class chooses the published line of the volume-based estimate.
type Class int

const (
	// Salt is an anhydrous simple ionic salt.
	Salt Class = iota
	// Hydrate is an ionic hydrate.
	Hydrate
	// Mineral is a mineral (silicates and other complex oxides).
	Mineral
)

// Line is one published line S°298 = K·V_m + C.
type Line struct {
	Class Class
	// K in J/(K·mol·nm³) per formula unit, C in J/(K·mol).
	K, C float64
	// Name says what the line is for; Citation where it is published.
	Name, Citation string
}

// Citation2003 is the source of every Line.
const Citation2003 = "Jenkins & Glasser, Inorg. Chem. 42, 8702 (2003), doi:10.1021/ic030219p"

// Lines returns the published lines, one per Class.
func Lines() []Line {
	return []Line{
		{Class: Salt, K: 1360, C: 15, Name: "ionic salts", Citation: Citation2003},
		{Class: Hydrate, K: 1579, C: 6, Name: "ionic hydrates", Citation: Citation2003},
		{Class: Mineral, K: 1262, C: 13, Name: "minerals", Citation: Citation2003},
	}
}

// LineFor returns the published line of class c.
func LineFor(c Class) Line {
	ls := Lines()
	if c < 0 || int(c) >= len(ls) {
		return ls[Salt]
	}
	return ls[c]
}

// String names the class as the paper does.
func (c Class) String() string { return LineFor(c).Name }

// VolumeError reports a formula-unit volume the estimate cannot use.
type VolumeError struct {
	Volume float64
}

func (e *VolumeError) Error() string {
	return fmt.Sprintf("formula-unit volume %g nm³ cannot give an entropy: it must be positive and finite", e.Volume)
}

// FromVolume returns S°298 = K·V_m + C (J/(mol·K)) for the formula-unit
// volume vm in nm³ on the line of class c.
func FromVolume(vm float64, c Class) (float64, error) {
	if !(vm > 0) || math.IsInf(vm, 0) {
		return 0, &VolumeError{Volume: vm}
	}
	l := LineFor(c)
	return l.K*vm + l.C, nil
}

// SphereVolume returns the volume (4π/3)·r³ of an ion of radius r (Å) in nm³.
func SphereVolume(r float64) float64 {
	const nm3PerA3 = 1e-3
	return 4 * math.Pi / 3 * r * r * r * nm3PerA3
}
