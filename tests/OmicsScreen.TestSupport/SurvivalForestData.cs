using OmicsScreen.Engine.Panels;
using OmicsScreen.Engine.Survival;

namespace OmicsScreen.TestSupport;

/// <summary>
/// The invented censored panel of reference/survival/survival_forest.csv (200 samples, 20 markers,
/// hazard 0.1 exp(0.8 x1 - 0.6 x2 + 0.7 [x3 > 0]); made by make_survival_forest_reference.R), and
/// the public lung cancer table of reference/survival/lung_forest.csv (make_lung_forest_reference.R).
/// </summary>
public static class SurvivalForestData
{
    public static (FeatureMatrix Matrix, FollowUpTimes FollowUp) Load() => ReferenceTables.FollowUp("survival", "survival_forest.csv");

    /// <summary>survival::lung (Loprinzi et al. 1994), the 168 patients with all seven clinical measurements.</summary>
    public static (FeatureMatrix Matrix, FollowUpTimes FollowUp) LoadLung() => ReferenceTables.FollowUp("survival", "lung_forest.csv");
}
