// Package prompt is a one-line question with a validated text input: the
// answer is checked on Enter and a bad answer is explained in place, under
// the line, and never accepted. The workshop uses it for file names and
// values.
package prompt
