package analysis

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"encoding/json"
	"errors"
	"io"
	"math"
	"path/filepath"
	"runtime"
	"slices"
	"strconv"
	"strings"
	"sync"

	"enthalpath/cycle"
)

// batchBlockRows is the number of rows handed to a worker at once.
const batchBlockRows = 64

// batchBlock is a run of consecutive rows and, once done is signalled,
// their output: the reader fills rows (and faults, a cell the row cannot
// be read by), a worker estimates and writes them into out, the writer
// copies out in input order and hands the block back to the reader.
type batchBlock struct {
	rows   []BatchRow
	faults []string      // a row's cell fault, worded; "" for a readable row
	out    []byte        // the rows' output, CSV records or ",\n  "-led JSON objects
	failed int           // rows with an error
	err    error         // a row that could not be written
	done   chan struct{} // one value when out is complete
}

func newBatchBlock() *batchBlock {
	return &batchBlock{rows: make([]BatchRow, 0, batchBlockRows), faults: make([]string, 0, batchBlockRows), done: make(chan struct{}, 1)}
}

// reuse empties blk for the next run of rows, keeping its storage.
func (blk *batchBlock) reuse() {
	clear(blk.rows) // let go of the rows' strings and options
	blk.rows, blk.faults, blk.out = blk.rows[:0], blk.faults[:0], blk.out[:0]
	blk.failed, blk.err = 0, nil
}

// batchWorker estimates blocks and writes their rows' output; each of a
// batch's workers has its own, and they share seen.
type batchWorker struct {
	a       *Analyst
	scratch *cycle.Cycle // every row's cycle, in turn
	format  rowFormat
	seen    *seenRows
	hits    []seenRow // the block's rows found in seen; rest nil where not
	fresh   []fresh   // the block's rows estimated here, for seen
	lead    []byte    // scratch: a row's output up to its line number
}

// seenRows holds the output of the rows a batch's workers have estimated,
// without their line, by the rows' cells. A screening list repeats rows
// (a formula under several models, a list stretched over a family), a
// row's cycle, model, solve and wording cost microseconds, and the same
// cells give the same output but for the line: that work is done once per
// distinct row (twice at most when two workers meet the same new row at
// once). At most size rows are held, so that memory does not grow with
// the file; past that, rows are estimated afresh. Workers take the lock
// once per block.
type seenRows struct {
	mu   sync.RWMutex
	rows map[string]seenRow
	size int
	hits int // rows found in rows
}

type seenRow struct {
	rest   []byte // the output after the line number
	failed bool
}

type fresh struct {
	cells string
	row   seenRow
}

// rowMemoSize bounds the rows a batch remembers (by reader and workers).
const rowMemoSize = 1 << 14

// worthRemembering says whether a memory of n rows (of at most size),
// in which hits rows were found, takes a new one: while it holds fewer
// than 1,024, or while it is found at least once per four rows it holds.
// A list whose rows do not repeat (a sweep of a radius, say) then stops
// paying for a memory it does not use, about a microsecond a row.
func worthRemembering(n, hits, size int) bool {
	return n < size && (n < 1024 || 4*hits >= n)
}

func newBatchWorker(a *Analyst, asJSON bool, seen *seenRows) *batchWorker {
	return &batchWorker{a: a, scratch: new(cycle.Cycle), format: newRowFormat(asJSON), seen: seen}
}

