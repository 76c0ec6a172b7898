# ranger's regression and survival forests on one benchmark panel file, for OmicsScreen's
# `outcome-forests` benchmark suite (issues 17 and 18): the same panel, trees, features per split
# (floor(sqrt(p))), leaves down to one sample (min.node.size = 1) and bootstrap as ours.
#
# Usage: Rscript outcome_forests_ranger.R PANEL.bin KIND SEEDS TREES THREADS
# PANEL.bin (little-endian): int32 n, int32 p, n float64 outcome values (measured) or times
# (time to event), n int32 event flags (1 = event; written for both kinds, ignored for measured),
# then p blocks of n float32 values (feature-major).
# Prints "run SEED ERROR TRAIN_SECONDS" per seed: ERROR is the out-of-bag MSE (measured) or
# 1 - Harrell's C of the out-of-bag cumulative hazards summed over the event times, scored by
# survival::concordance (time to event). Training time is the ranger() call alone.
args <- commandArgs(TRUE)
path <- args[1]; kind <- args[2]; seeds <- as.integer(args[3]); trees <- as.integer(args[4]); threads <- as.integer(args[5])
suppressPackageStartupMessages({ library(ranger); library(survival) })
con <- file(path, "rb")
n <- readBin(con, "integer", 1, size = 4, endian = "little")
p <- readBin(con, "integer", 1, size = 4, endian = "little")
y <- readBin(con, "numeric", n, size = 8, endian = "little")
status <- readBin(con, "integer", n, size = 4, endian = "little")
x <- matrix(readBin(con, "numeric", n * p, size = 4, endian = "little"), nrow = n, ncol = p)
close(con)
colnames(x) <- paste0("f", seq_len(p))
cat("version", as.character(packageVersion("ranger")), "\n")
for (seed in seq_len(seeds)) {
  if (kind == "measured") {
    t <- system.time(rf <- ranger(x = x, y = y, num.trees = trees, mtry = floor(sqrt(p)), min.node.size = 1,
                                  replace = TRUE, sample.fraction = 1, seed = seed, num.threads = threads))
    error <- rf$prediction.error
  } else {
    t <- system.time(rf <- ranger(x = x, y = Surv(y, status), num.trees = trees, mtry = floor(sqrt(p)),
                                  min.node.size = 1, replace = TRUE, sample.fraction = 1, splitrule = "logrank",
                                  seed = seed, num.threads = threads))
    mortality <- rowSums(rf$chf)
    error <- 1 - concordance(Surv(y, status) ~ mortality, reverse = TRUE)$concordance
  }
  cat("run", seed, sprintf("%.6f", error), sprintf("%.3f", t[["elapsed"]]), "\n")
}
