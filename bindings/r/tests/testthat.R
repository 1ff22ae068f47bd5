library(testthat)
library(natremia)

test_check("natremia")
