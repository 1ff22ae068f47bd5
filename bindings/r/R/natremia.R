# SPDX-License-Identifier: MIT
# natremia for R: vectorised wrappers of the C library (src/natremia_r.c).
#
# Conventions, the same for every function (see ?natremia):
# - recycling: the numeric arguments are recycled to the longest one; a
#   zero-length argument gives a zero-length result; a length that does not
#   divide the longest is an error.
# - a row the library refuses (NA or out-of-range input, an unknown sex, ...)
#   is NA in the result; attribute "status" (integer, 0 = success) is set
#   when at least one row failed, and row_status()/row_reason() read it.

.caution <- paste(
    "natremia: estimates for decision support, not orders;",
    "verify with measured values; follow local protocols and licensed",
    "clinical judgement.")

.onAttach <- function(libname, pkgname) {
    packageStartupMessage(.caution)
}

# Private numbers of the batch functions (the enum in src/natremia_r.c).
.batch_id <- c(
    osm_calculated = 1L, osm_effective = 2L, osm_gap = 3L,
    na_corrected_glucose = 4L, tbw_fraction = 5L, tbw_watson = 6L,
    free_water_deficit = 7L, na_deficit = 8L,
    infusate_change_per_litre = 9L, infusate_change = 10L,
    infusate_volume_for_change = 11L, furst_ratio = 12L,
    restriction_from_ratio = 13L, efwc = 14L)

# Enumerator values of include/natremia.h (ABI, fixed).
.osm_formulas <- c("2na" = 1L, dorwart_chalmers = 2L)
.glucose_methods <- c(katz = 1L, hillier = 2L)
.sexes <- c(male = 1L, m = 1L, female = 2L, f = 2L)
.analytes <- c(sodium = 1L, potassium = 2L, chloride = 3L, glucose = 4L,
               urea = 5L, urea_nitrogen = 6L, creatinine = 7L, ethanol = 8L)
.fluids <- c(nacl_0_9 = 1L, nacl_3 = 2L, nacl_5 = 3L, nacl_0_45 = 4L,
             ringer_lactate = 5L, dextrose_5 = 6L, nacl_0_2_dextrose_5 = 7L)
.course_presets <- c(hypo_standard = 1L, hypo_high_risk = 2L,
                     hyper_chronic = 3L, hyper_acute = 4L, hold = 5L)
.goals <- c(raise = 1L, lower = 2L, hold = 3L)
# Bits of ntr_course_report.flags, by name (NTR_CF_*).
.course_flags <- c(over_24h = 1, over_48h = 2, below_target = 4,
                   falling = 8, near_limit = 16, projected_over = 32,
                   rapid_6h = 64, fall_over_24h = 128, fall_over_48h = 256,
                   wrong_way = 512, approximate = 1024,
                   fall_near_limit = 2048, fall_projected_over = 4096)
.course_columns <- c("max_rise_24h", "max_rise_48h", "max_fall_24h",
                     "max_fall_48h", "excess_mmol_l", "rise_first_24h",
                     "fall_first_24h", "rise_now_24h", "fall_now_24h",
                     "last_rate_per_h", "elapsed_h", "worst_at_h", "flags",
                     "reserved")

# One option given as a name (case-blind) or its integer value.
.option <- function(x, table, what) {
    if (length(x) != 1L || is.na(x)) {
        stop(sprintf("natremia: '%s' must be one value", what), call. = FALSE)
    }
    if (is.numeric(x)) {
        if (!(x %in% table)) {
            stop(sprintf("natremia: unknown %s %s", what, format(x)),
                 call. = FALSE)
        }
        return(as.integer(x))
    }
    v <- table[tolower(as.character(x))]
    if (is.na(v)) {
        stop(sprintf("natremia: unknown %s '%s' (one of %s)", what, x,
                     paste(names(table), collapse = ", ")), call. = FALSE)
    }
    unname(v)
}

# A per-row enumerator: names or integers; NA and unknown names become 0,
# which the library refuses for that row alone (status 8).
.row_option <- function(x, table) {
    if (is.numeric(x)) {
        v <- as.integer(x)
    } else {
        v <- unname(table[tolower(as.character(x))])
    }
    v[is.na(v)] <- 0L
    v
}

# Recycle the arguments (a named list) to the longest length.
.recycle <- function(args) {
    lens <- vapply(args, length, 1L)
    if (any(lens == 0L)) {
        return(lapply(args, function(a) a[0L]))
    }
    n <- max(lens)
    bad <- names(args)[n %% lens != 0L]
    if (length(bad) > 0L) {
        stop(sprintf(paste("natremia: length of %s does not divide the",
                           "longest argument's length %d"),
                     paste(sQuote(bad, FALSE), collapse = ", "), n),
             call. = FALSE)
    }
    lapply(args, function(a) rep_len(a, n))
}

.as_double <- function(args) {
    lapply(args, function(a) {
        if (!is.numeric(a) && !is.logical(a)) {
            stop("natremia: numeric arguments expected", call. = FALSE)
        }
        as.double(a)
    })
}

