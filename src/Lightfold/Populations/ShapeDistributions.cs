using Lightfold.Randomness;
using MathNet.Numerics.Distributions;

namespace Lightfold.Populations;

/// <summary>Lens axis ratio q: a normal distribution truncated to [min, max].</summary>
/// <remarks>Default mean 0.78, σ 0.12 on [0.2, 1]: centred on the SLACS SIE fits, ⟨q⟩ ≈ 0.78 (Koopmans et al. 2006,
/// ApJ 649, 599; from memory); a truncated normal in q is common practice in forecasts. SIE models with an
/// observed-like axis-ratio distribution reproduce the two- to four-image ratio (Keeton, Kochanek &amp; Seljak 1997, ApJ 482, 604).</remarks>
public sealed record AxisRatioDistribution
{
    /// <summary>Mean of the untruncated normal.</summary>
    public double Mean { get; init => field = Check.Finite(value); } = 0.78;
    /// <summary>Standard deviation of the untruncated normal (&gt; 0).</summary>
    public double Sigma { get; init => field = Check.Positive(value); } = 0.12;
    /// <summary>Lower truncation (≥ 0.2, the cross-section table's limit).</summary>
    public double Min { get; init => field = Check.InRange(value, 0.2, 1.0); } = 0.2;
    /// <summary>Upper truncation (≤ 1).</summary>
    public double Max { get; init => field = Check.InRange(value, 0.2, 1.0); } = 1.0;

    /// <summary>True when Min = Max: every lens has that axis ratio.</summary>
    public bool IsFixed => Min == Max;

    /// <summary>Probability density at q (not defined for a fixed q).</summary>
    public double Density(double q)
        => q < Min || q > Max ? 0 : Normal.PDF(Mean, Sigma, q) / (Normal.CDF(Mean, Sigma, Max) - Normal.CDF(Mean, Sigma, Min));

    /// <summary>Draws q by inversion.</summary>
    public double Sample(ref KeyedRandom rng)
    {
        if (IsFixed) return Min;
        double a = Normal.CDF(Mean, Sigma, Min), b = Normal.CDF(Mean, Sigma, Max);
        return Math.Clamp(Normal.InvCDF(Mean, Sigma, a + (b - a) * rng.NextOpenDouble()), Min, Max);
    }
}

/// <summary>External shear magnitude γ: log-normal, truncated to [0, max]; the angle is uniform.</summary>
/// <remarks>Default median 0.05 with 0.2 dex scatter (a common forecasting choice; from memory), truncated at 0.3.
/// Fits to quadruple lenses need 10–15% shear where the tidal field alone gives 1–3% (Keeton, Kochanek &amp; Seljak 1997).</remarks>
public sealed record ShearDistribution
{
    /// <summary>Median γ (0 switches external shear off).</summary>
    public double Median { get; init => field = Check.NonNegative(value); } = 0.05;
    /// <summary>Scatter in log10 γ [dex] (&gt; 0).</summary>
    public double SigmaDex { get; init => field = Check.Positive(value); } = 0.2;
    /// <summary>Upper truncation (≤ 0.3, the cross-section table's limit).</summary>
    public double Max { get; init => field = Check.InRange(value, 1e-6, 0.3); } = 0.3;

    /// <summary>True when the median is 0: no external shear.</summary>
    public bool IsOff => Median == 0;

    /// <summary>Probability density of γ.</summary>
    public double Density(double gamma)
    {
        if (gamma <= 0 || gamma > Max) return 0;
        double mu = Math.Log10(Median);
        double norm = Normal.CDF(mu, SigmaDex, Math.Log10(Max));
        return Normal.PDF(mu, SigmaDex, Math.Log10(gamma)) / (gamma * Math.Log(10)) / norm;
    }

    /// <summary>Draws γ by inversion.</summary>
    public double Sample(ref KeyedRandom rng)
    {
        if (IsOff) return 0.0;
        double mu = Math.Log10(Median);
        double b = Normal.CDF(mu, SigmaDex, Math.Log10(Max));
        return Math.Min(Max, Math.Pow(10, Normal.InvCDF(mu, SigmaDex, b * rng.NextOpenDouble())));
    }
}
