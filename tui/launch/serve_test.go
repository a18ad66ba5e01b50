//go:build unix

package launch

import (
	"bytes"
	"crypto/ed25519"
	"crypto/rand"
	"encoding/json"
	"errors"
	"io"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	"github.com/charmbracelet/x/ansi"
	gossh "golang.org/x/crypto/ssh"

	"enthalpath/cycle/cli"
	"enthalpath/tui/serve"
)

// The flag rules tested here are the project's issue 7 (no authorized keys:
// loopback only) and the usual command-line convention that bad usage exits
// 2 (common practice, no source).

// runServe runs "enthalpath serve ARGS" through the command line's
// dispatcher, as main does, and returns the exit code.
func runServe(env cli.Env, args []string) cli.ExitCode {
	return cli.Main(env, append([]string{"serve"}, args...), cli.Interactive{Serve: Serve})
}

type lockedBuffer struct {
	mu  sync.Mutex
	buf bytes.Buffer
}

func (b *lockedBuffer) Write(p []byte) (int, error) {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.Write(p)
}

func (b *lockedBuffer) String() string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.String()
}

func TestServeUsage(t *testing.T) {
	state := t.TempDir()
	tests := []struct {
		args []string
		code cli.ExitCode
		says string
	}{
		{[]string{"--help"}, cli.ExitOK, "--authorized-keys"},
		{[]string{"--state-dir", state, "extra"}, cli.ExitUsage, "no arguments"},
		{[]string{"--state-dir", state, "--listen", "0.0.0.0:2324"}, cli.ExitUsage, "loopback"},
		{[]string{"--state-dir", state, "--listen", ":2324"}, cli.ExitUsage, "--authorized-keys FILE"},
		{[]string{"--state-dir", state, "--idle-timeout", "-5s"}, cli.ExitUsage, "--idle-timeout"},
		{[]string{"--state-dir", state, "--max-sessions", "0"}, cli.ExitUsage, "--max-sessions"},
		{[]string{"--state-dir", state, "--max-line", "0"}, cli.ExitUsage, "--max-line"},
		{[]string{"--state-dir", state, "--log-format", "xml"}, cli.ExitUsage, "--log-format"},
		{[]string{"--state-dir", state, "--bogus"}, cli.ExitUsage, "bogus"},
		{[]string{"--state-dir", state, "--authorized-keys", filepath.Join(state, "absent")}, cli.ExitUsage, "absent"},
	}
	for _, tt := range tests {
		t.Run(strings.Join(tt.args, " "), func(t *testing.T) {
			var stderr lockedBuffer
			code := runServe(cli.Env{Stdout: &stderr, Stderr: &stderr}, tt.args)
			if code != tt.code || !strings.Contains(stderr.String(), tt.says) {
				t.Errorf("runServe(%q) = %d, stderr %q; want %d mentioning %q", tt.args, code, stderr.String(), tt.code, tt.says)
			}
		})
	}
}

// TestServeMissingKeysCreatesNothing: serve with an authorized-keys file
// that is not there fails before it creates a host key (it once left a new
// key behind).
func TestServeMissingKeysCreatesNothing(t *testing.T) {
	state := filepath.Join(t.TempDir(), "state")
	var stderr lockedBuffer
	code := runServe(cli.Env{Stdout: io.Discard, Stderr: &stderr},
		[]string{"--state-dir", state, "--authorized-keys", filepath.Join(state, "absent.keys")})
	if code != cli.ExitUsage {
		t.Errorf("exit %d, want %d: %s", code, cli.ExitUsage, stderr.String())
	}
	if _, err := os.Stat(filepath.Join(state, "host_ed25519")); err == nil {
		t.Error("a host key was created")
	}
	if _, err := os.Stat(state); err == nil {
		t.Error("the state folder was created")
	}
}

func TestServeDefaults(t *testing.T) {
	f, err := parseServeFlags([]string{"--state-dir", "/srv/ep"})
	if err != nil {
		t.Fatal(err)
	}
	if f.listen != defaultListen || !serve.IsLoopback(f.listen) {
		t.Errorf("default listen %s is not loopback", f.listen)
	}
	if f.config.HostKeyPath != "/srv/ep/host_ed25519" || f.config.MaxSessions != serve.DefaultMaxSessions ||
		f.config.IdleTimeout != serve.DefaultIdleTimeout || f.config.RecoveryFile != "recovery.hesscycle" {
		t.Errorf("defaults = %+v", f.config)
	}
}

