-- SPDX-License-Identifier: MIT
-- SQL checks of the natremia extension against known values
-- (run by tests/postgresql/run.sh on a throwaway server).
-- Each check names its source. A failing check raises an exception, which
-- stops psql (ON_ERROR_STOP) and fails the test.

\set ON_ERROR_STOP 1
\o /dev/null
SET client_min_messages = warning;
CREATE EXTENSION natremia;

-- ------------------------------------------------------------ helpers
CREATE FUNCTION pg_temp.near(label text, got float8, want float8, tol float8)
RETURNS void LANGUAGE plpgsql AS $$
BEGIN
    IF got IS NULL OR abs(got - want) > tol THEN
        RAISE EXCEPTION 'check failed: % = %, expected % within %', label, got, want, tol;
    END IF;
END $$;

CREATE FUNCTION pg_temp.same(label text, got anyelement, want anyelement)
RETURNS void LANGUAGE plpgsql AS $$
BEGIN
    IF got IS DISTINCT FROM want THEN
        RAISE EXCEPTION 'check failed: % = %, expected %', label, got, want;
    END IF;
END $$;

-- Runs a statement and expects an error with the given SQLSTATE.
CREATE FUNCTION pg_temp.raises(label text, statement text, sqlstate text)
RETURNS void LANGUAGE plpgsql AS $$
DECLARE
    got text;
BEGIN
    BEGIN
        EXECUTE statement;
    EXCEPTION WHEN OTHERS THEN
        got := SQLSTATE;
    END;
    IF got IS DISTINCT FROM sqlstate THEN
        RAISE EXCEPTION 'check failed: % raised %, expected SQLSTATE %', label,
            coalesce(got, 'nothing'), sqlstate;
    END IF;
END $$;

-- ------------------------------------------------------------ known values
-- Source: the conventional 2*Na formula and Dorwart & Chalmers, Clin Chem
-- 1975;21:190-4 (1.86*Na + glucose + urea + 9): Na 140, glucose 5, urea 5.
SELECT pg_temp.near('osm 2na', ntr_osm_calculated(140, 5, 5), 290, 1e-12);
SELECT pg_temp.near('osm dorwart-chalmers',
                    ntr_osm_calculated(140, 5, 5, 0, 'dorwart_chalmers'), 279.4, 1e-9);
SELECT pg_temp.near('osm effective', ntr_osm_effective(140, 5), 285, 1e-12);
-- Source: textbook osmolal gap, measured - calculated.
SELECT pg_temp.near('osm gap', ntr_osm_gap(310, 290), 20, 1e-12);

-- Source: Katz, N Engl J Med 1973;289:843-4 (1.6 per 100 mg/dL) and
-- Hillier et al., Am J Med 1999;106:399-403 (2.4): Na 125, glucose 600 mg/dL.
SELECT pg_temp.near('glucose mmol/L',
                    ntr_convert(600, 'glucose', 'mg/dL', 'mmol/L'), 600 / 18.0156, 1e-9);
SELECT pg_temp.near('katz', ntr_na_corrected_glucose(
    125, ntr_convert(600, 'glucose', 'mg/dL', 'mmol/L')), 133, 1e-9);
SELECT pg_temp.near('hillier', ntr_na_corrected_glucose(
    125, ntr_convert(600, 'glucose', 'mg/dL', 'mmol/L'), 'Hillier'), 137, 1e-9);

-- Source: Adrogue & Madias, N Engl J Med 2000;342:1493-9 (hypernatremia),
-- worked example from memory: man of 78 years, 68 kg, Na 165: TBW 34 L,
-- 1 L of 5% dextrose lowers Na by 165/35 = 4.7 mmol/L.
SELECT pg_temp.near('tbw elderly man', ntr_tbw_fraction('male', 78, 68), 34, 1e-12);
SELECT pg_temp.near('d5w per litre',
    ntr_infusate_change_per_litre(165, ntr_tbw_fraction('male', 78, 68),
                                  ntr_fluid_na('dextrose_5'), ntr_fluid_k('dextrose_5')),
    -4.7, 0.05);
-- Source: Adrogue & Madias 2000 table of infusates (3% saline 513, Ringer's
-- lactate 130 with K 4).
SELECT pg_temp.near('3% saline', ntr_fluid_na('nacl_3'), 513, 0);
SELECT pg_temp.near('ringer K', ntr_fluid_k('ringer_lactate'), 4, 0);

-- Source: Watson, Watson & Batt, Am J Clin Nutr 1980;33:27-39 (men):
-- 2.447 - 0.09516*40 + 0.1074*180 + 0.3362*80 = 44.8686 L.
SELECT pg_temp.near('watson', ntr_tbw_watson('male', 40, 180, 80), 44.8686, 1e-9);

-- Hand-worked exact inverse of the mass balance on the inputs of the Furst
-- et al. (Am J Med Sci 2000;319:240-4) example: Na 108, TBW 30 L, 3% saline;
-- a rise of 4 needs 4*30/(513 - 108 - 4) = 120/401 = 0.299 L. (The paper
-- dosed a rise of 5 by the sodium-deficit step, 292 mL, reaching about 112.)
SELECT pg_temp.near('furst volume',
    ntr_infusate_volume_for_change(108, 30, 513, 0, 4), 0.3, 0.01);
SELECT pg_temp.near('volume round trip',
    ntr_infusate_change(108, 30, 513, 0, ntr_infusate_volume_for_change(108, 30, 513, 0, 4)),
    4, 1e-9);

