package serve

import (
	"encoding/base64"
	"errors"
	"net"
	"path/filepath"
	"strings"
	"testing"
	"time"

	gossh "golang.org/x/crypto/ssh"
)

// The expected behaviours below come from the
// project's issue 7 (what the server must do); the SSH protocol facts
// (methods, exit-status) are RFC 4252 and RFC 4254.

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
