using System.Globalization;
using Parquet;
using Parquet.Schema;

namespace Lightfold.Catalog;

/// <summary>Columns read from a user table: numbers by name, and any requested text columns.</summary>
public sealed record TableData(IReadOnlyDictionary<string, double[]?> Numbers, IReadOnlyDictionary<string, string[]> Text)
{
    /// <summary>A required numeric column.</summary>
    public double[] this[string name] => Numbers[name]!;
}

/// <summary>Reads user tables (CSV or Parquet) of named numeric columns, with errors that name the file, row and column.</summary>
/// <remarks>CSV: a header line of column names, comma-separated values, '#' starts a comment line; extra columns are
/// ignored. Parquet: numeric columns (double, float, int, long) read by name. Every value must be a finite number, except
/// in columns declared as allowing missing values (empty or NaN → NaN).</remarks>
public static class NumericTable
{
    /// <summary>Largest file accepted [bytes] (a guard against pointing at the wrong file).</summary>
    public const long MaxBytes = 2L << 30;

    /// <summary>The named columns of the table at <paramref name="path"/>; <paramref name="optional"/> columns may be absent (null).</summary>
    /// <exception cref="InputException">Missing file or column, unparsable or non-finite value, empty table.</exception>
    public static TableData Read(string path, IReadOnlyList<string> required, IReadOnlyList<string>? optional = null, IReadOnlyList<string>? textColumns = null,
        IReadOnlyList<string>? missingAllowed = null)
    {
        var missing = missingAllowed ?? [];
        optional ??= [];
        textColumns ??= [];
        if (string.IsNullOrWhiteSpace(path)) throw new InputException("table path is empty");
        if (!File.Exists(path)) throw new InputException($"table '{path}' does not exist");
        if (new FileInfo(path).Length > MaxBytes) throw new InputException($"table '{path}' is larger than {MaxBytes >> 30} GiB");
        var result = path.EndsWith(".parquet", StringComparison.OrdinalIgnoreCase) ? ReadParquet(path, required, optional, textColumns, missing) : ReadCsv(path, required, optional, textColumns, missing);
        int rows = result.Numbers[required[0]]!.Length;
        if (rows == 0) throw new InputException($"table '{path}' has no rows");
        return result;
    }

    static TableData ReadCsv(string path, IReadOnlyList<string> required, IReadOnlyList<string> optional, IReadOnlyList<string> textColumns, IReadOnlyList<string> missing)
    {
        string[] lines;
        try { lines = File.ReadAllLines(path); }
        catch (Exception e) when (e is IOException or UnauthorizedAccessException) { throw new InputException($"table '{path}' cannot be read: {e.Message}"); }
        int headerLine = Array.FindIndex(lines, l => l.Trim().Length > 0 && !l.TrimStart().StartsWith('#'));
        if (headerLine < 0) throw new InputException($"table '{path}' is empty (no header line)");
        string[] header = lines[headerLine].Split(',').Select(h => h.Trim().Trim('"')).ToArray();
        var index = new Dictionary<string, int>(StringComparer.OrdinalIgnoreCase);
        for (int i = 0; i < header.Length; i++) index.TryAdd(header[i], i);
        foreach (string name in required.Concat(textColumns))
            if (!index.ContainsKey(name)) throw new InputException($"table '{path}': missing column '{name}' (header: {string.Join(",", header)})");
        var names = required.Concat(optional.Where(index.ContainsKey)).ToList();
        var lists = names.ToDictionary(n => n, _ => new List<double>());
        var texts = textColumns.ToDictionary(n => n, _ => new List<string>());
        for (int li = headerLine + 1; li < lines.Length; li++)
        {
            string line = lines[li];
            if (line.Trim().Length == 0 || line.TrimStart().StartsWith('#')) continue;
            string[] cells = line.Split(',');
            foreach (string name in textColumns)
            {
                int c = index[name];
                if (c >= cells.Length) throw new InputException($"table '{path}' line {li + 1}: column '{name}' is missing ({cells.Length} values)");
                texts[name].Add(cells[c].Trim().Trim('"'));
            }
            foreach (string name in names)
            {
                int c = index[name];
                if (c >= cells.Length) throw new InputException($"table '{path}' line {li + 1}: column '{name}' is missing ({cells.Length} values)");
                string cell = cells[c].Trim().Trim('"');
                if (missing.Contains(name) && (cell.Length == 0 || cell.Equals("nan", StringComparison.OrdinalIgnoreCase)))
                {
                    lists[name].Add(double.NaN);
                    continue;
                }
                if (!double.TryParse(cell, NumberStyles.Float, CultureInfo.InvariantCulture, out double v) || !double.IsFinite(v))
                    throw new InputException($"table '{path}' line {li + 1}: column '{name}' = '{InputException.Shown(cell)}' is not a finite number");
                lists[name].Add(v);
            }
        }
        var result = new Dictionary<string, double[]?>(StringComparer.OrdinalIgnoreCase);
        foreach (string name in required.Concat(optional)) result[name] = lists.TryGetValue(name, out var l) ? l.ToArray() : null;
        return new TableData(result, texts.ToDictionary(kv => kv.Key, kv => kv.Value.ToArray()));
    }

