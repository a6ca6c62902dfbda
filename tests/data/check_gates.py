#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# check_gates.py: the accuracy gates of issue 3, on the test split (never used for fitting).
# Runs `pkad validate --format json` on the core set (data/handbook-*.csv) and on the broad
# set (data/iupac-pka.csv, tier A), prints every figure, and fails when one gate is missed.
import json
import os
import subprocess
import sys

SRC = os.environ.get("PKAD_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
BIN = os.environ.get("PKAD_BIN", "pkad")
CORE = ["handbook-acids.csv", "handbook-bases.csv", "handbook-additions.csv"]
BROAD = ["iupac-pka.csv"]

# Gates (issue 3). A class gate applies when the class has >= 10 test rows with a site.
CORE_RMSE, CORE_COVERAGE = 0.6, 0.95
BROAD_RMSE, BROAD_COVERAGE = 1.2, 0.85
CALIBRATION = (0.55, 0.80)
CLASS_RMSE = {
    "carboxylic acids": (["carboxylic_acid", "benzoic_acid"], 0.4),
    "phenols": (["phenol"], 0.4),
    "anilines": (["aniline"], 0.5),
    "pyridines": (["pyridine"], 0.6),
    "aliphatic amines": (["primary_amine", "secondary_amine", "tertiary_amine"], 0.6),
    "alcohols": (["alcohol"], 0.8),
}
MIN_CLASS_ROWS = 10

# Regression floors: the figures this version of the model reaches where it does not yet
# meet an issue-3 gate (measured on the test split when params.tsv was last fitted, with a
# small margin). A missed gate is reported as NOT MET and keeps issue 3 open; the test fails
# only when a gate without a floor is missed or a floor is broken, so accuracy cannot drop
# unnoticed while the targets are worked on. Remove a floor once its gate is met.
# Measured on 2026-12-02 with the fitted params.tsv of this version (the merged refit after
# the skipped-step row matching, the titration order through the most populated states, the
# per-arm carboxyl, aza-aromatic, azole N-H and atom-order rounds): broad tier A rmse 1.353.
# Of the drop from 1.733, the row matching alone (same model) accounts for 1.733 -> 1.46.
# Then 1.342 after the rounds of 2026-12-02 (sulfonamides, lactams, ring imines, bi-azines,
# meta-aza phenols, hydroxyquinones; train 1.070 -> 1.015): floor 1.35. Then 1.298 after the rounds of
# 2026-12-02 evening (crowded diacids, fused polyaza rings, sugars and N-aryl amides, phenols and
# pyridines, azinone lactams, fused anilines, amidines; train 1.008 -> 0.982): floor 1.31.
# Then 1.243 after the rounds of 2026-12-03 (lactam anions and fused lactams, pyrimidinone
# drawings, twisted anilines, tropolones and C-H acids, vinamidines and amine arms, purine
# transmission, chelating agents, phosphorus statistics, carboxylic and small acid classes;
# train 0.982 -> 0.915): floor 1.26.
# Earlier floors: 1.31, 1.35, 1.36; 2.25 at the start of 2026-12-01, then 1.90, 1.82, 1.77, 1.76, 1.755, 1.75,
# 1.74.
FLOORS = {
    "broad tier A overall rmse": 1.26,
}


def floor_of(what):
    for key, value in FLOORS.items():
        if what == key or what.startswith(key + " ("):
            return value
    return None


def validate(files, extra):
    cmd = [BIN, "validate", "--split", "test", "--format", "json", "--worst", "0"] + extra
    cmd += [os.path.join(SRC, "data", f) for f in files]
    p = subprocess.run(cmd, capture_output=True, text=True)
    if p.returncode != 0:
        print("pkad validate failed (exit %d): %s" % (p.returncode, p.stderr.strip()))
        sys.exit(1)
    return json.loads(p.stdout)


class Gates:
    def __init__(self):
        self.failed = []
        self.not_met = []

    def at_most(self, what, got, limit):
        self.report(what, got, "<=", limit, got is not None and got <= limit)

    def at_least(self, what, got, limit):
        self.report(what, got, ">=", limit, got is not None and got >= limit)

    def report(self, what, got, op, limit, ok):
        shown = "n/a" if got is None else "%.3f" % got
        if ok:
            print("ok   %-44s %s (gate %s %.2f)" % (what, shown, op, limit))
            return
        floor = floor_of(what)
        held = floor is not None and got is not None and (got <= floor if op == "<=" else
                                                          got >= floor)
        if held:
            print("NOT MET %-41s %s (gate %s %.2f; floor %.2f held)" % (what, shown, op, limit,
                                                                       floor))
            self.not_met.append(what)
        else:
            print("FAIL %-44s %s (gate %s %.2f%s)" % (what, shown, op, limit,
                                                      "" if floor is None else
                                                      "; floor %.2f broken" % floor))
            self.failed.append(what)


def pooled_rmse(classes, names):
    n = sum(classes[c]["found"] for c in names if c in classes)
    if n == 0:
        return 0, None
    sse = sum(classes[c]["found"] * classes[c]["rmse"] ** 2 for c in names
              if c in classes and classes[c]["found"])
    return n, (sse / n) ** 0.5


def check_set(g, label, res, rmse, coverage):
    o = res["overall"]
    print("%s: %d rows, %d with a site, %d unreadable" % (label, o["rows"], o["found"],
                                                         res["unreadable"]))
    g.at_most(label + " overall rmse", o["rmse"], rmse)
    g.at_least(label + " coverage", o["coverage"], coverage)
    g.at_least(label + " calibration, share within 1 unc. (low)", o["calibration"],
               CALIBRATION[0])
    g.at_most(label + " calibration, share within 1 unc. (high)", o["calibration"],
              CALIBRATION[1])


def main():
    g = Gates()
    core = validate(CORE, [])
    check_set(g, "core", core, CORE_RMSE, CORE_COVERAGE)
    for what, (names, limit) in CLASS_RMSE.items():
        n, r = pooled_rmse(core["classes"], names)
        if n >= MIN_CLASS_ROWS:
            g.at_most("core %s rmse (%d rows)" % (what, n), r, limit)
        else:
            print("info %-44s %s (%d test rows: reported, not gated)" %
                  ("core %s rmse" % what, "n/a" if r is None else "%.3f" % r, n))
    for name, s in sorted(core["classes"].items()):
        print("     class %-30s n %4d rmse %s coverage %.2f" %
              (name, s["found"], "n/a" if s["rmse"] is None else "%.2f" % s["rmse"],
               s["coverage"] or 0))
    broad = validate(BROAD, ["--tier", "A"])
    check_set(g, "broad tier A", broad, BROAD_RMSE, BROAD_COVERAGE)
    if g.not_met:
        print("%d gate(s) of issue 3 not met yet (floors held): %s" %
              (len(g.not_met), "; ".join(g.not_met)))
    if g.failed:
        print("%d gate(s) missed: %s" % (len(g.failed), "; ".join(g.failed)))
        return 1
    print("all gates met" if not g.not_met else "no regression below the floors")
    return 0


if __name__ == "__main__":
    sys.exit(main())
