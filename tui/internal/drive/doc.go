// Package drive runs the workshop's models in tests without a terminal: it
// turns key names into key messages, runs commands synchronously and feeds
// their messages back, and builds the shared fixture (data, styles pinned
// to the plain ASCII profile, a session with a cycle open).
package drive
