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
///        calibration weigh DIR [--forest-weights W,W,...] [--tail bound|fitted|exponential|edge-ratio|count] [--level L] [--screen-forest-weight W]
/// The tail rules replace the decoy tail bound in the tail region only (README, "How well the error
/// control holds"); the replay of the screen's own rule ("bound") is checked against the screen's
/// p-values at the weight the evidence was saved with.
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
        string tail = "bound";
        double level = 0.8;
        double? screenWeight = null;
        bool traceLost = false;
        for (int i = 1; i < args.Count; i++)
        {
            if (args[i] == "--forest-weights" && i + 1 < args.Count)
                weights = args[++i].Split(',').Select(w => double.Parse(w, CultureInfo.InvariantCulture)).ToArray();
            else if (args[i] == "--exponential-tail") tail = "exponential";
            else if (args[i] == "--trace-lost") traceLost = true;
            else if (args[i] == "--tail" && i + 1 < args.Count) tail = args[++i];
            else if (args[i] == "--level" && i + 1 < args.Count) level = double.Parse(args[++i], CultureInfo.InvariantCulture);
            else if (args[i] == "--screen-forest-weight" && i + 1 < args.Count) screenWeight = double.Parse(args[++i], CultureInfo.InvariantCulture);
            else throw new ArgumentException($"Unknown option '{args[i]}' of calibration weigh.");
        }
        if (tail is not ("bound" or "fitted" or "exponential" or "edge-ratio" or "count"))
            throw new ArgumentException($"Unknown tail rule '{tail}' (bound, fitted, exponential, edge-ratio, count).");
        output.WriteLine(Invariant($"# {folder}; tail rule: {TailRuleText(tail, level)}"));
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
                var pValues = Calibrate(tail, level, decoyCombined, featureCombined);
                // At the weight the evidence's screen ran with (the follow-up kind's, or even weights),
                // the replay of the screen's own rule must give its p-values (to rounding: 1.9e-12 relative seen).
                string name = Path.GetFileNameWithoutExtension(file);
                double ownWeight = screenWeight ?? (name.Contains("follow-up", StringComparison.Ordinal) ? 0.2 : 0.5);
                if (weight == ownWeight && tail == "bound")
                    for (int f = 0; f < features.Count; f++)
                        if (Math.Abs(pValues[f] - Number(features[f][6])) > 1e-9 * Math.Max(1e-300, pValues[f]) && !(double.IsNaN(pValues[f]) && double.IsNaN(Number(features[f][6]))))
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
                if (traceLost) TraceLost(output, name, features, featureCombined, decoyCombined, pValues, list);
                string design = name[..name.LastIndexOf('-')];
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
    /// Where each planted marker the baseline finds and this rule misses loses: its rank test's
    /// p-value, the combination (and its factor over the rank test), the calibrated p-value (and its
    /// factor over the combination), the tail's fitted value and the decoy count's p-value beside it,
    /// the decoys at or above it, and the Benjamini-Hochberg threshold it had to meet to join the
    /// list (0.10 (R + 1) / m with R the rule's list).
    /// </summary>
    private static void TraceLost(TextWriter output, string name, List<string[]> features, double[] featureCombined,
        double[] decoyCombined, double[] pValues, bool[] list)
    {
        var fitted = Calibrate("fitted", 0, decoyCombined, featureCombined);
        var counted = Calibrate("count", 0, decoyCombined, featureCombined);
        int listed = list.Count(x => x);
        for (int f = 0; f < features.Count; f++)
        {
            if (features[f][2] != "1" || features[f][3] != "1" || list[f]) continue;
            double rankP = Number(features[f][5]);
            int atOrAbove = decoyCombined.Count(p => p <= featureCombined[f]);
            output.WriteLine(Invariant(
                $"# lost {name} feature {features[f][1]}: rank p {rankP:G3}, forest p {Number(features[f][4]):G3}, combined {featureCombined[f]:G3} (x{featureCombined[f] / rankP:F2}), calibrated {pValues[f]:G3} (x{pValues[f] / featureCombined[f]:F2}), tail's fitted value {fitted[f]:G3}, count {counted[f]:G3}, decoys at or below its combination {atOrAbove}, BH threshold {0.10 * (listed + 1) / features.Count:G3}"));
        }
    }

    private static string TailRuleText(string tail, double level) => tail switch
    {
        "bound" => "the screen's (generalized Pareto tail, one-sided 80% jackknife upper bound)",
        "fitted" => "the generalized Pareto tail's fitted value",
        "exponential" => "exponential tail (shape fixed at 0), scale's jackknife 80% bound",
        "edge-ratio" => Invariant($"analytic combination times the decoys' liberality at the counted region's edge, {level:P0} upper bound"),
        _ => "the decoy count alone",
    };

    private static double[] Calibrate(string tail, double level, double[] decoyCombined, double[] featureCombined)
    {
        var decoyStatistics = DecoyEvidence.Surprise(decoyCombined);
        var scored = DecoyEvidence.Surprise(featureCombined);
        switch (tail)
        {
            case "bound":
                return DecoyNull.PValues(decoyStatistics, scored);
            case "exponential":
                return ExponentialTailPValues(decoyStatistics, scored);
            case "count":
                return TailRegionPValues(decoyStatistics, scored, (_, _, _) => double.PositiveInfinity);
            case "fitted":
                return TailRegionPValues(decoyStatistics, scored, (exceedances, _, y) => GeneralizedParetoTail.Fit(exceedances).Survival(y));
            default:
                double ratio = EdgeLiberality(decoyCombined, level);
                return TailRegionPValues(decoyStatistics, scored, (_, i, _) => featureCombined[i] * ratio, shareApplied: false);
        }
    }

    /// <summary>
    /// How liberal the analytic combination is where the decoy count stops being trusted: with k =
    /// DecoyNull.MinimumExceedances and t the k-th smallest decoy combination, the decoys with a
    /// combination at or under t number k where a valid p-value expects D t. The ratio's upper bound
    /// uses the Poisson count's exact one-sided upper limit, chi-square(level; 2(k + 1)) / 2 (Garwood
    /// 1936), and is never below 1: p = combination x ratio then trusts the analytic combination
    /// beyond the decoys only as far as the decoys at the edge show it is not liberal.
    /// </summary>
    private static double EdgeLiberality(double[] decoyCombined, double level)
    {
        var ascending = decoyCombined.Where(p => !double.IsNaN(p)).Order().ToArray();
        int k = DecoyNull.MinimumExceedances;
        double edge = ascending[k - 1];
        double upperCount = MathNet.Numerics.Distributions.ChiSquared.InvCDF(2 * (k + 1), level) / 2;
        return Math.Max(1, upperCount / (ascending.Length * edge));
    }

    /// <summary>
    /// DecoyNull's regions with another rule in the tail region (fewer than MinimumExceedances decoys
    /// at or above, above the threshold of the top 250 decoys): tailRule(exceedances, feature, y)
    /// gives P(Y &gt; y) (multiplied by the tail share) or, without shareApplied, the p-value itself;
    /// either way capped by the count's p-value, as DecoyNull caps it.
    /// </summary>
    private static double[] TailRegionPValues(double[] decoyStatistics, double[] scored, Func<double[], int, double, double> tailRule, bool shareApplied = true)
    {
        var ascending = decoyStatistics.Where(v => !double.IsNaN(v)).Order().ToArray();
        int decoyCount = ascending.Length;
        int tailCount = Math.Min(DecoyNull.MaximumTailCount, decoyCount / 4);
        double threshold = 0.5 * (ascending[decoyCount - tailCount] + ascending[decoyCount - tailCount - 1]);
        var exceedances = ascending[(decoyCount - tailCount)..].Select(v => v - threshold).ToArray();
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
            double rule = tailRule(exceedances, i, value - threshold);
            pValues[i] = Math.Min(monteCarlo, shareApplied ? (double)tailCount / (1 + decoyCount) * rule : rule);
        }
        return pValues;
    }

    /// <summary>
    /// DecoyNull's rule with the tail's shape fixed at 0: P(Y &gt; y) = exp(-y/scale), the scale the
    /// exceedances' mean, bounded as GeneralizedParetoTailBound bounds the full fit (log survival
    /// plus 0.8416 jackknife standard errors from the leave-one-out means).
    /// </summary>
    private static double[] ExponentialTailPValues(double[] decoyStatistics, double[] scored) =>
        TailRegionPValues(decoyStatistics, scored, (exceedances, _, y) => ExponentialUpperSurvival(exceedances, y));

    private static double ExponentialUpperSurvival(double[] exceedances, double y)
    {
        int tailCount = exceedances.Length;
        double total = exceedances.Sum();
        double scale = total / tailCount;
        var leaveOneOut = exceedances.Select(e => (total - e) / (tailCount - 1)).ToArray();
        double mean = leaveOneOut.Average(s => -y / s);
        double squares = leaveOneOut.Sum(s => (-y / s - mean) * (-y / s - mean));
        double standardError = Math.Sqrt((tailCount - 1.0) / tailCount * squares);
        return Math.Min(1, Math.Exp(-y / scale + GeneralizedParetoTailBound.OneSidedZ * standardError));
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
