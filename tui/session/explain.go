package session

import (
	"errors"
	"fmt"
	"strings"

	"enthalpath/cycle"
)

// Explain rewrites an engine error in the workshop's terms: which step is
// at fault and which key fixes it (the engine's own messages speak of
// command-line flags).
func Explain(err error) string {
	if err == nil {
		return ""
	}
	var miss *cycle.MissingError
	var unk *cycle.UnknownsError
	var me *cycle.ModelError
	switch {
	case errors.As(err, &miss):
		return fmt.Sprintf("No value for %s (step %s): press e on it to type one, or x to solve for it instead.", miss.What, miss.Key)
	case errors.As(err, &unk) && len(unk.Keys) == 0:
		return "Nothing to solve: press x on the step to solve for (usually the lattice step)."
	case errors.As(err, &unk):
		return fmt.Sprintf("%d unknowns (%s): exactly one can be solved; give the others a value with e, or reset them with r.",
			len(unk.Keys), strings.Join(unk.Keys, ", "))
	case errors.As(err, &me):
		return "The lattice step cannot come from a model here: " + me.Error()
	}
	return err.Error()
}
