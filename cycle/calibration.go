package cycle

import (
	"bytes"
	"encoding/csv"
	"fmt"
	"io"
	"strconv"
	"strings"

	"enthalpath/data"
)

// The built-in calibration: the validation of the models over the built-in
// compounds (Validate) written once as data/tables/model_calibration.csv by
// go run ./cycle/calibgen, so that a solve reads each model's σ, the
// verdict's thresholds and the verdict's model per family from the table
// instead of solving every compound first. A test and .ci/run check that
// the table equals a live validation.

// calibrationFamilyAll is the family of a model's row over every family.
const calibrationFamilyAll = "all"

// calibrationDigits is the decimals of the percentages in the table: 1e-6
// percentage points, so that the σ and thresholds, quoted to a tenth or a
// hundredth, read as a live validation's short of a chance in 10⁴ per value
// of the last digit falling on the other side, and far above the Ewald
// sums' 1e-8 and the last bits a platform may round differently.
const calibrationDigits = 6

// WriteCalibration writes v as the calibration table: per model, a row per
// family and one over all of them, with the σ a compound of the family
// gets (Validation.Sigma), the verdict's thresholds (Validation.Thresholds)
// and the family's verdict model where the extended model cannot be
// evaluated (Validation.Reference). The output depends on v only.
func WriteCalibration(w io.Writer, v *Validation) error {
	fmt.Fprintln(w, "# The lattice models against the cycles of the built-in compounds that close (default settings, ΔH_L")
	fmt.Fprintln(w, "# at 298.15 K). Written by go run ./cycle/calibgen (do not edit: .ci/run regenerates and compares).")
	fmt.Fprintln(w, "# gap = 100*(cycle - model)/|model|, negative when the cycle binds more; n, mean, RMS and largest |gap|")
	fmt.Fprintln(w, "# per model and family. sigma_percent: the model's relative sigma for a compound of the family (its RMS")
	fmt.Fprintln(w, "# over the family from 5 compounds, else over sigma_over); verdict_*: the model's verdict thresholds")
	fmt.Fprintf(w, "# (%g and %g sigma of its RMS over the %s); family_verdict_model: the model a compound of the\n", AdequateSigmas, SubstantialSigmas, IonicFamily)
	fmt.Fprintln(w, "# family is judged against where the extended model cannot be evaluated. The engine reads the counts,")
	fmt.Fprintln(w, "# means, RMS and largest gaps and derives the rest by the same rules; the other columns are for reading.")
	cw := csv.NewWriter(w)
	if err := cw.Write([]string{"model", "family", "n", "mean_gap_percent", "rms_gap_percent", "largest_gap_percent",
		"largest_gap_compound", "sigma_percent", "sigma_over", "verdict_adequate_percent", "verdict_substantial_percent",
		"family_verdict_model", "compounds_closing"}); err != nil {
		return err
	}
	pct := func(x float64) string { return strconv.FormatFloat(x, 'f', calibrationDigits, 64) }
	noExtended := func(name string) bool { return name != ModelExtended && v.Model(name) != nil }
	for _, m := range v.Models {
		th, _ := v.Thresholds(m.Model)
		rows := append(append([]FamilyStats(nil), m.Families...), m.All)
		for i, f := range rows {
			rec := []string{m.Model, f.Family, strconv.Itoa(f.N), "", "", "", f.Worst, "", "", pct(th.Adequate), pct(th.Substantial), "",
				strconv.Itoa(v.Compounds)}
			if f.N > 0 {
				rec[3], rec[4], rec[5] = pct(f.MeanPercent), pct(f.RMSPercent), pct(f.MaxPercent)
			}
			if i < len(m.Families) {
				if s := v.SigmaStats(m.Model, f.Family); s.N > 0 {
					rec[7], rec[8] = pct(s.RMSPercent), s.Family
				}
				rec[11], _ = v.Reference(f.Family, noExtended)
			}
			if err := cw.Write(rec); err != nil {
				return err
			}
		}
	}
	cw.Flush()
	return cw.Error()
}

// CalibrationText is WriteCalibration's output for v.
func CalibrationText(v *Validation) []byte {
	var b bytes.Buffer
	if err := WriteCalibration(&b, v); err != nil {
		panic(err) // a bytes.Buffer does not fail
	}
	return b.Bytes()
}

// validationOf returns the validation the built-in calibration holds
// (without the lists of compounds left out, which only a live Validate
// has), with note added to every σ's and threshold's basis; an error if
// the table does not fit the models and families of this program.
func validationOf(cal *data.Calibration, note string) (*Validation, error) {
	v := &Validation{Compounds: cal.Compounds, Builtin: true, note: note}
	families := ValidationFamilies()
	for _, name := range ModelNames() {
		mv := ModelValidation{Model: name}
		for _, fam := range append(families, calibrationFamilyAll) {
			i := -1
			for k, r := range cal.Rows {
				if r.Model == name && r.Family == fam {
					i = k
					break
				}
			}
			if i < 0 {
				return nil, fmt.Errorf("%s: no row for the %s model over %s", data.CalibrationFile, name, fam)
			}
			r := cal.Rows[i]
			s := FamilyStats{Family: fam, N: r.N, MeanPercent: r.MeanPercent, RMSPercent: r.RMSPercent, MaxPercent: r.MaxPercent, Worst: r.Worst}
			if fam == calibrationFamilyAll {
				mv.All = s
			} else {
				mv.Families = append(mv.Families, s)
			}
		}
		v.Models = append(v.Models, mv)
	}
	if want := len(ModelNames()) * (len(families) + 1); len(cal.Rows) != want {
		return nil, fmt.Errorf("%s: %d rows, want %d (%d models × %d families and all)", data.CalibrationFile, len(cal.Rows), want,
			len(ModelNames()), len(families))
	}
	v.index()
	return v, nil
}

// overlayNote words, for the σ and thresholds of data with overlays, that
// the calibration is the built-in data's.
func overlayNote(overlays []string) string {
	if len(overlays) == 0 {
		return ""
	}
	return "; calibrated on the built-in data, not on the data overlay " + strings.Join(overlays, ", ")
}

// MatchesBuiltinCalibration reports whether the built-in calibration is
// what v, a live validation, writes (byte for byte, at the table's
// rounding).
func MatchesBuiltinCalibration(v *Validation) (bool, error) {
	cal, err := data.ModelCalibration()
	if err != nil {
		return false, err
	}
	return bytes.Equal(cal.Text, CalibrationText(v)), nil
}
