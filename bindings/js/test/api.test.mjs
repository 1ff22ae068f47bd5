/* SPDX-License-Identifier: MIT */
// The JavaScript surface: the generated description, struct layouts, one
// method per C function, errors with their argument, typed-array batches,
// watchers and the structured calls.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { load, NatremiaError, layout } from '../natremia.mjs';
import { api } from '../natremia_api.mjs';
import { render } from '../gen_api.mjs';
import { renderDts } from '../gen_dts.mjs';
import { parseHex } from '../testsupport/hexdouble.mjs';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..', '..', '..');
const header = readFileSync(join(root, 'include', 'natremia.h'), 'utf8');
const n = await load();
const C = n.constants;

test('natremia_api.mjs is what gen_api.mjs makes of the header', () => {
  assert.equal(readFileSync(join(here, '..', 'natremia_api.mjs'), 'utf8'), render(header));
});

test('natremia.d.ts is what gen_dts.mjs makes of the description', () => {
  assert.equal(readFileSync(join(here, '..', 'natremia.d.ts'), 'utf8'), renderDts());
});

test('one method per public C function, named without ntr_', () => {
  const declared = [...header.matchAll(/NTR_API [^;(]*?\b(ntr_[a-z_0-9]+)\s*\(/g)].map((m) => m[1]);
  assert.ok(declared.length >= 84);
  for (const name of declared) assert.equal(typeof n[name.slice(4)], 'function', name);
  // and each is exported by the wasm module
  for (const name of declared) assert.equal(typeof n.exports[name], 'function', name);
});

test('struct layouts computed from the header equal the compiler\'s', () => {
  const order = ['ntr_outlook', 'ntr_finding_value', 'ntr_siad_findings', 'ntr_siad_result',
    'ntr_method_info', 'ntr_sample', 'ntr_limits', 'ntr_correction', 'ntr_watch',
    'ntr_course_limits', 'ntr_course_report', 'ntr_course_watch_ring', 'ntr_course_watch',
    'ntr_flow', 'ntr_timed_flow', 'ntr_plan_result', 'ntr_course_plan_result',
    'ntr_urine_interval', 'ntr_urine_feedback_result', 'ntr_fit', 'ntr_vaptan_watch'];
  assert.deepEqual([...order].sort(), Object.keys(api.structs).sort());
  order.forEach((s, i) => assert.equal(layout(s).size, n.exports.ntrjs_sizeof(i), s));
});

test('constants come from the header', () => {
  assert.equal(C.NTR_OK, 0);
  assert.equal(C.NTR_ERR_RANGE, 3);
  assert.equal(C.NTR_COURSE_NO_TIME, -1e9);
  assert.equal(C.NTR_SIAD_SUPPLEMENTAL_BITS, 0xffff0000);
  assert.equal(n.version_string(), '1.1.0');
  assert.equal(n.version_number(), 10100);
});

// A valid call of each plain scalar function: its first successful line in
// tests/refvectors/expected.txt (the contract's baseline), so no input is
// typed here.
function baselines() {
  const text = readFileSync(join(root, 'tests', 'refvectors', 'expected.txt'), 'utf8');
  const out = new Map();
  for (const l of text.split('\n')) {
    const m = l.match(/^ntr_([a-z_0-9]+) #0 ([-\d ]*)\| ([^>s]*?) -> 0( |$)/);
    if (m && !out.has(m[1])) {
      out.set(m[1], { enums: m[2].trim() ? m[2].trim().split(' ').map(Number) : [], nums: m[3].split(' ').map(parseHex) });
    }
  }
  return out;
}

test('NatremiaError names the failing argument (argument order, as documented)', () => {
  const base = baselines();
  let checked = 0;
  for (const fn of api.functions) {
    const short = fn.name.slice(4);
    const m = n[short];
    const b = base.get(short);
    if (!b || !m.parameters) continue;
    const params = m.parameters.map((p) => fn.params.find((x) => x.name === p));
    if (params.some((p) => p.pointer) || params.filter((p) => p.type === 'double').length !== b.nums.length ||
        params.filter((p) => p.type !== 'double').length !== b.enums.length) continue;
    const args = [];
    let e = 0;
    let k = 0;
    for (const p of params) args.push(p.type === 'double' ? b.nums[k++] : b.enums[e++]);
    m(...args); // the baseline is valid
    params.forEach((p, j) => {
      if (p.type !== 'double') return;
      for (const bad of [NaN, Infinity, 1e12, -1e12]) {
        const probe = args.slice();
        probe[j] = bad;
        let err = null;
        try { m(...probe); } catch (x) { err = x; }
        assert.ok(err instanceof NatremiaError, `${short}(${p.name} = ${bad}) did not fail`);
        const want = Number.isFinite(bad) ? C.NTR_ERR_RANGE : C.NTR_ERR_NONFINITE;
        assert.equal(err.status, want, `${short} ${p.name} = ${bad}`);
        assert.equal(err.argument, p.name, `${short} ${p.name} = ${bad}`);
        assert.equal(err.message, n.status_message(want));
        assert.equal(err.function, short);
        checked++;
      }
    });
    // Two bad inputs: the first in argument order is named.
    const doubles = params.map((p, j) => (p.type === 'double' ? j : -1)).filter((j) => j >= 0);
    if (doubles.length >= 2) {
      const probe = args.slice();
      probe[doubles[0]] = 1e12;
      probe[doubles[doubles.length - 1]] = 1e12;
      assert.throws(() => m(...probe), (x) => x.argument === params[doubles[0]].name);
    }
  }
  assert.ok(checked >= 4 * 100, `only ${checked} argument checks`);
});

test('an unknown enumerator throws NTR_ERR_ARG naming it', () => {
  assert.throws(() => n.osm_effective(130, 5) && n.na_corrected_glucose(125, 30, 99),
    (e) => e instanceof NatremiaError && e.status === C.NTR_ERR_ARG && e.argument === 'method');
  assert.throws(() => n.unit_parse('furlong'), (e) => e.status === C.NTR_ERR_UNIT);
  assert.equal(n.unit_parse('mg/dL'), C.NTR_UNIT_MG_DL);
});

test('batch forms take typed arrays and equal the scalar calls', () => {
  const na = new Float64Array([140, 125.5, 300, 118]);
  const glu = new Float64Array([5, 33.3, 5, NaN]);
  const r = n.batch_osm_effective(na, glu);
  assert.ok(r.out instanceof Float64Array && r.status instanceof Int32Array);
  assert.equal(r.failed, 2);
  assert.equal(r.result, C.NTR_ERR_RANGE);
  assert.deepEqual([...r.status], [0, 0, C.NTR_ERR_RANGE, C.NTR_ERR_NONFINITE]);
  assert.equal(r.out[0], n.osm_effective(140, 5));
  assert.equal(r.out[1], n.osm_effective(125.5, 33.3));
  assert.ok(Number.isNaN(r.out[2]));
  const sex = new Int32Array([C.NTR_SEX_MALE, C.NTR_SEX_FEMALE]);
  const t = n.batch_tbw_watson(sex, [50, 40], [175, 165], [75, 60]);
  assert.equal(t.out[0], n.tbw_watson(C.NTR_SEX_MALE, 50, 175, 75));
  assert.equal(t.out[1], n.tbw_watson(C.NTR_SEX_FEMALE, 40, 165, 60));
  const adv = n.batch_restriction_from_ratio(new Float64Array([0.5, 0.95, 1.5]));
  assert.deepEqual([...adv.advice], [C.NTR_RESTRICT_1000ML, C.NTR_RESTRICT_500_700ML, C.NTR_RESTRICT_500ML]);
  // A call-level error (unknown formula) writes nothing and throws.
  assert.throws(() => n.batch_osm_calculated(na, glu, glu, glu, 77), (e) => e.status === C.NTR_ERR_ARG);
});

test('grouped course assessment equals one call per series', () => {
  const lim = n.course_limits_preset(C.NTR_COURSE_HYPO_STANDARD);
  const a = [{ hours: 0, na_mmol_l: 118 }, { hours: 8, na_mmol_l: 124 }, { hours: 20, na_mmol_l: 128.5 }];
  const b = [{ hours: 0, na_mmol_l: 121 }, { hours: 12, na_mmol_l: 125 }];
  const r = n.batch_course_assess(new Uint32Array([0, 3, 5, 5]), [...a, ...b], lim);
  assert.deepEqual(r.out[0], n.course_assess(a, lim));
  assert.deepEqual(r.out[1], n.course_assess(b, lim));
  assert.deepEqual([...r.status], [0, 0, C.NTR_ERR_ARG]);
  assert.equal(r.failed, 1);
});

test('balance course, plan check and watcher work together', () => {
  // An invented plan: 3% saline at 30 mL/h for 24 h into 40 L, from 118.
  const flows = [{ start_h: 0, end_h: 24, rate_ml_h: 30, na_mmol_l: 513, k_mmol_l: 0 }];
  const series = n.balance_course(118, 40, flows, 24, 2);
  assert.equal(series.length, 13);
  assert.deepEqual(series[0], { hours: 0, na_mmol_l: 118 });
  const end = n.balance_predict(118, 40, [{ volume_l: 0.72, na_mmol_l: 513, k_mmol_l: 0 }]);
  assert.ok(Math.abs(series[12].na_mmol_l - end.na_out) < 1e-9);
  const lim = n.course_limits_preset(C.NTR_COURSE_HYPO_STANDARD);
  const history = [{ hours: -6, na_mmol_l: 116 }, { hours: 0, na_mmol_l: 118 }];
  const plan = n.course_plan_check(history, 40, flows, 24, 2, lim);
  assert.equal(plan.points, 12);
  assert.ok(Math.abs(plan.final_na_mmol_l - end.na_out) < 1e-9);
  assert.equal(typeof plan.course.max_rise_24h, 'number');
  // A watcher is state: its copy is private to each handle.
  const w1 = n.course_watch_init(lim);
  const w2 = n.course_watch_init(lim);
  n.course_watch_push(w1, 0, 118);
  n.course_watch_push(w1, 10, 126);
  n.course_watch_push(w2, 0, 118);
  assert.equal(n.course_watch_result(w1).max_rise_24h, 8);
  assert.equal(n.course_watch_result(w2).max_rise_24h, 0);
  assert.throws(() => n.course_watch_push({}, 1, 120), TypeError);
  assert.throws(() => n.watch_push(w1, 1, 120), TypeError);
  // Out of time order: NTR_ERR_ORDER, and the state is left as it was.
  assert.throws(() => n.course_watch_push(w1, 5, 127), (e) => e.status === C.NTR_ERR_ORDER);
  assert.equal(n.course_watch_result(w1).elapsed_h, 10);
  // The 1.0 watcher too.
  const w = n.watch_init(n.limits_preset(C.NTR_LIMITS_STANDARD));
  n.watch_push(w, 0, 118);
  assert.equal(n.watch_push(w, 10, 129).max_rise_24h, 11);
});

test('urine intervals, fit and therapy helpers are reachable', () => {
  const flow = n.urine_interval_flow({ start_h: 0, end_h: 4, volume_ml: 800, na_mmol_l: 40, k_mmol_l: 20, osm_mosm_kg: 250 });
  assert.equal(flow.rate_ml_h, -200);
  assert.equal(flow.na_mmol_l, 40);
  const siad = n.siad_evaluate(n.siad_findings_init());
  assert.equal(siad.verdict, C.NTR_SIAD_INCOMPLETE);
  const v = n.vaptan_watch_preset(0, 0);
  assert.equal(v.limits.goal, C.NTR_GOAL_RAISE);
  const b = n.bolus_plan(120, 40, 5, 10);
  assert.equal(typeof b.boluses, 'number');
  assert.equal(typeof b.held_by_limit, 'number');
  const out = n.restriction_outlook(600, 500, 150, 60, 125, 0.4, 1.0);
  assert.ok([C.NTR_OUTLOOK_TARGET_HOLDS, C.NTR_OUTLOOK_STRICTER_OR_SOLUTE, C.NTR_OUTLOOK_RESTRICTION_FAILS].includes(out.verdict));
});

test('fit, re-projection, urine feedback and the 1.0 calls marshal their structs', () => {
  const lim = n.course_limits_preset(C.NTR_COURSE_HYPO_STANDARD);
  // An invented series made by the model itself: 40 L, 3% saline 60 mL/h
  // for 12 h, then 5% dextrose 250 mL/h (two phases, so body water and an
  // unmeasured loss can be told apart): the fit must find 40 L and no loss.
  const flows = [{ start_h: 0, end_h: 12, rate_ml_h: 60, na_mmol_l: 513, k_mmol_l: 0 },
    { start_h: 12, end_h: 24, rate_ml_h: 250, na_mmol_l: 0, k_mmol_l: 0 }];
  const made = n.balance_course(118, 40, flows, 24, 3);
  const fit = n.course_fit(made, 30, flows);
  assert.equal(fit.struct_size, layout('ntr_fit').size);
  assert.ok(Math.abs(fit.tbw_l - 40) < 1e-3, `tbw ${fit.tbw_l}`);
  assert.ok(Math.abs(fit.free_water_loss_ml_h) < 0.1, `loss ${fit.free_water_loss_ml_h}`);
  // Flows are hours after history[0] here, hours after now in the plan check.
  const later = [{ start_h: 24, end_h: 48, rate_ml_h: 30, na_mmol_l: 513, k_mmol_l: 0 }];
  const re = n.fit_reproject(made, fit, [...flows, ...later], 24, 4, lim);
  assert.equal(re.struct_size, layout('ntr_course_plan_result').size);
  assert.equal(re.course.struct_size, layout('ntr_course_report').size);
  // With no loss fitted, re-projecting is the plan check from the last sample.
  const direct = n.course_plan_check(made, fit.tbw_last_l, [{ ...later[0], start_h: 0, end_h: 24 }], 24, 4, lim);
  assert.ok(Math.abs(re.final_na_mmol_l - direct.final_na_mmol_l) < 1e-6);
  const urine = [{ start_h: 0, end_h: 6, volume_ml: 600, na_mmol_l: 40, k_mmol_l: 20, osm_mosm_kg: 300 }];
  const fb = n.urine_feedback(made.slice(0, 2), 40, flows, urine, 12, 1, lim);
  assert.equal(fb.struct_size, layout('ntr_urine_feedback_result').size);
  assert.equal(fb.plan.struct_size, layout('ntr_course_plan_result').size);
  assert.ok(Number.isFinite(fb.na_now_mmol_l) && Number.isFinite(fb.urine_ml_h));
  assert.equal(fb.urine_ml_h, 100);
  // 1.0: correction_assess equals the grouped form, plan_check runs.
  const lim10 = n.limits_preset(C.NTR_LIMITS_STANDARD);
  const s = [{ hours: 0, na_mmol_l: 118 }, { hours: 20, na_mmol_l: 128.5 }];
  const one = n.correction_assess(s, lim10);
  assert.ok(one.flags & C.NTR_CF_OVER_24H);
  assert.deepEqual(n.batch_correction_assess([0, 2], s, lim10).out[0], one);
  const p = n.plan_check(s, 40, flows, 12, 1, lim10);
  assert.equal(p.points, 12);
  assert.equal(typeof p.course.max_rise_24h, 'number');
  const rl = n.relower_estimate(130, 40, 0, 0, 2, 6, 0, 0, 0);
  assert.ok(rl.volume_l > 0 && rl.rate_ml_h > 0);
});
