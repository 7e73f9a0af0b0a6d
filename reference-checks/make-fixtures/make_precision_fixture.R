# Makes reference-checks/fixtures/precision.json with R (Debian r-base-core 4.2 and its recommended nlme); run once:
#   Rscript make_precision_fixture.R
# The data are invented (R's generator, set.seed below): four precision studies of one material each.
# What comes from R itself, independently of Parallax's code:
#   - the one-way ANOVA table (df, mean squares) from aov(value ~ day) and summary();
#   - chi-square and t quantiles from qchisq() and qt(), at integer and non-integer degrees of freedom;
#   - for the balanced set whose between-day component is not clipped, the REML variance components and the
#     SE of the grand mean from nlme::lme (REML equals the ANOVA estimators in a balanced design when
#     MS_B > MS_W, so s_r, s_b and SE are checked by a different method).
# What is the EP15-A3 practice formula evaluated here in R (DOMAIN.md "Precision"), on aov's mean squares and
# with R's quantiles: n0, s_b = sqrt(max(0, (MS_B - MS_W)/n0)), the Satterthwaite df of s_WL and of the SE of
# the grand mean, the chi-square CIs, the UVLs and the trueness interval. The check compares Parallax's numbers
# with all of them.
library(nlme)
num <- function(v) paste(sprintf("%.17g", v), collapse = ",")
alpha <- 0.05

study <- function(name, day, value, claims, assigned, u, reml = FALSE) {
  d <- data.frame(day = factor(day), value = value)
  fit <- aov(value ~ day, data = d)
  tab <- summary(fit)[[1]]
  dfB <- tab[["Df"]][1]; dfW <- tab[["Df"]][2]
  msB <- tab[["Mean Sq"]][1]; msW <- tab[["Mean Sq"]][2]
  sizes <- as.vector(table(d$day)); N <- sum(sizes); k <- length(sizes)
  n0 <- (N - sum(sizes^2) / N) / (k - 1)
  xbar <- mean(value)
  clipped <- !(msB > msW)
  vr <- msW
  vb <- if (clipped) 0 else (msB - msW) / n0
  vwl <- vr + vb
  a <- 1 / n0; b <- 1 - 1 / n0
  dfWL <- if (clipped) dfW else (a * msB + b * msW)^2 / ((a * msB)^2 / dfB + (b * msW)^2 / dfW)
  ci <- function(s, nu) c(s * sqrt(nu / qchisq(1 - alpha / 2, nu)), s * sqrt(nu / qchisq(alpha / 2, nu)))
  uvl <- function(claim, nu, l) claim * sqrt(qchisq(1 - alpha / l, nu) / nu)
  # trueness: SE of the grand mean and its Satterthwaite df; Welch-Satterthwaite with u at infinite df
  if (clipped) { se2 <- vr / N; seDf <- dfW } else {
    se2 <- vb * sum(sizes^2) / N^2 + vr / N
    A <- sum(sizes^2) / (N^2 * n0); B <- 1 / N - A
    seDf <- se2^2 / ((A * msB)^2 / dfB + (B * msW)^2 / dfW)
  }
  dfT <- (se2 + u^2)^2 / (se2^2 / seDf)
  parts <- c(
    sprintf('"name": "%s"', name),
    sprintf('"day": [%s]', paste(sprintf('"%s"', day), collapse = ",")),
    sprintf('"value": [%s]', num(value)),
    sprintf('"aov": {"dfBetween": %d, "dfWithin": %d, "msBetween": %.17g, "msWithin": %.17g}', dfB, dfW, msB, msW),
    sprintf('"mean": %.17g, "n0": %.17g, "clipped": %s', xbar, n0, tolower(as.character(clipped))),
    sprintf('"sr": %.17g, "sb": %.17g, "swl": %.17g, "dfWL": %.17g', sqrt(vr), sqrt(vb), sqrt(vwl), dfWL),
    sprintf('"ciR": [%s], "ciWL": [%s]', num(ci(sqrt(vr), dfW)), num(ci(sqrt(vwl), dfWL))),
    sprintf('"claims": {"repeatability": %.17g, "withinLab": %.17g, "as": "sd"}', claims[1], claims[2]),
    sprintf('"uvl": {"1": [%s], "2": [%s], "3": [%s]}', num(c(uvl(claims[1], dfW, 1), uvl(claims[2], dfWL, 1))),
            num(c(uvl(claims[1], dfW, 2), uvl(claims[2], dfWL, 2))), num(c(uvl(claims[1], dfW, 3), uvl(claims[2], dfWL, 3)))),
    sprintf('"trueness": {"assigned": %.17g, "uncertainty": %.17g, "se": %.17g, "seDf": %.17g, "df": %.17g, "multiplier": %.17g, "materials": 2}',
            assigned, u, sqrt(se2), seDf, dfT, qt(1 - alpha / (2 * 2), dfT)))
  if (reml) {
    m <- lme(value ~ 1, random = ~ 1 | day, data = d, method = "REML", control = lmeControl(tolerance = 1e-12, msTol = 1e-12))
    parts <- c(parts, sprintf('"reml": {"sb": %.17g, "sr": %.17g, "seMean": %.17g}', sqrt(getVarCov(m)[1, 1]), m$sigma, summary(m)$tTable[1, "Std.Error"]))
  }
  paste0("{", paste(parts, collapse = ",\n "), "}")
}

