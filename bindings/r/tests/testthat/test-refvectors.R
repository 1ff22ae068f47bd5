# SPDX-License-Identifier: MIT
# The reference vectors of the C library (tests/refvectors/expected.txt,
# every function's results on a fixed input set as exact %a doubles): each
# line of a function this package exposes is recomputed here, vectorised
# over all the lines of that function, and must match bit for bit --
# identical() on the doubles and the same %a text, so -0 and 0 differ too.
#
# tests/r/build-package.sh copies the file into tests/testthat/refvectors/;
# NATREMIA_REFVECTORS names another copy.

refvectors_file <- function() {
    env <- Sys.getenv("NATREMIA_REFVECTORS")
    for (f in c(env, test_path("refvectors", "expected.txt"))) {
        if (nzchar(f) && file.exists(f)) {
            return(f)
        }
    }
    if (identical(Sys.getenv("NATREMIA_R_REQUIRE_ALL"), "1")) {
        stop("reference vectors not found")
    }
    NULL
}

ref_lines <- local({
    cache <- NULL
    function() {
        if (is.null(cache)) {
            f <- refvectors_file()
            if (is.null(f)) {
                skip("reference vectors not found (tests/r/build-package.sh copies them)")
            }
            cache <<- readLines(f)
        }
        cache
    }
})

hex <- function(s) {
    v <- as.numeric(s)
    # R reads C99 hex floats exactly; the %a text must round-trip as well.
    stopifnot(all(sprintf("%a", v) == s | s %in% c("nan", "-nan")))
    v
}

# Scalar lines "name #i en... | nums -> status results" of one function.
scalar_cases <- function(name) {
    l <- grep(paste0("^", name, " #"), ref_lines(), value = TRUE)
    expect_gt(length(l), 0)
    parts <- strsplit(l, " -> ", fixed = TRUE)
    lhs <- vapply(parts, `[`, "", 1L)
    rhs <- strsplit(vapply(parts, `[`, "", 2L), " ", fixed = TRUE)
    head <- lapply(strsplit(sub(" \\|.*$", "", lhs), " ", fixed = TRUE),
                   function(h) h[-(1:2)])
    nums <- lapply(trimws(sub("^[^|]*\\|", "", lhs)), function(s) {
        if (!nzchar(s)) character(0) else strsplit(s, " ", fixed = TRUE)[[1L]]
    })
    list(en = lapply(head, as.integer),
         num = lapply(nums, hex),
         status = vapply(rhs, function(r) as.integer(r[1L]), 1L),
         out = lapply(rhs, function(r) r[-1L]))
}

col_num <- function(cs, k) vapply(cs$num, `[`, 0, k)
col_en <- function(cs, k) vapply(cs$en, `[`, 0L, k)

# Compare a vectorised result with the file: statuses, NA in failed rows,
# and the first result of each successful row bit for bit.
expect_matches_ref <- function(got, cs, rows = seq_along(cs$status), k = 1L) {
    want_status <- cs$status[rows]
    expect_identical(row_status(got), want_status)
    ok <- want_status == 0L
    expect_true(all(is.na(got[!ok])))
    want_text <- vapply(cs$out[rows][ok], `[`, "", k)
    got_ok <- as.double(as.vector(got))[ok]
    expect_identical(got_ok, hex(want_text))
    expect_identical(sprintf("%a", got_ok), want_text)
    invisible(sum(ok))
}

test_that("status messages are the C library's", {
    l <- grep("^ntr_status_message ", ref_lines(), value = TRUE)
    code <- as.integer(sub("^ntr_status_message (-?[0-9]+) -> .*$", "\\1", l))
    text <- sub("^ntr_status_message -?[0-9]+ -> ", "", l)
    expect_identical(status_message(code), text)
})

test_that("reference vectors: osmolality", {
    cs <- scalar_cases("ntr_osm_calculated")
    formula <- col_en(cs, 1L)
    for (f in unique(formula)) {
        r <- formula == f
        got <- osm_calculated(col_num(cs, 1)[r], col_num(cs, 2)[r],
                              col_num(cs, 3)[r], col_num(cs, 4)[r], formula = f)
        expect_matches_ref(got, cs, which(r))
    }
    cs <- scalar_cases("ntr_osm_effective")
    expect_matches_ref(osm_effective(col_num(cs, 1), col_num(cs, 2)), cs)
    cs <- scalar_cases("ntr_osm_gap")
    expect_matches_ref(osm_gap(col_num(cs, 1), col_num(cs, 2)), cs)
})

test_that("reference vectors: sodium and water", {
    cs <- scalar_cases("ntr_na_corrected_glucose")
    method <- col_en(cs, 1L)
    for (m in unique(method)) {
        r <- method == m
        got <- na_corrected_glucose(col_num(cs, 1)[r], col_num(cs, 2)[r], method = m)
        expect_matches_ref(got, cs, which(r))
    }
    cs <- scalar_cases("ntr_na_deficit")
    expect_matches_ref(na_deficit(col_num(cs, 1), col_num(cs, 2), col_num(cs, 3)), cs)
    cs <- scalar_cases("ntr_tbw_fraction")
    expect_matches_ref(tbw_fraction(col_en(cs, 1), col_num(cs, 1), col_num(cs, 2)), cs)
    cs <- scalar_cases("ntr_tbw_watson")
    expect_matches_ref(tbw_watson(col_en(cs, 1), col_num(cs, 1), col_num(cs, 2),
                                  col_num(cs, 3)), cs)
    cs <- scalar_cases("ntr_free_water_deficit")
    expect_matches_ref(free_water_deficit(col_num(cs, 1), col_num(cs, 2)), cs)
})

