#!/usr/bin/env python3
"""Makes reference-checks/fixtures/outside-scipy.json with scipy 1.17 (the pyenv Python; run once, after
make_outside_r.R, whose weighted-Deming data it reads: python3 make_outside_scipy.py).

Weighted Deming (K. Linnet (1990), Stat. Med. 9, 1463-1473: weights 1/c^2, c the mean of a specimen's two true
values, recomputed from the fitted line until stable), by two routes that use no closed form of the Deming line:
- 'leastSquares': each round minimises the errors-in-variables weighted sum of squares
  sum w_i [(x_i - X_i)^2/lambda + (y_i - a - b X_i)^2] over a, b and all true values X_i with
  scipy.optimize.least_squares (trust-region reflective, exact Jacobian, tolerances 1e-15), then sets
  w_i = 1/((X_i + a + b X_i)/2)^2 from the solver's own X_i;
- 'odr': the same rounds with ODRPACK (scipy.odr) as the inner solver (weights wd = w/lambda on x, we = w on y),
  the reweighting from ODRPACK's fitted x (xplus).
The data are R's (fixtures/outside-r.json, invented there), so R's optim route is a third on the same data.
"""
import json, pathlib
import numpy as np
import scipy
from scipy import odr, optimize

here = pathlib.Path(__file__).resolve().parent
wd = json.loads((here.parent / "fixtures" / "outside-r.json").read_text())["weightedDeming"]
x = np.array(wd["x"]); y = np.array(wd["y"]); lam = wd["lambda"]; n = len(x)


def eiv_least_squares(w, start):
    sx = np.sqrt(w / lam); sy = np.sqrt(w)

    def residuals(p):
        a, b, X = p[0], p[1], p[2:]
        return np.concatenate([sx * (x - X), sy * (y - a - b * X)])

    def jacobian(p):
        a, b, X = p[0], p[1], p[2:]
        J = np.zeros((2 * n, n + 2))
        J[np.arange(n), 2 + np.arange(n)] = -sx
        J[n + np.arange(n), 0] = -sy
        J[n + np.arange(n), 1] = -sy * X
        J[n + np.arange(n), 2 + np.arange(n)] = -sy * b
        return J

    res = optimize.least_squares(residuals, start, jac=jacobian, method="trf", xtol=1e-15, ftol=1e-15, gtol=1e-15, max_nfev=10000)
    return res.x, float(np.max(np.abs(res.grad)))


def odr_inner(w, start):
    model = odr.Model(lambda beta, xx: beta[0] + beta[1] * xx)
    res = odr.ODR(odr.Data(x, y, wd=w / lam, we=w), model, beta0=start[:2], sstol=1e-15, partol=1e-15, maxit=1000).run()
    return np.concatenate([res.beta, res.xplus]), None


def reweighted(inner):
    w = 1 / ((x + y) / 2) ** 2
    p = np.concatenate([[0.0, 1.0], x])
    previous = None
    for rounds in range(1, 201):
        p, grad = inner(w, p)
        a, b, X = p[0], p[1], p[2:]
        w = 1 / ((X + a + b * X) / 2) ** 2
        change = abs(b - previous) / abs(b) if previous is not None else float("inf")
        previous = b
        if change < 1e-13:
            break
    return {"slope": float(b), "intercept": float(a), "rounds": rounds, "lastChange": change, "gradient": grad}


out = {"generator": f"scipy {scipy.__version__}, numpy {np.__version__}", "data": "fixtures/outside-r.json weightedDeming",
       "weightedDeming": {"lambda": lam, "leastSquares": reweighted(eiv_least_squares), "odr": reweighted(odr_inner)}}
print(json.dumps(out["weightedDeming"], indent=1))
(here.parent / "fixtures" / "outside-scipy.json").write_text(json.dumps(out, indent=1) + "\n")
