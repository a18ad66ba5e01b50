package gibbs

// Coverage is the number of standard uncertainties by which a reaction
// energy must lie from zero before a verdict is given: 2σ, about 95 % for a
// normal distribution (common practice, no source).
const Coverage = 2.0

// Verdict is what a reaction energy and its σ say about the reaction.
type Verdict int

const (
	// Undecided: zero lies within Coverage·σ of the value.
	Undecided Verdict = iota
	// Favoured: the value is negative beyond Coverage·σ.
	Favoured
	// Disfavoured: the value is positive beyond Coverage·σ.
	Disfavoured
)

// Judge returns the verdict on a reaction energy value with standard
// uncertainty sigma: Favoured or Disfavoured only when |value| exceeds
// Coverage·sigma, otherwise Undecided. A NaN value or σ is Undecided.
func Judge(value, sigma float64) Verdict {
	if value != value || sigma != sigma || sigma < 0 {
		return Undecided
	}
	switch {
	case value < -Coverage*sigma:
		return Favoured
	case value > Coverage*sigma:
		return Disfavoured
	}
	return Undecided
}

// String words the verdict for every front end.
func (v Verdict) String() string {
	switch v {
	case Favoured:
		return "favoured"
	case Disfavoured:
		return "disfavoured"
	}
	return "undecided within the data"
}
