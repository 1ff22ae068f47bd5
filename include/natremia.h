/* SPDX-License-Identifier: MIT */
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
 * - Overlapping buffers (aliasing rule): an output must not share memory
 *   with an input or with another output, with one exception: a batch
 *   function's @c out column may be the very same array as one of its
 *   double input columns (in place). Inputs may overlap each other freely
 *   (they are only read). Functions that write an array while still
 *   reading their inputs refuse any overlap of their buffers with
 *   @ref NTR_ERR_ARG (they are ntr_balance_course(), ntr_batch_correction_assess()
 *   and ntr_batch_course_assess()). Elsewhere an overlap the rule forbids
 *   gives unspecified output values and status, but no function then
 *   writes outside its outputs. A watcher state is both
 *   input and output of its push functions and must not overlap their
 *   other arguments.
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
#define NTR_VERSION_MINOR 1 /**< Minor version: compatible additions. */
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

/* Every function that returns a status carries NTR_MUST_CHECK, so that a
 * caller who drops the status gets a compiler warning (GCC and clang:
 * -Wunused-result, on by default; an error with -Werror): an unchecked
 * status is how a refused input passes quietly, with its outputs left
 * untouched. GCC warns even through a (void) cast; test the status
 * instead. Define NTR_NO_MUST_CHECK before including the header to switch
 * the attribute off. */
#if defined(NTR_NO_MUST_CHECK)
#  define NTR_MUST_CHECK
#elif defined(__GNUC__) && __GNUC__ >= 4
#  define NTR_MUST_CHECK __attribute__((warn_unused_result))
#else
#  define NTR_MUST_CHECK
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
 * @brief The library's version as text.
 * @return "MAJOR.MINOR.PATCH" as a static string; compare with the NTR_VERSION_* macros to detect
 *         a header/library mismatch.
 */
NTR_API const char *ntr_version_string(void);

/**
 * @brief The library's version as one number.
 * @return MAJOR*10000 + MINOR*100 + PATCH of the library that is running
 *         (10000 for 1.0.0); compare with the NTR_VERSION_* macros.
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
#define NTR_ANALYTE_OSMOLALITY 9    /**< osmolality (since 1.1): mosm/kg only, converted to itself */
#define NTR_ANALYTE_URIC_ACID 10    /**< uric acid, C5H4N4O3, 168.112 g/mol (since 1.1) */

/* Specimens a LOINC code names (ntr_loinc_lookup(), since 1.1). */
#define NTR_SPECIMEN_SERUM_PLASMA 1 /**< serum or plasma */
#define NTR_SPECIMEN_BLOOD 2        /**< whole blood */
#define NTR_SPECIMEN_URINE 3        /**< urine */

/** Longest text ntr_unit_parse_lenient() reads, in bytes, blanks included
 *  (since 1.1); a longer text is refused without being read further. */
#define NTR_UNIT_TEXT_MAX 32

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
NTR_API NTR_MUST_CHECK int ntr_unit_parse(const char *ucum, int *unit);

/**
 * @brief Parse a unit as laboratory feeds spell it (since 1.1).
 *
 * The text is folded before it is matched: blanks (space, tab) around it
 * are dropped, ASCII letters are compared without case (UCUM's
 * case-insensitive forms are the upper-case codes), and the micro sign
 * U+00B5 and the Greek small letter mu U+03BC, in UTF-8, read as "u".
 * What remains must be one of these spellings (shown folded):
 * - "mmol/l" gives @ref NTR_UNIT_MMOL_L ("mmol/L", "mmol/l", "MMOL/L")
 * - "mg/dl" gives @ref NTR_UNIT_MG_DL ("mg/dL", "mg/dl", "MG/DL")
 * - "meq/l" gives @ref NTR_UNIT_MEQ_L ("meq/L", "mEq/L", "MEQ/L")
 * - "mosm/kg", "mosm/kg{h2o}", "mosm/kg h2o", "mosmol/kg",
 *   "mosmol/kg{h2o}", "mosmol/kg h2o" give @ref NTR_UNIT_MOSM_KG
 *   ("mOsm/kg", "mosm/kg H2O", "mOsm/kg{H2O}", "mOsmol/kg")
 * - "g/l" gives @ref NTR_UNIT_G_L ("g/L", "g/l", "G/L")
 * - "umol/l" gives @ref NTR_UNIT_UMOL_L ("umol/L", and with the micro sign or mu for u)
 *
 * Everything else is refused, in particular what could mean two things:
 * "mosm/l" (an osmolarity, per litre of solution, not the osmolality per
 * kg of water that @ref NTR_UNIT_MOSM_KG is), "mmol/kg" (an osmolality to
 * some laboratories, a molality of one solute to others), "mg%" and
 * "mg/100ml" (older spellings of mg/dL that some texts use for other
 * quantities), blanks inside the unit other than the one before "h2o",
 * other non-ASCII bytes (Latin-1 micro 0xB5 included: the encoding is not
 * known) and texts longer than @ref NTR_UNIT_TEXT_MAX bytes. The strict
 * ntr_unit_parse() is unchanged.
 *
 * The text is read only up to its terminating NUL, and never more than
 * @ref NTR_UNIT_TEXT_MAX + 1 bytes.
 *
 * @param text  NUL-terminated unit text.
 * @param[out] unit one of the NTR_UNIT_* values.
 * @retval NTR_OK          parsed.
 * @retval NTR_ERR_NULL    @p text or @p unit is NULL.
 * @retval NTR_ERR_UNIT    not one of the spellings above.
 *
 * Reference: The Unified Code for Units of Measure (UCUM), Regenstrief
 * Institute (its case-insensitive forms and the {annotation} syntax).
 * Method: @ref NTR_METHOD_UNIT_CONVERSION.
 */
NTR_API NTR_MUST_CHECK int ntr_unit_parse_lenient(const char *text, int *unit);

/**
 * @brief Analyte, specimen and unit of a LOINC code (since 1.1).
 *
 * Only codes checked against a published source are mapped (docs/units.md
 * lists them with their source, and the codes not mapped until checked):
 *
 * | code | component [property] in system | analyte | specimen | unit |
 * |---|---|---|---|---|
 * | 2951-2 | Sodium [Moles/volume] in Serum or Plasma | sodium | serum/plasma | mmol/L |
 * | 2947-0 | Sodium [Moles/volume] in Blood | sodium | blood | mmol/L |
 * | 2823-3 | Potassium [Moles/volume] in Serum or Plasma | potassium | serum/plasma | mmol/L |
 * | 2075-0 | Chloride [Moles/volume] in Serum or Plasma | chloride | serum/plasma | mmol/L |
 * | 2345-7 | Glucose [Mass/volume] in Serum or Plasma | glucose | serum/plasma | mg/dL |
 * | 14749-6 | Glucose [Moles/volume] in Serum or Plasma | glucose | serum/plasma | mmol/L |
 * | 15074-8 | Glucose [Moles/volume] in Blood | glucose | blood | mmol/L |
 * | 14937-7 | Urea nitrogen [Moles/volume] in Serum or Plasma | urea nitrogen | serum/plasma | mmol/L |
 * | 2160-0 | Creatinine [Mass/volume] in Serum or Plasma | creatinine | serum/plasma | mg/dL |
 * | 14682-9 | Creatinine [Moles/volume] in Serum or Plasma | creatinine | serum/plasma | mmol/L |
 * | 2161-8 | Creatinine [Mass/volume] in Urine | creatinine | urine | mg/dL |
 * | 14933-6 | Urate [Moles/volume] in Serum or Plasma | uric acid | serum/plasma | mmol/L |
 *
 * The unit is the one the code's property implies: moles/volume gives
 * @ref NTR_UNIT_MMOL_L, mass/volume @ref NTR_UNIT_MG_DL, osmolality
 * @ref NTR_UNIT_MOSM_KG. It names the dimension, not the prefix the result
 * is sent with (creatinine of 14682-9 often comes in umol/L): read the
 * value's own unit (ntr_unit_parse_lenient()) and use this one to check
 * that the two agree in kind. The code must be given exactly (digits, the
 * hyphen and the check digit, no blanks); it is read up to its NUL and
 * never more than 8 bytes (the longest code, 7 characters, and its NUL).
 *
 * @param code  NUL-terminated LOINC code, e.g. "2951-2".
 * @param[out] analyte  one of NTR_ANALYTE_*.
 * @param[out] specimen one of NTR_SPECIMEN_*.
 * @param[out] unit     one of NTR_UNIT_*.
 * @retval NTR_OK          found.
 * @retval NTR_ERR_NULL    a pointer is NULL.
 * @retval NTR_ERR_UNIT    not a code of the table (unknown, or not checked yet).
 *
 * Reference: LOINC, Regenstrief Institute; the codes as used in the HL7
 * FHIR R4 published examples (hl7.fhir.r4.examples 4.0.1).
 * Method: @ref NTR_METHOD_LOINC_MAP.
 */
NTR_API NTR_MUST_CHECK int ntr_loinc_lookup(const char *code, int *analyte, int *specimen,
                             int *unit);

/**
 * @brief Glucose in mmol/L, refused when it contradicts the sodium and the
 *        measured osmolality for the unit given (since 1.1).
 *
 * The glucose is converted from @p unit to mmol/L (ntr_convert()); g is
 * the result. The osmolality that g implies is at least the
 * Dorwart-Chalmers value without urea or ethanol (both add, never
 * subtract): floor = 1.86*Na + g + 9. The glucose is refused with
 * @ref NTR_ERR_UNIT when
 * - floor > 600 mOsm/kg, the largest osmolality the library takes
 *   (docs/ranges.md), or
 * - an osmolality was measured and floor > measured + 20 mOsm/kg (the
 *   tolerance, docs/ranges.md).
 *
 * This catches the dangerous slip, a glucose in mg/dL passed as mmol/L
 * (150 "mmol/L" with sodium 135 implies at least 410 mOsm/kg; a measured
 * 290 refuses it), once 17/18 of the value exceeds urea, other osmoles,
 * the osmolal gap and the tolerance together (about 30 mg/dL with a
 * normal urea). Without a measured osmolality it catches only values the
 * first rule refuses: both readings of any value from 0 to 200 are then
 * possible, and docs/units.md says why. The reverse slip (mmol/L passed
 * as mg/dL) lowers the floor and cannot be refused: a measured
 * osmolality far above it is what unmeasured osmoles (toxic alcohols)
 * also give.
 *
 * @param glucose          the glucose in @p unit; finite, 0 to 200 mmol/L
 *                         once converted (0 to 3603 mg/dL).
 * @param unit             @ref NTR_UNIT_MMOL_L, @ref NTR_UNIT_MG_DL,
 *                         @ref NTR_UNIT_G_L or @ref NTR_UNIT_UMOL_L.
 * @param na_mmol_l        serum sodium, 80 to 220 mmol/L.
 * @param measured_osm_mosm_kg measured serum osmolality, 150 to 600
 *                         mOsm/kg, or exactly 0 when not measured.
 * @param[out] glucose_mmol_l the glucose in mmol/L.
 * @retval NTR_OK            converted and consistent with its unit.
 * @retval NTR_ERR_NULL      @p glucose_mmol_l is NULL.
 * @retval NTR_ERR_UNIT      @p unit is not a glucose unit; or, after every
 *                           range check, the rules above refuse the glucose.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its range.
 *
 * Reference: Dorwart WV, Chalmers L. Comparison of methods for
 * calculating serum osmolality from chemical concentrations. Clin Chem
 * 1975;21:190-4. The tolerance is the project's (docs/ranges.md).
 * Method: @ref NTR_METHOD_GLUCOSE_UNIT_CHECK.
 */
NTR_API NTR_MUST_CHECK int ntr_glucose_unit_check(double glucose, int unit, double na_mmol_l,
                                   double measured_osm_mosm_kg,
                                   double *glucose_mmol_l);

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
 * - uric acid (since 1.1): mmol/L, mg/dL, g/L, umol/L
 * - osmolality (since 1.1): mosm/kg only; mosm/kg to mosm/kg returns the
 *   value, any other unit gives NTR_ERR_UNIT
 *
 * @param analyte   one of NTR_ANALYTE_*.
 * @param value     the value in @p from_unit; finite, 0 to 1e6.
 * @param from_unit unit of @p value (NTR_UNIT_*).
 * @param to_unit   wanted unit (NTR_UNIT_*).
 * @param[out] out  the converted value.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown analyte.
 * @retval NTR_ERR_UNIT      unknown unit or one the analyte does not accept.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: IUPAC Commission on Isotopic Abundances and Atomic Weights,
 * standard atomic weights (abridged to five significant figures).
 * Method: @ref NTR_METHOD_UNIT_CONVERSION.
 */
