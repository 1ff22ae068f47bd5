-- SPDX-License-Identifier: MIT
-- natremia 1.0: serum sodium and water arithmetic as SQL functions.
--
-- Every formula exists twice:
--   ntr_<name>(...)          returns NULL for invalid input;
--   ntr_<name>_checked(...)  raises an error instead, with SQLSTATE 22003
--                            (numeric_value_out_of_range) for a value outside
--                            its plausible range and 22023
--                            (invalid_parameter_value) for a non-finite
--                            value, an unknown name, samples out of order, or
--                            a formula undefined for the inputs.
-- All are IMMUTABLE, STRICT and PARALLEL SAFE; units are in the argument
-- names. Every result is an estimate for decision support, not an order:
-- verify with measured values, follow local protocols and licensed clinical
-- judgement.

\echo Use "CREATE EXTENSION natremia" to load this file. \quit

-- ---------------------------------------------------------------- osmolality
CREATE FUNCTION ntr_osm_calculated(na_mmol_l float8, glucose_mmol_l float8,
                                   urea_mmol_l float8, ethanol_mmol_l float8 DEFAULT 0,
                                   formula text DEFAULT '2na')
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_osm_calculated'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_osm_calculated_checked(na_mmol_l float8, glucose_mmol_l float8,
                                           urea_mmol_l float8, ethanol_mmol_l float8 DEFAULT 0,
                                           formula text DEFAULT '2na')
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_osm_calculated_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_osm_calculated(float8, float8, float8, float8, text) IS
'Calculated serum osmolality, mOsm/kg: formula ''2na'' (2*Na + glucose + urea + ethanol) or ''dorwart_chalmers'' (1.86*Na + glucose + urea + 9 + ethanol); inputs mmol/L. NULL for invalid input.';

