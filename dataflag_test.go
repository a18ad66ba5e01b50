package main

import (
	"slices"
	"strings"
	"testing"
)

// TestDataFlag: --data FILE and --data=FILE before the command, as the
// README writes them; --data without a file is a usage error that says so
// (it once said `unknown command "--data"`).
func TestDataFlag(t *testing.T) {
	for _, tc := range []struct {
		args []string
		rest []string
		file string
		err  string
	}{
		{[]string{"--data", "my.toml", "cycle", "NaCl"}, []string{"cycle", "NaCl"}, "my.toml", ""},
		{[]string{"--data=my.toml", "cycle"}, []string{"cycle"}, "my.toml", ""},
		{[]string{"-data", "a.toml", "--data", "b.toml"}, []string{}, "b.toml", ""},
		{[]string{"cycle", "--data", "x"}, []string{"cycle", "--data", "x"}, "", ""},
		{[]string{"--data"}, nil, "", "--data needs a file name"},
		{[]string{"--data="}, nil, "", "--data needs a file name"},
		{[]string{"--data", ""}, nil, "", "--data needs a file name"},
	} {
		rest, file, err := dataFlag(tc.args)
		if tc.err != "" {
			if err == nil || !strings.Contains(err.Error(), tc.err) {
				t.Errorf("%q: err %v, want %q", tc.args, err, tc.err)
			}
			continue
		}
		if err != nil || file != tc.file || !slices.Equal(rest, tc.rest) {
			t.Errorf("%q: %q, %q, %v; want %q, %q", tc.args, rest, file, err, tc.rest, tc.file)
		}
	}
}
