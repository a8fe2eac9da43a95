namespace Lightfold.Cosmology;

/// <summary>Curvature functions shared by the exact and tabulated distance paths (Hogg 1999, astro-ph/9905116).</summary>
public static class Curvature
{
    /// <summary>D_M from a line-of-sight comoving distance D_C (Hogg 1999 eq. 16).</summary>
    public static double TransverseFromLineOfSight(double comovingMpc, double hubbleDistanceMpc, double omegaK)
    {
        if (omegaK == 0) return comovingMpc;
        double sk = Math.Sqrt(Math.Abs(omegaK));
        double x = sk * comovingMpc / hubbleDistanceMpc;
        return omegaK > 0 ? hubbleDistanceMpc / sk * Math.Sinh(x) : hubbleDistanceMpc / sk * Math.Sin(x);
    }

    /// <summary>All-sky comoving volume from the transverse comoving distance (Hogg 1999 eq. 29).</summary>
    public static double ComovingVolume(double dmMpc, double dhMpc, double omegaK)
    {
        if (omegaK == 0) return 4.0 / 3.0 * Math.PI * dmMpc * dmMpc * dmMpc;
        double sk = Math.Sqrt(Math.Abs(omegaK));
        double r = dmMpc / dhMpc;
        double root = Math.Sqrt(1.0 + omegaK * r * r);
        double angle = omegaK > 0 ? Math.Asinh(sk * r) : Math.Asin(sk * r);
        return 4.0 * Math.PI * dhMpc * dhMpc * dhMpc / (2.0 * omegaK) * (r * root - angle / sk);
    }

    /// <summary>Distance modulus of a luminosity distance in Mpc: 5 log10(D_L / 10 pc).</summary>
    public static double DistanceModulus(double luminosityDistanceMpc) => 5.0 * Math.Log10(luminosityDistanceMpc) + 25.0;
}
