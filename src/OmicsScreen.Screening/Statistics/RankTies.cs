namespace OmicsScreen.Screening.Statistics;

/// <summary>How a run of tied values shares the ranks it spans.</summary>
public enum RankTies
{
    /// <summary>Every member gets the mean of the ranks the run spans (midrank); what rank tests assume.</summary>
    Average = 0,
    /// <summary>Every member gets the lowest rank of the run ("competition" ranking).</summary>
    Minimum = 1,
    /// <summary>Every member gets the highest rank of the run.</summary>
    Maximum = 2,
    /// <summary>Every member gets the position of its distinct value (1, 2, 2, 3): what counting structures indexed by value need.</summary>
    Dense = 3,
}
