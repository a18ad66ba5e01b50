package main

import (
	"errors"
	"fmt"
	"os"
	"os/signal"
	"path/filepath"
	"syscall"

	tea "github.com/charmbracelet/bubbletea"

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
	db, err := data.LoadWithUserFile(env.DataFile)
	if err != nil {
		if env.DataFile != "" && db != nil {
			fmt.Fprintf(env.Stderr, "enthalpath: --data %s: %v\n", env.DataFile, err)
			return cli.ExitUsage
		}
		fmt.Fprintf(env.Stderr, "enthalpath: loading the built-in data: %v\n", err)
		return cli.ExitInternal
	}
	opts := tui.Options{DB: db, RecoveryPath: recoveryPath()}
	if len(args) == 1 {
		opts.Initial = args[0]
	}
	model := tui.New(opts)
	p := tea.NewProgram(model, tea.WithAltScreen())

	sig := make(chan os.Signal, 1)
	signal.Notify(sig, syscall.SIGTERM, syscall.SIGHUP)
	defer signal.Stop(sig)
	go func() {
		for s := range sig {
			p.Send(tui.ShutdownMsg{Reason: s.String()})
		}
	}()

	_, err = p.Run()
	root, _ := model.(*tui.Model)
	if err != nil {
		if root != nil && errors.Is(err, tea.ErrProgramPanic) {
			if path, werr := root.WriteRecovery(); werr == nil && path != "" {
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
