package fileio

import (
	"cmp"
	"errors"
	"io"
	"io/fs"
	"os"
	"path/filepath"
	"slices"
	"strconv"
	"strings"
)

// MaxBaseName is the longest base name, in bytes, that WriteAtomic and
// WriteNew write: 255 (the usual NAME_MAX) less what the temporary name
// ".NAME.tmp-NNNNNNNNNN" adds.
const MaxBaseName = 255 - len(".") - len(tempInfix) - 10

// maxSeries bounds the numbered names WriteNew tries.
const maxSeries = 10000

const tempInfix = ".tmp-"

// WriteAtomic writes path with what write produces, through a locked,
// synced temporary file in the same folder and a rename. An existing file
// at path must be a regular file; its permission bits are kept, a new file
// gets perm. Anything else at path (a symbolic link, a device, a folder) is
// refused with a *NotRegularError and left alone. An error returned by write
// is returned as it is, and nothing is replaced.
func WriteAtomic(path string, perm fs.FileMode, write func(io.Writer) error) (err error) {
	dir, base := split(path)
	if len(base) > MaxBaseName {
		return &NameError{Name: base, Max: MaxBaseName}
	}
	if perm, err = keptPerm(path, perm); err != nil {
		return err
	}
	CleanStale(dir, base)
	tmp, err := os.CreateTemp(dir, "."+base+tempInfix+"*")
	if err != nil {
		return err
	}
	_ = lock(tmp, true) // a new file: no one else holds it
	defer func() {
		if err != nil {
			tmp.Close()
			os.Remove(tmp.Name())
		}
	}()
	if err = write(tmp); err != nil {
		return err
	}
	if err = tmp.Chmod(perm); err != nil {
		return err
	}
	if err = tmp.Sync(); err != nil {
		return err
	}
	// Checked again: a link or device may have been put there meanwhile.
	if _, err = keptPerm(path, perm); err != nil {
		return err
	}
	if err = os.Rename(tmp.Name(), path); err != nil {
		return err
	}
	err = tmp.Close() // the lock is held until the file has its name
	syncDir(dir)
	return err
}

// CheckReplaceable reports, with a *NotRegularError, whether something
// that WriteAtomic would refuse to replace is at path (nil when nothing is
// there, or a regular file), so a front end can ask for another name first.
func CheckReplaceable(path string) error {
	_, err := keptPerm(path, 0)
	if errors.Is(err, fs.ErrNotExist) {
		return nil
	}
	return err
}

// keptPerm returns the permission bits of the regular file at path, perm
// when nothing is there, or a *NotRegularError.
func keptPerm(path string, perm fs.FileMode) (fs.FileMode, error) {
	st, err := os.Lstat(path)
	switch {
	case errors.Is(err, fs.ErrNotExist):
		return perm, nil
	case err != nil:
		return 0, err
	case !st.Mode().IsRegular():
		return 0, &NotRegularError{Path: path, Kind: kind(st.Mode()), Replace: true}
	}
	return st.Mode().Perm(), nil
}

// WriteNew writes b to path, or when any file is there to the first free
// name of its series (Numbered(path, 2), 3, …), and returns the name
// written. It never replaces a file: the name is claimed by a hard link of
// a synced temporary file, which fails when the name exists, so concurrent
// writers get different names. Where the file system has no hard links the
// name is claimed by an exclusive create and written in place.
func WriteNew(path string, perm fs.FileMode, b []byte) (written string, err error) {
	dir, base := split(path)
	if longest := filepath.Base(Numbered(path, maxSeries)); len(longest) > MaxBaseName {
		return "", &NameError{Name: base, Max: MaxBaseName - (len(longest) - len(base))}
	}
	CleanStale(dir, base)
	tmp, err := os.CreateTemp(dir, "."+base+tempInfix+"*")
	if err != nil {
		return "", err
	}
	_ = lock(tmp, true)
	defer func() {
		os.Remove(tmp.Name()) // linked or failed: the temporary name goes
		tmp.Close()
	}()
	if _, err = tmp.Write(b); err != nil {
		return "", err
	}
	if err = tmp.Chmod(perm); err != nil {
		return "", err
	}
	if err = tmp.Sync(); err != nil {
		return "", err
	}
	for n := 1; n <= maxSeries; n++ {
		name := Numbered(path, n)
		lerr := os.Link(tmp.Name(), name)
		if lerr == nil {
			syncDir(dir)
			return name, nil
		}
		if errors.Is(lerr, fs.ErrExist) {
			continue
		}
		// No hard links here (or another failure): claim the name by an
		// exclusive create instead.
		f, cerr := os.OpenFile(name, os.O_WRONLY|os.O_CREATE|os.O_EXCL, perm)
		if errors.Is(cerr, fs.ErrExist) {
			continue
		}
		if cerr != nil {
			return "", lerr
		}
		_, werr := f.Write(b)
		if werr == nil {
			werr = f.Sync()
		}
		if cerr := f.Close(); werr == nil {
			werr = cerr
		}
		if werr != nil {
			return "", werr
		}
		syncDir(dir)
		return name, nil
	}
	return "", &os.PathError{Op: "write", Path: path, Err: errors.New("every numbered name of the series is taken")}
}

