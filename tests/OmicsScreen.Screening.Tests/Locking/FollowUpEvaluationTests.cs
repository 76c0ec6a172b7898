using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Screening.Tests.Locking;

public class FollowUpEvaluationTests
{
    /// <summary>
    /// The evaluation of a follow-up panel on a cohort, with the Cox linear predictor of R survival's
    /// lung data (reference/apply) standing in for the panel's risk scores and the risk groups cut at
    /// its median: Harrell's C and its interval against R's concordance (C ± 1.96 SE, infinitesimal
    /// jackknife), the log-rank chi-square of the groups against survdiff, the AUC at 365 days
    /// against the written-out IPCW estimator, and the groups' Kaplan-Meier curves covering every sample.
    /// </summary>
    [Fact]
    public void Concordance_interval_log_rank_and_auc_equal_r_on_the_lung_data()
    {
        var time = ApplyReferenceData.LungTime;
        var events = ApplyReferenceData.LungEvents;
        var risk = ApplyReferenceData.LungMarker("cox_linear_predictor");
        var reference = ApplyReferenceData.Root;
        var high = reference.GetProperty("logrank_cox_lp_median").GetProperty("high").EnumerateArray().Select(e => e.GetInt32() == 1).ToArray();
        var ids = Enumerable.Range(0, time.Length).Select(i => $"L{i:D3}").ToArray();
        var scores = new LockedFollowUpScores(ids, risk, high, double.NaN, []);

        var performance = LockedPanelEvaluation.EvaluateFollowUp(scores, time, events, horizon: 365);

        var concordance = reference.GetProperty("concordance").EnumerateArray().Single(c => c.GetProperty("marker").GetString() == "cox_linear_predictor");
        Assert.Equal(concordance.GetProperty("concordance").GetDouble(), performance.Concordance.Concordance, 1e-10);
        Assert.Equal(concordance.GetProperty("lower").GetDouble(), performance.Concordance.Interval.Lower, 1e-8);
        Assert.Equal(concordance.GetProperty("upper").GetDouble(), performance.Concordance.Interval.Upper, 1e-8);
        Assert.Equal(reference.GetProperty("logrank_cox_lp_median").GetProperty("chisq").GetDouble(), performance.LogRank!.Value.ChiSquare, 1e-8);
        var auc = reference.GetProperty("time_dependent_auc").EnumerateArray()
            .Single(a => a.GetProperty("marker").GetString() == "cox_linear_predictor" && a.GetProperty("horizon").GetDouble() == 365);
        Assert.Equal(auc.GetProperty("auc").GetDouble(), performance.TimeDependentAuc!.Value.Auc, 1e-12);

        Assert.Equal(high.Count(h => h), performance.HighRiskCount);
        Assert.Equal(events.Count(e => e), performance.EventCount);
        Assert.Equal(performance.HighRiskCount, performance.HighRisk!.AtRisk[0] + CensoredBeforeFirstEvent(time, events, high, true));
        Assert.Null(LockedPanelEvaluation.EvaluateFollowUp(scores, time, events, horizon: null).TimeDependentAuc);
    }

    private static int CensoredBeforeFirstEvent(double[] time, bool[] events, bool[] group, bool which)
    {
        double first = time.Where((t, i) => events[i] && group[i] == which).Min();
        return time.Where((t, i) => group[i] == which && t < first).Count();
    }

    /// <summary>A horizon the cohort cannot support is refused by the evaluation itself, not answered with NaN.</summary>
    [Fact]
    public void A_horizon_beyond_the_follow_up_is_refused()
    {
        var time = ApplyReferenceData.LungTime;
        var events = ApplyReferenceData.LungEvents;
        var risk = ApplyReferenceData.LungMarker("age");
        var scores = new LockedFollowUpScores(Enumerable.Range(0, time.Length).Select(i => $"L{i}").ToArray(), risk, new bool[time.Length], 0, []);
        var error = Assert.Throws<ArgumentException>(() => LockedPanelEvaluation.EvaluateFollowUp(scores, time, events, horizon: 5000));
        Assert.Contains("last follow-up", error.Message);
        // Every sample in one group: no log-rank test to report.
        Assert.Null(LockedPanelEvaluation.EvaluateFollowUp(scores, time, events, null).LogRank);
    }
}