-- Source: Furst et al. 2000 (ratio and its table); Rose & Post, 5th ed.
-- (EFWC): urine 2 L with Na 60, K 20; serum Na 120.
SELECT pg_temp.near('furst ratio', ntr_furst_ratio(60, 20, 120), 2.0 / 3, 1e-15);
SELECT pg_temp.same('restriction', ntr_restriction_from_ratio(2.0 / 3), 'under_1000_ml');
SELECT pg_temp.same('restriction at 1', ntr_restriction_from_ratio(1.0), '500_to_700_ml');
SELECT pg_temp.same('restriction above 1', ntr_restriction_from_ratio(1.2), 'under_500_ml');
SELECT pg_temp.near('efwc', ntr_efwc(2, 60, 20, 120), 2.0 / 3, 1e-15);

-- Source: common practice (textbook deficit formulas).
SELECT pg_temp.near('free water deficit', ntr_free_water_deficit(40, 154), 4, 1e-12);
SELECT pg_temp.near('sodium deficit', ntr_na_deficit(30, 120, 126), 180, 1e-12);

-- Source: Spasovski et al., Eur J Endocrinol 2014 (severity bands: mild
-- 130 to 134, moderate 125 to 129, profound below 125; measured
-- osmolality below 275 is hypotonic).
SELECT pg_temp.same('severity 124', ntr_na_severity(124), 'profound'),
       pg_temp.same('severity 127', ntr_na_severity(127), 'moderate'),
       pg_temp.same('severity 132', ntr_na_severity(132), 'mild'),
       pg_temp.same('severity 140', ntr_na_severity(140), 'none'),
       pg_temp.same('tonicity 260', ntr_tonicity_class(260), 'hypotonic'),
       pg_temp.same('tonicity 285', ntr_tonicity_class(285), 'isotonic'),
       pg_temp.same('tonicity 310', ntr_tonicity_class(310), 'hypertonic');
-- Source: the standard fractional-excretion formula (U_x P_cr)/(P_x U_cr)
-- x 100, hand-worked: urine Na 40, plasma Na 130 mmol/L, urine creatinine
-- 8000, plasma creatinine 80 umol/L -> 0.3077 %.
SELECT pg_temp.near('FENa', ntr_fractional_excretion(40, 130, 8000, 80),
                    40.0 * 80 / (130.0 * 8000) * 100, 1e-12);
-- Source: Adrogue & Madias 2000 (one 1 L inflow is their per-litre
-- formula): 3% saline into TBW 30 L at Na 108 -> (108*30 + 513)/31.
SELECT pg_temp.near('balance one litre',
    ntr_balance_predict(108, 30, ARRAY[1.0], ARRAY[513.0], ARRAY[0.0]), (108.0 * 30 + 513) / 31, 1e-9);
SELECT pg_temp.near('balance = per litre',
    ntr_balance_predict(108, 30, ARRAY[1.0], ARRAY[513.0], ARRAY[0.0]),
    108 + ntr_infusate_change_per_litre(108, 30, 513), 1e-9);
-- Source: Adrogue & Madias 2000 formula solved for volume, 5% dextrose, no
-- urine (hand-worked): lowering 125.5 by 3.5 with TBW 26.1 L needs
-- 3.5 * 26.1 / 122 = 0.7488 L.
SELECT pg_temp.near('relower', ntr_relower_volume(125.5, 26.1, 0, 0, 3.5, 6), 3.5 * 26.1 / 122, 1e-9);

-- ------------------------------------------------------------ invalid input
SELECT pg_temp.same('range gives NULL', ntr_osm_effective(300, 5), NULL::float8);
SELECT pg_temp.same('NaN gives NULL', ntr_osm_effective('NaN', 5), NULL::float8);
SELECT pg_temp.same('domain gives NULL', ntr_free_water_deficit(40, 130), NULL::float8);
SELECT pg_temp.same('unknown name gives NULL',
                    ntr_osm_calculated(140, 5, 5, 0, 'three_na'), NULL::float8);
SELECT pg_temp.same('NULL gives NULL', ntr_osm_effective(NULL, 5), NULL::float8);

SELECT pg_temp.raises('range', 'SELECT ntr_osm_effective_checked(300, 5)', '22003');
SELECT pg_temp.raises('NaN', $q$SELECT ntr_osm_effective_checked('NaN', 5)$q$, '22023');
SELECT pg_temp.raises('infinity', $q$SELECT ntr_efwc_checked(1, 'Infinity', 0, 140)$q$, '22023');
SELECT pg_temp.raises('domain', 'SELECT ntr_free_water_deficit_checked(40, 130)', '22023');
SELECT pg_temp.raises('unknown formula',
    $q$SELECT ntr_osm_calculated_checked(140, 5, 5, 0, 'three_na')$q$, '22023');
SELECT pg_temp.raises('balance arrays differ',
    'SELECT ntr_balance_predict_checked(108, 30, ARRAY[1.0, 2.0], ARRAY[513.0], ARRAY[0.0])', '22023');
SELECT pg_temp.same('severity NULL for range', ntr_na_severity(500), NULL::text);
SELECT pg_temp.raises('unknown sex', $q$SELECT ntr_tbw_fraction_checked('x', 40, 70)$q$, '22023');
SELECT pg_temp.raises('unknown unit',
    $q$SELECT ntr_convert_checked(1, 'glucose', 'MG/DL', 'mmol/L')$q$, '22023');
SELECT pg_temp.near('checked returns the value', ntr_osm_effective_checked(140, 5), 285, 0);

-- Every natremia function is IMMUTABLE and PARALLEL SAFE, and every one
-- that takes no aggregate state is STRICT.
DO $$
DECLARE
    bad text;
