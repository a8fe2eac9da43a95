namespace Lightfold.Photometry;

/// <summary>Band-averaged blackbody flux of a redshifted, UV-suppressed photosphere, tabulated over (ln T, z).</summary>
/// <remarks>G(T, z) = ∫ B_λ(T, λ/(1+z)) S(λ/(1+z)) T_b(λ) λ dλ / (c ∫ T_b/λ dλ) [erg s⁻¹ cm⁻² Hz⁻¹ sr⁻¹ Å... per unit
/// area], so a photosphere of radius R gives f_ν = 4π² R² G / (4π D_L² (1+z)). 160 temperatures log-spaced over
/// 1500–60000 K and redshift steps of 0.01; bilinear interpolation of ln G (the tests bound the error).</remarks>
public sealed class BlackbodyBandTable
{
    const int NT = 160;
    const double TMin = 1500, TMax = 60000, ZStep = 0.01;
    static readonly double LnTMin = Math.Log(TMin), LnTStep = (Math.Log(TMax) - Math.Log(TMin)) / (NT - 1);
    readonly double[] lnG;   // [iz * NT + it]
    readonly int nz;

    /// <summary>Tabulates <paramref name="band"/> for 0 ≤ z ≤ zMax.</summary>
    public BlackbodyBandTable(Bandpass band, Func<double, double> uvSuppression, double zMax)
    {
        Band = band;
        nz = (int)Math.Ceiling(zMax / ZStep) + 2;
        lnG = new double[nz * NT];
        for (int iz = 0; iz < nz; iz++)
        {
            double z = iz * ZStep;
            for (int it = 0; it < NT; it++)
            {
                double t = Math.Exp(LnTMin + it * LnTStep);
                double g = SyntheticPhotometry.FluxNu(band, l => SyntheticPhotometry.PlanckLambda(t, l / (1 + z)) * uvSuppression(l / (1 + z)));
                lnG[iz * NT + it] = Math.Log(Math.Max(g, 1e-300));
            }
        }
    }

    /// <summary>The band.</summary>
    public Bandpass Band { get; }

    /// <summary>G(T, z) by bilinear interpolation of ln G; T is clamped to the grid.</summary>
    public double Evaluate(double temperatureK, double z)
    {
        double ut = (Math.Log(Math.Clamp(temperatureK, TMin, TMax)) - LnTMin) / LnTStep;
        int it = Math.Min((int)ut, NT - 2);
        double ft = ut - it;
        double uz = z / ZStep;
        int iz = Math.Clamp((int)uz, 0, nz - 2);
        double fz = Math.Clamp(uz - iz, 0, 1);
        double a = lnG[iz * NT + it] * (1 - ft) + lnG[iz * NT + it + 1] * ft;
        double b = lnG[(iz + 1) * NT + it] * (1 - ft) + lnG[(iz + 1) * NT + it + 1] * ft;
        return Math.Exp(a * (1 - fz) + b * fz);
    }
}
