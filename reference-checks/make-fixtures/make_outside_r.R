# Makes reference-checks/fixtures/outside-r.json with R (Debian r-base-core 4.2, base and stats only); run once:
#   Rscript make_outside_r.R
# then `python3 make_outside_scipy.py` (it reads the weighted-Deming data from this fixture).
# Every data set is invented here (R's generator, set.seed below, or typed by hand); nothing is copied, except
# Rosner's (1983) example data as the NIST/SEMATECH e-Handbook prints them (the same 54 values as scipy.json).
# Nothing below calls or retypes Parallax's code; each part is written from its published definition, in a
# different structure from the engine's:
#
# 1. Passing–Bablok (H. Passing and W. Bablok (1983), J. Clin. Chem. Clin. Biochem. 21, 709–720; the definitions
#    below are as we recall them from the paper, marked memory where the wording matters):
#    - every pair i < j of the n points gives S_ij = (y_j − y_i)/(x_j − x_i); a pair of identical points (0/0) is
#      left out; a pair with S_ij = −1 is left out; a pair with equal x and different y is a slope above every
#      finite slope (+∞; the paper's sign rule for such pairs is memory, and the engine takes the rows in order of
#      x then y, which makes every such slope +∞);
#    - with the N remaining slopes sorted and K of them below −1: b = S((N + 1)/2 + K) for N odd,
#      (S(N/2 + K) + S(N/2 + 1 + K))/2 for N even (the "shifted median");
#    - a = median(y_i − b·x_i);
#    - the CI: C = z(1 − α/2)·sqrt(n(n − 1)(2n + 5)/18) with z from qnorm (the normal quantile the paper uses),
#      M1 = round((N − C)/2), M2 = N − M1 + 1, slope CI [S(M1 + K), S(M2 + K)], intercept CI
#      [median(y − b_upper·x), median(y − b_lower·x)]; null when M1 + K < 1 or M2 + K > N.
#    Brute force over all pairs (outer()), every slope listed, base R sort(). Ties and −1 are judged exactly on the
#    values as integers of their last decimal (x·10^d): a slope is then a correctly rounded quotient of two exact
#    integers, equal quotients are equal doubles, and S = −1 exactly when Δy = −Δx.
# 2. Weighted Deming (K. Linnet (1990), Stat. Med. 9, 1463–1473: weights 1/c² with c the mean of the two
#    specimen's true values, recomputed from the fitted line until stable) solved WITHOUT the closed form: each round
#    minimises the errors-in-variables weighted sum of squares Σ w_i [(x_i − X_i)²/λ + (y_i − a − b·X_i)²] over
#    a, b and all n true values X_i at once with R's general-purpose optimiser nlminb (PORT library; the
#    objective with its analytic gradient and Hessian in all n + 2 unknowns, started from the previous round),
#    then sets w_i = 1/((X_i + a + b·X_i)/2)² from the optimiser's own X_i, until b changes by < 1e-14 relatively.
# 3. Generalized ESD (B. Rosner (1983), Technometrics 25(2), 165–172): R_i = max|x − mean|/sd (sd with n − 1)
#    over the values not yet removed; λ_i = (n − i)·t/sqrt((n − i − 1 + t²)(n − i + 1)) with t = qt(p, n − i − 1),
#    p = 1 − α/(2(n − i + 1)), R's own t quantile (Hill's algorithm 396), not jStat's.
# 4. Binomial-rank CIs of percentiles, equal-tailed at α = (1 − level)/2: two routes in R that must agree:
#    pbinom (largest r with P(B ≤ r − 1) ≤ α; smallest s with P(B ≥ s) ≤ α) and qbinom
#    (r = qbinom(α, n, p), s = qbinom(1 − α, n, p) + 1), with the coverage pbinom(s − 1) − pbinom(r − 1).
num <- function(v) paste(ifelse(is.infinite(v), ifelse(v > 0, '"Infinity"', '"-Infinity"'), sprintf("%.17g", v)), collapse = ",")
pair <- function(v) if (is.null(v)) "null" else sprintf("[%s]", num(v))
set.seed(20261203)

