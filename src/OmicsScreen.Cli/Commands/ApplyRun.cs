using System.Globalization;
using OmicsScreen.Cli.Console;
using OmicsScreen.Reporting.Json;
using OmicsScreen.Runs.Apply;
using OmicsScreen.Runs.Locking;

namespace OmicsScreen.Cli.Commands;

/// <summary>`apply` on the console: the job (<see cref="ApplyJob"/>), then its warnings and the summary or --json headline of the panel's kind.</summary>
internal static class ApplyRun
{
    public static int Execute(CliConsole console, ApplyRunOptions options)
    {
        var applied = ApplyJob.Run(options.Request, console.Error);
        foreach (var warning in applied.Warnings) console.Error.WriteLine($"warning: {TextTable.Printable(warning)}");
        // Each headline is written as its own type: the JSON holds the properties of the type it is given.
        switch (applied)
        {
            case ClassesApplied classes:
                if (options.Json) ManifestJson.Write(console.Out, ApplyClassesHeadline.Of(classes));
                else PrintSummary(console.Out, classes);
                break;
            case MeasuredApplied measured:
                if (options.Json) ManifestJson.Write(console.Out, ApplyMeasuredHeadline.Of(measured));
                else PrintSummary(console.Out, measured);
                break;
            case FollowUpApplied followUp:
                if (options.Json) ManifestJson.Write(console.Out, ApplyFollowUpHeadline.Of(followUp));
                else PrintSummary(console.Out, followUp);
                break;
        }
        return ExitCode.Success;
    }

    private static void PrintSummary(TextWriter output, ClassesApplied applied)
    {
        var (model, scores, performance) = (applied.Model, applied.Scores, applied.Performance);
        string rule = model.Threshold is { } threshold
            ? FormattableString.Invariant($"{model.ClassNames[model.PositiveClass]} when its probability is at least {threshold:0.###}")
            : "majority vote of the trees";
        output.WriteLine($"Scored {scores.SampleCount} samples with a locked panel of {model.MarkerCount} markers and {model.Trees.Count} trees; call: {rule}.");
        PrintMarkers(output, applied);
        var called = new int[scores.ClassCount];
        foreach (int c in scores.PredictedClasses) called[c]++;
        output.WriteLine("Called: " + string.Join(", ", scores.ClassNames.Select((name, c) => $"{called[c]} {name}")) + ".");
        if (performance is not null)
        {
            output.WriteLine();
            if (performance.Auc is { } auc && performance.AucInterval is { } interval)
            {
                string discovery = model.OutOfBagAuc is { } value ? FormattableString.Invariant($"; discovery out-of-bag AUC {value:0.000}") : "";
                output.WriteLine(FormattableString.Invariant(
                    $"AUC {auc:0.000} [95% CI {interval.Lower:0.000} to {interval.Upper:0.000}] ({model.ClassNames[model.PositiveClass]} positive){discovery}."));
            }
            output.WriteLine(FormattableString.Invariant($"Error at the locked call: {performance.Error:0.000}"));
            output.WriteLine();
            var header = new List<string> { "known \\ called" };
            header.AddRange(performance.ClassNames);
            var table = new TextTable(header.ToArray()).AlignRight(Enumerable.Range(1, performance.ClassNames.Count).ToArray());
            for (int c = 0; c < performance.ClassNames.Count; c++)
            {
                var row = new List<string> { performance.ClassNames[c] };
                foreach (int count in performance.Confusion[c]) row.Add(count.ToString(CultureInfo.InvariantCulture));
                table.Add(row.ToArray());
            }
            table.WriteTo(output);
        }
        output.WriteLine();
        output.WriteLine($"Results in {applied.Folder}");
    }

    private static void PrintSummary(TextWriter output, MeasuredApplied applied)
    {
        var (model, scores, performance) = (applied.Model, applied.Scores, applied.Performance);
        output.WriteLine($"Predicted {model.OutcomeName} for {scores.SampleCount} samples with a locked panel of {model.MarkerCount} markers and {model.Trees.Count} trees (a regression forest).");
        PrintMarkers(output, applied);
        if (performance is not null)
        {
            var line = performance.Calibration;
            output.WriteLine();
            output.WriteLine(FormattableString.Invariant(
                $"R² {performance.RSquared:0.000}, RMSE {performance.RootMeanSquaredError:G4}; discovery out-of-bag R² {model.OutOfBagRSquared:0.000}."));
            output.WriteLine(FormattableString.Invariant(
                $"Calibration (observed on predicted): slope {line.Slope:0.000} [95% CI {line.SlopeInterval.Lower:0.000} to {line.SlopeInterval.Upper:0.000}], intercept {line.Intercept:G4} [95% CI {line.InterceptInterval.Lower:G4} to {line.InterceptInterval.Upper:G4}]."));
        }
        output.WriteLine();
        output.WriteLine($"Results in {applied.Folder}");
        output.WriteLine("A locked panel is a candidate for validation in independent cohorts, not a measurement of the outcome.");
    }

    private static void PrintSummary(TextWriter output, FollowUpApplied applied)
    {
        var (model, scores, performance) = (applied.Model, applied.Scores, applied.Performance);
        int high = scores.HighRiskCount;
        output.WriteLine(FormattableString.Invariant(
            $"Scored {scores.SampleCount} samples with a locked panel of {model.MarkerCount} markers and {model.Trees.Count} trees (a random survival forest); risk groups: {high} high, {scores.SampleCount - high} low (cut at the discovery median risk score {model.RiskGroupCut:G4})."));
        PrintMarkers(output, applied);
        if (performance is not null)
        {
            var c = performance.Concordance;
            output.WriteLine();
            output.WriteLine(FormattableString.Invariant(
                $"Concordance (Harrell's C) {c.Concordance:0.000} [95% CI {c.Interval.Lower:0.000} to {c.Interval.Upper:0.000}] over {performance.EventCount} events; discovery out-of-bag C {model.OutOfBagConcordance:0.000}."));
            if (performance.TimeDependentAuc is { } auc)
                output.WriteLine(FormattableString.Invariant(
                    $"Time-dependent AUC at {auc.Horizon:G6}: {auc.Auc:0.000} ({auc.Cases} events by then against {auc.Controls} samples followed beyond it, censoring-weighted)."));
            if (performance.LogRank is { } test)
                output.WriteLine(FormattableString.Invariant($"Risk groups: log-rank chi-square {test.ChiSquare:0.00}, p {test.PValue:G2}."));
        }
        output.WriteLine();
        output.WriteLine($"Results in {applied.Folder}");
        output.WriteLine("A risk score ranks samples; it is not a calibrated survival probability. Validate the panel in independent cohorts before any use.");
    }

    private static void PrintMarkers(TextWriter output, AppliedPanel applied) =>
        output.WriteLine(TextTable.Printable("Markers (matched by id): " + string.Join(", ", applied.Markers.Select(m => MarkerLabels.Label(m, applied.DisplayNames)))));
}
