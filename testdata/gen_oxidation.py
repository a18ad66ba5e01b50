#!/usr/bin/env python3
"""Writes testdata/oxidation/*.cif and testdata/oxidation_reference.json.

Structure files as a general materials library writes them: each structure
is built with Debian's python3-pymatgen and written with its CifWriter
without oxidation states (so the files carry no charges), once in P1 and,
for some, with symmetry. The reference file records, per file:

- expected charges per site, in the order pymatgen reads the file
  (CifParser, conventional cell): pymatgen's BVAnalyzer valences, except
  for Fe3O4 where the inverse spinel is the fact of the trade (tetrahedral
  Fe3+, octahedral Fe2+/Fe3+ 1:1, mean 2.5); BVAnalyzer's choice (the
  normal spinel arrangement) is recorded beside it;
- pymatgen's EwaldSummation energy per cell with those charges (average
  oxidation state on a disordered site).

Structures are real compounds with cell parameters quoted from memory, as
noted; the triclinic cell and the Na/K chloride are invented (scenario
"tarnwick") and marked so. Run with /usr/bin/python3; output is
deterministic (sorted keys, floats rounded to 12 significant digits).
"""

import json
import os
import subprocess
import warnings

from pymatgen.analysis.bond_valence import BVAnalyzer, calculate_bv_sum_unordered
from pymatgen.analysis.ewald import EwaldSummation
from pymatgen.core import Lattice, Species, Structure
from pymatgen.io.cif import CifParser, CifWriter

HERE = os.path.dirname(os.path.abspath(__file__))
DIR = os.path.join(HERE, "oxidation")
OUT = os.path.join(HERE, "oxidation_reference.json")
ACC_FACTOR = 14.0


def pymatgen_version():
    out = subprocess.run(["dpkg-query", "-W", "-f=${Version}", "python3-pymatgen"],
                         capture_output=True, text=True, check=True)
    return "python3-pymatgen " + out.stdout.strip()


def r12(x):
    if x == 0:
        return 0.0
    return float("%.12g" % x)


def structures():
    """(file stem, structure, symmetrise?, expected charges by rule, note)."""
    out = []
    # Rock salt NaCl, a = 5.6402 A (from memory).
    s = Structure.from_spacegroup("Fm-3m", Lattice.cubic(5.6402), ["Na", "Cl"],
                                  [[0, 0, 0], [0.5, 0.5, 0.5]])
    out.append(("real_NaCl_rock_salt", s, False, None, "rock salt, a = 5.6402 A (from memory)"))
    # Fluorite CaF2, a = 5.4626 A (from memory).
    s = Structure.from_spacegroup("Fm-3m", Lattice.cubic(5.4626), ["Ca", "F"],
                                  [[0, 0, 0], [0.25, 0.25, 0.25]])
    out.append(("real_CaF2_fluorite", s, False, None, "fluorite, a = 5.4626 A (from memory)"))
    # Rutile TiO2 (Baur and Khan 1971, from memory).
    s = Structure.from_spacegroup("P4_2/mnm", Lattice.tetragonal(4.5937, 2.9587), ["Ti", "O"],
                                  [[0, 0, 0], [0.3048, 0.3048, 0]])
    out.append(("real_TiO2_rutile", s, True, None, "rutile, a = 4.5937, c = 2.9587 A, x(O) = 0.3048 (from memory)"))
    # Spinel MgAl2O4, a = 8.0832 A, u = 0.2624 in origin choice 2 (from
    # memory), here in pymatgen's setting of Fd-3m (origin choice 1: u + 1/8).
    s = Structure.from_spacegroup("Fd-3m", Lattice.cubic(8.0832), ["Mg", "Al", "O"],
                                  [[0, 0, 0], [0.625, 0.625, 0.625], [0.3874, 0.3874, 0.3874]])
    out.append(("real_MgAl2O4_spinel", s, True, None, "spinel, a = 8.0832 A, u = 0.2624 (origin 2; from memory)"))
    # Magnetite Fe3O4, inverse spinel, a = 8.396 A, u = 0.2549 (origin 2;
    # from memory); tetrahedral 8a first, then octahedral 16d.
    s = Structure.from_spacegroup("Fd-3m", Lattice.cubic(8.396), ["Fe", "Fe", "O"],
                                  [[0, 0, 0], [0.625, 0.625, 0.625], [0.3799, 0.3799, 0.3799]])
    out.append(("real_Fe3O4_magnetite", s, True, "inverse-spinel",
                "magnetite, a = 8.396 A, u = 0.2549 (origin 2; from memory); inverse spinel: Fe3+ on 8a, Fe2+/Fe3+ on 16d"))
    # Invented: a triclinic cell, rutile's contents in a sheared cell.
    s = Structure(Lattice.from_parameters(4.62, 4.58, 2.97, 88.0, 91.5, 92.0),
                  ["Ti", "Ti", "O", "O", "O", "O"],
                  [[0, 0, 0], [0.5, 0.5, 0.5], [0.3048, 0.3048, 0], [0.6952, 0.6952, 0],
                   [0.8048, 0.1952, 0.5], [0.1952, 0.8048, 0.5]])
    out.append(("invented_tarnwick_TiO2_triclinic", s, False, None,
                "invented (tarnwick scenario): rutile's sites in a triclinic cell"))
    # Invented: Na/K shared 1:1 on the cation site of a rock-salt cell.
    s = Structure.from_spacegroup("Fm-3m", Lattice.cubic(6.00), [{"Na": 0.5, "K": 0.5}, "Cl"],
                                  [[0, 0, 0], [0.5, 0.5, 0.5]])
    out.append(("invented_tarnwick_NaKCl_mixed_site", s, False, "averaged",
                "invented (tarnwick scenario): a = 6.00 A, Na 0.5 / K 0.5 on 4a"))
    return out


