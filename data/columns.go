package data

// Table files and their columns, as agreed in data/README.md. The overlay's
// [[table]] names map to the same columns.
var tableColumns = map[string][]string{
	"sources.csv": {"key", "citation"},
	"elements.csv": {"symbol", "z", "name", "standard_state", "atomization_kj_per_mol", "atomization_uncertainty", "source", "locator",
		"standard_entropy_j_per_mol_k", "entropy_source", "entropy_locator", "memory", "note"},
	"atomic_weights.csv":    {"symbol", "atomic_weight", "uncertainty", "source", "locator", "memory", "note"},
	"ionization.csv":        {"symbol", "stage", "energy_ev", "uncertainty_ev", "source", "locator", "memory", "note"},
	"affinity.csv":          {"symbol", "order", "affinity_ev", "affinity_kj_per_mol", "uncertainty_ev", "source", "locator", "memory", "derived", "note"},
	"atomization_steps.csv": {"element", "order", "kind", "reaction", "atoms_produced", "enthalpy_kj_per_mol", "uncertainty", "source", "locator", "memory", "note"},
	"shannon.csv":           {"core", "charge", "cn", "spin", "crystal_radius", "ionic_radius", "source", "locator", "memory", "note"},
	"born_exponents.csv":    {"config", "exponent", "source", "memory", "note"},
	"ions.csv":              {"symbol", "core", "charge", "polyatomic", "shape", "born_config", "note"},
	"ion_values.csv":        {"ion", "property", "value", "uncertainty", "unit", "scale", "source", "locator", "memory", "derived", "note"},
	"compounds.csv": {"formula", "name", "family", "cation", "cation_count", "anion", "anion_count",
		"state", "polymorph", "molecular",
		"formation_kj_per_mol", "formation_uncertainty", "formation_source", "locator",
		"gibbs_kj_per_mol", "entropy_j_per_mol_k", "structure", "params", "params_source",
		"density_g_cm3", "density_source", "density_locator", "lattice_kj_per_mol", "lattice_convention", "lattice_source", "memory", "note"},
	"solution_enthalpies.csv": {"formula", "solution_kj_per_mol", "uncertainty", "source", "locator", "memory", "note"},
	"species.csv": {"formula", "name", "formation_kj_per_mol", "formation_uncertainty", "gibbs_kj_per_mol",
		"entropy_j_per_mol_k", "source", "locator", "memory", "note"},
	"alternatives.csv": {"kind", "key", "value", "uncertainty", "unit", "source", "locator", "note"},
	AnionRadiiFile:     {"symbol", "radius_angstrom", "source", "locator", "memory", "note"},
	DerivedIonsFile:    {"ion", "gas_formation_kj_per_mol", "standard_error", "model", "salts", "outside_2sigma", "skipped", "derived", "note"},
}

// tableOrder is the order tables are read in (each may refer to the ones
// before it). Optional tables may be absent from the file system.
var tableOrder = []struct {
	file     string
	overlay  string // [[name]] in the overlay file
	optional bool
}{
	{"sources.csv", "source", false},
	{"elements.csv", "element", false},
	{"atomic_weights.csv", "atomic_weight", true},
	{"ionization.csv", "ionization", false},
	{"affinity.csv", "affinity", false},
	{"atomization_steps.csv", "atomization_step", false},
	{"born_exponents.csv", "born_exponent", false},
	{"ions.csv", "ion", false},
	{"shannon.csv", "shannon", false},
	{"ion_values.csv", "ion_value", true},
	{AnionRadiiFile, "anion_radius", true},
	{"compounds.csv", "compound", true},
	{"solution_enthalpies.csv", "solution_enthalpy", true},
	{"species.csv", "species", true},
	{"alternatives.csv", "alternative", true},
	{DerivedIonsFile, "derived_ion", true},
}

// TableFiles lists the table file names in reading order.
func TableFiles() []string {
	out := make([]string, len(tableOrder))
	for i, t := range tableOrder {
		out[i] = t.file
	}
	return out
}