# ---------------------------------------------------------------------------------------------------------- 1
pb_brute <- function(x, y, decimals, level = 0.95) {
  n <- length(x)
  kx <- round(x * 10^decimals); ky <- round(y * 10^decimals)
  stopifnot(all(abs(kx - x * 10^decimals) < 1e-6), all(abs(ky - y * 10^decimals) < 1e-6))
  dx <- outer(kx, kx, function(a, b) b - a)          # dx[i, j] = x_j − x_i
  dy <- outer(ky, ky, function(a, b) b - a)
  upper <- upper.tri(dx)                              # pairs i < j
  dx <- dx[upper]; dy <- dy[upper]
  identical_pts <- dx == 0 & dy == 0
  vertical <- dx == 0 & dy != 0
  minus_one <- dx != 0 & dy == -dx
  keep <- !identical_pts & !minus_one
  s <- ifelse(vertical, Inf, dy / ifelse(dx == 0, 1, dx))[keep]
  s <- sort(s)
  N <- length(s); K <- sum(s < -1)
  b <- if (N %% 2 == 1) s[(N + 1) / 2 + K] else (s[N / 2 + K] + s[N / 2 + 1 + K]) / 2
  a <- median(y - b * x)
  C <- qnorm(1 - (1 - level) / 2) * sqrt(n * (n - 1) * (2 * n + 5) / 18)
  half <- (N - C) / 2
  stopifnot(abs(half - floor(half) - 0.5) > 1e-9)   # R rounds halves to even; no half occurs here
  M1 <- round(half); M2 <- N - M1 + 1
  ci <- NULL; ici <- NULL
  if (M1 + K >= 1 && M2 + K <= N && M1 <= M2) {
    ci <- c(s[M1 + K], s[M2 + K])
    if (all(is.finite(ci))) ici <- c(median(y - ci[2] * x), median(y - ci[1] * x))
  }
  list(n = n, N = N, K = K, slope = b, intercept = a, slopeCi = ci, interceptCi = ici, M1 = M1, M2 = M2, C = C,
       identical = sum(identical_pts), vertical = sum(vertical), minusOne = sum(minus_one),
       horizontal = sum(dy == 0 & dx != 0), negative = sum(s < 0))
}

pb_sets <- list()
# a) integer results with many ties: equal x (vertical pairs), equal y (slope 0), identical points, slopes of −1
t <- sample(5:60, 40, replace = TRUE)
pb_sets$ties <- list(x = round(t + rnorm(40, 0, 1.5)), y = round(1.04 * t + 1 + rnorm(40, 0, 2)), decimals = 0)
# b) weakly related results on a narrow range with one decimal: many slopes below −1 and several exactly −1
t <- runif(30, 40, 50)
pb_sets$negative <- list(x = round(t + rnorm(30, 0, 2.5), 1), y = round(0.95 * t + 3 + rnorm(30, 0, 2.5), 1), decimals = 1)
# c) two decimals: a few slopes equal as quotients of different pairs (5 of 253), a few below −1; N odd
t <- sort(runif(23, 1, 9))
pb_sets$decimals <- list(x = round(t + rnorm(23, 0, 0.15), 2), y = round(1.1 * t - 0.2 + rnorm(23, 0, 0.25), 2), decimals = 2)
# d) typed by hand: 13 pairs with a vertical pair, an identical pair, a horizontal pair, a slope of −1 and slopes below −1 (−3, −1.05)
pb_sets$typed <- list(x = c(3, 4, 4, 5, 6, 6, 7, 8, 9, 10, 11, 12, 13), y = c(3.5, 3.9, 4.6, 5.5, 5.8, 5.8, 6.9, 5.9, 9.2, 10.1, 7.1, 12.4, 12.4), decimals = 1)
# e) too few pairs for the CI (n = 4: M1 = round((6 − 5.77)/2) = 0)
pb_sets$tiny <- list(x = c(1, 2, 3, 4), y = c(1.2, 1.9, 3.3, 3.8), decimals = 1)
# f) 150 integer results (the engine selects slopes by counting instead of listing them beyond 60 rows)
t <- round(rlnorm(150, log(80), 0.5))
pb_sets$large <- list(x = round(t + rnorm(150, 0, 4)), y = round(0.97 * t + 2 + rnorm(150, 0, 5)), decimals = 0)

