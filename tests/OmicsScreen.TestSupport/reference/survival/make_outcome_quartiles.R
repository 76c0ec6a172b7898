# Quartiles (R's default quantile type 7, Hyndman & Fan 1996) of the marker x of each data set in
# survival_reference.json, for the `check` summary of a measured outcome. Run beside that file:
#   Rscript make_outcome_quartiles.R
library(jsonlite)
reference <- fromJSON("survival_reference.json", simplifyVector = FALSE)
quartiles <- lapply(reference$data_sets, function(d) {
  x <- unlist(d$x)
  q <- quantile(x, c(0, 0.25, 0.5, 0.75, 1), type = 7, names = FALSE)
  list(name = d$name, samples = length(x), min = q[1], lower_quartile = q[2], median = q[3],
       upper_quartile = q[4], max = q[5])
})
out <- list(versions = list(R = R.version.string), quantile_type = 7, data_sets = quartiles)
writeLines(toJSON(out, auto_unbox = TRUE, digits = NA, pretty = TRUE), "outcome_quartiles.json")
