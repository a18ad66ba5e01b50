package serve

import (
	"crypto/sha256"
	"encoding/hex"
	"fmt"
	"io"
	"log/slog"
	"os"
	"path/filepath"
	"sync"
	"sync/atomic"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/ssh"
	"github.com/charmbracelet/wish/bubbletea"
	"github.com/muesli/termenv"
	gossh "golang.org/x/crypto/ssh"

	"enthalpath/tui/safepath"
)

// rendererQueryBudget bounds how long the renderer may wait for the
// client's terminal to answer the background-colour query. It is shorter
// than the one second wish allows, so the query gives up through our
// deadline and no keystroke typed meanwhile is swallowed.
const rendererQueryBudget = 900 * time.Millisecond

// frameRate is the most frames a second a session draws. Bubble Tea draws
// on a ticker, so a keystroke waits for the next tick: at its default of 60
// that is up to 17 ms, at 120 (its ceiling) up to 8 ms, for a cost of a
// cheap wake-up per tick when nothing changed.
const frameRate = 120

// The largest window a session lays out for: a client claiming more (no
// real terminal has 1000 columns) is drawn at this size rather than letting
// one session build frames of any size it likes.
const (
	maxWindowWidth  = 1000
	maxWindowHeight = 500
)

// clampWindow bounds a window size claimed by a client.
func clampWindow(w, h int) (int, int) {
	return max(0, min(w, maxWindowWidth)), max(0, min(h, maxWindowHeight))
}

// liveSession is a running session, as Shutdown sees it.
type liveSession struct {
	prog     *tea.Program
	shutdown func(string) tea.Msg
	log      *slog.Logger

	mu     sync.Mutex
	reason string // why the server ended it, "" if it did not
	exit   int
}

// stop tells the session's model to save and quit; the first reason wins.
func (ls *liveSession) stop(reason string, exit int) {
	ls.mu.Lock()
	first := ls.reason == ""
	if first {
		ls.reason, ls.exit = reason, exit
	}
	ls.mu.Unlock()
	if first {
		ls.log.Info("session told to save and quit", "reason", reason)
		// Send blocks until the event loop takes it; never block the caller.
		go ls.prog.Send(ls.shutdown(reason))
	}
}

func (ls *liveSession) stopped() (string, int, bool) {
	ls.mu.Lock()
	defer ls.mu.Unlock()
	return ls.reason, ls.exit, ls.reason != ""
}

func (ls *liveSession) kill() { ls.prog.Kill() }

// sessionInput is the session as wish's renderer sees it: reads come
// through the gate, which can time out.
type sessionInput struct {
	ssh.Session
	in io.Reader
}

func (s sessionInput) Read(p []byte) (int, error) { return s.in.Read(p) }

// handle runs one SSH session from start to exit status.
func (s *Server) handle(sess ssh.Session) {
	id := s.nextID.Add(1)
	start := time.Now()
	fingerprint := ""
	if key := sess.PublicKey(); key != nil {
		fingerprint = gossh.FingerprintSHA256(key)
	}
	log := s.log.With("session", id, "user", sess.User(), "remote", sess.RemoteAddr().String(), "fingerprint", fingerprint)
	// Shutdown waits for every session counted here, until its exit
	// status is sent.
	s.mu.Lock()
	closing := s.closing
	if !closing {
		s.sessWG.Add(1)
	}
	s.mu.Unlock()
	var exit int
	var reason string
	if closing {
		exit, reason = refuse(sess, log, ExitShutdown, "server shutting down",
			"the server is shutting down; please try again later")
	} else {
		defer s.sessWG.Done()
		exit, reason = s.run(sess, log)
	}
	log.Info("session end", "exit", exit, "reason", reason, "duration", time.Since(start).Round(time.Millisecond).String())
	_ = sess.Exit(exit)
}

// refuse prints one line to the client and returns the exit status.
func refuse(sess ssh.Session, log *slog.Logger, exit int, why, line string) (int, string) {
	fmt.Fprintf(sess.Stderr(), "enthalpath: %s\r\n", line)
	log.Info("session refused", "reason", why)
	return exit, why
}

