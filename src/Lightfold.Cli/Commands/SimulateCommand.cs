using System.CommandLine;
using System.Globalization;
using System.Reflection;
using Lightfold.Pipeline;
using Lightfold.Populations;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold simulate</c>: the main job — draw, solve and write a catalog of lensed systems.</summary>
public static class SimulateCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var output = new Option<string>("--out", "-o") { Description = "catalog folder to write (created; a rerun resumes it)", Required = true };
        var seed = new Option<string?>("--seed") { Description = "master seed (same as --set run.seed=S)" };
        var mode = new Option<string?>("--mode") { Description = "oversample (count weighted systems), realization (one Poisson draw of the survey) or training (labelled lensed + unlensed objects with splits and features)" };
        mode.AcceptOnlyFromAmong("oversample", "realization", "training");
        var count = new Option<string?>("--count") { Description = "systems in oversample and training modes (same as --set run.count=N)" };
        var shard = new Option<int>("--shard") { Description = "this process's part, 0-based (with --shards)", DefaultValueFactory = _ => 0 };
        var shards = new Option<int>("--shards") { Description = "number of parts the run is split into", DefaultValueFactory = _ => 1 };
        var threads = new Option<int>("--threads") { Description = "worker threads (default: all cores); output does not depend on it", DefaultValueFactory = _ => 0 };
        var quiet = new Option<bool>("--quiet", "-q") { Description = "no progress on stderr" };
        var noLightCurves = new Option<bool>("--no-light-curves") { Description = "write systems and images only (same as --set light_curves.enabled=false)" };
        var scenario = new ScenarioOptions();

        var command = new Command("simulate", "Draw lensed transients from the scenario, solve every lens, observe them and write the systems, images and observations tables (Parquet)");
        foreach (var o in new Option[] { output, seed, mode, count, shard, shards, threads, quiet, noLightCurves }) command.Options.Add(o);
        scenario.AddTo(command);
        command.SetAction(async (parse, ct) =>
        {
            var extra = new List<string>();
            if (parse.GetValue(seed) is { } s) extra.Add($"run.seed={s}");
            if (parse.GetValue(mode) is { } m) extra.Add($"run.mode={m}");
            if (parse.GetValue(count) is { } c) extra.Add($"run.count={c}");
            if (parse.GetValue(noLightCurves)) extra.Add("light_curves.enabled=false");
            var loaded = scenario.Load(parse, context, [.. extra]);
            if (parse.GetValue(threads) < 0) throw new InputException($"--threads {parse.GetValue(threads)}: expected ≥ 0");
            var target = new RunTarget(parse.GetValue(output)!, parse.GetValue(shard), parse.GetValue(shards), parse.GetValue(threads), Version);
            var progress = new ProgressReporter(context.Error, parse.GetValue(quiet), interactive: context.Error == Console.Error && !Console.IsErrorRedirected);
            var summary = await SimulationRunner.RunAsync(loaded, target, progress, ct);
            PrintSummary(context.Out, loaded, target, summary);
            return ExitCodes.Ok;
        });
        return command;
    }

    /// <summary>The tool version written to catalogs.</summary>
    public static string Version => typeof(SimulateCommand).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion.Split('+')[0] ?? "0";

    static void PrintSummary(TextWriter o, Configuration.Scenario scenario, RunTarget target, RunSummary s)
    {
        var inv = CultureInfo.InvariantCulture;
        double years = scenario.Survey.ExplosionYears;
        o.WriteLine($"{scenario.Survey.Name}: {scenario.Survey.AreaDeg2.ToString("G6", inv)} deg², MJD {scenario.Survey.StartMjd}–{scenario.Survey.EndMjd} (+{scenario.Survey.LeadInDays} d lead-in); simulated, not observed");
        o.WriteLine($"expected multiply-imaged events in the footprint (all, before detection):");
        o.WriteLine($"  {"type",-5} {"per year",12} {"in window",12} {"quads/yr",10}");
        foreach (var y in s.Yield.ByType.Values)
            o.WriteLine($"  {TransientTypes.Name(y.Type),-5} {(y.Lensed / years).ToString("F2", inv),12} {y.Lensed.ToString("F1", inv),12} {(y.Quads / years).ToString("F2", inv),10}");
        o.WriteLine($"  {"all",-5} {(s.Yield.TotalLensed / years).ToString("F2", inv),12} {s.Yield.TotalLensed.ToString("F1", inv),12}");
        string mode = scenario.Run.Mode switch
        {
            Configuration.RunMode.Oversample => $"oversample, weight {s.Weight.ToString("G6", inv)} per row",
            Configuration.RunMode.Realization => "realization, weight 1",
            _ => $"training set, {scenario.Run.Training.LensedFraction.ToString("P0", inv)} lensed, splits train/validation/test {scenario.Run.Training.TrainFraction.ToString(inv)}/{scenario.Run.Training.ValidationFraction.ToString(inv)}/rest; features table written",
        };
        if (s.Skipped)
            o.WriteLine($"shard {target.Shard}/{target.Shards} was already complete in {target.OutputDirectory}: nothing written");
        else
        {
            string obs = scenario.Observing.LightCurves ? $", {s.ObservationsWritten:N0} observations" : "";
            o.WriteLine($"wrote {s.SystemsWritten:N0} systems, {s.ImagesWritten:N0} images{obs} ({mode}; {s.TotalSystems:N0} systems in all shards) to {target.OutputDirectory}");
            if (scenario.Observing.LightCurves)
                o.WriteLine($"detected by the survey: {s.Detected.Count:N0} of these systems, {(s.Detected.Weight / years).ToString("F2", inv)} expected per year");
        }
    }
}
