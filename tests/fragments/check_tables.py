# SPDX-License-Identifier: MIT
"""check_tables.py: checks fragments/*.tsv against their format and the shared reference data.

(a) every SMARTS parses in Open Babel (RDKit, when present, is a second opinion: warnings only);
(b) coverage: for each row of handbook-acids.csv / handbook-bases.csv the site rows, applied the
    way the engine applies them, give a site of the right kind whose group belongs to the
    handbook's site_class; per-class coverage is printed;
(c) no duplicate ids, right columns, known values, corrections name existing sites;
(d) every substituent row copied from substituent-constants.csv claims its smiles_fragment
    attached to benzene, rooted at the attachment atom, and carries the same constants.
Run with /usr/bin/python3; exits 77 (CTest skip) when the Open Babel Python module is missing.
The source tree comes from PKAD_SOURCE_DIR; handbook rows from its data/handbook-*.csv and
constants from data/reference/substituent-constants.csv (PKAD_SHARED_DATA overrides both).
"""
import csv
import os
import re
import sys

try:
    from openbabel import openbabel as ob
    from openbabel import pybel
except ImportError:
    print("skip: python3-openbabel is not installed (apt-get install python3-openbabel)")
    sys.exit(77)

ob.obErrorLog.StopLogging()
SRC = os.environ.get("PKAD_SOURCE_DIR", os.path.join(os.path.dirname(__file__), "..", ".."))
FRAG = os.path.join(SRC, "fragments")
COLUMNS = {
    "sites.tsv": ["id", "kind", "group", "smarts", "centre", "parent", "rho", "rho_para",
                  "sigma_para", "rho_star", "unc", "charge_scale", "source"],
    "substituents.tsv": ["id", "smarts", "sigma_m", "sigma_p", "sigma_p_minus", "sigma_p_plus",
                         "sigma_star", "sigma_i", "transparent", "source"],
    "corrections.tsv": ["id", "term", "sites", "smarts", "value", "unc", "count", "source"],
}
# handbook site_class -> site groups that answer it (kind "any": either kind)
CLASS_GROUPS = {
    "carboxylic_acid": {"carboxylic_acid", "benzoic_acid"},
    "dicarboxylic_acid": {"carboxylic_acid", "benzoic_acid"},
    "tricarboxylic_acid": {"carboxylic_acid"},
    "benzoic_acid": {"benzoic_acid"},
    "phenol": {"phenol"}, "polynitrophenol": {"phenol"},
    "alcohol": {"alcohol"}, "amide": {"amide"}, "c_h_acid": {"c_h_acid"},
    "vinylogous_acid": {"vinylogous_acid"},
    "sulfonamide": {"sulfonamide"}, "thiol": {"thiol"}, "thiophenol": {"thiophenol"},
    "barbiturate": {"barbiturate"}, "hydantoin": {"hydantoin"},
    "amino_acid_zwitterion": {"carboxylic_acid", "primary_amine", "secondary_amine", "guanidine"},
    "phosphonic_acid": {"phosphonic_acid", "phosphinic_acid"},
    "phosphate_ester": {"phosphate_ester"},
    "water_like": {"water_like", "water"},
    "hydroxamic_acid": {"hydroxamic_acid"}, "oxime": {"oxime"},
    "imide": {"imide", "acyl_sulfonamide", "sulfonimide"},
    "hydroperoxide": {"hydroperoxide"},
    "primary_amine": {"primary_amine"}, "secondary_amine": {"secondary_amine"},
    "tertiary_amine": {"tertiary_amine"}, "aniline": {"aniline"},
    "pyridine": {"pyridine", "quinoline"},  # the handbook files 1,10-phenanthroline as pyridine
    "quinoline": {"quinoline", "isoquinoline"}, "oxygen_base": {"oxygen_base", "water"},
    "imidazole": {"imidazole"}, "hydrazine": {"hydrazine"}, "pyrimidine": {"pyrimidine"},
    "azole": {"pyrazole", "triazole", "thiazole", "oxazole"}, "pyrazine": {"pyrazine"},
    "pyridazine": {"pyridazine"}, "guanidine": {"guanidine"}, "amidine": {"amidine"},
    "triazine": {"triazine"}, "hydroxylamine": {"hydroxylamine"}, "amidoxime": {"amidoxime"},
    "n_oxide": {"n_oxide"}, "ammonia": {"ammonia"},
}
ANY_KIND = {"amino_acid_zwitterion"}
# handbook rows the tables knowingly do not answer as the handbook labels them, with the reason
KNOWN_GAPS = {
    ("creatinine", "amidine"): "acylguanidine in a ring: perceived as guanidine (N-acyl term)",
}  # tests/predictor/test_handbook.c also lists rows whose predicted step order differs
SOURCE_WORDS = re.compile(r"from memory|common practice|estimate|IUPAC|HLT1991|Taft|PDS1981|"
                          r"Perrin|Serjeant|Hammett|csv|Clark|DEVELOPERS|attenuation", re.I)