BEGIN
    SELECT string_agg(p.oid::regprocedure::text, ', ') INTO bad
    FROM pg_proc p
    JOIN pg_depend d ON d.objid = p.oid AND d.classid = 'pg_proc'::regclass
    JOIN pg_extension e ON e.oid = d.refobjid AND e.extname = 'natremia'
    WHERE p.prokind = 'f'
      AND (p.provolatile <> 'i' OR p.proparallel <> 's'
           OR (NOT p.proisstrict AND NOT 'internal'::regtype = ANY (p.proargtypes)));
    IF bad IS NOT NULL THEN
        RAISE EXCEPTION 'check failed: not IMMUTABLE STRICT PARALLEL SAFE: %', bad;
    END IF;
    SELECT string_agg(p.oid::regprocedure::text, ', ') INTO bad
    FROM pg_proc p
    JOIN pg_depend d ON d.objid = p.oid AND d.classid = 'pg_proc'::regclass
    JOIN pg_extension e ON e.oid = d.refobjid AND e.extname = 'natremia'
    WHERE p.prokind = 'a' AND p.proparallel <> 's';
    IF bad IS NOT NULL THEN
        RAISE EXCEPTION 'check failed: aggregate not PARALLEL SAFE: %', bad;
    END IF;
END $$;

-- ------------------------------------------------------------ correction
-- Limits: 10 mmol/L in any 24 h, 18 in 48 h, at least 4 in the first 24 h
-- (Verbalis et al., Am J Med 2013; Spasovski et al., Eur J Endocrinol
-- 2014); high risk 8 and 16. Invented series, worked by hand:
--   patient 1: 110, 116, 122, 124 at 0, 6, 12, 24 h: the largest rise
--     within 24 h is 124 - 110 = 14 > 10, so over_24h with excess 4; the
--     last rate is (124 - 122)/12 = 0.1667 mmol/L/h.
--   patient 2: 118, 120, 121, 121 at 0, 12, 24, 30 h: the first 24 h rise
--     is 3 < 4 after 24 h have passed: below_target.
--   patient 3: 112, 115, 117 at 0, 4, 8 h (given out of order, with a row
--     lacking its sodium): rise 5, rate 0.5, no flag.
CREATE TEMP TABLE lab (patient int, hours float8, na float8);
INSERT INTO lab VALUES
    (1, 0, 110), (1, 6, 116), (1, 12, 122), (1, 24, 124),
    (2, 0, 118), (2, 12, 120), (2, 24, 121), (2, 30, 121),
    (3, 8, 117), (3, 0, 112), (3, 6, NULL), (3, 4, 115);

CREATE TEMP TABLE assessed AS
SELECT patient, (ntr_correction_assess(hours, na ORDER BY hours)).*
FROM lab GROUP BY patient;

SELECT pg_temp.near('p1 max 24h', max_rise_24h, 14, 1e-12),
       pg_temp.near('p1 excess', excess_mmol_l, 4, 1e-12),
       pg_temp.near('p1 rate', last_rate_per_h, 2.0 / 12, 1e-15),
       pg_temp.same('p1 flags', flag_names, ARRAY['over_24h']),
       pg_temp.same('p1 flag bits', flags, 1),
       pg_temp.same('p1 samples', samples, 4)
FROM assessed WHERE patient = 1;
SELECT pg_temp.near('p2 first 24h', rise_first_24h, 3, 1e-12),
       pg_temp.same('p2 flags', flag_names, ARRAY['below_target'])
FROM assessed WHERE patient = 2;
SELECT pg_temp.near('p3 max 24h', max_rise_24h, 5, 1e-12),
       pg_temp.near('p3 rate', last_rate_per_h, 0.5, 1e-15),
       pg_temp.same('p3 flags', flags, 0),
       pg_temp.same('p3 samples', samples, 3)
FROM assessed WHERE patient = 3;

-- Row order does not matter: without ORDER BY the result is the same.
SELECT pg_temp.same('order-free', (SELECT count(*) FROM (
    SELECT patient, (ntr_correction_assess(hours, na)).* FROM lab GROUP BY patient
    EXCEPT SELECT * FROM assessed) x), 0::bigint);

-- The array form gives the same row.
SELECT pg_temp.same('array form',
    (ntr_correction_assess_series(ARRAY[0, 6, 12, 24]::float8[],
                                  ARRAY[110, 116, 122, 124]::float8[])).max_rise_24h,
    14::float8);

