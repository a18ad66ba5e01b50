package data

import (
	"strings"
	"testing"
)

// TestNotFoundQuotesLongInputShortened: a lookup's message quotes at most
// notation.MaxQuoted characters of what was typed (QA report: a 100 kB
// formula came back whole on stderr).
func TestNotFoundQuotesLongInputShortened(t *testing.T) {
	long := strings.Repeat("Na", 50000) + "q"
	nf := &NotFoundError{Kind: "compound", Query: long}
	if len(nf.Error()) > 200 {
		t.Errorf("NotFoundError quotes %d bytes", len(nf.Error()))
	}
}
