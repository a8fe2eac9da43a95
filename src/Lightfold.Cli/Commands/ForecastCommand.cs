using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Lightfold.Cosmology;
using Lightfold.Populations;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold forecast</c>: expected yields alone (no per-event simulation), with the inputs that drive them.</summary>
public static class ForecastCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var format = new Option<string>("--format") { Description = "table or json", DefaultValueFactory = _ => "table" };
        format.AcceptOnlyFromAmong("table", "json");
        var scenario = new ScenarioOptions();
        var command = new Command("forecast", "Expected numbers of multiply-imaged transients in the survey, by type and image multiplicity (before detection)");
        command.Options.Add(format);
        scenario.AddTo(command);
        command.SetAction(parse =>
        {
            var s = scenario.Load(parse, context);
            var cosmology = new FlrwCosmology(s.Cosmology);
            var yield = new LensingYield(cosmology, s.Deflectors, s.Sources, s.Survey, Catalog.CrossSectionTableCache.Shared);
            if (parse.GetValue(format) == "json") WriteJson(context.Out, s, yield);
            else WriteTable(context.Out, s, yield);
            return ExitCodes.Ok;
        });
        return command;
    }

    static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    static void WriteTable(TextWriter o, Configuration.Scenario s, LensingYield y)
    {
        double years = s.Survey.ExplosionYears;
        o.WriteLine($"Forecast for '{s.Name}' — {s.Survey.Name}: {s.Survey.AreaDeg2.ToString("G6", Inv)} deg², {years.ToString("F3", Inv)} yr of explosions (window + lead-in)");
        o.WriteLine("Expected events in the footprint, all of them (detection is not applied). Simulated forecast, not an observation.");
        o.WriteLine();
        o.WriteLine($"{"type",-5} {"unlensed/yr",14} {"lensed/yr",11} {"doubles/yr",11} {"quads/yr",9} {"lensed total",13} {"lensed fraction",16}");
        foreach (var t in y.ByType.Values)
            o.WriteLine($"{TransientTypes.Name(t.Type),-5} {(t.Unlensed / years).ToString("G6", Inv),14} {(t.Lensed / years).ToString("F2", Inv),11} {((t.Lensed - t.Quads) / years).ToString("F2", Inv),11} {(t.Quads / years).ToString("F2", Inv),9} {t.Lensed.ToString("F1", Inv),13} {(t.Lensed / t.Unlensed).ToString("E3", Inv),16}");
        double lensed = y.ByType.Values.Sum(t => t.Lensed), quads = y.ByType.Values.Sum(t => t.Quads), unl = y.ByType.Values.Sum(t => t.Unlensed);
        o.WriteLine($"{"all",-5} {(unl / years).ToString("G6", Inv),14} {(lensed / years).ToString("F2", Inv),11} {((lensed - quads) / years).ToString("F2", Inv),11} {(quads / years).ToString("F2", Inv),9} {lensed.ToString("F1", Inv),13} {(lensed / unl).ToString("E3", Inv),16}");
        o.WriteLine();
        o.WriteLine("Inputs that drive these numbers:");
        foreach (var (key, value) in Inputs(s, y)) o.WriteLine($"  {key,-44} {value}");
    }

    static IEnumerable<(string, string)> Inputs(Configuration.Scenario s, LensingYield y)
    {
        var c = s.Cosmology;
        var d = s.Deflectors;
        yield return ("cosmology", $"H0 = {c.H0KmSMpc.ToString(Inv)}, Ωm = {c.OmegaM0.ToString(Inv)}, Ωk = {c.OmegaK0.ToString(Inv)}, w0 = {c.W0.ToString(Inv)}, wa = {c.WA.ToString(Inv)}");
        yield return ("source redshifts", $"{s.Sources.ZMin.ToString(Inv)} – {s.Sources.ZMax.ToString(Inv)}");
        yield return ("deflector VDF (modified Schechter)", $"φ* = {d.Vdf.PhiStarH3PerMpc3.ToString("G4", Inv)} h³/Mpc³, σ* = {d.Vdf.SigmaStarKms.ToString(Inv)} km/s, α = {d.Vdf.Alpha.ToString(Inv)}, β = {d.Vdf.Beta.ToString(Inv)}, evolution (1+z)^({d.Vdf.PhiStarEvolution.ToString(Inv)}, {d.Vdf.SigmaStarEvolution.ToString(Inv)})");
        yield return ("deflector ranges", $"σ {d.SigmaMinKms.ToString(Inv)}–{d.SigmaMaxKms.ToString(Inv)} km/s, z {d.ZMin.ToString(Inv)}–{d.ZMax.ToString(Inv)}");
        yield return ("mean cross-section (θ_E² units)", $"≥2 images {y.MeanAreaTwo.ToString("F4", Inv)}, ≥4 images {y.MeanAreaFour.ToString("F4", Inv)} (SIS: π, 0)");
        foreach (double z in new[] { 0.5, 1.0, 2.0 })
            if (z <= s.Sources.ZMax) yield return ($"multiply-imaged fraction at z_s = {z.ToString(Inv)}", y.OpticalDepth(z).ToString("E3", Inv));
        foreach (var t in s.Sources.Types)
            yield return ($"rest-frame rate {TransientTypes.Name(t)} at z = 0, 1 [1/yr/Mpc³]", $"{y.Rates.RestFrameRate(t, 0).ToString("E3", Inv)}, {y.Rates.RestFrameRate(t, 1).ToString("E3", Inv)}");
    }

    static void WriteJson(TextWriter o, Configuration.Scenario s, LensingYield y)
    {
        using var stream = new MemoryStream();
        using (var json = new Utf8JsonWriter(stream, new JsonWriterOptions { Indented = true }))
        {
            json.WriteStartObject();
            json.WriteString("scenario", s.Name);
            json.WriteString("survey", s.Survey.Name);
            json.WriteNumber("area_deg2", s.Survey.AreaDeg2);
            json.WriteNumber("explosion_years", s.Survey.ExplosionYears);
            json.WriteNumber("mean_cross_section_two_theta_e2", y.MeanAreaTwo);
            json.WriteNumber("mean_cross_section_four_theta_e2", y.MeanAreaFour);
            json.WriteStartArray("by_type");
            foreach (var t in y.ByType.Values)
            {
                json.WriteStartObject();
                json.WriteString("transient_type", TransientTypes.Name(t.Type));
                json.WriteNumber("unlensed_total", t.Unlensed);
                json.WriteNumber("lensed_total", t.Lensed);
                json.WriteNumber("quads_total", t.Quads);
                json.WriteNumber("lensed_per_year", t.Lensed / s.Survey.ExplosionYears);
                json.WriteNumber("quads_per_year", t.Quads / s.Survey.ExplosionYears);
                json.WriteEndObject();
            }
            json.WriteEndArray();
            json.WriteNumber("lensed_total", y.TotalLensed);
            json.WriteEndObject();
        }
        o.WriteLine(Encoding.UTF8.GetString(stream.ToArray()));
    }
}
