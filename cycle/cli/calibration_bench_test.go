package cli

import (
	"io"
	"testing"
)

// BenchmarkCycleNaCl is the whole `enthalpath cycle NaCl` path in-process:
// loading the data, building and solving the cycle, every model, the
// verdict (its σ and thresholds from the built-in calibration) and the
// text. The data and the validation are not shared between iterations.
func BenchmarkCycleNaCl(b *testing.B) {
	env := Env{Stdout: io.Discard, Stderr: io.Discard}
	b.ReportAllocs()
	for b.Loop() {
		if code := Run(env, "cycle", []string{"NaCl"}); code != ExitOK {
			b.Fatalf("exit %d", code)
		}
	}
}
