# SPDX-License-Identifier: MIT
# Results against published sources (each check names its source; the
# values are those of /work/shared/sources.md where it lists them, and
# marked "from memory" or "common practice" where it does not).

test_that("Watson body water (Watson, Watson, Batt, Am J Clin Nutr 1980;33:27-39)", {
    # men: 2.447 - 0.09516*age + 0.1074*height + 0.3362*weight
    expect_equal(tbw_watson("male", 50, 175, 75),
                 2.447 - 0.09516 * 50 + 0.1074 * 175 + 0.3362 * 75, tolerance = 1e-12)
    # women: -2.097 + 0.1069*height + 0.2466*weight (no age term)
    expect_equal(tbw_watson("female", c(30, 70), 165, 60),
                 rep(-2.097 + 0.1069 * 165 + 0.2466 * 60, 2), tolerance = 1e-12)
})

test_that("body-water fractions (Adrogue & Madias, N Engl J Med 2000;342:1581-9; from memory)", {
    # 0.6 men, 0.5 women, 0.5 older men, 0.45 older women
    expect_equal(tbw_fraction(c("male", "female", "male", "female"),
                              c(40, 40, 70, 70), 60),
                 c(36, 30, 30, 27))
})

test_that("glucose-corrected sodium (Katz 1973; Hillier 1999)", {
    # 1.6 (Katz) and 2.4 (Hillier) mmol/L per 100 mg/dL above 100 mg/dL;
    # 33.3 mmol/L of glucose is 33.3 * 18.0156 mg/dL.
    g <- 33.3 * 18.0156
    expect_equal(na_corrected_glucose(125, 33.3, method = "katz"),
                 125 + 1.6 * (g - 100) / 100, tolerance = 1e-12)
    expect_equal(na_corrected_glucose(125, 33.3, method = "hillier"),
                 125 + 2.4 * (g - 100) / 100, tolerance = 1e-12)
    # no correction at or below the 100 mg/dL reference
    expect_identical(na_corrected_glucose(130, 5), 130)
})

test_that("Dorwart-Chalmers osmolality (Dorwart & Chalmers, Clin Chem 1975;21:190-4)", {
    # 1.86*Na + glucose + urea + 9 in mmol/L (the paper's mg/dL divisors
    # 18 and 2.8 turn its inputs into these)
    expect_equal(osm_calculated(140, 5, 5, formula = "dorwart_chalmers"),
                 1.86 * 140 + 5 + 5 + 9, tolerance = 1e-12)
    expect_identical(osm_calculated(140, 5, 5), 2 * 140 + 5 + 5)
})

test_that("effective osmolality, severity and tonicity (Spasovski et al., Eur J Endocrinol 2014;170:G1-47)", {
    expect_identical(osm_effective(126, 30), 2 * 126 + 30)
    # mild 130-135, moderate 125-129, profound below 125
    expect_identical(na_severity(c(135, 134.9, 130, 129.9, 125, 124.9)),
                     c(0L, 1L, 1L, 2L, 2L, 3L))
    # below 275 mOsm/kg is hypotonic
    expect_identical(tonicity_class(c(274.9, 275, 295, 295.1)), c(1L, 2L, 2L, 3L))
})

test_that("the Furst worked example (Furst et al., Am J Med Sci 2000;319:240-4)", {
    # Na 108, TBW 30 L, 3% saline (513 mmol/L): the paper's 292 mL reaches
    # about 112 (a rise of about 3.9); the exact inverse gives 375 mL for +5.
    rise <- infusate_change(na = 108, tbw = 30, infusate_na = 513, volume = 0.292)
    expect_equal(rise, 0.292 * (513 - 108) / 30.292, tolerance = 1e-12)
    expect_equal(round(108 + rise), 112)
    expect_equal(infusate_volume_for_change(na = 108, tbw = 30, infusate_na = 513,
                                            target_delta = 5), 0.375, tolerance = 1e-12)
    expect_identical(fluid_preset("nacl_3")$na, 513)
})

test_that("Furst ratio bands (Furst et al. 2000; Verbalis et al., Am J Med 2013)", {
    r <- furst_ratio(urine_na = c(60, 90, 120), urine_k = c(20, 25, 40), serum_na = 125)
    expect_equal(r, c(80, 115, 160) / 125)
    # below 1: under 1 L/day; about 1: 500-700 mL; above 1: under 500 mL
    expect_identical(restriction_from_ratio(r), c(1L, 2L, 3L))
})

test_that("water deficit and EFWC (textbook formulas: common practice; Rose & Post 5th ed.)", {
    expect_equal(free_water_deficit(tbw = 42, na = 160), 42 * (160 / 140 - 1))
    expect_equal(efwc(1.5, 60, 30, 130), 1.5 * (1 - 90 / 130))
    expect_equal(na_deficit(30, 120, 126), 180)
})

test_that("unit conversion by molar mass (glucose C6H12O6 180.156 g/mol, IUPAC)", {
    expect_equal(convert("glucose", 5.5, "mmol/L", "mg/dL"), 5.5 * 180.156 / 10,
                 tolerance = 1e-12)
    expect_identical(convert("sodium", 140, "mmol/L", "meq/L"), 140)
    expect_identical(unit_parse(c("mmol/L", "mg/dL")), c(1L, 2L))
})

test_that("correction limits per patient (Spasovski 2014; Verbalis 2013; Adrogue & Madias, N Engl J Med 2000;342:1493-9)", {
    # Invented series. The European limit is 10 mmol/L in the first 24 h:
    # a rise of 12 is over by 2; a rise of 8 is within it. The US panel's
    # 8 in any 24 h for high-risk patients flags 9.
    d <- data.frame(id = c("a", "a", "a", "b", "b", "c", "c"),
                    hours = c(0, 12, 24, 0, 24, 0, 24),
                    na = c(118, 124, 130, 120, 128, 110, 119))
    a <- course_assess(d, limits = "hypo_standard")
    expect_s3_class(a, "natremia_course")
    expect_identical(a$id, c("a", "b", "c"))
    expect_identical(a$n, c(3L, 2L, 2L))
    expect_identical(a$max_rise_24h, c(12, 8, 9))
    expect_identical(a$over_24h, c(TRUE, FALSE, FALSE))
    expect_identical(a$excess_mmol_l, c(2, 0, 0))
    expect_identical(a$worst_at_h, c(24, NA, NA))
    h <- course_assess(d, limits = "hypo_high_risk")
    expect_identical(h$over_24h, c(TRUE, FALSE, TRUE))
    # Chronic hypernatraemia: lower by at most about 10 per day.
    hy <- data.frame(id = c(1, 1, 1, 2, 2), hours = c(0, 12, 24, 0, 24),
                     na = c(162, 156, 150, 158, 150))
    r <- course_assess(hy, limits = "hyper_chronic")
    expect_identical(r$max_fall_24h, c(12, 8))
    expect_identical(r$fall_over_24h, c(TRUE, FALSE))
    expect_identical(r$last_rate_per_h, c(-0.5, -8 / 24))
    # The same fall with the goal "raise" moved the wrong way (more than
    # the library's 4 mmol/L analytical margin, from memory).
    w <- course_assess(hy, limits = "hypo_standard")
    expect_identical(w$wrong_way, c(TRUE, TRUE))
})
