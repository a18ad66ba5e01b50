package nav

import (
	"slices"
	"testing"
)

// TestLabel: the help label is written from the key names (the rule of
// this package; common practice, no source, for the arrow glyphs).
func TestLabel(t *testing.T) {
	cases := []struct {
		names []string
		want  string
	}{
		{[]string{"up", "k"}, "↑/k"},
		{[]string{"e", "enter"}, "e/enter"},
		{[]string{"f", "pgdown"}, "f/pgdn"},
		{[]string{"1", "2", "3", "4", "5", "6"}, "1…6"},
		{[]string{"1", "2"}, "1/2"},
		{[]string{"x", "1", "2", "3"}, "x/1…3"},
		{[]string{"1", "3", "4"}, "1/3/4"},
		{[]string{"left", "right"}, "←/→"},
	}
	for _, c := range cases {
		if got := Label(c.names); got != c.want {
			t.Errorf("Label(%q) = %q, want %q", c.names, got, c.want)
		}
	}
}

// TestTypingBindHasNoLetters: a screen that types gets the shared keys
// without their printable names, the vertical moves on ctrl+p and ctrl+n.
func TestTypingBindHasNoLetters(t *testing.T) {
	for _, k := range Keys() {
		b := k.TypingBind("x")
		for _, n := range b.Keys() {
			if len([]rune(n)) == 1 || n == "space" {
				t.Errorf("%v while typing has the printable key %q", k.Names(), n)
			}
		}
		if b.Help().Key != Label(b.Keys()) {
			t.Errorf("%v while typing: label %q, keys %q", k.Names(), b.Help().Key, b.Keys())
		}
	}
	if got := Up.TypingBind("x").Keys(); !slices.Equal(got, []string{"up", "ctrl+p"}) {
		t.Errorf("Up while typing = %q", got)
	}
}

// TestBindPutsOwnKeysFirst: a screen's own key beside a shared one is
// listed first and both act.
func TestBindPutsOwnKeysFirst(t *testing.T) {
	b := Enter.Bind("type a value", "e")
	if !slices.Equal(b.Keys(), []string{"e", "enter"}) || b.Help().Key != "e/enter" || b.Help().Desc != "type a value" {
		t.Errorf("Enter.Bind = %q %q %q", b.Keys(), b.Help().Key, b.Help().Desc)
	}
}

// TestWithoutPrintable: the key list while typing names only the keys
// that still act.
func TestWithoutPrintable(t *testing.T) {
	b, ok := WithoutPrintable(Help.Bind("all keys"))
	if !ok || !slices.Equal(b.Keys(), []string{"f1"}) || b.Help().Key != "f1" || b.Help().Desc != "all keys" {
		t.Errorf("WithoutPrintable(help) = %q %q %v", b.Keys(), b.Help().Key, ok)
	}
	if _, ok := WithoutPrintable(Quit.Bind("quit")); ok {
		t.Error("WithoutPrintable(q) kept a key")
	}
}
