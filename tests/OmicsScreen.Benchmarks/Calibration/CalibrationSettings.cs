using System.Globalization;
using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;

namespace OmicsScreen.Benchmarks.Calibration;

/// <summary>
/// The command line of the calibration mode:
/// calibration [--seeds N] [--first-seed S] [--quick] [--threads T] [--kind classes|measured|follow-up] [--only NAME[,NAME...]] (--only may repeat).
/// </summary>
public sealed record CalibrationSettings
{
    /// <summary>Half-sample pairs of a quick run (default 25).</summary>
    public const int QuickHalfSamplePairs = 5;

    /// <summary>Trees per forest of a quick run (default 500).</summary>
    public const int QuickTreesPerForest = 100;

    /// <summary>Samples of the fresh cohort every locked panel is scored on.</summary>
    public const int FreshCohortSize = 2000;

    public int SeedCount { get; init; } = 5;

    /// <summary>The first seed number run (seeds FirstSeed .. FirstSeed + SeedCount - 1), so a run can extend an earlier one with new panels.</summary>
    public int FirstSeed { get; init; } = 1;

    public bool Quick { get; init; }

    public int ThreadCount { get; init; }

    /// <summary>Only the shapes and designs of this outcome kind; null for every kind.</summary>
    public OutcomeKind? Kind { get; init; }

    /// <summary>Shapes and designs to run; empty runs all of them.</summary>
    public IReadOnlyList<string> Only { get; init; } = [];

    /// <summary>The screen's options for a panel: every default, the panel's seed, and the quick reductions when asked.</summary>
    public ScreenOptions ScreenOptions(ulong seed)
    {
        var options = new ScreenOptions { Seed = seed, ThreadCount = ThreadCount };
        return Quick ? options with { HalfSamplePairs = QuickHalfSamplePairs, TreesPerForest = QuickTreesPerForest } : options;
    }

    /// <exception cref="ArgumentException">An unknown option, a missing or malformed value.</exception>
    public static CalibrationSettings Parse(IReadOnlyList<string> args)
    {
        var settings = new CalibrationSettings();
        var only = new List<string>();
        for (int i = 0; i < args.Count; i++)
        {
            string Value() => i + 1 < args.Count ? args[++i] : throw new ArgumentException($"{args[i]} needs a value.");
            switch (args[i])
            {
                case "--seeds":
                    settings = settings with { SeedCount = PositiveInteger("--seeds", Value(), 1) };
                    break;
                case "--first-seed":
                    settings = settings with { FirstSeed = PositiveInteger("--first-seed", Value(), 1) };
                    break;
                case "--threads":
                    settings = settings with { ThreadCount = PositiveInteger("--threads", Value(), 0) };
                    break;
                case "--quick":
                    settings = settings with { Quick = true };
                    break;
                case "--kind":
                    settings = settings with { Kind = ParseKind(Value()) };
                    break;
                case "--only":
                    only.AddRange(Value().Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries));
                    break;
                default:
                    throw new ArgumentException($"Unknown calibration option '{args[i]}'.");
            }
        }
        return settings with { Only = only };
    }

    private static OutcomeKind ParseKind(string text) => text switch
    {
        "classes" => OutcomeKind.Classes,
        "measured" => OutcomeKind.Measured,
        "follow-up" => OutcomeKind.TimeToEvent,
        _ => throw new ArgumentException($"--kind takes classes, measured or follow-up, not '{text}'."),
    };

    private static int PositiveInteger(string option, string text, int minimum)
    {
        if (!int.TryParse(text, NumberStyles.None, CultureInfo.InvariantCulture, out int value) || value < minimum)
            throw new ArgumentException($"{option} needs a whole number of at least {minimum.ToString(CultureInfo.InvariantCulture)}.");
        return value;
    }
}
