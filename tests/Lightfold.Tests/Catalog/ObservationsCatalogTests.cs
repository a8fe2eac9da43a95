using System.Globalization;
using Lightfold.Configuration;
using Lightfold.Cosmology;
using Lightfold.Photometry;
using Lightfold.Populations;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;
using Lightfold.Transients;
using MathNet.Numerics.Distributions;

namespace Lightfold.Tests.Catalog;

/// <summary>Independent checks of the `observations` table of a small default-scenario catalog, read with DuckDB.</summary>
public sealed class ObservationsCatalogTests : IClassFixture<ObservationsCatalogTests.Catalog>
{
    public sealed class Catalog
    {
        public string Dir { get; } = Path.Combine(Path.GetTempPath(), $"lightfold-obs-{Guid.NewGuid():N}");

        public Catalog()
        {
            var (code, _, err) = CliRunner.Run("simulate", "--out", Dir, "--count", "400", "--seed", "11", "--quiet");
            Assert.True(code == 0, err);
        }
    }

    readonly string dir;
    public ObservationsCatalogTests(Catalog catalog) => dir = catalog.Dir;

    // Noise statistics: (flux − true)/error is standard normal over every row (KS at 1%; ~10^5 rows), and
    // constant sources (rows whose true flux is 0: before the explosion or after the model ends) have a reduced
    // χ² of 1 within 4√(2/N).
    [Fact]
    public void Noise_pulls_are_standard_normal_and_constant_sources_have_unit_chi2()
    {
        using var db = new DuckDb();
        string obs = DuckDb.Table(dir, "observations");
        var pulls = db.Rows($"SELECT (flux_njy - true_flux_njy) / flux_err_njy FROM {obs} USING SAMPLE 100000 ROWS (reservoir, 7)").Select(r => (double)r[0]!).ToArray();
        Assert.True(pulls.Length > 20_000, $"{pulls.Length} rows");
        Assert.True(Statistics.KolmogorovSmirnov(pulls, x => Normal.CDF(0, 1, x)) < Statistics.KsCritical1Percent(pulls.Length));
        long n = db.Scalar<long>($"SELECT count(*) FROM {obs} WHERE true_flux_njy = 0");
        double chi2 = db.Scalar<double>($"SELECT avg((flux_njy / flux_err_njy) ^ 2) FROM {obs} WHERE true_flux_njy = 0");
        AssertRelative.Near(1.0, chi2, 4 * Math.Sqrt(2.0 / n), $"reduced χ² over {n} rows");
    }