-- High-risk preset: 14 - 8 = 6 over; 14 is within 2 of the 48 h limit 16,
-- so near_limit is set too (the library's near-limit margin of 2 mmol/L).
SELECT pg_temp.near('p1 high risk excess', (ntr_correction_assess(hours, na, 'high_risk')).excess_mmol_l, 6, 1e-12),
       pg_temp.same('p1 high risk flags', (ntr_correction_assess(hours, na, 'high_risk')).flag_names,
                    ARRAY['over_24h', 'near_limit'])
FROM lab WHERE patient = 1;
-- Explicit limits 12 / 20 / 4: excess 2.
SELECT pg_temp.near('p1 explicit limits', (ntr_correction_assess(hours, na, 12, 20, 4)).excess_mmol_l, 2, 1e-12)
FROM lab WHERE patient = 1;

-- Invalid series: NULL, or an error from the _checked aggregate.
SELECT pg_temp.same('bad sodium gives NULL',
    (SELECT ntr_correction_assess(h, v) FROM (VALUES (0.0::float8, 110.0::float8), (6, 300)) s(h, v)),
    NULL::ntr_correction);
SELECT pg_temp.same('unknown preset gives NULL',
    (SELECT ntr_correction_assess(h, v, 'lenient') FROM (VALUES (0.0::float8, 110.0::float8)) s(h, v)),
    NULL::ntr_correction);
SELECT pg_temp.same('no rows gives NULL',
    (SELECT ntr_correction_assess(hours, na) FROM lab WHERE false), NULL::ntr_correction);
SELECT pg_temp.raises('checked aggregate range',
    $q$SELECT ntr_correction_assess_checked(h, v) FROM (VALUES (0.0::float8, 110.0::float8), (6, 300)) s(h, v)$q$,
    '22003');
SELECT pg_temp.raises('checked aggregate preset',
    $q$SELECT ntr_correction_assess_checked(h, v, 'lenient') FROM (VALUES (0.0::float8, 110.0::float8)) s(h, v)$q$,
    '22023');

-- Parallel partial aggregation (combine, serialize, deserialize) gives the
-- same result as a plain plan, on an invented cohort of 3000 patients.
CREATE TABLE cohort AS
SELECT p AS patient, t::float8 AS hours,
       112 + (p % 7) + t * ((p % 5) * 0.1) + ((p * 31 + t * 7) % 3) AS na
FROM generate_series(1, 3000) p, generate_series(0, 36, 6) t;
ANALYZE cohort;
SET max_parallel_workers_per_gather = 0;
CREATE TEMP TABLE serial AS
SELECT patient, (ntr_correction_assess(hours, na)).* FROM cohort GROUP BY patient;
SET max_parallel_workers_per_gather = 2;
SET parallel_setup_cost = 0;
SET parallel_tuple_cost = 0;
SET min_parallel_table_scan_size = 0;
SET enable_hashagg = off;
DO $$
DECLARE
    line text;
    partial boolean := false;
BEGIN
    FOR line IN EXPLAIN SELECT patient, ntr_correction_assess(hours, na)
                FROM cohort GROUP BY patient LOOP
        partial := partial OR line LIKE '%Partial%Aggregate%';
    END LOOP;
    IF NOT partial THEN
        RAISE EXCEPTION 'check failed: no partial aggregation in the parallel plan';
    END IF;
END $$;
SELECT pg_temp.same('parallel == serial', (SELECT count(*) FROM (
    (SELECT patient, (ntr_correction_assess(hours, na)).* FROM cohort GROUP BY patient
     EXCEPT SELECT * FROM serial)
    UNION ALL
    (SELECT * FROM serial EXCEPT
     SELECT patient, (ntr_correction_assess(hours, na)).* FROM cohort GROUP BY patient)) x),
    0::bigint);
SELECT pg_temp.same('cohort size', (SELECT count(*) FROM serial WHERE samples = 7), 3000::bigint);

-- ------------------------------------------------------------ 1.1: course
SELECT pg_temp.same('default version',
    (SELECT extversion FROM pg_extension WHERE extname = 'natremia'), '1.1');

-- Presets. Source: Adrogue & Madias, Hypernatremia, N Engl J Med
-- 2000;342:1493-9 (chronic: lower by at most about 10 mmol/L a day);
-- Spasovski et al., Eur J Endocrinol 2014 (10 in 24 h, 18 in 48 h) and the
-- US panel's 8 in any 24 h at high risk (16 in 48 h: the library's 2 x 8).
SELECT pg_temp.same('hyper_chronic goal', (ntr_course_limits_preset('hyper_chronic')).goal, 'lower'),
       pg_temp.near('hyper_chronic fall', (ntr_course_limits_preset('hyper_chronic')).max_fall_24h, 10, 0),
       pg_temp.near('hyper_chronic target', (ntr_course_limits_preset('hyper_chronic')).min_change_24h, 0, 0),
       pg_temp.same('hypo_standard goal', (ntr_course_limits_preset('HYPO_STANDARD')).goal, 'raise'),
       pg_temp.near('hypo_standard 24h', (ntr_course_limits_preset('hypo_standard')).max_rise_24h, 10, 0),
       pg_temp.near('hypo_standard 48h', (ntr_course_limits_preset('hypo_standard')).max_rise_48h, 18, 0),
       pg_temp.near('hypo_high_risk 24h', (ntr_course_limits_preset('hypo_high_risk')).max_rise_24h, 8, 0),
       pg_temp.near('hypo_high_risk 48h', (ntr_course_limits_preset('hypo_high_risk')).max_rise_48h, 16, 0);
SELECT pg_temp.same('unknown course preset gives NULL',
    ntr_course_limits_preset('lenient'), NULL::ntr_course_limits);
SELECT pg_temp.raises('unknown course preset checked',
    $q$SELECT ntr_course_limits_preset_checked('lenient')$q$, '22023');

-- The falling cases, invented series, worked by hand (a fall is the
-- largest decrease between two samples at most 24 h apart):
--   hyper_24h:  165 -> 140 in 24 h, lowering: fall 25, 15 over the limit 10;
--   hyper_12h:  170, 160, 148 at 0, 6, 12 h: fall 22, excess 12;
--   hypo_worse: 124 -> 112 in 12 h while raising: 12 against the goal;
--   hypo_fast:  the 1.0 patient 1 (110 -> 124 in 24 h): rise 14, excess 4.
CREATE TEMP TABLE course_lab (patient text, hours float8, na float8, preset text);
INSERT INTO course_lab VALUES
    ('hyper_24h', 24, 140, 'hyper_chronic'), ('hyper_24h', 0, 165, 'hyper_chronic'),
    ('hyper_12h', 0, 170, 'hyper_chronic'), ('hyper_12h', 6, 160, 'hyper_chronic'),
    ('hyper_12h', 12, 148, 'hyper_chronic'),
    ('hypo_worse', 0, 124, 'hypo_standard'), ('hypo_worse', 12, 112, 'hypo_standard'),
    ('hypo_worse', 6, NULL, 'hypo_standard'),
    ('hypo_fast', 0, 110, 'hypo_standard'), ('hypo_fast', 6, 116, 'hypo_standard'),
    ('hypo_fast', 12, 122, 'hypo_standard'), ('hypo_fast', 24, 124, 'hypo_standard');
