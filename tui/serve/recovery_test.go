package serve

import (
	"errors"
	"os"
	"path/filepath"
	"runtime"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	gossh "golang.org/x/crypto/ssh"

	"enthalpath/thermo/fileio"
)

// The expected behaviours below (work saved on shutdown, connection loss and failure; recovery files) come from the
// project's issue 7 (what the server must do); the SSH protocol facts
// (methods, exit-status) are RFC 4252 and RFC 4254.

// recoveryFiles returns the contents of every recovery file of key's user.
func recoveryFiles(t *testing.T, ts *testServer, key gossh.Signer) []string {
	t.Helper()
	dir := filepath.Join(ts.state, "users", UserFolderName(key.PublicKey()))
	names, _ := filepath.Glob(filepath.Join(dir, "recovered*"))
	var out []string
	for _, name := range names {
		b, err := os.ReadFile(name)
		if err != nil {
			t.Fatal(err)
		}
		out = append(out, string(b))
	}
	return out
}

func TestShutdownSavesWork(t *testing.T) {
	ts := startServer(t, nil)
	other := newKey(t)
	f, err := os.OpenFile(ts.authKeys, os.O_APPEND|os.O_WRONLY, 0)
	if err != nil {
		t.Fatal(err)
	}
	f.Write(gossh.MarshalAuthorizedKey(other.PublicKey()))
	f.Close()

	a := ts.mustTerm(t, ts.key, termOptions{})
	b := ts.mustTerm(t, other, termOptions{})
	clean := ts.mustTerm(t, other, termOptions{})
	a.mustSee("enthalpath probe screen")
	b.mustSee("enthalpath probe screen")
	clean.mustSee("enthalpath probe screen")
	a.typeKeys("KCl")
	b.typeKeys("MgO")
	a.mustSee("keys: KCl|")
	b.mustSee("keys: MgO|")

	start := time.Now()
	if err := ts.shutdown(t); err != nil {
		t.Fatalf("Shutdown: %v", err)
	}
	if took := time.Since(start); took > 10*time.Second {
		t.Errorf("shutdown took %v, more than the 10 s promised", took)
	}
	for _, tm := range []*term{a, b, clean} {
		if code, err := tm.exit(5 * time.Second); err != nil || code != ExitShutdown {
			t.Errorf("exit %d, %v; want %d", code, err, ExitShutdown)
		}
	}
	if got := recoveryFiles(t, ts, ts.key); len(got) != 1 || !strings.Contains(got[0], "typed: KCl") || !strings.Contains(got[0], "shutting down") {
		t.Errorf("first user's recovery files = %q", got)
	}
	if got := recoveryFiles(t, ts, other); len(got) != 1 || !strings.Contains(got[0], "typed: MgO") {
		t.Errorf("second user's recovery files = %q (the clean session must not write one)", got)
	}
	if !strings.Contains(a.stderr.String(), "shutting down") {
		t.Errorf("closing line = %q", a.stderr.String())
	}
	// No new connection gets in.
	if c, err := ts.dial(ts.key); err == nil {
		c.Close()
		t.Error("a connection was accepted after Shutdown")
	}
}

func TestConnectionLossSavesWork(t *testing.T) {
	ts := startServer(t, nil)
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	tm.typeKeys("CsI")
	tm.mustSee("keys: CsI|")
	tm.client.Close()
	deadline := time.Now().Add(10 * time.Second)
	for time.Now().Before(deadline) {
		if got := recoveryFiles(t, ts, ts.key); len(got) == 1 {
			if !strings.Contains(got[0], "typed: CsI") || !strings.Contains(got[0], "connection lost") {
				t.Errorf("recovery file = %q", got[0])
			}
			return
		}
		time.Sleep(20 * time.Millisecond)
	}
	t.Fatal("no recovery file after the connection dropped")
}

// TestFailureStaysInSession: a panic in Update, in a command or in View
// ends only that session, which saves its work; a neighbour keeps working.
func TestFailureStaysInSession(t *testing.T) {
	for _, trigger := range []string{"!", "@", "#"} {
		t.Run(trigger, func(t *testing.T) {
			ts := startServer(t, nil)
			neighbour := ts.mustTerm(t, ts.key, termOptions{})
			victim := ts.mustTerm(t, ts.key, termOptions{})
			neighbour.mustSee("enthalpath probe screen")
			victim.mustSee("enthalpath probe screen")
			victim.typeKeys("BaO")
			victim.mustSee("keys: BaO|")
			victim.typeKeys(trigger)
			if code, err := victim.exit(10 * time.Second); err != nil || code != ExitFailure {
				t.Fatalf("failed session: exit %d, %v; want %d", code, err, ExitFailure)
			}
			if msg := victim.stderr.String(); !strings.Contains(msg, "internal error") {
				t.Errorf("closing line = %q", msg)
			}
			got := recoveryFiles(t, ts, ts.key)
			if len(got) != 1 || !strings.Contains(got[0], "typed: BaO") {
				t.Errorf("recovery files = %q", got)
			}
			if !strings.Contains(ts.logs.String(), "session failed") {
				t.Error("the failure is not in the log")
			}
			neighbour.typeKeys("ok")
			neighbour.mustSee("keys: ok|")
		})
	}
}

