#!/usr/bin/env python3
"""Times pymatgen's EwaldSummation and enthalpath's ewald.Sum on the same
structures in one run and prints the ratio. Not part of CI (timings depend
on the machine); run by hand from the repository root or from testdata/:

    /usr/bin/python3 testdata/bench_ewald.py [--large] [--pymatgen-acc 12] [--ours-acc 1e-12]

Structures: the built-in prototypes exactly as the Go package builds them
(go run ./thermo/ewald/bench -emit-prototypes) and displaced
rock-salt supercells of 64 and 216 ions (and 1,000 with --large). Both
codes get exactly the same lattices, positions and charges. Accuracy is
judged against enthalpath's sum at 1e-13 (itself checked against
pymatgen at acc_factor 14 by the Go tests); both errors are printed, so
"equal or better accuracy" can be read off the table.
"""

import argparse
import json
import os
import random
import statistics
import subprocess
import sys
import tempfile
import time
import warnings

HERE = os.path.dirname(os.path.abspath(__file__))
ROOT = os.path.dirname(HERE)
sys.path.insert(0, HERE)

import gen_ewald  # noqa: E402  (same structures as the reference file)
from pymatgen.analysis.ewald import EwaldSummation  # noqa: E402
from pymatgen.core import Lattice, Species, Structure  # noqa: E402


def go_prototypes():
    """The prototypes exactly as the Go package builds them (default
    parameters), with the slot labels replaced by the example compound's
    elements from gen_ewald.py."""
    out = subprocess.run(["go", "run", "./thermo/ewald/bench", "-emit-prototypes"],
                         cwd=ROOT, capture_output=True, text=True, check=True)
    ions = {p["name"]: p["ions"] for p in gen_ewald.prototypes()}
    result = []
    for r in json.loads(out.stdout):
        table = ions[r["name"]]
        species = [Species(table[label][0], q) for label, q in zip(r["species"], r["charges"])]
        result.append((r["name"], Structure(Lattice(r["lattice"]), species, r["frac"])))
    return result


def structures(large):
    out = go_prototypes()
    rock = [s for k, s in out if k == "rock-salt"][0]
    rng = random.Random(11)
    for n in ([2, 3, 5] if large else [2, 3]):
        big = rock.copy()
        big.make_supercell([n, n, n])
        for i in range(len(big)):
            big.translate_sites([i], [rng.uniform(-0.01, 0.01) / n for _ in range(3)], frac_coords=True)
        out.append(("rock-salt %dx%dx%d displaced" % (n, n, n), big))
    return out


def time_pymatgen(st, acc, min_time=0.5):
    times = []
    energy = None
    start = time.perf_counter()
    while len(times) < 3 or (time.perf_counter() - start < min_time and len(times) < 50):
        t0 = time.perf_counter()
        e = EwaldSummation(st, acc_factor=acc)
        energy = e.total_energy
        _ = [e.get_site_energy(i) for i in range(len(st))]  # ours returns all site potentials too
        times.append(time.perf_counter() - t0)
    return statistics.median(times), energy


def run_ours(records, acc, timed=True):
    with tempfile.NamedTemporaryFile("w", suffix=".json", delete=False) as f:
        json.dump(records, f)
        path = f.name
    try:
        out = subprocess.run(
            ["go", "run", "./thermo/ewald/bench", "-in", path, "-accuracy", repr(acc)]
            + ([] if timed else ["-min-time", "0"]),
            cwd=ROOT, capture_output=True, text=True, check=True)
    finally:
        os.unlink(path)
    return {r["name"]: r for r in json.loads(out.stdout)}


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("--large", action="store_true", help="also a 1,000-ion supercell (slow in pymatgen)")
    ap.add_argument("--pymatgen-acc", type=float, default=12.0, help="EwaldSummation acc_factor")
    ap.add_argument("--ours-acc", type=float, default=1e-12, help="ewald.Sum relative accuracy")
    args = ap.parse_args()
    warnings.simplefilter("ignore")

    sts = structures(args.large)
    records = []
    for name, st in sts:
        records.append({
            "name": name,
            "lattice": st.lattice.matrix.tolist(),
            "frac": [[float(x) for x in s.frac_coords] for s in st],
            "charges": [float(s.specie.oxi_state) for s in st],
            "formula_units": 1,
        })
    ours = run_ours(records, args.ours_acc)
    ref = run_ours(records, 1e-13, timed=False)

    print("%s; ours at accuracy %g, pymatgen acc_factor %g" % (gen_ewald.pymatgen_version(), args.ours_acc, args.pymatgen_acc))
    print("%-30s %5s %12s %12s %9s %11s %11s" % ("structure", "ions", "pymatgen/s", "ours/s", "ratio", "err pmg", "err ours"))
    ratios = []
    for name, st in sts:
        tp, ep = time_pymatgen(st, args.pymatgen_acc)
        o = ours[name]
        e_ref = ref[name]["energy_ev"]
        ratio = tp / o["seconds_per_sum"]
        ratios.append(ratio)
        print("%-30s %5d %12.4g %12.4g %8.0fx %11.2g %11.2g" % (
            name, len(st), tp, o["seconds_per_sum"], ratio,
            abs(ep - e_ref) / abs(e_ref), abs(o["energy_ev"] - e_ref) / abs(e_ref)))
    print("median ratio %.0fx, smallest %.0fx" % (statistics.median(ratios), min(ratios)))


if __name__ == "__main__":
    main()