func (s *Server) run(sess ssh.Session, log *slog.Logger) (int, string) {
	if cmd := sess.RawCommand(); cmd != "" || sess.Subsystem() != "" {
		return refuse(sess, log, ExitNoTerminal, "command given",
			"this server runs only the interactive workshop; connect without a command: ssh -t HOST")
	}
	pty, winch, ok := sess.Pty()
	if !ok {
		return refuse(sess, log, ExitNoTerminal, "no terminal",
			"the workshop needs a terminal and none was requested; connect with ssh -t HOST")
	}
	select {
	case s.slots <- struct{}{}:
		defer func() { <-s.slots }()
	default:
		return refuse(sess, log, ExitBusy, "session limit reached",
			busyLine(s.cfg.MaxSessions))
	}
	folder, err := s.userFolder(sess.PublicKey())
	if err != nil {
		log.Error("user folder unusable", "error", err.Error())
		return refuse(sess, log, ExitFailure, "user folder unusable",
			"your folder on this server could not be prepared; please tell the administrator")
	}
	// Every session of a member names the same recovery file; the model
	// writes it or the first free name of its series, never over an
	// earlier one, and says which (Recoverer).
	recovery := filepath.Join(folder, s.cfg.RecoveryFile)

	var dropped atomic.Int64
	// The gate reads before the program runs; a drop is told to the
	// member only once there is a program to tell.
	var progRef atomic.Pointer[tea.Program]
	gate := newInputGate(sess, s.cfg.MaxBurst, func(n int, burstStart bool) {
		if dropped.Add(int64(n)) == int64(n) {
			log.Warn("input burst dropped", "bytes", n, "limit", s.cfg.MaxBurst)
		}
		if p := progRef.Load(); burstStart && p != nil && s.cfg.NoticeMsg != nil {
			p.Send(s.cfg.NoticeMsg(fmt.Sprintf("a paste of more than %d bytes at once was dropped (this server's limit); type or paste less at a time", s.cfg.MaxBurst)))
		}
	})
	defer gate.Close()

	gate.setDeadline(time.Now().Add(rendererQueryBudget))
	renderer := bubbletea.MakeRenderer(sessionInput{Session: sess, in: gate})
	gate.setDeadline(time.Time{})

	width, height := clampWindow(pty.Window.Width, pty.Window.Height)
	setup := SessionSetup{
		Renderer:     renderer,
		Width:        width,
		Height:       height,
		User:         sess.User(),
		Fingerprint:  gossh.FingerprintSHA256(sess.PublicKey()),
		Folder:       folder,
		RecoveryPath: recovery,
		MaxInputLen:  s.cfg.MaxInputLen,
	}
	model, err := s.buildModel(setup)
	if err != nil {
		log.Error("session model failed to start", "error", err.Error())
		return refuse(sess, log, ExitFailure, "model failed to start",
			"the workshop could not start; please tell the administrator")
	}
	g := newGuard(model, s.cfg.ShutdownMsg, func(where string, value any, stack []byte) {
		log.Error("session failed", "where", where, "panic", fmt.Sprint(value), "stack", string(stack))
	})
	prog := tea.NewProgram(g,
		tea.WithInput(gate),
		tea.WithOutput(sess),
		tea.WithEnvironment(append(sess.Environ(), "TERM="+pty.Term)),
		tea.WithoutSignalHandler(),
		tea.WithAltScreen(),
		tea.WithFPS(frameRate),
	)
	g.send = prog.Send
	progRef.Store(prog)

	ls := &liveSession{prog: prog, shutdown: s.cfg.ShutdownMsg, log: log}
	s.mu.Lock()
	if s.closing {
		s.mu.Unlock()
		return refuse(sess, log, ExitShutdown, "server shutting down",
			"the server is shutting down; please try again later")
	}
	s.sessions[ls] = struct{}{}
	s.mu.Unlock()
	defer func() {
		s.mu.Lock()
		delete(s.sessions, ls)
		s.mu.Unlock()
	}()
	log.Info("session start", "term", pty.Term, "width", pty.Window.Width, "height", pty.Window.Height,
		"colour_profile", profileName(renderer.ColorProfile()), "dark_background", renderer.HasDarkBackground(),
		"folder", filepath.Base(folder))

	done := make(chan struct{})
	defer close(done)
	go followWindow(prog, winch, done)
	go s.watch(ls, gate, sess, done)

	_, runErr := prog.Run()
	prog.Kill() // restores the terminal state if the program did not quit cleanly

	if n := dropped.Load(); n > 0 {
		log.Warn("input dropped in this session", "bytes", n)
	}
	saved := ""
	if p := g.recoveredTo(); p != "" {
		name, ok := safepath.Rel(folder, p)
		if !ok {
			name = filepath.Base(p)
		}
		saved = " Your unsaved work is in " + name + "."
	}
	reason, exit, byServer := ls.stopped()
	switch {
	case g.Failed():
		fmt.Fprintf(sess.Stderr(), "enthalpath: this session hit an internal error and was closed.%s\r\n", saved)
		return ExitFailure, "model failed"
	case byServer:
		switch exit {
		case ExitIdle:
			fmt.Fprintf(sess.Stderr(), "enthalpath: closed after %v without a keystroke.%s\r\n", s.cfg.IdleTimeout, saved)
		case ExitShutdown:
			fmt.Fprintf(sess.Stderr(), "enthalpath: the server is shutting down.%s\r\n", saved)
		}
		return exit, reason
	case runErr != nil:
		log.Error("program ended with an error", "error", runErr.Error())
		fmt.Fprintf(sess.Stderr(), "enthalpath: this session ended with an error.%s\r\n", saved)
		return ExitFailure, "program error"
	}
	return ExitOK, "quit"
}