CREATE TEMP TABLE course_assessed AS
SELECT patient, (ntr_course_assess(hours, na, preset)).*
FROM course_lab GROUP BY patient;

SELECT pg_temp.same('hyper_24h goal', goal, 'lower'),
       pg_temp.near('hyper_24h fall', max_fall_24h, 25, 1e-12),
       pg_temp.near('hyper_24h rise', max_rise_24h, 0, 0),
       pg_temp.near('hyper_24h excess', excess_mmol_l, 15, 1e-12),
       pg_temp.same('hyper_24h fall flagged', 'fall_over_24h' = ANY (flag_names), true),
       pg_temp.same('hyper_24h bit', flags & 128, 128),
       pg_temp.same('hyper_24h not below target', 'below_target' = ANY (flag_names), false),
       pg_temp.same('hyper_24h not wrong way', 'wrong_way' = ANY (flag_names), false),
       pg_temp.same('hyper_24h samples', samples, 2)
FROM course_assessed WHERE patient = 'hyper_24h';
-- "Now" and the time of the worst window (hand-worked): 165 -> 140 is the
-- whole course, so the fall now is 25 too, and the worst window ends at
-- 24 h; the last rate is -25/24 mmol/L/h.
SELECT pg_temp.near('hyper_24h fall now', fall_now_24h, 25, 1e-12),
       pg_temp.near('hyper_24h fall first', fall_first_24h, 25, 1e-12),
       pg_temp.near('hyper_24h worst at', worst_at_h, 24, 0),
       pg_temp.near('hyper_24h rate', last_rate_per_h, -25.0 / 24, 1e-15),
       pg_temp.near('hyper_24h elapsed', elapsed_h, 24, 0)
FROM course_assessed WHERE patient = 'hyper_24h';
SELECT pg_temp.same('no breach: worst_at_h NULL',
    (ntr_course_assess_series(ARRAY[0, 24]::float8[], ARRAY[160, 155]::float8[], 'hyper_chronic')).worst_at_h,
    NULL::float8);
-- Presets beyond the issue's three (header table; Adrogue & Madias 2000
-- for the acute pace of about 1 mmol/L/h; hold: the library's margin).
SELECT pg_temp.near('hyper_acute fall', (ntr_course_limits_preset('hyper_acute')).max_fall_24h, 24, 0),
       pg_temp.same('hold goal', (ntr_course_limits_preset('hold')).goal, 'hold');
SELECT pg_temp.near('hyper_12h fall', max_fall_24h, 22, 1e-12),
       pg_temp.near('hyper_12h excess', excess_mmol_l, 12, 1e-12),
       pg_temp.same('hyper_12h fall flagged', 'fall_over_24h' = ANY (flag_names), true)
FROM course_assessed WHERE patient = 'hyper_12h';
SELECT pg_temp.near('hypo_worse fall', max_fall_24h, 12, 1e-12),
       pg_temp.same('hypo_worse wrong way', 'wrong_way' = ANY (flag_names), true),
       pg_temp.same('hypo_worse no rise flag', 'rise_over_24h' = ANY (flag_names), false),
       pg_temp.same('hypo_worse samples (NULL skipped)', samples, 2)
FROM course_assessed WHERE patient = 'hypo_worse';
SELECT pg_temp.near('hypo_fast rise', max_rise_24h, 14, 1e-12),
       pg_temp.near('hypo_fast excess', excess_mmol_l, 4, 1e-12),
       pg_temp.same('hypo_fast rise flagged', 'rise_over_24h' = ANY (flag_names), true),
       pg_temp.same('hypo_fast not wrong way', 'wrong_way' = ANY (flag_names), false)
FROM course_assessed WHERE patient = 'hypo_fast';
-- The same rise as the 1.0 aggregate finds for that patient.
SELECT pg_temp.same('course rise = 1.0 rise',
    (SELECT (ntr_course_assess(hours, na, 'hypo_standard')).max_rise_24h FROM lab WHERE patient = 1),
    (SELECT max_rise_24h FROM assessed WHERE patient = 1));

-- A goal and explicit limits. Hand-worked: hold, 6 either way per 24 h;
-- 140 -> 147.5 in 12 h rises 7.5, 1.5 over, a move past a limit.
SELECT pg_temp.near('hold excess', (ntr_course_assess(h, v, 'hold', 6, 12, 6, 12, 0)).excess_mmol_l, 1.5, 1e-12),
       pg_temp.same('hold flags', (ntr_course_assess(h, v, 'hold', 6, 12, 6, 12, 0)).flag_names
                    @> ARRAY['rise_over_24h', 'wrong_way'], true),
       pg_temp.same('hold goal', (ntr_course_assess(h, v, 'HOLD', 6, 12, 6, 12, 0)).goal, 'hold')
FROM (VALUES (0.0::float8, 140.0::float8), (12, 147.5)) s(h, v);
-- The array form gives the same row as the aggregate.
SELECT pg_temp.same('course array form',
    ntr_course_assess_series(ARRAY[0, 24]::float8[], ARRAY[165, 140]::float8[], 'hyper_chronic'),
    (SELECT (goal, max_rise_24h, max_rise_48h, max_fall_24h, max_fall_48h, excess_mmol_l,
             flags, flag_names, rise_first_24h, fall_first_24h, rise_now_24h, fall_now_24h,
             last_rate_per_h, elapsed_h, worst_at_h, samples)::ntr_course_report
     FROM course_assessed WHERE patient = 'hyper_24h'));
SELECT pg_temp.same('course flag names', ntr_course_flag_names(128 | 512 | 1),
                    ARRAY['rise_over_24h', 'fall_over_24h', 'wrong_way']);

