using OmicsScreen.Reporting.Tables;
using OmicsScreen.Screening.Covariates;

namespace OmicsScreen.Reporting.Screen;

/// <summary>
/// added_value.tsv: one row per model scored in the curve's outer folds (covariates alone, panel
/// alone, covariates and panel) with its pooled out-of-fold score, and on the covariates-and-panel
/// row the gain over the covariates with its paired interval and p-value.
/// </summary>
public static class AddedValueTables
{
    public const string FileName = "added_value.tsv";

    private sealed record Row(string Model, double Score, double Gain, double Lower, double Upper, double PValue);

    public static int Write(TextWriter writer, AddedValue value)
    {
        string covariates = string.Join(",", value.Covariates);
        var rows = new[]
        {
            new Row("covariates", value.CovariatesAlone, double.NaN, double.NaN, double.NaN, double.NaN),
            new Row("panel", value.PanelAlone, double.NaN, double.NaN, double.NaN, double.NaN),
            new Row("covariates+panel", value.CovariatesAndPanel, value.Gain, value.GainInterval.Lower, value.GainInterval.Upper, value.GainPValue),
        };
        var columns = new List<TsvColumn<Row>>
        {
            TsvColumn<Row>.Text("model", r => r.Model),
            TsvColumn<Row>.Text("covariates", _ => covariates),
            TsvColumn<Row>.Number(value.Metric, r => r.Score, NumberFormat.Fixed(4)),
            TsvColumn<Row>.Number("gain_over_covariates", r => r.Gain, NumberFormat.Fixed(4)),
            TsvColumn<Row>.Number("gain_low95", r => r.Lower, NumberFormat.Fixed(4)),
            TsvColumn<Row>.Number("gain_high95", r => r.Upper, NumberFormat.Fixed(4)),
            TsvColumn<Row>.Number("gain_p", r => r.PValue, NumberFormat.Significant(3)),
            TsvColumn<Row>.Text("interval_method", _ => value.IntervalMethod),
            TsvColumn<Row>.Integer("samples", _ => value.SampleCount),
            TsvColumn<Row>.Integer("outer_folds", _ => value.FoldCount * value.FoldRepeats),
            TsvColumn<Row>.Integer("folds_without_panel", _ => value.FoldsWithoutPanel),
        };
        return new TsvTableWriter<Row>(columns).Write(writer, rows);
    }
}
