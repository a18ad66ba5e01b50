//go:build unix

package serve

import (
	"fmt"
	"math/rand/v2"
	"os"
	"runtime"
	"slices"
	"strings"
	"sync"
	"syscall"
	"testing"
	"time"
)

// loadFigures are the results of one load run.
type loadFigures struct {
	median, p99, worst time.Duration
	heapPerSession     float64 // bytes
	keystrokes         int
	cpuPerKey          time.Duration // process CPU (server and client) per keystroke
}

// runLoad opens sessions concurrent PTY sessions on 127.0.0.1, waits for
// every start screen, then has each type keystrokes keys one at a time,
// timing each from the write to the screen showing its effect (the probe's
// "count: N;" line). With pace > 0 each session waits that long between
// keystrokes (after a start offset spread evenly over one pace, so the
// sessions do not type in lockstep); with 0 they type flat out, the next
// key as soon as the last one shows. Everything is bounded: at most sessions × keystrokes
// writes, and each wait gives up after 10 s.
func runLoad(b *testing.B, sessions, keystrokes int, pace time.Duration) loadFigures {
	b.Helper()
	ts := startServer(b, func(c *Config) { c.MaxSessions = sessions + 8 })

	runtime.GC()
	var before runtime.MemStats
	runtime.ReadMemStats(&before)

	terms := make([]*term, sessions)
	var wg sync.WaitGroup
	errs := make(chan error, sessions)
	for i := range terms {
		wg.Add(1)
		go func() {
			defer wg.Done()
			tm, err := ts.openTerm(ts.key, termOptions{})
			if err != nil {
				errs <- err
				return
			}
			terms[i] = tm
			errs <- tm.waitFor("enthalpath probe screen", 0, 20*time.Second)
		}()
	}
	wg.Wait()
	close(errs)
	for err := range errs {
		if err != nil {
			b.Fatal(err)
		}
	}
	defer func() {
		for _, tm := range terms {
			tm.client.Close()
		}
	}()

	cpuBefore := cpuTime()
	var mu sync.Mutex
	latencies := make([]time.Duration, 0, sessions*keystrokes)
	failures := make(chan error, sessions)
	for i, tm := range terms {
		wg.Add(1)
		go func() {
			defer wg.Done()
			if pace > 0 {
				time.Sleep(pace * time.Duration(i) / time.Duration(sessions))
			}
			// Pauses vary by ±40 % (seeded per session, so runs repeat),
			// as a typist's do; a fixed pause would lock each session to
			// one phase of the frame ticker.
			jitter := rand.New(rand.NewPCG(uint64(i), 7))
			mine := make([]time.Duration, 0, keystrokes)
			for k := 1; k <= keystrokes; k++ {
				if pace > 0 && k > 1 {
					time.Sleep(pace * time.Duration(60+jitter.IntN(81)) / 100)
				}
				mark := tm.mark()
				start := time.Now()
				if _, err := tm.stdin.Write([]byte{byte('a' + k%26)}); err != nil {
					failures <- err
					return
				}
				if err := tm.waitFor(fmt.Sprintf("count: %d;", k), mark, 10*time.Second); err != nil {
					failures <- err
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
	close(failures)
	for err := range failures {
		b.Fatal(err)
	}

	cpu := cpuTime() - cpuBefore
	runtime.GC()
	var after runtime.MemStats
	runtime.ReadMemStats(&after)

	slices.Sort(latencies)
	at := func(q float64) time.Duration { return latencies[int(q*float64(len(latencies)-1))] }
	return loadFigures{
		median:         at(0.5),
		p99:            at(0.99),
		worst:          latencies[len(latencies)-1],
		heapPerSession: float64(int64(after.HeapAlloc)-int64(before.HeapAlloc)) / float64(sessions),
		keystrokes:     len(latencies),
		cpuPerKey:      cpu / time.Duration(len(latencies)),
	}
}

// BenchmarkLoad100Sessions: 100 concurrent sessions on loopback, 50
// keystrokes each, against the probe model, first at a fast typist's pace
// (a key every 100 ms, about 120 words a minute: 1000 keys a second for
// the server) and then flat out (a saturation test: each session sends its
// next key the moment the last one shows). Run it once:
//
//	go test ./tui/serve/ -run '^$' -bench Load100Sessions -benchtime 1x
//
// The heap figure is the live heap growth with all sessions open, divided
// by the session count; it includes the client side of each session, which
// runs in the same process, so the server's own share is smaller.
func BenchmarkLoad100Sessions(b *testing.B) {
	for _, pace := range []time.Duration{100 * time.Millisecond, 0} {
		name := "flat-out"
		if pace > 0 {
			name = "every-" + pace.String()
		}
		b.Run(name, func(b *testing.B) { benchLoad(b, pace) })
	}
}

func benchLoad(b *testing.B, pace time.Duration) {
	for range b.N {
		f := runLoad(b, 100, 50, pace)
		b.ReportMetric(float64(f.median.Microseconds())/1000, "median-ms")
		b.ReportMetric(float64(f.p99.Microseconds())/1000, "p99-ms")
		b.ReportMetric(float64(f.worst.Microseconds())/1000, "max-ms")
		b.ReportMetric(f.heapPerSession/(1<<20), "MiB/session")
		b.ReportMetric(float64(f.cpuPerKey.Microseconds())/1000, "cpu-ms/keystroke")
		b.Logf("%d keystrokes: median %v, p99 %v, max %v; heap %.2f MiB per session; CPU %v per keystroke (server and client); GOMAXPROCS %d, load average %s",
			f.keystrokes, f.median, f.p99, f.worst, f.heapPerSession/(1<<20), f.cpuPerKey, runtime.GOMAXPROCS(0), loadAverage())
	}
}

// loadAverage is the host's one-minute load average, to read the figures
// against (other work on the host inflates the tail); "?" off Linux.
func loadAverage() string {
	b, err := os.ReadFile("/proc/loadavg")
	if err != nil {
		return "?"
	}
	fields := strings.Fields(string(b))
	if len(fields) == 0 {
		return "?"
	}
	return fields[0]
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