-- Invalid input: NULL, or an error from the _checked aggregate.
SELECT pg_temp.same('course unknown preset gives NULL',
    (SELECT ntr_course_assess(h, v, 'lenient') FROM (VALUES (0.0::float8, 150.0::float8)) s(h, v)),
    NULL::ntr_course_report);
SELECT pg_temp.same('course unknown goal gives NULL',
    (SELECT ntr_course_assess(h, v, 'sideways', 10, 18, 10, 18, 0)
     FROM (VALUES (0.0::float8, 150.0::float8)) s(h, v)), NULL::ntr_course_report);
SELECT pg_temp.same('course bad sodium gives NULL',
    (SELECT ntr_course_assess(h, v, 'hyper_chronic')
     FROM (VALUES (0.0::float8, 150.0::float8), (6, 300)) s(h, v)), NULL::ntr_course_report);
SELECT pg_temp.same('course mixed presets give NULL',
    (SELECT ntr_course_assess(h, v, p)
     FROM (VALUES (0.0::float8, 150.0::float8, 'hyper_chronic'), (6, 148, 'hypo_standard')) s(h, v, p)),
    NULL::ntr_course_report);
SELECT pg_temp.raises('course checked range',
    $q$SELECT ntr_course_assess_checked(h, v, 'hyper_chronic') FROM (VALUES (0.0::float8, 150.0::float8), (6, 300)) s(h, v)$q$,
    '22003');
SELECT pg_temp.raises('course checked preset',
    $q$SELECT ntr_course_assess_checked(h, v, 'lenient') FROM (VALUES (0.0::float8, 150.0::float8)) s(h, v)$q$,
    '22023');

-- Parallel partial aggregation of the course aggregate equals the serial
-- plan on the invented cohort (the course limits travel in the state).
SET max_parallel_workers_per_gather = 0;
CREATE TEMP TABLE course_serial AS
SELECT patient, (ntr_course_assess(hours, na, 'hypo_high_risk')).* FROM cohort GROUP BY patient;
SET max_parallel_workers_per_gather = 2;
DO $$
DECLARE
    line text;
    partial boolean := false;
BEGIN
    FOR line IN EXPLAIN SELECT patient, ntr_course_assess(hours, na, 'hypo_high_risk')
                FROM cohort GROUP BY patient LOOP
        partial := partial OR line LIKE '%Partial%Aggregate%';
    END LOOP;
    IF NOT partial THEN
        RAISE EXCEPTION 'check failed: no partial aggregation in the parallel course plan';
    END IF;
END $$;
SELECT pg_temp.same('course parallel == serial', (SELECT count(*) FROM (
    (SELECT patient, (ntr_course_assess(hours, na, 'hypo_high_risk')).* FROM cohort GROUP BY patient
     EXCEPT SELECT * FROM course_serial)
    UNION ALL
    (SELECT * FROM course_serial EXCEPT
     SELECT patient, (ntr_course_assess(hours, na, 'hypo_high_risk')).* FROM cohort GROUP BY patient)) x),
    0::bigint);
SELECT pg_temp.same('course cohort size', (SELECT count(*) FROM course_serial WHERE samples = 7), 3000::bigint);

-- ------------------------------------------------------------ 1.1: tonicity
-- Source: Oster & Singer, Arch Intern Med 1999;159:333-6; Milionis et al.,
-- CMAJ 2002;166:1056-62 (urea and ethanol are ineffective osmoles; a
-- normal measured osmolality does not exclude hypotonicity). Hand-worked:
--   uraemia: Na 125, glucose 5, urea 40, measured 295: effective 255;
--   ethanol: Na 118, glucose 5, ethanol 45, measured 290: at most
--     2*118 + 5 = 241 whatever the ethanol coefficient;
--   urea 50, measured 307: effective 257.
SELECT pg_temp.same('uraemia class', (ntr_low_na_effective_tonicity(125, 5, 40, 0, 295)).tonicity, 'hypotonic'),
       pg_temp.same('uraemia flag', 'ineffective_osmoles' = ANY ((ntr_low_na_effective_tonicity(125, 5, 40, 0, 295)).flag_names), true),
       pg_temp.same('uraemia not pseudo', 'pseudo' = ANY ((ntr_low_na_effective_tonicity(125, 5, 40, 0, 295)).flag_names), false),
       pg_temp.same('ethanol class', (ntr_low_na_effective_tonicity(118, 5, 0, 45, 290)).tonicity, 'hypotonic'),
       pg_temp.same('ethanol flag', (ntr_low_na_effective_tonicity(118, 5, 0, 45, 290)).flags & 32, 32),
       pg_temp.same('ethanol not pseudo', (ntr_low_na_effective_tonicity(118, 5, 0, 45, 290)).flags & 2, 0),
       pg_temp.same('urea 50 class', (ntr_low_na_effective_tonicity(125, 5, 50, 0, 307, 'hillier')).tonicity, 'hypotonic'),
       pg_temp.same('urea 50 not translocational',
                    'translocational' = ANY ((ntr_low_na_effective_tonicity(125, 5, 50, 0, 307)).flag_names), false);
SELECT pg_temp.near('effective osmolality uraemia', ntr_effective_osm_measured(125, 5, 40, 0, 295), 255, 1e-12),
       pg_temp.same('effective osmolality range', ntr_effective_osm_measured(125, 5, 40, 0, 900), NULL::float8);
-- The 1.0 class of the measured value cannot see urea: isotonic.
SELECT pg_temp.same('measured class', ntr_tonicity_class(295), 'isotonic');
SELECT pg_temp.same('tonicity range gives NULL',
    ntr_low_na_effective_tonicity(125, 5, -1, 0, 295), NULL::ntr_low_na_tonicity);
SELECT pg_temp.raises('tonicity checked NaN',
    $q$SELECT ntr_low_na_effective_tonicity_checked(125, 5, 'NaN', 0, 295)$q$, '22023');
