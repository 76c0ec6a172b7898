using OmicsScreen.Engine.Randomness;

namespace OmicsScreen.TestSupport.Calibration;

/// <summary>
/// A panel where no feature is related to the outcome: the classes are dealt in fixed shares,
/// independently of every value, so any feature the screen shortlists is a false discovery.
/// </summary>
public sealed class NullModel : CalibrationModel
{
    private readonly double[] _classShares;

    /// <param name="classShares">Share of each class (summing to 1); its length is the number of classes.</param>
    public NullModel(string name, ulong seed, int sampleCount, BackgroundDesign background,
        IReadOnlyList<string> classNames, IReadOnlyList<double> classShares, int positiveClass = -1)
        : base(name, seed, sampleCount, background, classNames, positiveClass)
    {
        ArgumentNullException.ThrowIfNull(classShares);
        if (classShares.Count != classNames.Count) throw new ArgumentException("One share is needed per class.");
        if (Math.Abs(classShares.Sum() - 1) > 1e-9) throw new ArgumentException("Class shares must sum to 1.");
        _classShares = classShares.ToArray();
    }

    public IReadOnlyList<double> ClassShares => _classShares;

    protected override DrawnOutcome DrawOutcome(double[][] standardised, ref Xoshiro256StarStar generator) =>
        DrawnOutcome.OfClasses(ClassesInShares(standardised[0].Length, _classShares, ref generator));
}
