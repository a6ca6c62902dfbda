#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# split.py: the train/test split rule of data/*.csv; `--write` fills the split column once,
# tests/data/check_split.py verifies that the checked-in column still equals the rule.
#
# Rule (by molecule, deterministic):
#  1. key = Open Babel canonical SMILES of the row's `smiles`; h = FNV-1a 32-bit of its UTF-8.
#  2. a molecule is test when h % 5 == 0.
#  3. stratification over the core set (handbook-*.csv): for every (kind, site_class) with at
#     least two distinct molecules and no test molecule after step 2, the molecule with the
#     smallest h becomes test.
#  4. a molecule that is test in any file is test in every file (no leak through the broad set).
import csv
import os
import sys

CORE = ["handbook-acids.csv", "handbook-bases.csv", "handbook-additions.csv"]
BROAD = ["iupac-pka.csv"]


def fnv1a32(text):
    h = 0x811C9DC5
    for b in text.encode("utf-8"):
        h ^= b
        h = (h * 0x01000193) & 0xFFFFFFFF
    return h


def canonicaliser():
    try:
        from openbabel import openbabel as ob
    except ImportError:
        print("skip: python3-openbabel is missing")
        sys.exit(77)
    ob.obErrorLog.SetOutputLevel(0)
    conv = ob.OBConversion()
    conv.SetInAndOutFormats("smi", "can")

    def can(smi):
        mol = ob.OBMol()
        if not conv.ReadString(mol, smi):
            return smi
        return conv.WriteString(mol).split()[0] if mol.NumAtoms() else smi
    return can


def read(path):
    with open(path, newline="") as f:
        rd = csv.reader(f)
        header = next(rd)
        return header, list(rd)


def assign(tables, can):
    """tables: {file: (header, rows)}; returns {file: [split per row]}."""
    keys = {}
    for name, (hdr, rows) in tables.items():
        i = hdr.index("smiles")
        keys[name] = [can(r[i]) for r in rows]
    test = {k for ks in keys.values() for k in ks if fnv1a32(k) % 5 == 0}
    classes = {}
    for name in CORE:
        if name not in tables:
            continue
        hdr, rows = tables[name]
        ci, ki = hdr.index("site_class"), hdr.index("kind")
        for r, k in zip(rows, keys[name]):
            classes.setdefault((r[ki], r[ci]), set()).add(k)
    for mols in classes.values():
        if len(mols) >= 2 and not (mols & test):
            test.add(min(mols, key=fnv1a32))
    return {n: ["test" if k in test else "train" for k in ks] for n, ks in keys.items()}, classes


def with_split(hdr, rows, split):
    if "split" not in hdr:
        return hdr + ["split"], [r + [s] for r, s in zip(rows, split)]
    i = hdr.index("split")
    out = []
    for r, s in zip(rows, split):
        r = list(r)
        r[i] = s
        out.append(r)
    return hdr, out


def load_all(datadir):
    return {n: read(os.path.join(datadir, n)) for n in CORE + BROAD
            if os.path.exists(os.path.join(datadir, n))}


def main():
    datadir = os.path.dirname(os.path.abspath(__file__))
    tables = load_all(datadir)
    splits, _ = assign(tables, canonicaliser())
    for name, (hdr, rows) in tables.items():
        hdr2, rows2 = with_split(hdr, rows, splits[name])
        with open(os.path.join(datadir, name), "w", newline="") as f:
            w = csv.writer(f, lineterminator="\n" if name == "handbook-additions.csv" else "\r\n")
            w.writerow(hdr2)
            w.writerows(rows2)
        print("%s: %d test of %d" % (name, splits[name].count("test"), len(rows)))
    return 0


if __name__ == "__main__":
    if sys.argv[1:] != ["--write"]:
        print("usage: split.py --write   (tests/data/check_split.py checks the column)")
        sys.exit(2)
    sys.exit(main())
