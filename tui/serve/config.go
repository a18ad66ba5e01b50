package serve

import (
	"errors"
	"fmt"
	"log/slog"
	"net"
	"path/filepath"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/charmbracelet/lipgloss"
)

// Exit statuses a session ends with.
const (
	ExitOK         = 0  // the user quit
	ExitFailure    = 1  // the session's model failed (its work went to the recovery file)
	ExitNoTerminal = 2  // no PTY was requested, or a command was given
	ExitIdle       = 3  // closed after the idle timeout
	ExitShutdown   = 4  // the server is shutting down
	ExitLost       = 5  // the connection was lost (no client hears it; it tells the log a drop from a failure)
	ExitBusy       = 75 // every session place is taken; try later (EX_TEMPFAIL of sysexits.h)
)

// Defaults used when a Config field is zero.
const (
	DefaultMaxSessions   = 32
	DefaultIdleTimeout   = 30 * time.Minute
	DefaultMaxInputLen   = 256
	DefaultMaxBurst      = 4096
	DefaultShutdownGrace = 7 * time.Second
	DefaultLoginTimeout  = 20 * time.Second
	// DefaultMaxPendingPerAddress bounds the connections from one address
	// that have not logged in yet.
	DefaultMaxPendingPerAddress = 4
)

// Bounds on what one connection may ask for (common practice for a server
// that holds per-channel state, no source): a client opens one session
// channel per ssh -t, and sends a handful of environment variables.
const (
	// MaxChannelsPerConn is the most session channels open at once on one
	// connection; more are refused (resource shortage).
	MaxChannelsPerConn = 2
	// MaxEnvPerChannel is the most environment variables a session channel
	// may set; MaxEnvBytes the largest one, name and value. More, or
	// larger, are refused and not kept.
	MaxEnvPerChannel = 32
	MaxEnvBytes      = 1024
)

// SessionSetup is what a session's model is built from.
type SessionSetup struct {
	// Renderer is bound to this session: build every style from it.
	Renderer *lipgloss.Renderer
	// Width and Height are the client's window size at the start.
	Width, Height int
	// User is the user name the client gave; Fingerprint the SHA256
	// fingerprint of the key it authenticated with.
	User, Fingerprint string
	// Folder is the user's own folder; every file the session opens or
	// saves must be inside it (resolve names with safepath.Join).
	Folder string
	// RecoveryPath is where the model keeps unsaved work when it is told
	// to shut down or after a failure: this name inside Folder or the
	// first free name of its series, never over an earlier file
	// (fileio.WriteNew). The model says which file through Recoverer.
	RecoveryPath string
	// MaxInputLen bounds the length of any text the user types in a field.
	MaxInputLen int
}

// ModelFactory builds the root model of one session.
type ModelFactory func(SessionSetup) tea.Model

// Config configures a Server. NewModel and ShutdownMsg are required.
type Config struct {
	// HostKeyPath is the ed25519 host key, created (mode 0600, its folder
	// 0700) if missing. A key readable or writable by group or others is
	// refused.
	HostKeyPath string
	// AuthorizedKeysPath lists the keys allowed in. Empty: any key, and
	// loopback addresses only.
	AuthorizedKeysPath string
	// StateDir holds users/<hex fingerprint>/ folders.
	StateDir string

	// RecoveryFile is the base name of a user's recovery file inside their
	// folder (default "recovered.cycle"). Every session of the user is
	// given the same name, so a new session can offer the work an earlier
	// one left; the model writes that name or the first free one of its
	// series ("recovered-2.cycle", …), never over an earlier file, and
	// reports which through Recoverer.
	RecoveryFile string

	MaxSessions int
	IdleTimeout time.Duration
	// LoginTimeout closes a connection that has not authenticated within
	// it, so idle or trickling handshakes cannot hold connection places.
	LoginTimeout time.Duration
	// MaxPendingPerAddress bounds the connections from one address (IP)
	// that have not logged in, so one host's silent or slow connections
	// cannot fill the places others log in through.
	MaxPendingPerAddress int
	MaxInputLen          int
	MaxBurst             int
	ShutdownGrace        time.Duration

	// NewModel builds each session's model.
	NewModel ModelFactory
	// ShutdownMsg makes the message that tells a model to save its unsaved
	// work to its recovery file and quit.
	ShutdownMsg func(reason string) tea.Msg
	// NoticeMsg, when set, makes the message that shows the member a
	// one-line notice (input dropped for being too long, for one).
	NoticeMsg func(text string) tea.Msg

	// Logger receives structured logs; nil logs nothing.
	Logger *slog.Logger
}

// Configuration errors.
var (
	ErrNotLoopback = errors.New("without an authorized-keys file the server listens on loopback addresses only")
	ErrConfig      = errors.New("invalid server configuration")
)

func (c *Config) withDefaults() (Config, error) {
	out := *c
	if out.RecoveryFile == "" {
		out.RecoveryFile = "recovered.cycle"
	}
	if out.MaxSessions == 0 {
		out.MaxSessions = DefaultMaxSessions
	}
	if out.IdleTimeout == 0 {
		out.IdleTimeout = DefaultIdleTimeout
	}
	if out.MaxInputLen == 0 {
		out.MaxInputLen = DefaultMaxInputLen
	}
	if out.MaxBurst == 0 {
		out.MaxBurst = DefaultMaxBurst
	}
	if out.MaxPendingPerAddress == 0 {
		out.MaxPendingPerAddress = DefaultMaxPendingPerAddress
	}
	if out.LoginTimeout == 0 {
		out.LoginTimeout = DefaultLoginTimeout
	}
	if out.ShutdownGrace == 0 {
		out.ShutdownGrace = DefaultShutdownGrace
	}
	if out.Logger == nil {
		out.Logger = slog.New(slog.DiscardHandler)
	}
	switch {
	case out.MaxSessions < 0:
		return out, fmt.Errorf("%w: MaxSessions %d must be positive", ErrConfig, out.MaxSessions)
	case out.IdleTimeout < 0:
		return out, fmt.Errorf("%w: IdleTimeout %v must be positive", ErrConfig, out.IdleTimeout)
	case out.MaxInputLen < 0 || out.MaxBurst < 0 || out.ShutdownGrace < 0 || out.LoginTimeout < 0 || out.MaxPendingPerAddress < 0:
		return out, fmt.Errorf("%w: MaxInputLen, MaxBurst, LoginTimeout, MaxPendingPerAddress and ShutdownGrace must be positive", ErrConfig)
	case out.HostKeyPath == "":
		return out, fmt.Errorf("%w: HostKeyPath is empty", ErrConfig)
	case out.StateDir == "":
		return out, fmt.Errorf("%w: StateDir is empty", ErrConfig)
	case out.RecoveryFile != filepath.Base(out.RecoveryFile) || out.RecoveryFile == "." || out.RecoveryFile == "..":
		return out, fmt.Errorf("%w: RecoveryFile %q must be a plain file name", ErrConfig, out.RecoveryFile)
	case out.NewModel == nil || out.ShutdownMsg == nil:
		return out, fmt.Errorf("%w: NewModel and ShutdownMsg are required", ErrConfig)
	}
	return out, nil
}

// IsLoopback reports whether a listen address (host:port) names only
// loopback interfaces: 127.0.0.0/8, ::1 or "localhost". An empty host
// means every interface and is not loopback.
func IsLoopback(addr string) bool {
	host, _, err := net.SplitHostPort(addr)
	if err != nil {
		return false
	}
	if host == "localhost" {
		return true
	}
	ip := net.ParseIP(host)
	return ip != nil && ip.IsLoopback()
}
