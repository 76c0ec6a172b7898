namespace OmicsScreen.Data;

/// <summary>
/// The panel was read, but it cannot be screened as it is (a single class, a class of one
/// sample, every feature constant). Kept apart from <see cref="PanelInputException"/>, a file
/// that cannot be read, so every verb gives the same exit code as `check` for the same panel.
/// </summary>
public sealed class PanelNotScreenableException : Exception
{
    public PanelNotScreenableException(string message, string filePath) : base(message) => FilePath = filePath;

    public string FilePath { get; }
}
