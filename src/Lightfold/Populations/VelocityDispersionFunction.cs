using MathNet.Numerics;
using Lightfold.Randomness;

namespace Lightfold.Populations;

/// <summary>Velocity dispersion function of early-type galaxies in the modified Schechter form, with optional power-law evolution.</summary>
/// <remarks>
/// φ(σ) dσ = φ* (σ/σ*)^α exp[−(σ/σ*)^β] β/Γ(α/β) dσ/σ (Sheth et al. 2003, ApJ 594, 225; form from memory), so
/// ∫φ dσ = φ*. Default parameters are those of Choi, Park &amp; Vogeley 2007 (ApJ 658, 884; values from memory):
/// φ* = 8.0e-3 h³ Mpc⁻³, σ* = 161 km/s, α = 2.32, β = 2.67. Evolution: φ*(z) = φ*(0) (1+z)^νn and
/// σ*(z) = σ*(0) (1+z)^νσ (a documented power law; both 0 by default). Immutable.
/// </remarks>
public sealed record VelocityDispersionFunction
{
    /// <summary>φ* [h³ Mpc⁻³] (multiplied by h³ to give Mpc⁻³).</summary>
    public double PhiStarH3PerMpc3 { get; init => field = Check.Positive(value); } = 8.0e-3;

    /// <summary>σ* [km/s].</summary>
    public double SigmaStarKms { get; init => field = Check.Positive(value); } = 161.0;

    /// <summary>Low-σ slope α (&gt; 0).</summary>
    public double Alpha { get; init => field = Check.Positive(value); } = 2.32;

    /// <summary>High-σ cut-off exponent β (&gt; 0).</summary>
    public double Beta { get; init => field = Check.Positive(value); } = 2.67;

    /// <summary>Number-density evolution exponent νn: φ*(z) = φ*(0)(1+z)^νn.</summary>
    public double PhiStarEvolution { get; init => field = Check.Finite(value); }

    /// <summary>σ* evolution exponent νσ: σ*(z) = σ*(0)(1+z)^νσ.</summary>
    public double SigmaStarEvolution { get; init => field = Check.Finite(value); }

    /// <summary>φ*(z) [Mpc⁻³] for the Hubble parameter h.</summary>
    public double PhiStarPerMpc3(double z, double littleH) => PhiStarH3PerMpc3 * littleH * littleH * littleH * Math.Pow(1 + z, PhiStarEvolution);

    /// <summary>σ*(z) [km/s].</summary>
    public double SigmaStarKmsAt(double z) => SigmaStarKms * Math.Pow(1 + z, SigmaStarEvolution);

    /// <summary>dn/dσ [Mpc⁻³ (km/s)⁻¹] at σ and z.</summary>
    public double DensityPerKms(double sigmaKms, double z, double littleH)
    {
        double s = SigmaStarKmsAt(z), x = sigmaKms / s;
        return PhiStarPerMpc3(z, littleH) * Math.Pow(x, Alpha) * Math.Exp(-Math.Pow(x, Beta)) * Beta / SpecialFunctions.Gamma(Alpha / Beta) / sigmaKms;
    }

    /// <summary>∫ φ(σ, z) (σ/[km/s])^p dσ over [σ1, σ2]: φ* σ*^p Γ((α+p)/β)/Γ(α/β) [P(a, x2) − P(a, x1)], x = (σ/σ*)^β.</summary>
    public double Moment(double power, double z, double sigmaMinKms, double sigmaMaxKms, double littleH)
    {
        double s = SigmaStarKmsAt(z), a = (Alpha + power) / Beta;
        double x1 = Math.Pow(sigmaMinKms / s, Beta), x2 = Math.Pow(sigmaMaxKms / s, Beta);
        double fraction = SpecialFunctions.GammaLowerRegularized(a, x2) - SpecialFunctions.GammaLowerRegularized(a, x1);
        return PhiStarPerMpc3(z, littleH) * Math.Pow(s, power) * Math.Exp(SpecialFunctions.GammaLn(a) - SpecialFunctions.GammaLn(Alpha / Beta)) * fraction;
    }

    /// <summary>Draws σ from p(σ) ∝ φ(σ, z) σ⁴ on [σ1, σ2] (abundance × isothermal cross-section): x = (σ/σ*)^β is then
    /// Gamma-distributed with shape (α+4)/β, sampled by inverting the regularised incomplete gamma function.</summary>
    public double SampleLensingWeighted(double z, double sigmaMinKms, double sigmaMaxKms, ref KeyedRandom rng)
    {
        double s = SigmaStarKmsAt(z), a = (Alpha + 4.0) / Beta;
        double p1 = SpecialFunctions.GammaLowerRegularized(a, Math.Pow(sigmaMinKms / s, Beta));
        double p2 = SpecialFunctions.GammaLowerRegularized(a, Math.Pow(sigmaMaxKms / s, Beta));
        double u = p1 + (p2 - p1) * rng.NextOpenDouble();
        double x = SpecialFunctions.GammaLowerRegularizedInv(a, u);
        return Math.Clamp(s * Math.Pow(x, 1.0 / Beta), sigmaMinKms, sigmaMaxKms);
    }
}
