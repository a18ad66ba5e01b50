// Package serve runs the enthalpath workshop over SSH for a group of users,
// each with a terminal program of their own and a folder of their own.
//
// # Who may connect
//
// Only public-key authentication is offered; password and
// keyboard-interactive attempts are refused. Keys are checked against an
// authorized-keys file (one OpenSSH public key a line; options such as
// command= are ignored, with a warning in the log). The file is re-read
// whenever its size or modification time changes, at the next
// authentication, so members can be added or removed without a restart;
// sessions already open stay open. A file that cannot be read after start
// refuses everyone until it can be read again (it fails closed).
//
// Without an authorized-keys file the server only listens on a loopback
// address, and then accepts any key: every local user who can reach the
// port gets a folder keyed by the key they offered. It says so in the log
// at start.
//
// # What each session gets
//
// A session needs a PTY and no command. It runs its own tea.Program with a
// lipgloss renderer bound to that session (wish's bubbletea.MakeRenderer:
// the colour profile and dark/light background of the client's terminal,
// never the server's), draws at most 120 frames a second, follows
// window-change requests, and works inside
// STATE/users/HEX/ where HEX is the lowercase hexadecimal SHA-256 of the
// key in SSH wire format (the same digest as the "SHA256:" fingerprint
// printed by ssh-keygen -l, in hexadecimal so that folder names differ even
// on case-insensitive file systems). Folders are created with mode 0700.
//
// # Limits
//
// At most Config.MaxSessions sessions run at once; the next one gets a
// one-line refusal and exit status ExitBusy. A session with no keystroke for
// Config.IdleTimeout is told to save (its model gets the shutdown message)
// and closed. A single read of more than Config.MaxBurst bytes, and whatever
// follows it within a tenth of a second, is dropped (a runaway paste never
// reaches the model); Config.MaxInputLen is handed to the model for its
// text fields. A window claimed larger than 1000×500 is laid out at that
// size. A panic in one session's model, view or command is recovered
// in that session: its model is asked to write its recovery file, the user
// is told, and no other session notices.
//
// Connections are bounded before login too: at most
// Config.MaxPendingPerAddress from one address that have not logged in
// (more are closed at once), each closed after Config.LoginTimeout, and
// 4×MaxSessions+16 in all. On a connection at most MaxChannelsPerConn
// session channels are open at once, and each keeps at most
// MaxEnvPerChannel environment variables of MaxEnvBytes.
//
// Only interactive sessions are served: commands, subsystems (sftp), port
// forwarding and other channel types are refused.
//
// # Shutdown
//
// Server.Shutdown stops accepting, sends every session the shutdown message
// (the model writes its recovery file, never over an earlier one, and
// quits; a model that implements Recoverer tells the member which file),
// waits for them within the grace period, then closes every connection.
package serve
