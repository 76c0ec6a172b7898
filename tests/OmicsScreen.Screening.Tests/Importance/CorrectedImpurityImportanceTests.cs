using System.Globalization;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Importance;
using OmicsScreen.TestSupport;
using Xunit.Abstractions;

namespace OmicsScreen.Screening.Tests.Importance;

public class CorrectedImpurityImportanceTests(ITestOutputHelper output)
{
    [Fact]
    public void Correction_removes_the_preference_for_noise_with_many_values_that_plain_impurity_shows()
    {
        // Strobl, Boulesteix, Zeileis & Hothorn (2007), BMC Bioinformatics 8:25: Gini importance
        // favours features with many cut points even when they carry no information; Nembrini,
        // König & Wright (2018) show that AIR does not. Columns: 3 informative, then noise with
        // ~120 distinct values (column 3), then binary noise (column 4).
        const int replicates = 24;
        var plainGap = new double[replicates];
        var correctedGap = new double[replicates];
        for (int r = 0; r < replicates; r++)
        {
            var (matrix, outcome) = BiasPanel(sampleCount: 120, seed: (ulong)(100 + r));
            var options = new ForestOptions { TreeCount = 100, Seed = (ulong)r, ThreadCount = 2 };
            var plain = ImpurityImportance.From(ForestTrainer.Train(matrix, outcome, options)).MeanDecrease;
            var corrected = CorrectedImpurityImportance.Measure(matrix, outcome, null, [], options).Features;
            plainGap[r] = plain[3] - plain[4];
            correctedGap[r] = corrected[3] - corrected[4];
        }
        var (plainMean, plainSe) = MeanAndStandardError(plainGap);
        var (correctedMean, correctedSe) = MeanAndStandardError(correctedGap);
        output.WriteLine($"many-values minus binary noise: plain MDI {plainMean:F5} ± {plainSe:F5}, corrected {correctedMean:F5} ± {correctedSe:F5}");
        Assert.True(plainMean > 4 * plainSe, "plain impurity importance should favour the many-valued noise feature");
        Assert.True(Math.Abs(correctedMean) < 3 * correctedSe + 1e-4, "corrected importance should not favour either noise feature");
        Assert.True(Math.Abs(correctedMean) < 0.2 * plainMean, "the correction should remove most of the bias");
    }

    [Fact]
    public void Noise_scores_around_zero_informative_features_clearly_positive_and_decoys_like_noise()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(200, 60, 5, 1.5, seed: 21);
        var decoySources = Enumerable.Range(0, 60).ToArray();
        var importance = CorrectedImpurityImportance.Measure(matrix, outcome, null, decoySources,
            new ForestOptions { TreeCount = 300, Seed = 5 });
        var noise = importance.Features[5..];
        var (noiseMean, noiseSe) = MeanAndStandardError(noise);
        var (decoyMean, decoySe) = MeanAndStandardError(importance.Decoys);
        double noiseSd = noiseSe * Math.Sqrt(noise.Length);
        output.WriteLine($"noise {noiseMean:E3} (SD {noiseSd:E3}), decoys {decoyMean:E3} ± {decoySe:E3}, informative min {importance.Features[..5].Min():E3}");

