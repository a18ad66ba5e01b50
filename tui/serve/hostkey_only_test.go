package serve

import (
	"bytes"
	"net"
	"os"
	"testing"

	gossh "golang.org/x/crypto/ssh"
)

// TestOnlyConfiguredHostKey: the server presents exactly the host key of
// --host-key and writes no key of its own into the working directory
// (wish.NewServer does both when no signer is set while its options run).
func TestOnlyConfiguredHostKey(t *testing.T) {
	wd := t.TempDir()
	t.Chdir(wd)

	ts := startServer(t, nil)
	if n := len(ts.srv.ssh.HostSigners); n != 1 {
		t.Errorf("server holds %d host keys, want 1", n)
	}
	var seen gossh.PublicKey
	cfg := &gossh.ClientConfig{
		User: "tester",
		Auth: []gossh.AuthMethod{gossh.PublicKeys(ts.key)},
		HostKeyCallback: func(_ string, _ net.Addr, key gossh.PublicKey) error {
			seen = key
			return nil
		},
	}
	client, err := gossh.Dial("tcp", ts.addr, cfg)
	if err != nil {
		t.Fatal(err)
	}
	client.Close()
	if seen == nil || !bytes.Equal(seen.Marshal(), ts.srv.HostKey().Marshal()) {
		t.Errorf("client saw a host key other than the configured one")
	}
	entries, err := os.ReadDir(wd)
	if err != nil {
		t.Fatal(err)
	}
	for _, e := range entries {
		t.Errorf("server wrote %q into the working directory", e.Name())
	}
}