// busyLine is what a client is told when every session place is taken.
func busyLine(places int) string {
	if places == 1 {
		return "the one place on this server is taken; please try again in a few minutes"
	}
	return fmt.Sprintf("all %d places on this server are taken; please try again in a few minutes", places)
}

// buildModel calls the factory with panics contained.
func (s *Server) buildModel(setup SessionSetup) (m tea.Model, err error) {
	defer func() {
		if r := recover(); r != nil {
			err = fmt.Errorf("model factory panicked: %v", r)
		}
	}()
	m = s.cfg.NewModel(setup)
	if m == nil {
		return nil, fmt.Errorf("model factory returned no model")
	}
	return m, nil
}

// followWindow forwards window changes to the program until done.
func followWindow(prog *tea.Program, winch <-chan ssh.Window, done <-chan struct{}) {
	for {
		select {
		case <-done:
			return
		case w, ok := <-winch:
			if !ok {
				return
			}
			width, height := clampWindow(w.Width, w.Height)
			prog.Send(tea.WindowSizeMsg{Width: width, Height: height})
		}
	}
}

// watch ends the session when it has been idle too long or its connection
// is gone; either way the model is first told to save.
func (s *Server) watch(ls *liveSession, gate *inputGate, sess ssh.Session, done <-chan struct{}) {
	every := min(max(s.cfg.IdleTimeout/4, 10*time.Millisecond), time.Second)
	tick := time.NewTicker(every)
	defer tick.Stop()
	for {
		select {
		case <-done:
			return
		case <-sess.Context().Done():
			ls.stop("connection lost", ExitLost)
			return
		case <-gate.gone:
			ls.stop("connection lost", ExitLost)
			return
		case now := <-tick.C:
			if gate.idleFor(now) >= s.cfg.IdleTimeout {
				ls.stop(fmt.Sprintf("idle for %v", s.cfg.IdleTimeout), ExitIdle)
				return
			}
		}
	}
}

// UserFolderName is the folder name, under STATE/users, of the user who
// authenticates with key: the lowercase hexadecimal SHA-256 of the key in
// SSH wire format.
func UserFolderName(key gossh.PublicKey) string {
	sum := sha256.Sum256(key.Marshal())
	return hex.EncodeToString(sum[:])
}

// userFolder creates (mode 0700) and returns the folder of key's user.
func (s *Server) userFolder(key gossh.PublicKey) (string, error) {
	if key == nil {
		return "", fmt.Errorf("no public key on the session")
	}
	users := filepath.Join(s.cfg.StateDir, "users")
	dir := filepath.Join(users, UserFolderName(key))
	if err := os.MkdirAll(dir, 0o700); err != nil {
		return "", err
	}
	for _, d := range []string{users, dir} {
		info, err := os.Lstat(d)
		if err != nil {
			return "", err
		}
		if !info.IsDir() {
			return "", fmt.Errorf("%s is not a directory (a link?); refusing to use it", d)
		}
		if info.Mode().Perm() != 0o700 {
			if err := os.Chmod(d, 0o700); err != nil {
				return "", err
			}
		}
	}
	return filepath.Abs(dir)
}

// profileName names a termenv colour profile for the log.
func profileName(p termenv.Profile) string {
	switch p {
	case termenv.TrueColor:
		return "truecolor"
	case termenv.ANSI256:
		return "ansi256"
	case termenv.ANSI:
		return "ansi16"
	default:
		return "none"
	}
}
