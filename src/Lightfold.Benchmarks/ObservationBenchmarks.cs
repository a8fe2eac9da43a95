using Lightfold.Catalog;
using Lightfold.Configuration;
using Lightfold.Pipeline;
using Lightfold.Populations;
using Lightfold.Transients;

namespace Lightfold.Benchmarks;

/// <summary>Observation rows generated and written (all cores), against direct synthetic photometry per row (the reference).</summary>
public static class ObservationBenchmarks
{
    /// <summary>`simulate` with light curves, 2,000 and 10,000 systems; the difference gives the steady rate without the
    /// one-off set-up (band tables); reference: band fluxes by direct integration, per row.</summary>
    public static QuickBench.Result Quick()
    {
        (long Rows, double Seconds) Run(int count)
        {
            var scenario = ScenarioLoader.Load([], [$"run.count={count}"], []);
            _ = new SystemSampler(scenario);
            string dir = Path.Combine(Path.GetTempPath(), $"lightfold-bench-{Guid.NewGuid():N}");
            var watch = System.Diagnostics.Stopwatch.StartNew();
            var summary = SimulationRunner.RunAsync(scenario, new RunTarget(dir), null, CancellationToken.None).GetAwaiter().GetResult();
            double seconds = watch.Elapsed.TotalSeconds;
            Directory.Delete(dir, recursive: true);
            return (summary.ObservationsWritten, seconds);
        }
        Run(500);
        var small = Run(2000);
        var large = Run(10000);
        double rate = (large.Rows - small.Rows) / (large.Seconds - small.Seconds);
        double setup = small.Seconds - small.Rows / rate;

        // Reference: what each row would cost with synthetic photometry done directly instead of from the tables.
        var resources = ObservingResources.Load(ScenarioLoader.Load([], [], []));
        var model = resources.Models[TransientType.Ia];
        var band = resources.Bands[1];
        double reference = QuickBench.Rate(() =>
        {
            double sum = 0;
            for (int i = 0; i < 200; i++) sum += LightCurveBank.DirectQ(model, band, 0.8, 5 + i * 0.5);
            GC.KeepAlive(sum);
        }, 200, 1.0) * Environment.ProcessorCount;
        return new("observations", "rows/s", rate, "direct photometry per row", reference,
            $"steady rate incl. drawing, solving, schedule, noise and Parquet ({large.Rows:N0} rows in {large.Seconds:F1} s, one-off set-up ≈ {setup:F1} s); reference scaled to {Environment.ProcessorCount} cores");
    }
}
