/* SPDX-License-Identifier: MIT */
/*
 * natremia_pg.c: the natremia formulas as PostgreSQL functions.
 *
 * Every formula comes in two forms (natremia--1.0.sql declares them):
 *   ntr_<name>(...)          invalid input gives NULL;
 *   ntr_<name>_checked(...)  invalid input raises an error whose SQLSTATE
 *                            says why (see report_status()).
 * Both call the same C function of the library; only the reaction to a
 * status other than NTR_OK differs.
 *
 * The aggregate ntr_correction_assess(hours, na_mmol_l [, limits]) collects
 * a patient's samples (per GROUP BY), sorts them by time and runs
 * ntr_correction_assess() once in its final function.
 *
 * Every result is an estimate for decision support, not an order. Verify
 * with measured values; follow local protocols and licensed clinical
 * judgement.
 */
#include "postgres.h"

#include <math.h>
#include <string.h>

#include "access/htup_details.h"
#include "catalog/pg_type.h"
#include "fmgr.h"
#include "funcapi.h"
#include "libpq/pqformat.h"
#include "utils/array.h"
#include "utils/builtins.h"
#include "utils/lsyscache.h"

#include "natremia.h"

PG_MODULE_MAGIC;

/* ---------------------------------------------------------------------
 * Status to SQL error
 * --------------------------------------------------------------------- */

static const char *
status_name(int status)
{
	static const char *const names[] = {
		"NTR_OK", "NTR_ERR_NULL", "NTR_ERR_NONFINITE", "NTR_ERR_RANGE",
		"NTR_ERR_UNIT", "NTR_ERR_DOMAIN", "NTR_ERR_ORDER", "NTR_ERR_CAPACITY",
		"NTR_ERR_ARG"
	};

	if (status >= 0 && status < (int) lengthof(names))
		return names[status];
	return "unknown status";
}

/*
 * SQLSTATE for a status: a value outside its plausible range is
 * numeric_value_out_of_range (22003); a non-finite value, an unknown name,
 * samples out of time order or a formula undefined for the inputs are
 * invalid_parameter_value (22023); anything else (a bug) is internal_error.
 */
static int
status_sqlstate(int status)
{
	switch (status)
	{
		case NTR_ERR_RANGE:
			return ERRCODE_NUMERIC_VALUE_OUT_OF_RANGE;
		case NTR_ERR_NONFINITE:
		case NTR_ERR_UNIT:
		case NTR_ERR_DOMAIN:
		case NTR_ERR_ORDER:
		case NTR_ERR_ARG:
			return ERRCODE_INVALID_PARAMETER_VALUE;
		default:
			return ERRCODE_INTERNAL_ERROR;
	}
}

static void
report_status(const char *function, int status)
{
	ereport(ERROR,
			(errcode(status_sqlstate(status)),
			 errmsg("%s: %s", function, ntr_status_message(status)),
			 errdetail("natremia status %s (%d).", status_name(status), status),
			 errhint("The accepted range of every input is listed in the "
					 "natremia documentation (docs/ranges.md).")));
}

static void
report_name(const char *function, const char *what, const char *given,
			const char *accepted)
{
	ereport(ERROR,
			(errcode(ERRCODE_INVALID_PARAMETER_VALUE),
			 errmsg("%s: unknown %s \"%s\"", function, what, given),
			 errdetail("natremia status NTR_ERR_ARG (%d).", NTR_ERR_ARG),
			 errhint("Accepted: %s.", accepted)));
}

/* The result, NULL, or an error, depending on the status and the variant. */
#define RETURN_DOUBLE(function, checked, status, value) \
	do { \
		if ((status) == NTR_OK) \
			PG_RETURN_FLOAT8(value); \
		if (checked) \
			report_status((function), (status)); \
		PG_RETURN_NULL(); \
	} while (0)

