package data

import (
	"embed"
	"io/fs"
	"unsafe"
)

// This file hands Load the text of a table without copying it: the
// largest embedded tables are also embedded as strings (fs.ReadFile on an
// embed.FS copies every file), and a file read from any other file system
// is turned into a string without a second copy.

var (
	//go:embed tables/compounds.csv
	compoundsText string
	//go:embed tables/alternatives.csv
	alternativesText string
	//go:embed tables/ionization.csv
	ionizationText string
	//go:embed tables/solution_enthalpies.csv
	solutionsText string
	//go:embed tables/shannon.csv
	shannonText string
	//go:embed tables/ion_values.csv
	ionValuesText string
	//go:embed tables/ions.csv
	ionsText string
	//go:embed tables/derived_ions.csv
	derivedIonsText string
)

// embeddedTables is the tables directory of the embedded files; text
// answers from the string copies above where there is one.
type embeddedTables struct{ fs.FS }

func newEmbeddedTables(fsys embed.FS) (embeddedTables, error) {
	sub, err := fs.Sub(fsys, "tables")
	return embeddedTables{sub}, err
}

func (embeddedTables) text(name string) (string, bool) {
	switch name {
	case "compounds.csv":
		return compoundsText, true
	case "alternatives.csv":
		return alternativesText, true
	case "ionization.csv":
		return ionizationText, true
	case "solution_enthalpies.csv":
		return solutionsText, true
	case "shannon.csv":
		return shannonText, true
	case "ion_values.csv":
		return ionValuesText, true
	case "ions.csv":
		return ionsText, true
	case DerivedIonsFile:
		return derivedIonsText, true
	}
	return "", false
}

// readText returns the text of the file name in fsys.
func readText(fsys fs.FS, name string) (string, error) {
	if t, ok := fsys.(interface{ text(string) (string, bool) }); ok {
		if s, ok := t.text(name); ok {
			return s, nil
		}
	}
	raw, err := fs.ReadFile(fsys, name)
	return bytesText(raw), err
}

// bytesText views raw as a string without copying it: raw is the caller's
// own (fs.ReadFile's fresh slice) and is never written again.
func bytesText(raw []byte) string { return unsafe.String(unsafe.SliceData(raw), len(raw)) }
