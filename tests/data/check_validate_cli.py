#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# check_validate_cli.py: `pkad validate` and `pkad fit` from the outside: usage errors exit 2,
# a malformed CSV exits 1 naming file:line:column, unreadable SMILES are counted and listed,
# one result per row, the parity plot is written, and fit writes a params file.
import json
import os
import subprocess
import sys
import tempfile

BIN = os.environ.get("PKAD_BIN", "pkad")
SRC = os.environ.get("PKAD_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
# The mechanics are tested on the small fixture tables, independent of the shipped tables.
FIXTURE = os.path.join(SRC, "tests", "predictor", "fixture")
failures = []


def run(*args):
    return subprocess.run([BIN] + list(args), capture_output=True, text=True)


def check(cond, what):
    print("%-4s %s" % ("ok" if cond else "FAIL", what))
    if not cond:
        failures.append(what)


def write(d, name, text):
    path = os.path.join(d, name)
    with open(path, "w") as f:
        f.write(text)
    return path


def usage_and_malformed(d):
    check(run("validate").returncode == 2, "validate without a file exits 2")
    check(run("validate", "--split", "dev", "x.csv").returncode == 2, "bad --split exits 2")
    check(run("fit").returncode == 2, "fit without a file exits 2")
    bad = write(d, "bad.csv", "smiles,pka,kind\nCC(=O)O,4.76,acid\nO,15.7\n")
    p = run("validate", bad)
    check(p.returncode == 1 and "bad.csv:3:" in p.stderr and "expected 3 fields" in p.stderr,
          "malformed CSV names file:line:column (%s)" % p.stderr.strip())
    p = run("fit", bad)
    check(p.returncode == 1 and "bad.csv:3:" in p.stderr, "fit rejects the malformed CSV")
    nosplit = write(d, "nosplit.csv", "smiles,pka,kind\nCC(=O)O,4.76,acid\n")
    p = run("fit", nosplit)
    check(p.returncode == 1 and "no split column" in p.stderr, "fit needs a split column")
    p = run("validate", "--split", "test", nosplit)
    check(p.returncode == 1 and "no split column" in p.stderr, "--split needs a split column")


def scoring(d):
    # acetic acid 4.76, phenol 9.99 (handbook-acids.csv); pyridine 5.23 (handbook-bases.csv)
    rows = ("name,smiles,pka,pka_index,kind,split\nacetic acid,CC(=O)O,4.76,1,acid,test\n"
            "junk,C1CC(,4.0,1,acid,test\nphenol,Oc1ccccc1,9.99,1,acid,test\n"
            "pyridine,c1ccncc1,5.23,1,base,test\nno site,C,40,1,base,test\n"
            "train row,CCO,16.0,1,acid,train\n")
    ref = write(d, "ref.csv", rows)
    svg = os.path.join(d, "parity.svg")
    p = run("validate", "--fragments", FIXTURE, "--split", "test", "--format", "json",
            "--plot", svg, ref)
    check(p.returncode == 0, "validate runs on a small reference file (%s)" % p.stderr.strip())
    if p.returncode != 0:
        return
    res = json.loads(p.stdout)
    o = res["overall"]
    check(o["rows"] == 5, "every test row is offered once (%d)" % o["rows"])
    check(res["unreadable"] == 1, "the unreadable SMILES is counted")
    listed = [r["smiles"] for r in res["not_scored"]]
    check("C1CC(" in listed and "C" in listed, "unreadable and site-less rows are listed")
    check(o["found"] == 3 and abs(o["coverage"] - 0.6) < 1e-9, "coverage is 3 of 5")
    check(os.path.exists(svg) and open(svg).read().startswith("<svg"), "parity plot written")
    p = run("validate", "--fragments", FIXTURE, ref)
    check(p.returncode == 0 and "worst rows" in p.stdout, "text report lists the worst rows")


def fitting(d):
    rows = "smiles,pka,pka_index,kind,split\n"
    # handbook-acids.csv values: acetic 4.76, propanoic 4.87, chloroacetic 2.87, phenol 9.99
    for smi, v in [("CC(=O)O", 4.76), ("CCC(=O)O", 4.87), ("OC(=O)CCl", 2.87),
                   ("Oc1ccccc1", 9.99), ("CC(=O)O", 0.0)]:
        rows += "%s,%s,1,acid,%s\n" % (smi, v, "test" if v == 0.0 else "train")
    ref = write(d, "fit.csv", rows)
    out = os.path.join(d, "params.tsv")
    p = run("fit", "--fragments", FIXTURE, "--out", out, "--no-falloff", ref)
    check(p.returncode == 0, "fit runs on a small train file (%s)" % p.stderr.strip())
    if p.returncode != 0:
        return
    text = open(out).read()
    check("# data_version: fit.csv:4 train rows" in text, "the test row is not used")
    check("\nid\tvalue\tprior\tprior_sd\tn\trmse_cv\tnote\n" in text, "params header row")


def main():
    with tempfile.TemporaryDirectory() as d:
        usage_and_malformed(d)
        scoring(d)
        fitting(d)
    print("%d failure(s)" % len(failures))
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