set.seed(20260304)
days5 <- rep(sprintf("2026-03-%02d", 2:6), each = 5)
# 1. balanced 5 x 5, between-day component present (true s_b 1.2, s_r 1.5; mmol/L-like, 1 decimal)
v1 <- round(140 + rep(rnorm(5, 0, 1.2), each = 5) + rnorm(25, 0, 1.5), 1)
# 2. unbalanced: 5 planned days, 2 results lost on day 3 and 1 on day 5 (2 decimals)
v2full <- round(4.2 + rep(rnorm(5, 0, 0.06), each = 5) + rnorm(25, 0, 0.08), 2)
keep <- !(seq_along(v2full) %in% c(13, 14, 25))
# 3. balanced 5 x 5 with MS_B < MS_W (between-day clipped to 0): the first seed from 1 that gives it
seed <- 1
repeat { set.seed(seed); v3 <- round(25 + rnorm(25, 0, 0.9), 1)
  t3 <- summary(aov(v3 ~ factor(days5)))[[1]]
  if (t3[["Mean Sq"]][1] < t3[["Mean Sq"]][2]) break
  seed <- seed + 1 }
# 4. strongly unbalanced: 6 days of 2, 5, 5, 3, 5 and 4 results (true s_b 0.5, s_r 0.4)
set.seed(19991231)
sizes4 <- c(2, 5, 5, 3, 5, 4)
day4 <- rep(sprintf("run %d", 1:6), times = sizes4)
v4 <- round(60 + rep(rnorm(6, 0, 0.5), times = sizes4) + rnorm(sum(sizes4), 0, 0.4), 2)

studies <- c(
  study("balanced-5x5", days5, v1, c(1.4, 2.0), 141.0, 0.5, reml = TRUE),
  study("unbalanced-5-days", days5[keep], v2full[keep], c(0.07, 0.09), 4.15, 0.02),
  study(sprintf("clipped-5x5 (seed %d)", seed), days5, v3, c(0.8, 0.9), 25.3, 0),
  study("unbalanced-6-runs", day4, v4, c(0.35, 0.55), 60.0, 0.1))

# Quantiles on their own, integer and non-integer degrees of freedom (as Satterthwaite gives)
qs <- expand.grid(p = c(0.005, 0.025, 0.975, 0.9875, 1 - 0.05 / 3, 0.995), nu = c(4, 7.3456, 13.2, 20, 24.71, 60))
quantiles <- sprintf('{"p": %.17g, "nu": %.17g, "chisq": %.17g, "t": %.17g}', qs$p, qs$nu, qchisq(qs$p, qs$nu), qt(qs$p, qs$nu))

json <- sprintf('{"generator": "%s, nlme %s", "alpha": %s,\n"studies": [%s],\n"quantiles": [%s]}\n',
  R.version.string, packageVersion("nlme"), alpha, paste(studies, collapse = ",\n"), paste(quantiles, collapse = ",\n"))
args <- commandArgs(trailingOnly = FALSE)
here <- dirname(normalizePath(sub("--file=", "", args[grep("--file=", args)])))
writeLines(json, file.path(here, "..", "fixtures", "precision.json"), sep = "")
