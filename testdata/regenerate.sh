#!/usr/bin/env bash
# Regenerates every reference file under testdata/ with Debian's python3-pymatgen.
# Each generator names the package version it was written against in its output.
set -euo pipefail
cd "$(dirname "$0")"
shopt -s nullglob
for gen in gen_*.py; do
  echo "running $gen"
  /usr/bin/python3 "$gen"
done
