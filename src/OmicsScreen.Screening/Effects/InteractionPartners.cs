using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Trees;
using OmicsScreen.Screening.Randomness;

namespace OmicsScreen.Screening.Effects;

/// <summary>
/// Which shortlisted markers act together in the forest (issue 19, part 5): a forest is grown on
/// the panel plus, for each scanned marker, <see cref="CopiesPerMarker"/> copies permuted within
/// strata of the outcome; a pair of markers is named partners when its adjacent-split score
/// (<see cref="AdjacentSplits.Score"/>: how much more often the two split directly one below the
/// other than their own split counts predict) is positive and above the largest score of any
/// scanned marker with any other marker's copy.
/// </summary>
/// <remarks>
/// Why copies permuted within outcome strata: such a copy keeps its marker's distribution within
/// each stratum, so it keeps the marker's own link to the outcome, and loses any joint role with
/// another marker beyond what passes through the outcome. For a marker unrelated to the others
/// and to the outcome the copy has exactly the marker's joint law with them, so a real pair is
/// then exchangeable with its marker-with-copy pairs; taking the largest of all k (k - 1) C
/// marker-with-copy scores as the bar makes naming any false pair about as likely as one of the
/// k (k - 1) / 2 real pairs topping a pool 2C times its size, 1 / (2C + 1), under 5% with C = 10.
/// The bar pools copies of every scanned marker, strong and weak, so it is conservative for weak
/// pairs. Markers that each act on their own keep most, not all, of their law in a copy (the
/// copy breaks the dependence the outcome induces between them), so such pairs are named more
/// often than that; the README gives the simulated rates. The strata are each outcome kind's
/// (<c>ScreenOutcome.PartnerStrata</c>).
/// </remarks>
public static class InteractionPartners
{
    /// <summary>Markers scanned at most (the top of the shortlist).</summary>
    public const int MaxMarkers = 20;

    /// <summary>
    /// The scan's forest has this many times the screen's trees: the adjacent-split score of an
    /// interacting pair grows with the square root of the trees while the copies' scores do not
    /// (simulated XOR pair, 300 samples: named in 6 of 10 seeds with 500 trees, 9 of 10 with 1,000).
    /// </summary>
    public const int TreeFactor = 2;

    /// <summary>Stratum-permuted copies of each scanned marker.</summary>
    public const int CopiesPerMarker = 10;

    /// <param name="raw">The panel's values.</param>
    /// <param name="markers">Feature indices to scan, in shortlist order; only the first <see cref="MaxMarkers"/> are used.</param>
    /// <param name="strata">Stratum of every sample.</param>
    /// <param name="runSeed">The screen's run seed (the copies' streams are <see cref="RandomStreams.PartnerCopy"/>).</param>
    /// <param name="grow">Grows the scan's forest on a binned matrix and returns its trees.</param>
    public static InteractionPartnerScan Scan(FeatureMatrix raw, IReadOnlyList<int> markers, ReadOnlySpan<int> strata, ulong runSeed,
        int featuresPerSplit, Func<BinnedMatrix, int, IReadOnlyList<SplitTopology>> grow, int threadCount, int copiesPerMarker = CopiesPerMarker, int maxParentDepth = int.MaxValue)
    {
        ArgumentNullException.ThrowIfNull(raw);
        ArgumentNullException.ThrowIfNull(markers);
        ArgumentNullException.ThrowIfNull(grow);
        if (strata.Length != raw.SampleCount) throw new ArgumentException("Every sample needs a stratum.");
        ArgumentOutOfRangeException.ThrowIfLessThan(copiesPerMarker, 1);
        var scanned = markers.Take(MaxMarkers).ToArray();
        int k = scanned.Length;
        if (k < 2) return new InteractionPartnerScan(scanned, [], double.NaN, 0, copiesPerMarker);

        var extended = WithStratumCopies(raw, scanned, strata, runSeed, copiesPerMarker);
        var binned = new BinMapper().Bin(extended, threadCount);
        int p = raw.FeatureCount;
        var trees = grow(binned, ScanFeaturesPerSplit(featuresPerSplit, p, binned.FeatureCount));
        var tracked = new int[k * (copiesPerMarker + 1)];
        for (int i = 0; i < k; i++) tracked[i] = scanned[i];
        for (int c = 0; c < k * copiesPerMarker; c++) tracked[k + c] = p + c;
        var splits = AdjacentSplits.Measure(trees, tracked, binned.FeatureCount, maxParentDepth);

        double bar = double.NegativeInfinity;
        int nullCount = 0;
        for (int i = 0; i < k; i++)
            for (int j = 0; j < k; j++)
            {
                if (i == j) continue;
                for (int m = 0; m < copiesPerMarker; m++)
                {
                    bar = Math.Max(bar, splits.Score(i, k + j * copiesPerMarker + m));
                    nullCount++;
                }
            }
        var pairs = new List<InteractionPair>();
        for (int i = 0; i < k; i++)
            for (int j = i + 1; j < k; j++)
            {
                double score = splits.Score(i, j);
                pairs.Add(new InteractionPair(scanned[i], scanned[j], score, score > 0 && score > bar));
            }
        return new InteractionPartnerScan(scanned, pairs, bar, nullCount, copiesPerMarker);
    }

