package cli

import (
	"errors"
	"fmt"
	"strings"

	"enthalpath/cycle"
	"enthalpath/cycle/analysis"
)

// commandLineText words an error for the command line. The engine's
// errors name no flag: here the part at fault becomes the flag that gives
// it (an analysis field: "--set KEY", "--max-charge"), and the way out the
// flag that provides it (a missing step: --set or --solve; a model that
// needs a structure or a Born exponent: --structure, --born-n), both from
// the errors' fields.
func commandLineText(err error) string {
	if err == nil {
		return ""
	}
	msg := strings.TrimSpace(err.Error())
	var ie *analysis.InputError
	if errors.As(err, &ie) {
		if flag := inputFlag(ie); flag != "" {
			w := *ie
			w.Field, w.Key = flag, ""
			msg = strings.Replace(msg, ie.Error(), w.Error(), 1)
		}
	}
	if hint := commandLineHint(err); hint != "" {
		msg += " (" + hint + ")"
	}
	return msg
}

// inputFlag is the flag that gives an analysis input's field, or "".
func inputFlag(ie *analysis.InputError) string {
	withKey := func(flag string) string {
		if ie.Key == "" {
			return flag
		}
		return flag + " " + ie.Key
	}
	switch ie.Field {
	case analysis.FieldCharges:
		return "--charges"
	case analysis.FieldStepValue:
		return withKey("--set")
	case analysis.FieldUnknownStep:
		return withKey("--solve")
	case analysis.FieldIon:
		return withKey("--ion")
	case analysis.FieldMaxCharge:
		return "--max-charge"
	case analysis.FieldScale:
		return "--scale"
	case analysis.FieldLattice:
		return "--lattice"
	}
	return ""
}

// commandLineHint names the flags that supply what an engine error lacks.
func commandLineHint(err error) string {
	var miss *cycle.MissingError
	var unk *cycle.UnknownsError
	var me *cycle.ModelError
	switch {
	case errors.As(err, &miss):
		return missingHint(miss)
	case errors.As(err, &unk) && len(unk.Keys) == 0:
		return "--solve KEY, usually --solve lattice"
	case errors.As(err, &unk):
		return "--set KEY=VALUE"
	case errors.As(err, &me):
		switch me.Remedy {
		case cycle.RemedyBornExponent:
			return "--born-n N"
		case cycle.RemedyStructure:
			return "--structure PROTOTYPE or --structure FILE.cif"
		case cycle.RemedyStructureWithCell:
			return "--structure PROTOTYPE with --param, or --structure FILE.cif"
		case cycle.RemedyReadCIF:
			return "--structure FILE.cif"
		}
	}
	return ""
}

// missingHint says what supplies a missing step: the flags that set or
// solve it, the row of a data file (--data FILE) that gives it, and for the
// gas-phase enthalpy of an ion no table gives, the command that derives one
// over the ion's salts.
func missingHint(miss *cycle.MissingError) string {
	hint := fmt.Sprintf("--set %s=VALUE, or --solve %s", miss.Key, miss.Key)
	switch {
	case miss.Ion != "" && (miss.Kind == cycle.KindIonFormation || miss.Kind == cycle.KindAttachment && miss.Key != "attachment-1"):
		return fmt.Sprintf("%s; or give %s's gas-phase enthalpy in a data file (--data FILE, [[derived_ion]] ion = %q), or derive one over its salts: enthalpath ionfit '%s'",
			hint, miss.Ion, miss.Ion, miss.Ion)
	case miss.Kind == cycle.KindAttachment:
		return hint + "; or give the electron affinity in a data file (--data FILE, [[affinity]])"
	case miss.Kind == cycle.KindIonization:
		return hint + "; or give the ionization energy in a data file (--data FILE, [[ionization]])"
	case miss.Kind == cycle.KindFormation:
		return hint + "; or give the compound's enthalpy of formation in a data file (--data FILE, [[compound]])"
	}
	return hint
}
