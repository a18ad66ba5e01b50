package cycle

import "enthalpath/data"

// FileFormat is the name written in every cycle file, FileVersion its
// version; FileExtension is the usual file name ending.
const (
	FileFormat    = "enthalpath-cycle"
	FileVersion   = 1
	FileExtension = ".hesscycle"
)

// Marshal writes c as a cycle file (TOML, see the README section "Cycle
// files"): the compound, every step with its value, uncertainty, source and
// override flag, the unknown, the conventions and the model settings.
func Marshal(c *Cycle) ([]byte, error) { return marshal(c) }

// Unmarshal reads a cycle file: it rebuilds the compound's cycle from db
// and applies the file's values, unknowns, conventions and settings. A
// malformed file gives a *FileError with the line and field. A structure
// read from a CIF file is recorded by path only: the caller parses the CIF
// and sets Settings.Structure.Cell (this package reads no file but in Open).
func Unmarshal(db *data.DB, b []byte) (*Cycle, error) { return unmarshal(db, b, "") }

// Save writes c to path atomically: a temporary file in the same folder,
// synced, then renamed over path, so a crash never leaves a truncated file.
func Save(path string, c *Cycle) error { return save(path, c) }

// Open reads the cycle file at path (see Unmarshal).
func Open(db *data.DB, path string) (*Cycle, error) { return open(db, path) }
