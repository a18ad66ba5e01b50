package launch

import (
	"fmt"
	"os"
	"os/signal"
	"path/filepath"
	"syscall"

	tea "github.com/charmbracelet/bubbletea"
	"github.com/mattn/go-isatty"

	"enthalpath/cycle/cli"
	"enthalpath/tui"
)

// Workshop is the command "open" (and no command at all): the terminal
// workshop. "enthalpath" opens the shelf on the demo shortlist,
// "enthalpath open FORMULA|FILE" opens that compound's cycle or that cycle
// file. SIGTERM and SIGHUP save unsaved work to the recovery file before
// quitting; so does a crash, after the terminal is restored.
func Workshop(env cli.Env, args []string) error {
	fs := cli.NewFlagSet("open")
	pos, help, err := cli.ParseFlags(fs, args)
	if help || err != nil {
		return err
	}
	if len(pos) > 1 {
		return cli.Usagef("give one formula or cycle file: usage: enthalpath %s", cli.WorkshopSynopsis)
	}
	// The terminal is checked before the data are loaded: a script that
	// runs "enthalpath" by mistake learns at once what to run instead.
	if !isTerminal(env.Stdin) || !isTerminal(env.Stdout) {
		return cli.Usagef("the workshop needs a terminal, and standard input or output is not one;" +
			" run it in a terminal, or use a command such as enthalpath cycle FORMULA (enthalpath help lists them)")
	}
	db, err := cli.LoadData(env)
	if err != nil {
		return err
	}
	opts := tui.Options{DB: db, RecoveryPath: recoveryPath()}
	if len(pos) == 1 {
		opts.Initial = pos[0]
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

	_, err = p.Run()
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
		return err
	}
	if root != nil {
		if path := root.RecoveredTo(); path != "" {
			fmt.Fprintf(env.Stdout, "Unsaved work kept in %s; open it with: enthalpath open %s\n", path, path)
		}
	}
	return nil
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
