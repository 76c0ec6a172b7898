#!/usr/bin/python3
"""Out-of-bag error and training time of general-purpose random forests on one panel file.

Usage: /usr/bin/python3 reference_forests.py PANEL.bin [--seeds N] [--trees T] [--threads K]

PANEL.bin is the layout OmicsScreen's ReferencePanelFile writes: int32 sample count n, int32
feature count p, n int32 class codes, then p blocks of n float32 values (feature-major), all
little-endian. Both libraries run at the settings of OmicsScreen's default forest: T trees
(default 500), floor(sqrt(p)) features per split, leaves grown to purity, a bootstrap of n rows
with replacement, Gini splits.

- scikit-learn (Debian python3-sklearn): RandomForestClassifier(n_estimators=T,
  max_features="sqrt", oob_score=True, bootstrap=True, n_jobs=K, random_state=seed).
- ranger (Debian r-cran-ranger), through Rscript: ranger(x, factor(y), num.trees=T,
  mtry=floor(sqrt(p)), min.node.size=1, replace=TRUE, sample.fraction=1, seed=seed,
  num.threads=K); prediction.error is its out-of-bag misclassification rate.

Prints one line per library and seed, then one summary line per library:
  run library=scikit-learn seed=1 oob_error=0.0620 train_s=14.62
  summary library=scikit-learn version=1.2.1 seeds=5 oob_mean=0.0640 oob_sd=0.0034 oob_min=... oob_max=... train_median_s=...
The functions run_sklearn and run_ranger also return (version, errors, times), or None when the
library is missing; make_reference.py uses them. A library that is not installed prints "missing library=NAME" instead. Training time is the
fit alone (loading the file is not timed). Seeds are 1..N.
"""
import argparse
import os
import shutil
import statistics
import subprocess
import sys
import tempfile
import time

R_PROGRAM = r"""
args <- commandArgs(TRUE)
path <- args[1]; seeds <- as.integer(args[2]); trees <- as.integer(args[3]); threads <- as.integer(args[4])
suppressPackageStartupMessages(library(ranger))
con <- file(path, "rb")
n <- readBin(con, "integer", 1, size = 4, endian = "little")
p <- readBin(con, "integer", 1, size = 4, endian = "little")
y <- factor(readBin(con, "integer", n, size = 4, endian = "little"))
x <- matrix(readBin(con, "numeric", n * p, size = 4, endian = "little"), nrow = n, ncol = p)
close(con)
colnames(x) <- paste0("f", seq_len(p))
cat("version", as.character(packageVersion("ranger")), "\n")
for (seed in seq_len(seeds)) {
  t <- system.time(rf <- ranger(x = x, y = y, num.trees = trees, mtry = floor(sqrt(p)), min.node.size = 1,
                                replace = TRUE, sample.fraction = 1, seed = seed, num.threads = threads))
  cat("run", seed, sprintf("%.6f", rf$prediction.error), sprintf("%.3f", t[["elapsed"]]), "\n")
}
"""


def read_panel(path):
    import numpy as np
    with open(path, "rb") as f:
        n, p = np.fromfile(f, dtype="<i4", count=2)
        y = np.fromfile(f, dtype="<i4", count=n)
        x = np.fromfile(f, dtype="<f4", count=n * p).reshape(p, n).T
    return np.ascontiguousarray(x), y


def summary(name, version, errors, times):
    sd = statistics.stdev(errors) if len(errors) > 1 else 0.0
    print(f"summary library={name} version={version} seeds={len(errors)} oob_mean={statistics.mean(errors):.4f} "
          f"oob_sd={sd:.4f} oob_min={min(errors):.4f} oob_max={max(errors):.4f} "
          f"train_median_s={statistics.median(times):.3f}", flush=True)


def run_sklearn(path, seeds, trees, threads):
    try:
        import sklearn
        from sklearn.ensemble import RandomForestClassifier
    except ImportError:
        print("missing library=scikit-learn", flush=True)
        return None
    x, y = read_panel(path)
    errors, times = [], []
    for seed in range(1, seeds + 1):
        forest = RandomForestClassifier(n_estimators=trees, max_features="sqrt", oob_score=True, bootstrap=True,
                                        n_jobs=threads, random_state=seed)
        start = time.perf_counter()
        forest.fit(x, y)
        elapsed = time.perf_counter() - start
        errors.append(1.0 - forest.oob_score_)
        times.append(elapsed)
        print(f"run library=scikit-learn seed={seed} oob_error={errors[-1]:.4f} train_s={elapsed:.3f}", flush=True)
    summary("scikit-learn", sklearn.__version__, errors, times)
    return sklearn.__version__, errors, times


def run_ranger(path, seeds, trees, threads):
    rscript = shutil.which("Rscript")
    if rscript is None or subprocess.run([rscript, "-e", "library(ranger)"], capture_output=True).returncode != 0:
        print("missing library=ranger", flush=True)
        return None
    with tempfile.NamedTemporaryFile("w", suffix=".R", delete=False) as program:
        program.write(R_PROGRAM)
    try:
        process = subprocess.Popen([rscript, program.name, path, str(seeds), str(trees), str(threads)],
                                   stdout=subprocess.PIPE, text=True)
        version, errors, times = "?", [], []
        for line in process.stdout:
            fields = line.split()
            if fields[:1] == ["version"]:
                version = fields[1]
            elif fields[:1] == ["run"]:
                errors.append(float(fields[2]))
                times.append(float(fields[3]))
                print(f"run library=ranger seed={fields[1]} oob_error={errors[-1]:.4f} train_s={times[-1]:.3f}", flush=True)
        if process.wait() != 0:
            sys.exit("ranger failed")
        summary("ranger", version, errors, times)
        return version, errors, times
    finally:
        os.unlink(program.name)


def main():
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("panel")
    parser.add_argument("--seeds", type=int, default=5)
    parser.add_argument("--trees", type=int, default=500)
    parser.add_argument("--threads", type=int, default=os.cpu_count() or 1)
    parser.add_argument("--library", choices=["all", "scikit-learn", "ranger"], default="all")
    args = parser.parse_args()
    if args.library in ("all", "ranger"):
        run_ranger(args.panel, args.seeds, args.trees, args.threads)
    if args.library in ("all", "scikit-learn"):
        run_sklearn(args.panel, args.seeds, args.trees, args.threads)


if __name__ == "__main__":
    main()
