using System.Globalization;
using OmicsScreen.Reporting.Html;
using OmicsScreen.Screening.Covariates;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// The report's "Added value over covariates" section: the headline ("the panel adds 0.08 AUC
/// (95% CI ...) over age, sex and bmi"), the three pooled out-of-fold scores side by side, and
/// how they were measured. It says what added_value.tsv says, in sentences.
/// </summary>
internal static class AddedValueReportSection
{
    public const string Heading = "Added value over covariates";

    public static void Write(HtmlBuilder html, AddedValue value)
    {
        html.BeginSection(Heading);
        html.Paragraph(Headline(value));
        var table = new HtmlTable("Pooled out-of-fold scores of the three models",
        [
            new HtmlTableColumn("Model"),
            new HtmlTableColumn(MetricLabel(value.Metric), ColumnAlignment.Numeric),
        ]);
        table.AddRow("Covariates alone (" + CovariateList(value.Covariates) + ")", ReportNumber.Fixed(value.CovariatesAlone, 3));
        table.AddRow("Panel alone", ReportNumber.Fixed(value.PanelAlone, 3));
        table.AddRow("Covariates and panel", ReportNumber.Fixed(value.CovariatesAndPanel, 3));
        html.Table(table);
        html.Paragraph(HowMeasured(value));
        html.EndSection();
    }

    /// <summary>"The panel adds 0.081 AUC (95% CI 0.032 to 0.130, p = 0.0012) over age, sex and bmi", then what that means.</summary>
    public static string Headline(AddedValue value)
    {
        string metric = MetricLabel(value.Metric);
        string interval = double.IsNaN(value.GainInterval.Lower)
            ? "no interval could be computed"
            : Invariant($"95% CI {Signed(value.GainInterval.Lower)} to {Signed(value.GainInterval.Upper)}, p = {ReportNumber.Significant(value.GainPValue, 2)}");
        string change = value.Gain >= 0 ? "adds " + ReportNumber.Fixed(value.Gain, 3) : "changes by " + Signed(value.Gain);
        string head = Invariant($"The panel {change} {metric} ({interval}) over {CovariateList(value.Covariates)}: ")
            + Invariant($"{ReportNumber.Fixed(value.CovariatesAlone, 3)} with the covariates alone, {ReportNumber.Fixed(value.CovariatesAndPanel, 3)} with the panel beside them, and {ReportNumber.Fixed(value.PanelAlone, 3)} with the panel alone.");
        if (double.IsNaN(value.GainInterval.Lower)) return head;
        return head + " " + (value.GainInterval.Lower > 0
            ? "The interval lies above zero: the panel carries information the covariates do not."
            : value.GainInterval.Upper < 0
                ? "The interval lies below zero: beside the covariates the panel made the predictions worse (the forest spent splits on markers that add only noise)."
                : "The interval includes zero: these samples do not show that the panel adds anything to what the covariates already say; markers that only track a covariate are flagged in the shortlist.");
    }

    private static string HowMeasured(AddedValue value) =>
        Invariant($"Measured in the panel-size curve's {value.FoldCount * value.FoldRepeats} outer folds ({value.FoldCount} folds")
        + (value.FoldRepeats > 1 ? Invariant($", repeated {value.FoldRepeats} times; each sample's predictions averaged over the repeats") : "")
        + "): in every fold the panel was chosen by the screen on the training part only, and a forest on the covariates alone and one on the covariates beside the fold's locked panel were grown on the training part and scored on the held-out part. "
        + Invariant($"The {value.SampleCount} samples' held-out predictions are pooled into one score per model. ")
        + (value.IntervalMethod == "delong"
            ? "The interval and p-value of the gain compare the two correlated ROC curves on the same samples (DeLong, DeLong & Clarke-Pearson 1988). "
            : "The interval and p-value of the gain come from a paired bootstrap over samples (2,000 resamples of the pooled held-out predictions, percentile interval); it treats the predictions as fixed and so does not include the variation of refitting the folds. ")
        + "Categorical covariates enter the forests as level codes in one column. The covariates' forest tries every covariate at every split and keeps at least 10 samples per leaf, so a covariate without signal cannot weaken it by being drawn alone; the forests holding panel markers are the panel-size curve's own."
        + (value.FoldsWithoutPanel > 0
            ? Invariant($" In {value.FoldsWithoutPanel} folds the screen locked no panel; there the covariates and panel model is the covariates alone and the panel alone predicts nothing.")
            : "");

    private static string MetricLabel(string metric) => metric switch
    {
        "auc" => "AUC",
        "r_squared" => "R²",
        "concordance" => "concordance (Harrell's C)",
        _ => metric,
    };

    /// <summary>"age", "age and sex", "age, sex and bmi".</summary>
    internal static string CovariateList(IReadOnlyList<string> names) => names.Count switch
    {
        0 => "no covariates",
        1 => names[0],
        _ => string.Join(", ", names.Take(names.Count - 1)) + " and " + names[^1],
    };

    private static string Signed(double value) => (value > 0 ? "+" : "") + ReportNumber.Fixed(value, 3);

    private static string Invariant(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