class Report:
    def __init__(self):
        self.errors = 0

    def fail(self, msg):
        self.errors += 1
        print("FAIL " + msg)


def read_table(name, rep):
    """Rows of a fragment table as dicts with their line numbers; checks the header."""
    path = os.path.join(FRAG, name)
    rows, header = [], None
    with open(path, encoding="utf-8") as f:
        for lineno, line in enumerate(f, 1):
            line = line.rstrip("\n")
            if not line.strip() or line.startswith("#"):
                continue
            fields = line.split("\t")
            if header is None:
                header = fields
                if header != COLUMNS[name]:
                    rep.fail(f"fragments/{name}:{lineno}: header {header} != {COLUMNS[name]}")
                continue
            if len(fields) != len(header):
                rep.fail(f"fragments/{name}:{lineno}: expected {len(header)} columns, got {len(fields)}")
                continue
            row = dict(zip(header, fields))
            row["line"] = lineno
            rows.append(row)
    return rows


def compile_smarts(name, rows, rep):
    """(a): one OBSmartsPattern per row; RDKit disagreement is printed as a warning."""
    try:
        from rdkit import Chem, RDLogger
        RDLogger.DisableLog("rdApp.*")
    except ImportError:
        Chem = None
    for r in rows:
        pat = ob.OBSmartsPattern()
        if r["smarts"] in ("", None) or not pat.Init(r["smarts"]):
            rep.fail(f"fragments/{name}:{r['line']}: Open Babel cannot parse SMARTS '{r['smarts']}'")
            r["pat"] = None
            continue
        r["pat"] = pat
        if Chem is not None and Chem.MolFromSmarts(r["smarts"]) is None:
            print(f"warning fragments/{name}:{r['line']}: RDKit cannot parse '{r['smarts']}'")


def number(rep, name, r, col, blank_ok=False):
    v = r[col]
    if v == "" and blank_ok:
        return None
    try:
        return float(v)
    except ValueError:
        rep.fail(f"fragments/{name}:{r['line']}: {col} '{v}' is not a number")
        return None


def check_fields(tables, rep):
    """(c): duplicate ids, values, sources, correction targets."""
    for name, rows in tables.items():
        seen = {}
        for r in rows:
            if r["id"] in seen:
                rep.fail(f"fragments/{name}:{r['line']}: duplicate id '{r['id']}' (first at line {seen[r['id']]})")
            seen[r["id"]] = r["line"]
            if not SOURCE_WORDS.search(r["source"]):
                rep.fail(f"fragments/{name}:{r['line']}: source '{r['source']}' names no source")
    earlier = set()
    for r in tables["sites.tsv"]:
        for col in ("centre", "rho", "rho_star", "unc"):
            number(rep, "sites.tsv", r, col)
        if r["parent"].startswith("="):
            if r["parent"][1:] not in earlier:
                rep.fail(f"fragments/sites.tsv:{r['line']}: parent '{r['parent']}' names no earlier row")
        else:
            number(rep, "sites.tsv", r, "parent")
        earlier.add(r["id"])
        number(rep, "sites.tsv", r, "rho_para", blank_ok=True)
        number(rep, "sites.tsv", r, "charge_scale", blank_ok=True)
        if r["kind"] not in ("acid", "base"):
            rep.fail(f"fragments/sites.tsv:{r['line']}: kind '{r['kind']}'")
        if r["sigma_para"] not in ("sigma", "sigma_minus", "sigma_plus"):
            rep.fail(f"fragments/sites.tsv:{r['line']}: sigma_para '{r['sigma_para']}'")
        if r.get("pat") and not 0 <= int(r["centre"]) < r["pat"].NumAtoms():
            rep.fail(f"fragments/sites.tsv:{r['line']}: centre {r['centre']} outside the pattern")
    for r in tables["substituents.tsv"]:
        for col in ("sigma_m", "sigma_p", "sigma_i"):
            number(rep, "substituents.tsv", r, col)
        for col in ("sigma_p_minus", "sigma_p_plus", "sigma_star"):
            number(rep, "substituents.tsv", r, col, blank_ok=True)
        if r["transparent"] not in ("0", "1"):
            rep.fail(f"fragments/substituents.tsv:{r['line']}: transparent '{r['transparent']}'")
    names = {r["id"] for r in tables["sites.tsv"]} | {r["group"] for r in tables["sites.tsv"]}
    for r in tables["corrections.tsv"]:
        number(rep, "corrections.tsv", r, "value")
        number(rep, "corrections.tsv", r, "unc")
        if r["count"] not in ("site", "match"):
            rep.fail(f"fragments/corrections.tsv:{r['line']}: count '{r['count']}'")
        for s in r["sites"].split(","):
            if s != "*" and s not in names:
                rep.fail(f"fragments/corrections.tsv:{r['line']}: unknown site '{s}'")


