#!/usr/bin/env python3
"""Makes reference-checks/fixtures/plan-scipy.json: reference values for the planning checks (run once).

Run with scipy >= 1.12 (the pyenv Python on the build machine had scipy 1.17.1): `python3 make_plan_fixtures.py`.
The tests in reference-checks/plan.check.ts read the JSON; they never run Python. Everything here is computed by
scipy, an independent, general-purpose library, from the definitions (no project code is imported):

- transference: scipy.stats.binom.cdf. acceptFirst = F(k; n, p); acceptWithRetest = F + (1 - F) * F(k; m, p),
  the retest of m individuals judged on its own against the same k.
- expected order statistics: E[X(k)] of a sample of n, X = mu + sigma * Z (normal) or exp(mu + sigma * Z) (log-normal),
  by scipy.integrate.quad of g(z) * f_(k)(z) over the real line, with the order-statistic density
  f_(k)(z) = phi(z) * Phi(z)^(k-1) * (1 - Phi(z))^(n-k) / B(k, n - k + 1) in logs (norm.logcdf, norm.logsf, betaln).
  A second route integrates the same expectation on the probability scale, the integral over (0, 1) of
  Q(u) * Beta(u; k, n - k + 1) (norm.ppf and beta.pdf), and the script records how far the two agree.
- the expected span of a rank CI: E[F(X(k))] is the mean of Beta(k, n - k + 1) (scipy.stats.beta.mean), and the
  ranks of the equal-tailed binomial CI of a percentile from scipy.stats.binom (the largest r with
  P(B <= r - 1) <= alpha, the smallest s with P(B >= s) <= alpha, alpha = (1 - level) / 2).
"""
import json, math, pathlib, warnings
import numpy as np
import scipy
from scipy import integrate, special, stats

out = {"generator": f"scipy {scipy.__version__}, numpy {np.__version__}"}

# ---- transference ---------------------------------------------------------------------------------------
P_OUT = [0.025, 0.05, 0.075, 0.1, 0.15, 0.2, 0.25]
cases = []
for n in (20, 40, 60):
    k10 = math.floor(0.1 * n)
    for k in sorted({k10, k10 - 1, k10 + 1, 0}):
        for m in sorted({n, 20}):
            if k > m:
                continue
            rows = []
            for p in P_OUT:
                first = float(stats.binom.cdf(k, n, p))
                again = float(stats.binom.cdf(k, m, p))
                rows.append({"trueOutside": p, "acceptFirst": first, "acceptWithRetest": first + (1 - first) * again})
            cases.append({"n": n, "maxOutside": k, "retest": m, "rows": rows})
out["transference"] = {"method": "scipy.stats.binom.cdf", "cases": cases}

# ---- expected order statistics --------------------------------------------------------------------------
Z975 = float(stats.norm.ppf(0.975))


def log_density(z, n, k):
    return (stats.norm.logpdf(z) + (k - 1) * stats.norm.logcdf(z) + (n - k) * stats.norm.logsf(z)
            - special.betaln(k, n - k + 1))


def expect_z(g, n, k):
    """E[g(Z(k))] by quad over the real line, split around the peak so quad sees it; g(z, log f_(k)(z)) is the
    integrand itself, so that exp(mu + sigma z) of a log-normal is multiplied by the density in logs (no overflow)."""
    centre = float(stats.norm.ppf(k / (n + 1)))
    pieces = [(-np.inf, centre - 1), (centre - 1, centre), (centre, centre + 1), (centre + 1, np.inf)]
    total = 0.0
    for a, b in pieces:
        v, _ = integrate.quad(lambda z: g(z, log_density(z, n, k)), a, b, epsabs=1e-15, epsrel=1e-13, limit=400)
        total += v
    return total


def expect_u(q, n, k):
    """The same expectation on the probability scale: the integral of Q(u) Beta(u; k, n-k+1) du. Only a cross-check
    of expect_z (their largest difference is recorded); quad may warn of roundoff near u = 0 or 1 here, where
    Q(u) grows without bound, so its warnings are silenced and the recorded agreement speaks instead."""
    centre = k / (n + 1)
    pieces = [(0, centre / 2), (centre / 2, centre), (centre, (1 + centre) / 2), ((1 + centre) / 2, 1)]
    total = 0.0
    for a, b in pieces:
        with warnings.catch_warnings():
            warnings.simplefilter("ignore", integrate.IntegrationWarning)
            v, _ = integrate.quad(lambda u: q(u) * stats.beta.pdf(u, k, n - k + 1), a, b, epsabs=1e-15, epsrel=1e-13, limit=400)
        total += v
    return total


