//go:build unix

package launch

import (
	"context"
	"crypto/ed25519"
	"crypto/rand"
	"io"
	"log/slog"
	mrand "math/rand/v2"
	"net"
	"os"
	"path/filepath"
	"runtime"
	"slices"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"

	tea "github.com/charmbracelet/bubbletea"
	gossh "golang.org/x/crypto/ssh"

	"enthalpath/data"
	"enthalpath/tui"
	"enthalpath/tui/serve"
)

// benchClient is one SSH session of the load benchmark: it counts the
// bytes of screen output received so far.
type benchClient struct {
	client  *gossh.Client
	stdin   io.Writer
	mu      sync.Mutex
	got     int
	text    strings.Builder
	changed chan struct{}
}

func (c *benchClient) Write(p []byte) (int, error) {
	c.mu.Lock()
	c.got += len(p)
	if c.text.Len() < 1<<16 {
		c.text.Write(p)
	}
	c.mu.Unlock()
	select {
	case c.changed <- struct{}{}:
	default:
	}
	return len(p), nil
}

func (c *benchClient) received() int {
	c.mu.Lock()
	defer c.mu.Unlock()
	return c.got
}

// waitPast waits until more than n bytes have arrived.
func (c *benchClient) waitPast(n int, within time.Duration) bool {
	deadline := time.NewTimer(within)
	defer deadline.Stop()
	for c.received() <= n {
		select {
		case <-c.changed:
		case <-deadline.C:
			return false
		}
	}
	return true
}

// BenchmarkServeWorkshop100Sessions: 100 concurrent SSH sessions on
// 127.0.0.1, each running the real workshop and typing 50 keystrokes into
// the shelf's filter (NaCl, then four backspaces, over and over), a key
// every 100 ms ± 40 % (seeded), then flat out. A keystroke's latency runs
// from the write to the first screen bytes after it: the workshop draws
// nothing unprompted, so that frame is the keystroke's. Heap per session is
// the live-heap growth with every session open over the session count,
// client side included (it runs in this process). Run once:
//
//	go test . -run '^$' -bench ServeWorkshop100Sessions -benchtime 1x
func BenchmarkServeWorkshop100Sessions(b *testing.B) {
	for _, pace := range []time.Duration{100 * time.Millisecond, 0} {
		name := "flat-out"
		if pace > 0 {
			name = "every-" + pace.String()
		}
		b.Run(name, func(b *testing.B) {
			for range b.N {
				benchWorkshop(b, 100, 50, pace)
			}
		})
	}
}

