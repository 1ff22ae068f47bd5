#!/usr/bin/python3
# SPDX-License-Identifier: MIT
"""Code size and stack use of natremia built for a Cortex-M4 (issue P7).

Compiles every source that lib/meson.build lists with
    arm-none-eabi-gcc -std=c99 -Os -mcpu=cortex-m4 -mthumb
        -ffunction-sections -fdata-sections -fstack-usage -fcallgraph-info=su
then measures
  * code size: .text* + .rodata* of all objects (arm-none-eabi-size -A),
    and writable data (.data*, .bss*), which must be zero;
  * the largest stack frame of any exported entry point (from the .su files)
    and, for information, the deepest call chain inside the library (frames
    summed along the call graph from the .ci files; the libgcc
    double-precision helpers the chain ends in are listed, not counted);
  * for information, linked images (--gc-sections) that keep every entry
    point, or only the core formulas, or what a sodium-watching infusion
    pump calls, with the bytes from the library and from libgcc's
    soft-float helpers (double arithmetic on a Cortex-M4) read off the map.

Usage: firmware.py SOURCE_ROOT WORK_DIR  -> prints JSON on stdout.
"""
import json
import os
import re
import subprocess
import sys

CC = "arm-none-eabi-gcc"
FLAGS = ["-std=c99", "-Os", "-mcpu=cortex-m4", "-mthumb",
         "-ffunction-sections", "-fdata-sections", "-fstack-usage",
         "-fcallgraph-info=su", "-ffp-contract=off",
         "-Wall", "-Wextra", "-Werror", "-DNTR_BUILDING"]


def library_sources(root):
    text = open(os.path.join(root, "lib", "meson.build")).read()
    block = re.search(r"natremia_sources\s*=\s*files\((.*?)\)", text, re.S)
    names = re.findall(r"'([^']+\.c)'", block.group(1))
    return [os.path.join(root, "lib", n) for n in names]


def run(cmd, cwd):
    done = subprocess.run(cmd, cwd=cwd, capture_output=True, text=True)
    if done.returncode != 0:
        sys.stderr.write(done.stdout + done.stderr)
        raise SystemExit("firmware.py: failed: " + " ".join(cmd))
    return done.stdout


def section_sizes(path, cwd):
    """Sum of section sizes by class from `arm-none-eabi-size -A`."""
    sums = {"text": 0, "rodata": 0, "data": 0, "bss": 0}
    for line in run(["arm-none-eabi-size", "-A", path], cwd).splitlines():
        parts = line.split()
        if len(parts) < 2 or not parts[1].isdigit():
            continue
        name, size = parts[0], int(parts[1])
        for cls in sums:
            if name == "." + cls or name.startswith("." + cls + "."):
                sums[cls] += size
    return sums


def exported(objects, cwd):
    names = set()
    out = run(["arm-none-eabi-nm", "-g", "--defined-only"] + objects, cwd)
    for line in out.splitlines():
        parts = line.split()
        if len(parts) == 3 and parts[1] == "T" and parts[2].startswith("ntr_"):
            names.add(parts[2])
    return sorted(names)


def stack_frames(su_files):
    frames = {}
    for path in su_files:
        for line in open(path):
            where, size, kind = line.rstrip("\n").split("\t")
            name = where.rsplit(":", 1)[1]
            if name in frames and frames[name][0] > int(size):
                continue  # same static name in two files: keep the larger
            frames[name] = (int(size), kind)
    return frames


def bare(title):
    """Static functions appear in the .ci files as "path/file.c:name"."""
    return title.rsplit(":", 1)[-1]


def call_graph(ci_files):
    edges = {}
    node_re = re.compile(r'node: \{ title: "([^"]+)"')
    edge_re = re.compile(r'edge: \{ sourcename: "([^"]+)" targetname: "([^"]+)"')
    for path in ci_files:
        for line in open(path):
            m = edge_re.search(line)
            if m:
                edges.setdefault(bare(m.group(1)), set()).add(bare(m.group(2)))
                continue
            m = node_re.search(line)
            if m:
                edges.setdefault(bare(m.group(1)), set())
    return edges


def deepest_chain(name, frames, edges, seen=()):
    """(bytes, chain, external callees) of the deepest path from `name`."""
    own = frames.get(name, (0, "external"))[0]
    best = (0, [], set())
    external = set()
    for callee in sorted(edges.get(name, ())):
        if callee in seen:
            continue  # recursion would be unbounded; the library has none
        if callee not in frames:
            external.add(callee)
            continue
        sub = deepest_chain(callee, frames, edges, seen + (name,))
        external |= sub[2]
        if sub[0] > best[0]:
            best = sub
    return own + best[0], [name] + best[1], external


