namespace OmicsScreen.Reporting.Charts;

/// <summary>Horizontal anchoring of chart text (SVG text-anchor).</summary>
internal enum TextAnchor
{
    Start = 0,
    Middle = 1,
    End = 2,
}
