#!/usr/bin/python3
"""Export the standard atomic weights of mendeleev's elements.db to CSV.

Run from this folder with the database of GitHub lmmentel/mendeleev, commit
580e34010f5c90cf0a025d365948fd343670e9d2, file mendeleev/elements.db:

    git -C MENDELEEV show 580e3401:mendeleev/elements.db > /tmp/elements.db
    /usr/bin/python3 export.py /tmp/elements.db > atomic_weights_ciaaw.csv

Columns as in the database's table `elements` (atomic_weight in g/mol,
atomic_weight_uncertainty empty where the source gives the conventional
value of an interval). Weights are printed with 12 significant digits and uncertainties with 3, which
keeps every digit the database stores for these values.
"""
import csv
import sqlite3
import sys

con = sqlite3.connect(sys.argv[1])
out = csv.writer(sys.stdout, lineterminator="\n")
out.writerow(["symbol", "atomic_number", "atomic_weight", "atomic_weight_uncertainty"])
for sym, z, w, u in con.execute(
    "select symbol, atomic_number, atomic_weight, atomic_weight_uncertainty "
    "from elements where atomic_number <= 96 order by atomic_number"
):
    out.writerow([sym, z, "%.12g" % w, "" if u is None else "%.3g" % u])
