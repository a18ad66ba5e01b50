// Package session holds the one cycle a workshop session works on: the
// cycle itself, its last solved result, whether it has unsaved changes and
// the file it came from. Screens change the cycle through Change, which
// marks the session dirty and returns the command that re-solves it; the
// solve runs on a clone inside a tea.Cmd and comes back as a SolvedMsg,
// stamped with a generation so a late answer to an old question is dropped.
package session
