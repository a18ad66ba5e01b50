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
		return "The lattice step cannot come from a model here: " + Message(me)
	}
	return Message(err)
}

// Message is an engine error phrased for the screen. The engine's model
// errors name command-line options (--born-n, --structure) as the way out;
// here the Models screen's rows are named instead, built from the typed
// error's fields. Other errors are returned as they read.
func Message(err error) string {
	if err == nil {
		return ""
	}
	var me *cycle.ModelError
	var se *cycle.SettingError
	switch {
	case errors.As(err, &me):
		msg := "model " + me.Model + ": " + screenWording(me.Reason)
		if me.Err != nil {
			msg += ": " + Message(me.Err)
		}
		return msg
	case errors.As(err, &se):
		return strings.TrimSuffix(se.Reason, ".")
	}
	return err.Error()
}

// ValueError phrases the engine's refusal of a value typed as text: the
// text, what is wrong, and what to type (a *cycle.SettingError speaks of
// KEY=VALUE, the command line's form; a *cycle.ValueError of columns).
func ValueError(text string, err error) error {
	var se *cycle.SettingError
	var ve *cycle.ValueError
	var reason string
	switch {
	case errors.As(err, &se):
		reason = se.Reason
	case errors.As(err, &ve):
		reason = ve.Reason
	default:
		return err
	}
	return fmt.Errorf("%q: %s; type a number (with ± and an uncertainty, if you like) within ±%.0f kJ/mol",
		text, strings.TrimSuffix(reason, "."), float64(cycle.MaxStepMagnitude))
}

// screenWording replaces the command-line hints of the engine's model
// errors by the Models screen, where those settings are made (4 shows it).
func screenWording(reason string) string {
	return strings.NewReplacer(
		" (cycle --born-n, or the Models screen, takes n as given)", "; type n on the Models screen (4)",
		"; choose a prototype or a CIF file with --structure", "; set the structure on the Models screen (4)",
		"; choose a structure with parameters (--structure) or give a CIF file",
		"; set a structure with cell parameters or a CIF file on the Models screen (4)",
		"; open it with --structure FILE.cif", "; give the CIF file again on the Models screen (4)",
	).Replace(reason)
}
