# SPDX-License-Identifier: MIT
# Installing the Debian packages a script needs, only when some are missing.
# Sourced (not run) by the scripts that set up their own tools:
# tests/run-all.sh, examples/run-demo.sh, tests/cross.sh, tests/sanitize.sh,
# tests/coverage.sh and tests/static-analysis.sh.
#
#   apt_missing [--quiet] [APT-GET-INSTALL-OPTION...] [--] PACKAGE...
#       Checks each PACKAGE with dpkg-query (NAME or NAME:ARCH) and, when any
#       is not installed, says which on stdout, then runs apt-get update and
#       apt-get install -y for those alone. Nothing runs when all are there.
#       --quiet hides apt-get's own output (shown only through the exit
#       status); other options before the packages go to apt-get install.
#       Recommended packages are never installed: every script names what
#       it needs, and recommends drag in extras (a mail server through
#       cron, plotting and compiler stacks through the Python packages)
#       that only lengthen the install and add ways for it to fail.
#   apt_as_root COMMAND...
#       Runs COMMAND as root: directly when already root, through sudo
#       otherwise; fails with a note when neither is possible.
#   apt_installed PACKAGE
#       True when dpkg reports PACKAGE installed.

apt_installed() {
    [[ $(dpkg-query -W -f='${Status}' "$1" 2>/dev/null || true) == *"ok installed"* ]]
}

apt_as_root() {
    if [[ $(id -u) -eq 0 ]]; then
        "$@"
    elif command -v sudo >/dev/null 2>&1; then
        sudo "$@"
    else
        echo "$(basename "$0"): not root and no sudo: cannot run $*" >&2
        return 1
    fi
}

apt_missing() {
    local quiet=0 options=() missing=() p
    while [[ $# -gt 0 && $1 == -* ]]; do
        case $1 in
            --quiet) quiet=1 ;;
            --) shift; break ;;
            *) options+=("$1") ;;
        esac
        shift
    done
    for p in "$@"; do
        apt_installed "$p" || missing+=("$p")
    done
    [[ ${#missing[@]} -eq 0 ]] && return 0
    echo "$(basename "$0"): installing missing Debian packages: ${missing[*]}"
    if [[ $(id -u) -ne 0 ]] && ! command -v sudo >/dev/null 2>&1; then
        echo "Not root and no sudo: please install ${missing[*]}" >&2
        return 1
    fi
    if [[ $quiet -eq 1 ]]; then
        apt_as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null
        apt_as_root env DEBIAN_FRONTEND=noninteractive \
            apt-get install -y -qq --no-install-recommends "${options[@]}" "${missing[@]}" >/dev/null
    else
        apt_as_root env DEBIAN_FRONTEND=noninteractive apt-get update
        apt_as_root env DEBIAN_FRONTEND=noninteractive \
            apt-get install -y --no-install-recommends "${options[@]}" "${missing[@]}"
    fi
}
