using System.Globalization;
using System.Text.Json;
using Lightfold.Configuration;
using Lightfold.Cosmology;
using Lightfold.Lensing;
using Lightfold.Pipeline;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Catalog;

public class SimulateCatalogTests
{
    static string NewDir() => Path.Combine(Path.GetTempPath(), $"lightfold-cat-{Guid.NewGuid():N}");

    static string Simulate(params string[] extra)
    {
        string dir = NewDir();
        var (code, _, err) = CliRunner.Run(["simulate", "--out", dir, "--quiet", .. extra]);
        Assert.True(code == 0, err);
        return dir;
    }

    // Read back with DuckDB (a second, independent Parquet reader): row counts, unique ids, weights summing to the
    // expected number of lensed events (1e-9 relative), image indices and delays per the contract, and metadata.
    [Fact]
    public void Catalog_reads_back_with_duckdb_with_weights_summing_to_the_expectation()
    {
        string dir = Simulate("--count", "3000");
        using var db = new DuckDb();
        string systems = DuckDb.Table(dir, "systems"), images = DuckDb.Table(dir, "images");
        Assert.Equal(3000L, db.Scalar<long>($"SELECT count(*) FROM {systems}"));
        Assert.Equal(3000L, db.Scalar<long>($"SELECT count(DISTINCT system_id) FROM {systems}"));
        var meta = db.Metadata(Path.Combine(dir, "systems", "shard=0000", "part.parquet"));
        double expected = double.Parse(meta["lightfold.expected_lensed_events"], CultureInfo.InvariantCulture);
        AssertRelative.Equal(expected, db.Scalar<double>($"SELECT sum(weight) FROM {systems}"), 1e-9, "Σ weight");
        Assert.Equal(db.Scalar<long>($"SELECT sum(n_images) FROM {systems}"), db.Scalar<long>($"SELECT count(*) FROM {images}"));
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM {systems} WHERE n_images < 2"));
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM {images} WHERE delay_days < 0 OR (image_index = 0 AND delay_days <> 0)"));
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM (SELECT system_id, max(image_index) AS m, count(*) AS n FROM {images} GROUP BY system_id) WHERE m <> n - 1"));

        var (_, shown, _) = CliRunner.Run("config", "show", "--set", "run.count=3000");
        Assert.Equal(shown.Trim(), meta["lightfold.config"].Trim());
        Assert.Equal("20261202", meta["lightfold.seed"]);
        Assert.Equal(Lightfold.Catalog.CatalogSchema.Version, meta["lightfold.schema_version"]);
        using var cosmology = JsonDocument.Parse(meta["lightfold.cosmology"]);
        Assert.Equal(70.0, cosmology.RootElement.GetProperty("h0_kms_mpc").GetDouble());
        Assert.Equal(0.7, cosmology.RootElement.GetProperty("omega_de0").GetDouble(), 12);
        Assert.Empty(Directory.GetFiles(dir, "*.partial-*", SearchOption.AllDirectories));
    }

