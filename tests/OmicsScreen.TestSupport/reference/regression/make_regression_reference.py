#!/usr/bin/python3
"""Reference values for OmicsScreen's regression trees and forests (issue 17).

Usage: /usr/bin/python3 make_regression_reference.py      (writes next to itself, about 1 minute)

Data: Friedman's first regression benchmark (Friedman 1991, Ann. Statist. 19:1-67),
y = 10 sin(pi x1 x2) + 20 (x3 - 0.5)^2 + 10 x4 + 5 x5 + noise, with 25 further pure-noise
features, drawn by scikit-learn's make_friedman1(n_samples=300, n_features=30, noise=1.0,
random_state=7) and rounded to 4 decimals. Written to friedman1.csv (sample id, y, x1..x30).

Values written to regression_reference.json:
- "tree": scikit-learn DecisionTreeRegressor(max_depth=3, random_state=0) on all features, no
  sampling: its predictions on the training rows and each feature's unnormalised impurity
  decrease (tree_.compute_feature_importances(normalize=False): weighted variance decrease
  divided by the root's sample count). With at most 300 distinct values per feature and exact
  bins, a correct CART regression tree finds the same splits whatever its threshold placement.
- "spearman": each feature's Spearman rho and p-value against y (scipy.stats.spearmanr) and
  Benjamini-Hochberg q-values across the 30 features (statsmodels multipletests "fdr_bh").
- "cohort_spearman": Spearman rho of x1 and x4 against y within three invented cohorts (samples
  1-100, 101-200, 201-300).
- "forest": out-of-bag mean squared error of scikit-learn RandomForestRegressor and ranger
  (through Rscript), 500 trees, floor(sqrt(p)) = 5 features per split, leaves grown to purity
  (sklearn min_samples_leaf=1; ranger min.node.size=1), bootstrap of n rows, seeds 1..10.
  ranger's prediction.error is its out-of-bag MSE; sklearn's is computed from oob_prediction_.
"""
import json
import os
import subprocess
import tempfile

import numpy as np
import sklearn
from sklearn.datasets import make_friedman1
from sklearn.ensemble import RandomForestRegressor
from sklearn.tree import DecisionTreeRegressor

HERE = os.path.dirname(os.path.abspath(__file__))
SEEDS = list(range(1, 11))
TREES = 500

R_PROGRAM = r"""
args <- commandArgs(TRUE)
suppressPackageStartupMessages(library(ranger))
d <- read.csv(args[1])
x <- as.matrix(d[, -(1:2)]); y <- d$y
cat("version", as.character(packageVersion("ranger")), "\n")
for (seed in 1:10) {
  rf <- ranger(x = x, y = y, num.trees = 500, mtry = floor(sqrt(ncol(x))), min.node.size = 1,
               replace = TRUE, sample.fraction = 1, seed = seed, num.threads = 2)
  cat("run", seed, sprintf("%.6f", rf$prediction.error), "\n")
}
"""


def main():
    x, y = make_friedman1(n_samples=300, n_features=30, noise=1.0, random_state=7)
    x = np.round(x, 4)
    y = np.round(y, 4)
    csv = os.path.join(HERE, "friedman1.csv")
    with open(csv, "w") as f:
        f.write("sample,y," + ",".join(f"x{j + 1}" for j in range(x.shape[1])) + "\n")
        for i in range(x.shape[0]):
            f.write(f"F1-{i + 1:03d},{y[i]:.4f}," + ",".join(f"{v:.4f}" for v in x[i]) + "\n")

    tree = DecisionTreeRegressor(max_depth=3, random_state=0).fit(x, y)
    result = {
        "source": "sklearn.datasets.make_friedman1(n_samples=300, n_features=30, noise=1.0, random_state=7)",
        "sklearn_version": sklearn.__version__,
        "tree": {
            "max_depth": 3,
            "train_predictions": [round(float(v), 10) for v in tree.predict(x)],
            "impurity_decrease": [round(float(v), 10) for v in tree.tree_.compute_feature_importances(normalize=False)],
            "node_count": int(tree.tree_.node_count),
        },
        "forest": {"trees": TREES, "features_per_split": int(np.floor(np.sqrt(x.shape[1]))), "seeds": SEEDS},
    }

    sk = []
    for seed in SEEDS:
        rf = RandomForestRegressor(n_estimators=TREES, max_features=int(np.floor(np.sqrt(x.shape[1]))),
                                   min_samples_leaf=1, bootstrap=True, oob_score=True, n_jobs=2,
                                   random_state=seed).fit(x, y)
        sk.append(round(float(np.mean((rf.oob_prediction_ - y) ** 2)), 6))
    result["forest"]["scikit-learn"] = {"version": sklearn.__version__, "oob_mse": sk}

    with tempfile.NamedTemporaryFile("w", suffix=".R", delete=False) as f:
        f.write(R_PROGRAM)
        program = f.name
    out = subprocess.run(["Rscript", program, csv], capture_output=True, text=True, check=True).stdout
    os.unlink(program)
    version, rg = None, []
    for line in out.splitlines():
        parts = line.split()
        if parts[0] == "version":
            version = parts[1]
        elif parts[0] == "run":
            rg.append(round(float(parts[2]), 6))
    result["forest"]["ranger"] = {"version": version, "oob_mse": rg}
    result["y_variance_population"] = round(float(np.var(y)), 10)

    # Per-feature Spearman rho and p (scipy.stats.spearmanr, t approximation) with
    # Benjamini-Hochberg q-values (statsmodels multipletests, method "fdr_bh").
    import scipy
    import statsmodels
    from scipy.stats import spearmanr
    from statsmodels.stats.multitest import multipletests
    rho, pval = [], []
    for j in range(x.shape[1]):
        r = spearmanr(x[:, j].astype(np.float32), y)
        rho.append(float(r.correlation))
        pval.append(float(r.pvalue))
    q = multipletests(pval, method="fdr_bh")[1]
    # Per-cohort Spearman rho of x1 and x4 in three invented cohorts (samples 1-100, 101-200, 201-300).
    result["cohort_spearman"] = {
        f"x{j + 1}": [float(spearmanr(x[c * 100:(c + 1) * 100, j].astype(np.float32), y[c * 100:(c + 1) * 100]).correlation)
                      for c in range(3)] for j in (0, 3)}
    result["spearman"] = {"scipy_version": scipy.__version__, "statsmodels_version": statsmodels.__version__,
                          "rho": [round(v, 12) for v in rho], "p": pval, "q": [float(v) for v in q]}

    with open(os.path.join(HERE, "regression_reference.json"), "w") as f:
        json.dump(result, f, indent=1)
        f.write("\n")
    print("sklearn", np.mean(sk), np.std(sk, ddof=1), "ranger", np.mean(rg), np.std(rg, ddof=1))


if __name__ == "__main__":
    main()
