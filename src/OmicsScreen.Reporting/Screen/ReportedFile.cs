namespace OmicsScreen.Reporting.Screen;

/// <summary>A file the report vouches for: what it is, its name as the user knows it, and the SHA-256 of its bytes.</summary>
/// <param name="Role">What the file is to the run (for example "matrix", "sample sheet", "shortlist table").</param>
/// <param name="Name">The path or file name as given; untrusted text, encoded on output.</param>
/// <param name="Sha256">Lower-case hex SHA-256 of the file content.</param>
public sealed record ReportedFile(string Role, string Name, string Sha256);
