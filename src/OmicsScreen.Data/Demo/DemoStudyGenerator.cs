using System.Globalization;
using OmicsScreen.Engine.Panels;

namespace OmicsScreen.Data.Demo;

/// <summary>
/// Generates the invented "Marrowfen" plasma study: cases of a fictional condition and controls
/// from several recruitment centres, with correlated analyte modules, planted markers (alone, in
/// modules, and near the detection limit), one batch artefact, a milder batch shift, missing
/// cells and values below detection. Everything follows from the seed.
/// </summary>
/// <remarks>
/// Abundances are log-normal: log2 value = mean + SD x (sqrt(loading) x module factor +
/// sqrt(1 - loading) x own noise) + planted shifts, the usual way to simulate correlated omics
/// blocks (common practice). Effects are stated in SD units so that every planted marker has a
/// known standardised effect size.
/// </remarks>
public static class DemoStudyGenerator
{
    private static readonly double[] SingleMarkerShifts = [1.2, 1.0, 0.85, -0.85, 0.7, -0.6];
    private const int MissingHeavyFeatures = 20;

    public static DemoStudy Generate(DemoStudyOptions options)
    {
        options.Validate();
        var random = new DemoRandom(options.Seed);

        // Samples: every centre's cases and controls, then one shuffle so the file is in no
        // particular order (as files from a sample store are).
        var sampleCentre = new List<int>();
        var sampleIsCase = new List<bool>();
        for (int c = 0; c < options.Centres.Count; c++)
        {
            var (_, cases, controls) = options.Centres[c];
            for (int i = 0; i < cases; i++) { sampleCentre.Add(c); sampleIsCase.Add(true); }
            for (int i = 0; i < controls; i++) { sampleCentre.Add(c); sampleIsCase.Add(false); }
        }
        int sampleCount = sampleCentre.Count;
        var order = Enumerable.Range(0, sampleCount).ToArray();
        random.Shuffle(order.AsSpan());
        var centreOf = new int[sampleCount];
        var isCase = new bool[sampleCount];
        var sampleIds = new string[sampleCount];
        var perCentreCounter = new int[options.Centres.Count];
        for (int s = 0; s < sampleCount; s++)
        {
            centreOf[s] = sampleCentre[order[s]];
            isCase[s] = sampleIsCase[order[s]];
            string centre = options.Centres[centreOf[s]].Centre;
            sampleIds[s] = $"mf-{centre[0]}{++perCentreCounter[centreOf[s]]:D3}";
        }

        var status = new string[sampleCount];
        var centreLabel = new string[sampleCount];
        var age = new string[sampleCount];
        var sex = new string[sampleCount];
        for (int s = 0; s < sampleCount; s++)
        {
            status[s] = isCase[s] ? DemoStudy.CaseLabel : DemoStudy.ControlLabel;
            centreLabel[s] = options.Centres[centreOf[s]].Centre;
            age[s] = Math.Clamp(Math.Round(54 + 11 * random.Normal()), 18, 90).ToString(CultureInfo.InvariantCulture);
            sex[s] = random.NextDouble() < 0.5 ? "F" : "M";
        }

        var plan = PlanFeatures(options, ref random);
        int featureCount = options.FeatureCount;
        var names = new string[featureCount];
        for (int f = 0; f < featureCount; f++) names[f] = $"AN{f + 1:D4}";
        var builder = new FeatureMatrixBuilder(names, sampleIds);

        // Module factors: one standard normal per module and sample, shifted in cases for the
        // modules that carry signal.
        var moduleFactor = new double[plan.ModuleShift.Length, sampleCount];
        for (int m = 0; m < plan.ModuleShift.Length; m++)
            for (int s = 0; s < sampleCount; s++)
                moduleFactor[m, s] = random.Normal() + (isCase[s] ? plan.ModuleShift[m] : 0);

        int batchCentre = options.Centres.Count - 1;
        var truth = new DemoFeatureTruth[featureCount];
        for (int f = 0; f < featureCount; f++)
        {
            var p = plan.Features[f];
            double loading = p.Module >= 0 ? plan.ModuleLoading[p.Module] : 0;
            double shared = Math.Sqrt(loading), own = Math.Sqrt(1 - loading);
            bool numericLimit = random.NextDouble() < 0.5;
            for (int s = 0; s < sampleCount; s++)
            {
                double z = own * random.Normal() + (p.Module >= 0 ? shared * moduleFactor[p.Module, s] : 0);
                if (isCase[s]) z += p.CaseShiftSd;
                if (centreOf[s] == batchCentre) z += p.CohortShiftSd;
                double log2Value = p.Log2Mean + p.Log2Sd * z;
                double missingDraw = random.NextDouble();
                if (missingDraw < p.MissingRate)
                {
                    builder.SetMissing(f, s);
                }
                else if (p.HasDetectionLimit && log2Value < p.Log2DetectionLimit)
                {
                    builder.SetBelowDetection(f, s, numericLimit ? RoundAsWritten(Math.Pow(2, p.Log2DetectionLimit)) : float.NaN);
                }
                else
                {
                    builder.SetMeasured(f, s, RoundAsWritten(Math.Pow(2, log2Value)));
                }
            }
            truth[f] = new DemoFeatureTruth(names[f], p.Role, p.CaseShiftSd + (p.Module >= 0 ? shared * plan.ModuleShift[p.Module] : 0),
                p.CohortShiftSd, p.Module, p.Log2Mean, p.Log2Sd, p.MissingRate, p.HasDetectionLimit,
                p.HasDetectionLimit ? RoundAsWritten(Math.Pow(2, p.Log2DetectionLimit)) : float.NaN);
        }
        var matrix = builder.Build();
        var outcomes = PlantOutcomes(options, matrix, truth);
        return new DemoStudy(matrix, status, centreLabel, age, sex, truth, options, outcomes);
    }