        // Nembrini et al. (2018), Section 2: AIR of a null feature has expectation about 0 and can be negative.
        Assert.Contains(noise, value => value < 0);
        // Centred: the mean of 55 noise scores is small against their spread.
        Assert.True(Math.Abs(noiseMean) < 0.5 * noiseSd, $"noise mean {noiseMean:E3} is not near 0");
        for (int f = 0; f < 5; f++)
            Assert.True(importance.Features[f] > noiseMean + 5 * noiseSd, $"informative feature {f} scores {importance.Features[f]:E3}");
        double decoySd = decoySe * Math.Sqrt(importance.Decoys.Length);
        Assert.True(Math.Abs(decoyMean) < 0.5 * decoySd, $"decoy mean {decoyMean:E3} is not near 0");
        Assert.InRange(decoySd, 0.25 * noiseSd, 4 * noiseSd);
        Assert.Equal(decoySources, importance.DecoySources);
    }

    [Fact]
    public void Decoys_never_repeat_the_permutation_of_their_sources_permuted_copy()
    {
        var (matrix, _) = ImportanceTestPanels.Binned(100, 6, 1, 1.0, seed: 2);
        var augmented = CorrectedImpurityImportance.Augment(matrix, [0, 3, 5], runSeed: 9, repeat: 1);
        Assert.Equal(6 + 6 + 3, augmented.FeatureCount);
        int[] sources = [0, 3, 5];
        for (int i = 0; i < sources.Length; i++)
        {
            var decoy = augmented.Codes(12 + i);
            var permutedCopy = augmented.Codes(6 + sources[i]);
            Assert.True(augmented.IsPermutedCopy(12 + i));
            Assert.Equal(sources[i], augmented.SourceFeature(12 + i));
            Assert.False(decoy.SequenceEqual(permutedCopy), $"decoy {i} equals the permuted copy of feature {sources[i]}");
        }
    }

    [Fact]
    public void Results_are_identical_with_one_and_two_threads()
    {
        var (matrix, outcome) = ImportanceTestPanels.Binned(100, 20, 3, 1.0, seed: 8);
        var one = CorrectedImpurityImportance.Measure(matrix, outcome, null, [1, 7], new ForestOptions { TreeCount = 40, Seed = 3, ThreadCount = 1 });
        var two = CorrectedImpurityImportance.Measure(matrix, outcome, null, [1, 7], new ForestOptions { TreeCount = 40, Seed = 3, ThreadCount = 2 });
        Assert.Equal(one.Features, two.Features);
        Assert.Equal(one.Decoys, two.Decoys);
    }

    [Fact]
    public void Wdbc_rankings_agree_with_the_reference_forest_on_its_top_15()
    {
        var (raw, outcome) = WdbcData.Load();
        var matrix = new BinMapper().Bin(raw, threadCount: 2);
        var corrected = new double[matrix.FeatureCount];
        var permutation = new double[matrix.FeatureCount];
        const int seeds = 3;
        for (ulong seed = 0; seed < seeds; seed++)
        {
            var options = new ForestOptions { TreeCount = 300, Seed = seed };
            var air = CorrectedImpurityImportance.Measure(matrix, outcome, null, [], options).Features;
            var forest = ForestTrainer.Train(matrix, outcome, options);
            var oob = OutOfBagPermutationImportance.Measure(forest, matrix, outcome).MeanAccuracyDrop;
            for (int f = 0; f < corrected.Length; f++)
            {
                corrected[f] += air[f] / seeds;
                permutation[f] += oob[f] / seeds;
            }
        }
        // rf_reference.csv (reference/wdbc/README.md): scikit-learn 1.2.1 RandomForestClassifier,
        // 500 trees, 20 seeds; mdi_mean = feature_importances_, perm_oob_mean = Breiman OOB
        // permutation importance (unscaled accuracy drop). Compared on the reference's top 15.
        double mdiRho = TopSpearman(matrix, corrected, "mdi_mean");
        double permutationRho = TopSpearman(matrix, permutation, "perm_oob_mean");
        output.WriteLine($"Spearman on reference top 15: corrected impurity vs mdi_mean {mdiRho:F3}, OOB permutation vs perm_oob_mean {permutationRho:F3}");
        Assert.True(mdiRho >= 0.8, $"corrected impurity Spearman {mdiRho:F3} < 0.8");
        Assert.True(permutationRho >= 0.8, $"OOB permutation Spearman {permutationRho:F3} < 0.8");
    }

    /// <summary>Spearman's rho between our values and the reference column over the 15 features the reference ranks highest.</summary>
    private static double TopSpearman(BinnedMatrix matrix, double[] ours, string referenceColumn)
    {
        var reference = WdbcData.ReadTable("rf_reference.csv")
            .ToDictionary(row => row["feature"], row => double.Parse(row[referenceColumn], CultureInfo.InvariantCulture));
        var top = Enumerable.Range(0, matrix.FeatureCount)
            .OrderByDescending(f => reference[matrix.FeatureNames[f]]).Take(15).ToArray();
        return RankCorrelation.Spearman(top.Select(f => ours[f]).ToArray(), top.Select(f => reference[matrix.FeatureNames[f]]).ToArray());
    }

    internal static (double Mean, double StandardError) MeanAndStandardError(IReadOnlyList<double> values)
    {
        double mean = values.Average();
        double squares = values.Sum(v => (v - mean) * (v - mean));
        return (mean, Math.Sqrt(squares / (values.Count - 1) / values.Count));
    }

    /// <summary>Three informative normal features (shift 1 SD), one normal noise feature, one binary noise feature.</summary>
    private static (BinnedMatrix Matrix, ClassOutcome Outcome) BiasPanel(int sampleCount, ulong seed)
    {
        var generator = new Xoshiro256StarStar(seed);
        var classes = new int[sampleCount];
        for (int s = 0; s < sampleCount; s++) classes[s] = s % 2;
        var columns = new float[5][];
        for (int f = 0; f < 5; f++) columns[f] = new float[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            for (int f = 0; f < 3; f++) columns[f][s] = (float)(generator.NextGaussian() + classes[s]);
            columns[3][s] = (float)generator.NextGaussian();
            columns[4][s] = generator.NextInt(2);
        }
        string[] names = ["informative0", "informative1", "informative2", "noise_many_values", "noise_binary"];
        var ids = Enumerable.Range(0, sampleCount).Select(s => "S" + s.ToString(CultureInfo.InvariantCulture)).ToArray();
        var raw = new FeatureMatrix(names, ids, columns, new CellState[]?[5]);
        return (new BinMapper().Bin(raw, threadCount: 1), new ClassOutcome("outcome", ["a", "b"], classes));
    }
}
