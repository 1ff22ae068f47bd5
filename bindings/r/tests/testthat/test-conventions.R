# SPDX-License-Identifier: MIT
# The package's conventions (?natremia): recycling, failed rows as NA with
# a status, options, the course assessment's grouping. Inputs invented.

test_that("arguments recycle to the longest; a length that does not divide it is an error", {
    expect_identical(osm_effective(c(120, 130, 140), 5), c(245, 265, 285))
    expect_identical(osm_effective(c(120, 130), c(5, 10, 5, 10)), c(245, 270, 245, 270))
    expect_error(osm_effective(c(120, 130), c(5, 6, 7)), "does not divide")
    expect_identical(osm_effective(numeric(0), 5), numeric(0))
    expect_identical(tbw_fraction(c("m", "F", "female"), 40, c(60, 50, 70)), c(36, 25, 35))
})

test_that("a failed row is NA with its status and reason; the others are computed", {
    x <- osm_effective(c(120, NA, 300, 140), c(5, 5, 5, Inf))
    expect_identical(as.vector(x), c(245, NA, NA, NA))
    expect_identical(row_status(x), c(0L, 2L, 3L, 2L))
    expect_identical(row_reason(x)[c(1, 3)],
                     c("success", "an input was outside its plausible range"))
    clean <- osm_effective(120, 5)
    expect_null(attributes(clean))
    expect_identical(row_status(clean), 0L)
    s <- tbw_fraction(c("male", NA, "other"), 40, 60)
    expect_identical(row_status(s), c(0L, 8L, 8L))
    expect_identical(row_status(free_water_deficit(42, 130)), 5L)
    expect_identical(row_status(convert("sodium", 140, "mmol/L", c("mg/dL", "furlong"))),
                     c(0L, 4L))
    expect_true(is.na(restriction_from_ratio(NA)))
    expect_identical(row_status(na_severity(c(NA, 50))), c(2L, 3L))
})

test_that("options are checked for the whole call", {
    expect_error(osm_calculated(140, 5, 5, formula = "guess"), "unknown formula")
    expect_error(na_corrected_glucose(125, 30, method = 3), "unknown method")
    expect_identical(osm_calculated(140, 5, 5, formula = 2),
                     osm_calculated(140, 5, 5, formula = "Dorwart_Chalmers"))
    expect_error(course_limits_preset("fast"), "unknown preset")
})

test_that("course_assess groups by id in order of appearance and keeps each series as given", {
    d <- data.frame(pid = c(7, 3, 7, 3, 9, 9, 5),
                    h = c(0, 0, 24, 24, 24, 0, 0),
                    s = c(120, 125, 128, 127, 130, 131, NA))
    a <- course_assess(d, id = "pid", hours = "h", na = "s")
    expect_identical(a$pid, c(7, 3, 9, 5))
    expect_identical(a$status, c(0L, 0L, 6L, 2L))
    expect_identical(a$reason[3], "the series is not in time order")
    expect_true(all(is.na(unlist(a[3:4, c("max_rise_24h", course_flag_names())]))))
    expect_identical(a$max_rise_24h[1:2], c(8, 2))
    expect_error(course_assess(d, id = "patient"), "no column")
    lim <- course_limits("raise", max_rise_24h = 6, max_rise_48h = 12)
    expect_identical(course_assess(d[1:4, ], id = "pid", hours = "h", na = "s",
                                   limits = lim)$over_24h, c(TRUE, FALSE))
    expect_error(course_assess(d, id = "pid", hours = "h", na = "s",
                               limits = course_limits("raise", max_rise_24h = 20,
                                                      max_rise_48h = 10)),
                 "plausible range")
    expect_identical(course_limits_preset("hypo_standard")[c("goal", "max_rise_24h", "max_rise_48h")],
                     list(goal = "raise", max_rise_24h = 10, max_rise_48h = 18))
})

test_that("printed output carries the caution", {
    d <- data.frame(id = 1, hours = c(0, 24), na = c(120, 126))
    out <- capture.output(print(course_assess(d)))
    expect_match(out[1], "decision support, not orders")
})