    // Each image's true fluxes are the unlensed light curve shifted by the catalog's delay and scaled by |μ|:
    // F_i(t) = |μ_i| μ_micro F(t − t₀ − Δt_i) (μ_micro as written in the row), with F recomputed here by direct synthetic photometry (not the tables), the
    // peak normalisation and the luminosity distance from the cosmology. 400 rows, 0.6% (table interpolation).
    [Fact]
    public void True_fluxes_are_the_source_curve_shifted_by_delays_and_scaled_by_magnifications()
    {
        var scenario = ScenarioLoader.Load([], [], []);
        var resources = Lightfold.Catalog.ObservingResources.Load(scenario);
        var cosmology = new FlrwCosmology(scenario.Cosmology);
        var peakModel = resources.Models.ToDictionary(m => m.Key, m =>
        {
            double best = 0;
            for (double t = 0.1; t <= m.Value.MaxPhaseDays; t += 0.1) best = Math.Max(best, LightCurveBank.DirectQ(m.Value, BuiltInBands.RestFrameB, 0, t));
            return SyntheticPhotometry.AbMagnitude(best / (4 * Math.PI * Math.Pow(10 * Units.CmPerParsec, 2)));
        });
        using var db = new DuckDb();
        var rows = db.Rows($@"SELECT o.mjd, o.band, o.true_flux_njy, i.magnification, i.delay_days, s.t0_mjd, s.z_source, s.transient_type, s.peak_absolute_b_mag, o.micro_magnification
            FROM {DuckDb.Table(dir, "observations")} o JOIN {DuckDb.Table(dir, "images")} i USING (system_id, image_index)
            JOIN {DuckDb.Table(dir, "systems")} s USING (system_id)
            WHERE o.true_flux_njy > 0 ORDER BY hash(o.system_id, o.mjd, o.image_index) LIMIT 400");
        Assert.True(rows.Count > 100);
        foreach (var r in rows)
        {
            double mjd = (double)r[0]!, truth = (double)r[2]!, mu = (double)r[3]!, delay = (double)r[4]!, t0 = (double)r[5]!, z = (double)r[6]!, peak = (double)r[8]!;
            var type = TransientTypes.Parse((string)r[7]!);
            var band = resources.Bands.Single(b => b.Name == (string)r[1]!);
            double dl = cosmology.LuminosityDistanceMpc(z) * Units.CmPerMpc;
            double phase = (mjd - t0 - delay) / (1 + z);
            double scale = Math.Pow(10, -0.4 * (peak + LightCurveBank.BVegaToAb - peakModel[type])) / (4 * Math.PI * dl * dl * (1 + z)) / 1e-32;
            double expected = Math.Abs(mu) * (double)r[9]! * scale * LightCurveBank.DirectQ(resources.Models[type], band, z, phase);
            if (expected < 1e-3 * truth) continue;   // within a table cell of the explosion or the model's end
            AssertRelative.Equal(expected, truth, 6e-3, $"{type} z={z:F3} phase {phase:F2} d band {band.Name}");
        }
    }

    // An unresolved blend row carries exactly the summed true flux of its member images at that visit.
    [Fact]
    public void Blend_rows_sum_their_images()
    {
        using var db = new DuckDb();
        string obs = DuckDb.Table(dir, "observations");
        var rows = db.Rows($@"SELECT b.true_flux_njy, sum(i.true_flux_njy) FROM {obs} b JOIN {obs} i
              ON b.system_id = i.system_id AND b.mjd = i.mjd AND b.band = i.band AND i.blend_group = b.blend_group AND i.image_index >= 0
            WHERE b.image_index = -1 GROUP BY b.system_id, b.mjd, b.band, b.blend_group, b.true_flux_njy");
        Assert.NotEmpty(rows);
        foreach (var r in rows) AssertRelative.Near((double)r[1]!, (double)r[0]!, 1e-9 * Math.Max(1, (double)r[1]!));
    }

    // The detection rule re-evaluated here from the observations table: ≥ 2 rows with S/N ≥ 5 among resolved images
    // and blends within some 30-day window, in ≥ 1 band (the default rule); must equal systems.detected for every system.
    [Fact]
    public void Detected_flag_follows_the_rule()
    {
        using var db = new DuckDb();
        string obs = DuckDb.Table(dir, "observations");
        // Rows a survey measures: blends, and images not part of a blend at that visit.
        var detections = db.Rows($@"SELECT o.system_id, o.mjd FROM {obs} o
            WHERE o.snr >= 5 AND (o.image_index = -1 OR NOT EXISTS (SELECT 1 FROM {obs} b WHERE b.image_index = -1 AND b.system_id = o.system_id
                AND b.mjd = o.mjd AND b.band = o.band AND b.blend_group = o.blend_group))")
            .GroupBy(r => (long)r[0]!).ToDictionary(g => g.Key, g => g.Select(r => (double)r[1]!).Order().ToArray());
        var systems = db.Rows($"SELECT system_id, detected, n_detections FROM {DuckDb.Table(dir, "systems")}");
        int detected = 0;
        foreach (var s in systems)
        {
            long id = (long)s[0]!;
            var t = detections.TryGetValue(id, out var d) ? d : [];
            bool expected = false;
            for (int a = 0; a < t.Length && !expected; a++)
                expected = t.Count(x => x >= t[a] && x - t[a] <= 30) >= 2;
            Assert.Equal(expected, (bool)s[1]!);
            Assert.Equal(t.Length, (int)s[2]!);
            if (expected) detected++;
        }
        Assert.True(detected > 0, "some systems are detected");
    }

    // Microlensing in the default scenario: per-visit factors vary (not constant) and stay physical: median near 1,
    // the 5–95% range between 0.2 and 5, none negative; κ_* is positive and never exceeds κ.
    [Fact]
    public void Micro_magnifications_vary_within_physical_bounds()
    {
        using var db = new DuckDb();
        string obs = DuckDb.Table(dir, "observations");
        var q = db.Rows($"SELECT quantile_cont(micro_magnification, [0.05, 0.5, 0.95]), min(micro_magnification), stddev(ln(micro_magnification)) FROM {obs} WHERE image_index >= 0 AND true_flux_njy > 0")[0];
        var quantiles = ((System.Collections.IEnumerable)q[0]!).Cast<object>().Select(Convert.ToDouble).ToArray();
        Assert.InRange(quantiles[1], 0.5, 2.0);
        Assert.InRange(quantiles[0], 0.2, 1.0);
        Assert.InRange(quantiles[2], 1.0, 5.0);
        Assert.True((double)q[1]! > 0);
        Assert.True((double)q[2]! > 0.02, $"σ(ln μ_micro) = {q[2]}");
        Assert.Equal(0L, db.Scalar<long>($"SELECT count(*) FROM {DuckDb.Table(dir, "images")} WHERE kappa_star < 0 OR kappa_star > kappa + 1e-12"));
        Assert.True(db.Scalar<double>($"SELECT avg(kappa_star / kappa) FROM {DuckDb.Table(dir, "images")}") > 0.05);
    }

    [Fact]
    public void Lightcurve_command_prints_rows_and_draws_a_png()
    {
        using var db = new DuckDb();
        long id = db.Scalar<long>($"SELECT system_id FROM {DuckDb.Table(dir, "systems")} WHERE detected ORDER BY system_id LIMIT 1");
        var (code, output, err) = CliRunner.Run("lightcurve", dir, "--system-id", id.ToString(CultureInfo.InvariantCulture));
        Assert.True(code == 0, err);
        Assert.Contains("true_flux_njy", output);
        string png = Path.Combine(Path.GetTempPath(), $"lc-{Guid.NewGuid():N}.png");
        (code, _, err) = CliRunner.Run("lightcurve", dir, "--system-id", id.ToString(CultureInfo.InvariantCulture), "--png", png);
        Assert.True(code == 0, err);
        byte[] bytes = File.ReadAllBytes(png);
        Assert.Equal(new byte[] { 0x89, 0x50, 0x4E, 0x47 }, bytes[..4]);
        Assert.True(bytes.Length > 20_000, "a non-trivial image");
        Assert.Equal(2, CliRunner.Run("lightcurve", dir, "--system-id", "999999").Code);
    }
}
