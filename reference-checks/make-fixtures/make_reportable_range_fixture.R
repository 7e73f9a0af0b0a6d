# Makes reference-checks/fixtures/reportable-range-r.json with R (Debian r-base-core 4.2, base and stats only);
# run once:
#   Rscript make_reportable_range_fixture.R
# The three linearity studies below are invented for this fixture (numbers typed by hand, no copied data):
#   - "bent-top": 7 assigned levels x 3 replicates, straight up to 200 and falling short at 250 and 300;
#   - "straight": 7 assigned levels x 2 replicates on a straight line with small scatter;
#   - "fractions": 6 mixing fractions of a high pool (no pool values, so x is the fraction), 2 replicates except
#     one level with 3 and one with a single result, with a gentle curvature.
# What comes from R itself, independently of Parallax's code:
#   - lm(y ~ x), lm(y ~ x + I(x^2)), lm(y ~ x + I(x^2) + I(x^3)) on raw x: coefficients, their standard errors, the
#     top coefficient's t and two-sided p (summary.lm), the RSS (deviance) and residual df;
#   - predict() of each fit at every level's x, and the deviations of the degree-2 and degree-3 fits from the line;
#   - the best degree by the rule the analysis documents (shared/stats/analyze-reportable-range.ts, step 2: the
#     highest of 2 and 3 whose top coefficient has p < alpha, else 1), applied here to summary.lm's p-values;
#   - a bootstrap of the deviation at every level, with R's own generator (set.seed, sample.int): each resample
#     draws every level's results with replacement within the level (a level with one result keeps it), refits
#     the best degree and the line by least squares (qr() and qr.fitted() on the fixed design), and takes
#     fitted - line at each level; the percentile CI is quantile(type = 6) (rank (B + 1)p, as boot's norm.inter at
#     these B) of B = 200000 resamples. The Monte Carlo SE of each CI end is estimated by batch means: the end
#     computed on 20 batches of 10000, SD of the 20 values / sqrt(20).
num <- function(v) paste(sprintf("%.17g", v), collapse = ",")
alpha <- 0.05
level <- 0.95
B <- 200000
batches <- 20
set.seed(20240611)

studies <- list(
  list(name = "bent-top", basis = "assigned",
       levels = c("L1", "L2", "L3", "L4", "L5", "L6", "L7"),
       x = c(10, 50, 100, 150, 200, 250, 300),
       values = list(c(10.3, 9.8, 10.1), c(50.6, 49.7, 50.2), c(100.9, 99.6, 100.4), c(150.2, 151.3, 149.8),
                     c(198.9, 200.7, 199.6), c(245.1, 246.8, 245.9), c(287.4, 289.2, 288.1))),
  list(name = "straight", basis = "assigned",
       levels = c("A", "B", "C", "D", "E", "F", "G"),
       x = c(0.4, 2, 4, 6, 8, 10, 12),
       values = list(c(0.46, 0.41), c(2.01, 2.05), c(3.98, 4.01), c(5.95, 5.92), c(7.90, 7.97), c(9.86, 9.89),
                     c(11.83, 11.78))),
  list(name = "fractions", basis = "fraction",
       levels = c("P0", "P20", "P40", "P60", "P80", "P100"),
       x = c(0, 0.2, 0.4, 0.6, 0.8, 1),
       values = list(c(40.8, 39.5), c(117.3, 119.0, 118.1), c(190.2, 188.4), c(258.0), c(321.9, 324.1),
                     c(380.7, 379.2)))
)

formulas <- list(y ~ x, y ~ x + I(x^2), y ~ x + I(x^2) + I(x^3))

