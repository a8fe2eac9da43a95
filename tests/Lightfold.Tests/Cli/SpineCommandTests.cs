using System.Text.Json;
using Lightfold.Tests.Cosmology;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Cli;

public class SpineCommandTests
{
    [Fact]
    public void Version_prints_the_assembly_version()
    {
        var (code, output, _) = CliRunner.Run("--version");
        Assert.Equal(0, code);
        Assert.Matches(@"^\d+\.\d+\.\d+", output.Trim());
    }

    [Fact]
    public void Config_show_prints_resolved_json_with_overrides()
    {
        var (code, output, _) = CliRunner.Run("config", "show", "--set", "cosmology.h0_kms_mpc=67.4");
        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(67.4, doc.RootElement.GetProperty("cosmology").GetProperty("h0_kms_mpc").GetDouble());
    }

    [Fact]
    public void Config_check_exits_0_when_valid_and_2_with_one_message_when_not()
    {
        Assert.Equal(0, CliRunner.Run("config", "check").Code);
        var (code, output, err) = CliRunner.Run("config", "check", "--set", "cosmology.omega_m0=NaN");
        Assert.Equal(2, code);
        Assert.Equal("", output);
        Assert.Single(err.Trim().Split('\n'));
        Assert.Contains("cosmology.omega_m0", err);
    }

    [Fact]
    public void Environment_layer_reaches_the_cli()
    {
        var (code, output, _) = CliRunner.RunWithEnvironment(new() { ["LIGHTFOLD__COSMOLOGY__H0_KMS_MPC"] = "55" }, "config", "show");
        Assert.Equal(0, code);
        Assert.Contains("\"h0_kms_mpc\": 55", output);
    }

    // Independent check of `lightfold distances --format json` against astropy 5.2.1 (reference table
    // made by scripts/reference/make_cosmology_reference.py), 1e-6 relative, for an open cosmology.
    [Fact]
    public void Distances_json_agrees_with_astropy()
    {
        var rows = AstropyRow.Load().Where(r => r.Case == "open_lcdm").ToList();
        string zs = string.Join(",", rows.Select(r => r.Z.ToString("R", System.Globalization.CultureInfo.InvariantCulture)));
        var (code, output, err) = CliRunner.Run("distances", "--z", zs, "--format", "json",
            "--set", "cosmology.omega_k0=0.1", "--set", "cosmology.omega_m0=0.3");
        Assert.True(code == 0, err);
        using var doc = JsonDocument.Parse(output);
        var items = doc.RootElement.EnumerateArray().ToList();
        Assert.Equal(rows.Count, items.Count);
        for (int i = 0; i < rows.Count; i++)
        {
            var v = rows[i].Values;
            AssertRelative.Equal(v["dc"], items[i].GetProperty("comoving_distance_mpc").GetDouble(), 1e-6);
            AssertRelative.Equal(v["dm"], items[i].GetProperty("transverse_comoving_distance_mpc").GetDouble(), 1e-6);
            AssertRelative.Equal(v["da"], items[i].GetProperty("angular_diameter_distance_mpc").GetDouble(), 1e-6);
            AssertRelative.Equal(v["dl"], items[i].GetProperty("luminosity_distance_mpc").GetDouble(), 1e-6);
            AssertRelative.Equal(v["mu"], items[i].GetProperty("distance_modulus_mag").GetDouble(), 1e-6);
            AssertRelative.Equal(v["lookback"], items[i].GetProperty("lookback_time_gyr").GetDouble(), 1e-6);
            AssertRelative.Equal(v["age"], items[i].GetProperty("age_gyr").GetDouble(), 1e-6);
        }
    }

    [Fact]
    public void Distances_with_z_from_adds_lens_columns()
    {
        var (code, output, _) = CliRunner.Run("distances", "--z", "1,2", "--z-from", "0.5", "--format", "csv");
        Assert.Equal(0, code);
        string[] lines = output.Trim().Split('\n');
        Assert.Contains("angular_diameter_distance_from_mpc", lines[0]);
        Assert.Contains("time_delay_distance_mpc", lines[0]);
        Assert.Equal(3, lines.Length);
    }

    [Theory]
    [InlineData("distances", "--z", "abc")]
    [InlineData("distances", "--z", "1", "--z-from", "2")]
    [InlineData("distances", "--z", "1", "--format", "xml")]
    [InlineData("distances")]
    [InlineData("nosuchcommand")]
    public void Bad_arguments_exit_2(params string[] args)
    {
        var (code, _, err) = CliRunner.Run(args);
        Assert.Equal(2, code);
        Assert.NotEmpty(err);
    }
}
