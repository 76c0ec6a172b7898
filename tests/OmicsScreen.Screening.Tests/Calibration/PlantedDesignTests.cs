using OmicsScreen.TestSupport.Calibration;

namespace OmicsScreen.Screening.Tests.Calibration;

/// <summary>
/// The planted designs have the effects their comments promise, measured on a large cohort of the
/// model so that sampling error is small (an SD of a mean difference over 4,000 samples is ~0.03).
/// </summary>
public class PlantedDesignTests
{
    private const int LargeCohort = 4000;

    [Fact]
    public void Every_member_of_an_informative_block_shifts_by_its_blocks_effect_and_null_blocks_do_not()
    {
        var model = (BlockShiftModel)CalibrationCatalogue.Create("planted-blocks", 1);
        var panel = model.DrawFreshCohort(LargeCohort);
        Assert.Equal(15, model.RelatedCount);
        int blockSize = model.Background.BlockSize;
        for (int b = 0; b < model.InformativeBlocks.Count; b++)
            for (int i = 0; i < blockSize; i++)
            {
                int feature = model.InformativeBlocks[b] * blockSize + i;
                Assert.True(model.Truth[feature]);
                Assert.InRange(CalibrationValues.ClassShift(model, panel, feature), model.Effects[b] - 0.12, model.Effects[b] + 0.12);
            }
        for (int f = 0; f < model.FeatureCount; f++)
            if (!model.Truth[f]) Assert.InRange(CalibrationValues.ClassShift(model, panel, f), -0.15, 0.15);
    }

    [Fact]
    public void The_interacting_pair_has_no_marginal_shift_but_a_strong_joint_effect()
    {
        var model = (InteractionModel)CalibrationCatalogue.Create("planted-interaction", 1);
        var panel = model.DrawFreshCohort(LargeCohort);
        Assert.Equal(5, model.RelatedCount);
        foreach (int f in model.InteractingPair)
        {
            Assert.True(model.Truth[f]);
            Assert.InRange(CalibrationValues.ClassShift(model, panel, f), -0.1, 0.1);
            // No marginal association: a rank test rarely rejects (p > 0.001; under no effect that fails 1 time in 1,000).
            Assert.True(CalibrationValues.RankTestP(panel, f) > 0.001);
        }
        var first = CalibrationValues.Standardised(model, panel, model.InteractingPair[0]);
        var second = CalibrationValues.Standardised(model, panel, model.InteractingPair[1]);
        var classes = panel.Outcome.SampleClasses;
        int sameSign = 0, sameSignCases = 0, oppositeCases = 0;
        for (int s = 0; s < classes.Length; s++)
        {
            bool same = first[s] * second[s] > 0;
            if (same) { sameSign++; sameSignCases += classes[s]; }
            else oppositeCases += classes[s];
        }
        // Label noise 0.1: P(case | same sign) = 0.9, P(case | opposite signs) = 0.1.
        Assert.InRange(sameSignCases / (double)sameSign, 0.87, 0.93);
        Assert.InRange(oppositeCases / (double)(classes.Length - sameSign), 0.07, 0.13);
        for (int m = 0; m < model.Markers.Count; m++)
            Assert.InRange(CalibrationValues.ClassShift(model, panel, model.Markers[m]),
                MarginalMarkers.DefaultEffects[m] - 0.12, MarginalMarkers.DefaultEffects[m] + 0.12);
    }

    [Fact]
    public void The_case_rate_jumps_above_the_threshold_markers_upper_quartile_and_is_flat_below()
    {
        var model = (ThresholdModel)CalibrationCatalogue.Create("planted-threshold", 1);
        var panel = model.DrawFreshCohort(LargeCohort);
        Assert.Equal(4, model.RelatedCount);
        Assert.True(model.Truth[model.ThresholdMarker]);
        var marker = CalibrationValues.Standardised(model, panel, model.ThresholdMarker);
        var classes = panel.Outcome.SampleClasses;
        // Bands: below the median, median to upper quartile, above the upper quartile (0.6745).
        var counts = new int[3];
        var cases = new int[3];
        for (int s = 0; s < marker.Length; s++)
        {
            int band = marker[s] > ThresholdModel.UpperQuartile ? 2 : marker[s] > 0 ? 1 : 0;
            counts[band]++;
            cases[band] += classes[s];
        }
        // A quarter of a standard normal lies above Phi^-1(0.75); binomial SD over 4,000 is 0.007.
        Assert.InRange(counts[2] / (double)marker.Length, 0.23, 0.27);
        Assert.InRange(cases[0] / (double)counts[0], 0.31, 0.39);
        Assert.InRange(cases[1] / (double)counts[1], 0.29, 0.41);
        Assert.InRange(cases[2] / (double)counts[2], 0.92, 0.98);
        for (int m = 0; m < model.Markers.Count; m++)
            Assert.InRange(CalibrationValues.ClassShift(model, panel, model.Markers[m]),
                MarginalMarkers.DefaultEffects[m] - 0.12, MarginalMarkers.DefaultEffects[m] + 0.12);
    }

    [Theory]
    [InlineData("planted-blocks")]
    [InlineData("planted-interaction")]
    [InlineData("planted-threshold")]
    public void Planted_designs_have_two_classes_of_about_equal_size_on_150_by_1000(string name)
    {
        var panel = CalibrationCatalogue.Create(name, 2).Discovery();
        Assert.Equal(150, panel.SampleCount);
        Assert.Equal(1000, panel.FeatureCount);
        // Cases are drawn with probability 1/2 in designs (b) and (c): SD 6 of 150, so 4 SDs either side.
        Assert.InRange(panel.Outcome.ClassCounts[1], 51, 99);
    }
}
