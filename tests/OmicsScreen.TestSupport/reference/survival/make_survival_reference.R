# Reference values for OmicsScreen's survival statistics, computed by R's general-purpose
# survival package (Therneau; Debian r-cran-survival) and MASS (r-cran-mass, for the gehan data).
# Deterministic: run from this folder with `Rscript make_survival_reference.R`; it rewrites
# survival_reference.json. See README.md here for provenance and licences.
suppressPackageStartupMessages({ library(survival); library(MASS); library(jsonlite) })

describe <- function(name, time, status, x, note) {
  surv <- Surv(time, status)
  km <- survfit(surv ~ 1)
  reverse_km <- survfit(Surv(time, 1 - status) ~ 1)
  group <- as.integer(x > median(x))
  lr <- survdiff(surv ~ group)
  efron <- coxph(surv ~ x)
  scaled <- coxph(surv ~ I((x - mean(x)) / sd(x)))
  conc <- concordance(surv ~ x, reverse = TRUE)
  event_rows <- km$n.event > 0
  list(
    name = name, note = note,
    time = time, status = status, x = x,
    km_time = km$time[event_rows], km_n_risk = km$n.risk[event_rows],
    km_n_event = km$n.event[event_rows], km_survival = km$surv[event_rows],
    # survfit's std.err is the SE of the cumulative hazard (log survival); Greenwood's SE of S is surv * std.err.
    km_greenwood_se = (km$surv * km$std.err)[event_rows],
    km_cumhaz_nelson_aalen = km$cumhaz[event_rows],
    km_median = unname(summary(km)$table["median"]),
    reverse_km_median = unname(summary(reverse_km)$table["median"]),
    logrank_group = group, logrank_chisq = lr$chisq,
    logrank_p = pchisq(lr$chisq, 1, lower.tail = FALSE),
    cox_efron_coef = unname(coef(efron)), cox_efron_se = unname(sqrt(diag(vcov(efron)))),
    cox_efron_loglik = efron$loglik,
    cox_efron_score_chisq = unname(summary(efron)$sctest["test"]),
    cox_efron_score_p = unname(summary(efron)$sctest["pvalue"]),
    cox_efron_wald_p = unname(summary(efron)$waldtest["pvalue"]),
    cox_efron_per_sd_hr = unname(exp(coef(scaled))),
    cox_efron_per_sd_hr_lower = unname(summary(scaled)$conf.int[1, "lower .95"]),
    cox_efron_per_sd_hr_upper = unname(summary(scaled)$conf.int[1, "upper .95"]),
    concordance_higher_is_riskier = unname(conc$concordance),
    concordance_var = unname(conc$var),
    concordance_count = as.list(conc$count)
  )
}

data(gehan)
gehan_set <- describe("gehan", gehan$time, gehan$cens, as.numeric(gehan$treat == "control"),
  "Freireich et al. (1963) remission times of 42 leukaemia patients as MASS::gehan; x = 1 for the control (placebo) arm")

# The North Central Cancer Treatment Group lung cancer data (Loprinzi et al. 1994, J Clin Oncol
# 12:601-607; 228 patients with advanced lung cancer) as distributed with the survival package:
# status 2 = died, 1 = censored; the marker is age in years (no missing values).
data(cancer, package = "survival")
lung_set <- describe("lung", lung$time, as.integer(lung$status == 2), as.numeric(lung$age),
  "Loprinzi et al. (1994) NCCTG advanced lung cancer, 228 patients, survival::lung; time in days, x = age in years")

set.seed(20261204)
n <- 120
x <- round(rnorm(n), 3)
event_time <- rexp(n, rate = 0.1 * exp(0.6 * x))
censor_time <- runif(n, 2, 25)
synthetic_continuous <- describe("invented_continuous",
  round(pmin(event_time, censor_time), 1), as.integer(event_time <= censor_time), x,
  "invented: x ~ N(0,1), exponential event times with hazard 0.1 exp(0.6 x), uniform censoring on [2, 25], times rounded to 0.1 (some ties)")

n <- 80
x <- round(rnorm(n), 2)
event_time <- rexp(n, rate = 0.2 * exp(-0.8 * x))
censor_time <- runif(n, 1, 12)
synthetic_ties <- describe("invented_heavy_ties",
  ceiling(pmin(event_time, censor_time)), as.integer(event_time <= censor_time), x,
  "invented: hazard 0.2 exp(-0.8 x) (a protective marker), uniform censoring on [1, 12], times rounded up to whole units (heavy ties, events and censorings at the same time)")

out <- list(
  versions = list(R = R.version.string, survival = as.character(packageVersion("survival")),
                  MASS = as.character(packageVersion("MASS"))),
  data_sets = list(gehan_set, synthetic_continuous, synthetic_ties, lung_set))
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "survival_reference.json")
