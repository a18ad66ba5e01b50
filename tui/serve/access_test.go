package serve

import (
	"context"
	"encoding/base64"
	"errors"
	"net"
	"os"
	"path/filepath"
	"strings"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	gossh "golang.org/x/crypto/ssh"
)

// The expected behaviours below (keys, the host key, loopback, user folders and paths) come from the
// project's issue 7 (what the server must do); the SSH protocol facts
// (methods, exit-status) are RFC 4252 and RFC 4254.

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
