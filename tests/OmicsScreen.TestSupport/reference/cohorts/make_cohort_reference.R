# Reference values for the cohort check's outcome-cohort association tests, computed by R's
# general-purpose survival package (Therneau; Debian r-cran-survival) and base R's stats.
# Deterministic: run from this folder with `Rscript make_cohort_reference.R`; it writes lung_groups.csv
# and cohort_reference.json. See README.md here.
#
# Data: R's survival::lung (NCCTG advanced lung cancer, Loprinzi et al. 1994, J Clin Oncol 12:601),
# the 227 patients with an ECOG performance score, grouped by that score (0, 1, 2, 3) as if each
# score were a cohort.
suppressPackageStartupMessages({ library(survival); library(jsonlite) })
d <- survival::lung[!is.na(survival::lung$ph.ecog), c("time", "status", "ph.ecog", "age")]
d$status <- as.integer(d$status == 2)
write.csv(d, "lung_groups.csv", row.names = FALSE, quote = FALSE)
g <- factor(d$ph.ecog)

# k-sample log-rank test of the four groups.
sd <- survdiff(Surv(time, status) ~ g, data = d)
logrank_df <- length(sd$n) - 1
logrank_p <- pchisq(sd$chisq, logrank_df, lower.tail = FALSE)

# Two groups only (scores 0 and 1), as a second case.
d01 <- d[d$ph.ecog <= 1, ]
sd01 <- survdiff(Surv(time, status) ~ ph.ecog, data = d01)

# Martingale residuals of the model with no covariate: event minus the Nelson-Aalen cumulative
# hazard at the patient's own time; their correlation ratio on group (R^2 of a one-way model).
fit <- survfit(Surv(time, status) ~ 1, data = d, ctype = 1)
cumhaz <- fit$cumhaz[match(d$time, fit$time)]
residual <- d$status - cumhaz
eta2_martingale <- summary(lm(residual ~ g))$r.squared

# Kruskal-Wallis test of age across the groups (ties corrected); its H is (n - 1) eta^2 of the ranks.
kw <- kruskal.test(age ~ g, data = d)
eta2_ranks <- summary(lm(rank(d$age) ~ g))$r.squared

out <- list(
  versions = list(R = paste(R.version$major, R.version$minor, sep = "."), survival = as.character(packageVersion("survival"))),
  samples = nrow(d),
  logrank_chisq = unname(sd$chisq), logrank_df = logrank_df, logrank_p = logrank_p,
  logrank01_chisq = unname(sd01$chisq), logrank01_p = pchisq(sd01$chisq, 1, lower.tail = FALSE),
  martingale_first = unname(residual[1:5]),
  eta2_martingale = eta2_martingale,
  kruskal_h = unname(kw$statistic), kruskal_p = kw$p.value, eta2_ranks = eta2_ranks
)
write_json(out, "cohort_reference.json", digits = NA, auto_unbox = TRUE, pretty = TRUE)
