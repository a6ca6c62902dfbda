#!/usr/bin/python3
# SPDX-License-Identifier: MIT
# check_split.py: the checked-in split column of data/*.csv equals the rule of data/split.py,
# no molecule is in both splits, every core class with two or more molecules has test rows,
# and the test share is near the rule's 20%. Exits 77 (skip) without python3-openbabel.
import os
import sys

src = os.environ.get("PKAD_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
sys.path.insert(0, os.path.join(src, "data"))
import split  # noqa: E402


def main():
    tables = split.load_all(os.path.join(src, "data"))
    want, classes = split.assign(tables, split.canonicaliser())
    fails = 0
    n_test = n_all = 0
    for name, (hdr, rows) in tables.items():
        if "split" not in hdr:
            print("%s: no split column" % name)
            fails += 1
            continue
        i = hdr.index("split")
        for line, (r, s) in enumerate(zip(rows, want[name]), start=2):
            if r[i] != s:
                print("%s:%d: split is '%s', the rule gives '%s'" % (name, line, r[i], s))
                fails += 1
        n_test += want[name].count("test")
        n_all += len(rows)
    core_test = {}
    for name in split.CORE:
        if name in tables:
            hdr, rows = tables[name]
            ci, ki = hdr.index("site_class"), hdr.index("kind")
            for r, s in zip(rows, want[name]):
                core_test.setdefault((r[ki], r[ci]), []).append(s)
    for key, mols in classes.items():
        if len(mols) >= 2 and "test" not in core_test[key]:
            print("class %s/%s has no test row" % key)
            fails += 1
    share = n_test / n_all if n_all else 0
    print("rows %d, test %d (%.1f%%), mismatches/failures %d" % (n_all, n_test, 100 * share, fails))
    if not 0.15 <= share <= 0.25:
        print("test share %.3f outside 0.15..0.25" % share)
        fails += 1
    return 1 if fails else 0


if __name__ == "__main__":
    sys.exit(main())
