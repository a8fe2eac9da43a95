namespace Lightfold.Lensing;

/// <summary>Einstein radii of isothermal lenses and point masses.</summary>
public static class EinsteinRadius
{
    /// <summary>θ_E = 4π (σ_v/c)² D_ds/D_s [arcsec] of a singular isothermal sphere or, in the catalog normalisation, SIE.</summary>
    /// <remarks>E.g. Schneider, Ehlers &amp; Falco 1992, eq. 8.36 (from memory); the catalog contract in DESIGN.md.</remarks>
    /// <param name="sigmaVKms">Velocity dispersion [km/s].</param>
    /// <param name="dsOverDsRatio">D_ds / D_s (angular-diameter distances).</param>
    public static double IsothermalArcsec(double sigmaVKms, double dsOverDsRatio)
    {
        double v = sigmaVKms / Units.SpeedOfLightKms;
        return 4.0 * Math.PI * v * v * dsOverDsRatio * Units.ArcsecPerRadian;
    }

    /// <summary>θ_E = √(4GM/c² · D_ds/(D_d D_s)) [arcsec] of a point mass.</summary>
    /// <param name="massSolar">Mass [M☉].</param>
    /// <param name="ddCm">D_d [cm].</param>
    /// <param name="dsCm">D_s [cm].</param>
    /// <param name="ddsCm">D_ds [cm].</param>
    public static double PointMassArcsec(double massSolar, double ddCm, double dsCm, double ddsCm)
    {
        double rs2 = 4.0 * Units.GravitationalConstantCgs * massSolar * Units.SolarMassG / (Units.SpeedOfLightCms * Units.SpeedOfLightCms);
        return Math.Sqrt(rs2 * ddsCm / (ddCm * dsCm)) * Units.ArcsecPerRadian;
    }
}
