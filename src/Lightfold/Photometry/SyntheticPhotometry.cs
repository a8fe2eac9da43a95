namespace Lightfold.Photometry;

/// <summary>AB synthetic photometry through a photon-counting bandpass.</summary>
/// <remarks>
/// f_ν = ∫ F_λ T λ dλ / ∫ T (c/λ) dλ, m_AB = −2.5 log10 f_ν − 48.60 (Oke &amp; Gunn 1983, ApJ 266, 713; the
/// photon-counting weight as in Fukugita et al. 1996, AJ 111, 1748, from memory). Trapezoid rule on the band's grid.
/// </remarks>
public static class SyntheticPhotometry
{
    /// <summary>Mean f_ν [erg s⁻¹ cm⁻² Hz⁻¹] of a spectrum F_λ [erg s⁻¹ cm⁻² Å⁻¹] given as a function of λ [Å].</summary>
    public static double FluxNu(Bandpass band, Func<double, double> fLambda)
    {
        var l = band.WavelengthAngstrom;
        var t = band.Throughput;
        double num = 0, den = 0;
        double fa = fLambda(l[0]) * t[0] * l[0], da = t[0] / l[0];
        for (int i = 1; i < l.Length; i++)
        {
            double fb = fLambda(l[i]) * t[i] * l[i], db = t[i] / l[i], dl = l[i] - l[i - 1];
            num += 0.5 * dl * (fa + fb);
            den += 0.5 * dl * (da + db);
            fa = fb;
            da = db;
        }
        return num / (den * Units.SpeedOfLightAngstromPerS);
    }

    /// <summary>AB magnitude of f_ν [cgs].</summary>
    public static double AbMagnitude(double fluxNuCgs) => -2.5 * Math.Log10(fluxNuCgs) + Units.AbZeroPointCgs;

    /// <summary>Flux in nJy of f_ν [cgs].</summary>
    public static double ToNanojansky(double fluxNuCgs) => fluxNuCgs / Units.CgsPerNjy;

    /// <summary>AB magnitude of a flux in nJy (zero point 31.4).</summary>
    public static double MagnitudeFromNjy(double fluxNjy) => -2.5 * Math.Log10(fluxNjy) + Units.AbZeroPointNjy;

    /// <summary>Flux in nJy of an AB magnitude.</summary>
    public static double NjyFromMagnitude(double mag) => Math.Pow(10, -0.4 * (mag - Units.AbZeroPointNjy));

    /// <summary>Planck's B_λ(T) [erg s⁻¹ cm⁻² Å⁻¹ sr⁻¹] at λ [Å].</summary>
    public static double PlanckLambda(double temperatureK, double wavelengthAngstrom)
    {
        double lcm = wavelengthAngstrom * 1e-8;
        double x = Units.PlanckErgS * Units.SpeedOfLightCms / (lcm * Units.BoltzmannErgPerK * temperatureK);
        if (x > 700) return 0.0;
        return 2 * Units.PlanckErgS * Units.SpeedOfLightCms * Units.SpeedOfLightCms / Math.Pow(lcm, 5) / (Math.Exp(x) - 1) * 1e-8;
    }
}
