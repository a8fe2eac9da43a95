namespace Lightfold.Catalog;

/// <summary>The tables of a catalog: their columns in order, and their place in a dataset folder.</summary>
/// <remarks>
/// A catalog is a folder: <c>DIR/&lt;table&gt;/shard=KKKK/part.parquet</c> for each table and shard, plus
/// <c>DIR/manifest.json</c> and one completion marker per shard in <c>DIR/manifest.d/</c>. Readers take every
/// <c>part.parquet</c> under a table folder (e.g. DuckDB: <c>read_parquet('DIR/systems/*/part.parquet')</c>).
/// The columns are pinned by an approval test: a change here is a change of the catalog contract.
/// </remarks>
public static class CatalogSchema
{
    /// <summary>Schema version written to every file's metadata; bump it on any column change.</summary>
    public const string Version = "1";

    /// <summary>Name of the systems table.</summary>
    public const string SystemsTable = "systems";

    /// <summary>Name of the images table.</summary>
    public const string ImagesTable = "images";

    /// <summary>Path of one table's part for one shard.</summary>
    public static string PartPath(string directory, string table, int shard)
        => Path.Combine(directory, table, $"shard={shard:D4}", "part.parquet");

    /// <summary>Builders of the tables later stages add (observations, …), for schema listings.</summary>
    public static IReadOnlyList<Func<int, TableBuffer>> ExtraTables { get; } = [];

    /// <summary>An empty systems buffer.</summary>
    public static TableBuffer Systems(int capacity) => new(SystemsTable,
    [
        new ValueColumn<long>(Columns.SystemId, capacity),
        new ValueColumn<double>(Columns.Weight, capacity),
        new TextColumn(Columns.TransientType, capacity),
        new ValueColumn<double>(Columns.ZLens, capacity),
        new ValueColumn<double>(Columns.ZSource, capacity),
        new ValueColumn<double>(Columns.LensSigmaVKms, capacity),
        new ValueColumn<double>(Columns.ThetaEArcsec, capacity),
        new ValueColumn<double>(Columns.LensQ, capacity),
        new ValueColumn<double>(Columns.LensPaDeg, capacity),
        new ValueColumn<double>(Columns.ShearGamma, capacity),
        new ValueColumn<double>(Columns.ShearPaDeg, capacity),
        new ValueColumn<double>(Columns.SourceXArcsec, capacity),
        new ValueColumn<double>(Columns.SourceYArcsec, capacity),
        new ValueColumn<int>(Columns.NImages, capacity),
        new ValueColumn<bool>(Columns.OnCaustic, capacity),
        new ValueColumn<double>(Columns.T0Mjd, capacity),
        new ValueColumn<double>(Columns.PeakAbsoluteBMag, capacity),
        new ValueColumn<double>(Columns.TimeDelayDistanceMpc, capacity),
        new ValueColumn<double>(Columns.MaxDelayDays, capacity),
        new ValueColumn<double>(Columns.MaxSeparationArcsec, capacity),
        new ValueColumn<double>(Columns.TotalMagnification, capacity),
    ]);

    /// <summary>An empty images buffer.</summary>
    public static TableBuffer Images(int capacity) => new(ImagesTable,
    [
        new ValueColumn<long>(Columns.SystemId, capacity),
        new ValueColumn<int>(Columns.ImageIndex, capacity),
        new ValueColumn<double>(Columns.XArcsec, capacity),
        new ValueColumn<double>(Columns.YArcsec, capacity),
        new ValueColumn<double>(Columns.Magnification, capacity),
        new ValueColumn<double>(Columns.DelayDays, capacity),
        new ValueColumn<double>(Columns.Kappa, capacity),
        new ValueColumn<double>(Columns.Gamma, capacity),
    ]);
}