    /// <summary>
    /// The study's other two outcomes, drawn after (and apart from) everything the class outcome
    /// uses, from a stream of their own, so the abundances and the class results of the demo are
    /// the same with or without them. Five analytes that are noise for the class outcome (alone,
    /// no detection limit, ordinary missingness) carry them: the activity score rises by 6 and 5
    /// points per SD of two of them and by 7 points above +0.8 SD of a third (a threshold); the
    /// hazard of a flare rises by exp(0.7) and exp(0.6) per SD of the other two (a Cox model),
    /// with a baseline median of 30 months, follow-up ending at 60 months and a small drop-out rate.
    /// </summary>
    private static DemoOutcomes PlantOutcomes(DemoStudyOptions options, FeatureMatrix matrix, DemoFeatureTruth[] truth)
    {
        var random = new DemoRandom(options.Seed ^ OutcomeStreamKey);
        var eligible = Enumerable.Range(0, truth.Length).Where(f => truth[f].Role == DemoFeatureRole.Noise && truth[f].Module < 0
            && !truth[f].HasDetectionLimit && truth[f].MissingRate <= options.CellMissingRate).ToArray();
        random.Shuffle(eligible.AsSpan());
        if (eligible.Length < 5) throw new ArgumentException("The demo study needs at least five plain noise analytes to carry its other outcomes.");
        int[] carriers = eligible[..5];
        int sampleCount = matrix.SampleCount;
        var z = new double[5][];
        for (int k = 0; k < 5; k++)
        {
            var t = truth[carriers[k]];
            z[k] = new double[sampleCount];
            for (int s = 0; s < sampleCount; s++)
                // A missing cell sits at the feature's mean: it moves neither outcome.
                z[k][s] = matrix.State(carriers[k], s) == CellState.Measured ? (Math.Log2(matrix.Value(carriers[k], s)) - t.Log2Mean) / t.Log2Sd : 0;
        }
        truth[carriers[0]] = truth[carriers[0]] with { ActivityEffect = "+6 points per SD" };
        truth[carriers[1]] = truth[carriers[1]] with { ActivityEffect = "+5 points per SD" };
        truth[carriers[2]] = truth[carriers[2]] with { ActivityEffect = "+7 points above +0.8 SD" };
        truth[carriers[3]] = truth[carriers[3]] with { LogHazardPerSd = 0.7 };
        truth[carriers[4]] = truth[carriers[4]] with { LogHazardPerSd = 0.6 };

        var score = new double[sampleCount];
        var months = new double[sampleCount];
        var flare = new bool[sampleCount];
        double baseline = Math.Log(2) / 30;
        for (int s = 0; s < sampleCount; s++)
        {
            score[s] = Math.Round(40 + 6 * z[0][s] + 5 * z[1][s] + (z[2][s] > 0.8 ? 7 : 0) + 6 * random.Normal(), 1);
            double eventTime = -Math.Log(1 - random.NextDouble()) / (baseline * Math.Exp(0.7 * z[3][s] + 0.6 * z[4][s]));
            double dropOut = -Math.Log(1 - random.NextDouble()) / 0.004;
            double end = Math.Min(60, dropOut);
            // One decimal, as a clinic records months; at least 0.1 so no follow-up is zero.
            months[s] = Math.Max(0.1, Math.Round(Math.Min(eventTime, end), 1));
            flare[s] = eventTime <= end;
        }
        return new DemoOutcomes(score, months, flare);
    }

