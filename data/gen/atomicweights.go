package main

// Standard atomic weights: the IUPAC 2016 table as Debian's python3-ase
// ships it (atomic-weights/ase_data_init.py, array
// atomic_masses_iupac2016), compared with the NIST compilation of 2001 as
// Debian's python3-periodictable ships it (atomic-weights/periodictable_mass.py).

import (
	"bufio"
	"fmt"
	"os"
	"path/filepath"
	"strconv"
	"strings"
)

// iupacWeight is one line of ASE's atomic_masses_iupac2016 array:
// "    1.008,  # H [1.00784, 1.00811]" or "    97.90721,  # 98Tc".
type iupacWeight struct {
	line     int
	symbol   string
	value    string // as printed
	interval string // "[1.00784, 1.00811]" where the value is the conventional one of an interval
	isotope  string // "98" where the value is the mass of that isotope (no stable isotope)
}

// nistWeight is the element's weight as periodictable's table prints it
// on the first line of the element: "1.00794(7)", or "[98]" for an element
// without a stable isotope.
type nistWeight struct {
	line  int
	value string
}

// readIUPACWeights reads the atomic_masses_iupac2016 array of the vendored
// ASE file, element by element (the placeholder X of index 0 left out).
func readIUPACWeights(dir string) ([]iupacWeight, error) {
	f, err := os.Open(filepath.Join(dir, asePeriodicFile))
	if err != nil {
		return nil, err
	}
	defer f.Close()
	var out []iupacWeight
	in := false
	sc := bufio.NewScanner(f)
	for n := 1; sc.Scan(); n++ {
		text := sc.Text()
		switch {
		case strings.HasPrefix(text, "atomic_masses_iupac2016 = np.array(["):
			in = true
			continue
		case !in:
			continue
		case strings.HasPrefix(text, "])"):
			if len(out) == 0 {
				return nil, fmt.Errorf("%s: atomic_masses_iupac2016 is empty", asePeriodicFile)
			}
			return out, nil
		}
		value, comment, ok := strings.Cut(text, "#")
		value = strings.TrimSuffix(strings.TrimSpace(value), ",")
		if _, err := strconv.ParseFloat(value, 64); !ok || err != nil {
			return nil, fmt.Errorf("%s:%d: %q is not a weight and its symbol", asePeriodicFile, n, text)
		}
		label, interval, _ := strings.Cut(strings.TrimSpace(comment), " ")
		w := iupacWeight{line: n, value: value, interval: strings.TrimSpace(interval)}
		w.symbol = strings.TrimLeft(label, "0123456789")
		w.isotope = label[:len(label)-len(w.symbol)]
		if w.symbol == "X" {
			continue
		}
		out = append(out, w)
	}
	if err := sc.Err(); err != nil {
		return nil, err
	}
	return nil, fmt.Errorf("%s: no atomic_masses_iupac2016 array", asePeriodicFile)
}

// readNISTWeights reads the element weights of the vendored periodictable
// table ("1-H-1,1.0078250321(4),99.9885(70),1.00794(7)": Z, symbol, mass
// number, isotope mass, abundance, element weight), by symbol.
func readNISTWeights(dir string) (map[string]nistWeight, error) {
	f, err := os.Open(filepath.Join(dir, nistPeriodicFile))
	if err != nil {
		return nil, err
	}
	defer f.Close()
	out := map[string]nistWeight{}
	sc := bufio.NewScanner(f)
	for n := 1; sc.Scan(); n++ {
		cells := strings.Split(sc.Text(), ",")
		id := strings.Split(cells[0], "-")
		if len(cells) != 4 || len(id) != 3 {
			continue
		}
		if _, err := strconv.Atoi(id[0]); err != nil {
			continue
		}
		if _, seen := out[id[1]]; !seen && cells[3] != "" {
			out[id[1]] = nistWeight{line: n, value: cells[3]}
		}
	}
	return out, sc.Err()
}

// nistValue is the number of a periodictable weight ("1.00794(7)" →
// 1.00794; "[98]" → 98).
func nistValue(s string) (float64, bool) {
	s = strings.Trim(s, "[]")
	if i := strings.IndexByte(s, '('); i >= 0 {
		s = s[:i]
	}
	v, err := strconv.ParseFloat(s, 64)
	return v, err == nil
}

// weightNote says what the IUPAC value is (standard weight, conventional
// value of an interval, mass of an isotope), that no uncertainty comes
// with it, and where the NIST 2001 compilation prints another number.
func weightNote(w iupacWeight, nist nistWeight, hasNIST bool) string {
	var note string
	switch {
	case w.interval != "":
		note = "conventional value of the interval " + w.interval + " (Meija et al. 2016, Table 3)"
	case w.isotope != "":
		note = "mass of " + w.isotope + w.symbol + ", the longest-lived isotope: no stable isotope, no standard atomic weight"
	default:
		note = "standard atomic weight; its uncertainty is not given in the vendored copy"
	}
	v, _ := strconv.ParseFloat(w.value, 64)
	if n, ok := nistValue(nist.value); hasNIST && ok && n != v {
		note += fmt.Sprintf("; NIST 2001 compilation (%s:%d) prints %s", nistPeriodicFile, nist.line, nist.value)
	}
	return note
}

// readAtomicWeights reads the vendored IUPAC 2016 weights by symbol, for
// the X-ray densities.
func readAtomicWeights(sourcesDir string) (map[string]float64, error) {
	rows, err := readIUPACWeights(sourcesDir)
	if err != nil {
		return nil, err
	}
	out := make(map[string]float64, len(rows))
	for _, r := range rows {
		if w, err := strconv.ParseFloat(r.value, 64); err == nil {
			out[r.symbol] = w
		}
	}
	return out, nil
}
