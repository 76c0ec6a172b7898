using System.Security.Cryptography;
using System.Text;
using System.Text.Json.Nodes;
using OmicsScreen.Data;
using OmicsScreen.Screening.Locking;

namespace OmicsScreen.Runs.Locking;

/// <summary>
/// Whether a cohort given to `apply` is, or shares samples with, the discovery data the panel was
/// chosen on: its performance would then measure fit, not validation. The locked panel records
/// each discovery input's SHA-256 and the SHA-256 of every discovery sample id (hashed, so the
/// file does not list ids in clear text; this is not anonymisation).
/// </summary>
public static class DiscoveryOverlap
{
    /// <summary>Key of the hashed discovery sample ids in the locked panel's content.</summary>
    public const string SampleIdHashesKey = "discovery_sample_id_sha256";

    public static JsonArray SampleIdHashes(IEnumerable<string> sampleIds) =>
        new(sampleIds.Select(Hash).Order(StringComparer.Ordinal).Select(h => (JsonNode)JsonValue.Create(h)).ToArray());

    public static HashSet<string>? ReadSampleIdHashes(JsonObject content) =>
        content[SampleIdHashesKey] is JsonArray array
            ? array.Select(node => node?.GetValue<string>() ?? "").ToHashSet(StringComparer.Ordinal)
            : null;

    /// <summary>The warnings for one cohort: the same file as a discovery input, and samples whose ids the discovery data had.</summary>
    public static List<string> Warnings(LockedPanel model, HashSet<string>? discoveryIdHashes, IReadOnlyList<InputFileRecord> inputs,
        IReadOnlyList<string> sampleIds) => Warnings(model.Provenance, discoveryIdHashes, inputs, sampleIds);

    /// <summary>As above, for a locked panel of any outcome kind (its provenance holds the discovery inputs' SHA-256).</summary>
    public static List<string> Warnings(LockProvenance provenance, HashSet<string>? discoveryIdHashes, IReadOnlyList<InputFileRecord> inputs,
        IReadOnlyList<string> sampleIds)
    {
        var warnings = new List<string>();
        // With the discovery ids recorded, a shared file whose scored samples were all left out of
        // the screen (a held-out centre of one matrix, chosen by the sample sheet) is said to be so.
        int shared = discoveryIdHashes is null || discoveryIdHashes.Count == 0 ? -1 : sampleIds.Count(id => discoveryIdHashes.Contains(Hash(id)));
        foreach (var input in inputs)
            foreach (var (name, sha256) in provenance.InputSha256)
                if (string.Equals(input.Sha256, sha256, StringComparison.OrdinalIgnoreCase))
                    warnings.Add(shared == 0
                        ? FormattableString.Invariant($"{Path.GetFileName(input.Path)} is the discovery file '{name}' itself (same SHA-256), but none of the {sampleIds.Count} samples scored here has the id of a discovery sample: ")
                            + "they are a part of the file the screen left out. Their performance means validation only if they were collected, measured and processed apart from the discovery samples."
                        : $"{Path.GetFileName(input.Path)} is the discovery file '{name}' itself (same SHA-256): the panel was chosen on these samples, "
                            + "so its performance here measures fit, not validation. Apply the panel to samples that were not screened.");
        if (shared < 0) return warnings;
        // Counted, not listed: the warning also goes into the report, which shows no sample id unless asked to.
        if (shared > 0 && warnings.Count == 0)
            warnings.Add(FormattableString.Invariant($"{shared} of {sampleIds.Count} samples have the ids of discovery samples (scores.tsv lists every id): ")
                + "if they are the same samples, their scores and any performance that includes them are optimistic. Remove them, or apply the panel to a cohort that was not screened.");
        return warnings;
    }

    private static string Hash(string sampleId) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(sampleId)));
}
