using System.Globalization;
using System.Text.Json;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;
using SkiaSharp;

namespace Lightfold.Tests.Analysis;

/// <summary>The three users' commands on small catalogs: report, estimate-delays → score-delays, training sets.</summary>
public sealed class UserCommandsTests : IClassFixture<UserCommandsTests.Catalogs>
{
    public sealed class Catalogs
    {
        public string Weighted { get; } = Run("--count", "500", "--seed", "31");
        public string Realization { get; } = Run("--mode", "realization", "--seed", "32", "--set", "survey.area_deg2=20");

        static string Run(params string[] args)
        {
            string dir = Path.Combine(Path.GetTempPath(), $"lightfold-user-{Guid.NewGuid():N}");
            var (code, _, err) = CliRunner.Run(["simulate", "--out", dir, "--quiet", .. args]);
            Assert.True(code == 0, err);
            return dir;
        }
    }

    readonly Catalogs catalogs;
    public UserCommandsTests(Catalogs c) => catalogs = c;

    static double Years(string dir) => double.Parse(new DuckDb().Metadata(Path.Combine(dir, "systems", "shard=0000", "part.parquet"))["lightfold.explosion_years"], CultureInfo.InvariantCulture);

    // Report yields equal an independent sum over the catalog's weights (DuckDB), for a weighted (oversample) and an
    // unweighted (realization) catalog; every PNG is a valid, non-trivial image.
    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void Report_yields_equal_the_sum_of_weights_and_plots_are_images(bool weighted)
    {
        string dir = weighted ? catalogs.Weighted : catalogs.Realization;
        string outDir = Path.Combine(dir, $"report-{Guid.NewGuid():N}");
        var (code, output, err) = CliRunner.Run("report", dir, "--out", outDir);
        Assert.True(code == 0, err);
        Assert.Contains("simulated", output);
        using var doc = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "summary.json")));
        double years = Years(dir);
        using var db = new DuckDb();
        var yields = doc.RootElement.GetProperty("yields").EnumerateArray().ToList();
        double PerYear(string name) => yields.Single(y => y.GetProperty("name").GetString() == name).GetProperty("per_year").GetDouble();
        AssertRelative.Equal(db.Scalar<double>($"SELECT coalesce(sum(weight), 0) FROM {DuckDb.Table(dir, "systems")}") / years, PerYear("all multiply imaged"), 1e-9);
        AssertRelative.Near(db.Scalar<double>($"SELECT coalesce(sum(weight), 0) FROM {DuckDb.Table(dir, "systems")} WHERE detected") / years, PerYear("detected"), 1e-9);
        foreach (var row in db.Rows($"SELECT transient_type, sum(weight) FROM {DuckDb.Table(dir, "systems")} GROUP BY 1"))
            AssertRelative.Equal((double)row[1]! / years, PerYear((string)row[0]!), 1e-9);
        AssertRelative.Near(db.Scalar<double>($"SELECT coalesce(sum(weight), 0) FROM {DuckDb.Table(dir, "systems")} WHERE n_images >= 4") / years, PerYear("4+ images"), 1e-9);
        var pngs = Directory.GetFiles(outDir, "*.png");
        Assert.True(pngs.Length >= 5, $"{pngs.Length} plots");
        foreach (string png in pngs)
        {
            using var bitmap = SKBitmap.Decode(png);
            Assert.NotNull(bitmap);
            var colours = new HashSet<SKColor>();
            for (int y = 0; y < bitmap.Height; y += 7) for (int x = 0; x < bitmap.Width; x += 7) colours.Add(bitmap.GetPixel(x, y));
            Assert.True(colours.Count > 8, $"{Path.GetFileName(png)} has content");
        }
    }

    // estimate-delays followed by score-delays prints the metrics; its output is exactly what score-delays reads.
    [Fact]
    public void Estimate_then_score_prints_the_metrics()
    {
        string est = Path.Combine(Path.GetTempPath(), $"est-{Guid.NewGuid():N}.csv");
        var (code, _, err) = CliRunner.Run("estimate-delays", "--catalog", catalogs.Weighted, "--out", est);
        Assert.True(code == 0, err);
        string png = Path.ChangeExtension(est, ".png"), json = Path.ChangeExtension(est, ".json");
        (code, var output, err) = CliRunner.Run("score-delays", "--catalog", catalogs.Weighted, "--estimates", est, "--png", png, "--json", json);
        Assert.True(code == 0, err);
        Assert.Contains("f = ", output);
        Assert.Contains("by true |delay|", output);
        using var doc = JsonDocument.Parse(File.ReadAllText(json));
        Assert.True(doc.RootElement.GetProperty("pairs").GetInt32() > 0);
        Assert.True(File.Exists(png));
    }

    // Bad estimates: unknown system ids and duplicated pairs are reported (exit 2), absent pairs are counted, not dropped.
    [Fact]
    public void Score_delays_reports_unknown_duplicate_and_missing_rows()
    {
        string Csv(string body)
        {
            string p = Path.Combine(Path.GetTempPath(), $"est-{Guid.NewGuid():N}.csv");
            File.WriteAllText(p, "system_id,image_a,image_b,delay_days,delay_err_days\n" + body);
            return p;
        }
        var (code, _, err) = CliRunner.Run("score-delays", "--catalog", catalogs.Weighted, "--estimates", Csv("999999,0,1,5,1\n"));
        Assert.Equal(2, code);
        Assert.Contains("999999", err);
        using var db = new DuckDb();
        long id = db.Scalar<long>($"SELECT system_id FROM {DuckDb.Table(catalogs.Weighted, "systems")} WHERE detected ORDER BY system_id LIMIT 1");
        (code, _, err) = CliRunner.Run("score-delays", "--catalog", catalogs.Weighted, "--estimates", Csv($"{id},0,1,5,1\n{id},1,0,-5,1\n"));
        Assert.Equal(2, code);
        Assert.Contains("more than once", err);
        (code, var output, err) = CliRunner.Run("score-delays", "--catalog", catalogs.Weighted, "--estimates", Csv($"{id},0,1,,\n"));
        Assert.True(code == 0, err);
        long targets = db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(catalogs.Weighted, "images")} i JOIN {DuckDb.Table(catalogs.Weighted, "systems")} s USING (system_id) WHERE s.detected AND i.image_index > 0");
        Assert.Contains($"{targets} pairs ({targets - 1} target pairs", output);
        Assert.Contains("f = 0", output);
    }

    // Training sets: the class balance as configured (binomial, 5σ), splits stable under re-runs and sharding
    // (a hash of system_id), unlensed objects have one unmagnified image, and features come per object per band.
    [Fact]
    public void Training_sets_have_labels_balance_and_stable_splits()
    {
        string Run(params string[] extra)
        {
            string dir = Path.Combine(Path.GetTempPath(), $"lightfold-train-{Guid.NewGuid():N}");
            var (code, _, err) = CliRunner.Run(["simulate", "--out", dir, "--mode", "training", "--count", "800", "--quiet", "--set", "training.lensed_fraction=0.3", .. extra]);
            Assert.True(code == 0, err);
            return dir;
        }
        string a = Run(), b = Run("--seed", "77");
        string sharded = Path.Combine(Path.GetTempPath(), $"lightfold-train-{Guid.NewGuid():N}");
        for (int k = 0; k < 2; k++)
            Assert.Equal(0, CliRunner.Run("simulate", "--out", sharded, "--mode", "training", "--count", "800", "--quiet", "--set", "training.lensed_fraction=0.3", "--shard", k.ToString(), "--shards", "2").Code);
        using var db = new DuckDb();
        double lensed = db.Scalar<double>($"SELECT avg(CASE WHEN label = 'lensed' THEN 1.0 ELSE 0.0 END) FROM {DuckDb.Table(a, "systems")}");
        AssertRelative.Near(0.3, lensed, 5 * Math.Sqrt(0.3 * 0.7 / 800));
        // Splits depend only on system_id: identical across seeds and shardings.
        string Splits(string dir) => string.Join(",", db.Rows($"SELECT system_id, split FROM {DuckDb.Table(dir, "systems")} ORDER BY system_id").Select(r => $"{r[0]}:{r[1]}"));
        Assert.Equal(Splits(a), Splits(b));
        Assert.Equal(Splits(a), Splits(sharded));
        CatalogCompare.AssertSameRows(a, sharded, "systems", "features");
        double train = db.Scalar<double>($"SELECT avg(CASE WHEN split = 'train' THEN 1.0 ELSE 0.0 END) FROM {DuckDb.Table(a, "systems")}");
        AssertRelative.Near(0.7, train, 5 * Math.Sqrt(0.7 * 0.3 / 800));
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(a, "systems")} WHERE label = 'unlensed' AND (n_images <> 1 OR total_magnification <> 1 OR z_lens IS NOT NULL AND NOT isnan(z_lens))"));
        Assert.Equal(800L * 4, db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(a, "features")}"));
    }
}
