#!/usr/bin/python3
"""Reference out-of-bag errors of scikit-learn and ranger on the small shapes of issue 15.

Usage:
    dotnet run -c Release --project tests/OmicsScreen.Benchmarks -- write-panels /tmp/forest-panels
    /usr/bin/python3 make_reference.py /tmp/forest-panels

The benchmark program writes each panel of OmicsScreen.TestSupport.ForestReferenceShapes as
NAME.bin (the float32 values our generator made, so both sides see identical data). For every
small shape this script runs both libraries at our default forest (reference_forests.py: 500
trees, floor(sqrt(p)) features per split, leaves to purity, bootstrap) over seeds 1..10 and writes
oob_reference.json next to itself: per shape and library, the version and the out-of-bag error of
every seed. Deterministic for a given library version and thread count (scikit-learn and ranger
seed every tree from random_state / seed). About 3 minutes on 2 cores.
"""
import json
import os
import sys

sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
import reference_forests  # noqa: E402

SHAPES = ["wide-60x2000", "middle-200x400", "tall-800x60"]
SEEDS = 10
TREES = 500
THREADS = 2


def main():
    panels = sys.argv[1]
    result = {"trees": TREES, "seeds": list(range(1, SEEDS + 1)), "threads": THREADS, "shapes": {}}
    for shape in SHAPES:
        path = os.path.join(panels, shape + ".bin")
        entry = {}
        for name, run in (("scikit-learn", reference_forests.run_sklearn), ("ranger", reference_forests.run_ranger)):
            outcome = run(path, SEEDS, TREES, THREADS)
            if outcome is None:
                sys.exit(f"{name} is not installed (Debian: python3-sklearn, r-cran-ranger)")
            version, errors, _ = outcome
            entry[name] = {"version": version, "oob_error": [round(e, 6) for e in errors]}
        result["shapes"][shape] = entry
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "oob_reference.json")
    with open(out, "w") as f:
        json.dump(result, f, indent=1)
        f.write("\n")
    print("wrote", out)


if __name__ == "__main__":
    main()
