namespace OmicsScreen.Screening.Effects;

/// <summary>
/// Two-marker partial dependence (Friedman 2001, sec. 8.2): the mean over samples of the forest's
/// prediction with both markers set to a pair of grid values.
/// </summary>
/// <param name="FirstGrid">Grid values of the first marker (its units, increasing).</param>
/// <param name="SecondGrid">Grid values of the second marker.</param>
/// <param name="Average">Partial dependence, first-marker-major: Average[i * SecondGrid.Length + j].</param>
public sealed record EffectSurface(int FirstFeature, int SecondFeature, double[] FirstGrid, double[] SecondGrid, double[] Average)
{
    public double At(int first, int second) => Average[first * SecondGrid.Length + second];
}
