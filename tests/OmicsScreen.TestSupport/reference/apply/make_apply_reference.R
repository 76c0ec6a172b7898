# Reference values for what `apply` reports on a validation cohort, computed with R and its
# general-purpose survival package (Therneau; Debian r-cran-survival) on public data, so that the
# C# tests can check them without R. Deterministic: run from this folder with
#   Rscript make_apply_reference.R
# which rewrites apply_reference.json. See README.md here for provenance.
suppressPackageStartupMessages({ library(survival); library(jsonlite) })

# --- Time-dependent AUC, cumulative/dynamic with IPCW -------------------------------------------
# No Debian package of timeROC exists here (apt-cache policy r-cran-timeroc: none), so the
# estimator is written out from its definition, a second implementation independent of the C#:
#   AUC(t) = sum_i sum_j w_i [1{M_i > M_j} + 0.5 1{M_i = M_j}] 1{T_i <= t, d_i = 1} 1{T_j > t}
#            / (sum_i w_i 1{T_i <= t, d_i = 1} * #{j : T_j > t}),
#   w_i = 1 / G(T_i-), G the Kaplan-Meier of the censoring times (survfit(Surv(T, 1 - d))),
# which is timeROC(..., cause = 1, weighting = "marginal")'s estimator (Blanche et al. 2013,
# Stat Med 32:5381; Uno et al. 2007; Heagerty, Lumley & Pepe 2000). Controls share the weight
# 1 / G(t), which cancels. Pairs are enumerated by brute force (no sorting tricks).
censoring_before <- function(time, status) {
  fit <- survfit(Surv(time, 1 - status) ~ 1)
  # G(u-): the product over censoring times strictly before u.
  sapply(time, function(u) {
    before <- fit$time < u
    if (!any(before)) 1 else min(fit$surv[before])
  })
}

cumulative_dynamic_auc <- function(time, status, marker, horizon) {
  g <- censoring_before(time, status)
  cases <- which(time <= horizon & status == 1)
  controls <- which(time > horizon)
  numerator <- 0
  for (i in cases) {
    credit <- sum(marker[i] > marker[controls]) + 0.5 * sum(marker[i] == marker[controls])
    numerator <- numerator + credit / g[i]
  }
  list(auc = numerator / (sum(1 / g[cases]) * length(controls)),
       cases = length(cases), controls = length(controls),
       censored_before = sum(time <= horizon & status == 0))
}

data(cancer, package = "survival")
lung_complete <- lung[!is.na(lung$ph.ecog) & !is.na(lung$ph.karno), ]
time <- lung_complete$time
status <- as.integer(lung_complete$status == 2)   # 1 = censored, 2 = dead in the data set
markers <- list(
  age = lung_complete$age,                                  # many distinct values, some ties
  ph_ecog = lung_complete$ph.ecog,                          # four values: heavy ties
  minus_ph_karno = -lung_complete$ph.karno,                 # higher Karnofsky score = fitter, so negated
  cox_linear_predictor = unname(predict(coxph(Surv(time, status) ~ age + sex + ph.ecog, data = lung_complete), type = "lp"))
)
horizons <- c(180, 365, 540)
auc_sets <- list()
for (name in names(markers)) {
  for (h in horizons) {
    r <- cumulative_dynamic_auc(time, status, markers[[name]], h)
    auc_sets[[length(auc_sets) + 1]] <- list(marker = name, horizon = h, auc = r$auc, cases = r$cases,
                                             controls = r$controls, censored_before = r$censored_before)
  }
}

# Harrell's C of the same markers with R's concordance (higher marker = higher risk) and the 95%
# interval C +- qnorm(0.975) sqrt(var), var being the infinitesimal jackknife variance.
concordance_sets <- lapply(names(markers), function(name) {
  fit <- concordance(Surv(time, status) ~ markers[[name]], reverse = TRUE)
  se <- sqrt(fit$var)
  list(marker = name, concordance = unname(fit$concordance), se = se,
       lower = unname(fit$concordance) - qnorm(0.975) * se, upper = unname(fit$concordance) + qnorm(0.975) * se)
})

# The log-rank test of the Cox linear predictor cut at its median (high = above), survdiff.
lp <- markers$cox_linear_predictor
high <- as.integer(lp > median(lp))
lr <- survdiff(Surv(time, status) ~ high)

# --- Calibration line: ordinary least squares with lm ------------------------------------------
# R's cars data (Ezekiel 1930: stopping distance against speed of 50 cars), read as "observed"
# (dist) regressed on "predicted" (speed): slope, intercept, their 95% t intervals, residual SE.
fit <- lm(dist ~ speed, data = cars)
ci <- confint(fit, level = 0.95)
calibration <- list(
  predicted = cars$speed, observed = cars$dist,
  intercept = unname(coef(fit)[1]), slope = unname(coef(fit)[2]),
  intercept_lower = unname(ci[1, 1]), intercept_upper = unname(ci[1, 2]),
  slope_lower = unname(ci[2, 1]), slope_upper = unname(ci[2, 2]),
  residual_standard_error = summary(fit)$sigma)

out <- list(
  versions = list(r = paste(R.version$major, R.version$minor, sep = "."), survival = as.character(packageVersion("survival"))),
  lung = list(note = "survival::lung (Loprinzi et al. 1994) rows with ph.ecog and ph.karno recorded; status 1 = died",
              time = time, status = status, markers = markers),
  time_dependent_auc = auc_sets,
  concordance = concordance_sets,
  logrank_cox_lp_median = list(high = high, chisq = lr$chisq, p = pchisq(lr$chisq, 1, lower.tail = FALSE)),
  calibration_cars = calibration)
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "apply_reference.json")