one <- function(s) {
  sizes <- lengths(s$values)
  d <- data.frame(x = rep(s$x, sizes), y = unlist(s$values))
  lv <- data.frame(x = s$x)
  fits <- lapply(formulas, function(f) lm(f, data = d))
  fitJson <- sapply(seq_along(fits), function(k) {
    m <- fits[[k]]
    tab <- summary(m)$coefficients
    sprintf('{"degree": %d, "coefficients": [%s], "se": [%s], "t": %.17g, "p": %.17g, "rss": %.17g, "df": %d}',
            k, num(tab[, "Estimate"]), num(tab[, "Std. Error"]), tab[k + 1, "t value"], tab[k + 1, "Pr(>|t|)"],
            deviance(m), df.residual(m))
  })
  p <- sapply(fits, function(m) summary(m)$coefficients[nrow(summary(m)$coefficients), "Pr(>|t|)"])
  best <- if (p[3] < alpha) 3 else if (p[2] < alpha) 2 else 1
  pred <- sapply(fits, function(m) predict(m, newdata = lv))
  dev <- pred[, best] - pred[, 1]

  ci <- matrix(NA_real_, length(s$x), 2); mcse <- matrix(NA_real_, length(s$x), 2)
  if (best > 1) {
    X1 <- model.matrix(formulas[[1]], d); Xb <- model.matrix(formulas[[best]], d)
    q1 <- qr(X1); qb <- qr(Xb)
    # Ystar: one column per resample, rows in the data's order (levels in order of x, results within a level)
    Ystar <- matrix(0, nrow(d), B)
    row <- 0
    for (i in seq_along(s$values)) {
      v <- s$values[[i]]; n <- length(v)
      for (j in seq_len(n)) Ystar[row + j, ] <- if (n == 1) v else v[sample.int(n, B, replace = TRUE)]
      row <- row + n
    }
    first <- c(1, 1 + cumsum(sizes)[-length(sizes)])
    D <- qr.fitted(qb, Ystar)[first, , drop = FALSE] - qr.fitted(q1, Ystar)[first, , drop = FALSE]
    probs <- c((1 - level) / 2, (1 + level) / 2)
    size <- B / batches
    for (i in seq_along(s$x)) {
      ci[i, ] <- quantile(D[i, ], probs, type = 6, names = FALSE)
      byBatch <- sapply(seq_len(batches), function(b) quantile(D[i, ((b - 1) * size + 1):(b * size)], probs, type = 6, names = FALSE))
      mcse[i, ] <- apply(byBatch, 1, sd) / sqrt(batches)
    }
  }
  levelJson <- sapply(seq_along(s$x), function(i) {
    v <- s$values[[i]]
    sprintf(paste0('{"name": "%s", "x": %.17g, "values": [%s], "mean": %.17g, "sd": %s, "linear": %.17g, ',
                   '"fitted": [%s], "deviation2": %.17g, "deviation3": %.17g, "deviation": %.17g, "ci": %s, "mcSe": %s}'),
            s$levels[i], s$x[i], num(v), mean(v), if (length(v) > 1) sprintf("%.17g", sd(v)) else "null",
            pred[i, 1], num(pred[i, ]), pred[i, 2] - pred[i, 1], pred[i, 3] - pred[i, 1], dev[i],
            if (best > 1) sprintf("[%s]", num(ci[i, ])) else "null",
            if (best > 1) sprintf("[%s]", num(mcse[i, ])) else "null")
  })
  sprintf('{"name": "%s", "basis": "%s", "bestDegree": %d,\n  "fits": [%s],\n  "levels": [\n   %s]}',
          s$name, s$basis, best, paste(fitJson, collapse = ",\n   "), paste(levelJson, collapse = ",\n   "))
}

json <- sprintf('{"generator": "%s", "alpha": %.17g, "level": %.17g, "resamples": %d, "batches": %d, "studies": [\n %s]}\n',
                R.version.string, alpha, level, B, batches, paste(sapply(studies, one), collapse = ",\n "))
args <- commandArgs(trailingOnly = FALSE)
here <- dirname(normalizePath(sub("--file=", "", args[grep("--file=", args)])))
writeLines(json, file.path(here, "..", "fixtures", "reportable-range-r.json"), sep = "")
