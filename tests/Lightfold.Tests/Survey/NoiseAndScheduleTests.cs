using Lightfold.Randomness;
using Lightfold.Survey;
using Lightfold.Tests.Support;
using MathNet.Numerics.Distributions;

namespace Lightfold.Tests.Survey;

public class NoiseAndScheduleTests
{
    // Definition of the 5σ depth (common practice): a source exactly at m₅ has S/N = 5. Expected S/N is exact; the
    // measured S/N over 10^5 noisy draws has mean 5 within 4 standard errors (1/√n), and the pulls are N(0, 1) (KS 1%).
    [Theory]
    [InlineData(24.5, 0.0)]
    [InlineData(23.1, 0.04)]
    [InlineData(25.3, 0.3)]
    public void Source_at_the_5_sigma_depth_has_signal_to_noise_5(double depth, double sourceFraction)
    {
        var noise = new NoiseModel { SourceFractionAtDepth = sourceFraction };
        double f5 = Math.Pow(10, -0.4 * (depth - 31.4));
        double sigma = noise.SigmaNjy(f5, depth);
        AssertRelative.Equal(5.0, f5 / sigma, 1e-12);
        var rng = KeyedRandom.For(7, 0, Stage.Noise);
        const int n = 100_000;
        var pulls = new double[n];
        double snr = 0;
        for (int i = 0; i < n; i++)
        {
            double flux = f5 + sigma * rng.Normal();
            snr += flux / sigma / n;
            pulls[i] = (flux - f5) / sigma;
        }
        AssertRelative.Near(5.0, snr, 4 / Math.Sqrt(n));
        Assert.True(Statistics.KolmogorovSmirnov(pulls, x => Normal.CDF(0, 1, x)) < Statistics.KsCritical1Percent(n));
    }

    // Limits of the noise model: faint sources are background-limited (σ → F₅/5 √(1 − s) ...), bright ones reach
    // the systematic floor ε F with ε = 0.005 ln10/2.5 (a 5 mmag floor, Ivezić et al. 2019 requirement).
    [Fact]
    public void Noise_model_has_background_and_floor_limits()
    {
        var noise = new NoiseModel { SourceFractionAtDepth = 0.04, FloorMag = 0.005 };
        double f5 = Math.Pow(10, -0.4 * (24.0 - 31.4));
        double eps = 0.005 * Math.Log(10) / 2.5;
        AssertRelative.Equal(Math.Sqrt((f5 / 5) * (f5 / 5) * 0.96 - eps * eps * f5 * f5), noise.SigmaNjy(0, 24.0), 1e-12);
        double bright = 1e6 * f5;
        AssertRelative.Equal(eps, noise.SigmaNjy(bright, 24.0) / bright, 2e-3);
    }

    // The cadence generator: per-band revisit spacing, the season gap and the survey window are respected, and the
    // same system gets the same visits (keyed by system id).
    [Fact]
    public void Cadence_schedule_respects_revisits_seasons_and_window()
    {
        var bands = new[] { new BandCadence("g", 4, 24.5, 0.2, 0.9, 0.05), new BandCadence("r", 3, 24.2, 0.2, 0.9, 0.05) };
        var schedule = new CadenceSchedule(bands, 60000, 61000, 200, 0.0, 0.0);
        var a = new List<Visit>();
        var b = new List<Visit>();
        schedule.Visits(1, 42, 59000, 62000, a);
        schedule.Visits(1, 42, 59000, 62000, b);
        Assert.Equal(a, b);
        Assert.All(a, v => Assert.InRange(v.Mjd, 60000, 61000));
        foreach (int band in new[] { 0, 1 })
        {
            var t = a.Where(v => v.Band == band).Select(v => v.Mjd).ToArray();
            var gaps = t.Zip(t.Skip(1), (x, y) => y - x).ToArray();
            double step = bands[band].RevisitDays;
            Assert.All(gaps, g => Assert.True(Math.Abs(g / step - Math.Round(g / step)) < 1e-9, $"gap {g} is a multiple of {step}"));
            Assert.Contains(gaps, g => g > 150);   // the 165-day season gap
            // Within a 200-day season every revisit is kept (no weather loss): about 200/step visits per season.
            Assert.InRange(t.Length, (int)(2 * 200 / step * 0.6), (int)(3 * 200 / step));
        }
    }
}
