using Parquet;
using Parquet.Schema;

namespace Lightfold.Catalog;

/// <summary>Columns of one table read from a catalog folder (all shard parts), in part order.</summary>
public sealed class TableColumns
{
    readonly Dictionary<string, Array> columns;

    internal TableColumns(Dictionary<string, Array> columns, int rows, IReadOnlyDictionary<string, string> metadata)
    {
        this.columns = columns;
        Rows = rows;
        Metadata = metadata;
    }

    /// <summary>Rows read.</summary>
    public int Rows { get; }

    /// <summary>Key-value metadata of the first part.</summary>
    public IReadOnlyDictionary<string, string> Metadata { get; }

    /// <summary>Whether a column was read.</summary>
    public bool Has(string name) => columns.ContainsKey(name);

    /// <summary>A double column.</summary>
    public double[] D(string name) => (double[])columns[name];
    /// <summary>A long column.</summary>
    public long[] L(string name) => (long[])columns[name];
    /// <summary>An int column.</summary>
    public int[] I(string name) => (int[])columns[name];
    /// <summary>A bool column.</summary>
    public bool[] B(string name) => (bool[])columns[name];
    /// <summary>A string column.</summary>
    public string[] S(string name) => (string[])columns[name];
}

/// <summary>Reads tables of a catalog folder (every <c>TABLE/*/part.parquet</c>), optionally only some systems.</summary>
/// <remarks>Row groups whose system_id statistics exclude the wanted ids are skipped, so reading one system of a large
/// catalog does not decode the rest. Bad folders are an <see cref="InputException"/>.</remarks>
public static class CatalogReader
{
    /// <summary>The part files of a table, sorted by shard.</summary>
    public static string[] Parts(string directory, string table)
    {
        string folder = Path.Combine(directory, table);
        if (!Directory.Exists(directory)) throw new InputException($"catalog folder '{directory}' does not exist");
        if (!Directory.Exists(folder)) throw new InputException($"catalog '{directory}' has no '{table}' table");
        var parts = Directory.GetFiles(folder, "part.parquet", SearchOption.AllDirectories).Order(StringComparer.Ordinal).ToArray();
        if (parts.Length == 0) throw new InputException($"catalog '{directory}' has no finished parts of '{table}'");
        return parts;
    }

    /// <summary>Reads <paramref name="names"/> (all columns when null) of a table, keeping rows whose system id is in [minId, maxId].</summary>
    public static TableColumns Read(string directory, string table, IReadOnlyList<string>? names = null, long minId = long.MinValue, long maxId = long.MaxValue)
        => ReadAsync(directory, table, names, minId, maxId).GetAwaiter().GetResult();

    static async Task<TableColumns> ReadAsync(string directory, string table, IReadOnlyList<string>? names, long minId, long maxId)
    {
        var lists = new Dictionary<string, Accumulator>();
        Dictionary<string, string>? metadata = null;
        int rows = 0;
        foreach (string part in Parts(directory, table))
        {
            ParquetReader reader;
            try { reader = await ParquetReader.CreateAsync(part); }
            catch (Exception e) when (e is not OutOfMemoryException) { throw new InputException($"'{part}' is not a readable Parquet file ({e.GetType().Name}: {InputException.Shown(e.Message, 120)})"); }
            await using var _ = reader;
            metadata ??= new Dictionary<string, string>(reader.CustomMetadata ?? new Dictionary<string, string>());
            var fields = reader.Schema.GetDataFields();
            var wanted = names is null ? fields : names.Select(n => fields.FirstOrDefault(f => f.Name == n) ?? throw new InputException($"'{part}' has no column '{n}'")).ToArray();
            var idField = fields.FirstOrDefault(f => f.Name == Columns.SystemId);
            foreach (var f in wanted) if (!lists.ContainsKey(f.Name)) lists[f.Name] = Accumulator.For(f.ClrType);
            for (int g = 0; g < reader.RowGroupCount; g++)
            {
                using var rg = reader.OpenRowGroupReader(g);
                int n = checked((int)rg.RowCount);
                long[]? ids = null;
                if (idField is not null && (minId != long.MinValue || maxId != long.MaxValue))
                {
                    var stats = rg.GetStatistics(idField);
                    if (stats?.MinValue is long lo && stats.MaxValue is long hi && (hi < minId || lo > maxId)) continue;
                    ids = new long[n];
                    await rg.ReadAsync<long>(idField, ids);
                }
                foreach (var f in wanted)
                    lists[f.Name].Append(await ReadColumn(rg, f, n), ids, minId, maxId);
                rows += ids is null ? n : ids.Count(id => id >= minId && id <= maxId);
            }
        }
        var arrays = lists.ToDictionary(kv => kv.Key, kv => kv.Value.ToArray());
        return new TableColumns(arrays, rows, metadata ?? []);
    }

    abstract class Accumulator
    {
        public abstract void Append(Array values, long[]? ids, long minId, long maxId);
        public abstract Array ToArray();

        public static Accumulator For(Type t)
            => t == typeof(double) ? new Typed<double>() : t == typeof(long) ? new Typed<long>() : t == typeof(int) ? new Typed<int>()
             : t == typeof(bool) ? new Typed<bool>() : IsText(t) ? new Typed<string>()
             : throw new InputException($"unsupported column type {t.Name}");

        sealed class Typed<T> : Accumulator
        {
            T[] data = new T[1024];
            int count;

            public override void Append(Array values, long[]? ids, long minId, long maxId)
            {
                var v = (T[])values;
                if (count + v.Length > data.Length) Array.Resize(ref data, Math.Max(2 * data.Length, count + v.Length));
                if (ids is null)
                {
                    Array.Copy(v, 0, data, count, v.Length);
                    count += v.Length;
                    return;
                }
                for (int i = 0; i < v.Length; i++)
                    if (ids[i] >= minId && ids[i] <= maxId) data[count++] = v[i];
            }

            public override Array ToArray() => data[..count];
        }
    }

    /// <summary>Parquet.Net reports text columns as string or ReadOnlyMemory&lt;char&gt;.</summary>
    internal static bool IsText(Type t) => t == typeof(string) || t == typeof(ReadOnlyMemory<char>);

    static async Task<Array> ReadColumn(ParquetRowGroupReader rg, DataField f, int n)
    {
        if (f.ClrType == typeof(double)) { var a = new double[n]; await rg.ReadAsync<double>(f, a); return a; }
        if (f.ClrType == typeof(long)) { var a = new long[n]; await rg.ReadAsync<long>(f, a); return a; }
        if (f.ClrType == typeof(int)) { var a = new int[n]; await rg.ReadAsync<int>(f, a); return a; }
        if (f.ClrType == typeof(bool)) { var a = new bool[n]; await rg.ReadAsync<bool>(f, a); return a; }
        if (IsText(f.ClrType)) { var a = new string?[n]; await rg.ReadAsync(f, a.AsMemory()); return a.Select(s => s ?? "").ToArray(); }
        throw new InputException($"column '{f.Name}' has unsupported type {f.ClrType.Name}");
    }
}
