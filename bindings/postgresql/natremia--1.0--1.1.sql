-- SPDX-License-Identifier: MIT
-- natremia 1.0 -> 1.1: the sodium course in both directions, tonicity
-- judged on the effective osmolality, solute and restriction, and the
-- fractional urate excretion. Everything of 1.0 stays as it was
-- (ntr_correction_assess and its type keep their meaning for existing
-- queries); this script only adds. A fresh CREATE EXTENSION natremia runs
-- natremia--1.1.sql, which the Makefile builds as natremia--1.0.sql
-- followed by this file, so both paths give the same objects.
--
-- Every result is an estimate for decision support, not an order: verify
-- with measured values, follow local protocols and licensed clinical
-- judgement.

\echo Use "ALTER EXTENSION natremia UPDATE TO '1.1'" to load this file. \quit

-- ---------------------------------------------------------------- course
CREATE TYPE ntr_course_report AS (
    goal            text,    -- raise, lower or hold: the goal the limits carry
    max_rise_24h    float8,  -- largest rise between samples at most 24 h apart
    max_rise_48h    float8,  -- largest rise between samples at most 48 h apart
    max_fall_24h    float8,  -- largest fall between samples at most 24 h apart
    max_fall_48h    float8,  -- largest fall between samples at most 48 h apart
    excess_mmol_l   float8,  -- the worst window's excess over its limit, either direction
    flags           int4,    -- NTR_CF_* bits
    flag_names      text[],  -- the same bits by name (rise_over_24h, fall_over_24h, wrong_way, ...)
    rise_first_24h  float8,  -- highest sodium within 24 h of the first sample, minus the first
    fall_first_24h  float8,  -- the first sample minus the lowest within 24 h of it
    rise_now_24h    float8,  -- "now": the last sample minus the lowest in the 24 h ending at it
    fall_now_24h    float8,  -- "now": the highest in the 24 h ending at the last sample minus the last
    last_rate_per_h float8,  -- change per hour over the last interval
    elapsed_h       float8,  -- last sample's time minus the first's
    worst_at_h      float8,  -- time of the later sample of the worst window; NULL when none is over
    samples         int4     -- number of samples assessed
);

CREATE TYPE ntr_course_limits AS (
    goal            text,
    max_rise_24h    float8,
    max_rise_48h    float8,
    max_fall_24h    float8,
    max_fall_48h    float8,
    min_change_24h  float8
);

CREATE FUNCTION ntr_course_flag_names(flags int4)
RETURNS text[] AS 'MODULE_PATHNAME', 'ntrpg_course_flag_names'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

CREATE FUNCTION ntr_course_limits_preset(preset text)
RETURNS ntr_course_limits AS 'MODULE_PATHNAME', 'ntrpg_course_limits'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_course_limits_preset_checked(preset text)
RETURNS ntr_course_limits AS 'MODULE_PATHNAME', 'ntrpg_course_limits_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_course_limits_preset(text) IS
'The limits of a course preset: hypo_standard (raise; rises at most 10 in 24 h, 18 in 48 h), hypo_high_risk (raise; 8 and 16), hyper_chronic (lower; falls at most 10 in any 24 h), hyper_acute (lower; falls at most 24 in 24 h), hold (rises and falls at most 4 in 24 h). NULL for an unknown name.';

CREATE FUNCTION ntr_course_assess_series(hours float8[], na_mmol_l float8[], preset text)
RETURNS ntr_course_report AS 'MODULE_PATHNAME', 'ntrpg_course_series'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_course_assess_series_checked(hours float8[], na_mmol_l float8[],
                                                 preset text)
RETURNS ntr_course_report AS 'MODULE_PATHNAME', 'ntrpg_course_series_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

-- Aggregate support functions (not for direct use). The state, combine,
-- serialize and deserialize functions are the 1.0 aggregate's.
CREATE FUNCTION ntr_course_transition(internal, float8, float8, text)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_course_transition_preset'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_course_transition(internal, float8, float8, text, float8, float8,
                                      float8, float8, float8)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_course_transition_limits'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_course_final(internal)
RETURNS ntr_course_report AS 'MODULE_PATHNAME', 'ntrpg_course_final'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_course_final_checked(internal)
RETURNS ntr_course_report AS 'MODULE_PATHNAME', 'ntrpg_course_final_checked'
LANGUAGE C IMMUTABLE PARALLEL SAFE;

