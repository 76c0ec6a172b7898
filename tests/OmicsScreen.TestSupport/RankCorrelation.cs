namespace OmicsScreen.TestSupport;

/// <summary>Spearman's rank correlation: Pearson's correlation of mid-ranks (Spearman 1904).</summary>
public static class RankCorrelation
{
    public static double Spearman(IReadOnlyList<double> x, IReadOnlyList<double> y)
    {
        if (x.Count != y.Count) throw new ArgumentException("Both series need the same length.");
        return Pearson(MidRanks(x), MidRanks(y));
    }

    public static double[] MidRanks(IReadOnlyList<double> values)
    {
        var order = Enumerable.Range(0, values.Count).OrderBy(i => values[i]).ToArray();
        var ranks = new double[values.Count];
        int start = 0;
        while (start < order.Length)
        {
            int end = start + 1;
            while (end < order.Length && values[order[end]] == values[order[start]]) end++;
            double midRank = (start + 1 + end) / 2.0;
            for (int k = start; k < end; k++) ranks[order[k]] = midRank;
            start = end;
        }
        return ranks;
    }

    private static double Pearson(double[] x, double[] y)
    {
        double meanX = x.Average(), meanY = y.Average();
        double sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++)
        {
            sxy += (x[i] - meanX) * (y[i] - meanY);
            sxx += (x[i] - meanX) * (x[i] - meanX);
            syy += (y[i] - meanY) * (y[i] - meanY);
        }
        return sxy / Math.Sqrt(sxx * syy);
    }
}
