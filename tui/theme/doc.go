// Package theme builds the workshop's styles from one lipgloss renderer, so a
// program served over SSH styles text for the client's terminal and not the
// server's.
//
// Every colour is an AdaptiveColor (one shade for light backgrounds, one for
// dark); nothing relies on colour alone: the solved step, the selection, errors
// and warnings also carry a textual marker or an attribute that survives
// NO_COLOR and the plain ASCII profile used by the golden tests.
package theme
