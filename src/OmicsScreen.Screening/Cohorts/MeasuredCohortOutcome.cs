using OmicsScreen.Engine.Panels;
using OmicsScreen.Screening.Screen;
using OmicsScreen.Screening.Statistics;
using OmicsScreen.Screening.Univariate;

namespace OmicsScreen.Screening.Cohorts;

/// <summary>
/// A measured quantity: Spearman's rho in each cohort, pooled on Fisher's z scale with the
/// Bonett &amp; Wright (2000) variance (<see cref="CohortOutcomePooling.Spearman"/>), rho over all
/// samples from the single-marker table, eta of the outcome's ranks on cohort with the
/// Kruskal-Wallis test, and held-out cohorts scored by R².
/// </summary>
internal sealed class MeasuredCohortOutcome(Panel panel, MeasuredOutcomeMarker[] markers) : CohortOutcome(panel)
{
    private readonly double[] _values = panel.Measured!.Values.ToArray();

    public override CohortEffectMeasure Measure => CohortEffectMeasure.SpearmanRho;

    public override (double Strength, double PValue) Association() => OutcomeCohortAssociation.OfMeasured(_values, Cohort);

    public override MarkerHeterogeneity Marker(int feature, int cohortImportanceRank, int[][] rowsOf)
    {
        var pooling = CohortOutcomePooling.Spearman(Panel.Matrix, feature, _values, Cohort);
        return FromPooling(feature, pooling, markers[feature].Rho, markers[feature].Interval, cohortImportanceRank, rowsOf);
    }

    /// <summary>R² of the panel's predictions about the held-out cohort's own mean, and the mean squared error; R² has no interval here.</summary>
    public override HeldOutCohort HeldOut(string cohortName, int panelSize, PanelScore scored, int[] testRows) =>
        new(cohortName, testRows.Length, panelSize, scored.Score, ConfidenceInterval.Undefined(0.95), scored.Error);
}