// Numbered is the n-th name of path's series: path itself for n = 1, else
// the number before the extension (recovery.hesscycle → recovery-2.hesscycle).
func Numbered(path string, n int) string {
	if n <= 1 {
		return path
	}
	ext := filepath.Ext(path)
	return strings.TrimSuffix(path, ext) + "-" + strconv.Itoa(n) + ext
}

// NextFree is the name WriteNew would write now, if no one else writes
// first.
func NextFree(path string) string {
	for n := 1; n <= maxSeries; n++ {
		if _, err := os.Lstat(Numbered(path, n)); errors.Is(err, fs.ErrNotExist) {
			return Numbered(path, n)
		}
	}
	return path
}

// Series lists the regular files of path's series that exist (the names
// WriteNew writes), the most recently modified first.
func Series(path string) []string {
	if path == "" {
		return nil
	}
	ext := filepath.Ext(path)
	stem := strings.TrimSuffix(path, ext)
	type file struct {
		path string
		mod  int64
	}
	var found []file
	names, _ := filepath.Glob(globEscape(stem) + "-*" + globEscape(ext))
	for _, name := range append([]string{path}, names...) {
		if name != path {
			s := strings.TrimSuffix(strings.TrimPrefix(name, stem+"-"), ext)
			if n, err := strconv.Atoi(s); err != nil || n < 2 || n > maxSeries || strconv.Itoa(n) != s {
				continue
			}
		}
		if st, err := os.Lstat(name); err == nil && st.Mode().IsRegular() {
			found = append(found, file{name, st.ModTime().UnixNano()})
		}
	}
	slices.SortStableFunc(found, func(a, b file) int { return cmp.Compare(b.mod, a.mod) })
	out := make([]string, len(found))
	for i, f := range found {
		out[i] = f.path
	}
	return out
}

// CleanStale removes the temporary files ".BASE.tmp-NNN" in dir that a
// writer of BASE left when it died: only regular files whose lock no live
// writer holds. It returns how many it removed; errors are ignored (a file
// it cannot remove stays, as it would have anyway).
func CleanStale(dir, base string) int {
	prefix := "." + base + tempInfix
	names, _ := filepath.Glob(filepath.Join(globEscape(dir), globEscape(prefix)+"*"))
	removed := 0
	for _, name := range names {
		digits := strings.TrimPrefix(filepath.Base(name), prefix)
		if digits == "" || strings.Trim(digits, "0123456789") != "" {
			continue
		}
		if removeIfUnlocked(name) {
			removed++
		}
	}
	return removed
}

func removeIfUnlocked(name string) bool {
	before, err := os.Lstat(name)
	if err != nil || !before.Mode().IsRegular() {
		return false
	}
	f, err := os.OpenFile(name, os.O_RDONLY|openNonblock, 0)
	if err != nil {
		return false
	}
	defer f.Close()
	if lock(f, false) != nil {
		return false // a live writer holds it
	}
	held, err := f.Stat()
	if err != nil {
		return false
	}
	// Still the same file under that name (not renamed away and replaced).
	now, err := os.Lstat(name)
	if err != nil || !os.SameFile(held, now) || !os.SameFile(before, now) {
		return false
	}
	return os.Remove(name) == nil
}

func split(path string) (dir, base string) {
	dir, base = filepath.Split(filepath.Clean(path))
	if dir == "" {
		dir = "."
	}
	return dir, base
}

func syncDir(dir string) {
	if d, err := os.Open(dir); err == nil {
		d.Sync()
		d.Close()
	}
}

// globEscape quotes the pattern characters of a path for filepath.Glob.
func globEscape(s string) string {
	return strings.NewReplacer(`\`, `\\`, "*", `\*`, "?", `\?`, "[", `\[`).Replace(s)
}
