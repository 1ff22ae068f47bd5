#!/usr/bin/env bash
# SPDX-License-Identifier: MIT
# Cross-architecture check (docs/reliability.md).
#
# For 32-bit x86 (i686, SSE2 arithmetic), 32-bit ARM (arm-linux-gnueabihf)
# and big-endian s390x: build the library and the unit suite with the meson
# cross files in tests/cross/ and run the whole 'unit' suite under
# qemu-user -- every area's tests, the bad-input matrix and the reference
# vectors, which must equal tests/refvectors/expected.txt bit for bit.
# For a Cortex-M4 (arm-none-eabi, -mcpu=cortex-m4 -mthumb): build the
# static library freestanding and link a bare-metal image against it; then
# build the reference-vector program for the M4 (at -O2 and -Os, newlib with
# semihosting), run it on an emulated Cortex-M4 board (qemu-system-arm -M
# mps2-an386) and require the committed vectors bit for bit there too.
# 'minsize' is the host optimised for size (-Os, as firmware is built: the
# range checks then go through one shared function), which must give the
# same vectors too.
#
# Usage: tests/cross.sh [i686] [arm] [s390x] [cortex-m4] [minsize]
#        (default: all)
# Environment: NTR_BUILD_PREFIX (default "build"): build dirs are
# <prefix>-cross-<arch>. Installs what it needs with apt-get when missing
# (cross compilers, qemu-user, and cmocka for each target through Debian
# multiarch; never gcc-multilib, which conflicts with the cross compilers).
# A target whose packages the release's mirror lacks is skipped and said
# so; the script exits 77 (skipped) when every requested target was.
set -euo pipefail
root="$(cd "$(dirname "$0")/.." && pwd)"
cd "$root"
prefix="${NTR_BUILD_PREFIX:-build}-cross"
archs=("$@")
[ ${#archs[@]} -eq 0 ] && archs=(i686 arm s390x cortex-m4 minsize)

source tests/lib/build-steps.sh  # quiet, meson_setup_dir
source tests/lib/apt-missing.sh
source tests/lib/debian-names.sh  # deb_known
need=(meson ninja-build pkg-config)
want_arch() { # Debian multiarch: the target's libcmocka-dev needs its architecture
  if ! dpkg --print-foreign-architectures | grep -qx "$1" && [ "$(dpkg --print-architecture)" != "$1" ]; then
    apt_as_root dpkg --add-architecture "$1"
  fi
}
declare -A arch_need
for a in "${archs[@]}"; do
  case "$a" in
    i686) want_arch i386; arch_need[$a]="gcc-i686-linux-gnu libc6-dev-i386-cross qemu-user libcmocka-dev:i386" ;;
    arm) want_arch armhf; arch_need[$a]="gcc-arm-linux-gnueabihf libc6-dev-armhf-cross qemu-user libcmocka-dev:armhf" ;;
    s390x) want_arch s390x; arch_need[$a]="gcc-s390x-linux-gnu libc6-dev-s390x-cross qemu-user libcmocka-dev:s390x" ;;
    cortex-m4) arch_need[$a]="gcc-arm-none-eabi libnewlib-arm-none-eabi qemu-system-arm" ;;
    minsize) arch_need[$a]="libcmocka-dev" ;;
    *) echo "cross.sh: unknown architecture $a" >&2; exit 2 ;;
  esac
