using System.Globalization;
using OmicsScreen.Engine.Metrics;
using OmicsScreen.TestSupport;

namespace OmicsScreen.Engine.Tests.Metrics;

public class MannWhitneyAucTests
{
    [Fact]
    public void Ties_count_one_half_in_a_worked_example()
    {
        // Positives score {2, 3}, negatives {1, 2}: pairs (2>1)=1, (2=2)=1/2, (3>1)=1, (3>2)=1, so AUC = 3.5/4
        // (Hanley & McNeil 1982: AUC = P(X_pos > X_neg) + P(tie)/2).
        double auc = MannWhitneyAuc.Compute([1, 2, 2, 3], [false, true, false, true]);
        Assert.Equal(0.875, auc, 15);
    }

    [Fact]
    public void Per_feature_AUC_on_WDBC_matches_the_reference_library()
    {
        var (matrix, outcome) = WdbcData.Load();
        var positive = outcome.SampleClasses.ToArray().Select(c => c == 1).ToArray(); // malignant
        var reference = WdbcData.ReadTable("feature_stats.csv");
        foreach (var row in reference)
        {
            int feature = matrix.FeatureNames.ToList().IndexOf(row["feature"]);
            var scores = matrix.Column(feature).ToArray().Select(v => (double)v).ToArray();
            // feature_stats.csv auc_malignant: scikit-learn roc_auc_score, exact rank statistic.
            double expected = double.Parse(row["auc_malignant"], CultureInfo.InvariantCulture);
            Assert.Equal(expected, MannWhitneyAuc.Compute(scores, positive), 9);
        }
    }
}
