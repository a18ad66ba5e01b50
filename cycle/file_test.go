package cycle

import (
	"errors"
	"os"
	"path/filepath"
	"strings"
	"testing"
)

// A cycle survives Marshal → Unmarshal with its user values, unknown,
// conventions and settings, and marshals to the same bytes again.
func TestFileRoundTrip(t *testing.T) {
	db := loadDB(t)
	c := build(t, "MgO", Options{Conventions: Conventions{Lattice: LatticeEnergy, Ionization: Enthalpies298}})
	if err := c.Set("attachment-2", 744, 20); err != nil {
		t.Fatal(err)
	}
	c.Settings.LatticeFrom = ModelEwald
	c.Settings.Rho = 0.33
	c.Settings.BornExponent = 7.5
	c.Settings.Radius = RadiusCrystal
	c.Settings.CationCN, c.Settings.AnionCN = 6, 6
	c.Settings.Distance, c.Settings.D0 = DistanceUser, 2.106
	c.Settings.Structure = Structure{Prototype: "rock-salt", Params: map[string]float64{"a": 4.2}}
	c.Note = "invented scenario: round-trip test"
	if err := c.SolveFor("formation"); err != nil {
		t.Fatal(err)
	}
	b, err := Marshal(c)
	if err != nil {
		t.Fatal(err)
	}
	d, err := Unmarshal(db, b)
	if err != nil {
		t.Fatalf("Unmarshal: %v\n%s", err, b)
	}
	if d.Conventions != c.Conventions || d.Settings.Rho != 0.33 || d.Settings.BornExponent != 7.5 || d.Settings.Radius != RadiusCrystal ||
		d.Settings.D0 != 2.106 || d.Settings.Distance != DistanceUser || d.Settings.LatticeFrom != ModelEwald ||
		d.Settings.Structure.Params["a"] != 4.2 || d.Note != c.Note {
		t.Errorf("settings changed in the round trip: %+v %+v", d.Conventions, d.Settings)
	}
	for i := range c.Steps {
		a, z := c.Steps[i], d.Steps[i]
		if a.Key != z.Key || !near(a.Value, z.Value, 1e-9) || a.Uncertainty != z.Uncertainty || a.Unknown != z.Unknown || a.Source.Kind != z.Source.Kind {
			t.Errorf("step %s: %+v became %+v", a.Key, a, z)
		}
	}
	b2, err := Marshal(d)
	if err != nil {
		t.Fatal(err)
	}
	if string(b) != string(b2) {
		t.Errorf("second Marshal differs:\n%s\n---\n%s", b, b2)
	}
	r1, err1 := Solve(c)
	r2, err2 := Solve(d)
	if err1 != nil || err2 != nil || !near(r1.Solved.Value, r2.Solved.Value, 1e-9) {
		t.Errorf("solved values differ: %v %v", err1, err2)
	}
}

// Save writes atomically: the file appears complete, replaces an older
// one, and leaves no temporary file behind; Open reads it back.
func TestSaveAtomicAndOpen(t *testing.T) {
	dir := t.TempDir()
	path := filepath.Join(dir, "nacl"+FileExtension)
	if err := os.WriteFile(path, []byte("old content"), 0o644); err != nil {
		t.Fatal(err)
	}
	c := build(t, "NaCl", Options{})
	c.Set("formation", -411.0, 0.5)
	if err := Save(path, c); err != nil {
		t.Fatal(err)
	}
	entries, _ := os.ReadDir(dir)
	if len(entries) != 1 {
		t.Errorf("files left in the folder: %v", entries)
	}
	d, err := Open(loadDB(t), path)
	if err != nil {
		t.Fatal(err)
	}
	if s, _ := d.Step("formation"); s.Value != -411.0 || s.Source.Kind != SourceUser || !s.Source.Override {
		t.Errorf("formation after Open: %+v", s)
	}
	if err := Save(filepath.Join(dir, "missing-folder", "x.hesscycle"), c); err == nil {
		t.Errorf("saving into a missing folder should fail")
	}
	if _, err := Open(loadDB(t), filepath.Join(dir, "absent.hesscycle")); !errors.Is(err, ErrBadFile) {
		t.Errorf("opening a missing file: %v", err)
	}
}