// block estimates blk's rows and writes their output into blk.out.
func (w *batchWorker) block(blk *batchBlock) {
	defer func() { blk.done <- struct{}{} }()
	w.hits = slices.Grow(w.hits[:0], len(blk.rows))[:len(blk.rows)]
	hits := 0
	w.seen.mu.RLock()
	for i := range blk.rows {
		w.hits[i] = w.seen.rows[blk.rows[i].cells] // a row with a cell fault is never stored
		if w.hits[i].rest != nil {
			hits++
		}
	}
	remembering := worthRemembering(len(w.seen.rows), w.seen.hits, w.seen.size)
	w.seen.mu.RUnlock()
	w.fresh = w.fresh[:0]
	defer w.remember(hits)
	for i := range blk.rows {
		row := &blk.rows[i]
		if blk.faults[i] != "" { // a cell fault found while reading
			blk.failed++
			if blk.out, blk.err = w.format.write(blk.out, &BatchResult{Line: row.Line, Formula: row.Formula, Error: blk.faults[i]}); blk.err != nil {
				return
			}
			continue
		}
		if s := w.hits[i]; s.rest != nil {
			blk.out = w.format.appendLine(blk.out, row.Line)
			blk.out = append(blk.out, s.rest...)
			if s.failed {
				blk.failed++
			}
			continue
		}
		res := w.a.rowInto(*row, w.scratch)
		start := len(blk.out)
		if blk.out, blk.err = w.format.write(blk.out, &res); blk.err != nil {
			return
		}
		if res.Error != "" {
			blk.failed++
		}
		if !remembering || row.cells == "" {
			continue
		}
		w.lead = w.format.appendLine(w.lead[:0], row.Line)
		if out := blk.out[start:]; bytes.HasPrefix(out, w.lead) {
			w.fresh = append(w.fresh, fresh{row.cells, seenRow{rest: bytes.Clone(out[len(w.lead):]), failed: res.Error != ""}})
		}
	}
}

// remember counts the block's hits and puts the rows the worker
// estimated into seen while it is worth it.
func (w *batchWorker) remember(hits int) {
	if hits == 0 && len(w.fresh) == 0 {
		return
	}
	s := w.seen
	s.mu.Lock()
	s.hits += hits
	for _, f := range w.fresh {
		if worthRemembering(len(s.rows), s.hits, s.size) {
			s.rows[f.cells] = f.row
		}
	}
	s.mu.Unlock()
}

// rowFormat writes BatchResults as CSV records (encoding/csv's quoting)
// or as JSON objects (encoding/json), each JSON object led by ",\n  ".
type rowFormat struct {
	json bool
	buf  bytes.Buffer
	cw   *csv.Writer
	rec  []string
}

// jsonRowLead is what a JSON row starts with (the writer drops the
// comma of the first), jsonLead the same up to its line number
// (BatchResult's first field).
const (
	jsonRowLead = ",\n  "
	jsonLead    = jsonRowLead + `{"line":`
)

func newRowFormat(asJSON bool) rowFormat {
	return rowFormat{json: asJSON, rec: make([]string, len(batchCSVHeader))}
}

// write appends res's output to dst.
func (f *rowFormat) write(dst []byte, res *BatchResult) ([]byte, error) {
	if f.json {
		b, err := json.Marshal(res)
		if err != nil {
			return dst, err
		}
		return append(append(dst, jsonRowLead...), b...), nil
	}
	res.fill(f.rec)
	return f.csv(dst, f.rec)
}

// csv appends rec as one CSV record to dst.
func (f *rowFormat) csv(dst []byte, rec []string) ([]byte, error) {
	if f.cw == nil {
		f.cw = csv.NewWriter(&f.buf)
	}
	f.buf.Reset()
	f.cw.Write(rec)
	f.cw.Flush()
	if err := f.cw.Error(); err != nil {
		return dst, err
	}
	return append(dst, f.buf.Bytes()...), nil
}

// appendLine appends the start of a row's output up to and with its line
// number: what write puts before a row's other fields.
func (f *rowFormat) appendLine(dst []byte, line int) []byte {
	if f.json {
		dst = append(dst, jsonLead...)
	}
	return strconv.AppendInt(dst, int64(line), 10)
}

// BatchResult is one output row.
type BatchResult struct {
	Line    int    `json:"line"`
	Formula string `json:"formula"`
	Cation  string `json:"cation,omitempty"`
	Anion   string `json:"anion,omitempty"`
	Model   string `json:"model,omitempty"`
	// LatticeKJPerMol is the model's lattice step (ΔH_L, negative) and
	// ModelUncertaintyKJPerMol its σ.
	LatticeKJPerMol          *float64 `json:"lattice_kj_per_mol,omitempty"`
	ModelUncertaintyKJPerMol *float64 `json:"model_uncertainty_kj_per_mol,omitempty"`
	// FormationKJPerMol is the estimated formation enthalpy and
	// UncertaintyKJPerMol its total σ.
	FormationKJPerMol   *float64 `json:"formation_kj_per_mol,omitempty"`
	UncertaintyKJPerMol *float64 `json:"uncertainty_kj_per_mol,omitempty"`
	// MeasuredFormationKJPerMol is the data's value when tabulated, and
	// CycleLatticeKJPerMol the lattice step Hess's law gives from it.
	MeasuredFormationKJPerMol *float64 `json:"measured_formation_kj_per_mol,omitempty"`
	CycleLatticeKJPerMol      *float64 `json:"cycle_lattice_kj_per_mol,omitempty"`
	Error                     string   `json:"error,omitempty"`
}

