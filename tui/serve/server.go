package serve

import (
	"context"
	"errors"
	"fmt"
	"log/slog"
	"net"
	"sync"
	"sync/atomic"
	"time"

	"github.com/charmbracelet/ssh"
	"github.com/charmbracelet/wish"
	gossh "golang.org/x/crypto/ssh"
)

// Server serves the workshop over SSH. Make one with New, run it with
// Serve, stop it with Shutdown.
type Server struct {
	cfg      Config
	log      *slog.Logger
	ssh      *ssh.Server
	keys     *authorizedKeys // nil: any key, loopback only
	hostKey  gossh.Signer
	slots    chan struct{}
	nextID   atomic.Uint64
	conns    atomic.Int64
	maxConns int64

	mu       sync.Mutex
	sessions map[*liveSession]struct{}
	// pending counts, per remote address, the connections that have not
	// logged in yet.
	pending   map[string]int
	listeners []net.Listener
	closing   bool
	sessWG    sync.WaitGroup
}

// New checks cfg, loads or creates the host key and reads the
// authorized-keys file.
func New(cfg Config) (*Server, error) {
	cfg, err := cfg.withDefaults()
	if err != nil {
		return nil, err
	}
	s := &Server{
		cfg:      cfg,
		log:      cfg.Logger,
		slots:    make(chan struct{}, cfg.MaxSessions),
		sessions: make(map[*liveSession]struct{}),
		pending:  make(map[string]int),
		// Connections that have not opened a session yet (or are being
		// refused) are bounded too, so a flood of handshakes cannot
		// exhaust the host.
		maxConns: int64(4*cfg.MaxSessions + 16),
	}
	// The key file first: a server that cannot start must not leave a new
	// host key behind.
	if cfg.AuthorizedKeysPath != "" {
		if s.keys, err = loadAuthorizedKeys(cfg.AuthorizedKeysPath, s.log); err != nil {
			return nil, err
		}
	}
	signer, created, err := LoadOrCreateHostKey(cfg.HostKeyPath)
	if err != nil {
		return nil, err
	}
	s.hostKey = signer
	if created {
		s.log.Info("host key created", "path", cfg.HostKeyPath, "fingerprint", gossh.FingerprintSHA256(signer.PublicKey()))
	} else {
		s.log.Info("host key loaded", "path", cfg.HostKeyPath, "fingerprint", gossh.FingerprintSHA256(signer.PublicKey()))
	}
	s.ssh, err = wish.NewServer(
		// The host key goes in as an option: wish.NewServer writes a fresh
		// id_ed25519 into the working directory and serves it as a second
		// host key when no signer is set by the time the options have run.
		func(srv *ssh.Server) error { srv.AddHostKey(signer); return nil },
		wish.WithPublicKeyAuth(s.checkKey),
		wish.WithMiddleware(func(ssh.Handler) ssh.Handler { return s.handle }),
		// A backstop for connections that never open a session; sessions
		// have their own idle timeout, counted in keystrokes.
		wish.WithIdleTimeout(cfg.IdleTimeout+time.Minute),
	)
	if err != nil {
		return nil, err
	}
	s.ssh.Version = "enthalpath"
	// Only session channels, at most MaxChannelsPerConn at once on a
	// connection, with their requests bounded (boundedRequests).
	s.ssh.ChannelHandlers = map[string]ssh.ChannelHandler{"session": s.sessionChannel}
	s.ssh.ConnCallback = s.onConnect
	s.ssh.ConnectionFailedCallback = func(conn net.Conn, err error) {
		s.log.Info("connection refused during handshake", "remote", conn.RemoteAddr().String(), "reason", err.Error())
	}
	s.ssh.ServerConfigCallback = func(ctx ssh.Context) *gossh.ServerConfig {
		return &gossh.ServerConfig{
			MaxAuthTries: 6,
			AuthLogCallback: func(conn gossh.ConnMetadata, method string, err error) {
				if err == nil {
					if cc, ok := ctx.Value(connKey{}).(*countedConn); ok {
						cc.authenticated.Store(true)
						cc.loggedIn() // its place among the address's pending ones is free
					}
				}
				s.onAuthAttempt(conn, method, err)
			},
		}
	}
	return s, nil
}

// HostKey returns the server's public host key.
func (s *Server) HostKey() gossh.PublicKey { return s.hostKey.PublicKey() }

