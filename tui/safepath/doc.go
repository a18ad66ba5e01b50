// Package safepath turns a file name typed by a user into a path inside that
// user's own folder, or refuses it.
//
// Join is called before every open and save the workshop makes on a user's
// behalf (over SSH every user has a folder of their own, and no name typed in
// a session may reach a file outside it). A name is refused when it is
// empty, too long, holds a NUL byte or another control character, is
// absolute, starts with "~", has a ".." component, or passes through or ends
// at a symbolic link whose target lies outside the folder (or does not
// exist).
//
// Join checks the file system at the moment it is called; a user who can
// write inside the folder from elsewhere could still swap a directory for a
// link between the check and the open. Over SSH the only writer is the
// server itself, which creates no links.
package safepath
