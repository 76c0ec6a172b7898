using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;

namespace OmicsScreen.Engine.Survival;

/// <summary>
/// A grown random survival forest (Ishwaran et al. 2008): its trees, each tree's out-of-bag rows
/// with that tree's mortality for them, and the follow-up it was grown on. The ensemble mortality
/// of a sample is the mean of its leaves' mortality over the trees, a risk score: higher means
/// more events expected, earlier.
/// </summary>
public sealed class SurvivalForest
{
    private readonly SurvivalTree[] _trees;
    private readonly int[][] _outOfBagRows;
    private readonly double[][] _outOfBagMortality;

    internal SurvivalForest(ForestOptions options, FollowUpTimes followUp, SurvivalTree[] trees, int[][] outOfBagRows,
        double[][] outOfBagMortality, int featureCount)
    {
        Options = options;
        FollowUp = followUp;
        _trees = trees;
        _outOfBagRows = outOfBagRows;
        _outOfBagMortality = outOfBagMortality;
        FeatureCount = featureCount;
    }

    public ForestOptions Options { get; }
    public FollowUpTimes FollowUp { get; }
    public int TreeCount => _trees.Length;
    public int SampleCount => FollowUp.SampleCount;
    public int FeatureCount { get; }

    public SurvivalTree Tree(int index) => _trees[index];

    /// <summary>The rows tree index left out of its bag, in increasing order.</summary>
    public ReadOnlySpan<int> OutOfBagRows(int index) => _outOfBagRows[index];

    /// <summary>Tree index's mortality for its out-of-bag rows, parallel to <see cref="OutOfBagRows"/>.</summary>
    public ReadOnlySpan<double> OutOfBagMortality(int index) => _outOfBagMortality[index];

    /// <summary>Each sample's mean mortality over the trees that left it out; NaN where none did.</summary>
    public double[] OutOfBagRisk()
    {
        var sums = new double[SampleCount];
        var counts = new int[SampleCount];
        for (int t = 0; t < _trees.Length; t++)
        {
            var rows = _outOfBagRows[t];
            var values = _outOfBagMortality[t];
            for (int i = 0; i < rows.Length; i++)
            {
                sums[rows[i]] += values[i];
                counts[rows[i]]++;
            }
        }
        for (int s = 0; s < sums.Length; s++) sums[s] = counts[s] > 0 ? sums[s] / counts[s] : double.NaN;
        return sums;
    }

    /// <summary>The ensemble mortality of every sample of a binned matrix encoded like the training panel.</summary>
    public double[] Risk(BinnedMatrix matrix)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        var risk = new double[matrix.SampleCount];
        for (int s = 0; s < risk.Length; s++)
        {
            double sum = 0;
            foreach (var tree in _trees) sum += tree.MortalityOf(matrix, s);
            risk[s] = sum / _trees.Length;
        }
        return risk;
    }

    /// <summary>
    /// The ensemble cumulative hazard of one sample at each training event time: the mean over
    /// trees of its leaf's Nelson-Aalen hazard (Ishwaran et al. 2008, eq. 3).
    /// </summary>
    public double[] CumulativeHazard(BinnedMatrix matrix, int sample)
    {
        ArgumentNullException.ThrowIfNull(matrix);
        var hazard = new double[FollowUp.EventTimes.Length];
        foreach (var tree in _trees)
        {
            int leaf = tree.Topology.LeafOf(matrix, sample);
            for (int g = 0; g < hazard.Length; g++) hazard[g] += tree.CumulativeHazard(leaf, g);
        }
        for (int g = 0; g < hazard.Length; g++) hazard[g] /= _trees.Length;
        return hazard;
    }

    /// <summary>Each feature's log-rank split statistics summed over a tree's splits, averaged over trees.</summary>
    public double[] MeanSplitStatistic()
    {
        var mean = new double[FeatureCount];
        foreach (var tree in _trees) tree.AddSplitStatistics(mean);
        for (int f = 0; f < mean.Length; f++) mean[f] /= _trees.Length;
        return mean;
    }
}
