package serve

import (
	"context"
	"encoding/base64"
	"errors"
	"net"
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

// The expected behaviours below come from the project's issue 7 (what the
// server must do); the SSH protocol facts (methods, exit-status) are
// RFC 4252 and RFC 4254.

func TestUnknownKeyRejected(t *testing.T) {
	ts := startServer(t, nil)
	stranger := newKey(t)
	if _, err := ts.dial(stranger); err == nil {
		t.Fatal("a key missing from the authorized-keys file was let in")
	}
	logs := ts.logs.String()
	if !strings.Contains(logs, gossh.FingerprintSHA256(stranger.PublicKey())) || !strings.Contains(logs, "key not in the authorized-keys file") {
		t.Errorf("refusal not logged with the key's fingerprint; logs:\n%s", logs)
	}
	// The log names keys by fingerprint only, never by their bytes.
	if material := base64.StdEncoding.EncodeToString(stranger.PublicKey().Marshal()); strings.Contains(logs, material) {
		t.Errorf("log holds key material")
	}
}

func TestPasswordRejected(t *testing.T) {
	ts := startServer(t, nil)
	const password = "correct horse battery staple"
	_, err := ts.dial(nil, gossh.Password(password))
	if err == nil {
		t.Fatal("password authentication was accepted")
	}
	if strings.Contains(ts.logs.String(), password) {
		t.Error("log holds the password")
	}
	// Even with an authorized key offered after it, the password is not
	// what lets the client in: the key is.
	client, err := ts.dial(ts.key, gossh.Password(password))
	if err != nil {
		t.Fatalf("authorized key after a password refused: %v", err)
	}
	client.Close()
}

func TestKeyboardInteractiveRejected(t *testing.T) {
	ts := startServer(t, nil)
	asked := false
	challenge := gossh.KeyboardInteractive(func(string, string, []string, []bool) ([]string, error) {
		asked = true
		return []string{"hunter2"}, nil
	})
	if _, err := ts.dial(nil, challenge); err == nil {
		t.Fatal("keyboard-interactive authentication was accepted")
	}
	if asked {
		t.Error("the server offered keyboard-interactive questions")
	}
}

func TestPTYSessionShowsScreenAndReactsToKeys(t *testing.T) {
	setups := make(chan SessionSetup, 1)
	ts := startServer(t, func(c *Config) { c.NewModel = newProbe(setups); c.MaxInputLen = 77 })
	tm := ts.mustTerm(t, ts.key, termOptions{answer: lightAnswer, width: 90, height: 30})
	tm.mustSee("enthalpath probe screen")
	tm.mustSee("size: 90x30")
	tm.typeKeys("NaCl")
	tm.mustSee("keys: NaCl|")

	setup := <-setups
	if setup.Width != 90 || setup.Height != 30 || setup.User != "ada" || setup.MaxInputLen != 77 {
		t.Errorf("setup = %+v; want 90x30, user ada, MaxInputLen 77", setup)
	}
	if setup.Renderer.HasDarkBackground() {
		t.Error("the client answered a white background; the session's renderer thinks it is dark")
	}
	if got := profileName(setup.Renderer.ColorProfile()); got != "ansi256" {
		t.Errorf("TERM=xterm-256color gave colour profile %s, want ansi256", got)
	}
	if want := filepath.Join(ts.state, "users", UserFolderName(ts.key.PublicKey())); setup.Folder != want {
		t.Errorf("Folder = %s, want %s", setup.Folder, want)
	}
	if filepath.Dir(setup.RecoveryPath) != setup.Folder {
		t.Errorf("RecoveryPath %s is not inside the folder %s", setup.RecoveryPath, setup.Folder)
	}

	if err := tm.sess.WindowChange(40, 120); err != nil {
		t.Fatal(err)
	}
	tm.mustSee("size: 120x40")
	tm.typeKeys("\x03") // ctrl+c: the probe quits
	if code, err := tm.exit(10 * time.Second); err != nil || code != ExitOK {
		t.Fatalf("exit = %d, %v; want %d", code, err, ExitOK)
	}
	// The log tells the story: connection, login, start, end with its
	// duration, each session line with the key's fingerprint.
	fp := gossh.FingerprintSHA256(ts.key.PublicKey())
	deadline := time.Now().Add(5 * time.Second)
	for !strings.Contains(ts.logs.String(), `"msg":"session end"`) && time.Now().Before(deadline) {
		time.Sleep(10 * time.Millisecond)
	}
	logs := ts.logs.String()
	for _, want := range []string{`"msg":"connection"`, `"msg":"authenticated","method":"publickey","user":"ada"`,
		`"msg":"session start"`, `"msg":"session end"`, `"duration":`, `"fingerprint":"` + fp + `"`} {
		if !strings.Contains(logs, want) {
			t.Errorf("log lacks %s; logs:\n%s", want, logs)
		}
	}
}

// TestRendererFollowsEachClient: two clients at once, each gets its own
// profile and background, none the server's.
func TestRendererFollowsEachClient(t *testing.T) {
	setups := make(chan SessionSetup, 2)
	ts := startServer(t, func(c *Config) { c.NewModel = newProbe(setups) })
	plain := ts.mustTerm(t, ts.key, termOptions{term: "dumb", silent: true})
	plain.mustSee("enthalpath probe screen")
	first := <-setups
	light := ts.mustTerm(t, ts.key, termOptions{term: "xterm-256color", answer: lightAnswer})
	light.mustSee("enthalpath probe screen")
	second := <-setups
	if got := profileName(first.Renderer.ColorProfile()); got != "none" {
		t.Errorf("TERM=dumb gave colour profile %s, want none", got)
	}
	if got := profileName(second.Renderer.ColorProfile()); got != "ansi256" {
		t.Errorf("TERM=xterm-256color gave colour profile %s, want ansi256", got)
	}
	if first.Renderer == second.Renderer {
		t.Error("two sessions share one renderer")
	}
	if second.Renderer.HasDarkBackground() {
		t.Error("the white-background client got a dark-background renderer")
	}
	// A silent xterm: the query times out and the session still starts.
	silent := ts.mustTerm(t, ts.key, termOptions{silent: true})
	silent.mustSee("enthalpath probe screen")
	silent.typeKeys("a")
	silent.mustSee("keys: a|")
}

func TestNoPTYGetsMessage(t *testing.T) {
	ts := startServer(t, nil)
	client, err := ts.dial(ts.key)
	if err != nil {
		t.Fatal(err)
	}
	defer client.Close()
	sess, err := client.NewSession()
	if err != nil {
		t.Fatal(err)
	}
	stderr := &syncBuffer{}
	sess.Stderr = stderr
	if err := sess.Shell(); err != nil {
		t.Fatal(err)
	}
	err = sess.Wait()
	var exitErr *gossh.ExitError
	if !errors.As(err, &exitErr) || exitErr.ExitStatus() != ExitNoTerminal {
		t.Fatalf("Wait() = %v; want exit status %d", err, ExitNoTerminal)
	}
	msg := stderr.String()
	if !strings.Contains(msg, "needs a terminal") || strings.Count(strings.TrimSpace(msg), "\n") != 0 {
		t.Errorf("message = %q; want one line saying a terminal is needed", msg)
	}
}

func TestCommandRefused(t *testing.T) {
	ts := startServer(t, nil)
	client, err := ts.dial(ts.key)
	if err != nil {
		t.Fatal(err)
	}
	defer client.Close()
	sess, err := client.NewSession()
	if err != nil {
		t.Fatal(err)
	}
	out, err := sess.CombinedOutput("cat /etc/passwd")
	var exitErr *gossh.ExitError
	if !errors.As(err, &exitErr) || exitErr.ExitStatus() != ExitNoTerminal {
		t.Fatalf("exec: %v; want exit status %d", err, ExitNoTerminal)
	}
	if strings.Contains(string(out), "root:") || !strings.Contains(string(out), "without a command") {
		t.Errorf("output = %q", out)
	}
}

func TestSessionLimit(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.MaxSessions = 2 })
	a := ts.mustTerm(t, ts.key, termOptions{})
	a.mustSee("enthalpath probe screen")
	b := ts.mustTerm(t, ts.key, termOptions{})
	b.mustSee("enthalpath probe screen")

	c := ts.mustTerm(t, ts.key, termOptions{})
	code, err := c.exit(10 * time.Second)
	if err != nil || code != ExitBusy {
		t.Fatalf("third session: exit %d, %v; want %d", code, err, ExitBusy)
	}
	if msg := c.stderr.String(); !strings.Contains(msg, "all 2 places") || !strings.Contains(msg, "try again") {
		t.Errorf("refusal = %q; want a polite line naming the limit", msg)
	}
	// The two running sessions are untouched, and a freed place is reused.
	a.typeKeys("x")
	a.mustSee("keys: x|")
	b.typeKeys("\x03")
	if code, err := b.exit(10 * time.Second); err != nil || code != ExitOK {
		t.Fatalf("second session exit %d, %v", code, err)
	}
	d := ts.mustTerm(t, ts.key, termOptions{})
	d.mustSee("enthalpath probe screen")
}

