#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# check_atom_order.py: a prediction is a function of the molecule, not of the atom order it is
# written in. A fixed sample of the reference SMILES (data/iupac-pka.csv and the handbook
# files) goes in as several random atom orders written by RDKit (an independent toolkit):
# the families whose answer followed the atom order before (hydroxy- and mercapto-azines with
# two lactam or thione forms, a centre between two aryl rings, two N joined by a saturated and
# an aromatic route, C=O or C=S between two ring N, phosphines, enamines and ring imines),
# plus molecules drawn at random. Every order must give the same sorted list of (kind, pKa)
# of the sites, and the same canonical "smiles".
# Usage: check_atom_order.py [PKAD_BIN] ; exits 77 (skip) without rdkit.
import csv
import os
import random
import sys

from pkad_run import run_pkad

SEED = 20261202
ORDERS = 8        # random atom orders per molecule, besides the reference SMILES itself
PER_FAMILY = 60   # molecules per family
RANDOM = 300      # molecules drawn from all the rest

# RDKit SMARTS of the families (any match puts a molecule in the family)
FAMILIES = {
    "hydroxy/mercapto-azine": "[OX2H1,SX2H1][c;$(c:n),$(c:c:c:n)]",
    "azinone/thione between ring N": "[OX1,SX1]=c(:n):n",
    "centre between two aryls": "[$([NX3](c)c),$([CX3](=O)(c)c),$([PX3](c)c)]",
    "saturated and aromatic route": "[#7]1-[CX4]-[CX4]-[#7]-c:c-1",
    "phosphine": "[PX3;+0]",
    "enamine or ring imine": "[$([NX3;!a]-[CX3;!a]=[CX3;!a]),$([NX2;R;!a]=[CX3;R;!a])]",
}

# Sites with one micro value that are not equivalent (the sulfonic acids of azo-naphthol dyes):
# the stepwise titration once took the first of them by atom index, so they shared the charge
# interaction terms by input order; it now breaks such ties by canonical rank
# (predictor/stepwise.c site_before). Kept in the sample as a family of their own.
TIES = {
    "Oc1c(N=Nc2ccc(cc2)S(=O)(=O)O)c(cc2c1c(ccc2)S(=O)(=O)O)S(=O)(=O)O",
    "Oc1c(N=Nc2ccc(cc2)S(=O)(=O)O)cc(c2c1cc(cc2)S(=O)(=O)O)S(=O)(=O)O",
    "Oc1cc(c2c(c1N=Nc1ccc(cc1)S(=O)(=O)O)c(ccc2)S(=O)(=O)O)S(=O)(=O)O",
    "Oc1cc(cc2c1c(N=Nc1c(O)c3cc(O)c(cc3cc1S(=O)(=O)O)S(=O)(=O)O)cc(c2)S(=O)(=O)O)"
    "S(=O)(=O)O",
    "Oc1cc(cc2c1c(O)c(c(c2)S(=O)(=O)O)N=Nc1ccccc1S(=O)(=O)O)S(=O)(=O)O",
    "Oc1cc(ccc1N=Nc1c(O)c2c(O)cc(cc2cc1S(=O)(=O)O)S(=O)(=O)O)S(=O)(=O)O",
    "Oc1cc2c(cc1O)oc1-c(c2c2ccccc2O)cc(c(=O)c1)O",
}
KNOWN = set()  # order dependence reported but not counted (none now)


def load_rdkit():
    try:
        from rdkit import Chem, RDLogger
    except ImportError as e:
        print("skip: %s (install python3-rdkit for /usr/bin/python3)" % e)
        sys.exit(77)
    RDLogger.DisableLog("rdApp.*")
    return Chem


def reference_smiles(source):
    out = set()
    for name in ("iupac-pka.csv", "handbook-acids.csv", "handbook-bases.csv",
                 "handbook-additions.csv"):
        with open(os.path.join(source, "data", name), newline="") as f:
            for row in csv.DictReader(f):
                if row.get("smiles"):
                    out.add(row["smiles"])
    return sorted(out)


def pick(Chem, smiles):
    """(smiles, mol, family) for the families' molecules and the random draw, in a fixed
    order: the seed alone decides the sample."""
    rng = random.Random(SEED)
    mols = []
    for s in smiles:
        m = Chem.MolFromSmiles(s)
        if m is not None and m.GetNumHeavyAtoms() > 1:
            mols.append((s, m))
    picked, taken = [], set()
    for fam, sma in FAMILIES.items():
        patt = Chem.MolFromSmarts(sma)
        members = [(s, m) for s, m in mols if s not in taken and m.HasSubstructMatch(patt)]
        rng.shuffle(members)
        for s, m in members[:PER_FAMILY]:
            picked.append((s, m, fam))
            taken.add(s)
    rest = [(s, m) for s, m in mols if s not in taken]
    rng.shuffle(rest)
    picked += [(s, m, "random") for s, m in rest[:RANDOM]]
    picked += [(s, Chem.MolFromSmiles(s), "stepwise ties") for s in sorted(TIES | KNOWN)
               if s not in taken and s not in {p[0] for p in picked}]
    return picked


def answer(res):
    if "error" in res:
        return ("error", res["error"]["code"])
    sites = tuple(sorted((s["kind"], round(s["pka"], 2)) for s in res.get("sites", [])))
    return (res.get("smiles"), sites)


def main():
    pkad = sys.argv[1] if len(sys.argv) > 1 else os.environ.get("PKAD_BIN", "pkad")
    source = os.environ.get("PKAD_SOURCE_DIR",
                            os.path.dirname(os.path.dirname(os.path.dirname(
                                os.path.abspath(__file__)))))
    Chem = load_rdkit()
    picked = pick(Chem, reference_smiles(source))
    lines = []
    for i, (s, m, _) in enumerate(picked):
        lines.append("%s %d:ref\n" % (s, i))
        for k, r in enumerate(Chem.MolToRandomSmilesVect(m, ORDERS, randomSeed=SEED + i)):
            lines.append("%s %d:%d\n" % (r, i, k))
    results = run_pkad(pkad, lines)
    per = ORDERS + 1
    if len(results) != len(lines):
        sys.exit("pkad gave %d results for %d records" % (len(results), len(lines)))
    fails, known, fams = [], [], {}
    for i, (s, m, fam) in enumerate(picked):
        fams[fam] = fams.get(fam, 0) + 1
        got = {}
        for k in range(per):
            got.setdefault(answer(results[i * per + k]), lines[i * per + k].split()[0])
        if len(got) == 1:
            if s in KNOWN:
                print("note: known order dependence not seen in these orders: %s" % s)
            continue
        text = "%s (%s): %d answers: %s" % (
            s, fam, len(got), "; ".join("%s -> %s" % (v, list(a[1])[:6])
                                         for a, v in list(got.items())[:3]))
        (known if s in KNOWN else fails).append(text)
    print("%d molecules x %d atom orders (%s)" % (
        len(picked), per, ", ".join("%s %d" % kv for kv in fams.items())))
    print("%d molecules with more than one answer, %d of them known" % (
        len(fails) + len(known), len(known)))
    for k in known:
        print("known", k)
    for f in fails[:20]:
        print("FAIL", f)
    if sum(v for f, v in fams.items() if f not in ("random", "known", "stepwise ties")) < 150:
        fails.append("only %d family molecules in the sample" % len(picked))
    return 1 if fails else 0


if __name__ == "__main__":
    sys.exit(main())
