package serve

import (
	"bytes"
	"context"
	"crypto/ed25519"
	"crypto/rand"
	"errors"
	"fmt"
	"io"
	"log/slog"
	"net"
	"os"
	"path/filepath"
	"strings"
	"sync"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/x/ansi"
	gossh "golang.org/x/crypto/ssh"

	"enthalpath/thermo/fileio"
	"enthalpath/tui/safepath"
)

// Every test here talks to the server over 127.0.0.1 only.

// probeShutdown is the test's shutdown message.
type probeShutdown struct{ reason string }

// probeNotice is the probe's notice message (Config.NoticeMsg); it shows
// the text on its note line.
type probeNotice struct{ text string }

// probe is a small stand-in for the workshop: it shows what was typed, the
// window size, and saves through safepath on ">NAME<Enter>". '!' panics in
// Update, '@' in a command, '#' in View. On the shutdown message it writes
// what was typed to its recovery file, if anything was typed.
type probe struct {
	setup      SessionSetup
	typed      string
	w, h       int
	naming     bool
	name, note string
	viewPanic  bool
	recovered  string
}

// RecoveredTo implements Recoverer.
func (p *probe) RecoveredTo() string { return p.recovered }

func newProbe(setups chan<- SessionSetup) ModelFactory {
	return func(s SessionSetup) tea.Model {
		if setups != nil {
			select {
			case setups <- s:
			default:
			}
		}
		return &probe{setup: s, w: s.Width, h: s.Height}
	}
}

func (p *probe) Init() tea.Cmd { return nil }

func (p *probe) Update(msg tea.Msg) (tea.Model, tea.Cmd) {
	switch msg := msg.(type) {
	case probeShutdown:
		if p.typed != "" && p.recovered == "" {
			// As the workshop does: never over an earlier file.
			content := fmt.Sprintf("reason: %s\ntyped: %s\n", msg.reason, p.typed)
			written, err := fileio.WriteNew(p.setup.RecoveryPath, 0o600, []byte(content))
			if err != nil {
				p.note = err.Error()
			}
			p.recovered = written
		}
		return p, tea.Quit
	case probeNotice:
		p.note = msg.text
	case tea.WindowSizeMsg:
		p.w, p.h = msg.Width, msg.Height
	case tea.KeyMsg:
		if msg.Type != tea.KeyRunes {
			switch msg.String() {
			case "ctrl+c":
				return p, tea.Quit
			case "enter":
				if p.naming {
					p.naming = false
					p.note = p.save(p.name)
					p.name = ""
				}
			}
			return p, nil
		}
		for _, r := range msg.Runes {
			switch {
			case p.naming:
				p.name += string(r)
			case r == '>':
				p.naming = true
			case r == '!':
				panic("probe: panic in Update")
			case r == '@':
				return p, tea.Batch(nil, func() tea.Msg { panic("probe: panic in a command") })
			case r == '#':
				p.viewPanic = true
			default:
				p.typed += string(r)
			}
		}
	}
	return p, nil
}

func (p *probe) save(name string) string {
	path, err := safepath.Join(p.setup.Folder, name)
	if err != nil {
		return "refused " + name
	}
	if err := os.MkdirAll(filepath.Dir(path), 0o700); err != nil {
		return "failed " + name
	}
	if err := os.WriteFile(path, []byte(p.typed), 0o600); err != nil {
		return "failed " + name
	}
	return "saved " + name
}

func (p *probe) View() string {
	if p.viewPanic {
		panic("probe: panic in View")
	}
	return fmt.Sprintf("enthalpath probe screen\nkeys: %s|\ncount: %d;\nsize: %dx%d\nnote: %s\n",
		p.typed, len(p.typed), p.w, p.h, p.note)
}

// testServer is a running server with its folders and one authorized key.
type testServer struct {
	srv       *Server
	addr      string
	state     string
	authKeys  string
	key       gossh.Signer // authorized
	logs      *syncBuffer
	served    chan error
	shutdowns sync.Once
}

