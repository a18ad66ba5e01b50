#!/usr/bin/python3
"""Writes the reference files the data package's tests compare against.

Reads two files shipped with Debian's python3-pymatgen (written against
2022.11.7+dfsg1-11+deb12u2):
  pymatgen/core/periodic_table.json      ionization energies, electron
                                          affinities, Shannon radii
  pymatgen/entries/exp_compounds.json.gz experimental formation enthalpies
and writes, deterministically (sorted keys, fixed float formatting):
  pymatgen_elements.json   per element: ionization energies (eV), first
                           electron affinity (eV), Shannon radii
  pymatgen_formation.json  per formula: formation enthalpy (eV per formula
                           unit as stored, and kJ/mol) with its uncertainty
Run from anywhere: paths are relative to this file.
"""
import gzip
import importlib.metadata
import json
import math
import os
import subprocess

import pymatgen.core
import pymatgen.entries

HERE = os.path.dirname(os.path.abspath(__file__))
CORE = os.path.dirname(pymatgen.core.__file__)
ENTRIES = os.path.dirname(pymatgen.entries.__file__)

# Exact SI values (2019 redefinition): e in C, N_A in 1/mol.
ELEMENTARY_CHARGE = 1.602176634e-19
AVOGADRO = 6.02214076e23
KJ_PER_MOL_PER_EV = ELEMENTARY_CHARGE * AVOGADRO / 1000.0


def package_version():
    try:
        out = subprocess.run(
            ["dpkg-query", "-W", "-f=${Version}", "python3-pymatgen"],
            capture_output=True, text=True, check=True)
        debian = out.stdout.strip()
    except (OSError, subprocess.CalledProcessError):
        debian = "unknown"
    return {"python3-pymatgen (Debian)": debian,
            "pymatgen": importlib.metadata.version("pymatgen")}


def fixed(x, digits):
    """Rounds to a fixed number of decimals; None for NaN or absent."""
    if x is None:
        return None
    x = float(x)
    if math.isnan(x):
        return None
    return round(x, digits)


def elements():
    with open(os.path.join(CORE, "periodic_table.json")) as f:
        table = json.load(f)
    out = {}
    for sym in sorted(table):
        rec = table[sym]
        ies = rec.get("Ionization energies") or []
        shannon = []
        for charge, by_cn in sorted((rec.get("Shannon radii") or {}).items()):
            for cn, by_spin in sorted(by_cn.items()):
                for spin, radii in sorted(by_spin.items()):
                    shannon.append({
                        "charge": int(charge),
                        "cn": cn,
                        "spin": {"High Spin": "HS", "Low Spin": "LS"}.get(spin, spin),
                        "crystal_radius": fixed(radii.get("crystal_radius"), 4),
                        "ionic_radius": fixed(radii.get("ionic_radius"), 4),
                    })
        ea = rec.get("Electron affinity")
        mass = rec.get("Atomic mass")
        out[sym] = {
            "atomic_mass": fixed(mass, 8) if isinstance(mass, (int, float)) else None,
            "z": rec.get("Atomic no"),
            "ionization_energies_ev": [fixed(v, 8) for v in ies],
            "electron_affinity_ev": fixed(ea, 8) if isinstance(ea, (int, float)) else None,
            "shannon": shannon,
        }
    return out


def formation():
    with gzip.open(os.path.join(ENTRIES, "exp_compounds.json.gz"), "rt") as f:
        rows = json.load(f)
    out = {}
    for row in sorted(rows, key=lambda r: r["formula"]):
        ev = fixed(row.get("exp energy"), 8)
        u = fixed(row.get("uncertainty"), 8)
        rec = {
            "energy_ev_per_fu": ev,
            "uncertainty_ev_per_fu": u,
            "formation_kj_per_mol": fixed(ev * KJ_PER_MOL_PER_EV, 3) if ev is not None else None,
            "uncertainty_kj_per_mol": fixed(u * KJ_PER_MOL_PER_EV, 3) if u is not None else None,
        }
        if row["formula"] in out:
            raise SystemExit("duplicate formula in exp_compounds.json.gz: " + row["formula"])
        out[row["formula"]] = rec
    return out


def write(name, payload):
    with open(os.path.join(HERE, name), "w") as f:
        json.dump(payload, f, indent=1, sort_keys=True, ensure_ascii=False)
        f.write("\n")


def main():
    version = package_version()
    write("pymatgen_elements.json", {
        "generator": "testdata/gen_data.py",
        "from": "pymatgen/core/periodic_table.json",
        "version": version,
        "units": {"ionization_energies_ev": "eV", "electron_affinity_ev": "eV", "radii": "angstrom", "atomic_mass": "g/mol"},
        "elements": elements(),
    })
    write("pymatgen_formation.json", {
        "generator": "testdata/gen_data.py",
        "from": "pymatgen/entries/exp_compounds.json.gz",
        "version": version,
        "note": "energy as stored (eV per formula unit); kJ/mol = eV x e x N_A / 1000 with exact SI e and N_A",
        "compounds": formation(),
    })


if __name__ == "__main__":
    main()
