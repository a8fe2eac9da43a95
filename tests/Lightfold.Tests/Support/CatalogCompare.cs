namespace Lightfold.Tests.Support;

/// <summary>Compares catalogs table by table through DuckDB (an independent reader), order-independently.</summary>
public static class CatalogCompare
{
    /// <summary>Asserts that two catalog folders hold the same rows in every table (sorted row-by-row comparison).</summary>
    public static void AssertSameRows(string expectedDir, string actualDir, params string[] tables)
    {
        using var db = new DuckDb();
        foreach (string table in tables.Length > 0 ? tables : ["systems", "images", "observations"])
        {
            var a = db.Rows($"SELECT * FROM {DuckDb.Table(expectedDir, table)} ORDER BY ALL");
            var b = db.Rows($"SELECT * FROM {DuckDb.Table(actualDir, table)} ORDER BY ALL");
            Assert.True(a.Count == b.Count, $"{table}: {a.Count} rows expected, {b.Count} found");
            for (int i = 0; i < a.Count; i++)
                Assert.True(a[i].SequenceEqual(b[i]), $"{table}: row {i} differs:\n  {string.Join(", ", a[i])}\n  {string.Join(", ", b[i])}");
            Assert.True(a.Count > 0, $"{table} is empty");
        }
    }
}
