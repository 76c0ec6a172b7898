using OmicsScreen.Screening.Randomness;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Screening.Effects;

/// <summary>
/// How each shortlisted marker acts (issue 19, parts 4-5): partial dependence of the reference
/// forest on the marker with its ICE band and shape words, interaction partners from the
/// partner scan (<see cref="InteractionPartners"/>), and two-marker partial dependence of the
/// strongest named pairs. Works for every outcome kind through the kind's leaf values: the
/// positive class's probability, the mean, or the mortality.
/// </summary>
public static class EffectAnalysis
{
    /// <summary>Two-marker surfaces drawn at most.</summary>
    public const int MaxSurfaces = 3;

    /// <summary>Unrelated features whose curves set the smallest effect worth naming.</summary>
    public const int UnrelatedCount = 20;

    internal static ScreenEffects Run(ScreenContext context, IReadOnlyList<TreeLeafValues> referenceTrees, IReadOnlyList<int> shortlisted,
        IReadOnlyList<int> order)
    {
        if (shortlisted.Count == 0 || referenceTrees.Count == 0) return ScreenEffects.Empty;
        var panel = context.Panel;
        int threads = context.ThreadCount;
        var unrelated = UnrelatedFeatures(order, shortlisted);
        double noise = 0;
        foreach (int f in unrelated)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            noise = Math.Max(noise, PartialDependence.Compute(referenceTrees, panel.Matrix, context.Matrix, f, threadCount: threads).Range);
        }
        double smallestEffect = 2 * noise;

        var model = context.ScreenOutcome;
        var options = context.Settings.ForestOptions(panel.Subject, RandomStreams.PartnerForest(context.Options.Seed));
        var scan = InteractionPartners.Scan(panel.Matrix, shortlisted, model.PartnerStrata(), context.Options.Seed,
            context.Settings.FeaturesPerSplit,
            (binned, featuresPerSplit) => model.GrowLeafValues(binned, options with
            {
                TreeCount = InteractionPartners.TreeFactor * options.TreeCount,
                Tree = options.Tree with { FeaturesPerSplit = featuresPerSplit },
            })
                .Select(t => t.Topology).ToArray(), threads);

        var markers = new List<MarkerEffect>(shortlisted.Count);
        foreach (int f in shortlisted)
        {
            context.Cancellation.ThrowIfCancellationRequested();
            var curve = PartialDependence.Compute(referenceTrees, panel.Matrix, context.Matrix, f, threadCount: threads);
            markers.Add(new MarkerEffect(f, curve, EffectShapeReader.Read(curve, smallestEffect), scan.PartnersOf(f)));
        }
        var surfaces = new List<EffectSurface>();
        foreach (var pair in scan.Pairs.Where(p => p.Named).OrderByDescending(p => p.Score).ThenBy(p => p.First).ThenBy(p => p.Second).Take(MaxSurfaces))
        {
            context.Cancellation.ThrowIfCancellationRequested();
            surfaces.Add(PairPartialDependence.Compute(referenceTrees, panel.Matrix, context.Matrix, pair.First, pair.Second, threadCount: threads));
        }
        return new ScreenEffects(markers, smallestEffect, unrelated, scan, surfaces);
    }

    /// <summary>
    /// Up to <see cref="UnrelatedCount"/> features not on the shortlist, at evenly spaced positions
    /// of the lower half of the screen's order: features the screen found no evidence for, chosen
    /// without a random draw.
    /// </summary>
    internal static int[] UnrelatedFeatures(IReadOnlyList<int> order, IReadOnlyList<int> shortlisted)
    {
        var listed = new HashSet<int>(shortlisted);
        var candidates = order.Skip(order.Count / 2).Where(f => !listed.Contains(f)).ToArray();
        if (candidates.Length <= UnrelatedCount) return candidates;
        var chosen = new int[UnrelatedCount];
        for (int i = 0; i < UnrelatedCount; i++) chosen[i] = candidates[(int)((long)i * candidates.Length / UnrelatedCount)];
        return chosen;
    }
}