func benchWorkshop(b *testing.B, sessions, keystrokes int, pace time.Duration) {
	db, err := data.Load()
	if err != nil {
		b.Fatal(err)
	}
	dir := b.TempDir()
	_, private, _ := ed25519.GenerateKey(rand.Reader)
	signer, _ := gossh.NewSignerFromKey(private)
	keys := filepath.Join(dir, "authorized_keys")
	os.WriteFile(keys, gossh.MarshalAuthorizedKey(signer.PublicKey()), 0o600)
	srv, err := serve.New(serve.Config{
		HostKeyPath: filepath.Join(dir, "host"), AuthorizedKeysPath: keys, StateDir: dir,
		MaxSessions: sessions + 8, Logger: slog.New(slog.DiscardHandler),
		NewModel: func(s serve.SessionSetup) tea.Model {
			return tui.New(tui.Options{Renderer: s.Renderer, DB: db, FileRoot: s.Folder, RecoveryPath: s.RecoveryPath,
				Width: s.Width, Height: s.Height, MaxInputLen: s.MaxInputLen})
		},
		ShutdownMsg: func(r string) tea.Msg { return tui.ShutdownMsg{Reason: r} },
	})
	if err != nil {
		b.Fatal(err)
	}
	ln, err := net.Listen("tcp", "127.0.0.1:0")
	if err != nil {
		b.Fatal(err)
	}
	go srv.Serve(ln)
	defer func() {
		ctx, cancel := context.WithTimeout(context.Background(), 10*time.Second)
		defer cancel()
		srv.Shutdown(ctx)
	}()

	runtime.GC()
	var before runtime.MemStats
	runtime.ReadMemStats(&before)

	clients := make([]*benchClient, sessions)
	var wg sync.WaitGroup
	for i := range clients {
		wg.Add(1)
		go func() {
			defer wg.Done()
			c := &benchClient{changed: make(chan struct{}, 1)}
			cl, err := gossh.Dial("tcp", ln.Addr().String(), &gossh.ClientConfig{User: "bench",
				Auth: []gossh.AuthMethod{gossh.PublicKeys(signer)}, HostKeyCallback: gossh.FixedHostKey(srv.HostKey()),
				Timeout: 10 * time.Second})
			if err != nil {
				b.Error(err)
				return
			}
			c.client = cl
			sess, _ := cl.NewSession()
			sess.Stdout = c
			c.stdin, _ = sess.StdinPipe()
			if err := sess.RequestPty("xterm-256color", 30, 100, gossh.TerminalModes{}); err != nil {
				b.Error(err)
				return
			}
			if err := sess.Shell(); err != nil {
				b.Error(err)
				return
			}
			io.WriteString(c.stdin, "\x1b[?62c") // the DA1 answer of a VT220-class terminal
			for deadline := time.Now().Add(30 * time.Second); time.Now().Before(deadline); {
				c.mu.Lock()
				ready := strings.Contains(c.text.String(), "NaCl")
				c.mu.Unlock()
				if ready {
					break
				}
				c.waitPast(c.received(), 100*time.Millisecond)
			}
			clients[i] = c
		}()
	}
	wg.Wait()
	if b.Failed() {
		return
	}
	defer func() {
		for _, c := range clients {
			c.client.Close()
		}
	}()
	// Let the first frames settle: nothing may arrive unprompted.
	time.Sleep(300 * time.Millisecond)
	quiet := clients[0].received()
	time.Sleep(300 * time.Millisecond)
	if clients[0].received() != quiet {
		b.Log("warning: the workshop draws unprompted; latencies below are upper bounds")
	}

	runtime.GC()
	var opened runtime.MemStats
	runtime.ReadMemStats(&opened)

	cpuBefore := cpuTime()
	pattern := []string{"N", "a", "C", "l", "\x7f", "\x7f", "\x7f", "\x7f"}
	var mu sync.Mutex
	latencies := make([]time.Duration, 0, sessions*keystrokes)
	for i, c := range clients {
		wg.Add(1)
		go func() {
			defer wg.Done()
			jitter := mrand.New(mrand.NewPCG(uint64(i), 11))
			if pace > 0 {
				time.Sleep(pace * time.Duration(i) / time.Duration(sessions))
			}
			mine := make([]time.Duration, 0, keystrokes)
			for k := range keystrokes {
				if pace > 0 && k > 0 {
					time.Sleep(pace * time.Duration(60+jitter.IntN(81)) / 100)
				}
				n := c.received()
				start := time.Now()
				io.WriteString(c.stdin, pattern[k%len(pattern)])
				if !c.waitPast(n, 10*time.Second) {
					b.Errorf("session %d: no frame 10 s after keystroke %d", i, k)
					return
				}
				mine = append(mine, time.Since(start))
			}
			mu.Lock()
			latencies = append(latencies, mine...)
			mu.Unlock()
		}()
	}
	wg.Wait()
	cpu := cpuTime() - cpuBefore
	if len(latencies) == 0 {
		return
	}
	slices.Sort(latencies)
	at := func(q float64) time.Duration { return latencies[int(q*float64(len(latencies)-1))] }
	perSession := float64(int64(opened.HeapAlloc)-int64(before.HeapAlloc)) / float64(sessions) / (1 << 20)
	b.ReportMetric(float64(at(0.5).Microseconds())/1000, "median-ms")
	b.ReportMetric(float64(at(0.99).Microseconds())/1000, "p99-ms")
	b.ReportMetric(perSession, "MiB/session")
	perKey := float64(cpu.Microseconds()) / 1000 / float64(len(latencies))
	b.ReportMetric(perKey, "cpu-ms/keystroke")
	load, _ := os.ReadFile("/proc/loadavg")
	b.Logf("%d keystrokes: median %v, p99 %v, max %v; heap %.2f MiB per session; CPU %.3f ms per keystroke (server, workshop and client together); GOMAXPROCS %d; loadavg %s",
		len(latencies), at(0.5), at(0.99), latencies[len(latencies)-1], perSession, perKey, runtime.GOMAXPROCS(0), strings.TrimSpace(string(load)))
}

// cpuTime is the user and system CPU time this process has used: a cost
// per keystroke that does not depend on what else the host is running.
func cpuTime() time.Duration {
	var u syscall.Rusage
	if err := syscall.Getrusage(syscall.RUSAGE_SELF, &u); err != nil {
		return 0
	}
	return time.Duration(u.Utime.Nano() + u.Stime.Nano())
}
