namespace Lightfold.Catalog;

/// <summary>Writes files under a temporary name and renames them when complete, so no finished-looking partial file is ever left.</summary>
public static class AtomicFile
{
    static long counter;

    /// <summary>A fresh temporary name for writing <paramref name="path"/> (unique per process and call).</summary>
    public static string TempName(string path) => path + $".partial-{Environment.ProcessId}-{Interlocked.Increment(ref counter)}";

    /// <summary>Writes <paramref name="text"/> to <paramref name="path"/> atomically.</summary>
    /// <exception cref="InputException">The folder does not exist or cannot be written.</exception>
    public static void WriteAllText(string path, string text)
    {
        string full = Path.GetFullPath(path);
        string temp = TempName(full);
        try
        {
            File.WriteAllText(temp, text);
            File.Move(temp, full, overwrite: true);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            TryDelete(temp);
            throw new InputException($"cannot write '{path}': {e.Message}");
        }
    }

    /// <summary>Renames a completed temporary file onto its final name.</summary>
    public static void Commit(string temp, string path) => File.Move(temp, path, overwrite: true);

    /// <summary>Deletes a file if it exists, ignoring failures (cleanup paths).</summary>
    public static void TryDelete(string path)
    {
        try
        {
            if (File.Exists(path)) File.Delete(path);
        }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException)
        {
            // Best effort.
        }
    }
}
