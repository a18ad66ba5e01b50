package cli

import (
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"io/fs"
	"math"
	"path/filepath"
	"strconv"
	"strings"
	"syscall"
	"unicode/utf8"

	"enthalpath/thermo"
	"enthalpath/thermo/fileio"
)

// outputFileError words a failure to write the file a flag names: what the
// user can fix (a folder that does not exist, a name taken by a folder, a
// link or a device, a name too long, no permission) is a usage error naming
// the flag; anything else (a full disk) stays an internal error.
func outputFileError(flag, path string, err error) error {
	var notRegular *fileio.NotRegularError
	var name *fileio.NameError
	switch {
	case errors.As(err, &notRegular):
		return Usagef("%s %s: it is %s, not a regular file; it is not replaced: give another file name", flag, path, notRegular.Kind)
	case errors.As(err, &name):
		return Usagef("%s %s: %v", flag, path, err)
	case errors.Is(err, fs.ErrNotExist):
		return Usagef("%s %s: the folder %s does not exist; create it first or give another path", flag, path, filepath.Dir(path))
	case errors.Is(err, fs.ErrPermission):
		return Usagef("%s %s: permission denied; give a path you may write", flag, path)
	case errors.Is(err, syscall.ENOTDIR):
		return Usagef("%s %s: a part of the path is a file, not a folder; give another path", flag, path)
	}
	return fmt.Errorf("%s %s: %w", flag, path, err)
}

// energy formats a value in kJ/mol in unit u with a sensible precision.
func energy(kj float64, u thermo.Unit) string {
	if math.IsNaN(kj) {
		return "—"
	}
	v := thermo.FromKJPerMol(kj, u)
	prec := 1
	if u == thermo.EVPerFormulaUnit {
		prec = 3
	}
	return strings.Replace(fmt.Sprintf("%.*f", prec, v), "-", "−", 1)
}

// energyPM formats value ± uncertainty in unit u, both rounded by the one
// rule of thermo.UncertaintyDecimals; without an uncertainty, as energy.
func energyPM(kj, unc float64, u thermo.Unit) string {
	if math.IsNaN(kj) || !(unc > 0) {
		return energy(kj, u)
	}
	return plusMinus(thermo.FromKJPerMol(kj, u), thermo.FromKJPerMol(unc, u))
}

// plusMinus writes "v ± u" by the rule of thermo.UncertaintyDecimals, with
// a typographic minus; without an uncertainty, v to six significant figures.
func plusMinus(v, u float64) string {
	value, unc := thermo.FormatWithUncertainty(v, u, 0)
	if unc == "" {
		return strings.Replace(strconv.FormatFloat(v, 'g', 6, 64), "-", "−", 1)
	}
	return strings.Replace(value, "-", "−", 1) + " ± " + unc
}

// percent formats a percentage with its sign.
func percent(p float64) string {
	if math.IsNaN(p) {
		return "—"
	}
	return strings.Replace(fmt.Sprintf("%+.1f %%", p), "-", "−", 1)
}

// table lays out rows in columns padded by rune count; right lists the
// columns to right-align.
type table struct {
	head  []string
	rows  [][]string
	right map[int]bool
}

func (t *table) add(cells ...string) { t.rows = append(t.rows, cells) }

func (t *table) write(w io.Writer, indent string) {
	widths := make([]int, len(t.head))
	all := append([][]string{t.head}, t.rows...)
	for _, r := range all {
		for i, c := range r {
			if i < len(widths) {
				widths[i] = max(widths[i], utf8.RuneCountInString(c))
			}
		}
	}
	for k, r := range all {
		var b strings.Builder
		b.WriteString(indent)
		for i, c := range r {
			if i >= len(widths) {
				break
			}
			pad := strings.Repeat(" ", widths[i]-utf8.RuneCountInString(c))
			if t.right[i] {
				b.WriteString(pad + c)
			} else if i == len(r)-1 {
				b.WriteString(c)
			} else {
				b.WriteString(c + pad)
			}
			if i < len(r)-1 {
				b.WriteString("  ")
			}
		}
		fmt.Fprintln(w, strings.TrimRight(b.String(), " "))
		if k == 0 {
			var u strings.Builder
			u.WriteString(indent)
			for i := range widths {
				u.WriteString(strings.Repeat("─", widths[i]))
				if i < len(widths)-1 {
					u.WriteString("  ")
				}
			}
			fmt.Fprintln(w, u.String())
		}
	}
}

// writeJSON writes v as indented JSON with a final newline.
func writeJSON(w io.Writer, v any) error {
	enc := json.NewEncoder(w)
	enc.SetIndent("", "  ")
	enc.SetEscapeHTML(false)
	return enc.Encode(v)
}

// jsonNumber is a float that encodes NaN and infinities as null.
type jsonNumber float64

func (n jsonNumber) MarshalJSON() ([]byte, error) {
	f := float64(n)
	if math.IsNaN(f) || math.IsInf(f, 0) {
		return []byte("null"), nil
	}
	return json.Marshal(math.Round(f*1e6) / 1e6)
}

// wrapText wraps s at width runes with the given indent on continuation lines.
func wrapText(s string, width int, indent string) string {
	words := strings.Fields(s)
	var b strings.Builder
	line := 0
	for i, wd := range words {
		n := utf8.RuneCountInString(wd)
		if i > 0 && line+1+n > width {
			b.WriteString("\n" + indent)
			line = utf8.RuneCountInString(indent)
		} else if i > 0 {
			b.WriteString(" ")
			line++
		}
		b.WriteString(wd)
		line += n
	}
	return b.String()
}

type thermoUnit = thermo.Unit

// parseUnitOrKJ reads a unit key, kJ/mol when it cannot.
func parseUnitOrKJ(s string) (thermo.Unit, error) {
	u, err := thermo.ParseUnit(s)
	if err != nil {
		return thermo.KJPerMol, err
	}
	return u, nil
}