// TestRecoveryFilesNeverReplaced: successive sessions that end with
// unsaved work each leave a recovery file of their own (an earlier one was
// once overwritten by the next session), and each closing line names the
// file its own session wrote, as the model reports it.
func TestRecoveryFilesNeverReplaced(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.IdleTimeout = 300 * time.Millisecond })
	for i, typed := range []string{"NaCl", "KBr"} {
		tm := ts.mustTerm(t, ts.key, termOptions{})
		tm.mustSee("enthalpath probe screen")
		tm.typeKeys(typed)
		tm.mustSee("keys: " + typed + "|")
		if code, err := tm.exit(5 * time.Second); err != nil || code != ExitIdle {
			t.Fatalf("session %d: exit %d, %v; want %d", i+1, code, err, ExitIdle)
		}
		want := []string{"recovered.cycle", "recovered-2.cycle"}[i]
		if msg := tm.stderr.String(); !strings.Contains(msg, "Your unsaved work is in "+want+".") {
			t.Errorf("session %d: closing line %q does not name %s", i+1, msg, want)
		}
	}
	got := recoveryFiles(t, ts, ts.key)
	if len(got) != 2 || !strings.Contains(strings.Join(got, ""), "typed: NaCl") || !strings.Contains(strings.Join(got, ""), "typed: KBr") {
		t.Errorf("recovery files = %q; want NaCl's and KBr's", got)
	}
}

// TestConcurrentSessionsRecoverApart: a member's sessions at once, all
// stopped together, write different files of the one series, each named to
// its own session (a second concurrent keep once wrote recovery-2-2, a name
// never offered).
func TestConcurrentSessionsRecoverApart(t *testing.T) {
	ts := startServer(t, nil)
	var terms []*term
	for _, typed := range []string{"LiF", "NaF", "KF"} {
		tm := ts.mustTerm(t, ts.key, termOptions{})
		tm.mustSee("enthalpath probe screen")
		tm.typeKeys(typed)
		tm.mustSee("keys: " + typed + "|")
		terms = append(terms, tm)
	}
	if err := ts.shutdown(t); err != nil {
		t.Fatal(err)
	}
	folder := filepath.Join(ts.state, "users", UserFolderName(ts.key.PublicKey()))
	named := map[string]bool{}
	for i, tm := range terms {
		tm.exit(5 * time.Second)
		_, name, ok := strings.Cut(tm.stderr.String(), "Your unsaved work is in ")
		name, _, _ = strings.Cut(name, ".\r")
		name = strings.TrimSuffix(name, ".")
		if !ok || named[name] {
			t.Fatalf("session %d: closing line %q names no file of its own", i+1, tm.stderr.String())
		}
		named[name] = true
		b, err := os.ReadFile(filepath.Join(folder, name))
		if err != nil || !strings.Contains(string(b), "typed: "+[]string{"LiF", "NaF", "KF"}[i]) {
			t.Errorf("session %d: %s holds %q, %v", i+1, name, b, err)
		}
	}
	series := fileio.Series(filepath.Join(folder, "recovered.cycle"))
	if len(series) != 3 {
		t.Errorf("series %v, want 3 files", series)
	}
	for _, p := range series {
		if !named[filepath.Base(p)] {
			t.Errorf("%s was written but no session named it", p)
		}
	}
}

func TestRecoveryFileNameChecked(t *testing.T) {
	if _, err := New(Config{HostKeyPath: "h", StateDir: "s", RecoveryFile: "../x", NewModel: newProbe(nil),
		ShutdownMsg: func(string) tea.Msg { return nil }}); !errors.Is(err, ErrConfig) {
		t.Errorf("RecoveryFile ../x accepted: %v", err)
	}
}

// TestSessionsLeaveNothingBehind: after sessions end, by quitting or by a
// dropped connection, their goroutines are gone (common practice for a
// long-running server, no source).
func TestSessionsLeaveNothingBehind(t *testing.T) {
	ts := startServer(t, nil)
	warm := ts.mustTerm(t, ts.key, termOptions{})
	warm.mustSee("enthalpath probe screen")
	warm.typeKeys("\x03")
	warm.exit(5 * time.Second)
	warm.client.Close()
	time.Sleep(100 * time.Millisecond)
	baseline := runtime.NumGoroutine()
	for i := 0; i < 10; i++ {
		tm := ts.mustTerm(t, ts.key, termOptions{})
		tm.mustSee("enthalpath probe screen")
		if i%2 == 0 {
			tm.typeKeys("\x03")
			if _, err := tm.exit(5 * time.Second); err != nil {
				t.Fatal(err)
			}
		}
		tm.client.Close()
	}
	deadline := time.Now().Add(10 * time.Second)
	for runtime.NumGoroutine() > baseline+2 && time.Now().Before(deadline) {
		time.Sleep(20 * time.Millisecond)
	}
	if n := runtime.NumGoroutine(); n > baseline+2 {
		buf := make([]byte, 1<<20)
		t.Errorf("%d goroutines after 10 sessions ended, %d before:\n%s", n, baseline, buf[:runtime.Stack(buf, true)])
	}
}

// TestOldRecoveryFileNotAnnounced: a session that had nothing unsaved does
// not claim an earlier session's recovery file as its own.
func TestOldRecoveryFileNotAnnounced(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.IdleTimeout = 300 * time.Millisecond })
	folder := filepath.Join(ts.state, "users", UserFolderName(ts.key.PublicKey()))
	if err := os.MkdirAll(folder, 0o700); err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(filepath.Join(folder, "recovered.cycle"), []byte("earlier"), 0o600); err != nil {
		t.Fatal(err)
	}
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	if code, err := tm.exit(5 * time.Second); err != nil || code != ExitIdle {
		t.Fatalf("exit %d, %v; want %d", code, err, ExitIdle)
	}
	if msg := tm.stderr.String(); strings.Contains(msg, "unsaved work") {
		t.Errorf("closing line %q announces the earlier file", msg)
	}
}
