# Makes reference-checks/fixtures/boot.json with R's boot package (Debian r-cran-boot); run once:
#   Rscript make_boot_fixture.R
# The data are invented (R's generator, set.seed below). For the mean and the median, boot() draws its own
# resamples; the fixture keeps boot's replicates t and its percentile and BCa intervals, the BCa made with
# jackknife empirical influence values (L = empinf(type = "jack")), so the check can hand the same
# replicates to Parallax's interval code and compare the interval arithmetic exactly.
library(boot)
set.seed(19870301)
x <- round(rlnorm(25, meanlog = 1, sdlog = 0.5), 2)
stats <- list(mean = function(d, i) mean(d[i]), median = function(d, i) median(d[i]))
num <- function(v) paste(sprintf("%.17g", v), collapse = ",")
parts <- c()
for (name in names(stats)) {
  b <- boot(x, stats[[name]], R = 1999)
  L <- empinf(b, type = "jack")
  ci <- boot.ci(b, conf = 0.95, type = c("perc", "bca"), L = L)
  parts <- c(parts, sprintf('"%s": {"t0": %.17g, "t": [%s], "percentile": [%s], "bca": [%s]}',
    name, b$t0, num(b$t[, 1]), num(ci$percent[4:5]), num(ci$bca[4:5])))
}
json <- sprintf('{"generator": "%s, boot %s", "data": [%s], "level": 0.95,\n%s}\n',
  R.version.string, packageVersion("boot"), num(x), paste(parts, collapse = ",\n"))
args <- commandArgs(trailingOnly = FALSE)
here <- dirname(normalizePath(sub("--file=", "", args[grep("--file=", args)])))
writeLines(json, file.path(here, "..", "fixtures", "boot.json"), sep = "")
