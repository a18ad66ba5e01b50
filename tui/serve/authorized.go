package serve

import (
	"bytes"
	"fmt"
	"log/slog"
	"os"
	"strings"
	"sync"
	"time"

	gossh "golang.org/x/crypto/ssh"
)

// authorizedKeys is the authorized-keys file, re-read when its size or
// modification time changes.
type authorizedKeys struct {
	path string
	log  *slog.Logger

	mu      sync.Mutex
	modTime time.Time
	size    int64
	keys    map[string]bool // key in wire format
	loadErr error           // the last read failed: refuse everyone
}

// AuthorizedKeysError names the file and line at fault.
type AuthorizedKeysError struct {
	Path string
	Line int // 0 when the whole file is at fault
	Err  error
}

func (e *AuthorizedKeysError) Error() string {
	if e.Line > 0 {
		return fmt.Sprintf("authorized keys %s:%d: %v", e.Path, e.Line, e.Err)
	}
	return fmt.Sprintf("authorized keys %s: %v", e.Path, e.Err)
}

func (e *AuthorizedKeysError) Unwrap() error { return e.Err }

// loadAuthorizedKeys reads the file once; an unreadable file is an error at
// start.
func loadAuthorizedKeys(path string, log *slog.Logger) (*authorizedKeys, error) {
	a := &authorizedKeys{path: path, log: log}
	a.mu.Lock()
	defer a.mu.Unlock()
	if err := a.reloadLocked(); err != nil {
		return nil, err
	}
	return a, nil
}

// allows reports whether key is listed, re-reading the file first if it
// changed.
func (a *authorizedKeys) allows(key gossh.PublicKey) bool {
	a.mu.Lock()
	defer a.mu.Unlock()
	info, err := os.Stat(a.path)
	if err != nil {
		if a.loadErr == nil {
			a.log.Error("authorized keys file unreadable; refusing every key until it is back", "path", a.path, "error", err)
		}
		a.loadErr = err
		return false
	}
	if a.loadErr != nil || !info.ModTime().Equal(a.modTime) || info.Size() != a.size {
		if err := a.reloadLocked(); err != nil {
			a.log.Error("authorized keys file unreadable; refusing every key until it is back", "path", a.path, "error", err)
			return false
		}
	}
	return a.keys[string(key.Marshal())]
}

func (a *authorizedKeys) reloadLocked() error {
	info, err := os.Stat(a.path)
	if err != nil {
		a.loadErr = &AuthorizedKeysError{Path: a.path, Err: err}
		return a.loadErr
	}
	content, err := os.ReadFile(a.path)
	if err != nil {
		a.loadErr = &AuthorizedKeysError{Path: a.path, Err: err}
		return a.loadErr
	}
	keys := make(map[string]bool)
	for i, line := range bytes.Split(content, []byte("\n")) {
		text := strings.TrimSpace(string(line))
		if text == "" || strings.HasPrefix(text, "#") {
			continue
		}
		key, _, options, _, err := gossh.ParseAuthorizedKey([]byte(text))
		if err != nil {
			a.log.Warn("authorized keys line skipped", "error", (&AuthorizedKeysError{Path: a.path, Line: i + 1, Err: err}).Error())
			continue
		}
		if len(options) > 0 {
			a.log.Warn("authorized keys options are ignored; the key is accepted as a plain key",
				"path", a.path, "line", i+1, "options", strings.Join(options, ","))
		}
		keys[string(key.Marshal())] = true
	}
	if len(keys) == 0 {
		a.log.Warn("authorized keys file lists no usable key; every connection will be refused", "path", a.path)
	}
	a.keys, a.loadErr = keys, nil
	a.modTime, a.size = info.ModTime(), info.Size()
	a.log.Info("authorized keys loaded", "path", a.path, "keys", len(keys))
	return nil
}
