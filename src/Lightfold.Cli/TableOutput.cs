using System.Globalization;
using System.Text;
using System.Text.Json;

namespace Lightfold.Cli;

/// <summary>Writes rows of named numeric columns as an aligned table, JSON (array of objects) or CSV.</summary>
public static class TableOutput
{
    /// <summary>Accepted values of --format.</summary>
    public static readonly string[] Formats = ["table", "json", "csv"];

    /// <summary>Writes <paramref name="rows"/> (one value per column) in <paramref name="format"/>.</summary>
    public static void Write(TextWriter output, string format, IReadOnlyList<string> columns, IReadOnlyList<double[]> rows)
    {
        switch (format)
        {
            case "json":
                using (var stream = new MemoryStream())
                {
                    using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
                    {
                        json.WriteStartArray();
                        foreach (var row in rows)
                        {
                            json.WriteStartObject();
                            for (int c = 0; c < columns.Count; c++)
                            {
                                if (double.IsFinite(row[c])) json.WriteNumber(columns[c], row[c]);
                                else json.WriteNull(columns[c]);
                            }
                            json.WriteEndObject();
                        }
                        json.WriteEndArray();
                    }
                    output.WriteLine(Encoding.UTF8.GetString(stream.ToArray()));
                }
                break;
            case "csv":
                output.WriteLine(string.Join(",", columns));
                foreach (var row in rows)
                    output.WriteLine(string.Join(",", row.Select(v => double.IsFinite(v) ? v.ToString("R", CultureInfo.InvariantCulture) : "")));
                break;
            default:
                var cells = rows.Select(r => r.Select(v => double.IsFinite(v) ? v.ToString("G8", CultureInfo.InvariantCulture) : "-").ToArray()).ToList();
                var widths = columns.Select((c, i) => Math.Max(c.Length, cells.Count == 0 ? 0 : cells.Max(r => r[i].Length))).ToArray();
                output.WriteLine(string.Join("  ", columns.Select((c, i) => c.PadLeft(widths[i]))));
                foreach (var r in cells)
                    output.WriteLine(string.Join("  ", r.Select((v, i) => v.PadLeft(widths[i]))));
                break;
        }
    }
}
