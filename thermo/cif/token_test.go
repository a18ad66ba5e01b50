package cif

import (
	"errors"
	"strings"
	"testing"
)

// The expected tokens follow the CIF 1.1 syntax rules (Hall, Allen & Brown
// 1991; IUCr CIF 1.1 syntax specification): the rules for quotes, text
// fields, comments and reserved words are those of the specification, the
// inputs are ours.
func TestTokenize(t *testing.T) {
	type tok struct {
		kind tokenKind
		text string
		line int
	}
	tests := []struct {
		name string
		src  string
		want []tok
	}{
		{"block and item", "data_x\n_cell_length_a 5.4309(2)\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_cell_length_a", 2}, {tokValue, "5.4309(2)", 2}}},
		{"comment skipped", "# head\ndata_x # trailing\n_a 1 #c\n",
			[]tok{{tokData, "x", 2}, {tokTag, "_a", 3}, {tokValue, "1", 3}}},
		{"hash inside an unquoted word is part of it", "data_x\n_a b#c\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "b#c", 2}}},
		{"single quotes with inner apostrophe", "data_x\n_a 'a dog's life'\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "a dog's life", 2}}},
		{"double quotes", "data_x\n_a \"x, y, z\"\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "x, y, z", 2}}},
		{"text field", "data_x\n_a\n;line one\nline two\n;\n_b 2\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "line one\nline two", 3}, {tokTag, "_b", 6}, {tokValue, "2", 6}}},
		{"semicolon not at line start is a word", "data_x\n_a b;c\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "b;c", 2}}},
		{"reserved words any case", "DATA_X\nLoop_\n_atom_site_label\n1\n",
			[]tok{{tokData, "X", 1}, {tokLoop, "Loop_", 2}, {tokTag, "_atom_site_label", 3}, {tokValue, "1", 4}}},
		{"values of a loop the reader does not use are counted, not kept", "data_x\nloop_\n_refln_index_h\n_refln_index_k\n1 2\n3 4\n_a 1\n",
			[]tok{{tokData, "x", 1}, {tokLoop, "loop_", 2}, {tokTag, "_refln_index_h", 3}, {tokTag, "_refln_index_k", 4}, {tokSkipped, "", 6}, {tokTag, "_a", 7}, {tokValue, "1", 7}}},
		{"CRLF line ends", "data_x\r\n_a 1\r\n_b 2\r\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "1", 2}, {tokTag, "_b", 3}, {tokValue, "2", 3}}},
		{"unknown and inapplicable marks", "data_x\n_a ?\n_b .\n_c '?'\n",
			[]tok{{tokData, "x", 1}, {tokTag, "_a", 2}, {tokValue, "?", 2}, {tokTag, "_b", 3}, {tokValue, ".", 3}, {tokTag, "_c", 4}, {tokValue, "?", 4}}},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			got, err := tokenize(tc.src, "t.cif")
			if err != nil {
				t.Fatal(err)
			}
			if len(got) != len(tc.want) {
				t.Fatalf("got %d tokens %+v, want %d", len(got), got, len(tc.want))
			}
			for i, w := range tc.want {
				g := got[i]
				if g.kind != w.kind || g.text != w.text || g.line != w.line {
					t.Errorf("token %d = {%v %q line %d}, want {%v %q line %d}", i, g.kind, g.text, g.line, w.kind, w.text, w.line)
				}
			}
		})
	}
}

func TestTokenizeQuotedFlag(t *testing.T) {
	toks, err := tokenize("data_x\n_a '?'\n_b ?\n", "t.cif")
	if err != nil {
		t.Fatal(err)
	}
	// A quoted '?' is a string, an unquoted ? is the unknown mark (CIF 1.1).
	if !toks[2].quoted || toks[4].quoted {
		t.Errorf("quoted flags %v, %v; want true, false", toks[2].quoted, toks[4].quoted)
	}
}

func TestTokenizeErrors(t *testing.T) {
	tests := []struct {
		name, src string
		line      int
		want      string
	}{
		{"unclosed quote", "data_x\n_a 'abc\n", 2, "no closing '"},
		{"quote closed only by quote+space", "data_x\n_a 'abc'd\n", 2, "no closing '"},
		{"unclosed text field", "data_x\n_a\n;text\nmore\n", 3, "never closed"},
		{"empty block name", "data_\n_a 1\n", 1, "needs a block name"},
		{"reserved bracket", "data_x\n_a [1,2]\n", 2, "reserves"},
		// Columns count characters: "_ö 'é' [" puts the bracket at column
		// 8 (bytes would say 10).
		{"column in characters", "data_x\n_ö 'é' [1]\n", 2, "at column 8"},
	}
	for _, tc := range tests {
		t.Run(tc.name, func(t *testing.T) {
			_, err := tokenize(tc.src, "t.cif")
			var e *Error
			if !errors.As(err, &e) {
				t.Fatalf("err = %v, want *Error", err)
			}
			if e.Line != tc.line || !strings.Contains(e.Msg, tc.want) || !errors.Is(err, ErrSyntax) {
				t.Errorf("got %q (line %d), want line %d and %q", err, e.Line, tc.line, tc.want)
			}
		})
	}
}

func TestParseNumber(t *testing.T) {
	// CIF numeric values with standard uncertainties (CIF 1.1 specification,
	// "numeric values"); expected values are the digits themselves.
	good := []struct {
		in   string
		want float64
	}{
		{"5.4309(2)", 5.4309}, {"-0.25", -0.25}, {"+3", 3}, {".5", 0.5}, {"5.", 5},
		{"1.2e-3", 1.2e-3}, {"1E2(3)", 100}, {"90", 90},
	}
	for _, g := range good {
		x, ok := parseNumber(g.in)
		if !ok || x != g.want {
			t.Errorf("parseNumber(%q) = %v, %v; want %v", g.in, x, ok, g.want)
		}
	}
	for _, bad := range []string{"", "0.5x", "NaN", "Inf", "1e", "1(2", "1()", "1(a)", "--1", ".", "0x10", "1_0", "1e999"} {
		if x, ok := parseNumber(bad); ok {
			t.Errorf("parseNumber(%q) = %v, want failure", bad, x)
		}
	}
}
