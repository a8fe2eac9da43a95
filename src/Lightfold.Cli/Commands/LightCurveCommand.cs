using System.CommandLine;
using System.Globalization;
using Lightfold.Catalog;
using ScottPlot;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold lightcurve</c>: one system's multi-image light curves, as a table or a PNG.</summary>
public static class LightCurveCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var dir = new Argument<string>("catalog") { Description = "catalog folder written by simulate" };
        var id = new Option<long>("--system-id") { Description = "system to show", Required = true };
        var png = new Option<string?>("--png") { Description = "write a plot (one panel per band) instead of printing rows" };
        var command = new Command("lightcurve", "Show one system's light curves: observed points with error bars and true fluxes, per image and band");
        command.Arguments.Add(dir);
        command.Options.Add(id);
        command.Options.Add(png);
        command.SetAction(parse =>
        {
            string catalog = parse.GetValue(dir)!;
            long systemId = parse.GetValue(id);
            var system = CatalogReader.Read(catalog, CatalogSchema.SystemsTable, null, systemId, systemId);
            if (system.Rows == 0) throw new InputException($"--system-id {systemId}: no such system in '{catalog}'");
            var images = CatalogReader.Read(catalog, CatalogSchema.ImagesTable, null, systemId, systemId);
            var obs = CatalogReader.Read(catalog, CatalogSchema.ObservationsTable, null, systemId, systemId);
            Describe(context.Out, system, images);
            if (parse.GetValue(png) is { } path)
            {
                Plot(path, systemId, system, obs);
                context.Out.WriteLine($"wrote {path}");
            }
            else Print(context.Out, obs);
            return ExitCodes.Ok;
        });
        return command;
    }

    static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    static void Describe(TextWriter o, TableColumns s, TableColumns im)
    {
        o.WriteLine($"system {s.L(Columns.SystemId)[0]}: {s.S(Columns.TransientType)[0]} at z = {s.D(Columns.ZSource)[0].ToString("F3", Inv)}, lens z = {s.D(Columns.ZLens)[0].ToString("F3", Inv)}, " +
                    $"θ_E = {s.D(Columns.ThetaEArcsec)[0].ToString("F3", Inv)}\", explosion MJD {s.D(Columns.T0Mjd)[0].ToString("F2", Inv)}" +
                    (s.Has(Columns.Detected) ? $", detected: {(s.B(Columns.Detected)[0] ? "yes" : "no")}" : "") + " (simulated)");
        for (int i = 0; i < im.Rows; i++)
            o.WriteLine($"  image {im.I(Columns.ImageIndex)[i]}: ({im.D(Columns.XArcsec)[i].ToString("F3", Inv)}\", {im.D(Columns.YArcsec)[i].ToString("F3", Inv)}\"), " +
                        $"μ = {im.D(Columns.Magnification)[i].ToString("F3", Inv)}, delay {im.D(Columns.DelayDays)[i].ToString("F2", Inv)} d");
    }

    static void Print(TextWriter o, TableColumns obs)
    {
        o.WriteLine($"{"mjd",12} {"band",4} {"image",5} {"flux_njy",12} {"flux_err_njy",12} {"true_flux_njy",13} {"snr",8}");
        var order = Enumerable.Range(0, obs.Rows).OrderBy(i => obs.D(Columns.Mjd)[i]).ThenBy(i => obs.I(Columns.ImageIndex)[i]);
        foreach (int i in order)
            o.WriteLine($"{obs.D(Columns.Mjd)[i].ToString("F3", Inv),12} {obs.S(Columns.Band)[i],4} {obs.I(Columns.ImageIndex)[i],5} " +
                        $"{obs.D(Columns.FluxNjy)[i].ToString("G6", Inv),12} {obs.D(Columns.FluxErrNjy)[i].ToString("G5", Inv),12} {obs.D(Columns.TrueFluxNjy)[i].ToString("G6", Inv),13} {obs.D(Columns.Snr)[i].ToString("F1", Inv),8}");
    }

    /// <summary>Writes the light-curve PNG of one system (one panel per band).</summary>
    public static void Plot(string path, long systemId, TableColumns s, TableColumns obs)
    {
        var bands = obs.S(Columns.Band).Distinct().ToList();
        if (bands.Count == 0) throw new InputException($"system {systemId} has no observations (outside the survey window or season)");
        var panels = new List<Plot>();
        var palette = new ScottPlot.Palettes.Category10();
        foreach (string band in bands)
        {
            var plot = new Plot();
            var images = Enumerable.Range(0, obs.Rows).Where(i => obs.S(Columns.Band)[i] == band).Select(i => obs.I(Columns.ImageIndex)[i]).Distinct().Order().ToList();
            foreach (int image in images)
            {
                var rows = Enumerable.Range(0, obs.Rows).Where(i => obs.S(Columns.Band)[i] == band && obs.I(Columns.ImageIndex)[i] == image)
                    .OrderBy(i => obs.D(Columns.Mjd)[i]).ToArray();
                double[] x = rows.Select(i => obs.D(Columns.Mjd)[i]).ToArray();
                var color = palette.GetColor(image < 0 ? 9 : image);
                string name = image < 0 ? "unresolved blend" : $"image {image}";
                var truth = plot.Add.Scatter(x, rows.Select(i => obs.D(Columns.TrueFluxNjy)[i]).ToArray());
                truth.Color = color; truth.MarkerSize = 0; truth.LineWidth = 1.5f; truth.LegendText = $"{name} true";
                var points = plot.Add.Scatter(x, rows.Select(i => obs.D(Columns.FluxNjy)[i]).ToArray());
                points.Color = color; points.LineWidth = 0; points.MarkerSize = 4; points.LegendText = $"{name} observed";
                var bars = plot.Add.ErrorBar(x, rows.Select(i => obs.D(Columns.FluxNjy)[i]).ToArray(), rows.Select(i => obs.D(Columns.FluxErrNjy)[i]).ToArray());
                bars.Color = color;
            }
            plot.Title($"system {systemId} ({s.S(Columns.TransientType)[0]}, z = {s.D(Columns.ZSource)[0].ToString("F2", Inv)}) — band {band} (simulated)");
            plot.XLabel("MJD");
            plot.YLabel("flux [nJy]");
            plot.ShowLegend(Alignment.UpperRight);
            panels.Add(plot);
        }
        PngPanels.Save(path, panels);
    }
}
