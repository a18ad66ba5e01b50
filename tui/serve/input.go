package serve

import (
	"io"
	"os"
	"sync"
	"sync/atomic"
	"time"
)

// burstQuiet is how long input must pause after a dropped burst before
// reads are accepted again, so the tail of a runaway paste is dropped too.
const burstQuiet = 100 * time.Millisecond

// inputGate stands between a session's channel and its program: it records
// when the last keystroke came (for the idle timeout), drops runaway
// bursts, and can be closed or given a read deadline, which a plain SSH
// channel cannot.
type inputGate struct {
	chunks   chan []byte
	closed   chan struct{}
	gone     chan struct{} // closed when the channel itself ends
	once     sync.Once
	maxBurst int
	// onDrop is told of each dropped read, and whether it starts a burst.
	onDrop func(bytes int, burstStart bool)
	// now is the clock the burst rule reads (time.Now; a fake one in the
	// fuzz test, so that what is dropped follows from the input alone).
	now func() time.Time

	lastInput atomic.Int64 // UnixNano of the last accepted read

	mu       sync.Mutex // guards pending and deadline; Read is called from one goroutine at a time
	pending  []byte
	deadline time.Time
}

func newInputGate(src io.Reader, maxBurst int, onDrop func(bytes int, burstStart bool)) *inputGate {
	return newInputGateClock(src, maxBurst, onDrop, time.Now)
}

// newInputGateClock is newInputGate reading the time from now.
func newInputGateClock(src io.Reader, maxBurst int, onDrop func(bytes int, burstStart bool), now func() time.Time) *inputGate {
	g := &inputGate{
		now:      now,
		chunks:   make(chan []byte, 4),
		closed:   make(chan struct{}),
		gone:     make(chan struct{}),
		maxBurst: maxBurst,
		onDrop:   onDrop,
	}
	g.lastInput.Store(now().UnixNano())
	go g.pump(src)
	return g
}

// pump copies from the channel until it ends or the gate closes.
func (g *inputGate) pump(src io.Reader) {
	defer close(g.chunks)
	// One byte more than a burst may hold tells a full burst from a
	// runaway one.
	buf := make([]byte, g.maxBurst+1)
	var droppedAt time.Time
	for {
		n, err := src.Read(buf)
		if n > 0 {
			now := g.now()
			if n > g.maxBurst || (!droppedAt.IsZero() && now.Sub(droppedAt) < burstQuiet) {
				first := droppedAt.IsZero() || now.Sub(droppedAt) >= burstQuiet
				droppedAt = now
				if g.onDrop != nil {
					g.onDrop(n, first)
				}
			} else {
				droppedAt = time.Time{}
				g.lastInput.Store(now.UnixNano())
				chunk := make([]byte, n)
				copy(chunk, buf[:n])
				select {
				case g.chunks <- chunk:
				case <-g.closed:
					return
				}
			}
		}
		if err != nil {
			close(g.gone)
			return
		}
	}
}

// Read implements io.Reader for the program.
func (g *inputGate) Read(p []byte) (int, error) {
	g.mu.Lock()
	if len(g.pending) > 0 {
		n := copy(p, g.pending)
		g.pending = g.pending[n:]
		g.mu.Unlock()
		return n, nil
	}
	deadline := g.deadline
	g.mu.Unlock()

	var timeout <-chan time.Time
	if !deadline.IsZero() {
		wait := time.Until(deadline)
		if wait <= 0 {
			return 0, os.ErrDeadlineExceeded
		}
		timer := time.NewTimer(wait)
		defer timer.Stop()
		timeout = timer.C
	}
	select {
	case chunk, ok := <-g.chunks:
		if !ok {
			return 0, io.EOF
		}
		n := copy(p, chunk)
		if n < len(chunk) {
			g.mu.Lock()
			g.pending = chunk[n:]
			g.mu.Unlock()
		}
		return n, nil
	case <-g.closed:
		return 0, io.EOF
	case <-timeout:
		return 0, os.ErrDeadlineExceeded
	}
}

// setDeadline makes Read give up at t (zero: never).
func (g *inputGate) setDeadline(t time.Time) {
	g.mu.Lock()
	g.deadline = t
	g.mu.Unlock()
}

// idleFor is how long ago the last keystroke came.
func (g *inputGate) idleFor(now time.Time) time.Duration {
	return now.Sub(time.Unix(0, g.lastInput.Load()))
}

// Close makes every Read return io.EOF.
func (g *inputGate) Close() error {
	g.once.Do(func() { close(g.closed) })
	return nil
}
