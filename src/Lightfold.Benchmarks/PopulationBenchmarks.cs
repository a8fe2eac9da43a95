using Lightfold.Configuration;
using Lightfold.Pipeline;

namespace Lightfold.Benchmarks;

/// <summary>The main job: systems drawn, solved and written to Parquet, all cores against one thread.</summary>
public static class PopulationBenchmarks
{
    /// <summary>Rate of `simulate` (systems + images tables) for 200,000 systems, all cores vs one thread, same run.</summary>
    public static QuickBench.Result Quick()
    {
        const long n = 200_000;
        var scenario = ScenarioLoader.Load([], [$"run.count={n}", "light_curves.enabled=false"], []);
        _ = new SystemSampler(scenario);   // warm the cross-section table and JIT
        double Run(int threads)
        {
            string dir = Path.Combine(Path.GetTempPath(), $"lightfold-bench-{Guid.NewGuid():N}");
            var watch = System.Diagnostics.Stopwatch.StartNew();
            SimulationRunner.RunAsync(scenario, new RunTarget(dir, Threads: threads), null, CancellationToken.None).GetAwaiter().GetResult();
            double rate = n / watch.Elapsed.TotalSeconds;
            Directory.Delete(dir, recursive: true);
            return rate;
        }
        Run(0);
        double all = Run(0), one = Run(1);
        return new("simulate", "systems/s", all, "same, one thread", one, $"{Environment.ProcessorCount} cores; 10^6 systems ≈ {1e6 / all:F0} s");
    }
}
