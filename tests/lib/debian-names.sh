# SPDX-License-Identifier: MIT
# Debian package names that change between releases, found on the machine
# instead of written into the scripts (Debian 12 ships PostgreSQL 15 and
# clang 14, Debian 13 PostgreSQL 17 and clang 19). Sourced, not run; needs
# tests/lib/apt-missing.sh sourced first (apt_as_root, apt_installed).
#
#   deb_known PACKAGE
#       True when apt knows an installable version of PACKAGE (a real
#       package with a candidate, not only a name something provides).
#   deb_dependency METAPACKAGE REGEX
#       Prints the first "Depends:" of METAPACKAGE whose name matches the
#       extended REGEX (whole name), e.g. deb_dependency postgresql
#       'postgresql-[0-9]+' prints postgresql-17 on Debian 13. Prints
#       nothing when apt does not know METAPACKAGE.
#   deb_pg_major
#       The PostgreSQL major version to build the extension against: the
#       newest one whose server and server headers are both installed, else
#       the one Debian's "postgresql" metapackage depends on. Prints nothing
#       when neither is found.
#   deb_clang_major
#       The major version of the installed clang, else of the clang that
#       Debian's "clang" metapackage depends on. Prints nothing when neither
#       is found.
#   deb_clang_rt_package MAJOR
#       The package carrying clang MAJOR's sanitizer and libFuzzer runtimes:
#       libclang-rt-MAJOR-dev (Debian 12 and later), else
#       libclang-common-MAJOR-dev (where the runtimes lived before), else
#       the unversioned libclang-rt-dev. Prints nothing when apt knows none.
#
# The look-ups read apt's package lists; when those are empty (a container
# image with /var/lib/apt/lists removed) they run apt-get update once first.

deb_lists_ready=no

deb_need_lists() {
    [[ $deb_lists_ready == yes ]] && return 0
    deb_lists_ready=yes
    if ! compgen -G '/var/lib/apt/lists/*_Packages*' >/dev/null; then
        echo "$(basename "$0"): apt's package lists are empty: apt-get update"
        apt_as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null || true
    fi
}

deb_known() {
    deb_need_lists
    local candidate
    candidate=$(apt-cache policy "$1" 2>/dev/null | sed -n 's/^ *Candidate: //p')
    [[ -n $candidate && $candidate != "(none)" ]]
}

deb_dependency() {
    deb_need_lists
    apt-cache depends "$1" 2>/dev/null |
        sed -n 's/^ *|\{0,1\}Depends: //p' | grep -E -x -m 1 "$2" || true
}

deb_pg_major() {
    local dir major newest=""
    for dir in /usr/lib/postgresql/*/bin; do
        major=${dir#/usr/lib/postgresql/}
        major=${major%/bin}
        [[ $major =~ ^[0-9]+$ && -x $dir/postgres && -x $dir/pg_config ]] || continue
        apt_installed "postgresql-server-dev-$major" || continue
        if [[ -z $newest || $major -gt $newest ]]; then
            newest=$major
        fi
    done
    if [[ -z $newest ]]; then
        newest=$(deb_dependency postgresql 'postgresql-[0-9]+')
        newest=${newest#postgresql-}
    fi
    echo "$newest"
}

deb_clang_major() {
    local version
    if command -v clang >/dev/null 2>&1; then
        version=$(clang -dumpversion 2>/dev/null || true)
        version=${version%%.*}
    fi
    if [[ -z ${version:-} ]]; then
        version=$(deb_dependency clang 'clang-[0-9]+')
        version=${version#clang-}
    fi
    echo "${version:-}"
}

deb_clang_rt_package() {
    local p
    for p in "libclang-rt-$1-dev" "libclang-common-$1-dev" libclang-rt-dev; do
        if deb_known "$p"; then
            echo "$p"
            return 0
        fi
    done
}
