# The general-purpose library's whole process for the `grow-process` benchmark (issue 15): read a
# panel CSV (sample_id, class, then one column per feature), grow one ranger forest at the
# settings of OmicsScreen's default `grow`, print its out-of-bag error. The benchmark times this
# whole Rscript process, start-up and reading included, beside `omicsscreen grow` on the same file.
#
# Usage: Rscript grow_ranger.R PANEL.csv SEED THREADS
# Reading uses data.table::fread (multithreaded; the fastest CSV reader installed here, Debian's
# r-cran-data.table). Settings: 500 trees, mtry = floor(sqrt(p)), min.node.size = 1, a bootstrap
# of n rows with replacement (ranger 0.14.1, Debian's r-cran-ranger).
args <- commandArgs(TRUE)
path <- args[1]; seed <- as.integer(args[2]); threads <- as.integer(args[3])
suppressPackageStartupMessages({ library(data.table); library(ranger) })
panel <- fread(path, nThread = threads)
y <- factor(panel[[2]])
x <- as.matrix(panel[, -(1:2)])
p <- ncol(x)
rf <- ranger(x = x, y = y, num.trees = 500, mtry = floor(sqrt(p)), min.node.size = 1,
             replace = TRUE, sample.fraction = 1, seed = seed, num.threads = threads)
cat(sprintf("oob_error=%.6f\n", rf$prediction.error))