NTR_API NTR_MUST_CHECK int ntr_convert(int analyte, double value, int from_unit, int to_unit,
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
 * - @ref NTR_OSM_2NA (1): Osm = 2*Na + glucose + urea + ethanol
 * - @ref NTR_OSM_DORWART_CHALMERS (2): Osm = 1.86*Na + glucose + urea + 9 + ethanol
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown formula.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: Dorwart WV, Chalmers L. Comparison of methods for calculating
 * serum osmolality from chemical concentrations. Clin Chem 1975;21:190-4.
 * Methods: @ref NTR_METHOD_OSM_2NA, @ref NTR_METHOD_OSM_DORWART_CHALMERS.
 */
NTR_API NTR_MUST_CHECK int ntr_osm_calculated(double na_mmol_l, double glucose_mmol_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Spasovski G et al. Clinical practice guideline on diagnosis
 * and treatment of hyponatraemia. Eur J Endocrinol 2014;170:G1-47.
 * Method: @ref NTR_METHOD_OSM_EFFECTIVE.
 */
NTR_API NTR_MUST_CHECK int ntr_osm_effective(double na_mmol_l, double glucose_mmol_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: textbook definition of the osmolal gap.
 * Method: @ref NTR_METHOD_OSM_GAP.
 */
NTR_API NTR_MUST_CHECK int ntr_osm_gap(double measured_mosm_kg, double calculated_mosm_kg,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       @p method is not a NTR_GLUCOSE_* value.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: Katz MA. Hyperglycemia-induced hyponatremia: calculation of
 * expected serum sodium depression. N Engl J Med 1973;289:843-4.
 * Hillier TA, Abbott RD, Barrett EJ. Hyponatremia: evaluating the
 * correction factor for hyperglycemia. Am J Med 1999;106:399-403.
 * Methods: @ref NTR_METHOD_GLUCOSE_KATZ, @ref NTR_METHOD_GLUCOSE_HILLIER.
 */
NTR_API NTR_MUST_CHECK int ntr_na_corrected_glucose(double na_mmol_l, double glucose_mmol_l,
                                     int method, double *na_corrected_mmol_l);

/**
 * @brief Serum sodium corrected for hyperglycaemia with a caller's factor.
 *
 * As ntr_na_corrected_glucose() with an explicit factor (mmol/L of sodium
 * per 100 mg/dL of glucose above 100 mg/dL).
 *
 * @param na_mmol_l            80 to 220 mmol/L.
 * @param glucose_mmol_l       0 to 200 mmol/L.
 * @param factor_per_100mg_dl  0 to 5 (the published factors and why 5:
 *                             @ref sodium_page).
 * @param[out] na_corrected_mmol_l corrected sodium, mmol/L.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: as ntr_na_corrected_glucose().
 * Method: @ref NTR_METHOD_GLUCOSE_FACTOR.
 */
NTR_API NTR_MUST_CHECK int ntr_na_corrected_glucose_factor(double na_mmol_l,
                                            double glucose_mmol_l,
                                            double factor_per_100mg_dl,
                                            double *na_corrected_mmol_l);

/**
 * @brief Sodium needed to raise serum sodium to a target.
 *
 * deficit = TBW * (target - Na), in mmol.
 *
 * It ignores the water the sodium is given in, so giving the deficit as a
 * saline falls short of the target: 300 mmol (TBW 30 L, 120 to 130) as
 * 0.585 L of 3% saline reaches 127.5 by mass balance, not 130. To size a
 * fluid for a target use ntr_infusate_volume_for_change(), which solves
 * the mass balance exactly.
 *
 * @param tbw_l               total body water, 0.1 to 400 L.
 * @param na_mmol_l           current serum sodium, 80 to 220 mmol/L.
 * @param target_na_mmol_l    target serum sodium, 80 to 220 mmol/L.
 * @param[out] mmol           sodium to give, mmol.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    target below the current sodium.
 *
 * Reference: common practice (the sodium-deficit formula of general
 * medical texts). It ignores ongoing losses too; see ntr_balance_predict().
 * Method: @ref NTR_METHOD_NA_DEFICIT.
 */
NTR_API NTR_MUST_CHECK int ntr_na_deficit(double tbw_l, double na_mmol_l,
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
 * TBW = f * weight, with f = 0.6 for children (1 year to below 18 years),
 * 0.6 for men 18 to 64, 0.5 for women 18 to 64, 0.5 for men 65 and over,
 * 0.45 for women 65 and over. The child boundary is the age of majority
 * used by paediatric services; 65 is the conventional start of "elderly"
 * in the geriatric literature (both common practice; the paper does not
 * state ages). Infants under 1 year are refused (NTR_ERR_RANGE): a
 * newborn holds about 0.75 to 0.8 of its weight as water, falling to about
 * 0.6 over the first year, so 0.6 would under-read a neonate by a fifth;
 * use a measured or paediatric estimate for them (docs/water.md). Since
 * 1.1; 1.0 gave 0.6 from age 0.
 *
 * @param sex         @ref NTR_SEX_MALE or @ref NTR_SEX_FEMALE.
 * @param age_years   1 to 130.
 * @param weight_kg   0.3 to 650.
 * @param[out] litres total body water, L.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       @p sex is not a NTR_SEX_* value.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med
 * 2000;342:1581-9.
 * Method: @ref NTR_METHOD_TBW_FRACTION.
 */
NTR_API NTR_MUST_CHECK int ntr_tbw_fraction(int sex, double age_years, double weight_kg,
                             double *litres);

/**
 * @brief Total body water by the Watson anthropometric equations (adults).
 *
 * - men:   TBW = 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight
 * - women: TBW = -2.097 + 0.1069*height + 0.2466*weight
 *
 * with age in years, height in cm, weight in kg, TBW in litres.
 *
 * The equations are regressions on adults of ordinary build; far outside
 * it they give numbers no body holds. A result below 20% or above 80% of
 * the weight is refused (adult body water is about 40 to 75% of weight,
 * lower in severe obesity, and lean tissue itself is about 73% water;
 * docs/water.md), and so is one below 0.1 L, which no function taking a
 * body water accepts. Adults 145 to 210 cm tall with a body-mass index
 * of 17 to 80 keep the 1.0 result (tested); a very light, short young man
 * (BMI 15 to 16, under 160 cm) can exceed 80% and is refused.
 *
 * @param sex         @ref NTR_SEX_MALE or @ref NTR_SEX_FEMALE.
 * @param age_years   18 to 130 (adults only: the equations were derived
 *                    in adults; younger ages give NTR_ERR_RANGE).
 * @param height_cm   30 to 275.
 * @param weight_kg   0.3 to 650.
 * @param[out] litres total body water, L.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       @p sex is not a NTR_SEX_* value.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the result is below 20% or above 80% of the
 *                           weight, or below 0.1 L; 1.0 refused only 0 L or
 *                           less.
 *
 * Reference: Watson PE, Watson ID, Batt RD. Total body water volumes for
 * adult males and females estimated from simple anthropometric
 * measurements. Am J Clin Nutr 1980;33:27-39.
 * Method: @ref NTR_METHOD_TBW_WATSON.
 */
NTR_API NTR_MUST_CHECK int ntr_tbw_watson(int sex, double age_years, double height_cm,
                           double weight_kg, double *litres);

/**
 * @brief Free-water deficit in high serum sodium.
 *
 * deficit = TBW * (Na / 140 - 1), in litres; 0 at 140 mmol/L.
 *
 * @param tbw_l       total body water, 0.1 to 400 L.
 * @param na_mmol_l   serum sodium, 80 to 220 mmol/L.
 * @param[out] litres water deficit, L.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    sodium below 140: there is no water deficit.
 *
 * Reference: the textbook water-deficit formula (common practice); for the
 * choice of infusate see Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med
 * 2000;342:1493-9.
 * Method: @ref NTR_METHOD_FREE_WATER_DEFICIT.
 */
NTR_API NTR_MUST_CHECK int ntr_free_water_deficit(double tbw_l, double na_mmol_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       @p fluid is not a NTR_FLUID_* value.
 *
 * Reference: Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med
 * 2000;342:1581-9 (table of infusates).
 * Method: @ref NTR_METHOD_FLUID_PRESETS.
 */
NTR_API NTR_MUST_CHECK int ntr_fluid_preset(int fluid, double *na_mmol_l, double *k_mmol_l);

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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the sodium after, Na + delta, would lie outside 80
 *                           to 220 mmol/L, or the body water after, TBW + 1,
 *                           above 400 L: the rule ntr_balance_predict()
 *                           applies to the same 1 L; since 1.1.
 *
 * Reference: Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med
 * 2000;342:1581-9.
 * Method: @ref NTR_METHOD_ADROGUE_MADIAS.
 */
NTR_API NTR_MUST_CHECK int ntr_infusate_change_per_litre(double na_mmol_l, double tbw_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the sodium after would lie outside 80 to 220
 *                           mmol/L, or the body water after outside 0.1 to 400
 *                           L: exactly what ntr_balance_predict() refuses for
 *                           the same flow; since 1.1, where 1.0 answered, e.g.
 *                           264 mmol/L for 20 L of 3% saline on 140 and 40 L.
 *
 * Reference: derived from the Adrogue-Madias mass balance
 * (N Engl J Med 2000;342:1581-9).
 * Method: @ref NTR_METHOD_INFUSATE_MASS_BALANCE.
 */
NTR_API NTR_MUST_CHECK int ntr_infusate_change(double na_mmol_l, double tbw_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the target sodium Na + delta lies outside 80 to
 *                           220 mmol/L, as ntr_relower_estimate() refuses a
 *                           target below 80; the infusate cannot move sodium
 *                           that far in that direction; the volume would
 *                           exceed 20 L; or ntr_infusate_change() would refuse
 *                           the volume found. The first and last since 1.1.
 *
 * Unlike the sodium-deficit step (ntr_na_deficit() divided by the
 * infusate's sodium), this counts the water the infusate brings: on the
 * inputs of the Furst et al. example (Na 108, TBW 30 L, 3% saline, a rise
 * of 5) it gives 150/400 = 0.375 L, where the deficit step's 292 mL
 * reaches only about 112.
 *
 * Reference: derived from the Adrogue & Madias 2000 mass balance (exact
 * inverse of ntr_infusate_change()).
 * Method: @ref NTR_METHOD_INFUSATE_VOLUME.
 */
NTR_API NTR_MUST_CHECK int ntr_infusate_volume_for_change(double na_mmol_l, double tbw_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Furst H, Hallows KR, Post J, et al. The urine/plasma
 * electrolyte ratio: a predictive guide to water restriction. Am J Med Sci
 * 2000;319:240-4.
 * Method: @ref NTR_METHOD_FURST.
 */
NTR_API NTR_MUST_CHECK int ntr_furst_ratio(double urine_na_mmol_l, double urine_k_mmol_l,
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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: Furst et al., Am J Med Sci 2000;319:240-4. Verbalis JG et al.
 * Diagnosis, evaluation, and treatment of hyponatremia: expert panel
 * recommendations. Am J Med 2013;126(10 Suppl 1):S1-42.
 * Method: @ref NTR_METHOD_FURST.
 */
NTR_API NTR_MUST_CHECK int ntr_restriction_from_ratio(double ratio, int *advice);

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
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: standard renal physiology (for example Rose BD, Post TW.
 * Clinical Physiology of Acid-Base and Electrolyte Disorders, 5th ed.).
 * Method: @ref NTR_METHOD_EFWC.
 */
NTR_API NTR_MUST_CHECK int ntr_efwc(double urine_volume_l, double urine_na_mmol_l,
                     double urine_k_mmol_l, double serum_na_mmol_l,
                     double *litres);
/** @} */

/* ======================================================================= */
/* ==== section: solute (lib/solute.c, docs/solute.md) =================== */
/* ======================================================================= */

/** @defgroup solute Solute, urine volume and fluid restriction
 *  How much urine the day's solute makes at the urine's fixed osmolality
 *  (Berl 2008), the most fluid per day that does not lower the sodium, the
 *  osmoles of urea or salt tablets and the dose that makes a chosen fluid
 *  allowance hold, and one outlook for "will restriction, with or without
 *  solute, work?". docs/solute.md lists what the model ignores.
 *
 *  Common premises: the urine osmolality stays as measured (in SIAD it is
 *  fixed by the antidiuretic hormone; when that falls, a water diuresis
 *  follows and every figure here is too low); a kilogram of urine is taken
 *  as a litre; the day is in steady state, so solute taken is solute
 *  excreted.
 *  @{ */

#define NTR_SOLUTE_UREA 1 /**< urea, CH4N2O: 1 osmole per mole */
#define NTR_SOLUTE_NACL 2 /**< sodium chloride tablets: 2 osmoles per mole (full dissociation, an idealisation) */

/**
 * @brief Daily urine volume that a solute load makes at a fixed urine osmolality.
 *
 * V = solute / U_osm (Berl): the kidney must excrete the day's osmoles,
 * and at a urine osmolality it cannot change (as in SIAD) the volume
 * follows the solute. mOsm/day divided by mOsm/kg gives kg/day, read as
 * L/day (urine density taken as 1 kg/L; real urine is up to about 3%
 * denser).
 *
 * @param solute_mosm_day    osmoles excreted per day, 0 to 10000 mOsm/day
 *                           (about 600-900 on a usual diet).
 * @param urine_osm_mosm_kg  urine osmolality, 10 to 2000 mOsm/kg.
 * @param[out] urine_l_day   urine volume, L/day.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the volume would exceed 30 L/day, the largest
 *                           urine volume the library accepts anywhere.
 *
 * Reference: Berl T. Impact of solute intake on urine flow and water
 * excretion. J Am Soc Nephrol 2008;19:1076-8.
 * Method: @ref NTR_METHOD_SOLUTE_URINE_VOLUME.
 */
NTR_API NTR_MUST_CHECK int ntr_urine_volume_from_solute(double solute_mosm_day,
                                         double urine_osm_mosm_kg,
                                         double *urine_l_day);

/**
 * @brief The most fluid per day that does not lower the serum sodium.
 *
 * intake = V * (1 - (U_Na + U_K) / S_Na) + insensible, with
 * V = solute / U_osm (ntr_urine_volume_from_solute()). The first term is
 * the electrolyte-free water clearance of that urine (ntr_efwc()), the
 * factor in brackets 1 minus the Furst ratio (ntr_furst_ratio()). Drinking
 * less than the allowance raises the sodium, more lowers it.
 *
 * A negative result is returned as it is: restriction alone cannot hold
 * the sodium, even with nothing to drink (the urine carries more sodium
 * and potassium per litre than the serum holds, and the insensible loss
 * does not make up for it). With no insensible loss the result is
 * negative exactly when the Furst ratio is above 1 (and V > 0).
 *
 * The urine composition is read as measured at this solute load: the same
 * concentrations at another @p solute_mosm_day describe another urine
 * (more electrolyte excreted), not added solute. For added urea or salt
 * use ntr_fluid_allowance_with_dose().
 *
 * What it ignores: electrolytes eaten or infused (the urine's sodium and
 * potassium count as lost, as in the clearance, so the figure errs towards
 * restriction), water in food and the water made by metabolism (fold them
 * into @p insensible_l_day as a net loss), stool and drain losses.
 *
 * @param solute_mosm_day    osmoles excreted per day, 0 to 10000 mOsm/day.
 * @param urine_osm_mosm_kg  urine osmolality, 10 to 2000 mOsm/kg.
 * @param urine_na_mmol_l    0 to 500 mmol/L.
 * @param urine_k_mmol_l     0 to 300 mmol/L.
 * @param serum_na_mmol_l    80 to 220 mmol/L.
 * @param insensible_l_day   net insensible loss (skin and breath minus
 *                           water of metabolism), 0 to 10 L/day.
 * @param[out] intake_l_day  the allowance, L/day; may be negative.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the urine volume would exceed 30 L/day.
 *
 * References: Berl T, J Am Soc Nephrol 2008;19:1076-8 (urine volume from
 * solute). Furst H et al., Am J Med Sci 2000;319:240-4 (the ratio).
 * Electrolyte-free water clearance: standard renal physiology (Rose BD,
 * Post TW. Clinical Physiology of Acid-Base and Electrolyte Disorders,
 * 5th ed.).
 * Method: @ref NTR_METHOD_FLUID_ALLOWANCE.
 */
NTR_API NTR_MUST_CHECK int ntr_fluid_allowance(double solute_mosm_day,
                                double urine_osm_mosm_kg,
                                double urine_na_mmol_l, double urine_k_mmol_l,
                                double serum_na_mmol_l,
                                double insensible_l_day,
                                double *intake_l_day);

/**
 * @brief Osmoles in a dose of urea or sodium chloride.
 *
 * mOsm = 1000 * grams / M * n, M the molar mass from the IUPAC standard
 * atomic weights (urea CH4N2O 60.056 g/mol; NaCl 58.443 g/mol), n the
 * osmoles per mole: 1 for urea, 2 for NaCl. Two per mole assumes full
 * dissociation, an idealisation: the osmotic coefficient of saline is
 * about 0.93 (from memory), so the true figure is a few per cent lower.
 * 30 g of urea is about 500 mOsm; 1 g of NaCl about 34 mOsm (and 17 mmol
 * of sodium).
 *
 * @param solute      NTR_SOLUTE_UREA or NTR_SOLUTE_NACL.
 * @param grams       the dose, 0 to 200 g.
 * @param[out] mosm   its osmoles, mOsm.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown solute.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: IUPAC standard atomic weights (abridged, Commission on
 * Isotopic Abundances and Atomic Weights); Berl T, J Am Soc Nephrol
 * 2008;19:1076-8 (urea and salt as solute).
 * Method: @ref NTR_METHOD_SOLUTE_DOSE.
 */
NTR_API NTR_MUST_CHECK int ntr_solute_dose_osmoles(int solute, double grams, double *mosm);

/**
 * @brief The fluid allowance after a daily dose of urea or salt tablets.
 *
 * intake = A0 + D / U_osm, with A0 = ntr_fluid_allowance() of the measured
 * urine and D = ntr_solute_dose_osmoles() of the daily dose: the added
 * osmoles leave in extra urine at the same osmolality, and that extra
 * urine carries no net electrolyte. For urea this is plain (urea is not
 * an electrolyte); for NaCl the tablets' sodium is taken in and excreted
 * the same day (steady state), so it cancels in the balance and only the
 * osmoles remain. The dose therefore helps even when the Furst ratio is
 * above 1, which restriction alone cannot.
 *
 * Also ignores: sodium kept rather than excreted (volume depletion, heart
 * failure, cirrhosis: salt then raises the sodium directly and loads the
 * circulation), a fall of urine osmolality as the dose takes effect, and
 * urea's own effect on thirst and protein intake. Each gram of NaCl is
 * about 17 mmol of sodium.
 *
 * @param solute            NTR_SOLUTE_UREA or NTR_SOLUTE_NACL.
 * @param grams_day         the daily dose, 0 to 200 g/day.
 * @param solute_mosm_day   osmoles excreted per day before the dose,
 *                          0 to 10000 mOsm/day.
 * @param urine_osm_mosm_kg 10 to 2000 mOsm/kg.
 * @param urine_na_mmol_l   0 to 500 mmol/L (measured before the dose).
 * @param urine_k_mmol_l    0 to 300 mmol/L.
 * @param serum_na_mmol_l   80 to 220 mmol/L.
 * @param insensible_l_day  0 to 10 L/day.
 * @param[out] intake_l_day the allowance with the dose, L/day; may be negative.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown solute.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the urine volume, before or with the dose, would
 *                           exceed 30 L/day.
 *
 * References: Berl T, J Am Soc Nephrol 2008;19:1076-8; as
 * ntr_fluid_allowance().
 * Method: @ref NTR_METHOD_SOLUTE_FOR_ALLOWANCE.
 */
NTR_API NTR_MUST_CHECK int ntr_fluid_allowance_with_dose(int solute, double grams_day,
                                          double solute_mosm_day,
                                          double urine_osm_mosm_kg,
                                          double urine_na_mmol_l,
                                          double urine_k_mmol_l,
                                          double serum_na_mmol_l,
                                          double insensible_l_day,
                                          double *intake_l_day);

/**
 * @brief The daily dose of urea or salt that makes a chosen fluid allowance hold.
 *
 * The inverse of ntr_fluid_allowance_with_dose(): D = (target - A0) * U_osm
 * osmoles a day, turned into grams by the molar mass and the osmoles per
 * mole (ntr_solute_dose_osmoles()). When the measured urine already allows
 * the target (A0 >= target) the dose is 0. Same premises and omissions as
 * ntr_fluid_allowance_with_dose().
 *
 * @param solute              NTR_SOLUTE_UREA or NTR_SOLUTE_NACL.
 * @param solute_mosm_day     0 to 10000 mOsm/day (before the dose).
 * @param urine_osm_mosm_kg   10 to 2000 mOsm/kg.
 * @param urine_na_mmol_l     0 to 500 mmol/L.
 * @param urine_k_mmol_l      0 to 300 mmol/L.
 * @param serum_na_mmol_l     80 to 220 mmol/L.
 * @param insensible_l_day    0 to 10 L/day.
 * @param target_intake_l_day the daily fluid intake to allow, above 0 and
 *                            at most 10 L/day (for example 1).
 * @param[out] grams_day      the daily dose, g/day (0 when none is needed).
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown solute.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the dose would exceed 200 g/day, or the urine
 *                           volume 30 L/day.
 *
 * @warning An estimate for decision support, not an order: doses are
 * limited by tolerance and local protocol, and the sodium must be measured.
 *
 * References: Berl T, J Am Soc Nephrol 2008;19:1076-8; as
 * ntr_fluid_allowance().
 * Method: @ref NTR_METHOD_SOLUTE_FOR_ALLOWANCE.
 */
NTR_API NTR_MUST_CHECK int ntr_solute_dose_for_allowance(int solute, double solute_mosm_day,
                                          double urine_osm_mosm_kg,
                                          double urine_na_mmol_l,
                                          double urine_k_mmol_l,
                                          double serum_na_mmol_l,
                                          double insensible_l_day,
                                          double target_intake_l_day,
                                          double *grams_day);

#define NTR_OUTLOOK_TARGET_HOLDS 1       /**< the allowance reaches the target: restricting to it holds the sodium */
#define NTR_OUTLOOK_STRICTER_OR_SOLUTE 2 /**< 0 < allowance < target: restrict below the target, or add solute */
#define NTR_OUTLOOK_RESTRICTION_FAILS 3  /**< allowance <= 0: restriction alone cannot hold the sodium */

#define NTR_OUTLOOK_FURST_ABOVE_ONE 0x1u   /**< Furst ratio above 1, a predictor that restriction fails */
#define NTR_OUTLOOK_UREA_OUT_OF_RANGE 0x2u /**< no urea dose up to 200 g/day reaches the target */
#define NTR_OUTLOOK_NACL_OUT_OF_RANGE 0x4u /**< no NaCl dose up to 200 g/day reaches the target */

/** Dose member of ntr_outlook when no dose within range reaches the target. */
#define NTR_OUTLOOK_NO_DOSE (-1.0)

/**
 * @brief The answer of ntr_restriction_outlook().
 *
 * Growth (ABI): the caller sets @c struct_size to sizeof(ntr_outlook);
 * members are only appended, and the library writes only members that fit
 * in the caller's @c struct_size. A @c struct_size below this version's
 * size gives NTR_ERR_ARG.
 */
typedef struct ntr_outlook {
    size_t struct_size;         /**< sizeof(ntr_outlook) as the caller knows it; read, not written. */
    int verdict;                /**< NTR_OUTLOOK_TARGET_HOLDS, _STRICTER_OR_SOLUTE or _RESTRICTION_FAILS. */
    int furst_advice;           /**< NTR_RESTRICT_* band of the Furst ratio (ntr_restriction_from_ratio()). */
    double furst_ratio;         /**< (U_Na + U_K) / S_Na. */
    double urine_l_day;         /**< urine volume from the current solute, L/day. */
    double efwc_l_day;          /**< electrolyte-free water clearance of that urine, L/day. */
    double allowance_l_day;     /**< the most fluid per day that does not lower the sodium (may be negative). */
    double target_intake_l_day; /**< the target asked about, L/day. */
    double urea_g_day;          /**< urea per day that makes the target hold; 0 if none is needed; NTR_OUTLOOK_NO_DOSE. */
    double nacl_g_day;          /**< the same for NaCl tablets. */
    unsigned int flags;         /**< NTR_OUTLOOK_* flag bits. */
    unsigned int reserved;      /**< Written as 0. */
} ntr_outlook;

/**
 * @brief Will restriction, with or without solute, hold this patient's sodium?
 *
 * Combines, for one measured urine: the Furst ratio and its restriction
 * band (ntr_furst_ratio(), ntr_restriction_from_ratio()); the urine volume
 * the day's solute makes (ntr_urine_volume_from_solute()) and its
 * electrolyte-free water clearance (ntr_efwc()); the fluid allowance
 * (ntr_fluid_allowance()); and the daily urea and NaCl doses that make
 * @p target_intake_l_day hold (ntr_solute_dose_for_allowance(); a dose
 * above 200 g/day, or one that needs more than 30 L/day of urine, is
 * reported as NTR_OUTLOOK_NO_DOSE with its flag).
 *
 * Verdict: allowance <= 0 gives NTR_OUTLOOK_RESTRICTION_FAILS; else
 * allowance >= target gives NTR_OUTLOOK_TARGET_HOLDS; else
 * NTR_OUTLOOK_STRICTER_OR_SOLUTE. The Furst band is reported beside it and
 * can disagree when the insensible loss is large: with no insensible loss,
 * a ratio above 1 means the allowance is negative.
 *
 * What it ignores: everything ntr_fluid_allowance() and
 * ntr_fluid_allowance_with_dose() ignore; thirst and adherence; that the
 * urine changes as the sodium corrects (recheck it); diuretics, vaptans
 * and other treatment; how fast the sodium rises when intake is below the
 * allowance (use the balance functions with the body water).
 *
 * Check order: NULL pointer; @c struct_size (NTR_ERR_ARG); the numbers in
 * argument order; the domain.
 *
 * @param solute_mosm_day     0 to 10000 mOsm/day.
 * @param urine_osm_mosm_kg   10 to 2000 mOsm/kg.
 * @param urine_na_mmol_l     0 to 500 mmol/L.
 * @param urine_k_mmol_l      0 to 300 mmol/L.
 * @param serum_na_mmol_l     80 to 220 mmol/L.
 * @param insensible_l_day    0 to 10 L/day.
 * @param target_intake_l_day above 0 and at most 10 L/day (for example 1).
 * @param[out] out            the outlook; set out->struct_size first.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       struct_size too small.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the urine volume would exceed 30 L/day.
 *
 * @warning An estimate for decision support, not an order.
 *
 * References: Berl T, J Am Soc Nephrol 2008;19:1076-8. Furst H et al., Am
 * J Med Sci 2000;319:240-4. Verbalis JG et al., Am J Med 2013;126(10 Suppl
 * 1):S1-42 (a ratio above 1 predicts failure of restriction).
 * Methods: @ref NTR_METHOD_RESTRICTION_OUTLOOK, @ref NTR_METHOD_FURST,
 * @ref NTR_METHOD_EFWC, @ref NTR_METHOD_FLUID_ALLOWANCE,
 * @ref NTR_METHOD_SOLUTE_FOR_ALLOWANCE.
 */
NTR_API NTR_MUST_CHECK int ntr_restriction_outlook(double solute_mosm_day,
                                    double urine_osm_mosm_kg,
                                    double urine_na_mmol_l,
                                    double urine_k_mmol_l,
                                    double serum_na_mmol_l,
                                    double insensible_l_day,
                                    double target_intake_l_day,
                                    ntr_outlook *out);
/** @} */

/* ======================================================================= */
/* ==== section: workup (lib/workup.c, docs/workup.md) =================== */
/* ======================================================================= */

/** @defgroup workup Work-up of a low sodium
 *  Severity, tonicity, urine findings, fractional excretion and the
 *  criteria for the syndrome of inappropriate antidiuresis (SIAD).
 *  Thresholds follow the European guideline: Spasovski G et al. Clinical
 *  practice guideline on diagnosis and treatment of hyponatraemia. Eur J
 *  Endocrinol 2014;170(3):G1-G47. docs/workup.md says which values were
 *  checked against the text and which are from memory.
 *  @{ */

#define NTR_SEVERITY_NONE 0     /**< sodium 135 mmol/L or more: no hyponatraemia */
#define NTR_SEVERITY_MILD 1     /**< 130 <= Na < 135 mmol/L */
#define NTR_SEVERITY_MODERATE 2 /**< 125 <= Na < 130 mmol/L */
#define NTR_SEVERITY_PROFOUND 3 /**< Na < 125 mmol/L */

/**
 * @brief Biochemical severity of a low serum sodium.
 *
 * Bands of the European guideline: mild 130-135, moderate 125-129,
 * profound below 125 mmol/L. The guideline writes its bands in whole
 * numbers; the library reads them as half-open intervals that meet without
 * a gap, each including its lower edge:
 * - Na >= 135: @ref NTR_SEVERITY_NONE
 * - 130 <= Na < 135: @ref NTR_SEVERITY_MILD
 * - 125 <= Na < 130: @ref NTR_SEVERITY_MODERATE (so 129.9 is moderate)
 * - Na < 125: @ref NTR_SEVERITY_PROFOUND
 *
 * The band describes the number only; the guideline grades clinical
 * severity by symptoms separately. A high sodium gives NTR_SEVERITY_NONE.
 *
 * @param na_mmol_l     serum sodium, 80 to 220 mmol/L.
 * @param[out] severity one of NTR_SEVERITY_*.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Spasovski G et al. Eur J Endocrinol 2014;170(3):G1-G47
 * (classification by biochemical severity).
 * Method: @ref NTR_METHOD_NA_SEVERITY.
 */
NTR_API NTR_MUST_CHECK int ntr_na_severity(double na_mmol_l, int *severity);

#define NTR_TONICITY_HYPOTONIC 1  /**< osmolality (measured, or effective where a function says so) below 275 mOsm/kg */
#define NTR_TONICITY_ISOTONIC 2   /**< 275 to 295 mOsm/kg inclusive */
#define NTR_TONICITY_HYPERTONIC 3 /**< above 295 mOsm/kg */

/** Measured serum osmolality below this (mOsm/kg) is hypotonic. */
#define NTR_TONICITY_HYPOTONIC_BELOW 275.0
/** Measured serum osmolality above this (mOsm/kg) is hypertonic. */
#define NTR_TONICITY_HYPERTONIC_ABOVE 295.0

/**
 * @brief Tonicity class from measured serum osmolality.
 *
 * - Osm < 275: @ref NTR_TONICITY_HYPOTONIC
 * - 275 <= Osm <= 295: @ref NTR_TONICITY_ISOTONIC
 * - Osm > 295: @ref NTR_TONICITY_HYPERTONIC
 *
 * 275 mOsm/kg is the European guideline's limit for hypotonic
 * hyponatraemia; 295 mOsm/kg is the upper end of the usual reference
 * interval for serum osmolality (common practice).
 *
 * @param measured_osm_mosm_kg measured serum osmolality, 150 to 600 mOsm/kg.
 * @param[out] tonicity        one of NTR_TONICITY_*.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Spasovski G et al. Eur J Endocrinol 2014;170(3):G1-G47.
 * Method: @ref NTR_METHOD_TONICITY_CLASS.
 */
NTR_API NTR_MUST_CHECK int ntr_tonicity_class(double measured_osm_mosm_kg, int *tonicity);

/** Flag bits written by ntr_low_na_tonicity() and
 *  ntr_low_na_effective_tonicity(). "Osmolality" is the measured value for
 *  the first, the effective one (ntr_effective_osm_measured()) for the
 *  second. */
#define NTR_LOW_NA_NOT_HYPOTONIC 0x01u    /**< low sodium, osmolality 275 or more */
#define NTR_LOW_NA_PSEUDO 0x02u           /**< isotonic and not explained by glucose: suspect pseudohyponatraemia */
#define NTR_LOW_NA_TRANSLOCATIONAL 0x04u  /**< hypertonic, or glucose explains the sodium */
#define NTR_LOW_NA_GLUCOSE_EXPLAINS 0x08u /**< glucose-corrected sodium is 135 or more */
#define NTR_LOW_NA_DISCORDANT 0x10u       /**< hypotonic, yet glucose alone would explain the sodium: recheck */
#define NTR_LOW_NA_INEFFECTIVE_OSMOLES 0x20u /**< measured osmolality 275 or more, effective below 275: urea or ethanol hide a hypotonic state */

/**
 * @brief Is a low sodium hypotonic, pseudo- or translocational? Measured
 *        osmolality only: prefer ntr_low_na_effective_tonicity().
 *
 * The same as ntr_low_na_effective_tonicity() with urea and ethanol 0, so
 * it classifies the **measured** osmolality as it stands. It cannot see
 * the ineffective osmoles: urea and ethanol raise the measured value
 * without holding water outside cells, so uraemia or ethanol intoxication
 * with a truly hypotonic plasma can read here as isotonic with
 * @ref NTR_LOW_NA_PSEUDO, or as hypertonic with
 * @ref NTR_LOW_NA_TRANSLOCATIONAL (sodium 125, glucose 5, urea 40,
 * measured 295: isotonic and "pseudo", while the effective osmolality is
 * 255). A normal measured osmolality does not exclude hypotonicity (Oster
 * and Singer 1999); call ntr_low_na_effective_tonicity() with the urea and
 * ethanol results. Kept unchanged for 1.0 callers: it never sets
 * @ref NTR_LOW_NA_INEFFECTIVE_OSMOLES.
 *
 * Writes the tonicity class of ntr_tonicity_class() and, when
 * Na < 135 mmol/L, flags (0 when Na >= 135: there is no low sodium to
 * explain):
 * - @ref NTR_LOW_NA_GLUCOSE_EXPLAINS when the sodium corrected for glucose by
 *   @p glucose_method (ntr_na_corrected_glucose()) is 135 or more.
 * - @ref NTR_LOW_NA_NOT_HYPOTONIC when measured osmolality >= 275.
 * - @ref NTR_LOW_NA_TRANSLOCATIONAL when hypertonic (> 295), or glucose
 *   explains the sodium and measured osmolality >= 275: water has moved out
 *   of cells towards an effective osmole (glucose, mannitol).
 * - @ref NTR_LOW_NA_PSEUDO when isotonic (275 to 295) and glucose does not
 *   explain the sodium: suspect a laboratory artefact from high lipids or
 *   proteins (indirect ion-selective electrode), or an isotonic solute;
 *   confirm with a direct ion-selective electrode.
 * - @ref NTR_LOW_NA_DISCORDANT when hypotonic by measurement, yet glucose would
 *   explain the whole sodium fall; the two do not fit, so recheck both.
 *
 * @param na_mmol_l            serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l       serum glucose, 0 to 200 mmol/L.
 * @param measured_osm_mosm_kg measured serum osmolality, 150 to 600 mOsm/kg.
 * @param glucose_method       @ref NTR_GLUCOSE_KATZ or @ref NTR_GLUCOSE_HILLIER.
 * @param[out] tonicity        one of NTR_TONICITY_*.
 * @param[out] flags           a combination of NTR_LOW_NA_* bits.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown glucose method.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Spasovski G et al. Eur J Endocrinol 2014;170(3):G1-G47
 * (exclusion of non-hypotonic hyponatraemia); Katz 1973; Hillier et al.
 * 1999; Oster JR, Singer I. Arch Intern Med 1999;159:333-6 (what the
 * measured value cannot show).
 * Methods: @ref NTR_METHOD_LOW_NA_TONICITY, @ref NTR_METHOD_TONICITY_CLASS,
 * @ref NTR_METHOD_GLUCOSE_KATZ or @ref NTR_METHOD_GLUCOSE_HILLIER.
 */
NTR_API NTR_MUST_CHECK int ntr_low_na_tonicity(double na_mmol_l, double glucose_mmol_l,
                                double measured_osm_mosm_kg,
                                int glucose_method, int *tonicity,
                                unsigned int *flags);

/**
 * @brief Effective serum osmolality from a measured one: the measured value
 *        less the ineffective osmoles urea and ethanol.
 *
 * Urea and ethanol cross cell membranes freely: they raise the measured
 * osmolality but hold no water outside cells, so they do not count towards
 * tonicity.
 *
 *     subtracted = measured - urea - 1.25 * ethanol
 *     floor      = min(2*Na + glucose, measured)
 *     effective  = max(subtracted, floor)
 *
 * - Ethanol coefficient 1.25 mOsm/kg per mmol/L: the empirical value of
 *   Purssell et al. for freezing-point osmometry (ethanol 4.6 mg/dL is
 *   1 mmol/L). A vapour-pressure osmometer does not detect ethanol, which
 *   is volatile: then pass @p ethanol_mmol_l = 0.
 * - Floor: the subtraction stops at the calculated effective osmolality
 *   2*Na + glucose (ntr_osm_effective()). Sodium salts and glucose are
 *   effective osmoles measured in the same sample; a value below what they
 *   supply means more was subtracted than the sample held (an osmometer
 *   that does not see ethanol, a coefficient too high for this patient,
 *   samples drawn at different times, assay errors adding up). The floor
 *   is below 275 whenever 2*Na + glucose is, so it never hides a
 *   hypotonicity that sodium and glucose show. It never exceeds the
 *   measured value: with urea and ethanol 0 the result is exactly the
 *   measured osmolality.
 *
 * The result lies in 150 to 600 mOsm/kg, the range of an osmolality input,
 * so it can be passed as the effective osmolality of ntr_siad_findings.
 *
 * @param na_mmol_l            serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l       serum glucose, 0 to 200 mmol/L.
 * @param urea_mmol_l          serum urea, 0 to 200 mmol/L (BUN mg/dL / 2.8).
 * @param ethanol_mmol_l       serum ethanol, 0 to 400 mmol/L (mg/dL / 4.6);
 *                             0 when not measured or when the osmometer
 *                             uses vapour pressure.
 * @param measured_osm_mosm_kg measured serum osmolality, 150 to 600 mOsm/kg,
 *                             from the same sample.
 * @param[out] mosm_kg         effective osmolality, mOsm/kg.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: Oster JR, Singer I. Arch Intern Med 1999;159:333-6 and
 * Milionis HJ et al. CMAJ 2002;166:1056-62 (a normal measured osmolality
 * does not exclude hypotonicity; effective osmolality is the measured
 * value less urea); Purssell RA et al. Ann Emerg Med 2001 (ethanol
 * coefficient; docs/workup.md says how sure it is).
 * Method: @ref NTR_METHOD_EFFECTIVE_OSM_MEASURED.
 */
NTR_API NTR_MUST_CHECK int ntr_effective_osm_measured(double na_mmol_l, double glucose_mmol_l,
                                       double urea_mmol_l, double ethanol_mmol_l,
                                       double measured_osm_mosm_kg,
                                       double *mosm_kg);

/**
 * @brief Is a low sodium hypotonic, pseudo- or translocational, judged on
 *        the effective osmolality (urea and ethanol taken out)?
 *
 * Classifies the effective osmolality E of ntr_effective_osm_measured()
 * (measured - urea - 1.25*ethanol, floored at min(2*Na + glucose,
 * measured); see there why). @p tonicity is ntr_tonicity_class() of E.
 * When Na < 135 mmol/L the flags of ntr_low_na_tonicity() are set with
 * their meanings, judged on E:
 * - @ref NTR_LOW_NA_GLUCOSE_EXPLAINS when glucose-corrected sodium >= 135.
 * - @ref NTR_LOW_NA_NOT_HYPOTONIC when E >= 275.
 * - @ref NTR_LOW_NA_TRANSLOCATIONAL when E > 295, or E >= 275 and glucose
 *   explains the sodium.
 * - @ref NTR_LOW_NA_PSEUDO when 275 <= E <= 295 and glucose does not explain
 *   the sodium. Never set when urea and ethanol account for a normal
 *   measured osmolality: then E < 275.
 * - @ref NTR_LOW_NA_DISCORDANT when E < 275, yet glucose would explain the
 *   sodium.
 *
 * and, whatever the sodium (it explains the class, not the sodium):
 * - @ref NTR_LOW_NA_INEFFECTIVE_OSMOLES when measured >= 275 but E < 275, a
 *   true hypotonic state that the measured value alone would hide.
 *
 * Examples (hand-worked): sodium 125, glucose 5, urea 40 mmol/L, measured
 * 295 mOsm/kg: E = 255, hypotonic, INEFFECTIVE_OSMOLES. Sodium 118,
 * glucose 5, ethanol 45 mmol/L, measured 295: 295 - 56.25 = 238.75 is
 * floored at 2*118 + 5 = 241; hypotonic, INEFFECTIVE_OSMOLES.
 *
 * Check order: NULL pointers, @p glucose_method, then the numbers in
 * argument order (non-finite, then out of range). With @p urea_mmol_l and
 * @p ethanol_mmol_l 0 the results equal ntr_low_na_tonicity() bit for bit.
 *
 * @param na_mmol_l            serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l       serum glucose, 0 to 200 mmol/L.
 * @param urea_mmol_l          serum urea, 0 to 200 mmol/L.
 * @param ethanol_mmol_l       serum ethanol, 0 to 400 mmol/L (0 when not
 *                             measured or with a vapour-pressure osmometer).
 * @param measured_osm_mosm_kg measured serum osmolality, 150 to 600 mOsm/kg.
 * @param glucose_method       @ref NTR_GLUCOSE_KATZ or @ref NTR_GLUCOSE_HILLIER.
 * @param[out] tonicity        one of NTR_TONICITY_*, of the effective value.
 * @param[out] flags           a combination of NTR_LOW_NA_* bits.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown glucose method.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: Oster JR, Singer I. Arch Intern Med 1999;159:333-6;
 * Milionis HJ et al. CMAJ 2002;166:1056-62; Spasovski G et al. Eur J
 * Endocrinol 2014;170(3):G1-G47; Katz 1973; Hillier et al. 1999;
 * Purssell RA et al. Ann Emerg Med 2001.
 * Methods: @ref NTR_METHOD_LOW_NA_EFFECTIVE_TONICITY,
 * @ref NTR_METHOD_EFFECTIVE_OSM_MEASURED, @ref NTR_METHOD_TONICITY_CLASS,
 * @ref NTR_METHOD_GLUCOSE_KATZ or @ref NTR_METHOD_GLUCOSE_HILLIER.
 */
NTR_API NTR_MUST_CHECK int ntr_low_na_effective_tonicity(double na_mmol_l, double glucose_mmol_l,
                                          double urea_mmol_l, double ethanol_mmol_l,
                                          double measured_osm_mosm_kg,
                                          int glucose_method, int *tonicity,
                                          unsigned int *flags);

/** Urine osmolality at or below this (mOsm/kg) is maximally dilute. */
#define NTR_URINE_OSM_DILUTE_MAX 100.0
/** Urine sodium above this (mmol/L) on normal intake points to the kidney. */
#define NTR_URINE_NA_HIGH_ABOVE 30.0

/**
 * @brief Is the urine maximally dilute?
 *
 * dilute = 1 when urine osmolality <= 100 mOsm/kg, else 0. Maximally
 * dilute urine in a hypotonic low sodium means vasopressin is suppressed
 * (high water or low solute intake), which points away from SIAD.
 *
 * @param urine_osm_mosm_kg urine osmolality, 10 to 2000 mOsm/kg.
 * @param[out] dilute       1 or 0.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: common practice; the same cut-off is the European guideline's
 * (Spasovski G et al. 2014) first urine step.
 * Method: @ref NTR_METHOD_URINE_DILUTE.
 */
NTR_API NTR_MUST_CHECK int ntr_urine_maximally_dilute(double urine_osm_mosm_kg, int *dilute);

/**
 * @brief Is the urine sodium high?
 *
 * high = 1 when urine sodium > 30 mmol/L, else 0. The reading holds on
 * normal salt and water intake and without diuretics: then a high urine
 * sodium in hypotonic hyponatraemia points to the kidney (SIAD, renal or
 * cerebral salt loss, adrenal insufficiency), and 30 or less to a low
 * effective circulating volume.
 *
 * @param urine_na_mmol_l urine sodium, 0 to 500 mmol/L.
 * @param[out] high       1 or 0.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Spasovski G et al. Eur J Endocrinol 2014;170(3):G1-G47.
 * Method: @ref NTR_METHOD_URINE_NA_HIGH.
 */
NTR_API NTR_MUST_CHECK int ntr_urine_na_high(double urine_na_mmol_l, int *high);

/**
 * @brief Fractional excretion of a solute (sodium, urea, uric acid, ...).
 *
 * FE% = 100 * (U_x * P_cr) / (P_x * U_cr)
 *
 * The result has no unit, so any unit works as long as each pair shares
 * one: @p urine_x and @p plasma_x in the same unit (for example both
 * mmol/L), @p urine_creatinine and @p plasma_creatinine in the same unit
 * (for example both umol/L). The library cannot see units: mixing umol/L
 * and mmol/L within a pair makes the result 1000 times wrong.
 *
 * @param urine_x           urine concentration of the solute, 0 to 1e6.
 * @param plasma_x          plasma concentration of the solute, 0 to 1e6.
 * @param urine_creatinine  urine creatinine, 0 to 1e6.
 * @param plasma_creatinine plasma creatinine, 0 to 1e6.
 * @param[out] percent      fractional excretion, %.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    @p plasma_x, @p urine_creatinine or
 *                           @p plasma_creatinine is 0: nothing filtered or no
 *                           clearance marker, so the fraction has no meaning;
 *                           or denominators so close to 0 that the quotient is
 *                           not a finite double.
 *
 * Reference: standard renal physiology (clearance of x over clearance of
 * creatinine); the SIAD cut-offs for sodium, urea and uric acid are in
 * Spasovski G et al. 2014.
 * Method: @ref NTR_METHOD_FRACTIONAL_EXCRETION.
 */
NTR_API NTR_MUST_CHECK int ntr_fractional_excretion(double urine_x, double plasma_x,
                                     double urine_creatinine,
                                     double plasma_creatinine,
                                     double *percent);

/** Tri-state answer to a yes/no finding. 0 means "not known", so a zeroed
 *  struct says "nothing is known". */
#define NTR_FINDING_UNKNOWN 0 /**< not known */
#define NTR_FINDING_NO 1      /**< known: no */
#define NTR_FINDING_YES 2     /**< known: yes */

#define NTR_VOLUME_UNKNOWN 0        /**< volume status not known */
#define NTR_VOLUME_HYPOVOLAEMIC 1   /**< clinically low extracellular volume */
#define NTR_VOLUME_EUVOLAEMIC 2     /**< clinically normal extracellular volume */
#define NTR_VOLUME_HYPERVOLAEMIC 3  /**< clinically high extracellular volume (oedema, ascites) */

/**
 * @brief A measured value that may be missing.
 *
 * @c known = 0 means "not known" and @c value is then ignored (whatever it
 * holds, even NaN); @c known = 1 means @c value is the measurement and is
 * range-checked. An explicit flag, rather than NaN as a marker, keeps the
 * library's rule that a NaN input is an error (NTR_ERR_NONFINITE).
 */
typedef struct ntr_finding_value {
    int known;    /**< 0 not known, 1 known; anything else gives NTR_ERR_ARG. */
    int reserved; /**< Set to 0; ignored. */
    double value; /**< The value, in the unit named by the member that holds it. */
} ntr_finding_value;

/** Criterion numbers of the SIAD table; also the bit numbers of the masks
 *  in ntr_siad_result (bit = 1ul << number). Bits 0-15 are essential
 *  criteria, bits 16-31 supplemental. */
#define NTR_SIAD_OSM_LOW 0               /**< effective serum osmolality < 275 mOsm/kg */
#define NTR_SIAD_URINE_CONCENTRATED 1    /**< urine osmolality > 100 mOsm/kg */
#define NTR_SIAD_EUVOLAEMIA 2            /**< clinical euvolaemia */
#define NTR_SIAD_URINE_NA_HIGH 3         /**< urine sodium > 30 mmol/L on normal salt and water intake */
#define NTR_SIAD_THYROID_NORMAL 4        /**< no thyroid insufficiency */
#define NTR_SIAD_ADRENAL_NORMAL 5        /**< no adrenal insufficiency */
#define NTR_SIAD_PITUITARY_NORMAL 6      /**< no pituitary insufficiency */
#define NTR_SIAD_KIDNEY_NORMAL 7         /**< no renal insufficiency */
#define NTR_SIAD_NO_DIURETIC 8           /**< no recent diuretic use */
#define NTR_SIAD_INTAKE_NORMAL 9         /**< finding only (no criterion): normal salt and water intake */
#define NTR_SIAD_URIC_ACID_LOW 16        /**< serum uric acid < 0.24 mmol/L */
#define NTR_SIAD_UREA_LOW 17             /**< serum urea < 3.6 mmol/L */
#define NTR_SIAD_SALINE_FAILS 18         /**< 0.9% saline fails to correct the sodium */
#define NTR_SIAD_FE_NA_HIGH 19           /**< fractional sodium excretion > 0.5% */
#define NTR_SIAD_FE_UREA_HIGH 20         /**< fractional urea excretion > 55% */
#define NTR_SIAD_FE_URIC_ACID_HIGH 21    /**< fractional uric acid excretion > 12% */
#define NTR_SIAD_RESTRICTION_CORRECTS 22 /**< fluid restriction corrects the sodium */

/** Bits of the essential criteria (all must be met). */
#define NTR_SIAD_ESSENTIAL_BITS 0x0000FFFFul
/** Bits of the supplemental criteria (support, never decide). */
#define NTR_SIAD_SUPPLEMENTAL_BITS 0xFFFF0000ul

/**
 * @brief Findings for the SIAD criteria; each is a value or "not known".
 *
 * Set @c struct_size to sizeof(ntr_siad_findings); ntr_siad_findings_init()
 * does that and marks everything not known.
 *
 * Growth (ABI): members are only ever appended at the end, never moved,
 * removed or retyped. A program built against an older header passes its
 * smaller @c struct_size, and the library treats every finding beyond it
 * as not known. A @c struct_size below this version's size gives
 * NTR_ERR_ARG.
 */
typedef struct ntr_siad_findings {
    size_t struct_size; /**< sizeof(ntr_siad_findings) as the caller knows it. */
    /* Essential findings. */
    ntr_finding_value effective_osm_mosm_kg; /**< effective (not measured) osmolality, 150 to 600 mOsm/kg: ntr_effective_osm_measured() (measured less urea and ethanol), or ntr_osm_effective() (2*Na + glucose) when none was measured. */
    ntr_finding_value urine_osm_mosm_kg;     /**< urine osmolality, 10 to 2000 mOsm/kg. */
    ntr_finding_value urine_na_mmol_l;       /**< urine sodium, 0 to 500 mmol/L. */
    int volume_status;            /**< NTR_VOLUME_*. */
    int normal_salt_water_intake; /**< NTR_FINDING_*: salt and water intake are normal. */
    int thyroid_normal;           /**< NTR_FINDING_*: thyroid function is normal. */
    int adrenal_normal;           /**< NTR_FINDING_*: adrenal function is normal. */
    int pituitary_normal;         /**< NTR_FINDING_*: pituitary function is normal. */
    int kidney_normal;            /**< NTR_FINDING_*: kidney function is normal. */
    int recent_diuretic;          /**< NTR_FINDING_*: a diuretic was used recently. */
    /* Supplemental yes/no findings. */
    int saline_corrected;         /**< NTR_FINDING_*: 0.9% saline corrected the sodium. */
    int restriction_corrected;    /**< NTR_FINDING_*: fluid restriction corrected the sodium. */
    int reserved;                 /**< Set to 0; ignored. */
    /* Supplemental values. */
    ntr_finding_value uric_acid_mmol_l;     /**< serum uric acid, 0 to 2 mmol/L. */
    ntr_finding_value urea_mmol_l;          /**< serum urea, 0 to 200 mmol/L. */
    ntr_finding_value fe_na_percent;        /**< fractional sodium excretion, 0 to 200 %. */
    ntr_finding_value fe_urea_percent;      /**< fractional urea excretion, 0 to 200 %. */
    ntr_finding_value fe_uric_acid_percent; /**< fractional uric acid excretion, 0 to 200 %. */
} ntr_siad_findings;

#define NTR_SIAD_CONSISTENT 1     /**< every essential criterion is met */
#define NTR_SIAD_NOT_CONSISTENT 2 /**< at least one essential criterion is not met */
#define NTR_SIAD_INCOMPLETE 3     /**< none is failed, but at least one is not settled */

/**
 * @brief Outcome of the SIAD criteria, per criterion and overall.
 *
 * Masks use the criterion numbers (NTR_SIAD_*) as bit numbers. For every
 * criterion in @c evaluated exactly one of @c met, @c not_met, @c not_known
 * and @c not_assessable has its bit set.
 *
 * Growth (ABI): the caller sets @c struct_size to sizeof(ntr_siad_result);
 * members are only appended, and the library writes only members that fit
 * in the caller's @c struct_size. New criteria take unused bit numbers and
 * appear in @c evaluated.
 */
typedef struct ntr_siad_result {
    size_t struct_size;          /**< sizeof(ntr_siad_result) as the caller knows it; read, not written. */
    int verdict;                 /**< NTR_SIAD_CONSISTENT, _NOT_CONSISTENT or _INCOMPLETE. */
    int supplemental_met_count;  /**< number of supplemental criteria met. */
    unsigned long evaluated;     /**< criteria this library version evaluates. */
    unsigned long met;           /**< criteria met. */
    unsigned long not_met;       /**< criteria not met. */
    unsigned long not_known;     /**< criteria whose finding is not known. */
    unsigned long not_assessable; /**< criteria that cannot be judged: urine sodium when intake is not normal. */
    unsigned long missing;       /**< findings (NTR_SIAD_* bit numbers) not known that an unsettled criterion needs. */
} ntr_siad_result;

/**
 * @brief Mark every finding "not known" and set @c struct_size.
 * @param[out] findings the struct to initialise.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * Reference: none (initialiser). Method: @ref NTR_METHOD_SIAD_CRITERIA.
 */
NTR_API NTR_MUST_CHECK int ntr_siad_findings_init(ntr_siad_findings *findings);

/**
 * @brief Test the findings against the criteria for SIAD.
 *
 * Essential criteria (every one must hold; thresholds are strict as in
 * the table): effective osmolality < 275 mOsm/kg (the hypotonic edge
 * @ref NTR_TONICITY_HYPOTONIC_BELOW, so the criterion is met exactly when
 * ntr_low_na_effective_tonicity() gives @ref NTR_TONICITY_HYPOTONIC for
 * the same value); urine osmolality > 100 mOsm/kg; extracellular volume
 * judged normal at the bedside; urine sodium > 30 mmol/L while salt and
 * water intake are usual; thyroid, adrenal, pituitary and kidney function
 * normal; no diuretic taken recently.
 * Supplemental criteria (add weight, never decide): serum uric acid
 * < 0.24 mmol/L; serum urea < 3.6 mmol/L; the sodium stays low after 0.9%
 * saline; fractional excretion of sodium > 0.5%, of urea > 55%, of uric
 * acid > 12%; fluid restriction brings the sodium up.
 *
 * Each criterion is met, not met, not known (its finding is not known) or
 * not assessable (urine sodium when intake is known not to be normal: a
 * low intake lowers it and a high one raises it). Verdict:
 * any essential criterion not met gives NTR_SIAD_NOT_CONSISTENT; else all
 * met gives NTR_SIAD_CONSISTENT; else NTR_SIAD_INCOMPLETE, and @c missing
 * says which findings to obtain.
 *
 * The evaluator takes the effective osmolality as given and does not
 * derive it: the caller passes the value of ntr_effective_osm_measured()
 * (measured less urea and ethanol) or of ntr_osm_effective(), never the
 * measured osmolality itself, which urea or ethanol can hold at 275 or
 * more in a hypotonic patient (the 1.0 layout has no room for a measured
 * value and an ethanol result).
 *
 * Check order: NULL pointers; then @c struct_size of both structs, the
 * @c known flags and the enumerators (NTR_ERR_ARG); then the known values
 * in member order (NTR_ERR_NONFINITE, NTR_ERR_RANGE). On error nothing is
 * written.
 *
 * @param findings     the findings (see ntr_siad_findings for ranges).
 * @param[out] result  verdict and per-criterion masks.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       a @c struct_size too small, a @c known flag or
 *                           an enumerator not one of its values.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Spasovski G et al. Eur J Endocrinol 2014;170(3):G1-G47, table
 * of diagnostic criteria for SIAD, adapted there from Schwartz WB, Bennett
 * W, Curelop S, Bartter FC. A syndrome of renal sodium loss and
 * hyponatremia probably resulting from inappropriate secretion of
 * antidiuretic hormone. Am J Med 1957;23:529-42, and Bartter FC, Schwartz
 * WB. The syndrome of inappropriate secretion of antidiuretic hormone. Am J
 * Med 1967;42:790-806.
 * Method: @ref NTR_METHOD_SIAD_CRITERIA.
 */
NTR_API NTR_MUST_CHECK int ntr_siad_evaluate(const ntr_siad_findings *findings,
                              ntr_siad_result *result);

/** Classes written by ntr_fe_uric_acid_class(). */
#define NTR_FE_URIC_ACID_AGAINST_SIAD 1  /**< below 8 %: argues against SIAD */
#define NTR_FE_URIC_ACID_INDETERMINATE 2 /**< 8 to 12 %, both included: neither */
#define NTR_FE_URIC_ACID_SUPPORTS_SIAD 3 /**< above 12 %: supports SIAD */

/** A fractional uric acid excretion below this (%) argues against SIAD. */
#define NTR_FE_URIC_ACID_LOW_BELOW 8.0
/** A fractional uric acid excretion above this (%) supports SIAD; the
 *  supplemental criterion @ref NTR_SIAD_FE_URIC_ACID_HIGH uses the same
 *  edge. */
#define NTR_FE_URIC_ACID_HIGH_ABOVE 12.0

/**
 * @brief What a fractional uric acid excretion, measured while the sodium
 *        is low, says about SIAD.
 *
 * - FE < 8 %: @ref NTR_FE_URIC_ACID_AGAINST_SIAD
 * - 8 % <= FE <= 12 %: @ref NTR_FE_URIC_ACID_INDETERMINATE
 * - FE > 12 %: @ref NTR_FE_URIC_ACID_SUPPORTS_SIAD
 *
 * Both edges are strict as the source states them ("above 12 %", "below
 * 8 %"), so 8 and 12 themselves are indeterminate, and the class is
 * @ref NTR_FE_URIC_ACID_SUPPORTS_SIAD exactly when ntr_siad_evaluate()
 * meets @ref NTR_SIAD_FE_URIC_ACID_HIGH for the same value. The
 * evaluator's masks cannot say "argues against" (a value of 12 or less is
 * only "not met"); this function can. It supports a judgement, never
 * decides one: any drug or tubular disorder that changes urate handling
 * changes the value.
 *
 * Give a percentage: ntr_fractional_excretion() returns one. A fraction
 * passed by mistake (0.15 for 15 %) reads as 0.15 % and so as "against".
 *
 * @param fe_uric_acid_percent fractional uric acid excretion at the low
 *                             sodium, 0 to 200 %.
 * @param[out] fe_class        one of NTR_FE_URIC_ACID_*.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Fenske W et al. J Clin Endocrinol Metab 2008;93:2991-7 (both
 * cut-offs, in hyponatraemic patients);
 * Spasovski G et al. Eur J Endocrinol 2014;170(3):G1-G47 (12 % in the
 * table of SIAD criteria).
 * Method: @ref NTR_METHOD_FE_URIC_ACID_CLASS.
 */
NTR_API NTR_MUST_CHECK int ntr_fe_uric_acid_class(double fe_uric_acid_percent, int *fe_class);

/** Readings written by ntr_fe_uric_acid_after_correction(). Exactly one
 *  applies to each pair of measurements. */
#define NTR_URIC_ACID_COURSE_NOT_CORRECTED 1   /**< sodium at the second measurement below 135 mmol/L: not yet an after-correction reading */
#define NTR_URIC_ACID_COURSE_NOT_HIGH_BEFORE 2 /**< 12 % or less at the low sodium: no high excretion to follow */
#define NTR_URIC_ACID_COURSE_NORMALISED 3      /**< above 12 % at the low sodium, below 8 % once corrected: the course of SIAD */
#define NTR_URIC_ACID_COURSE_UNSETTLED 4       /**< above 12 % at the low sodium, 8 to 12 % once corrected: neither pattern */
#define NTR_URIC_ACID_COURSE_PERSISTENT_HIGH 5 /**< above 12 % at the low sodium and still above 12 % once corrected: points to renal or cerebral salt wasting rather than SIAD */

/**
 * @brief Read a fractional uric acid excretion measured again after the
 *        sodium was corrected: normalised (as in SIAD) or still high (as
 *        in renal or cerebral salt wasting)?
 *
 * A low sodium raises uric acid excretion in SIAD and in salt wasting
 * alike. Once the sodium is corrected the excretion falls back in SIAD but
 * stays high in salt wasting, where the tubular loss of urate does not
 * depend on the sodium (Maesaka and colleagues; from memory, see
 * docs/workup.md). With 135 mmol/L (the end of hyponatraemia,
 * ntr_na_severity()) as "corrected" and the edges of
 * ntr_fe_uric_acid_class():
 *
 * - @p na_corrected_mmol_l < 135: @ref NTR_URIC_ACID_COURSE_NOT_CORRECTED
 *   (whatever the two values say);
 * - otherwise, @p fe_low_na_percent <= 12:
 *   @ref NTR_URIC_ACID_COURSE_NOT_HIGH_BEFORE;
 * - otherwise, @p fe_corrected_percent > 12:
 *   @ref NTR_URIC_ACID_COURSE_PERSISTENT_HIGH;
 * - otherwise, @p fe_corrected_percent < 8:
 *   @ref NTR_URIC_ACID_COURSE_NORMALISED;
 * - otherwise (8 to 12 %): @ref NTR_URIC_ACID_COURSE_UNSETTLED.
 *
 * Using the hyponatraemic edges for the corrected value is this library's
 * rule, not the source's: 12 % is kept as "still high", and only a value
 * below 8 % counts as normalised, so a value between the two settles
 * nothing. The reading points, never diagnoses: salt wasting also needs
 * clinical volume depletion and a cause, and the drugs and tubular
 * disorders that change urate handling change the values.
 *
 * Give percentages (ntr_fractional_excretion()).
 *
 * @param fe_low_na_percent    fractional uric acid excretion while the
 *                             sodium was low, 0 to 200 %.
 * @param fe_corrected_percent fractional uric acid excretion after the
 *                             correction, 0 to 200 %.
 * @param na_corrected_mmol_l  serum sodium when the second value was
 *                             measured, 80 to 220 mmol/L.
 * @param[out] course          one of NTR_URIC_ACID_COURSE_*.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: Fenske W et al. J Clin Endocrinol Metab 2008;93:2991-7 (the
 * 8 % and 12 % edges at a low sodium); Maesaka JK et al., on telling SIAD
 * from cerebral or renal salt wasting by the fractional urate excretion
 * after correction (from memory: see docs/workup.md).
 * Method: @ref NTR_METHOD_FE_URIC_ACID_AFTER_CORRECTION.
 */
NTR_API NTR_MUST_CHECK int ntr_fe_uric_acid_after_correction(double fe_low_na_percent,
                                              double fe_corrected_percent,
                                              double na_corrected_mmol_l,
                                              int *course);
/** @} */

/* ======================================================================= */
/* ==== section: input ranges (lib/ranges.c, docs/ranges.md) ============= */
/* ======================================================================= */

/** @defgroup ranges Input ranges
 *  The accepted range of each kind of numeric input, so that a form can
 *  check a value before the call and a binding can name the input that
 *  failed and the range it has to be in. The values are the ones the
 *  computing functions test (NTR_ERR_RANGE outside them); docs/ranges.md
 *  says where each comes from. A value inside its range can still be
 *  refused with NTR_ERR_DOMAIN when it does not fit the other inputs.
 *  Kinds are numbered from 1 without gaps; later versions only add kinds
 *  at the end, so a caller may walk them until NTR_ERR_ARG.
 *  @{ */
#define NTR_INPUT_NA 1               /**< serum sodium (also a target sodium), mmol/L */
#define NTR_INPUT_GLUCOSE 2          /**< serum glucose, mmol/L */
#define NTR_INPUT_UREA 3             /**< serum urea, mmol/L */
#define NTR_INPUT_ETHANOL 4          /**< serum ethanol, mmol/L */
#define NTR_INPUT_OSMOLALITY 5       /**< serum osmolality, measured or calculated, mOsm/kg */
#define NTR_INPUT_AGE_FRACTION 6     /**< age in ntr_tbw_fraction(), years */
#define NTR_INPUT_AGE_WATSON 7       /**< age in ntr_tbw_watson() (adults), years */
#define NTR_INPUT_HEIGHT 8           /**< height, cm */
#define NTR_INPUT_WEIGHT 9           /**< body weight, kg */
#define NTR_INPUT_TBW 10             /**< total body water, L */
#define NTR_INPUT_INFUSATE_NA 11     /**< sodium of an infusate or flow, mmol/L */
#define NTR_INPUT_INFUSATE_K 12      /**< potassium of an infusate or flow, mmol/L */
#define NTR_INPUT_VOLUME 13          /**< volume of one infusion, L */
#define NTR_INPUT_DELTA 14           /**< a wanted signed change of sodium, mmol/L */
#define NTR_INPUT_URINE_NA 15        /**< urine sodium, mmol/L */
#define NTR_INPUT_URINE_K 16         /**< urine potassium, mmol/L */
#define NTR_INPUT_URINE_VOLUME 17    /**< urine volume (in ntr_efwc(), a day's urine), L */
#define NTR_INPUT_URINE_OSM 18       /**< urine osmolality, mOsm/kg */
#define NTR_INPUT_RATIO 19           /**< Furst ratio given to ntr_restriction_from_ratio() */
#define NTR_INPUT_GLUCOSE_FACTOR 20  /**< factor of ntr_na_corrected_glucose_factor(), mmol/L per 100 mg/dL */
#define NTR_INPUT_CONVERT_VALUE 21   /**< the value given to ntr_convert(), in its own unit */
#define NTR_INPUT_HOURS 22           /**< time of a sodium sample, h (any origin) */
#define NTR_INPUT_LIMIT 23           /**< a field of ntr_limits or ntr_course_limits, mmol/L */
#define NTR_INPUT_FLOW_RATE 24       /**< signed rate of a timed flow, mL/h */
#define NTR_INPUT_URINE_RATE 25      /**< a urine (or saline) rate given alone, mL/h */
#define NTR_INPUT_PLAN_HOURS 26      /**< flow and interval times, h; also a plan's length, which must be above 0 */
#define NTR_INPUT_PLAN_STEP 27       /**< plan step, re-lowering or lowering period, h */
#define NTR_INPUT_FLOW_VOLUME 28     /**< signed volume of a gain or loss in ntr_balance_predict(), L */
#define NTR_INPUT_URINE_ML 29        /**< volume of one measured urine interval, mL */
#define NTR_INPUT_URIC_ACID 30       /**< serum uric acid, mmol/L */
#define NTR_INPUT_FE_PERCENT 31      /**< a fractional excretion given as input, % */
#define NTR_INPUT_FE_VALUE 32        /**< a concentration given to ntr_fractional_excretion() */
#define NTR_INPUT_SOLUTE_MOSM_DAY 33 /**< osmoles excreted per day, mOsm/day */
#define NTR_INPUT_INSENSIBLE_L_DAY 34 /**< net insensible loss, L/day */
#define NTR_INPUT_SOLUTE_GRAMS 35    /**< a daily dose of urea or NaCl, g */
#define NTR_INPUT_INTAKE_L_DAY 36    /**< a target fluid intake, L/day, above the lower end (0 itself is refused) */
#define NTR_INPUT_RELOWER_MARGIN 37  /**< margin below a limit when re-lowering, mmol/L */
#define NTR_INPUT_INSENSIBLE_ML_H 38 /**< insensible water loss in ntr_hyper_lower_plan(), mL/h */
#define NTR_INPUT_CHANGE 39          /**< the size of a change (a fall, a rise aimed at, a lowering), mmol/L, above the lower end (0 itself is refused) */

/**
 * @brief The accepted range of one kind of numeric input.
 *
 * Writes the smallest and the largest value a computing function accepts
 * for an input of kind @p kind. Both ends are accepted, except the lower
 * end 0 of @ref NTR_INPUT_INTAKE_L_DAY and of @ref NTR_INPUT_CHANGE (no
 * intake, or no change, is refused; any value above 0 is taken). A finite
 * value outside the range gives NTR_ERR_RANGE, a NaN or infinity
 * NTR_ERR_NONFINITE.
 * No arithmetic: the values are the library's own range constants, the
 * ones every function checks against (docs/ranges.md gives the source of
 * each).
 *
 * @param kind      one of NTR_INPUT_* (1 to 39 in this version).
 * @param[out] min  smallest accepted value, in the unit named by the kind.
 * @param[out] max  largest accepted value, in the same unit.
 * @retval NTR_OK        both ends written.
 * @retval NTR_ERR_NULL  @p min or @p max is NULL.
 * @retval NTR_ERR_ARG   @p kind is not an NTR_INPUT_* value.
 *
 * On error nothing is written. Reference: docs/ranges.md (the library's
 * plausibility nets; not clinical limits). Method: none.
 */
NTR_API NTR_MUST_CHECK int ntr_input_range(int kind, double *min, double *max);
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
NTR_API NTR_MUST_CHECK int ntr_method_info(int method, struct ntr_method_info *out);

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
NTR_API NTR_MUST_CHECK int ntr_method_next(int after, int *next);
/** @} */

/* ======================================================================= */
/* ==== section: batch (lib/batch.c, docs/batch.md) ====================== */
/* ======================================================================= */

/** @defgroup batch Batch (array) entry points
 *  The formulas above applied to whole columns at once, for cohort work
 *  and for bindings (Python, SQL) that hand over arrays.
 *
 *  Conventions shared by every ntr_batch_* function:
 *  - @p n rows; input @c i of every row is element @c i of its array.
 *    Arrays are caller-owned; the library allocates nothing.
 *  - Row @c i gives exactly the result and status the scalar function
 *    would give for the same inputs (same expression, bit for bit).
 *  - Call-level errors come first and write nothing at all:
 *    @ref NTR_ERR_NULL when a required array is NULL (checked even when
 *    @p n is 0), then @ref NTR_ERR_ARG for an unknown enumerator passed as
 *    a single argument (such as @p formula).
 *  - Otherwise every row is written: @c status[i] receives the row's status
 *    and @c out[i] its result, or a quiet NaN when the row failed (so a
 *    stale value can never be mistaken for a result). Integer outputs of a
 *    failed row are set to 0, which no enumerator uses.
 *  - Return value: @ref NTR_OK when every row succeeded (and when @p n is
 *    0); otherwise the status of the first failing row (lowest index).
 *    The optional @p failed (may be NULL) receives the number of failing
 *    rows whenever the call got past its call-level checks.
 *  - @c out may be the very same array as one of the double inputs (in
 *    place); other overlaps are not allowed.
 *  - Enumerators stored per row (such as @c sex) that are unknown give that
 *    row @ref NTR_ERR_ARG.
 *  @{ */

/**
 * @brief Calculated serum osmolality for @p n rows (see ntr_osm_calculated()).
 *
 * - formula @ref NTR_OSM_2NA gives out[i] = 2*na + glucose + urea + ethanol
 * - formula @ref NTR_OSM_DORWART_CHALMERS gives
 *   out[i] = 1.86*na + glucose + urea + 9 + ethanol
 *
 * (each term row i of its array), mOsm/kg.
 *
 * @param n number of rows.
 * @param na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param glucose_mmol_l serum glucose, mmol/L, 0 to 200.
 * @param urea_mmol_l serum urea, mmol/L, 0 to 200.
 * @param ethanol_mmol_l serum ethanol, mmol/L, 0 to 400 (0 where not
 *                       measured).
 * @param formula @ref NTR_OSM_2NA or @ref NTR_OSM_DORWART_CHALMERS (all rows).
 * @param[out] out     n results, mOsm/kg (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG (unknown formula), or the
 *         status of the first failed row.
 *
 * Reference: Dorwart WV, Chalmers L. Clin Chem 1975;21:190-4.
 * Methods: @ref NTR_METHOD_OSM_2NA, @ref NTR_METHOD_OSM_DORWART_CHALMERS.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_osm_calculated(size_t n, const double *na_mmol_l,
                                     const double *glucose_mmol_l,
                                     const double *urea_mmol_l,
                                     const double *ethanol_mmol_l, int formula,
                                     double *out, int *status, size_t *failed);

/**
 * @brief Effective osmolality 2*na_mmol_l[i] + glucose_mmol_l[i] for @p n rows
 *        (see ntr_osm_effective()).
 *
 * @param n number of rows.
 * @param na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param glucose_mmol_l serum glucose, mmol/L, 0 to 200.
 * @param[out] out     n results, mOsm/kg (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: Spasovski G et al. Eur J Endocrinol 2014;170:G1-47.
 * Method: @ref NTR_METHOD_OSM_EFFECTIVE.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_osm_effective(size_t n, const double *na_mmol_l,
                                    const double *glucose_mmol_l, double *out,
                                    int *status, size_t *failed);

/**
 * @brief Osmolal gap measured_mosm_kg[i] - calculated_mosm_kg[i] for @p n rows
 *        (see ntr_osm_gap()).
 *
 * @param n number of rows.
 * @param measured_mosm_kg measured osmolality, mOsm/kg, 150 to 600.
 * @param calculated_mosm_kg calculated osmolality, mOsm/kg, 150 to 600.
 * @param[out] out     n gaps, mOsm/kg (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: textbook definition of the osmolal gap.
 * Method: @ref NTR_METHOD_OSM_GAP.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_osm_gap(size_t n, const double *measured_mosm_kg,
                              const double *calculated_mosm_kg, double *out,
                              int *status, size_t *failed);

/**
 * @brief Glucose-corrected sodium for @p n rows
 *        (see ntr_na_corrected_glucose()).
 *
 * G = glucose_mmol_l[i] * 18.0156 (mg/dL);
 * out[i] = na_mmol_l[i] + f*(G - 100)/100 when G > 100, else na_mmol_l[i];
 * f = 1.6 (Katz) or 2.4 (Hillier).
 *
 * @param n number of rows.
 * @param na_mmol_l measured serum sodium, mmol/L, 80 to 220.
 * @param glucose_mmol_l serum glucose, mmol/L, 0 to 200.
 * @param method @ref NTR_GLUCOSE_KATZ or @ref NTR_GLUCOSE_HILLIER (all rows).
 * @param[out] out     n corrected sodium values, mmol/L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, NTR_ERR_ARG (unknown method), or the status
 *         of the first failed row.
 *
 * References: Katz MA. N Engl J Med 1973;289:843-4. Hillier TA et al.
 * Am J Med 1999;106:399-403.
 * Methods: @ref NTR_METHOD_GLUCOSE_KATZ, @ref NTR_METHOD_GLUCOSE_HILLIER.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_na_corrected_glucose(size_t n, const double *na_mmol_l,
                                           const double *glucose_mmol_l,
                                           int method, double *out, int *status,
                                           size_t *failed);

/**
 * @brief Total body water as a fraction of weight for @p n rows
 *        (see ntr_tbw_fraction()).
 *
 * out[i] = f(sex[i], age_years[i]) * weight_kg[i], f = 0.6 (1 to below 18
 * years), 0.6 / 0.5 (men / women 18 to 64), 0.5 / 0.45 (men / women 65 and
 * over). Infants under 1 year are refused, as by ntr_tbw_fraction().
 *
 * @param n number of rows.
 * @param sex @ref NTR_SEX_MALE or @ref NTR_SEX_FEMALE per row.
 * @param age_years age, years, 1 to 130.
 * @param weight_kg body weight, kg, 0.3 to 650.
 * @param[out] out     n volumes, L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_ARG (unknown sex),
 *                     NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: Adrogue HJ, Madias NE. N Engl J Med 2000;342:1581-9.
 * Method: @ref NTR_METHOD_TBW_FRACTION.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_tbw_fraction(size_t n, const int *sex,
                                   const double *age_years,
                                   const double *weight_kg, double *out,
                                   int *status, size_t *failed);

/**
 * @brief Watson total body water for @p n rows (see ntr_tbw_watson()).
 *
 * men: 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight;
 * women: -2.097 + 0.1069*height + 0.2466*weight (litres).
 *
 * @param n number of rows.
 * @param sex @ref NTR_SEX_MALE or @ref NTR_SEX_FEMALE per row.
 * @param age_years age, years, 18 to 130.
 * @param height_cm height, cm, 30 to 275.
 * @param weight_kg body weight, kg, 0.3 to 650.
 * @param[out] out     n volumes, L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_ARG (unknown sex),
 *                     NTR_ERR_NONFINITE, NTR_ERR_RANGE, NTR_ERR_DOMAIN
 *                     (the result is below 20% or above 80% of the
 *                     weight, or below 0.1 L, as ntr_tbw_watson()).
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: Watson PE, Watson ID, Batt RD. Am J Clin Nutr 1980;33:27-39.
 * Method: @ref NTR_METHOD_TBW_WATSON.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_tbw_watson(size_t n, const int *sex,
                                 const double *age_years,
                                 const double *height_cm,
                                 const double *weight_kg, double *out,
                                 int *status, size_t *failed);

/**
 * @brief Free-water deficit tbw_l[i]*(na_mmol_l[i]/140 - 1) for @p n rows
 *        (see ntr_free_water_deficit()).
 *
 * @param n number of rows.
 * @param tbw_l total body water, L, 0.1 to 400.
 * @param na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param[out] out     n deficits, L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE,
 *                     NTR_ERR_RANGE, NTR_ERR_DOMAIN (sodium below 140).
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: the textbook water-deficit formula (common practice).
 * Method: @ref NTR_METHOD_FREE_WATER_DEFICIT.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_free_water_deficit(size_t n, const double *tbw_l,
                                         const double *na_mmol_l, double *out,
                                         int *status, size_t *failed);

/**
 * @brief Sodium deficit tbw_l[i]*(target_na_mmol_l[i] - na_mmol_l[i])
 *        for @p n rows (see ntr_na_deficit()).
 *
 * @param n number of rows.
 * @param tbw_l total body water, L, 0.1 to 400.
 * @param na_mmol_l current serum sodium, mmol/L, 80 to 220.
 * @param target_na_mmol_l target serum sodium, mmol/L, 80 to 220.
 * @param[out] out     n deficits, mmol (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE,
 *                     NTR_ERR_RANGE, NTR_ERR_DOMAIN (target below sodium).
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: common practice (the sodium-deficit formula).
 * Method: @ref NTR_METHOD_NA_DEFICIT.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_na_deficit(size_t n, const double *tbw_l,
                                 const double *na_mmol_l,
                                 const double *target_na_mmol_l, double *out,
                                 int *status, size_t *failed);

/**
 * @brief Change in sodium from 1 L of infusate for @p n rows
 *        (see ntr_infusate_change_per_litre()).
 *
 * out[i] = (infusate_na_mmol_l[i] + infusate_k_mmol_l[i] - na_mmol_l[i]) /
 *        (tbw_l[i] + 1), mmol/L.
 *
 * @param n number of rows.
 * @param na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param tbw_l total body water, L, 0.1 to 400.
 * @param infusate_na_mmol_l infusate sodium, mmol/L, 0 to 1100.
 * @param infusate_k_mmol_l infusate potassium, mmol/L, 0 to 400.
 * @param[out] out     n changes, mmol/L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE,
 *                     NTR_ERR_DOMAIN (as ntr_infusate_change_per_litre()).
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: Adrogue HJ, Madias NE. N Engl J Med 2000;342:1581-9.
 * Method: @ref NTR_METHOD_ADROGUE_MADIAS.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_infusate_change_per_litre(size_t n,
                                                const double *na_mmol_l,
                                                const double *tbw_l,
                                                const double *infusate_na_mmol_l,
                                                const double *infusate_k_mmol_l,
                                                double *out, int *status,
                                                size_t *failed);

/**
 * @brief Change in sodium from any volume of infusate for @p n rows
 *        (see ntr_infusate_change()).
 *
 * out[i] = volume_l[i]*(infusate_na_mmol_l[i] + infusate_k_mmol_l[i] -
 *        na_mmol_l[i]) / (tbw_l[i] + volume_l[i]).
 *
 * @param n number of rows.
 * @param na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param tbw_l total body water, L, 0.1 to 400.
 * @param infusate_na_mmol_l infusate sodium, mmol/L, 0 to 1100.
 * @param infusate_k_mmol_l infusate potassium, mmol/L, 0 to 400.
 * @param volume_l volume given, L, 0 to 20.
 * @param[out] out     n changes, mmol/L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE,
 *                     NTR_ERR_DOMAIN (as ntr_infusate_change()).
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: the Adrogue-Madias mass balance (N Engl J Med 2000;342:1581-9).
 * Method: @ref NTR_METHOD_INFUSATE_MASS_BALANCE.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_infusate_change(size_t n, const double *na_mmol_l,
                                      const double *tbw_l,
                                      const double *infusate_na_mmol_l,
                                      const double *infusate_k_mmol_l,
                                      const double *volume_l, double *out,
                                      int *status, size_t *failed);

/**
 * @brief Volume of infusate for a wanted change, for @p n rows
 *        (see ntr_infusate_volume_for_change()).
 *
 * out[i] = target_delta_mmol_l[i]*tbw_l[i] / (infusate_na_mmol_l[i] +
 *        infusate_k_mmol_l[i] - na_mmol_l[i] - target_delta_mmol_l[i]),
 * 0 when target_delta_mmol_l[i] is 0.
 *
 * @param n number of rows.
 * @param na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param tbw_l total body water, L, 0.1 to 400.
 * @param infusate_na_mmol_l infusate sodium, mmol/L, 0 to 1100.
 * @param infusate_k_mmol_l infusate potassium, mmol/L, 0 to 400.
 * @param target_delta_mmol_l wanted change, mmol/L, -50 to 50.
 * @param[out] out     n volumes, L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE,
 *                     NTR_ERR_RANGE, NTR_ERR_DOMAIN (as
 *                     ntr_infusate_volume_for_change(): target sodium
 *                     outside 80 to 220, unreachable target, more than
 *                     20 L, or a volume ntr_infusate_change() refuses).
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: derived from Adrogue & Madias 2000; Furst H et al., Am J Med
 * Sci 2000;319:240-4.
 * Method: @ref NTR_METHOD_INFUSATE_VOLUME.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_infusate_volume_for_change(size_t n,
                                                 const double *na_mmol_l,
                                                 const double *tbw_l,
                                                 const double *infusate_na_mmol_l,
                                                 const double *infusate_k_mmol_l,
                                                 const double *target_delta_mmol_l,
                                                 double *out, int *status,
                                                 size_t *failed);

/**
 * @brief Furst ratio (urine_na_mmol_l[i] + urine_k_mmol_l[i]) /
 *        serum_na_mmol_l[i] for @p n rows (see ntr_furst_ratio()).
 *
 * @param n number of rows.
 * @param urine_na_mmol_l urine sodium, mmol/L, 0 to 500.
 * @param urine_k_mmol_l urine potassium, mmol/L, 0 to 300.
 * @param serum_na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param[out] out     n ratios (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: Furst H et al. Am J Med Sci 2000;319:240-4.
 * Method: @ref NTR_METHOD_FURST.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_furst_ratio(size_t n, const double *urine_na_mmol_l,
                                  const double *urine_k_mmol_l,
                                  const double *serum_na_mmol_l, double *out,
                                  int *status, size_t *failed);

/**
 * @brief Fluid restriction advice for @p n Furst ratios
 *        (see ntr_restriction_from_ratio()).
 *
 * ratio < 0.9: @ref NTR_RESTRICT_1000ML; 0.9 to 1.0 inclusive:
 * @ref NTR_RESTRICT_500_700ML; above 1.0: @ref NTR_RESTRICT_500ML.
 *
 * @param n number of rows.
 * @param ratio Furst ratio, 0 to 20.
 * @param[out] advice  n NTR_RESTRICT_* values (0 in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * References: Furst et al. 2000; Verbalis JG et al. Am J Med
 * 2013;126(10 Suppl 1):S1-42.
 * Method: @ref NTR_METHOD_FURST.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_restriction_from_ratio(size_t n, const double *ratio,
                                             int *advice, int *status,
                                             size_t *failed);

/**
 * @brief Electrolyte-free water clearance for @p n rows (see ntr_efwc()).
 *
 * out[i] = urine_volume_l[i] * (1 - (urine_na_mmol_l[i] + urine_k_mmol_l[i]) /
 *        serum_na_mmol_l[i]), litres.
 *
 * @param n number of rows.
 * @param urine_volume_l urine volume, L, 0 to 30.
 * @param urine_na_mmol_l urine sodium, mmol/L, 0 to 500.
 * @param urine_k_mmol_l urine potassium, mmol/L, 0 to 300.
 * @param serum_na_mmol_l serum sodium, mmol/L, 80 to 220.
 * @param[out] out     n clearances, L (NaN in failed rows).
 * @param[out] status  n row statuses: NTR_OK, NTR_ERR_NONFINITE, NTR_ERR_RANGE.
 * @param[out] failed  optional: number of failed rows.
 * @return NTR_OK, NTR_ERR_NULL, or the status of the first failed row.
 *
 * Reference: standard renal physiology (Rose BD, Post TW, 5th ed.).
 * Method: @ref NTR_METHOD_EFWC.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_efwc(size_t n, const double *urine_volume_l,
                           const double *urine_na_mmol_l,
                           const double *urine_k_mmol_l,
                           const double *serum_na_mmol_l, double *out,
                           int *status, size_t *failed);
/** @} */

/* ======================================================================= */
/* ==== section: correction (lib/correction.c, docs/correction.md) ======= */
/* ======================================================================= */

/** @defgroup correction Correction-rate safety limits
 *  Watch a measured sodium series against limits on how fast it may rise
 *  and, since 1.1 (ntr_course_assess(), ntr_course_watch_push()), on how
 *  fast it may fall.
 *
 *  The rises that matter are counted over sliding windows: a rise is the
 *  later sample minus the earlier one, for two samples at most 24 h (or
 *  48 h) apart, both in the series. A window "ending at" a sample holds
 *  every sample at most that many hours before it (the sample included).
 *  All rises and limits are in mmol/L.
 *  @{ */

/** One measured (or predicted) serum sodium. */
typedef struct ntr_sample {
    double hours;     /**< Time in hours since an origin the caller picks. */
    double na_mmol_l; /**< Serum sodium, mmol/L. */
} ntr_sample;

/** Limits on the rise of serum sodium, mmol/L (ABI: layout fixed). */
typedef struct ntr_limits {
    double max_rise_24h; /**< Largest allowed rise within any 24 h. */
    double max_rise_48h; /**< Largest allowed rise within any 48 h. */
    double min_rise_24h; /**< Rise wanted by the end of the first 24 h (0: no target). */
} ntr_limits;

/** What ntr_correction_assess() finds in a series (ABI: layout fixed). */
typedef struct ntr_correction {
    double rise_first_24h;  /**< Highest sodium within 24 h of the first sample, minus the first (>= 0). */
    double max_rise_24h;    /**< Largest rise between two samples at most 24 h apart (>= 0). */
    double max_rise_48h;    /**< Largest rise between two samples at most 48 h apart (>= 0). */
    double last_rate_per_h; /**< Change per hour over the last interval, mmol/L/h (0 without one). */
    double excess_mmol_l;   /**< How far the worst window exceeds its limit (0 if none does). */
    unsigned int flags;     /**< NTR_CF_* bits. */
    unsigned int reserved;  /**< Written as 0. */
} ntr_correction;

#define NTR_LIMITS_STANDARD 1  /**< {10, 18, 4} mmol/L: US panel and European guideline */
#define NTR_LIMITS_HIGH_RISK 2 /**< {8, 16, 4} mmol/L: high risk of osmotic demyelination */

/** @name Correction flags (bits of ntr_correction.flags; ABI)
 *  A comparison of a rise with a threshold ignores differences below
 *  @ref NTR_CF_TOLERANCE, so a rise that equals a limit (for example
 *  130.1 - 120.1) is not over it because of rounding.
 *  @{ */
/** max_rise_24h exceeds limits.max_rise_24h. */
#define NTR_CF_OVER_24H 1u
/** max_rise_48h exceeds limits.max_rise_48h. */
#define NTR_CF_OVER_48H 2u
/** At least 24 h passed between the first and the last sample and
 *  rise_first_24h is below limits.min_rise_24h. */
#define NTR_CF_BELOW_TARGET 4u
/** The last interval is falling: the last sample is lower than the latest
 *  sample taken at an earlier time (the two more than
 *  @ref NTR_CF_TIME_TOLERANCE_H apart). */
#define NTR_CF_FALLING 8u
/** Near a limit: the rise into the last sample, over the 24 h or the 48 h
 *  ending at it, is above 0, within @ref NTR_CF_NEAR_MARGIN of that
 *  window's limit and not above it. */
#define NTR_CF_NEAR_LIMIT 16u
/** Projected over: the last interval rises, and if the next sample, due
 *  after the same interval as the last one, rose by the same amount again,
 *  the 24 h or 48 h window ending at it would exceed its limit. */
#define NTR_CF_PROJECTED_OVER 32u
/** Rapid: the rise into the last sample over the 6 h ending at it is
 *  @ref NTR_CF_RAPID_RISE (6 mmol/L) or more: the point at which an urgent
 *  correction for severe symptoms is usually stopped for the day (the
 *  "rule of sixes"). */
#define NTR_CF_RAPID_6H 64u
/** Every flag this version defines. */
#define NTR_CF_ALL 127u

#define NTR_CF_TOLERANCE 1e-6    /**< mmol/L: smaller differences count as equal. */
#define NTR_CF_NEAR_MARGIN 2.0   /**< mmol/L below a limit at which NTR_CF_NEAR_LIMIT starts. */
#define NTR_CF_RAPID_WINDOW_H 6.0 /**< hours: window of NTR_CF_RAPID_6H. */
#define NTR_CF_RAPID_RISE 6.0    /**< mmol/L: rise that sets NTR_CF_RAPID_6H. */
/** hours: two samples count as within a W-hour window when the later is at
 *  most W + this after the earlier, so a pair exactly W apart (say 0.1 h
 *  and 24.1 h) is inside despite rounding: the safe side. */
#define NTR_CF_TIME_TOLERANCE_H 1e-6
/** @} */

/** @name Tri-state answers and ODS risk factors
 *  @{ */
#define NTR_TRI_UNKNOWN 0 /**< Not known (the value a zeroed struct gives). */
#define NTR_TRI_NO 1      /**< Known to be absent. */
#define NTR_TRI_YES 2     /**< Known to be present. */

#define NTR_ODS_NA_105 1u        /**< baseline sodium 105 mmol/L or below */
#define NTR_ODS_LOW_K 2u         /**< low potassium */
#define NTR_ODS_ALCOHOL 4u       /**< alcohol use disorder */
#define NTR_ODS_MALNUTRITION 8u  /**< malnutrition */
#define NTR_ODS_LIVER 16u        /**< advanced liver disease */
/** @} */

/**
 * @brief Preset correction limits.
 *
 * - @ref NTR_LIMITS_STANDARD gives {max_rise_24h 10, max_rise_48h 18,
 *   min_rise_24h 4} mmol/L.
 * - @ref NTR_LIMITS_HIGH_RISK gives {8, 16, 4} mmol/L, for patients at
 *   high risk of osmotic demyelination (see ntr_ods_risk()).
 *
 * The US panel gives a maximum of 10 to 12 mmol/L in any 24 h and 18 in
 * any 48 h, 8 in any 24 h at high risk, and a minimum of 4 to 8 (4 to 6 at
 * high risk). The European guideline limits the first 24 h to 10 and each
 * later 24 h to 8 (18 over 48 h) and has no separate high-risk tier. The
 * presets take the stricter end of each range; the 48 h high-risk figure
 * (2 x 8) is the library's own choice. docs/correction.md explains the
 * differences.
 *
 * @param preset   @ref NTR_LIMITS_STANDARD or @ref NTR_LIMITS_HIGH_RISK.
 * @param[out] out the limits.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown preset.
 *
 * References: Verbalis JG et al. Diagnosis, evaluation, and treatment of
 * hyponatremia: expert panel recommendations. Am J Med 2013;126(10 Suppl
 * 1):S1-42. Spasovski G et al. Clinical practice guideline on diagnosis and
 * treatment of hyponatraemia. Eur J Endocrinol 2014;170:G1-47.
 * Methods: @ref NTR_METHOD_LIMITS_STANDARD, @ref NTR_METHOD_LIMITS_HIGH_RISK.
 */
NTR_API NTR_MUST_CHECK int ntr_limits_preset(int preset, ntr_limits *out);

/**
 * @brief Whether the high-risk correction limits apply, and why.
 *
 * High risk when the baseline sodium is 105 mmol/L or below, or any of the
 * four factors is @ref NTR_TRI_YES, or any is @ref NTR_TRI_UNKNOWN (a
 * missing answer never loosens the limits). The factors that are known and
 * present go to @p drivers, the unknown ones to @p unknowns, so a caller
 * can say "high-risk limits because alcohol use is not known" and ask.
 *
 * @param baseline_na_mmol_l     sodium before correction, 80 to 220 mmol/L.
 * @param low_potassium          NTR_TRI_* (hypokalaemia).
 * @param alcohol_use_disorder   NTR_TRI_*.
 * @param malnutrition           NTR_TRI_*.
 * @param advanced_liver_disease NTR_TRI_*.
 * @param[out] preset   @ref NTR_LIMITS_HIGH_RISK or @ref NTR_LIMITS_STANDARD.
 * @param[out] drivers  NTR_ODS_* bits of the factors known to be present
 *                      (including @ref NTR_ODS_NA_105).
 * @param[out] unknowns NTR_ODS_* bits of the factors not known.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       a factor is not an NTR_TRI_* value.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * Reference: Verbalis JG et al., Am J Med 2013;126(10 Suppl 1):S1-42
 * (risk factors for osmotic demyelination).
 * Method: @ref NTR_METHOD_ODS_RISK.
 */
NTR_API NTR_MUST_CHECK int ntr_ods_risk(double baseline_na_mmol_l, int low_potassium,
                         int alcohol_use_disorder, int malnutrition,
                         int advanced_liver_disease, int *preset,
                         unsigned int *drivers, unsigned int *unknowns);

/**
 * @brief Assess a measured sodium series against correction limits.
 *
 * For samples s[0..n-1] in non-decreasing time, with i <= j counting as
 * "earlier" and "later" (array order breaks ties of time):
 * - rise_first_24h = max over j with t_j - t_0 <= 24 of (Na_j - Na_0);
 * - max_rise_W = max(0, max over i < j with t_j - t_i <= W of
 *   (Na_j - Na_i)), for W = 24 and 48 h;
 * - last_rate_per_h = (Na_last - Na_prev) / (t_last - t_prev), where prev
 *   is the latest sample taken strictly before the last one; 0 if there
 *   is none or the two are within @ref NTR_CF_TIME_TOLERANCE_H (too close
 *   for a rate: they count as one time point, as in the windows);
 * - excess_mmol_l = the larger of max_rise_24h - limit_24h and
 *   max_rise_48h - limit_48h, over the windows that are flagged over
 *   (0 if none);
 * - flags: NTR_CF_* as defined above. "Next sample due" for
 *   @ref NTR_CF_PROJECTED_OVER is t_last + (t_last - t_prev), the series'
 *   own rhythm; the projected sodium is Na_last + (Na_last - Na_prev).
 *
 * Cost: linear in n, no allocation, O(1) extra memory (a block scheme over
 * the time axis; docs/correction.md). One sample yields zeros and no flag.
 * Since 1.1 this is ntr_course_assess() with goal raise, no fall limits and
 * the 1.0 target, its flags limited to those of @ref NTR_CF_ALL (one
 * engine, the same results bit for bit). It cannot see falls: use ntr_course_assess().
 *
 * @param s   samples in non-decreasing time; hours finite, -1e6 to 1e6
 *            (any origin, so times before it are negative); sodium 80 to
 *            220 mmol/L.
 * @param n   number of samples, at least 1.
 * @param lim limits: max_rise_24h and max_rise_48h above 0 and at most 50,
 *            max_rise_24h <= max_rise_48h, 0 <= min_rise_24h <= max_rise_24h.
 * @param[out] out the assessment.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p s, @p lim or @p out is NULL.
 * @retval NTR_ERR_ARG       @p n is 0.
 * @retval NTR_ERR_NONFINITE a sample or limit is NaN or infinite.
 * @retval NTR_ERR_RANGE     a sample or limit is out of range, or the
 *                           limits contradict each other.
 * @retval NTR_ERR_ORDER     a sample is earlier than the one before it.
 * Checks run: pointers, n, samples (each: hours, sodium) in index order,
 * limits, then time order.
 *
 * References: Verbalis JG et al., Am J Med 2013; Spasovski G et al., Eur J
 * Endocrinol 2014 (the limits); Sterns RH, Hix JK, Silver S, Am J Kidney
 * Dis 2010;56:774-9 (the 6-in-6-hours stop point; cited from memory).
 * Methods: @ref NTR_METHOD_CORRECTION_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES.
 */
NTR_API NTR_MUST_CHECK int ntr_correction_assess(const ntr_sample *s, size_t n,
                                  const ntr_limits *lim, ntr_correction *out);

/** Most samples an ntr_watch keeps: enough for a sample every 23 minutes
 *  rising steadily for 48 h. Only samples that can still be the lowest
 *  point of a 48 h window are kept, so a falling or flat series needs far
 *  fewer. */
#define NTR_WATCH_CAPACITY 128

/**
 * @brief State of a streaming watcher (caller-owned; ABI: layout fixed).
 *
 * Fill it with ntr_watch_init(), then feed results one at a time with
 * ntr_watch_push(). It holds no pointers, so it may be copied, stored as
 * bytes and restored on the same platform. The members are private: read
 * results through ntr_watch_push() or ntr_watch_result(). Size: 2200
 * bytes on common 32- and 64-bit targets.
 *
 * ntr_watch_init() does not clear @c ring: the bytes of ring entries that
 * no push has used yet are unspecified (whatever the memory held before;
 * the library never reads them). Copies and stored bytes restore
 * correctly all the same. To compare two states byte by byte, or to store
 * one without stale memory in it, set the struct to zero (memset) before
 * ntr_watch_init().
 */
typedef struct ntr_watch {
    unsigned int magic;      /**< private: marks an initialised state */
    unsigned int kept;       /**< private: samples kept */
    unsigned int head;       /**< private: ring index of the oldest kept sample */
    unsigned int front24;    /**< private: first kept sample in the last 24 h (offset) */
    unsigned int front6;     /**< private: first kept sample in the last 6 h (offset) */
    unsigned int seen;       /**< private: 0 none, 1 one time point, 2 two or more */
    unsigned int first_open; /**< private: still within 24 h of the first sample */
    unsigned int reserved_u; /**< private */
    ntr_limits limits;       /**< private: the limits given to ntr_watch_init() */
    ntr_sample first;        /**< private */
    ntr_sample prev;         /**< private: latest sample before the last one's time */
    ntr_sample last;         /**< private */
    double rise_first_24h;   /**< private */
    double max_rise_24h;     /**< private */
    double max_rise_48h;     /**< private */
    double reserved_d[3];    /**< private */
    ntr_sample ring[NTR_WATCH_CAPACITY]; /**< private: candidate window minima */
} ntr_watch;

/**
 * @brief Start a streaming watcher with the given limits.
 *
 * @param lim    limits, checked as in ntr_correction_assess().
 * @param[out] w the state to initialise.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: as ntr_correction_assess().
 * Methods: @ref NTR_METHOD_CORRECTION_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES.
 */
NTR_API NTR_MUST_CHECK int ntr_watch_init(const ntr_limits *lim, ntr_watch *w);

/**
 * @brief Add one result to a watcher and return the assessment so far.
 *
 * The assessment equals, field for field and bit for bit, what
 * ntr_correction_assess() returns for all the samples pushed so far.
 * Cost (since 1.1, issue 16), with k the samples kept (k <= @ref
 * NTR_WATCH_CAPACITY): the state check reads every kept sample once (one
 * ordered comparison per number, O(k)); everything else is O(log k): the
 * five window starts (the 48 h drop, the 24 h and 6 h fronts and the two
 * projected windows) and the samples pushed out from the back are found
 * by a walk of at most 4 steps, then galloping and bisection of the
 * time-ordered ring, at most 4 + 2 log2(k) + 2 probes each. So a single
 * push costs at most about a k + b log2(k) + c instructions, whatever it
 * drops: no push costs more than a steady push with as many samples kept
 * plus O(log k) (tests/bench/notes.md, "Worst single push"); no
 * allocation.
 *
 * @param w         a state from ntr_watch_init() (updated on success only).
 * @param hours     time of the result, -1e6 to 1e6, not before the last one.
 * @param na_mmol_l serum sodium, 80 to 220 mmol/L.
 * @param[out] out  the assessment of the series so far.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p w or @p out is NULL.
 * @retval NTR_ERR_ARG       @p w was not initialised, or is damaged (an
 *         impossible count or index, or, since 1.1, a stored number that is
 *         NaN, infinite or out of its range, or kept samples out of the
 *         order every push keeps: times not decreasing, sodium rising).
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: @p hours or
 *                           @p na_mmol_l.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: @p hours
 *                           or @p na_mmol_l.
 * @retval NTR_ERR_ORDER     @p hours is before the previous result.
 * @retval NTR_ERR_CAPACITY  the series rises so steadily and densely that
 *         more than @ref NTR_WATCH_CAPACITY samples would have to be kept;
 *         nothing changed: keep the series and use ntr_correction_assess().
 *
 * References: as ntr_correction_assess().
 * Methods: @ref NTR_METHOD_CORRECTION_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES.
 */
NTR_API NTR_MUST_CHECK int ntr_watch_push(ntr_watch *w, double hours, double na_mmol_l,
                           ntr_correction *out);

/**
 * @brief The current assessment of a watcher, without adding a result.
 *
 * @param w        a state from ntr_watch_init() with at least one result.
 * @param[out] out the assessment (as the last ntr_watch_push() returned).
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       not initialised, damaged as for ntr_watch_push(),
 *                           or no result pushed yet.
 *
 * References: as ntr_correction_assess().
 * Methods: @ref NTR_METHOD_CORRECTION_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES.
 */
NTR_API NTR_MUST_CHECK int ntr_watch_result(const ntr_watch *w, ntr_correction *out);

/* ---- 1.1: direction-aware course limits (rises and falls) ------------- */

/** @name Goals of a correction (ntr_course_limits.goal; ABI, since 1.1)
 *  @{ */
#define NTR_GOAL_RAISE 1 /**< A low sodium being raised. */
#define NTR_GOAL_LOWER 2 /**< A high sodium being lowered. */
#define NTR_GOAL_HOLD 3  /**< Neither direction wanted (target reached, clamp, neurosurgery). */
/** @} */

/** @name Course presets (ntr_course_limits_preset(); ABI, since 1.1)
 *  @{ */
#define NTR_COURSE_HYPO_STANDARD 1  /**< raise; rises at most 10 in 24 h, 18 in 48 h */
#define NTR_COURSE_HYPO_HIGH_RISK 2 /**< raise; rises at most 8 in 24 h, 16 in 48 h */
#define NTR_COURSE_HYPER_CHRONIC 3  /**< lower; falls at most 10 in any 24 h */
#define NTR_COURSE_HYPER_ACUTE 4    /**< lower; falls at most 24 in any 24 h (1 mmol/L/h) */
#define NTR_COURSE_HOLD 5           /**< hold; rises and falls at most 4 in any 24 h */
/** @} */

/**
 * @brief Limits on a sodium course in both directions (ABI since 1.1).
 *
 * Set @c struct_size to sizeof(ntr_course_limits) (ntr_course_limits_preset()
 * does). Every function taking limits refuses, with NTR_ERR_ARG, a
 * struct_size smaller than the 1.1 size (sizeof(ntr_course_limits) in this
 * header); a larger one (a caller built against a later header) is
 * accepted and only the members listed here are read.
 *
 * A limit of 0 means no limit in that direction over that window. Each
 * limit is 0 to 50 mmol/L; where both windows of a direction have a limit,
 * the 24 h one may not exceed the 48 h one (any 24 h lies inside a 48 h
 * window). @c min_change_24h is 0 (no target) for @ref NTR_GOAL_HOLD and
 * may not exceed a limit of the goal's direction (a target above the
 * ceiling could never be met safely).
 */
typedef struct ntr_course_limits {
    size_t struct_size;    /**< sizeof(ntr_course_limits) as the caller knows it. */
    int goal;              /**< NTR_GOAL_*. */
    double max_rise_24h;   /**< Largest allowed rise within any 24 h, mmol/L (0: none). */
    double max_rise_48h;   /**< Largest allowed rise within any 48 h, mmol/L (0: none). */
    double max_fall_24h;   /**< Largest allowed fall within any 24 h, mmol/L (0: none). */
    double max_fall_48h;   /**< Largest allowed fall within any 48 h, mmol/L (0: none). */
    double min_change_24h; /**< Change wanted in the goal's direction by 24 h, mmol/L (0: no target). */
} ntr_course_limits;

/** @name Course flags added in 1.1 (bits of ntr_course_report.flags; ABI)
 *  Bits 1-64 keep their 1.0 meaning, for rises (NTR_CF_OVER_24H to
 *  NTR_CF_RAPID_6H; a rise limit of 0 sets none of the rise-limit bits).
 *  The fall bits mirror them for falls. There is no fall counterpart of
 *  NTR_CF_RAPID_6H: no published short-window stop point for a fall was
 *  found (docs/correction.md).
 *  @{ */
/** max_fall_24h exceeds limits.max_fall_24h (a limit above 0). */
#define NTR_CF_FALL_OVER_24H 0x80u
/** max_fall_48h exceeds limits.max_fall_48h (a limit above 0). */
#define NTR_CF_FALL_OVER_48H 0x100u
/** Moved against the goal. Raising (@ref NTR_GOAL_RAISE), max_fall_48h is
 *  more than @ref NTR_CF_WRONG_WAY_MARGIN; lowering (@ref NTR_GOAL_LOWER),
 *  max_rise_48h is more than the margin; holding (@ref NTR_GOAL_HOLD), any
 *  window is over its limit (any
 *  of the four OVER bits), or, in a direction with no limit at all, the
 *  48 h change in that direction is more than the margin. */
#define NTR_CF_WRONG_WAY 0x200u
/** A watcher compacted its memory: the window figures (and the flags read
 *  from them) are upper bounds of the exact ones (ntr_course_watch_push()). */
#define NTR_CF_APPROXIMATE 0x400u
/** Fall near a limit: the fall into the last sample, over the 24 h or 48 h
 *  ending at it, is above 0, within @ref NTR_CF_NEAR_MARGIN of that
 *  window's fall limit (above 0) and not above it. */
#define NTR_CF_FALL_NEAR_LIMIT 0x800u
/** Fall projected over: the last interval falls, and if the next sample,
 *  due after the same interval, fell by the same amount again, the 24 h or
 *  48 h window ending at it would exceed its fall limit. */
#define NTR_CF_FALL_PROJECTED_OVER 0x1000u
/** Every flag ntr_course_assess() and the course watcher can set. */
#define NTR_CF_COURSE_ALL 0x1fffu
/** mmol/L: the change against the goal that sets @ref NTR_CF_WRONG_WAY.
 *  Two sodium results of an unchanged patient can differ by about this
 *  much through analytical error alone (an analytical coefficient of
 *  variation near 1 %, and the +-4 mmol/L allowable error of US
 *  proficiency testing, both from memory; docs/correction.md), so a
 *  smaller move is not evidence of a wrong direction. */
#define NTR_CF_WRONG_WAY_MARGIN 4.0
/** hours: ntr_course_report.worst_at_h when no window is over its limit
 *  (outside every accepted sample time). */
#define NTR_COURSE_NO_TIME (-1.0e9)
/** @} */

/**
 * @brief What ntr_course_assess() finds in a series (ABI since 1.1).
 *
 * Set @c struct_size to sizeof(ntr_course_report) before the call: a
 * smaller value (an older or wrong size) is refused with NTR_ERR_ARG and
 * nothing is written. On success @c struct_size is set to the size this
 * library fills (sizeof(ntr_course_report) of 1.1), so a caller built
 * against a later, larger struct knows which members were written.
 *
 * The maxima are "so far" (any window of the course); rise_now_24h and
 * fall_now_24h are "now" (the 24 h ending at the last sample), so a
 * screen can tell a past breach from a current one.
 */
typedef struct ntr_course_report {
    size_t struct_size;     /**< sizeof(ntr_course_report) as the caller knows it; set on success. */
    double max_rise_24h;    /**< Largest rise between two samples at most 24 h apart (>= 0). */
    double max_rise_48h;    /**< Largest rise between two samples at most 48 h apart (>= 0). */
    double max_fall_24h;    /**< Largest fall between two samples at most 24 h apart (>= 0). */
    double max_fall_48h;    /**< Largest fall between two samples at most 48 h apart (>= 0). */
    double excess_mmol_l;   /**< The worst window's excess over its limit, either direction (0 if none). */
    unsigned int flags;     /**< NTR_CF_* bits. */
    unsigned int reserved;  /**< Written as 0. */
    double rise_first_24h;  /**< Highest sodium within 24 h of the first sample minus the first (>= 0). */
    double fall_first_24h;  /**< The first sample minus the lowest within 24 h of it (>= 0). */
    double rise_now_24h;    /**< The last sample minus the lowest in the 24 h ending at it (>= 0). */
    double fall_now_24h;    /**< The highest in the 24 h ending at the last sample minus the last (>= 0). */
    double last_rate_per_h; /**< Change per hour over the last interval, mmol/L/h (0 without one). */
    double elapsed_h;       /**< Last sample's time minus the first's, hours. */
    double worst_at_h;      /**< Time of the later sample of the worst window (the one excess_mmol_l
                                 measures), hours; @ref NTR_COURSE_NO_TIME when none is over. */
} ntr_course_report;

/**
 * @brief Preset limits for a sodium course, in both directions.
 *
 * | preset | goal | rise 24 h / 48 h | fall 24 h / 48 h | source |
 * |---|---|---|---|---|
 * | @ref NTR_COURSE_HYPO_STANDARD  | raise | 10 / 18 | none | Verbalis 2013; Spasovski 2014 |
 * | @ref NTR_COURSE_HYPO_HIGH_RISK | raise | 8 / 16  | none | Verbalis 2013 (16 = 2 x 8, the library's choice) |
 * | @ref NTR_COURSE_HYPER_CHRONIC  | lower | none    | 10 / none | Adrogue & Madias 2000 (about 10 per day, 0.5 per hour) |
 * | @ref NTR_COURSE_HYPER_ACUTE    | lower | none    | 24 / none | Adrogue & Madias 2000 (hours-old: about 1 per hour; 24 in 24 h is the library's arithmetic) |
 * | @ref NTR_COURSE_HOLD           | hold  | 4 / none | 4 / none | library's choice: the analytical margin @ref NTR_CF_WRONG_WAY_MARGIN |
 *
 * min_change_24h is 0 in every preset: a target is the caller's choice.
 * The European guideline's "10 in the first 24 h, then 8 in each later
 * 24 h" cannot be written as limits on any window and gets no preset of
 * its own; its 18 over 48 h is what @ref NTR_COURSE_HYPO_STANDARD checks.
 *
 * @param preset   NTR_COURSE_*.
 * @param[out] out the limits, struct_size set.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL (@p out).
 * @retval NTR_ERR_ARG       unknown preset.
 *
 * References: Verbalis JG et al., Am J Med 2013;126(10 Suppl 1):S1-42;
 * Spasovski G et al., Eur J Endocrinol 2014;170:G1-47; Adrogue HJ, Madias
 * NE. Hypernatremia. N Engl J Med 2000;342:1493-9.
 * Methods: @ref NTR_METHOD_LIMITS_STANDARD, @ref NTR_METHOD_LIMITS_HIGH_RISK,
 * @ref NTR_METHOD_COURSE_HYPER_CHRONIC, @ref NTR_METHOD_COURSE_HYPER_ACUTE,
 * @ref NTR_METHOD_COURSE_HOLD.
 */
NTR_API NTR_MUST_CHECK int ntr_course_limits_preset(int preset, ntr_course_limits *out);

/**
 * @brief Assess a sodium series against limits in both directions.
 *
 * For samples s[0..n-1] in non-decreasing time, i <= j meaning "earlier"
 * and "later" (array order breaks ties of time), windows W = 24 and 48 h,
 * and two samples are within W when t_j - t_i <= W +
 * @ref NTR_CF_TIME_TOLERANCE_H . Then:
 * - max_rise_W = max(0, max over i < j within W of (Na_j - Na_i));
 * - max_fall_W = max(0, max over i < j within W of (Na_i - Na_j)): falls
 *   are counted exactly as rises (the engine reads the series' mirror
 *   image, every sodium negated, with the same operations);
 * - rise_first_24h, fall_first_24h: max over j within 24 h of s[0] of
 *   (Na_j - Na_0), and of (Na_0 - Na_j), at least 0;
 * - rise_now_24h, fall_now_24h: the same against the last sample, over the
 *   samples within 24 h before it;
 * - last_rate_per_h, the projection of the next sample and @ref
 *   NTR_CF_FALLING, @ref NTR_CF_NEAR_LIMIT, @ref NTR_CF_PROJECTED_OVER and
 *   @ref NTR_CF_RAPID_6H as in ntr_correction_assess() (a rise limit of 0
 *   sets no rise-limit bit); @ref NTR_CF_FALL_NEAR_LIMIT and @ref
 *   NTR_CF_FALL_PROJECTED_OVER their mirror images for falls;
 * - a window is over when its figure exceeds its limit (above 0) by more
 *   than @ref NTR_CF_TOLERANCE (@ref NTR_CF_OVER_24H, @ref NTR_CF_OVER_48H,
 *   @ref NTR_CF_FALL_OVER_24H, @ref NTR_CF_FALL_OVER_48H);
 *   excess_mmol_l = the largest figure minus limit among the windows over
 *   (ties: rise 24 h, rise 48 h, fall 24 h, fall 48 h), 0 if none;
 *   worst_at_h = the time of the smallest j of a pair reaching that
 *   window's figure;
 * - @ref NTR_CF_WRONG_WAY as defined with the flag;
 * - @ref NTR_CF_BELOW_TARGET only when min_change_24h > 0, at least 24 h
 *   passed (elapsed_h >= 24 - @ref NTR_CF_TIME_TOLERANCE_H) and the first
 *   24 h change in the goal's direction (rise_first_24h for raise,
 *   fall_first_24h for lower) is below min_change_24h by more than
 *   @ref NTR_CF_TOLERANCE.
 *
 * ntr_correction_assess() is this function with goal raise, no fall
 * limits and its flags limited to @ref NTR_CF_ALL. Cost: linear in n, no
 * allocation, O(1) extra memory (docs/correction.md).
 *
 * @param s   samples in non-decreasing time; hours finite, -1e6 to 1e6;
 *            sodium 80 to 220 mmol/L.
 * @param n   number of samples, at least 1.
 * @param lim limits (see ntr_course_limits for the accepted values).
 * @param[in,out] out the assessment; struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p s, @p lim or @p out is NULL.
 * @retval NTR_ERR_ARG       @p n is 0, lim->struct_size or out->struct_size
 *                           is smaller than the 1.1 size, or lim->goal is
 *                           not an NTR_GOAL_* value.
 * @retval NTR_ERR_NONFINITE a sample or limit is NaN or infinite.
 * @retval NTR_ERR_RANGE     a sample or limit is out of range, or the
 *                           limits contradict each other.
 * @retval NTR_ERR_ORDER     a sample is earlier than the one before it.
 * Checks run: pointers, n, lim->struct_size, lim->goal, out->struct_size,
 * samples (each: hours, sodium) in index order, limits (rise 24 h,
 * rise 48 h, fall 24 h, fall 48 h, target, then their consistency), then
 * time order.
 *
 * References: Verbalis JG et al., Am J Med 2013; Spasovski G et al., Eur J
 * Endocrinol 2014; Adrogue HJ, Madias NE, N Engl J Med 2000;342:1493-9
 * (falls in hypernatraemia); Sterns RH, Hix JK, Silver S, Am J Kidney Dis
 * 2010;56:774-9 (the 6-in-6-hours stop point; cited from memory).
 * Methods: @ref NTR_METHOD_COURSE_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES, @ref NTR_METHOD_COURSE_WRONG_WAY.
 */
NTR_API NTR_MUST_CHECK int ntr_course_assess(const ntr_sample *s, size_t n,
                              const ntr_course_limits *lim,
                              ntr_course_report *out);

/** Candidates an ntr_course_watch keeps per direction (window minima for
 *  rises, maxima for falls): exact for a series rising (or falling)
 *  steadily, for any length, sampled every 31 minutes or less often.
 *  Denser series are compacted, never refused. */
#define NTR_COURSE_WATCH_CAPACITY 96

/** Private part of an ntr_course_watch: one direction's candidates. */
typedef struct ntr_course_watch_ring {
    unsigned int kept;    /**< private: candidates kept */
    unsigned int head;    /**< private: index of the oldest */
    unsigned int front24; /**< private: first candidate in the last 24 h (offset) */
    unsigned int front6;  /**< private: first candidate in the last 6 h (offset) */
    ntr_sample entry[NTR_COURSE_WATCH_CAPACITY]; /**< private */
    float span[NTR_COURSE_WATCH_CAPACITY];       /**< private: over-report bound of each entry */
} ntr_course_watch_ring;

/**
 * @brief State of a streaming course watcher (caller-owned; since 1.1).
 *
 * Fill it with ntr_course_watch_init(), then feed results one at a time
 * with ntr_course_watch_push(). Fixed size, no pointers: it may be copied,
 * stored as bytes and restored on the same platform. The members are
 * private. Size: about 4 KiB (4072 bytes on common 64-bit targets, 4064
 * on 32-bit ones); every call is allocation-free with a
 * small, fixed stack. As with ntr_watch, ntr_course_watch_init() leaves
 * unused candidate entries uncleared (memset the struct first to compare
 * states byte by byte).
 */
typedef struct ntr_course_watch {
    unsigned int magic;       /**< private: marks an initialised state */
    unsigned int seen;        /**< private: 0 none, 1 one time point, 2 two or more */
    unsigned int first_open;  /**< private: still within 24 h of the first sample */
    unsigned int approximate; /**< private: 1 once memory was compacted */
    ntr_course_limits limits; /**< private: the limits given to ntr_course_watch_init() */
    ntr_sample first;         /**< private */
    ntr_sample prev;          /**< private: latest sample before the last one's time */
    ntr_sample last;          /**< private */
    double rise_first_24h;    /**< private */
    double fall_first_24h;    /**< private */
    double max_rise_24h;      /**< private */
    double max_rise_48h;      /**< private */
    double max_fall_24h;      /**< private */
    double max_fall_48h;      /**< private */
    double at_rise_24h;       /**< private: time the largest 24 h rise was reached */
    double at_rise_48h;       /**< private */
    double at_fall_24h;       /**< private */
    double at_fall_48h;       /**< private */
    ntr_course_watch_ring low;  /**< private: candidate minima (rises) */
    ntr_course_watch_ring high; /**< private: candidate maxima, stored negated (falls) */
} ntr_course_watch;

/**
 * @brief Start a streaming course watcher with the given limits.
 *
 * @param lim    limits, checked as in ntr_course_assess().
 * @param[out] w the state to initialise.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       lim->struct_size below the 1.1 size, or an unknown
 *                           goal.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 *
 * References: as ntr_course_assess().
 * Methods: @ref NTR_METHOD_COURSE_WATCH, @ref NTR_METHOD_COURSE_WINDOWS.
 */
NTR_API NTR_MUST_CHECK int ntr_course_watch_init(const ntr_course_limits *lim, ntr_course_watch *w);

/**
 * @brief Add one result to a course watcher and return the assessment so far.
 *
 * While each direction has kept at most @ref NTR_COURSE_WATCH_CAPACITY
 * candidates, the report equals, field for field and bit for bit, what
 * ntr_course_assess() returns for all the samples pushed so far. A
 * candidate is a sample that can still be the lowest (highest) point of a
 * 48 h window ending at a later sample: a series rising steadily keeps
 * every sample of the last 48 h as a rise candidate.
 *
 * When a direction's memory is full, the watcher compacts it instead of
 * refusing: of the adjacent candidate pairs (t_k, m_k), (t_k+1, m_k+1)
 * it merges the one with the smallest |m_k+1 - m_k| into one candidate
 * with the later time t_k+1 and the more extreme sodium m_k. Every window
 * that holds the later time then sees a sodium at least as extreme as the
 * true one, so max_rise_24h, max_rise_48h, max_fall_24h, max_fall_48h,
 * rise_now_24h, fall_now_24h and the flags read from them are never
 * smaller than the exact ones; the state keeps @ref NTR_CF_APPROXIMATE
 * set from then on. rise_first_24h, fall_first_24h, last_rate_per_h and
 * elapsed_h stay exact. Each merged entry remembers how far it can
 * over-report (its span), and the merge chosen is the one whose merged
 * span is smallest. Measured over-report (tests/test_correction.c,
 * docs/correction.md): at most 0.29 mmol/L on 5- and 15-minute series over
 * 72 h rising or falling 0.375-0.5 mmol/L/h, noisy and adversarial; on
 * random dense series at most 1.4 % of the exact 48 h change.
 *
 * Cost (issue 16), with k the candidates kept per direction (k <= @ref
 * NTR_COURSE_WATCH_CAPACITY): per direction, the state check reads every
 * candidate and span once (O(k)), the window starts are found in O(log k)
 * as for ntr_watch_push(), and a push into a full direction compacts it:
 * one pass over the k - 1 adjacent pairs to choose the merge, then at
 * most (k - 2) / 2 candidates moved (the shorter side of the merge). So a
 * single push costs at most about a k + b log2(k) + c instructions per
 * direction, plus d k in a direction that compacts: no push costs more
 * than a steady push with as many candidates plus O(log k) and one
 * compaction (tests/bench/notes.md, "Worst single push"); no allocation.
 *
 * @param w         a state from ntr_course_watch_init() (updated on success only).
 * @param hours     time of the result, -1e6 to 1e6, not before the last one.
 * @param na_mmol_l serum sodium, 80 to 220 mmol/L.
 * @param[in,out] out the assessment of the series so far; struct_size set
 *                  by the caller, as for ntr_course_assess().
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p w or @p out is NULL.
 * @retval NTR_ERR_ARG       out->struct_size below the 1.1 size, or @p w
 *         was not initialised or is damaged (an impossible count or index,
 *         a stored number that is NaN, infinite or out of its range, or
 *         candidates out of the order every push keeps).
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: @p hours or
 *                           @p na_mmol_l.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: @p hours
 *                           or @p na_mmol_l.
 * @retval NTR_ERR_ORDER     @p hours is before the previous result.
 *
 * References: as ntr_course_assess().
 * Methods: @ref NTR_METHOD_COURSE_WATCH, @ref NTR_METHOD_COURSE_WINDOWS,
 * @ref NTR_METHOD_CORRECTION_TREND, @ref NTR_METHOD_RULE_OF_SIXES,
 * @ref NTR_METHOD_COURSE_WRONG_WAY.
 */
NTR_API NTR_MUST_CHECK int ntr_course_watch_push(ntr_course_watch *w, double hours,
                                  double na_mmol_l, ntr_course_report *out);

/**
 * @brief Add one result to a course watcher on the glucose-corrected sodium (since 1.1).
 *
 * Corrects @p na_mmol_l for glucose exactly as ntr_na_corrected_glucose()
 * does (the same code, so bit for bit the same value):
 * Na_corr = Na + f * (G * 18.0156 - 100) / 100, G in mmol/L, f = 1.6
 * (Katz) or 2.4 (Hillier) mmol/L per 100 mg/dL; a glucose at or below
 * 100 mg/dL (5.55 mmol/L), including 0, gives no correction. Then pushes
 * Na_corr as ntr_course_watch_push() does, so hyperglycaemic states are
 * watched on the sodium the water balance acts on.
 *
 * Consistency is the caller's part: the state does not record whether
 * its results were corrected (the 1.1 layout has no spare member), so a
 * series mixing this call with ntr_course_watch_push() (or two methods)
 * is accepted and is a mixed series whose rises and falls are wrong.
 * Push every result of one watcher through the same call and method. A
 * missing glucose is not a 0: NaN is refused (NTR_ERR_NONFINITE).
 *
 * @param w              as ntr_course_watch_push() (updated on success only).
 * @param hours          as ntr_course_watch_push().
 * @param na_mmol_l      measured serum sodium, 80 to 220 mmol/L.
 * @param glucose_mmol_l plasma glucose of the same sample, 0 to 200 mmol/L.
 * @param glucose_method @ref NTR_GLUCOSE_KATZ or @ref NTR_GLUCOSE_HILLIER.
 * @param[in,out] out    as ntr_course_watch_push().
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p w or @p out is NULL.
 * @retval NTR_ERR_ARG       unknown @p glucose_method, then as
 *         ntr_course_watch_push() (out->struct_size, state not sound).
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: @p hours,
 *                           @p na_mmol_l, @p glucose_mmol_l in that order.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: @p hours,
 *                           @p na_mmol_l, @p glucose_mmol_l in that order;
 *                           also when the corrected sodium is above
 *                           220 mmol/L.
 * @retval NTR_ERR_ORDER     @p hours is before the previous result.
 *
 * References: Katz MA, N Engl J Med 1973;289:843-4; Hillier TA et al.,
 * Am J Med 1999;106:399-403; the rest as ntr_course_assess().
 * Methods: as ntr_course_watch_push(), with @ref NTR_METHOD_GLUCOSE_KATZ
 * or @ref NTR_METHOD_GLUCOSE_HILLIER.
 */
NTR_API NTR_MUST_CHECK int ntr_course_watch_push_glucose(ntr_course_watch *w, double hours,
                                          double na_mmol_l, double glucose_mmol_l,
                                          int glucose_method, ntr_course_report *out);

/**
 * @brief The current assessment of a course watcher, without adding a result.
 *
 * @param w        a state from ntr_course_watch_init() with at least one result.
 * @param[in,out] out the assessment (as the last ntr_course_watch_push()
 *                 returned); struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       out->struct_size below the 1.1 size; @p w not
 *                           initialised, damaged, or with no result pushed
 *                           yet.
 *
 * References: as ntr_course_assess().
 * Methods: @ref NTR_METHOD_COURSE_WATCH, @ref NTR_METHOD_COURSE_WINDOWS.
 */
NTR_API NTR_MUST_CHECK int ntr_course_watch_result(const ntr_course_watch *w, ntr_course_report *out);
/** @} */

/* ======================================================================= */
/* ==== section: balance (lib/balance.c, docs/balance.md) ================ */
/* ======================================================================= */

/** @defgroup balance Predicting a fluid plan by mass balance
 *  Where serum sodium goes under infusions and losses, and whether a plan
 *  stays within the correction limits. Based on the Edelman relation
 *  (serum Na tracks exchangeable (Na + K) / total body water) with the
 *  slope 1 and intercept 0 that the Adrogue-Madias formula also assumes;
 *  docs/balance.md lists what the model ignores.
 *  @{ */

/** A volume of fluid gained or lost (ABI: layout fixed). */
typedef struct ntr_flow {
    double volume_l;  /**< L; > 0 into the patient, < 0 out (urine and other losses). */
    double na_mmol_l; /**< Sodium of the fluid, mmol/L. */
    double k_mmol_l;  /**< Potassium of the fluid, mmol/L. */
} ntr_flow;

/** A fluid given or lost at a steady rate over a span of a plan
 *  (ABI: layout fixed). Times are hours after the plan starts. */
typedef struct ntr_timed_flow {
    double start_h;   /**< Start, 0 to 720 h after the plan starts. */
    double end_h;     /**< End, start_h to 720 h (the flow stops at the plan's end anyway). */
    double rate_ml_h; /**< mL/h, -5000 to 5000; > 0 in, < 0 out (urine). */
    double na_mmol_l; /**< Sodium of the fluid, 0 to 1100 mmol/L. */
    double k_mmol_l;  /**< Potassium of the fluid, 0 to 400 mmol/L. */
    unsigned int reserved[2]; /**< Must be 0 (room for growth). */
} ntr_timed_flow;

/** ntr_plan_result breach time when no predicted point breaches. */
#define NTR_PLAN_NO_BREACH (-1.0)

/** Verdict of ntr_plan_check() (ABI: layout fixed). */
typedef struct ntr_plan_result {
    ntr_correction course;  /**< ntr_correction_assess() of history + predicted series. */
    double final_na_mmol_l; /**< Predicted sodium at the end of the plan. */
    double final_tbw_l;     /**< Predicted body water at the end of the plan. */
    double breach_24h_h;    /**< Hours after the plan starts of the first predicted point whose
                                 24 h rise exceeds the limit, or NTR_PLAN_NO_BREACH. */
    double breach_48h_h;    /**< The same for the 48 h limit. */
    double reserved_d[2];   /**< Written as 0. */
    unsigned int points;    /**< Predicted points checked (the history not counted). */
    unsigned int reserved;  /**< Written as 0. */
} ntr_plan_result;

/** @name Direction of a predicted breach (ntr_course_plan_result; ABI, since 1.1)
 *  @{ */
#define NTR_PLAN_BREACH_NONE 0 /**< No predicted point is over any limit. */
#define NTR_PLAN_BREACH_RISE 1 /**< The first breach is of a rise limit (24 h or 48 h). */
#define NTR_PLAN_BREACH_FALL 2 /**< The first breach is of a fall limit (24 h or 48 h). */
/** @} */

/**
 * @brief Verdict of ntr_course_plan_check() (ABI since 1.1).
 *
 * Set @c struct_size to sizeof(ntr_course_plan_result) before the call: a
 * smaller value is refused with NTR_ERR_ARG and nothing is written; on
 * success it is set to the size this library fills (the 1.1 size). The
 * report @c course is the last member so that a later, larger
 * ntr_course_report only lengthens this struct at its end: the members
 * before it keep their offsets in every 1.x.
 *
 * Breach times are hours after the plan starts (plan time 0 is the last
 * measured sample) of the first predicted point whose window ending at it
 * is over that limit; @ref NTR_PLAN_NO_BREACH when none is, and always for
 * a limit of 0 (no limit).
 */
typedef struct ntr_course_plan_result {
    size_t struct_size;         /**< sizeof(ntr_course_plan_result) as the caller knows it; set on success. */
    double final_na_mmol_l;     /**< Predicted sodium at the end of the plan, mmol/L. */
    double final_tbw_l;         /**< Predicted body water at the end of the plan, L. */
    double breach_rise_24h_h;   /**< First predicted point over the 24 h rise limit, or NTR_PLAN_NO_BREACH. */
    double breach_rise_48h_h;   /**< The same for the 48 h rise limit. */
    double breach_fall_24h_h;   /**< The same for the 24 h fall limit. */
    double breach_fall_48h_h;   /**< The same for the 48 h fall limit. */
    double first_breach_h;      /**< The earliest of the four, or NTR_PLAN_NO_BREACH. */
    unsigned int first_breach_flag; /**< The limit breached first, as its flag: NTR_CF_OVER_24H,
                                         NTR_CF_OVER_48H, NTR_CF_FALL_OVER_24H or
                                         NTR_CF_FALL_OVER_48H (ties in that order); 0 for none. */
    int first_breach_direction; /**< NTR_PLAN_BREACH_NONE, _RISE or _FALL (of first_breach_flag). */
    unsigned int points;        /**< Predicted points checked (the history not counted). */
    unsigned int reserved;      /**< Written as 0. */
    ntr_course_report course;   /**< ntr_course_assess() of history + predicted series (struct_size set). */
} ntr_course_plan_result;

/**
 * @brief Sodium and body water after a set of fluid gains and losses.
 *
 * Mass balance of exchangeable cation and water:
 * Na1 = (Na0*TBW0 + sum v_i*(na_i + k_i)) / (TBW0 + sum v_i),
 * TBW1 = TBW0 + sum v_i, computed as
 * Na1 = Na0 + sum v_i*(na_i + k_i - Na0) / TBW1 so Na0 does not cancel.
 * With one inflow of 1 L it equals Na0 + ntr_infusate_change_per_litre().
 *
 * @param na_mmol_l sodium before, 80 to 220 mmol/L.
 * @param tbw_l     body water before, 0.1 to 400 L.
 * @param flows     the gains and losses (may be NULL when @p n is 0):
 *                  volume_l -30 to 20 L, na_mmol_l 0 to 1100,
 *                  k_mmol_l 0 to 400 mmol/L.
 * @param n         number of flows (0 gives the inputs back).
 * @param[out] na_out  sodium after, mmol/L.
 * @param[out] tbw_out body water after, L.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    body water after outside 0.1 to 400 L, or sodium
 *                           after outside 80 to 220 mmol/L: the model no
 *                           longer applies, and no function would take that
 *                           state as input. The infusate and re-lowering
 *                           functions apply the same rule; 400 L since 1.1.
 *
 * References: Edelman IS, Leibman J, O'Meara MP, Birkenfeld LW. Interrelations
 * between serum sodium concentration, serum osmolarity and total
 * exchangeable sodium, total exchangeable potassium and total body water.
 * J Clin Invest 1958;37:1236-56. Adrogue HJ, Madias NE. Hyponatremia.
 * N Engl J Med 2000;342:1581-9.
 * Method: @ref NTR_METHOD_BALANCE_MASS.
 */
NTR_API NTR_MUST_CHECK int ntr_balance_predict(double na_mmol_l, double tbw_l,
                                const ntr_flow *flows, size_t n,
                                double *na_out, double *tbw_out);

/**
 * @brief Predicted sodium over time under rate-based gains and losses.
 *
 * At each time tau the volume of flow i so far is
 * v_i = rate_i/1000 * (min(end_i, tau) - start_i), 0 before it starts, and
 * the sodium is ntr_balance_predict() of those volumes (exact for steady
 * rates). Points are at tau = 0, step, 2*step, ... below @p duration_h, and
 * at @p duration_h itself: ceil(duration/step) + 1 points. series[0] is
 * (0, na_mmol_l). The series can go straight to ntr_correction_assess().
 *
 * @param na_mmol_l  sodium at the start, 80 to 220 mmol/L.
 * @param tbw_l      body water at the start, 0.1 to 400 L.
 * @param flows      the plan (may be NULL when @p n_flows is 0); ranges in
 *                   ntr_timed_flow.
 * @param n_flows    number of flows.
 * @param duration_h length of the prediction, above 0 and at most 720 h.
 * @param step_h     spacing of the points, 1/60 to 720 h.
 * @param[out] series   buffer for the points (may be NULL when
 *                      @p capacity is 0, to ask for the count).
 * @param capacity   number of ntr_sample the buffer holds.
 * @param[out] count points written; with NTR_ERR_CAPACITY, the number
 *                   needed (the only output written on an error).
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p count is NULL, or @p series with a capacity,
 *                           or @p flows with flows to read.
 * @retval NTR_ERR_ARG       a flow's reserved field is not 0, or @p series
 *                           (its @p capacity elements) or @p count overlaps
 *                           @p flows or each other (aliasing rule, top of
 *                           this header); checked right after the NULL
 *                           pointers.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: an input (in argument
 *                           order; each flow's fields in struct order).
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: an input
 *                           (in argument order; each flow's fields in struct
 *                           order).
 * @retval NTR_ERR_ORDER     a flow ends before it starts.
 * @retval NTR_ERR_CAPACITY  @p capacity is below the count needed.
 * @retval NTR_ERR_DOMAIN    a point leaves the model's range (as in
 *                           ntr_balance_predict()).
 *
 * References: as ntr_balance_predict().
 * Method: @ref NTR_METHOD_BALANCE_COURSE.
 */
NTR_API NTR_MUST_CHECK int ntr_balance_course(double na_mmol_l, double tbw_l,
                               const ntr_timed_flow *flows, size_t n_flows,
                               double duration_h, double step_h,
                               ntr_sample *series, size_t capacity,
                               size_t *count);

/**
 * @brief Check a fluid plan against the correction limits before giving it.
 *
 * Builds the series: the measured history, whose last sample is "now"
 * (the sodium the plan starts from, at plan time 0), followed by the
 * points of ntr_balance_course() after time 0, placed at
 * t_last + tau. It runs ntr_correction_assess() over that whole series (so
 * a rise already measured counts against the limits) and reports the first
 * predicted point whose 24 h or 48 h window rise exceeds the limit.
 * No buffer is needed; the cost is O((n_history + points) * n_flows).
 *
 * It judges rises only: a plan that lowers sodium too fast (free water in
 * hypernatraemia, or a hyponatraemia worsening) is not flagged. For
 * either direction use ntr_course_plan_check() (since 1.1), which gives
 * these same rise breach times under the same rise limits.
 *
 * @param history   measured samples, as in ntr_correction_assess(); the
 *                  last one is the sodium now.
 * @param n_history at least 1.
 * @param tbw_l     body water now, 0.1 to 400 L.
 * @param flows     the plan, as in ntr_balance_course() (times are hours
 *                  after now; may be NULL when @p n_flows is 0).
 * @param n_flows   number of flows.
 * @param duration_h how far ahead to predict, above 0 and at most 720 h.
 * @param step_h    spacing of the predicted points, 1/60 to 720 h.
 * @param lim       limits, as in ntr_correction_assess().
 * @param[out] out  the verdict; out->course.flags tells whether and which
 *                  limit is breached, breach_24h_h / breach_48h_h when.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       n_history 0, or a reserved field not 0.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_ORDER     history out of time order, or a flow ending before
 *                           it starts.
 * @retval NTR_ERR_DOMAIN    as ntr_balance_course().
 * Checks run: pointers, counts and reserved fields, history, tbw, flows,
 * duration, step, limits, time order, domain.
 *
 * References: as ntr_balance_predict() and ntr_correction_assess().
 * Methods: @ref NTR_METHOD_PLAN_CHECK, @ref NTR_METHOD_BALANCE_COURSE,
 * @ref NTR_METHOD_CORRECTION_WINDOWS.
 */
NTR_API NTR_MUST_CHECK int ntr_plan_check(const ntr_sample *history, size_t n_history,
                           double tbw_l, const ntr_timed_flow *flows,
                           size_t n_flows, double duration_h, double step_h,
                           const ntr_limits *lim, ntr_plan_result *out);

/**
 * @brief Check a fluid plan against limits in both directions (since 1.1).
 *
 * The direction-aware ntr_plan_check(): the same series (the measured
 * history, whose last sample is "now", plan time 0, then the points of
 * ntr_balance_course() after time 0 placed at t_last + tau) assessed with
 * ntr_course_assess() under @p lim, so a rise or fall already measured
 * counts against the limits. For each of the four limits it reports the
 * first predicted point whose window ending at it is over that limit (the
 * window's figure exceeds the limit by more than @ref NTR_CF_TOLERANCE,
 * as for the flags), and the earliest of those with its direction. Use it
 * for hypernatraemia (a water plan against the fall limits, for example
 * @ref NTR_COURSE_HYPER_CHRONIC), hyponatraemia (as ntr_plan_check(), and
 * a plan that lowers sodium is caught too) and holding a sodium steady
 * (@ref NTR_GOAL_HOLD). With the 1.0 limits written as course limits
 * (goal raise, the same rise limits, no fall limit) the rise breach times
 * equal ntr_plan_check()'s breach_24h_h and breach_48h_h (tested).
 * No buffer is needed; the cost is O((n_history + points) * n_flows).
 *
 * @param history   measured samples, as in ntr_course_assess(); the last
 *                  one is the sodium now.
 * @param n_history at least 1.
 * @param tbw_l     body water now, 0.1 to 400 L.
 * @param flows     the plan, as in ntr_balance_course() (times are hours
 *                  after now; may be NULL when @p n_flows is 0).
 * @param n_flows   number of flows.
 * @param duration_h how far ahead to predict, above 0 and at most 720 h.
 * @param step_h    spacing of the predicted points, 1/60 to 720 h.
 * @param lim       course limits, as in ntr_course_assess().
 * @param[in,out] out the verdict; struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p history, @p lim or @p out is NULL, or
 *                           @p flows with flows to read.
 * @retval NTR_ERR_ARG       @p n_history is 0, lim->struct_size or
 *                           out->struct_size is below the 1.1 size,
 *                           lim->goal is not an NTR_GOAL_* value, or a
 *                           flow's reserved field is not 0.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: an input: history
 *                           (each sample: hours, sodium), body water, flows
 *                           (each in struct order), duration, step, then the
 *                           limits (as in ntr_course_assess()).
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: an input:
 *                           history (each sample: hours, sodium), body water,
 *                           flows (each in struct order), duration, step, then
 *                           the limits (as in ntr_course_assess()).
 * @retval NTR_ERR_ORDER     history out of time order, or a flow ending
 *                           before it starts.
 * @retval NTR_ERR_DOMAIN    a predicted point leaves the model's range (as
 *                           in ntr_balance_course()).
 * Checks run: pointers; n_history, lim->struct_size, lim->goal,
 * out->struct_size, reserved fields; history, body water, flows, duration,
 * step, limits; time order; domain.
 *
 * References: as ntr_balance_predict() and ntr_course_assess() (Adrogue HJ,
 * Madias NE. Hypernatremia. N Engl J Med 2000;342:1493-9 for the falls).
 * Methods: @ref NTR_METHOD_PLAN_CHECK, @ref NTR_METHOD_BALANCE_COURSE,
 * @ref NTR_METHOD_COURSE_WINDOWS.
 */
NTR_API NTR_MUST_CHECK int ntr_course_plan_check(const ntr_sample *history, size_t n_history,
                                  double tbw_l, const ntr_timed_flow *flows,
                                  size_t n_flows, double duration_h,
                                  double step_h, const ntr_course_limits *lim,
                                  ntr_course_plan_result *out);

/**
 * @brief Fluid needed to bring sodium back down after overcorrection.
 *
 * Over @p hours, a fluid of sodium + potassium c_f at rate r (L/h) and
 * urine at rate u (L/h) with sodium + potassium c_u change sodium by mass
 * balance; the target is Na1 = Na0 - d. Solving
 * Na1 = (Na0*TBW0 + r*T*c_f - u*T*c_u) / (TBW0 + r*T - u*T) for r gives
 * r*T = (d*TBW0 + u*T*(Na1 - c_u)) / (Na1 - c_f).
 * With no urine this is ntr_infusate_volume_for_change() for a fall of d.
 * When the losses alone lower sodium by d or more, the result is 0 (check
 * the plan with ntr_plan_check(): it may fall further than wanted).
 * Re-lowering is usually given with desmopressin to stop the water
 * diuresis; with desmopressin, pass the urine rate expected under it.
 *
 * @param na_mmol_l        sodium now, 80 to 220 mmol/L.
 * @param tbw_l            body water now, 0.1 to 400 L.
 * @param fluid_na_mmol_l  sodium of the fluid, 0 to 1100 (5% dextrose: 0).
 * @param fluid_k_mmol_l   potassium of the fluid, 0 to 400.
 * @param lower_by_mmol_l  wanted fall d, above 0 and at most 50 (for
 *                         example ntr_correction.excess_mmol_l).
 * @param hours            time over which to give it, 1/60 to 720 h.
 * @param urine_ml_h       expected urine rate, 0 to 5000 mL/h.
 * @param urine_na_mmol_l  0 to 500 mmol/L.
 * @param urine_k_mmol_l   0 to 300 mmol/L.
 * @param[out] volume_l    volume of fluid to give over @p hours, L.
 * @param[out] rate_ml_h   the same as a rate, mL/h.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the fluid's sodium + potassium is not below the
 *                           target, the target is below 80 mmol/L, the volume
 *                           would exceed 20 L, the rate would exceed 5000 mL/h
 *                           (what a timed flow takes), or the plan's end state
 *                           is one ntr_balance_predict() refuses: body water
 *                           outside 0.1 to 400 L, or, when the losses alone
 *                           overshoot, sodium below 80. The rate and end-state
 *                           rules since 1.1.
 *
 * @warning An estimate for decision support, not an order: re-lowering
 * needs frequent measured sodium and specialist judgement.
 *
 * References: Adrogue HJ, Madias NE, N Engl J Med 2000;342:1581-9 (mass
 * balance). Sterns RH, Hix JK. Overcorrection of hyponatremia is a medical
 * emergency. Kidney Int 2009;76:587-9 (re-lowering; cited from memory).
 * Method: @ref NTR_METHOD_RELOWER.
 */
NTR_API NTR_MUST_CHECK int ntr_relower_estimate(double na_mmol_l, double tbw_l,
                                 double fluid_na_mmol_l, double fluid_k_mmol_l,
                                 double lower_by_mmol_l, double hours,
                                 double urine_ml_h, double urine_na_mmol_l,
                                 double urine_k_mmol_l, double *volume_l,
                                 double *rate_ml_h);
/** @} */

/* ======================================================================= */
/* ==== section: feedback (lib/feedback.c, docs/feedback.md) ============= */
/* ======================================================================= */

/** @defgroup feedback Urine feedback and the fitted prediction
 *  Closing the loop: measured urine turned into an electrolyte-free water
 *  balance and a re-projected course, and the patient's apparent body water
 *  and unmeasured free-water loss fitted to the measured sodium series.
 *  Everything runs on the library's mass balance (section balance); the
 *  clock of every flow and interval is hours after the first measured
 *  sample (history[0]). docs/feedback.md gives the equations, the
 *  validation and what the model ignores.
 *
 *  @warning Estimates for decision support, not orders. Verify with
 *  measured values; follow local protocols and licensed clinical judgement.
 *  @{ */

/** A measured urine collection (ABI since 1.1; layout fixed, grows only
 *  into its reserved fields). */
typedef struct ntr_urine_interval {
    double start_h;      /**< Start, 0 to 720 h after history[0]. */
    double end_h;        /**< End, at least a minute after start_h, at most 720 h. */
    double volume_ml;    /**< Volume collected, 0 to 30000 mL. */
    double na_mmol_l;    /**< Urine sodium, 0 to 500 mmol/L. */
    double k_mmol_l;     /**< Urine potassium, 0 to 300 mmol/L. */
    double osm_mosm_kg;  /**< Urine osmolality, 10 to 2000 mOsm/kg. */
    double reserved_d[2];     /**< Must be 0 (room for growth). */
    unsigned int reserved[2]; /**< Must be 0 (room for growth). */
} ntr_urine_interval;

/** @name Urine feedback flags (bits of ntr_urine_feedback_result.flags; ABI since 1.1)
 *  @{ */
/** The re-projected course passes a limit (either direction) before the horizon ends. */
#define NTR_FB_LIMIT_AHEAD 0x1u
/** "Water diuresis under way": the first breach ahead is of a rise limit
 *  and the latest urine loses electrolyte-free water (its Na + K below the
 *  serum sodium). */
#define NTR_FB_WATER_DIURESIS 0x2u
/** The latest urine is maximally dilute (osmolality 100 mOsm/kg or below). */
#define NTR_FB_DILUTE_URINE 0x4u
/** The breach is already behind "now": by the estimate, the urine measured
 *  since the last sample has carried the sodium past the limit. */
#define NTR_FB_OVER_NOW 0x8u
/** The first breach ahead is of a fall limit and the latest urine's
 *  Na + K exceeds the serum sodium (electrolyte-rich urine lowers it). */
#define NTR_FB_SALT_LOSS 0x10u
/** @} */

/**
 * @brief What ntr_urine_feedback() finds (ABI since 1.1).
 *
 * Set @c struct_size to sizeof(ntr_urine_feedback_result) before the call;
 * on success it is set to the size filled. EFW figures are mL of
 * electrolyte-free water, positive for water gained (inputs) or lost
 * (outputs). "Now" is the later of the last sample and the end of the last
 * interval.
 */
typedef struct ntr_urine_feedback_result {
    size_t struct_size;        /**< sizeof(ntr_urine_feedback_result) as the caller knows it; set on success. */
    double now_h;              /**< "Now", hours after history[0]. */
    double na_now_mmol_l;      /**< Sodium estimated now (the last sample carried forward by the balance). */
    double tbw_now_l;          /**< Body water estimated now, L. */
    double efw_in_ml;          /**< EFW of the inputs (flows with rate > 0) from the last sample to now. */
    double efw_out_ml;         /**< EFW of the measured urine and other losses (rate < 0) over the same span. */
    double efw_balance_ml;     /**< efw_in_ml - efw_out_ml (> 0 lowers the sodium, < 0 raises it). */
    double urine_ml_h;         /**< Rate of the latest interval, the rate continued over the horizon. */
    double urine_efw_ml_h;     /**< Its electrolyte-free water clearance, relative to na_now_mmol_l. */
    double input_efw_ml_h;     /**< EFW rate of the inputs running at now, relative to na_now_mmol_l. */
    double na_rate_mmol_l_h;   /**< Rate of change of sodium now from the EFW balance rate. */
    double breach_h;           /**< Hours after now of the first predicted breach (0 if already
                                    behind now), or NTR_PLAN_NO_BREACH. */
    unsigned int flags;        /**< NTR_FB_* bits. */
    unsigned int reserved;     /**< Written as 0. */
    ntr_course_plan_result plan; /**< The re-projected course checked: from the last sample to now + horizon
                                      (breach times in it are hours after the last sample). */
} ntr_urine_feedback_result;

/**
 * @brief Measured urine into an electrolyte-free water balance and a
 * re-projected course; warns when the urine would carry the sodium past a
 * limit within a horizon.
 *
 * Electrolyte-free water (EFW) of a volume V of fluid whose sodium +
 * potassium is c, at serum sodium Na: EFW = V*(1 - c/Na) (Shah & Bhave;
 * for urine it is the electrolyte-free water clearance, ntr_efwc()).
 * From the last sample (sodium Na_L, body water @p tbw_l) to now, with the
 * EFW of the inputs (flows with rate > 0) and of the outputs (the measured
 * urine, pro rata where an interval straddles the last sample, and flows
 * with rate < 0) taken relative to Na_L, and the net volume G:
 *   Na_now = Na_L - Na_L*(EFW_in - EFW_out)/(tbw_l + G),
 * which is the library's mass balance written in EFW terms (equal to
 * ntr_balance_predict() of the same volumes). The rate form at now:
 *   dNa/dt = -Na_now*(EFW rate of inputs - EFW clearance of urine)/TBW_now
 * (per hour, EFW rates in L/h).
 * The re-projection continues the latest interval's urine (rate and
 * Na + K) from now to now + @p horizon_h beside the flows, and checks the
 * whole course (the history, the estimate up to now, the projection) with
 * ntr_course_plan_check() under @p lim. Gaps between intervals count as no
 * urine.
 *
 * @param history   measured sodium, time-ordered; history[0] is the clock's origin.
 * @param n_history at least 1.
 * @param tbw_l     body water at the last sample, 0.1 to 400 L.
 * @param flows     inputs given and planned, and losses other than urine
 *                  (ranges as in ntr_timed_flow; times hours after history[0]; may
 *                  be NULL when @p n_flows is 0).
 * @param n_flows   number of flows.
 * @param urine     measured intervals, in time order, not overlapping.
 * @param n_urine   at least 1.
 * @param horizon_h how far past now to look, above 0 and at most 720 h
 *                  (for example 6 h).
 * @param step_h    spacing of the predicted points, 1/60 to 720 h.
 * @param lim       course limits, as in ntr_course_assess().
 * @param[in,out] out the result; struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer is NULL (@p flows only with flows to read).
 * @retval NTR_ERR_ARG       @p n_history or @p n_urine is 0, a struct_size
 *                           below the 1.1 size, lim->goal unknown, or a
 *                           reserved field not 0.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: an input: history,
 *                           body water, flows, intervals (each in struct
 *                           order), horizon, step, limits.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: an input:
 *                           history, body water, flows, intervals (each in
 *                           struct order), horizon, step, limits.
 * @retval NTR_ERR_ORDER     history out of time order, a flow ending before
 *                           it starts, an interval shorter than a minute or
 *                           starting before the previous one ends.
 * @retval NTR_ERR_DOMAIN    the last sample more than 720 h after the first,
 *                           the horizon ending more than 720 h after the last
 *                           sample, an interval's rate above 5000 mL/h, or a
 *                           point leaving the model's range.
 * Checks run: pointers; counts, the limits' struct_size and goal, the
 * result's struct_size, reserved fields (flows, then intervals); history,
 * body water, flows, intervals, horizon, step, limits; order (history,
 * flows, intervals); domain.
 *
 * References: Shah SR, Bhave G. Using electrolyte free water balance to
 * rationalize and treat dysnatremias. Front Med 2018;5:103 (EFW balance);
 * Spasovski G et al. Eur J Endocrinol 2014;170:G1-G47 (urine osmolality
 * 100 mOsm/kg or below: maximally dilute); mass balance as
 * ntr_balance_predict().
 * Methods: @ref NTR_METHOD_EFW_BALANCE, @ref NTR_METHOD_URINE_FEEDBACK,
 * @ref NTR_METHOD_PLAN_CHECK.
 */
NTR_API NTR_MUST_CHECK int ntr_urine_feedback(const ntr_sample *history, size_t n_history,
                               double tbw_l, const ntr_timed_flow *flows,
                               size_t n_flows, const ntr_urine_interval *urine,
                               size_t n_urine, double horizon_h, double step_h,
                               const ntr_course_limits *lim,
                               ntr_urine_feedback_result *out);

/**
 * @brief A measured urine interval as a timed loss (since 1.1).
 *
 * rate = -volume / (end - start) (mL/h), sodium and potassium the urine's,
 * over the interval's span: give the intervals to ntr_course_fit() as
 * flows so the fitted loss is what the measured urine does not explain.
 *
 * @param urine     the interval (ranges in ntr_urine_interval).
 * @param[out] flow the timed flow (reserved fields 0).
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       a reserved field not 0.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range (a member,
 *                           in struct order).
 * @retval NTR_ERR_ORDER     shorter than a minute.
 * @retval NTR_ERR_DOMAIN    rate above 5000 mL/h.
 *
 * References: mass balance as ntr_balance_course().
 * Method: @ref NTR_METHOD_URINE_FEEDBACK.
 */
NTR_API NTR_MUST_CHECK int ntr_urine_interval_flow(const ntr_urine_interval *urine,
                                    ntr_timed_flow *flow);

/** @name Fit flags (bits of ntr_fit.flags; ABI since 1.1)
 *  @{ */
#define NTR_FIT_TBW_AT_BOUND 0x1u  /**< tbw_l is at an end of its search range (guess/3 to 3*guess). */
#define NTR_FIT_LOSS_AT_BOUND 0x2u /**< free_water_loss_ml_h is at -2000 or 2000 mL/h. */
#define NTR_FIT_NOT_CONVERGED 0x4u /**< The iteration limit ended the search. */
#define NTR_FIT_EXACT 0x8u         /**< Three samples: as many as parameters, no residual left, no standard errors. */
#define NTR_FIT_DRIFT 0x10u        /**< The last three residuals average more than 1.5 mmol/L:
                                        the series is leaving the model (a rate that changed). */
/** @} */

/**
 * @brief Apparent body water and unmeasured free-water loss fitted to a
 * measured series (ABI since 1.1).
 *
 * Set @c struct_size to sizeof(ntr_fit) before the call; on success it is
 * set to the size filled. ntr_fit_reproject() reads struct_size, tbw_l and
 * free_water_loss_ml_h only, so a caller may fill those to project a plan
 * with values of its own (for example the guess and 0).
 */
typedef struct ntr_fit {
    size_t struct_size;          /**< sizeof(ntr_fit) as the caller knows it; set on success. */
    double tbw_l;                /**< Apparent body water at history[0], L. */
    double free_water_loss_ml_h; /**< Unmeasured free-water loss, mL/h (> 0 loss, < 0 gain). */
    double rms_residual_mmol_l;  /**< sqrt(mean of (measured - fitted)^2), mmol/L. */
    unsigned int flags;          /**< NTR_FIT_* bits. */
    unsigned int iterations;     /**< Iterations used, all starts together. */
    double na0_mmol_l;           /**< Fitted sodium at history[0] (the first sample is measured too). */
    double tbw_se_l;             /**< Approximate standard error of tbw_l (0 with NTR_FIT_EXACT). */
    double free_water_loss_se_ml_h; /**< The same for the loss. */
    double correlation;          /**< Correlation of the two estimates (the separability measure). */
    double tbw_last_l;           /**< Body water at the last sample by the fitted model, L. */
    double na_last_fit_mmol_l;   /**< Fitted sodium at the last sample. */
    double late_residual_mmol_l; /**< Mean of the last three residuals (measured - fitted). */
} ntr_fit;

/**
 * @brief Fit body water and an unmeasured free-water loss to the measured
 * sodium by least squares under the library's mass balance (since 1.1).
 *
 * Model at sample k, t_k = history[k].hours - history[0].hours: the flows
 * that ran by t_k (volume V_k, Na + K content S_k, as ntr_balance_course())
 * and a free-water loss L mL/h from t = 0 (a timed flow of rate -L with no
 * sodium) give, by ntr_balance_predict()'s mass balance,
 *   Na_k = (Na0*W + S_k) / (W + V_k - L*t_k/1000).
 * W (body water at history[0]), L and Na0 minimise
 * sum (measured_k - Na_k)^2. Na0 is fitted too, so the first sample's
 * error does not bias the other two. Search: Levenberg-Marquardt on the
 * three, each step clipped to the box W in [guess/3, 3*guess] (within 0.1
 * to 400 L), L in [-2000, 2000] mL/h, Na0 in [80, 220]; at most 100
 * iterations from each of two starts (the guess with no loss, and the
 * solution of the model linearised in 1/W), the better result kept.
 * Deterministic, no allocation, O(iterations * n * n_flows).
 *
 * Separability: from the normal matrix J'J at the solution (J the
 * derivatives of Na_k by Na0, W, L), scaled to unit diagonal, the
 * correlation r of the W and L estimates (from its inverse). When
 * |r| > 0.999, or the scaled matrix is singular, the data cannot tell a
 * smaller body water from a free-water loss: NTR_ERR_DOMAIN. That happens
 * without flows (the series then fixes only L/W) and under one steady
 * infusion from the first sample; a bolus, a stop or a change of rate
 * separates them. Standard errors: s*sqrt(diag((J'J)^-1)) with
 * s^2 = sum of squared residuals / (n - 3).
 *
 * @param history     measured sodium, at least 3 samples, time-ordered,
 *                    the last at most 720 h after the first.
 * @param n           number of samples.
 * @param tbw_guess_l body water guess at history[0], 0.1 to 400 L (for
 *                    example ntr_tbw_watson()); it sets the search range.
 * @param flows       the known flows (infusions, measured urine as
 *                    ntr_urine_interval_flow() gives it), times hours after
 *                    history[0]; may be NULL when @p n_flows is 0.
 * @param n_flows     number of flows.
 * @param[in,out] out the fit; struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      @p history or @p out is NULL, or @p flows with flows to read.
 * @retval NTR_ERR_ARG       @p n below 3, out->struct_size below the 1.1
 *                           size, or a flow's reserved field not 0.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite: an input: history
 *                           (each sample: hours, sodium), guess, flows (each
 *                           in struct order).
 * @retval NTR_ERR_RANGE     an input is outside its accepted range: an input:
 *                           history (each sample: hours, sodium), guess, flows
 *                           (each in struct order).
 * @retval NTR_ERR_ORDER     history out of time order, or a flow ending
 *                           before it starts.
 * @retval NTR_ERR_DOMAIN    the last sample more than 720 h after the first;
 *                           the model leaves its range at both starts; or the
 *                           data cannot separate the two (above).
 *
 * References: mass balance as ntr_balance_predict(); Levenberg K. Q Appl
 * Math 1944;2:164-8 and Marquardt DW. J Soc Ind Appl Math 1963;11:431-41
 * (the search; cited from memory). Formula predictions that fall short of
 * the measured rise, mostly through urine water (Mohmand HK et al. Clin J
 * Am Soc Nephrol 2007; from memory), are what the fitted loss captures.
 * Methods: @ref NTR_METHOD_COURSE_FIT, @ref NTR_METHOD_FIT_SEPARABILITY,
 * @ref NTR_METHOD_BALANCE_COURSE.
 */
NTR_API NTR_MUST_CHECK int ntr_course_fit(const ntr_sample *history, size_t n,
                           double tbw_guess_l, const ntr_timed_flow *flows,
                           size_t n_flows, ntr_fit *out);

/**
 * @brief Re-project the remaining plan with fitted values and check it
 * (since 1.1).
 *
 * Body water at the last sample: fit->tbw_l carried through the flows and
 * the fitted loss up to t_last = history[n-1].hours - history[0].hours.
 * From the last sample, the flows (times hours after history[0]; only what
 * runs after t_last counts) and the fitted loss as one more timed flow
 * (rate -free_water_loss_ml_h, no sodium) over @p duration_h, checked by
 * ntr_course_plan_check() with the measured history in front.
 *
 * @param history   measured sodium, time-ordered, at least 1 sample, the
 *                  last at most 720 h after the first.
 * @param n         number of samples.
 * @param fit       the fit (ntr_course_fit()): struct_size, tbw_l 0.1 to
 *                  400 L, free_water_loss_ml_h -2000 to 2000 are read.
 * @param flows     given and planned flows, as in ntr_course_fit().
 * @param n_flows   number of flows.
 * @param duration_h how far past the last sample, above 0 and at most 720 h.
 * @param step_h    spacing of the predicted points, 1/60 to 720 h.
 * @param lim       course limits, as in ntr_course_assess().
 * @param[in,out] out the verdict, as ntr_course_plan_check()'s (breach times
 *                  hours after the last sample); struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       @p n 0, a struct_size below the 1.1 size,
 *                           lim->goal unknown, a reserved field not 0.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range (history,
 *                           fit's body water and loss, flows, duration, step,
 *                           limits).
 * @retval NTR_ERR_ORDER     the series is out of time order.
 * @retval NTR_ERR_DOMAIN    the last sample more than 720 h after the first,
 *                           or a point, the body water at the last sample
 *                           included, leaving the model's range.
 *
 * References: as ntr_course_plan_check().
 * Methods: @ref NTR_METHOD_FIT_REPROJECT, @ref NTR_METHOD_PLAN_CHECK.
 */
NTR_API NTR_MUST_CHECK int ntr_fit_reproject(const ntr_sample *history, size_t n,
                              const ntr_fit *fit, const ntr_timed_flow *flows,
                              size_t n_flows, double duration_h, double step_h,
                              const ntr_course_limits *lim,
                              ntr_course_plan_result *out);
/** @} */

/* ======================================================================= */
/* ==== section: therapy (lib/therapy.c, docs/therapy.md) ================ */
/* ======================================================================= */

/** @defgroup therapy Whole-therapy helpers (since 1.1)
 *  A loop diuretic, the desmopressin clamp, vaptan monitoring, lowering a
 *  high sodium with hypotonic fluid and the symptom-driven 3% saline
 *  boluses, each predicted through the balance functions. Every result is
 *  an estimate for decision support, not an order: verify with measured
 *  values, follow local protocols and licensed clinical judgement.
 *  @{ */

/** mmol/L: urine sodium + potassium commonly assumed after a loop
 *  diuretic, about half of isotonic (common practice; no published value
 *  checked). Pass a measured value when there is one. */
#define NTR_LOOP_URINE_NA_K 75.0
/** hours: a stop hour that is never reached within 720 h (ntr_dda_clamp()). */
#define NTR_THERAPY_NEVER (-1.0)
/** mL of 3% saline per bolus for severe symptoms (Spasovski 2014; from memory). */
#define NTR_BOLUS_VOLUME_ML 150.0
/** minutes over which each bolus runs before the recheck (Spasovski 2014; from memory). */
#define NTR_BOLUS_MINUTES 20.0
/** mmol/L: the rise the boluses aim at (Spasovski 2014; from memory). */
#define NTR_BOLUS_AIM_MMOL_L 5.0
/** Most boluses ntr_bolus_plan() plans before it reports the aim out of reach. */
#define NTR_BOLUS_COUNT_MAX 10
/** hours: projection horizon while a vaptan acts (common practice). */
#define NTR_VAPTAN_HORIZON_H 6.0
/** hours: recommended interval between sodium results on a vaptan in the
 *  first day (common practice). */
#define NTR_VAPTAN_RESAMPLE_H 6.0

/** @name Vaptan cautions (ntr_vaptan_watch.cautions; ABI, since 1.1)
 *  @{ */
/** No fluid restriction during the first 24 h of a vaptan: with the
 *  water diuresis it adds, restriction risks overcorrection (tolvaptan
 *  prescribing information; from memory). Always set. */
#define NTR_VAPTAN_NO_RESTRICTION_24H 0x1u
/** Liver disease: tolvaptan is to be avoided (liver injury; US FDA drug
 *  safety communication 2013, from memory), and liver disease is a risk
 *  factor for osmotic demyelination (Verbalis 2013). */
#define NTR_VAPTAN_LIVER_DISEASE 0x2u
/** The high-risk limits (@ref NTR_COURSE_HYPO_HIGH_RISK) were chosen. */
#define NTR_VAPTAN_HIGH_RISK_LIMITS 0x4u
/** Every caution bit ntr_vaptan_watch_preset() can set. */
#define NTR_VAPTAN_CAUTION_ALL 0x7u
/** @} */

/**
 * @brief Monitoring plan while a vaptan acts (ABI since 1.1).
 *
 * Set @c struct_size to sizeof(ntr_vaptan_watch) before the call: a
 * smaller value is refused with NTR_ERR_ARG; on success it is set to the
 * size this library fills.
 */
typedef struct ntr_vaptan_watch {
    size_t struct_size;       /**< sizeof(ntr_vaptan_watch) as the caller knows it; set on success. */
    ntr_course_limits limits; /**< Course limits to watch with (goal raise). */
    double horizon_h;         /**< How far ahead to project a plan, hours. */
    double resample_h;        /**< Recommended hours between sodium results. */
    unsigned int cautions;    /**< NTR_VAPTAN_* bits. */
    unsigned int reserved;    /**< Written as 0. */
} ntr_vaptan_watch;

/**
 * @brief Sodium after a loop diuretic, with and without salt replacement.
 *
 * The urine lost after a loop diuretic is about half-isotonic
 * (@ref NTR_LOOP_URINE_NA_K, common practice), so losing it raises the
 * sodium; replacing its salt and not its water raises it further. Through
 * ntr_balance_predict():
 * na_without = balance of the flow {-U, c_u};
 * na_with = balance of {-U, c_u} and {+R, c_r}, where
 * balance = Na0 + sum v*(c - Na0) / (TBW0 + sum v).
 *
 * @param na_mmol_l          sodium before, 80 to 220 mmol/L.
 * @param tbw_l              body water before, 0.1 to 400 L.
 * @param urine_l            urine volume over the period, 0 to 30 L.
 * @param urine_na_k_mmol_l  urine sodium + potassium, 0 to 500 mmol/L
 *                           (measured, or @ref NTR_LOOP_URINE_NA_K).
 * @param replace_l          replacement fluid given, 0 to 20 L (0: none).
 * @param replace_na_mmol_l  its sodium, 0 to 1100 mmol/L (0.9%: 154).
 * @param[out] na_without_mmol_l sodium after the urine loss alone.
 * @param[out] na_with_mmol_l    sodium after the loss and the replacement.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range (inputs in
 *                           argument order).
 * @retval NTR_ERR_DOMAIN    a state ntr_balance_predict() refuses: body water
 *                           outside 0.1 to 400 L or sodium outside 80 to 220
 *                           mmol/L.
 *
 * References: mass balance of Edelman 1958 and Adrogue HJ, Madias NE,
 * N Engl J Med 2000;342:1581-9; urine composition common practice.
 * Method: @ref NTR_METHOD_LOOP_DIURETIC.
 */
NTR_API NTR_MUST_CHECK int ntr_loop_diuretic(double na_mmol_l, double tbw_l, double urine_l,
                              double urine_na_k_mmol_l, double replace_l,
                              double replace_na_mmol_l,
                              double *na_without_mmol_l,
                              double *na_with_mmol_l);

/**
 * @brief Desmopressin clamp: rise per day and the hour to stop.
 *
 * Saline at a steady rate r (L/h, concentration c_s) with the urine held
 * low by desmopressin (rate u, cation c_u). The rise over 24 h is
 * ntr_balance_course() of the two flows. The stop hour is the same mass
 * balance, Na(t) = Na0 + t*A / (TBW0 + t*B) with A = r*(c_s - Na0) -
 * u*(c_u - Na0) and B = r - u, solved for Na(t) = Na0 + d:
 * t = d*TBW0 / (A - d*B); @ref NTR_THERAPY_NEVER when A - d*B <= 0 or
 * t > 720 h. Pass d = the target rise, or the 24 h limit to learn when the
 * infusion must stop at the latest.
 *
 * @param na_mmol_l          sodium now, 80 to 220 mmol/L.
 * @param tbw_l              body water now, 0.1 to 400 L.
 * @param saline_ml_h        saline rate, 0 to 5000 mL/h.
 * @param saline_na_mmol_l   saline sodium, 0 to 1100 mmol/L (3%: 513).
 * @param urine_ml_h         expected urine rate under desmopressin, 0 to 5000 mL/h.
 * @param urine_na_k_mmol_l  urine sodium + potassium, 0 to 500 mmol/L.
 * @param stop_rise_mmol_l   rise d at which to stop, above 0 and at most 50.
 * @param[out] rise_24h_mmol_l predicted change over 24 h (negative if it falls).
 * @param[out] stop_h          hours until the rise reaches d (0 to 720), or
 *                             NTR_THERAPY_NEVER.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    the 24 h course or the state at the stop hour
 *                           leaves the model's range, as in
 *                           ntr_balance_course().
 *
 * References: mass balance as ntr_balance_course(); the clamp as described
 * by Sood L, Sterns RH, Hix JK, Silver SM, Chen L. Am J Kidney Dis
 * 2013;61:571-8 (from memory).
 * Method: @ref NTR_METHOD_DDAVP_CLAMP.
 */
NTR_API NTR_MUST_CHECK int ntr_dda_clamp(double na_mmol_l, double tbw_l, double saline_ml_h,
                          double saline_na_mmol_l, double urine_ml_h,
                          double urine_na_k_mmol_l, double stop_rise_mmol_l,
                          double *rise_24h_mmol_l, double *stop_h);

/**
 * @brief Re-lowering after a breach, aimed at or below the limit.
 *
 * Lowers by d = excess + margin with 5% dextrose (ntr_fluid_preset())
 * through ntr_relower_estimate() (potassium of the urine counted in
 * @p urine_na_k_mmol_l). Pass ntr_course_report.excess_mmol_l as the
 * excess; a margin of 0 aims at the limit, a margin above 0 that much
 * below it. An excess of 0 (no window over) gives 0 volume and rate,
 * whatever the margin.
 *
 * @param na_mmol_l          sodium now, 80 to 220 mmol/L.
 * @param tbw_l              body water now, 0.1 to 400 L.
 * @param excess_mmol_l      ntr_course_report.excess_mmol_l, 0 to 50.
 * @param margin_mmol_l      how far below the limit to aim, 0 to 10 mmol/L.
 * @param hours              time over which to give it, 1/60 to 720 h.
 * @param urine_ml_h         expected urine rate (under desmopressin), 0 to 5000 mL/h.
 * @param urine_na_k_mmol_l  urine sodium + potassium, 0 to 500 mmol/L.
 * @param[out] volume_l      5% dextrose to give over @p hours, L.
 * @param[out] rate_ml_h     the same as a rate, mL/h.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    excess + margin above 50, or as
 *                           ntr_relower_estimate().
 *
 * References: as ntr_relower_estimate(); Sterns RH, Hix JK, Kidney Int
 * 2009;76:587-9 (cited from memory).
 * Methods: @ref NTR_METHOD_DDAVP_RELOWER, @ref NTR_METHOD_RELOWER.
 */
NTR_API NTR_MUST_CHECK int ntr_dda_relower(double na_mmol_l, double tbw_l,
                            double excess_mmol_l, double margin_mmol_l,
                            double hours, double urine_ml_h,
                            double urine_na_k_mmol_l, double *volume_l,
                            double *rate_ml_h);

/**
 * @brief Limits, projection horizon, resample interval and cautions while a
 *        vaptan acts.
 *
 * Limits: @ref NTR_COURSE_HYPO_HIGH_RISK when @p high_risk or
 * @p liver_disease (liver disease is a risk factor for osmotic
 * demyelination), else @ref NTR_COURSE_HYPO_STANDARD. Horizon
 * @ref NTR_VAPTAN_HORIZON_H and resample @ref NTR_VAPTAN_RESAMPLE_H (6 h
 * each, common practice: a vaptan's water diuresis can move the sodium
 * within hours). Cautions: @ref NTR_VAPTAN_NO_RESTRICTION_24H always,
 * @ref NTR_VAPTAN_LIVER_DISEASE, @ref NTR_VAPTAN_HIGH_RISK_LIMITS.
 *
 * @param high_risk     1 when risk factors for osmotic demyelination are
 *                      present (ntr_ods_risk()), else 0.
 * @param liver_disease 1 with liver disease, else 0.
 * @param[in,out] out   the plan; struct_size set by the caller.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL (@p out).
 * @retval NTR_ERR_ARG       a flag not 0 or 1, or out->struct_size too small.
 *
 * References: Verbalis JG et al., Am J Med 2013;126(10 Suppl 1):S1-42
 * (limits, risk factors); tolvaptan prescribing information and US FDA
 * drug safety communication 2013 (no restriction in the first 24 h; liver
 * injury; from memory).
 * Method: @ref NTR_METHOD_VAPTAN_WATCH.
 */
NTR_API NTR_MUST_CHECK int ntr_vaptan_watch_preset(int high_risk, int liver_disease,
                                    ntr_vaptan_watch *out);

/**
 * @brief Rate of a hypotonic fluid that lowers a high sodium by a wanted
 *        fall, counting urine and insensible losses, checked against the
 *        fall limits.
 *
 * With fluid (c_f from ntr_fluid_preset()), urine u (cation c_u) and
 * insensible loss i (cation 0) over T hours, the rate solves the mass
 * balance for Na(T) = Na0 - d (ntr_relower_estimate(), with the two losses
 * pooled: rate u + i, cation u*c_u/(u + i)):
 * V = (d*TBW0 + L*(Na1 - c_L)) / (Na1 - c_f), L = (u + i)*T; 0 when the
 * losses alone lower the sodium that far. The plan (fluid, urine,
 * insensible) is then checked with ntr_course_plan_check() under the
 * preset's fall limit; @p first_breach_h is its breach_fall_24h_h.
 *
 * @param na_mmol_l          sodium now, 80 to 220 mmol/L.
 * @param tbw_l              body water now, 0.1 to 400 L.
 * @param fluid              NTR_FLUID_* (5% dextrose, 0.45% saline, ...).
 * @param limits_preset      @ref NTR_COURSE_HYPER_CHRONIC or @ref NTR_COURSE_HYPER_ACUTE.
 * @param fall_mmol_l        wanted fall d, above 0 and at most 50.
 * @param hours              span T, 1/60 to 720 h.
 * @param urine_ml_h         urine rate, 0 to 5000 mL/h.
 * @param urine_na_k_mmol_l  urine sodium + potassium, 0 to 500 mmol/L.
 * @param insensible_ml_h    insensible water loss, 0 to 500 mL/h.
 * @param[out] rate_ml_h       fluid rate, mL/h.
 * @param[out] volume_l        fluid volume over @p hours, L.
 * @param[out] first_breach_h  hours until the plan passes the 24 h fall
 *                             limit, or @ref NTR_PLAN_NO_BREACH.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_ARG       unknown fluid, or a preset other than the two.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range (inputs in
 *                           argument order).
 * @retval NTR_ERR_DOMAIN    urine + insensible above 5000 mL/h; the fluid not
 *                           below the target; or as ntr_relower_estimate() and
 *                           ntr_course_plan_check().
 *
 * References: Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med
 * 2000;342:1493-9 (the fluids, counting ongoing losses, the pace).
 * Methods: @ref NTR_METHOD_HYPER_LOWER, @ref NTR_METHOD_RELOWER,
 * @ref NTR_METHOD_PLAN_CHECK.
 */
NTR_API NTR_MUST_CHECK int ntr_hyper_lower_plan(double na_mmol_l, double tbw_l, int fluid,
                                 int limits_preset, double fall_mmol_l,
                                 double hours, double urine_ml_h,
                                 double urine_na_k_mmol_l,
                                 double insensible_ml_h, double *rate_ml_h,
                                 double *volume_l, double *first_breach_h);

/**
 * @brief Number of 3% saline boluses for severe symptoms, held within a
 *        limit.
 *
 * The European guideline for severe symptoms: 150 mL of 3% saline over
 * 20 min, recheck, repeat, until the sodium has risen by about 5 mmol/L
 * (@ref NTR_BOLUS_VOLUME_ML, @ref NTR_BOLUS_MINUTES,
 * @ref NTR_BOLUS_AIM_MMOL_L; from memory). The rise after k boluses is
 * ntr_balance_predict() of k*0.15 L of 513 mmol/L (urine ignored). The
 * plan is the smallest k whose rise reaches @p aim_rise_mmol_l; if a bolus
 * would pass @p max_rise_mmol_l the plan stops before it and
 * @p held_by_limit is 1. Each bolus takes @ref NTR_BOLUS_MINUTES.
 *
 * @param na_mmol_l         sodium now, 80 to 220 mmol/L.
 * @param tbw_l             body water, 0.1 to 400 L.
 * @param aim_rise_mmol_l   rise aimed at, above 0 and at most 50 (guideline: 5).
 * @param max_rise_mmol_l   rise not to pass (the 24 h limit), above 0 and at most 50.
 * @param[out] boluses        boluses planned, 1 to @ref NTR_BOLUS_COUNT_MAX.
 * @param[out] rise_mmol_l    predicted rise after them.
 * @param[out] held_by_limit  1 when the limit stopped the plan short of the aim, else 0.
 * @retval NTR_OK            success; the outputs were written.
 * @retval NTR_ERR_NULL      a pointer argument is NULL.
 * @retval NTR_ERR_NONFINITE an input is NaN or infinite.
 * @retval NTR_ERR_RANGE     an input is outside its accepted range.
 * @retval NTR_ERR_DOMAIN    aim above the limit; one bolus already passes the
 *                           limit; the aim not reached within
 *                           NTR_BOLUS_COUNT_MAX boluses; or a state
 *                           ntr_balance_predict() refuses.
 *
 * References: Spasovski G et al. Eur J Endocrinol 2014;170:G1-G47
 * (bolus regimen, from memory); mass balance as ntr_balance_predict().
 * Methods: @ref NTR_METHOD_BOLUS_PLAN, @ref NTR_METHOD_BALANCE_MASS.
 */
NTR_API NTR_MUST_CHECK int ntr_bolus_plan(double na_mmol_l, double tbw_l,
                           double aim_rise_mmol_l, double max_rise_mmol_l,
                           int *boluses, double *rise_mmol_l,
                           int *held_by_limit);
/** @} */

/* ======================================================================= */
/* ==== section: batch correction (lib/batch.c, docs/batch.md) =========== */
/* ======================================================================= */

/** @addtogroup batch
 *  The correction assessment of many series in one call. It needs the
 *  types of the correction section, hence its own section after it; the
 *  conventions are those of the batch section, with "row" read as "group".
 *  @{ */

/**
 * @brief Assess many sodium series at once (one per patient), CSR style.
 *
 * Rises only, as ntr_correction_assess(); for falls as well use
 * ntr_batch_course_assess() (since 1.1).
 *
 * Group g is the series samples[offsets[g]] to samples[offsets[g+1] - 1];
 * out[g] and status[g] are exactly what ntr_correction_assess() returns for
 * it (see that function for the equations, flags and per-series checks).
 * A group whose status is not NTR_OK gets NaN in every double member of
 * out[g] and 0 in flags and reserved. An empty group (offsets[g] ==
 * offsets[g+1]) gets @ref NTR_ERR_ARG, as n == 0 does in the scalar call.
 *
 * @param groups     number of series.
 * @param offsets    groups + 1 indices into @p samples, non-decreasing, the
 *                   last at most @p n_samples (offsets[0] need not be 0).
 * @param samples    all series back to back, each in non-decreasing time;
 *                   hours -1e6 to 1e6, sodium 80 to 220 mmol/L.
 * @param n_samples  number of elements of @p samples (a bound for offsets).
 * @param lim        limits for every series, as in ntr_correction_assess().
 * @param[out] out     @p groups assessments.
 * @param[out] status  @p groups statuses: NTR_OK, NTR_ERR_ARG (empty group),
 *                     NTR_ERR_NONFINITE, NTR_ERR_RANGE (a sample or the
 *                     limits), NTR_ERR_ORDER.
 * @param[out] failed  optional (may be NULL): number of failed groups.
 * @return NTR_OK; NTR_ERR_NULL (a required pointer is NULL, checked even
 *         when @p groups is 0); NTR_ERR_ARG (offsets decrease or pass
 *         @p n_samples, or @p out or @p status overlaps an input or each
 *         other: nothing is written); otherwise the status of the first
 *         failed group.
 *
 * Cost: linear in the number of samples; no allocation.
 *
 * References: as ntr_correction_assess() (Verbalis JG et al., Am J Med
 * 2013; Spasovski G et al., Eur J Endocrinol 2014).
 * Methods: @ref NTR_METHOD_CORRECTION_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_correction_assess(size_t groups, const size_t *offsets,
                                        const ntr_sample *samples,
                                        size_t n_samples, const ntr_limits *lim,
                                        ntr_correction *out, int *status,
                                        size_t *failed);

/**
 * @brief Assess many sodium series at once against course limits, CSR
 *        style (since 1.1).
 *
 * The direction-aware ntr_batch_correction_assess(). Group g is the series
 * samples[offsets[g]] to samples[offsets[g+1] - 1]; its report and
 * status[g] are exactly what ntr_course_assess() returns for it (see that
 * function for the equations, flags and per-series checks). A group whose
 * status is not NTR_OK gets NaN in every double member of its report, 0 in
 * flags and reserved. An empty group gets @ref NTR_ERR_ARG, as n == 0 does
 * in the scalar call; limits that the scalar call refuses (struct_size,
 * goal, values) fail every group with that status.
 *
 * Reports are written @p report_size bytes apart: pass
 * sizeof(ntr_course_report). A caller built against a later header with a
 * larger report passes its own size, and the array is then still walked
 * correctly; each written report has struct_size set to the size this
 * library fills (the 1.1 size), as in ntr_course_assess().
 *
 * @param groups      number of series.
 * @param offsets     groups + 1 indices into @p samples, non-decreasing, the
 *                    last at most @p n_samples (offsets[0] need not be 0).
 * @param samples     all series back to back, each in non-decreasing time;
 *                    hours -1e6 to 1e6, sodium 80 to 220 mmol/L.
 * @param n_samples   number of elements of @p samples (a bound for offsets).
 * @param lim         limits for every series, as in ntr_course_assess().
 * @param report_size bytes from one report to the next: at least the 1.1
 *                    sizeof(ntr_course_report) and a multiple of its
 *                    alignment.
 * @param[out] out     @p groups reports, @p report_size bytes apart.
 * @param[out] status  @p groups statuses: NTR_OK, NTR_ERR_ARG (empty group,
 *                     or the limits' struct_size or goal), NTR_ERR_NONFINITE,
 *                     NTR_ERR_RANGE (a sample or the limits), NTR_ERR_ORDER.
 * @param[out] failed  optional (may be NULL): number of failed groups.
 * @return NTR_OK; NTR_ERR_NULL (a required pointer is NULL, checked even
 *         when @p groups is 0); NTR_ERR_ARG (@p report_size too small or
 *         misaligned, or offsets decrease or pass @p n_samples, or @p out
 *         or @p status overlaps an input or each other: nothing is
 *         written); otherwise the status of the first failed group.
 *
 * Cost: linear in the number of samples; no allocation.
 *
 * References: as ntr_course_assess().
 * Methods: @ref NTR_METHOD_COURSE_WINDOWS, @ref NTR_METHOD_CORRECTION_TREND,
 * @ref NTR_METHOD_RULE_OF_SIXES, @ref NTR_METHOD_COURSE_WRONG_WAY.
 */
NTR_API NTR_MUST_CHECK int ntr_batch_course_assess(size_t groups, const size_t *offsets,
                                    const ntr_sample *samples,
                                    size_t n_samples,
                                    const ntr_course_limits *lim,
                                    size_t report_size, ntr_course_report *out,
                                    int *status, size_t *failed);
/** @} */

/* ======================================================================= */
/* ==== section: methods (provenance ids; lib/methods.c, docs/methods.md)  */
/* ======================================================================= */

/** @defgroup methods Method identifiers
 *  Every published method the library uses has an id (ABI). Ids 1-29 are
 *  the core formulas, 30-49 correction and balance, 50-69 the work-up,
 *  70-89 the therapy areas of issue P2 (70-74 solute and restriction,
 *  75-82 therapy, 83-89 urine feedback and the fit).
 *  @{ */
#define NTR_METHOD_UNIT_CONVERSION 1       /**< unit conversion by molar mass (IUPAC, UCUM) */
#define NTR_METHOD_OSM_2NA 2               /**< calculated osmolality, 2*Na formula */
#define NTR_METHOD_OSM_DORWART_CHALMERS 3  /**< calculated osmolality, Dorwart-Chalmers 1975 */
#define NTR_METHOD_OSM_EFFECTIVE 4         /**< effective osmolality (tonicity), 2*Na + glucose */
#define NTR_METHOD_OSM_GAP 5               /**< osmolal gap, measured minus calculated */
#define NTR_METHOD_GLUCOSE_KATZ 6          /**< glucose-corrected sodium, Katz 1973 (1.6) */
#define NTR_METHOD_GLUCOSE_HILLIER 7       /**< glucose-corrected sodium, Hillier 1999 (2.4) */
#define NTR_METHOD_GLUCOSE_FACTOR 8        /**< glucose-corrected sodium, caller's factor */
#define NTR_METHOD_NA_DEFICIT 9            /**< sodium deficit, TBW*(target - Na) */
#define NTR_METHOD_TBW_FRACTION 10         /**< body water as a fraction of weight (Adrogue-Madias) */
#define NTR_METHOD_TBW_WATSON 11           /**< Watson anthropometric body water (adults) */
#define NTR_METHOD_FREE_WATER_DEFICIT 12   /**< free-water deficit, TBW*(Na/140 - 1) */
#define NTR_METHOD_FLUID_PRESETS 13        /**< sodium and potassium of common infusates */
#define NTR_METHOD_ADROGUE_MADIAS 14       /**< Adrogue-Madias change per litre of infusate */
#define NTR_METHOD_INFUSATE_MASS_BALANCE 15 /**< infusate effect for any volume by mass balance */
#define NTR_METHOD_INFUSATE_VOLUME 16      /**< infusate volume for a wanted change */
#define NTR_METHOD_FURST 17                /**< Furst urine/serum electrolyte ratio and restriction bands */
#define NTR_METHOD_EFWC 18                 /**< electrolyte-free water clearance */
#define NTR_METHOD_LOINC_MAP 19            /**< LOINC code to analyte, specimen and unit (since 1.1) */
#define NTR_METHOD_GLUCOSE_UNIT_CHECK 20   /**< glucose unit against sodium and measured osmolality (since 1.1) */
/* Correction and balance (ids 30-49, issue P2; lib/correction.c, lib/balance.c). */
#define NTR_METHOD_LIMITS_STANDARD 30      /**< 10/24 h, 18/48 h, at least 4/24 h */
#define NTR_METHOD_LIMITS_HIGH_RISK 31     /**< 8/24 h, 16/48 h, at least 4/24 h */
#define NTR_METHOD_ODS_RISK 32             /**< risk factors for osmotic demyelination */
#define NTR_METHOD_CORRECTION_WINDOWS 33   /**< largest rise within 24 h and 48 h windows */
#define NTR_METHOD_CORRECTION_TREND 34     /**< near-limit and projected-over flags */
#define NTR_METHOD_RULE_OF_SIXES 35        /**< 6 mmol/L within 6 h: stop point */
#define NTR_METHOD_BALANCE_MASS 36         /**< Edelman-based mass balance of flows */
#define NTR_METHOD_BALANCE_COURSE 37       /**< time course under steady rates */
#define NTR_METHOD_PLAN_CHECK 38           /**< predicted course against the limits */
#define NTR_METHOD_RELOWER 39              /**< fluid to re-lower after overcorrection */
#define NTR_METHOD_COURSE_HYPER_CHRONIC 40 /**< falls at most 10/24 h in chronic hypernatraemia */
#define NTR_METHOD_COURSE_HYPER_ACUTE 41   /**< falls at most 24/24 h (1/h) in hours-old hypernatraemia */
#define NTR_METHOD_COURSE_HOLD 42          /**< hold: rises and falls at most 4/24 h */
#define NTR_METHOD_COURSE_WINDOWS 43       /**< largest rise and fall within 24 h and 48 h windows */
#define NTR_METHOD_COURSE_WRONG_WAY 44     /**< moved against the goal beyond analytical error */
#define NTR_METHOD_COURSE_WATCH 45         /**< streaming watcher with bounded memory (upper bounds) */
/* Work-up (ids 50-69, issue P3; lib/workup.c). */
#define NTR_METHOD_NA_SEVERITY 50          /**< severity bands of a low sodium */
#define NTR_METHOD_TONICITY_CLASS 51       /**< hypo-, iso-, hypertonic by measured osmolality */
#define NTR_METHOD_LOW_NA_TONICITY 52      /**< pseudo- or translocational low sodium */
#define NTR_METHOD_URINE_DILUTE 53         /**< urine osmolality <= 100: maximally dilute */
#define NTR_METHOD_URINE_NA_HIGH 54        /**< urine sodium > 30 mmol/L */
#define NTR_METHOD_FRACTIONAL_EXCRETION 55 /**< fractional excretion of a solute */
#define NTR_METHOD_SIAD_CRITERIA 56        /**< essential and supplemental SIAD criteria */
#define NTR_METHOD_EFFECTIVE_OSM_MEASURED 57 /**< measured osmolality less urea and 1.25*ethanol, floored at 2*Na + glucose */
#define NTR_METHOD_LOW_NA_EFFECTIVE_TONICITY 58 /**< low-sodium flags judged on the effective osmolality */
#define NTR_METHOD_FE_URIC_ACID_CLASS 59 /**< fractional uric acid excretion: against SIAD < 8 %, supports > 12 % */
#define NTR_METHOD_FE_URIC_ACID_AFTER_CORRECTION 60 /**< fractional uric acid excretion after correction: normalised or persistently high */
/* Therapy (ids 70-89, issue P2); solute and restriction (lib/solute.c). */
#define NTR_METHOD_SOLUTE_URINE_VOLUME 70  /**< urine volume = solute / urine osmolality (Berl 2008) */
#define NTR_METHOD_FLUID_ALLOWANCE 71      /**< most fluid per day that holds the sodium: EFWC + insensible */
#define NTR_METHOD_SOLUTE_DOSE 72          /**< osmoles of a dose of urea or NaCl (IUPAC molar masses) */
#define NTR_METHOD_SOLUTE_FOR_ALLOWANCE 73 /**< allowance with a solute dose, and the dose for an allowance */
#define NTR_METHOD_RESTRICTION_OUTLOOK 74  /**< will restriction, with or without solute, hold the sodium */
/* Urine feedback and the fitted prediction (ids 83-89, issue P2; lib/feedback.c). */
#define NTR_METHOD_EFW_BALANCE 83          /**< electrolyte-free water balance of inputs and outputs */
#define NTR_METHOD_URINE_FEEDBACK 84       /**< measured urine continued: limit within a horizon */
#define NTR_METHOD_COURSE_FIT 85           /**< least-squares fit of body water and free-water loss */
#define NTR_METHOD_FIT_SEPARABILITY 86     /**< correlation test: can the data tell the two apart */
#define NTR_METHOD_FIT_REPROJECT 87        /**< remaining plan re-projected with fitted values */
/* Therapy (ids 75-82, issue P2; lib/therapy.c). */
#define NTR_METHOD_LOOP_DIURETIC 75        /**< loop diuretic: half-isotonic urine lost, with or without salt */
#define NTR_METHOD_DDAVP_CLAMP 76          /**< desmopressin clamp: rise per day and stop hour */
#define NTR_METHOD_DDAVP_RELOWER 77        /**< re-lowering by the excess over the limit plus a margin */
#define NTR_METHOD_VAPTAN_WATCH 78         /**< vaptan monitoring: limits, horizon, resample, cautions */
#define NTR_METHOD_HYPER_LOWER 79          /**< hypotonic fluid rate to lower a high sodium, losses counted */
#define NTR_METHOD_BOLUS_PLAN 80           /**< 3% saline boluses for severe symptoms */
/** @} */

#ifdef __cplusplus
}
#endif

#endif /* NATREMIA_H */
