/* SPDX-License-Identifier: MIT */
// The demonstration page: an invented patient's work-up, a plan check and a
// watched sodium series, all computed here in the browser by the natremia
// WebAssembly module (bindings/js). Nothing is fetched from outside this
// site. Every number shown keeps its full value in data-exact, so the page
// test (tests/js/check_page.py) can compare it with the C library.
import { load } from '../../bindings/js/natremia.mjs';

// A failure to load is shown on the page (and marks it finished), like a
// failure to compute below: a blank page must never look like a quiet one.
function showFailure(what, err) {
  document.body.dataset.ready = 'error';
  document.querySelector('#error').textContent = `The page could not ${what}: ${err.message}`;
}

let n;
let scenario;
try {
  n = await load();
  scenario = await (await fetch(new URL('./scenario.json', import.meta.url))).json();
} catch (err) {
  showFailure('load the library or its scenario', err);
  throw err;
}
const C = n.constants;

const TRI = { yes: C.NTR_TRI_YES, no: C.NTR_TRI_NO, unknown: C.NTR_TRI_UNKNOWN };
const SEX = { female: C.NTR_SEX_FEMALE, male: C.NTR_SEX_MALE };
const SEVERITY = ['no hyponatraemia', 'mild', 'moderate', 'profound'];
const TONICITY = { [C.NTR_TONICITY_HYPOTONIC]: 'hypotonic', [C.NTR_TONICITY_ISOTONIC]: 'isotonic', [C.NTR_TONICITY_HYPERTONIC]: 'hypertonic' };
const ADVICE = {
  [C.NTR_RESTRICT_1000ML]: 'fluid under 1 L/day',
  [C.NTR_RESTRICT_500_700ML]: 'fluid 500 to 700 mL/day',
  [C.NTR_RESTRICT_500ML]: 'under 500 mL/day; restriction alone likely to fail',
};
// Our own short words for the course flags (NTR_CF_*).
const FLAG_WORDS = [
  ['NTR_CF_OVER_24H', '24 h rise over limit'],
  ['NTR_CF_OVER_48H', '48 h rise over limit'],
  ['NTR_CF_BELOW_TARGET', 'short of 24 h aim'],
  ['NTR_CF_FALLING', 'falling'],
  ['NTR_CF_NEAR_LIMIT', 'near 24 h limit'],
  ['NTR_CF_PROJECTED_OVER', 'heading over limit'],
  ['NTR_CF_RAPID_6H', 'fast rise within 6 h'],
  ['NTR_CF_FALL_OVER_24H', '24 h fall over limit'],
  ['NTR_CF_FALL_OVER_48H', '48 h fall over limit'],
  ['NTR_CF_WRONG_WAY', 'moving the wrong way'],
  ['NTR_CF_APPROXIMATE', 'approximate'],
  ['NTR_CF_FALL_NEAR_LIMIT', 'near fall limit'],
  ['NTR_CF_FALL_PROJECTED_OVER', 'heading over fall limit'],
];
const flagWords = (flags) => FLAG_WORDS.filter(([k]) => flags & C[k]).map(([, w]) => w);

const $ = (sel) => document.querySelector(sel);

// One row of a results table; the full value goes to data-exact.
function row(table, label, key, value, digits, unit = '', words = '') {
  const tr = document.createElement('tr');
  const th = document.createElement('th');
  th.textContent = label;
  const td = document.createElement('td');
  td.dataset.key = key;
  td.dataset.exact = String(value);
  const tw = document.createElement('td');
  if (typeof digits === 'number') {
    td.className = 'num';
    td.textContent = `${value.toFixed(digits)}${unit ? ` ${unit}` : ''}`;
    tw.textContent = words;
  } else {
    // A class or a yes/no: the words stand for the code (kept in data-exact).
    td.className = 'word';
    td.colSpan = 2;
    td.textContent = words;
  }
  tr.append(th, td);
  if (typeof digits === 'number') tr.append(tw);
  table.append(tr);
}

