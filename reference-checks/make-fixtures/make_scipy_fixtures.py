#!/usr/bin/python3
"""Makes reference-checks/fixtures/scipy.json with Debian's python3-scipy (run once: /usr/bin/python3 make_scipy_fixtures.py).

Every data set here is invented (seeded numpy generator); the values are computed by scipy, an independent,
general-purpose library. The tests in reference-checks/*.check.ts read the JSON; they never run Python.
"""
import json, pathlib
import numpy as np
import scipy
from scipy import stats, odr, special

rng = np.random.default_rng(20240917)
out = {"generator": f"scipy {scipy.__version__}, numpy {np.__version__}", "seed": 20240917}

def r1(a, d=1):
    return [float(round(v, d)) for v in a]

# Wilcoxon signed-rank and sign test
untied = r1(rng.normal(0.4, 1.0, 14), 3)          # no ties, no zeros -> exact
tied = r1(rng.normal(0.3, 0.8, 36), 1)            # ties and zeros -> normal approximation
large = r1(rng.normal(0.2, 1.0, 64), 4)           # no ties, n >= 50 -> normal approximation
assert len(set(abs(v) for v in untied)) == len(untied)
cases = []
for name, d, method in [("untied-14", untied, "exact"), ("tied-36", tied, "approx"), ("untied-64", large, "approx")]:
    nz = [v for v in d if v != 0]
    w = stats.wilcoxon(nz, method=method, correction=(method == "approx"), zero_method="wilcox")
    pos = sum(v > 0 for v in nz)
    sign = stats.binomtest(pos, len(nz), 0.5).pvalue
    cases.append({"name": name, "differences": d, "wilcoxonMethod": method, "wilcoxonP": float(w.pvalue), "signP": float(sign)})
out["signedRank"] = cases

# Theil-Sen (scipy.stats.theilslopes, method 'joint'): data with no negative pairwise slopes, no ties in x or y
x = np.round(np.sort(rng.choice(np.arange(200, 4000), 25, replace=False)) / 100, 2)   # distinct x
y = np.round(np.cumsum(rng.uniform(0.3, 2.5, 25)) + 2.0, 3)                             # strictly increasing y
dx = x[:, None] - x; dy = y[:, None] - y
assert (dy[dx > 0] / dx[dx > 0]).min() > 0 and len(set(x)) == 25 and len(set(y)) == 25
ts = stats.theilslopes(y, x, 0.95, method="joint")
out["theilSen"] = {"x": x.tolist(), "y": y.tolist(), "level": 0.95, "slope": ts.slope, "intercept": ts.intercept,
                   "lowSlope": ts.low_slope, "highSlope": ts.high_slope}

# Deming: closed form in the delta = var(y err)/var(x err) form, and ODRPACK (scipy.odr)
xt = rng.uniform(5, 120, 30)
xd = (xt + rng.normal(0, 2.0, 30)).round(1)
yd = (0.97 * xt + 1.5 + rng.normal(0, 2.5, 30)).round(1)
def deming_delta(x, y, delta):
    sxx = ((x - x.mean()) ** 2).sum(); syy = ((y - y.mean()) ** 2).sum(); sxy = ((x - x.mean()) * (y - y.mean())).sum()
    b = (syy - delta * sxx + np.sqrt((syy - delta * sxx) ** 2 + 4 * delta * sxy ** 2)) / (2 * sxy)
    return float(b), float(y.mean() - b * x.mean())
def odr_fit(x, y, wd, we, beta0):
    model = odr.Model(lambda beta, xx: beta[0] + beta[1] * xx)
    data = odr.Data(x, y, wd=wd, we=we)
    res = odr.ODR(data, model, beta0=beta0, sstol=1e-15, partol=1e-15, maxit=1000).run()
    return res
deming_cases = []
for lam in [1.0, 2.5]:
    b, a = deming_delta(xd, yd, 1 / lam)
    res = odr_fit(xd, yd, 1 / lam, 1.0, [0.0, 1.0])
    deming_cases.append({"lambda": lam, "closedSlope": b, "closedIntercept": a, "odrSlope": float(res.beta[1]), "odrIntercept": float(res.beta[0])})
out["deming"] = {"x": xd.tolist(), "y": yd.tolist(), "cases": deming_cases}

