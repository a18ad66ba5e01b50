package prompt

import (
	"errors"
	"strings"
	"testing"

	"github.com/charmbracelet/lipgloss"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/tui/internal/drive"
	"enthalpath/tui/theme"
)

// accepter returns an Accept that takes only "ok" and records what it
// applied, so a test can see that a refused answer changed nothing.
func accepter(applied *[]string) Accept {
	return func(answer string) (tea.Cmd, error) {
		if answer != "ok" {
			return nil, errors.New("only ok will do, not " + answer)
		}
		*applied = append(*applied, answer)
		return func() tea.Msg { return "done" }, nil
	}
}

func send(s *Slot, keys ...string) tea.Cmd {
	var cmd tea.Cmd
	for _, k := range keys {
		if len([]rune(k)) > 1 && k != "enter" && k != "esc" && k != "backspace" && k != "ctrl+u" {
			for _, r := range k {
				cmd = s.Update(drive.Key(string(r)))
			}
			continue
		}
		cmd = s.Update(drive.Key(k))
	}
	return cmd
}

// TestSlotFlows: what each sequence of keys leaves behind (the prompt's
// contract in the package comment; no outside source).
func TestSlotFlows(t *testing.T) {
	st := theme.DefaultStyles(drive.Renderer())
	cases := []struct {
		name     string
		initial  string
		keys     []string
		active   bool   // the prompt is still open
		refusal  string // part of the shown refusal, "" for none
		applied  int    // answers Accept took
		wantCmd  bool   // the last key returned Accept's command
		hintSeen bool
	}{
		{name: "good answer closes", keys: []string{"ok", "enter"}, applied: 1, wantCmd: true},
		{name: "initial answer accepted as is", initial: "ok", keys: []string{"enter"}, applied: 1, wantCmd: true},
		{name: "spaces are trimmed", keys: []string{" ok ", "enter"}, applied: 1, wantCmd: true},
		{name: "bad answer is refused in place", keys: []string{"no", "enter"}, active: true, refusal: "only ok will do, not no"},
		{name: "empty answer is refused", keys: []string{"enter"}, active: true, refusal: "not "},
		{name: "typing clears the refusal", keys: []string{"no", "enter", "backspace"}, active: true, hintSeen: true},
		{name: "refused then corrected", keys: []string{"no", "enter", "ctrl+u", "ok", "enter"}, applied: 1, wantCmd: true},
		{name: "esc cancels without accepting", initial: "ok", keys: []string{"esc"}},
		{name: "esc after a refusal", keys: []string{"no", "enter", "esc"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var applied []string
			var s Slot
			if s.Active() {
				t.Fatal("the zero slot is open")
			}
			s.Open(New(st, "Question", c.initial, "the hint", 40, accepter(&applied)))
			if !s.Active() {
				t.Fatal("Open left the slot closed")
			}
			cmd := send(&s, c.keys...)
			if s.Active() != c.active {
				t.Errorf("open = %v, want %v", s.Active(), c.active)
			}
			if len(applied) != c.applied {
				t.Errorf("Accept took %d answers (%v), want %d", len(applied), applied, c.applied)
			}
			if got := cmd != nil && cmd() == "done"; got != c.wantCmd {
				t.Errorf("returned Accept's command: %v, want %v", got, c.wantCmd)
			}
			v := s.View()
			switch {
			case c.refusal != "":
				if s.Err() == nil || !strings.Contains(v, "not accepted: ") || !strings.Contains(v, c.refusal) {
					t.Errorf("refusal %q not shown (err %v):\n%s", c.refusal, s.Err(), v)
				}
				if strings.Contains(v, "the hint") {
					t.Errorf("hint shown beside the refusal:\n%s", v)
				}
			case c.active:
				if s.Err() != nil || strings.Contains(v, "not accepted") {
					t.Errorf("stale refusal: %v\n%s", s.Err(), v)
				}
			default:
				if v != "" || s.Err() != nil || s.ShortHelp() != nil || s.FullHelp() != nil {
					t.Errorf("closed slot still shows %q, err %v, help %v", v, s.Err(), s.ShortHelp())
				}
			}
			if c.hintSeen && !strings.Contains(v, "the hint") {
				t.Errorf("hint not shown:\n%s", v)
			}
			if !c.active && s.Update(drive.Key("x")) != nil {
				t.Error("a closed slot returned a command")
			}
		})
	}
}

