using Lightfold.Catalog;
using Lightfold.Configuration;
using Lightfold.Photometry;
using Lightfold.Populations;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;
using Lightfold.Transients;

namespace Lightfold.Tests.Survey;

public class UserTableTests
{
    static string Temp(string text, string ext = ".csv")
    {
        string path = Path.Combine(Path.GetTempPath(), $"lightfold-table-{Guid.NewGuid():N}{ext}");
        File.WriteAllText(path, text);
        return path;
    }

    [Theory]
    [InlineData("phase_days,wavelength_angstrom,flux\n1,4000,1\n1,5000,x\n", "line 3", "flux")]
    [InlineData("phase_days,wavelength_angstrom\n1,4000\n", "missing column 'flux'", "")]
    [InlineData("phase_days,wavelength_angstrom,flux\n1,4000,1\n1,5000,-2\n2,4000,1\n2,5000,1\n", "row 2", "flux")]
    [InlineData("phase_days,wavelength_angstrom,flux\n1,4000,1\n1,4000,2\n2,4000,1\n2,5000,1\n", "row 2", "duplicate")]
    [InlineData("phase_days,wavelength_angstrom,flux\n1,4000,NaN\n", "line 2", "finite")]
    public void Bad_templates_are_one_clear_message_naming_the_row(string text, string mention1, string mention2)
    {
        string path = Temp(text);
        var e = Assert.Throws<InputException>(() => ObservingResources.LoadTemplate(path, 1e4));
        Assert.Contains(mention1, e.Message);
        Assert.Contains(mention2, e.Message);
        Assert.Contains(path, e.Message);
    }

    [Fact]
    public void Bad_bandpass_and_visit_tables_name_the_row()
    {
        var e = Assert.Throws<InputException>(() => ObservingResources.LoadBandpass("q", Temp("wavelength_angstrom,transmission\n5000,0.5\n4000,0.5\n")));
        Assert.Contains("row 2", e.Message);
        var v = Assert.Throws<InputException>(() => ObservingResources.LoadVisitTable(Temp("mjd,band,depth_5sigma_mag,seeing_fwhm_arcsec\n60000,g,24,0.9\n60001,w,24,0.9\n"), ["g", "r"]));
        Assert.Contains("row 2", v.Message);
        Assert.Contains("'w'", v.Message);
        // Through the CLI: exit 2, one message, no catalog written.
        string dir = Path.Combine(Path.GetTempPath(), $"lightfold-bad-{Guid.NewGuid():N}");
        string table = Temp("mjd,band,depth_5sigma_mag,seeing_fwhm_arcsec\n60000,g,24,oops\n");
        var (code, _, err) = CliRunner.Run("simulate", "--out", dir, "--count", "10", "--quiet", "--set", $"survey.visit_table={table}");
        Assert.Equal(2, code);
        Assert.Contains("line 2", err);
        Assert.False(Directory.Exists(dir));
    }

    // A template made by sampling the built-in SN Ia model (every 1 d, every 20 Å) reproduces its band light curve at
    // z = 0.6 within 2% around peak (the template path: table interpolation + direct photometry).
    [Fact]
    public void A_template_sampled_from_a_model_reproduces_it()
    {
        var spec = (ArnettSpec)ScenarioLoader.Load([], [], []).Observing.Models[TransientType.Ia];
        var model = spec.Build(new UvSuppression());
        var lines = new List<string> { "phase_days,wavelength_angstrom,flux" };
        for (int t = 1; t <= 80; t++)
            for (int l = 1500; l <= 12000; l += 20)
                lines.Add(FormattableString.Invariant($"{t},{l},{model.SpectralLuminosity(t, l) / 1e38}"));
        var template = ObservingResources.LoadTemplate(Temp(string.Join("\n", lines)), 1e4);
        BuiltInBands.TryGet("r", out var r);
        double ratio0 = LightCurveBank.DirectQ(model, r, 0.6, 20) / LightCurveBank.DirectQ(template, r, 0.6, 20);
        foreach (double t in new[] { 10.0, 15.5, 25.0, 40.0 })
            AssertRelative.Equal(ratio0, LightCurveBank.DirectQ(model, r, 0.6, t) / LightCurveBank.DirectQ(template, r, 0.6, t), 0.02, $"phase {t}");
        AssertRelative.Equal(1e38, ratio0, 0.02);
    }

    // A visit table replaces the cadence: every observation happens at a listed visit.
    [Fact]
    public void Visit_table_drives_the_observations()
    {
        var lines = new List<string> { "mjd,band,depth_5sigma_mag,seeing_fwhm_arcsec" };
        for (int d = 0; d < 1096; d += 2) lines.Add(FormattableString.Invariant($"{62137 + d + 0.3},{(d % 4 == 0 ? "g" : "r")},24.5,0.8"));
        string table = Temp(string.Join("\n", lines));
        string dir = Path.Combine(Path.GetTempPath(), $"lightfold-vt-{Guid.NewGuid():N}");
        var (code, _, err) = CliRunner.Run("simulate", "--out", dir, "--count", "60", "--quiet", "--set", $"survey.visit_table={table}");
        Assert.True(code == 0, err);
        using var db = new DuckDb();
        var mjds = db.Rows($"SELECT DISTINCT mjd, band FROM {DuckDb.Table(dir, "observations")}");
        Assert.NotEmpty(mjds);
        var allowed = lines.Skip(1).Select(l => l.Split(',')).Select(p => (double.Parse(p[0], System.Globalization.CultureInfo.InvariantCulture), p[1])).ToHashSet();
        Assert.All(mjds, r => Assert.Contains(((double)r[0]!, (string)r[1]!), allowed));
    }
}
