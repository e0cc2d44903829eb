"""The benchmark's comparison: the same paired analysis as `tandem analyze --procedure paired-t`
with its diagnostics, written the usual way with pandas and scipy (Debian's python3-pandas and
python3-scipy), on the same file.

    /usr/bin/python3 bench/pandas_paired.py FILE ID FIRST SECOND

Reads the CSV, refuses repeated ids, drops incomplete pairs, takes the differences (first minus
second), runs the paired t with its 95% interval and d_z, and describes the differences as tandem
does: mean, SD, median, quartiles, skewness, 1.5 x IQR outliers, zeros and tied values (and
Shapiro-Wilk only up to 5000 values, as tandem). Prints one JSON line with the numbers and the
library versions.
"""
import json
import sys

import numpy as np
import pandas as pd
import scipy
from scipy import stats


def main(path, id_col, first, second):
    df = pd.read_csv(path, usecols=[id_col, first, second])
    if df[id_col].duplicated().any():
        raise SystemExit(f"repeated ids in {id_col}")
    pairs = df.dropna(subset=[first, second])
    d = (pairs[first] - pairs[second]).to_numpy()
    n = d.size
    res = stats.ttest_rel(pairs[first], pairs[second])
    mean = d.mean()
    sd = d.std(ddof=1)
    se = sd / np.sqrt(n)
    half = stats.t.ppf(0.975, n - 1) * se
    q1, median, q3 = np.percentile(d, [25, 50, 75])
    iqr = q3 - q1
    outliers = int(((d < q1 - 1.5 * iqr) | (d > q3 + 1.5 * iqr)).sum())
    counts = pd.Series(d).value_counts()
    tied = int(counts[counts > 1].sum())
    shapiro = stats.shapiro(d) if 3 <= n <= 5000 else None
    print(json.dumps({
        "pairs": int(n),
        "dropped": int(len(df) - n),
        "estimate": float(mean),
        "ci": [float(mean - half), float(mean + half)],
        "t": float(res.statistic),
        "df": int(n - 1),
        "pValue": float(res.pvalue),
        "dz": float(mean / sd),
        "sd": float(sd),
        "median": float(median),
        "quartiles": [float(q1), float(q3)],
        "skewness": float(stats.skew(d, bias=False)),
        "outliers": outliers,
        "zeros": int((d == 0).sum()),
        "tied": tied,
        "shapiro": None if shapiro is None else [float(shapiro.statistic), float(shapiro.pvalue)],
        "versions": {"pandas": pd.__version__, "scipy": scipy.__version__, "numpy": np.__version__},
    }))


if __name__ == "__main__":
    main(*sys.argv[1:5])
