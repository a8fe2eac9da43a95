namespace Lightfold.Photometry;

/// <summary>The extinction law of Cardelli, Clayton &amp; Mathis 1989 (ApJ 345, 245): A(λ)/A(V) = a(x) + b(x)/R_V, x = 1/λ[μm].</summary>
/// <remarks>Coefficients as published for 0.3 ≤ x ≤ 8 μm⁻¹ (from memory); outside, the nearest end is used.
/// A band's extinction is evaluated at its pivot wavelength (rest-frame pivot for host dust): an
/// effective-wavelength approximation, good to a few hundredths of a magnitude for broad bands and E(B−V) ≲ 0.3.</remarks>
public static class Extinction
{
    /// <summary>A(λ)/A(V) for the given R_V.</summary>
    public static double RelativeToV(double wavelengthAngstrom, double rV)
    {
        double x = Math.Clamp(1e4 / wavelengthAngstrom, 0.3, 8.0);
        double a, b;
        if (x < 1.1)
        {
            a = 0.574 * Math.Pow(x, 1.61);
            b = -0.527 * Math.Pow(x, 1.61);
        }
        else if (x < 3.3)
        {
            double y = x - 1.82;
            a = 1 + y * (0.17699 + y * (-0.50447 + y * (-0.02427 + y * (0.72085 + y * (0.01979 + y * (-0.77530 + y * 0.32999))))));
            b = y * (1.41338 + y * (2.28305 + y * (1.07233 + y * (-5.38434 + y * (-0.62251 + y * (5.30260 + y * -2.09002))))));
        }
        else
        {
            double fa = 0, fb = 0;
            if (x >= 5.9)
            {
                double d = x - 5.9;
                fa = -0.04473 * d * d - 0.009779 * d * d * d;
                fb = 0.2130 * d * d + 0.1207 * d * d * d;
            }
            a = 1.752 - 0.316 * x - 0.104 / ((x - 4.67) * (x - 4.67) + 0.341) + fa;
            b = -3.090 + 1.825 * x + 1.206 / ((x - 4.62) * (x - 4.62) + 0.263) + fb;
        }
        return a + b / rV;
    }

    /// <summary>A(λ) [mag] for a colour excess E(B−V): R_V E(B−V) × A(λ)/A(V).</summary>
    public static double Magnitudes(double wavelengthAngstrom, double ebv, double rV) => ebv == 0 ? 0 : rV * ebv * RelativeToV(wavelengthAngstrom, rV);
}