    /// <summary>
    /// Features tried at each split of the scan's forest: the reference forest's count scaled by
    /// the added width, so every panel column is a candidate as often as in the reference forest
    /// and the copies do not thin out the markers' splits (which would hide the adjacent splits
    /// the scan counts).
    /// </summary>
    public static int ScanFeaturesPerSplit(int featuresPerSplit, int panelFeatures, int scanColumns) =>
        Math.Clamp((int)Math.Round((double)featuresPerSplit * scanColumns / panelFeatures), 1, scanColumns);

    /// <summary>
    /// The panel followed by copiesPerMarker copies of each marker (marker i's copy m at column
    /// p + i x copiesPerMarker + m), each permuted within every stratum by its own stream: the
    /// samples of a stratum, in panel order, receive the values of the same samples shuffled.
    /// </summary>
    internal static FeatureMatrix WithStratumCopies(FeatureMatrix raw, int[] markers, ReadOnlySpan<int> strata, ulong runSeed, int copiesPerMarker)
    {
        int p = raw.FeatureCount, n = raw.SampleCount;
        var names = new string[p + markers.Length * copiesPerMarker];
        for (int f = 0; f < p; f++) names[f] = raw.FeatureNames[f];
        for (int i = 0; i < markers.Length; i++)
            for (int m = 0; m < copiesPerMarker; m++)
                names[p + i * copiesPerMarker + m] = $"partner-copy-{m + 1}:{raw.FeatureNames[markers[i]]}";
        var builder = new FeatureMatrixBuilder(names, raw.SampleIds);
        for (int f = 0; f < p; f++) CopyCells(raw, builder, f, f, null);
        int stratumCount = 0;
        foreach (int s in strata) stratumCount = Math.Max(stratumCount, s + 1);
        var members = new List<int>[stratumCount];
        for (int s = 0; s < stratumCount; s++) members[s] = [];
        for (int sample = 0; sample < n; sample++) members[strata[sample]].Add(sample);
        var source = new int[n];
        for (int i = 0; i < markers.Length; i++)
            for (int m = 0; m < copiesPerMarker; m++)
            {
                int copy = i * copiesPerMarker + m;
                var generator = RandomStreams.PartnerCopy(runSeed, copy);
                foreach (var group in members)
                {
                    var shuffled = group.ToArray();
                    generator.Shuffle(shuffled.AsSpan());
                    for (int r = 0; r < shuffled.Length; r++) source[group[r]] = shuffled[r];
                }
                CopyCells(raw, builder, markers[i], p + copy, source);
            }
        return builder.Build();
    }

    /// <summary>Copies feature <paramref name="from"/> into column <paramref name="to"/>; sample s takes the cell of sample source[s] (or s).</summary>
    private static void CopyCells(FeatureMatrix raw, FeatureMatrixBuilder builder, int from, int to, int[]? source)
    {
        for (int s = 0; s < raw.SampleCount; s++)
        {
            int at = source is null ? s : source[s];
            float value = raw.Value(from, at);
            switch (raw.State(from, at))
            {
                case CellState.Missing: builder.SetMissing(to, s); break;
                case CellState.BelowDetection: builder.SetBelowDetection(to, s, value); break;
                default: builder.SetMeasured(to, s, value); break;
            }
        }
    }
}
