using System.CommandLine;
using Lightfold.Analysis;
using Lightfold.Catalog;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold estimate-delays</c>: a baseline delay estimator run on every detected system's image pairs.</summary>
public static class EstimateDelaysCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var catalog = new Option<string>("--catalog") { Description = "catalog folder written by simulate", Required = true };
        var output = new Option<string>("--out") { Description = "estimates table to write (.csv, or .parquet)", Required = true };
        var seed = new Option<ulong>("--seed") { Description = "seed of the bootstrap streams", DefaultValueFactory = _ => 1UL };
        var command = new Command("estimate-delays", "Estimate the delays of every detected system's image pairs (0, k) by curve shifting with bootstrap errors; writes what score-delays reads");
        command.Options.Add(catalog);
        command.Options.Add(output);
        command.Options.Add(seed);
        command.SetAction(parse =>
        {
            string dir = parse.GetValue(catalog)!;
            var systems = CatalogReader.Read(dir, CatalogSchema.SystemsTable, [Columns.SystemId, Columns.Detected]);
            var images = CatalogReader.Read(dir, CatalogSchema.ImagesTable, [Columns.SystemId, Columns.ImageIndex, Columns.DelayDays, Columns.Magnification]);
            var obs = CatalogReader.Read(dir, CatalogSchema.ObservationsTable, [Columns.SystemId, Columns.ImageIndex, Columns.Mjd, Columns.Band, Columns.FluxNjy, Columns.Snr]);
            var targets = DelayPairs.Targets(systems, images, null);
            var curves = DelayPairs.LightCurves(obs, targets.Select(t => t.SystemId).ToHashSet());
            var estimator = new DispersionDelayEstimator();
            var rows = new DelayEstimateRow[targets.Count];
            ulong s = parse.GetValue(seed);
            Parallel.For(0, targets.Count, i =>
            {
                var t = targets[i];
                var est = EstimatePair(estimator, curves, t, s);
                rows[i] = new DelayEstimateRow(t.SystemId, t.ImageA, t.ImageB, est.DelayDays, est.ErrorDays, i + 1);
            });
            DelayEstimatesFile.Write(parse.GetValue(output)!, rows);
            int measured = rows.Count(r => double.IsFinite(r.DelayDays));
            context.Out.WriteLine($"estimated {measured} of {rows.Length} image pairs of detected systems (the rest lacked overlapping detections); wrote {parse.GetValue(output)}");
            return ExitCodes.Ok;
        });
        return command;
    }

    // The band whose two curves have the most points in common coverage; NaN if none has enough.
    static DelayEstimate EstimatePair(DispersionDelayEstimator estimator, Dictionary<(long, int), Dictionary<string, LightCurve>> curves, PairTruth t, ulong seed)
    {
        if (!curves.TryGetValue((t.SystemId, t.ImageA), out var a) || !curves.TryGetValue((t.SystemId, t.ImageB), out var b)) return new(double.NaN, double.NaN);
        var band = a.Keys.Intersect(b.Keys).OrderByDescending(k => Math.Min(a[k].Mjd.Length, b[k].Mjd.Length)).ThenBy(k => k, StringComparer.Ordinal).FirstOrDefault();
        return band is null ? new(double.NaN, double.NaN) : estimator.Estimate(a[band], b[band], seed, t.SystemId, (ulong)t.ImageB);
    }
}
