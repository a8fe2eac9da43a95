using BenchmarkDotNet.Attributes;
using Lightfold.Cosmology;

namespace Lightfold.Benchmarks;

/// <summary>Comoving distances: the interpolation table against direct quadrature (the reference).</summary>
[MemoryDiagnoser]
public class CosmologyBenchmarks
{
    const int N = 4096;
    readonly double[] redshifts = new double[N];
    FlrwCosmology cosmology = null!;

    /// <summary>Prepares a spread of redshifts in [0, 6).</summary>
    [GlobalSetup]
    public void Setup()
    {
        cosmology = new FlrwCosmology(new CosmologyParameters());
        _ = cosmology.Table;
        for (int i = 0; i < N; i++) redshifts[i] = 6.0 * ((i * 0.6180339887498949) % 1.0);
    }

    /// <summary>Reference: adaptive Gauss–Kronrod quadrature per distance.</summary>
    [Benchmark(Baseline = true, OperationsPerInvoke = N)]
    public double DirectQuadrature()
    {
        double sum = 0;
        foreach (double z in redshifts) sum += cosmology.ComovingDistanceMpc(z);
        return sum;
    }

    /// <summary>Table with cubic Hermite interpolation.</summary>
    [Benchmark(OperationsPerInvoke = N)]
    public double Table()
    {
        var table = cosmology.Table;
        double sum = 0;
        foreach (double z in redshifts) sum += table.ComovingDistanceMpc(z);
        return sum;
    }

    /// <summary>Single-pass rate and ratio for scripts/bench (one core).</summary>
    public static QuickBench.Result Quick()
    {
        var b = new CosmologyBenchmarks();
        b.Setup();
        double table = QuickBench.Rate(() => b.Table(), N);
        double direct = QuickBench.Rate(() => b.DirectQuadrature(), N);
        return new("distances", "distances/s", table, "direct quadrature", direct);
    }
}
