using Lightfold.Catalog;

namespace Lightfold.Tests.Catalog;

/// <summary>Pins the catalog contract: any change to a table's columns (name, order, type) shows as a diff of the
/// committed approved file. Update it deliberately (and bump CatalogSchema.Version, with a README migration note).</summary>
public class SchemaApprovalTests
{
    public static string Describe() => string.Join("\n", CatalogSchema.AllVariants()
        .SelectMany(t => t.Columns.Select(c => $"{t.Table}[{t.Columns.Count} columns].{c.Name}: {(c is TextColumn ? "String" : c.Field.ClrType.Name)}")))
        + $"\nschema_version: {CatalogSchema.Version}\n";

    [Fact]
    public void Catalog_schema_matches_the_approved_file()
    {
        string approved = Path.Combine(AppContext.BaseDirectory, "Data", "catalog-schema.approved.txt");
        string actual = Describe();
        if (!File.Exists(approved) || File.ReadAllText(approved) != actual)
        {
            File.WriteAllText(Path.Combine(AppContext.BaseDirectory, "catalog-schema.received.txt"), actual);
            Assert.Fail($"catalog schema changed; received:\n{actual}");
        }
    }
}
