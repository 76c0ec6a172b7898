using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// A statistical model of a panel with known truth, from which the calibration suite draws the
/// discovery panel and, for scoring a locked panel, fresh cohorts of any size: the same feature
/// parameters (location, scale, blocks, planted effects) with new samples.
/// </summary>
/// <remarks>
/// Every draw comes from the model's seed through <see cref="SeedSchedule"/>: the feature
/// parameters from cohort slot -1, the discovery panel from cohort 0 and fresh cohort k from
/// cohort k, so a fresh cohort never repeats a discovery sample and the same (seed, k) always
/// gives the same cohort. Feature f has location mu_f ~ U(2, 8) and scale sigma_f ~ U(0.3, 1)
/// (as <see cref="SyntheticPanel"/>); its reported value is <see cref="CellDistribution"/> applied
/// to the standardised value the background and the planted design produce.
/// </remarks>
public abstract class CalibrationModel
{
    private const int ParameterCohort = -1;
    private const int FeatureParameterStream = 0;
    private const int PlacementStream = 1;
    private const int CohortStream = 2;

    private readonly double[] _location;
    private readonly double[] _scale;
    private readonly bool[] _related;
    private readonly string[] _featureNames;

    /// <summary>A model whose outcome is classes.</summary>
    protected CalibrationModel(string name, ulong seed, int sampleCount, BackgroundDesign background,
        IReadOnlyList<string> classNames, int positiveClass)
        : this(name, seed, sampleCount, background, OutcomeKind.Classes, classNames ?? throw new ArgumentNullException(nameof(classNames)), positiveClass)
    {
    }

    /// <summary>A model whose outcome is a measured quantity or censored follow-up (no classes).</summary>
    protected CalibrationModel(string name, ulong seed, int sampleCount, BackgroundDesign background, OutcomeKind kind)
        : this(name, seed, sampleCount, background, kind, [], -1)
    {
        if (kind == OutcomeKind.Classes) throw new ArgumentException("A class model names its classes.");
    }

    private CalibrationModel(string name, ulong seed, int sampleCount, BackgroundDesign background, OutcomeKind kind,
        IReadOnlyList<string> classNames, int positiveClass)
    {
        ArgumentNullException.ThrowIfNull(background);
        background.Validate();
        if (sampleCount < 4) throw new ArgumentException("A calibration panel needs at least 4 samples.");
        Name = name;
        Kind = kind;
        Seed = seed;
        SampleCount = sampleCount;
        Background = background;
        ClassNames = classNames.ToArray();
        PositiveClass = positiveClass;
        int featureCount = background.FeatureCount;
        _location = new double[featureCount];
        _scale = new double[featureCount];
        _related = new bool[featureCount];
        var generator = SeedSchedule.Generator(seed, ParameterCohort, FeatureParameterStream, SeedPurpose.Sampling);
        for (int f = 0; f < featureCount; f++)
        {
            _location[f] = 2 + 6 * generator.NextDouble();
            _scale[f] = 0.3 + 0.7 * generator.NextDouble();
        }
        // Invented identifiers that resemble no accession or patient.
        _featureNames = new string[featureCount];
        for (int f = 0; f < featureCount; f++) _featureNames[f] = "CAL" + (f + 1).ToString("D4", CultureInfo.InvariantCulture);
    }

    /// <summary>The shape or design this model stands for, e.g. "null-blocks".</summary>
    public string Name { get; }

    /// <summary>What the outcome is: classes, a measured quantity or a censored time to an event.</summary>
    public OutcomeKind Kind { get; }

    public ulong Seed { get; }

    /// <summary>Samples of the discovery panel.</summary>
    public int SampleCount { get; }

    public int FeatureCount => Background.FeatureCount;

    public BackgroundDesign Background { get; }

    /// <summary>The classes of a class model; empty for other kinds.</summary>
    public IReadOnlyList<string> ClassNames { get; }

