package modelpanel

import (
	"math"
	"os"
	"path/filepath"
	"strconv"
	"strings"
	"testing"

	"enthalpath/cycle"
	"enthalpath/tui/internal/drive"
	"enthalpath/tui/session"
)

func setup(t *testing.T, formula string) (*drive.Fixture, *Model, drive.Updater) {
	t.Helper()
	f := drive.NewFixture(t, t.TempDir())
	m := New(f.Ctx, f.Session)
	m.SetSize(120, 37)
	f.Open(t, m, formula)
	return f, m, f.Screen(m)
}

func row(t *testing.T, m *Model, name string) int {
	t.Helper()
	for i, n := range m.SettingNames() {
		if strings.HasPrefix(n, name) {
			return i
		}
	}
	t.Fatalf("no setting %q in %v", name, m.SettingNames())
	return 0
}

func moveTo(t *testing.T, m *Model, u drive.Updater, name string) {
	t.Helper()
	for m.Cursor() > 0 {
		drive.Run(u, drive.Key("k"))
	}
	for range row(t, m, name) {
		drive.Run(u, drive.Key("j"))
	}
}

func TestEveryModelBesideTheCycle(t *testing.T) {
	f, m, _ := setup(t, "NaCl")
	res := f.Session.Solved()
	v := m.View()
	for _, mr := range res.Models {
		if !strings.Contains(v, mr.Model) {
			t.Errorf("model %s not listed", mr.Model)
		}
		if mr.OK() && !strings.Contains(v, f.Ctx.Signed(mr.Value)) {
			t.Errorf("model %s value %s not shown", mr.Model, f.Ctx.Signed(mr.Value))
		}
		if mr.OK() && !strings.Contains(v, mr.Verdict.Character.String()) {
			t.Errorf("verdict of %s not shown in words", mr.Model)
		}
	}
	// Rock salt: Madelung constant 1.747565 referred to the nearest
	// cation–anion distance (Madelung 1918; CRC Handbook table of Madelung
	// constants, from memory).
	if !strings.Contains(v, "A = 1.7475") {
		t.Errorf("Ewald Madelung constant of rock salt not shown:\n%s", v)
	}
	// The verdict is read against one model, with thresholds from the
	// validation of the built-in data (cycle.Validation.Thresholds).
	if flat := strings.Join(strings.Fields(v), " "); !strings.Contains(flat, "read against extended") || !strings.Contains(flat, "built-in alkali halides)") {
		t.Errorf("the verdict's reference model and the origin of its thresholds are not shown:\n%s", v)
	}
}

func TestGapBar(t *testing.T) {
	// 2 % per cell, left for negative gaps, clipped with an arrow (the
	// drawing rule of this panel; no outside source).
	cases := []struct {
		pct  float64
		half int
		want string
	}{
		{0, 5, "·····│·····"},
		{-4, 5, "···██│·····"},
		{6.1, 5, "·····│███··"},
		{-25, 5, "◀████│·····"},
		{25, 5, "·····│████▶"},
		{math.NaN(), 5, "·····│·····"},
	}
	for _, c := range cases {
		if got := bar(c.pct, c.half); got != c.want {
			t.Errorf("bar(%v) = %q, want %q", c.pct, got, c.want)
		}
	}
}

