package notation

import (
	"math"
	"strconv"
	"strings"
)

// AssignmentProblem says what is wrong with one item of a name=value list.
type AssignmentProblem int

const (
	// NotNameValue: the item has no "=" or no name before it.
	NotNameValue AssignmentProblem = iota
	// NotANumber: the value is not a finite number.
	NotANumber
	// GivenTwice: the name was already given in the list.
	GivenTwice
)

// AssignmentError reports an item of a name=value list that could not be
// read; each caller words it for its own input (a table's column, a flag).
type AssignmentError struct {
	Item    string // the item as given, trimmed
	Name    string // the name before "=", when there is one
	Value   string // the value after "=", trimmed
	Problem AssignmentProblem
}

func (e *AssignmentError) Error() string {
	switch e.Problem {
	case NotANumber:
		return QuoteInput(e.Item) + ": " + QuoteInput(e.Value) + " is not a number"
	case GivenTwice:
		return e.Name + " given twice"
	default:
		return QuoteInput(e.Item) + ": want name=value"
	}
}

// ParseAssignments reads a list of name=value items separated by sep
// ("a=5.64;c=3.2" in the tables, "Na=1,Cl=-1" on a command line) into
// into, which may already hold names from an earlier list: a name given
// twice is an error. Empty items are skipped; a value may carry the
// typographic minus (−). The one reader of such lists, for the tables and
// every front end.
func ParseAssignments(list, sep string, into map[string]float64) error {
	for _, item := range strings.Split(list, sep) {
		item = strings.TrimSpace(item)
		if item == "" {
			continue
		}
		k, v, ok := strings.Cut(item, "=")
		k, v = strings.TrimSpace(k), strings.TrimSpace(v)
		if !ok || k == "" {
			return &AssignmentError{Item: item, Name: k, Value: v, Problem: NotNameValue}
		}
		x, err := strconv.ParseFloat(strings.Replace(v, "−", "-", 1), 64)
		if err != nil || math.IsNaN(x) || math.IsInf(x, 0) {
			return &AssignmentError{Item: item, Name: k, Value: v, Problem: NotANumber}
		}
		if _, dup := into[k]; dup {
			return &AssignmentError{Item: item, Name: k, Value: v, Problem: GivenTwice}
		}
		into[k] = x
	}
	return nil
}
