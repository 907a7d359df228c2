#!/usr/bin/env bash
# Installs what building, running and testing Reckoner needs on a fresh Debian or Ubuntu machine:
# a JDK (17 or newer) and Maven. Safe to run again: it installs only what is missing.
# Needs root (or sudo) only when something must be installed.
set -euo pipefail

need=()
if ! command -v java >/dev/null 2>&1 || ! java -version 2>&1 | grep -Eq 'version "(1[7-9]|[2-9][0-9])'; then
  need+=(openjdk-17-jdk-headless)
fi
command -v mvn >/dev/null 2>&1 || need+=(maven)
command -v curl >/dev/null 2>&1 || need+=(curl)

if [ ${#need[@]} -gt 0 ]; then
  sudo_cmd=""
  [ "$(id -u)" -eq 0 ] || sudo_cmd="sudo"
  echo "prepare-machine: installing ${need[*]}"
  $sudo_cmd apt-get update -qq
  DEBIAN_FRONTEND=noninteractive $sudo_cmd apt-get install -y -qq "${need[@]}" >/dev/null
fi
java -version 2>&1 | sed -n 1p  # sed reads to the end: head would close the pipe early, and pipefail would fail the script
mvn -version 2>&1 | sed -n 1p