func TestSettingsEditableInPlace(t *testing.T) {
	f, m, u := setup(t, "NaCl")
	bm := func() float64 {
		mr, _ := f.Session.Solved().Model(cycle.ModelBornMayer)
		return mr.Value
	}
	before := bm()

	// ρ: a bad value is explained in place and not taken.
	moveTo(t, m, u, "ρ")
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("abc")...)
	drive.Run(u, drive.Key("enter"))
	if editing, err := m.Editing(); !editing || err == nil || !strings.Contains(m.View(), "not accepted") {
		t.Fatalf("bad ρ: editing=%v err=%v", editing, err)
	}
	if f.Session.Cycle.Settings.Rho != 0 {
		t.Fatal("a refused ρ was stored")
	}
	drive.Run(u, drive.Key("esc"))
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("0.30")...)
	drive.Run(u, drive.Key("enter"))
	if f.Session.Cycle.Settings.Rho != 0.30 {
		t.Fatalf("ρ = %v, want 0.30", f.Session.Cycle.Settings.Rho)
	}
	// Born–Mayer: U ∝ (1 − ρ/d₀), so a smaller ρ binds more (more negative).
	if after := bm(); !(after < before) {
		t.Errorf("Born–Mayer with ρ 0.30 = %.1f, want below %.1f (ρ 0.345)", after, before)
	}
	drive.Run(u, drive.Key("r"))
	if f.Session.Cycle.Settings.Rho != 0 || math.Abs(bm()-before) > 1e-9 {
		t.Errorf("r did not restore the default ρ")
	}

	// Radii: ←/→ step through the choices.
	moveTo(t, m, u, "radii")
	drive.Run(u, drive.Key("l"))
	if f.Session.Cycle.Settings.Radius != cycle.RadiusCrystal {
		t.Errorf("→ on radii gave %v, want crystal", f.Session.Cycle.Settings.Radius)
	}
	drive.Run(u, drive.Key("h"))
	if f.Session.Cycle.Settings.Radius != cycle.RadiusIonic {
		t.Errorf("← on radii gave %v, want ionic", f.Session.Cycle.Settings.Radius)
	}

	// Structure: another prototype, then a name that is neither.
	moveTo(t, m, u, "structure")
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("caesium-chloride")...)
	drive.Run(u, drive.Key("enter"))
	if got := f.Session.Cycle.Settings.Structure.Name(); got != "caesium-chloride" {
		t.Errorf("structure %q", got)
	}
	// CsCl type: Madelung constant 1.762675 (referred to the nearest
	// distance; CRC Handbook, from memory).
	mr, _ := f.Session.Solved().Model(cycle.ModelEwald)
	if math.Abs(mr.Inputs.Madelung-1.762675) > 1e-5 {
		t.Errorf("Madelung constant for caesium-chloride = %.6f, want 1.762675", mr.Inputs.Madelung)
	}
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("no-such-thing")...)
	drive.Run(u, drive.Key("enter"))
	if _, err := m.Editing(); err == nil || !strings.Contains(err.Error(), "prototype") {
		t.Errorf("bad structure: %v", err)
	}
	drive.Run(u, drive.Key("esc"))

	// d₀: a distance of one's own.
	moveTo(t, m, u, "d₀")
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("2.9")...)
	drive.Run(u, drive.Key("enter"))
	if s := f.Session.Cycle.Settings; s.Distance != cycle.DistanceUser || s.D0 != 2.9 {
		t.Errorf("d₀: %v %v", s.Distance, s.D0)
	}
}

func TestStructureFromACIFFile(t *testing.T) {
	f, m, u := setup(t, "NaCl")
	src, err := os.ReadFile("../../testdata/cif/real_NaCl_rocksalt_Fm-3m.cif")
	if err != nil {
		entries, _ := filepath.Glob("../../testdata/cif/*.cif")
		t.Skipf("no rock-salt CIF in testdata/cif (%v): %v", entries, err)
	}
	dir := filepath.Dir(must(f.Ctx.ResolvePath("x")))
	if err := os.WriteFile(filepath.Join(dir, "salt.cif"), src, 0o600); err != nil {
		t.Fatal(err)
	}
	moveTo(t, m, u, "structure")
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("salt.cif")...)
	drive.Run(u, drive.Key("enter"))
	if _, err := m.Editing(); err != nil {
		t.Fatalf("CIF refused: %v", err)
	}
	mr, _ := f.Session.Solved().Model(cycle.ModelEwald)
	// The rock-salt cell read from the file gives rock salt's 1.747565.
	if math.Abs(mr.Inputs.Madelung-1.747565) > 1e-5 {
		t.Errorf("Madelung constant from the CIF = %.6f, want 1.747565", mr.Inputs.Madelung)
	}
	// The file carries no charges: the compound's ions are assigned, and
	// the screen lists its sites with their potential and bond-valence sum
	// (rock salt's cation potential is −A·e/(4πε₀·d) = −8.92 V at
	// d = 2.820 Å, from A = 1.747565 and the NaCl cell; the sum of six
	// Na–Cl bonds at 2.820 Å is near 1, Brown's rule, common practice).
	v := m.View()
	for _, want := range []string{"Sites of salt.cif", "Na", "φ -8.92", "BVS 1."} {
		if !strings.Contains(v, want) {
			t.Errorf("Models screen lacks %q:\n%s", want, v)
		}
	}
}

