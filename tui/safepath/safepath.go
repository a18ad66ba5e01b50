package safepath

import (
	"errors"
	"fmt"
	"io/fs"
	"os"
	"path/filepath"
	"strings"
	"unicode"
	"unicode/utf8"

	"enthalpath/thermo/fileio"
)

// Limits on a typed name, in bytes.
const (
	// MaxNameLen bounds the whole name a user may type.
	MaxNameLen = 1024
	// MaxComponentLen bounds one component between separators (the usual
	// NAME_MAX of Linux and macOS file systems).
	MaxComponentLen = 255
)

// Reasons a name is refused; a *RefusedError unwraps to one of them.
var (
	ErrEmpty        = errors.New("the name is empty")
	ErrTooLong      = errors.New("the name is too long")
	ErrControl      = errors.New("the name holds a NUL byte or another control character")
	ErrInvisible    = errors.New("the name holds a character that does not show")
	ErrAbsolute     = errors.New("the name is an absolute path")
	ErrHome         = errors.New(`the name starts with "~"`)
	ErrClimb        = errors.New(`the name has a ".." component`)
	ErrLinkOutside  = errors.New("the name passes through a symbolic link that leads outside the folder")
	ErrDanglingLink = errors.New("the name passes through a symbolic link whose target does not exist")
	ErrRootUnusable = errors.New("the folder itself cannot be resolved")
	ErrOutside      = errors.New("the resolved path lies outside the folder")
)

// RefusedError says which name was refused, why, and what to do instead.
type RefusedError struct {
	Name   string // the name as typed
	Reason error  // one of the Err* values above
	Hint   string // what the user can do instead
	Err    error  // an underlying file-system error, if any
}

func (e *RefusedError) Error() string {
	msg := fmt.Sprintf("file name %q refused: %v", e.Name, e.Reason)
	if e.Err != nil {
		msg += " (" + e.Err.Error() + ")"
	}
	if e.Hint != "" {
		msg += "; " + e.Hint
	}
	return msg
}

// Unwrap returns the reason and any underlying error, so errors.Is works
// with both.
func (e *RefusedError) Unwrap() []error {
	if e.Err != nil {
		return []error{e.Reason, e.Err}
	}
	return []error{e.Reason}
}

// Join resolves name, as typed by a user, inside root and returns the
// absolute path to open or create. root must exist; it may itself be a
// symbolic link. Existing components of name are followed through symbolic
// links only while they stay inside root; the returned path has those links
// resolved. Components that do not exist yet are appended as typed, so a
// save may create them.
func Join(root, name string) (string, error) {
	if err := checkName(name); err != nil {
		return "", err
	}
	realRoot, err := resolveRoot(root)
	if err != nil {
		return "", &RefusedError{Name: name, Reason: ErrRootUnusable, Err: err,
			Hint: "ask the administrator to check the folder"}
	}
	parts := strings.Split(filepath.Clean(name), string(filepath.Separator))
	current := realRoot
	for i, part := range parts {
		next := filepath.Join(current, part)
		info, err := os.Lstat(next)
		if errors.Is(err, fs.ErrNotExist) {
			// Nothing exists from here on: the rest is created as typed.
			rest := filepath.Join(parts[i:]...)
			return filepath.Join(current, rest), nil
		}
		if err != nil {
			return "", &RefusedError{Name: name, Reason: ErrRootUnusable, Err: err,
				Hint: "check the name and try again"}
		}
		if info.Mode()&fs.ModeSymlink != 0 {
			target, err := filepath.EvalSymlinks(next)
			if errors.Is(err, fs.ErrNotExist) {
				return "", &RefusedError{Name: name, Reason: ErrDanglingLink,
					Hint: "remove the link or choose another name"}
			}
			if err != nil {
				return "", &RefusedError{Name: name, Reason: ErrLinkOutside, Err: err,
					Hint: "choose a name without that link"}
			}
			if !within(realRoot, target) {
				return "", &RefusedError{Name: name, Reason: ErrLinkOutside,
					Hint: "choose a name inside your folder"}
			}
			next = target
		}
		current = next
	}
	if !within(realRoot, current) {
		return "", &RefusedError{Name: name, Reason: ErrOutside,
			Hint: "choose a name inside your folder"}
	}
	return current, nil
}

