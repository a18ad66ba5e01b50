package notation

import (
	"errors"
	"testing"
)

// The lists are the forms the tables (data/tables/compounds.csv, params
// column: "a=5.64;c=3.2") and the command line (--charges Na=1,Cl=-1)
// write; the expected maps are read off the inputs.
func TestParseAssignments(t *testing.T) {
	for _, tc := range []struct {
		list, sep string
		want      map[string]float64
		problem   AssignmentProblem
		bad       bool
	}{
		{"a=5.64;c=3.2", ";", map[string]float64{"a": 5.64, "c": 3.2}, 0, false},
		{" Na = 1 , Cl=−1 ,", ",", map[string]float64{"Na": 1, "Cl": -1}, 0, false},
		{"", ";", map[string]float64{}, 0, false},
		{"a5.64", ";", nil, NotNameValue, true},
		{"=2", ";", nil, NotNameValue, true},
		{"a=x", ";", nil, NotANumber, true},
		{"a=NaN", ";", nil, NotANumber, true},
		{"a=Inf", ";", nil, NotANumber, true},
		{"a=1;a=2", ";", nil, GivenTwice, true},
	} {
		got := map[string]float64{}
		err := ParseAssignments(tc.list, tc.sep, got)
		var ae *AssignmentError
		switch {
		case tc.bad && (!errors.As(err, &ae) || ae.Problem != tc.problem):
			t.Errorf("%q: err %v, want problem %d", tc.list, err, tc.problem)
		case !tc.bad && err != nil:
			t.Errorf("%q: %v", tc.list, err)
		case !tc.bad && len(got) != len(tc.want):
			t.Errorf("%q: got %v, want %v", tc.list, got, tc.want)
		case !tc.bad:
			for k, v := range tc.want {
				if got[k] != v {
					t.Errorf("%q: %s = %v, want %v", tc.list, k, got[k], v)
				}
			}
		}
	}
	// A second list into the same map: a name of the first is a repeat.
	m := map[string]float64{}
	if err := ParseAssignments("Na=1", ",", m); err != nil {
		t.Fatal(err)
	}
	var ae *AssignmentError
	if err := ParseAssignments("Na=2", ",", m); !errors.As(err, &ae) || ae.Problem != GivenTwice || ae.Name != "Na" {
		t.Errorf("repeat across lists: %v", err)
	}
}
