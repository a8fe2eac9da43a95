using System.Globalization;
using System.Text;

namespace Lightfold.Catalog;

/// <summary>One row of a delay-estimates table.</summary>
/// <param name="SystemId">Catalog system.</param>
/// <param name="ImageA">Earlier image (reference).</param>
/// <param name="ImageB">Other image.</param>
/// <param name="DelayDays">Estimated t_b − t_a [days]; NaN (or an empty CSV cell) = the pair was attempted but not measured.</param>
/// <param name="ErrorDays">1σ uncertainty [days]; NaN or ≤ 0 = not measured.</param>
/// <param name="Row">1-based row in the file.</param>
public readonly record struct DelayEstimateRow(long SystemId, int ImageA, int ImageB, double DelayDays, double ErrorDays, int Row);

/// <summary>The delay-estimates table read by <c>score-delays</c> and written by <c>estimate-delays</c>.</summary>
/// <remarks>CSV (header line) or Parquet, columns <c>system_id, image_a, image_b, delay_days, delay_err_days</c>
/// (extra columns are ignored). A pair the estimator could not measure is kept with delay_days and delay_err_days empty
/// (CSV) or NaN: it counts as attempted but not submitted.</remarks>
public static class DelayEstimatesFile
{
    /// <summary>Reads the table; malformed rows are an <see cref="InputException"/> naming the row.</summary>
    public static List<DelayEstimateRow> Read(string path)
    {
        var t = NumericTable.Read(path, [Columns.SystemId, Columns.ImageA, Columns.ImageB, Columns.DelayDays, Columns.DelayErrDays],
            missingAllowed: [Columns.DelayDays, Columns.DelayErrDays]);
        var rows = new List<DelayEstimateRow>();
        double[] id = t[Columns.SystemId], a = t[Columns.ImageA], b = t[Columns.ImageB], d = t[Columns.DelayDays], e = t[Columns.DelayErrDays];
        for (int i = 0; i < id.Length; i++)
        {
            if (id[i] != Math.Floor(id[i]) || id[i] < 0) throw new InputException($"estimates '{path}' row {i + 1}: system_id = {id[i]} is not a non-negative integer");
            if (a[i] != Math.Floor(a[i]) || b[i] != Math.Floor(b[i]) || a[i] < 0 || b[i] < 0 || a[i] == b[i])
                throw new InputException($"estimates '{path}' row {i + 1}: image_a = {a[i]}, image_b = {b[i]} must be two different image indices");
            rows.Add(new DelayEstimateRow((long)id[i], (int)a[i], (int)b[i], d[i], e[i], i + 1));
        }
        return rows;
    }

    /// <summary>Writes estimates as CSV (or Parquet when the name ends in .parquet), atomically.</summary>
    public static void Write(string path, IReadOnlyList<DelayEstimateRow> rows)
    {
        if (path.EndsWith(".parquet", StringComparison.OrdinalIgnoreCase))
        {
            var table = new TableBuffer("delay_estimates",
            [
                new ValueColumn<long>(Columns.SystemId, rows.Count), new ValueColumn<int>(Columns.ImageA, rows.Count), new ValueColumn<int>(Columns.ImageB, rows.Count),
                new ValueColumn<double>(Columns.DelayDays, rows.Count), new ValueColumn<double>(Columns.DelayErrDays, rows.Count),
            ]);
            for (int i = 0; i < rows.Count; i++)
            {
                table.L(Columns.SystemId)[i] = rows[i].SystemId; table.I(Columns.ImageA)[i] = rows[i].ImageA; table.I(Columns.ImageB)[i] = rows[i].ImageB;
                table.D(Columns.DelayDays)[i] = rows[i].DelayDays; table.D(Columns.DelayErrDays)[i] = rows[i].ErrorDays;
            }
            table.Count = rows.Count;
            Task.Run(async () =>
            {
                await using var writer = await ParquetTableWriter.CreateAsync(path, table, new Dictionary<string, string> { ["lightfold.table"] = "delay_estimates" }, default);
                await writer.WriteAsync(table, default);
                await writer.CommitAsync();
            }).GetAwaiter().GetResult();
            return;
        }
        var text = new StringBuilder($"{Columns.SystemId},{Columns.ImageA},{Columns.ImageB},{Columns.DelayDays},{Columns.DelayErrDays}\n");
        string F(double v) => double.IsFinite(v) ? v.ToString("R", CultureInfo.InvariantCulture) : "";
        foreach (var r in rows) text.Append($"{r.SystemId},{r.ImageA},{r.ImageB},{F(r.DelayDays)},{F(r.ErrorDays)}\n");
        AtomicFile.WriteAllText(path, text.ToString());
    }
}