func TestIdleTimeoutClosesIdleSession(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.IdleTimeout = 400 * time.Millisecond })
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	// Keystrokes keep it open: one every 100 ms for a second is well within
	// the 400 ms allowance.
	for i := 0; i < 10; i++ {
		tm.typeKeys("k")
		time.Sleep(100 * time.Millisecond)
	}
	tm.mustSee("keys: kkkkkkkkkk|")
	code, err := tm.exit(5 * time.Second)
	if err != nil || code != ExitIdle {
		t.Fatalf("exit %d, %v; want %d", code, err, ExitIdle)
	}
	if msg := tm.stderr.String(); !strings.Contains(msg, "without a keystroke") || !strings.Contains(msg, "recovered.cycle") {
		t.Errorf("closing line = %q; want the idle reason and the recovery file", msg)
	}
	saved := recoveryFiles(t, ts, ts.key)
	if len(saved) != 1 || !strings.Contains(saved[0], "typed: kkkkkkkkkk") {
		t.Errorf("recovery files = %q", saved)
	}
}

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

func TestBurstDropped(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.MaxBurst = 1024 })
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	tm.typeKeys(strings.Repeat("B", 16*1024))
	time.Sleep(300 * time.Millisecond) // past the quiet period after a burst
	tm.typeKeys("z")
	tm.mustSee("keys: z|")
	if strings.Contains(tm.screen(), "BBBB") {
		t.Error("part of a 16 KiB burst reached the model")
	}
	if !strings.Contains(ts.logs.String(), "input burst dropped") {
		t.Error("the dropped burst is not in the log")
	}
	// The member is told on screen, not only the log.
	tm.mustSee("note: a paste of more than 1024 bytes at once was dropped")
}

