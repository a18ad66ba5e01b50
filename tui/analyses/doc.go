// Package analyses is the workshop's screen for the questions beyond one
// cycle: the estimate for a hypothetical compound, the oxidation-state
// scan, the solution cycle and the derived radius. Each runs the engine's
// analysis in a tea.Cmd from a short form and shows the answer.
package analyses