CREATE FUNCTION ntr_osm_effective(na_mmol_l float8, glucose_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_osm_effective'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_osm_effective_checked(na_mmol_l float8, glucose_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_osm_effective_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_osm_effective(float8, float8) IS
'Effective osmolality (tonicity) 2*Na + glucose, mOsm/kg. NULL for invalid input.';

CREATE FUNCTION ntr_osm_gap(measured_mosm_kg float8, calculated_mosm_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_osm_gap'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_osm_gap_checked(measured_mosm_kg float8, calculated_mosm_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_osm_gap_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_osm_gap(float8, float8) IS
'Osmolal gap, measured minus calculated, mOsm/kg. NULL for invalid input.';

-- -------------------------------------------------------------------- sodium
CREATE FUNCTION ntr_na_corrected_glucose(na_mmol_l float8, glucose_mmol_l float8,
                                         method text DEFAULT 'katz')
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_na_corrected_glucose'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_na_corrected_glucose_checked(na_mmol_l float8, glucose_mmol_l float8,
                                                 method text DEFAULT 'katz')
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_na_corrected_glucose_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_na_corrected_glucose(float8, float8, text) IS
'Sodium corrected for hyperglycaemia, mmol/L: method ''katz'' (1.6) or ''hillier'' (2.4) per 100 mg/dL of glucose above 100 mg/dL. NULL for invalid input.';

CREATE FUNCTION ntr_na_corrected_glucose_factor(na_mmol_l float8, glucose_mmol_l float8,
                                                factor_per_100mg_dl float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_na_corrected_glucose_factor'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_na_corrected_glucose_factor_checked(na_mmol_l float8, glucose_mmol_l float8,
                                                        factor_per_100mg_dl float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_na_corrected_glucose_factor_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

CREATE FUNCTION ntr_na_deficit(tbw_l float8, na_mmol_l float8, target_na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_na_deficit'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_na_deficit_checked(tbw_l float8, na_mmol_l float8, target_na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_na_deficit_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_na_deficit(float8, float8, float8) IS
'Sodium to raise serum sodium to a target, TBW*(target - Na), mmol. NULL for invalid input or a target below the sodium.';

-- --------------------------------------------------------------------- water
CREATE FUNCTION ntr_tbw_fraction(sex text, age_years float8, weight_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_tbw_fraction'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_tbw_fraction_checked(sex text, age_years float8, weight_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_tbw_fraction_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_tbw_fraction(text, float8, float8) IS
'Total body water as a fraction of weight (Adrogue-Madias), L; sex ''male''/''female'' (or ''m''/''f''). NULL for invalid input.';

CREATE FUNCTION ntr_tbw_watson(sex text, age_years float8, height_cm float8, weight_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_tbw_watson'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_tbw_watson_checked(sex text, age_years float8, height_cm float8,
                                       weight_kg float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_tbw_watson_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_tbw_watson(text, float8, float8, float8) IS
'Total body water by the Watson equations (adults), L. NULL for invalid input.';

CREATE FUNCTION ntr_free_water_deficit(tbw_l float8, na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_free_water_deficit'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_free_water_deficit_checked(tbw_l float8, na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_free_water_deficit_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_free_water_deficit(float8, float8) IS
'Free-water deficit TBW*(Na/140 - 1), L. NULL for invalid input or sodium below 140.';

-- ------------------------------------------------------------------ infusion
CREATE FUNCTION ntr_fluid_na(fluid text)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fluid_na'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_fluid_na_checked(fluid text)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fluid_na_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_fluid_k(fluid text)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fluid_k'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_fluid_k_checked(fluid text)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fluid_k_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_fluid_na(text) IS
'Sodium of a common infusate, mmol/L: nacl_0_9, nacl_3, nacl_5, nacl_0_45, ringer_lactate, dextrose_5, nacl_0_2_dextrose_5.';

CREATE FUNCTION ntr_infusate_change_per_litre(na_mmol_l float8, tbw_l float8,
                                              infusate_na_mmol_l float8,
                                              infusate_k_mmol_l float8 DEFAULT 0)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_infusate_change_per_litre'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_infusate_change_per_litre_checked(na_mmol_l float8, tbw_l float8,
                                                      infusate_na_mmol_l float8,
                                                      infusate_k_mmol_l float8 DEFAULT 0)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_infusate_change_per_litre_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_infusate_change_per_litre(float8, float8, float8, float8) IS
'Expected change in serum sodium from 1 L of infusate (Adrogue-Madias), mmol/L. NULL for invalid input.';

CREATE FUNCTION ntr_infusate_change(na_mmol_l float8, tbw_l float8, infusate_na_mmol_l float8,
                                    infusate_k_mmol_l float8, volume_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_infusate_change'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_infusate_change_checked(na_mmol_l float8, tbw_l float8,
                                            infusate_na_mmol_l float8,
                                            infusate_k_mmol_l float8, volume_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_infusate_change_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_infusate_change(float8, float8, float8, float8, float8) IS
'Expected change in serum sodium from any volume of infusate (mass balance), mmol/L. NULL for invalid input.';

CREATE FUNCTION ntr_infusate_volume_for_change(na_mmol_l float8, tbw_l float8,
                                               infusate_na_mmol_l float8,
                                               infusate_k_mmol_l float8,
                                               target_delta_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_infusate_volume_for_change'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_infusate_volume_for_change_checked(na_mmol_l float8, tbw_l float8,
                                                       infusate_na_mmol_l float8,
                                                       infusate_k_mmol_l float8,
                                                       target_delta_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_infusate_volume_for_change_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_infusate_volume_for_change(float8, float8, float8, float8, float8) IS
'Volume of infusate expected to change serum sodium by a target, L. NULL for invalid input or an unreachable target.';

-- --------------------------------------------------------------------- urine
CREATE FUNCTION ntr_furst_ratio(urine_na_mmol_l float8, urine_k_mmol_l float8,
                                serum_na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_furst_ratio'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_furst_ratio_checked(urine_na_mmol_l float8, urine_k_mmol_l float8,
                                        serum_na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_furst_ratio_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_furst_ratio(float8, float8, float8) IS
'Furst urine-to-serum electrolyte ratio (U_Na + U_K)/S_Na. NULL for invalid input.';

CREATE FUNCTION ntr_restriction_from_ratio(ratio float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_restriction_from_ratio'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_restriction_from_ratio_checked(ratio float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_restriction_from_ratio_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_restriction_from_ratio(float8) IS
'Fluid restriction for a Furst ratio: under_1000_ml (below 0.9), 500_to_700_ml (0.9 to 1.0), under_500_ml (above 1.0).';

CREATE FUNCTION ntr_efwc(urine_volume_l float8, urine_na_mmol_l float8,
                         urine_k_mmol_l float8, serum_na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_efwc'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_efwc_checked(urine_volume_l float8, urine_na_mmol_l float8,
                                 urine_k_mmol_l float8, serum_na_mmol_l float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_efwc_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_efwc(float8, float8, float8, float8) IS
'Electrolyte-free water clearance V*(1 - (U_Na + U_K)/S_Na), L. NULL for invalid input.';

-- --------------------------------------------------------------------- units
CREATE FUNCTION ntr_convert(value float8, analyte text, from_unit text, to_unit text)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_convert'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_convert_checked(value float8, analyte text, from_unit text, to_unit text)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_convert_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_convert(float8, text, text, text) IS
'A laboratory value converted between UCUM units (mmol/L, mg/dL, meq/L, g/L, umol/L) for an analyte (sodium, potassium, chloride, glucose, urea, urea_nitrogen, creatinine, ethanol).';

-- ---------------------------------------------------------------- correction
CREATE TYPE ntr_correction AS (
    rise_first_24h  float8,  -- highest sodium within 24 h of the first sample, minus the first
    max_rise_24h    float8,  -- largest rise between samples at most 24 h apart
    max_rise_48h    float8,  -- largest rise between samples at most 48 h apart
    last_rate_per_h float8,  -- change per hour over the last interval
    excess_mmol_l   float8,  -- how far the worst window exceeds its limit
    flags           int4,    -- NTR_CF_* bits
    flag_names      text[],  -- the same bits by name
    samples         int4     -- number of samples assessed
);

CREATE FUNCTION ntr_correction_flag_names(flags int4)
RETURNS text[] AS 'MODULE_PATHNAME', 'ntrpg_correction_flag_names'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

-- One series given as two arrays (times in hours, sodium in mmol/L).
CREATE FUNCTION ntr_correction_assess_series(hours float8[], na_mmol_l float8[],
                                             limits text DEFAULT 'standard')
RETURNS ntr_correction AS 'MODULE_PATHNAME', 'ntrpg_series'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_correction_assess_series_checked(hours float8[], na_mmol_l float8[],
                                                     limits text DEFAULT 'standard')
RETURNS ntr_correction AS 'MODULE_PATHNAME', 'ntrpg_series_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

-- Aggregate support functions (not for direct use). The transition
-- functions are not STRICT: a row with a NULL time or sodium is skipped.
CREATE FUNCTION ntr_correction_transition(internal, float8, float8)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_correction_transition'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_correction_transition(internal, float8, float8, text)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_correction_transition_preset'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_correction_transition(internal, float8, float8, float8, float8, float8)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_correction_transition_limits'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_correction_combine(internal, internal)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_correction_combine'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_correction_serialize(internal)
RETURNS bytea AS 'MODULE_PATHNAME', 'ntrpg_correction_serialize'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_correction_deserialize(bytea, internal)
RETURNS internal AS 'MODULE_PATHNAME', 'ntrpg_correction_deserialize'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_correction_final(internal)
RETURNS ntr_correction AS 'MODULE_PATHNAME', 'ntrpg_correction_final'
LANGUAGE C IMMUTABLE PARALLEL SAFE;
CREATE FUNCTION ntr_correction_final_checked(internal)
RETURNS ntr_correction AS 'MODULE_PATHNAME', 'ntrpg_correction_final_checked'
LANGUAGE C IMMUTABLE PARALLEL SAFE;

-- ntr_correction_assess(hours, na_mmol_l): one patient's series per group,
-- standard limits. Rows may come in any order (they are sorted by time).
CREATE AGGREGATE ntr_correction_assess(hours float8, na_mmol_l float8) (
    SFUNC = ntr_correction_transition, STYPE = internal,
    FINALFUNC = ntr_correction_final, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
-- ... with preset limits by name: 'standard' or 'high_risk'.
CREATE AGGREGATE ntr_correction_assess(hours float8, na_mmol_l float8, limits text) (
    SFUNC = ntr_correction_transition, STYPE = internal,
    FINALFUNC = ntr_correction_final, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
-- ... with explicit limits, mmol/L.
CREATE AGGREGATE ntr_correction_assess(hours float8, na_mmol_l float8,
                                       max_rise_24h float8, max_rise_48h float8,
                                       min_rise_24h float8) (
    SFUNC = ntr_correction_transition, STYPE = internal,
    FINALFUNC = ntr_correction_final, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);

CREATE AGGREGATE ntr_correction_assess_checked(hours float8, na_mmol_l float8) (
    SFUNC = ntr_correction_transition, STYPE = internal,
    FINALFUNC = ntr_correction_final_checked, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
CREATE AGGREGATE ntr_correction_assess_checked(hours float8, na_mmol_l float8, limits text) (
    SFUNC = ntr_correction_transition, STYPE = internal,
    FINALFUNC = ntr_correction_final_checked, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);
CREATE AGGREGATE ntr_correction_assess_checked(hours float8, na_mmol_l float8,
                                               max_rise_24h float8, max_rise_48h float8,
                                               min_rise_24h float8) (
    SFUNC = ntr_correction_transition, STYPE = internal,
    FINALFUNC = ntr_correction_final_checked, COMBINEFUNC = ntr_correction_combine,
    SERIALFUNC = ntr_correction_serialize, DESERIALFUNC = ntr_correction_deserialize,
    PARALLEL = SAFE);

COMMENT ON AGGREGATE ntr_correction_assess(float8, float8) IS
'Assesses one patient''s sodium series (per GROUP BY) against the standard correction limits (10 mmol/L in 24 h, 18 in 48 h). NULL for invalid input.';

-- ------------------------------------------------------------------ work-up
CREATE FUNCTION ntr_na_severity(na_mmol_l float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_na_severity'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_na_severity_checked(na_mmol_l float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_na_severity_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_na_severity(float8) IS
'Biochemical severity of a low sodium: none, mild, moderate or profound (European guideline bands).';

CREATE FUNCTION ntr_tonicity_class(measured_osm_mosm_kg float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_tonicity_class'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_tonicity_class_checked(measured_osm_mosm_kg float8)
RETURNS text AS 'MODULE_PATHNAME', 'ntrpg_tonicity_class_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_tonicity_class(float8) IS
'Measured serum osmolality as hypotonic (below 275), isotonic (275 to 295) or hypertonic (above 295).';

CREATE FUNCTION ntr_urine_maximally_dilute(urine_osm_mosm_kg float8)
RETURNS boolean AS 'MODULE_PATHNAME', 'ntrpg_urine_maximally_dilute'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_urine_maximally_dilute_checked(urine_osm_mosm_kg float8)
RETURNS boolean AS 'MODULE_PATHNAME', 'ntrpg_urine_maximally_dilute_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

CREATE FUNCTION ntr_urine_na_high(urine_na_mmol_l float8)
RETURNS boolean AS 'MODULE_PATHNAME', 'ntrpg_urine_na_high'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_urine_na_high_checked(urine_na_mmol_l float8)
RETURNS boolean AS 'MODULE_PATHNAME', 'ntrpg_urine_na_high_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;

CREATE FUNCTION ntr_fractional_excretion(urine_x float8, plasma_x float8,
                                         urine_creatinine float8, plasma_creatinine float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fractional_excretion'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_fractional_excretion_checked(urine_x float8, plasma_x float8,
                                                 urine_creatinine float8,
                                                 plasma_creatinine float8)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_fractional_excretion_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_fractional_excretion(float8, float8, float8, float8) IS
'Fractional excretion of a solute, percent: (U_x * P_cr) / (P_x * U_cr) * 100 (solute and creatinine each in one unit).';

-- ------------------------------------------------------------------ balance
CREATE FUNCTION ntr_balance_predict(na_mmol_l float8, tbw_l float8, volume_l float8[],
                                    flow_na_mmol_l float8[], flow_k_mmol_l float8[])
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_balance_predict'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_balance_predict_checked(na_mmol_l float8, tbw_l float8,
                                            volume_l float8[], flow_na_mmol_l float8[],
                                            flow_k_mmol_l float8[])
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_balance_predict_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_balance_predict(float8, float8, float8[], float8[], float8[]) IS
'Serum sodium after gains (volume > 0) and losses (volume < 0) by mass balance; the three arrays describe one flow per element.';

CREATE FUNCTION ntr_relower_volume(na_mmol_l float8, tbw_l float8, fluid_na_mmol_l float8,
                                   fluid_k_mmol_l float8, lower_by_mmol_l float8,
                                   hours float8, urine_ml_h float8 DEFAULT 0,
                                   urine_na_mmol_l float8 DEFAULT 0,
                                   urine_k_mmol_l float8 DEFAULT 0)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_relower_volume'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
CREATE FUNCTION ntr_relower_volume_checked(na_mmol_l float8, tbw_l float8,
                                           fluid_na_mmol_l float8, fluid_k_mmol_l float8,
                                           lower_by_mmol_l float8, hours float8,
                                           urine_ml_h float8 DEFAULT 0,
                                           urine_na_mmol_l float8 DEFAULT 0,
                                           urine_k_mmol_l float8 DEFAULT 0)
RETURNS float8 AS 'MODULE_PATHNAME', 'ntrpg_relower_volume_checked'
LANGUAGE C IMMUTABLE STRICT PARALLEL SAFE;
COMMENT ON FUNCTION ntr_relower_volume(float8, float8, float8, float8, float8, float8, float8, float8, float8) IS
'Volume (L) of a fluid to give over the hours so that sodium falls back by lower_by_mmol_l after overcorrection; an estimate that needs frequent measured sodium and specialist judgement.';