function workUp() {
  const { labs, patient, risk } = scenario;
  const t = $('#workup tbody');
  const eff = n.osm_effective(labs.na_mmol_l, labs.glucose_mmol_l);
  row(t, 'Effective osmolality (2 Na + glucose)', 'osm_effective', eff, 1, 'mOsm/kg');
  const calc = n.osm_calculated(labs.na_mmol_l, labs.glucose_mmol_l, labs.urea_mmol_l, labs.ethanol_mmol_l, C.NTR_OSM_2NA);
  row(t, 'Calculated osmolality', 'osm_calculated', calc, 1, 'mOsm/kg');
  const gap = n.osm_gap(labs.measured_osm_mosm_kg, calc);
  row(t, 'Osmolal gap (measured minus calculated)', 'osm_gap', gap, 1, 'mOsm/kg');
  const corr = n.na_corrected_glucose(labs.na_mmol_l, labs.glucose_mmol_l, C.NTR_GLUCOSE_HILLIER);
  row(t, 'Sodium corrected for glucose (Hillier)', 'na_corrected', corr, 1, 'mmol/L');
  const sev = n.na_severity(labs.na_mmol_l);
  row(t, 'Severity band', 'severity', sev, null, '', SEVERITY[sev]);
  const ton = n.low_na_effective_tonicity(labs.na_mmol_l, labs.glucose_mmol_l, labs.urea_mmol_l,
    labs.ethanol_mmol_l, labs.measured_osm_mosm_kg, C.NTR_GLUCOSE_HILLIER);
  row(t, 'Tonicity of the low sodium', 'tonicity', ton.tonicity, null, '', TONICITY[ton.tonicity]);
  const tbw = n.tbw_fraction(SEX[patient.sex], patient.age_years, patient.weight_kg);
  row(t, 'Total body water (fraction of weight)', 'tbw', tbw, 1, 'L');
  const dilute = n.urine_maximally_dilute(labs.urine_osm_mosm_kg);
  row(t, 'Urine maximally dilute', 'urine_dilute', dilute, null, '', dilute ? 'yes' : 'no: concentrated');
  const naHigh = n.urine_na_high(labs.urine_na_mmol_l);
  row(t, 'Urine sodium above 30 mmol/L', 'urine_na_high', naHigh, null, '', naHigh ? 'yes' : 'no');
  const ratio = n.furst_ratio(labs.urine_na_mmol_l, labs.urine_k_mmol_l, labs.na_mmol_l);
  const advice = n.restriction_from_ratio(ratio);
  row(t, 'Urine/serum electrolyte ratio (Furst)', 'furst_ratio', ratio, 2, '', ADVICE[advice]);
  const ods = n.ods_risk(labs.na_mmol_l, TRI[risk.low_potassium], TRI[risk.alcohol_use_disorder],
    TRI[risk.malnutrition], TRI[risk.advanced_liver_disease]);
  row(t, 'Osmotic demyelination risk limits', 'ods_preset', ods.preset, null, '',
    ods.preset === C.NTR_LIMITS_HIGH_RISK ? 'high-risk limits' : 'standard limits');
  return { tbw, ods };
}

function planCheck(tbw, lim) {
  const p = scenario.plan;
  const history = p.history.map(([hours, na]) => ({ hours, na_mmol_l: na }));
  const r = n.course_plan_check(history, tbw, p.flows, p.duration_h, p.step_h, lim);
  const t = $('#plan tbody');
  $('#plan-label').textContent = p.label;
  row(t, `Predicted sodium after ${p.duration_h} h`, 'plan_final_na', r.final_na_mmol_l, 1, 'mmol/L');
  row(t, 'Predicted body water at the end', 'plan_final_tbw', r.final_tbw_l, 1, 'L');
  row(t, 'Largest predicted 24 h rise', 'plan_max_rise_24h', r.course.max_rise_24h, 1, 'mmol/L');
  const none = r.first_breach_h === C.NTR_PLAN_NO_BREACH;
  row(t, 'First predicted breach', 'plan_first_breach_h', r.first_breach_h, none ? null : 0,
    none ? '' : 'h', none ? 'none within the plan' : 'after the plan starts');
  const predicted = n.balance_course(history[history.length - 1].na_mmol_l, tbw, p.flows, p.duration_h, p.step_h);
  return { r, predicted };
}

