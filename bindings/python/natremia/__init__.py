# SPDX-License-Identifier: MIT
"""natremia: sodium and water arithmetic for clinical software.

A ctypes binding of the natremia C library. Scalar functions live here
(``natremia.osm_calculated(na_mmol_l=..., glucose_mmol_l=..., ...)``);
numpy array versions that call the C batch entry points live in
``natremia.arrays`` (imported on first use, so numpy stays optional).
Since 1.1 the course functions (``course_assess``, ``course_limits_preset``,
``arrays.course_assess_table``) assess a sodium series in both directions
against a goal; the 1.0 calls stay as they were.

Every result is an estimate for decision support, not an order. Verify
with measured values; follow local protocols and licensed clinical
judgement.
"""

from ._core import (  # noqa: F401
    OK, ERR_NULL, ERR_NONFINITE, ERR_RANGE, ERR_UNIT, ERR_DOMAIN, ERR_ORDER,
    ERR_CAPACITY, ERR_ARG, STATUS_NAMES,
    NatremiaError, status_name, status_message, version, method_info, methods,
    library_path, InputKind, InputRange, input_range,
    MethodInfo,
    Unit, Analyte, OsmFormula, GlucoseMethod, Sex, Fluid, Restriction,
    LimitsPreset, CorrectionFlag, OdsFactor,
    unit_parse, convert,
    osm_calculated, osm_effective, osm_gap,
    na_corrected_glucose, na_corrected_glucose_factor, na_deficit,
    tbw_fraction, tbw_watson, free_water_deficit,
    FluidComposition, fluid_preset, infusate_change_per_litre, infusate_change,
    infusate_volume_for_change,
    furst_ratio, restriction_from_ratio, efwc,
    Severity, Tonicity, LowNaFlag, LowNaTonicity, na_severity, tonicity_class,
    low_na_tonicity, urine_maximally_dilute, urine_na_high,
    fractional_excretion,
    Limits, Correction, limits_preset, ods_risk, OdsRisk, correction_assess,
    Watch,
    Flow, TimedFlow, BalanceResult, balance_predict, balance_course,
    PlanResult, plan_check, RelowerEstimate, relower_estimate,
    low_na_effective_tonicity, effective_osm_measured,
    Solute, urine_volume_from_solute, fluid_allowance, solute_dose_osmoles,
    FeUricAcidClass, fe_uric_acid_class,
)
from ._course import (  # noqa: F401
    Goal, CoursePreset, CourseFlag, FLAG_LABELS, flag_labels, CourseLimits,
    CourseReport, course_limits_preset, course_preset_names, course_assess,
    BreachDirection, CoursePlanResult, course_plan_check, CourseWatch,
)
from ._units import (  # noqa: F401
    Specimen, LoincInfo, ANALYTE_OSMOLALITY, ANALYTE_URIC_ACID, UNIT_TEXT_MAX,
    unit_parse_lenient, loinc_lookup, glucose_unit_check, convert_array,
)
from ._fit import (  # noqa: F401
    FitFlag, FIT_FLAG_LABELS, CourseFit, course_fit, fit_reproject,
    FeedbackFlag, FEEDBACK_FLAG_LABELS, UrineFeedback, urine_feedback,
    urine_interval_flow,
)

__version__ = "1.1.0"

CAUTION = ("Estimates for decision support, not orders. Verify with measured "
           "values; follow local protocols and licensed clinical judgement.")


def __getattr__(name):
    # natremia.arrays needs numpy: load it only when asked for (and
    # natremia.fhir, the FHIR R4 reader, likewise).
    if name in ("arrays", "fhir"):
        import importlib
        return importlib.import_module("." + name, __name__)
    raise AttributeError("module 'natremia' has no attribute %r" % (name,))
