#!/usr/bin/env python3
"""Writes testdata/ewald_reference.json: Ewald energies of the built-in
prototype structures and of every testdata/cif/*.cif file, computed with
Debian's python3-pymatgen (pymatgen.analysis.ewald.EwaldSummation).

The prototype structures are built here independently of the Go code, from
their space groups and Wyckoff positions with pymatgen's
Structure.from_spacegroup, with the same parameters as the Go defaults (and
a few variants); "displaced" holds a 216-ion rock-salt supercell whose ions
are moved at random (seeded), read by the Go test from its sites. The Go test checks that it builds the same lattice and the
same set of sites (up to a global translation) and that its energies match.

Run with /usr/bin/python3 from any directory; output is deterministic
(sorted keys, floats rounded to 12 significant digits).
"""

import glob
import json
import math
import os
import random
import re
import subprocess
import warnings

from pymatgen.analysis.ewald import EwaldSummation
from pymatgen.core import Lattice, Species, Structure
from pymatgen.io.cif import CifParser

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, "ewald_reference.json")

# EwaldSummation's acc_factor is the number of significant figures each of
# its sums is taken to (its default is 12).
ACC_FACTOR = 14.0

# Charges for CIF files that carry none (the Go test passes the same map as
# cif.Options.Charges, keyed by element).
USER_CHARGES = {
    "real_NaCl_rocksalt_Fm-3m.cif": {"Na": 1, "Cl": -1},
}


def pymatgen_version():
    try:
        out = subprocess.run(
            ["dpkg-query", "-W", "-f=${Version}", "python3-pymatgen"],
            capture_output=True, text=True, check=True)
        return "python3-pymatgen " + out.stdout.strip()
    except (OSError, subprocess.CalledProcessError):
        import importlib.metadata
        return "pymatgen " + importlib.metadata.version("pymatgen")


def r12(x):
    """Rounds to 12 significant digits so the file is reproducible."""
    if x == 0:
        return 0.0
    return float("%.12g" % x)


def sp(symbol, charge):
    return Species(symbol, charge)