// batchCSVHeader is the output CSV header, in BatchResult order.
var batchCSVHeader = []string{"line", "formula", "cation", "anion", "model", "lattice_kj_per_mol", "model_uncertainty_kj_per_mol",
	"formation_kj_per_mol", "uncertainty_kj_per_mol", "measured_formation_kj_per_mol", "cycle_lattice_kj_per_mol", "error"}

// BatchOptions choose the output.
type BatchOptions struct {
	// JSON writes a JSON array (one object per row) instead of CSV.
	JSON bool
	// Progress, when set, is called after each row with the rows done.
	Progress func(rows int)
	// Workers is the number of rows estimated at once (0: one per
	// processor, runtime.GOMAXPROCS). The output does not depend on it.
	Workers int
	// Dir is the folder a relative CIF path in the structure column is
	// read from (the batch file's); "" is the working directory.
	Dir string
	// memoRows bounds the rows remembered by the reader and by the
	// workers together (0: rowMemoSize); tests set it small to cross the
	// bound.
	memoRows int
}

// BatchSummary counts the rows.
type BatchSummary struct {
	Rows, Failed int
}

// Row estimates one batch row.
func (a *Analyst) Row(row BatchRow) BatchResult { return a.rowInto(row, nil) }

// rowInto is Row building the row's cycle in scratch's storage when scratch
// is not nil (one per batch worker: a row's cycle is not kept).
func (a *Analyst) rowInto(row BatchRow, scratch *cycle.Cycle) BatchResult {
	out := BatchResult{Line: row.Line, Formula: row.Formula}
	est, _, err := a.quickEstimateInto(row.Formula, row.Options, scratch)
	if err != nil {
		out.Error = oneLine(err.Error())
		return out
	}
	out.Formula = est.Formula
	out.Cation, out.Anion, out.Model = est.Cation.Symbol, est.Anion.Symbol, est.Model
	out.LatticeKJPerMol = num(est.Lattice)
	out.ModelUncertaintyKJPerMol = num(est.ModelUncertainty)
	out.FormationKJPerMol = num(est.Value)
	out.UncertaintyKJPerMol = num(est.Uncertainty)
	if est.Measured != nil && est.Solved.Key == "formation" {
		out.MeasuredFormationKJPerMol = num(est.Measured.Value)
		// Cycle lattice = model lattice + (measured − estimated formation).
		out.CycleLatticeKJPerMol = num(est.Lattice + est.Measured.Value - est.Value)
	}
	return out
}

func num(v float64) *float64 {
	if math.IsNaN(v) || math.IsInf(v, 0) {
		return nil
	}
	r := math.Round(v*1000) / 1000
	return &r
}

func oneLine(s string) string { return strings.Join(strings.Fields(s), " ") }

