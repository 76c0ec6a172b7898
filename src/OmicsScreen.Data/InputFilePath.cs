namespace OmicsScreen.Data;

/// <summary>
/// Checks that an input path names a readable file before any reader opens it, so a folder given
/// by mistake is called a folder rather than "does not exist".
/// </summary>
internal static class InputFilePath
{
    /// <param name="path">The path as the user gave it.</param>
    /// <param name="role">What the file is for, in the user's words: "matrix" or "sample sheet".</param>
    public static void EnsureFile(string path, string role)
    {
        if (Directory.Exists(path))
            throw PanelInputException.At(path, null, null, "is a folder, not a file.",
                $"Give the path of the {role} file itself, not of the folder holding it.");
        if (!File.Exists(path))
            throw PanelInputException.At(path, null, null, "does not exist.", $"Check the {role} path.");
    }
}
