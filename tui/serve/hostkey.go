package serve

import (
	"crypto/ed25519"
	"crypto/rand"
	"encoding/pem"
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"

	gossh "golang.org/x/crypto/ssh"
)

// HostKeyError says what is wrong with the host key file and what to do.
type HostKeyError struct {
	Path string
	What string
	Err  error
}

func (e *HostKeyError) Error() string {
	msg := fmt.Sprintf("host key %s: %s", e.Path, e.What)
	if e.Err != nil {
		msg += ": " + e.Err.Error()
	}
	return msg
}

func (e *HostKeyError) Unwrap() error { return e.Err }

// LoadOrCreateHostKey reads the host key at path, or creates an ed25519 key
// there (file mode 0600; missing folders 0700) when the file does not exist.
// It refuses a key file that group or others may read or write, the way a
// private key should never be: fix it with chmod 600. created reports
// whether a new key was written.
func LoadOrCreateHostKey(path string) (signer gossh.Signer, created bool, err error) {
	info, err := os.Stat(path)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		signer, err := createHostKey(path)
		return signer, err == nil, err
	case err != nil:
		return nil, false, &HostKeyError{Path: path, What: "cannot be read", Err: err}
	case !info.Mode().IsRegular():
		return nil, false, &HostKeyError{Path: path, What: "is not a regular file"}
	case info.Mode().Perm()&0o077 != 0:
		return nil, false, &HostKeyError{Path: path,
			What: fmt.Sprintf("has mode %04o, open to group or others; run chmod 600 %s", info.Mode().Perm(), path)}
	}
	pemBytes, err := os.ReadFile(path)
	if err != nil {
		return nil, false, &HostKeyError{Path: path, What: "cannot be read", Err: err}
	}
	signer, err = gossh.ParsePrivateKey(pemBytes)
	if err != nil {
		return nil, false, &HostKeyError{Path: path, What: "is not an unencrypted OpenSSH or PEM private key", Err: err}
	}
	return signer, false, nil
}

func createHostKey(path string) (gossh.Signer, error) {
	if err := os.MkdirAll(filepath.Dir(path), 0o700); err != nil {
		return nil, &HostKeyError{Path: path, What: "its folder cannot be created", Err: err}
	}
	_, private, err := ed25519.GenerateKey(rand.Reader)
	if err != nil {
		return nil, &HostKeyError{Path: path, What: "key generation failed", Err: err}
	}
	block, err := gossh.MarshalPrivateKey(private, "enthalpath host key")
	if err != nil {
		return nil, &HostKeyError{Path: path, What: "key encoding failed", Err: err}
	}
	// O_EXCL: two servers starting at once must not overwrite each other's key.
	file, err := os.OpenFile(path, os.O_WRONLY|os.O_CREATE|os.O_EXCL, 0o600)
	if err != nil {
		return nil, &HostKeyError{Path: path, What: "cannot be created", Err: err}
	}
	if err := pem.Encode(file, block); err != nil {
		file.Close()
		os.Remove(path)
		return nil, &HostKeyError{Path: path, What: "cannot be written", Err: err}
	}
	if err := file.Close(); err != nil {
		os.Remove(path)
		return nil, &HostKeyError{Path: path, What: "cannot be written", Err: err}
	}
	return gossh.NewSignerFromKey(private)
}
