namespace Lightfold.Lensing;

/// <summary>A sampled closed curve (sky frame, arcsec); the last point is not repeated.</summary>
public sealed record Polyline(double[] X, double[] Y)
{
    /// <summary>Number of points.</summary>
    public int Count => X.Length;

    /// <summary>Signed enclosed area by the shoelace formula [arcsec²] (positive when counter-clockwise).</summary>
    public double SignedArea()
    {
        double sum = 0;
        for (int i = 0, j = X.Length - 1; i < X.Length; j = i++)
            sum += X[j] * Y[i] - X[i] * Y[j];
        return 0.5 * sum;
    }
}

/// <summary>Critical curve and caustics of a singular SIE plus shear, sampled by image-plane direction.</summary>
/// <param name="TangentialCritical">Image-plane curve where det(∂β/∂θ) = 0 (the only critical curve of the singular SIE).</param>
/// <param name="TangentialCaustic">Its image on the source plane (the astroid-like caustic with four cusps).</param>
/// <param name="Cut">The cut (pseudo-caustic): the source-plane image of θ → 0, β = −α(φ); crossing it creates or removes the faint image near the centre.</param>
public sealed record CausticSet(Polyline TangentialCritical, Polyline TangentialCaustic, Polyline Cut);

/// <summary>Computes critical curves and caustics.</summary>
/// <remarks>
/// With θ = r u(φ), the SIE Hessian is H₁(φ)/r with det H₁ = 0, so det(M − H₁/r) = 0 (M = I − Γ) is linear in
/// 1/r: r_c(φ) = (M₁₁ H₂₂ + M₂₂ H₁₁ − 2 M₁₂ H₁₂)/det M, one tangential critical curve per direction. The
/// caustic is β = M θ_c − α(φ); the cut is β = −α(φ) (Kormann, Schneider &amp; Bartelmann 1994, §4, for the
/// bare SIE; the shear terms follow from the same algebra).
/// </remarks>
public static class CriticalCurves
{
    /// <summary>The curves sampled at <paramref name="points"/> uniformly spaced image-plane directions.</summary>
    public static CausticSet Compute(SieShearLens lens, int points = 1000)
    {
        var k = new SieKernel(lens);
        Trace(in k, points, out var cx, out var cy, out var sx, out var sy, out var ux, out var uy, lensFrame: false);
        return new CausticSet(new Polyline(cx, cy), new Polyline(sx, sy), new Polyline(ux, uy));
    }

    /// <summary>Samples the critical curve, the caustic and the cut, in the lens or sky frame.</summary>
    internal static void Trace(in SieKernel k, int points,
        out double[] critX, out double[] critY, out double[] causX, out double[] causY, out double[] cutX, out double[] cutY, bool lensFrame)
    {
        critX = new double[points]; critY = new double[points];
        causX = new double[points]; causY = new double[points];
        cutX = new double[points]; cutY = new double[points];
        double m11 = 1 - k.G1, m22 = 1 + k.G1, m12 = -k.G2, detM = m11 * m22 - m12 * m12;
        for (int i = 0; i < points; i++)
        {
            (double s, double c) = Math.SinCos(2.0 * Math.PI * i / points);
            k.UnitDirection(c, s, out double ax, out double ay, out double hxx, out double hyy, out double hxy);
            double rc = (m11 * hyy + m22 * hxx - 2 * m12 * hxy) / detM;
            double tx = rc * c, ty = rc * s;
            double bx = m11 * tx + m12 * ty - ax, by = m12 * tx + m22 * ty - ay;
            if (lensFrame)
            {
                (critX[i], critY[i], causX[i], causY[i], cutX[i], cutY[i]) = (tx, ty, bx, by, -ax, -ay);
            }
            else
            {
                k.ToSky(tx, ty, out critX[i], out critY[i]);
                k.ToSky(bx, by, out causX[i], out causY[i]);
                k.ToSky(-ax, -ay, out cutX[i], out cutY[i]);
            }
        }
    }
}
