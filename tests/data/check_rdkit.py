#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# check_rdkit.py: reads every reference SMILES of data/ with RDKit and with Open Babel and
# fails when the two toolkits disagree on a heavy atom's formal charge, hydrogen count or
# aromaticity, or when only one of them can read the structure.
# Usage: check_rdkit.py [--list] ; exits 77 (skip) when rdkit or openbabel is missing.
import csv
import os
import sys

DATA_FILES = ["handbook-acids.csv", "handbook-bases.csv", "handbook-additions.csv",
              "iupac-pka.csv"]


def load_toolkits():
    try:
        from rdkit import Chem, RDLogger
        from openbabel import openbabel as ob
    except ImportError as e:
        print("skip: %s (install python3-rdkit and python3-openbabel)" % e)
        sys.exit(77)
    RDLogger.DisableLog("rdApp.*")
    ob.obErrorLog.SetOutputLevel(0)
    return Chem, ob


def rdkit_atoms(Chem, smi):
    mol = Chem.MolFromSmiles(smi)
    if mol is None:
        return None
    return [(a.GetAtomicNum(), a.GetFormalCharge(), a.GetTotalNumHs(), int(a.GetIsAromatic()))
            for a in mol.GetAtoms() if a.GetAtomicNum() > 1]


def obabel_atoms(ob, conv, smi):
    mol = ob.OBMol()
    if not conv.ReadString(mol, smi) or mol.NumAtoms() == 0:
        return None
    out = []
    for a in ob.OBMolAtomIter(mol):
        if a.GetAtomicNum() <= 1:
            continue
        h = a.GetImplicitHCount() + a.ExplicitHydrogenCount()
        out.append((a.GetAtomicNum(), a.GetFormalCharge(), h, int(a.IsAromatic())))
    return out


def compare(rd, obv):
    """One-line reason for a disagreement, or None when the toolkits agree."""
    if rd is None and obv is None:
        return "unreadable by both toolkits"
    if rd is None:
        return "rdkit cannot read it"
    if obv is None:
        return "open babel cannot read it"
    if len(rd) != len(obv):
        return "heavy atom count %d vs %d" % (len(rd), len(obv))
    what = {1: "formal charge", 2: "hydrogen count", 3: "aromaticity"}
    for i, (x, y) in enumerate(zip(rd, obv)):
        for k in (1, 2, 3):
            if x[k] != y[k]:
                return "atom %d: %s rdkit %d, open babel %d" % (i, what[k], x[k], y[k])
    return None


def main():
    Chem, ob = load_toolkits()
    conv = ob.OBConversion()
    conv.SetInFormat("smi")
    src = os.environ.get("PKAD_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
    listing = "--list" in sys.argv
    bad = 0
    total = 0
    for name in DATA_FILES:
        path = os.path.join(src, "data", name)
        with open(path, newline="") as f:
            for line, row in enumerate(csv.DictReader(f), start=2):
                total += 1
                smi = row["smiles"]
                why = compare(rdkit_atoms(Chem, smi), obabel_atoms(ob, conv, smi))
                if why:
                    bad += 1
                    print("%s,%d,%s,%s,%s" % (name, line, smi, row.get("pka_index", ""), why))
    print("checked %d rows, %d disagreements" % (total, bad))
    if listing:
        return 0
    return 1 if bad else 0


if __name__ == "__main__":
    sys.exit(main())
