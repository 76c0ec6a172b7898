# Reference values for OmicsScreen's paired comparison of two AUCs (DeLong, DeLong &
# Clarke-Pearson 1988), computed by R's general-purpose pROC package (Robin et al. 2011, BMC
# Bioinformatics 12:77; Debian r-cran-proc). Deterministic: run from this folder with
# `Rscript make_paired_delong_reference.R`; it writes asah.csv and paired_delong_reference.json.
#
# Data: pROC's aSAH data (Turck et al. 2010, Clin Chem Lab Med 48:1135; 113 patients after
# aneurysmal subarachnoid haemorrhage, outcome Good/Poor, biomarkers s100b and ndka, the WFNS
# grade and age), as distributed with pROC (GPL >= 3). Sample ids AS-001.. are row numbers.
suppressPackageStartupMessages({ library(pROC); library(jsonlite) })
data(aSAH)
d <- data.frame(sample = sprintf("AS-%03d", seq_len(nrow(aSAH))), poor = as.integer(aSAH$outcome == "Poor"),
                s100b = aSAH$s100b, ndka = aSAH$ndka, wfns = as.numeric(as.character(aSAH$wfns)), age = aSAH$age)
write.csv(d, "asah.csv", row.names = FALSE, quote = FALSE)

curve <- function(x) roc(d$poor, x, levels = c(0, 1), direction = "<", quiet = TRUE)
pairs <- list(c("s100b", "wfns"), c("s100b", "ndka"), c("ndka", "age"), c("wfns", "age"))
comparisons <- lapply(pairs, function(p) {
  t <- roc.test(curve(d[[p[1]]]), curve(d[[p[2]]]), method = "delong", paired = TRUE)
  list(a = p[1], b = p[2], auc_a = unname(t$estimate[1]), auc_b = unname(t$estimate[2]),
       z = unname(t$statistic), p = t$p.value,
       lower = t$conf.int[1], upper = t$conf.int[2])
})
out <- list(versions = list(R = as.character(getRversion()), pROC = as.character(packageVersion("pROC"))),
            method = "roc.test(roc(poor, a, direction = '<'), roc(poor, b, direction = '<'), method = 'delong', paired = TRUE)",
            comparisons = comparisons)
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "paired_delong_reference.json")
