/* SPDX-License-Identifier: MIT */
// Main results of the JavaScript methods against published values. Each
// check names its source; the values are those the C tests use (tests/*.c)
// and /work/shared/sources.md lists as checked against the publication.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { load } from '../natremia.mjs';

const n = await load();
const C = n.constants;
const near = (got, want, tol, what) =>
  assert.ok(Math.abs(got - want) <= tol, `${what}: ${got} is not within ${tol} of ${want}`);
const mgdl = (analyte, v) => n.convert(analyte, v, C.NTR_UNIT_MG_DL, C.NTR_UNIT_MMOL_L);

test('Katz 1973 and Hillier 1999: sodium corrected for glucose', () => {
  // Katz MA, N Engl J Med 1973;289:843-4 (1.6 per 100 mg/dL above 100);
  // Hillier TA et al., Am J Med 1999;106:399-403 (2.4). Hand-worked:
  // Na 130 with glucose 600 mg/dL -> 138.0 and 142.0; 125 with 400 -> 129.8, 132.2.
  const g600 = mgdl(C.NTR_ANALYTE_GLUCOSE, 600);
  const g400 = mgdl(C.NTR_ANALYTE_GLUCOSE, 400);
  near(n.na_corrected_glucose(130, g600, C.NTR_GLUCOSE_KATZ), 138.0, 1e-9, 'Katz 600');
  near(n.na_corrected_glucose(130, g600, C.NTR_GLUCOSE_HILLIER), 142.0, 1e-9, 'Hillier 600');
  near(n.na_corrected_glucose(125, g400, C.NTR_GLUCOSE_KATZ), 129.8, 1e-9, 'Katz 400');
  near(n.na_corrected_glucose(125, g400, C.NTR_GLUCOSE_HILLIER), 132.2, 1e-9, 'Hillier 400');
  // Both take 100 mg/dL as the reference: no correction at or below it.
  near(n.na_corrected_glucose(128, mgdl(C.NTR_ANALYTE_GLUCOSE, 90), C.NTR_GLUCOSE_HILLIER), 128, 1e-9, 'below 100');
});

test('Dorwart & Chalmers 1975: calculated osmolality', () => {
  // Dorwart WV, Chalmers L. Clin Chem 1975;21:190-4: 1.86*Na + glucose/18 +
  // BUN/2.8 + 9 (mg/dL). Na 140, glucose 90, BUN 14 -> 260.4 + 5 + 5 + 9 = 279.4.
  const osm = n.osm_calculated(140, mgdl(C.NTR_ANALYTE_GLUCOSE, 90),
    mgdl(C.NTR_ANALYTE_UREA_NITROGEN, 14), 0, C.NTR_OSM_DORWART_CHALMERS);
  near(osm, 279.4, 0.02, 'Dorwart-Chalmers');
});

test('Watson 1980: total body water of adults', () => {
  // Watson PE, Watson ID, Batt RD. Am J Clin Nutr 1980;33:27-39 (abstract):
  // men 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight;
  // women -2.097 + 0.1069*height + 0.2466*weight. Hand-worked:
  // man 50 y, 175 cm, 75 kg -> 41.699 L; woman 40 y, 165 cm, 60 kg -> 30.3375 L.
  near(n.tbw_watson(C.NTR_SEX_MALE, 50, 175, 75), 41.699, 1e-9, 'men');
  near(n.tbw_watson(C.NTR_SEX_FEMALE, 40, 165, 60), 30.3375, 1e-9, 'women');
  const info = n.method_info(C.NTR_METHOD_TBW_WATSON);
  for (const c of ['2.447', '0.09516', '0.1074', '0.3362', '-2.097', '0.1069', '0.2466']) {
    assert.ok(info.equation.includes(c), c);
  }
  assert.match(info.reference, /Am J Clin Nutr 1980/);
});