/* Defines the two SQL-callable C functions of one formula. */
#define NTRPG_PAIR(name) \
	PG_FUNCTION_INFO_V1(ntrpg_##name); \
	PG_FUNCTION_INFO_V1(ntrpg_##name##_checked); \
	Datum ntrpg_##name(PG_FUNCTION_ARGS); \
	Datum ntrpg_##name##_checked(PG_FUNCTION_ARGS); \
	Datum ntrpg_##name(PG_FUNCTION_ARGS) { return name##_impl(fcinfo, false); } \
	Datum ntrpg_##name##_checked(PG_FUNCTION_ARGS) { return name##_impl(fcinfo, true); }

/* ---------------------------------------------------------------------
 * Names of enumerators (case-insensitive in SQL)
 * --------------------------------------------------------------------- */

typedef struct named_value
{
	const char *name;
	int			value;
} named_value;

static const named_value osm_formulas[] = {
	{"2na", NTR_OSM_2NA}, {"two_na", NTR_OSM_2NA},
	{"dorwart_chalmers", NTR_OSM_DORWART_CHALMERS}, {NULL, 0}
};
static const named_value glucose_methods[] = {
	{"katz", NTR_GLUCOSE_KATZ}, {"hillier", NTR_GLUCOSE_HILLIER}, {NULL, 0}
};
static const named_value sexes[] = {
	{"male", NTR_SEX_MALE}, {"m", NTR_SEX_MALE},
	{"female", NTR_SEX_FEMALE}, {"f", NTR_SEX_FEMALE}, {NULL, 0}
};
static const named_value fluids[] = {
	{"nacl_0_9", NTR_FLUID_NACL_0_9}, {"nacl_3", NTR_FLUID_NACL_3},
	{"nacl_5", NTR_FLUID_NACL_5}, {"nacl_0_45", NTR_FLUID_NACL_0_45},
	{"ringer_lactate", NTR_FLUID_RINGER_LACTATE},
	{"dextrose_5", NTR_FLUID_DEXTROSE_5},
	{"nacl_0_2_dextrose_5", NTR_FLUID_NACL_0_2_DEXTROSE_5}, {NULL, 0}
};
static const named_value analytes[] = {
	{"sodium", NTR_ANALYTE_SODIUM}, {"potassium", NTR_ANALYTE_POTASSIUM},
	{"chloride", NTR_ANALYTE_CHLORIDE}, {"glucose", NTR_ANALYTE_GLUCOSE},
	{"urea", NTR_ANALYTE_UREA}, {"urea_nitrogen", NTR_ANALYTE_UREA_NITROGEN},
	{"creatinine", NTR_ANALYTE_CREATININE}, {"ethanol", NTR_ANALYTE_ETHANOL},
	{"osmolality", NTR_ANALYTE_OSMOLALITY}, {"uric_acid", NTR_ANALYTE_URIC_ACID},
	{NULL, 0}
};
static const named_value specimens[] = {
	{"serum_plasma", NTR_SPECIMEN_SERUM_PLASMA}, {"blood", NTR_SPECIMEN_BLOOD},
	{"urine", NTR_SPECIMEN_URINE}, {NULL, 0}
};
/* The strict UCUM code of each NTR_UNIT_* value (index = value). */
static const char *const ucum_codes[] = {
	NULL, "mmol/L", "mg/dL", "meq/L", "mosm/kg", "g/L", "umol/L"
};

/* The name a table gives a value (the first, where several share it). */
static const char *
name_of(const named_value *table, int value)
{
	int			i;

	for (i = 0; table[i].name != NULL; i++)
		if (table[i].value == value)
			return table[i].name;
	return "?";
}
static const named_value limit_presets[] = {
	{"standard", NTR_LIMITS_STANDARD}, {"high_risk", NTR_LIMITS_HIGH_RISK},
	{NULL, 0}
};

/* Accepted names, comma separated, for an error hint. */
static char *
accepted_names(const named_value *table)
{
	StringInfoData buf;
	int			i;

	initStringInfo(&buf);
	for (i = 0; table[i].name != NULL; i++)
		appendStringInfo(&buf, "%s%s", i ? ", " : "", table[i].name);
	return buf.data;
}

/*
 * Looks up a text argument in a table. On an unknown name: raises (checked)
 * or returns false (the caller then returns NULL).
 */
static bool
lookup_name(text *arg, const named_value *table, const char *what,
			const char *function, bool checked, int *value)
{
	char	   *given = text_to_cstring(arg);
	int			i;

	for (i = 0; table[i].name != NULL; i++)
	{
		if (pg_strcasecmp(given, table[i].name) == 0)
		{
			*value = table[i].value;
			return true;
		}
	}
	if (checked)
		report_name(function, what, given, accepted_names(table));
	return false;
}

#define LOOKUP_OR_NULL(argno, table, what, function, checked, var) \
	do { \
		if (!lookup_name(PG_GETARG_TEXT_PP(argno), (table), (what), \
						 (function), (checked), &(var))) \
			PG_RETURN_NULL(); \
	} while (0)

/* ---------------------------------------------------------------------
 * Core formulas
 * --------------------------------------------------------------------- */

static Datum
osm_calculated_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_osm_calculated_checked" : "ntr_osm_calculated";
	double		out = 0.0;
	int			formula;
	int			st;

	LOOKUP_OR_NULL(4, osm_formulas, "formula", f, checked, formula);
	st = ntr_osm_calculated(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
							PG_GETARG_FLOAT8(2), PG_GETARG_FLOAT8(3), formula,
							&out);
	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(osm_calculated)

static Datum
osm_effective_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_osm_effective_checked" : "ntr_osm_effective";
	double		out = 0.0;
	int			st = ntr_osm_effective(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
									   &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(osm_effective)

static Datum
osm_gap_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_osm_gap_checked" : "ntr_osm_gap";
	double		out = 0.0;
	int			st = ntr_osm_gap(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(osm_gap)

static Datum
na_corrected_glucose_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_na_corrected_glucose_checked"
		: "ntr_na_corrected_glucose";
	double		out = 0.0;
	int			method;
	int			st;

	LOOKUP_OR_NULL(2, glucose_methods, "method", f, checked, method);
	st = ntr_na_corrected_glucose(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
								  method, &out);
	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(na_corrected_glucose)

static Datum
na_corrected_glucose_factor_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_na_corrected_glucose_factor_checked"
		: "ntr_na_corrected_glucose_factor";
	double		out = 0.0;
	int			st = ntr_na_corrected_glucose_factor(PG_GETARG_FLOAT8(0),
													 PG_GETARG_FLOAT8(1),
													 PG_GETARG_FLOAT8(2), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(na_corrected_glucose_factor)

static Datum
na_deficit_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_na_deficit_checked" : "ntr_na_deficit";
	double		out = 0.0;
	int			st = ntr_na_deficit(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
									PG_GETARG_FLOAT8(2), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(na_deficit)

static Datum
tbw_fraction_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_tbw_fraction_checked" : "ntr_tbw_fraction";
	double		out = 0.0;
	int			sex;
	int			st;

	LOOKUP_OR_NULL(0, sexes, "sex", f, checked, sex);
	st = ntr_tbw_fraction(sex, PG_GETARG_FLOAT8(1), PG_GETARG_FLOAT8(2), &out);
	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(tbw_fraction)

static Datum
tbw_watson_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_tbw_watson_checked" : "ntr_tbw_watson";
	double		out = 0.0;
	int			sex;
	int			st;

	LOOKUP_OR_NULL(0, sexes, "sex", f, checked, sex);
	st = ntr_tbw_watson(sex, PG_GETARG_FLOAT8(1), PG_GETARG_FLOAT8(2),
						PG_GETARG_FLOAT8(3), &out);
	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(tbw_watson)

static Datum
free_water_deficit_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_free_water_deficit_checked"
		: "ntr_free_water_deficit";
	double		out = 0.0;
	int			st = ntr_free_water_deficit(PG_GETARG_FLOAT8(0),
											PG_GETARG_FLOAT8(1), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(free_water_deficit)

/* Fluid presets: one function for sodium, one for potassium. */
static Datum
fluid_value(FunctionCallInfo fcinfo, bool checked, bool potassium)
{
	const char *f = potassium
		? (checked ? "ntr_fluid_k_checked" : "ntr_fluid_k")
		: (checked ? "ntr_fluid_na_checked" : "ntr_fluid_na");
	double		na = 0.0;
	double		k = 0.0;
	int			fluid;
	int			st;

	LOOKUP_OR_NULL(0, fluids, "fluid", f, checked, fluid);
	st = ntr_fluid_preset(fluid, &na, &k);
	RETURN_DOUBLE(f, checked, st, potassium ? k : na);
}

static Datum
fluid_na_impl(FunctionCallInfo fcinfo, bool checked)
{
	return fluid_value(fcinfo, checked, false);
}
NTRPG_PAIR(fluid_na)

static Datum
fluid_k_impl(FunctionCallInfo fcinfo, bool checked)
{
	return fluid_value(fcinfo, checked, true);
}
NTRPG_PAIR(fluid_k)

static Datum
infusate_change_per_litre_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_infusate_change_per_litre_checked"
		: "ntr_infusate_change_per_litre";
	double		out = 0.0;
	int			st = ntr_infusate_change_per_litre(PG_GETARG_FLOAT8(0),
												   PG_GETARG_FLOAT8(1),
												   PG_GETARG_FLOAT8(2),
												   PG_GETARG_FLOAT8(3), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(infusate_change_per_litre)

static Datum
infusate_change_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_infusate_change_checked"
		: "ntr_infusate_change";
	double		out = 0.0;
	int			st = ntr_infusate_change(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
										 PG_GETARG_FLOAT8(2), PG_GETARG_FLOAT8(3),
										 PG_GETARG_FLOAT8(4), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(infusate_change)

static Datum
infusate_volume_for_change_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_infusate_volume_for_change_checked"
		: "ntr_infusate_volume_for_change";
	double		out = 0.0;
	int			st = ntr_infusate_volume_for_change(PG_GETARG_FLOAT8(0),
													PG_GETARG_FLOAT8(1),
													PG_GETARG_FLOAT8(2),
													PG_GETARG_FLOAT8(3),
													PG_GETARG_FLOAT8(4), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(infusate_volume_for_change)

static Datum
furst_ratio_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_furst_ratio_checked" : "ntr_furst_ratio";
	double		out = 0.0;
	int			st = ntr_furst_ratio(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
									 PG_GETARG_FLOAT8(2), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(furst_ratio)

/* Restriction advice as a stable code word. */
static Datum
restriction_from_ratio_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_restriction_from_ratio_checked"
		: "ntr_restriction_from_ratio";
	int			advice = 0;
	int			st = ntr_restriction_from_ratio(PG_GETARG_FLOAT8(0), &advice);

	if (st != NTR_OK)
	{
		if (checked)
			report_status(f, st);
		PG_RETURN_NULL();
	}
	switch (advice)
	{
		case NTR_RESTRICT_1000ML:
			PG_RETURN_TEXT_P(cstring_to_text("under_1000_ml"));
		case NTR_RESTRICT_500_700ML:
			PG_RETURN_TEXT_P(cstring_to_text("500_to_700_ml"));
		default:
			PG_RETURN_TEXT_P(cstring_to_text("under_500_ml"));
	}
}
NTRPG_PAIR(restriction_from_ratio)

static Datum
efwc_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_efwc_checked" : "ntr_efwc";
	double		out = 0.0;
	int			st = ntr_efwc(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
							  PG_GETARG_FLOAT8(2), PG_GETARG_FLOAT8(3), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(efwc)

/*
 * A unit error that names the unit: not known at all, or known but not a
 * unit of the analyte. (Before 1.1 it came out as the generic status text
 * with a hint about input ranges.)
 */
static void
report_unit(const char *function, const char *given, const char *analyte)
{
	if (analyte == NULL)
		ereport(ERROR,
				(errcode(ERRCODE_INVALID_PARAMETER_VALUE),
				 errmsg("%s: unit \"%s\" is not known", function, given),
				 errdetail("natremia status NTR_ERR_UNIT (%d).", NTR_ERR_UNIT),
				 errhint("Units are case-sensitive UCUM codes: mmol/L, mg/dL, meq/L, "
						 "mosm/kg, g/L, umol/L. ntr_unit_normalize() turns laboratory "
						 "spellings such as mEq/L or mg/dl into these codes.")));
	ereport(ERROR,
			(errcode(ERRCODE_INVALID_PARAMETER_VALUE),
			 errmsg("%s: unit \"%s\" does not fit analyte \"%s\"", function, given,
					analyte),
			 errdetail("natremia status NTR_ERR_UNIT (%d).", NTR_ERR_UNIT),
			 errhint("Ions take mmol/L, meq/L, mg/dL, umol/L; other solutes mmol/L, "
					 "mg/dL, g/L, umol/L; osmolality only mosm/kg (docs/units.md).")));
}

/* Units are UCUM codes (case-sensitive, as ntr_unit_parse() wants). */
static Datum
convert_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_convert_checked" : "ntr_convert";
	double		out = 0.0;
	double		probe;
	int			analyte;
	int			units[2] = {0, 0};
	char	   *given[2];
	int			k;
	int			st;

	LOOKUP_OR_NULL(1, analytes, "analyte", f, checked, analyte);
	for (k = 0; k < 2; k++)
	{
		given[k] = text_to_cstring(PG_GETARG_TEXT_PP(2 + k));
		if (ntr_unit_parse(given[k], &units[k]) != NTR_OK)
		{
			if (checked)
				report_unit(f, given[k], NULL);
			PG_RETURN_NULL();
		}
	}
	st = ntr_convert(analyte, PG_GETARG_FLOAT8(0), units[0], units[1], &out);
	if (st == NTR_ERR_UNIT && checked)
	{
		/* Which of the two does not fit: the one that fails on its own. */
		k = ntr_convert(analyte, 1.0, units[0], units[0], &probe) == NTR_OK ? 1 : 0;
		report_unit(f, given[k], name_of(analytes, analyte));
	}
	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(convert)

/* A unit as laboratory feeds spell it (mEq/L, mg/dl, mOsm/kg H2O, umol/L
 * with a micro sign) turned into the strict UCUM code (since 1.1). */
static Datum
unit_normalize_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_unit_normalize_checked" : "ntr_unit_normalize";
	char	   *given = text_to_cstring(PG_GETARG_TEXT_PP(0));
	int			unit = 0;

	if (ntr_unit_parse_lenient(given, &unit) != NTR_OK)
	{
		if (checked)
			ereport(ERROR,
					(errcode(ERRCODE_INVALID_PARAMETER_VALUE),
					 errmsg("%s: unit \"%s\" is not known", f, given),
					 errdetail("natremia status NTR_ERR_UNIT (%d).", NTR_ERR_UNIT),
					 errhint("docs/units.md lists the spellings read, and those refused "
							 "as ambiguous (mOsm/L is an osmolarity, not an osmolality).")));
		PG_RETURN_NULL();
	}
	PG_RETURN_TEXT_P(cstring_to_text(ucum_codes[unit]));
}
NTRPG_PAIR(unit_normalize)

/* Analyte, specimen and unit of a checked LOINC code (since 1.1). */
static Datum
loinc_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_loinc_checked" : "ntr_loinc";
	char	   *given = text_to_cstring(PG_GETARG_TEXT_PP(0));
	int			analyte = 0;
	int			specimen = 0;
	int			unit = 0;
	TupleDesc	desc;
	Datum		values[3];
	bool		nulls[3] = {false, false, false};

	if (ntr_loinc_lookup(given, &analyte, &specimen, &unit) != NTR_OK)
	{
		if (checked)
			ereport(ERROR,
					(errcode(ERRCODE_INVALID_PARAMETER_VALUE),
					 errmsg("%s: LOINC code \"%s\" is not mapped", f, given),
					 errdetail("natremia status NTR_ERR_UNIT (%d).", NTR_ERR_UNIT),
					 errhint("Only codes checked against a published source are mapped; "
							 "docs/units.md lists them and those not mapped until checked.")));
		PG_RETURN_NULL();
	}
	if (get_call_result_type(fcinfo, NULL, &desc) != TYPEFUNC_COMPOSITE)
		ereport(ERROR,
				(errcode(ERRCODE_FEATURE_NOT_SUPPORTED),
				 errmsg("natremia: the result of %s must be a record", f)));
	desc = BlessTupleDesc(desc);
	values[0] = PointerGetDatum(cstring_to_text(name_of(analytes, analyte)));
	values[1] = PointerGetDatum(cstring_to_text(name_of(specimens, specimen)));
	values[2] = PointerGetDatum(cstring_to_text(ucum_codes[unit]));
	PG_RETURN_DATUM(HeapTupleGetDatum(heap_form_tuple(desc, values, nulls)));
}
NTRPG_PAIR(loinc)

/* ---------------------------------------------------------------------
 * Work-up classifications and fractional excretion
 * --------------------------------------------------------------------- */

/* A classification returned as a code word. */
#define RETURN_WORD(function, checked, status, word) \
	do { \
		if ((status) == NTR_OK) \
			PG_RETURN_TEXT_P(cstring_to_text(word)); \
		if (checked) \
			report_status((function), (status)); \
		PG_RETURN_NULL(); \
	} while (0)

#define RETURN_BOOL(function, checked, status, value) \
	do { \
		if ((status) == NTR_OK) \
			PG_RETURN_BOOL((value) != 0); \
		if (checked) \
			report_status((function), (status)); \
		PG_RETURN_NULL(); \
	} while (0)

static Datum
na_severity_impl(FunctionCallInfo fcinfo, bool checked)
{
	static const char *const words[] = {"none", "mild", "moderate", "profound"};
	const char *f = checked ? "ntr_na_severity_checked" : "ntr_na_severity";
	int			severity = 0;
	int			st = ntr_na_severity(PG_GETARG_FLOAT8(0), &severity);

	if (st == NTR_OK && (severity < 0 || severity >= (int) lengthof(words)))
		st = NTR_ERR_ARG;		/* a newer library with a new class */
	RETURN_WORD(f, checked, st, words[st == NTR_OK ? severity : 0]);
}
NTRPG_PAIR(na_severity)

static Datum
tonicity_class_impl(FunctionCallInfo fcinfo, bool checked)
{
	static const char *const words[] = {"", "hypotonic", "isotonic", "hypertonic"};
	const char *f = checked ? "ntr_tonicity_class_checked" : "ntr_tonicity_class";
	int			tonicity = 0;
	int			st = ntr_tonicity_class(PG_GETARG_FLOAT8(0), &tonicity);

	if (st == NTR_OK && (tonicity < 1 || tonicity >= (int) lengthof(words)))
		st = NTR_ERR_ARG;
	RETURN_WORD(f, checked, st, words[st == NTR_OK ? tonicity : 0]);
}
NTRPG_PAIR(tonicity_class)

static Datum
urine_maximally_dilute_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_urine_maximally_dilute_checked"
		: "ntr_urine_maximally_dilute";
	int			dilute = 0;
	int			st = ntr_urine_maximally_dilute(PG_GETARG_FLOAT8(0), &dilute);

	RETURN_BOOL(f, checked, st, dilute);
}
NTRPG_PAIR(urine_maximally_dilute)

static Datum
urine_na_high_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_urine_na_high_checked" : "ntr_urine_na_high";
	int			high = 0;
	int			st = ntr_urine_na_high(PG_GETARG_FLOAT8(0), &high);

	RETURN_BOOL(f, checked, st, high);
}
NTRPG_PAIR(urine_na_high)

static Datum
fractional_excretion_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_fractional_excretion_checked"
		: "ntr_fractional_excretion";
	double		out = 0.0;
	int			st = ntr_fractional_excretion(PG_GETARG_FLOAT8(0),
											  PG_GETARG_FLOAT8(1),
											  PG_GETARG_FLOAT8(2),
											  PG_GETARG_FLOAT8(3), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(fractional_excretion)

/* ---------------------------------------------------------------------
 * Balance: sodium after flows, and the re-lowering volume
 * --------------------------------------------------------------------- */

static bool float8_elements(ArrayType *array, Datum **values, int *n);

static Datum
balance_predict_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_balance_predict_checked"
		: "ntr_balance_predict";
	Datum	   *volume;
	Datum	   *na;
	Datum	   *k;
	int			n_volume;
	int			n_na;
	int			n_k;
	ntr_flow   *flows;
	double		na_out = 0.0;
	double		tbw_out = 0.0;
	int			st = NTR_OK;
	int			i;

	if (!float8_elements(PG_GETARG_ARRAYTYPE_P(2), &volume, &n_volume) ||
		!float8_elements(PG_GETARG_ARRAYTYPE_P(3), &na, &n_na) ||
		!float8_elements(PG_GETARG_ARRAYTYPE_P(4), &k, &n_k) ||
		n_volume != n_na || n_volume != n_k)
		st = NTR_ERR_ARG;
	if (st == NTR_OK)
	{
		flows = palloc(sizeof(ntr_flow) * (size_t) (n_volume > 0 ? n_volume : 1));
		for (i = 0; i < n_volume; i++)
		{
			flows[i].volume_l = DatumGetFloat8(volume[i]);
			flows[i].na_mmol_l = DatumGetFloat8(na[i]);
			flows[i].k_mmol_l = DatumGetFloat8(k[i]);
		}
		st = ntr_balance_predict(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1), flows,
								 (size_t) n_volume, &na_out, &tbw_out);
	}
	RETURN_DOUBLE(f, checked, st, na_out);
}
NTRPG_PAIR(balance_predict)

static Datum
relower_volume_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_relower_volume_checked"
		: "ntr_relower_volume";
	double		volume = 0.0;
	double		rate = 0.0;
	int			st = ntr_relower_estimate(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
										  PG_GETARG_FLOAT8(2), PG_GETARG_FLOAT8(3),
										  PG_GETARG_FLOAT8(4), PG_GETARG_FLOAT8(5),
										  PG_GETARG_FLOAT8(6), PG_GETARG_FLOAT8(7),
										  PG_GETARG_FLOAT8(8), &volume, &rate);

	RETURN_DOUBLE(f, checked, st, volume);
}
NTRPG_PAIR(relower_volume)

/* ---------------------------------------------------------------------
 * Correction assessment: composite result
 * --------------------------------------------------------------------- */

/* Names of the NTR_CF_* bits, in bit order. */
static const char *const flag_names[] = {
	"over_24h", "over_48h", "below_target", "falling", "near_limit",
	"projected_over", "rapid_6h"
};

static Datum
flags_array(unsigned int flags)
{
	Datum		items[lengthof(flag_names)];
	int			n = 0;
	int			bit;

	for (bit = 0; bit < (int) lengthof(flag_names); bit++)
	{
		if (flags & (1u << bit))
			items[n++] = CStringGetTextDatum(flag_names[bit]);
	}
	return PointerGetDatum(construct_array(items, n, TEXTOID, -1, false,
										   TYPALIGN_INT));
}

PG_FUNCTION_INFO_V1(ntrpg_correction_flag_names);
Datum		ntrpg_correction_flag_names(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_flag_names(PG_FUNCTION_ARGS)
{
	PG_RETURN_DATUM(flags_array((unsigned int) PG_GETARG_INT32(0)));
}

/* The composite ntr_correction row of an assessment. */
static Datum
correction_datum(FunctionCallInfo fcinfo, const ntr_correction *c, int n)
{
	TupleDesc	desc;
	Datum		values[8];
	bool		nulls[8] = {false, false, false, false, false, false, false, false};

	if (get_call_result_type(fcinfo, NULL, &desc) != TYPEFUNC_COMPOSITE)
		ereport(ERROR,
				(errcode(ERRCODE_FEATURE_NOT_SUPPORTED),
				 errmsg("natremia: the result type must be ntr_correction")));
	desc = BlessTupleDesc(desc);
	values[0] = Float8GetDatum(c->rise_first_24h);
	values[1] = Float8GetDatum(c->max_rise_24h);
	values[2] = Float8GetDatum(c->max_rise_48h);
	values[3] = Float8GetDatum(c->last_rate_per_h);
	values[4] = Float8GetDatum(c->excess_mmol_l);
	values[5] = Int32GetDatum((int32) c->flags);
	values[6] = flags_array(c->flags);
	values[7] = Int32GetDatum(n);
	return HeapTupleGetDatum(heap_form_tuple(desc, values, nulls));
}

/* Samples by time, then by sodium: the order of the rows never matters, and
 * of two results at the same moment the lower one counts as earlier, so a
 * difference between them counts as a rise (the cautious reading). */
static int
sample_cmp(const void *a, const void *b)
{
	const ntr_sample *x = (const ntr_sample *) a;
	const ntr_sample *y = (const ntr_sample *) b;

	if (x->hours != y->hours)
		return x->hours < y->hours ? -1 : 1;
	if (x->na_mmol_l != y->na_mmol_l)
		return x->na_mmol_l < y->na_mmol_l ? -1 : 1;
	return 0;
}

/* NaN sorts nowhere sensible; the library rejects it anyway, so sorting is
 * skipped when any value is not finite (the assessment then fails). */
static void
sort_samples(ntr_sample *s, size_t n)
{
	size_t		i;

	for (i = 0; i < n; i++)
	{
		if (!isfinite(s[i].hours) || !isfinite(s[i].na_mmol_l))
			return;
	}
	if (n > 1)
		qsort(s, n, sizeof(ntr_sample), sample_cmp);
}

/* ---------------------------------------------------------------------
 * Aggregate state
 * --------------------------------------------------------------------- */

typedef struct series_state
{
	ntr_limits	limits;			/* the 1.0 aggregates' limits (else zero) */
	ntr_course_limits course;	/* the 1.1 course aggregates' (else zero) */
	int			limits_status;	/* NTR_OK, or why the limits are unusable */
	bool		have_limits;
	size_t		n;
	size_t		capacity;
	ntr_sample *samples;
} series_state;

static series_state *
state_new(MemoryContext context)
{
	series_state *state = MemoryContextAllocZero(context, sizeof(series_state));

	state->capacity = 16;
	state->samples = MemoryContextAlloc(context,
										state->capacity * sizeof(ntr_sample));
	state->limits_status = NTR_OK;
	return state;
}

static void
state_reserve(series_state *state, size_t extra, MemoryContext context)
{
	size_t		need = state->n + extra;
	MemoryContext old;

	if (need <= state->capacity)
		return;
	while (state->capacity < need)
		state->capacity *= 2;
	old = MemoryContextSwitchTo(context);
	state->samples = repalloc_huge(state->samples,
								   state->capacity * sizeof(ntr_sample));
	MemoryContextSwitchTo(old);
}

/* Every row must carry the same limits; a change makes the result invalid.
 * A 1.0 aggregate passes zeroed course limits and a course aggregate
 * zeroed 1.0 limits (both memset, so padding compares equal too). */
static void
state_set_limits(series_state *state, const ntr_limits *lim,
				 const ntr_course_limits *course, int status)
{
	if (!state->have_limits)
	{
		state->limits = *lim;
		/* memcpy, not assignment: the padding must be copied for memcmp. */
		memcpy(&state->course, course, sizeof(ntr_course_limits));
		state->limits_status = status;
		state->have_limits = true;
		return;
	}
	if (state->limits_status == NTR_OK &&
		(status != NTR_OK ||
		 memcmp(&state->limits, lim, sizeof(ntr_limits)) != 0 ||
		 memcmp(&state->course, course, sizeof(ntr_course_limits)) != 0))
		state->limits_status = status != NTR_OK ? status : NTR_ERR_ARG;
}

static series_state *
transition(FunctionCallInfo fcinfo, const ntr_limits *lim,
		   const ntr_course_limits *course, int limits_status)
{
	MemoryContext aggcontext;
	series_state *state;

	if (!AggCheckCallContext(fcinfo, &aggcontext))
		elog(ERROR, "natremia: ntr_correction_assess called outside an aggregate");
	state = PG_ARGISNULL(0) ? state_new(aggcontext)
		: (series_state *) PG_GETARG_POINTER(0);
	state_set_limits(state, lim, course, limits_status);
	/* A row without a time or a sodium is a missing result: skipped. */
	if (!PG_ARGISNULL(1) && !PG_ARGISNULL(2))
	{
		state_reserve(state, 1, aggcontext);
		state->samples[state->n].hours = PG_GETARG_FLOAT8(1);
		state->samples[state->n].na_mmol_l = PG_GETARG_FLOAT8(2);
		state->n++;
	}
	return state;
}

/* Limits from a preset name; on an unknown name the status says so. */
static int
preset_limits(text *name, ntr_limits *lim)
{
	char	   *given = text_to_cstring(name);
	int			i;

	for (i = 0; limit_presets[i].name != NULL; i++)
	{
		if (pg_strcasecmp(given, limit_presets[i].name) == 0)
			return ntr_limits_preset(limit_presets[i].value, lim);
	}
	memset(lim, 0, sizeof *lim);
	return NTR_ERR_ARG;
}

PG_FUNCTION_INFO_V1(ntrpg_correction_transition);
Datum		ntrpg_correction_transition(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_transition(PG_FUNCTION_ARGS)
{
	ntr_limits	lim;
	ntr_course_limits none;
	int			st = ntr_limits_preset(NTR_LIMITS_STANDARD, &lim);

	memset(&none, 0, sizeof none);
	PG_RETURN_POINTER(transition(fcinfo, &lim, &none, st));
}

PG_FUNCTION_INFO_V1(ntrpg_correction_transition_preset);
Datum		ntrpg_correction_transition_preset(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_transition_preset(PG_FUNCTION_ARGS)
{
	ntr_limits	lim;
	ntr_course_limits none;
	int			st;

	memset(&none, 0, sizeof none);
	if (PG_ARGISNULL(3))
	{
		memset(&lim, 0, sizeof lim);
		st = NTR_ERR_ARG;
	}
	else
		st = preset_limits(PG_GETARG_TEXT_PP(3), &lim);
	PG_RETURN_POINTER(transition(fcinfo, &lim, &none, st));
}

PG_FUNCTION_INFO_V1(ntrpg_correction_transition_limits);
Datum		ntrpg_correction_transition_limits(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_transition_limits(PG_FUNCTION_ARGS)
{
	ntr_limits	lim;
	ntr_course_limits none;
	int			st = NTR_OK;

	memset(&lim, 0, sizeof lim);
	memset(&none, 0, sizeof none);
	if (PG_ARGISNULL(3) || PG_ARGISNULL(4) || PG_ARGISNULL(5))
		st = NTR_ERR_ARG;
	else
	{
		lim.max_rise_24h = PG_GETARG_FLOAT8(3);
		lim.max_rise_48h = PG_GETARG_FLOAT8(4);
		lim.min_rise_24h = PG_GETARG_FLOAT8(5);
	}
	PG_RETURN_POINTER(transition(fcinfo, &lim, &none, st));
}

/* Partial aggregation (parallel workers, distributed engines): the sample
 * lists are concatenated; the final function sorts them anyway. */
PG_FUNCTION_INFO_V1(ntrpg_correction_combine);
Datum		ntrpg_correction_combine(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_combine(PG_FUNCTION_ARGS)
{
	MemoryContext aggcontext;
	series_state *a;
	series_state *b;

	if (!AggCheckCallContext(fcinfo, &aggcontext))
		elog(ERROR, "natremia: combine function called outside an aggregate");
	if (PG_ARGISNULL(1))
		PG_RETURN_POINTER(PG_ARGISNULL(0) ? NULL : PG_GETARG_POINTER(0));
	b = (series_state *) PG_GETARG_POINTER(1);
	if (PG_ARGISNULL(0))
	{
		a = state_new(aggcontext);
		a->limits = b->limits;
		memcpy(&a->course, &b->course, sizeof(ntr_course_limits));
		a->limits_status = b->limits_status;
		a->have_limits = b->have_limits;
	}
	else
	{
		a = (series_state *) PG_GETARG_POINTER(0);
		if (b->have_limits)
			state_set_limits(a, &b->limits, &b->course, b->limits_status);
	}
	state_reserve(a, b->n, aggcontext);
	if (b->n > 0)
		memcpy(a->samples + a->n, b->samples, b->n * sizeof(ntr_sample));
	a->n += b->n;
	PG_RETURN_POINTER(a);
}

PG_FUNCTION_INFO_V1(ntrpg_correction_serialize);
Datum		ntrpg_correction_serialize(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_serialize(PG_FUNCTION_ARGS)
{
	series_state *state = (series_state *) PG_GETARG_POINTER(0);
	StringInfoData buf;
	size_t		i;

	pq_begintypsend(&buf);
	pq_sendfloat8(&buf, state->limits.max_rise_24h);
	pq_sendfloat8(&buf, state->limits.max_rise_48h);
	pq_sendfloat8(&buf, state->limits.min_rise_24h);
	pq_sendint64(&buf, (int64) state->course.struct_size);
	pq_sendint32(&buf, (int32) state->course.goal);
	pq_sendfloat8(&buf, state->course.max_rise_24h);
	pq_sendfloat8(&buf, state->course.max_rise_48h);
	pq_sendfloat8(&buf, state->course.max_fall_24h);
	pq_sendfloat8(&buf, state->course.max_fall_48h);
	pq_sendfloat8(&buf, state->course.min_change_24h);
	pq_sendint32(&buf, (int32) state->limits_status);
	pq_sendbyte(&buf, state->have_limits ? 1 : 0);
	pq_sendint64(&buf, (int64) state->n);
	for (i = 0; i < state->n; i++)
	{
		pq_sendfloat8(&buf, state->samples[i].hours);
		pq_sendfloat8(&buf, state->samples[i].na_mmol_l);
	}
	PG_RETURN_BYTEA_P(pq_endtypsend(&buf));
}

PG_FUNCTION_INFO_V1(ntrpg_correction_deserialize);
Datum		ntrpg_correction_deserialize(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_deserialize(PG_FUNCTION_ARGS)
{
	bytea	   *data = PG_GETARG_BYTEA_PP(0);
	MemoryContext aggcontext;
	series_state *state;
	StringInfoData buf;
	size_t		i;
	size_t		n;

	if (!AggCheckCallContext(fcinfo, &aggcontext))
		elog(ERROR, "natremia: deserialize called outside an aggregate");
	initStringInfo(&buf);
	appendBinaryStringInfo(&buf, VARDATA_ANY(data), VARSIZE_ANY_EXHDR(data));
	state = state_new(aggcontext);
	state->limits.max_rise_24h = pq_getmsgfloat8(&buf);
	state->limits.max_rise_48h = pq_getmsgfloat8(&buf);
	state->limits.min_rise_24h = pq_getmsgfloat8(&buf);
	/* state_new() zeroed the struct, padding included (memcmp above). */
	state->course.struct_size = (size_t) pq_getmsgint64(&buf);
	state->course.goal = pq_getmsgint(&buf, 4);
	state->course.max_rise_24h = pq_getmsgfloat8(&buf);
	state->course.max_rise_48h = pq_getmsgfloat8(&buf);
	state->course.max_fall_24h = pq_getmsgfloat8(&buf);
	state->course.max_fall_48h = pq_getmsgfloat8(&buf);
	state->course.min_change_24h = pq_getmsgfloat8(&buf);
	state->limits_status = pq_getmsgint(&buf, 4);
	state->have_limits = pq_getmsgbyte(&buf) != 0;
	n = (size_t) pq_getmsgint64(&buf);
	state_reserve(state, n, aggcontext);
	for (i = 0; i < n; i++)
	{
		state->samples[i].hours = pq_getmsgfloat8(&buf);
		state->samples[i].na_mmol_l = pq_getmsgfloat8(&buf);
	}
	state->n = n;
	pq_getmsgend(&buf);
	PG_RETURN_POINTER(state);
}

/* Sorts, assesses, returns the composite, NULL or an error. */
static Datum
assess_samples(FunctionCallInfo fcinfo, ntr_sample *samples, size_t n,
			   const ntr_limits *lim, int limits_status, bool checked,
			   const char *function)
{
	ntr_correction result;
	int			st = limits_status;

	memset(&result, 0, sizeof result);
	if (st == NTR_OK)
	{
		sort_samples(samples, n);
		st = ntr_correction_assess(samples, n, lim, &result);
	}
	if (st != NTR_OK)
	{
		if (checked)
			report_status(function, st);
		PG_RETURN_NULL();
	}
	PG_RETURN_DATUM(correction_datum(fcinfo, &result, (int) n));
}

static Datum
correction_final(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_correction_assess_checked"
		: "ntr_correction_assess";
	series_state *state;

	/* No rows, or only rows without values: no series, so no result. */
	if (PG_ARGISNULL(0))
		PG_RETURN_NULL();
	state = (series_state *) PG_GETARG_POINTER(0);
	if (state->n == 0)
		PG_RETURN_NULL();
	/* The final function may run more than once on the same state (window
	 * use); sorting in place is harmless because it is idempotent. */
	return assess_samples(fcinfo, state->samples, state->n, &state->limits,
						  state->limits_status, checked, f);
}

PG_FUNCTION_INFO_V1(ntrpg_correction_final);
Datum		ntrpg_correction_final(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_final(PG_FUNCTION_ARGS)
{
	return correction_final(fcinfo, false);
}

PG_FUNCTION_INFO_V1(ntrpg_correction_final_checked);
Datum		ntrpg_correction_final_checked(PG_FUNCTION_ARGS);
Datum
ntrpg_correction_final_checked(PG_FUNCTION_ARGS)
{
	return correction_final(fcinfo, true);
}

/* ---------------------------------------------------------------------
 * The same assessment over two arrays (one call, one series)
 * --------------------------------------------------------------------- */

/* The float8 elements of a one-dimensional array; false when an element is
 * NULL. */
static bool
float8_elements(ArrayType *array, Datum **values, int *n)
{
	bool	   *nulls;
	int			i;

	if (ARR_NDIM(array) > 1)
		return false;
	deconstruct_array(array, FLOAT8OID, sizeof(float8), FLOAT8PASSBYVAL,
					  TYPALIGN_DOUBLE, values, &nulls, n);
	for (i = 0; i < *n; i++)
	{
		if (nulls[i])
			return false;
	}
	return true;
}

/* The series of arguments 0 (hours) and 1 (sodium) as samples, for the
 * series functions of both versions: NTR_ERR_ARG when either array has a
 * NULL element or more than one dimension, the two differ in length, or
 * they are empty. */
static int
samples_from_arrays(FunctionCallInfo fcinfo, ntr_sample **samples, int *n)
{
	Datum	   *hours;
	Datum	   *na;
	int			n_hours;
	int			n_na;
	int			i;

	if (!float8_elements(PG_GETARG_ARRAYTYPE_P(0), &hours, &n_hours) ||
		!float8_elements(PG_GETARG_ARRAYTYPE_P(1), &na, &n_na) ||
		n_hours != n_na || n_hours == 0)
		return NTR_ERR_ARG;
	*samples = palloc(sizeof(ntr_sample) * (size_t) n_hours);
	for (i = 0; i < n_hours; i++)
	{
		(*samples)[i].hours = DatumGetFloat8(hours[i]);
		(*samples)[i].na_mmol_l = DatumGetFloat8(na[i]);
	}
	*n = n_hours;
	return NTR_OK;
}

static Datum
series_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_correction_assess_series_checked"
		: "ntr_correction_assess_series";
	int			n_hours;
	ntr_limits	lim;
	ntr_sample *samples = NULL;
	int			st;

	st = preset_limits(PG_GETARG_TEXT_PP(2), &lim);
	if (st == NTR_OK)
		st = samples_from_arrays(fcinfo, &samples, &n_hours);
	if (st != NTR_OK)
	{
		if (checked)
			report_status(f, st);
		PG_RETURN_NULL();
	}
	return assess_samples(fcinfo, samples, (size_t) n_hours, &lim, NTR_OK,
						  checked, f);
}
NTRPG_PAIR(series)

/* =====================================================================
 * 1.1: the course in both directions (natremia--1.0--1.1.sql)
 *
 * ntr_course_assess(hours, na_mmol_l, preset) and
 * ntr_course_assess(hours, na_mmol_l, goal, max_rise_24h, max_rise_48h,
 * max_fall_24h, max_fall_48h, min_change_24h) collect a series as the 1.0
 * aggregate does (same state, combine, serialize and deserialize) and run
 * ntr_course_assess() once in the final function.
 * ===================================================================== */

static const named_value course_presets[] = {
	{"hypo_standard", NTR_COURSE_HYPO_STANDARD},
	{"hypo_high_risk", NTR_COURSE_HYPO_HIGH_RISK},
	{"hyper_chronic", NTR_COURSE_HYPER_CHRONIC},
	{"hyper_acute", NTR_COURSE_HYPER_ACUTE},
	{"hold", NTR_COURSE_HOLD},
	{NULL, 0}
};
static const named_value goals[] = {
	{"raise", NTR_GOAL_RAISE}, {"lower", NTR_GOAL_LOWER},
	{"hold", NTR_GOAL_HOLD}, {NULL, 0}
};

/* Readable names of the NTR_CF_* bits of a course report, in bit order:
 * the 1.0 rise bits say "rise" so they never read as a fall. */
static const char *const course_flag_names[] = {
	"rise_over_24h", "rise_over_48h", "below_target", "falling",
	"near_limit", "projected_over", "rapid_6h", "fall_over_24h",
	"fall_over_48h", "wrong_way", "approximate", "fall_near_limit",
	"fall_projected_over"
};

static Datum
course_flags_array(unsigned int flags)
{
	Datum		items[lengthof(course_flag_names)];
	int			n = 0;
	int			bit;

	for (bit = 0; bit < (int) lengthof(course_flag_names); bit++)
	{
		if (flags & (1u << bit))
			items[n++] = CStringGetTextDatum(course_flag_names[bit]);
	}
	return PointerGetDatum(construct_array(items, n, TEXTOID, -1, false,
										   TYPALIGN_INT));
}

PG_FUNCTION_INFO_V1(ntrpg_course_flag_names);
Datum		ntrpg_course_flag_names(PG_FUNCTION_ARGS);
Datum
ntrpg_course_flag_names(PG_FUNCTION_ARGS)
{
	PG_RETURN_DATUM(course_flags_array((unsigned int) PG_GETARG_INT32(0)));
}

static const char *
value_name(const named_value *table, int value)
{
	int			i;

	for (i = 0; table[i].name != NULL; i++)
	{
		if (table[i].value == value)
			return table[i].name;
	}
	return "unknown";
}

/* Course limits from a preset name (NTR_ERR_ARG when unknown). */
static int
course_preset_limits(text *name, ntr_course_limits *lim)
{
	char	   *given = text_to_cstring(name);
	int			i;

	memset(lim, 0, sizeof *lim);
	lim->struct_size = sizeof *lim;
	for (i = 0; course_presets[i].name != NULL; i++)
	{
		if (pg_strcasecmp(given, course_presets[i].name) == 0)
			return ntr_course_limits_preset(course_presets[i].value, lim);
	}
	return NTR_ERR_ARG;
}

PG_FUNCTION_INFO_V1(ntrpg_course_transition_preset);
Datum		ntrpg_course_transition_preset(PG_FUNCTION_ARGS);
Datum
ntrpg_course_transition_preset(PG_FUNCTION_ARGS)
{
	ntr_limits	none;
	ntr_course_limits lim;
	int			st;

	memset(&none, 0, sizeof none);
	memset(&lim, 0, sizeof lim);
	if (PG_ARGISNULL(3))
		st = NTR_ERR_ARG;
	else
		st = course_preset_limits(PG_GETARG_TEXT_PP(3), &lim);
	PG_RETURN_POINTER(transition(fcinfo, &none, &lim, st));
}

PG_FUNCTION_INFO_V1(ntrpg_course_transition_limits);
Datum		ntrpg_course_transition_limits(PG_FUNCTION_ARGS);
Datum
ntrpg_course_transition_limits(PG_FUNCTION_ARGS)
{
	ntr_limits	none;
	ntr_course_limits lim;
	int			st = NTR_OK;
	int			arg;
	int			goal = 0;

	memset(&none, 0, sizeof none);
	memset(&lim, 0, sizeof lim);
	lim.struct_size = sizeof lim;
	for (arg = 3; arg <= 8; arg++)
	{
		if (PG_ARGISNULL(arg))
			st = NTR_ERR_ARG;
	}
	if (st == NTR_OK &&
		!lookup_name(PG_GETARG_TEXT_PP(3), goals, "goal", "ntr_course_assess",
					 false, &goal))
		st = NTR_ERR_ARG;
	if (st == NTR_OK)
	{
		lim.goal = goal;
		lim.max_rise_24h = PG_GETARG_FLOAT8(4);
		lim.max_rise_48h = PG_GETARG_FLOAT8(5);
		lim.max_fall_24h = PG_GETARG_FLOAT8(6);
		lim.max_fall_48h = PG_GETARG_FLOAT8(7);
		lim.min_change_24h = PG_GETARG_FLOAT8(8);
	}
	PG_RETURN_POINTER(transition(fcinfo, &none, &lim, st));
}

/* The composite ntr_course_report row of an assessment. */
static Datum
course_datum(FunctionCallInfo fcinfo, const ntr_course_report *r,
			 const ntr_course_limits *lim, int n)
{
	TupleDesc	desc;
	Datum		values[16];
	bool		nulls[16];

	memset(nulls, 0, sizeof nulls);
	if (get_call_result_type(fcinfo, NULL, &desc) != TYPEFUNC_COMPOSITE)
		ereport(ERROR,
				(errcode(ERRCODE_FEATURE_NOT_SUPPORTED),
				 errmsg("natremia: the result type must be ntr_course_report")));
	desc = BlessTupleDesc(desc);
	values[0] = CStringGetTextDatum(value_name(goals, lim->goal));
	values[1] = Float8GetDatum(r->max_rise_24h);
	values[2] = Float8GetDatum(r->max_rise_48h);
	values[3] = Float8GetDatum(r->max_fall_24h);
	values[4] = Float8GetDatum(r->max_fall_48h);
	values[5] = Float8GetDatum(r->excess_mmol_l);
	values[6] = Int32GetDatum((int32) r->flags);
	values[7] = course_flags_array(r->flags);
	values[8] = Float8GetDatum(r->rise_first_24h);
	values[9] = Float8GetDatum(r->fall_first_24h);
	values[10] = Float8GetDatum(r->rise_now_24h);
	values[11] = Float8GetDatum(r->fall_now_24h);
	values[12] = Float8GetDatum(r->last_rate_per_h);
	values[13] = Float8GetDatum(r->elapsed_h);
	values[14] = Float8GetDatum(r->worst_at_h);
	nulls[14] = r->worst_at_h == NTR_COURSE_NO_TIME;
	values[15] = Int32GetDatum(n);
	return HeapTupleGetDatum(heap_form_tuple(desc, values, nulls));
}

/* Sorts, assesses, returns the composite, NULL or an error. */
static Datum
course_samples(FunctionCallInfo fcinfo, ntr_sample *samples, size_t n,
			   const ntr_course_limits *lim, int limits_status, bool checked,
			   const char *function)
{
	ntr_course_report report;
	int			st = limits_status;

	memset(&report, 0, sizeof report);
	report.struct_size = sizeof report;
	if (st == NTR_OK)
	{
		sort_samples(samples, n);
		st = ntr_course_assess(samples, n, lim, &report);
	}
	if (st != NTR_OK)
	{
		if (checked)
			report_status(function, st);
		PG_RETURN_NULL();
	}
	PG_RETURN_DATUM(course_datum(fcinfo, &report, lim, (int) n));
}

static Datum
course_final(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_course_assess_checked" : "ntr_course_assess";
	series_state *state;

	if (PG_ARGISNULL(0))
		PG_RETURN_NULL();
	state = (series_state *) PG_GETARG_POINTER(0);
	if (state->n == 0)
		PG_RETURN_NULL();
	return course_samples(fcinfo, state->samples, state->n, &state->course,
						  state->limits_status, checked, f);
}

PG_FUNCTION_INFO_V1(ntrpg_course_final);
Datum		ntrpg_course_final(PG_FUNCTION_ARGS);
Datum
ntrpg_course_final(PG_FUNCTION_ARGS)
{
	return course_final(fcinfo, false);
}

PG_FUNCTION_INFO_V1(ntrpg_course_final_checked);
Datum		ntrpg_course_final_checked(PG_FUNCTION_ARGS);
Datum
ntrpg_course_final_checked(PG_FUNCTION_ARGS)
{
	return course_final(fcinfo, true);
}

/* One series given as two arrays, with a preset. */
static Datum
course_series_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_course_assess_series_checked"
		: "ntr_course_assess_series";
	int			n_hours;
	ntr_course_limits lim;
	ntr_sample *samples = NULL;
	int			st;

	st = course_preset_limits(PG_GETARG_TEXT_PP(2), &lim);
	if (st == NTR_OK)
		st = samples_from_arrays(fcinfo, &samples, &n_hours);
	if (st != NTR_OK)
	{
		if (checked)
			report_status(f, st);
		PG_RETURN_NULL();
	}
	return course_samples(fcinfo, samples, (size_t) n_hours, &lim, NTR_OK,
						  checked, f);
}
NTRPG_PAIR(course_series)

/* The limits of a preset as a row (goal, the five limits). */
static Datum
course_limits_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_course_limits_preset_checked"
		: "ntr_course_limits_preset";
	ntr_course_limits lim;
	TupleDesc	desc;
	Datum		values[6];
	bool		nulls[6];
	int			st = course_preset_limits(PG_GETARG_TEXT_PP(0), &lim);

	if (st != NTR_OK)
	{
		if (checked)
			report_status(f, st);
		PG_RETURN_NULL();
	}
	memset(nulls, 0, sizeof nulls);
	if (get_call_result_type(fcinfo, NULL, &desc) != TYPEFUNC_COMPOSITE)
		ereport(ERROR,
				(errcode(ERRCODE_FEATURE_NOT_SUPPORTED),
				 errmsg("natremia: the result type must be ntr_course_limits")));
	desc = BlessTupleDesc(desc);
	values[0] = CStringGetTextDatum(value_name(goals, lim.goal));
	values[1] = Float8GetDatum(lim.max_rise_24h);
	values[2] = Float8GetDatum(lim.max_rise_48h);
	values[3] = Float8GetDatum(lim.max_fall_24h);
	values[4] = Float8GetDatum(lim.max_fall_48h);
	values[5] = Float8GetDatum(lim.min_change_24h);
	PG_RETURN_DATUM(HeapTupleGetDatum(heap_form_tuple(desc, values, nulls)));
}
NTRPG_PAIR(course_limits)

/* ---------------------------------------------------------------------
 * 1.1: tonicity judged on the effective osmolality
 * --------------------------------------------------------------------- */

/* Names of the NTR_LOW_NA_* bits, in bit order. */
static const char *const low_na_flag_names[] = {
	"not_hypotonic", "pseudo", "translocational", "glucose_explains",
	"discordant", "ineffective_osmoles"
};

static Datum
low_na_flags_array(unsigned int flags)
{
	Datum		items[lengthof(low_na_flag_names)];
	int			n = 0;
	int			bit;

	for (bit = 0; bit < (int) lengthof(low_na_flag_names); bit++)
	{
		if (flags & (1u << bit))
			items[n++] = CStringGetTextDatum(low_na_flag_names[bit]);
	}
	return PointerGetDatum(construct_array(items, n, TEXTOID, -1, false,
										   TYPALIGN_INT));
}

static Datum
low_na_effective_tonicity_impl(FunctionCallInfo fcinfo, bool checked)
{
	static const char *const words[] = {"", "hypotonic", "isotonic", "hypertonic"};
	const char *f = checked ? "ntr_low_na_effective_tonicity_checked"
		: "ntr_low_na_effective_tonicity";
	int			method;
	int			tonicity = 0;
	unsigned int flags = 0;
	int			st;
	TupleDesc	desc;
	Datum		values[3];
	bool		nulls[3] = {false, false, false};

	LOOKUP_OR_NULL(5, glucose_methods, "glucose_method", f, checked, method);
	st = ntr_low_na_effective_tonicity(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
									   PG_GETARG_FLOAT8(2), PG_GETARG_FLOAT8(3),
									   PG_GETARG_FLOAT8(4), method, &tonicity,
									   &flags);
	if (st == NTR_OK && (tonicity < 1 || tonicity >= (int) lengthof(words)))
		st = NTR_ERR_ARG;		/* a newer library with a new class */
	if (st != NTR_OK)
	{
		if (checked)
			report_status(f, st);
		PG_RETURN_NULL();
	}
	if (get_call_result_type(fcinfo, NULL, &desc) != TYPEFUNC_COMPOSITE)
		ereport(ERROR,
				(errcode(ERRCODE_FEATURE_NOT_SUPPORTED),
				 errmsg("natremia: the result type must be ntr_low_na_tonicity")));
	desc = BlessTupleDesc(desc);
	values[0] = CStringGetTextDatum(words[tonicity]);
	values[1] = Int32GetDatum((int32) flags);
	values[2] = low_na_flags_array(flags);
	PG_RETURN_DATUM(HeapTupleGetDatum(heap_form_tuple(desc, values, nulls)));
}
NTRPG_PAIR(low_na_effective_tonicity)

static Datum
effective_osm_measured_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_effective_osm_measured_checked"
		: "ntr_effective_osm_measured";
	double		out = 0.0;
	int			st = ntr_effective_osm_measured(PG_GETARG_FLOAT8(0),
												PG_GETARG_FLOAT8(1),
												PG_GETARG_FLOAT8(2),
												PG_GETARG_FLOAT8(3),
												PG_GETARG_FLOAT8(4), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(effective_osm_measured)

/* ---------------------------------------------------------------------
 * Solute and restriction; fractional urate excretion (since 1.1)
 * --------------------------------------------------------------------- */

static const named_value solutes[] = {
	{"urea", NTR_SOLUTE_UREA}, {"nacl", NTR_SOLUTE_NACL}, {NULL, 0}
};

static Datum
urine_volume_from_solute_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_urine_volume_from_solute_checked"
		: "ntr_urine_volume_from_solute";
	double		out = 0.0;
	int			st = ntr_urine_volume_from_solute(PG_GETARG_FLOAT8(0),
												  PG_GETARG_FLOAT8(1), &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(urine_volume_from_solute)

static Datum
fluid_allowance_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_fluid_allowance_checked" : "ntr_fluid_allowance";
	double		out = 0.0;
	int			st = ntr_fluid_allowance(PG_GETARG_FLOAT8(0), PG_GETARG_FLOAT8(1),
										 PG_GETARG_FLOAT8(2), PG_GETARG_FLOAT8(3),
										 PG_GETARG_FLOAT8(4), PG_GETARG_FLOAT8(5),
										 &out);

	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(fluid_allowance)

static Datum
solute_dose_osmoles_impl(FunctionCallInfo fcinfo, bool checked)
{
	const char *f = checked ? "ntr_solute_dose_osmoles_checked"
		: "ntr_solute_dose_osmoles";
	double		out = 0.0;
	int			solute;
	int			st;

	LOOKUP_OR_NULL(0, solutes, "solute", f, checked, solute);
	st = ntr_solute_dose_osmoles(solute, PG_GETARG_FLOAT8(1), &out);
	RETURN_DOUBLE(f, checked, st, out);
}
NTRPG_PAIR(solute_dose_osmoles)

static Datum
fe_uric_acid_class_impl(FunctionCallInfo fcinfo, bool checked)
{
	static const char *const words[] = {"", "against_siad", "indeterminate",
	"supports_siad"};
	const char *f = checked ? "ntr_fe_uric_acid_class_checked"
		: "ntr_fe_uric_acid_class";
	int			fe_class = 0;
	int			st = ntr_fe_uric_acid_class(PG_GETARG_FLOAT8(0), &fe_class);

	if (st == NTR_OK && (fe_class < 1 || fe_class >= (int) lengthof(words)))
		st = NTR_ERR_ARG;		/* a newer library with a new class */
	RETURN_WORD(f, checked, st, words[st == NTR_OK ? fe_class : 0]);
}
NTRPG_PAIR(fe_uric_acid_class)