def read_mol(smiles):
    return pybel.readstring("smi", smiles).OBMol


def matches(pat, mol):
    """Every match of a compiled pattern as a list of 0-based atom indices."""
    pat.Match(mol)
    return [[i - 1 for i in m] for m in pat.GetUMapList()]


def perceive(site_rows, mol):
    """The engine's rule: rows in file order; the first row matching an atom claims it per kind."""
    sites, taken = [], set()
    for r in site_rows:
        if r["pat"] is None:
            continue
        for m in matches(r["pat"], mol):
            key = (m[0], r["kind"])
            if key not in taken:
                taken.add(key)
                sites.append((m[0], r))
    return sites


def claims(subst_rows, mol):
    """The engine's claim rule: groups in file order; a match claims only free atoms."""
    group, root = {}, {}
    for r in subst_rows:
        if r["pat"] is None:
            continue
        for m in matches(r["pat"], mol):
            if all(a not in group for a in m):
                for a in m:
                    group[a], root[a] = r["id"], m[0]
    return group, root


HANDBOOKS = ("handbook-acids.csv", "handbook-bases.csv", "handbook-additions.csv")


def data_file(name):
    """Path of a reference file: $PKAD_SHARED_DATA, else data/ or data/reference/; None if absent."""
    dirs = [os.environ["PKAD_SHARED_DATA"]] if os.environ.get("PKAD_SHARED_DATA") else \
        [os.path.join(SRC, "data"), os.path.join(SRC, "data", "reference")]
    for d in dirs:
        if os.path.isfile(os.path.join(d, name)):
            return os.path.join(d, name)
    return None


def check_substituents(rows, rep):
    """(d): rows citing 'substituent-constants.csv NAME' claim NAME on benzene, same constants."""
    path = data_file("substituent-constants.csv")
    if path is None:
        rep.fail("substituents: data/reference/substituent-constants.csv not found")
        return
    ref = {r["substituent"]: r for r in csv.DictReader(open(path))}
    checked = 0
    for r in rows:
        m = re.match(r"substituent-constants\.csv (\S+):", r["source"])
        if not m:
            continue
        name = m.group(1)
        if name not in ref:
            rep.fail(f"fragments/substituents.tsv:{r['line']}: '{name}' is not in substituent-constants.csv")
            continue
        frag = ref[name]["smiles_fragment"]
        mol = read_mol("c1ccccc1" + frag)
        group, root = claims(rows, mol)
        if group.get(6) != r["id"] or root.get(6) != 6:
            rep.fail(f"substituents: {name} ({frag}) on benzene is claimed by {group.get(6)} "
                     f"rooted at {root.get(6)}, expected {r['id']} rooted at the attachment atom")
        for col in ("sigma_m", "sigma_p", "sigma_p_minus", "sigma_p_plus", "sigma_i"):
            want = ref[name][col]
            if want and (r[col] == "" or abs(float(r[col]) - float(want)) > 1e-9):
                rep.fail(f"fragments/substituents.tsv:{r['line']}: {col} {r[col]} != {want} of {name}")
        checked += 1
    print(f"substituents: {checked} rows checked against substituent-constants.csv on benzene")
    if checked < 40:
        rep.fail(f"substituents: only {checked} rows cite substituent-constants.csv")