    static TableData ReadParquet(string path, IReadOnlyList<string> required, IReadOnlyList<string> optional, IReadOnlyList<string> textColumns, IReadOnlyList<string> missing)
    {
        try
        {
            return ReadParquetAsync(path, required, optional, textColumns, missing).GetAwaiter().GetResult();
        }
        catch (InputException) { throw; }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // Parquet.Net reports malformed files with a variety of exception types (overflow, format, index…).
            throw new InputException($"table '{path}' is not a readable Parquet file ({e.GetType().Name}: {InputException.Shown(e.Message, 120)})");
        }
    }

    static async Task<TableData> ReadParquetAsync(string path, IReadOnlyList<string> required, IReadOnlyList<string> optional, IReadOnlyList<string> textColumns, IReadOnlyList<string> missing)
    {
        await using var reader = await ParquetReader.CreateAsync(path);
        var fields = reader.Schema.GetDataFields().ToDictionary(f => f.Name, StringComparer.OrdinalIgnoreCase);
        foreach (string name in required.Concat(textColumns))
            if (!fields.ContainsKey(name)) throw new InputException($"table '{path}': missing column '{name}'");
        var texts = textColumns.ToDictionary(n => n, _ => new List<string>());
        var lists = new Dictionary<string, List<double>>(StringComparer.OrdinalIgnoreCase);
        foreach (string name in required.Concat(optional).Where(fields.ContainsKey)) lists[name] = [];
        long rowOffset = 0;
        for (int g = 0; g < reader.RowGroupCount; g++)
        {
            using var rg = reader.OpenRowGroupReader(g);
            int n = checked((int)rg.RowCount);
            foreach (var (name, list) in texts)
            {
                var field = fields[name];
                if (!CatalogReader.IsText(field.ClrType)) throw new InputException($"table '{path}': column '{name}' must be text");
                var values = new string?[n];
                await rg.ReadAsync(field, values.AsMemory());
                for (int i = 0; i < n; i++)
                    list.Add(values[i] ?? throw new InputException($"table '{path}' row {rowOffset + i + 1}: column '{name}' is empty"));
            }
            foreach (var (name, list) in lists)
            {
                var field = fields[name];
                double[] values = await ReadNumeric(rg, field, n, path);
                for (int i = 0; i < n; i++)
                    if (!double.IsFinite(values[i]) && !(double.IsNaN(values[i]) && missing.Contains(name))) throw new InputException($"table '{path}' row {rowOffset + i + 1}: column '{name}' is not a finite number");
                list.AddRange(values);
            }
            rowOffset += n;
        }
        var result = new Dictionary<string, double[]?>(StringComparer.OrdinalIgnoreCase);
        foreach (string name in required.Concat(optional)) result[name] = lists.TryGetValue(name, out var l) ? l.ToArray() : null;
        return new TableData(result, texts.ToDictionary(kv => kv.Key, kv => kv.Value.ToArray()));
    }

    static async Task<double[]> ReadNumeric(ParquetRowGroupReader rg, DataField field, int n, string path)
    {
        var t = field.ClrType;
        if (field.IsNullable) throw new InputException($"table '{path}': column '{field.Name}' is nullable; write it without nulls");
        if (t == typeof(double)) { var a = new double[n]; await rg.ReadAsync<double>(field, a); return a; }
        if (t == typeof(float)) { var a = new float[n]; await rg.ReadAsync<float>(field, a); return a.Select(v => (double)v).ToArray(); }
        if (t == typeof(int)) { var a = new int[n]; await rg.ReadAsync<int>(field, a); return a.Select(v => (double)v).ToArray(); }
        if (t == typeof(long)) { var a = new long[n]; await rg.ReadAsync<long>(field, a); return a.Select(v => (double)v).ToArray(); }
        throw new InputException($"table '{path}': column '{field.Name}' has type {t.Name}, expected a number");
    }
}