// TestPathEscapesThroughServer types file names into a session: names that
// leave the user's folder are refused and nothing appears outside it.
func TestPathEscapesThroughServer(t *testing.T) {
	ts := startServer(t, nil)
	outside := t.TempDir()
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	folder := filepath.Join(ts.state, "users", UserFolderName(ts.key.PublicKey()))
	if err := os.Symlink(outside, filepath.Join(folder, "door")); err != nil {
		t.Fatal(err)
	}
	tm.typeKeys("LiF")
	tm.mustSee("keys: LiF|")
	for _, name := range []string{
		"../escape.cycle",
		"../../../../../../tmp/escape.cycle",
		filepath.Join(outside, "escape.cycle"),
		"door/escape.cycle",
		"~/escape.cycle",
	} {
		tm.typeKeys(">" + name + "\r")
		tm.mustSee("refused " + name)
	}
	tm.typeKeys(">mine/LiF.cycle\r")
	tm.mustSee("saved mine/LiF.cycle")
	if b, err := os.ReadFile(filepath.Join(folder, "mine", "LiF.cycle")); err != nil || string(b) != "LiF" {
		t.Errorf("saved file: %q, %v", b, err)
	}
	if entries, _ := os.ReadDir(outside); len(entries) != 0 {
		t.Errorf("files appeared outside the user's folder: %v", entries)
	}
	if _, err := os.Stat(filepath.Join(ts.state, "users", "escape.cycle")); err == nil {
		t.Error("escape.cycle written next to the user folders")
	}
}

func TestUserFolders(t *testing.T) {
	ts := startServer(t, nil)
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	for _, dir := range []string{filepath.Join(ts.state, "users"), filepath.Join(ts.state, "users", UserFolderName(ts.key.PublicKey()))} {
		info, err := os.Stat(dir)
		if err != nil {
			t.Fatal(err)
		}
		if info.Mode().Perm() != 0o700 {
			t.Errorf("%s has mode %04o, want 0700", dir, info.Mode().Perm())
		}
	}
	// The folder name is the hexadecimal form of the digest in the
	// SHA256 fingerprint (OpenSSH prints it as unpadded base64).
	fp := strings.TrimPrefix(gossh.FingerprintSHA256(ts.key.PublicKey()), "SHA256:")
	digest, err := base64.RawStdEncoding.DecodeString(fp)
	if err != nil {
		t.Fatal(err)
	}
	if got := UserFolderName(ts.key.PublicKey()); got != strings.ToLower(hexString(digest)) || len(got) != 64 {
		t.Errorf("UserFolderName = %s, want hex of %s", got, fp)
	}
}

