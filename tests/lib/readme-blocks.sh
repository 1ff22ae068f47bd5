# SPDX-License-Identifier: MIT
# Code blocks taken out of README.md, so that the scripts which check the
# README's instructions run them as written and cannot drift from them
# (tests/check_install.sh, tests/fresh-machine.sh). Sourced, not run.
#
#   readme_block README LEAD LANGUAGE
#       Prints the first fenced block marked LANGUAGE (```LANGUAGE) that
#       follows the first line of README starting with LEAD, without its
#       fences. Fails, with a note on stderr, when there is none.
#
#   readme_marked README NAME
#       Prints the fenced block that follows the marker line
#       <!-- fresh-machine: NAME --> (only blank lines between them), without
#       its fences. Fails, with a note on stderr, when the marker is missing,
#       appears more than once, or is not followed by a fenced block.
#
# The blocks the scripts use:
#   readme_block README.md "Install the library" sh   the install recipe
#   readme_block README.md "## Using it from C" c      the program it builds
#   readme_marked README.md install      the install recipe (tests/fresh-machine.sh)
#   readme_marked README.md python       installing and calling the Python binding
#   readme_marked README.md sql-install  building and installing the extension
#   readme_marked README.md sql          its SQL (CREATE EXTENSION, the GROUP BY query)

readme_block() {
    local text
    text=$(awk -v lead="$2" -v lang="$3" '
        !found && index($0, lead) == 1 { found = 1; next }
        found && !inside && $0 == "```" lang { inside = 1; next }
        inside && $0 == "```" { exit }
        inside { print }
    ' "$1")
    if [[ -z $text ]]; then
        echo "readme_block: no \`\`\`$3 block after \"$2\" in $1" >&2
        return 1
    fi
    printf '%s\n' "$text"
}

readme_marked() {
    local text status=0
    text=$(awk -v marker="<!-- fresh-machine: $2 -->" '
        $0 == marker { seen++; if (seen == 1) { wait = 1 }; next }
        wait && /^[[:space:]]*$/ { next }
        wait && /^```/ { wait = 0; inside = 1; next }
        wait { wait = 0 }
        inside && /^```[[:space:]]*$/ { inside = 0; done = 1; next }
        inside { print }
        END { if (seen != 1) exit 2; if (!done) exit 3 }
    ' "$1") || status=$?
    case $status in
        0) ;;
        2) echo "readme_marked: marker <!-- fresh-machine: $2 --> not found exactly once in $1" >&2; return 1 ;;
        *) echo "readme_marked: no fenced block right after <!-- fresh-machine: $2 --> in $1" >&2; return 1 ;;
    esac
    if [[ -z $text ]]; then
        echo "readme_marked: the block after <!-- fresh-machine: $2 --> in $1 is empty" >&2
        return 1
    fi
    printf '%s\n' "$text"
}