pb_json <- c()
for (name in names(pb_sets)) {
  d <- pb_sets[[name]]
  r <- pb_brute(d$x, d$y, d$decimals)
  pb_json <- c(pb_json, sprintf(paste0(
    '{"name": "%s", "decimals": %d, "x": [%s], "y": [%s], "level": 0.95, "N": %d, "K": %d, "slope": %s, ',
    '"intercept": %.17g, "slopeCi": %s, "interceptCi": %s, "M1": %d, "M2": %d, "C": %.17g, "identical": %d, ',
    '"vertical": %d, "minusOne": %d, "horizontal": %d, "negative": %d}'),
    name, d$decimals, num(d$x), num(d$y), r$N, r$K, num(r$slope), r$intercept, pair(r$slopeCi), pair(r$interceptCi),
    r$M1, r$M2, r$C, r$identical, r$vertical, r$minusOne, r$horizontal, r$negative))
  cat(sprintf("PB %-9s n=%3d N=%5d K=%4d b=%.6f a=%.6f vertical=%d identical=%d minusOne=%d horizontal=%d\n", name,
              r$n, r$N, r$K, r$slope, r$intercept, r$vertical, r$identical, r$minusOne, r$horizontal))
}

# ---------------------------------------------------------------------------------------------------------- 2
xt <- runif(40, 10, 400)
wx <- round(xt * (1 + rnorm(40, 0, 0.04)), 1)
wy <- round((1.04 * xt + 2) * (1 + rnorm(40, 0, 0.05)), 1)
lambda <- 1.3
eiv_fit <- function(x, y, w, lambda, start) {
  n <- length(x)
  f <- function(p) { a <- p[1]; b <- p[2]; X <- p[-(1:2)]; sum(w * ((x - X)^2 / lambda + (y - a - b * X)^2)) }
  g <- function(p) {
    a <- p[1]; b <- p[2]; X <- p[-(1:2)]; r <- y - a - b * X
    c(-2 * sum(w * r), -2 * sum(w * r * X), -2 * w * (x - X) / lambda - 2 * w * b * r)
  }
  h <- function(p) {
    a <- p[1]; b <- p[2]; X <- p[-(1:2)]; r <- y - a - b * X
    H <- matrix(0, n + 2, n + 2)
    H[1, 1] <- 2 * sum(w); H[1, 2] <- H[2, 1] <- 2 * sum(w * X); H[2, 2] <- 2 * sum(w * X^2)
    H[1, -(1:2)] <- H[-(1:2), 1] <- 2 * w * b
    H[2, -(1:2)] <- H[-(1:2), 2] <- 2 * w * (b * X - r)
    H[cbind(3:(n + 2), 3:(n + 2))] <- 2 * w / lambda + 2 * w * b^2
    H
  }
  o <- nlminb(start, f, g, h, control = list(eval.max = 1000, iter.max = 1000, rel.tol = 1e-15, x.tol = 1e-15))
  list(par = o$par, message = o$message, gradient = max(abs(g(o$par))))
}
w <- 1 / ((wx + wy) / 2)^2
start <- c(0, 1, wx)
for (round in 1:200) {
  fit <- eiv_fit(wx, wy, w, lambda, start)
  a <- fit$par[1]; b <- fit$par[2]; X <- fit$par[-(1:2)]
  w_next <- 1 / ((X + a + b * X) / 2)^2
  change <- if (round > 1) abs(b - start[2]) / abs(b) else Inf
  start <- fit$par; w <- w_next
  if (change < 1e-14) break
}
cat(sprintf("weighted Deming by nlminb: b = %.15g, a = %.15g, %d rounds, last change %.3g, gradient %.3g (%s)\n", b, a, round, change, fit$gradient, fit$message))
wd_json <- sprintf('{"x": [%s], "y": [%s], "lambda": %.17g, "slope": %.17g, "intercept": %.17g, "rounds": %d, "lastChange": %.17g, "gradient": %.17g}',
                   num(wx), num(wy), lambda, b, a, round, change, fit$gradient)

