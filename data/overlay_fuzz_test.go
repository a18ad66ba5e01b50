package data

import (
	"bytes"
	"errors"
	"strings"
	"testing"
)

// FuzzOverlay: any bytes as a user data file are refused with a
// *TableError that names the file, or applied to a copy of the data that
// still holds every built-in compound; never a panic, and the built-in DB
// is never changed. Seeds: the test overlay of overlay_test.go and faults
// the issue found (a count of 10¹², a file over the size cap).
func FuzzOverlay(f *testing.F) {
	base, err := Load()
	if err != nil {
		f.Fatal(err)
	}
	builtIn := len(base.Compounds())
	for _, seed := range []string{
		testOverlay,
		"",
		"[[compound]]\nformula = \"NaCl\"\ncation_count = 1000000000000\n",
		"[[compound]]\nformula = \"NaCl\"\ncation_count = 1e12\n",
		"[[element]]\nsymbol = \"Na\"\natomization_kj_per_mol = nan\n",
		"[[ion]]\nsymbol = \"\"\n",
		"[[compound]]\nformula = \"Q\"\ncation = \"Na+\"\nanion = \"Cl-\"\ncation_count = 1\nanion_count = 1\n",
		"[source]\nkey = 1\n",
		"[[shannon]]\ncore = \"Na\"\ncharge = 1\ncn = \"VI\"\nionic_radius = -1\n",
		"x = '''\n" + strings.Repeat("a", 100) + "\n'''\n",
	} {
		f.Add([]byte(seed))
	}
	f.Fuzz(func(t *testing.T, raw []byte) {
		db, err := base.WithOverlay(bytes.NewReader(raw), "user.toml")
		if err != nil {
			var te *TableError
			if !errors.As(err, &te) || te.File != "user.toml" {
				t.Fatalf("error %v (%T) is not a TableError naming the file", err, err)
			}
			if db != nil {
				t.Fatal("a DB returned with the error")
			}
		} else if n := len(db.Compounds()); n < builtIn {
			t.Fatalf("the overlay left %d compounds of %d", n, builtIn)
		}
		if len(base.Compounds()) != builtIn {
			t.Fatal("the overlay changed the built-in DB")
		}
	})
}
