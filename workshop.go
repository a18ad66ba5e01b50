package main

import (
	"fmt"
	"os"
	"os/signal"
	"path/filepath"
	"syscall"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/mattn/go-isatty"

	"enthalpath/cycle"
	"enthalpath/cycle/cli"
	"enthalpath/data"
	"enthalpath/tui"
)

// runWorkshop starts the terminal workshop: "enthalpath" opens the shelf on
// the demo shortlist, "enthalpath open FORMULA|FILE" opens that compound's
// cycle or that cycle file. SIGTERM and SIGHUP save unsaved work to the
// recovery file before quitting; so does a crash, after the terminal is
// restored.
func runWorkshop(env cli.Env, args []string) int {
	if len(args) > 1 || (len(args) == 1 && (args[0] == "-h" || args[0] == "--help")) {
		fmt.Fprintln(env.Stderr, "usage: enthalpath [--data FILE] open [FORMULA | FILE"+cycle.FileExtension+"]")
		if len(args) == 1 {
			return cli.ExitOK
		}
		return cli.ExitUsage
	}
	if !isTerminal(env.Stdin) || !isTerminal(env.Stdout) {
		fmt.Fprintln(env.Stderr, "enthalpath: the workshop needs a terminal, and standard input or output is not one;"+
			" run it in a terminal, or use a command such as enthalpath cycle FORMULA (enthalpath help lists them)")
		return cli.ExitUsage
	}
	db, code := loadUserData(env, "enthalpath")
	if db == nil {
		return code
	}
	opts := tui.Options{DB: db, RecoveryPath: recoveryPath()}
	if len(args) == 1 {
		opts.Initial = args[0]
	}
	model := tui.New(opts)
	// Bubble Tea's own handler turns SIGTERM into a plain quit, which would
	// drop unsaved work: the workshop takes the signals itself and shuts
	// down the way it does on SIGHUP, keeping the work in the recovery file.
	p := tea.NewProgram(model, tea.WithAltScreen(), tea.WithoutSignalHandler())

	sig := make(chan os.Signal, 1)
	signal.Notify(sig, syscall.SIGTERM, syscall.SIGHUP, syscall.SIGINT)
	defer signal.Stop(sig)
	go func() {
		for s := range sig {
			p.Send(tui.ShutdownMsg{Reason: s.String()})
		}
	}()

	_, err := p.Run()
	root, _ := model.(*tui.Model)
	if err != nil {
		// A failure, or a terminal gone from under the program: whatever
		// it was, unsaved work goes to a recovery file of its own.
		if root != nil {
			if path, werr := root.WriteRecovery(); werr != nil {
				fmt.Fprintf(env.Stderr, "enthalpath: could not keep the unsaved work: %v\n", werr)
			} else if path != "" {
				fmt.Fprintf(env.Stderr, "enthalpath: unsaved work kept in %s\n", path)
			}
		}
		fmt.Fprintf(env.Stderr, "enthalpath: %v\n", err)
		return cli.ExitInternal
	}
	if root != nil {
		if path := root.RecoveredTo(); path != "" {
			fmt.Fprintf(env.Stdout, "Unsaved work kept in %s; open it with: enthalpath open %s\n", path, path)
		}
	}
	return cli.ExitOK
}

// isTerminal reports whether a stream is a terminal.
func isTerminal(stream any) bool {
	f, ok := stream.(*os.File)
	return ok && (isatty.IsTerminal(f.Fd()) || isatty.IsCygwinTerminal(f.Fd()))
}

// recoveryPath is $XDG_STATE_HOME/enthalpath/recovery.hesscycle, or under
// ~/.local/state, or the temporary folder when there is no home.
func recoveryPath() string {
	dir := os.Getenv("XDG_STATE_HOME")
	if dir == "" {
		if home, err := os.UserHomeDir(); err == nil {
			dir = filepath.Join(home, ".local", "state")
		} else {
			dir = os.TempDir()
		}
	}
	return filepath.Join(dir, "enthalpath", "recovery.hesscycle")
}

// loadUserData loads the built-in data with the user's overlay (--data FILE,
// else the default overlay file when it exists). A broken --data file is a
// usage error; a broken default file is reported and the built-in data are
// used. On failure it returns a nil DB and the exit code.
func loadUserData(env cli.Env, who string) (*data.DB, int) {
	db, err := data.LoadWithUserFile(data.UserDataPath(env.DataFile))
	switch {
	case err == nil:
		return db, cli.ExitOK
	case db == nil:
		fmt.Fprintf(env.Stderr, "%s: loading the built-in data: %v\n", who, err)
		return nil, cli.ExitInternal
	case env.DataFile != "":
		fmt.Fprintf(env.Stderr, "%s: --data %s: %v\n", who, env.DataFile, err)
		return nil, cli.ExitUsage
	}
	fmt.Fprintf(env.Stderr, "%s: ignoring the overlay file: %v\n", who, err)
	return db, cli.ExitOK
}
