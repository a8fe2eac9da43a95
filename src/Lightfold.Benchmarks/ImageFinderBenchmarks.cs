using BenchmarkDotNet.Attributes;
using Lightfold.Lensing;
using Lightfold.Randomness;

namespace Lightfold.Benchmarks;

/// <summary>Solving SIE + shear systems (all images, magnifications, Fermat potentials, κ, γ): the polar finder against brute force.</summary>
[MemoryDiagnoser]
public class ImageFinderBenchmarks
{
    const int N = 2048;
    readonly SieShearLens[] lenses = new SieShearLens[N];
    readonly double[] bx = new double[N], by = new double[N];

    /// <summary>Random lenses (q in [0.3, 1], γ ≤ 0.15) with sources inside 1.2 θ_E, as a population run has them.</summary>
    [GlobalSetup]
    public void Setup()
    {
        for (int i = 0; i < N; i++)
        {
            var rng = KeyedRandom.For(99, i, Stage.Population);
            lenses[i] = new SieShearLens
            {
                ThetaEArcsec = rng.Uniform(0.3, 2), AxisRatio = rng.Uniform(0.3, 1), PositionAngleDeg = rng.Uniform(0, 180),
                ShearGamma = rng.Uniform(0, 0.15), ShearPositionAngleDeg = rng.Uniform(0, 180),
            };
            double r = 1.2 * lenses[i].ThetaEArcsec * Math.Sqrt(rng.NextDouble()), a = rng.Uniform(0, 2 * Math.PI);
            bx[i] = r * Math.Cos(a);
            by[i] = r * Math.Sin(a);
        }
    }

    /// <summary>The polar image finder (allocation-free).</summary>
    [Benchmark(OperationsPerInvoke = N)]
    public int PolarFinder()
    {
        Span<LensedImage> buffer = stackalloc LensedImage[ImageFinder.MaxImages];
        int total = 0;
        for (int i = 0; i < N; i++)
        {
            ImageFinder.TryFindImages(lenses[i], bx[i], by[i], buffer, out int n, out _);
            total += n;
        }
        return total;
    }

    /// <summary>Reference: brute-force triangle mapping on a 161² grid (the resolution the tests use) plus Newton polishing.</summary>
    [Benchmark(Baseline = true, OperationsPerInvoke = 16)]
    public int BruteForce()
    {
        int total = 0;
        for (int i = 0; i < 16; i++)
            total += GridImageFinder.Find(lenses[i].Prepare(), bx[i], by[i], 3.5 * lenses[i].ThetaEArcsec, 161, 1e-11 * lenses[i].ThetaEArcsec).Count;
        return total;
    }

    /// <summary>Single-pass rate and ratio for scripts/bench (one core).</summary>
    public static QuickBench.Result Quick()
    {
        var b = new ImageFinderBenchmarks();
        b.Setup();
        double fast = QuickBench.Rate(() => b.PolarFinder(), N, 2.0);
        double brute = QuickBench.Rate(() => b.BruteForce(), 16, 2.0);
        return new("lens-solver", "systems/s", fast, "brute-force grid 161²", brute);
    }
}
