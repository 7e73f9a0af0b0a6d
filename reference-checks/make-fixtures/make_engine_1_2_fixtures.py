#!/usr/bin/env python3
"""Makes reference-checks/fixtures/engine-1-2.json: the reference values for the engine 1.2 checks (run once).

Every data set here is invented (seeded numpy generator). The values are computed by scipy, an independent,
general-purpose library:
- Box-Cox lambda by scipy.stats.boxcox_normmax(method='mle'). scipy 1.10 (Debian's python3-scipy) computes
  its log-likelihood as var(x**lmb / lmb), which cancels badly for data with a small coefficient of
  variation, so the values are taken from scipy >= 1.12, whose boxcox_llf works in log space (run with
  that scipy: `python3 make_engine_1_2_fixtures.py`); the script records the version it ran with and, where
  Debian's scipy 1.10 is given as a second interpreter (--compare /usr/bin/python3), how far 1.10 is off.
- the standard normal quantile z(0.975) by scipy.stats.norm.ppf, for the Gaussian limits of NIST's Lew data.
The tests in reference-checks/*.check.ts read the JSON; they never run Python.
"""
import json, pathlib, subprocess, sys
import numpy as np
import scipy
from scipy import stats

rng = np.random.default_rng(20261202)
out = {"generator": f"scipy {scipy.__version__}, numpy {np.__version__}", "seed": 20261202}

def lam(x):
    return float(stats.boxcox_normmax(np.asarray(x, dtype=float), method="mle"))

# 60 sets with a small coefficient of variation (0.3% to 3%), around means from 0.5 to 5000, 3 decimals of
# the mean's magnitude; and 20 ordinary skewed sets (lognormal, gamma).
low_cv = []
for k in range(60):
    n = int(rng.integers(20, 121))
    mean = float(10 ** rng.uniform(-0.3, 3.7))
    cv = float(rng.uniform(0.003, 0.03))
    shape = k % 3
    if shape == 0:
        x = rng.normal(mean, cv * mean, n)
    elif shape == 1:
        x = mean * np.exp(rng.normal(0, cv, n))
    else:
        x = mean * (1 + cv * (rng.gamma(4.0, 1.0, n) - 4.0) / 2.0)
    digits = max(0, 4 - int(np.floor(np.log10(mean))))
    x = np.round(x, digits)
    low_cv.append({"values": x.tolist(), "lambda": lam(x)})
skewed = []
for k in range(20):
    n = int(rng.integers(25, 200))
    x = rng.lognormal(rng.uniform(0, 3), rng.uniform(0.2, 0.8), n) if k % 2 == 0 else rng.gamma(rng.uniform(1.5, 8), rng.uniform(0.5, 20), n)
    x = np.round(x, 3)
    skewed.append({"values": x.tolist(), "lambda": lam(x)})
out["boxCox"] = {"lowCv": low_cv, "skewed": skewed, "method": "scipy.stats.boxcox_normmax(x, method='mle')"}
out["normalQuantile975"] = float(stats.norm.ppf(0.975))

if "--compare" in sys.argv:
    other = sys.argv[sys.argv.index("--compare") + 1]
    code = ("import json,sys,numpy as np,scipy;from scipy import stats;d=json.load(sys.stdin);"
            "print(json.dumps({'version':scipy.__version__,'lambdas':[float(stats.boxcox_normmax(np.asarray(s['values'],dtype=float),method='mle')) for s in d]}))")
    sets = low_cv + skewed
    res = json.loads(subprocess.run([other, "-c", code], input=json.dumps(sets), capture_output=True, text=True, check=True).stdout)
    diffs = [abs(a - s["lambda"]) for a, s in zip(res["lambdas"], sets)]
    out["compare"] = {"scipy": res["version"], "maxAbsDifferenceLowCv": max(diffs[:60]), "maxAbsDifferenceSkewed": max(diffs[60:]),
                      "lowCvSetsOffBy1e-5": sum(d > 1e-5 for d in diffs[:60])}

here = pathlib.Path(__file__).resolve().parent
(here.parent / "fixtures" / "engine-1-2.json").write_text(json.dumps(out, indent=1) + "\n")
print(json.dumps({k: v for k, v in out.items() if k not in ("boxCox",)}, indent=1))
lams = [s["lambda"] for s in low_cv]
print("low-CV lambdas inside (-5, 5):", sum(abs(l) < 5 for l in lams), "of", len(lams))
