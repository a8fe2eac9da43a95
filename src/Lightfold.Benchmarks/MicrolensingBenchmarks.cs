using Lightfold.Microlensing;

namespace Lightfold.Benchmarks;

/// <summary>Inverse ray shooting: the tree/local-expansion shooter against direct summation over every star.</summary>
public static class MicrolensingBenchmarks
{
    /// <summary>A 1000² map at 100 rays per pixel with about 10^4 stars (all cores), and direct summation on a ray sample.</summary>
    public static QuickBench.Result Quick()
    {
        var spec = new MapSpec { Kappa = 0.5, Gamma = 0.3, KappaStar = 0.42, SizeEinsteinRadii = 20, Pixels = 1000, RaysPerPixel = 100, MarginEinsteinRadii = 2, Seed = 1 };
        var stars = RayShooter.Stars(spec);
        var watch = System.Diagnostics.Stopwatch.StartNew();
        var map = RayShooter.Shoot(spec, stars: stars);
        double seconds = watch.Elapsed.TotalSeconds, rate = map.Rays / seconds;

        // Reference: every ray summed over every star (exact), measured on a sample of rays, scaled to all cores.
        var rng = Randomness.KeyedRandom.For(1, 0, Randomness.Stage.StarField);
        double direct = QuickBench.Rate(() =>
        {
            double s = 0;
            for (int i = 0; i < 200; i++) s += stars.DirectDeflection(rng.Uniform(-20, 20), rng.Uniform(-20, 20)).X;
            GC.KeepAlive(s);
        }, 200, 1.0) * Environment.ProcessorCount;

        // Floating-point work: Horner (8 flops per order) + 10 per near star + ~12 per ray for the lens equation and binning.
        double flops = map.Rays * (8.0 * StarTree.Order + 12) + 10.0 * map.NearInteractions;
        double ghz = CpuGhz();
        double peak = Environment.ProcessorCount * ghz * 1e9 * 16;   // AVX2: 2 FMA units × 4 doubles × 2 flops per cycle
        return new("micromap", "rays/s", rate, "direct summation", direct,
            $"{map.Stars:N0} stars, 1000² px, {map.Rays:N0} rays in {seconds:F1} s; {flops / seconds / 1e9:F1} GFLOP/s ≈ {100 * flops / seconds / peak:F1}% of a {peak / 1e9:F0} GFLOP/s peak ({ghz:F2} GHz × {Environment.ProcessorCount} cores × 16)");
    }

    static double CpuGhz()
    {
        try
        {
            var line = File.ReadLines("/proc/cpuinfo").FirstOrDefault(l => l.StartsWith("cpu MHz", StringComparison.Ordinal));
            if (line is not null) return double.Parse(line.Split(':')[1], System.Globalization.CultureInfo.InvariantCulture) / 1000;
        }
        catch (IOException) { }
        return 3.0;
    }
}
