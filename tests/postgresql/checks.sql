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

\o
\pset tuples_only on
SELECT 'natremia SQL checks passed' AS result;