def coverage(site_rows, rep):
    """(b): each handbook row gets a site of its kind whose group answers its site_class."""
    per_class = {}
    for fname in HANDBOOKS:
        path = data_file(fname)
        if path is None:
            rep.fail(f"coverage: data/{fname} not found")
            continue
        for h in csv.DictReader(open(path)):
            cls, kind = h["site_class"], h["kind"]
            groups = CLASS_GROUPS.get(cls)
            if groups is None:
                rep.fail(f"coverage: handbook site_class '{cls}' has no mapping")
                continue
            found = [(a, r) for a, r in perceive(site_rows, read_mol(h["smiles"]))
                     if r["group"] in groups and (cls in ANY_KIND or r["kind"] == kind)]
            ok = len(found) > 0
            tally = per_class.setdefault(cls, [0, 0])
            tally[0] += ok
            tally[1] += 1
            if not ok and (h["name"], cls) not in KNOWN_GAPS:
                rep.fail(f"coverage: {fname} '{h['name']}' {h['smiles']} ({cls}, {kind}): no site of {sorted(groups)}")
            elif not ok:
                print(f"known gap: {h['name']} ({cls}): {KNOWN_GAPS[(h['name'], cls)]}")
    for cls in sorted(per_class):
        ok, n = per_class[cls]
        print(f"coverage {cls:24s} {ok:3d}/{n:3d}")


def unused_rows(site_rows):
    """Informational: site rows that no molecule of the IUPAC set (data/iupac-pka.csv) matches."""
    used = set()
    path = data_file("iupac-pka.csv")
    for r in csv.DictReader(open(path)) if path else []:
        try:
            mol = read_mol(r["smiles"])
        except OSError:
            continue
        used.update(s["id"] for _, s in perceive(site_rows, mol))
    idle = [r["id"] for r in site_rows if r["id"] not in used]
    print(f"site rows matching no IUPAC molecule ({len(idle)}): {' '.join(idle)}")


def selftest():
    """The checks themselves: a copy of the tables with one fault of each kind must fail each."""
    import shutil
    import tempfile
    global FRAG
    tmp = tempfile.mkdtemp(prefix="pkad-frag-")
    try:
        for name in COLUMNS:
            shutil.copy(os.path.join(FRAG, name), tmp)
        faults = {
            "sites.tsv": lambda t: t + t.splitlines()[-1] + "\n",        # duplicate id
            "corrections.tsv": lambda t: t + "bad\tortho\t*\t[C;\t0\t0\tsite\tcommon practice\n",
            "substituents.tsv": lambda t: t + "short\t[Cl]\t0.1\n",      # column count
        }
        for name, inject in faults.items():
            path = os.path.join(tmp, name)
            text = open(path, encoding="utf-8").read()
            open(path, "w", encoding="utf-8").write(inject(text))
        FRAG = tmp
        out = []
        rep = Report()
        rep.fail = lambda msg: out.append(msg)
        tables = {name: read_table(name, rep) for name in COLUMNS}
        for name, rows in tables.items():
            compile_smarts(name, rows, rep)
        check_fields(tables, rep)
    finally:
        shutil.rmtree(tmp)
    wanted = ["duplicate id", "cannot parse SMARTS", "expected 10 columns"]
    missing = [w for w in wanted if not any(w in m for m in out)]
    for w in missing:
        print(f"FAIL selftest: an injected fault was not reported: {w}")
    print(f"selftest: {len(out)} faults reported, {len(wanted) - len(missing)}/{len(wanted)} expected kinds")
    return 1 if missing else 0


def main():
    if "--selftest" in sys.argv:
        return selftest()
    rep = Report()
    tables = {name: read_table(name, rep) for name in COLUMNS}
    for name, rows in tables.items():
        compile_smarts(name, rows, rep)
    check_fields(tables, rep)
    check_substituents(tables["substituents.tsv"], rep)
    coverage(tables["sites.tsv"], rep)
    if "--unused" in sys.argv:
        unused_rows(tables["sites.tsv"])
    counts = ", ".join(f"{len(v)} {k}" for k, v in tables.items())
    print(f"{counts}; {rep.errors} failures")
    return 1 if rep.errors else 0


if __name__ == "__main__":
    sys.exit(main())
