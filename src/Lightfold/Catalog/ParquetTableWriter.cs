using Parquet;

namespace Lightfold.Catalog;

/// <summary>Streams row groups of one table into a Parquet file that appears under its final name only when complete.</summary>
/// <remarks>
/// Written to <c>path.partial-PID</c> and renamed by <see cref="CommitAsync"/>; disposing without committing deletes
/// the partial file, so a failed or cancelled run leaves nothing that looks finished. One row group per
/// <see cref="WriteAsync"/> (Parquet.Net 6, column by column from the buffer's arrays).
/// </remarks>
public sealed class ParquetTableWriter : IAsyncDisposable
{
    readonly string path, temp;
    readonly FileStream stream;
    readonly ParquetWriter writer;
    bool committed, disposed;

    ParquetTableWriter(string path, string temp, FileStream stream, ParquetWriter writer)
    {
        this.path = path;
        this.temp = temp;
        this.stream = stream;
        this.writer = writer;
    }

    /// <summary>Rows written so far.</summary>
    public long RowsWritten { get; private set; }

    /// <summary>Opens a writer for <paramref name="buffer"/>'s schema with file key-value metadata.</summary>
    public static async Task<ParquetTableWriter> CreateAsync(string path, TableBuffer buffer, IReadOnlyDictionary<string, string> metadata, CancellationToken ct)
    {
        Directory.CreateDirectory(Path.GetDirectoryName(Path.GetFullPath(path))!);
        string temp = AtomicFile.TempName(path);
        var stream = new FileStream(temp, FileMode.Create, FileAccess.ReadWrite, FileShare.None, 1 << 20);
        try
        {
            var writer = await ParquetWriter.CreateAsync(buffer.Schema, stream, null, false, ct);
            writer.CustomMetadata = metadata.ToDictionary(kv => kv.Key, kv => kv.Value);
            return new ParquetTableWriter(path, temp, stream, writer);
        }
        catch
        {
            await stream.DisposeAsync();
            AtomicFile.TryDelete(temp);
            throw;
        }
    }

    /// <summary>Writes the buffer's rows as one row group (nothing if the buffer is empty).</summary>
    public async Task WriteAsync(TableBuffer buffer, CancellationToken ct)
    {
        if (buffer.Count == 0) return;
        using (var rowGroup = writer.CreateRowGroup())
        {
            foreach (var column in buffer.Columns)
                await column.WriteAsync(rowGroup, buffer.Count, ct);
            rowGroup.CompleteValidate();
        }
        RowsWritten += buffer.Count;
    }

    /// <summary>Finishes the file and moves it to its final name.</summary>
    public async Task CommitAsync()
    {
        await writer.DisposeAsync();
        await stream.FlushAsync();
        await stream.DisposeAsync();
        disposed = true;
        AtomicFile.Commit(temp, path);
        committed = true;
    }

    /// <inheritdoc/>
    public async ValueTask DisposeAsync()
    {
        if (!disposed)
        {
            try { await writer.DisposeAsync(); } catch (Exception e) when (e is IOException or InvalidOperationException or ObjectDisposedException) { }
            await stream.DisposeAsync();
            disposed = true;
        }
        if (!committed) AtomicFile.TryDelete(temp);
    }
}
