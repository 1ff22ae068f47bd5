/* SPDX-License-Identifier: MIT */
// tests/refvectors/expected.txt through the JavaScript methods, bit for bit.
//
// The file is written by tests/refvectors/refvectors.c from the contract
// table tests/fuzz/ntr_contract.c: one call a line,
//   name #case enumerators | inputs [sFINGERPRINT] -> status results
// with doubles as exact %a text, and batch calls as
//   name -> status failed N   and   name row i | columns -> status result.
// Every line whose inputs are all in the line (no series fingerprint) is
// replayed here: enumerators go to the int parameters and numbers to the
// double parameters, each in C argument order (the contract's order);
// results are the double outputs, then the integer ones, in C order, or
// the struct members that the contract's results function lists (RESULTS
// below). Lines with series inputs are made by the contract's generator,
// which is C; test/wasm-refvectors.test.mjs runs that generator itself,
// compiled to WebAssembly, under node.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { load } from '../natremia.mjs';
import { api } from '../natremia_api.mjs';
import { formatHex, parseHex } from '../testsupport/hexdouble.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const expectedPath = process.env.NATREMIA_REFVECTORS ||
  join(here, '..', '..', '..', 'tests', 'refvectors', 'expected.txt');
const lines = readFileSync(expectedPath, 'utf8').split('\n').filter((l) => l && !l.startsWith('#'));
const lib = await load();
const C = lib.constants;

// Struct results as the contract's results_* functions list them.
const RESULTS = {
  ntr_limits_preset: (r) => [r.max_rise_24h, r.max_rise_48h, r.min_rise_24h],
  ntr_course_limits_preset: (r) => [r.goal, r.max_rise_24h, r.max_rise_48h, r.max_fall_24h,
    r.max_fall_48h, r.min_change_24h],
  ntr_vaptan_watch_preset: (r) => [r.limits.max_rise_24h, r.limits.max_rise_48h, r.horizon_h,
    r.resample_h, r.cautions],
  ntr_restriction_outlook: (r) => [r.verdict, r.furst_advice, r.furst_ratio, r.urine_l_day,
    r.efwc_l_day, r.allowance_l_day, r.target_intake_l_day, r.urea_g_day, r.nacl_g_day, r.flags],
};
// Enumerators that are not C parameters: the contract's struct_size modes
// (0 = the caller's size is the library's; only that mode is replayed).
const SIZE_MODE_LAST = new Set(['ntr_restriction_outlook', 'ntr_vaptan_watch_preset']);
// Functions whose enumerators describe struct members, or whose results
// are private watcher state or a struct input, or whose string inputs are
// picked from the fuzz contract's own tables (the lenient unit parser, the
// LOINC lookup): the C generator, run under WASI in
// wasm-refvectors.test.mjs, covers them; published.test.mjs calls the two
// string functions through the JavaScript methods.
const NOT_REPLAYED = new Set(['ntr_siad_evaluate', 'ntr_siad_findings_init', 'ntr_method_info',
  'ntr_watch_init', 'ntr_course_watch_init', 'ntr_urine_interval_flow',
  'ntr_unit_parse_lenient', 'ntr_loinc_lookup']);
// Call-level enumerators of the batch forms: the scalar entry's base_en in
// tests/fuzz/ntr_contract.c; per-row sex cycles through {male, female}.
const BATCH_CALL_ENUM = {
  ntr_batch_osm_calculated: C.NTR_OSM_2NA,
  ntr_batch_na_corrected_glucose: C.NTR_GLUCOSE_KATZ,
};
const SEX_CYCLE = [C.NTR_SEX_MALE, C.NTR_SEX_FEMALE];
// ntr_unit_parse's enumerator picks a string; the first six (the only ones
// in the file) are the accepted codes in NTR_UNIT_* order, as in the
// contract's unit_strings.
const UNIT_STRINGS = ['mmol/L', 'mg/dL', 'meq/L', 'mosm/kg', 'g/L', 'umol/L'];

const fnByName = new Map(api.functions.map((f) => [f.name, f]));

