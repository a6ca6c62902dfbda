#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# check_canonical_smiles.py: pkad's "smiles" and species SMILES are canonical and right. On
# single-component molecules of the NCI first_5K set (Debian rdkit-data), some given a random
# stereoisomer by RDKit, each molecule goes in as several random atom orders written by RDKit
# (an independent toolkit); every order must give one and the same "smiles" and species
# SMILES, and RDKit must read pkad's "smiles" back to the input molecule (RDKit canonical
# SMILES with stereo equal) where pkad did not rewrite the input (no warnings).
# Usage: check_canonical_smiles.py [PKAD_BIN] ; exits 77 (skip) without rdkit or the set.
import os
import random
import sys

from pkad_run import run_pkad

NCI_SET = "/usr/share/RDKit/Data/NCI/first_5K.smi"
MOLECULES = 300   # molecules checked
ORDERS = 4        # random atom orders per molecule
SEED = 20261201


def load_rdkit():
    try:
        from rdkit import Chem, RDLogger
        from rdkit.Chem.EnumerateStereoisomers import (EnumerateStereoisomers,
                                                        StereoEnumerationOptions)
    except ImportError as e:
        print("skip: %s (install python3-rdkit for /usr/bin/python3)" % e)
        sys.exit(77)
    RDLogger.DisableLog("rdApp.*")
    return Chem, EnumerateStereoisomers, StereoEnumerationOptions


def pick_molecules(Chem, enum, options):
    """Single-component molecules RDKit reads; every other one with stereo centres or
    double bonds gets a random stereoisomer, so that stereo marks are covered too."""
    rng = random.Random(SEED)
    out = []
    with open(NCI_SET) as f:
        for line in f:
            smi = line.split()[0] if line.strip() else ""
            mol = Chem.MolFromSmiles(smi) if smi and "." not in smi else None
            if mol is None or mol.GetNumHeavyAtoms() < 2:
                continue
            if len(out) % 2 == 0:
                opts = options(onlyUnassigned=True, maxIsomers=8, rand=rng.randrange(1 << 30),
                               unique=True)
                isomers = list(enum(mol, options=opts))
                if len(isomers) > 1:
                    mol = isomers[rng.randrange(len(isomers))]
            out.append(mol)
            if len(out) == MOLECULES:
                break
    return out


def species_of(res):
    return [s["smiles"] for s in res.get("at_ph", {}).get("species", [])]


def check_molecule(Chem, i, mol, results):
    """Returns (failures, compared with the input)."""
    fails = []
    ok = [r for r in results if "error" not in r]
    if len(ok) != len(results):
        codes = {r["error"]["code"] if "error" in r else "ok" for r in results}
        if len(codes) > 1:
            fails.append("molecule %d: some orders fail, others not: %s" % (i, sorted(codes)))
        return fails, 0
    forms = {(r["smiles"], tuple(species_of(r))) for r in ok}
    if len(forms) > 1:
        fails.append("molecule %d: %d different outputs for one molecule: %s" %
                     (i, len(forms), sorted(forms)[:3]))
    if ok[0]["warnings"]:
        return fails, 0
    want = Chem.MolToSmiles(mol)
    back = Chem.MolFromSmiles(ok[0]["smiles"])
    got = Chem.MolToSmiles(back) if back is not None else None
    if got != want:
        fails.append("molecule %d: pkad smiles %s reads back as %s, input %s" %
                     (i, ok[0]["smiles"], got, want))
    return fails, 1


def main():
    pkad = sys.argv[1] if len(sys.argv) > 1 else os.environ.get("PKAD_BIN", "pkad")
    Chem, enum, options = load_rdkit()
    if not os.path.exists(NCI_SET):
        print("skip: %s not found (Debian package rdkit-data)" % NCI_SET)
        sys.exit(77)
    mols = pick_molecules(Chem, enum, options)
    lines = []
    for i, mol in enumerate(mols):
        for k, smi in enumerate(Chem.MolToRandomSmilesVect(mol, ORDERS, randomSeed=SEED + i)):
            lines.append("%s %d:%d\n" % (smi, i, k))
    results = run_pkad(pkad, lines)
    if len(results) != len(lines):
        sys.exit("pkad gave %d results for %d records" % (len(results), len(lines)))
    fails, compared, stereo = [], 0, 0
    for i, mol in enumerate(mols):
        f, c = check_molecule(Chem, i, mol, results[i * ORDERS:(i + 1) * ORDERS])
        fails += f
        compared += c
        stereo += "@" in Chem.MolToSmiles(mol) or "/" in Chem.MolToSmiles(mol)
    print("%d molecules (%d with stereo marks) x %d atom orders; %d read back against the "
          "input" % (len(mols), stereo, ORDERS, compared))
    for f in fails[:20]:
        print("FAIL", f)
    # pkad rewrites some inputs (salts, tautomers, charges): most must still be compared
    if compared < len(mols) // 2:
        fails.append("only %d of %d molecules compared with the input" % (compared, len(mols)))
    return 1 if fails else 0


if __name__ == "__main__":
    sys.exit(main())