    /// <summary>Classes of a class model; 0 for other kinds.</summary>
    public int ClassCount => ClassNames.Count;

    /// <summary>The class scored by AUCs; -1 leaves the choice to <see cref="ClassOutcome"/> (the smallest class).</summary>
    public int PositiveClass { get; }

    /// <summary>Per feature, whether it is truly related to the outcome.</summary>
    public IReadOnlyList<bool> Truth => _related;

    public int RelatedCount => _related.Count(r => r);

    public bool IsNull => RelatedCount == 0;

    /// <summary>The two features whose product decides the class; empty unless the design plants an interaction.</summary>
    public virtual IReadOnlyList<int> InteractingPair => [];

    /// <summary>The feature whose upper quartile raises the class rate; -1 unless the design plants a threshold.</summary>
    public virtual int ThresholdMarker => -1;

    /// <summary>Location mu_f of feature f on the standardised-to-measured transform.</summary>
    public double Location(int feature) => _location[feature];

    /// <summary>Scale sigma_f of feature f.</summary>
    public double Scale(int feature) => _scale[feature];

    /// <summary>The discovery panel (cohort 0), sample ids cal-s0001, cal-s0002, ...</summary>
    public Panel Discovery() => Draw(SampleCount, 0, "cal-s");

    /// <summary>A new cohort from the same model (cohort number 1 or more), sample ids cal-f{k}-s0001, ...</summary>
    public Panel DrawFreshCohort(int sampleCount, int cohortNumber = 1)
    {
        if (cohortNumber < 1) throw new ArgumentOutOfRangeException(nameof(cohortNumber), "Cohort 0 is the discovery panel.");
        if (sampleCount < 2) throw new ArgumentOutOfRangeException(nameof(sampleCount));
        return Draw(sampleCount, cohortNumber, "cal-f" + cohortNumber.ToString(CultureInfo.InvariantCulture) + "-s");
    }