// Malformed files give errors with the line and the field.
func TestFileErrors(t *testing.T) {
	db := loadDB(t)
	good, err := Marshal(build(t, "NaCl", Options{}))
	if err != nil {
		t.Fatal(err)
	}
	lines := strings.Split(string(good), "\n")
	lineOf := func(prefix string, nth int) int {
		n := 0
		for i, l := range lines {
			if strings.HasPrefix(l, prefix) {
				if n == nth {
					return i + 1
				}
				n++
			}
		}
		t.Fatalf("no line %q", prefix)
		return 0
	}
	replace := func(prefix string, nth int, with string) string {
		out := append([]string(nil), lines...)
		out[lineOf(prefix, nth)-1] = with
		return strings.Join(out, "\n")
	}
	for _, tc := range []struct {
		name, text, field string
		line              int
	}{
		{"format", replace("format", 0, `format = "something-else"`), "format", lineOf("format", 0)},
		{"version", replace("version", 0, `version = 99`), "version", lineOf("version", 0)},
		{"step key", replace("key = ", 2, `key = "ionisation-9"`), "step[3].key", lineOf("key = ", 2)},
		{"source kind", replace("source = ", 1, `source = "guess"`), "step[2].source", lineOf("source = ", 1)},
		{"lattice convention", replace("lattice = ", 0, `lattice = "sideways"`), "conventions.lattice", lineOf("lattice = ", 0)},
		{"radius", replace("radius = ", 0, `radius = "huge"`), "models.radius", lineOf("radius = ", 0)},
		{"unknown field", replace("compound", 0, "compound = \"NaCl\"\ncolour = \"blue\""), "colour", lineOf("compound", 0) + 1},
		{"syntax", replace("value = ", 0, `value = 12..5`), "", lineOf("value = ", 0)},
		{"type", replace("value = ", 1, `value = "twelve"`), "", lineOf("value = ", 1)},
	} {
		_, err := Unmarshal(db, []byte(tc.text))
		var fe *FileError
		if !errors.As(err, &fe) {
			t.Errorf("%s: error %v, want a *FileError", tc.name, err)
			continue
		}
		if fe.Line != tc.line || (tc.field != "" && fe.Field != tc.field) {
			t.Errorf("%s: line %d field %q (%v), want line %d field %q", tc.name, fe.Line, fe.Field, err, tc.line, tc.field)
		}
	}
	if _, err := Unmarshal(db, []byte(strings.Repeat("#", MaxFileSize+1))); !errors.Is(err, ErrBadFile) {
		t.Errorf("oversized file: %v", err)
	}
}

// The example files in testdata/cycle open, and solve or report why not.
func TestExampleFiles(t *testing.T) {
	files, _ := filepath.Glob("../testdata/cycle/*" + FileExtension)
	if len(files) == 0 {
		t.Fatal("no example cycle files in testdata/cycle")
	}
	for _, f := range files {
		c, err := Open(loadDB(t), f)
		if err != nil {
			t.Errorf("%s: %v", f, err)
			continue
		}
		if !strings.Contains(strings.ToLower(c.Note), "invented") {
			t.Errorf("%s: the note should mark the scenario as invented", f)
		}
		if c.Settings.Structure.CIF != "" {
			continue // the caller reads the CIF
		}
		if _, err := Solve(c); err != nil {
			t.Errorf("%s: %v", f, err)
		}
	}
}

func FuzzUnmarshal(f *testing.F) {
	db := loadDB(f)
	for _, formula := range []string{"NaCl", "MgO", "NH4Cl", "CaF2"} {
		c, err := Build(db, formula, Options{})
		if err != nil {
			f.Fatal(err)
		}
		b, _ := Marshal(c)
		f.Add(b)
	}
	f.Add([]byte("format = \"enthalpath-cycle\"\nversion = 1\ncompound = \"KBr\"\n[[step]]\nkey = \"lattice\"\nsource = \"user\"\nvalue = -1e308\n"))
	f.Add([]byte("[[step]]\n[[step]]\nkey=1"))
	memo := NewMemo() // one memo: the fuzzer should spend its time in the reader
	f.Fuzz(func(t *testing.T, b []byte) {
		c, err := Unmarshal(db, b)
		if err != nil {
			var fe *FileError
			if !errors.As(err, &fe) {
				t.Fatalf("error is not a *FileError: %T %v", err, err)
			}
			return
		}
		if _, err := Marshal(c); err != nil {
			t.Fatalf("a file that reads cannot be written: %v", err)
		}
		c.SetMemo(memo)
		Solve(c)
	})
}

// TestHostileCycleFilesRefusedEarly: a cycle file with more [[step]]
// tables than a cycle has (13,000 in 1 MiB once took 111 s and 14.6 GB),
// with a step given twice, or nested past the limit is refused with its
// line.
func TestHostileCycleFilesRefusedEarly(t *testing.T) {
	db := loadDB(t)
	head := "format = \"enthalpath-cycle\"\nversion = 1\ncompound = \"NaCl\"\n"
	step := "[[step]]\nkey = \"ionization-1\"\nvalue = 500.0\nuncertainty = 1.0\nsource = \"user\"\n"
	for _, tc := range []struct {
		name, text, want string
	}{
		{"too many steps", head + strings.Repeat(step, maxFileSteps+1), "more than 64 steps"},
		{"a step twice", head + step + step, `step "ionization-1" is given twice (first as step[1])`},
		{"nested too deep", head + "note = " + strings.Repeat("[", 40) + "\n", ":4: arrays or inline tables nested more than 8 deep"},
	} {
		_, err := Unmarshal(db, []byte(tc.text))
		if !errors.Is(err, ErrBadFile) || !strings.Contains(err.Error(), tc.want) {
			t.Errorf("%s: err = %v, want %q", tc.name, err, tc.want)
		}
	}
}