function callScalar(name, enums, nums) {
  const fn = fnByName.get(name);
  const method = lib[name.replace(/^ntr_/, '')];
  const args = [];
  let e = 0;
  let k = 0;
  const en = SIZE_MODE_LAST.has(name) ? enums.slice(0, -1) : enums;
  for (const pname of method.parameters) {
    const p = fn.params.find((x) => x.name === pname);
    if (p.type === 'double') args.push(nums[k++]);
    else if (p.type === 'char') args.push(UNIT_STRINGS[en[e++]]);
    else args.push(en[e++]);
  }
  if (e !== en.length || k !== nums.length) return null;
  try {
    const r = method(...args);
    let values;
    if (RESULTS[name]) values = RESULTS[name](r);
    else {
      const obj = method.results.length === 1 ? { [method.results[0]]: r } : r;
      const outs = method.results.map((n) => fn.params.find((x) => x.name === n));
      values = [...outs.filter((p) => p.type === 'double'), ...outs.filter((p) => p.type !== 'double')]
        .map((p) => obj[p.name]);
    }
    return `0${values.map((v) => ` ${formatHex(v)}`).join('')}`;
  } catch (err) {
    if (err instanceof lib.NatremiaError) return String(err.status);
    throw err;
  }
}

test('status messages equal the C file', () => {
  const msgs = lines.filter((l) => l.startsWith('ntr_status_message '));
  assert.equal(msgs.length, 11);
  for (const l of msgs) {
    const m = l.match(/^ntr_status_message (-?\d+) -> (.*)$/);
    assert.equal(lib.status_message(Number(m[1])), m[2], l);
  }
});

test('every scalar line with its inputs in the line, bit for bit', (t) => {
  let replayed = 0;
  const skipped = new Set();
  const seen = new Set();
  for (const l of lines) {
    const m = l.match(/^(ntr_[a-z_0-9]+) #\d+ ([-\d ]*)\| ?([^>]*?) ?-> (.*)$/);
    if (!m || /(^| )s[0-9a-f]{16}$/.test(m[3])) continue;
    const name = m[1];
    seen.add(name);
    if (NOT_REPLAYED.has(name) || (SIZE_MODE_LAST.has(name) && !/ 0 $/.test(` ${m[2]}`))) {
      skipped.add(name);
      continue;
    }
    const enums = m[2].trim() ? m[2].trim().split(' ').map(Number) : [];
    const nums = m[3].trim() ? m[3].trim().split(' ').map(parseHex) : [];
    const got = callScalar(name, enums, nums);
    assert.notEqual(got, null, `${name}: the line's inputs do not fit the C parameters`);
    assert.equal(got, m[4], l);
    replayed++;
  }
  // Nothing silently dropped: every function but the listed ones was replayed.
  for (const name of skipped) assert.ok(NOT_REPLAYED.has(name) || SIZE_MODE_LAST.has(name), name);
  assert.ok(seen.size >= 45, `only ${seen.size} functions found`);
  assert.ok(replayed >= 400, `only ${replayed} lines replayed`);
  t.diagnostic(`${replayed} lines of ${seen.size - skipped.size} functions replayed; generator-only: ${[...skipped].join(' ')}`);
});

test('every batch call, row by row, bit for bit', () => {
  const groups = new Map();
  for (const l of lines) {
    const head = l.match(/^(ntr_batch_[a-z_]+) -> (\d+) failed (\d+)$/);
    if (head) {
      groups.set(head[1], { status: Number(head[2]), failed: Number(head[3]), rows: [] });
      continue;
    }
    const row = l.match(/^(ntr_batch_[a-z_]+) row (\d+) \| (.*) -> (-?\d+) (\S+)$/);
    if (row) groups.get(row[1]).rows.push({ cols: row[3].split(' ').map(parseHex), status: Number(row[4]), out: row[5] });
  }
  assert.ok(groups.size >= 14);
  for (const [name, g] of groups) {
    const method = lib[name.replace(/^ntr_/, '')];
    const fn = fnByName.get(name);
    const args = [];
    let col = 0;
    for (const pname of method.parameters) {
      const p = fn.params.find((x) => x.name === pname);
      if (p.pointer && p.type === 'double') args.push(Float64Array.from(g.rows, (r) => r.cols[col]));
      else if (p.pointer && p.type === 'int') args.push(Int32Array.from(g.rows, (_, i) => SEX_CYCLE[i % 2]));
      else args.push(BATCH_CALL_ENUM[name]);
      if (p.pointer && p.type === 'double') col++;
    }
    assert.equal(col, g.rows[0].cols.length, name);
    const r = method(...args);
    assert.equal(r.result, g.status, `${name} call status`);
    assert.equal(r.failed, g.failed, `${name} failed count`);
    const out = r.out || r.advice;
    g.rows.forEach((row, i) => {
      assert.equal(r.status[i], row.status, `${name} row ${i} status`);
      const text = r.advice ? String(out[i]) : formatHex(out[i]);
      assert.equal(text, row.out, `${name} row ${i}`);
    });
  }
});