// TestServeEndToEnd runs the command with the real workshop on 127.0.0.1,
// opens a compound over SSH, changes a value, sends the process SIGTERM and
// checks that the work was saved and the command ended in time.
func TestServeEndToEnd(t *testing.T) {
	if testing.Short() {
		t.Skip("starts the whole workshop")
	}
	dir := t.TempDir()
	_, private, _ := ed25519.GenerateKey(rand.Reader)
	signer, _ := gossh.NewSignerFromKey(private)
	keys := filepath.Join(dir, "authorized_keys")
	if err := os.WriteFile(keys, gossh.MarshalAuthorizedKey(signer.PublicKey()), 0o600); err != nil {
		t.Fatal(err)
	}
	var stderr lockedBuffer
	done := make(chan cli.ExitCode, 1)
	go func() {
		done <- runServe(cli.Env{Stdout: io.Discard, Stderr: &stderr}, []string{
			"--state-dir", filepath.Join(dir, "state"), "--listen", "127.0.0.1:0",
			"--authorized-keys", keys, "--log-format", "json"})
	}()
	addr := ""
	for deadline := time.Now().Add(20 * time.Second); addr == "" && time.Now().Before(deadline); time.Sleep(20 * time.Millisecond) {
		for _, line := range strings.Split(stderr.String(), "\n") {
			var rec struct{ Msg, Listen string }
			if json.Unmarshal([]byte(line), &rec) == nil && rec.Msg == "listening" {
				addr = rec.Listen
			}
		}
	}
	if addr == "" {
		t.Fatalf("the server did not start; stderr:\n%s", stderr.String())
	}
	client, err := gossh.Dial("tcp", addr, &gossh.ClientConfig{User: "ada", Auth: []gossh.AuthMethod{gossh.PublicKeys(signer)},
		HostKeyCallback: gossh.InsecureIgnoreHostKey(), Timeout: 5 * time.Second})
	if err != nil {
		t.Fatal(err)
	}
	defer client.Close()
	sess, _ := client.NewSession()
	var out, sessErr lockedBuffer
	sess.Stdout, sess.Stderr = &out, &sessErr
	stdin, _ := sess.StdinPipe()
	if err := sess.RequestPty("xterm-256color", 30, 100, gossh.TerminalModes{}); err != nil {
		t.Fatal(err)
	}
	if err := sess.Shell(); err != nil {
		t.Fatal(err)
	}
	see := func(text string) {
		t.Helper()
		for deadline := time.Now().Add(15 * time.Second); time.Now().Before(deadline); time.Sleep(20 * time.Millisecond) {
			if strings.Contains(ansi.Strip(out.String()), text) {
				return
			}
		}
		t.Fatalf("%q never shown; screen:\n%s", text, ansi.Strip(out.String()))
	}
	io.WriteString(stdin, "\x1b[?62c") // answer the terminal query as a VT220 does
	see("NaCl")                        // the shelf lists the compounds
	io.WriteString(stdin, "NaCl")
	time.Sleep(200 * time.Millisecond)
	io.WriteString(stdin, "\r")
	see("sodium chloride")
	for _, keys := range []string{"k", "e", "-350", "\r"} {
		io.WriteString(stdin, keys)
		time.Sleep(200 * time.Millisecond)
	}
	see("unsaved")

	// Names typed into the save prompt cannot leave the user's folder.
	outside := t.TempDir()
	folder := filepath.Join(dir, "state", "users", serve.UserFolderName(signer.PublicKey()))
	if err := os.Symlink(outside, filepath.Join(folder, "door")); err != nil {
		t.Fatal(err)
	}
	for _, name := range []string{"../escape", "../../../escape", filepath.Join(outside, "escape"), "~/escape", "door/escape"} {
		mark := len(out.String())
		for _, keys := range []string{"\x13", "\x15", name, "\r"} { // ctrl+s, ctrl+u (clear), the name, enter
			io.WriteString(stdin, keys)
			time.Sleep(150 * time.Millisecond)
		}
		for deadline := time.Now().Add(10 * time.Second); ; time.Sleep(20 * time.Millisecond) {
			if strings.Contains(ansi.Strip(out.String()[mark:]), "refused") {
				break
			}
			if time.Now().After(deadline) {
				t.Fatalf("saving as %q was not refused; screen:\n%s", name, ansi.Strip(out.String()[mark:]))
			}
		}
		io.WriteString(stdin, "\x1b") // esc closes the prompt
		time.Sleep(150 * time.Millisecond)
	}
	if entries, _ := os.ReadDir(outside); len(entries) != 0 {
		t.Errorf("a file was written outside the user's folder: %v", entries)
	}
	if matches, _ := filepath.Glob(filepath.Join(dir, "*escape*")); len(matches) != 0 {
		t.Errorf("a file was written outside the user's folder: %v", matches)
	}

	// An earlier session's recovery file is not written over (it once
	// was): this session's work goes to the next name, and the member is
	// told that name, as the workshop reports it.
	earlier := filepath.Join(folder, "recovery.hesscycle")
	if err := os.WriteFile(earlier, []byte("an earlier session's work"), 0o600); err != nil {
		t.Fatal(err)
	}
	start := time.Now()
	if err := syscall.Kill(os.Getpid(), syscall.SIGTERM); err != nil {
		t.Fatal(err)
	}
	select {
	case code := <-done:
		if code != cli.ExitOK {
			t.Errorf("serve exited %d after SIGTERM; stderr:\n%s", code, stderr.String())
		}
	case <-time.After(15 * time.Second):
		t.Fatal("serve still running 15 s after SIGTERM")
	}
	if took := time.Since(start); took > 10*time.Second {
		t.Errorf("SIGTERM to exit took %v, over 10 s", took)
	}
	err = sess.Wait()
	var exitErr *gossh.ExitError
	if !errors.As(err, &exitErr) || exitErr.ExitStatus() != serve.ExitShutdown {
		t.Errorf("session ended with %v; want exit status %d", err, serve.ExitShutdown)
	}
	recovery := filepath.Join(folder, "recovery-2.hesscycle")
	if b, err := os.ReadFile(recovery); err != nil || !bytes.Contains(b, []byte("NaCl")) {
		t.Errorf("recovery file %s: %v, content %q", recovery, err, b)
	}
	if b, _ := os.ReadFile(earlier); string(b) != "an earlier session's work" {
		t.Errorf("the earlier recovery file was changed: %q", b)
	}
	if !strings.Contains(sessErr.String(), "Your unsaved work is in recovery-2.hesscycle.") {
		t.Errorf("closing line %q does not name recovery-2.hesscycle", sessErr.String())
	}
}
