using Lightfold.Randomness;

namespace Lightfold.Analysis;

/// <summary>One light curve: times [MJD], magnitudes and their errors.</summary>
public sealed record LightCurve(double[] Mjd, double[] Mag, double[] MagErr);

/// <summary>A delay estimate between two light curves: t_b − t_a [days] with a 1σ error; NaN when it could not be measured.</summary>
public readonly record struct DelayEstimate(double DelayDays, double ErrorDays)
{
    /// <summary>Whether an estimate was made.</summary>
    public bool Submitted => double.IsFinite(DelayDays) && ErrorDays > 0;
}

/// <summary>Time delays by curve shifting: the dispersion idea of Pelt et al. (1994, A&amp;A 286, 775; 1996, A&amp;A 305, 97)
/// with each curve compared against a cubic-spline interpolation of the other, as in spline-based curve shifting
/// (Tewes, Courbin &amp; Meylan 2013, A&amp;A 553, A120; from memory).</summary>
/// <remarks>
/// For a trial delay τ (image b arriving τ after image a): D²(τ) = Σ_j w_j (b_j − S_a(t_j − τ) − Δm)² / Σ w_j
/// + Σ_i w_i (a_i − S_b(t_i + τ) + Δm)² / Σ w_i, with S the natural cubic spline through a curve's points, w = 1/σ², points
/// falling outside the other curve's coverage (or in a gap longer than <see cref="MaxGapDays"/>) left out, and the
/// magnitude offset Δm (the magnification ratio) fitted per τ in closed form. Pair-based D² without interpolation is
/// biased by the sampling when curves are sparse; interpolation removes that for smooth curves (the tests recover known
/// delays of noiseless curves within 0.1 d). τ is scanned on a grid, refined by a finer scan and a parabola.
/// Uncertainty: a parametric bootstrap adding fresh noise N(0, ε σ) to every point (ε = 0.5) and taking the rms
/// change of τ̂ divided by ε: the estimator's linear response to noise of the measured size. The tests check that the
/// resulting pulls have unit width. Bootstrap streams are keyed (seed, system id, Bootstrap stage, pair).
/// </remarks>
public sealed record DispersionDelayEstimator
{
    /// <summary>Spline segments longer than this are gaps (no comparison inside) [days].</summary>
    public double MaxGapDays { get; init; } = 20;
    /// <summary>Largest |τ| scanned [days].</summary>
    public double MaxDelayDays { get; init; } = 150;
    /// <summary>Grid step of the scan [days].</summary>
    public double StepDays { get; init; } = 0.5;
    /// <summary>Bootstrap realisations.</summary>
    public int Bootstraps { get; init; } = 40;
    /// <summary>Scale ε of the bootstrap noise (fraction of σ); the spread is divided by ε.</summary>
    public double BootstrapNoiseScale { get; init; } = 0.5;
    /// <summary>Fewest compared points accepted.</summary>
    public int MinPoints { get; init; } = 6;

    /// <summary>τ̂ minimising D² (NaN if no τ has enough overlap).</summary>
    public double Minimise(LightCurve a, LightCurve b)
    {
        var sa = new Spline(a.Mjd, a.Mag);
        var sb = new Spline(b.Mjd, b.Mag);
        int n = (int)Math.Round(2 * MaxDelayDays / StepDays) + 1;
        double best = double.PositiveInfinity;
        int bestIndex = -1;
        for (int k = 0; k < n; k++)
        {
            double v = Dispersion(a, b, sa, sb, -MaxDelayDays + k * StepDays);
            if (v < best) { best = v; bestIndex = k; }
        }
        if (bestIndex < 0) return double.NaN;
        double tau = -MaxDelayDays + bestIndex * StepDays, fine = StepDays / 20, tauFine = tau, bestFine = best;
        for (int k = -20; k <= 20; k++)
        {
            double t = tau + k * fine, v = Dispersion(a, b, sa, sb, t);
            if (v < bestFine) { bestFine = v; tauFine = t; }
        }
        double ym = Dispersion(a, b, sa, sb, tauFine - fine), yp = Dispersion(a, b, sa, sb, tauFine + fine);
        double curvature = ym - 2 * bestFine + yp;
        return curvature > 0 && double.IsFinite(ym) && double.IsFinite(yp) ? tauFine + 0.5 * fine * (ym - yp) / curvature : tauFine;
    }

    /// <summary>D²(τ) for curves a, b.</summary>
    public double Dispersion(LightCurve a, LightCurve b, double tau) => Dispersion(a, b, new Spline(a.Mjd, a.Mag), new Spline(b.Mjd, b.Mag), tau);

