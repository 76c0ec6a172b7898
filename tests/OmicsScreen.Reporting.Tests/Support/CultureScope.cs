using System.Globalization;

namespace OmicsScreen.Reporting.Tests.Support;

/// <summary>
/// Sets a current culture whose numbers look German ("," decimal separator, "." group separator)
/// for the life of the scope. The projects run with InvariantGlobalization, so named cultures such
/// as de-DE cannot be created; a clone of the invariant culture with those separators is what a
/// culture-dependent formatting bug would pick up.
/// </summary>
internal sealed class CultureScope : IDisposable
{
    private readonly CultureInfo _previous;

    private CultureScope(CultureInfo culture)
    {
        _previous = CultureInfo.CurrentCulture;
        CultureInfo.CurrentCulture = culture;
    }

    public static CultureScope CommaDecimal()
    {
        var culture = (CultureInfo)CultureInfo.InvariantCulture.Clone();
        culture.NumberFormat.NumberDecimalSeparator = ",";
        culture.NumberFormat.NumberGroupSeparator = ".";
        culture.NumberFormat.NegativeSign = "\u2212";
        return new CultureScope(culture);
    }

    public void Dispose() => CultureInfo.CurrentCulture = _previous;
}
