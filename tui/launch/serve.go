package launch

import (
	"context"
	"errors"
	"fmt"
	"log/slog"
	"os"
	"os/signal"
	"path/filepath"
	"syscall"
	"time"

	tea "github.com/charmbracelet/bubbletea"

	"enthalpath/cycle"
	"enthalpath/cycle/cli"
	"enthalpath/tui"
	"enthalpath/tui/screen"
	"enthalpath/tui/serve"
)

// defaultListen is the address served when --listen is not given: loopback
// only, on a port of our own above the privileged range.
const defaultListen = "127.0.0.1:2324"

// shutdownDeadline bounds SIGINT/SIGTERM handling from signal to exit.
const shutdownDeadline = 10 * time.Second

// serveFlags are the parsed command line of "enthalpath serve".
type serveFlags struct {
	listen    string
	logFormat string
	config    serve.Config
}

// parseServeFlags reads the command line: the error is the help request
// or a UsageError.
func parseServeFlags(args []string) (serveFlags, error) {
	var f serveFlags
	fs := cli.NewFlagSet("serve")
	stateDir := fs.String("state-dir", defaultStateDir(), "`DIR` holding the host key (unless --host-key) and users/<key digest>/ folders")
	fs.StringVar(&f.listen, "listen", defaultListen, "`ADDR`ess to listen on, host:port")
	hostKey := fs.String("host-key", "", "ed25519 host key `FILE`, created (mode 0600) if missing (default DIR/host_ed25519)")
	fs.StringVar(&f.config.AuthorizedKeysPath, "authorized-keys", "", "`FILE` of public keys allowed in, re-read when it changes (none: any key, loopback only)")
	fs.IntVar(&f.config.MaxSessions, "max-sessions", serve.DefaultMaxSessions, "most sessions at once; the next is refused politely")
	fs.DurationVar(&f.config.IdleTimeout, "idle-timeout", serve.DefaultIdleTimeout, "close a session after this `DURATION` without a keystroke (its work is saved first)")
	fs.IntVar(&f.config.MaxInputLen, "max-line", serve.DefaultMaxInputLen, "most characters in any text a user types in a field")
	fs.IntVar(&f.config.MaxBurst, "max-burst", serve.DefaultMaxBurst, "drop any input burst longer than this many `BYTES` (a runaway paste)")
	fs.StringVar(&f.logFormat, "log-format", "text", "log lines on standard error as text or json")
	pos, help, err := cli.ParseFlags(fs, args)
	if help || err != nil {
		return f, err
	}
	if len(pos) > 0 {
		return f, cli.Usagef("serve takes no arguments, got %q: usage: enthalpath %s", pos[0], cli.ServeSynopsis)
	}
	var problems []error
	if f.config.MaxSessions < 1 {
		problems = append(problems, fmt.Errorf("--max-sessions %d: give at least 1", f.config.MaxSessions))
	}
	if f.config.IdleTimeout <= 0 {
		problems = append(problems, fmt.Errorf("--idle-timeout %v: give a positive duration such as 30m", f.config.IdleTimeout))
	}
	if f.config.MaxInputLen < 1 {
		problems = append(problems, fmt.Errorf("--max-line %d: give at least 1", f.config.MaxInputLen))
	}
	if f.config.MaxBurst < 16 {
		problems = append(problems, fmt.Errorf("--max-burst %d: give at least 16 bytes", f.config.MaxBurst))
	}
	if f.logFormat != "text" && f.logFormat != "json" {
		problems = append(problems, fmt.Errorf("--log-format %q: give text or json", f.logFormat))
	}
	if *stateDir == "" {
		problems = append(problems, errors.New("--state-dir is empty and there is no home folder: give --state-dir DIR"))
	}
	if f.config.AuthorizedKeysPath == "" && !serve.IsLoopback(f.listen) {
		problems = append(problems, fmt.Errorf("--listen %s: %w; give --authorized-keys FILE to serve other addresses", f.listen, serve.ErrNotLoopback))
	}
	if err := errors.Join(problems...); err != nil {
		return f, &cli.UsageError{Err: err}
	}
	f.config.StateDir = *stateDir
	f.config.HostKeyPath = *hostKey
	if f.config.HostKeyPath == "" {
		f.config.HostKeyPath = filepath.Join(*stateDir, "host_ed25519")
	}
	f.config.RecoveryFile = "recovery" + cycle.FileExtension
	return f, nil
}

// defaultStateDir is $XDG_STATE_HOME/enthalpath/serve, or the same under
// ~/.local/state; "" when there is no home folder.
func defaultStateDir() string {
	dir := os.Getenv("XDG_STATE_HOME")
	if dir == "" {
		home, err := os.UserHomeDir()
		if err != nil {
			return ""
		}
		dir = filepath.Join(home, ".local", "state")
	}
	return filepath.Join(dir, "enthalpath", "serve")
}

// Serve is the command "serve": the workshop over SSH until SIGINT or
// SIGTERM.
func Serve(env cli.Env, args []string) error {
	f, err := parseServeFlags(args)
	if err != nil {
		return err
	}
	var handler slog.Handler = slog.NewTextHandler(env.Stderr, nil)
	if f.logFormat == "json" {
		handler = slog.NewJSONHandler(env.Stderr, nil)
	}
	log := slog.New(handler)

	// The data is loaded once and shared, read-only, by every session.
	db, err := cli.LoadData(env)
	if err != nil {
		return err
	}

	cfg := f.config
	cfg.Logger = log
	cfg.NewModel = func(s serve.SessionSetup) tea.Model {
		return tui.New(tui.Options{
			Renderer:     s.Renderer,
			DB:           db,
			FileRoot:     s.Folder,
			RecoveryPath: s.RecoveryPath,
			Width:        s.Width,
			Height:       s.Height,
			MaxInputLen:  s.MaxInputLen,
		})
	}
	cfg.ShutdownMsg = func(reason string) tea.Msg { return tui.ShutdownMsg{Reason: reason} }
	cfg.NoticeMsg = func(text string) tea.Msg { return screen.StatusMsg{Text: text, Err: true} }
	if cfg.AuthorizedKeysPath != "" {
		// Checked before anything is created in the state folder.
		if _, err := os.Stat(cfg.AuthorizedKeysPath); err != nil {
			return cli.Usagef("--authorized-keys %s: %v", cfg.AuthorizedKeysPath, err)
		}
	}
	if err := os.MkdirAll(cfg.StateDir, 0o700); err != nil {
		return cli.Usagef("--state-dir %s: %v", cfg.StateDir, err)
	}
	srv, err := serve.New(cfg)
	if err != nil {
		return &cli.UsageError{Err: err}
	}

	signals := make(chan os.Signal, 1)
	signal.Notify(signals, syscall.SIGINT, syscall.SIGTERM)
	served := make(chan error, 1)
	go func() { served <- srv.ListenAndServe(f.listen) }()
	select {
	case err := <-served:
		signal.Stop(signals)
		return err
	case sig := <-signals:
		// A second signal ends the process at once (Go's default action).
		signal.Stop(signals)
		log.Info("signal received; saving every session's work", "signal", sig.String())
	}
	ctx, cancel := context.WithTimeout(context.Background(), shutdownDeadline)
	defer cancel()
	err = srv.Shutdown(ctx)
	if err != nil {
		log.Error("shutdown incomplete", "error", err.Error())
		err = fmt.Errorf("shutdown incomplete: %w", err)
	}
	select {
	case <-served:
	case <-ctx.Done():
	}
	return err
}
