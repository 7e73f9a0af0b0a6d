#!/usr/bin/env python3
"""Makes reference-checks/fixtures/precision-scipy.json (run once: python3 make_precision_scipy.py).

The χ² and t quantiles at the points a 5 × 5 precision verification (CLSI EP15-A3 practice, DOMAIN.md) uses,
from scipy.stats.chi2.ppf and scipy.stats.t.ppf, an independent general-purpose library (a second source beside
R's qchisq in precision.json), in place of a printed χ² table: no published worked example of the verification
with its data could be found to check against (see reference-checks/README.md).
- UVL factor √(χ²(1 − α/ℓ; ν)/ν) for ν = 20 (repeatability of 5 × 5), α = 0.05, ℓ = 1 … 4 materials, and for
  a few non-integer ν as Satterthwaite gives for s_WL;
- χ² CI factors of an SD, √(ν/χ²(1 − α/2; ν)) and √(ν/χ²(α/2; ν)), for the same ν;
- the trueness multiplier t(1 − α/(2ℓ); ν) for ν = 4 (k − 1 of 5 days) and non-integer ν.
"""
import json, pathlib
import numpy as np
import scipy
from scipy import stats

alpha = 0.05
out = {"generator": f"scipy {scipy.__version__}, numpy {np.__version__}", "alpha": alpha, "points": []}
for nu in [20.0, 4.0, 6.522781254978665, 14.1279856580916, 37.5]:
    for l in [1, 2, 3, 4]:
        out["points"].append({
            "nu": nu, "materials": l,
            "uvlFactor": float(np.sqrt(stats.chi2.ppf(1 - alpha / l, nu) / nu)),
            "ciLowerFactor": float(np.sqrt(nu / stats.chi2.ppf(1 - alpha / 2, nu))),
            "ciUpperFactor": float(np.sqrt(nu / stats.chi2.ppf(alpha / 2, nu))),
            "tMultiplier": float(stats.t.ppf(1 - alpha / (2 * l), nu)),
        })
path = pathlib.Path(__file__).resolve().parent.parent / "fixtures" / "precision-scipy.json"
path.write_text(json.dumps(out, indent=1) + "\n")
