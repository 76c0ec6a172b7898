using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Screening.Tests.Locking;

public class YoudenThresholdTests
{
    [Fact]
    public void The_threshold_maximises_sensitivity_plus_specificity_minus_one()
    {
        // Youden 1950 (Cancer 3:32-35): J = sensitivity + specificity - 1, rule "positive when score >= t".
        // Hand count: t = 0.9 J = .25; 0.8 J = .50; 0.7 J = .25; 0.6 J = .50; 0.4 J = .75 (4/4 - 1/4); 0.3 J = .50.
        double[] scores = [0.9, 0.8, 0.6, 0.4, 0.7, 0.3, 0.2, 0.1];
        bool[] positive = [true, true, true, true, false, false, false, false];
        Assert.Equal(0.4, YoudenThreshold.Choose(scores, positive));
    }

    [Fact]
    public void Equal_J_goes_to_the_threshold_nearest_one_half()
    {
        // Hand count: t = 0.9 J = 1/2 - 0 = .5; t = 0.6 J = 1/2 - 1/2 = 0; t = 0.3 J = 1 - 1/2 = .5; t = 0.1 J = 0.
        // 0.3 is 0.2 from 0.5, 0.9 is 0.4 away.
        double[] scores = [0.9, 0.3, 0.6, 0.1];
        bool[] positive = [true, true, false, false];
        Assert.Equal(0.3, YoudenThreshold.Choose(scores, positive));
    }

    [Fact]
    public void Samples_without_a_score_take_no_part()
    {
        double[] scores = [0.9, double.NaN, 0.6, 0.4, 0.2];
        bool[] positive = [true, false, true, false, false];
        // Without the NaN sample: t = 0.6 calls both positives and no negative, J = 1.
        Assert.Equal(0.6, YoudenThreshold.Choose(scores, positive));
    }

    [Fact]
    public void A_single_class_leaves_the_majority_threshold()
    {
        Assert.Equal(0.5, YoudenThreshold.Choose([0.2, 0.7], [true, true]));
    }
}
