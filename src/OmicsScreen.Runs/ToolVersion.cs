using System.Reflection;

namespace OmicsScreen.Runs;

/// <summary>The version this program stamps into manifests, locked panels and run identities.</summary>
public static class ToolVersion
{
    /// <summary>
    /// The informational version (0.1.0+commit), read once. Every project of the solution is built
    /// with the same version properties, so this assembly's is the program's.
    /// </summary>
    public static string Current { get; } =
        typeof(ToolVersion).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";
}