    double Dispersion(LightCurve a, LightCurve b, Spline sa, Spline sb, double tau)
    {
        // Residuals d = (b_j − S_a(t_j − τ)) and e = (S_b(t_i + τ) − a_i) share the offset Δm.
        double sw = 0, swd = 0, swd2 = 0;
        int count = 0;
        void Add(double d, double sigma)
        {
            double w = 1 / (sigma * sigma);
            sw += w; swd += w * d; swd2 += w * d * d;
            count++;
        }
        for (int j = 0; j < b.Mjd.Length; j++)
            if (sa.TryEvaluate(b.Mjd[j] - tau, MaxGapDays, out double v)) Add(b.Mag[j] - v, b.MagErr[j]);
        for (int i = 0; i < a.Mjd.Length; i++)
            if (sb.TryEvaluate(a.Mjd[i] + tau, MaxGapDays, out double v)) Add(v - a.Mag[i], a.MagErr[i]);
        if (count < MinPoints) return double.NaN;
        double offset = swd / sw;
        return (swd2 - 2 * offset * swd + offset * offset * sw) / sw;
    }

    /// <summary>τ̂ and its bootstrap error; NaN when the curves do not overlap enough.</summary>
    public DelayEstimate Estimate(LightCurve a, LightCurve b, ulong seed, long systemId, ulong pair)
    {
        if (a.Mjd.Length < 4 || b.Mjd.Length < 4) return new(double.NaN, double.NaN);
        double tau = Minimise(a, b);
        if (!double.IsFinite(tau)) return new(double.NaN, double.NaN);
        var rng = KeyedRandom.For(seed, systemId, Stage.Bootstrap, pair);
        var samples = new List<double>(Bootstraps);
        for (int k = 0; k < Bootstraps; k++)
        {
            double t = Minimise(Perturb(a, BootstrapNoiseScale, ref rng), Perturb(b, BootstrapNoiseScale, ref rng));
            if (double.IsFinite(t)) samples.Add(t);
        }
        if (samples.Count < Bootstraps / 2) return new(double.NaN, double.NaN);
        // Spread about the estimate itself, rescaled from noise ε σ to σ (linear response of τ̂ to the noise).
        double sd = Math.Sqrt(samples.Sum(s => (s - tau) * (s - tau)) / samples.Count) / BootstrapNoiseScale;
        return new(tau, Math.Max(sd, StepDays / 20));
    }

    static LightCurve Perturb(LightCurve c, double scale, ref KeyedRandom rng)
    {
        var m = new double[c.Mag.Length];
        for (int i = 0; i < m.Length; i++) m[i] = c.Mag[i] + scale * c.MagErr[i] * rng.Normal();
        return c with { Mag = m };
    }

    /// <summary>Natural cubic spline through (x_i, y_i), x increasing (e.g. Press et al., Numerical Recipes, §3.3).</summary>
    sealed class Spline
    {
        readonly double[] x, y, m;   // m = second derivatives

        public Spline(double[] x, double[] y)
        {
            this.x = x;
            this.y = y;
            int n = x.Length;
            m = new double[n];
            if (n < 3) return;
            var u = new double[n];
            for (int i = 1; i < n - 1; i++)
            {
                double sig = (x[i] - x[i - 1]) / (x[i + 1] - x[i - 1]);
                double p = sig * m[i - 1] + 2;
                m[i] = (sig - 1) / p;
                u[i] = (y[i + 1] - y[i]) / (x[i + 1] - x[i]) - (y[i] - y[i - 1]) / (x[i] - x[i - 1]);
                u[i] = (6 * u[i] / (x[i + 1] - x[i - 1]) - sig * u[i - 1]) / p;
            }
            m[n - 1] = 0;
            for (int k = n - 2; k >= 0; k--) m[k] = m[k] * m[k + 1] + u[k];
        }

        public bool TryEvaluate(double t, double maxGap, out double value)
        {
            value = 0;
            if (x.Length < 2 || t < x[0] || t > x[^1]) return false;
            int hi = Array.BinarySearch(x, t);
            if (hi >= 0) { value = y[hi]; return true; }
            hi = ~hi;
            int lo = hi - 1;
            double h = x[hi] - x[lo];
            if (h > maxGap || h <= 0) return false;
            double a = (x[hi] - t) / h, b = (t - x[lo]) / h;
            value = a * y[lo] + b * y[hi] + ((a * a * a - a) * m[lo] + (b * b * b - b) * m[hi]) * h * h / 6;
            return true;
        }
    }
}