-- ntr_course_assess(hours, na_mmol_l, preset): one patient's series per
-- group against a course preset; rows in any order (sorted by time).
CREATE AGGREGATE ntr_course_assess(hours float8, na_mmol_l float8, preset text) (
    SFUNC = ntr_course_transition, STYPE = internal,
    FINALFUNC = ntr_course_final, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
-- ... with a goal ('raise', 'lower', 'hold') and explicit limits, mmol/L
-- (0: no limit in that direction; min_change_24h 0: no target).
CREATE AGGREGATE ntr_course_assess(hours float8, na_mmol_l float8, goal text,
                                   max_rise_24h float8, max_rise_48h float8,
                                   max_fall_24h float8, max_fall_48h float8,
                                   min_change_24h float8) (
    SFUNC = ntr_course_transition, STYPE = internal,
    FINALFUNC = ntr_course_final, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
CREATE AGGREGATE ntr_course_assess_checked(hours float8, na_mmol_l float8, preset text) (
    SFUNC = ntr_course_transition, STYPE = internal,
    FINALFUNC = ntr_course_final_checked, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
CREATE AGGREGATE ntr_course_assess_checked(hours float8, na_mmol_l float8, goal text,
                                           max_rise_24h float8, max_rise_48h float8,
                                           max_fall_24h float8, max_fall_48h float8,
                                           min_change_24h float8) (
    SFUNC = ntr_course_transition, STYPE = internal,
    FINALFUNC = ntr_course_final_checked, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);

COMMENT ON AGGREGATE ntr_course_assess(float8, float8, text) IS
'Assesses one patient''s sodium series (per GROUP BY) in both directions against a course preset (hypo_standard, hypo_high_risk, hyper_chronic, hyper_acute, hold): largest rises and falls within 24 h and 48 h, the excess over a limit, and flags by name. NULL for invalid input.';
COMMENT ON AGGREGATE ntr_course_assess(float8, float8, text, float8, float8, float8, float8, float8) IS
'Assesses one patient''s sodium series (per GROUP BY) against a goal (raise, lower, hold) and explicit limits in mmol/L: max_rise_24h, max_rise_48h, max_fall_24h, max_fall_48h (0: no limit), min_change_24h (0: no target). NULL for invalid input.';

-- ------------------------------------------------------------- tonicity
CREATE TYPE ntr_low_na_tonicity AS (
    tonicity    text,    -- hypotonic, isotonic or hypertonic (of the effective osmolality)
    flags       int4,    -- NTR_LOW_NA_* bits
    flag_names  text[]   -- the same bits by name
);

CREATE FUNCTION ntr_low_na_effective_tonicity(na_mmol_l float8, glucose_mmol_l float8,
                                              urea_mmol_l float8, ethanol_mmol_l float8,
                                              measured_osm_mosm_kg float8,
                                              glucose_method text DEFAULT 'katz')
RETURNS ntr_low_na_tonicity AS 'MODULE_PATHNAME', 'ntrpg_low_na_effective_tonicity'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_low_na_effective_tonicity_checked(na_mmol_l float8,
                                                      glucose_mmol_l float8,
                                                      urea_mmol_l float8,
                                                      ethanol_mmol_l float8,
                                                      measured_osm_mosm_kg float8,
                                                      glucose_method text DEFAULT 'katz')
RETURNS ntr_low_na_tonicity AS 'MODULE_PATHNAME', 'ntrpg_low_na_effective_tonicity_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_low_na_effective_tonicity(float8, float8, float8, float8, float8, text) IS
'Whether a low sodium is truly hypotonic, judged on the effective measured osmolality (measured minus urea and ethanol): tonicity class and flags (not_hypotonic, pseudo, translocational, glucose_explains, discordant, ineffective_osmoles). NULL for invalid input.';

CREATE FUNCTION ntr_effective_osm_measured(na_mmol_l float8, glucose_mmol_l float8,
                                           urea_mmol_l float8, ethanol_mmol_l float8,
                                           measured_osm_mosm_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_effective_osm_measured'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_effective_osm_measured_checked(na_mmol_l float8, glucose_mmol_l float8,
                                                   urea_mmol_l float8, ethanol_mmol_l float8,
                                                   measured_osm_mosm_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_effective_osm_measured_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_effective_osm_measured(float8, float8, float8, float8, float8) IS
'Effective serum osmolality from a measured one, mOsm/kg: measured less urea and 1.25 x ethanol, not below min(2*Na + glucose, measured). NULL for invalid input.';

-- ------------------------------------------------- solute and restriction
CREATE FUNCTION ntr_urine_volume_from_solute(solute_mosm_day float8,
                                             urine_osm_mosm_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_urine_volume_from_solute'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_urine_volume_from_solute_checked(solute_mosm_day float8,
                                                     urine_osm_mosm_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_urine_volume_from_solute_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_urine_volume_from_solute(float8, float8) IS
'Daily urine volume, L/day, that a solute load makes at a fixed urine osmolality: solute / U_osm (Berl 2008). NULL for invalid input.';

CREATE FUNCTION ntr_fluid_allowance(solute_mosm_day float8, urine_osm_mosm_kg float8,
                                    urine_na_mmol_l float8, urine_k_mmol_l float8,
                                    serum_na_mmol_l float8, insensible_l_day float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fluid_allowance'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_fluid_allowance_checked(solute_mosm_day float8, urine_osm_mosm_kg float8,
                                            urine_na_mmol_l float8, urine_k_mmol_l float8,
                                            serum_na_mmol_l float8, insensible_l_day float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fluid_allowance_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_fluid_allowance(float8, float8, float8, float8, float8, float8) IS
'The most fluid per day, L/day, that does not lower the serum sodium: V * (1 - (U_Na + U_K)/S_Na) + insensible, V = solute / U_osm. Negative: restriction alone cannot hold the sodium. NULL for invalid input.';

CREATE FUNCTION ntr_solute_dose_osmoles(solute text, grams float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_solute_dose_osmoles'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_solute_dose_osmoles_checked(solute text, grams float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_solute_dose_osmoles_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_solute_dose_osmoles(text, float8) IS
'Osmoles, mOsm, of a dose in grams of urea (1 per mole) or nacl tablets (2 per mole), IUPAC molar masses. NULL for invalid input or an unknown solute.';

-- ------------------------------------------- fractional urate excretion
CREATE FUNCTION ntr_fe_uric_acid_class(fe_uric_acid_percent float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_fe_uric_acid_class'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_fe_uric_acid_class_checked(fe_uric_acid_percent float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_fe_uric_acid_class_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_fe_uric_acid_class(float8) IS
'Fractional uric acid excretion at the low sodium: against_siad (below 8 %), indeterminate (8 to 12 %), supports_siad (above 12 %) (Fenske 2008). NULL for invalid input.';

-- ------------------------------------------------ units as they arrive (issue 13)
-- ntr_convert (1.0) also takes the analytes osmolality (mosm/kg only) and
-- uric_acid since 1.1, and its _checked form names the unit that is wrong.
COMMENT ON FUNCTION ntr_convert(float8, text, text, text) IS
'A laboratory value converted between UCUM units (mmol/L, mg/dL, meq/L, mosm/kg, g/L, umol/L; case-sensitive, see ntr_unit_normalize) for an analyte (sodium, potassium, chloride, glucose, urea, urea_nitrogen, creatinine, ethanol, osmolality, uric_acid). NULL for invalid input.';

CREATE FUNCTION ntr_unit_normalize(unit text)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_unit_normalize'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_unit_normalize_checked(unit text)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_unit_normalize_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_unit_normalize(text) IS
'The UCUM code of a unit as laboratory feeds spell it (mEq/L -> meq/L, mg/dl -> mg/dL, mOsm/kg H2O -> mosm/kg, a micro sign -> umol/L). NULL when refused: unknown, or ambiguous such as mOsm/L (an osmolarity).';

CREATE FUNCTION ntr_loinc(code text, OUT analyte text, OUT specimen text, OUT unit text)
RETURNS record AS 'MODULE_PATHNAME', 'ntrpg_loinc'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_loinc_checked(code text, OUT analyte text, OUT specimen text,
                                  OUT unit text)
RETURNS record AS 'MODULE_PATHNAME', 'ntrpg_loinc_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_loinc(text) IS
'Analyte, specimen (serum_plasma, blood, urine) and the UCUM unit the property implies (moles/volume mmol/L, mass/volume mg/dL) of a LOINC code checked against a published source. NULL for a code not mapped.';
