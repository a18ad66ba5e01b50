package tui

import (
	"errors"
	"fmt"
	"path/filepath"

	"github.com/charmbracelet/lipgloss"

	"enthalpath/data"
	"enthalpath/tui/safepath"
)

// Options configure one workshop session.
type Options struct {
	// Renderer builds every style; over SSH it is the session's renderer.
	// Nil means lipgloss's default renderer (a local terminal).
	Renderer *lipgloss.Renderer
	// DB is the data, with any user overlay applied. Required.
	DB *data.DB
	// FileRoot, when set, confines every file name typed in the session:
	// names are resolved inside it with safepath.Join and escapes refused.
	FileRoot string
	// RecoveryPath is where unsaved work is written on shutdown, on a panic
	// or when the user quits choosing to keep it. "" disables recovery
	// (the quit confirmation then offers only save or discard).
	RecoveryPath string
	// Initial is a formula or a cycle file to open at start ("" opens the
	// shelf on the demo shortlist).
	Initial string
	// Width and Height are the initial size (0: wait for the terminal's).
	Width, Height int
	// MaxInputLen bounds every text input; 0 means DefaultMaxInputLen.
	MaxInputLen int
}

// DefaultMaxInputLen is the input bound when Options.MaxInputLen is 0.
const DefaultMaxInputLen = 256

// MinWidth and MinHeight are the smallest window the workshop lays out in.
const (
	MinWidth  = 80
	MinHeight = 24
)

// Validate reports options that cannot work.
func (o Options) Validate() error {
	var errs []error
	if o.DB == nil {
		errs = append(errs, errors.New("tui.Options: DB is nil; load the data with data.Load first"))
	}
	if o.Width < 0 || o.Height < 0 {
		errs = append(errs, fmt.Errorf("tui.Options: negative size %d×%d", o.Width, o.Height))
	}
	if o.MaxInputLen < 0 {
		errs = append(errs, fmt.Errorf("tui.Options: negative MaxInputLen %d", o.MaxInputLen))
	}
	return errors.Join(errs...)
}

// resolver returns the function that turns a typed file name into a path.
func (o Options) resolver() func(string) (string, error) {
	root := o.FileRoot
	return func(name string) (string, error) {
		if name == "" {
			return "", errors.New("type a file name")
		}
		if root != "" {
			return safepath.Join(root, name)
		}
		if err := safepath.CheckCharacters(name); err != nil {
			return "", err
		}
		return filepath.Clean(name), nil
	}
}
