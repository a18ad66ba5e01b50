package main

import (
	"bufio"
	"fmt"
	"os"
	"path/filepath"
	"strings"
)

// crcRow is one line of the CRC table of physical constants of inorganic
// compounds (crc-inorganic/): the compound's name and its density as the
// file prints it, in kg/m³.
type crcRow struct {
	line int
	name string
	rho  string
}

// readCRCInorganic reads the vendored CRC table (tab-separated: CAS,
// Chemical, Tm, Tb, rho), keyed by crcKey of the name. A name printed on
// more than one line is ambiguous and left out of the map.
func readCRCInorganic(dir string) (map[string]crcRow, error) {
	f, err := os.Open(filepath.Join(dir, crcInorganicFile))
	if err != nil {
		return nil, err
	}
	defer f.Close()
	out := map[string]crcRow{}
	twice := map[string]bool{}
	sc := bufio.NewScanner(f)
	n := 0
	for sc.Scan() {
		n++
		cells := strings.Split(sc.Text(), "\t")
		if n == 1 {
			if len(cells) < 5 || cells[1] != "Chemical" || cells[4] != "rho" {
				return nil, fmt.Errorf("%s: unexpected header %q", crcInorganicFile, sc.Text())
			}
			continue
		}
		if len(cells) < 5 {
			continue
		}
		key := crcKey(cells[1])
		if _, dup := out[key]; dup || twice[key] {
			twice[key] = true
			delete(out, key)
			continue
		}
		out[key] = crcRow{line: n, name: cells[1], rho: strings.TrimSpace(cells[4])}
	}
	return out, sc.Err()
}

// crcKey normalises a compound name for matching our names with the CRC's:
// lower case, American spellings (cesium, aluminum), "hydrogen" written
// apart ("hydrogencarbonate" → "hydrogen carbonate"), silver named with its
// charge as the CRC does ("silver chloride" → "silver(i) chloride").
func crcKey(name string) string {
	k := strings.ToLower(strings.TrimSpace(name))
	k = strings.NewReplacer("caesium", "cesium", "aluminium", "aluminum", "sulphate", "sulfate", "sulphide", "sulfide",
		"hydrogendifluoride", "hydrogen fluoride", "hydrogen", "hydrogen ").Replace(k)
	k = strings.ReplaceAll(k, "hydrogen  ", "hydrogen ")
	if strings.HasPrefix(k, "silver ") {
		k = "silver(i) " + strings.TrimPrefix(k, "silver ")
	}
	return strings.Join(strings.Fields(k), " ")
}

// crcDensity looks a compound up in the CRC table, by the name a crcname
// choice gives for its formula or else by its own name, and returns its
// density in g/cm³ (the printed kg/m³ with the decimal point moved three
// places: no rounding) and the locator of the line.
func (g *generator) crcDensity(formula, name string) (density, loc string, ok bool) {
	if g.crc == nil {
		return "", "", false
	}
	key := crcKey(name)
	if ch, chosen := g.choices.get("crcname", formula); chosen {
		key = crcKey(ch.value)
	}
	r, found := g.crc[key]
	if !found || r.rho == "" {
		return "", "", false
	}
	d, ok := shiftDecimal(r.rho, 3)
	if !ok {
		return "", "", false
	}
	return d, locator(crcInorganicFile, r.line), true
}

// shiftDecimal divides a plain decimal number written as a string by 10^k
// by moving its decimal point, so that no binary rounding enters.
func shiftDecimal(s string, k int) (string, bool) {
	intPart, frac, _ := strings.Cut(s, ".")
	if intPart == "" || strings.Trim(intPart+frac, "0123456789") != "" {
		return "", false
	}
	for len(intPart) <= k {
		intPart = "0" + intPart
	}
	cut := len(intPart) - k
	out := strings.TrimLeft(intPart[:cut], "0")
	if out == "" {
		out = "0"
	}
	if f := strings.TrimRight(intPart[cut:]+frac, "0"); f != "" {
		out += "." + f
	}
	return out, true
}
