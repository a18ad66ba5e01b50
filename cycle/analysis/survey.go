package analysis

import (
	"fmt"

	"enthalpath/cycle"
	"enthalpath/data"
)

// SurveyOptions chooses how Survey builds each compound's cycle.
type SurveyOptions struct {
	// Conventions of every cycle (the zero value: the defaults).
	Conventions cycle.Conventions
	// Prepare, when set, changes each cycle after it is built and before
	// it is solved (a front end's model settings); an error from it stops
	// the survey and is returned.
	Prepare func(*cycle.Cycle) error
}

// SurveyEntry is one compound of a survey.
type SurveyEntry struct {
	// Formula is the formula as asked; Cycle.Formula the data's.
	Formula string
	// Cycle is the cycle as built (nil when it could not be built) and
	// Result its solution (nil when it could not be solved).
	Cycle  *cycle.Cycle
	Result *cycle.Result
	// Err is why the cycle could not be built or solved.
	Err error
}

// SurveyPanicError reports a compound whose cycle panicked while it was
// built or solved: the survey records it and goes on with the others.
type SurveyPanicError struct {
	Formula string
	Value   any
}

func (e *SurveyPanicError) Error() string {
	return e.Formula + ": internal error while solving (" + fmt.Sprint(e.Value) + ")"
}

// Survey builds and solves the cycle of each formula (of every compound of
// db when formulas is nil) with the same options, sharing one Madelung
// memo: the one loop behind a comparison of every compound, the
// workshop's survey and the magnitudes its plausibility check uses. A
// compound that fails is an entry with Err; only Prepare's error stops it.
func Survey(db *data.DB, formulas []string, opt SurveyOptions) ([]SurveyEntry, error) {
	if db == nil {
		return nil, nil
	}
	if formulas == nil {
		for _, c := range db.Compounds() {
			formulas = append(formulas, c.Formula)
		}
	}
	memo := cycle.NewMemo()
	out := make([]SurveyEntry, 0, len(formulas))
	for _, f := range formulas {
		e, err := surveyOne(db, f, memo, opt)
		if err != nil {
			return nil, err
		}
		out = append(out, e)
	}
	return out, nil
}

// surveyOne builds, prepares and solves one compound; a panic becomes the
// entry's *SurveyPanicError.
func surveyOne(db *data.DB, formula string, memo *cycle.Memo, opt SurveyOptions) (e SurveyEntry, stop error) {
	e.Formula = formula
	defer func() {
		if r := recover(); r != nil {
			e.Result, e.Err = nil, &SurveyPanicError{Formula: formula, Value: r}
		}
	}()
	c, err := cycle.Build(db, formula, cycle.Options{Conventions: opt.Conventions, Memo: memo})
	if err != nil {
		e.Err = err
		return e, nil
	}
	e.Cycle = c
	if opt.Prepare != nil {
		if err := opt.Prepare(c); err != nil {
			return e, err
		}
	}
	if res, err := cycle.Solve(c); err != nil {
		e.Err = err
	} else {
		e.Result = res
	}
	return e, nil
}
