# Reference values for OmicsScreen's random survival forests, computed by R's general-purpose
# ranger (Wright & Ziegler 2017; Debian r-cran-ranger) and survival (r-cran-survival) packages.
# Deterministic: run from this folder with `Rscript make_survival_forest_reference.R`; it writes
# survival_forest.csv and survival_forest_reference.json. See README.md here.
#
# Data: 200 invented samples (ids SF-001..), 20 markers N(0, 1) rounded to 2 decimals (at most
# 200 distinct values per marker, so binned and exact splits coincide); event times exponential
# with hazard 0.1 exp(0.8 x1 - 0.6 x2 + 0.7 [x3 > 0]), censoring uniform on (0, 12), times
# rounded to 0.01. Markers x4..x20 do not enter the hazard.
suppressPackageStartupMessages({ library(ranger); library(survival); library(jsonlite) })
set.seed(20261204)
n <- 200; p <- 20
x <- matrix(round(rnorm(n * p), 2), n, p)
colnames(x) <- paste0("x", 1:p)
hazard <- 0.1 * exp(0.8 * x[, 1] - 0.6 * x[, 2] + 0.7 * (x[, 3] > 0))
event_time <- rexp(n, hazard)
censor_time <- runif(n, 0, 12)
time <- round(pmin(event_time, censor_time), 2)
time[time == 0] <- 0.01
status <- as.integer(event_time <= censor_time)
data <- data.frame(sample = sprintf("SF-%03d", 1:n), time = time, status = status, x)
write.csv(data, "survival_forest.csv", row.names = FALSE, quote = FALSE)
d <- data[, -1]

# Root split of one tree on every row with every marker tried: marker and threshold (mid-point).
root <- ranger(Surv(time, status) ~ ., data = d, num.trees = 1, mtry = p, replace = FALSE, sample.fraction = 1,
               max.depth = 1, min.node.size = 1, splitrule = "logrank", seed = 1, num.threads = 1)
info <- treeInfo(root, 1)

seeds <- 1:10
ranger_error <- c(); ranger_c_survival <- c()
for (seed in seeds) {
  rf <- ranger(Surv(time, status) ~ ., data = d, num.trees = 500, mtry = floor(sqrt(p)), min.node.size = 1,
               replace = TRUE, sample.fraction = 1, splitrule = "logrank", seed = seed, num.threads = 2)
  ranger_error <- c(ranger_error, rf$prediction.error)
  mortality <- rowSums(rf$chf)  # out-of-bag ensemble cumulative hazard summed over the event times
  ranger_c_survival <- c(ranger_c_survival, concordance(Surv(time, status) ~ mortality, data = d, reverse = TRUE)$concordance)
}
# Per-marker statistics: Cox model (Efron ties) hazard ratio per SD with its Wald interval, the
# score-test p-value, Harrell's C of the marker as a risk score, BH q-values over the 20 markers.
univariate <- lapply(1:p, function(j) {
  v <- d[[paste0("x", j)]]
  fit <- coxph(Surv(time, status) ~ I(v / sd(v)), data = d)
  s <- summary(fit)
  list(marker = paste0("x", j), hr_per_sd = unname(s$conf.int[1, "exp(coef)"]),
       hr_lower = unname(s$conf.int[1, "lower .95"]), hr_upper = unname(s$conf.int[1, "upper .95"]),
       score_p = unname(s$sctest["pvalue"]),
       concordance = unname(concordance(Surv(time, status) ~ v, data = d, reverse = TRUE)$concordance))
})
score_p <- sapply(univariate, function(u) u$score_p)
q <- p.adjust(score_p, "BH")
for (j in 1:p) univariate[[j]]$q <- q[j]
# Per-cohort Cox models of x1 and x2 in two invented cohorts (samples 1-100, 101-200), the marker
# in units of its SD over all 200 samples: log hazard ratio and standard error per cohort.
cohort_cox <- lapply(c("x1", "x2"), function(m) {
  v <- d[[m]] / sd(d[[m]])
  fits <- lapply(list(1:100, 101:200), function(rows) coxph(Surv(time, status) ~ v[rows], data = d[rows, ]))
  list(marker = m, log_hr = sapply(fits, function(f) unname(coef(f))), se = sapply(fits, function(f) unname(sqrt(diag(vcov(f))))))
})
out <- list(
  versions = list(R = as.character(getRversion()), ranger = as.character(packageVersion("ranger")),
                  survival = as.character(packageVersion("survival"))),
  events = sum(status), samples = n,
  univariate = univariate,
  cohort_cox = cohort_cox,
  root_split = list(marker = info$splitvarName[1], threshold = info$splitval[1]),
  forest = list(trees = 500, features_per_split = floor(sqrt(p)), seeds = seeds,
                ranger_prediction_error = ranger_error,
                oob_concordance_survival_convention = unname(ranger_c_survival))
)
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "survival_forest_reference.json")
cat("events", sum(status), "root", info$splitvarName[1], info$splitval[1], "C", mean(ranger_c_survival), sd(ranger_c_survival), "\n")