SELECT pg_temp.raises('tonicity checked method',
    $q$SELECT ntr_low_na_effective_tonicity_checked(125, 5, 40, 0, 295, 'guess')$q$, '22023');

-- ------------------------------------------------------------ 1.1: units (issue 13)
-- Runs a statement and expects an error whose message contains a text.
CREATE FUNCTION pg_temp.says(label text, statement text, fragment text)
RETURNS void LANGUAGE plpgsql AS $$
DECLARE
    got text;
BEGIN
    BEGIN
        EXECUTE statement;
    EXCEPTION WHEN OTHERS THEN
        got := SQLERRM;
    END;
    IF got IS NULL OR strpos(got, fragment) = 0 THEN
        RAISE EXCEPTION 'check failed: % said %, expected a message with %', label,
            coalesce(got, 'nothing'), fragment;
    END IF;
END $$;

-- Unit errors speak of units (issue 13), not of ranges.
SELECT pg_temp.says('unknown unit named',
    $q$SELECT ntr_convert_checked(1, 'glucose', 'MG/DL', 'mmol/L')$q$,
    'unit "MG/DL" is not known');
SELECT pg_temp.says('unknown target unit named',
    $q$SELECT ntr_convert_checked(1, 'glucose', 'mg/dL', 'mmol/l')$q$,
    'unit "mmol/l" is not known');
SELECT pg_temp.says('unit that does not fit',
    $q$SELECT ntr_convert_checked(5, 'glucose', 'meq/L', 'mmol/L')$q$,
    'unit "meq/L" does not fit analyte "glucose"');
SELECT pg_temp.says('target unit that does not fit',
    $q$SELECT ntr_convert_checked(290, 'osmolality', 'mosm/kg', 'mmol/L')$q$,
    'unit "mmol/L" does not fit analyte "osmolality"');
SELECT pg_temp.raises('unit that does not fit, SQLSTATE',
    $q$SELECT ntr_convert_checked(5, 'glucose', 'meq/L', 'mmol/L')$q$, '22023');
SELECT pg_temp.same('unknown unit gives NULL',
    ntr_convert(1, 'glucose', 'mg/dl', 'mmol/L'), NULL::float8);