# Each prototype: Go name, Go parameters, space group, lattice, species with
# charges, Wyckoff representatives, and the slot → species map the Go test
# applies with WithIons.
def prototypes():
    out = []

    def add(key, name, params, group, lattice, species, coords, ions):
        out.append(dict(key=key, name=name, params=params, group=group,
                        lattice=lattice, species=species, coords=coords, ions=ions))

    a = 5.6402
    add("rock-salt", "rock-salt", {"a": a}, "Fm-3m", Lattice.cubic(a),
        [sp("Na", 1), sp("Cl", -1)], [[0, 0, 0], [0.5, 0.5, 0.5]],
        {"M": ["Na", 1], "X": ["Cl", -1]})
    a = 4.123
    add("caesium-chloride", "caesium-chloride", {"a": a}, "Pm-3m", Lattice.cubic(a),
        [sp("Cs", 1), sp("Cl", -1)], [[0, 0, 0], [0.5, 0.5, 0.5]],
        {"M": ["Cs", 1], "X": ["Cl", -1]})
    a = 5.4093
    add("zinc-blende", "zinc-blende", {"a": a}, "F-43m", Lattice.cubic(a),
        [sp("Zn", 2), sp("S", -2)], [[0, 0, 0], [0.25, 0.25, 0.25]],
        {"M": ["Zn", 2], "X": ["S", -2]})
    for key, (a, c, u) in {
        "wurtzite": (3.2496, 5.2042, 0.3819),
        "wurtzite-ideal": (3.0, 3.0 * math.sqrt(8.0 / 3.0), 0.375),
    }.items():
        add(key, "wurtzite", {"a": a, "c": c, "u": u}, "P6_3mc", Lattice.hexagonal(a, c),
            [sp("Zn", 2), sp("O", -2)], [[1 / 3, 2 / 3, 0], [1 / 3, 2 / 3, u]],
            {"M": ["Zn", 2], "X": ["O", -2]})
    a = 5.4626
    add("fluorite", "fluorite", {"a": a}, "Fm-3m", Lattice.cubic(a),
        [sp("Ca", 2), sp("F", -1)], [[0, 0, 0], [0.25, 0.25, 0.25]],
        {"M": ["Ca", 2], "X": ["F", -1]})
    a = 4.6114
    add("antifluorite", "antifluorite", {"a": a}, "Fm-3m", Lattice.cubic(a),
        [sp("Li", 1), sp("O", -2)], [[0.25, 0.25, 0.25], [0, 0, 0]],
        {"M": ["Li", 1], "X": ["O", -2]})
    a, c, x = 4.5937, 2.9587, 0.30479
    add("rutile", "rutile", {"a": a, "c": c, "x": x}, "P4_2/mnm", Lattice.tetragonal(a, c),
        [sp("Ti", 4), sp("O", -2)], [[0, 0, 0], [x, x, 0]],
        {"M": ["Ti", 4], "X": ["O", -2]})
    a, c, z = 3.846, 17.49, 0.25
    add("cadmium-chloride", "cadmium-chloride", {"a": a, "c": c, "z": z}, "R-3m",
        Lattice.hexagonal(a, c), [sp("Cd", 2), sp("Cl", -1)], [[0, 0, 0], [0, 0, z]],
        {"M": ["Cd", 2], "X": ["Cl", -1]})
    a, c, z = 4.24, 6.84, 0.25
    add("cadmium-iodide", "cadmium-iodide", {"a": a, "c": c, "z": z}, "P-3m1",
        Lattice.hexagonal(a, c), [sp("Cd", 2), sp("I", -1)], [[0, 0, 0], [1 / 3, 2 / 3, z]],
        {"M": ["Cd", 2], "X": ["I", -1]})
    a, c, z, x = 4.7602, 12.9933, 0.35216, 0.30624
    add("corundum", "corundum", {"a": a, "c": c, "z_cation": z, "x_anion": x}, "R-3c",
        Lattice.hexagonal(a, c), [sp("Al", 3), sp("O", -2)], [[0, 0, z], [x, 0, 0.25]],
        {"M": ["Al", 3], "X": ["O", -2]})
    a = 3.905
    add("perovskite", "perovskite", {"a": a}, "Pm-3m", Lattice.cubic(a),
        [sp("Sr", 2), sp("Ti", 4), sp("O", -2)], [[0, 0, 0], [0.5, 0.5, 0.5], [0.5, 0.5, 0]],
        {"A": ["Sr", 2], "B": ["Ti", 4], "X": ["O", -2]})
    # pymatgen's "Fd-3m" is origin choice 1 (8a at 0,0,0); the Go prototype
    # uses origin choice 2, whose coordinates are those of choice 1 minus
    # (1/8, 1/8, 1/8); the 32e representative (u, u, u) of choice 2 is
    # (u + 1/8, u + 1/8, u + 1/8) in choice 1 (u = 0.2624 there is the usual
    # 0.3874).
    a, u = 8.0832, 0.2624
    add("spinel", "spinel", {"a": a, "u": u}, "Fd-3m", Lattice.cubic(a),
        [sp("Mg", 2), sp("Al", 3), sp("O", -2)],
        [[0, 0, 0], [0.625, 0.625, 0.625], [u + 0.125] * 3],
        {"A": ["Mg", 2], "B": ["Al", 3], "X": ["O", -2]})
    a, c = 3.446, 5.877
    add("nickel-arsenide", "nickel-arsenide", {"a": a, "c": c}, "P6_3/mmc",
        Lattice.hexagonal(a, c), [sp("Fe", 2), sp("S", -2)], [[0, 0, 0], [1 / 3, 2 / 3, 0.25]],
        {"M": ["Fe", 2], "X": ["S", -2]})
    return out


def type_symbol_charges(path):
    """Element -> charge from charged _atom_site_type_symbol values such as
    Cs1+ or O2- (pymatgen reads oxidation states only from an
    _atom_type_oxidation_number loop)."""
    charges = {}
    for block in CifParser(path).as_dict().values():
        for sym in block.get("_atom_site_type_symbol", []):
            m = re.fullmatch(r"([A-Z][a-z]?)(\d*)([+-])", sym.strip())
            if m:
                n = int(m.group(2) or 1)
                charges[m.group(1)] = n if m.group(3) == "+" else -n
    return charges


