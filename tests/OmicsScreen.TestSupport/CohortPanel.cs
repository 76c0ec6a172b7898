using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport;

/// <summary>
/// Simulated multi-cohort panels with planted cohort and class effects: every cell is a standard
/// normal draw (in cohort-major sample order, feature by feature), shifted by the planted effects
/// that apply to it, then exponentiated.
/// </summary>
public static class CohortPanel
{
    /// <summary>A shift of one feature, in SD units: in cases only or in every sample, in one cohort or all.</summary>
    public sealed record PlantedEffect(int Feature, double Shift, bool CasesOnly, int? OnlyCohort = null);

    public sealed record Design
    {
        public int SamplesPerCohort { get; init; } = 90;
        public int FeatureCount { get; init; } = 150;
        /// <summary>Share of cases in each cohort; its length is the number of cohorts.</summary>
        public IReadOnlyList<double> CaseShares { get; init; } = [0.25, 0.25, 0.6];
        public IReadOnlyList<string>? CohortNames { get; init; }
        public IReadOnlyList<PlantedEffect> Effects { get; init; } = [];
        /// <summary>Names for chosen features; the rest are f000, f001, ...</summary>
        public IReadOnlyDictionary<int, string> FeatureNames { get; init; } = new Dictionary<int, string>();
        public string SampleIdPrefix { get; init; } = "s";
        public ulong Seed { get; init; } = 1;
    }

    public static Panel Generate(Design design)
    {
        int cohortCount = design.CaseShares.Count, perCohort = design.SamplesPerCohort, featureCount = design.FeatureCount;
        var random = new Xoshiro256StarStar(design.Seed);
        int sampleCount = cohortCount * perCohort;
        var cohort = new int[sampleCount];
        var classes = new int[sampleCount];
        for (int c = 0; c < cohortCount; c++)
            for (int i = 0; i < perCohort; i++)
            {
                int s = c * perCohort + i;
                cohort[s] = c;
                classes[s] = i < design.CaseShares[c] * perCohort ? 1 : 0;
            }
        var columns = new float[featureCount][];
        for (int f = 0; f < featureCount; f++)
        {
            columns[f] = new float[sampleCount];
            for (int s = 0; s < sampleCount; s++)
            {
                double x = random.NextGaussian();
                foreach (var effect in design.Effects)
                    if (effect.Feature == f && (!effect.CasesOnly || classes[s] == 1) && (effect.OnlyCohort is null || effect.OnlyCohort == cohort[s]))
                        x += effect.Shift;
                columns[f][s] = (float)Math.Exp(x);
            }
        }
        var names = Enumerable.Range(0, featureCount)
            .Select(f => design.FeatureNames.TryGetValue(f, out var name) ? name : "f" + f.ToString("D3", CultureInfo.InvariantCulture)).ToArray();
        var ids = Enumerable.Range(0, sampleCount).Select(s => design.SampleIdPrefix + s.ToString("D3", CultureInfo.InvariantCulture)).ToArray();
        var cohortNames = design.CohortNames ?? Enumerable.Range(0, cohortCount).Select(c => "c" + c.ToString(CultureInfo.InvariantCulture)).ToArray();
        return new Panel(new FeatureMatrix(names, ids, columns, new CellState[]?[featureCount]),
            new ClassOutcome("status", ["control", "case"], classes, positiveClass: 1),
            new SampleGrouping("centre", cohortNames, cohort));
    }
}
