package cli

import (
	"errors"
	"fmt"
	"io"
	"os"
	"path/filepath"
	"strings"
	"time"

	"github.com/mattn/go-isatty"

	"enthalpath/cycle/analysis"
	"enthalpath/thermo/fileio"
)

const batchSynopsis = "batch FILE.csv [--out FILE] [--json]"

func runBatch(env Env, args []string) error {
	fs := NewFlagSet("batch")
	var out string
	var asJSON bool
	fs.StringVar(&out, "out", "", "write the results to `FILE` (default standard output); written to a temporary file and renamed when complete")
	fs.BoolVar(&asJSON, "json", false, "write a JSON array instead of CSV")
	pos, a, err := analysisSetup(env, fs, args)
	if err != nil || a == nil {
		return err
	}
	if len(pos) != 1 {
		return Usagef("give one input file: usage: enthalpath %s", batchSynopsis)
	}
	name := pos[0]
	var in io.Reader = env.Stdin
	var size int64
	if name != "-" {
		f, err := os.Open(name)
		if err != nil {
			return Usagef("batch input: %v", err)
		}
		defer f.Close()
		if st, err := f.Stat(); err == nil {
			size = st.Size()
		}
		in = f
	}
	counted := &countingReader{r: in}
	bar := newProgressBar(env.Stderr, size, counted)
	dir := "."
	if name != "-" {
		dir = filepath.Dir(name)
	}
	var sum analysis.BatchSummary
	run := func(w io.Writer) error {
		var err error
		sum, err = a.Batch(counted, w, analysis.BatchOptions{JSON: asJSON, Progress: bar.update, Dir: dir})
		return err
	}
	if out == "" {
		err = run(env.Stdout)
	} else {
		// Written whole or not at all: a temporary file renamed when complete.
		err = fileio.WriteAtomic(out, 0o644, run)
	}
	bar.finish()
	var ce *analysis.CSVError
	switch {
	case errors.As(err, &ce):
		return Usagef("%s: %v", name, err)
	case err != nil && out != "":
		return outputFileError("--out", out, err)
	case err != nil:
		return err
	}
	if sum.Failed > 0 {
		fmt.Fprintf(env.Stderr, "enthalpath batch: %d of %d rows could not be estimated (see their error column)\n", sum.Failed, sum.Rows)
	}
	return nil
}

type countingReader struct {
	r io.Reader
	n int64
}

func (c *countingReader) Read(p []byte) (int, error) {
	n, err := c.r.Read(p)
	c.n += int64(n)
	return n, err
}

// progressBar draws a bar on stderr once the work has run for more than a
// second, and only when stderr is a terminal; otherwise it does nothing.
// It shows the share of the input file read and the rows done, or, when
// status is set, the share and text status gives.
type progressBar struct {
	w       io.Writer
	on      bool
	start   time.Time
	last    time.Time
	size    int64
	read    *countingReader
	rows    int
	visible bool
	status  func() (share float64, text string)
}

func newProgressBar(w io.Writer, size int64, read *countingReader) *progressBar {
	b := &progressBar{w: w, size: size, read: read, start: time.Now()}
	if f, ok := w.(*os.File); ok {
		b.on = isatty.IsTerminal(f.Fd()) || isatty.IsCygwinTerminal(f.Fd())
	}
	return b
}

func (b *progressBar) update(rows int) {
	b.rows = rows
	if rows%64 == 0 {
		b.tick()
	}
}

// tick draws the bar if it is on, has run a second and was not drawn in
// the last tenth of a second.
func (b *progressBar) tick() {
	if !b.on {
		return
	}
	now := time.Now()
	if now.Sub(b.start) < time.Second || now.Sub(b.last) < 100*time.Millisecond {
		return
	}
	b.last = now
	b.draw()
}

func (b *progressBar) draw() {
	const width = 30
	if b.status != nil {
		share, text := b.status()
		n := int(min(max(share, 0), 1) * width)
		fmt.Fprintf(b.w, "\r[%s%s] %3.0f %%  %s", strings.Repeat("#", n), strings.Repeat(".", width-n), 100*min(max(share, 0), 1), text)
	} else if b.size > 0 {
		frac := float64(b.read.n) / float64(b.size)
		frac = min(max(frac, 0), 1)
		n := int(frac * width)
		fmt.Fprintf(b.w, "\r[%s%s] %3.0f %%  %d rows", strings.Repeat("#", n), strings.Repeat(".", width-n), 100*frac, b.rows)
	} else {
		fmt.Fprintf(b.w, "\r%d rows", b.rows)
	}
	b.visible = true
}

func (b *progressBar) finish() {
	if b.visible {
		b.draw()
		fmt.Fprintln(b.w)
	}
}
