# Code blocks taken out of README.md, so that the scripts which check the
# README's instructions run them as written and cannot drift from them
# (tests/check_install.sh, tests/fresh-machine.sh). Sourced, not run.
#
#   readme_block README LEAD LANGUAGE
#       Prints the first fenced block marked LANGUAGE (```LANGUAGE) that
#       follows the first line of README starting with LEAD, without its
#       fences. Fails, with a note on stderr, when there is none.
#
# The blocks the scripts use:
#   readme_block README.md "Install the library" sh   the install recipe
#   readme_block README.md "## Using it from C" c      the program it builds

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
