namespace OmicsScreen.Reporting.Html;

/// <summary>A column of an <see cref="HtmlTable"/>: header text and alignment.</summary>
public sealed record HtmlTableColumn(string Header, ColumnAlignment Alignment = ColumnAlignment.Text);