// ListenAndServe listens on addr and serves until Shutdown.
func (s *Server) ListenAndServe(addr string) error {
	if s.keys == nil && !IsLoopback(addr) {
		return fmt.Errorf("listen %s: %w (give --authorized-keys, or listen on 127.0.0.1 or ::1)", addr, ErrNotLoopback)
	}
	ln, err := net.Listen("tcp", addr)
	if err != nil {
		return err
	}
	return s.Serve(ln)
}

// Serve accepts connections on ln until Shutdown. It refuses a listener
// that is not on loopback when there is no authorized-keys file.
func (s *Server) Serve(ln net.Listener) error {
	addr := ln.Addr().String()
	if s.keys == nil && !IsLoopback(addr) {
		ln.Close()
		return fmt.Errorf("listen %s: %w (give --authorized-keys, or listen on 127.0.0.1 or ::1)", addr, ErrNotLoopback)
	}
	if s.keys == nil {
		s.log.Warn("no authorized-keys file: ANY key is accepted, from loopback only; every key gets its own folder",
			"listen", addr)
	}
	s.mu.Lock()
	if s.closing {
		s.mu.Unlock()
		ln.Close()
		return nil
	}
	s.listeners = append(s.listeners, ln)
	s.mu.Unlock()
	s.log.Info("listening", "listen", addr, "max_sessions", s.cfg.MaxSessions,
		"idle_timeout", s.cfg.IdleTimeout.String(), "state_dir", s.cfg.StateDir)
	err := s.ssh.Serve(ln)
	s.mu.Lock()
	closing := s.closing
	s.mu.Unlock()
	if closing || errors.Is(err, ssh.ErrServerClosed) {
		return nil
	}
	return err
}

// Shutdown stops accepting connections, tells every session to save its
// work and quit, waits for them until ctx ends or the grace period passes,
// then closes every connection.
func (s *Server) Shutdown(ctx context.Context) error {
	s.mu.Lock()
	s.closing = true
	live := make([]*liveSession, 0, len(s.sessions))
	for ls := range s.sessions {
		live = append(live, ls)
	}
	listeners := s.listeners
	s.listeners = nil
	s.mu.Unlock()

	ctx, cancel := context.WithTimeout(ctx, s.cfg.ShutdownGrace)
	defer cancel()
	// Stop accepting; established connections stay until Close below.
	// (Closing our listeners rather than calling the ssh server's
	// Shutdown, whose wait races with a Serve that is just starting.)
	for _, ln := range listeners {
		ln.Close()
	}
	s.log.Info("shutting down", "sessions", len(live))
	for _, ls := range live {
		ls.stop("server shutting down", ExitShutdown)
	}
	finished := make(chan struct{})
	go func() {
		s.sessWG.Wait()
		close(finished)
	}()
	var err error
	select {
	case <-finished:
	case <-ctx.Done():
		err = fmt.Errorf("shutdown: sessions still running after the grace period: %w", ctx.Err())
		s.mu.Lock()
		for ls := range s.sessions {
			ls.kill()
		}
		s.mu.Unlock()
	}
	if cerr := s.ssh.Close(); cerr != nil && err == nil && !errors.Is(cerr, net.ErrClosed) {
		err = cerr
	}
	s.log.Info("stopped")
	return err
}

// onConnect logs a new TCP connection and bounds their number.
func (s *Server) onConnect(ctx ssh.Context, conn net.Conn) net.Conn {
	remote := conn.RemoteAddr().String()
	if n := s.conns.Add(1); n > s.maxConns {
		s.conns.Add(-1)
		s.log.Warn("connection refused: too many connections", "remote", remote, "limit", s.maxConns)
		return nil
	}
	host := remoteHost(conn.RemoteAddr())
	s.mu.Lock()
	if s.pending[host] >= s.cfg.MaxPendingPerAddress {
		s.mu.Unlock()
		s.conns.Add(-1)
		s.log.Warn("connection refused: too many connections from this address not logged in",
			"remote", remote, "limit", s.cfg.MaxPendingPerAddress)
		return nil
	}
	s.pending[host]++
	s.mu.Unlock()
	s.log.Info("connection", "remote", remote)
	cc := &countedConn{Conn: conn, done: func() { s.conns.Add(-1) }}
	cc.loggedIn = sync.OnceFunc(func() {
		s.mu.Lock()
		defer s.mu.Unlock()
		if s.pending[host]--; s.pending[host] <= 0 {
			delete(s.pending, host)
		}
	})
	ctx.SetValue(connKey{}, cc)
	time.AfterFunc(s.cfg.LoginTimeout, func() {
		if !cc.authenticated.Load() {
			s.log.Info("connection closed: no login in time", "remote", remote, "timeout", s.cfg.LoginTimeout.String())
			cc.Close()
		}
	})
	return cc
}

