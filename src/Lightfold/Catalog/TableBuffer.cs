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

/// <summary>A column of unmanaged values (double, long, int, bool, float).</summary>
public sealed class ValueColumn<T> : ColumnBuffer where T : struct
{
    readonly DataField<T> dataField;

    /// <summary>Creates the column with an initial capacity.</summary>
    public ValueColumn(string name, int capacity)
    {
        dataField = new DataField<T>(name, false);
        Values = new T[capacity];
    }

    /// <summary>The values; rows [0, table count) are written.</summary>
    public T[] Values { get; private set; }

    /// <inheritdoc/>
    public override string Name => dataField.Name;
    /// <inheritdoc/>
    public override DataField Field => dataField;

    internal override Task WriteAsync(ParquetRowGroupWriter rowGroup, int rows, CancellationToken ct)
        => rowGroup.WriteAsync<T>(dataField, new ReadOnlyMemory<T>(Values, 0, rows), null, null, ct);

    internal override void EnsureCapacity(int rows)
    {
        if (rows > Values.Length)
        {
            var bigger = new T[Math.Max(rows, 2 * Values.Length)];
            Array.Copy(Values, bigger, Values.Length);
            Values = bigger;
        }
    }
}

/// <summary>A column of strings (short categorical values such as a transient type).</summary>
public sealed class TextColumn : ColumnBuffer
{
    readonly DataField<string> dataField;

    /// <summary>Creates the column.</summary>
    public TextColumn(string name, int capacity)
    {
        dataField = new DataField<string>(name, false);
        Values = new string[capacity];
    }

    /// <summary>The values.</summary>
    public string[] Values { get; private set; }

    /// <inheritdoc/>
    public override string Name => dataField.Name;
    /// <inheritdoc/>
    public override DataField Field => dataField;

    internal override Task WriteAsync(ParquetRowGroupWriter rowGroup, int rows, CancellationToken ct)
        => rowGroup.WriteAsync(dataField, new ArraySegment<string>(Values, 0, rows), null);

    internal override void EnsureCapacity(int rows)
    {
        if (rows > Values.Length)
        {
            var bigger = new string[Math.Max(rows, 2 * Values.Length)];
            Array.Copy(Values, bigger, Values.Length);
            Values = bigger;
        }
    }
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