// TestStructureFileReadOffUpdate: reading a CIF and assigning its charges
// runs in a command, not inside Update: before the command has run the
// structure is unchanged and the panel says it is reading the file; after
// it the file's structure is the cycle's. A file that cannot be read comes
// back to the prompt with the reason, the structure kept.
func TestStructureFileReadOffUpdate(t *testing.T) {
	f, m, u := setup(t, "NaCl")
	src, err := os.ReadFile("../../testdata/cif/real_NaCl_rocksalt_Fm-3m.cif")
	if err != nil {
		t.Skipf("no rock-salt CIF in testdata/cif: %v", err)
	}
	dir := filepath.Dir(must(f.Ctx.ResolvePath("x")))
	for name, text := range map[string][]byte{"salt.cif": src, "junk.cif": []byte("not a structure\n")} {
		if err := os.WriteFile(filepath.Join(dir, name), text, 0o600); err != nil {
			t.Fatal(err)
		}
	}
	before := f.Session.Cycle.Settings.Structure.Name()
	moveTo(t, m, u, "structure")
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("salt.cif")...)
	cmd := u(drive.Key("enter"))
	if got := f.Session.Cycle.Settings.Structure.Name(); got != before {
		t.Fatalf("structure %q inside Update, want %q until the command has run", got, before)
	}
	if v := m.View(); !strings.Contains(v, "reading salt.cif") {
		t.Errorf("no reading state before the command ran:\n%s", v)
	}
	drive.RunCmd(u, cmd)
	if got := f.Session.Cycle.Settings.Structure.Name(); got != "salt.cif" {
		t.Errorf("structure %q after the command, want salt.cif", got)
	}
	if v := m.View(); strings.Contains(v, "reading salt.cif") {
		t.Errorf("still reading once read:\n%s", v)
	}

	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("junk.cif")...)
	drive.RunCmd(u, u(drive.Key("enter")))
	if editing, err := m.Editing(); !editing || err == nil {
		t.Errorf("junk.cif: editing %v, refusal %v; want the prompt back with the reason", editing, err)
	}
	if got := f.Session.Cycle.Settings.Structure.Name(); got != "salt.cif" {
		t.Errorf("structure %q after a refused file, want salt.cif kept", got)
	}
}

func must(s string, err error) string {
	if err != nil {
		panic(err)
	}
	return s
}

// TestModelRowsSpeakOfTheScreen: a model that cannot be evaluated says why
// and where to fix it on the screen, not with command-line options
// (CaCl2 has no structure in the data, RbOH no cell and no density).
func TestModelRowsSpeakOfTheScreen(t *testing.T) {
	for _, formula := range []string{"CaCl2", "RbOH"} {
		_, m, _ := setup(t, formula)
		v := m.View()
		if !strings.Contains(v, "not available") {
			t.Fatalf("%s: no model is unavailable:\n%s", formula, v)
		}
		if strings.Contains(v, "--") || !strings.Contains(v, "on the Models") {
			t.Errorf("%s: a model row speaks of options or not of the screen:\n%s", formula, v)
		}
	}
}

// TestReferenceIsNamedWhenTheLatticeIsAModel: with the lattice step taken
// from the Born–Landé model (and the attachment solved from it), the panel
// names that model as the reference instead of "cycle", and gives no
// covalency verdict: a gap between two point-charge models says nothing
// about covalency (the verdict compares a measured cycle with a model;
// common practice, no source).
func TestReferenceIsNamedWhenTheLatticeIsAModel(t *testing.T) {
	f, m, u := setup(t, "NaCl")
	cmd, err := f.Session.Change(func(c *cycle.Cycle) error {
		c.Settings.LatticeFrom = cycle.ModelBornLande
		return c.MarkUnknown("attachment-1")
	})
	if err != nil {
		t.Fatal(err)
	}
	drive.Run(u, cmd())
	res := f.Session.Solved()
	if res == nil {
		t.Fatalf("not solved: %v", f.Session.SolveErr)
	}
	v := m.View()
	head := strings.Split(v, "\n")[0]
	if strings.Contains(head, "cycle") || !strings.Contains(head, "lattice from the born-lande model") {
		t.Errorf("the header does not name the model the lattice comes from: %q", head)
	}
	for _, mr := range res.Models {
		if mr.OK() && strings.Contains(v, mr.Verdict.Character.String()) {
			t.Errorf("a covalency verdict %q is given against a model value:\n%s", mr.Verdict.Character, v)
		}
	}
	if !strings.Contains(v, "born-lande − model") || !strings.Contains(v, "model–model") {
		t.Errorf("the gaps are not said to be model–model differences:\n%s", v)
	}
}

