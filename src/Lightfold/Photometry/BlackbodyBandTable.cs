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
        // Same trapezoid rule as SyntheticPhotometry.FluxNu, with everything that does not depend on T hoisted:
        // per redshift, the weight w_k = T_b λ Δλ × S(λ_rest) × 2hc²/λ_rest⁵ and the exponent scale hc/(λ_rest k).
        var l = band.WavelengthAngstrom;
        var tb = band.Throughput;
        int n = l.Length;
        double den = 0;
        for (int k = 1; k < n; k++) den += 0.5 * (l[k] - l[k - 1]) * (tb[k] / l[k] + tb[k - 1] / l[k - 1]);
        den *= Units.SpeedOfLightAngstromPerS;
        const double hc = Units.PlanckErgS * Units.SpeedOfLightCms;
        Parallel.For(0, nz, iz =>
        {
            double z = iz * ZStep;
            var weight = new double[n];
            var scale = new double[n];
            for (int k = 0; k < n; k++)
            {
                double trapezoid = 0.5 * ((k > 0 ? l[k] - l[k - 1] : 0) + (k < n - 1 ? l[k + 1] - l[k] : 0));
                double restCm = l[k] / (1 + z) * 1e-8;
                weight[k] = tb[k] * l[k] * trapezoid * uvSuppression(l[k] / (1 + z)) * 2 * hc * Units.SpeedOfLightCms / Math.Pow(restCm, 5) * 1e-8;
                scale[k] = hc / (restCm * Units.BoltzmannErgPerK);
            }
            for (int it = 0; it < NT; it++)
            {
                double inverseT = 1.0 / Math.Exp(LnTMin + it * LnTStep), sum = 0;
                for (int k = 0; k < n; k++)
                {
                    double x = scale[k] * inverseT;
                    if (x < 700) sum += weight[k] / (Math.Exp(x) - 1);
                }
                lnG[iz * NT + it] = Math.Log(Math.Max(sum / den, 1e-300));
            }
        });
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
