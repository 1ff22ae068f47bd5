# SPDX-License-Identifier: MIT
library(testthat)
library(natremia)

test_check("natremia")
