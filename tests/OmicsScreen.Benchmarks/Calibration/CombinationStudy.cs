using System.Diagnostics;
using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Importance;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// How the combination's weights move error control and power, without growing forests again:
/// the forest's and the rank test's p-values of every feature and decoy do not depend on the
/// weights, so they are saved once per calibration panel ("evidence"), and each candidate forest
/// weight is then applied to the saved values exactly as the screen applies its own ("weigh"):
/// capped Cauchy combination, calibration against the decoys' combinations, Benjamini-Hochberg at
/// the default level. Class panels are left out (their interaction scan is a third input).
/// Usage: calibration evidence --out DIR [--decoys N] [--kind measured|follow-up] [--seeds N] [--first-seed S] [--only NAME[,NAME...]]
///        calibration weigh DIR [--forest-weights W,W,...]
/// </summary>
public static class CombinationStudy
{
    public static int Run(IReadOnlyList<string> args, TextWriter output)
    {
        ArgumentNullException.ThrowIfNull(args);
        ArgumentNullException.ThrowIfNull(output);
        return args[0] == "evidence" ? Save(args.Skip(1).ToList(), output) : Weigh(args.Skip(1).ToList(), output);
    }

    private static int Save(IReadOnlyList<string> args, TextWriter output)
    {
        string? folder = null;
        int decoyCount = -1;
        var rest = new List<string>();
        for (int i = 0; i < args.Count; i++)
        {
            if (args[i] == "--out" && i + 1 < args.Count) folder = args[++i];
            else if (args[i] == "--decoys" && i + 1 < args.Count) decoyCount = int.Parse(args[++i], NumberStyles.None, CultureInfo.InvariantCulture);
            else rest.Add(args[i]);
        }
        if (folder is null) throw new ArgumentException("evidence needs --out DIR.");
        Directory.CreateDirectory(folder);
        var settings = CalibrationSettings.Parse(rest);
        var designs = CalibrationCatalogue.All
            .Where(d => settings.Only.Count == 0 || settings.Only.Contains(d))
            .Where(d => CalibrationCatalogue.Create(d, 1).Kind != OutcomeKind.Classes)
            .Where(d => settings.Kind is null || CalibrationCatalogue.Create(d, 1).Kind == settings.Kind)
            .ToList();
        for (int seedNumber = settings.FirstSeed; seedNumber < settings.FirstSeed + settings.SeedCount; seedNumber++)
            foreach (var design in designs)
            {
                var watch = Stopwatch.StartNew();
                var model = CalibrationCatalogue.Create(design, seedNumber);
                var panel = model.Discovery();
                // The curve does not touch the p-values; leave it out to save time.
                var options = settings.ScreenOptions(model.Seed) with { CurveFolds = 0, DecoyCount = decoyCount };
                var result = ScreenRunner.Run(panel, options);
                var allRows = Enumerable.Range(0, panel.SampleCount).ToArray();
                var plan = DecoyPlan.For(panel.FeatureCount, result.Settings.DecoyCount, options.Seed);
                var decoyRankP = ScreenOutcome.For(panel).RankTestPValues(plan.Values(panel.Matrix), allRows, options.ThreadCount);
                var featureRankP = result.Features.Select(f => f.RankTestP).ToArray();
                var decoys = DecoyEvidence.From(result.Repeats, new DirectTestEvidence(featureRankP, decoyRankP, [], [], []));
                var decoyForestP = DecoyNull.DecoyPValues(decoys.Means);
                var baseline = UnivariateBaseline.Discoveries(panel);
                var lines = new List<string> { "role\tindex\trelated\tbaseline\tforest_p\trank_p\tscreen_p" };
                foreach (var f in result.Features)
                    lines.Add(Invariant($"feature\t{f.FeatureIndex}\t{(model.Truth[f.FeatureIndex] ? 1 : 0)}\t{(baseline[f.FeatureIndex] ? 1 : 0)}\t{f.ForestP:R}\t{f.RankTestP:R}\t{f.PValue:R}"));
                for (int d = 0; d < decoyForestP.Length; d++)
                    lines.Add(Invariant($"decoy\t{d}\t0\t0\t{decoyForestP[d]:R}\t{decoyRankP[d]:R}\tNaN"));
                File.WriteAllLines(Path.Combine(folder, Invariant($"{design}-{seedNumber}.tsv")), lines);
                output.WriteLine(Invariant($"{design} seed {seedNumber}: shortlist {result.Shortlist.Count}, {watch.Elapsed.TotalSeconds:F0} s"));
                output.Flush();
            }
        return 0;
    }

