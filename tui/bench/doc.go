// Package bench is the workshop's main screen for one cycle: every step in
// a list (reaction, multiplicity, value, uncertainty, source), the solved
// term with its uncertainty, and the cycle drawn to scale. A step's value
// can be typed (validated, a refusal explained under the line), marked as
// the unknown, reset to the data, or traced to its full citation; the
// drawing exports to SVG.
package bench
