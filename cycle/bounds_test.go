package cycle

import (
	"errors"
	"math"
	"testing"
)

// boundCases are the values every front end must take or refuse alike for
// ρ and the Born exponent n. The ends are the project's choice (common
// practice, no source): ρ of Born–Mayer is 0.345 Å in the tables and
// 0.30–0.40 Å in use; Born–Landé's factor 1 − 1/n vanishes at n = 1 and
// Pauling's n run 5–12.
var boundCases = []struct {
	setting ModelSetting
	v       float64
	ok      bool
}{
	{SettingRho, 0.345, true},
	{SettingRho, 2, true},
	{SettingRho, 0, false},
	{SettingRho, -0.3, false},
	{SettingRho, 2.5, false}, // the command line took it before (< 5 Å)
	{SettingRho, math.NaN(), false},
	{SettingBornExponent, 9, true},
	{SettingBornExponent, 1.5, true},
	{SettingBornExponent, 30, true},
	{SettingBornExponent, 1, false}, // the workshop took it before, and the model then failed
	{SettingBornExponent, 0.5, false},
	{SettingBornExponent, 50, false}, // the command line and cycle files took it before (< 100)
}

func TestCheckSetting(t *testing.T) {
	for _, tc := range boundCases {
		err := CheckSetting(tc.setting, tc.v)
		if (err == nil) != tc.ok {
			t.Errorf("CheckSetting(%v, %g) = %v; want accepted %v", tc.setting, tc.v, err, tc.ok)
		}
		var be *BoundError
		if err != nil && (!errors.As(err, &be) || be.Setting != tc.setting || !(be.Value == tc.v || math.IsNaN(tc.v))) {
			t.Errorf("CheckSetting(%v, %g): %v is no *BoundError naming the setting and the value", tc.setting, tc.v, err)
		}
	}
	// Whole numbers only for a coordination number.
	if CheckSetting(SettingCN, 6.5) == nil || CheckSetting(SettingCN, 6) != nil || CheckSetting(SettingCN, 0) == nil {
		t.Error("CN bound: 6.5 or 0 accepted, or 6 refused")
	}
}

// TestCycleFileBounds: a cycle file takes and refuses ρ and n as
// CheckSetting does (the same cases through Marshal and Unmarshal).
func TestCycleFileBounds(t *testing.T) {
	db := loadDB(t)
	for _, tc := range boundCases {
		if math.IsNaN(tc.v) {
			continue // TOML writes no NaN for a setting
		}
		c := build(t, "NaCl", Options{})
		if tc.setting == SettingRho {
			c.Settings.Rho = tc.v
		} else {
			c.Settings.BornExponent = tc.v
		}
		b, err := Marshal(c)
		if err != nil {
			t.Fatal(err)
		}
		back, err := Unmarshal(db, b)
		if tc.v == 0 { // 0 is "absent": the default
			if err != nil {
				t.Errorf("%v = 0 in a file: %v", tc.setting, err)
			}
			continue
		}
		var fe *FileError
		if (err == nil) != tc.ok || err != nil && !errors.As(err, &fe) {
			t.Errorf("cycle file with %v = %g: %v; want accepted %v", tc.setting, tc.v, err, tc.ok)
		}
		if err == nil && back.Settings.Rho != c.Settings.Rho {
			t.Errorf("ρ %g read back as %g", c.Settings.Rho, back.Settings.Rho)
		}
	}
}