-- The 1.1 analytes. Sources: Spasovski et al. 2014 (uric acid 4 mg/dL =
-- 0.24 mmol/L, the guideline's rounding); osmolality converts to itself.
SELECT pg_temp.near('uric acid mg/dL', ntr_convert(4, 'uric_acid', 'mg/dL', 'mmol/L'),
                    0.24, 0.005);
SELECT pg_temp.same('osmolality identity',
                    ntr_convert(287.5, 'osmolality', 'mosm/kg', 'mosm/kg'), 287.5::float8);
-- Lab spellings (docs/units.md; UCUM and common practice).
SELECT pg_temp.same('mEq/L', ntr_unit_normalize('mEq/L'), 'meq/L');
SELECT pg_temp.same('mg/dl', ntr_unit_normalize('mg/dl'), 'mg/dL');
SELECT pg_temp.same('mOsm/kg H2O', ntr_unit_normalize(' mOsm/kg H2O '), 'mosm/kg');
SELECT pg_temp.same('micro sign', ntr_unit_normalize(E'\u00b5mol/L'), 'umol/L');
SELECT pg_temp.same('mOsm/L refused', ntr_unit_normalize('mOsm/L'), NULL::text);
SELECT pg_temp.says('mOsm/L refused, checked',
    $q$SELECT ntr_unit_normalize_checked('mOsm/L')$q$, 'unit "mOsm/L" is not known');
SELECT pg_temp.near('lab spelling then convert',
    ntr_convert(90, 'glucose', ntr_unit_normalize('mg/dl'), ntr_unit_normalize('MMOL/L')),
    90 / 18.0156, 1e-3);
-- LOINC (checked codes; tests/test_units.c names the source of each):
-- 2951-2 from the HL7 FHIR R4 example Bundle 72ac8493 and the project's
-- checked sources, 14933-6 and 14749-6 from the same Bundle.
SELECT pg_temp.same('LOINC sodium', (SELECT row(l.analyte, l.specimen, l.unit)::text
                                     FROM ntr_loinc('2951-2') l), '(sodium,serum_plasma,mmol/L)');
SELECT pg_temp.same('LOINC urate', (SELECT row(l.analyte, l.specimen, l.unit)::text
                                    FROM ntr_loinc('14933-6') l), '(uric_acid,serum_plasma,mmol/L)');
SELECT pg_temp.same('LOINC glucose mass', (ntr_loinc('2345-7')).unit, 'mg/dL');
SELECT pg_temp.same('LOINC unknown', (ntr_loinc('2951-3')).analyte, NULL::text);
SELECT pg_temp.says('LOINC unknown, checked',
    $q$SELECT ntr_loinc_checked('2951-3')$q$, 'LOINC code "2951-3" is not mapped');

-- ------------------------------------------------------------ upgrade 1.0 -> 1.1
-- A fresh 1.1 and a 1.0 updated with ALTER EXTENSION hold the same objects,
-- and both the 1.0 and the course aggregates work after the update.
CREATE TEMP TABLE objects_fresh AS
SELECT pg_describe_object(classid, objid, objsubid) AS object
FROM pg_depend
WHERE refclassid = 'pg_extension'::regclass AND deptype = 'e'
  AND refobjid = (SELECT oid FROM pg_extension WHERE extname = 'natremia');
-- Solute and restriction (1.1). Berl T, J Am Soc Nephrol 2008;19:1076-8:
-- V = solute / U_osm; Furst H et al. 2000: the allowance is
-- V * (1 - (U_Na + U_K)/S_Na) + insensible. Values hand-worked.
SELECT pg_temp.near('Berl 600/600 (hand-worked)', ntr_urine_volume_from_solute(600, 600), 1.0, 1e-12);
SELECT pg_temp.near('Berl 600/100 (hand-worked)', ntr_urine_volume_from_solute(600, 100), 6.0, 1e-12);
SELECT pg_temp.same('urine volume, invalid osmolality gives NULL',
    ntr_urine_volume_from_solute(600, -5), NULL::float8);
SELECT pg_temp.raises('urine volume range', 'SELECT ntr_urine_volume_from_solute_checked(600, -5)', '22003');
-- 1.2 L at ratio 170/125: 1.2 * (1 - 1.36) = -0.432 (hand-worked)
SELECT pg_temp.near('allowance negative (hand-worked)',
    ntr_fluid_allowance(600, 500, 130, 40, 125, 0), -0.432, 1e-12);
-- 2 L at ratio 75/125: 2 * 0.4 + 0.5 = 1.3 (hand-worked)
SELECT pg_temp.near('allowance with insensible (hand-worked)',
    ntr_fluid_allowance_checked(800, 400, 50, 25, 125, 0.5), 1.3, 1e-12);
SELECT pg_temp.raises('allowance serum range',
    'SELECT ntr_fluid_allowance_checked(600, 500, 130, 40, 5, 0)', '22003');
-- IUPAC molar masses: urea CH4N2O 60.056 g/mol, NaCl 58.443 g/mol
-- (2 osmoles per mole); 30 g urea = 30000/60.056 mOsm (hand-worked).
SELECT pg_temp.near('urea 30 g (IUPAC, hand-worked)',
    ntr_solute_dose_osmoles('urea', 30), 30000.0 / 60.056, 0.05);
SELECT pg_temp.near('NaCl 1 g (IUPAC, hand-worked)',
    ntr_solute_dose_osmoles_checked('NaCl', 1), 2000.0 / 58.443, 0.01);
SELECT pg_temp.same('unknown solute gives NULL', ntr_solute_dose_osmoles('sugar', 1), NULL::float8);
SELECT pg_temp.raises('unknown solute', $q$SELECT ntr_solute_dose_osmoles_checked('sugar', 1)$q$, '22023');
-- Fenske W et al. J Clin Endocrinol Metab 2008;93:2991-7: FEurate below 8 %
-- against SIAD, above 12 % supports it.
SELECT pg_temp.same('FEurate 5 %', ntr_fe_uric_acid_class(5), 'against_siad');
SELECT pg_temp.same('FEurate 10 %', ntr_fe_uric_acid_class(10), 'indeterminate');
SELECT pg_temp.same('FEurate 12 %', ntr_fe_uric_acid_class(12), 'indeterminate');
SELECT pg_temp.same('FEurate 15 %', ntr_fe_uric_acid_class_checked(15), 'supports_siad');
SELECT pg_temp.raises('FEurate NaN', $q$SELECT ntr_fe_uric_acid_class_checked('NaN')$q$, '22023');

DROP EXTENSION natremia;
CREATE EXTENSION natremia VERSION '1.0';
SELECT pg_temp.same('1.0 installed',
    (SELECT extversion FROM pg_extension WHERE extname = 'natremia'), '1.0');
SELECT pg_temp.same('1.0 has no course aggregate',
    (SELECT count(*) FROM pg_proc WHERE proname = 'ntr_course_assess'), 0::bigint);
SELECT pg_temp.near('1.0 aggregate before update',
    (SELECT (ntr_correction_assess(hours, na)).max_rise_24h FROM lab WHERE patient = 1), 14, 1e-12);
ALTER EXTENSION natremia UPDATE TO '1.1';
SELECT pg_temp.same('updated version',
    (SELECT extversion FROM pg_extension WHERE extname = 'natremia'), '1.1');
SELECT pg_temp.same('fresh and updated objects', (SELECT count(*) FROM (
    (SELECT object FROM objects_fresh
     EXCEPT
     SELECT pg_describe_object(classid, objid, objsubid) FROM pg_depend
     WHERE refclassid = 'pg_extension'::regclass AND deptype = 'e'
       AND refobjid = (SELECT oid FROM pg_extension WHERE extname = 'natremia'))
    UNION ALL
    (SELECT pg_describe_object(classid, objid, objsubid) FROM pg_depend
     WHERE refclassid = 'pg_extension'::regclass AND deptype = 'e'
       AND refobjid = (SELECT oid FROM pg_extension WHERE extname = 'natremia')
     EXCEPT
     SELECT object FROM objects_fresh)) x), 0::bigint);
-- (the comparison saw both generations of objects)
SELECT pg_temp.same('fresh 1.1 objects listed',
    (SELECT count(*) FROM objects_fresh WHERE object IN (
        'function ntr_course_assess(double precision,double precision,text)',
        'type ntr_course_report', 'type ntr_low_na_tonicity',
        'function ntr_correction_assess(double precision,double precision)',
        'function ntr_osm_effective(double precision,double precision)',
        'function ntr_fluid_allowance(double precision,double precision,double precision,double precision,double precision,double precision)')), 6::bigint);
SELECT pg_temp.same('1.0 aggregate after update', (SELECT count(*) FROM (
    SELECT patient, (ntr_correction_assess(hours, na)).* FROM lab GROUP BY patient
    EXCEPT SELECT * FROM assessed) x), 0::bigint);
SELECT pg_temp.same('course aggregate after update', (SELECT count(*) FROM (
    SELECT patient, (ntr_course_assess(hours, na, preset)).* FROM course_lab GROUP BY patient
    EXCEPT SELECT * FROM course_assessed) x), 0::bigint);

\o
\pset tuples_only on
SELECT 'natremia SQL checks passed' AS result;