function watchSeries(lim) {
  const w = n.course_watch_init(lim);
  const t = $('#watch tbody');
  const points = [];
  for (const [hours, na] of scenario.series) {
    const rep = n.course_watch_push(w, hours, na);
    const tr = document.createElement('tr');
    const words = flagWords(rep.flags);
    tr.innerHTML = '<td class="num"></td><td class="num"></td><td class="num"></td><td></td>';
    const [h, v, rise, f] = tr.children;
    h.textContent = `${hours} h`;
    v.textContent = na.toFixed(1);
    rise.textContent = rep.max_rise_24h.toFixed(1);
    rise.dataset.key = `watch_max_rise_24h_${hours}`;
    rise.dataset.exact = String(rep.max_rise_24h);
    f.textContent = words.join(', ') || 'within limits';
    f.dataset.key = `watch_flags_${hours}`;
    f.dataset.exact = String(rep.flags);
    if (rep.flags & (C.NTR_CF_OVER_24H | C.NTR_CF_OVER_48H)) tr.className = 'over';
    t.append(tr);
    points.push({ hours, na, over: (rep.flags & (C.NTR_CF_OVER_24H | C.NTR_CF_OVER_48H)) !== 0 });
  }
  const final = n.course_watch_result(w);
  const s = $('#watch-summary tbody');
  row(s, 'Largest 24 h rise so far', 'watch_final_max_rise_24h', final.max_rise_24h, 1, 'mmol/L');
  row(s, 'Largest 48 h rise so far', 'watch_final_max_rise_48h', final.max_rise_48h, 1, 'mmol/L');
  row(s, 'Worst excess over a limit', 'watch_final_excess', final.excess_mmol_l, 1, 'mmol/L');
  return points;
}

// ---- the chart (SVG drawn here) ----------------------------------------

const SVGNS = 'http://www.w3.org/2000/svg';
function el(name, attrs, text) {
  const e = document.createElementNS(SVGNS, name);
  for (const [k, v] of Object.entries(attrs)) e.setAttribute(k, v);
  if (text !== undefined) e.textContent = text;
  return e;
}