    /// <summary>Mixed into the seed for the other outcomes' stream (an arbitrary odd constant).</summary>
    private const ulong OutcomeStreamKey = 0x6A09E667F3BCC909UL;

    /// <summary>
    /// Rounds to the six significant digits the writer prints, so the study in memory equals
    /// the study read back from its files.
    /// </summary>
    internal static float RoundAsWritten(double value) =>
        float.Parse(((float)value).ToString("G6", CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);

    private sealed record FeaturePlan(DemoFeatureRole Role, double CaseShiftSd, double CohortShiftSd, int Module,
        double Log2Mean, double Log2Sd, double MissingRate, bool HasDetectionLimit, double Log2DetectionLimit);

    private sealed record StudyPlan(FeaturePlan[] Features, double[] ModuleShift, double[] ModuleLoading);

    private static StudyPlan PlanFeatures(DemoStudyOptions options, ref DemoRandom random)
    {
        int featureCount = options.FeatureCount;
        // Roles are assigned to a random permutation of positions so planted features are
        // scattered through the file, not first.
        var positions = Enumerable.Range(0, featureCount).ToArray();
        random.Shuffle(positions.AsSpan());
        int next = 0;
        int Take() => positions[next++];

        int moduleCount = Math.Max(2, options.ModuleCount);
        var moduleShift = new double[moduleCount];
        var moduleLoading = new double[moduleCount];
        var moduleSize = new int[moduleCount];
        moduleShift[0] = 1.2; moduleLoading[0] = 0.7; moduleSize[0] = 6;
        moduleShift[1] = -1.0; moduleLoading[1] = 0.6; moduleSize[1] = 4;
        for (int m = 2; m < moduleCount; m++)
        {
            moduleLoading[m] = random.Uniform(0.3, 0.8);
            moduleSize[m] = 4 + random.NextInt(11);
        }

        var plans = new FeaturePlan?[featureCount];
        FeaturePlan Base(DemoFeatureRole role, double caseShift, double cohortShift, int module, ref DemoRandom r)
        {
            double mean = r.Uniform(6, 17), sd = r.Uniform(0.35, 1.0);
            bool limited = mean < 8.5;
            double limit = limited ? mean - r.Uniform(1.0, 1.8) * sd : double.NegativeInfinity;
            return new FeaturePlan(role, caseShift, cohortShift, module, mean, sd, options.CellMissingRate, limited, limit);
        }

        foreach (double shift in SingleMarkerShifts)
            plans[Take()] = Base(DemoFeatureRole.Marker, shift, 0, -1, ref random);
        for (int m = 0; m < 2; m++)
            for (int i = 0; i < moduleSize[m]; i++)
                plans[Take()] = Base(DemoFeatureRole.ModuleMarker, 0, 0, m, ref random);
        // A low-abundance marker: about 40% of controls fall below the limit.
        plans[Take()] = new FeaturePlan(DemoFeatureRole.CensoredMarker, 1.1, 0, -1, 7.0, 0.8, options.CellMissingRate, true, 7.0 - 0.25 * 0.8);
        plans[Take()] = Base(DemoFeatureRole.BatchArtefact, 0, 2.0, -1, ref random);
        for (int m = 2; m < moduleCount; m++)
            for (int i = 0; i < moduleSize[m] && next < featureCount; i++)
                plans[Take()] = Base(DemoFeatureRole.Noise, 0, 0, m, ref random);
        while (next < featureCount)
        {
            bool shifted = random.NextDouble() < 0.10;
            plans[Take()] = Base(shifted ? DemoFeatureRole.BatchShifted : DemoFeatureRole.Noise, 0, shifted ? 0.4 : 0, -1, ref random);
        }

        // A few noise features with heavy missingness, as a failing assay well gives.
        var features = plans.Select(p => p!).ToArray();
        for (int i = 0; i < MissingHeavyFeatures; i++)
        {
            int f = random.NextInt(featureCount);
            if (features[f].Role == DemoFeatureRole.Noise)
                features[f] = features[f] with { MissingRate = random.Uniform(0.2, 0.4) };
        }
        return new StudyPlan(features, moduleShift, moduleLoading);
    }
}
