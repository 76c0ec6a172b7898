namespace OmicsScreen.Screening.Screen;

/// <summary>Whether trees draw the same number of samples from each class.</summary>
public enum BalanceMode
{
    /// <summary>On when the smallest class is under two thirds of the largest.</summary>
    Auto,
    On,
    Off,
}
