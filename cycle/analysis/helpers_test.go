package analysis

import (
	"math"
	"sync"
	"testing"

	"enthalpath/data"
)

var (
	testOnce sync.Once
	testDB   *data.DB
	testErr  error
)

// testAnalyst returns an Analyst over the built-in data (loaded once).
func testAnalyst(t testing.TB) *Analyst {
	t.Helper()
	testOnce.Do(func() { testDB, testErr = data.Load() })
	if testErr != nil {
		t.Fatalf("data.Load: %v", testErr)
	}
	return New(testDB)
}

func near(got, want, tol float64) bool { return math.Abs(got-want) <= tol }
