#!/usr/bin/python3
"""Writes testdata/cif_reference.json: for every testdata/cif/*.cif, what
Debian's python3-pymatgen makes of it (CifParser, primitive=False) and its
point-charge Ewald energy (EwaldSummation), for the tests of package
enthalpath/thermo/cif.

Charges are assigned the way enthalpath's reader does. CifParser (in this
version) reads them only from an _atom_type_symbol /
_atom_type_oxidation_number loop; where the file has no such loop, the
charges written in the type symbols (Cs1+, Cl1-) are read here with the
same rule as the Go reader (charge_from_type_symbol); for a file that
gives none, they come from CHARGES_GIVEN below, which the Go test passes
as cif.Options.Charges.

Run with /usr/bin/python3 (python3-pymatgen 2022.11.7+dfsg1). The output is
deterministic: sorted keys, floats rounded to fixed digits.
"""
import glob
import json
import math
import os
import subprocess
import warnings

from pymatgen.analysis.ewald import EwaldSummation
from pymatgen.io.cif import CifFile, CifParser

HERE = os.path.dirname(os.path.abspath(__file__))

# Charges by element for files that carry no oxidation numbers.
CHARGES_GIVEN = {
    "real_NaCl_rocksalt_Fm-3m.cif": {"Cl": -1, "Na": 1},
}

# acc_factor is the number of significant figures to which pymatgen
# converges each part of the sum (its docstring; default 12). 16 is used so
# that pymatgen's own truncation error (~1e-16 relative) stays far below
# the 1e-8 tolerance of the Go test; ACC_CHECK is a second, coarser run
# that must agree with the first to CONVERGED (relative), or the generator
# stops.
ACC_FACTOR = 16.0
ACC_CHECK = 13.0
CONVERGED = 1e-11


def sig(x, digits=12):
    """x rounded to a fixed number of significant digits."""
    if x == 0:
        return 0.0
    return float(f"{x:.{digits - 1}e}")


def wrap(f):
    """Fractional coordinate into [0,1), rounded to 6 decimals."""
    g = round(f - math.floor(f), 6)
    return 0.0 if g >= 1.0 else g + 0.0


def charge_from_type_symbol(sym):
    """Element and charge of a type symbol such as "Fe3+", "O2-", "Fe+3";
    None for the charge when the symbol carries none."""
    n = 0
    while n < len(sym) and n < 3 and sym[n].isalpha():
        n += 1
    el, rest = sym[:n].capitalize(), sym[n:]
    if not rest:
        return el, None
    if rest[-1] in "+-":
        digits, sign = rest[:-1], rest[-1]
    elif rest[0] in "+-":
        digits, sign = rest[1:], rest[0]
    else:
        raise SystemExit(f"cannot read the charge in type symbol {sym!r}")
    q = float(digits) if digits else 1.0
    return el, -q if sign == "-" else q


def type_symbol_charges(path):
    """Element -> charge from the charged type symbols of the file's first
    block with atom sites, or None if it has an _atom_type loop or no
    charged symbols."""
    cif = CifFile.from_file(path)
    for block in cif.data.values():
        d = block.data
        if "_atom_site_fract_x" not in d:
            continue
        if "_atom_type_oxidation_number" in d or "_atom_site_type_symbol" not in d:
            return None
        out = {}
        for sym in d["_atom_site_type_symbol"]:
            el, q = charge_from_type_symbol(sym)
            if q is None:
                return None
            if out.get(el, q) != q:
                raise SystemExit(f"{path}: element {el} has two charges")
            out[el] = q
        return out
    return None


def pymatgen_version():
    try:
        out = subprocess.run(
            ["dpkg-query", "-W", "-f=${Version}", "python3-pymatgen"],
            capture_output=True, text=True, check=True).stdout.strip()
        if out:
            return "python3-pymatgen " + out
    except (OSError, subprocess.CalledProcessError):
        pass
    import importlib.metadata
    return "pymatgen " + importlib.metadata.version("pymatgen")


def main():
    files = sorted(glob.glob(os.path.join(HERE, "cif", "*.cif")))
    entries = {}
    for path in files:
        name = os.path.basename(path)
        with warnings.catch_warnings():
            warnings.simplefilter("ignore")
            s = CifParser(path).get_structures(primitive=False)[0]
        given = CHARGES_GIVEN.get(name)
        if given:
            s.add_oxidation_state_by_element(given)
        else:
            from_symbols = type_symbol_charges(path)
            if from_symbols:
                s.add_oxidation_state_by_element(from_symbols)
        charges = [getattr(sp, "oxi_state", None) for site in s for sp in site.species]
        if len(charges) != len(s) or any(q is None for q in charges):
            raise SystemExit(f"{name}: some site has no charge (or a mixed site)")
        if abs(sum(charges)) > 1e-8:
            raise SystemExit(f"{name}: charges sum to {sum(charges)}")
        e = EwaldSummation(s, acc_factor=ACC_FACTOR).total_energy
        e_check = EwaldSummation(s, acc_factor=ACC_CHECK).total_energy
        if abs(e - e_check) > CONVERGED * abs(e):
            raise SystemExit(f"{name}: pymatgen Ewald energy changes by {abs(e - e_check) / abs(e):.1e} "
                             f"between acc_factor {ACC_CHECK} and {ACC_FACTOR}")
        sites = sorted(
            [site.specie.symbol, float(site.specie.oxi_state)] + [wrap(f) for f in site.frac_coords]
            for site in s)
        comp = {el.symbol: int(round(n)) for el, n in s.composition.element_composition.items()}
        entries[name] = {
            "charges_given": given or {},
            "composition": dict(sorted(comp.items())),
            "ewald_energy_ev": sig(e),
            "num_sites": len(s),
            "sites_species_charge_frac": sites,
            "volume_angstrom3": sig(s.volume),
        }
    out = {
        "about": "pymatgen's reading of testdata/cif/*.cif (CifParser(path).get_structures(primitive=False)[0]) "
                 "and its EwaldSummation total_energy in eV per cell (tin-foil boundary), acc_factor %g, "
                 "checked to change by less than %g (relative) from acc_factor %g; "
                 "written by testdata/gen_cif.py" % (ACC_FACTOR, CONVERGED, ACC_CHECK),
        "generator": pymatgen_version(),
        "structures": entries,
    }
    with open(os.path.join(HERE, "cif_reference.json"), "w") as fh:
        json.dump(out, fh, indent=1, sort_keys=True)
        fh.write("\n")


if __name__ == "__main__":
    main()
