namespace Lightfold.Lensing;

/// <summary>One image of a point source (sky frame, arcsec), as found by <see cref="ImageFinder"/>.</summary>
/// <param name="XArcsec">East offset from the lens centre.</param>
/// <param name="YArcsec">North offset from the lens centre.</param>
/// <param name="Magnification">Signed magnification 1/det(∂β/∂θ); negative for saddle points.</param>
/// <param name="FermatPotentialArcsec2">τ = ½|θ − β|² − ψ(θ) [arcsec²].</param>
/// <param name="RelativeFermatArcsec2">τ − τ of the first-arriving image (≥ 0) [arcsec²]; multiply by
/// <see cref="TimeDelays.DaysPerArcsec2"/> for the delay in days.</param>
/// <param name="Kappa">Convergence at the image (½∇²ψ).</param>
/// <param name="Gamma">Magnitude of the total shear (lens plus external) at the image.</param>
/// <param name="ResidualArcsec">|β − (θ − α(θ))| after refinement.</param>
public readonly record struct LensedImage(
    double XArcsec, double YArcsec, double Magnification, double FermatPotentialArcsec2,
    double RelativeFermatArcsec2, double Kappa, double Gamma, double ResidualArcsec)
{
    /// <summary>+1 for minima and maxima (det &gt; 0), −1 for saddle points.</summary>
    public int Parity => Magnification >= 0 ? 1 : -1;
}

/// <summary>What kind of image configuration a source produced.</summary>
public enum ImageSetStatus
{
    /// <summary>Isolated images, each a simple root of the lens equation.</summary>
    Regular = 0,
    /// <summary>Two images merged on a critical curve (source on a caustic to working precision): reported once, magnification capped.</summary>
    OnCaustic = 1,
    /// <summary>Source exactly behind the centre of a circular lens without shear: an Einstein ring, no discrete images.</summary>
    Ring = 2,
}

/// <summary>Converts Fermat-potential differences to time delays.</summary>
public static class TimeDelays
{
    /// <summary>Days of delay per arcsec² of Fermat potential: D_Δt / c with angles in radians.</summary>
    /// <param name="timeDelayDistanceMpc">D_Δt = (1 + z_d) D_d D_s / D_ds [Mpc].</param>
    public static double DaysPerArcsec2(double timeDelayDistanceMpc)
        => timeDelayDistanceMpc * Units.KmPerMpc / Units.SpeedOfLightKms / (Units.ArcsecPerRadian * Units.ArcsecPerRadian) / Units.SecondsPerDay;
}
