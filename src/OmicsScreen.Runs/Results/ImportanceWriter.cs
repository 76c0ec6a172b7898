using OmicsScreen.Engine.Forests;
using OmicsScreen.Reporting.Tables;

namespace OmicsScreen.Runs.Results;

/// <summary>Writes one forest's impurity decrease per feature as a TSV, most important first.</summary>
public static class ImportanceWriter
{
    /// <summary>The header every file written here starts with; how an earlier one is recognised before it is replaced.</summary>
    public const string HeaderLine = "rank\tfeature\tmean_gini_decrease\tshare_of_total\n";

    private sealed record Row(int Rank, string Feature, double MeanDecrease, double Share);

    public static void Write(TextWriter writer, IReadOnlyList<string> featureNames, int[] ranked, ForestResult result)
    {
        var table = new TsvTableWriter<Row>(
        [
            TsvColumn<Row>.Integer("rank", r => r.Rank),
            TsvColumn<Row>.Text("feature", r => r.Feature),
            TsvColumn<Row>.Number("mean_gini_decrease", r => r.MeanDecrease, NumberFormat.Significant(6)),
            TsvColumn<Row>.Number("share_of_total", r => r.Share, NumberFormat.Significant(6)),
        ]);
        table.Write(writer, ranked.Select((f, i) => new Row(i + 1, featureNames[f], result.MeanDecreaseImpurity[f], result.NormalisedDecreaseImpurity[f])));
    }
}
