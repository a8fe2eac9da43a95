using System.Diagnostics;

namespace Lightfold.Benchmarks;

/// <summary>Quick rate measurements: each hot stage against its straightforward reference, same process, same run.</summary>
public static class QuickBench
{
    /// <summary>One measured comparison.</summary>
    public sealed record Result(string Name, string Unit, double Rate, string ReferenceName, double ReferenceRate, string? Note = null)
    {
        /// <summary>Rate divided by the reference rate.</summary>
        public double Ratio => Rate / ReferenceRate;
    }

    static readonly (string Name, Func<Result> Run)[] All =
    [
        ("distances", CosmologyBenchmarks.Quick),
        ("lens-solver", ImageFinderBenchmarks.Quick),
        ("simulate", PopulationBenchmarks.Quick),
        ("observations", ObservationBenchmarks.Quick),
        ("micromap", MicrolensingBenchmarks.Quick),
    ];

    /// <summary>Runs the named comparisons (all when none named) and prints one line each.</summary>
    public static int Run(string[] names, TextWriter output)
    {
        var chosen = names.Length == 0 ? All : All.Where(a => names.Contains(a.Name)).ToArray();
        if (chosen.Length == 0)
        {
            output.WriteLine("unknown benchmark; choose from: " + string.Join(", ", All.Select(a => a.Name)));
            return 2;
        }
        output.WriteLine($"{"benchmark",-14} {"rate",14} {"unit",-12} {"reference",-28} {"ref rate",14} {"ratio",9}");
        foreach (var (_, run) in chosen)
        {
            var r = run();
            output.WriteLine($"{r.Name,-14} {r.Rate,14:G4} {r.Unit,-12} {r.ReferenceName,-28} {r.ReferenceRate,14:G4} {r.Ratio,9:F1}"
                             + (r.Note is null ? "" : "   " + r.Note));
        }
        return 0;
    }

    /// <summary>Calls <paramref name="body"/> (which does <paramref name="itemsPerCall"/> items) for at least <paramref name="seconds"/>; returns items per second.</summary>
    public static double Rate(Action body, double itemsPerCall, double seconds = 1.0)
    {
        body();   // warm-up (JIT, caches)
        var watch = Stopwatch.StartNew();
        long calls = 0;
        do
        {
            body();
            calls++;
        } while (watch.Elapsed.TotalSeconds < seconds);
        return calls * itemsPerCall / watch.Elapsed.TotalSeconds;
    }
}
