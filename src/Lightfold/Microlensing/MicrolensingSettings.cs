namespace Lightfold.Microlensing;

/// <summary>Microlensing of each image by the stars of the lens galaxy.</summary>
/// <remarks>
/// The source is the transient's photosphere (radius R(t) from its light-curve model) as a limb-darkened disk, fixed on
/// the map (transverse motion over a season is ≪ R_E and is ignored). Its effective radius depends on band after an
/// achromatic phase (Goldstein et al. 2018, ApJ 855, 22: achromatic for about three rest-frame weeks): R_b = R(t) ×
/// (λ_rest/λ_ref)^(−p w(t)), with w rising linearly from 0 at <see cref="AchromaticDays"/> to 1 twenty days later, so
/// bluer light comes from a larger radius later on. p = 0.5 and λ_ref = 5000 Å are our documented choice.
/// </remarks>
public sealed record MicrolensingSettings
{
    /// <summary>Apply microlensing (false: factor 1 everywhere, κ_* still reported).</summary>
    public bool Enabled { get; init; } = true;
    /// <summary>Stellar convergence model.</summary>
    public StellarConvergence Stellar { get; init; } = new();
    /// <summary>Map bank sampling.</summary>
    public MapBankSettings Bank { get; init; } = new();
    /// <summary>Linear limb-darkening coefficient u.</summary>
    public double LimbDarkening { get; init => field = Check.InRange(value, 0, 1); } = 0.6;
    /// <summary>End of the achromatic phase [rest-frame days].</summary>
    public double AchromaticDays { get; init => field = Check.NonNegative(value); } = 20;
    /// <summary>Chromatic index p of the effective radius.</summary>
    public double ChromaticIndex { get; init => field = Check.InRange(value, 0, 5); } = 0.5;
    /// <summary>Reference wavelength λ_ref [Å].</summary>
    public double ReferenceWavelengthAngstrom { get; init => field = Check.Positive(value); } = 5000;

    /// <summary>Effective-radius factor for a band at rest wavelength λ and phase t.</summary>
    public double ChromaticFactor(double restWavelengthAngstrom, double phaseDays)
    {
        double w = Math.Clamp((phaseDays - AchromaticDays) / 20.0, 0, 1);
        return w == 0 ? 1.0 : Math.Pow(restWavelengthAngstrom / ReferenceWavelengthAngstrom, -ChromaticIndex * w);
    }

    /// <summary>Einstein radius of a 1 M☉ star projected on the source plane [cm]: R_E = √(4GM/c² · D_s D_ds / D_d).</summary>
    /// <remarks>E.g. Schneider, Ehlers &amp; Falco 1992 (from memory); REFERENCES.md §7 gives 4.11e16 cm for z_l = 0.5, z_s = 1.</remarks>
    public static double EinsteinRadiusCm(double dLensMpc, double dSourceMpc, double dLensSourceMpc)
    {
        double rs = 4 * Units.GravitationalConstantCgs * Units.SolarMassG / (Units.SpeedOfLightCms * Units.SpeedOfLightCms);
        return Math.Sqrt(rs * dSourceMpc * dLensSourceMpc / dLensMpc * Units.CmPerMpc);
    }
}
