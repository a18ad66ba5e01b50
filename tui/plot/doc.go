// Package plot draws small charts in the terminal: a scatter plot of one
// value against another with a y = x line, and a strip chart of values by
// group. Each group has its own ASCII glyph, listed in a legend, so the
// charts read without colour.
package plot
