using System.Globalization;
using System.Runtime.InteropServices;
using System.Security.Cryptography;
using OmicsScreen.Engine.Binning;
using OmicsScreen.Engine.Forests;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Sampling;
using OmicsScreen.Engine.Trees;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Forests;

/// <summary>
/// Guards speed work on the engine: forests grown on a dozen setups must stay bit-identical to
/// the forests the engine grew before that work (binning, trees, out-of-bag votes, importances).
/// </summary>
/// <remarks>
/// The expected fingerprints were captured from the engine as it was at main 7fb5729, before the
/// hygiene, packed-histogram and radix-binning changes. A fingerprint is the SHA-256 of every bit
/// of every stored tree array, out-of-bag row and vote, and impurity importance, so any change to
/// a split, a threshold's float, a weight or an importance's last bit fails the test. Each setup
/// is grown on 1 and on 2 threads; both must give the captured forest.
/// </remarks>
public class ForestFingerprintTests
{
    public static TheoryData<string, string> Setups => new()
    {
        { "two-class bootstrap",
            "nodes 733, oob error 0.25833333333333336, sha256 A5EE2F85E6A421ED0685A7F4" },
        { "three-class bootstrap",
            "nodes 1137, oob error 0.2833333333333333, sha256 9B672B2EDAF64617F60DCA46" },
        { "two-class subsample",
            "nodes 705, oob error 0.275, sha256 7333FAE4898E56E5EA9C3914" },
        { "three-class subsample",
            "nodes 867, oob error 0.425, sha256 149E3D683B3E68D540868B94" },
        { "two-class missing and below detection",
            "nodes 717, oob error 0.2916666666666667, sha256 3A90A7E4E0D2953B9180D8A5" },
        { "three-class missing and below detection",
            "nodes 1171, oob error 0.5833333333333334, sha256 D4BB6DEFFA79F130FF68C589" },
        { "two-class min leaf 5",
            "nodes 437, oob error 0.225, sha256 34D3F6F55F40537000F32F28" },
        { "three-class max depth 4",
            "nodes 553, oob error 0.4666666666666667, sha256 3AF5C45570D5BF2A106400FC" },
        { "two-class class-balanced",
            "nodes 545, oob error 0.19166666666666668, sha256 A530BC64AADBB3A42E3AA646" },
        { "two-class fractional sample weights",
            "nodes 849, oob error 0.24166666666666667, sha256 35D8B9DACCCAEF1B63E174F4" },
        { "two-class quantile bins 400 samples",
            "nodes 2081, oob error 0.12, sha256 C113BA05E9B3965FA1F2D506" },
        { "two-class few distinct values",
            "nodes 1097, oob error 0.3, sha256 4A4744F6DA419EDD4C6E0B70" },
        { "two-class wide, 30 features per split",
            "nodes 463, oob error 0.4375, sha256 D49C33BDC552247FCB906B8E" },
    };

    [Theory]
    [MemberData(nameof(Setups))]
    public void Forests_are_bit_identical_to_those_grown_before_the_speed_work(string setup, string expected)
    {
        var (matrix, outcome, options, weights) = Build(setup);
        var binned = new BinMapper().Bin(matrix, threadCount: 1);
        string one = Fingerprint(binned, ForestTrainer.Train(binned, outcome, options with { ThreadCount = 1 }, sampleWeights: weights), outcome);
        string two = Fingerprint(binned, ForestTrainer.Train(binned, outcome, options with { ThreadCount = 2 }, sampleWeights: weights), outcome);
        Assert.Equal(one, two);
        Assert.Equal(expected, one);
    }

