package serve

import (
	"errors"
	"fmt"
	"net"
	"runtime"
	"strings"
	"testing"
	"time"

	gossh "golang.org/x/crypto/ssh"
)

// The limits tested here are the project's issue 11: an authorised member
// is let in while 200 silent connections are open from one address, and
// one member's flood of requests keeps the server under 200 MB (the issue
// measured 20,000 env requests of 32 kB growing it from 17 to 854 MB).

// dialFrom opens a TCP connection to addr from the local address ip.
func dialFrom(ip, addr string) (net.Conn, error) {
	d := net.Dialer{LocalAddr: &net.TCPAddr{IP: net.ParseIP(ip)}, Timeout: 5 * time.Second}
	return d.Dial("tcp", addr)
}

// TestSilentFloodFromOneAddressLocksNoOneOut: 200 silent connections from
// 127.0.0.2 (another host, as the server sees it) hold at most
// MaxPendingPerAddress places; the rest are closed at once, and a member
// connecting from 127.0.0.1 logs in and works (47 silent connections once
// locked every member out with "handshake failed: EOF").
func TestSilentFloodFromOneAddressLocksNoOneOut(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.LoginTimeout = time.Minute })
	var silent []net.Conn
	for i := 0; i < 200; i++ {
		conn, err := dialFrom("127.0.0.2", ts.addr)
		if err != nil {
			t.Skipf("cannot connect from 127.0.0.2 on this system: %v", err)
		}
		defer conn.Close()
		silent = append(silent, conn)
	}
	// Count the connections the server keeps: those it refused end with
	// EOF; those it keeps send their version line and then wait.
	kept := 0
	deadline := time.Now().Add(2 * time.Second)
	for _, conn := range silent {
		conn.SetReadDeadline(deadline)
	}
	for _, conn := range silent {
		buf := make([]byte, 256)
		open := false
		for {
			n, err := conn.Read(buf)
			if n > 0 && strings.Contains(string(buf[:n]), "SSH-2.0") {
				open = true
			}
			if err != nil {
				var ne net.Error
				if errors.As(err, &ne) && ne.Timeout() {
					break // still open
				}
				open = false // closed by the server
				break
			}
		}
		if open {
			kept++
		}
	}
	if kept > DefaultMaxPendingPerAddress {
		t.Errorf("%d silent connections from one address kept open, want at most %d", kept, DefaultMaxPendingPerAddress)
	}
	tm := ts.mustTerm(t, ts.key, termOptions{})
	tm.mustSee("enthalpath probe screen")
	tm.typeKeys("ok")
	tm.mustSee("keys: ok|")
	t.Logf("200 silent connections from 127.0.0.2: %d kept open, the member from 127.0.0.1 logged in", kept)
}

// TestPendingPlaceFreedAtLogin: an address's connections that have logged
// in no longer count against its pending places, so a member may open more
// sessions than MaxPendingPerAddress from one address.
func TestPendingPlaceFreedAtLogin(t *testing.T) {
	ts := startServer(t, func(c *Config) { c.MaxPendingPerAddress = 1 })
	for range 3 {
		tm := ts.mustTerm(t, ts.key, termOptions{})
		tm.mustSee("enthalpath probe screen")
		defer tm.client.Close()
	}
}

// heapInUse is the live heap after a collection, in bytes.
func heapInUse() uint64 {
	runtime.GC()
	var m runtime.MemStats
	runtime.ReadMemStats(&m)
	return m.HeapInuse
}

// floodEnv sends n env requests of size bytes each on a new session of
// client, each waiting for its reply, and returns how many were accepted.
func floodEnv(t testing.TB, client *gossh.Client, n, size int) int {
	t.Helper()
	ch, reqs, err := client.OpenChannel("session", nil)
	if err != nil {
		t.Fatal(err)
	}
	defer ch.Close()
	go gossh.DiscardRequests(reqs)
	value := strings.Repeat("x", size)
	accepted := 0
	for i := range n {
		payload := gossh.Marshal(struct{ Name, Value string }{fmt.Sprintf("V%d", i), value})
		ok, err := ch.SendRequest("env", true, payload)
		if err != nil {
			t.Fatalf("env request %d: %v", i, err)
		}
		if ok {
			accepted++
		}
	}
	return accepted
}