func hexString(b []byte) string {
	const digits = "0123456789abcdef"
	out := make([]byte, 0, 2*len(b))
	for _, c := range b {
		out = append(out, digits[c>>4], digits[c&15])
	}
	return string(out)
}

func TestAuthorizedKeysReread(t *testing.T) {
	ts := startServer(t, nil)
	newcomer := newKey(t)
	if _, err := ts.dial(newcomer); err == nil {
		t.Fatal("newcomer let in before being listed")
	}
	content := string(gossh.MarshalAuthorizedKey(ts.key.PublicKey())) +
		"# a comment, a bad line and an option line follow\nnot-a-key at all\n" +
		`command="true" ` + string(gossh.MarshalAuthorizedKey(newcomer.PublicKey()))
	writeLater(t, ts.authKeys, content)
	c, err := ts.dial(newcomer)
	if err != nil {
		t.Fatalf("newcomer refused after being listed: %v", err)
	}
	c.Close()
	if logs := ts.logs.String(); !strings.Contains(logs, ":3:") || !strings.Contains(logs, "options are ignored") {
		t.Errorf("bad line or ignored options not reported with the line number; logs:\n%s", logs)
	}
	writeLater(t, ts.authKeys, string(gossh.MarshalAuthorizedKey(newcomer.PublicKey())))
	if c, err := ts.dial(ts.key); err == nil {
		c.Close()
		t.Fatal("a key removed from the file is still let in")
	}
	// An unreadable file refuses everyone (fails closed).
	if err := os.Remove(ts.authKeys); err != nil {
		t.Fatal(err)
	}
	if c, err := ts.dial(newcomer); err == nil {
		c.Close()
		t.Fatal("a key was let in while the authorized-keys file is missing")
	}
}

// writeLater rewrites path with a modification time distinct from the
// previous one, so the change is seen even on coarse-grained file systems.
func writeLater(t *testing.T, path, content string) {
	t.Helper()
	info, err := os.Stat(path)
	if err != nil {
		t.Fatal(err)
	}
	if err := os.WriteFile(path, []byte(content), 0o600); err != nil {
		t.Fatal(err)
	}
	later := info.ModTime().Add(2 * time.Second)
	if err := os.Chtimes(path, later, later); err != nil {
		t.Fatal(err)
	}
}

func TestHostKeyCreatedAndReused(t *testing.T) {
	path := filepath.Join(t.TempDir(), "keys", "host_ed25519")
	first, created, err := LoadOrCreateHostKey(path)
	if err != nil || !created {
		t.Fatalf("first start: created=%v, %v", created, err)
	}
	if first.PublicKey().Type() != gossh.KeyAlgoED25519 {
		t.Errorf("host key type %s, want ed25519", first.PublicKey().Type())
	}
	for p, want := range map[string]os.FileMode{path: 0o600, filepath.Dir(path): 0o700} {
		info, err := os.Stat(p)
		if err != nil {
			t.Fatal(err)
		}
		if info.Mode().Perm() != want {
			t.Errorf("%s mode %04o, want %04o", p, info.Mode().Perm(), want)
		}
	}
	again, created, err := LoadOrCreateHostKey(path)
	if err != nil || created {
		t.Fatalf("second start: created=%v, %v", created, err)
	}
	if gossh.FingerprintSHA256(again.PublicKey()) != gossh.FingerprintSHA256(first.PublicKey()) {
		t.Error("host key changed between starts")
	}
	if err := os.Chmod(path, 0o644); err != nil {
		t.Fatal(err)
	}
	_, _, err = LoadOrCreateHostKey(path)
	var hkErr *HostKeyError
	if !errors.As(err, &hkErr) || !strings.Contains(err.Error(), "chmod 600") {
		t.Errorf("group-readable host key: %v; want a HostKeyError saying chmod 600", err)
	}
}

