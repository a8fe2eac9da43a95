using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using Lightfold.Analysis;
using Lightfold.Catalog;
using ScottPlot;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold report</c>: yields with Poisson uncertainties, distributions, yield vs depth, a light-curve gallery and an H0 forecast.</summary>
public static class ReportCommand
{
    static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var dir = new Argument<string>("catalog") { Description = "catalog folder written by simulate (all shard parts are read)" };
        var output = new Option<string?>("--out") { Description = "report folder (default: CATALOG/report)" };
        var delays = new Option<string?>("--delays") { Description = "delay estimates (as score-delays reads) to use for the H0 forecast instead of the delay-error model" };
        var gallery = new Option<int>("--gallery") { Description = "light-curve plots of this many detected systems", DefaultValueFactory = _ => 4 };
        var minDelay = new Option<double>("--min-delay-days") { Description = "H0: shortest usable delay", DefaultValueFactory = _ => 10 };
        var floorDays = new Option<double>("--delay-floor-days") { Description = "H0: delay error floor σ₀ without measured delays", DefaultValueFactory = _ => 1.0 };
        var micro = new Option<double>("--micro-fraction") { Description = "H0: microlensing delay error as a fraction of the delay", DefaultValueFactory = _ => 0.01 };
        var model = new Option<double>("--lens-model-floor") { Description = "H0: per-system lens-model (mass-sheet) fractional floor", DefaultValueFactory = _ => 0.05 };
        var los = new Option<double>("--los-floor") { Description = "H0: per-system line-of-sight fractional floor", DefaultValueFactory = _ => 0.03 };
        var command = new Command("report", "Summarise a catalog for survey planning: yields per year with Poisson errors, distributions, yield vs depth, gallery, H0 forecast");
        command.Arguments.Add(dir);
        foreach (var o in new Option[] { output, delays, gallery, minDelay, floorDays, micro, model, los }) command.Options.Add(o);
        command.SetAction(parse =>
        {
            string catalog = parse.GetValue(dir)!;
            string outDir = parse.GetValue(output) ?? Path.Combine(catalog, "report");
            var settings = new H0ForecastSettings
            {
                MinDelayDays = OptionChecks.Above(parse.GetValue(minDelay), "--min-delay-days", 0), DelayFloorDays = OptionChecks.Above(parse.GetValue(floorDays), "--delay-floor-days", 0),
                MicrolensingFraction = OptionChecks.InRange(parse.GetValue(micro), "--micro-fraction", 0, double.PositiveInfinity), LensModelFraction = OptionChecks.InRange(parse.GetValue(model), "--lens-model-floor", 0, double.PositiveInfinity),
                LineOfSightFraction = OptionChecks.InRange(parse.GetValue(los), "--los-floor", 0, double.PositiveInfinity),
            };
            var report = Build(catalog, outDir, parse.GetValue(delays), Math.Max(0, parse.GetValue(gallery)), settings);
            context.Out.Write(report);
            context.Out.WriteLine($"\nwrote {Path.Combine(outDir, "summary.md")}, summary.json and the plots in {outDir}");
            return ExitCodes.Ok;
        });
        return command;
    }


    /// <summary>Writes the report files and returns the Markdown summary.</summary>
    public static string Build(string catalog, string outDir, string? delaysPath, int galleryCount, H0ForecastSettings h0)
    {
        var systems = CatalogReader.Read(catalog, CatalogSchema.SystemsTable);
        var images = CatalogReader.Read(catalog, CatalogSchema.ImagesTable);
        bool lightCurves = systems.Has(Columns.Detected);
        if (!double.TryParse(systems.Metadata.GetValueOrDefault("lightfold.explosion_years"), NumberStyles.Float, Inv, out double years) || years <= 0)
            throw new InputException($"catalog '{catalog}' has no explosion-window metadata (not written by lightfold simulate?)");
        Directory.CreateDirectory(outDir);
        int n = systems.Rows;
        var w = systems.D(Columns.Weight);
        var type = systems.S(Columns.TransientType);
        var nImages = systems.I(Columns.NImages);
        var detected = lightCurves ? systems.B(Columns.Detected) : new bool[n];
        string mode = systems.Metadata.GetValueOrDefault("lightfold.mode", "?");
        string name = ScenarioName(systems.Metadata.GetValueOrDefault("lightfold.config", "{}"));

        var md = new StringBuilder();
        var json = new Dictionary<string, object?> { ["catalog"] = catalog, ["scenario"] = name, ["mode"] = mode, ["rows"] = n, ["explosion_years"] = years, ["note"] = "simulated, not observed" };
        md.AppendLine($"# Lensed transients expected in '{name}' (simulated forecast)\n");
        md.AppendLine($"{n:N0} catalog rows ({mode} mode), {years.ToString("F2", Inv)} years of explosions in the footprint. Counts are per year; ± is the Poisson");
        md.AppendLine("scatter of one survey with that expectation, (±MC) the sampling error of this catalog. Nothing here is observed.\n");

        var groups = new List<(string Group, string Name, Func<int, bool> Pick)> { ("all", "all multiply imaged", _ => true) };
        if (lightCurves) groups.Add(("all", "detected", i => detected[i]));
        foreach (string t in type.Distinct().Order(StringComparer.Ordinal))
        {
            groups.Add(("type", $"{t}", i => type[i] == t));
            if (lightCurves) groups.Add(("type", $"{t} detected", i => type[i] == t && detected[i]));
        }
        foreach (var (label, pick) in new (string, Func<int, int, bool>)[] { ("2 images", (k, _) => k == 2), ("3 images", (k, _) => k == 3), ("4+ images", (k, _) => k >= 4) })
        {
            groups.Add(("images", label, i => pick(nImages[i], i)));
            if (lightCurves) groups.Add(("images", $"{label}, detected", i => pick(nImages[i], i) && detected[i]));
        }
        md.AppendLine("| group | per year | ± Poisson | ± MC | rows |\n| --- | ---: | ---: | ---: | ---: |");
        var table = new List<object>();
        foreach (var (group, label, pick) in groups)
        {
            var c = YieldCount.Of(Enumerable.Range(0, n).Where(pick).Select(i => w[i]), years);
            md.AppendLine($"| {label} | {c.PerYear.ToString("F2", Inv)} | {c.PoissonPerYear.ToString("F2", Inv)} | {c.SamplingPerYear.ToString("F2", Inv)} | {c.Rows:N0} |");
            table.Add(new { group, name = label, per_year = c.PerYear, poisson_per_year = c.PoissonPerYear, mc_per_year = c.SamplingPerYear, expected_total = c.ExpectedTotal, rows = c.Rows });
        }
        json["yields"] = table;

        var plots = Distributions(outDir, systems, images, detected, lightCurves);
        md.AppendLine($"\nPlots: {string.Join(", ", plots.Select(p => $"[{Path.GetFileNameWithoutExtension(p)}]({Path.GetFileName(p)})"))}.");
        json["plots"] = plots.Select(Path.GetFileName).ToArray();

        if (lightCurves)
        {
            var obs = CatalogReader.Read(catalog, CatalogSchema.ObservationsTable, [Columns.SystemId, Columns.ImageIndex, Columns.TrueFluxNjy, Columns.FluxNjy, Columns.Snr]);
            var depth = YieldVersusDepth(outDir, systems, obs, years);
            md.AppendLine($"\n## Yield against limiting magnitude\n\nExpected systems per year whose brightest image peaks brighter than m (true flux at the visits, any band): " +
                          string.Join(", ", depth.Where(d => d.Mag % 1 == 0).Select(d => $"m < {d.Mag.ToString("F0", Inv)}: {d.PerYear.ToString("G3", Inv)}")) + ". See [yield_vs_depth](yield_vs_depth.png).");
            json["yield_vs_depth"] = depth.Select(d => new { limiting_mag = d.Mag, per_year = d.PerYear }).ToArray();

            var galleryIds = Enumerable.Range(0, n).Where(i => detected[i]).OrderByDescending(i => systems.I(Columns.NDetections)[i]).ThenBy(i => systems.L(Columns.SystemId)[i])
                .Take(galleryCount).Select(i => systems.L(Columns.SystemId)[i]).ToList();
            foreach (long id in galleryIds)
            {
                var s1 = CatalogReader.Read(catalog, CatalogSchema.SystemsTable, null, id, id);
                var o1 = CatalogReader.Read(catalog, CatalogSchema.ObservationsTable, null, id, id);
                LightCurveCommand.Plot(Path.Combine(outDir, $"gallery_{id}.png"), id, s1, o1);
            }
            if (galleryIds.Count > 0)
                md.AppendLine($"\n## Gallery\n\n{string.Join(" ", galleryIds.Select(id => $"[system {id}](gallery_{id}.png)"))}: detected systems with the most detections.");

            var (rows, source) = H0Sample(systems, images, delaysPath, catalog, h0, years);
            var forecast = new[] { 1.0, 2, 3, 5, 10 }.Select(y => (Years: y, Fraction: H0Forecast.Combined(rows, y, h0))).ToList();
            md.AppendLine($"\n## Hubble-constant forecast\n\nFrom detected systems with a delay of at least {h0.MinDelayDays.ToString(Inv)} d ({rows.Count(r => r.DelayDays >= h0.MinDelayDays)} catalog rows, " +
                          $"{rows.Where(r => r.DelayDays >= h0.MinDelayDays).Sum(r => r.PerYear).ToString("F1", Inv)} per year); delay errors {source}; floors: lens model {h0.LensModelFraction.ToString(Inv)}, " +
                          $"line of sight {h0.LineOfSightFraction.ToString(Inv)} per system. D_Δt ∝ 1/H0, so each system's fractional D_Δt error is its fractional H0 error.\n");
            md.AppendLine("| survey years | σ(H0)/H0 |\n| ---: | ---: |");
            foreach (var (y, f) in forecast) md.AppendLine($"| {y.ToString(Inv)} | {(double.IsFinite(f) ? f.ToString("P2", Inv) : "no usable systems")} |");
            json["h0_forecast"] = forecast.Select(f => new { years = f.Years, fractional_error = double.IsFinite(f.Fraction) ? f.Fraction : (double?)null }).ToArray();
            PlotH0(outDir, rows, h0);
            md.AppendLine("\nSee [h0_forecast](h0_forecast.png).");
        }
        else md.AppendLine("\n(The catalog has no light curves: detection, yield vs depth, gallery and H0 forecast need `simulate` with light curves.)");

        AtomicFile.WriteAllText(Path.Combine(outDir, "summary.md"), md.ToString());
        AtomicFile.WriteAllText(Path.Combine(outDir, "summary.json"), JsonSerializer.Serialize(json, new JsonSerializerOptions { WriteIndented = true }));
        return md.ToString();
    }

    static string ScenarioName(string configJson)
    {
        try
        {
            using var doc = JsonDocument.Parse(configJson);
            return doc.RootElement.GetProperty("run").GetProperty("name").GetString() ?? "?";
        }
        catch (Exception e) when (e is JsonException or KeyNotFoundException or InvalidOperationException)
        {
            return "?";
        }
    }

    static List<string> Distributions(string outDir, TableColumns s, TableColumns im, bool[] detected, bool lightCurves)
    {
        int n = s.Rows;
        var w = s.D(Columns.Weight);
        var det = Enumerable.Range(0, n).Where(i => detected[i]).ToArray();
        (string, double[], double[])[] Series(double[] values) => lightCurves
            ? [("all", values, w), ("detected", det.Select(i => values[i]).ToArray(), det.Select(i => w[i]).ToArray())]
            : [("all", values, w)];
        var files = new List<string>();
        void Save(string file, Plot[] panels)
        {
            string path = Path.Combine(outDir, file);
            PngPanels.Save(path, panels, 900, 420);
            files.Add(path);
        }
        // Each quantity twice: expected events in the catalog (all and detected), then each series normalised to 1 so the
        // detected shape can be compared with the parent population.
        Plot[] Both(string title, string x, double[] edges, double[] values, bool logX = false) =>
        [
            Histograms.Build($"{title}: expected events (weighted)", x, "expected events", edges, Series(values), logX),
            Histograms.Build($"{title}: shapes (each normalised to 1)", x, "fraction per bin", edges, Series(values), logX, normalise: true),
        ];
        Save("redshifts.png", [.. Both("source redshift", "z_source", Histograms.Edges(0, 3.2, 32), s.D(Columns.ZSource)),
            .. Both("lens redshift", "z_lens", Histograms.Edges(0, 2.0, 40), s.D(Columns.ZLens))]);
        Save("separations.png", Both("largest image separation", "separation [arcsec]", Histograms.Edges(0, 5, 50), s.D(Columns.MaxSeparationArcsec)));
        Save("delays.png", Both("longest delay", "delay [days]", Histograms.Edges(-1, 3, 40), s.D(Columns.MaxDelayDays).Select(v => Math.Max(v, 1e-3)).ToArray(), logX: true));
        // Per-image |μ|: weights from the parent system.
        var weightById = new Dictionary<long, (double W, bool D)>();
        for (int i = 0; i < n; i++) weightById[s.L(Columns.SystemId)[i]] = (w[i], detected[i]);
        var mu = im.D(Columns.Magnification).Select(Math.Abs).ToArray();
        var wi = im.L(Columns.SystemId).Select(id => weightById[id].W).ToArray();
        var di = im.L(Columns.SystemId).Select(id => weightById[id].D).ToArray();
        var imageSeries = lightCurves
            ? new (string, double[], double[])[] { ("all images", mu, wi), ("images of detected systems", mu.Where((_, k) => di[k]).ToArray(), wi.Where((_, k) => di[k]).ToArray()) }
            : [("all images", mu, wi)];
        Save("magnifications.png", [
            Histograms.Build("total magnification Σ|μ|", "Σ|μ|", "expected events", Histograms.Edges(-0.5, 2.5, 45), Series(s.D(Columns.TotalMagnification)), logX: true),
            Histograms.Build("total magnification Σ|μ|: shapes (each normalised to 1)", "Σ|μ|", "fraction per bin", Histograms.Edges(-0.5, 2.5, 45), Series(s.D(Columns.TotalMagnification)), logX: true, normalise: true),
            Histograms.Build("per-image |μ| (shapes, each normalised to 1)", "|μ|", "fraction per bin", Histograms.Edges(-2, 2.5, 45), imageSeries, logX: true, normalise: true)]);
        return files;
    }

    static List<(double Mag, double PerYear)> YieldVersusDepth(string outDir, TableColumns s, TableColumns obs, double years)
    {
        var peak = new Dictionary<long, double>();
        var sid = obs.L(Columns.SystemId);
        var idx = obs.I(Columns.ImageIndex);
        var truth = obs.D(Columns.TrueFluxNjy);
        for (int r = 0; r < obs.Rows; r++)
            if (idx[r] >= 0 && truth[r] > peak.GetValueOrDefault(sid[r])) peak[sid[r]] = truth[r];
        var mags = new List<double>();
        var result = new List<(double, double)>();
        var w = s.D(Columns.Weight);
        var ids = s.L(Columns.SystemId);
        for (double m = 18; m <= 28.001; m += 0.25)
        {
            double limit = Photometry.SyntheticPhotometry.NjyFromMagnitude(m), sum = 0;
            for (int i = 0; i < s.Rows; i++) if (peak.GetValueOrDefault(ids[i]) > limit) sum += w[i];
            result.Add((Math.Round(m, 2), sum / years));
        }
        var plot = new Plot();
        var line = plot.Add.Scatter(result.Select(r => r.Item1).ToArray(), result.Select(r => Math.Log10(Math.Max(r.Item2, 1e-2))).ToArray());
        line.LegendText = "brightest image peaks brighter than m";
        plot.Title("expected lensed transients per year brighter than a limiting magnitude (simulated)");
        plot.XLabel("limiting AB magnitude m (peak true flux of the brightest image at the visits)");
        plot.YLabel("log10(systems per year)");
        PngPanels.Save(Path.Combine(outDir, "yield_vs_depth.png"), [plot], 900, 500);
        return result;
    }

    static (List<H0System> Rows, string Source) H0Sample(TableColumns s, TableColumns im, string? delaysPath, string catalog, H0ForecastSettings h0, double years)
    {
        var delay = new Dictionary<long, (double Delay, int Image)>();
        for (int i = 0; i < im.Rows; i++)
        {
            long id = im.L(Columns.SystemId)[i];
            double d = im.D(Columns.DelayDays)[i];
            if (d > delay.GetValueOrDefault(id).Delay) delay[id] = (d, im.I(Columns.ImageIndex)[i]);
        }
        Dictionary<(long, int), double>? measured = null;
        if (delaysPath is not null)
            measured = DelayEstimatesFile.Read(delaysPath).Where(r => r.ImageA == 0 && double.IsFinite(r.DelayDays) && r.ErrorDays > 0)
                .ToDictionary(r => (r.SystemId, r.ImageB), r => r.ErrorDays);
        var rows = new List<H0System>();
        for (int i = 0; i < s.Rows; i++)
        {
            if (!s.B(Columns.Detected)[i]) continue;
            long id = s.L(Columns.SystemId)[i];
            var (d, image) = delay.GetValueOrDefault(id);
            if (d <= 0) continue;
            double err = measured is null ? H0Forecast.ModelDelayError(d, h0)
                : measured.TryGetValue((id, image), out double e) ? e : double.PositiveInfinity;
            rows.Add(new H0System(d, err, s.D(Columns.Weight)[i] / years));
        }
        return (rows, measured is null
            ? $"from the model √(σ₀² + (ε Δt)²) with σ₀ = {h0.DelayFloorDays.ToString(Inv)} d, ε = {h0.MicrolensingFraction.ToString(Inv)}"
            : $"from '{delaysPath}' (unmeasured pairs contribute nothing)");
    }

    static void PlotH0(string outDir, List<H0System> rows, H0ForecastSettings h0)
    {
        var years = Enumerable.Range(1, 40).Select(k => k * 0.25).ToArray();
        var f = years.Select(y => H0Forecast.Combined(rows, y, h0)).Select(v => double.IsFinite(v) ? 100 * v : double.NaN).ToArray();
        var plot = new Plot();
        var line = plot.Add.Scatter(years, f);
        line.LegendText = "σ(H0)/H0";
        plot.Title("forecast precision on H0 from lensed-transient delays (simulated)");
        plot.XLabel("survey years");
        plot.YLabel("σ(H0)/H0 [%]");
        PngPanels.Save(Path.Combine(outDir, "h0_forecast.png"), [plot], 900, 500);
    }
}
