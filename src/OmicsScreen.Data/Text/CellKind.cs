namespace OmicsScreen.Data.Text;

/// <summary>What a text cell of a feature column turned out to hold.</summary>
internal enum CellKind : byte
{
    Measured,
    Missing,
    BelowDetection,
    /// <summary>Text that is neither a number nor a known token: an input error.</summary>
    NotANumber,
    /// <summary>Infinity, or a number beyond float32 range such as 1e400: an input error.</summary>
    Infinite,
}