# Result of one call: NA rows already set in C; the status attribute when a
# row failed.
.finish <- function(value, status) {
    if (any(status != 0L)) {
        attr(value, "status") <- status
    }
    value
}

.batch <- function(name, nums, call_en = NA_integer_, row_en = NULL) {
    if (!is.null(row_en)) {
        nums <- c(list(.row_en = row_en), nums)
    }
    args <- .recycle(nums)
    if (!is.null(row_en)) {
        row_en <- .row_option(args$.row_en, .sexes)
        args$.row_en <- NULL
    }
    cols <- .as_double(args)
    r <- .Call(r_batch, .batch_id[[name]], unname(cols), as.integer(call_en),
               row_en)
    value <- if (name == "restriction_from_ratio") r[[3L]] else r[[1L]]
    .finish(value, r[[2L]])
}

version_string <- function() .Call(r_version)

status_message <- function(status) {
    .Call(r_status_message, as.integer(status))
}

row_status <- function(x) {
    s <- attr(x, "status", exact = TRUE)
    if (is.null(s)) {
        s <- integer(if (is.data.frame(x)) nrow(x) else length(x))
    }
    s
}

row_reason <- function(x) {
    status_message(row_status(x))
}

unit_parse <- function(ucum) {
    r <- .Call(r_unit_parse, as.character(ucum))
    .finish(r[[3L]], r[[2L]])
}

# A unit: a UCUM string ("mg/dL") or a unit code.
.unit_codes <- function(u) {
    if (is.numeric(u)) {
        v <- as.integer(u)
    } else {
        v <- as.integer(unit_parse(u))
    }
    v[is.na(v)] <- 0L
    v
}

convert <- function(analyte, value, from_unit, to_unit) {
    args <- .recycle(list(analyte = analyte, value = value,
                          from_unit = from_unit, to_unit = to_unit))
    an <- .row_option(args$analyte, .analytes)
    r <- .Call(r_convert, an, as.double(args$value),
               .unit_codes(args$from_unit), .unit_codes(args$to_unit))
    .finish(r[[1L]], r[[2L]])
}

osm_calculated <- function(na, glucose, urea, ethanol = 0, formula = "2na") {
    .batch("osm_calculated", list(na = na, glucose = glucose, urea = urea,
                                  ethanol = ethanol),
           call_en = .option(formula, .osm_formulas, "formula"))
}

osm_effective <- function(na, glucose) {
    .batch("osm_effective", list(na = na, glucose = glucose))
}

osm_gap <- function(measured, calculated) {
    .batch("osm_gap", list(measured = measured, calculated = calculated))
}

na_corrected_glucose <- function(na, glucose, method = "hillier") {
    .batch("na_corrected_glucose", list(na = na, glucose = glucose),
           call_en = .option(method, .glucose_methods, "method"))
}

tbw_fraction <- function(sex, age, weight) {
    .batch("tbw_fraction", list(age = age, weight = weight), row_en = sex)
}

tbw_watson <- function(sex, age, height, weight) {
    .batch("tbw_watson", list(age = age, height = height, weight = weight),
           row_en = sex)
}

free_water_deficit <- function(tbw, na) {
    .batch("free_water_deficit", list(tbw = tbw, na = na))
}

na_deficit <- function(tbw, na, target_na) {
    .batch("na_deficit", list(tbw = tbw, na = na, target_na = target_na))
}

fluid_preset <- function(fluid) {
    f <- .row_option(fluid, .fluids)
    r <- .Call(r_fluid_preset, f)
    df <- data.frame(fluid = if (is.numeric(fluid)) f else as.character(fluid),
                     na = r[[1L]], k = r[[3L]], stringsAsFactors = FALSE)
    .finish(df, r[[2L]])
}

infusate_change_per_litre <- function(na, tbw, infusate_na, infusate_k = 0) {
    .batch("infusate_change_per_litre",
           list(na = na, tbw = tbw, infusate_na = infusate_na,
                infusate_k = infusate_k))
}

infusate_change <- function(na, tbw, infusate_na, infusate_k = 0, volume) {
    .batch("infusate_change",
           list(na = na, tbw = tbw, infusate_na = infusate_na,
                infusate_k = infusate_k, volume = volume))
}

infusate_volume_for_change <- function(na, tbw, infusate_na, infusate_k = 0,
                                       target_delta) {
    .batch("infusate_volume_for_change",
           list(na = na, tbw = tbw, infusate_na = infusate_na,
                infusate_k = infusate_k, target_delta = target_delta))
}

furst_ratio <- function(urine_na, urine_k, serum_na) {
    .batch("furst_ratio", list(urine_na = urine_na, urine_k = urine_k,
                               serum_na = serum_na))
}

restriction_from_ratio <- function(ratio) {
    .batch("restriction_from_ratio", list(ratio = ratio))
}

