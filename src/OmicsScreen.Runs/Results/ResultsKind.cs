namespace OmicsScreen.Runs.Results;

/// <summary>Which verb's results a folder holds; each verb writes into a folder of its own.</summary>
public enum ResultsKind
{
    Screen,
    Apply,
}
