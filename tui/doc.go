// Package tui is enthalpath's interactive workshop: a keyboard-driven
// terminal program where a Born–Haber cycle is picked from the shelf or
// assembled step by step, drawn to scale, solved on every change and set
// beside the ionic models.
//
// New returns the root model: it owns the shared context, the session's
// cycle and the screens (shelf, bench, assembly, models, survey, analyses,
// each in its own package), routes messages, draws the header, status and
// help line, and handles quitting, saving, opening and recovery. The logic
// of each screen lives in its package. The same model serves a local
// terminal and an SSH session: every style is built from Options.Renderer.
package tui
