using Lightfold.Randomness;
using Lightfold.Tests.Support;
using MathNet.Numerics.Distributions;

namespace Lightfold.Tests.Randomness;

public class KeyedRandomTests
{
    [Fact]
    public void Same_key_gives_the_same_sequence()
    {
        var a = KeyedRandom.For(42, 7, Stage.Population);
        var b = KeyedRandom.For(42, 7, Stage.Population);
        for (int i = 0; i < 1000; i++) Assert.Equal(a.NextUInt64(), b.NextUInt64());
    }

    [Fact]
    public void Different_stage_seed_or_substream_gives_a_different_sequence()
    {
        ulong first = KeyedRandom.For(42, 7, Stage.Population).NextUInt64();
        Assert.NotEqual(first, KeyedRandom.For(42, 7, Stage.Noise).NextUInt64());
        Assert.NotEqual(first, KeyedRandom.For(43, 7, Stage.Population).NextUInt64());
        Assert.NotEqual(first, KeyedRandom.For(42, 8, Stage.Population).NextUInt64());
        Assert.NotEqual(first, KeyedRandom.For(42, 7, Stage.Population, 1).NextUInt64());
    }

    // Regression vector: pins the generator so an accidental change of the key hash or of
    // xoshiro256** (Blackman & Vigna 2021) shows up as a failing test, not as silently different catalogs.
    [Fact]
    public void Regression_vector_is_unchanged()
    {
        var r = KeyedRandom.For(20261202, 12345, Stage.Population);
        ulong[] got = [r.NextUInt64(), r.NextUInt64(), r.NextUInt64()];
        Assert.Equal(Expected, got);
    }

    static readonly ulong[] Expected = [2297948004591273081UL, 7414512895265941924UL, 453442732779387744UL];

    // Adjacent ids must be unrelated: the correlation of first draws of 10^5 consecutive ids has
    // standard error 1/√n ≈ 0.0032 under independence; require |r| < 4σ.
    [Fact]
    public void Adjacent_ids_are_uncorrelated()
    {
        const int n = 100_000;
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = KeyedRandom.For(5, i, Stage.Population).NextDouble();
        double mean = x.Average(), num = 0, den = 0;
        for (int i = 0; i < n - 1; i++) num += (x[i] - mean) * (x[i + 1] - mean);
        for (int i = 0; i < n; i++) den += (x[i] - mean) * (x[i] - mean);
        double r = num / den;
        Assert.True(Math.Abs(r) < 4.0 / Math.Sqrt(n), $"lag-1 correlation across ids {r:E3}");
    }

    // Uniformity: Kolmogorov–Smirnov test at 1% over 10^5 draws (one stream) and over first draws
    // of 10^5 streams; D_crit = 1.628/√n (Kolmogorov asymptotic distribution).
    [Fact]
    public void Uniform_draws_pass_Kolmogorov_Smirnov()
    {
        const int n = 100_000;
        var r = KeyedRandom.For(9, 0, Stage.Noise);
        var within = new double[n];
        var across = new double[n];
        for (int i = 0; i < n; i++)
        {
            within[i] = r.NextDouble();
            across[i] = KeyedRandom.For(9, i, Stage.Noise).NextDouble();
        }
        Assert.True(Statistics.KolmogorovSmirnov(within, u => u) < Statistics.KsCritical1Percent(n));
        Assert.True(Statistics.KolmogorovSmirnov(across, u => u) < Statistics.KsCritical1Percent(n));
    }

    // Normal deviates: KS against the standard normal CDF (MathNet), mean 0 ± 4/√n, variance 1 ± 4√(2/n).
    [Fact]
    public void Normal_draws_have_unit_moments_and_pass_KS()
    {
        const int n = 100_000;
        var r = KeyedRandom.For(11, 0, Stage.Noise);
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = r.Normal();
        var (mean, variance) = Statistics.Moments(x);
        AssertRelative.Near(0, mean, 4 / Math.Sqrt(n));
        AssertRelative.Near(1, variance, 4 * Math.Sqrt(2.0 / n));
        Assert.True(Statistics.KolmogorovSmirnov(x, v => Normal.CDF(0, 1, v)) < Statistics.KsCritical1Percent(n));
    }

    // Poisson moments: mean λ and variance λ, each within 4 standard errors for n = 10^5 draws
    // (s.e. of the mean √(λ/n); of the variance ≈ √((2λ² + λ)/n)). Both the small-λ (Knuth) and
    // large-λ (Hörmann 1993 PTRS) branches are covered.
    [Theory]
    [InlineData(0.3)]
    [InlineData(4.0)]
    [InlineData(25.0)]
    [InlineData(1000.0)]
    public void Poisson_draws_have_mean_and_variance_lambda(double lambda)
    {
        const int n = 100_000;
        var r = KeyedRandom.For(13, (long)lambda, Stage.EventCount);
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = r.Poisson(lambda);
        var (mean, variance) = Statistics.Moments(x);
        AssertRelative.Near(lambda, mean, 4 * Math.Sqrt(lambda / n), "mean");
        AssertRelative.Near(lambda, variance, 4 * Math.Sqrt((2 * lambda * lambda + lambda) / n), "variance");
    }

    // Power law p(x) ∝ x^k on [a, b]: KS against its analytic CDF, (x^(k+1) − a^(k+1)) / (b^(k+1) − a^(k+1)).
    [Theory]
    [InlineData(-2.35, 0.1, 100.0)]
    [InlineData(-1.0, 1.0, 10.0)]
    [InlineData(1.5, 0.0001, 2.0)]
    public void PowerLaw_draws_follow_the_analytic_cdf(double k, double a, double b)
    {
        const int n = 50_000;
        var r = KeyedRandom.For(17, 0, Stage.Population);
        var x = new double[n];
        for (int i = 0; i < n; i++) x[i] = r.PowerLaw(k, a, b);
        Func<double, double> cdf = Math.Abs(k + 1) < 1e-12
            ? v => Math.Log(v / a) / Math.Log(b / a)
            : v => (Math.Pow(v, k + 1) - Math.Pow(a, k + 1)) / (Math.Pow(b, k + 1) - Math.Pow(a, k + 1));
        Assert.True(Statistics.KolmogorovSmirnov(x, cdf) < Statistics.KsCritical1Percent(n));
    }

    // Exponential: mean μ within 4 s.e. (μ/√n).
    [Fact]
    public void Exponential_draws_have_the_requested_mean()
    {
        const int n = 100_000;
        var r = KeyedRandom.For(19, 0, Stage.Population);
        double sum = 0;
        for (int i = 0; i < n; i++) sum += r.Exponential(3.0);
        AssertRelative.Near(3.0, sum / n, 4 * 3.0 / Math.Sqrt(n));
    }

    [Fact]
    public void NextInt_is_in_range_and_covers_it()
    {
        var r = KeyedRandom.For(23, 0, Stage.Population);
        var counts = new int[7];
        for (int i = 0; i < 70_000; i++) counts[r.NextInt(7)]++;
        // Each count ~ Binomial(70000, 1/7): mean 10000, s.d. ≈ 92.6; allow 5σ.
        Assert.All(counts, c => Assert.InRange(c, 10_000 - 463, 10_000 + 463));
    }
}