test('Adrogue & Madias 2000: infusate table and per-litre change', () => {
  // Adrogue HJ, Madias NE, N Engl J Med 2000;342:1581-9, infusate table
  // (sodium, mmol/L); potassium 4 in Ringer's lactate (common practice).
  const table = [[C.NTR_FLUID_NACL_0_9, 154, 0], [C.NTR_FLUID_NACL_3, 513, 0],
    [C.NTR_FLUID_NACL_5, 855, 0], [C.NTR_FLUID_NACL_0_45, 77, 0],
    [C.NTR_FLUID_RINGER_LACTATE, 130, 4], [C.NTR_FLUID_DEXTROSE_5, 0, 0],
    [C.NTR_FLUID_NACL_0_2_DEXTROSE_5, 34, 0]];
  for (const [fluid, na, k] of table) {
    assert.deepEqual(n.fluid_preset(fluid), { na_mmol_l: na, k_mmol_l: k });
  }
  // change per litre = (infusate Na + K - serum Na) / (TBW + 1) (same paper):
  // 3% saline, Na 110, TBW 30 L -> 403/31 = 13.0.
  near(n.infusate_change_per_litre(110, 30, 513, 0), 403 / 31, 1e-12, 'per litre');
});

test('Furst 2000 worked example: 3% saline from 108 in 30 L', () => {
  // Furst H et al., Am J Med Sci 2000;319:240-4 (sources.md): deficit
  // 5 x 30 = 150 mmol, 150/513 = 292 mL; its mass-balance check gives about
  // 112 (a rise of 3.9093 hand-worked); the exact inverse for +5 is 375 mL.
  assert.equal(n.na_deficit(30, 108, 113), 150);
  const dose = 150 / 513;
  near(n.infusate_change(108, 30, 513, 0, dose), 3.9093, 1e-4, 'rise');
  near(n.infusate_volume_for_change(108, 30, 513, 0, 5), 0.375, 0.0005, 'inverse');
  // Furst ratio (U_Na + U_K)/S_Na and its bands (same paper); urine Na 60,
  // K 20, serum 120 -> 0.667, restrict to under 1 L/day.
  near(n.furst_ratio(60, 20, 120), 2 / 3, 1e-15, 'ratio');
  assert.equal(n.restriction_from_ratio(2 / 3), C.NTR_RESTRICT_1000ML);
});

test('Spasovski 2014: severity bands, tonicity and urine thresholds', () => {
  // Spasovski G et al., Eur J Endocrinol 2014;170:G1-G47: mild 130-135,
  // moderate 125-129, profound below 125; hypotonic below 275 mOsm/kg;
  // urine osmolality 100 or below maximally dilute; urine Na above 30.
  assert.equal(n.na_severity(135), C.NTR_SEVERITY_NONE);
  assert.equal(n.na_severity(134.9), C.NTR_SEVERITY_MILD);
  assert.equal(n.na_severity(129.9), C.NTR_SEVERITY_MODERATE);
  assert.equal(n.na_severity(124.9), C.NTR_SEVERITY_PROFOUND);
  assert.equal(n.tonicity_class(274.9), C.NTR_TONICITY_HYPOTONIC);
  assert.equal(n.tonicity_class(280), C.NTR_TONICITY_ISOTONIC);
  assert.equal(n.urine_maximally_dilute(100), 1);
  assert.equal(n.urine_maximally_dilute(101), 0);
  assert.equal(n.urine_na_high(30), 0);
  assert.equal(n.urine_na_high(31), 1);
});

test('Fenske 2008: fractional uric acid excretion', () => {
  // Fenske W et al. J Clin Endocrinol Metab 2008;93:2991-7: above 12 %
  // supports SIAD, below 8 % argues against it.
  assert.equal(n.fe_uric_acid_class(12.5), C.NTR_FE_URIC_ACID_SUPPORTS_SIAD);
  assert.equal(n.fe_uric_acid_class(10), C.NTR_FE_URIC_ACID_INDETERMINATE);
  assert.equal(n.fe_uric_acid_class(7.9), C.NTR_FE_URIC_ACID_AGAINST_SIAD);
});

test('Verbalis 2013 and Spasovski 2014: correction limits, assessed and watched', () => {
  // Verbalis JG et al., Am J Med 2013;126(10 Suppl 1):S1-42; Spasovski 2014:
  // at most 10 in 24 h and 18 in 48 h; at high risk 8 in 24 h.
  assert.deepEqual(n.limits_preset(C.NTR_LIMITS_STANDARD), { max_rise_24h: 10, max_rise_48h: 18, min_rise_24h: 4 });
  assert.equal(n.limits_preset(C.NTR_LIMITS_HIGH_RISK).max_rise_24h, 8);
  // 118 -> 128.5 within 20 h: 10.5 > 10, over (tests/test_correction.c).
  const series = [{ hours: 0, na_mmol_l: 118 }, { hours: 8, na_mmol_l: 124 }, { hours: 20, na_mmol_l: 128.5 }];
  const lim = n.course_limits_preset(C.NTR_COURSE_HYPO_STANDARD);
  const report = n.course_assess(series, lim);
  assert.ok(report.flags & C.NTR_CF_OVER_24H);
  near(report.excess_mmol_l, 0.5, 1e-12, 'excess');
  // The watcher, fed one sample at a time, reports the same.
  const w = n.course_watch_init(lim);
  let last;
  for (const s of series) last = n.course_watch_push(w, s.hours, s.na_mmol_l);
  assert.deepEqual(last, report);
  assert.deepEqual(n.course_watch_result(w), report);
});

