namespace Lightfold.Analysis;

/// <summary>Inputs of the Hubble-constant forecast.</summary>
/// <remarks>D_Δt ∝ 1/H0 (every distance scales as c/H0), so a fractional error on a system's time-delay distance is the same
/// fractional error on H0. Per system: σ_H0/H0 = √((σ_Δt/Δt)² + f_model² + f_los²), where the lens-model floor stands for
/// the mass-sheet degeneracy and model systematics and the line-of-sight floor for external convergence (both irreducible
/// per system). Without measured delays, σ_Δt = √(σ₀² + (ε_micro Δt)²): a sampling floor σ₀ and a microlensing term
/// (≈1% in the achromatic phase for colour curves, ≈4% for single bands: Goldstein et al. 2018, ApJ 855, 22).
/// Independent systems combine as 1/σ² = Σ n_i/σ_i², n_i the expected number of such systems.</remarks>
public sealed record H0ForecastSettings
{
    /// <summary>Shortest usable delay [days].</summary>
    public double MinDelayDays { get; init; } = 10;
    /// <summary>σ₀ [days].</summary>
    public double DelayFloorDays { get; init; } = 1.0;
    /// <summary>ε_micro (fraction of the delay).</summary>
    public double MicrolensingFraction { get; init; } = 0.01;
    /// <summary>f_model.</summary>
    public double LensModelFraction { get; init; } = 0.05;
    /// <summary>f_los.</summary>
    public double LineOfSightFraction { get; init; } = 0.03;
}

/// <summary>One system's contribution: its delay, delay error and expected number per survey year.</summary>
public readonly record struct H0System(double DelayDays, double DelayErrorDays, double PerYear);

/// <summary>Forecast σ(H0)/H0 from a sample.</summary>
public static class H0Forecast
{
    /// <summary>Fractional H0 error of one system.</summary>
    public static double SystemFraction(double delayDays, double delayErrorDays, H0ForecastSettings s)
    {
        double d = delayErrorDays / delayDays;
        return Math.Sqrt(d * d + s.LensModelFraction * s.LensModelFraction + s.LineOfSightFraction * s.LineOfSightFraction);
    }

    /// <summary>Modelled delay error when none was measured: √(σ₀² + (ε Δt)²).</summary>
    public static double ModelDelayError(double delayDays, H0ForecastSettings s)
        => Math.Sqrt(s.DelayFloorDays * s.DelayFloorDays + Math.Pow(s.MicrolensingFraction * delayDays, 2));

    /// <summary>Combined σ(H0)/H0 after <paramref name="years"/> of survey: [Σ n_i Y / σ_i²]^(−1/2); ∞ for an empty sample.</summary>
    public static double Combined(IEnumerable<H0System> systems, double years, H0ForecastSettings s)
    {
        double information = 0;
        foreach (var x in systems)
        {
            if (x.DelayDays < s.MinDelayDays) continue;
            double f = SystemFraction(x.DelayDays, x.DelayErrorDays, s);
            information += x.PerYear * years / (f * f);
        }
        return information > 0 ? 1 / Math.Sqrt(information) : double.PositiveInfinity;
    }
}