test_that("reference vectors: infusion, urine, work-up, units", {
    cs <- scalar_cases("ntr_infusate_change_per_litre")
    expect_matches_ref(infusate_change_per_litre(col_num(cs, 1), col_num(cs, 2),
                                                 col_num(cs, 3), col_num(cs, 4)), cs)
    cs <- scalar_cases("ntr_infusate_change")
    expect_matches_ref(infusate_change(col_num(cs, 1), col_num(cs, 2), col_num(cs, 3),
                                       col_num(cs, 4), col_num(cs, 5)), cs)
    cs <- scalar_cases("ntr_infusate_volume_for_change")
    expect_matches_ref(infusate_volume_for_change(col_num(cs, 1), col_num(cs, 2),
                                                  col_num(cs, 3), col_num(cs, 4),
                                                  col_num(cs, 5)), cs)
    cs <- scalar_cases("ntr_furst_ratio")
    expect_matches_ref(furst_ratio(col_num(cs, 1), col_num(cs, 2), col_num(cs, 3)), cs)
    cs <- scalar_cases("ntr_restriction_from_ratio")
    expect_matches_ref(restriction_from_ratio(col_num(cs, 1)), cs)
    cs <- scalar_cases("ntr_efwc")
    expect_matches_ref(efwc(col_num(cs, 1), col_num(cs, 2), col_num(cs, 3),
                            col_num(cs, 4)), cs)
    cs <- scalar_cases("ntr_na_severity")
    expect_matches_ref(na_severity(col_num(cs, 1)), cs)
    cs <- scalar_cases("ntr_tonicity_class")
    expect_matches_ref(tonicity_class(col_num(cs, 1)), cs)
    cs <- scalar_cases("ntr_convert")
    expect_gt(expect_matches_ref(convert(col_en(cs, 1), col_num(cs, 1), col_en(cs, 2),
                                         col_en(cs, 3)), cs), 10)
    cs <- scalar_cases("ntr_fluid_preset")
    fp <- fluid_preset(col_en(cs, 1))
    expect_matches_ref(fp$na, cs, k = 1L)
    expect_matches_ref(fp$k, cs, k = 2L)
})

# Batch lines: "name -> status failed k", then "name row i | cols -> status out".
# The generator passes the scalar function's baseline option to the whole
# call (2*Na formula, Katz) and sex male, female, male, ... by row.
batch_cases <- function(name) {
    l <- ref_lines()
    top <- grep(paste0("^", name, " -> "), l, value = TRUE)
    expect_length(top, 1L)
    failed <- as.integer(sub("^.* failed ([0-9]+)$", "\\1", top))
    rows <- grep(paste0("^", name, " row "), l, value = TRUE)
    parts <- strsplit(sub("^.* \\| ", "", rows), " -> ", fixed = TRUE)
    cols <- lapply(parts, function(p) hex(strsplit(p[1L], " ", fixed = TRUE)[[1L]]))
    rhs <- strsplit(vapply(parts, `[`, "", 2L), " ", fixed = TRUE)
    list(failed = failed, num = cols,
         status = vapply(rhs, function(r) as.integer(r[1L]), 1L),
         out = lapply(rhs, function(r) r[-1L]))
}

test_that("reference vectors: batch calls", {
    sex <- rep_len(c(1L, 2L), 12L)
    calls <- list(
        ntr_batch_osm_calculated = function(col) osm_calculated(col(1), col(2), col(3), col(4), formula = "2na"),
        ntr_batch_osm_effective = function(col) osm_effective(col(1), col(2)),
        ntr_batch_osm_gap = function(col) osm_gap(col(1), col(2)),
        ntr_batch_na_corrected_glucose = function(col) na_corrected_glucose(col(1), col(2), method = "katz"),
        ntr_batch_tbw_fraction = function(col) tbw_fraction(sex, col(1), col(2)),
        ntr_batch_tbw_watson = function(col) tbw_watson(sex, col(1), col(2), col(3)),
        ntr_batch_free_water_deficit = function(col) free_water_deficit(col(1), col(2)),
        ntr_batch_na_deficit = function(col) na_deficit(col(1), col(2), col(3)),
        ntr_batch_infusate_change_per_litre = function(col) infusate_change_per_litre(col(1), col(2), col(3), col(4)),
        ntr_batch_infusate_change = function(col) infusate_change(col(1), col(2), col(3), col(4), col(5)),
        ntr_batch_infusate_volume_for_change = function(col) infusate_volume_for_change(col(1), col(2), col(3), col(4), col(5)),
        ntr_batch_furst_ratio = function(col) furst_ratio(col(1), col(2), col(3)),
        ntr_batch_efwc = function(col) efwc(col(1), col(2), col(3), col(4)))
    for (name in names(calls)) {
        bc <- batch_cases(name)
        col <- function(k) vapply(bc$num, `[`, 0, k)
        got <- calls[[name]](col)
        expect_length(got, 12L)
        expect_identical(sum(row_status(got) != 0L), bc$failed)
        expect_matches_ref(got, bc)
    }
    bc <- batch_cases("ntr_batch_restriction_from_ratio")
    got <- restriction_from_ratio(vapply(bc$num, `[`, 0, 1L))
    expect_identical(row_status(got), bc$status)
    ok <- bc$status == 0L
    expect_identical(as.vector(got)[ok], as.integer(vapply(bc$out[ok], `[`, "", 1L)))
    expect_true(all(is.na(got[!ok])))
})
