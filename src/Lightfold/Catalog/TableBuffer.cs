using Parquet;
using Parquet.Schema;

namespace Lightfold.Catalog;

/// <summary>One column of a <see cref="TableBuffer"/>: a typed array, written to Parquet as one column chunk.</summary>
public abstract class ColumnBuffer
{
    /// <summary>Column name (from <see cref="Columns"/>).</summary>
    public abstract string Name { get; }
    /// <summary>Parquet field.</summary>
    public abstract DataField Field { get; }
    internal abstract Task WriteAsync(ParquetRowGroupWriter rowGroup, int rows, CancellationToken ct);
    internal abstract void EnsureCapacity(int rows);
}

/// <summary>A column held in a growable array of <typeparamref name="T"/>.</summary>
public abstract class ArrayColumn<T> : ColumnBuffer
{
    readonly DataField<T> dataField;

    /// <summary>Creates the column with an initial capacity.</summary>
    protected ArrayColumn(string name, int capacity)
    {
        dataField = new DataField<T>(name, false);
        Values = new T[capacity];
    }

    /// <summary>The values; rows [0, table count) are written.</summary>
    public T[] Values { get; private set; }

    /// <summary>The Parquet field.</summary>
    protected DataField<T> TypedField => dataField;

    /// <inheritdoc/>
    public override string Name => dataField.Name;
    /// <inheritdoc/>
    public override DataField Field => dataField;

    internal override void EnsureCapacity(int rows)
    {
        if (rows <= Values.Length) return;
        var bigger = new T[Math.Max(rows, 2 * Values.Length)];
        Array.Copy(Values, bigger, Values.Length);
        Values = bigger;
    }
}

/// <summary>A column of unmanaged values (double, long, int, bool, float).</summary>
public sealed class ValueColumn<T>(string name, int capacity) : ArrayColumn<T>(name, capacity) where T : struct
{
    internal override Task WriteAsync(ParquetRowGroupWriter rowGroup, int rows, CancellationToken ct)
        => rowGroup.WriteAsync<T>(TypedField, new ReadOnlyMemory<T>(Values, 0, rows), null, null, ct);
}

/// <summary>A column of strings (short categorical values such as a transient type).</summary>
public sealed class TextColumn(string name, int capacity) : ArrayColumn<string>(name, capacity)
{
    internal override Task WriteAsync(ParquetRowGroupWriter rowGroup, int rows, CancellationToken ct)
        => rowGroup.WriteAsync(TypedField, new ArraySegment<string>(Values, 0, rows), null);
}

/// <summary>Struct-of-arrays rows of one table, reused batch after batch so memory stays flat.</summary>
public sealed class TableBuffer
{
    readonly Dictionary<string, ColumnBuffer> byName;

    /// <summary>Creates a buffer with the given columns, in schema order.</summary>
    public TableBuffer(string table, IReadOnlyList<ColumnBuffer> columns)
    {
        Table = table;
        Columns = columns;
        byName = columns.ToDictionary(c => c.Name);
        Schema = new ParquetSchema(columns.Select(c => (Field)c.Field).ToArray());
    }

    /// <summary>Table name (file folder).</summary>
    public string Table { get; }

    /// <summary>Columns in schema order.</summary>
    public IReadOnlyList<ColumnBuffer> Columns { get; }

    /// <summary>The Parquet schema.</summary>
    public ParquetSchema Schema { get; }

    /// <summary>Rows filled.</summary>
    public int Count { get; set; }

    /// <summary>Makes room for <paramref name="rows"/> rows.</summary>
    public void EnsureCapacity(int rows)
    {
        foreach (var c in Columns) c.EnsureCapacity(rows);
    }

    /// <summary>The double column called <paramref name="name"/>.</summary>
    public double[] D(string name) => ((ValueColumn<double>)byName[name]).Values;
    /// <summary>The long column called <paramref name="name"/>.</summary>
    public long[] L(string name) => ((ValueColumn<long>)byName[name]).Values;
    /// <summary>The int column called <paramref name="name"/>.</summary>
    public int[] I(string name) => ((ValueColumn<int>)byName[name]).Values;
    /// <summary>The bool column called <paramref name="name"/>.</summary>
    public bool[] B(string name) => ((ValueColumn<bool>)byName[name]).Values;
    /// <summary>The string column called <paramref name="name"/>.</summary>
    public string[] S(string name) => ((TextColumn)byName[name]).Values;
}
