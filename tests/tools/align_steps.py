#!/usr/bin/env python3
"""align_steps.py: how much of a compilation file's error is row numbering.

The compilations number only the steps they measured (a book entry may list pK2 and pK4 of a
molecule with four steps, and Serjeant's "acid" rows include ammonium steps), so the default
matching of `pkad validate` can pair a row with the wrong step. This diagnostic pairs the
rows of each book entry (same SMILES, kind and entry) with the predicted steps by an
order-preserving assignment of least total squared difference, the way predicted and
measured macroscopic pKa lists are compared when their assignment is unknown (common
practice in blind pKa challenges: predicted values are matched to measured ones by value
before scoring). It is more lenient than the gate's rule on purpose: it bounds what a
perfect numbering could give and is reported beside the gate, never instead of it.

Candidate steps are those of `pkad validate --match steps`: sites of the row's kind with pKa
0..14 and of the other kind with pKa 1..13, in titration order (acids from the lowest pKa,
bases from the highest), then sites of the row's kind outside the window. An entry with more
rows than candidates keeps its first rows in order and counts the rest as not found.

Usage: align_steps.py PKAD CSV [--split test] [--tier A] [--worst N]
"""
import argparse
import csv
import json
import math
import subprocess
import sys
from collections import defaultdict


def candidates(sites, kind):
    inside, outside = [], []
    for s in sites:
        v = s["pka"]
        if s["kind"] == kind:
            (inside if 0.0 <= v <= 14.0 else outside).append(v)
        elif 1.0 <= v <= 13.0:
            inside.append(v)
    sign = 1.0 if kind == "acid" else -1.0
    return sorted(inside, key=lambda v: sign * v) + sorted(outside, key=lambda v: sign * v)


def align(pred, exp):
    """Order-preserving assignment of exp[i] to distinct pred[j]; returns the list of j."""
    k, n = len(exp), len(pred)
    inf = float("inf")
    cost = [[inf] * (n + 1) for _ in range(k + 1)]
    take = [[False] * (n + 1) for _ in range(k + 1)]
    for j in range(n + 1):
        cost[0][j] = 0.0
    for i in range(1, k + 1):
        for j in range(i, n + 1):
            skip = cost[i][j - 1]
            use = cost[i - 1][j - 1] + (pred[j - 1] - exp[i - 1]) ** 2
            if use < skip:
                cost[i][j], take[i][j] = use, True
            else:
                cost[i][j] = skip
    picks, i, j = [], k, n
    while i > 0:
        if take[i][j]:
            picks.append(j - 1)
            i -= 1
        j -= 1
    return picks[::-1]


def main():
    ap = argparse.ArgumentParser()
    ap.add_argument("pkad")
    ap.add_argument("csv")
    ap.add_argument("--split", default="")
    ap.add_argument("--tier", default="")
    ap.add_argument("--worst", type=int, default=0)
    a = ap.parse_args()
    with open(a.csv, newline="") as f:
        rows = [r for r in csv.DictReader(f)
                if (not a.split or r.get("split") == a.split)
                and (not a.tier or r.get("tier") == a.tier)]
    smiles = sorted({r["smiles"] for r in rows})
    out = subprocess.run([a.pkad, "predict", "-"], input="\n".join(smiles) + "\n",
                         capture_output=True, text=True)
    pred = {}
    for line in out.stdout.splitlines():
        j = json.loads(line)
        if "sites" in j:
            pred[j["input"]] = j["sites"]
    groups = defaultdict(list)
    for r in rows:
        groups[(r["smiles"], r["kind"], r.get("entry", ""))].append(r)
    scored, missing = [], 0
    for (smi, kind, _), g in groups.items():
        g.sort(key=lambda r: int(r.get("pka_index") or 1))
        c = candidates(pred.get(smi, []), kind)
        exp = [float(r["pka"]) for r in g]
        if len(g) > len(c):
            picks = list(range(len(c)))
            missing += len(g) - len(c)
        else:
            picks = align(c, exp)
        for i, j in enumerate(picks):
            scored.append((c[j] - exp[i], g[i]))
    n = len(scored)
    if not n:
        print("align_steps: no rows scored", file=sys.stderr)
        return 1
    rmse = math.sqrt(sum(e * e for e, _ in scored) / n)
    within = sum(abs(e) <= 1.0 for e, _ in scored) / n
    print(f"rows {len(rows)}, aligned {n}, not found {missing}, coverage {n / len(rows):.0%}; "
          f"RMSE {rmse:.2f}, within 1 unit {within:.0%}")
    scored.sort(key=lambda t: -abs(t[0]))
    for e, r in scored[:a.worst]:
        print(f"  {e:+6.2f} {r['kind']}{r.get('pka_index', '1')} {float(r['pka']):6.2f} {r['smiles']}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
