// Package fileio reads and writes the files a user names: cycle files, CIF
// files, user data overlays, SVG drawings, batch output and recovery files.
//
// It is not physics: it sits under thermo because thermo is the lowest
// layer, and the CIF reader there is one of its users, so every layer above
// can import it without an import pointing the wrong way.
//
// # Reading
//
// ReadFile opens without blocking (a named pipe does not hang the
// program), refuses anything that is not a regular file (a folder, a
// device such as /dev/zero, a pipe, a socket) with a *NotRegularError, and
// reads at most the caller's byte cap, refusing a larger file with a
// *TooLargeError before more than cap+1 bytes are held.
//
// # Writing
//
// WriteAtomic replaces a file only through a synced temporary file in the
// same folder and a rename, so a crash leaves either the old file or the
// new one. It keeps the permission bits of the file it replaces, and
// refuses to replace a symbolic link, a device, a folder or anything else
// that is not a regular file (*NotRegularError). The temporary file is
// named ".NAME.tmp-NNN" and is locked while it is written; a temporary file
// of NAME left by a writer that died (kill -9 during the sync) is removed by
// the next write of NAME, and only when no live writer holds its lock.
//
// WriteNew writes a file that never replaces another: PATH, else the first
// free name of its series PATH-2, PATH-3, … (before the extension). Two
// writers at once get two different names of the series (the name is
// claimed with a hard link, which fails when the name exists), and Series
// lists exactly the names WriteNew may have written.
//
// A base name longer than MaxBaseName bytes is refused (*NameError) before
// anything is created: the temporary name adds to it, and most file systems
// stop at 255 bytes.
package fileio