def describe(structure):
    lat = structure.lattice
    sites = []
    for s in structure:
        sites.append({
            "species": s.specie.symbol,
            "charge": r12(s.specie.oxi_state),
            "frac": [r12(v - math.floor(v)) for v in s.frac_coords],
        })
    return {
        "lattice_abc": [r12(v) for v in lat.abc],
        "lattice_angles": [r12(v) for v in lat.angles],
        "volume": r12(lat.volume),
        "sites": sites,
    }


def ewald(structure):
    e = EwaldSummation(structure, acc_factor=ACC_FACTOR)
    total = e.total_energy
    site_e = [e.get_site_energy(i) for i in range(len(structure))]
    pots = [2 * se / s.specie.oxi_state for se, s in zip(site_e, structure)]
    return {
        "energy_ev": r12(total),
        "site_energies_ev": [r12(v) for v in site_e],
        "site_potentials_volt": [r12(v) for v in pots],
        "eta": r12(e.eta),
    }


def main():
    warnings.simplefilter("ignore")
    records = []
    for p in prototypes():
        st = Structure.from_spacegroup(p["group"], p["lattice"], p["species"], p["coords"])
        rec = {"key": p["key"], "prototype": p["name"], "params": p["params"], "ions": p["ions"]}
        rec.update(describe(st))
        rec.update(ewald(st))
        records.append(rec)
        # A supercell, to check the energy per cell scales with the cell.
        if p["key"] == "rock-salt":
            big = st.copy()
            big.make_supercell([2, 2, 2])
            rec2 = {"key": "rock-salt-2x2x2", "prototype": p["name"], "params": p["params"],
                    "ions": p["ions"], "supercell": [2, 2, 2]}
            rec2.update(describe(big))
            rec2.update(ewald(big))
            records.append(rec2)

    # A displaced supercell (no internal translation left): the general path
    # of the Go sum, which the Go test takes with one image per pair and with
    # several by forcing the splitting parameter.
    displaced = []
    rock = [r for r in prototypes() if r["key"] == "rock-salt"][0]
    big = Structure.from_spacegroup(rock["group"], rock["lattice"], rock["species"], rock["coords"])
    big.make_supercell([3, 3, 3])
    rng = random.Random(19)
    for i in range(len(big)):
        big.translate_sites([i], [rng.uniform(-0.0125, 0.0125) for _ in range(3)], frac_coords=True)
    rec = {"key": "rock-salt-3x3x3-displaced", "prototype": rock["name"], "params": rock["params"],
           "ions": rock["ions"], "supercell": [3, 3, 3]}
    rec.update(describe(big))
    rec.update(ewald(big))
    displaced.append(rec)

    cifs = []
    for path in sorted(glob.glob(os.path.join(HERE, "cif", "*.cif"))):
        rel = os.path.relpath(path, HERE)
        try:
            parser = CifParser(path)
            st = parser.get_structures(primitive=False)[0]
            user = USER_CHARGES.get(os.path.basename(path))
            if user:
                st.add_oxidation_state_by_element(user)
            elif any(getattr(s.specie, "oxi_state", None) is None for s in st):
                st.add_oxidation_state_by_element(type_symbol_charges(path))
            missing = [s.species_string for s in st if getattr(s.specie, "oxi_state", None) is None]
            if missing:
                raise ValueError("no oxidation state for " + ", ".join(sorted(set(missing))))
            rec = {"file": rel}
            if user:
                rec["user_charges"] = user
            rec.update(describe(st))
            rec.update(ewald(st))
        except Exception as exc:  # recorded, so the Go test can skip it knowingly
            rec = {"file": rel, "skipped": "%s: %s" % (type(exc).__name__, exc)}
        cifs.append(rec)

    doc = {
        "generator": "testdata/gen_ewald.py",
        "pymatgen": pymatgen_version(),
        "acc_factor": ACC_FACTOR,
        "units": "energies in eV per cell, potentials in volt, lengths in angstrom, angles in degrees",
        "note": "EwaldSummation with acc_factor as given; structures from Structure.from_spacegroup; "
                "site potentials are 2*site_energy/charge",
        "prototypes": records,
        "displaced": displaced,
        "cif": cifs,
    }
    with open(OUT, "w") as f:
        json.dump(doc, f, indent=1, sort_keys=True)
        f.write("\n")


if __name__ == "__main__":
    main()