def main():
    os.makedirs(DIR, exist_ok=True)
    files = {}
    for stem, s, sym, rule, note in structures():
        variants = [(stem + "_P1.cif", None)]
        if sym:
            variants.append((stem + "_sym.cif", 0.01))
        for name, symprec in variants:
            text = str(CifWriter(s, symprec=symprec))
            with open(os.path.join(DIR, name), "w") as f:
                f.write(text)
            with warnings.catch_warnings():
                warnings.simplefilter("ignore")
                read = CifParser(os.path.join(DIR, name)).get_structures(primitive=False)[0]
            entry = {"note": note, "sites": len(read)}
            if rule == "averaged":
                ox = {"Na": 1, "K": 1, "Cl": -1}
                read.add_oxidation_state_by_element(ox)
                charges = [sum(occ * sp.oxi_state for sp, occ in site.species.items()) for site in read]
                entry["rule"] = "averaged crystal: mean of Na+ and K+ on the shared site (BVAnalyzer does not take disordered sites)"
            else:
                bva = BVAnalyzer().get_valences(read)
                entry["bvanalyzer_charges"] = bva
                charges = list(bva)
                if rule == "inverse-spinel":
                    # Tetrahedral (4 O neighbours within 2.2 A) Fe3+, octahedral mean 2.5.
                    charges = []
                    for site in read:
                        if site.specie.symbol == "O":
                            charges.append(-2)
                        else:
                            n = len(read.get_neighbors(site, 2.2))
                            charges.append(3 if n == 4 else 2.5)
                    entry["rule"] = "inverse spinel (fact of the trade): 4-coordinated Fe +3, 6-coordinated Fe mean +2.5"
                    entry["bvanalyzer_energy_ev"] = r12(EwaldSummation(with_charges(read, bva), acc_factor=ACC_FACTOR).total_energy)
                else:
                    entry["rule"] = "pymatgen BVAnalyzer valences"
            entry["charges"] = [r12(q) for q in charges]
            # pymatgen's bond-valence sums (its b = 0.31 A, every neighbour
            # within 8 A), magnitudes; the Go test sums with the same b.
            entry["pymatgen_bv_sums_b031"] = [
                r12(abs(calculate_bv_sum_unordered(site, read.get_neighbors(site, 8.0)))) for site in read]
            entry["energy_ev"] = r12(EwaldSummation(with_charges(read, charges), acc_factor=ACC_FACTOR).total_energy)
            files[name] = entry
    with open(OUT, "w") as f:
        json.dump({"generator": "testdata/gen_oxidation.py", "library": pymatgen_version(),
                   "acc_factor": ACC_FACTOR, "files": files, "charged_cells": charged_cells()},
                  f, indent=1, sort_keys=True)
        f.write("\n")


def charged_cells():
    """Cells with a net charge: EwaldSummation's total energy includes its
    charged-cell term (a uniform neutralising background)."""
    out = {}
    cases = [
        ("CsCl-type, Cs+2 Cl-1", Lattice.cubic(4.123), [("Cs", 2, [0, 0, 0]), ("Cl", -1, [0.5, 0.5, 0.5])]),
        ("rock salt with a Cl vacancy", Lattice.cubic(5.6402),
         [("Na", 1, [0, 0, 0]), ("Na", 1, [0, 0.5, 0.5]), ("Na", 1, [0.5, 0, 0.5]), ("Na", 1, [0.5, 0.5, 0]),
          ("Cl", -1, [0.5, 0.5, 0.5]), ("Cl", -1, [0.5, 0, 0]), ("Cl", -1, [0, 0.5, 0])]),
        ("triclinic, net -0.5", Lattice.from_parameters(4.1, 4.6, 5.2, 81, 97, 104),
         [("Mg", 2, [0.1, 0.2, 0.3]), ("O", -1.5, [0.6, 0.55, 0.8]), ("O", -1, [0.3, 0.8, 0.1])]),
    ]
    for name, lat, sites in cases:
        s = Structure(lat, [Species(el, q) for el, q, _ in sites], [f for _, _, f in sites])
        e = EwaldSummation(s, acc_factor=ACC_FACTOR)
        out[name] = {"lattice": [[r12(x) for x in row] for row in lat.matrix.tolist()],
                     "species": [el for el, _, _ in sites], "charges": [q for _, q, _ in sites],
                     "frac": [f for _, _, f in sites], "energy_ev": r12(e.total_energy),
                     "charged_cell_energy_ev": r12(e._charged_cell_energy)}
    return out


def with_charges(s, charges):
    """A copy of s with each site's species carrying its charge: a single
    species takes the charge; a shared site (the Na/K case) keeps its
    species, each with its own formal state, whose average is the charge."""
    s = s.copy()
    if all(len(site.species) == 1 for site in s):
        s.add_site_property("charge", list(charges))
        s.add_oxidation_state_by_site(list(charges))
        return s
    s.add_oxidation_state_by_element({"Na": 1, "K": 1, "Cl": -1})
    return s


if __name__ == "__main__":
    main()