test('Adrogue & Madias 2000 (hypernatremia): a fall of 25 in 24 h is over 10 per day', () => {
  // Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med 2000;342:1493-9:
  // chronic: lower by at most about 10 mmol/L per day. 165 -> 140 in 24 h
  // is over by 15 (tests/test_correction.c).
  const s = [[0, 165], [6, 159], [12, 152], [18, 146], [24, 140]].map(([hours, na_mmol_l]) => ({ hours, na_mmol_l }));
  const r = n.course_assess(s, n.course_limits_preset(C.NTR_COURSE_HYPER_CHRONIC));
  assert.ok(r.flags & C.NTR_CF_FALL_OVER_24H);
  near(r.excess_mmol_l, 15, 1e-12, 'excess');
});

test('Berl 2008: urine volume from solute excretion', () => {
  // Berl T. J Am Soc Nephrol 2008;19:1076-8: urine volume = osmoles excreted
  // / urine osmolality; 600 mOsm/day at 300 mOsm/kg -> 2 L/day.
  near(n.urine_volume_from_solute(600, 300), 2, 1e-12, 'volume');
  // Added urea (60.056 g/mol, IUPAC) raises the osmoles: 30 g -> 499.5 mOsm.
  near(n.solute_dose_osmoles(C.NTR_SOLUTE_UREA, 30), 30000 / 60.056, 1e-9, 'urea osmoles');
});

test('LOINC codes and lab unit spellings through the string marshalling', () => {
  // LOINC 2951-2 "Sodium [Moles/volume] in Serum or Plasma" and 2345-7
  // "Glucose [Mass/volume] in Serum or Plasma": /work/shared/sources.md
  // (LOINC, as used in HL7 FHIR published examples); 14933-6 "Urate
  // [Moles/volume] in Serum or Plasma": HL7 FHIR R4 examples
  // (hl7.fhir.r4.examples 4.0.1, Bundle-72ac8493-...).
  assert.deepEqual(n.loinc_lookup('2951-2'),
    { analyte: C.NTR_ANALYTE_SODIUM, specimen: C.NTR_SPECIMEN_SERUM_PLASMA, unit: C.NTR_UNIT_MMOL_L });
  assert.deepEqual(n.loinc_lookup('2345-7'),
    { analyte: C.NTR_ANALYTE_GLUCOSE, specimen: C.NTR_SPECIMEN_SERUM_PLASMA, unit: C.NTR_UNIT_MG_DL });
  assert.deepEqual(n.loinc_lookup('14933-6'),
    { analyte: C.NTR_ANALYTE_URIC_ACID, specimen: C.NTR_SPECIMEN_SERUM_PLASMA, unit: C.NTR_UNIT_MMOL_L });
  assert.throws(() => n.loinc_lookup('0000-0'), (e) => e instanceof n.NatremiaError && e.status === C.NTR_ERR_UNIT);
  // UCUM's case-insensitive forms and common lab spellings (docs/units.md).
  assert.equal(n.unit_parse_lenient('mEq/L'), C.NTR_UNIT_MEQ_L);
  assert.equal(n.unit_parse_lenient(' mmol/l '), C.NTR_UNIT_MMOL_L);
  assert.equal(n.unit_parse_lenient('mOsm/kg H2O'), C.NTR_UNIT_MOSM_KG);
  assert.equal(n.unit_parse_lenient('\u00b5mol/L'), C.NTR_UNIT_UMOL_L); // UTF-8 micro sign
  // mOsm/L is an osmolarity, not an osmolality: refused.
  assert.throws(() => n.unit_parse_lenient('mOsm/L'), (e) => e instanceof n.NatremiaError && e.status === C.NTR_ERR_UNIT);
});