// connKey finds a connection's countedConn in its context.
type connKey struct{}

// remoteHost is the address part of a remote address (its IP), the unit
// the pending-connection limit counts by.
func remoteHost(a net.Addr) string {
	if tcp, ok := a.(*net.TCPAddr); ok {
		return tcp.IP.String()
	}
	host, _, err := net.SplitHostPort(a.String())
	if err != nil {
		return a.String()
	}
	return host
}

// sessionChannel opens a session channel unless the connection has
// MaxChannelsPerConn open already, and hands its requests through
// boundedRequests.
func (s *Server) sessionChannel(srv *ssh.Server, conn *gossh.ServerConn, newChan gossh.NewChannel, ctx ssh.Context) {
	cc, _ := ctx.Value(connKey{}).(*countedConn)
	if cc != nil {
		if cc.channels.Add(1) > MaxChannelsPerConn {
			cc.channels.Add(-1)
			s.log.Warn("channel refused: too many on one connection", "remote", conn.RemoteAddr().String(), "limit", MaxChannelsPerConn)
			newChan.Reject(gossh.ResourceShortage, fmt.Sprintf("at most %d sessions on one connection", MaxChannelsPerConn))
			return
		}
		defer cc.channels.Add(-1)
	}
	ssh.DefaultSessionHandler(srv, conn, boundedChannel{newChan}, ctx)
}

// boundedChannel is a new session channel whose requests, once accepted,
// pass through boundedRequests.
type boundedChannel struct{ gossh.NewChannel }

func (b boundedChannel) Accept() (gossh.Channel, <-chan *gossh.Request, error) {
	ch, reqs, err := b.NewChannel.Accept()
	if err != nil {
		return ch, reqs, err
	}
	return ch, boundedRequests(reqs), nil
}

// boundedRequests passes a channel's requests on, one at a time (so a
// flood waits on the client's own connection rather than in memory here),
// refusing environment variables beyond MaxEnvPerChannel or MaxEnvBytes:
// the session handler keeps every one it is given.
func boundedRequests(in <-chan *gossh.Request) <-chan *gossh.Request {
	out := make(chan *gossh.Request)
	go func() {
		defer close(out)
		envs := 0
		for req := range in {
			if req.Type == "env" {
				envs++
				if envs > MaxEnvPerChannel || len(req.Payload) > MaxEnvBytes {
					req.Reply(false, nil)
					continue
				}
			}
			out <- req
		}
	}()
	return out
}

// onAuthAttempt logs every authentication outcome except the initial
// "none" probe every client makes and refused keys (checkKey logs those,
// with their fingerprints). It never logs key material or passwords. A
// success here is final (a key query without a signature is not reported
// by x/crypto); the key's fingerprint is logged with every line of the
// session, from the verified key the connection carries.
func (s *Server) onAuthAttempt(conn gossh.ConnMetadata, method string, err error) {
	switch {
	case method == "none":
	case err == nil:
		s.log.Info("authenticated", "method", method, "user", conn.User(), "remote", conn.RemoteAddr().String())
	case method != "publickey":
		s.log.Info("authentication refused", "method", method, "user", conn.User(),
			"remote", conn.RemoteAddr().String(), "reason", "only public keys are accepted")
	}
}

// checkKey decides a public key.
func (s *Server) checkKey(ctx ssh.Context, key ssh.PublicKey) bool {
	if s.keys == nil {
		return true
	}
	if s.keys.allows(key) {
		return true
	}
	s.log.Info("authentication refused", "method", "publickey", "user", ctx.User(),
		"remote", ctx.RemoteAddr().String(), "fingerprint", gossh.FingerprintSHA256(key),
		"reason", "key not in the authorized-keys file")
	return false
}

// countedConn calls done once when closed, and knows whether its client
// has logged in.
type countedConn struct {
	net.Conn
	once          sync.Once
	done          func()
	authenticated atomic.Bool
	// loggedIn frees the connection's place among its address's pending
	// ones, once: at login or at close, whichever comes first.
	loggedIn func()
	channels atomic.Int64 // session channels open
}

func (c *countedConn) Close() error {
	c.once.Do(func() {
		c.loggedIn()
		c.done()
	})
	return c.Conn.Close()
}
