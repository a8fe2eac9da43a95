using System.CommandLine;
using System.Diagnostics;
using System.Globalization;
using Lightfold.Catalog;
using Lightfold.Cosmology;
using Lightfold.Microlensing;
using ScottPlot;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold micromap</c>: one microlensing magnification map (FITS), its statistics and a PNG.</summary>
public static class MicromapCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var kappa = new Option<double>("--kappa") { Description = "total convergence κ at the image", Required = true };
        var gamma = new Option<double>("--gamma") { Description = "shear γ at the image", Required = true };
        var kappaStar = new Option<double>("--kappa-star") { Description = "convergence in stars κ_* (≤ κ)", Required = true };
        var size = new Option<double>("--size") { Description = "map side in Einstein radii of a 1 M☉ star", DefaultValueFactory = _ => 20 };
        var pixels = new Option<int>("--pixels") { Description = "pixels per side", DefaultValueFactory = _ => 500 };
        var rays = new Option<double>("--rays-per-pixel") { Description = "mean rays per pixel", DefaultValueFactory = _ => 100 };
        var seed = new Option<ulong>("--seed") { Description = "star-field seed", DefaultValueFactory = _ => 1UL };
        var imf = new Option<string>("--imf") { Description = "salpeter or kroupa", DefaultValueFactory = _ => "salpeter" };
        imf.AcceptOnlyFromAmong("salpeter", "kroupa");
        var mmin = new Option<double>("--mass-min") { Description = "lowest stellar mass [M☉]", DefaultValueFactory = _ => 0.1 };
        var mmax = new Option<double>("--mass-max") { Description = "highest stellar mass [M☉]", DefaultValueFactory = _ => 1.0 };
        var margin = new Option<double>("--margin") { Description = "source-plane margin shot around the map [R_E]", DefaultValueFactory = _ => 2 };
        var zl = new Option<double?>("--z-lens") { Description = "with --z-source: report R_E in cm and light-days (flat ΛCDM of the scenario)" };
        var zs = new Option<double?>("--z-source") { Description = "source redshift for R_E" };
        var threads = new Option<int>("--threads") { Description = "worker threads (default all cores); the map does not depend on it", DefaultValueFactory = _ => 0 };
        var output = new Option<string>("--out") { Description = "FITS file to write", Required = true };
        var png = new Option<string?>("--png") { Description = "also draw log10(μ/μ_macro) as a PNG" };
        var scenario = new ScenarioOptions();
        var command = new Command("micromap", "Shoot one microlensing magnification map (inverse ray shooting with a tree code); print its statistics");
        foreach (var o in new Option[] { kappa, gamma, kappaStar, size, pixels, rays, seed, imf, mmin, mmax, margin, zl, zs, threads, output, png }) command.Options.Add(o);
        scenario.AddTo(command);
        command.SetAction(parse =>
        {
            double k = OptionChecks.InRange(parse.GetValue(kappa), "--kappa", 0, 5), g = OptionChecks.InRange(parse.GetValue(gamma), "--gamma", 0, 5), ks = OptionChecks.InRange(parse.GetValue(kappaStar), "--kappa-star", 0, 5);
            if (ks > k) throw new InputException($"--kappa-star {ks} exceeds --kappa {k}");
            int n = parse.GetValue(pixels);
            if (n < 8 || n > 20000) throw new InputException($"--pixels {n}: expected 8 … 20000");
            double lo = OptionChecks.InRange(parse.GetValue(mmin), "--mass-min", 1e-3, 100), hi = OptionChecks.InRange(parse.GetValue(mmax), "--mass-max", 1e-3, 100);
            if (hi <= lo) throw new InputException($"--mass-max {hi} must exceed --mass-min {lo}");
            var spec = new MapSpec
            {
                Kappa = k, Gamma = g, KappaStar = ks,
                SizeEinsteinRadii = OptionChecks.InRange(parse.GetValue(size), "--size", 1e-3, 1e5),
                Pixels = n,
                RaysPerPixel = OptionChecks.InRange(parse.GetValue(rays), "--rays-per-pixel", 0.01, 1e6),
                MarginEinsteinRadii = OptionChecks.InRange(parse.GetValue(margin), "--margin", 0, 1e4),
                Seed = parse.GetValue(seed),
                Imf = new InitialMassFunction { Kind = parse.GetValue(imf)!, MinMassSolar = lo, MaxMassSolar = hi },
            };
            if (Math.Abs((1 - k) * (1 - k) - g * g) < 1e-3) throw new InputException($"κ = {k}, γ = {g} lies on a macro critical curve (|μ_macro| > 1000): no finite map");
            double? einsteinCm = null;
            if (parse.GetValue(zl) is { } zLens && parse.GetValue(zs) is { } zSource)
            {
                if (!(zSource > zLens && zLens > 0)) throw new InputException("--z-source must exceed --z-lens > 0");
                var c = new FlrwCosmology(scenario.Load(parse, context).Cosmology);
                einsteinCm = MicrolensingSettings.EinsteinRadiusCm(c.AngularDiameterDistanceMpc(zLens), c.AngularDiameterDistanceMpc(zSource), c.AngularDiameterDistanceMpc(zLens, zSource));
            }
            var watch = Stopwatch.StartNew();
            var map = RayShooter.Shoot(spec, parse.GetValue(threads));
            double seconds = watch.Elapsed.TotalSeconds;
            FitsMapCache.Write(parse.GetValue(output)!, map, einsteinCm);
            Report(context.Out, map, seconds, einsteinCm);
            if (parse.GetValue(png) is { } pngPath) Draw(pngPath, map);
            return ExitCodes.Ok;
        });
        return command;
    }


    static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    static void Report(TextWriter o, MagnificationMap map, double seconds, double? einsteinCm)
    {
        var s = map.Spec;
        double macro = Math.Abs(s.MacroMagnification);
        o.WriteLine($"map κ = {s.Kappa.ToString(Inv)}, γ = {s.Gamma.ToString(Inv)}, κ_* = {s.KappaStar.ToString(Inv)} ({s.Imf.Kind} {s.Imf.MinMassSolar.ToString(Inv)}–{s.Imf.MaxMassSolar.ToString(Inv)} M☉): " +
                    $"{s.Pixels}² pixels over {s.SizeEinsteinRadii.ToString(Inv)} R_E, {map.Stars:N0} stars, {map.Rays:N0} rays in {seconds:F1} s ({map.Rays / seconds:E2} rays/s)");
        if (einsteinCm is { } re)
            o.WriteLine($"R_E = {re.ToString("E4", Inv)} cm = {(re / Units.CmPerLightDay).ToString("F2", Inv)} light-days; pixel = {(re * s.SizeEinsteinRadii / s.Pixels).ToString("E3", Inv)} cm");
        o.WriteLine($"macro magnification |μ| = {macro.ToString("F4", Inv)}; map mean = {map.Mean().ToString("F4", Inv)} (ratio {(map.Mean() / macro).ToString("F4", Inv)})");
        o.WriteLine("quantiles of μ:  " + string.Join("  ", new[] { 0.05, 0.16, 0.5, 0.84, 0.95 }.Select(q => $"{(100 * q).ToString("F0", Inv)}%: {map.Quantile(q).ToString("G5", Inv)}")));
    }

    static void Draw(string path, MagnificationMap map)
    {
        int n = map.Pixels;
        double macro = Math.Abs(map.Spec.MacroMagnification);
        var values = new double[n, n];
        for (int y = 0; y < n; y++)
            for (int x = 0; x < n; x++)
                values[n - 1 - y, x] = Math.Log10(Math.Max(map.Magnification[y * n + x], 1e-3 * macro) / macro);
        var plot = new Plot();
        var heat = plot.Add.Heatmap(values);
        heat.Colormap = new ScottPlot.Colormaps.Viridis();
        heat.Extent = new CoordinateRect(-map.Spec.SizeEinsteinRadii / 2, map.Spec.SizeEinsteinRadii / 2, -map.Spec.SizeEinsteinRadii / 2, map.Spec.SizeEinsteinRadii / 2);
        plot.Add.ColorBar(heat).Label = "log10(μ / μ_macro)";
        plot.Title($"κ = {map.Spec.Kappa.ToString(Inv)}, γ = {map.Spec.Gamma.ToString(Inv)}, κ_* = {map.Spec.KappaStar.ToString(Inv)} (simulated)");
        plot.XLabel("source-plane x [R_E] (shear direction)");
        plot.YLabel("y [R_E]");
        PngPanels.Save(path, [plot], 900, 800);
    }
}
