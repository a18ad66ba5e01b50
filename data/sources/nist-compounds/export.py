#!/usr/bin/python3
"""Export the NIST compound list of xraylib (name, density, composition) to CSV.

xraylib carries the list compiled into its C library; this prints it as Debian 12
ships it (packages python3-xraylib and libxrl11 4.0.0+dfsg1-3):

    apt-get install python3-xraylib
    /usr/bin/python3 export.py > nist_compounds_xraylib.csv

One line a material, in xraylib's order: its name, the density in g/cm3 and the
elements with their mass fractions, as the library returns them (Python's repr
of each number, so no digit is added or dropped).
"""
import csv
import sys

import xraylib

out = csv.writer(sys.stdout, lineterminator="\n")
out.writerow(["name", "density_g_cm3", "elements", "mass_fractions"])
for name in xraylib.GetCompoundDataNISTList():
    d = xraylib.GetCompoundDataNISTByName(name)
    out.writerow([
        d["name"],
        repr(d["density"]),
        ";".join(xraylib.AtomicNumberToSymbol(z) for z in d["Elements"]),
        ";".join(repr(w) for w in d["massFractions"]),
    ])
