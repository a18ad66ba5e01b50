package notation

import "strconv"

// FormulaError reports a formula that could not be parsed. Column is the
// position of the offending character, counted in characters (not bytes)
// from 1 like every column the program reports ("Na2Q": column 4 is "Q");
// 0 means the error concerns the whole input.
type FormulaError struct {
	Input  string
	Column int
	// Msg says what is wrong; Hint, when set, what to type instead.
	Msg  string
	Hint string
}

// Error reads like `formula "Na2Q": unknown element "Q" at column 4`: it
// names what the user typed, not the function that read it.
func (e *FormulaError) Error() string {
	return "formula " + QuoteInput(e.Input) + ": " + e.Detail()
}

// Detail is the message without the input: what is wrong and where
// (`unknown element "Q" at column 4`), for a caller that names the input
// itself.
func (e *FormulaError) Detail() string {
	msg := e.Msg
	if e.Column > 0 {
		msg += " at column " + strconv.Itoa(e.Column)
	}
	if e.Hint != "" {
		msg += "; " + e.Hint
	}
	return msg
}

// MaxQuoted is the number of characters of an input that a message quotes;
// a longer input is shortened to its first MaxQuoted characters, "…" and
// its length, so that a pasted page does not come back as an error.
const MaxQuoted = 40

// QuoteInput quotes what the user typed for a message, Go-quoted like %q;
// beyond MaxQuoted characters it gives the start, "…" and the length:
// "NaNaNa…"… (100000 characters).
func QuoteInput(s string) string {
	head, n, long := cut(s)
	if !long {
		return strconv.Quote(s)
	}
	return strconv.Quote(head) + "… (" + strconv.Itoa(n) + " characters)"
}

// ShortInput is QuoteInput without the quotes, for a formula printed as a
// label: NaNaNa… (100000 characters).
func ShortInput(s string) string {
	head, n, long := cut(s)
	if !long {
		return s
	}
	return head + "… (" + strconv.Itoa(n) + " characters)"
}

// cut returns the first MaxQuoted characters of s, its length in
// characters and whether it is longer than that.
func cut(s string) (head string, n int, long bool) {
	i := 0
	for pos := range s {
		if i == MaxQuoted {
			head = s[:pos]
		}
		i++
	}
	return head, i, i > MaxQuoted
}
