// Package prompt is a one-line question with a validated text input: the
// answer is checked on Enter and a bad answer is explained in place, under
// the line, and never accepted; esc cancels. The workshop uses it for file
// names and for every value typed on a screen. A Slot holds a screen's
// prompt while it is open, so the screen captures keys exactly then and
// shows the prompt's own keys in its help.
package prompt
