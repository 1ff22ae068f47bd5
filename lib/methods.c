/* SPDX-License-Identifier: MIT */
/* Provenance: name, equation, reference and population of every method id
 * (docs/methods.md).
 *
 * One switch holds the descriptions: ntr_method_info() reads it. Beside it,
 * method_runs lists the same ids as runs of consecutive ids for
 * ntr_method_next(), so adding a method means adding one case in the block
 * of its area and extending (or adding) its run; the method tests fail
 * until the two agree. The strings are literals (read-only data, no
 * relocated pointer table), and no state is kept. */
#include "ntr_internal.h"

static int entry(struct ntr_method_info *info, int method, const char *name,
                 const char *equation, const char *reference,
                 const char *population)
{
    int i;
    info->method = method;
    info->reserved_int = 0;
    info->name = name;
    info->equation = equation;
    info->reference = reference;
    info->population = population;
    for (i = 0; i < 4; i++) {
        info->reserved[i] = NULL;
    }
    return NTR_OK;
}

/* Shared reference strings, so the same paper is cited the same way. */
#define REF_SPASOVSKI                                                        \
    "Spasovski G, Vanholder R, Allolio B, et al. Clinical practice "         \
    "guideline on diagnosis and treatment of hyponatraemia. Eur J "          \
    "Endocrinol 2014;170(3):G1-G47"
#define REF_ADROGUE_MADIAS_HYPO                                              \
    "Adrogue HJ, Madias NE. Hyponatremia. N Engl J Med 2000;342:1581-9"
#define REF_OSTER_SINGER                                                     \
    "Oster JR, Singer I. Arch Intern Med 1999;159:333-6"
#define REF_MILIONIS                                                         \
    "Milionis HJ et al. CMAJ 2002;166:1056-62"
#define REF_KATZ                                                             \
    "Katz MA. Hyperglycemia-induced hyponatremia: calculation of expected "  \
    "serum sodium depression. N Engl J Med 1973;289:843-4"
#define REF_HILLIER                                                          \
    "Hillier TA, Abbott RD, Barrett EJ. Hyponatremia: evaluating the "       \
    "correction factor for hyperglycemia. Am J Med 1999;106:399-403"
#define REF_FURST                                                            \
    "Furst H, Hallows KR, Post J, et al. The urine/plasma electrolyte "      \
    "ratio: a predictive guide to water restriction. Am J Med Sci "          \
    "2000;319:240-4"
#define REF_FENSKE                                                           \
    "Fenske W et al. J Clin Endocrinol Metab 2008;93:2991-7"
#define REF_BERL                                                             \
    "Berl T. Impact of solute intake on urine flow and water excretion. "    \
    "J Am Soc Nephrol 2008;19:1076-8"
#define REF_VERBALIS_2013                                                    \
    "Verbalis JG, Goldsmith SR, Greenberg A, et al. Diagnosis, evaluation, " \
    "and treatment of hyponatremia: expert panel recommendations. Am J Med " \
    "2013;126(10 Suppl 1):S1-S42"

