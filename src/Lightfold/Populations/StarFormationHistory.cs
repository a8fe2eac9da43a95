namespace Lightfold.Populations;

/// <summary>Cosmic star-formation rate density of Madau &amp; Dickinson 2014 (ARA&amp;A 52, 415, eq. 15).</summary>
/// <remarks>ψ(z) = 0.015 (1+z)^2.7 / [1 + ((1+z)/2.9)^5.6] M☉ yr⁻¹ Mpc⁻³ (Salpeter IMF, 0.1–100 M☉; coefficients
/// from memory, the peak near z ≈ 1.9 confirmed in the paper's abstract).</remarks>
public static class StarFormationHistory
{
    /// <summary>ψ(z) [M☉ yr⁻¹ Mpc⁻³].</summary>
    public static double MadauDickinson2014(double z)
    {
        double a = 1 + z;
        return 0.015 * Math.Pow(a, 2.7) / (1 + Math.Pow(a / 2.9, 5.6));
    }
}
