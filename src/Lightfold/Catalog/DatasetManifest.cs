using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using System.Text.Json.Nodes;

namespace Lightfold.Catalog;

/// <summary>Identity and completion state of a dataset folder: <c>manifest.json</c> plus one marker per finished shard.</summary>
/// <remarks>
/// The manifest names the configuration (SHA-256 of the resolved JSON), seed, tool and schema versions and shard
/// count. Shards never write to a shared file once it exists: each finished shard adds <c>manifest.d/shard-KKKK.json</c>
/// (atomically), so array tasks on a cluster need no coordination. A rerun with the same inputs skips finished shards;
/// one with different inputs into the same folder is refused.
/// </remarks>
public static class DatasetManifest
{
    /// <summary>SHA-256 (hex) of the resolved configuration.</summary>
    public static string ConfigHash(string resolvedJson)
        => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(resolvedJson)));

    /// <summary>The identity a dataset folder must carry for this run.</summary>
    public static JsonObject Identity(string resolvedJson, ulong seed, int shards, string toolVersion) => new()
    {
        ["format"] = "lightfold-catalog",
        ["schema_version"] = CatalogSchema.Version,
        ["tool_version"] = toolVersion,
        ["config_sha256"] = ConfigHash(resolvedJson),
        ["seed"] = seed,
        ["shards"] = shards,
    };

    /// <summary>Creates the manifest, or checks that an existing one matches; throws <see cref="InputException"/> if not.</summary>
    public static void EnsureMatches(string directory, JsonObject identity)
    {
        if (File.Exists(directory)) throw new InputException($"--out '{directory}' is a file, not a folder");
        try { Directory.CreateDirectory(directory); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { throw new InputException($"--out '{directory}' cannot be created: {e.Message}"); }
        string path = Path.Combine(directory, "manifest.json");
        string text = identity.ToJsonString(new JsonSerializerOptions { WriteIndented = true });
        if (!File.Exists(path))
        {
            // Create-if-absent: several shards may race here; the loser reads and compares.
            string temp = AtomicFile.TempName(path);
            File.WriteAllText(temp, text);
            try { File.Move(temp, path, overwrite: false); }
            catch (IOException) { AtomicFile.TryDelete(temp); }
        }
        JsonObject existing;
        try
        {
            existing = JsonNode.Parse(File.ReadAllText(path))!.AsObject();
        }
        catch (Exception e) when (e is JsonException or InvalidOperationException)
        {
            throw new InputException($"'{path}' exists but is not a Lightfold manifest; choose another --out folder");
        }
        foreach (string key in new[] { "format", "schema_version", "config_sha256", "seed", "shards" })
        {
            string mine = identity[key]?.ToJsonString() ?? "", theirs = existing[key]?.ToJsonString() ?? "(missing)";
            if (mine != theirs)
                throw new InputException($"'{directory}' holds a catalog made with different inputs ({key}: {theirs} there, {mine} now); use a new --out folder or delete it");
        }
    }

    /// <summary>Deletes leftover temporary files (from a killed run) in one shard folder.</summary>
    public static void RemoveStalePartials(string shardFolder)
    {
        if (!Directory.Exists(shardFolder)) return;
        foreach (string file in Directory.GetFiles(shardFolder, "*.partial-*")) AtomicFile.TryDelete(file);
    }

    static string MarkerPath(string directory, int shard) => Path.Combine(directory, "manifest.d", $"shard-{shard:D4}.json");

    /// <summary>Whether shard <paramref name="shard"/> finished earlier.</summary>
    public static bool IsComplete(string directory, int shard) => File.Exists(MarkerPath(directory, shard));

    /// <summary>Marks a shard finished (after all its files were committed).</summary>
    public static void MarkComplete(string directory, int shard, JsonObject details)
    {
        string path = MarkerPath(directory, shard);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        AtomicFile.WriteAllText(path, details.ToJsonString(new JsonSerializerOptions { WriteIndented = true }));
    }
}
