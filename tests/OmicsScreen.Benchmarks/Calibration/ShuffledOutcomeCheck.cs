using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// Issue 17's shuffled-outcome check on many panels: the planted panels of
/// OutcomeKindScreenTests (standard-normal features; measured y = 1.0 z0 + 0.8 z1 + 1.2 [z2 &gt; 0.5]
/// + e, or follow-up with that log hazard), the outcome moved to a random other sample, so every
/// feature is null (known truth). Each panel is screened; the decoys' evidence is recomputed as
/// the screen computes it, so the smallest p-value can be traced to its source: a count of decoys
/// (the Monte Carlo p-value) or the generalized Pareto tail, and the forest's and the rank test's
/// p-values beneath it. Prints the list rate beside the rates of simpler rules on the same p-values,
/// and how uniform the null p-values are.
/// Usage: calibration shuffled [--kind measured|follow-up] [--panels N] [--first-seed S]
/// [--samples N] [--features N] [--defaults] [--threads T] [--evidence DIR]
/// With --evidence, each panel's evidence (every feature's and decoy's forest and rank-test p-value,
/// all null) is saved as CombinationStudy's evidence files are, so `calibration weigh` can replay
/// other calibration rules on the shuffled panels.
/// </summary>
public static class ShuffledOutcomeCheck
{
    private sealed record PanelTrace(int Seed, int Listed, double SmallestP, int DecoysAtOrAbove, bool FromTail,
        double ForestP, double RankP, double CombinedP, bool ListByCount, bool ListByRankTest, bool ListUncalibrated,
        double[] PValues, double[] ForestPs, double[] RankPs, double Seconds);

