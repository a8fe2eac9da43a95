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

    /// <summary>Name of the observations table.</summary>
    public const string ObservationsTable = "observations";

    /// <summary>Name of the per-object, per-band features table (training sets).</summary>
    public const string FeaturesTable = "features";

    /// <summary>Path of one table's part for one shard.</summary>
    public static string PartPath(string directory, string table, int shard)
        => Path.Combine(directory, table, $"shard={shard:D4}", "part.parquet");

    /// <summary>Every table variant, for schema listings: systems and images without and with light curves, observations.</summary>
    public static IReadOnlyList<TableBuffer> AllVariants() => [Systems(1, false), Images(1, false), Systems(1, true), Images(1, true), Observations(1), Systems(1, true, training: true), Features(1)];

    /// <summary>An empty systems buffer; with light curves it adds the detection columns.</summary>
    public static TableBuffer Systems(int capacity, bool lightCurves, bool training = false) => new(SystemsTable,
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
        .. lightCurves
            ? (ColumnBuffer[])
            [
                new ValueColumn<bool>(Columns.Detected, capacity),
                new ValueColumn<int>(Columns.NDetections, capacity),
                new ValueColumn<double>(Columns.FirstDetectionMjd, capacity),
                new ValueColumn<double>(Columns.HostEbvMag, capacity),
            ]
            : [],
        .. training ? (ColumnBuffer[])[new TextColumn(Columns.Label, capacity), new TextColumn(Columns.Split, capacity)] : [],
    ]);

    /// <summary>An empty features buffer (training sets): one row per object per band, from observed photometry only.</summary>
    public static TableBuffer Features(int capacity) => new(FeaturesTable,
    [
        new ValueColumn<long>(Columns.SystemId, capacity),
        new TextColumn(Columns.Band, capacity),
        new ValueColumn<int>(Columns.NVisits, capacity),
        new ValueColumn<int>(Columns.NDetections, capacity),
        new ValueColumn<double>(Columns.PeakFluxNjy, capacity),
        new ValueColumn<double>(Columns.PeakMjd, capacity),
        new ValueColumn<double>(Columns.RiseDays, capacity),
        new ValueColumn<double>(Columns.DeclineDays, capacity),
        new ValueColumn<double>(Columns.ColourToNextBandMag, capacity),
    ]);

    /// <summary>An empty images buffer; with light curves it adds each image's peak observed magnitude.</summary>
    public static TableBuffer Images(int capacity, bool lightCurves) => new(ImagesTable,
    [
        new ValueColumn<long>(Columns.SystemId, capacity),
        new ValueColumn<int>(Columns.ImageIndex, capacity),
        new ValueColumn<double>(Columns.XArcsec, capacity),
        new ValueColumn<double>(Columns.YArcsec, capacity),
        new ValueColumn<double>(Columns.Magnification, capacity),
        new ValueColumn<double>(Columns.DelayDays, capacity),
        new ValueColumn<double>(Columns.Kappa, capacity),
        new ValueColumn<double>(Columns.Gamma, capacity),
        new ValueColumn<double>(Columns.KappaStar, capacity),
        .. lightCurves ? (ColumnBuffer[])[new ValueColumn<double>(Columns.PeakMag, capacity), new TextColumn(Columns.PeakBand, capacity)] : [],
    ]);

    /// <summary>An empty observations buffer: one row per visit per image, and per unresolved blend (image_index −1).</summary>
    public static TableBuffer Observations(int capacity) => new(ObservationsTable,
    [
        new ValueColumn<long>(Columns.SystemId, capacity),
        new ValueColumn<int>(Columns.ImageIndex, capacity),
        new ValueColumn<int>(Columns.BlendGroup, capacity),
        new ValueColumn<double>(Columns.Mjd, capacity),
        new TextColumn(Columns.Band, capacity),
        new ValueColumn<double>(Columns.FluxNjy, capacity),
        new ValueColumn<double>(Columns.FluxErrNjy, capacity),
        new ValueColumn<double>(Columns.TrueFluxNjy, capacity),
        new ValueColumn<double>(Columns.MicroMagnification, capacity),
        new ValueColumn<double>(Columns.Snr, capacity),
        new ValueColumn<bool>(Columns.IsDetection, capacity),
        new ValueColumn<double>(Columns.Depth5SigmaMag, capacity),
        new ValueColumn<double>(Columns.SeeingFwhmArcsec, capacity),
    ]);
}
