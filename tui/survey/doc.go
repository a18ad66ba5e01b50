// Package survey is the screen that explores every compound of the data at
// once: a sortable, filterable table of the cycle's lattice value, each
// model's and the gap, and two terminal charts (a model against the cycle,
// and the gap by compound family). The table is computed in a tea.Cmd the
// first time the screen is shown, never on the way to the first frame.
package survey