// TestHelpComesFromTheKeyMap: the help lists the bindings Update matches,
// with the description the screen gave Enter.
func TestHelpComesFromTheKeyMap(t *testing.T) {
	st := theme.DefaultStyles(drive.Renderer())
	var applied []string
	var s Slot
	s.Open(New(st, "", "", "", 10, accepter(&applied), WithSubmitHelp("run")))
	short := s.ShortHelp()
	if len(short) != 2 || short[0].Help().Desc != "run" || short[1].Help().Key != "esc" {
		t.Fatalf("short help %v", short)
	}
	full := s.FullHelp()
	if len(full) != 1 || len(full[0]) != 2 {
		t.Fatalf("full help %v", full)
	}
	for _, b := range short {
		if b.Keys()[0] != DefaultKeyMap().Submit.Keys()[0] && b.Keys()[0] != DefaultKeyMap().Cancel.Keys()[0] {
			t.Errorf("binding %v is not one of the prompt's keys", b.Keys())
		}
	}
	// The submit help of this prompt did not leak into the defaults.
	if DefaultKeyMap().Submit.Help().Desc != "accept" {
		t.Error("WithSubmitHelp changed the default key map")
	}
	s.Update(drive.Key("esc"))
	if s.Active() {
		t.Error("esc, as listed in the help, did not close the prompt")
	}
}

// TestViewFitsItsWidth: label, placeholder and a long refusal stay within
// the width given, and the whole reason is still there.
func TestViewFitsItsWidth(t *testing.T) {
	st := theme.DefaultStyles(drive.Renderer())
	long := errors.New(strings.Repeat("a long reason ", 12) + "END")
	cases := []struct {
		name, question, aside string
		label, placeholder    string
		width                 int
		refuse                bool
		want                  []string
	}{
		{name: "placeholder whole when it fits", label: "value › ", placeholder: "e.g. -349.0±0.5 (kJ/mol)", width: 36,
			want: []string{"value › ", "e.g. -349.0±0.5 (kJ/mol)"}},
		{name: "placeholder cut when it does not", label: "value › ", placeholder: strings.Repeat("p", 80), width: 40,
			want: []string{"value › ", "…"}},
		{name: "refusal wrapped", label: "ρ › ", width: 40, refuse: true, want: []string{"not accepted:", "END"}},
		// Wrapped, not cut: the end of the question and the whole aside show.
		{name: "question and aside wrapped", question: "New value for the first ionization energy", aside: " — a long aside",
			label: "v › ", width: 30, want: []string{"New value for", "ionization energy", "a long aside"}},
	}
	for _, c := range cases {
		t.Run(c.name, func(t *testing.T) {
			var s Slot
			s.SetWidth(c.width)
			s.Open(New(st, c.question, "", "", 100, func(string) (tea.Cmd, error) { return nil, long },
				WithLabel(c.label), WithPlaceholder(c.placeholder), WithAside(c.aside)))
			if c.refuse {
				s.Update(drive.Key("enter"))
			}
			v := s.View()
			for _, w := range c.want {
				if !strings.Contains(v, w) {
					t.Errorf("view lacks %q:\n%s", w, v)
				}
			}
			for i, l := range strings.Split(v, "\n") {
				if n := lipgloss.Width(l); n > c.width {
					t.Errorf("line %d is %d cells wide, more than %d: %q", i, n, c.width, l)
				}
			}
		})
	}
}

// TestRetryOnlyAfterWaiting: Retry submits again only an answer refused
// because it had to wait; another refusal, or no prompt, is left alone.
func TestRetryOnlyAfterWaiting(t *testing.T) {
	errWait := errors.New("a moment")
	ready := false
	var s Slot
	s.Open(New(theme.DefaultStyles(drive.Renderer()), "Q", "", "", 20, func(answer string) (tea.Cmd, error) {
		switch {
		case answer != "ok":
			return nil, errors.New("only ok")
		case !ready:
			return nil, errWait
		}
		return func() tea.Msg { return "done" }, nil
	}))
	waiting := func(err error) bool { return errors.Is(err, errWait) }
	send(&s, "no", "enter")
	if s.Retry(waiting) != nil || !s.Active() {
		t.Fatal("a refusal that did not wait was submitted again")
	}
	send(&s, "ctrl+u", "ok", "enter")
	if !errors.Is(s.Err(), errWait) {
		t.Fatalf("refusal %v, want the waiting one", s.Err())
	}
	ready = true
	if cmd := s.Retry(waiting); cmd == nil || s.Active() {
		t.Fatal("the answer that waited was not submitted again")
	}
	if s.Retry(waiting) != nil {
		t.Error("Retry with no prompt open did something")
	}
}
