package lattice

import (
	"strings"
	"testing"
)

// TestParamErrorWords: a message names the quantity as a user knows it and
// never the Go function or argument that refused it (QA report: "BornExponent:
// configs[0] = \"\"" reached the command line).
func TestParamErrorWords(t *testing.T) {
	_, errEmpty := BornExponent("", "Ar")
	_, errRn := BornExponent("Ne", "Rn")
	_, errRho := BornMayer(pairNaCl, 3)
	_, errKnown := KapustinskiiRadius(-786, 2, 1, -1, 5)
	cases := []struct {
		err    error
		want   []string
		banned []string
	}{
		{errEmpty, []string{"electron configuration of the first ion", "none given", "give n yourself"}, []string{"BornExponent", "configs[", `""`}},
		{errRn, []string{`electron configuration of the second ion = "Rn"`, "use He, Ne"}, []string{"BornExponent", "PaulingExponent", "configs["}},
		{errRho, []string{"Born–Mayer range ρ = 3"}, []string{"BornMayer:", "rho ="}},
		{errKnown, []string{"radius of the other ion = 5"}, []string{"KapustinskiiRadius", "known ="}},
	}
	for _, c := range cases {
		if c.err == nil {
			t.Errorf("no error, want one saying %q", c.want)
			continue
		}
		msg := c.err.Error()
		for _, w := range c.want {
			if !strings.Contains(msg, w) {
				t.Errorf("%q lacks %q", msg, w)
			}
		}
		for _, b := range c.banned {
			if strings.Contains(msg, b) {
				t.Errorf("%q shows the Go name %q", msg, b)
			}
		}
	}
}
