using Lightfold.Analysis;
using Lightfold.Randomness;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Analysis;

public class DelayEstimationTests
{
    // Worked example of the Time Delay Challenge metrics (definitions of Dobler et al. 2015 as used by Liao et al. 2015,
    // ApJ 800, 11; from memory): four pairs, one not submitted. By hand: f = 3/4;
    // χ² = ((12−10)²/1² + (18−20)²/2² + (33−30)²/3²)/3 = (4 + 1 + 1)/3 = 2;
    // P = (1/10 + 2/20 + 3/30)/3 = 0.1; A = (2/10 − 2/20 + 3/30)/3 = 0.2/3.
    [Fact]
    public void Tdc_metrics_match_a_worked_example()
    {
        var m = DelayMetrics.Of(new List<ScoredPair>
        {
            new(1, 0, 1, 10, 12, 1), new(2, 0, 1, 20, 18, 2), new(3, 0, 1, 30, 33, 3), new(4, 0, 1, 40, double.NaN, double.NaN),
        });
        Assert.Equal(4, m.Total);
        Assert.Equal(3, m.Submitted);
        AssertRelative.Equal(0.75, m.SuccessFraction, 1e-15);
        AssertRelative.Equal(2.0, m.ChiSquare, 1e-14);
        AssertRelative.Equal(0.1, m.Precision, 1e-14);
        AssertRelative.Equal(0.2 / 3, m.Accuracy, 1e-14);
    }

    static double Curve(double t) { double d = t - 20; return 22 - 2.5 * Math.Log10(Math.Exp(-d / 30) / (1 + Math.Exp(-d / 5)) + 1e-6); }

    static (LightCurve A, LightCurve B) Pair(double delay, double noise, ref KeyedRandom rng)
    {
        var ta = new List<double>();
        var tb = new List<double>();
        for (double t = 0; t < 150; t += 3.1) { ta.Add(t + rng.Uniform(-0.5, 0.5)); tb.Add(t + 1.3 + rng.Uniform(-0.5, 0.5)); }
        double[] ma = new double[ta.Count], mb = new double[tb.Count];
        for (int i = 0; i < ta.Count; i++) ma[i] = Curve(ta[i]) + noise * rng.Normal();
        for (int i = 0; i < tb.Count; i++) mb[i] = Curve(tb[i] - delay) + 0.7 + noise * rng.Normal();
        double err = Math.Max(noise, 1e-3);
        return (new LightCurve(ta.ToArray(), ma, ta.Select(_ => err).ToArray()), new LightCurve(tb.ToArray(), mb, tb.Select(_ => err).ToArray()));
    }

    // The baseline estimator recovers known delays of noiseless, irregularly sampled light curves within 0.1 d.
    [Theory]
    [InlineData(5.3)]
    [InlineData(17.9)]
    [InlineData(42.2)]
    [InlineData(-12.4)]
    public void Noiseless_delays_are_recovered_within_a_tenth_of_a_day(double delay)
    {
        var rng = KeyedRandom.For(1, (long)(delay * 10), Stage.Noise);
        var (a, b) = Pair(delay, 0, ref rng);
        AssertRelative.Near(delay, new DispersionDelayEstimator().Minimise(a, b), 0.1);
    }

    // Calibration: over 200 noisy realisations (0.05 mag), the pulls (τ̂ − τ)/σ have mean 0 and unit width within
    // 3 statistical errors (1/√200 for the mean, 1/√398 for the width).
    [Fact]
    public void Bootstrap_errors_are_calibrated()
    {
        var estimator = new DispersionDelayEstimator { Bootstraps = 30 };
        var pulls = new double[200];
        for (int r = 0; r < pulls.Length; r++)
        {
            var rng = KeyedRandom.For(2, r, Stage.Noise);
            var (a, b) = Pair(20, 0.05, ref rng);
            var e = estimator.Estimate(a, b, 3, r, 0);
            Assert.True(e.Submitted);
            pulls[r] = (e.DelayDays - 20) / e.ErrorDays;
        }
        var (mean, variance) = Statistics.Moments(pulls);
        AssertRelative.Near(0, mean, 3 / Math.Sqrt(pulls.Length), "pull mean");
        AssertRelative.Near(1, Math.Sqrt(variance), 3 / Math.Sqrt(2 * (pulls.Length - 1)), "pull width");
    }

    // H0 forecast identities: a single system's error is the quadrature sum of its terms; N identical systems give
    // exactly 1/√N of it; and D_Δt ∝ 1/H0 (recomputed at two H0 with the cosmology), so fractional errors carry over.
    [Fact]
    public void H0_forecast_combines_systems_as_expected()
    {
        var s = new H0ForecastSettings { LensModelFraction = 0.05, LineOfSightFraction = 0.03, MinDelayDays = 10 };
        double one = H0Forecast.Combined([new H0System(50, 2, 1)], 1, s);
        AssertRelative.Equal(Math.Sqrt(0.04 * 0.04 + 0.05 * 0.05 + 0.03 * 0.03), one, 1e-14);
        double many = H0Forecast.Combined(Enumerable.Repeat(new H0System(50, 2, 1), 25), 1, s);
        AssertRelative.Equal(one / 5, many, 1e-14);
        AssertRelative.Equal(one / Math.Sqrt(4), H0Forecast.Combined([new H0System(50, 2, 1)], 4, s), 1e-14);
        Assert.True(double.IsPositiveInfinity(H0Forecast.Combined([new H0System(5, 1, 1)], 1, s)), "delays below the minimum do not count");
        var c70 = new Lightfold.Cosmology.FlrwCosmology(new Lightfold.Cosmology.CosmologyParameters { H0KmSMpc = 70 });
        var c77 = new Lightfold.Cosmology.FlrwCosmology(new Lightfold.Cosmology.CosmologyParameters { H0KmSMpc = 77 });
        AssertRelative.Equal(70.0 / 77.0, c77.TimeDelayDistanceMpc(0.5, 2) / c70.TimeDelayDistanceMpc(0.5, 2), 1e-12);
    }
}