    public static int Run(IReadOnlyList<string> args, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(args);
        ArgumentNullException.ThrowIfNull(output);
        var kind = OutcomeKind.Measured;
        int panels = 200, firstSeed = 1, samples = 100, features = 60, threads = 0;
        bool defaults = false;
        string? evidence = null;
        for (int i = 0; i < args.Count; i++)
        {
            string Value() => i + 1 < args.Count ? args[++i] : throw new ArgumentException($"{args[i]} needs a value.");
            int Integer() => int.Parse(Value(), NumberStyles.None, CultureInfo.InvariantCulture);
            switch (args[i])
            {
                case "--kind": kind = Value() == "follow-up" ? OutcomeKind.TimeToEvent : OutcomeKind.Measured; break;
                case "--panels": panels = Integer(); break;
                case "--first-seed": firstSeed = Integer(); break;
                case "--samples": samples = Integer(); break;
                case "--features": features = Integer(); break;
                case "--threads": threads = Integer(); break;
                case "--defaults": defaults = true; break;
                case "--evidence": evidence = Value(); break;
                default: throw new ArgumentException($"Unknown option '{args[i]}' of the shuffled-outcome check.");
            }
        }

        output.WriteLine(Invariant($"# shuffled-outcome check: {kind}, {panels} panels of {samples} x {features} (seeds {firstSeed}-{firstSeed + panels - 1}), {(defaults ? "default options" : "the test's quick options (6 pairs, 150 trees)")}; load average {Load()}"));
        var traces = new List<PanelTrace>();
        var watch = Stopwatch.StartNew();
        for (int seed = firstSeed; seed < firstSeed + panels; seed++)
        {
            var trace = Measure(kind, samples, features, (ulong)seed, defaults, threads, evidence);
            traces.Add(trace);
            output.WriteLine(Invariant(
                $"seed {seed}: list {trace.Listed}; smallest p {trace.SmallestP:G3} ({(trace.FromTail ? "tail" : "count")}, {trace.DecoysAtOrAbove} decoys at or above; forest p {trace.ForestP:G3}, rank p {trace.RankP:G3}, combined {trace.CombinedP:G3}); list by count {Yes(trace.ListByCount)}, by rank test alone {Yes(trace.ListByRankTest)}, uncalibrated {Yes(trace.ListUncalibrated)}; {trace.Seconds:F1} s"));
            output.Flush();
        }

        int count = traces.Count;
        output.WriteLine();
        output.WriteLine(Invariant($"Panels with a list (BH 0.10; a valid rule gives at most 10%; 95% Wilson interval):"));
        Rate(output, "the screen", traces.Count(t => t.Listed > 0), count);
        Rate(output, "calibration by decoy count only (no tail)", traces.Count(t => t.ListByCount), count);
        Rate(output, "rank test alone", traces.Count(t => t.ListByRankTest), count);
        Rate(output, "combination, uncalibrated", traces.Count(t => t.ListUncalibrated), count);
        output.WriteLine(Invariant($"Lists whose smallest p came from the tail: {traces.Count(t => t.Listed > 0 && t.FromTail)} of {traces.Count(t => t.Listed > 0)}"));
        output.WriteLine();
        output.WriteLine("Null p-values pooled over panels (share at or under each level; KS distance to uniform):");
        Uniformity(output, "screen p", traces.SelectMany(t => t.PValues).ToList());
        Uniformity(output, "forest p", traces.SelectMany(t => t.ForestPs).ToList());
        Uniformity(output, "rank p", traces.SelectMany(t => t.RankPs).ToList());
        // Under the global null with independent uniform p-values, 1 - (1 - smallest)^features is uniform (Šidák).
        Uniformity(output, "smallest screen p per panel, Sidak-adjusted", traces.Select(t => 1 - Math.Pow(1 - t.SmallestP, features)).ToList());
        output.WriteLine(Invariant($"Wall time {watch.Elapsed.TotalSeconds:F0} s; load average at the end {Load()}."));
        return 0;
    }

    private static PanelTrace Measure(OutcomeKind kind, int samples, int features, ulong seed, bool defaults, int threads, string? evidence)
    {
        var watch = Stopwatch.StartNew();
        var panel = OutcomeKindPanels.Shuffled(kind == OutcomeKind.Measured
            ? OutcomeKindPanels.Measured(samples, features, 80 + seed, planted: true)
            : OutcomeKindPanels.FollowUp(samples, features, 80 + seed, planted: true), seed);
        var options = defaults
            ? new ScreenOptions { Seed = seed, CurveFolds = 0, ThreadCount = threads }
            : new ScreenOptions { Seed = seed, HalfSamplePairs = 6, TreesPerForest = 150, CurveFolds = 0, ThreadCount = threads };
        var result = ScreenRunner.Run(panel, options);

        // The decoys' evidence as the screen computed it (ScreenRunner): same plan, same rank test.
        var allRows = Enumerable.Range(0, panel.SampleCount).ToArray();
        var plan = DecoyPlan.For(panel.FeatureCount, result.Settings.DecoyCount, options.Seed);
        var outcome = ScreenOutcome.For(panel);
        var decoyRankP = outcome.RankTestPValues(plan.Values(panel.Matrix), allRows, threads);
        var featureRankP = result.Features.Select(f => f.RankTestP).ToArray();
        var decoys = DecoyEvidence.From(result.Repeats, new DirectTestEvidence(featureRankP, decoyRankP, [], [], []) { Weights = outcome.CombinationWeights });
        var pValues = result.Features.Select(f => f.PValue).ToArray();
        var check = DecoyNull.PValues(DecoyEvidence.Surprise(decoys.CombinedP), DecoyEvidence.Surprise(result.Features.Select(f => f.CombinedP).ToArray()));
        for (int f = 0; f < pValues.Length; f++)
            if (check[f] != pValues[f]) throw new InvalidOperationException($"seed {seed}: recomputed p-value of feature {f} differs ({check[f]} vs {pValues[f]}).");

        if (evidence is not null)
        {
            Directory.CreateDirectory(evidence);
            var decoyForestP = DecoyNull.DecoyPValues(decoys.Means);
            var lines = new List<string> { "role\tindex\trelated\tbaseline\tforest_p\trank_p\tscreen_p" };
            foreach (var f in result.Features)
                lines.Add(Invariant($"feature\t{f.FeatureIndex}\t0\t0\t{f.ForestP:R}\t{f.RankTestP:R}\t{f.PValue:R}"));
            for (int d = 0; d < decoyForestP.Length; d++)
                lines.Add(Invariant($"decoy\t{d}\t0\t0\t{decoyForestP[d]:R}\t{decoyRankP[d]:R}\tNaN"));
            string prefix = kind == OutcomeKind.Measured ? "shuffled-measured" : "shuffled-follow-up";
            File.WriteAllLines(Path.Combine(evidence, Invariant($"{prefix}-{seed}.tsv")), lines);
        }

        int smallest = 0;
        for (int f = 1; f < pValues.Length; f++) if (pValues[f] < pValues[smallest]) smallest = f;
        var best = result.Features[smallest];
        int decoyCount = decoys.CombinedP.Length;
        int atOrAbove = decoys.CombinedP.Count(p => p <= best.CombinedP);
        double countP = (1.0 + atOrAbove) / (1.0 + decoyCount);
        // The count-only rule: every feature's p-value is its Monte Carlo p-value against the decoys.
        var byCount = result.Features.Select(f => (1.0 + decoys.CombinedP.Count(p => p <= f.CombinedP)) / (1.0 + decoyCount)).ToArray();
        return new PanelTrace((int)seed, result.Shortlist.Count, best.PValue, atOrAbove, best.PValue < countP,
            best.ForestP, best.RankTestP, best.CombinedP,
            BenjaminiHochberg.RejectionSet(byCount, 0.10).Any(x => x),
            BenjaminiHochberg.RejectionSet(featureRankP, 0.10).Any(x => x),
            BenjaminiHochberg.RejectionSet(result.Features.Select(f => f.CombinedP).ToArray(), 0.10).Any(x => x),
            pValues, result.Features.Select(f => f.ForestP).ToArray(), featureRankP, watch.Elapsed.TotalSeconds);
    }

    /// <summary>The rate with its 95% Wilson (1927) score interval.</summary>
    private static void Rate(TextWriter output, string label, int hits, int count)
    {
        const double z = 1.959963984540054;
        double p = (double)hits / count, denominator = 1 + z * z / count;
        double centre = (p + z * z / (2 * count)) / denominator;
        double half = z * Math.Sqrt(p * (1 - p) / count + z * z / (4.0 * count * count)) / denominator;
        output.WriteLine(Invariant($"  {label}: {hits} of {count} ({p:P1}; {Math.Max(0, centre - half):P1}-{Math.Min(1, centre + half):P1})"));
    }

    private static void Uniformity(TextWriter output, string label, IReadOnlyList<double> pValues)
    {
        var levels = new[] { 0.001, 0.002, 0.005, 0.01, 0.05, 0.1, 0.5 };
        output.WriteLine(Invariant($"  {label} ({pValues.Count}): ") + string.Join(", ", levels.Select(l => Invariant($"<= {l}: {PValueUniformity.ShareAtOrBelow(pValues, l):F4}")))
            + Invariant($"; KS {PValueUniformity.KolmogorovSmirnovDistance(pValues):F3} (5% critical {PValueUniformity.CriticalDistance(pValues.Count):F3})"));
    }

    private static string Yes(bool value) => value ? "yes" : "no";

    private static string Load()
    {
        try
        {
            return File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Split(' ')[0] : "n/a";
        }
        catch (IOException)
        {
            return "n/a";
        }
    }

    private static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
