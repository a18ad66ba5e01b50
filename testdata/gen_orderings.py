#!/usr/bin/env python3
"""Writes testdata/orderings_reference.json: pymatgen's Ewald energies of
Li/vacancy orderings on the cation (octahedral) sites of rock-salt
supercells, for the Go package thermo/ordering.

The case: the conventional rock-salt cell (a = 5.6402 Å, Fm-3m, cation at
4a, anion at 4b, built here with pymatgen's Structure.from_spacegroup),
repeated 2x2x1 (32 sites, 16 cation sites) and 2x2x3 (96 sites, 48 cation
sites). Half the cation sites hold Li+, half are empty; every anion carries
-1/2, so the cell is neutral.

pymatgen's EwaldSummation (acc_factor 14) of the fully occupied neutral
cell (cation +1, anion -1) gives the energy matrix M (E = sum of M); the
pair potential is Phi_ij = 2 M_ij / (q_i q_j), and any neutral ordering q'
has E = 1/2 q'^T Phi q' (the bilinear form of the Ewald sum). For the
2x2x1 cell every one of the C(16,8) = 12,870 orderings is evaluated this way
and the ten lowest energy levels are written with the number of orderings on
each; each level's first ordering is also summed directly by
EwaldSummation on the ordered structure (vacancies removed, anions O with
charge -0.5), and the two must agree to 1e-9. For the 2x2x3 cell, too large
to enumerate, the file holds Phi itself (upper triangle, with the site
positions) and three seeded random orderings summed directly.

Run with /usr/bin/python3 from any directory; output is deterministic.
"""

import itertools
import json
import os
import random
import warnings

import numpy as np
from pymatgen.analysis.ewald import EwaldSummation
from pymatgen.core import Lattice, Species, Structure

import gen_ewald

HERE = os.path.dirname(os.path.abspath(__file__))
OUT = os.path.join(HERE, "orderings_reference.json")
ACC_FACTOR = 14.0
A = 5.6402


def g13(x):
    return float("%.13g" % x)


def parent(n):
    s = Structure.from_spacegroup("Fm-3m", Lattice.cubic(A), [Species("Li", 1), Species("O", -1)],
                                  [[0, 0, 0], [0.5, 0, 0]])
    s.make_supercell(n)
    return s


def pair_potentials(s):
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        m = EwaldSummation(s, acc_factor=ACC_FACTOR).total_energy_matrix
    q = np.array([site.specie.oxi_state for site in s])
    return 2 * m / np.outer(q, q)


def charges(s, occupied):
    """q' for the cation sites in occupied (a set of indices) holding Li+."""
    return np.array([(1.0 if i in occupied else 0.0) if site.specie.symbol == "Li" else -0.5
                     for i, site in enumerate(s)])


def direct(s, occupied):
    species, coords = [], []
    for i, site in enumerate(s):
        if site.specie.symbol == "Li":
            if i in occupied:
                species.append(Species("Li", 1))
                coords.append(site.frac_coords)
        else:
            species.append(Species("O", -0.5))
            coords.append(site.frac_coords)
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        return EwaldSummation(Structure(s.lattice, species, coords), acc_factor=ACC_FACTOR).total_energy


def frac(s):
    return [[g13(x % 1.0) for x in site.frac_coords] for site in s]


def small_case():
    s = parent([2, 2, 1])
    phi = pair_potentials(s)
    cations = [i for i, site in enumerate(s) if site.specie.symbol == "Li"]
    combos = list(itertools.combinations(cations, len(cations) // 2))
    energies = []
    for occ in combos:
        q = charges(s, set(occ))
        energies.append(0.5 * q @ phi @ q)
    order = np.argsort(energies, kind="stable")
    levels = []
    for k in order:
        e = energies[k]
        if levels and abs(e - levels[-1]["energy_ev"]) <= 1e-9 * abs(e):
            levels[-1]["count"] += 1
            continue
        if len(levels) == 10:
            break
        occ = set(combos[k])
        d = direct(s, occ)
        assert abs(d - e) <= 1e-9 * abs(e), (d, e)
        levels.append({"energy_ev": e, "count": 1, "direct_energy_ev": g13(d),
                       "occupied": [frac(s)[i] for i in sorted(occ)]})
    for lv in levels:
        lv["energy_ev"] = g13(lv["energy_ev"])
    return {"supercell": [2, 2, 1], "orderings": len(combos), "levels": levels}


def large_case():
    s = parent([2, 2, 3])
    phi = pair_potentials(s)
    n = len(s)
    cations = [i for i, site in enumerate(s) if site.specie.symbol == "Li"]
    rng = random.Random(19)
    spots = []
    for _ in range(3):
        occ = set(rng.sample(cations, len(cations) // 2))
        q = charges(s, occ)
        e = 0.5 * q @ phi @ q
        d = direct(s, occ)
        assert abs(d - e) <= 1e-9 * abs(e), (d, e)
        spots.append({"energy_ev": g13(d), "occupied": [frac(s)[i] for i in sorted(occ)]})
    return {
        "supercell": [2, 2, 3],
        "sites": [{"species": site.specie.symbol, "frac": f} for site, f in zip(s, frac(s))],
        "phi_upper_ev": [g13(phi[i, j]) for i in range(n) for j in range(i, n)],
        "random_orderings": spots,
    }


def main():
    out = {
        "generator": "testdata/gen_orderings.py",
        "pymatgen": gen_ewald.pymatgen_version(),
        "acc_factor": ACC_FACTOR,
        "a_angstrom": A,
        "case": "Li/vacancy half occupancy on the cation sites of rock salt, anions -1/2",
        "small": small_case(),
        "large": large_case(),
    }
    with open(OUT, "w") as f:
        json.dump(out, f, indent=1, sort_keys=True)
        f.write("\n")


if __name__ == "__main__":
    main()