    // The independent checker: for 150 systems read back with DuckDB, every image satisfies the lens equation of
    // the contract lens (J-integral deflection), magnifications and delays agree with the contract, and the
    // brute-force finder finds no image the catalog lacks.
    [Fact]
    public void Every_catalog_image_satisfies_the_contract()
    {
        string dir = Simulate("--count", "150", "--seed", "7");
        using var db = new DuckDb();
        var systems = db.Rows($"SELECT system_id, theta_e_arcsec, lens_q, lens_pa_deg, shear_gamma, shear_pa_deg, source_x_arcsec, source_y_arcsec, time_delay_distance_mpc, z_lens, z_source, n_images FROM {DuckDb.Table(dir, "systems")} ORDER BY system_id");
        var images = db.Rows($"SELECT system_id, image_index, x_arcsec, y_arcsec, magnification, delay_days, kappa FROM {DuckDb.Table(dir, "images")} ORDER BY system_id, image_index")
            .GroupBy(r => (long)r[0]!).ToDictionary(g => g.Key, g => g.ToList());
        var cosmology = new FlrwCosmology(new CosmologyParameters());
        foreach (var s in systems)
        {
            double D(int i) => Convert.ToDouble(s[i], CultureInfo.InvariantCulture);
            var lens = new ContractLens(D(1), D(2), D(3), D(4), D(5));
            double bx = D(6), by = D(7), zl = D(9), zs = D(10);
            double dDt = (1 + zl) * cosmology.AngularDiameterDistanceMpc(zl) * cosmology.AngularDiameterDistanceMpc(zs) / cosmology.AngularDiameterDistanceMpc(zl, zs);
            AssertRelative.Equal(dDt, D(8), 1e-6, "D_Δt");
            var rows = images[(long)s[0]!];
            Assert.Equal(Convert.ToInt32(s[11]), rows.Count);
            double tau0 = 0;
            foreach (var im in rows)
            {
                double x = (double)im[2]!, y = (double)im[3]!;
                Assert.True(lens.Residual(x, y, bx, by) < 1e-9 * lens.ThetaE, "lens equation");
                AssertRelative.Equal(lens.Magnification(x, y), (double)im[4]!, 1e-5, "μ");
                AssertRelative.Equal(lens.Kappa(x, y), (double)im[6]!, 1e-9, "κ");
                double tau = 0.5 * ((x - bx) * (x - bx) + (y - by) * (y - by)) - lens.Potential(x, y);
                if ((int)im[1]! == 0) tau0 = tau;
                AssertRelative.Near((tau - tau0) * ContractLens.DaysPerArcsec2(D(8)), (double)im[5]!, 1e-6 + 1e-8 * (double)im[5]!, "delay");
            }
            var sie = new SieShearLens { ThetaEArcsec = D(1), AxisRatio = D(2), PositionAngleDeg = D(3), ShearGamma = D(4), ShearPositionAngleDeg = D(5) };
            foreach (var (x, y, _) in GridImageFinder.Find(sie.Prepare(), bx, by, 3.5 * D(1) / (1 - D(4)), 201, 1e-11 * D(1)))
                Assert.Contains(rows, im => Math.Abs((double)im[2]! - x) < 1e-7 && Math.Abs((double)im[3]! - y) < 1e-7);
        }
    }

    // Determinism contract: the same inputs give the same rows whatever the thread count; another seed differs.
    [Fact]
    public void Same_seed_gives_identical_rows_with_one_or_two_threads()
    {
        string a = Simulate("--count", "2000", "--threads", "1", "--set", "run.batch_size=700");
        string b = Simulate("--count", "2000", "--threads", "2");
        string c = Simulate("--count", "2000", "--seed", "99");
        using var db = new DuckDb();
        string Q(string dir, string table) => $"SELECT * FROM {DuckDb.Table(dir, table)} ORDER BY ALL";
        foreach (string table in new[] { "systems", "images" })
        {
            var ra = db.Rows(Q(a, table));
            var rb = db.Rows(Q(b, table));
            Assert.Equal(ra.Count, rb.Count);
            for (int i = 0; i < ra.Count; i++) Assert.Equal(ra[i], rb[i]);
        }
        Assert.NotEqual(db.Rows(Q(a, "systems"))[0], db.Rows(Q(c, "systems"))[0]);
    }

    [Fact]
    public void Realization_mode_draws_the_poisson_count_with_unit_weights()
    {
        var scenario = ScenarioLoader.Load([], ["run.mode=realization", "survey.area_deg2=20"], []);
        var (count, weight) = new SystemSampler(scenario).RunSize();
        Assert.Equal(1.0, weight);
        string dir = Simulate("--mode", "realization", "--set", "survey.area_deg2=20");
        using var db = new DuckDb();
        Assert.Equal(count, db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(dir, "systems")}"));
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(dir, "systems")} WHERE weight <> 1"));
    }

    [Fact]
    public void Rerun_resumes_and_different_inputs_into_the_same_folder_are_refused()
    {
        string dir = Simulate("--count", "500");
        var (code, output, _) = CliRunner.Run("simulate", "--out", dir, "--count", "500", "--quiet");
        Assert.Equal(0, code);
        Assert.Contains("already complete", output);
        var (code2, _, err2) = CliRunner.Run("simulate", "--out", dir, "--count", "500", "--seed", "5", "--quiet");
        Assert.Equal(2, code2);
        Assert.Contains("different inputs", err2);
    }

    // The comparison switch: with microlensing off every factor is exactly 1 (κ_* is still reported).
    [Fact]
    public void Microlensing_switch_off_gives_unit_factors()
    {
        string dir = Simulate("--count", "60", "--set", "microlensing.enabled=false");
        using var db = new DuckDb();
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(dir, "observations")} WHERE micro_magnification <> 1"));
        Assert.True(db.Scalar<double>($"SELECT max(kappa_star) FROM {DuckDb.Table(dir, "images")}") > 0);
    }
}