static int describe(int method, struct ntr_method_info *info)
{
    switch (method) {

    /* ==== core formulas (ids 1-29, issue P1) ============================ */
    case NTR_METHOD_UNIT_CONVERSION:
        return entry(info, method, "Unit conversion by molar mass",
            "out = value * f(from) / f(to); f = 1 for mmol/L and meq/L, "
            "0.001 for umol/L, 10/M for mg/dL, 1000/M for g/L; M = molar mass "
            "(g/mol) from IUPAC standard atomic weights",
            "IUPAC Commission on Isotopic Abundances and Atomic Weights, "
            "standard atomic weights; The Unified Code for Units of Measure "
            "(UCUM), Regenstrief Institute",
            "any");
    case NTR_METHOD_OSM_2NA:
        return entry(info, method, "Calculated serum osmolality (2 Na)",
            "Osm = 2*Na + glucose + urea + ethanol (mmol/L; mOsm/kg)",
            "Conventional bedside formula (common practice), as compared in "
            "Dorwart WV, Chalmers L. Comparison of methods for calculating "
            "serum osmolality from chemical concentrations. Clin Chem "
            "1975;21:190-4",
            "any");
    case NTR_METHOD_OSM_DORWART_CHALMERS:
        return entry(info, method, "Calculated serum osmolality (Dorwart-Chalmers)",
            "Osm = 1.86*Na + glucose + urea + 9 + ethanol (mmol/L; mOsm/kg)",
            "Dorwart WV, Chalmers L. Comparison of methods for calculating "
            "serum osmolality from chemical concentrations. Clin Chem "
            "1975;21:190-4",
            "any (regression on hospital patients' sera)");
    case NTR_METHOD_OSM_EFFECTIVE:
        return entry(info, method, "Effective serum osmolality (tonicity)",
            "Osm_eff = 2*Na + glucose (mmol/L; mOsm/kg); urea is left out as "
            "it crosses cell membranes",
            REF_SPASOVSKI,
            "any");
    case NTR_METHOD_OSM_GAP:
        return entry(info, method, "Osmolal gap",
            "gap = measured - calculated osmolality (mOsm/kg); above about 10 "
            "suggests unmeasured osmoles",
            "Textbook definition; the threshold of about 10 mOsm/kg is "
            "common practice",
            "any");
    case NTR_METHOD_GLUCOSE_KATZ:
        return entry(info, method, "Glucose-corrected sodium (Katz)",
            "G = glucose_mmol_l * 18.0156 (mg/dL); Na_corr = Na + 1.6*(G - 100)/100 "
            "when G > 100, else Na",
            REF_KATZ,
            "hyperglycaemia (theoretical derivation)");
    case NTR_METHOD_GLUCOSE_HILLIER:
        return entry(info, method, "Glucose-corrected sodium (Hillier)",
            "G = glucose_mmol_l * 18.0156 (mg/dL); Na_corr = Na + 2.4*(G - 100)/100 "
            "when G > 100, else Na",
            REF_HILLIER,
            "hyperglycaemia (derived in healthy adult volunteers)");
    case NTR_METHOD_GLUCOSE_FACTOR:
        return entry(info, method, "Glucose-corrected sodium (caller's factor)",
            "G = glucose_mmol_l * 18.0156 (mg/dL); Na_corr = Na + factor*(G - 100)/100 "
            "when G > 100, else Na",
            REF_KATZ "; " REF_HILLIER,
            "hyperglycaemia");
    case NTR_METHOD_NA_DEFICIT:
        return entry(info, method, "Sodium deficit",
            "deficit (mmol) = TBW * (target Na - Na)",
            "Common practice (sodium-deficit formula of general medical texts)",
            "low serum sodium; ignores ongoing losses and the water the sodium "
            "is given in, so a saline dosed by it falls short of the target");
    case NTR_METHOD_TBW_FRACTION:
        return entry(info, method, "Total body water as a fraction of weight",
            "TBW = f * weight; f = 0.6 children (1 to < 18 y), 0.6 men, 0.5 "
            "women, 0.5 men >= 65 y, 0.45 women >= 65 y",
            REF_ADROGUE_MADIAS_HYPO,
            "children from 1 year and adults; infants under 1 year refused");
    case NTR_METHOD_TBW_WATSON:
        return entry(info, method, "Watson total body water",
            "men: TBW = 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight; "
            "women: TBW = -2.097 + 0.1069*height + 0.2466*weight "
            "(years, cm, kg, L)",
            "Watson PE, Watson ID, Batt RD. Total body water volumes for adult "
            "males and females estimated from simple anthropometric "
            "measurements. Am J Clin Nutr 1980;33:27-39",
            "adults (18 years and over); a result outside 20% to 80% of the "
            "weight, or below 0.1 L, is refused");
    case NTR_METHOD_FREE_WATER_DEFICIT:
        return entry(info, method, "Free-water deficit",
            "deficit (L) = TBW * (Na/140 - 1)",
            "Textbook water-deficit formula (common practice); infusate choice "
            "per Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med "
            "2000;342:1493-9",
            "high serum sodium (140 mmol/L or more)");
    case NTR_METHOD_FLUID_PRESETS:
        return entry(info, method, "Infusate composition table",
            "Na (mmol/L): 0.9% NaCl 154, 3% NaCl 513, 5% NaCl 855, 0.45% NaCl "
            "77, Ringer's lactate 130 (K 4), 5% dextrose 0, 0.2% NaCl in 5% "
            "dextrose 34",
            REF_ADROGUE_MADIAS_HYPO " (table of infusates)",
            "any");
    case NTR_METHOD_ADROGUE_MADIAS:
        return entry(info, method, "Adrogue-Madias change per litre",
            "delta Na = (Na_inf + K_inf - Na) / (TBW + 1)",
            REF_ADROGUE_MADIAS_HYPO,
            "any (body water estimated separately)");
    case NTR_METHOD_INFUSATE_MASS_BALANCE:
        return entry(info, method, "Infusate effect by mass balance",
            "delta Na = V * (Na_inf + K_inf - Na) / (TBW + V); equals the "
            "Adrogue-Madias formula at V = 1 L",
            "Derived from the mass balance of " REF_ADROGUE_MADIAS_HYPO
            "; the same forward step checks the dose in the worked example of "
            REF_FURST,
            "any (body water estimated separately; no losses)");
    case NTR_METHOD_INFUSATE_VOLUME:
        return entry(info, method, "Infusate volume for a wanted change",
            "V = delta * TBW / (Na_inf + K_inf - Na - delta)",
            "Exact inverse of the mass balance of " REF_ADROGUE_MADIAS_HYPO
            " (counts the water given, unlike the sodium-deficit step)",
            "any (body water estimated separately; no losses)");
    case NTR_METHOD_FURST:
        return entry(info, method, "Furst urine/serum electrolyte ratio",
            "ratio = (U_Na + U_K) / S_Na; < 0.9: under 1 L/day; 0.9 to 1.0: "
            "500-700 mL/day; > 1.0: under 500 mL/day, restriction alone likely "
            "to fail (the 0.9 edge is the library's own choice)",
            REF_FURST "; " REF_VERBALIS_2013,
            "adults with hyponatraemia from inappropriate antidiuresis");
    case NTR_METHOD_EFWC:
        return entry(info, method, "Electrolyte-free water clearance",
            "EFWC = V * (1 - (U_Na + U_K) / S_Na)",
            "Standard renal physiology, e.g. Rose BD, Post TW. Clinical "
            "Physiology of Acid-Base and Electrolyte Disorders, 5th ed. "
            "McGraw-Hill 2001",
            "any");
    case NTR_METHOD_LOINC_MAP:
        return entry(info, method, "LOINC code to analyte, specimen and unit",
            "table lookup of checked codes; unit from the code's property: "
            "moles/volume -> mmol/L, mass/volume -> mg/dL, osmolality -> "
            "mosm/kg",
            "LOINC, Regenstrief Institute; codes as used in the HL7 FHIR R4 "
            "published examples (hl7.fhir.r4.examples 4.0.1, 2019)",
            "any");
    case NTR_METHOD_GLUCOSE_UNIT_CHECK:
        return entry(info, method, "Glucose unit against sodium and osmolality",
            "g = glucose in mmol/L; floor = 1.86*Na + g + 9; refused when "
            "floor > 600, or floor > measured osmolality + 20 (mOsm/kg)",
            "Dorwart WV, Chalmers L. Comparison of methods for calculating "
            "serum osmolality from chemical concentrations. Clin Chem "
            "1975;21:190-4 (the floor); the tolerance is the project's",
            "any");

    /* ==== correction and balance (ids 30-49, issue P2) ================== */
    case NTR_METHOD_LIMITS_STANDARD:
        return entry(info, method, "Correction limits, standard risk",
            "rise <= 10 mmol/L in any 24 h and <= 18 mmol/L in any 48 h; "
            "at least 4 mmol/L by 24 h (the stricter ends of the US ranges "
            "10-12 and 4-8; the European first-day 10 and 10 + 8 over 48 h)",
            REF_VERBALIS_2013 "; " REF_SPASOVSKI,
            "adults with chronic or unknown-duration hyponatraemia under "
            "treatment");
    case NTR_METHOD_LIMITS_HIGH_RISK:
        return entry(info, method, "Correction limits, high risk of osmotic demyelination",
            "rise <= 8 mmol/L in any 24 h and <= 16 mmol/L in any 48 h; at "
            "least 4 mmol/L by 24 h (16 over 48 h is the library's own choice, "
            "twice the 24 h figure)",
            REF_VERBALIS_2013,
            "adults at high risk of osmotic demyelination (see the ODS risk "
            "method)");
    case NTR_METHOD_ODS_RISK:
        return entry(info, method, "Risk factors for osmotic demyelination",
            "high risk if baseline Na <= 105 mmol/L, or low potassium, alcohol "
            "use disorder, malnutrition or advanced liver disease is present; "
            "a factor not known counts as possibly present (library's choice)",
            REF_VERBALIS_2013,
            "adults with hyponatraemia");
    case NTR_METHOD_CORRECTION_WINDOWS:
        return entry(info, method, "Largest rise within sliding 24 h and 48 h windows",
            "max_rise_W = max over earlier i, later j with t_j - t_i <= W of "
            "(Na_j - Na_i), W = 24 and 48 h; rise_first_24h = max Na within "
            "24 h of the first sample minus the first; over when the rise "
            "exceeds the limit by more than 1e-6 mmol/L",
            REF_VERBALIS_2013 "; " REF_SPASOVSKI,
            "any measured serum sodium series");
    case NTR_METHOD_CORRECTION_TREND:
        return entry(info, method, "Near-limit and projected-over warnings",
            "near: the rise into the last sample over the 24 h or 48 h ending "
            "at it is within 2 mmol/L of the limit; projected over: the next "
            "sample, due after the same interval as the last, rising by the "
            "same amount again, would exceed a limit (library's own rules)",
            "Library's own warning rules built on " REF_VERBALIS_2013,
            "any measured serum sodium series");
    case NTR_METHOD_RULE_OF_SIXES:
        return entry(info, method, "Six mmol/L within 6 h (rule of sixes)",
            "flag when the rise into the last sample over the 6 h ending at it "
            "is >= 6 mmol/L: the point at which urgent correction for severe "
            "symptoms is usually stopped for the day",
            "Sterns RH, Hix JK, Silver S. Treating profound hyponatremia: a "
            "strategy for controlled correction. Am J Kidney Dis "
            "2010;56:774-9",
            "adults given hypertonic saline for severe symptoms");
    case NTR_METHOD_BALANCE_MASS:
        return entry(info, method, "Mass balance of fluids (Edelman-based)",
            "Na1 = (Na0*TBW0 + sum v*(Na_f + K_f)) / (TBW0 + sum v); "
            "TBW1 = TBW0 + sum v; v > 0 in, v < 0 out (urine)",
            "Edelman IS, Leibman J, O'Meara MP, Birkenfeld LW. Interrelations "
            "between serum sodium concentration, serum osmolarity and total "
            "exchangeable sodium, total exchangeable potassium and total body "
            "water. J Clin Invest 1958;37:1236-56; " REF_ADROGUE_MADIAS_HYPO,
            "any (slope 1, intercept 0 simplification of the Edelman relation; "
            "ignores unmeasured losses and shifts)");
    case NTR_METHOD_BALANCE_COURSE:
        return entry(info, method, "Predicted sodium course under steady rates",
            "at time tau each flow has given rate/1000 * (min(end, tau) - "
            "start) L; Na(tau) by the mass balance of those volumes; points "
            "every step and at the end",
            "Derived from the mass balance of " REF_ADROGUE_MADIAS_HYPO,
            "any (rates assumed steady within each span)");
    case NTR_METHOD_PLAN_CHECK:
        return entry(info, method, "Check of a fluid plan against correction limits",
            "measured history followed by the predicted course, assessed with "
            "the sliding-window limits; first predicted point whose 24 h or "
            "48 h rise exceeds its limit",
            "Library's own combination of the mass balance ("
            REF_ADROGUE_MADIAS_HYPO ") and the limits of " REF_VERBALIS_2013,
            "adults with hyponatraemia under treatment");
    case NTR_METHOD_RELOWER:
        return entry(info, method, "Fluid to re-lower sodium after overcorrection",
            "V = (d*TBW0 + U*(Na1 - c_u)) / (Na1 - c_f), Na1 = Na0 - d; U = "
            "urine volume over the period, c_u its Na + K, c_f the fluid's "
            "Na + K; 0 when losses alone lower sodium by d",
            "Mass balance of " REF_ADROGUE_MADIAS_HYPO "; re-lowering as "
            "advised by Sterns RH, Hix JK. Overcorrection of hyponatremia is "
            "a medical emergency. Kidney Int 2009;76:587-9",
            "adults whose sodium rose faster than the limits");
    /* ---- course limits in both directions (ids 40-45, issue P1) ------- */
#define REF_ADROGUE_MADIAS_HYPER                                             \
    "Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med 2000;342:1493-9"
    case NTR_METHOD_COURSE_HYPER_CHRONIC:
        return entry(info, method, "Lowering limit, chronic hypernatraemia",
            "fall <= 10 mmol/L in any 24 h (about 0.5 mmol/L/h); no 48 h "
            "limit (10 in every 24 h bounds it); no target by default",
            REF_ADROGUE_MADIAS_HYPER,
            "adults with hypernatraemia of more than a day's or unknown "
            "duration");
    case NTR_METHOD_COURSE_HYPER_ACUTE:
        return entry(info, method, "Lowering limit, hypernatraemia of hours",
            "fall <= 24 mmol/L in any 24 h: about 1 mmol/L/h kept for a day "
            "(the 24 h figure is the library's arithmetic)",
            REF_ADROGUE_MADIAS_HYPER,
            "adults whose hypernatraemia developed over hours (for example "
            "salt loading)");
    case NTR_METHOD_COURSE_HOLD:
        return entry(info, method, "Holding limits: neither direction wanted",
            "rise <= 4 and fall <= 4 mmol/L in any 24 h: the analytical "
            "margin of the wrong-way flag used as the limit (library's own "
            "choice)",
            "Library's own choice, derived from the margin of the wrong-way "
            "method (US proficiency-testing allowance for sodium, CLIA 1988, "
            "42 CFR 493.931)",
            "patients held at a sodium level (target reached, desmopressin "
            "clamp, neurosurgical care)");
    case NTR_METHOD_COURSE_WINDOWS:
        return entry(info, method, "Largest rise and fall within sliding 24 h and 48 h windows",
            "max_rise_W = max over earlier i, later j with t_j - t_i <= W of "
            "(Na_j - Na_i); max_fall_W the same for (Na_i - Na_j), computed "
            "as the rise of the series with every sodium negated; W = 24 and "
            "48 h; a limit of 0 is no limit; over when a figure exceeds its "
            "limit by more than 1e-6 mmol/L",
            REF_VERBALIS_2013 "; " REF_SPASOVSKI "; " REF_ADROGUE_MADIAS_HYPER,
            "any measured or predicted serum sodium series");
    case NTR_METHOD_COURSE_WRONG_WAY:
        return entry(info, method, "Moved against the goal",
            "raise: largest fall within 48 h > 4 mmol/L; lower: largest rise "
            "within 48 h > 4 mmol/L; hold: any window over its limit (or, "
            "with no limit in a direction, > 4 mmol/L); 4 mmol/L is about "
            "the difference analytical error alone can make between two "
            "results (library's own margin)",
            "Library's own rule; margin from the allowable error for sodium "
            "in US proficiency testing (Clinical Laboratory Improvement Amendments of 1988, 42 CFR 493.931)",
            "any serum sodium series under a stated goal");
    case NTR_METHOD_COURSE_WATCH:
        return entry(info, method, "Streaming course watcher with bounded memory",
            "keeps the candidate window minima and maxima of the last 48 h; "
            "when its memory is full it merges the two adjacent candidates "
            "whose sodium differs least into one with the later time and the "
            "more extreme sodium, so every reported rise and fall is at "
            "least the exact one (then marked approximate)",
            "Library's own method, derived from the sliding-window maxima of "
            "the course windows method; docs/correction.md gives its "
            "measured error",
            "any measured serum sodium series, sampled as often as every 5 min");
#undef REF_ADROGUE_MADIAS_HYPER

    /* ==== work-up (ids 50-69, issue P3) ================================= */
    case NTR_METHOD_NA_SEVERITY:
        return entry(info, method, "Severity of a low sodium",
            "Na >= 135: none; 130 <= Na < 135: mild; 125 <= Na < 130: "
            "moderate; Na < 125: profound (mmol/L; each band includes its "
            "lower edge)",
            REF_SPASOVSKI " (classification by biochemical severity)",
            "adults with a low serum sodium");
    case NTR_METHOD_TONICITY_CLASS:
        return entry(info, method, "Tonicity class by measured osmolality",
            "Osm < 275: hypotonic; 275 <= Osm <= 295: isotonic; Osm > 295: "
            "hypertonic (measured serum osmolality, mOsm/kg)",
            REF_SPASOVSKI " (275 limit); 295 is the upper end of the usual "
            "reference interval (common practice)",
            "any");
    case NTR_METHOD_LOW_NA_TONICITY:
        return entry(info, method, "Pseudo- or translocational low sodium",
            "when Na < 135: glucose explains if glucose-corrected Na >= 135; "
            "not hypotonic if measured Osm >= 275; translocational if Osm > 295 "
            "or (Osm >= 275 and glucose explains); pseudo if 275 <= Osm <= 295 "
            "and glucose does not explain; discordant if Osm < 275 and "
            "glucose explains",
            REF_SPASOVSKI " (exclusion of non-hypotonic hyponatraemia); "
            REF_KATZ "; " REF_HILLIER,
            "adults with a low serum sodium");
    case NTR_METHOD_URINE_DILUTE:
        return entry(info, method, "Maximally dilute urine",
            "urine Osm <= 100 mOsm/kg: maximally dilute",
            "Common practice; the same cut-off opens the urine steps of "
            REF_SPASOVSKI,
            "hypotonic hyponatraemia");
    case NTR_METHOD_URINE_NA_HIGH:
        return entry(info, method, "High urine sodium",
            "urine Na > 30 mmol/L: high (valid on normal salt and water "
            "intake, without diuretics)",
            REF_SPASOVSKI,
            "hypotonic hyponatraemia with urine Osm > 100 mOsm/kg");
    case NTR_METHOD_FRACTIONAL_EXCRETION:
        return entry(info, method, "Fractional excretion",
            "FE% = 100 * (U_x * P_cr) / (P_x * U_cr); each pair in one unit",
            "Standard renal physiology (clearance of x over creatinine "
            "clearance); SIAD cut-offs in " REF_SPASOVSKI,
            "any (spot urine and plasma taken together)");
    case NTR_METHOD_SIAD_CRITERIA:
        return entry(info, method, "Criteria for inappropriate antidiuresis",
            "essential (all): effective Osm < 275 mOsm/kg; urine Osm > 100 "
            "mOsm/kg; clinical euvolaemia; urine Na > 30 mmol/L on normal salt "
            "and water intake; no adrenal, thyroid, pituitary or renal "
            "insufficiency; no recent diuretic. supplemental: uric acid < 0.24 "
            "mmol/L; urea < 3.6 mmol/L; 0.9% saline fails to correct; FE Na > "
            "0.5%; FE urea > 55%; FE uric acid > 12%; fluid restriction "
            "corrects",
            REF_SPASOVSKI " (table of SIAD criteria), adapted from Schwartz "
            "WB, Bennett W, Curelop S, Bartter FC. Am J Med 1957;23:529-42 and "
            "Bartter FC, Schwartz WB. Am J Med 1967;42:790-806",
            "adults with hypotonic hyponatraemia");
    case NTR_METHOD_EFFECTIVE_OSM_MEASURED:
        return entry(info, method, "Effective osmolality from a measured osmolality",
            "E = max(measured - urea - 1.25*ethanol, min(2*Na + glucose, "
            "measured)) (mOsm/kg; urea, ethanol, Na, glucose in mmol/L; "
            "ethanol 0 with a vapour-pressure osmometer)",
            REF_OSTER_SINGER "; " REF_MILIONIS " (urea and ethanol are "
            "ineffective osmoles); Purssell RA et al. Ann Emerg Med 2001 "
            "(ethanol coefficient, freezing-point osmometry)",
            "any; measured osmolality, urea and ethanol from one sample");
    case NTR_METHOD_LOW_NA_EFFECTIVE_TONICITY:
        return entry(info, method, "Low sodium judged on the effective osmolality",
            "as the pseudo- or translocational flags, with the effective "
            "osmolality E in place of the measured one; ineffective osmoles "
            "if measured Osm >= 275 and E < 275",
            REF_OSTER_SINGER "; " REF_MILIONIS "; " REF_SPASOVSKI
            " (exclusion of non-hypotonic hyponatraemia); " REF_KATZ "; "
            REF_HILLIER,
            "adults with a low serum sodium");
    case NTR_METHOD_FE_URIC_ACID_CLASS:
        return entry(info, method, "Fractional uric acid excretion and SIAD",
            "FE uric acid < 8%: argues against SIAD; 8-12% (both included): "
            "indeterminate; > 12%: supports SIAD",
            REF_FENSKE "; " REF_SPASOVSKI " (12% in the table of SIAD "
            "criteria)",
            "adults with hypotonic hyponatraemia, measured at the low sodium");
    case NTR_METHOD_FE_URIC_ACID_AFTER_CORRECTION:
        return entry(info, method, "Fractional uric acid excretion after correction",
            "second sodium < 135 mmol/L: not corrected; else FE at the low "
            "sodium <= 12%: not high before; else FE after > 12%: persistently "
            "high (points to renal or cerebral salt wasting); < 8%: normalised "
            "(the course of SIAD); 8-12%: unsettled",
            REF_FENSKE " (edges at the low sodium); Maesaka JK et al. on "
            "telling SIAD from cerebral or renal salt wasting (from memory; "
            "the corrected-value edges are this library's rule)",
            "adults with hypotonic hyponatraemia, measured again once the "
            "sodium is corrected");

    /* ==== urine feedback and the fitted prediction (ids 83-89, issue P2) === */
    case NTR_METHOD_EFW_BALANCE:
        return entry(info, method, "Electrolyte-free water balance of inputs and outputs",
            "EFW of a volume V with sodium + potassium c at serum sodium Na: "
            "V*(1 - c/Na); balance = EFW in - EFW out; "
            "Na1 = Na0 - Na0*balance/TBW1 (the mass balance in EFW terms); "
            "rate form dNa/dt = -Na*(EFW rate in - EFW clearance)/TBW",
            "Shah SR, Bhave G. Using electrolyte free water balance to "
            "rationalize and treat dysnatremias. Front Med 2018;5:103",
            "adults with a low or high sodium whose inputs and urine are measured");
    case NTR_METHOD_URINE_FEEDBACK:
        return entry(info, method, "Measured urine continued over a horizon",
            "the latest collection's rate and Na + K continued from now to "
            "now + horizon beside the planned flows; the course (history, "
            "estimate to now, projection) checked against the course limits; "
            "water diuresis under way when the first breach ahead is a rise "
            "and the urine's EFW clearance is positive; urine osmolality "
            "<= 100 mOsm/kg marks it maximally dilute",
            "Library's own method on the EFW balance (Shah SR, Bhave G. Front "
            "Med 2018;5:103) and the mass balance; " REF_SPASOVSKI
            " (maximally dilute urine)",
            "adults under treatment for a low sodium with urine collected "
            "hourly or every few hours");
    case NTR_METHOD_COURSE_FIT:
        return entry(info, method, "Fitted body water and unmeasured free-water loss",
            "Na_k = (Na0*W + S_k)/(W + V_k - L*t_k/1000) (V_k, S_k: volume "
            "and Na + K content of the known flows by t_k); Na0, W, L "
            "minimise sum (measured - Na_k)^2 by Levenberg-Marquardt, "
            "W in guess/3..3*guess, |L| <= 2000 mL/h, at most 100 "
            "iterations from each of two starts",
            "Library's own method on the mass balance of " REF_ADROGUE_MADIAS_HYPO
            "; Levenberg K. Q Appl Math 1944;2:164-8; Marquardt DW. J Soc "
            "Ind Appl Math 1963;11:431-41 (from memory)",
            "adults with at least 3 measured sodium values and known "
            "infusions that change rate (a bolus, a stop)");
    case NTR_METHOD_FIT_SEPARABILITY:
        return entry(info, method, "Can the data tell body water from a water loss",
            "r = correlation of the W and L estimates from the inverse of "
            "J'J scaled to unit diagonal (J: derivatives of Na_k by Na0, W, "
            "L); not separable when |r| > 0.999 or the scaled matrix is "
            "singular; standard errors s*sqrt(diag((J'J)^-1)), "
            "s^2 = SSR/(n - 3)",
            "Library's own criterion, derived from the least-squares covariance "
            "(Marquardt DW. J Soc Ind Appl Math 1963;11:431-41; from memory)",
            "as the fit");
    case NTR_METHOD_FIT_REPROJECT:
        return entry(info, method, "Remaining plan re-projected with fitted values",
            "body water at the last sample = fitted W carried through the "
            "flows and the fitted loss; from the last measured sodium, the "
            "flows after it and the fitted loss as a timed flow of rate -L "
            "without sodium, checked as ntr_course_plan_check()",
            "Library's own method on the mass balance of " REF_ADROGUE_MADIAS_HYPO,
            "as the fit");

    /* ==== therapy (ids 70-89, issue P2): solute and restriction ========= */
    case NTR_METHOD_SOLUTE_URINE_VOLUME:
        return entry(info, method, "Urine volume from the solute load",
            "V (L/day) = solute excreted (mOsm/day) / urine osmolality "
            "(mOsm/kg), 1 kg of urine read as 1 L",
            REF_BERL,
            "any; the urine osmolality must stay fixed (as in SIAD)");
    case NTR_METHOD_FLUID_ALLOWANCE:
        return entry(info, method, "Fluid allowance that holds the sodium",
            "intake (L/day) = V * (1 - (U_Na + U_K) / S_Na) + net insensible "
            "loss, V = solute / U_osm; negative: restriction alone cannot "
            "hold the sodium (with no insensible loss, exactly when the Furst "
            "ratio is above 1)",
            REF_BERL "; " REF_FURST "; electrolyte-free water clearance: "
            "standard renal physiology (Rose BD, Post TW, Clinical Physiology "
            "of Acid-Base and Electrolyte Disorders, 5th ed., 2001)",
            "adults with a low sodium and a fixed urine osmolality");
    case NTR_METHOD_SOLUTE_DOSE:
        return entry(info, method, "Osmoles of a dose of urea or NaCl",
            "mOsm = 1000 * g / M * n; M from IUPAC standard atomic weights "
            "(urea CH4N2O 60.056, NaCl 58.443 g/mol); n = 1 for urea, 2 for "
            "NaCl (full dissociation, an idealisation)",
            "IUPAC Commission on Isotopic Abundances and Atomic Weights, "
            "standard atomic weights (abridged, 2013 onwards); " REF_BERL,
            "any");
    case NTR_METHOD_SOLUTE_FOR_ALLOWANCE:
        return entry(info, method, "Solute dose and fluid allowance",
            "allowance with dose = A0 + D / U_osm, D = osmoles of the daily "
            "dose, A0 the allowance of the measured urine; inverse: D = "
            "(target - A0) * U_osm, 0 when A0 >= target; the dose's urine "
            "carries no net electrolyte (tablet sodium in = out)",
            REF_BERL,
            "adults with SIAD-like fixed urine osmolality, in steady state");
    case NTR_METHOD_RESTRICTION_OUTLOOK:
        return entry(info, method, "Outlook of fluid restriction with or without solute",
            "verdict: allowance <= 0 restriction fails; allowance >= target "
            "target holds; else stricter restriction or solute; with the "
            "Furst band (ratio > 1 flagged) and the urea and NaCl doses for "
            "the target",
            REF_BERL "; " REF_FURST "; " REF_VERBALIS_2013,
            "adults with a low sodium and a fixed urine osmolality");

    /* ==== therapy (ids 75-82, issue P2) ================================= */
#define REF_ADROGUE_MADIAS_HYPER_T                                           \
    "Adrogue HJ, Madias NE. Hypernatremia. N Engl J Med 2000;342:1493-9"
    case NTR_METHOD_LOOP_DIURETIC:
        return entry(info, method, "Loop diuretic: urine lost with and without salt replacement",
            "Na1 = Na0 + sum v*(c - Na0) / (TBW0 + sum v) over the flows "
            "{-U, c_u} (and {+R, c_r} with replacement); c_u about 75 mmol/L "
            "(Na + K, half-isotonic) unless measured",
            "Mass balance of " REF_ADROGUE_MADIAS_HYPO "; urine composition "
            "after a loop diuretic: common practice",
            "adults given a loop diuretic for a concentrated urine");
    case NTR_METHOD_DDAVP_CLAMP:
        return entry(info, method, "Desmopressin clamp: rise per day and stop hour",
            "rise_24h by mass balance of saline (r, c_s) and urine (u, c_u); "
            "stop t = d*TBW0 / (A - d*B), A = r*(c_s - Na0) - u*(c_u - Na0), "
            "B = r - u; never when A - d*B <= 0",
            "Mass balance of " REF_ADROGUE_MADIAS_HYPO "; clamp strategy: "
            "Sood L et al. Am J Kidney Dis 2013;61:571-8 (from memory)",
            "adults with hyponatraemia on desmopressin and hypertonic saline");
    case NTR_METHOD_DDAVP_RELOWER:
        return entry(info, method, "Re-lowering by the excess over a limit plus a margin",
            "d = excess + margin; 5% dextrose volume from the re-lowering "
            "mass balance; 0 when no window is over",
            "Sterns RH, Hix JK. Kidney Int 2009;76:587-9 (from memory); "
            "margin: library's option",
            "adults whose sodium rose faster than the limits");
    case NTR_METHOD_VAPTAN_WATCH:
        return entry(info, method, "Monitoring while a vaptan acts",
            "high-risk limits (8/24 h, 16/48 h) with risk factors or liver "
            "disease, else standard; horizon 6 h, resample every 6 h (common "
            "practice); cautions: no fluid restriction in the first 24 h, "
            "liver disease",
            REF_VERBALIS_2013 "; tolvaptan prescribing information and US "
            "FDA drug safety communication 2013 (from memory)",
            "adults with hyponatraemia starting a vaptan");
    case NTR_METHOD_HYPER_LOWER:
        return entry(info, method, "Hypotonic fluid rate to lower a high sodium",
            "V = (d*TBW0 + L*(Na1 - c_L)) / (Na1 - c_f), L = (urine + "
            "insensible) * T, c_L = urine*c_u / (urine + insensible); rate = "
            "V / T; plan checked against the fall limits",
            REF_ADROGUE_MADIAS_HYPER_T,
            "adults with hypernatraemia");
    case NTR_METHOD_BOLUS_PLAN:
        return entry(info, method, "3% saline boluses for severe symptoms",
            "smallest k with Na(k*0.15 L of 513 mmol/L) - Na0 >= aim "
            "(about 5), stopping before a bolus that passes the limit",
            REF_SPASOVSKI " (bolus regimen, from memory)",
            "adults with severely symptomatic hyponatraemia");
#undef REF_ADROGUE_MADIAS_HYPER_T

    default:
        return NTR_ERR_ARG;
    }
}

