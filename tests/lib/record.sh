# SPDX-License-Identifier: MIT
# Shell side of tests/lib/record_block.py, for the scripts' --record option:
# their measured figures go into docs/reliability.md, between the markers of
# the script's own block, stamped with the commit, the date and the command.
#
#   source tests/lib/record.sh
#   record_stamp FILE          # when the measurement begins
#   echo BODY | record_write NAME SCRIPT COMMAND SUMMARY SECTION FILE
#   meson_counts LOG           # "N ok, N skipped" from a meson test log

_record_lib=$(cd "$(dirname "${BASH_SOURCE[0]}")" && pwd)

# record_stamp FILE: the commit and date the measurement starts from.
record_stamp() {
  /usr/bin/python3 "$_record_lib/record_block.py" stamp >"$1"
}

# record_write NAME SCRIPT COMMAND SUMMARY SECTION STAMPFILE < BODY
record_write() {
  /usr/bin/python3 "$_record_lib/record_block.py" write --name "$1" --script "$2" \
    --command "$3" --summary "$4" --section "$5" --stamp-file "$6"
}

# meson_counts LOG: the counts of meson test's closing summary, as
# "N tests: N ok, N skipped" (failures are not recorded: a script records
# only a run that passed).
meson_counts() {
  local ok skip
  ok=$(sed -n 's/^Ok: *\([0-9]*\).*/\1/p' "$1" | tail -1)
  skip=$(sed -n 's/^Skipped: *\([0-9]*\).*/\1/p' "$1" | tail -1)
  echo "$(( ${ok:-0} + ${skip:-0} )) tests: ${ok:-0} passed, ${skip:-0} skipped"
}
