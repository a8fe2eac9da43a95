using DuckDB.NET.Data;

namespace Lightfold.Tests.Support;

/// <summary>DuckDB as a second, independent Parquet reader for tests.</summary>
public sealed class DuckDb : IDisposable
{
    readonly DuckDBConnection connection = new("DataSource=:memory:");

    /// <summary>Opens an in-memory database.</summary>
    public DuckDb() => connection.Open();

    /// <summary>All rows of a query as object arrays.</summary>
    public List<object?[]> Rows(string sql)
    {
        using var command = connection.CreateCommand();
        command.CommandText = sql;
        using var reader = command.ExecuteReader();
        var rows = new List<object?[]>();
        while (reader.Read())
        {
            var row = new object?[reader.FieldCount];
            for (int i = 0; i < row.Length; i++) row[i] = reader.IsDBNull(i) ? null : reader.GetValue(i);
            rows.Add(row);
        }
        return rows;
    }

    /// <summary>The single value of a scalar query.</summary>
    public T Scalar<T>(string sql)
    {
        object value = Rows(sql)[0][0]!;
        if (value is System.Numerics.BigInteger big) value = (decimal)big;   // DuckDB sums integers as HUGEINT
        return (T)Convert.ChangeType(value, typeof(T), System.Globalization.CultureInfo.InvariantCulture);
    }

    /// <summary>The file key-value metadata of one Parquet file as strings.</summary>
    public Dictionary<string, string> Metadata(string file)
        => Rows($"SELECT decode(key), decode(value) FROM parquet_kv_metadata('{file}')").ToDictionary(r => (string)r[0]!, r => (string)r[1]!);

    /// <summary>The glob that reads every part of a table in a catalog folder.</summary>
    public static string Table(string dir, string table) => $"read_parquet('{Path.Combine(dir, table)}/*/part.parquet', hive_partitioning = false)";

    /// <inheritdoc/>
    public void Dispose() => connection.Dispose();
}