// Batch reads rows from r and writes one result per row to w as it goes
// (CSV, or a JSON array). A row that cannot be estimated, or has a cell
// that cannot be read (a model, charges, radius or set: value), gets its
// error in the error column and the batch goes on; only a file that cannot
// be read as the table its header declares (malformed CSV, a row with the
// wrong number of columns, an over-long line) stops the batch, with a
// *CSVError naming its line. Rows are estimated on opt.Workers cores and
// written in input order; rows with the same cells are estimated once
// (see seenRows), so the output is the same whatever the workers.
func (a *Analyst) Batch(r io.Reader, w io.Writer, opt BatchOptions) (BatchSummary, error) {
	var sum BatchSummary
	br, err := NewBatchReader(r)
	if err != nil {
		return sum, err
	}
	memoRows := rowMemoSize
	if opt.memoRows > 0 {
		memoRows = opt.memoRows
	}
	br.readSize = memoRows
	bw := bufio.NewWriterSize(w, 64<<10)
	if opt.JSON {
		bw.WriteString("[")
	} else {
		f := newRowFormat(false)
		head, err := f.csv(nil, batchCSVHeader)
		if err != nil {
			return sum, err
		}
		bw.Write(head)
	}
	finish := func() error {
		if opt.JSON {
			if sum.Rows > 0 {
				bw.WriteString("\n")
			}
			bw.WriteString("]\n")
		}
		return bw.Flush()
	}
	// Rows are read into blocks, estimated and written out by workers
	// block by block, and copied to w in input order: a bounded queue of
	// blocks keeps at most cap(queue) blocks in flight, so memory does not
	// grow with the file, and a block's rows share one hand-over (rows
	// take microseconds, a hand-over per row would cost as much).
	workers := opt.Workers
	if workers <= 0 {
		workers = runtime.GOMAXPROCS(0)
	}
	queue := make(chan *batchBlock, 4*workers)
	jobs := make(chan *batchBlock, 4*workers)
	spare := make(chan *batchBlock, 4*workers+2) // written blocks, for the reader to fill again
	seen := &seenRows{rows: map[string]seenRow{}, size: memoRows}
	var wg sync.WaitGroup
	for range workers {
		wg.Add(1)
		go func() {
			defer wg.Done()
			bw := newBatchWorker(a, opt.JSON, seen)
			for blk := range jobs {
				bw.block(blk)
			}
		}()
	}
	var readErr error
	go func() {
		defer close(queue)
		defer close(jobs)
		next := func() *batchBlock {
			select {
			case blk := <-spare:
				blk.reuse()
				return blk
			default:
				return newBatchBlock()
			}
		}
		blk := next()
		send := func() {
			queue <- blk
			jobs <- blk
			blk = next()
		}
		for {
			row, err := br.Next()
			if err == io.EOF {
				break
			}
			if err != nil {
				var ce *CSVError
				if !errors.As(err, &ce) || ce.Column == "" {
					readErr = err
					break
				}
				// A cell fault is this row's result, like a failed estimate.
				blk.rows = append(blk.rows, row)
				blk.faults = append(blk.faults, oneLine(err.Error()))
			} else {
				if st := row.Options.Structure; isCIFPath(st) && !filepath.IsAbs(st) {
					row.Options.Structure = filepath.Join(opt.Dir, st)
				}
				blk.rows = append(blk.rows, row)
				blk.faults = append(blk.faults, "")
			}
			if len(blk.rows) == batchBlockRows {
				send()
			}
		}
		if len(blk.rows) > 0 {
			send()
		}
	}()
	var writeErr error
	for blk := range queue {
		<-blk.done
		if writeErr != nil {
			continue // drain
		}
		if writeErr = blk.err; writeErr != nil {
			continue
		}
		out := blk.out
		if opt.JSON && sum.Rows == 0 {
			out = out[1:] // the first object has no comma before it
		}
		if _, writeErr = bw.Write(out); writeErr != nil {
			continue
		}
		sum.Failed += blk.failed
		for range blk.rows {
			sum.Rows++
			if opt.Progress != nil {
				opt.Progress(sum.Rows)
			}
		}
		select {
		case spare <- blk:
		default:
		}
	}
	wg.Wait()
	if writeErr != nil {
		return sum, writeErr
	}
	if readErr != nil {
		finish()
		return sum, readErr
	}
	return sum, finish()
}

func (res *BatchResult) fill(rec []string) {
	f := func(p *float64) string {
		if p == nil {
			return ""
		}
		return strconv.FormatFloat(*p, 'f', -1, 64)
	}
	rec[0], rec[1], rec[2], rec[3], rec[4] = strconv.Itoa(res.Line), res.Formula, res.Cation, res.Anion, res.Model
	rec[5], rec[6], rec[7], rec[8] = f(res.LatticeKJPerMol), f(res.ModelUncertaintyKJPerMol), f(res.FormationKJPerMol), f(res.UncertaintyKJPerMol)
	rec[9], rec[10], rec[11] = f(res.MeasuredFormationKJPerMol), f(res.CycleLatticeKJPerMol), res.Error
}