# ---------------------------------------------------------------------------------------------------------- 3
esd_steps <- function(x, alpha, r) {
  n <- length(x); v <- x; out <- c()
  for (i in 1:r) {
    d <- abs(v - mean(v)); k <- which.max(d)
    p <- 1 - alpha / (2 * (n - i + 1)); t <- qt(p, n - i - 1)
    lam <- (n - i) * t / sqrt((n - i - 1 + t^2) * (n - i + 1))
    out <- c(out, sprintf('{"value": %.17g, "statistic": %.17g, "critical": %.17g}', v[k], d[k] / sd(v), lam))
    v <- v[-k]
  }
  out
}
rosner <- c(-0.25, 0.68, 0.94, 1.15, 1.20, 1.26, 1.26, 1.34, 1.38, 1.43, 1.49, 1.49, 1.55, 1.56, 1.58, 1.65, 1.69, 1.70,
            1.76, 1.77, 1.81, 1.91, 1.94, 1.96, 1.99, 2.06, 2.09, 2.10, 2.14, 2.15, 2.23, 2.24, 2.26, 2.35, 2.37, 2.40,
            2.47, 2.54, 2.62, 2.64, 2.90, 2.92, 2.92, 2.93, 3.21, 3.26, 3.30, 3.59, 3.68, 4.30, 4.64, 5.34, 5.42, 6.01)
skew <- round(c(rnorm(37, 100, 8), 141.3, 58.9, 150.2), 1)
esd_json <- sprintf(paste0('{"rosner": {"values": [%s], "alpha": 0.05, "maxOutliers": 10, "steps": [%s]},\n',
                           ' "invented": {"values": [%s], "alpha": 0.01, "maxOutliers": 5, "steps": [%s]}}'),
                    num(rosner), paste(esd_steps(rosner, 0.05, 10), collapse = ","),
                    num(skew), paste(esd_steps(skew, 0.01, 5), collapse = ","))

# ---------------------------------------------------------------------------------------------------------- 4
rank_ci <- function(n, p, level) {
  a <- (1 - level) / 2
  lo <- max(c(0, which(pbinom((1:n) - 1, n, p) <= a)))
  hi <- min(c(Inf, which(pbinom((1:n) - 1, n, p, lower.tail = FALSE) <= a)))
  lo_q <- qbinom(a, n, p); hi_q <- qbinom(1 - a, n, p) + 1
  if (lo_q < 1) lo_q <- 0
  if (hi_q > n) hi_q <- Inf
  stopifnot(lo == lo_q, hi == hi_q)
  if (lo == 0 || !is.finite(hi) || lo >= hi) return('null')
  sprintf('{"lowerRank": %d, "upperRank": %d, "coverage": %.17g}', lo, hi, pbinom(hi - 1, n, p) - pbinom(lo - 1, n, p))
}
rank_json <- c()
for (level in c(0.9, 0.95)) for (p in c(0.025, 0.05, 0.5, 0.95, 0.975, 0.99)) for (n in c(20, 40, 59, 118, 119, 120, 132, 133, 160, 161, 187, 188, 240, 400, 1000))
  rank_json <- c(rank_json, sprintf('{"n": %d, "p": %.17g, "level": %.17g, "ci": %s}', n, p, level, rank_ci(n, p, level)))

json <- sprintf('{"generator": "%s (base and stats only)", "seed": 20261203,\n"passingBablok": [\n%s],\n"weightedDeming": %s,\n"esd": %s,\n"rankCi": [\n%s]}\n',
                R.version.string, paste(pb_json, collapse = ",\n"), wd_json, esd_json, paste(rank_json, collapse = ",\n"))
args <- commandArgs(trailingOnly = FALSE)
here <- dirname(normalizePath(sub("--file=", "", args[grep("--file=", args)])))
writeLines(json, file.path(here, "..", "fixtures", "outside-r.json"), sep = "")
