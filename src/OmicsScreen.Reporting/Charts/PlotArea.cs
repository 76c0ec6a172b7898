namespace OmicsScreen.Reporting.Charts;

/// <summary>The rectangle data are drawn in, in SVG pixels (y grows downwards).</summary>
internal readonly record struct PlotArea(double Left, double Top, double Width, double Height)
{
    public double Right => Left + Width;

    public double Bottom => Top + Height;

    public double X(IAxisScale scale, double value) => Left + scale.Fraction(value) * Width;

    public double Y(IAxisScale scale, double value) => Bottom - scale.Fraction(value) * Height;

    /// <summary>x clamped into the area, for error bars that run off the axis.</summary>
    public double ClampedX(IAxisScale scale, double value) => Math.Clamp(X(scale, value), Left, Right);

    public double ClampedY(IAxisScale scale, double value) => Math.Clamp(Y(scale, value), Top, Bottom);
}
