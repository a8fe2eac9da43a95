namespace Lightfold.Transients;

/// <summary>Energy deposition by ⁵⁶Ni → ⁵⁶Co → ⁵⁶Fe with full γ-ray trapping.</summary>
/// <remarks>L(t) = [6.45 e^(−t/8.8 d) + 1.45 e^(−t/111.3 d)] × 10⁴³ (M_Ni/M☉) erg s⁻¹ (Nadyozhin 1994, ApJS 92, 527,
/// as commonly restated; coefficients from memory, consistent with ε_Ni = 3.97e10 erg s⁻¹ g⁻¹ from 1.75 MeV per decay
/// and τ_Ni = 8.8 d). Mean lives τ_Ni = 8.8 d and τ_Co = 111.3 d.</remarks>
public static class RadioactiveDecay
{
    /// <summary>⁵⁶Ni mean life [days].</summary>
    public const double NickelMeanLifeDays = 8.8;
    /// <summary>⁵⁶Co mean life [days].</summary>
    public const double CobaltMeanLifeDays = 111.3;

    /// <summary>Deposition rate [erg/s] at t days after explosion for M_Ni [M☉].</summary>
    public static double DepositionErgPerS(double nickelMassSolar, double tDays)
        => (6.45e43 * Math.Exp(-tDays / NickelMeanLifeDays) + 1.45e43 * Math.Exp(-tDays / CobaltMeanLifeDays)) * nickelMassSolar;
}
