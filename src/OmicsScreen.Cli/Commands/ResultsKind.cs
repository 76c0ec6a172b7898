namespace OmicsScreen.Cli.Commands;

/// <summary>Which verb's results a folder holds; each verb writes into a folder of its own.</summary>
internal enum ResultsKind
{
    Screen,
    Apply,
}
