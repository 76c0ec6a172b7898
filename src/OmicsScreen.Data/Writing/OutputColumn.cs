namespace OmicsScreen.Data.Writing;

/// <summary>One column of a panel written as a table: numbers (null = missing) or text cells.</summary>
internal sealed record OutputColumn(string Name, float?[]? Numbers, string?[]? Texts);