def population(shape, lower, upper):
    lo, hi = (math.log(lower), math.log(upper)) if shape == "log-normal" else (lower, upper)
    mu, sigma = (lo + hi) / 2, (hi - lo) / (2 * Z975)
    if shape == "log-normal":
        return (lambda z, ld: math.exp(mu + sigma * z + ld)), (lambda u: math.exp(mu + sigma * stats.norm.ppf(u)))
    return (lambda z, ld: (mu + sigma * z) * math.exp(ld)), (lambda u: mu + sigma * stats.norm.ppf(u))


PAIRS = [(2, 2), (3, 3), (5, 5), (10, 10), (20, 20), (10, 1), (120, 1), (120, 7), (120, 114), (120, 120), (240, 3), (240, 12), (400, 5), (400, 16)]
POPS = [
    {"shape": "normal", "lower": -Z975, "upper": Z975},  # the standard normal itself
    {"shape": "normal", "lower": 3.5, "upper": 5.3},
    {"shape": "log-normal", "lower": 0.4, "upper": 4.0},
    {"shape": "log-normal", "lower": 10, "upper": 180},
]
order = []
worst = 0.0
for pop in POPS:
    g, q = population(pop["shape"], pop["lower"], pop["upper"])
    for n, k in PAIRS:
        a = expect_z(g, n, k)
        b = expect_u(q, n, k)
        worst = max(worst, abs(a - b) / max(1.0, abs(a)))
        order.append({**pop, "n": n, "k": k, "expected": a})
out["orderStatistics"] = {
    "method": "scipy.integrate.quad of g(z) * f_(k)(z) over the real line (norm.logpdf, logcdf, logsf, special.betaln)",
    "cases": order,
    "agreementWithProbabilityScale": worst,
}

# ---- the establish plan: ranks, expected span and width -------------------------------------------------
def rank_ci(n, p, level):
    alpha = (1 - level) / 2
    lower = 0
    for r in range(1, n + 1):
        if stats.binom.cdf(r - 1, n, p) > alpha:
            break
        lower = r
    upper = 0
    for s in range(n, 0, -1):
        if stats.binom.sf(s - 1, n, p) > alpha:
            break
        upper = s
    return None if lower == 0 or upper == 0 or lower >= upper else (lower, upper)


plans = []
for pop in (POPS[1], POPS[3]):
    g, _ = population(pop["shape"], pop["lower"], pop["upper"])
    rows = []
    for n in (100, 118, 119, 120, 150, 200, 240, 300, 400):
        limits = []
        for pc in (2.5, 97.5):
            ci = rank_ci(n, pc / 100, 0.9)
            if ci is None:
                limits.append({"percentile": pc, "lowerRank": None, "upperRank": None, "expectedSpan": None, "expectedWidth": None})
                continue
            r, s = ci
            span = 100 * (float(stats.beta(s, n - s + 1).mean()) - float(stats.beta(r, n - r + 1).mean()))
            width = expect_z(g, n, s) - expect_z(g, n, r)
            limits.append({"percentile": pc, "lowerRank": r, "upperRank": s, "expectedSpan": span, "expectedWidth": width})
        rows.append({"n": n, "limits": limits})
    plans.append({"population": pop, "level": 0.9, "rows": rows})
out["establish"] = {
    "method": "ranks by scipy.stats.binom (equal-tailed, 90%); span = 100 * (beta(s, n-s+1).mean() - beta(r, n-r+1).mean()); width by quad as above",
    "plans": plans,
}

here = pathlib.Path(__file__).resolve().parent
(here.parent / "fixtures" / "plan-scipy.json").write_text(json.dumps(out, indent=1) + "\n")
print(out["generator"], "cases:", len(cases), "order statistics:", len(order), "quad vs probability scale:", worst)
for c in order[:14]:
    print(c["n"], c["k"], repr(c["expected"]))
