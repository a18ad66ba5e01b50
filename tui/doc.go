// Package tui is enthalpath's interactive workshop: a keyboard-driven
// terminal program where a Born–Haber cycle is picked from the shelf or
// assembled step by step, drawn to scale, solved on every change and set
// beside the ionic models.
//
// New returns the root model: it owns the shared context, the session's
// cycle and the screens (shelf, bench, assembly, models, survey, analyses,
// each in its own package), routes messages and composes the views of the
// chrome, whose components live in packages of their own: frame (the
// window's rows and overlays), header (tabs, compound, unit), status (the
// status line), keyhelp (the help line and the key list), unsaved (the
// question before work is lost), filedialog (the save and open prompts),
// recovery (the recovery files), and nav (the shared keys). The logic of
// each screen lives in its package. The same model serves a local
// terminal and an SSH session: every style is built from Options.Renderer.
//
// # Shape
//
// A screen (package screen) is a pointer that updates in place: its Update
// returns only the command, not a new model, so the root never
// type-asserts a returned value back to its concrete type, and the screens
// that show one cycle share a *session.Session instead of copies of it.
// Keys are key.Binding fields of each screen's exported KeyMap, built by
// package nav: the shared keys (moves, pages, enter, esc, screens, help,
// quit) are declared there once and each screen gives them its own
// description; every help label is written from its keys. The help line
// and the key list are generated from the same bindings (ShortHelp,
// FullHelp), a test presses every listed key, and nav's
// TestKeysDeclaredOnce fails on a key declared anywhere else. Every value typed on a
// screen (a step's value, a model setting, an analysis's arguments, a file
// name) is a prompt.Model held in a prompt.Slot: checked on Enter by its
// Accept, refused in place with the reason, cancelled with esc; the screen
// captures keys exactly while the slot is open and its help is then the
// prompt's keys. session.Change applies a change whole or not at all.
// Every engine call that
// can take time (solving, the survey of all compounds, the analyses, file
// I/O) runs inside a tea.Cmd and comes back as a message.
//
// # Files
//
// Cycle files are written with cycle.Save (atomic). Quitting or opening
// another cycle over unsaved work asks first (package unsaved: save, keep,
// discard, back); in a window smaller than 80×24 the question is drawn
// short, and where it cannot be drawn its answers do not act. One writer
// keeps unsaved work (recovery.Keeper): for the keep answer, on ShutdownMsg
// (a signal, a closed terminal or connection, a server shutdown) and when
// Update or View panics, it writes Options.RecoveryPath or, when any file
// is there, the first free name of its series (recovery-2.hesscycle, …),
// never over an earlier file; RecoveredTo says which, for the runner and
// the SSH server
// (the panic then goes on to Bubble Tea, which restores the
// terminal). With Options.FileRoot set, every typed name goes through
// safepath.Join.
package tui