    private static int Weigh(IReadOnlyList<string> args, TextWriter output)
    {
        string folder = args[0];
        double[] weights = [0.5];
        bool exponential = false;
        for (int i = 1; i < args.Count; i++)
        {
            if (args[i] == "--forest-weights" && i + 1 < args.Count)
                weights = args[++i].Split(',').Select(w => double.Parse(w, CultureInfo.InvariantCulture)).ToArray();
            if (args[i] == "--exponential-tail") exponential = true;
        }
        if (exponential) output.WriteLine("# tail: exponential (shape fixed at 0), scale's jackknife 80% bound");
        var files = Directory.GetFiles(folder, "*.tsv").Order(StringComparer.Ordinal).ToList();
        output.WriteLine("forest weight | null panels with a list | planted: listed, true, false, false share | baseline true | per design: lists or true/baseline");
        foreach (double weight in weights)
        {
            int nullPanels = 0, nullLists = 0, listed = 0, truePlanted = 0, falsePlanted = 0, baselineTrue = 0, plantedPanels = 0;
            double falseShare = 0;
            var perDesign = new SortedDictionary<string, (int Panels, int Lists, int True, int Baseline)>(StringComparer.Ordinal);
            foreach (var file in files)
            {
                var rows = File.ReadLines(file).Skip(1).Select(l => l.Split('\t')).ToList();
                var features = rows.Where(r => r[0] == "feature").ToList();
                var decoyRows = rows.Where(r => r[0] == "decoy").ToList();
                var featureCombined = features.Select(r => Combine(Number(r[4]), Number(r[5]), weight)).ToArray();
                var decoyCombined = decoyRows.Select(r => Combine(Number(r[4]), Number(r[5]), weight)).ToArray();
                var pValues = exponential
                    ? ExponentialTailPValues(DecoyEvidence.Surprise(decoyCombined), DecoyEvidence.Surprise(featureCombined))
                    : DecoyNull.PValues(DecoyEvidence.Surprise(decoyCombined), DecoyEvidence.Surprise(featureCombined));
                // The screen's own weights are 0.5 and 0.5 once the scan is absent: the replay must give its p-values.
                if (weight == 0.5 && !exponential)
                    for (int f = 0; f < features.Count; f++)
                        if (Math.Abs(pValues[f] - Number(features[f][6])) > 1e-12 * Math.Max(1e-300, pValues[f]) && !(double.IsNaN(pValues[f]) && double.IsNaN(Number(features[f][6]))))
                            throw new InvalidOperationException($"{file}: replayed p-value of feature {f} differs from the screen's.");
                var list = BenjaminiHochberg.RejectionSet(pValues, 0.10);
                int related = features.Count(r => r[2] == "1");
                int found = 0, wrong = 0, baseline = 0;
                for (int f = 0; f < features.Count; f++)
                {
                    if (features[f][2] == "1" && features[f][3] == "1") baseline++;
                    if (!list[f]) continue;
                    if (features[f][2] == "1") found++;
                    else wrong++;
                }
                string design = Path.GetFileNameWithoutExtension(file)[..Path.GetFileNameWithoutExtension(file).LastIndexOf('-')];
                var entry = perDesign.GetValueOrDefault(design);
                perDesign[design] = (entry.Panels + 1, entry.Lists + (found + wrong > 0 ? 1 : 0), entry.True + found, entry.Baseline + baseline);
                if (related == 0)
                {
                    nullPanels++;
                    if (wrong > 0) nullLists++;
                    continue;
                }
                plantedPanels++;
                listed += found + wrong;
                truePlanted += found;
                falsePlanted += wrong;
                baselineTrue += baseline;
                falseShare += (double)wrong / Math.Max(1, found + wrong);
            }
            output.WriteLine(Invariant($"{weight:F2} | {nullLists} of {nullPanels} | {listed}, {truePlanted}, {falsePlanted}, {falseShare / Math.Max(1, plantedPanels):F3} | {baselineTrue} | ")
                + string.Join("; ", perDesign.Select(p => Invariant($"{p.Key} {p.Value.Lists}/{p.Value.Panels} lists, true {p.Value.True}/{p.Value.Baseline}"))));
        }
        return 0;
    }

    /// <summary>
    /// DecoyNull's rule with the tail's shape fixed at 0: P(Y &gt; y) = exp(-y/scale), the scale the
    /// exceedances' mean, bounded as GeneralizedParetoTailBound bounds the full fit (log survival
    /// plus 0.8416 jackknife standard errors from the leave-one-out means).
    /// </summary>
    private static double[] ExponentialTailPValues(double[] decoyStatistics, double[] scored)
    {
        var ascending = decoyStatistics.Where(v => !double.IsNaN(v)).Order().ToArray();
        int decoyCount = ascending.Length;
        int tailCount = Math.Min(DecoyNull.MaximumTailCount, decoyCount / 4);
        double threshold = 0.5 * (ascending[decoyCount - tailCount] + ascending[decoyCount - tailCount - 1]);
        var exceedances = ascending[(decoyCount - tailCount)..].Select(v => v - threshold).ToArray();
        double total = exceedances.Sum();
        var leaveOneOut = exceedances.Select(e => (total - e) / (tailCount - 1)).ToArray();
        double scale = total / tailCount;
        var pValues = new double[scored.Length];
        for (int i = 0; i < scored.Length; i++)
        {
            double value = scored[i];
            int atOrAbove = ascending.Count(v => v >= value);
            double monteCarlo = (1.0 + atOrAbove) / (1.0 + decoyCount);
            if (atOrAbove >= DecoyNull.MinimumExceedances || value <= threshold)
            {
                pValues[i] = monteCarlo;
                continue;
            }
            double y = value - threshold;
            double mean = leaveOneOut.Average(s => -y / s);
            double squares = leaveOneOut.Sum(s => (-y / s - mean) * (-y / s - mean));
            double standardError = Math.Sqrt((tailCount - 1.0) / tailCount * squares);
            double upper = Math.Min(1, Math.Exp(-y / scale + GeneralizedParetoTailBound.OneSidedZ * standardError));
            pValues[i] = Math.Min(monteCarlo, (double)tailCount / (1 + decoyCount) * upper);
        }
        return pValues;
    }

    /// <summary>ScreenAggregation.Combine with the forest's weight as given and the rest on the rank test (no interaction scan).</summary>
    private static double Combine(double forestP, double rankP, double forestWeight)
    {
        double cap = ScreenAggregation.CombinationCap;
        Span<double> pValues = [Math.Min(forestP, cap), Math.Min(rankP, cap)];
        Span<double> weights = [forestWeight, 1 - forestWeight];
        return CauchyCombination.Combine(pValues, weights);
    }

    private static double Number(string text) => double.Parse(text, CultureInfo.InvariantCulture);

    private static string Invariant(FormattableString text) => FormattableString.Invariant(text);
}