// TestExplanationsAreNotCut: at the widths the workshop supports, the
// panel's explanations (the verdict thresholds, the Madelung constant's
// provenance, why a model is not available) wrap instead of ending in
// "…", and every setting stays reachable in the rows left.
func TestExplanationsAreNotCut(t *testing.T) {
	for _, formula := range []string{"NaCl", "MgO", "MgCl", "CaF2"} {
		for _, size := range [][2]int{{80, 21}, {100, 27}, {120, 37}} {
			f, m, u := setup(t, formula)
			m.SetSize(size[0], size[1])
			res := f.Session.Solved()
			v := m.View()
			for _, l := range strings.Split(v, "\n") {
				if strings.HasSuffix(strings.TrimRight(l, " "), "…") {
					t.Errorf("%s at %d columns: a line is cut: %q", formula, size[0], l)
				}
			}
			flat := strings.Join(strings.Fields(v), " ")
			if res != nil && res.Verdict() != nil && !strings.Contains(flat, res.Verdict().Verdict.Basis) {
				t.Errorf("%s at %d columns: the thresholds are not shown whole:\n%s", formula, size[0], v)
			}
			if res != nil {
				for _, mr := range res.Models {
					if !mr.OK() && !strings.Contains(flat, strings.Join(strings.Fields(session.Message(mr.Err)), " ")) {
						t.Errorf("%s at %d columns: why %s is not available is not shown whole:\n%s", formula, size[0], mr.Model, v)
					}
				}
			}
			for _, name := range m.SettingNames() {
				moveTo(t, m, u, name)
				if !strings.Contains(m.View(), "› "+name) {
					t.Errorf("%s at %d×%d: the setting %s is not shown when chosen:\n%s", formula, size[0], size[1], name, m.View())
				}
			}
		}
	}
}

// TestSettingsTakeTheEngineBounds: the ρ and n rows accept exactly what
// cycle.CheckSetting accepts, the bound of the command line and of cycle
// files too (before: ρ ≤ 2 Å and 1 ≤ n ≤ 20 here, ρ < 5 Å and n < 100 on
// the command line). The values straddle the ends (common practice, no
// source).
func TestSettingsTakeTheEngineBounds(t *testing.T) {
	f, _, _ := setup(t, "NaCl")
	rows := settingsRows()
	find := func(prefix string) setting {
		for _, r := range rows {
			if strings.HasPrefix(r.name, prefix) {
				return r
			}
		}
		t.Fatalf("no row %q", prefix)
		return setting{}
	}
	for _, tc := range []struct {
		row     string
		setting cycle.ModelSetting
		values  []float64
	}{
		{"ρ", cycle.SettingRho, []float64{0.345, 2, 2.5, 4, -0.3}},
		{"Born exponent", cycle.SettingBornExponent, []float64{1, 1.5, 9, 30, 50}},
	} {
		r := find(tc.row)
		for _, v := range tc.values {
			c := f.Session.Cycle.Clone()
			err := r.parse(c, strconv.FormatFloat(v, 'g', -1, 64))
			if want := cycle.CheckSetting(tc.setting, v) == nil; (err == nil) != want {
				t.Errorf("%s row, %g: %v; engine bound accepts: %v", tc.row, v, err, want)
			}
		}
	}
}

// TestStructureThatDoesNotFitIsRefused: spinel (sites A, B, X) for NaCl is
// refused in place when chosen (it was accepted, and then three models
// said "no site has species M"), the structure stays as it was, and ←/→
// step only through prototypes that hold the compound's ions.
func TestStructureThatDoesNotFitIsRefused(t *testing.T) {
	f, m, u := setup(t, "NaCl")
	before := f.Session.Cycle.Settings.Structure.Name()
	moveTo(t, m, u, "structure")
	drive.Run(u, drive.Key("e"))
	drive.Run(u, drive.Text("spinel")...)
	drive.Run(u, drive.Key("enter"))
	if _, err := m.Editing(); err == nil || !strings.Contains(err.Error(), "does not fit NaCl") {
		t.Errorf("spinel for NaCl: %v, want refused as not fitting", err)
	}
	drive.Run(u, drive.Key("esc"))
	if got := f.Session.Cycle.Settings.Structure.Name(); got != before {
		t.Errorf("structure %q after a refusal, want %q kept", got, before)
	}
	seen := map[string]bool{}
	for range 15 {
		drive.Run(u, drive.Key("right"))
		n := f.Session.Cycle.Settings.Structure.Name()
		if n == "spinel" || n == "perovskite" || n == "fluorite" {
			t.Fatalf("→ stepped to %s, which cannot hold NaCl", n)
		}
		seen[n] = true
	}
	if len(seen) < 3 {
		t.Errorf("→ stepped through %v only", seen)
	}
}
