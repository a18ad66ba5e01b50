package data

import (
	"bufio"
	"os"
	"strconv"
	"strings"
	"testing"
)

// Every species of heat_capacities.csv reads, its intervals follow one
// another, and each interval is at its locator in the vendored thermo.inp
// (NASA Glenn, data/sources/nasa-cea-thermo): the locator's line starts
// with the interval's bounds as the source prints them.
func TestHeatCapacitiesAtTheirLocators(t *testing.T) {
	tb, err := mustLoad(t).HeatCapacities()
	if err != nil {
		t.Fatal(err)
	}
	f, err := os.Open("sources/nasa-cea-thermo/thermo.inp")
	if err != nil {
		t.Fatal(err)
	}
	defer f.Close()
	var lines []string
	sc := bufio.NewScanner(f)
	for sc.Scan() {
		lines = append(lines, sc.Text())
	}
	if tb.Len() < 700 {
		t.Errorf("%d species", tb.Len())
	}
	rows := 0
	for _, key := range tb.Keys() {
		ivs, ok, err := tb.Species(key)
		if err != nil || !ok || len(ivs) == 0 {
			t.Errorf("%s: %v", key, err)
			continue
		}
		for _, iv := range ivs {
			rows++
			file, num, _ := strings.Cut(iv.Locator, ":")
			n, err := strconv.Atoi(num)
			if iv.Source != "nasa-glenn" || file != "nasa-cea-thermo/thermo.inp" || err != nil || n < 1 || n > len(lines) {
				t.Errorf("%s: source %s, locator %s", key, iv.Source, iv.Locator)
				continue
			}
			fields := strings.Fields(lines[n-1])
			if len(fields) < 2 {
				t.Errorf("%s: %s is not an interval line", key, iv.Locator)
				continue
			}
			lo, _ := strconv.ParseFloat(fields[0], 64)
			hi, _ := strconv.ParseFloat(strings.TrimSuffix(fields[1], "7"), 64) // the interval's bound runs into the count of exponents (7)
			if lo != iv.TLow || hi != iv.THigh {
				t.Errorf("%s: %g–%g K, %s reads %q", key, iv.TLow, iv.THigh, iv.Locator, lines[n-1][:22])
			}
		}
	}
	t.Logf("%d species, %d intervals", tb.Len(), rows)
	if _, ok, err := tb.Species("no such species(g)"); ok || err != nil {
		t.Errorf("an unknown species: %v, %v", ok, err)
	}
}
