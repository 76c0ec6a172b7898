#!/usr/bin/python3
"""Reference values for OmicsScreen's regression forests and Spearman statistics on public data (issue 17).

Usage: /usr/bin/python3 make_diabetes_reference.py      (writes next to itself, about a minute)

Data: the diabetes data of Efron, Hastie, Johnstone & Tibshirani (2004, Ann. Statist. 32:407-499,
"Least angle regression"): 442 patients, ten baseline measurements (age, sex, body mass index,
mean blood pressure, six blood serum measurements s1..s6) and a quantitative measure of disease
progression one year later, as shipped with scikit-learn (sklearn.datasets.load_diabetes,
scaled=False: the original units; BSD-3-Clause distribution). Written to diabetes.csv with
invented sample ids (DB-001..), not patient identifiers.

Values written to diabetes_reference.json:
- "forest": scikit-learn RandomForestRegressor(n_estimators=500, max_features=3 = floor(sqrt(10)),
  min_samples_leaf=1, bootstrap=True, oob_score=True) for random_state 1..10: oob_score_ (the
  out-of-bag R^2) and feature_importances_ (mean decrease in impurity, normalised to sum 1).
- "spearman": each feature's Spearman rho and two-sided p-value against the outcome
  (scipy.stats.spearmanr), and a 95% Fisher-z interval with the variance (1 + rho^2/2)/(n - 3) of
  Bonett & Wright (2000), written out here because scipy 1.10 gives no interval for spearmanr.
"""
import json
import math
import os

import numpy as np
import scipy
import sklearn
from scipy import stats
from sklearn.datasets import load_diabetes
from sklearn.ensemble import RandomForestRegressor

HERE = os.path.dirname(os.path.abspath(__file__))
SEEDS = list(range(1, 11))
Z975 = 1.959963984540054


def main():
    data = load_diabetes(scaled=False)
    x, y = data.data, data.target
    names = ["age", "sex", "bmi", "bp", "s1", "s2", "s3", "s4", "s5", "s6"]
    csv = os.path.join(HERE, "diabetes.csv")
    with open(csv, "w") as f:
        f.write("sample,progression," + ",".join(names) + "\n")
        for i in range(x.shape[0]):
            f.write(f"DB-{i + 1:03d},{y[i]:g}," + ",".join(f"{v:g}" for v in x[i]) + "\n")
    # Read back what the C# tests will read, so both sides see the same numbers.
    table = np.genfromtxt(csv, delimiter=",", skip_header=1, usecols=range(1, 12))
    y, x = table[:, 0], table[:, 1:]

    oob_r2, importances = [], []
    for seed in SEEDS:
        rf = RandomForestRegressor(n_estimators=500, max_features=3, min_samples_leaf=1, bootstrap=True,
                                   oob_score=True, random_state=seed, n_jobs=2).fit(x, y)
        oob_r2.append(float(rf.oob_score_))
        importances.append([float(v) for v in rf.feature_importances_])

    spearman = []
    n = len(y)
    for j, name in enumerate(names):
        rho, p = stats.spearmanr(x[:, j], y)
        z, se = math.atanh(rho), math.sqrt((1 + rho * rho / 2) / (n - 3))
        spearman.append({"feature": name, "rho": float(rho), "p": float(p),
                         "lower": math.tanh(z - Z975 * se), "upper": math.tanh(z + Z975 * se)})

    result = {
        "source": "sklearn.datasets.load_diabetes(scaled=False) (Efron et al. 2004)",
        "versions": {"sklearn": sklearn.__version__, "scipy": scipy.__version__, "numpy": np.__version__},
        "samples": int(n), "features": names,
        "forest": {"trees": 500, "features_per_split": 3, "seeds": SEEDS, "oob_r_squared": oob_r2,
                   "feature_importances": importances},
        "spearman": spearman,
    }
    with open(os.path.join(HERE, "diabetes_reference.json"), "w") as f:
        json.dump(result, f, indent=1)
    print("oob R2 mean", np.mean(oob_r2), "sd", np.std(oob_r2, ddof=1))


if __name__ == "__main__":
    main()