func newKey(t testing.TB) gossh.Signer {
	t.Helper()
	_, private, err := ed25519.GenerateKey(rand.Reader)
	if err != nil {
		t.Fatal(err)
	}
	signer, err := gossh.NewSignerFromKey(private)
	if err != nil {
		t.Fatal(err)
	}
	return signer
}

// syncBuffer collects log output from many goroutines.
type syncBuffer struct {
	mu  sync.Mutex
	buf bytes.Buffer
}

func (b *syncBuffer) Write(p []byte) (int, error) {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.Write(p)
}

func (b *syncBuffer) String() string {
	b.mu.Lock()
	defer b.mu.Unlock()
	return b.buf.String()
}

// startServer starts a server on 127.0.0.1 with an authorized-keys file
// holding one fresh key; edit adjusts the configuration first.
func startServer(t testing.TB, edit func(*Config)) *testServer {
	t.Helper()
	dir := t.TempDir()
	ts := &testServer{state: filepath.Join(dir, "state"), authKeys: filepath.Join(dir, "authorized_keys"),
		key: newKey(t), logs: &syncBuffer{}, served: make(chan error, 1)}
	if err := os.WriteFile(ts.authKeys, gossh.MarshalAuthorizedKey(ts.key.PublicKey()), 0o600); err != nil {
		t.Fatal(err)
	}
	cfg := Config{
		HostKeyPath:        filepath.Join(ts.state, "host", "ed25519"),
		AuthorizedKeysPath: ts.authKeys,
		StateDir:           ts.state,
		MaxSessions:        8,
		IdleTimeout:        time.Minute,
		NewModel:           newProbe(nil),
		ShutdownMsg:        func(reason string) tea.Msg { return probeShutdown{reason} },
		NoticeMsg:          func(text string) tea.Msg { return probeNotice{text} },
		Logger:             slog.New(slog.NewJSONHandler(ts.logs, &slog.HandlerOptions{Level: slog.LevelDebug})),
	}
	if edit != nil {
		edit(&cfg)
	}
	srv, err := New(cfg)
	if err != nil {
		t.Fatal(err)
	}
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		t.Fatal(err)
	}
	ts.srv, ts.addr = srv, ln.Addr().String()
	go func() { ts.served <- srv.Serve(ln) }()
	t.Cleanup(func() { ts.shutdown(t) })
	return ts
}

func (ts *testServer) shutdown(t testing.TB) error {
	var err error
	ts.shutdowns.Do(func() {
		ctx, cancel := context.WithTimeout(context.Background(), 10*time.Second)
		defer cancel()
		err = ts.srv.Shutdown(ctx)
		select {
		case serr := <-ts.served:
			if serr != nil {
				t.Errorf("Serve returned %v after Shutdown", serr)
			}
		case <-time.After(5 * time.Second):
			t.Errorf("Serve did not return after Shutdown")
		}
	})
	return err
}

func (ts *testServer) dial(key gossh.Signer, auth ...gossh.AuthMethod) (*gossh.Client, error) {
	if key != nil {
		auth = append(auth, gossh.PublicKeys(key))
	}
	return gossh.Dial("tcp", ts.addr, &gossh.ClientConfig{
		User:            "ada",
		Auth:            auth,
		HostKeyCallback: gossh.FixedHostKey(ts.srv.HostKey()),
		Timeout:         5 * time.Second,
	})
}

// term is a client session with a PTY whose screen output is collected.
type term struct {
	t       testing.TB
	client  *gossh.Client
	sess    *gossh.Session
	stdin   io.WriteCloser
	stderr  *syncBuffer
	mu      sync.Mutex
	out     []byte
	changed chan struct{}
	waited  chan error
}

// termOptions shape a terminal: its TERM and how it answers the
// background-colour query (by default with DA1 only, as a terminal without
// OSC 11 does; silent: not at all).
type termOptions struct {
	term   string
	answer string
	silent bool
	width  int
	height int
}

// da1Only is the reply of a terminal that ignores OSC 11 but answers the
// primary device attributes request (VT220-class, common practice, no source).
const da1Only = "\x1b[?62;22c"

// lightAnswer is what a terminal with a white background answers to
// OSC 11 followed by DA1 (xterm control sequences, common practice, no source).
const lightAnswer = "\x1b]11;rgb:ffff/ffff/ffff\x07\x1b[?62;22c"

