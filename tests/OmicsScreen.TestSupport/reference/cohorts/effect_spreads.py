# The minimum spreads of the cohort check's heterogeneity flag for measured and time-to-event
# outcomes (src/OmicsScreen.Screening/Cohorts/CohortEffectMeasure.cs), chosen to move the
# concordance index as much as the classes' 0.10 of AUC: a normal marker, 4,000 invented samples,
# 5 draws per setting; scipy's Kendall tau gives C = (tau + 1) / 2 (no ties, no censoring).
# Run with /usr/bin/python3 effect_spreads.py > effect_spreads.txt (numpy and scipy from Debian).
import numpy as np
from scipy import stats

rng = np.random.default_rng(1)
n = 4000


def concordance(x, y):
    return (stats.kendalltau(x, y).correlation + 1) / 2


for r in [0.1, 0.2, 0.25, 0.3]:
    cs, rhos = [], []
    for _ in range(5):
        x = rng.normal(size=n)
        y = r * x + np.sqrt(1 - r * r) * rng.normal(size=n)
        cs.append(concordance(x, y))
        rhos.append(stats.spearmanr(x, y).correlation)
    print(f"pearson {r:.2f}  spearman {np.mean(rhos):.3f}  C {np.mean(cs):.3f}")
for beta in [0.2, 0.3, 0.35, 0.4, 0.5]:
    cs = []
    for _ in range(5):
        x = rng.normal(size=n)
        t = rng.exponential(size=n) / np.exp(beta * x)
        cs.append(1 - concordance(x, t))
    print(f"log hazard ratio per SD {beta:.2f}  C {np.mean(cs):.3f}")
