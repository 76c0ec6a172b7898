using OmicsScreen.Screening.Statistics.Survival;

namespace OmicsScreen.Screening.Tests.Locking;

public class TimeDependentAucTests
{
    /// <summary>
    /// Source: reference/apply/make_apply_reference.R, the cumulative/dynamic AUC with
    /// Kaplan-Meier censoring weights (Heagerty, Lumley &amp; Pepe 2000; Uno et al. 2007; Blanche et
    /// al. 2013, timeROC's "marginal" weighting) written out in R and evaluated pair by pair on R
    /// survival's lung data (Loprinzi et al. 1994): four markers (one with four values only) at
    /// three horizons. Deterministic sums, so agreement to 1e-12.
    /// </summary>
    [Fact]
    public void The_auc_at_each_horizon_equals_the_reference_on_the_lung_data()
    {
        var time = ApplyReferenceData.LungTime;
        var events = ApplyReferenceData.LungEvents;
        int checkedSets = 0;
        foreach (var set in ApplyReferenceData.Root.GetProperty("time_dependent_auc").EnumerateArray())
        {
            var marker = ApplyReferenceData.LungMarker(set.GetProperty("marker").GetString()!);
            double horizon = set.GetProperty("horizon").GetDouble();
            var estimate = TimeDependentAuc.CumulativeDynamic(time, events, marker, horizon);
            Assert.Equal(set.GetProperty("auc").GetDouble(), estimate.Auc, 1e-12);
            Assert.Equal(set.GetProperty("cases").GetInt32(), estimate.Cases);
            Assert.Equal(set.GetProperty("controls").GetInt32(), estimate.Controls);
            Assert.Equal(set.GetProperty("censored_before").GetInt32(), estimate.CensoredBeforeHorizon);
            checkedSets++;
        }
        Assert.Equal(12, checkedSets);
    }

    /// <summary>
    /// Without censoring every weight is 1 and the AUC is the Mann-Whitney share of (event by t,
    /// event-free after t) pairs (Heagerty et al. 2000, section 2). Worked by hand at t = 3: cases
    /// score 3 and 5 (times 1, 2), controls 1, 4 and 5 (times 4, 5, 6).
    /// </summary>
    [Fact]
    public void Without_censoring_the_auc_is_the_share_of_case_control_pairs_ranked_right()
    {
        double[] time = [1, 2, 4, 5, 6];
        bool[] events = [true, true, true, true, true];
        double[] score = [3, 5, 1, 4, 5];
        // Case 3 beats 1 only (1 of 3); case 5 beats 1 and 4 and ties 5 (2.5 of 3): (1 + 2.5) / 6.
        var estimate = TimeDependentAuc.CumulativeDynamic(time, events, score, 3);
        Assert.Equal(3.5 / 6, estimate.Auc, 1e-15);
        Assert.Equal(2, estimate.Cases);
        Assert.Equal(3, estimate.Controls);
    }

    [Fact]
    public void A_horizon_at_or_beyond_the_last_follow_up_or_before_the_first_event_is_refused_with_the_figures()
    {
        double[] time = [1, 2, 4, 5, 6];
        bool[] events = [false, true, true, false, true];
        Assert.Contains("at or beyond the last follow-up time (6)", TimeDependentAuc.HorizonProblem(time, events, 6));
        Assert.Contains("at or beyond the last follow-up time (6)", TimeDependentAuc.HorizonProblem(time, events, 40));
        Assert.Contains("no event happened by the horizon 1.5 (the first event is at 2)", TimeDependentAuc.HorizonProblem(time, events, 1.5));
        Assert.Contains("not a positive number", TimeDependentAuc.HorizonProblem(time, events, -1));
        Assert.Null(TimeDependentAuc.HorizonProblem(time, events, 4.5));
        Assert.Throws<ArgumentException>(() => TimeDependentAuc.CumulativeDynamic(time, events, [1, 2, 3, 4, 5], 6));
    }
}