func (ts *testServer) openTerm(key gossh.Signer, o termOptions) (*term, error) {
	if o.term == "" {
		o.term = "xterm-256color"
	}
	if o.answer == "" && !o.silent {
		o.answer = da1Only
	}
	if o.width == 0 {
		o.width, o.height = 80, 24
	}
	client, err := ts.dial(key)
	if err != nil {
		return nil, err
	}
	sess, err := client.NewSession()
	if err != nil {
		client.Close()
		return nil, err
	}
	tm := &term{client: client, sess: sess, stderr: &syncBuffer{}, changed: make(chan struct{}, 1), waited: make(chan error, 1)}
	sess.Stderr = tm.stderr
	stdout, err := sess.StdoutPipe()
	if err != nil {
		client.Close()
		return nil, err
	}
	if tm.stdin, err = sess.StdinPipe(); err != nil {
		client.Close()
		return nil, err
	}
	if err := sess.RequestPty(o.term, o.height, o.width, gossh.TerminalModes{}); err != nil {
		client.Close()
		return nil, err
	}
	if err := sess.Shell(); err != nil {
		client.Close()
		return nil, err
	}
	go func() {
		buf := make([]byte, 32*1024)
		answered := o.answer == ""
		for {
			n, err := stdout.Read(buf)
			if n > 0 {
				tm.mu.Lock()
				tm.out = append(tm.out, buf[:n]...)
				query := !answered && bytes.Contains(tm.out, []byte("\x1b]11;?"))
				tm.mu.Unlock()
				if query {
					answered = true
					io.WriteString(tm.stdin, o.answer)
				}
				select {
				case tm.changed <- struct{}{}:
				default:
				}
			}
			if err != nil {
				return
			}
		}
	}()
	go func() { tm.waited <- sess.Wait() }()
	return tm, nil
}

func (ts *testServer) mustTerm(t testing.TB, key gossh.Signer, o termOptions) *term {
	t.Helper()
	tm, err := ts.openTerm(key, o)
	if err != nil {
		t.Fatalf("opening a terminal session: %v", err)
	}
	tm.t = t
	t.Cleanup(func() { tm.client.Close() })
	return tm
}

// screen is everything shown so far, with escape sequences removed.
func (tm *term) screen() string {
	tm.mu.Lock()
	defer tm.mu.Unlock()
	return ansi.Strip(string(tm.out))
}

func (tm *term) mark() int {
	tm.mu.Lock()
	defer tm.mu.Unlock()
	return len(tm.out)
}

// waitFor waits until text appears in the output after offset.
func (tm *term) waitFor(text string, offset int, within time.Duration) error {
	deadline := time.NewTimer(within)
	defer deadline.Stop()
	for {
		tm.mu.Lock()
		from := max(0, min(offset, len(tm.out)))
		found := strings.Contains(ansi.Strip(string(tm.out[from:])), text)
		tm.mu.Unlock()
		if found {
			return nil
		}
		select {
		case <-tm.changed:
		case <-deadline.C:
			return fmt.Errorf("%q did not appear within %v; screen so far:\n%s", text, within, tm.screen())
		}
	}
}

func (tm *term) mustSee(text string) {
	tm.t.Helper()
	if err := tm.waitFor(text, 0, 10*time.Second); err != nil {
		tm.t.Fatal(err)
	}
}

func (tm *term) typeKeys(keys string) {
	tm.t.Helper()
	if _, err := io.WriteString(tm.stdin, keys); err != nil {
		tm.t.Fatalf("typing %q: %v", keys, err)
	}
}

// exit waits for the session to end and returns its exit status.
func (tm *term) exit(within time.Duration) (int, error) {
	select {
	case err := <-tm.waited:
		var exitErr *gossh.ExitError
		switch {
		case err == nil:
			return 0, nil
		case errors.As(err, &exitErr):
			return exitErr.ExitStatus(), nil
		default:
			return -1, err
		}
	case <-time.After(within):
		return -1, fmt.Errorf("session still running after %v", within)
	}
}
