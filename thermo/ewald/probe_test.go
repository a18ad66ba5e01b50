package ewald

import (
	"fmt"
	"testing"

	"enthalpath/thermo/crystal"
)

func TestProbeSmall(t *testing.T) {
	for _, name := range []string{"rock-salt", "caesium-chloride", "fluorite", "zinc-blende", "rutile", "wurtzite", "perovskite"} {
		c, err := crystal.Build(name, nil)
		if err != nil {
			continue
		}
		r, _ := Sum(c, Options{})
		g, _ := Sum(c, Options{general: true})
		t.Logf("%s n=%d alpha=%.4f rc=%.3f kc=%.3f real=%d recip=%d  general alpha=%.4f real=%d recip=%d  dE=%.3g", name, len(c.Sites), r.Alpha, r.RealCutoff, r.RecipCutoff, r.RealTerms, r.RecipTerms, g.Alpha, g.RealTerms, g.RecipTerms, (r.EnergyEV-g.EnergyEV)/g.EnergyEV)
	}
}

func BenchmarkProbeAlpha(b *testing.B) {
	c, _ := crystal.Build("rock-salt", nil)
	base := smallAlpha(2, c.Volume()/4)
	for _, f := range []float64{0.8, 0.9, 1.0, 1.1, 1.2, 1.35, 1.5} {
		b.Run(fmt.Sprintf("f=%.2f", f), func(b *testing.B) {
			for i := 0; i < b.N; i++ {
				Sum(c, Options{alpha: base * f})
			}
		})
	}
}
