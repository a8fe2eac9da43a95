using Lightfold.Lensing;

namespace Lightfold.Catalog;

/// <summary>The cross-section lookup table kept on disk between runs ($LIGHTFOLD_CACHE_DIR, else $XDG_CACHE_HOME/lightfold,
/// else ~/.cache/lightfold), so only the first run pays the few seconds of building it.</summary>
/// <remarks>The file name carries <see cref="CrossSectionTable.VersionName"/>; unreadable or mismatched files are rebuilt,
/// and failing to write only means the next process builds it again.</remarks>
public static class CrossSectionTableCache
{
    static readonly Lazy<CrossSectionTable> shared = new(LoadOrBuild, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>The process-wide table, from the disk cache when possible.</summary>
    public static CrossSectionTable Shared => shared.Value;

    /// <summary>The per-user cache folder.</summary>
    public static string? Folder()
    {
        string? root = Environment.GetEnvironmentVariable("LIGHTFOLD_CACHE_DIR");
        if (!string.IsNullOrEmpty(root)) return root;
        string? xdg = Environment.GetEnvironmentVariable("XDG_CACHE_HOME");
        string home = Environment.GetFolderPath(Environment.SpecialFolder.UserProfile);
        return !string.IsNullOrEmpty(xdg) ? Path.Combine(xdg, "lightfold") : string.IsNullOrEmpty(home) ? null : Path.Combine(home, ".cache", "lightfold");
    }

    static CrossSectionTable LoadOrBuild()
    {
        string? folder = Folder();
        string? path = folder is null ? null : Path.Combine(folder, CrossSectionTable.VersionName + ".bin");
        try
        {
            if (path is not null && File.Exists(path))
            {
                byte[] bytes = File.ReadAllBytes(path);
                if (bytes.Length % sizeof(float) == 0)
                {
                    var values = new float[bytes.Length / sizeof(float)];
                    Buffer.BlockCopy(bytes, 0, values, 0, bytes.Length);
                    if (CrossSectionTable.FromArray(values) is { } loaded) return loaded;
                }
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Rebuild below.
        }
        var table = CrossSectionTable.Build();
        try
        {
            if (path is not null)
            {
                Directory.CreateDirectory(folder!);
                float[] values = table.ToArray();
                var bytes = new byte[values.Length * sizeof(float)];
                Buffer.BlockCopy(values, 0, bytes, 0, bytes.Length);
                string temp = AtomicFile.TempName(path);
                File.WriteAllBytes(temp, bytes);
                AtomicFile.Commit(temp, path);
            }
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // No cache this time.
        }
        return table;
    }
}