    /// <summary>
    /// Draws the outcome of every sample (its class, measured value or follow-up), reading and
    /// changing the standardised values of the planted features as the design says; the background
    /// is already in <paramref name="standardised"/>.
    /// </summary>
    protected abstract DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator);

    /// <summary>True for a feature the design needs free of any block (its z is its own noise alone).</summary>
    protected virtual bool IsIndependent(int feature) => false;

    protected void MarkRelated(int feature) => _related[feature] = true;

    /// <summary>The generator a design uses once, when built, to place its planted features.</summary>
    protected Xoshiro256StarStar PlacementGenerator() =>
        SeedSchedule.Generator(Seed, ParameterCohort, PlacementStream, SeedPurpose.Sampling);

    /// <summary>Distinct features drawn uniformly without replacement (a partial Fisher-Yates shuffle), in draw order.</summary>
    protected static int[] DrawDistinct(int count, int outOf, ref Xoshiro256StarStar generator)
    {
        if (count > outOf) throw new ArgumentException("Cannot draw more distinct items than there are.");
        var items = new int[outOf];
        for (int i = 0; i < outOf; i++) items[i] = i;
        for (int i = 0; i < count; i++)
        {
            int j = i + generator.NextInt(outOf - i);
            (items[i], items[j]) = (items[j], items[i]);
        }
        return items[..count];
    }

    /// <summary>
    /// Class codes in fixed proportions, round(share x samples) per class with the last class taking
    /// the remainder, in a random order: a designed study rather than a random draw of classes.
    /// </summary>
    protected static int[] ClassesInShares(int sampleCount, IReadOnlyList<double> shares, ref Xoshiro256StarStar generator)
    {
        var classes = new int[sampleCount];
        double cumulative = 0;
        int start = 0;
        for (int c = 0; c < shares.Count; c++)
        {
            cumulative += shares[c];
            int end = c == shares.Count - 1 ? sampleCount : (int)Math.Round(cumulative * sampleCount);
            for (int s = start; s < end; s++) classes[s] = c;
            start = end;
        }
        generator.Shuffle(classes.AsSpan());
        return classes;
    }

    private Panel Draw(int sampleCount, int cohortNumber, string samplePrefix)
    {
        var generator = SeedSchedule.Generator(Seed, cohortNumber, CohortStream, SeedPurpose.Sampling);
        var standardised = DrawBackground(sampleCount, ref generator);
        var outcome = DrawOutcome(standardised, ref generator);
        if (outcome.Kind != Kind) throw new InvalidOperationException($"Model {Name} drew an outcome of another kind than its own.");
        var columns = new float[FeatureCount][];
        var states = new CellState[]?[FeatureCount];
        for (int f = 0; f < FeatureCount; f++)
        {
            var column = new float[sampleCount];
            CellState[]? state = null;
            for (int s = 0; s < sampleCount; s++)
            {
                double z = standardised[f][s];
                if (Background.DetectionLimit is { } limit && z < limit)
                {
                    state ??= new CellState[sampleCount];
                    state[s] = CellState.BelowDetection;
                    z = limit;
                }
                column[s] = (float)Measured(f, z);
            }
            columns[f] = column;
            states[f] = state;
        }
        var sampleIds = new string[sampleCount];
        for (int s = 0; s < sampleCount; s++) sampleIds[s] = samplePrefix + (s + 1).ToString("D4", CultureInfo.InvariantCulture);
        var matrix = new FeatureMatrix(_featureNames, sampleIds, columns, states);
        return outcome.ToPanel(matrix, ClassNames, PositiveClass);
    }

    /// <summary>The reported value of a standardised value z of feature f.</summary>
    private double Measured(int feature, double z) => Background.Distribution == CellDistribution.LogNormal
        ? Math.Exp(_location[feature] + _scale[feature] * z)
        : _location[feature] + _scale[feature] * z;

    /// <summary>
    /// Standardised values, feature-major: first every block's latent factor for every sample, then
    /// each feature's own noise, so the values never depend on the planted design.
    /// </summary>
    private double[][] DrawBackground(int sampleCount, ref Xoshiro256StarStar generator)
    {
        int blockSize = Background.BlockSize;
        double rho = Background.BlockCorrelation;
        bool blocks = blockSize > 1 && rho > 0;
        int blockCount = (FeatureCount + blockSize - 1) / blockSize;
        var latent = blocks ? new double[blockCount * sampleCount] : [];
        for (int i = 0; i < latent.Length; i++) latent[i] = generator.NextGaussian();
        double shared = Math.Sqrt(rho), own = Math.Sqrt(1 - rho);
        bool heavy = Background.Distribution == CellDistribution.HeavyTailed;
        var values = new double[FeatureCount][];
        for (int f = 0; f < FeatureCount; f++)
        {
            var column = new double[sampleCount];
            bool inBlock = blocks && !IsIndependent(f);
            int block = f / blockSize;
            for (int s = 0; s < sampleCount; s++)
            {
                double noise = heavy ? StudentTwo(ref generator) : generator.NextGaussian();
                column[s] = inBlock ? shared * latent[block * sampleCount + s] + own * noise : noise;
            }
            values[f] = column;
        }
        return values;
    }

    /// <summary>
    /// Student t with 2 degrees of freedom: T = Z / sqrt(V / 2) with V chi-squared on 2 degrees of
    /// freedom, and V / 2 = -ln U is exponential (common practice; e.g. Devroye 1986, Non-Uniform
    /// Random Variate Generation, ch. IX). U = 0 gives V infinite and T = 0, never a division by zero.
    /// </summary>
    private static double StudentTwo(ref Xoshiro256StarStar generator)
    {
        double z = generator.NextGaussian();
        double halfChiSquare = -Math.Log(generator.NextDouble());
        return z / Math.Sqrt(halfChiSquare);
    }
}