# The P1 formulas (the core a meter or a calculator needs) and what an
# infusion pump that watches a sodium series would call on top of them.
CORE = ["ntr_status_message", "ntr_unit_parse", "ntr_convert",
        "ntr_osm_calculated", "ntr_osm_effective", "ntr_osm_gap",
        "ntr_na_corrected_glucose", "ntr_na_corrected_glucose_factor",
        "ntr_na_deficit", "ntr_tbw_fraction", "ntr_tbw_watson",
        "ntr_free_water_deficit", "ntr_fluid_preset",
        "ntr_infusate_change_per_litre", "ntr_infusate_change",
        "ntr_infusate_volume_for_change", "ntr_furst_ratio",
        "ntr_restriction_from_ratio", "ntr_efwc"]
PUMP = CORE + ["ntr_limits_preset", "ntr_ods_risk", "ntr_watch_init",
               "ntr_watch_push", "ntr_watch_result", "ntr_balance_predict",
               "ntr_plan_check", "ntr_relower_estimate"]


def profile_sets(names):
    return {"every entry point": names,
            "core formulas (P1)": [n for n in CORE if n in names],
            "pump: core + limits, watcher, balance, plan check":
                [n for n in PUMP if n in names]}


MAP_ENTRY = re.compile(
    r"^ (\.(?:text|rodata)\S*)\s+0x[0-9a-f]+\s+0x([0-9a-f]+)\s+(\S+)", re.M)


def link_profile(work, profile, keep):
    """Bytes of .text + .rodata in a linked image keeping `keep`: from the
    library and from everything else (libgcc, newlib), read off the map."""
    elf = "profile.elf"
    link = [CC, "-mcpu=cortex-m4", "-mthumb", "-nostartfiles",
            "-Wl,--gc-sections", "-Wl,-e," + keep[0], "--specs=nosys.specs",
            "-Wl,-Map=profile.map"]
    link += ["-Wl,-u," + n for n in keep]
    link += ["libnatremia-m4.a", "-lgcc", "-o", elf]
    run(link, work)
    text = open(os.path.join(work, "profile.map")).read()
    # Input sections sit on one line, or the name alone on the line before.
    text = re.sub(r"^ (\.\S+)\n\s+", r" \1 ", text, flags=re.M)
    start = text.index("Linker script and memory map")
    sums = {"library": 0, "other": 0}
    for m in MAP_ENTRY.finditer(text, start):
        size = int(m.group(2), 16)
        origin = m.group(3)
        if size == 0 or origin.startswith("*"):
            continue
        sums["library" if "libnatremia-m4.a(" in origin else "other"] += size
    sums["entry_points"] = len(keep)
    return sums


def main():
    root, work = sys.argv[1], sys.argv[2]
    os.makedirs(work, exist_ok=True)
    objects = []
    for src in library_sources(root):
        obj = os.path.splitext(os.path.basename(src))[0] + ".o"
        run([CC] + FLAGS + ["-I", os.path.join(root, "include"),
                            "-I", os.path.join(root, "lib"),
                            "-c", src, "-o", obj], work)
        objects.append(obj)
    run(["rm", "-f", "libnatremia-m4.a"], work)
    run(["arm-none-eabi-ar", "rcs", "libnatremia-m4.a"] + objects, work)

    totals = {"text": 0, "rodata": 0, "data": 0, "bss": 0}
    per_object = {}
    for obj in objects:
        s = section_sizes(obj, work)
        per_object[obj] = s["text"] + s["rodata"]
        for k in totals:
            totals[k] += s[k]

    names = exported(objects, work)
    frames = stack_frames([os.path.join(work, o[:-2] + ".su") for o in objects])
    edges = call_graph([os.path.join(work, o[:-2] + ".ci") for o in objects])
    entry_frames = {n: frames[n][0] for n in names if n in frames}
    largest = max(entry_frames.items(), key=lambda kv: (kv[1], kv[0]))
    chains = {n: deepest_chain(n, frames, edges) for n in names}
    deepest = max(chains.items(), key=lambda kv: (kv[1][0], kv[0]))
    external = sorted(set().union(*(c[2] for c in chains.values())))

    # Linked images (--gc-sections) that keep a set of entry points, with
    # libgcc's soft-float helpers (and newlib only if the compiler emitted
    # a libc call): every entry point, and the sets two kinds of firmware
    # would call.
    profiles = {}
    for profile, keep in profile_sets(names).items():
        profiles[profile] = link_profile(work, profile, keep)
    image = profiles["every entry point"]

    print(json.dumps({
        "compiler": run([CC, "--version"], work).splitlines()[0],
        "flags": " ".join(FLAGS),
        "objects": per_object,
        "text": totals["text"], "rodata": totals["rodata"],
        "code_bytes": totals["text"] + totals["rodata"],
        "writable_bytes": totals["data"] + totals["bss"],
        "entry_points": len(names),
        "largest_frame_bytes": largest[1], "largest_frame_function": largest[0],
        "entry_frames": entry_frames,
        "deepest_chain_bytes": deepest[1][0],
        "deepest_chain": deepest[1][1],
        "external_callees": external,
        "image_code_bytes": image["library"] + image["other"],
        "profiles": profiles,
    }, indent=1, sort_keys=True))


if __name__ == "__main__":
    main()
