"""pkad_run.py: runs `pkad predict` over SMILES lines for the CLI checks written in Python."""
import json
import subprocess
import sys


def run_pkad(pkad, lines):
    """One JSON result per input line, in order; exits when pkad itself fails (status 1 only
    says that some record was answered with an error)."""
    p = subprocess.run([pkad, "predict", "--threads", "2", "--no-progress", "-"],
                       input="".join(lines), capture_output=True, text=True, timeout=600)
    if p.returncode not in (0, 1):
        sys.exit("pkad predict exited with %d: %s" % (p.returncode, p.stderr))
    return [json.loads(x) for x in p.stdout.splitlines()]