efwc <- function(urine_volume, urine_na, urine_k, serum_na) {
    .batch("efwc", list(urine_volume = urine_volume, urine_na = urine_na,
                        urine_k = urine_k, serum_na = serum_na))
}

na_severity <- function(na) {
    r <- .Call(r_classify, 1L, as.double(na))
    .finish(r[[3L]], r[[2L]])
}

tonicity_class <- function(measured_osm) {
    r <- .Call(r_classify, 2L, as.double(measured_osm))
    .finish(r[[3L]], r[[2L]])
}

# ---- course limits and the per-patient assessment ----------------------

.limits_list <- function(v) {
    list(goal = names(.goals)[match(as.integer(v[1L]), .goals)],
         max_rise_24h = v[2L], max_rise_48h = v[3L], max_fall_24h = v[4L],
         max_fall_48h = v[5L], min_change_24h = v[6L])
}

course_limits_preset <- function(preset) {
    p <- .option(preset, .course_presets, "preset")
    .limits_list(.Call(r_course_limits_preset, p))
}

course_limits <- function(goal, max_rise_24h = 0, max_rise_48h = 0,
                          max_fall_24h = 0, max_fall_48h = 0,
                          min_change_24h = 0) {
    .option(goal, .goals, "goal")
    list(goal = tolower(goal), max_rise_24h = as.double(max_rise_24h),
         max_rise_48h = as.double(max_rise_48h),
         max_fall_24h = as.double(max_fall_24h),
         max_fall_48h = as.double(max_fall_48h),
         min_change_24h = as.double(min_change_24h))
}

course_flag_names <- function() names(.course_flags)

.limits_vector <- function(limits) {
    if (is.character(limits) && length(limits) == 1L) {
        limits <- course_limits_preset(limits)
    }
    if (!is.list(limits)) {
        stop("natremia: 'limits' is a preset name or a list from course_limits()",
             call. = FALSE)
    }
    c(as.double(.option(limits$goal, .goals, "goal")),
      as.double(limits$max_rise_24h), as.double(limits$max_rise_48h),
      as.double(limits$max_fall_24h), as.double(limits$max_fall_48h),
      as.double(limits$min_change_24h))
}

course_assess <- function(data, id = "id", hours = "hours", na = "na",
                          limits = "hypo_standard") {
    if (!is.data.frame(data)) {
        stop("natremia: 'data' must be a data frame", call. = FALSE)
    }
    for (col in c(id, hours, na)) {
        if (!(col %in% names(data))) {
            stop(sprintf("natremia: no column '%s' in 'data'", col),
                 call. = FALSE)
        }
    }
    lim <- .limits_vector(limits)
    ids <- data[[id]]
    # Patients in order of first appearance; each patient's rows in the
    # order given (the library refuses a series out of time order rather
    # than this function sorting it silently).
    key <- factor(as.character(ids), levels = unique(as.character(ids)))
    rows <- split(seq_len(nrow(data)), key)
    idx <- unlist(rows, use.names = FALSE)
    offsets <- c(0, cumsum(vapply(rows, length, 1L)))
    r <- .Call(r_course_assess, as.double(offsets),
               as.double(data[[hours]])[idx], as.double(data[[na]])[idx],
               lim)
    m <- r[[1L]]
    colnames(m) <- .course_columns
    status <- r[[2L]]
    first <- vapply(rows, function(i) i[1L], 1L)
    out <- data.frame(id = ids[first], n = vapply(rows, length, 1L),
                      status = status, reason = status_message(status),
                      stringsAsFactors = FALSE)
    names(out)[1L] <- id
    for (k in setdiff(.course_columns, c("flags", "reserved"))) {
        out[[k]] <- m[, k]
    }
    # The library's "no window over" time (NTR_COURSE_NO_TIME) is NA here.
    out$worst_at_h[!is.na(out$worst_at_h) & out$worst_at_h == -1e9] <- NA
    flags <- m[, "flags"]
    out$flags <- as.integer(flags)
    for (f in names(.course_flags)) {
        out[[f]] <- ifelse(is.na(flags), NA,
                           (flags %/% .course_flags[[f]]) %% 2 == 1)
    }
    rownames(out) <- NULL
    attr(out, "limits") <- .limits_list(lim)
    class(out) <- c("natremia_course", "data.frame")
    out
}

print.natremia_course <- function(x, ...) {
    cat(.caution, "\n", sep = "")
    lim <- attr(x, "limits")
    if (!is.null(lim)) {
        cat(sprintf(paste("limits: goal %s; rise 24 h %g, 48 h %g;",
                          "fall 24 h %g, 48 h %g; target 24 h %g\n"),
                    lim$goal, lim$max_rise_24h, lim$max_rise_48h,
                    lim$max_fall_24h, lim$max_fall_48h, lim$min_change_24h))
    }
    y <- x
    attr(y, "limits") <- NULL
    class(y) <- "data.frame"
    print(y, ...)
    invisible(x)
}
