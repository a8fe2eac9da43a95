namespace Lightfold.Microlensing;

/// <summary>Convergence in stars at each image: a constant fraction of κ, or a de Vaucouleurs stellar profile.</summary>
/// <remarks>
/// de Vaucouleurs (1948) profile, κ_*(R) ∝ exp(−b[(R/R_e)^(1/4) − 1]) with b = 7.669 (Ciotti &amp; Bertin 1999, A&amp;A 352, 447,
/// for n = 4), on the lens's elliptical radius R = √(q x′² + y′²/q). Its effective radius follows σ_v through
/// R_e = R₀ (σ_v/200 km/s)^β (defaults R₀ = 4 kpc, β = 1.2: a rough early-type size–dispersion relation, from memory,
/// configurable). The profile is normalised so the stellar share of the convergence at the Einstein radius is f_E
/// (default 0.4, in the range suggested by lens models of early types; from memory). κ_* never exceeds κ.
/// </remarks>
public sealed record StellarConvergence
{
    /// <summary>"de_vaucouleurs" or "constant".</summary>
    public string Model { get; init; } = "de_vaucouleurs";
    /// <summary>κ_*/κ for the constant model.</summary>
    public double ConstantFraction { get; init => field = Check.InRange(value, 0, 1); } = 0.3;
    /// <summary>κ_*/κ at the Einstein radius for the de Vaucouleurs model.</summary>
    public double FractionAtEinsteinRadius { get; init => field = Check.InRange(value, 0, 1); } = 0.4;
    /// <summary>R₀ [kpc] of the size–dispersion relation.</summary>
    public double EffectiveRadiusKpcAt200Kms { get; init => field = Check.Positive(value); } = 4.0;
    /// <summary>β of the size–dispersion relation.</summary>
    public double EffectiveRadiusSlope { get; init => field = Check.InRange(value, -5, 5); } = 1.2;

    const double B4 = 7.669;

    /// <summary>Effective radius [arcsec] for σ_v and the lens's angular-diameter distance.</summary>
    public double EffectiveRadiusArcsec(double sigmaVKms, double lensDistanceMpc)
        => EffectiveRadiusKpcAt200Kms * Math.Pow(sigmaVKms / 200, EffectiveRadiusSlope) / (lensDistanceMpc * 1e3) * Units.ArcsecPerRadian;

    /// <summary>κ_* at an image with total convergence κ and elliptical radius R (θ_E, R_e in the same angular units).</summary>
    public double KappaStar(double kappa, double ellipticalRadius, double thetaE, double effectiveRadius)
    {
        if (Model == "constant") return ConstantFraction * kappa;
        double ks = 0.5 * FractionAtEinsteinRadius * Math.Exp(-B4 * (Math.Pow(ellipticalRadius / effectiveRadius, 0.25) - Math.Pow(thetaE / effectiveRadius, 0.25)));
        return Math.Min(ks, kappa);
    }
}