function chart(points, predicted, lim, history) {
  const svg = $('#chart');
  const W = 760;
  const H = 340;
  const m = { l: 56, r: 20, t: 20, b: 44 };
  const hours = [...points.map((p) => p.hours), ...history.map((h) => h[0])];
  const x0 = Math.min(...hours);
  const x1 = Math.max(...hours);
  const nas = [...points.map((p) => p.na), ...predicted.map((p) => p.na_mmol_l), history[0][1]];
  const y0 = Math.floor(Math.min(...nas) - 2);
  const y1 = Math.ceil(Math.max(...nas, points[0].na + lim.max_rise_48h) + 1);
  const X = (h) => m.l + ((h - x0) / (x1 - x0)) * (W - m.l - m.r);
  const Y = (v) => H - m.b - ((v - y0) / (y1 - y0)) * (H - m.t - m.b);
  svg.setAttribute('viewBox', `0 0 ${W} ${H}`);
  for (let v = Math.ceil(y0 / 2) * 2; v <= y1; v += 2) {
    svg.append(el('line', { x1: m.l, x2: W - m.r, y1: Y(v), y2: Y(v), class: 'grid' }));
    svg.append(el('text', { x: m.l - 8, y: Y(v) + 4, class: 'tick', 'text-anchor': 'end' }, String(v)));
  }
  for (let h = Math.ceil(x0 / 6) * 6; h <= x1; h += 6) {
    svg.append(el('line', { x1: X(h), x2: X(h), y1: m.t, y2: H - m.b, class: 'grid' }));
    svg.append(el('text', { x: X(h), y: H - m.b + 18, class: 'tick', 'text-anchor': 'middle' }, `${h} h`));
  }
  svg.append(el('text', { x: 14, y: m.t + (H - m.t - m.b) / 2, class: 'axis', transform: `rotate(-90 14 ${m.t + (H - m.t - m.b) / 2})`, 'text-anchor': 'middle' }, 'sodium, mmol/L'));
  // The limits measured from the first watched sample.
  const first = points[0];
  const lim24 = first.na + lim.max_rise_24h;
  const lim48 = first.na + lim.max_rise_48h;
  svg.append(el('line', { x1: X(first.hours), x2: X(Math.min(first.hours + 24, x1)), y1: Y(lim24), y2: Y(lim24), class: 'limit' }));
  svg.append(el('text', { x: X(first.hours) + 4, y: Y(lim24) - 6, class: 'limit-label' }, `24 h limit ${lim24}`));
  if (x1 > first.hours + 24) {
    svg.append(el('line', { x1: X(first.hours + 24), x2: X(Math.min(first.hours + 48, x1)), y1: Y(lim48), y2: Y(lim48), class: 'limit' }));
    svg.append(el('text', { x: X(first.hours + 24) + 4, y: Y(lim48) - 6, class: 'limit-label' }, `48 h limit ${lim48}`));
  }
  const line = (pts) => pts.map(([h, v], i) => `${i ? 'L' : 'M'}${X(h).toFixed(1)},${Y(v).toFixed(1)}`).join(' ');
  const t0 = history[history.length - 1][0];
  svg.append(el('path', { d: line(history), class: 'history' }));
  svg.append(el('path', { d: line(predicted.map((p) => [t0 + p.hours, p.na_mmol_l])), class: 'predicted' }));
  svg.append(el('path', { d: line(points.map((p) => [p.hours, p.na])), class: 'measured' }));
  for (const p of points) {
    svg.append(el('circle', { cx: X(p.hours), cy: Y(p.na), r: p.over ? 6 : 4, class: p.over ? 'dot over' : 'dot' }));
  }
  const lg = [['measured', 'measured (watched)'], ['predicted', 'plan prediction'], ['limit', 'limit from first sample']];
  lg.forEach(([cls, label], i) => {
    const x = m.l + 12 + i * 200;
    svg.append(el('line', { x1: x, x2: x + 26, y1: H - 10, y2: H - 10, class: cls }));
    svg.append(el('text', { x: x + 32, y: H - 6, class: 'tick' }, label));
  });
}

function main() {
  $('#scenario-note').textContent = scenario.note;
  const p = scenario.patient;
  const l = scenario.labs;
  $('#patient').textContent = `${p.label}: ${p.sex}, ${p.age_years} years, ${p.weight_kg} kg. ` +
    `Serum sodium ${l.na_mmol_l} mmol/L, glucose ${l.glucose_mmol_l}, urea ${l.urea_mmol_l} mmol/L, ` +
    `measured osmolality ${l.measured_osm_mosm_kg} mOsm/kg; urine osmolality ${l.urine_osm_mosm_kg} mOsm/kg, ` +
    `urine sodium ${l.urine_na_mmol_l} and potassium ${l.urine_k_mmol_l} mmol/L.`;
  const { tbw, ods } = workUp();
  const preset = ods.preset === C.NTR_LIMITS_HIGH_RISK ? C.NTR_COURSE_HYPO_HIGH_RISK : C.NTR_COURSE_HYPO_STANDARD;
  const lim = n.course_limits_preset(preset);
  $('#limits').textContent = `Course limits: rise at most ${lim.max_rise_24h} mmol/L in any 24 h and ` +
    `${lim.max_rise_48h} in any 48 h.`;
  const { predicted } = planCheck(tbw, lim);
  const points = watchSeries(lim);
  chart(points, predicted, lim, scenario.plan.history);
  $('#version').textContent = `natremia ${n.version_string()} (WebAssembly)`;
  document.body.dataset.ready = '1';
}

try {
  main();
} catch (err) {
  showFailure('compute', err);
  throw err;
}