done
# The tools every target needs.
apt_missing --quiet "${need[@]}"
# A target whose packages this release's mirror does not carry (not in the
# package lists, or listed but not downloadable, as when a mirror holds
# fewer architectures than its lists announce) is skipped, said so, and
# counted as skipped (exit 77 when nothing else ran), never as passed. Any
# other failure to install is a failure.
lists_updated=0
skipped=()
failed=()
run_archs=()
for a in "${archs[@]}"; do
  missing=()
  for p in ${arch_need[$a]}; do
    apt_installed "$p" || missing+=("$p")
  done
  if [ ${#missing[@]} -eq 0 ]; then
    run_archs+=("$a")
    continue
  fi
  # (an architecture just added has no package lists yet)
  if [ $lists_updated -eq 0 ]; then
    apt_as_root env DEBIAN_FRONTEND=noninteractive apt-get update -qq >/dev/null || true
    lists_updated=1
  fi
  absent=()
  for p in "${missing[@]}"; do
    deb_known "$p" || absent+=("$p")
  done
  if [ ${#absent[@]} -gt 0 ]; then
    echo "cross.sh: $a SKIPPED: the package mirror has no ${absent[*]}"
    skipped+=("$a")
    continue
  fi
  echo "cross.sh: installing for $a: ${missing[*]}"
  apt_log=$(mktemp)
  if apt_as_root env DEBIAN_FRONTEND=noninteractive \
       apt-get install -y -qq --no-install-recommends "${missing[@]}" >"$apt_log" 2>&1; then
    run_archs+=("$a")
  elif grep -q '^E: Failed to fetch .* 404 ' "$apt_log"; then
    echo "cross.sh: $a SKIPPED: the package mirror lists but cannot deliver" \
      "$(sed -n 's|^E: Failed to fetch [^ ]*/\([^/ ]*\.deb\) .*|\1|p' "$apt_log" | sed 's/%2[bB]/+/g' | tr '\n' ' ')"
    skipped+=("$a")
  else
    cat "$apt_log"
    echo "cross.sh: $a FAILED: its packages did not install"
    failed+=("$a")
  fi
  rm -f "$apt_log"
done
archs=(${run_archs[@]+"${run_archs[@]}"})

# Unit tests under qemu-user run 10 to 30 times slower than natively (the
# long-stream tests of test_correction take about 23 s emulated on a loaded
# two-core machine, against 2 natively): emulated runs get three times the
# native timeouts, so a busy machine cannot fail them by the clock alone.
timeout_scale() {
  if [ "$1" = native ]; then echo 1; else echo 3; fi
}

setup() { # builddir crossfile (or "native": the host at -Os)
  if [ "$2" = native ]; then
    quiet meson_setup_dir "$1" -Dbuildtype=minsize
  else
    quiet meson_setup_dir "$1" --cross-file "$2"
  fi
}

passed=()
for a in ${archs[@]+"${archs[@]}"}; do
  start=$SECONDS
  dir="$prefix-$a"
  case "$a" in
    i686) ini=tests/cross/i686-linux-gnu.ini ;;
    arm) ini=tests/cross/arm-linux-gnueabihf.ini ;;
    s390x) ini=tests/cross/s390x-linux-gnu.ini ;;
    cortex-m4) ini=tests/cross/arm-none-eabi-cortex-m4.ini ;;
    minsize) ini=native ;;
  esac
  if [ "$a" = cortex-m4 ]; then
    if setup "$dir" "$ini" && quiet ninja -C "$dir" lib/libnatremia.a &&
       arm-none-eabi-gcc -std=c99 -Os -mcpu=cortex-m4 -mthumb -mfloat-abi=hard -mfpu=fpv4-sp-d16 \
         -ffreestanding -Wall -Wextra -Werror -Iinclude tests/cross/cortex_m4_image.c \
         "$dir/lib/libnatremia.a" --specs=nosys.specs -Wl,--gc-sections -o "$dir/natremia-m4.elf"; then
      # The library may import only libgcc's soft-double helpers and the four
      # functions GCC requires of every freestanding environment (memcpy,
      # memset, memmove, memcmp: struct copies and clears).
      imports=$(arm-none-eabi-nm -u "$dir/lib/libnatremia.a" | awk 'NF==2{print $2}' | sort -u |
                grep -v -E '^(__aeabi_|ntr_|ntri_|memcpy$|memset$|memmove$|memcmp$)' || true)
      if [ -n "$imports" ]; then
        echo "cross.sh: cortex-m4 library imports $imports"; failed+=("$a")
      else
        lib_text=$(arm-none-eabi-size -t "$dir/lib/libnatremia.a" | awk 'END{print $1}')
        img=$(arm-none-eabi-size "$dir/natremia-m4.elf" | awk 'NR==2{print "text " $1 ", data " $2 ", bss " $3}')
        echo "cross.sh: cortex-m4: library builds freestanding (${lib_text} bytes of code, no data), image links ($img bytes)"
        # The reference vectors on an emulated Cortex-M4 (soft double
        # arithmetic from libgcc), optimised for speed and for size.
        m4_ok=1
        for opt in -O2 -Os; do
          elf="$dir/refvectors-m4$opt.elf"
          if ! quiet arm-none-eabi-gcc -std=c99 "$opt" -mcpu=cortex-m4 -mthumb -mfloat-abi=hard \
                 -mfpu=fpv4-sp-d16 -ffp-contract=off -Iinclude -Ilib -Itests/fuzz lib/*.c \
                 tests/fuzz/ntr_contract.c tests/refvectors/refvectors.c tests/cross/cortex_m4_start.c \
                 --specs=rdimon.specs -Wl,--section-start=.vectors=0 -lm -o "$elf"; then
            m4_ok=0
            continue
          fi
          if timeout 600 qemu-system-arm -M mps2-an386 -nographic -semihosting -kernel "$elf" \
               >"$dir/refvectors-m4$opt.txt" 2>&1 &&
             cmp -s "$dir/refvectors-m4$opt.txt" tests/refvectors/expected.txt; then
            echo "cross.sh: cortex-m4 $opt: reference vectors identical under qemu-system-arm (mps2-an386, $(wc -l <tests/refvectors/expected.txt) lines)"
          else
            diff "$dir/refvectors-m4$opt.txt" tests/refvectors/expected.txt | head -10 || true
            echo "cross.sh: cortex-m4 $opt: reference vectors DIFFER"
            m4_ok=0
          fi
        done
        if [ $m4_ok -eq 1 ]; then
          echo "cross.sh: cortex-m4 passes [$((SECONDS - start))s]"
          passed+=("$a")
        else
          failed+=("$a")
        fi
      fi
    else
      echo "cross.sh: cortex-m4 build FAILED"; failed+=("$a")
    fi
    continue
  fi
  if setup "$dir" "$ini" && quiet ninja -C "$dir" &&
     meson test -C "$dir" --suite unit --num-processes 2 --timeout-multiplier "$(timeout_scale "$ini")" \
       --print-errorlogs >"$dir/cross-test.log" 2>&1; then
    summary=$(grep -E '^Ok:' "$dir/cross-test.log" | tr -s ' ')
    if [ "$ini" = native ]; then
      how="natively at -Os"
    else
      how="under $(grep "^exe_wrapper" "$ini" | grep -o "qemu-[a-z0-9]*" | head -n 1)"
    fi
    echo "cross.sh: $a: unit suite passes $how, reference vectors identical ($summary) [$((SECONDS - start))s]"
    passed+=("$a")
  else
    echo "cross.sh: $a FAILED (log: $dir/cross-test.log)"
    grep -E 'FAIL|differs|expected:|computed:' "$dir/cross-test.log" | head -20 || true
    failed+=("$a")
  fi
done
names=()
[ ${#passed[@]} -eq 0 ] || names+=("passed: ${passed[*]}")
[ ${#failed[@]} -eq 0 ] || names+=("failed: ${failed[*]}")
[ ${#skipped[@]} -eq 0 ] || names+=("skipped: ${skipped[*]}")
echo "cross.sh: ${#passed[@]} passed, ${#failed[@]} failed, ${#skipped[@]} skipped ($(IFS=';'; echo "${names[*]}" | sed 's/;/; /g'))"
[ ${#failed[@]} -eq 0 ] || exit 1
# only skipped targets (none ran): meson counts the test as skipped
[ ${#passed[@]} -gt 0 ] || exit 77