int ntr_method_info(int method, struct ntr_method_info *out)
{
    if (out == NULL) {
        return NTR_ERR_NULL;
    }
    /* describe() writes only in the case that matches, so an unknown id
     * leaves *out untouched without a copy through a local (which doubled
     * the cost of a call; tests/bench/run-bench.sh). */
    return describe(method, out);
}

/* The ids describe() knows, as runs of consecutive ids in increasing
 * order, one run per area, all positive and below 1000 (header:
 * ntr_method_next). They must cover exactly the cases of
 * describe(): tests/test_methods.c (info_and_next_agree) checks that over
 * the whole id space, and that the walk finds exactly the ids the header
 * defines. A handful of runs cost a few comparisons; walking the switch id by id
 * cost a call per id tried (68 instructions for the next id, about a
 * thousand calls past the last one; tests/bench/run-bench.sh). */
static const struct {
    int first;
    int last;
} method_runs[] = {
    {NTR_METHOD_UNIT_CONVERSION, NTR_METHOD_GLUCOSE_UNIT_CHECK}, /* core, 1-29 */
    {NTR_METHOD_LIMITS_STANDARD, NTR_METHOD_COURSE_WATCH},  /* correction, 30-49 */
    {NTR_METHOD_NA_SEVERITY, NTR_METHOD_FE_URIC_ACID_AFTER_CORRECTION}, /* work-up, 50-69 */
    {NTR_METHOD_SOLUTE_URINE_VOLUME, NTR_METHOD_RESTRICTION_OUTLOOK}, /* solute, 70-74 */
    {NTR_METHOD_LOOP_DIURETIC, NTR_METHOD_BOLUS_PLAN},     /* therapy, 75-82 */
    {NTR_METHOD_EFW_BALANCE, NTR_METHOD_FIT_REPROJECT}};    /* feedback, 83-89 */

int ntr_method_next(int after, int *next)
{
    size_t k;
    if (next == NULL) {
        return NTR_ERR_NULL;
    }
    for (k = 0; k < sizeof method_runs / sizeof method_runs[0]; k++) {
        /* after < last also keeps after + 1 from overflowing. */
        if (after < method_runs[k].last) {
            *next = after < method_runs[k].first ? method_runs[k].first
                                                 : after + 1;
            return NTR_OK;
        }
    }
    return NTR_ERR_RANGE;
}