# Weighted Deming (constant CV), the iteration of weighted-deming.ts with ODRPACK as the inner solver
xt = rng.uniform(10, 400, 40)
xw = (xt * (1 + rng.normal(0, 0.04, 40))).round(1)
yw = ((1.04 * xt + 2) * (1 + rng.normal(0, 0.05, 40))).round(1)
lam = 1.3
w = 1 / ((xw + yw) / 2) ** 2
beta = [0.0, 1.0]
for _ in range(100):
    res = odr_fit(xw, yw, w / lam, w, beta)
    a, b = res.beta
    xhat = res.xplus
    w_new = 1 / ((xhat + a + b * xhat) / 2) ** 2
    if abs(b - beta[1]) < 1e-13 and _ > 2:
        break
    beta, w = [a, b], w_new
out["weightedDeming"] = {"x": xw.tolist(), "y": yw.tolist(), "lambda": lam, "slope": float(res.beta[1]), "intercept": float(res.beta[0])}

# Binomial-rank CIs of percentiles (equal-tailed, alpha = 0.05 each side)
def rank_ci(n, p, alpha=0.05):
    lo = max([r for r in range(1, n + 1) if stats.binom.cdf(r - 1, n, p) <= alpha], default=None)
    hi = min([s for s in range(1, n + 1) if stats.binom.sf(s - 1, n, p) <= alpha], default=None)
    return lo, hi
out["rankCi"] = [{"n": n, "p": p, "lowerRank": rank_ci(n, p)[0], "upperRank": rank_ci(n, p)[1]}
                 for n in [59, 120, 153, 240, 500] for p in [0.025, 0.975, 0.99]]

# Box-Cox maximum likelihood lambda (scipy.stats.boxcox_normmax, method 'mle')
skewed = rng.lognormal(1.2, 0.35, 150).round(2)
out["boxCox"] = {"values": skewed.tolist(), "lambda": float(stats.boxcox_normmax(skewed, method="mle"))}

# Generalized ESD on Rosner's (1983) example data, as printed in the NIST/SEMATECH e-Handbook 1.3.5.17.3:
# R_i by numpy, lambda_i by scipy's t quantiles
rosner = [-0.25, 0.68, 0.94, 1.15, 1.20, 1.26, 1.26, 1.34, 1.38, 1.43, 1.49, 1.49, 1.55, 1.56, 1.58, 1.65, 1.69, 1.70,
          1.76, 1.77, 1.81, 1.91, 1.94, 1.96, 1.99, 2.06, 2.09, 2.10, 2.14, 2.15, 2.23, 2.24, 2.26, 2.35, 2.37, 2.40,
          2.47, 2.54, 2.62, 2.64, 2.90, 2.92, 2.92, 2.93, 3.21, 3.26, 3.30, 3.59, 3.68, 4.30, 4.64, 5.34, 5.42, 6.01]
vals = np.array(rosner); n = len(vals); steps = []
for i in range(1, 11):
    m, s = vals.mean(), vals.std(ddof=1)
    k = np.argmax(np.abs(vals - m))
    p = 1 - 0.05 / (2 * (n - i + 1))
    t = stats.t.ppf(p, n - i - 1)
    lam_i = (n - i) * t / np.sqrt((n - i - 1 + t ** 2) * (n - i + 1))
    steps.append({"statistic": float(abs(vals[k] - m) / s), "critical": float(lam_i), "value": float(vals[k])})
    vals = np.delete(vals, k)
out["esd"] = {"values": rosner, "alpha": 0.05, "maxOutliers": 10, "steps": steps}

# Exact bootstrap distribution of the median, odd n (Maritz & Jarrett 1978): P(median* <= x_(k))
odd = np.sort(rng.normal(0.5, 1.0, 21).round(3))
m = (len(odd) + 1) // 2
exact_cdf = [float(stats.binom.sf(m - 1, len(odd), k / len(odd))) for k in range(1, len(odd) + 1)]
out["exactMedian"] = {"sorted": odd.tolist(), "cdfAtOrder": exact_cdf}

# Definition-6 quantiles (numpy 'weibull' method = Hyndman & Fan type 6) and the Kolmogorov survival function
q_data = rng.normal(50, 10, 37).round(1)
out["quantiles"] = {"values": q_data.tolist(), "p": [0.025, 0.1, 0.25, 0.5, 0.9, 0.975],
                    "type6": [float(np.percentile(q_data, 100 * p, method="weibull")) for p in [0.025, 0.1, 0.25, 0.5, 0.9, 0.975]]}
out["kolmogorov"] = [{"h": h, "q": float(special.kolmogorov(h))} for h in [0.5, 0.8, 1.0, 1.36, 1.63, 2.2]]

path = pathlib.Path(__file__).resolve().parent.parent / "fixtures" / "scipy.json"
path.write_text(json.dumps(out, indent=1) + "\n")
print("wrote", path)
