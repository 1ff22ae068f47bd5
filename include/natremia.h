/**
 * @file natremia.h
 * @brief natremia: sodium and water arithmetic for clinical software.
 *
 * One public header for the whole library. It is C99, compiles as C++,
 * and every symbol carries the prefix `ntr_` or `NTR_`.
 *
 * Conventions that hold for every computing function:
 * - The return value is a status (@ref NTR_OK or one of the `NTR_ERR_*`
 *   codes); results are written through the pointer arguments, which come
 *   last. On any status other than @ref NTR_OK no output is written.
 * - Inputs are numbers whose unit is in the parameter name
 *   (`na_mmol_l`, `glucose_mmol_l`, `weight_kg`, ...). Each is checked
 *   against a plausible range listed in docs/ranges.md.
 * - Checks run in this order and the first failure is returned: NULL
 *   pointers (@ref NTR_ERR_NULL), unknown enumerators (@ref NTR_ERR_ARG),
 *   numeric inputs in argument order (@ref NTR_ERR_NONFINITE, then
 *   @ref NTR_ERR_RANGE), then whether the formula is defined for the inputs
 *   (@ref NTR_ERR_DOMAIN).
 * - The library allocates nothing, prints nothing, keeps no mutable global
 *   state and is reentrant.
 *
 * @warning Every result is an estimate for decision support, not an order.
 * Verify with measured values, follow local protocols and licensed clinical
 * judgement.
 */
#ifndef NATREMIA_H
#define NATREMIA_H

#include <stddef.h>

/** @name Version
 *  @{ */
#define NTR_VERSION_MAJOR 1 /**< Major version: changes only with an ABI break. */
#define NTR_VERSION_MINOR 0 /**< Minor version: compatible additions. */
#define NTR_VERSION_PATCH 0 /**< Patch version: fixes without API change. */
/** @} */

/* Symbol visibility: the library is built with -fvisibility=hidden and
 * exports only what is marked NTR_API. */
#if defined(_WIN32) || defined(__CYGWIN__)
#  if defined(NTR_BUILDING)
#    define NTR_API __declspec(dllexport)
#  else
#    define NTR_API
#  endif
#elif defined(__GNUC__) && __GNUC__ >= 4
#  define NTR_API __attribute__((visibility("default")))
#else
#  define NTR_API
#endif

