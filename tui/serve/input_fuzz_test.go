package serve

import (
	"bytes"
	"errors"
	"io"
	"sync"
	"testing"
	"time"
)

// pieceReader returns data in reads of the sizes cuts gives (cycled, 1 to
// 128 bytes; the top bit of a cut says whether a pause longer than
// burstQuiet came before the read, on the clock it advances), remembering
// each read and whether the gate dropped it.
type pieceReader struct {
	data  []byte
	cuts  []byte
	i     int
	clock time.Time

	mu      sync.Mutex
	reads   [][]byte
	dropped []bool
}

func (r *pieceReader) Read(p []byte) (int, error) {
	if len(r.data) == 0 {
		return 0, io.EOF
	}
	cut := r.cuts[r.i%len(r.cuts)]
	r.i++
	n := 1 + int(cut&0x7f)
	if cut&0x80 != 0 {
		r.clock = r.clock.Add(2 * burstQuiet)
	} else {
		r.clock = r.clock.Add(time.Millisecond)
	}
	n = min(n, len(p), len(r.data))
	copy(p, r.data[:n])
	r.mu.Lock()
	r.reads = append(r.reads, bytes.Clone(r.data[:n]))
	r.dropped = append(r.dropped, false)
	r.mu.Unlock()
	r.data = r.data[n:]
	return n, nil
}

// FuzzInputGate: whatever a client sends, in whatever pieces, the gate
// hands the program exactly the reads it did not drop, in order, each no
// longer than the burst limit; what it drops is what onDrop was told; it
// ends with io.EOF when the client does; never a panic or a hang. The
// gate's clock is the reader's, so what is dropped follows from the input
// alone (on the real clock the fuzzer's minimizer stalled). Seeds:
// keystrokes, a paste over the limit, an escape sequence split in two.
func FuzzInputGate(f *testing.F) {
	f.Add([]byte("NaCl\r"), []byte{0}, uint16(16), uint8(7))
	f.Add(bytes.Repeat([]byte("x"), 5000), []byte{255, 3}, uint16(64), uint8(1))
	f.Add([]byte("\x1b[A\x1b[B\x1b]11;rgb:ffff/ffff/ffff\x07"), []byte{2, 40}, uint16(16), uint8(255))
	f.Fuzz(fuzzGateOnce)
}

// fuzzGateOnce is one run of FuzzInputGate.
func fuzzGateOnce(t *testing.T, data, cuts []byte, limit uint16, bufSize uint8) {
	if len(cuts) == 0 {
		cuts = []byte{0}
	}
	// Past a few bursts nothing new happens; a megabyte read a byte at a
	// time only slows the fuzzer (and its minimizer) down.
	data = data[:min(len(data), 16<<10)]
	maxBurst := 16 + int(limit)%4096
	src := &pieceReader{data: bytes.Clone(data), cuts: cuts, clock: time.Unix(0, 0)}
	total := len(data)
	var dropped int
	g := newInputGateClock(src, maxBurst, func(n int, _ bool) {
		src.mu.Lock()
		src.dropped[len(src.dropped)-1] = true // the read just made
		src.mu.Unlock()
		dropped += n
	}, func() time.Time { return src.clock })
	defer g.Close()
	var out bytes.Buffer
	buf := make([]byte, 1+int(bufSize))
	for {
		n, err := g.Read(buf)
		if n > len(buf) {
			t.Fatalf("Read returned %d bytes into %d", n, len(buf))
		}
		out.Write(buf[:n])
		if errors.Is(err, io.EOF) {
			break
		}
		if err != nil {
			t.Fatalf("Read: %v", err)
		}
	}
	<-g.gone
	var want bytes.Buffer
	src.mu.Lock()
	for i, r := range src.reads {
		if !src.dropped[i] {
			if len(r) > maxBurst {
				t.Fatalf("a read of %d bytes passed a limit of %d", len(r), maxBurst)
			}
			want.Write(r)
		}
	}
	src.mu.Unlock()
	if !bytes.Equal(out.Bytes(), want.Bytes()) {
		t.Fatalf("gate passed %q, want the undropped reads %q", out.Bytes(), want.Bytes())
	}
	if out.Len()+dropped != total {
		t.Fatalf("%d passed + %d dropped != %d sent", out.Len(), dropped, total)
	}
}