// CheckCharacters refuses a name with a character that does not show as
// itself: a control character (NUL, escape, C1), an invisible formatting
// character (the right-to-left override U+202E that makes "evil‮txt.exe"
// read backwards, zero-width spaces and joiners, the byte-order mark), a
// line or paragraph separator, a private-use or unassigned code point, or
// bytes that are not UTF-8.
func CheckCharacters(name string) error {
	if !utf8.ValidString(name) {
		return &RefusedError{Name: name, Reason: ErrInvisible, Hint: "type the name again; it holds bytes that are not text"}
	}
	for _, r := range name {
		switch {
		case r < 0x20 || r == 0x7f || (r >= 0x80 && r < 0xa0):
			return &RefusedError{Name: name, Reason: ErrControl, Hint: "type the name with printable characters only"}
		case unicode.In(r, unicode.Cf, unicode.Zl, unicode.Zp, unicode.Co, unicode.Cs) || !unicode.IsPrint(r) && r != ' ':
			return &RefusedError{Name: name, Reason: ErrInvisible,
				Hint: fmt.Sprintf("it holds U+%04X, which does not show; type the name with visible characters only", r)}
		}
	}
	return nil
}

// checkName applies the rules that need no file system.
func checkName(name string) error {
	refuse := func(reason error, hint string) error {
		return &RefusedError{Name: name, Reason: reason, Hint: hint}
	}
	switch {
	case name == "":
		return refuse(ErrEmpty, "type a file name")
	case len(name) > MaxNameLen:
		return refuse(ErrTooLong, fmt.Sprintf("use at most %d bytes", MaxNameLen))
	}
	if err := CheckCharacters(name); err != nil {
		return err
	}
	if filepath.IsAbs(name) || strings.HasPrefix(name, "/") || strings.HasPrefix(name, `\`) {
		return refuse(ErrAbsolute, "type a name relative to your folder, such as cycles/NaCl")
	}
	if strings.HasPrefix(name, "~") {
		return refuse(ErrHome, "names are already relative to your folder; drop the ~")
	}
	parts := strings.Split(name, string(filepath.Separator))
	for _, part := range parts {
		if part == ".." {
			return refuse(ErrClimb, "names cannot leave your folder; type a name inside it")
		}
		if len(part) > MaxComponentLen {
			return refuse(ErrTooLong, fmt.Sprintf("use at most %d bytes between slashes", MaxComponentLen))
		}
	}
	if last := parts[len(parts)-1]; len(last) > fileio.MaxBaseName {
		// Saving writes a temporary name longer than the file's own.
		return refuse(ErrTooLong, fmt.Sprintf("use at most %d bytes for the file's own name", fileio.MaxBaseName))
	}
	if filepath.Clean(name) == "." {
		return refuse(ErrEmpty, "type a file name, not the folder itself")
	}
	return nil
}

func resolveRoot(root string) (string, error) {
	abs, err := filepath.Abs(root)
	if err != nil {
		return "", err
	}
	real, err := filepath.EvalSymlinks(abs)
	if err != nil {
		return "", err
	}
	info, err := os.Stat(real)
	if err != nil {
		return "", err
	}
	if !info.IsDir() {
		return "", fmt.Errorf("%s is not a directory", root)
	}
	return real, nil
}

// within reports whether path is root or lies below it; both are cleaned
// absolute paths.
func within(root, path string) bool {
	rel, err := filepath.Rel(root, path)
	if err != nil {
		return false
	}
	return rel == "." || (rel != ".." && !strings.HasPrefix(rel, ".."+string(filepath.Separator)))
}

// Rel returns path as a name relative to root, the name a user confined to
// root types for it, and true; or path and false when it does not lie
// inside root. root may be given as configured or with its links resolved
// (Join returns resolved paths).
func Rel(root, path string) (string, bool) {
	if root == "" || path == "" {
		return path, false
	}
	roots := []string{filepath.Clean(root)}
	if abs, err := filepath.Abs(root); err == nil {
		roots = append(roots, abs)
	}
	if real, err := resolveRoot(root); err == nil {
		roots = append(roots, real)
	}
	for _, r := range roots {
		if rel, err := filepath.Rel(r, path); err == nil && within(r, filepath.Join(r, rel)) && rel != "." &&
			filepath.IsAbs(path) == filepath.IsAbs(r) {
			return rel, true
		}
	}
	return path, false
}