#ifdef __cplusplus
extern "C" {
#endif

/* ======================================================================= */
/* ==== section: status and version (lib/status.c, docs/api.md) ========== */
/* ======================================================================= */

/** @defgroup status Status codes and version
 *  Every computing function returns one of these codes. Values are ABI.
 *  @{ */
#define NTR_OK 0            /**< Success; outputs were written. */
#define NTR_ERR_NULL 1      /**< A required pointer argument was NULL. */
#define NTR_ERR_NONFINITE 2 /**< A numeric input was NaN or infinite. */
#define NTR_ERR_RANGE 3     /**< A numeric input was outside its plausible range. */
#define NTR_ERR_UNIT 4      /**< Unknown unit, or a unit that does not fit the analyte. */
#define NTR_ERR_DOMAIN 5    /**< Formula undefined for these (otherwise valid) inputs. */
#define NTR_ERR_ORDER 6     /**< A series was not in non-decreasing time order. */
#define NTR_ERR_CAPACITY 7  /**< A caller buffer was too small. */
#define NTR_ERR_ARG 8       /**< Unknown enumerator, or a count that is not allowed. */

/**
 * @brief A short English description of a status code.
 * @param status any integer.
 * @return a static, NUL-terminated string; never NULL. Unknown codes give
 *         "unknown status".
 */
NTR_API const char *ntr_status_message(int status);

/**
 * @brief The library's version as "MAJOR.MINOR.PATCH".
 * @return a static string; compare with the NTR_VERSION_* macros to detect
 *         a header/library mismatch.
 */
NTR_API const char *ntr_version_string(void);

/**
 * @brief The library's version as MAJOR*10000 + MINOR*100 + PATCH.
 */
NTR_API unsigned long ntr_version_number(void);
/** @} */

/* ======================================================================= */
/* ==== section: units (lib/units.c, docs/units.md) ====================== */
/* ======================================================================= */

/** @defgroup units Units and conversion
 *  UCUM unit codes and conversion of laboratory values between units.
 *  @{ */
#define NTR_UNIT_MMOL_L 1  /**< "mmol/L" */
#define NTR_UNIT_MG_DL 2   /**< "mg/dL" */
#define NTR_UNIT_MEQ_L 3   /**< "meq/L" (monovalent ions only: equal to mmol/L) */
#define NTR_UNIT_MOSM_KG 4 /**< "mosm/kg" (osmolality; no analyte converts to it) */
#define NTR_UNIT_G_L 5     /**< "g/L" */
#define NTR_UNIT_UMOL_L 6  /**< "umol/L" */

#define NTR_ANALYTE_SODIUM 1        /**< Na+, 22.98977 g/mol */
#define NTR_ANALYTE_POTASSIUM 2     /**< K+, 39.0983 g/mol */
#define NTR_ANALYTE_CHLORIDE 3      /**< Cl-, 35.453 g/mol */
#define NTR_ANALYTE_GLUCOSE 4       /**< C6H12O6, 180.156 g/mol */
#define NTR_ANALYTE_UREA 5          /**< CH4N2O, 60.056 g/mol */
#define NTR_ANALYTE_UREA_NITROGEN 6 /**< BUN: the 2 N of urea, 28.014 g/mol per mmol urea; mmol/L means mmol of urea */
#define NTR_ANALYTE_CREATININE 7    /**< C4H7N3O, 113.120 g/mol */
#define NTR_ANALYTE_ETHANOL 8       /**< C2H6O, 46.069 g/mol */

/**
 * @brief Parse a case-sensitive UCUM unit code.
 *
 * Accepted codes: "mmol/L", "mg/dL", "meq/L", "mosm/kg", "g/L", "umol/L".
 * The string is read only up to its terminating NUL, and never more than
 * 8 characters.
 *
 * @param ucum  NUL-terminated unit code.
 * @param[out] unit one of the NTR_UNIT_* values.
 * @retval NTR_OK          parsed.
 * @retval NTR_ERR_NULL    @p ucum or @p unit is NULL.
 * @retval NTR_ERR_UNIT    not one of the accepted codes (including case variants).
 *
 * Reference: The Unified Code for Units of Measure (UCUM), Regenstrief Institute.
 * Method: @ref NTR_METHOD_UNIT_CONVERSION.
 */
NTR_API int ntr_unit_parse(const char *ucum, int *unit);

/**
 * @brief Convert a laboratory value of an analyte between units.
 *
 * out = value * factor(from_unit) / factor(to_unit), where the factor turns
 * the unit into mmol/L: 1 for mmol/L and meq/L, 0.001 for umol/L,
 * 10/M for mg/dL and 1000/M for g/L, M being the molar mass in g/mol
 * computed from IUPAC standard atomic weights (H 1.008, C 12.011,
 * N 14.007, O 15.999, Na 22.98977, Cl 35.453, K 39.0983). For urea
 * nitrogen M is 2 * 14.007 = 28.014 g per mol of urea.
 *
 * Units each analyte accepts:
 * - sodium, potassium, chloride: mmol/L, meq/L, mg/dL, umol/L
 * - glucose, urea, urea nitrogen, ethanol: mmol/L, mg/dL, g/L, umol/L
 * - creatinine: mmol/L, umol/L, mg/dL, g/L
 *
 * @param analyte   one of NTR_ANALYTE_*.
 * @param value     the value in @p from_unit; finite, 0 to 1e6.
 * @param from_unit unit of @p value (NTR_UNIT_*).
 * @param to_unit   wanted unit (NTR_UNIT_*).
 * @param[out] out  the converted value.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG (unknown analyte),
 *         NTR_ERR_UNIT (unknown unit or one the analyte does not accept),
 *         NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: IUPAC Commission on Isotopic Abundances and Atomic Weights,
 * standard atomic weights (abridged to five significant figures).
 * Method: @ref NTR_METHOD_UNIT_CONVERSION.
 */
NTR_API int ntr_convert(int analyte, double value, int from_unit, int to_unit,
                        double *out);
/** @} */

/* ======================================================================= */
/* ==== section: osmolality (lib/osmolality.c, docs/osmolality.md) ======= */
/* ======================================================================= */

/** @defgroup osmolality Osmolality and tonicity
 *  @{ */
#define NTR_OSM_2NA 1              /**< 2*Na + glucose + urea + ethanol */
#define NTR_OSM_DORWART_CHALMERS 2 /**< 1.86*Na + glucose + urea + 9 + ethanol */

/**
 * @brief Calculated serum osmolality.
 *
 * - @ref NTR_OSM_2NA: Osm = 2*Na + glucose + urea + ethanol
 * - @ref NTR_OSM_DORWART_CHALMERS: Osm = 1.86*Na + glucose + urea + 9 + ethanol
 *
 * All inputs in mmol/L (the mg/dL forms divide glucose by 18, BUN by 2.8 and
 * ethanol by 4.6; that is the same as converting to mmol/L first). Ethanol
 * enters with coefficient 1 per mmol/L, the ideal-solute value (molar mass
 * 46.07 g/mol, hence the conventional mg/dL divisor 4.6); pass 0 when it
 * was not measured. Purssell et al. (Ann Emerg Med 2001) measured an
 * empirical coefficient near 1.25; the library keeps the ideal value so the
 * gap it leaves is conservative (see docs/osmolality.md).
 *
 * @param na_mmol_l       serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l  serum glucose, 0 to 200 mmol/L.
 * @param urea_mmol_l     serum urea, 0 to 200 mmol/L.
 * @param ethanol_mmol_l  serum ethanol, 0 to 400 mmol/L (0 if not measured).
 * @param formula         @ref NTR_OSM_2NA or @ref NTR_OSM_DORWART_CHALMERS.
 * @param[out] mosm_kg    calculated osmolality, mOsm/kg.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG (unknown formula),
 *         NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * References: Dorwart WV, Chalmers L. Comparison of methods for calculating
 * serum osmolality from chemical concentrations. Clin Chem 1975;21:190-4.
 * Methods: @ref NTR_METHOD_OSM_2NA, @ref NTR_METHOD_OSM_DORWART_CHALMERS.
 */
NTR_API int ntr_osm_calculated(double na_mmol_l, double glucose_mmol_l,
                               double urea_mmol_l, double ethanol_mmol_l,
                               int formula, double *mosm_kg);

/**
 * @brief Effective osmolality (tonicity): 2*Na + glucose.
 *
 * Urea crosses cell membranes freely and so is left out.
 *
 * @param na_mmol_l      serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l serum glucose, 0 to 200 mmol/L.
 * @param[out] mosm_kg   effective osmolality, mOsm/kg.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: Spasovski G et al. Clinical practice guideline on diagnosis
 * and treatment of hyponatraemia. Eur J Endocrinol 2014;170:G1-47.
 * Method: @ref NTR_METHOD_OSM_EFFECTIVE.
 */
NTR_API int ntr_osm_effective(double na_mmol_l, double glucose_mmol_l,
                              double *mosm_kg);

/**
 * @brief Osmolal gap: measured minus calculated osmolality.
 *
 * gap = measured - calculated. A gap above about 10 mOsm/kg suggests
 * unmeasured osmoles (common practice).
 *
 * @param measured_mosm_kg   measured serum osmolality, 150 to 600 mOsm/kg.
 * @param calculated_mosm_kg calculated serum osmolality, 150 to 600 mOsm/kg.
 * @param[out] gap_mosm_kg   the gap, mOsm/kg (may be negative).
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: textbook definition of the osmolal gap.
 * Method: @ref NTR_METHOD_OSM_GAP.
 */
NTR_API int ntr_osm_gap(double measured_mosm_kg, double calculated_mosm_kg,
                        double *gap_mosm_kg);
/** @} */

/* ======================================================================= */
/* ==== section: sodium (lib/sodium.c, docs/sodium.md) =================== */
/* ======================================================================= */

/** @defgroup sodium Sodium: glucose correction and deficits
 *  @{ */
#define NTR_GLUCOSE_KATZ 1    /**< 1.6 mmol/L Na per 100 mg/dL glucose (Katz 1973) */
#define NTR_GLUCOSE_HILLIER 2 /**< 2.4 mmol/L Na per 100 mg/dL glucose (Hillier 1999) */

/**
 * @brief Serum sodium corrected for hyperglycaemia by a published factor.
 *
 * G = glucose_mmol_l * 18.0156 (mg/dL). If G > 100:
 * Na_corr = Na + factor * (G - 100) / 100, else Na_corr = Na (no correction
 * below the 100 mg/dL reference).
 *
 * @param na_mmol_l       measured serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l  serum glucose, 0 to 200 mmol/L.
 * @param method          @ref NTR_GLUCOSE_KATZ (factor 1.6) or
 *                        @ref NTR_GLUCOSE_HILLIER (factor 2.4).
 * @param[out] na_corrected_mmol_l corrected sodium, mmol/L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * References: Katz MA. Hyperglycemia-induced hyponatremia: calculation of
 * expected serum sodium depression. N Engl J Med 1973;289:843-4.
 * Hillier TA, Abbott RD, Barrett EJ. Hyponatremia: evaluating the
 * correction factor for hyperglycemia. Am J Med 1999;106:399-403.
 * Methods: @ref NTR_METHOD_GLUCOSE_KATZ, @ref NTR_METHOD_GLUCOSE_HILLIER.
 */
NTR_API int ntr_na_corrected_glucose(double na_mmol_l, double glucose_mmol_l,
                                     int method, double *na_corrected_mmol_l);

/**
 * @brief Serum sodium corrected for hyperglycaemia with a caller's factor.
 *
 * As ntr_na_corrected_glucose() with an explicit factor (mmol/L of sodium
 * per 100 mg/dL of glucose above 100 mg/dL).
 *
 * @param na_mmol_l            80 to 220 mmol/L.
 * @param glucose_mmol_l       0 to 200 mmol/L.
 * @param factor_per_100mg_dl  0 to 5 (published factors lie between 1.6 and 2.4).
 * @param[out] na_corrected_mmol_l corrected sodium, mmol/L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: as ntr_na_corrected_glucose().
 * Method: @ref NTR_METHOD_GLUCOSE_FACTOR.
 */
NTR_API int ntr_na_corrected_glucose_factor(double na_mmol_l,
                                            double glucose_mmol_l,
                                            double factor_per_100mg_dl,
                                            double *na_corrected_mmol_l);

/**
 * @brief Sodium needed to raise serum sodium to a target.
 *
 * deficit = TBW * (target - Na), in mmol.
 *
 * @param tbw_l               total body water, 0.1 to 400 L.
 * @param na_mmol_l           current serum sodium, 80 to 220 mmol/L.
 * @param target_na_mmol_l    target serum sodium, 80 to 220 mmol/L.
 * @param[out] mmol           sodium to give, mmol.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE,
 *         NTR_ERR_DOMAIN (target below the current sodium).
 *
 * Reference: common practice (the sodium-deficit formula of general
 * medical texts). It ignores ongoing losses; see ntr_balance_predict().
 * Method: @ref NTR_METHOD_NA_DEFICIT.
 */
NTR_API int ntr_na_deficit(double tbw_l, double na_mmol_l,
                           double target_na_mmol_l, double *mmol);
/** @} */

/* ======================================================================= */
/* ==== section: water (lib/water.c, docs/water.md) ====================== */
/* ======================================================================= */

/** @defgroup water Total body water and water deficit
 *  @{ */
#define NTR_SEX_MALE 1   /**< male */
#define NTR_SEX_FEMALE 2 /**< female */

/**
 * @brief Total body water as a fraction of body weight.
 *
 * TBW = f * weight, with f = 0.6 for children (age below 18 years),
 * 0.6 for men 18 to 64, 0.5 for women 18 to 64, 0.5 for men 65 and over,
 * 0.45 for women 65 and over. The child boundary is the age of majority
 * used by paediatric services; 65 is the conventional start of "elderly"
 * in the geriatric literature (both common practice; the paper does not
 * state ages). Neonates hold more water (about 0.7 to 0.8) than this
 * fraction: use a measured or paediatric estimate for them.
 *
 * @param sex         @ref NTR_SEX_MALE or @ref NTR_SEX_FEMALE.
 * @param age_years   0 to 130.
 * @param weight_kg   0.3 to 650.
 * @param[out] litres total body water, L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med
 * 2000;342:1581-9.
 * Method: @ref NTR_METHOD_TBW_FRACTION.
 */
NTR_API int ntr_tbw_fraction(int sex, double age_years, double weight_kg,
                             double *litres);

/**
 * @brief Total body water by the Watson anthropometric equations (adults).
 *
 * - men:   TBW = 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight
 * - women: TBW = -2.097 + 0.1069*height + 0.2466*weight
 *
 * with age in years, height in cm, weight in kg, TBW in litres.
 *
 * @param sex         @ref NTR_SEX_MALE or @ref NTR_SEX_FEMALE.
 * @param age_years   18 to 130 (adults only: the equations were derived
 *                    in adults; younger ages give NTR_ERR_RANGE).
 * @param height_cm   30 to 275.
 * @param weight_kg   0.3 to 650.
 * @param[out] litres total body water, L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG, NTR_ERR_NONFINITE,
 *         NTR_ERR_RANGE, NTR_ERR_DOMAIN (the equation gives 0 L or less).
 *
 * Reference: Watson PE, Watson ID, Batt RD. Total body water volumes for
 * adult males and females estimated from simple anthropometric
 * measurements. Am J Clin Nutr 1980;33:27-39.
 * Method: @ref NTR_METHOD_TBW_WATSON.
 */
NTR_API int ntr_tbw_watson(int sex, double age_years, double height_cm,
                           double weight_kg, double *litres);

/**
 * @brief Free-water deficit in high serum sodium.
 *
 * deficit = TBW * (Na / 140 - 1), in litres; 0 at 140 mmol/L.
 *
 * @param tbw_l       total body water, 0.1 to 400 L.
 * @param na_mmol_l   serum sodium, 80 to 220 mmol/L.
 * @param[out] litres water deficit, L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE,
 *         NTR_ERR_DOMAIN (sodium below 140: there is no water deficit).
 *
 * Reference: the textbook water-deficit formula (common practice); for the
 * choice of infusate see Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med
 * 2000;342:1493-9.
 * Method: @ref NTR_METHOD_FREE_WATER_DEFICIT.
 */
NTR_API int ntr_free_water_deficit(double tbw_l, double na_mmol_l,
                                   double *litres);
/** @} */

/* ======================================================================= */
/* ==== section: infusion (lib/infusion.c, docs/infusion.md) ============= */
/* ======================================================================= */

/** @defgroup infusion Infusates and their predicted effect
 *  @{ */
#define NTR_FLUID_NACL_0_9 1           /**< 0.9% saline: Na 154 */
#define NTR_FLUID_NACL_3 2             /**< 3% saline: Na 513 */
#define NTR_FLUID_NACL_5 3             /**< 5% saline: Na 855 */
#define NTR_FLUID_NACL_0_45 4          /**< 0.45% saline: Na 77 */
#define NTR_FLUID_RINGER_LACTATE 5     /**< Ringer's lactate: Na 130, K 4 */
#define NTR_FLUID_DEXTROSE_5 6         /**< 5% dextrose in water: Na 0 */
#define NTR_FLUID_NACL_0_2_DEXTROSE_5 7 /**< 0.2% saline in 5% dextrose: Na 34 */

/**
 * @brief Sodium and potassium of a common infusate.
 *
 * Values as tabulated by Adrogue and Madias (2000): 0.9% NaCl 154,
 * 3% NaCl 513, 5% NaCl 855, 0.45% NaCl 77, Ringer's lactate 130 (K 4),
 * 5% dextrose 0, 0.2% NaCl in 5% dextrose 34 mmol/L.
 *
 * @param fluid       one of NTR_FLUID_*.
 * @param[out] na_mmol_l sodium of the infusate, mmol/L.
 * @param[out] k_mmol_l  potassium of the infusate, mmol/L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG.
 *
 * Reference: Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med
 * 2000;342:1581-9 (table of infusates).
 * Method: @ref NTR_METHOD_FLUID_PRESETS.
 */
NTR_API int ntr_fluid_preset(int fluid, double *na_mmol_l, double *k_mmol_l);

/**
 * @brief Expected change in serum sodium from 1 L of an infusate.
 *
 * delta = (Na_inf + K_inf - Na) / (TBW + 1)
 *
 * @param na_mmol_l          serum sodium, 80 to 220 mmol/L.
 * @param tbw_l              total body water, 0.1 to 400 L.
 * @param infusate_na_mmol_l 0 to 1100 mmol/L.
 * @param infusate_k_mmol_l  0 to 400 mmol/L.
 * @param[out] delta_mmol_l  expected change, mmol/L (negative: a fall).
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med
 * 2000;342:1581-9.
 * Method: @ref NTR_METHOD_ADROGUE_MADIAS.
 */
NTR_API int ntr_infusate_change_per_litre(double na_mmol_l, double tbw_l,
                                          double infusate_na_mmol_l,
                                          double infusate_k_mmol_l,
                                          double *delta_mmol_l);

/**
 * @brief Expected change in serum sodium from any volume of an infusate.
 *
 * Exact mass balance, with no losses:
 * delta = (Na*TBW + (Na_inf + K_inf)*V) / (TBW + V) - Na,
 * computed as V*(Na_inf + K_inf - Na)/(TBW + V), which is the same
 * quantity without cancellation. At V = 1 L it equals
 * ntr_infusate_change_per_litre().
 *
 * @param na_mmol_l          serum sodium, 80 to 220 mmol/L.
 * @param tbw_l              total body water, 0.1 to 400 L.
 * @param infusate_na_mmol_l 0 to 1100 mmol/L.
 * @param infusate_k_mmol_l  0 to 400 mmol/L.
 * @param volume_l           volume given, 0 to 20 L.
 * @param[out] delta_mmol_l  expected change, mmol/L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: derived from the Adrogue-Madias mass balance
 * (N Engl J Med 2000;342:1581-9).
 * Method: @ref NTR_METHOD_INFUSATE_MASS_BALANCE.
 */
NTR_API int ntr_infusate_change(double na_mmol_l, double tbw_l,
                                double infusate_na_mmol_l,
                                double infusate_k_mmol_l, double volume_l,
                                double *delta_mmol_l);

/**
 * @brief Volume of an infusate expected to change serum sodium by a target.
 *
 * Inverse of ntr_infusate_change():
 * V = delta * TBW / (Na_inf + K_inf - Na - delta).
 *
 * @param na_mmol_l          serum sodium, 80 to 220 mmol/L.
 * @param tbw_l              total body water, 0.1 to 400 L.
 * @param infusate_na_mmol_l 0 to 1100 mmol/L.
 * @param infusate_k_mmol_l  0 to 400 mmol/L.
 * @param target_delta_mmol_l wanted change, -50 to 50 mmol/L.
 * @param[out] volume_l      volume needed, L (0 when the target is 0).
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE,
 *         NTR_ERR_DOMAIN (the infusate cannot move sodium that far in
 *         that direction, or the volume would exceed 20 L).
 *
 * Reference: derived from Adrogue & Madias 2000; Furst H et al., Am J Med
 * Sci 2000;319:240-4 uses the same relation for its worked example.
 * Method: @ref NTR_METHOD_INFUSATE_VOLUME.
 */
NTR_API int ntr_infusate_volume_for_change(double na_mmol_l, double tbw_l,
                                           double infusate_na_mmol_l,
                                           double infusate_k_mmol_l,
                                           double target_delta_mmol_l,
                                           double *volume_l);
/** @} */

/* ======================================================================= */
/* ==== section: urine (lib/urine.c, docs/urine.md) ====================== */
/* ======================================================================= */

/** @defgroup urine Urine indices and fluid restriction
 *  @{ */
#define NTR_RESTRICT_1000ML 1    /**< ratio below 0.9: restrict to under 1 L/day */
#define NTR_RESTRICT_500_700ML 2 /**< ratio 0.9 to 1.0: restrict to 500-700 mL/day */
#define NTR_RESTRICT_500ML 3     /**< ratio above 1.0: under 500 mL/day; restriction alone likely to fail */

/** Lower edge (inclusive) of the library's "ratio about 1" band. */
#define NTR_FURST_ABOUT_ONE_LOW 0.9
/** Upper edge (inclusive) of the library's "ratio about 1" band. */
#define NTR_FURST_ABOUT_ONE_HIGH 1.0

/**
 * @brief The Furst urine-to-serum electrolyte ratio.
 *
 * ratio = (U_Na + U_K) / S_Na
 *
 * @param urine_na_mmol_l  0 to 500 mmol/L.
 * @param urine_k_mmol_l   0 to 300 mmol/L.
 * @param serum_na_mmol_l  80 to 220 mmol/L.
 * @param[out] ratio       dimensionless.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: Furst H, Hallows KR, Post J, et al. The urine/plasma
 * electrolyte ratio: a predictive guide to water restriction. Am J Med Sci
 * 2000;319:240-4.
 * Method: @ref NTR_METHOD_FURST.
 */
NTR_API int ntr_furst_ratio(double urine_na_mmol_l, double urine_k_mmol_l,
                            double serum_na_mmol_l, double *ratio);

/**
 * @brief Fluid restriction recommended for a Furst ratio.
 *
 * - ratio < 0.9: @ref NTR_RESTRICT_1000ML
 * - 0.9 <= ratio <= 1.0: @ref NTR_RESTRICT_500_700ML
 * - ratio > 1.0: @ref NTR_RESTRICT_500ML (restriction alone is likely to
 *   fail; Verbalis et al. 2013 list a ratio above 1 as a predictor of
 *   failure).
 *
 * The paper gives bands ("<1", "about 1", ">1"), not cut-offs. The library
 * places "about 1" at 0.9 to 1.0 inclusive (its own choice): any ratio
 * above 1 gets the strictest advice, as the US panel treats it as a
 * predictor of failure, and ratios from 0.9 up to 1 are close enough to 1
 * that the looser under-1-L advice would be optimistic.
 *
 * @param ratio       0 to 20.
 * @param[out] advice one of NTR_RESTRICT_*.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * References: Furst et al., Am J Med Sci 2000;319:240-4. Verbalis JG et al.
 * Diagnosis, evaluation, and treatment of hyponatremia: expert panel
 * recommendations. Am J Med 2013;126(10 Suppl 1):S1-42.
 * Method: @ref NTR_METHOD_FURST.
 */
NTR_API int ntr_restriction_from_ratio(double ratio, int *advice);

/**
 * @brief Electrolyte-free water clearance.
 *
 * EFWC = V * (1 - (U_Na + U_K) / S_Na). Positive: the kidney is excreting
 * free water (serum sodium tends to rise); negative: retaining it.
 *
 * @param urine_volume_l   urine volume over the period, 0 to 30 L.
 * @param urine_na_mmol_l  0 to 500 mmol/L.
 * @param urine_k_mmol_l   0 to 300 mmol/L.
 * @param serum_na_mmol_l  80 to 220 mmol/L.
 * @param[out] litres      free water cleared over the same period, L.
 * @retval NTR_OK, NTR_ERR_NULL, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 *
 * Reference: standard renal physiology (for example Rose BD, Post TW.
 * Clinical Physiology of Acid-Base and Electrolyte Disorders, 5th ed.).
 * Method: @ref NTR_METHOD_EFWC.
 */
NTR_API int ntr_efwc(double urine_volume_l, double urine_na_mmol_l,
                     double urine_k_mmol_l, double serum_na_mmol_l,
                     double *litres);
/** @} */

/* ======================================================================= */
/* ==== section: provenance (lib/methods.c, docs/methods.md) ============= */
/* ======================================================================= */

/** @defgroup provenance Provenance of every method
 *  Where each result comes from: a short name, the equation in plain text,
 *  the published reference and the population it was made for.
 *  @{ */

/**
 * @brief Description of one method, filled by ntr_method_info().
 *
 * Every string is a static, NUL-terminated, non-empty ASCII string owned by
 * the library; never free or modify it. Where no population restriction
 * applies, @c population is "any".
 *
 * It is a plain struct tag with no typedef, because the function that fills
 * it carries the same name (as with POSIX `struct stat` and `stat()`);
 * write `struct ntr_method_info`.
 *
 * Layout (ABI): members are never reordered, removed or retyped. The
 * @c reserved pointers are written as NULL today; a later minor version may
 * give them a name and a meaning (always a static string or NULL), so a
 * reader must treat NULL as "not provided".
 */
struct ntr_method_info {
    int method;              /**< The id that was asked for (an NTR_METHOD_* value). */
    int reserved_int;        /**< Written as 0. */
    const char *name;        /**< Short name, e.g. "Watson total body water". */
    const char *equation;    /**< The equation or rule in plain ASCII text. */
    const char *reference;   /**< Authors, journal or publisher, year; or "common practice". */
    const char *population;  /**< Population it is valid for, or "any". */
    const char *reserved[4]; /**< Written as NULL (room for growth). */
};

/**
 * @brief Describe a method: name, equation, reference and valid population.
 *
 * @param method    an NTR_METHOD_* id.
 * @param[out] out  filled with static strings (see ntr_method_info).
 * @retval NTR_OK        @p out filled.
 * @retval NTR_ERR_NULL  @p out is NULL.
 * @retval NTR_ERR_ARG   @p method is not an id this library knows.
 *
 * Reference: this is the library's own provenance table (docs/methods.md);
 * each entry names the published source of its method.
 * Method: none of its own (it describes the others).
 */
NTR_API int ntr_method_info(int method, struct ntr_method_info *out);

/**
 * @brief Iterate over every method id the library knows, in increasing order.
 *
 * Writes the smallest known id greater than @p after. Start with
 * @p after = 0; the walk ends when NTR_ERR_RANGE comes back:
 * @code
 * int id = 0;
 * while (ntr_method_next(id, &id) == NTR_OK) { ... ntr_method_info(id, &info) ... }
 * @endcode
 * The walk reflects the library that is running, not the header a program
 * was compiled with, so ids added by later versions appear without any
 * change to the caller. Ids are positive and below 1000.
 *
 * @param after      any integer (0 or negative to start).
 * @param[out] next  the next known id.
 * @retval NTR_OK        @p next written.
 * @retval NTR_ERR_NULL  @p next is NULL.
 * @retval NTR_ERR_RANGE no known id is greater than @p after (end of walk).
 *
 * Reference: none (library bookkeeping). Method: none.
 */
NTR_API int ntr_method_next(int after, int *next);
/** @} */

/* ======================================================================= */
/* ==== section: methods (provenance ids; lib/methods.c, docs/methods.md)  */
/* ======================================================================= */

/** @defgroup methods Method identifiers
 *  Every published method the library uses has an id (ABI). Ids 1-29 are
 *  the core formulas, 30-49 correction and balance, 50-69 the work-up.
 *  @{ */
#define NTR_METHOD_UNIT_CONVERSION 1
#define NTR_METHOD_OSM_2NA 2
#define NTR_METHOD_OSM_DORWART_CHALMERS 3
#define NTR_METHOD_OSM_EFFECTIVE 4
#define NTR_METHOD_OSM_GAP 5
#define NTR_METHOD_GLUCOSE_KATZ 6
#define NTR_METHOD_GLUCOSE_HILLIER 7
#define NTR_METHOD_GLUCOSE_FACTOR 8
#define NTR_METHOD_NA_DEFICIT 9
#define NTR_METHOD_TBW_FRACTION 10
#define NTR_METHOD_TBW_WATSON 11
#define NTR_METHOD_FREE_WATER_DEFICIT 12
#define NTR_METHOD_FLUID_PRESETS 13
#define NTR_METHOD_ADROGUE_MADIAS 14
#define NTR_METHOD_INFUSATE_MASS_BALANCE 15
#define NTR_METHOD_INFUSATE_VOLUME 16
#define NTR_METHOD_FURST 17
#define NTR_METHOD_EFWC 18
/** @} */

#ifdef __cplusplus
}
#endif

#endif /* NATREMIA_H */
