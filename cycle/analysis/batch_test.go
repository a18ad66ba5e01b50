package analysis

import (
	"bufio"
	"bytes"
	"encoding/csv"
	"encoding/json"
	"errors"
	"fmt"
	"io"
	"reflect"
	"strings"
	"testing"
	"testing/iotest"
)

func TestBatchCSV(t *testing.T) {
	a := testAnalyst(t)
	in := "# invented screening list (demo data, not a study)\n" +
		"formula,charges,model,cation_radius,set:attachment-2\n" +
		"MgCl,,,,\n" +
		"NaCl,,born-mayer,,\n" +
		"CaCl,\"Ca=+1,Cl=-1\",,1.3,\n" +
		"Qq2,,,,\n" +
		"MgO,,,,744±20\n"
	var out bytes.Buffer
	sum, err := a.Batch(strings.NewReader(in), &out, BatchOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if sum.Rows != 5 || sum.Failed != 1 {
		t.Errorf("summary %+v, want 5 rows with 1 failure (Qq2)", sum)
	}
	recs, err := csv.NewReader(&out).ReadAll()
	if err != nil {
		t.Fatal(err)
	}
	if len(recs) != 6 || strings.Join(recs[0], ",") != strings.Join(batchCSVHeader, ",") {
		t.Fatalf("output:\n%v", recs)
	}
	byFormula := map[string][]string{}
	for _, r := range recs[1:] {
		byFormula[r[1]] = r
	}
	if r := byFormula["Qq2"]; r == nil || r[11] == "" {
		t.Errorf("Qq2 row has no error: %v", r)
	}
	if r := byFormula["NaCl"]; r == nil || r[4] != "born-mayer" || r[9] != "-411.153" { // NaCl ΔfH° −411.153 kJ/mol, NBS 1982 via compounds.csv
		t.Errorf("NaCl row: %v", r)
	}
	if r := byFormula["CaCl"]; r == nil || r[2] != "Ca+" || r[11] != "" {
		t.Errorf("CaCl row: %v", r)
	}
	if r := byFormula["MgO"]; r == nil || r[7] == "" {
		t.Errorf("MgO row: %v", r)
	}
	// The batch agrees with a single estimate of the same formula.
	e, err := a.Estimate("MgCl", EstimateOptions{})
	if err != nil {
		t.Fatal(err)
	}
	if got := byFormula["MgCl"][7]; got != fmt.Sprint(*num(e.Value)) {
		t.Errorf("batch MgCl formation %s, Estimate %.3f", got, e.Value)
	}
}

func TestBatchJSON(t *testing.T) {
	a := testAnalyst(t)
	var out bytes.Buffer
	if _, err := a.Batch(strings.NewReader("formula\nMgCl\nMgCl2\n"), &out, BatchOptions{JSON: true}); err != nil {
		t.Fatal(err)
	}
	var rows []BatchResult
	if err := json.Unmarshal(out.Bytes(), &rows); err != nil {
		t.Fatalf("%v\n%s", err, out.String())
	}
	if len(rows) != 2 || rows[0].FormationKJPerMol == nil || rows[1].MeasuredFormationKJPerMol == nil {
		t.Errorf("rows: %s", out.String())
	}
	out.Reset()
	if _, err := a.Batch(strings.NewReader("formula\n"), &out, BatchOptions{JSON: true}); err != nil || strings.TrimSpace(out.String()) != "[]" {
		t.Errorf("empty batch: %q %v", out.String(), err)
	}
}

// TestBatchInputErrors: a file that cannot be read as its header's table
// stops the batch with a *CSVError naming the line (and column); a cell
// that cannot be read is that row's error, naming its line and column, and
// the other rows are still estimated.
func TestBatchInputErrors(t *testing.T) {
	a := testAnalyst(t)
	files := []struct {
		name, in string
		line     int
		column   string
	}{
		{"empty", "", 1, ""},
		{"no formula column", "model\nkapustinskii\n", 1, "formula"},
		{"unknown column", "formula,colour\nNaCl,red\n", 1, "colour"},
		{"field count", "formula,model\nNaCl\n", 2, ""},
		{"bare quote", "formula\n\"NaCl\n", 0, ""},
	}
	for _, tc := range files {
		_, err := a.Batch(strings.NewReader(tc.in), io.Discard, BatchOptions{})
		var ce *CSVError
		if !errors.As(err, &ce) || !errors.Is(err, ErrBadCSV) {
			t.Errorf("%s: got %v, want a *CSVError", tc.name, err)
			continue
		}
		if (tc.line != 0 && ce.Line != tc.line) || ce.Column != tc.column {
			t.Errorf("%s: error at line %d column %q (%v), want line %d column %q", tc.name, ce.Line, ce.Column, err, tc.line, tc.column)
		}
	}
	cells := []struct {
		name, in string
		line     int
		column   string
	}{
		{"bad radius", "formula,anion_radius\nNaCl,1.8\nKCl,big\n", 3, "anion_radius"},
		{"bad charges", "formula,charges\nNaCl,\nMgCl,Mg=+x\n", 3, "charges"},
		{"bad set", "formula,set:lattice\nNaCl,\nKCl,-780±\n", 3, "set:lattice"},
		{"unknown model", "formula,model\nNaCl,\nKCl,guess\n", 3, "model"},
	}
	for _, tc := range cells {
		var out bytes.Buffer
		sum, err := a.Batch(strings.NewReader(tc.in), &out, BatchOptions{JSON: true})
		if err != nil {
			t.Errorf("%s: the batch stopped: %v", tc.name, err)
			continue
		}
		var rows []BatchResult
		if err := json.Unmarshal(out.Bytes(), &rows); err != nil || len(rows) != 2 {
			t.Fatalf("%s: %v\n%s", tc.name, err, out.String())
		}
		good, bad := rows[0], rows[1]
		if good.Error != "" || good.FormationKJPerMol == nil {
			t.Errorf("%s: the good row was not estimated: %+v", tc.name, good)
		}
		if bad.Line != tc.line || !strings.Contains(bad.Error, fmt.Sprintf("line %d", tc.line)) || !strings.Contains(bad.Error, tc.column) {
			t.Errorf("%s: bad row %+v, want its error to name line %d and column %q", tc.name, bad, tc.line, tc.column)
		}
		if sum.Rows != 2 || sum.Failed != 1 {
			t.Errorf("%s: summary %+v, want 2 rows, 1 failed", tc.name, sum)
		}
	}
}

func TestBatchLongLine(t *testing.T) {
	a := testAnalyst(t)
	in := "formula\n" + strings.Repeat("N", MaxBatchLine+10) + "\n"
	_, err := a.Batch(strings.NewReader(in), io.Discard, BatchOptions{})
	var ce *CSVError
	if !errors.As(err, &ce) || ce.Line != 2 {
		t.Errorf("long line: %v", err)
	}
}

// FuzzBatchReader: no input makes the reader panic or loop, every error
// is a *CSVError with a line, and a reader that remembers the rows it has
// read returns what one that remembers nothing returns, row by row.
func FuzzBatchReader(f *testing.F) {
	for _, s := range []string{
		"formula\nNaCl\n",
		"formula,charges,model,structure,cation_radius,anion_radius,set:attachment-2\nMgCl,\"Mg=+1,Cl=-1\",born-mayer,rock-salt,1.0,1.8,744±20\n",
		"# c\nformula\n\"Na\"\"Cl\"\n",
		"formula,set:\nx,1\n",
		"\ufeffFormula\r\nKCl\r\n",
		"formula,charges\nMgCl,M=2;X=-1\n",
		"formula,charges,set:lattice\nMgCl,Mg=+1,-700\nMgCl,Mg=+1,-700\nMgCl,Mg=+x,\nMgCl,Mg=+x,\n",
	} {
		f.Add([]byte(s))
	}
	f.Fuzz(func(t *testing.T, b []byte) {
		br, err := NewBatchReader(bytes.NewReader(b))
		if err != nil {
			var ce *CSVError
			if !errors.As(err, &ce) {
				t.Fatalf("header error %v is not a *CSVError", err)
			}
			return
		}
		fresh, _ := NewBatchReader(bytes.NewReader(b))
		fresh.readSize = 0
		for i := 0; i < 10000; i++ {
			row, err := br.Next()
			want, wantErr := fresh.Next()
			if !reflect.DeepEqual(row, want) || fmt.Sprint(err) != fmt.Sprint(wantErr) {
				t.Fatalf("row %d: remembered %+v (%v), read afresh %+v (%v)", i+1, row, err, want, wantErr)
			}
			if err == io.EOF {
				return
			}
			if err != nil {
				var ce *CSVError
				if !errors.As(err, &ce) {
					t.Fatalf("row error %v is not a *CSVError", err)
				}
				if _, ok := err.(*CSVError); ok && strings.Contains(err.Error(), "malformed") {
					return // the csv reader does not resync after a bad quote
				}
				continue
			}
			if row.Formula == "" {
				t.Fatalf("row without formula accepted at line %d", row.Line)
			}
		}
		t.Fatal("more than 10000 rows from a fuzz input")
	})
}

// TestBatchSameOnEveryCore: the output, CSV and JSON, is byte for byte the
// same with one worker as with several, on an invented list of 2,000 rows
// (demo data) with failing rows and unreadable cells among them, so that
// results from different workers interleave.
func TestBatchSameOnEveryCore(t *testing.T) {
	a := testAnalyst(t)
	var in bytes.Buffer
	in.Write(batchInput(2000))
	in.WriteString("Qx2,\nMgCl,Mg=+9\nNaCl,\n")
	for _, asJSON := range []bool{false, true} {
		var want []byte
		for _, workers := range []int{1, 2, 3, 8} {
			var out bytes.Buffer
			sum, err := a.Batch(bytes.NewReader(in.Bytes()), &out, BatchOptions{JSON: asJSON, Workers: workers})
			if err != nil {
				t.Fatal(err)
			}
			if sum.Rows != 2003 || sum.Failed == 0 {
				t.Fatalf("%d rows, %d failed", sum.Rows, sum.Failed)
			}
			if want == nil {
				want = out.Bytes()
				continue
			}
			if !bytes.Equal(out.Bytes(), want) {
				t.Errorf("JSON %v: %d workers write other bytes than one", asJSON, workers)
			}
		}
	}
}

// TestBatchRepeatsAsIfFresh: a batch remembers rows by their cells (the
// reader its parsed rows, each worker its output), so its output must be
// what each row gives on its own: every row of an invented list (demo
// data) with repeated formulas, repeated failing rows and repeated
// unreadable cells is read alone (behind comment lines, so that its line
// number is kept), estimated with Row and written with encoding/csv or
// encoding/json as the batch's format says; the batch's bytes must equal
// these, with the memory bound crossed (2 rows) and not (the default),
// on one worker and two.
func TestBatchRepeatsAsIfFresh(t *testing.T) {
	a := testAnalyst(t)
	const header = "formula,charges,anion_radius\n"
	var in bytes.Buffer
	in.WriteString(header)
	body := strings.SplitAfter(string(batchInput(400)), "\n")
	for _, line := range body[1 : len(body)-1] {
		in.WriteString(strings.TrimSuffix(line, "\n") + ",\n")
	}
	for range 3 {
		in.WriteString("Qx2,,\nMgCl,Mg=+x,\nNaCl,,big\nKCl,,1.9\n KCl,,1.9\n")
	}
	lines := strings.SplitAfter(in.String(), "\n")
	lines = lines[1 : len(lines)-1]
	for _, asJSON := range []bool{false, true} {
		var want bytes.Buffer
		failed := 0
		cw := csv.NewWriter(&want)
		if asJSON {
			want.WriteString("[")
		} else {
			cw.Write(batchCSVHeader)
		}
		for i, line := range lines {
			br, err := NewBatchReader(strings.NewReader(header + strings.Repeat("#\n", i) + line))
			if err != nil {
				t.Fatal(err)
			}
			row, err := br.Next()
			var res BatchResult
			switch {
			case err != nil:
				res = BatchResult{Line: row.Line, Formula: row.Formula, Error: oneLine(err.Error())}
			default:
				res = a.Row(row)
			}
			if res.Error != "" {
				failed++
			}
			if res.Line != i+2 {
				t.Fatalf("line %d read as line %d", i+2, res.Line)
			}
			if asJSON {
				b, err := json.Marshal(res)
				if err != nil {
					t.Fatal(err)
				}
				if i > 0 {
					want.WriteString(",")
				}
				want.WriteString("\n  ")
				want.Write(b)
				continue
			}
			rec := make([]string, len(batchCSVHeader))
			res.fill(rec)
			cw.Write(rec)
		}
		cw.Flush()
		if asJSON {
			want.WriteString("\n]\n")
		}
		for _, memo := range []int{2, 0} {
			for _, workers := range []int{1, 2} {
				var got bytes.Buffer
				sum, err := a.Batch(bytes.NewReader(in.Bytes()), &got, BatchOptions{JSON: asJSON, Workers: workers, memoRows: memo})
				if err != nil {
					t.Fatal(err)
				}
				if sum.Rows != len(lines) || sum.Failed != failed || failed < 9 {
					t.Errorf("JSON %v, memory %d, %d workers: %+v, want %d rows, %d failed (9 or more)", asJSON, memo, workers, sum, len(lines), failed)
				}
				if !bytes.Equal(got.Bytes(), want.Bytes()) {
					g, w := strings.Split(got.String(), "\n"), strings.Split(want.String(), "\n")
					for k := range min(len(g), len(w)) {
						if g[k] != w[k] {
							t.Errorf("JSON %v, memory %d, %d workers: output line %d\n got %s\nwant %s", asJSON, memo, workers, k+1, g[k], w[k])
							break
						}
					}
				}
			}
		}
	}
}

// TestLineLimiter: a line of MaxBatchLine bytes passes and one byte more
// stops the reading at that byte, naming its line, whether the bytes come
// in one read or one at a time (the limit's definition, no outside
// source).
func TestLineLimiter(t *testing.T) {
	long := strings.Repeat("x", MaxBatchLine)
	cases := []struct {
		name, in string
		line     int // 0: no error
	}{
		{"at the limit", "a\n" + long + "\nb\n", 0},
		{"at the limit, no final newline", long, 0},
		{"one over on line 2", "a\n" + long + "y\nb\n", 2},
		{"one over on line 3", "a\n\n" + long + "yz", 3},
	}
	for _, tc := range cases {
		for _, slow := range []bool{false, true} {
			var src io.Reader = strings.NewReader(tc.in)
			if slow {
				src = iotest.OneByteReader(src)
			}
			got, err := io.ReadAll(&lineLimiter{r: bufio.NewReader(src)})
			var ll *lineTooLong
			switch {
			case tc.line == 0 && (err != nil || string(got) != tc.in):
				t.Errorf("%s (one byte at a time %v): %d of %d bytes, %v", tc.name, slow, len(got), len(tc.in), err)
			case tc.line != 0 && (!errors.As(err, &ll) || ll.line != tc.line):
				t.Errorf("%s (one byte at a time %v): %v, want line %d too long", tc.name, slow, err, tc.line)
			case tc.line != 0 && len(got) != strings.Index(tc.in, long)+MaxBatchLine:
				t.Errorf("%s (one byte at a time %v): %d bytes passed, want %d (up to the byte over)", tc.name, slow, len(got), strings.Index(tc.in, long)+MaxBatchLine)
			}
		}
	}
}