    private static (FeatureMatrix, ClassOutcome, ForestOptions, double[]?) Build(string setup)
    {
        var spec = new SyntheticPanelSpec { SampleCount = 120, FeatureCount = 40, Seed = 11 };
        var options = new ForestOptions { TreeCount = 25, Seed = 17, Repeat = 1 };
        double[]? weights = null;
        bool censor = false, coarse = false;
        switch (setup)
        {
            case "two-class bootstrap": break;
            case "three-class bootstrap": spec = spec with { ClassCount = 3, Seed = 12 }; break;
            case "two-class subsample":
                options = options with { Sampling = new SamplingOptions { Drawing = SampleDrawing.Subsample } };
                break;
            case "three-class subsample":
                spec = spec with { ClassCount = 3, Seed = 13 };
                options = options with { Sampling = new SamplingOptions { Drawing = SampleDrawing.Subsample, SubsampleFraction = 0.5 } };
                break;
            case "two-class missing and below detection": spec = spec with { MissingFraction = 0.08, Seed = 14 }; censor = true; break;
            case "three-class missing and below detection":
                spec = spec with { ClassCount = 3, MissingFraction = 0.05, Seed = 15 };
                censor = true;
                break;
            case "two-class min leaf 5": options = options with { Tree = new TreeOptions { MinLeafSize = 5 } }; break;
            case "three-class max depth 4":
                spec = spec with { ClassCount = 3, Seed = 16 };
                options = options with { Tree = new TreeOptions { MaxDepth = 4 } };
                break;
            case "two-class class-balanced":
                spec = spec with { ClassFractions = [0.7, 0.3], Seed = 18 };
                options = options with { Sampling = new SamplingOptions { ClassBalanced = true } };
                break;
            case "two-class fractional sample weights":
                weights = Enumerable.Range(0, spec.SampleCount).Select(s => 0.25 + (s % 7) * 0.3).ToArray();
                break;
            case "two-class quantile bins 400 samples": spec = spec with { SampleCount = 400, FeatureCount = 20, Seed = 19 }; break;
            case "two-class few distinct values": spec = spec with { Seed = 20 }; coarse = true; break;
            case "two-class wide, 30 features per split":
                spec = spec with { SampleCount = 80, FeatureCount = 600, Seed = 21 };
                options = options with { Tree = new TreeOptions { FeaturesPerSplit = 30 } };
                break;
            default: throw new ArgumentException(setup);
        }
        var panel = SyntheticPanel.Generate(spec);
        var matrix = censor || coarse ? Rewrite(panel.Matrix, censor, coarse) : panel.Matrix;
        return (matrix, panel.Outcome, options, weights);
    }

    /// <summary>Censors every third feature's low tail (below detection), or rounds values to a few levels.</summary>
    private static FeatureMatrix Rewrite(FeatureMatrix source, bool censor, bool coarse)
    {
        var builder = new FeatureMatrixBuilder(source.FeatureNames, source.SampleIds);
        for (int f = 0; f < source.FeatureCount; f++)
            for (int s = 0; s < source.SampleCount; s++)
            {
                float value = source.Value(f, s);
                if (float.IsNaN(value)) builder.SetMissing(f, s);
                else if (censor && f % 3 == 0 && value < 20f) builder.SetBelowDetection(f, s, 20f);
                else builder.SetMeasured(f, s, coarse ? MathF.Round(MathF.Log(value) * 2f) : value);
            }
        return builder.Build();
    }

    private static string Fingerprint(BinnedMatrix binned, Forest forest, ClassOutcome outcome)
    {
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        for (int f = 0; f < binned.FeatureCount; f++)
        {
            hash.AppendData(binned.Codes(f));
            hash.AppendData(MemoryMarshal.AsBytes(binned.Bins(f).UpperBounds));
        }
        int nodes = 0;
        for (int t = 0; t < forest.TreeCount; t++)
        {
            var tree = forest.Tree(t);
            nodes += tree.NodeCount;
            hash.AppendData(MemoryMarshal.AsBytes(tree.Features));
            hash.AppendData(tree.BinThresholds);
            hash.AppendData(MemoryMarshal.AsBytes(tree.Thresholds));
            hash.AppendData(MemoryMarshal.AsBytes(tree.Routing));
            hash.AppendData(MemoryMarshal.AsBytes(tree.LeftChildren));
            hash.AppendData(MemoryMarshal.AsBytes(tree.RightChildren));
            hash.AppendData(MemoryMarshal.AsBytes(tree.ClassWeights));
            hash.AppendData(MemoryMarshal.AsBytes(tree.NodeClasses));
            hash.AppendData(MemoryMarshal.AsBytes(tree.ImpurityDecreases));
            hash.AppendData(MemoryMarshal.AsBytes(tree.NodeSampleCounts));
            hash.AppendData(MemoryMarshal.AsBytes(forest.OutOfBag(t).Rows));
            hash.AppendData(MemoryMarshal.AsBytes(forest.OutOfBag(t).PredictedClasses));
        }
        var votes = new OutOfBagVotes(forest, outcome);
        hash.AppendData(MemoryMarshal.AsBytes(votes.Votes));
        hash.AppendData(MemoryMarshal.AsBytes(ImpurityImportance.From(forest).MeanDecrease));
        // The readable part says what moved when the hash differs.
        return string.Create(CultureInfo.InvariantCulture,
            $"nodes {nodes}, oob error {votes.Error:R}, sha256 {Convert.ToHexString(hash.GetHashAndReset())[..24]}");
    }
}
