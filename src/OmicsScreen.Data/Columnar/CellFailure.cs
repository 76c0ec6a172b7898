using OmicsScreen.Data.Text;

namespace OmicsScreen.Data.Columnar;

/// <summary>A cell of a table column that is not a measurement: its 0-based row, text and kind.</summary>
internal readonly record struct CellFailure(int Row, string Text, CellKind Kind);