// TestRequestFloodBounded: a member's flood of env requests keeps only
// MaxEnvPerChannel small ones, and the server's live heap does not grow
// with the flood; session channels beyond MaxChannelsPerConn are refused.
func TestRequestFloodBounded(t *testing.T) {
	ts := startServer(t, nil)
	client, err := ts.dial(ts.key)
	if err != nil {
		t.Fatal(err)
	}
	defer client.Close()
	if got := floodEnv(t, client, 500, 16); got != MaxEnvPerChannel {
		t.Errorf("%d of 500 small env requests accepted, want %d", got, MaxEnvPerChannel)
	}
	before := heapInUse()
	const n, size = 2000, 32 << 10
	if got := floodEnv(t, client, n, size); got != 0 {
		t.Errorf("%d env requests of %d bytes accepted, want none", got, size)
	}
	grew := int64(heapInUse()) - int64(before)
	// Kept, the flood would hold n×size = 64 MiB.
	if grew > 16<<20 {
		t.Errorf("live heap grew %.1f MiB over %d env requests of %d kB", float64(grew)/(1<<20), n, size>>10)
	}
	t.Logf("live heap change over %d env requests of %d kB: %+.1f MiB", n, size>>10, float64(grew)/(1<<20))

	// Channels: two open at once on one connection, the third refused.
	var open []gossh.Channel
	for i := range 5 {
		ch, reqs, err := client.OpenChannel("session", nil)
		if err != nil {
			var oc *gossh.OpenChannelError
			if !errors.As(err, &oc) || oc.Reason != gossh.ResourceShortage || i < MaxChannelsPerConn {
				t.Fatalf("channel %d: %v", i+1, err)
			}
			continue
		}
		go gossh.DiscardRequests(reqs)
		open = append(open, ch)
	}
	if len(open) != MaxChannelsPerConn {
		t.Errorf("%d session channels open at once, want %d", len(open), MaxChannelsPerConn)
	}
	for _, ch := range open {
		ch.Close()
	}
	// A closed channel frees its place.
	deadline := time.Now().Add(5 * time.Second)
	for {
		ch, reqs, err := client.OpenChannel("session", nil)
		if err == nil {
			go gossh.DiscardRequests(reqs)
			ch.Close()
			break
		}
		if time.Now().After(deadline) {
			t.Fatalf("no channel place freed after closing: %v", err)
		}
		time.Sleep(20 * time.Millisecond)
	}
}

// BenchmarkEnvFlood20k is the flood: 20,000 env requests of 32 kB
// on one session channel. It reports the server's live heap after it
// (MiB-retained) and the process's peak heap during it (MiB-peak-heap),
// both including the client's side, which runs in the same process.
func BenchmarkEnvFlood20k(b *testing.B) {
	ts := startServer(b, nil)
	client, err := ts.dial(ts.key)
	if err != nil {
		b.Fatal(err)
	}
	defer client.Close()
	before := heapInUse()
	var peak uint64
	stop := make(chan struct{})
	sampled := make(chan struct{})
	go func() {
		defer close(sampled)
		var m runtime.MemStats
		for {
			select {
			case <-stop:
				return
			case <-time.After(10 * time.Millisecond):
				runtime.ReadMemStats(&m)
				peak = max(peak, m.HeapInuse)
			}
		}
	}()
	for range b.N {
		floodEnv(b, client, 20000, 32<<10)
	}
	close(stop)
	<-sampled
	b.ReportMetric(float64(int64(heapInUse())-int64(before))/(1<<20), "MiB-retained")
	b.ReportMetric(float64(peak)/(1<<20), "MiB-peak-heap")
}
