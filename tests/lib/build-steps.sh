# SPDX-License-Identifier: MIT
# Steps shared by the scripts that make builds of their own (tests/run-all.sh,
# tests/cross.sh, tests/sanitize.sh, tests/coverage.sh,
# tests/static-analysis.sh). Sourced, not run.
#
#   quiet COMMAND...
#       Runs COMMAND (a program or a shell function) with its output kept
#       back, shown only when it fails; returns COMMAND's failure as 1.
#   meson_setup_dir BUILDDIR MESON-SETUP-OPTION...
#       Configures BUILDDIR with the options: reconfigures a build dir
#       meson already knows (wiping it when that fails, e.g. after a meson
#       upgrade), otherwise removes whatever is there and sets it up anew.

quiet() {
    local log
    log=$(mktemp)
    if "$@" >"$log" 2>&1; then
        rm -f "$log"
    else
        cat "$log"
        rm -f "$log"
        return 1
    fi
}

meson_setup_dir() {
    local dir="$1"
    shift
    if [[ -f "$dir/meson-private/coredata.dat" ]]; then
        meson setup --reconfigure "$dir" "$@" || meson setup --wipe "$dir" "$@"
    else
        rm -rf "$dir"
        meson setup "$dir" "$@"
    fi
}
