using Lightfold.Cosmology;

namespace Lightfold.Populations;

/// <summary>How the SN Ia volumetric rate depends on redshift.</summary>
public enum IaRateShape
{
    /// <summary>r(z) = r_ref ((1+z)/(1+z_ref))^β (Dilday et al. 2008, ApJ 682, 262: r_ref = 2.93e-5 h70³ yr⁻¹ Mpc⁻³ at z_ref = 0.09, β = 1.5).</summary>
    PowerLaw,
    /// <summary>Star-formation history convolved with a power-law delay-time distribution τ^s for τ &gt; τ_min, normalised to r_ref at z_ref.</summary>
    DelayTime,
}

/// <summary>Rest-frame volumetric rates of every transient type [yr⁻¹ Mpc⁻³].</summary>
/// <remarks>
/// Core-collapse types follow star formation: R_CC = k_CC ψ(z) × fraction (Madau &amp; Dickinson 2014 ψ; k_CC = 0.0068 M☉⁻¹
/// for a Salpeter IMF between 8 and 40 M☉, REFERENCES.md [D], quoted by Madau &amp; Dickinson 2014 from memory).
/// Default fractions follow Smith et al. 2011 (MNRAS 412, 1522; from memory) with IIb counted as Ib and peculiar Ibc as Ic:
/// IIP 0.482, IIL 0.064, IIn 0.088, Ib 0.177, Ic 0.189. The measured CC rate is about half the rate predicted from
/// star formation (Horiuchi et al. 2011, ApJ 738, 154); <see cref="CcScale"/> lets a user apply such a factor.
/// Rates quoted "h70³" scale as (H0/70)³.
/// </remarks>
public sealed record RateModel
{
    /// <summary>SN Ia rate shape.</summary>
    public IaRateShape IaShape { get; init; } = IaRateShape.PowerLaw;
    /// <summary>SN Ia rate at the reference redshift [h70³ yr⁻¹ Mpc⁻³].</summary>
    public double IaRateH70 { get; init => field = Check.Positive(value); } = 2.93e-5;
    /// <summary>Reference redshift of <see cref="IaRateH70"/>.</summary>
    public double IaZRef { get; init => field = Check.InRange(value, 0, 3); } = 0.09;
    /// <summary>Power-law exponent β.</summary>
    public double IaExponent { get; init => field = Check.InRange(value, -5, 10); } = 1.5;
    /// <summary>Shortest delay of the delay-time distribution [Gyr].</summary>
    public double IaDtdMinGyr { get; init => field = Check.InRange(value, 1e-3, 5); } = 0.04;
    /// <summary>Delay-time distribution slope s (DTD ∝ τ^s).</summary>
    public double IaDtdIndex { get; init => field = Check.InRange(value, -3, 1); } = -1.0;
    /// <summary>Core-collapse supernovae per solar mass of stars formed [M☉⁻¹].</summary>
    public double CcPerSolarMass { get; init => field = Check.InRange(value, 0, 1); } = 0.0068;
    /// <summary>Multiplier on every core-collapse rate (1 = as predicted from star formation).</summary>
    public double CcScale { get; init => field = Check.InRange(value, 0, 100); } = 1.0;
    /// <summary>Fractions of core-collapse events per type (IIP, IIL, IIn, Ib, Ic), summing to 1.</summary>
    public IReadOnlyDictionary<TransientType, double> CcFractions { get; init; } = new Dictionary<TransientType, double>
    {
        [TransientType.IIP] = 0.482, [TransientType.IIL] = 0.064, [TransientType.IIn] = 0.088,
        [TransientType.Ib] = 0.177, [TransientType.Ic] = 0.189,
    };
}

/// <summary>The rates of a <see cref="RateModel"/> evaluated for one cosmology (the delay-time model needs cosmic time).</summary>
public sealed class VolumetricRates
{
    readonly RateModel model;
    readonly double h70Cubed;
    readonly double[]? dtdZ, dtdRate;   // tabulated R_Ia(z) for the delay-time model

    /// <summary>Prepares the rates.</summary>
    public VolumetricRates(RateModel model, FlrwCosmology cosmology, double zMax)
    {
        this.model = model;
        double h70 = cosmology.Parameters.H0KmSMpc / 70.0;
        h70Cubed = h70 * h70 * h70;
        if (model.IaShape == IaRateShape.DelayTime)
            (dtdZ, dtdRate) = TabulateDelayTime(model, cosmology, Math.Max(zMax, model.IaZRef) + 0.1);
    }

    /// <summary>Rest-frame rate of <paramref name="type"/> at z [yr⁻¹ Mpc⁻³].</summary>
    public double RestFrameRate(TransientType type, double z)
    {
        if (type == TransientType.Ia)
        {
            double r = model.IaShape == IaRateShape.PowerLaw
                ? model.IaRateH70 * Math.Pow((1 + z) / (1 + model.IaZRef), model.IaExponent)
                : model.IaRateH70 * Numerics.Tabulated.Interpolate(dtdZ!, dtdRate!, z);
            return r * h70Cubed;
        }
        return model.CcScale * model.CcPerSolarMass * StarFormationHistory.MadauDickinson2014(z)
               * (model.CcFractions.TryGetValue(type, out double f) ? f : 0.0);
    }

    // R_Ia(t) ∝ ∫_{τmin}^{t − t(z=20)} ψ(t − τ) τ^s dτ, normalised to 1 at z_ref; ψ at a cosmic time by inverting the age.
    static (double[] Z, double[] Rate) TabulateDelayTime(RateModel m, FlrwCosmology c, double zMax)
    {
        const int nAge = 400;
        var ageZ = new double[nAge];
        var age = new double[nAge];
        for (int i = 0; i < nAge; i++)
        {
            ageZ[i] = Math.Exp(Math.Log(21.0) * i / (nAge - 1)) - 1.0;   // 0 … 20, dense at low z
            age[i] = c.AgeGyr(ageZ[i]);
        }
        double tFirst = age[nAge - 1];
        double ZAtAge(double t)
        {
            // age decreases with z: find the bracket by bisection.
            int lo = 0, hi = nAge - 1;
            if (t >= age[0]) return 0.0;
            if (t <= tFirst) return ageZ[nAge - 1];
            while (hi - lo > 1)
            {
                int mid = (lo + hi) / 2;
                if (age[mid] > t) lo = mid; else hi = mid;
            }
            double f = (t - age[lo]) / (age[hi] - age[lo]);
            return ageZ[lo] + f * (ageZ[hi] - ageZ[lo]);
        }
        double Raw(double z)
        {
            double t = c.AgeGyr(z), span = t - tFirst;
            if (span <= m.IaDtdMinGyr) return 0.0;
            // Integrate in log τ: ∫ ψ(t − τ) τ^(s+1) d ln τ.
            return Numerics.Quadrature.Integrate(lnTau =>
            {
                double tau = Math.Exp(lnTau);
                return StarFormationHistory.MadauDickinson2014(ZAtAge(t - tau)) * Math.Pow(tau, m.IaDtdIndex + 1);
            }, Math.Log(m.IaDtdMinGyr), Math.Log(span), 1e-8);
        }
        const int n = 200;
        var zs = new double[n];
        var rates = new double[n];
        double norm = Raw(m.IaZRef);
        for (int i = 0; i < n; i++)
        {
            zs[i] = zMax * i / (n - 1);
            rates[i] = Raw(zs[i]) / norm;
        }
        return (zs, rates);
    }

}
