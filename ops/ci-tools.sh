#!/usr/bin/env bash
# Installs, from Debian's packages, the outside programs the ops tests run, and checks that each
# starts: promtool (prometheus), Chromium and its driver (chromium, chromium-driver), haproxy and
# systemd-analyze (systemd), and the General Decimal Arithmetic test cases that arith@2 is checked
# against (libpython3.11-testsuite ships them for CPython's decimal tests). Safe to run again: it installs only what is missing. Exits non-zero
# when a program cannot be installed or does not start, so that CI fails rather than skips.
set -euo pipefail

declare -A program=(
  [prometheus]=/usr/bin/promtool
  [chromium]=/usr/bin/chromium
  [chromium-driver]=/usr/bin/chromedriver
  [haproxy]=/usr/sbin/haproxy
  [systemd]=/usr/bin/systemd-analyze
  [libpython3.11-testsuite]=/usr/lib/python3.11/test/decimaltestdata/add.decTest
)

need=()
for pkg in "${!program[@]}"; do
  [ -e "${program[$pkg]}" ] || need+=("$pkg")
done
if [ ${#need[@]} -gt 0 ]; then
  sudo_cmd=""
  [ "$(id -u)" -eq 0 ] || sudo_cmd="sudo"
  echo "ci-tools: installing ${need[*]}"
  $sudo_cmd apt-get update -qq
  # prometheus's package would start its server where an init system runs; the tests need only promtool.
  DEBIAN_FRONTEND=noninteractive $sudo_cmd apt-get install -y -qq "${need[@]}" >/dev/null
fi

# Each must start, not just be there.
promtool --version 2>&1 | sed -n 1p
chromium --headless=new --no-sandbox --disable-gpu --dump-dom about:blank >/dev/null 2>&1 \
  || { echo "ci-tools: chromium does not start headless" >&2; exit 1; }
chromium --version
chromedriver --version
haproxy -v | sed -n 1p
systemd-analyze --version | sed -n 1p
[ -r /usr/lib/python3.11/test/decimaltestdata/add.decTest ] \
  || { echo "ci-tools: the decTest cases are not where libpython3.11-testsuite puts them" >&2; exit 1; }
