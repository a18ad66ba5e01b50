// Package launch runs the workshop as a process: on the user's terminal
// (Workshop, the command "open") or served over SSH (Serve), with their
// flags, signals, recovery files and shutdown. main hands both to the
// command table of cycle/cli (cli.Interactive); they answer in its terms
// (cli.Env, a UsageError for bad usage, the help request of
// cli.ParseFlags), so the exit codes and help stay in that one home.
package launch
