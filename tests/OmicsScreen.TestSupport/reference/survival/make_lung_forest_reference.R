# Reference values for OmicsScreen's random survival forests on public data, computed by R's
# general-purpose ranger (Wright & Ziegler 2017; Debian r-cran-ranger) and survival
# (r-cran-survival) packages. Deterministic: run from this folder with
# `Rscript make_lung_forest_reference.R`; it writes lung_forest.csv and lung_forest_reference.json.
#
# Data: the North Central Cancer Treatment Group advanced lung cancer data (Loprinzi et al. 1994,
# J Clin Oncol 12:601-607) as distributed with the survival package (survival::lung, LGPL >= 2),
# the patients with every one of the seven clinical measurements present (167 of 228). Time in
# days; status 1 = died (the package codes it 2), 0 = censored. Sample ids are row numbers of the
# package's table (LU-001..), not patient identifiers.
suppressPackageStartupMessages({ library(ranger); library(survival); library(jsonlite) })
data(cancer, package = "survival")
markers <- c("age", "sex", "ph.ecog", "ph.karno", "pat.karno", "meal.cal", "wt.loss")
rows <- which(complete.cases(lung[, markers]))
d <- data.frame(time = lung$time[rows], status = as.integer(lung$status[rows] == 2), lung[rows, markers])
names(d) <- c("time", "status", gsub(".", "_", markers, fixed = TRUE))
write.csv(data.frame(sample = sprintf("LU-%03d", rows), d), "lung_forest.csv", row.names = FALSE, quote = FALSE)

p <- length(markers)
seeds <- 1:10
ranger_error <- c(); ranger_c <- c()
for (seed in seeds) {
  rf <- ranger(Surv(time, status) ~ ., data = d, num.trees = 500, mtry = floor(sqrt(p)), min.node.size = 1,
               replace = TRUE, sample.fraction = 1, splitrule = "logrank", seed = seed, num.threads = 2)
  ranger_error <- c(ranger_error, rf$prediction.error)
  mortality <- rowSums(rf$chf)  # out-of-bag ensemble cumulative hazard summed over the event times
  ranger_c <- c(ranger_c, concordance(Surv(time, status) ~ mortality, data = d, reverse = TRUE)$concordance)
}
out <- list(
  versions = list(R = as.character(getRversion()), ranger = as.character(packageVersion("ranger")),
                  survival = as.character(packageVersion("survival"))),
  source = "survival::lung (Loprinzi et al. 1994), complete cases of age, sex, ph.ecog, ph.karno, pat.karno, meal.cal, wt.loss",
  samples = nrow(d), events = sum(d$status),
  forest = list(trees = 500, features_per_split = floor(sqrt(p)), seeds = seeds,
                ranger_prediction_error = ranger_error,
                oob_concordance_survival_convention = unname(ranger_c))
)
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "lung_forest_reference.json")
cat("samples", nrow(d), "events", sum(d$status), "C", mean(ranger_c), sd(ranger_c), "\n")
