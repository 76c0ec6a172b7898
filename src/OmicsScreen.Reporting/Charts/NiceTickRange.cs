namespace OmicsScreen.Reporting.Charts;

/// <summary>An axis from <paramref name="First"/> to <paramref name="Last"/> with a tick every <paramref name="Step"/>.</summary>
/// <param name="FractionDigits">Decimals the tick labels need to tell the ticks apart: max(0, -floor(log10 Step)).</param>
public readonly record struct NiceTickRange(double First, double Last, double Step, int FractionDigits)
{
    /// <summary>Number of ticks from <see cref="First"/> to <see cref="Last"/> inclusive.</summary>
    public int TickCount => (int)Math.Round((Last - First) / Step) + 1;

    /// <summary>The tick value at <paramref name="index"/>, computed from the integer multiple so errors do not accumulate.</summary>
    public double Tick(int index) => (Math.Round(First / Step) + index) * Step;
}
