#!/usr/bin/env python3
"""Times pymatgen's route to the lowest Li/vacancy orderings (EwaldSummation
energy matrix, then EwaldMinimizer with ALGO_FAST, ten orderings) and
enthalpath's orderings command (whole process, enumeration) on the same
cases in one run, and prints the ratio and both lowest energies. Not part of
CI (timings depend on the machine); run by hand from the repository root or
from testdata/:

    /usr/bin/python3 testdata/bench_orderings.py [--repeat 5]

Cases: half the cation sites of 2x2x1 and 3x2x1 rock-salt supercells
(16 and 24 sites) hold Li+, anions carry -1/2 (testdata/gen_orderings.py).
pymatgen's minimiser lists orderings, not symmetry-distinct ones, so its
ten may be copies of one ordering; the lowest energies are compared.
"""

import argparse
import json
import os
import statistics
import subprocess
import sys
import tempfile
import time
import warnings

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(HERE)
sys.path.insert(0, HERE)

import gen_ewald  # noqa: E402
import gen_orderings  # noqa: E402
from pymatgen.analysis.ewald import EwaldMinimizer, EwaldSummation  # noqa: E402
from pymatgen.core import Species  # noqa: E402


def pymatgen_lowest(n):
    s = gen_orderings.parent(n)
    for i, site in enumerate(s):
        if site.specie.symbol == "O":
            s.replace(i, Species("O", -0.5))
    t0 = time.perf_counter()
    with warnings.catch_warnings():
        warnings.simplefilter("ignore")
        m = EwaldSummation(s, acc_factor=12).total_energy_matrix
    li = [i for i, site in enumerate(s) if site.specie.symbol == "Li"]
    mini = EwaldMinimizer(m, [[0, len(li) // 2, li, None]], num_to_return=10, algo=EwaldMinimizer.ALGO_FAST)
    return time.perf_counter() - t0, mini.minimized_sum


def ours_lowest(binary, n):
    t0 = time.perf_counter()
    out = subprocess.run([binary, "orderings", "rock-salt", "--supercell", "x".join(map(str, n)),
                          "--site", "M=Li:+1:0.5,vac:0.5", "--site", "X=O:-0.5", "--keep", "10", "--json"],
                         capture_output=True, text=True, check=True)
    dt = time.perf_counter() - t0
    return dt, json.loads(out.stdout)["orderings"][0]["energy_ev_per_cell"]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--repeat", type=int, default=5)
    args = ap.parse_args()
    with tempfile.TemporaryDirectory() as tmp:
        binary = os.path.join(tmp, "enthalpath")
        subprocess.run(["go", "build", "-o", binary, "."], cwd=ROOT, check=True)
        print("%s; pymatgen EwaldSummation (acc_factor 12) + EwaldMinimizer ALGO_FAST against enthalpath orderings (whole process)" % gen_ewald.pymatgen_version())
        print("%-10s %6s %12s %12s %8s %16s %16s" % ("cell", "sites", "pymatgen/s", "ours/s", "ratio", "lowest pmg/eV", "lowest ours/eV"))
        for n in ([2, 2, 1], [3, 2, 1]):
            tp, to, ep, eo = [], [], None, None
            for _ in range(args.repeat):  # interleaved
                t, ep = pymatgen_lowest(n)
                tp.append(t)
                t, eo = ours_lowest(binary, n)
                to.append(t)
            mp, mo = statistics.median(tp), statistics.median(to)
            print("%-10s %6d %12.4g %12.4g %7.0fx %16.10f %16.10f" % (
                "x".join(map(str, n)), 8 * n[0] * n[1] * n[2] // 2, mp, mo, mp / mo, ep, eo))


if __name__ == "__main__":
    main()
