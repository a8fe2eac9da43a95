using System.CommandLine;
using System.Globalization;
using System.Text.Json;
using Lightfold.Analysis;
using Lightfold.Catalog;
using ScottPlot;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold score-delays</c>: Time Delay Challenge metrics of an estimates table against the catalog's truth.</summary>
public static class ScoreDelaysCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var catalog = new Option<string>("--catalog") { Description = "catalog folder written by simulate", Required = true };
        var estimates = new Option<string>("--estimates") { Description = "estimates table (CSV or Parquet): system_id, image_a, image_b, delay_days, delay_err_days; empty/NaN delay = not measured", Required = true };
        var png = new Option<string?>("--png") { Description = "also plot estimated against true delay" };
        var json = new Option<string?>("--json") { Description = "also write the metrics as JSON" };
        var command = new Command("score-delays", "Score delay estimates with the Time Delay Challenge metrics (f, χ², P, A), overall and binned");
        foreach (var o in new Option[] { catalog, estimates, png, json }) command.Options.Add(o);
        command.SetAction(parse =>
        {
            string dir = parse.GetValue(catalog)!;
            var systems = CatalogReader.Read(dir, CatalogSchema.SystemsTable, [Columns.SystemId, Columns.Detected]);
            var images = CatalogReader.Read(dir, CatalogSchema.ImagesTable, [Columns.SystemId, Columns.ImageIndex, Columns.DelayDays, Columns.Magnification]);
            var obs = CatalogReader.Read(dir, CatalogSchema.ObservationsTable, [Columns.SystemId, Columns.ImageIndex, Columns.Mjd, Columns.Band, Columns.MicroMagnification]);
            var rows = DelayEstimatesFile.Read(parse.GetValue(estimates)!);
            var scored = Score(systems, images, obs, rows, out var missing);
            var metrics = DelayMetrics.Of(scored.Select(x => x.Pair).ToList());
            Print(context.Out, metrics, scored, missing);
            if (parse.GetValue(png) is { } path) Plot(path, scored);
            if (parse.GetValue(json) is { } jsonPath) WriteJson(jsonPath, metrics, scored, missing);
            return ExitCodes.Ok;
        });
        return command;
    }

    /// <summary>Joins estimates to truth. Unknown systems, non-existent images and duplicate pairs are input errors
    /// (one message listing them); target pairs (0, k) of detected systems absent from the table count as not submitted.</summary>
    public static List<(ScoredPair Pair, PairTruth Truth)> Score(TableColumns systems, TableColumns images, TableColumns obs, List<DelayEstimateRow> rows, out int missing)
    {
        var known = systems.L(Columns.SystemId).ToHashSet();
        var imageDelay = new Dictionary<(long, int), (double Delay, double Mu)>();
        for (int i = 0; i < images.Rows; i++) imageDelay[(images.L(Columns.SystemId)[i], images.I(Columns.ImageIndex)[i])] = (images.D(Columns.DelayDays)[i], images.D(Columns.Magnification)[i]);
        var unknown = rows.Where(r => !known.Contains(r.SystemId)).ToList();
        if (unknown.Count > 0)
            throw new InputException($"estimates name {unknown.Count} system(s) not in the catalog, e.g. system_id {unknown[0].SystemId} (row {unknown[0].Row})" +
                                     (unknown.Count > 1 ? $", {unknown[1].SystemId} (row {unknown[1].Row})" : ""));
        var badImage = rows.FirstOrDefault(r => !imageDelay.ContainsKey((r.SystemId, r.ImageA)) || !imageDelay.ContainsKey((r.SystemId, r.ImageB)));
        if (badImage.Row > 0) throw new InputException($"estimates row {badImage.Row}: system {badImage.SystemId} has no image {badImage.ImageA} or {badImage.ImageB}");
        var duplicate = rows.GroupBy(r => (r.SystemId, Math.Min(r.ImageA, r.ImageB), Math.Max(r.ImageA, r.ImageB))).FirstOrDefault(g => g.Count() > 1);
        if (duplicate is not null)
            throw new InputException($"estimates list the pair (system {duplicate.Key.SystemId}, images {duplicate.Key.Item2}, {duplicate.Key.Item3}) more than once (rows {string.Join(", ", duplicate.Select(r => r.Row))})");

        var targets = DelayPairs.Targets(systems, images, obs).ToDictionary(t => (t.SystemId, t.ImageA, t.ImageB));
        var result = new List<(ScoredPair, PairTruth)>();
        foreach (var r in rows)
        {
            var (da, ma) = imageDelay[(r.SystemId, r.ImageA)];
            var (db, mb) = imageDelay[(r.SystemId, r.ImageB)];
            var truth = targets.GetValueOrDefault((r.SystemId, r.ImageA, r.ImageB)) ?? new PairTruth(r.SystemId, r.ImageA, r.ImageB, db - da, Math.Abs(mb / ma), double.NaN);
            double error = double.IsFinite(r.ErrorDays) && r.ErrorDays > 0 ? r.ErrorDays : double.NaN;
            result.Add((new ScoredPair(r.SystemId, r.ImageA, r.ImageB, db - da, double.IsFinite(error) ? r.DelayDays : double.NaN, error), truth));
        }
        var listed = rows.Select(r => (r.SystemId, r.ImageA, r.ImageB)).ToHashSet();
        missing = 0;
        foreach (var t in targets.Values)
            if (!listed.Contains((t.SystemId, t.ImageA, t.ImageB)))
            {
                missing++;
                result.Add((new ScoredPair(t.SystemId, t.ImageA, t.ImageB, t.TrueDelayDays, double.NaN, double.NaN), t));
            }
        return result;
    }

    static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    static IEnumerable<(string Name, Func<PairTruth, double> Value, double[] Edges)> Binnings() =>
    [
        ("true |delay| [days]", t => Math.Abs(t.TrueDelayDays), [0, 10, 20, 50, 100, double.PositiveInfinity]),
        ("magnification ratio |μ_b/μ_a|", t => t.MagnificationRatio, [0, 0.5, 1, 2, double.PositiveInfinity]),
        ("microlensing rms [mag]", t => t.MicroAmplitudeMag, [0, 0.05, 0.2, 0.5, double.PositiveInfinity]),
    ];

    static void Print(TextWriter o, DelayMetrics m, List<(ScoredPair Pair, PairTruth Truth)> scored, int missing)
    {
        o.WriteLine($"{m.Total} pairs ({missing} target pairs of detected systems absent from the estimates, counted as not submitted)");
        o.WriteLine($"overall: f = {F(m.SuccessFraction)}, χ² = {F(m.ChiSquare)}, P = {F(m.Precision)}, A = {F(m.Accuracy)}  (Liao et al. 2015 metrics; simulated truth)");
        foreach (var (name, value, edges) in Binnings())
        {
            o.WriteLine($"by {name}:");
            for (int k = 0; k + 1 < edges.Length; k++)
            {
                var bin = scored.Where(x => value(x.Truth) >= edges[k] && value(x.Truth) < edges[k + 1]).Select(x => x.Pair).ToList();
                if (bin.Count == 0) continue;
                var b = DelayMetrics.Of(bin);
                o.WriteLine($"  [{edges[k].ToString(Inv)}, {edges[k + 1].ToString(Inv)}): N = {b.Total,5}  f = {F(b.SuccessFraction)}  χ² = {F(b.ChiSquare)}  P = {F(b.Precision)}  A = {F(b.Accuracy)}");
            }
        }
    }

    static string F(double v) => double.IsFinite(v) ? v.ToString("G4", Inv) : "—";

    static void Plot(string path, List<(ScoredPair Pair, PairTruth Truth)> scored)
    {
        var s = scored.Where(x => x.Pair.Submitted).Select(x => x.Pair).ToList();
        var plot = new Plot();
        if (s.Count > 0)
        {
            double[] x = s.Select(p => p.TrueDelayDays).ToArray(), y = s.Select(p => p.EstimatedDays).ToArray();
            var points = plot.Add.Scatter(x, y);
            points.LineWidth = 0;
            points.MarkerSize = 5;
            points.LegendText = "estimates (±1σ)";
            plot.Add.ErrorBar(x, y, s.Select(p => p.ErrorDays).ToArray()).Color = points.Color;
            double lo = Math.Min(x.Min(), y.Min()), hi = Math.Max(x.Max(), y.Max());
            var line = plot.Add.Line(lo, lo, hi, hi);
            line.LegendText = "estimate = truth";
        }
        plot.Title($"estimated vs true delays ({s.Count} of {scored.Count} pairs submitted; simulated)");
        plot.XLabel("true delay t_b − t_a [days]");
        plot.YLabel("estimated delay [days]");
        plot.ShowLegend(Alignment.UpperLeft);
        PngPanels.Save(path, [plot], 900, 700);
    }

    static void WriteJson(string path, DelayMetrics m, List<(ScoredPair Pair, PairTruth Truth)> scored, int missing)
    {
        var doc = new Dictionary<string, object?>
        {
            ["pairs"] = m.Total, ["submitted"] = m.Submitted, ["missing_rows"] = missing,
            ["f"] = Finite(m.SuccessFraction), ["chi2"] = Finite(m.ChiSquare), ["precision"] = Finite(m.Precision), ["accuracy"] = Finite(m.Accuracy),
        };
        AtomicFile.WriteAllText(path, JsonSerializer.Serialize(doc, new JsonSerializerOptions { WriteIndented = true }));
    }

    static double? Finite(double v) => double.IsFinite(v) ? v : null;
}
