package cli

import (
	"os"
	"testing"
)

// TestMain points XDG_CONFIG_HOME at an empty folder, so a real
// ~/.config/enthalpath/data.toml on the machine cannot change what the
// commands under test read (tests of the default overlay set their own).
func TestMain(m *testing.M) {
	dir, err := os.MkdirTemp("", "enthalpath-cli-config-")
	if err != nil {
		panic(err)
	}
	os.Setenv("XDG_CONFIG_HOME", dir)
	code := m.Run()
	os.RemoveAll(dir)
	os.Exit(code)
}
