using Lightfold.Configuration;

namespace Lightfold.Tests.Configuration;

public class ScenarioLoaderTests
{
    static Scenario Load(string[]? files = null, string[]? sets = null, Dictionary<string, string?>? env = null)
        => ScenarioLoader.Load(files ?? [], sets ?? [], env ?? []);

    static string TempJson(string text)
    {
        string path = Path.Combine(Path.GetTempPath(), $"lightfold-test-{Guid.NewGuid():N}.json");
        File.WriteAllText(path, text);
        return path;
    }

    [Fact]
    public void Embedded_default_is_valid()
    {
        var s = Load();
        Assert.Equal(70.0, s.Cosmology.H0KmSMpc);
        Assert.Contains("\"h0_kms_mpc\"", s.ResolvedJson);
    }

    [Fact]
    public void Layers_apply_in_order_file_then_environment_then_set()
    {
        string file = TempJson("""
            // comments and trailing commas are allowed
            { "cosmology": { "h0_kms_mpc": 60, "omega_m0": 0.25, "w0": -0.9, }, }
            """);
        var env = new Dictionary<string, string?> { ["LIGHTFOLD__COSMOLOGY__OMEGA_M0"] = "0.35", ["OTHER__X"] = "1" };
        var s = Load([file], ["cosmology.w0=-0.8"], env);
        Assert.Equal(60.0, s.Cosmology.H0KmSMpc);    // file over default
        Assert.Equal(0.35, s.Cosmology.OmegaM0);     // environment over file
        Assert.Equal(-0.8, s.Cosmology.W0);          // --set over everything
    }

    [Fact]
    public void Later_config_file_wins()
    {
        string a = TempJson("""{ "cosmology": { "h0_kms_mpc": 60 } }""");
        string b = TempJson("""{ "cosmology": { "h0_kms_mpc": 65 } }""");
        Assert.Equal(65.0, Load([a, b]).Cosmology.H0KmSMpc);
    }

    [Fact]
    public void Lists_replace_rather_than_merge()
    {
        string a = TempJson("""{ "cosmology": { "tcmb0_k": 2.7255, "neutrino_masses_ev": [0.1, 0.1, 0.1] } }""");
        string b = TempJson("""{ "cosmology": { "neutrino_masses_ev": [0.06, 0] , "neff": 2.5 } }""");
        Assert.Equal([0.06, 0.0], Load([a, b]).Cosmology.NeutrinoMassesEv.ToArray());
        Assert.Equal([0.2, 0.0, 0.0], Load([a], ["cosmology.neutrino_masses_ev=0.2,0,0"]).Cosmology.NeutrinoMassesEv.ToArray());
    }

    [Theory]
    [InlineData("cosmology.h0_kms_mpc=abc", "cosmology.h0_kms_mpc", "abc")]
    [InlineData("cosmology.h0_kms_mpc=NaN", "cosmology.h0_kms_mpc", "NaN")]
    [InlineData("cosmology.omega_m0=Infinity", "cosmology.omega_m0", "Infinity")]
    [InlineData("cosmology.omega_m0=-0.1", "cosmology.omega_m0", "[0, 10]")]
    [InlineData("run.seed=-3", "run.seed", "-3")]
    [InlineData("cosmology.neutrino_masses_ev=0.1,x", "cosmology.neutrino_masses_ev[1]", "x")]
    public void Bad_values_name_the_key_and_the_value_or_range(string set, string key, string mention)
    {
        var e = Assert.Throws<InputException>(() => Load(sets: [set]));
        Assert.Contains(key, e.Message);
        Assert.Contains(mention, e.Message);
    }

    [Fact]
    public void Unknown_key_suggests_the_nearest_valid_key()
    {
        var e = Assert.Throws<InputException>(() => Load(sets: ["cosmology.h0=67"]));
        Assert.Contains("unknown config key 'cosmology.h0'", e.Message);
        Assert.Contains("did you mean 'cosmology.h0_kms_mpc'", e.Message);
        var e2 = Assert.Throws<InputException>(() => Load(sets: ["cosmolgy.omega_m0=0.3"]));
        Assert.Contains("'cosmology.omega_m0'", e2.Message);
    }

    [Fact]
    public void Malformed_files_and_sets_are_clear_errors()
    {
        Assert.Contains("line", Assert.Throws<InputException>(() => Load([TempJson("{ \"run\": { \"seed\": 1, }\n  oops }")])).Message);
        Assert.Contains("does not exist", Assert.Throws<InputException>(() => Load(["/nonexistent/x.json"])).Message);
        Assert.Contains("expected section.key=value", Assert.Throws<InputException>(() => Load(sets: ["novalue"])).Message);
        Assert.Contains("top level", Assert.Throws<InputException>(() => Load([TempJson("[1,2]")])).Message);
    }

    [Fact]
    public void A_universe_without_a_valid_expansion_history_is_refused()
    {
        // Ωm = 0.3, Ωk = −2 gives Ω_Λ = 2.7 and H² < 0 at moderate z (a bounce): not integrable.
        var e = Assert.Throws<InputException>(() => Load(sets: ["cosmology.omega_k0=-2"]));
        Assert.Contains("not a valid expanding universe", e.Message);
    }
}
