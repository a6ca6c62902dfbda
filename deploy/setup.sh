#!/usr/bin/env bash
# Installs the Debian packages pkad needs to build, run and test; does nothing when all are present.
set -euo pipefail
build_pkgs="build-essential cmake pkg-config libopenbabel-dev openbabel libmicrohttpd-dev libcjson-dev liblapacke-dev"
test_pkgs="rdkit-data python3-rdkit python3-openbabel default-jre-headless libopsin-java curl wrk valgrind nodejs npm clang"
want="$build_pkgs"
[ "${1:-}" = "--test" ] && want="$build_pkgs $test_pkgs"
# Some tools may come from elsewhere than Debian (a Node.js build that ships npm, a JDK):
# a package whose command is already on PATH is not installed again.
command_of() {
  case "$1" in
    nodejs) echo node ;;
    npm) echo npm ;;
    default-jre-headless) echo java ;;
    *) echo "" ;;
  esac
}
missing=""
for p in $want; do
  cmd=$(command_of "$p")
  if [ -n "$cmd" ] && command -v "$cmd" >/dev/null 2>&1; then
    continue
  fi
  dpkg-query -W -f='${Status}' "$p" 2>/dev/null | grep -q "install ok installed" || missing="$missing $p"
done
if [ -z "$missing" ]; then
  echo "setup: all packages present"
  exit 0
fi
echo "setup: installing$missing"
sudo=""
[ "$(id -u)" -eq 0 ] || sudo="sudo"
$sudo apt-get update -qq
DEBIAN_FRONTEND=noninteractive $sudo apt-get install -y -qq --no-install-recommends $missing