func TestLoopbackOnlyWithoutAuthorizedKeys(t *testing.T) {
	dir := t.TempDir()
	cfg := Config{
		HostKeyPath: filepath.Join(dir, "host"),
		StateDir:    filepath.Join(dir, "state"),
		NewModel:    newProbe(nil),
		ShutdownMsg: func(reason string) tea.Msg { return probeShutdown{reason} },
	}
	srv, err := New(cfg)
	if err != nil {
		t.Fatal(err)
	}
	for _, addr := range []string{"0.0.0.0:0", ":0", "[::]:0", "192.0.2.1:2324"} {
		if err := srv.ListenAndServe(addr); !errors.Is(err, ErrNotLoopback) {
			t.Errorf("ListenAndServe(%s) = %v; want ErrNotLoopback", addr, err)
		}
	}
	for addr, want := range map[string]bool{"127.0.0.1:2324": true, "[::1]:2324": true, "localhost:2324": true,
		"127.9.9.9:1": true, "0.0.0.0:2324": false, ":2324": false, "example.org:22": false, "nonsense": false} {
		if got := IsLoopback(addr); got != want {
			t.Errorf("IsLoopback(%q) = %v, want %v", addr, got, want)
		}
	}
	// On loopback, any key is let in, into a folder of its own.
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Fatal(err)
	}
	served := make(chan error, 1)
	go func() { served <- srv.Serve(ln) }()
	defer func() {
		ctx, cancel := context.WithTimeout(context.Background(), 10*time.Second)
		defer cancel()
		srv.Shutdown(ctx)
		<-served
	}()
	client, err := gossh.Dial("tcp", ln.Addr().String(), &gossh.ClientConfig{
		User: "anyone", Auth: []gossh.AuthMethod{gossh.PublicKeys(newKey(t))},
		HostKeyCallback: gossh.FixedHostKey(srv.HostKey()), Timeout: 5 * time.Second,
	})
	if err != nil {
		t.Fatalf("loopback without authorized keys refused a key: %v", err)
	}
	client.Close()
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

func TestHugeWindowClamped(t *testing.T) {
	ts := startServer(t, nil)
	tm := ts.mustTerm(t, ts.key, termOptions{width: 100000, height: 100000})
	tm.mustSee("size: 1000x500")
	if err := tm.sess.WindowChange(1<<30, 1<<30); err != nil {
		t.Fatal(err)
	}
	tm.typeKeys("w")
	tm.mustSee("keys: w|")
	if strings.Contains(tm.screen(), "size: 1073741824") {
		t.Error("a window of 2³⁰ columns reached the model")
	}
}

// TestOnlyTheWorkshopIsServed: port forwarding, subsystems (sftp) and
// other channel types are refused, so nothing else on the host is exposed.
func TestOnlyTheWorkshopIsServed(t *testing.T) {
	ts := startServer(t, nil)
	client, err := ts.dial(ts.key)
	if err != nil {
		t.Fatal(err)
	}
	defer client.Close()
	if conn, err := client.Dial("tcp", ts.addr); err == nil {
		conn.Close()
		t.Error("local port forwarding was allowed")
	}
	if ln, err := client.Listen("tcp", "127.0.0.1:0"); err == nil {
		ln.Close()
		t.Error("remote port forwarding was allowed")
	}
	if _, _, err := client.OpenChannel("x11", nil); err == nil {
		t.Error("an x11 channel was opened")
	}
	sess, err := client.NewSession()
	if err != nil {
		t.Fatal(err)
	}
	defer sess.Close()
	if err := sess.RequestSubsystem("sftp"); err == nil {
		if err := sess.Wait(); err == nil {
			t.Error("the sftp subsystem ran and exited 0")
		}
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

// TestSilentConnectionClosed: a TCP connection that never logs in is closed
// after the login timeout, and a flood of them cannot hold every place.
func TestSilentConnectionClosed(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.LoginTimeout = 300 * time.Millisecond; c.MaxSessions = 1 })
	var silent []net.Conn
	for i := 0; i < 40; i++ { // more than the 4×1+16 connection places
		conn, err := net.Dial("tcp", ts.addr)
		if err != nil {
			t.Fatal(err)
		}
		defer conn.Close()
		silent = append(silent, conn)
	}
	for _, conn := range silent {
		conn.SetReadDeadline(time.Now().Add(10 * time.Second))
		buf := make([]byte, 256)
		for {
			if _, err := conn.Read(buf); err != nil {
				if ne, ok := err.(net.Error); ok && ne.Timeout() {
					t.Fatal("a silent connection stayed open 10 s")
				}
				break
			}
		}
	}
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
}

// TestBusyLine: the refusal reads right for one place and for several.
func TestBusyLine(t *testing.T) {
	for _, tc := range []struct {
		n    int
		want string
	}{{1, "the one place on this server is taken"}, {3, "all 3 places on this server are taken"}} {
		if got := busyLine(tc.n); !strings.HasPrefix(got, tc.want) {
			t.Errorf("busyLine(%d) = %q, want it to start %q", tc.n, got, tc.want)
		}
	}
}
