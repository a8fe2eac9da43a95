using System.Runtime.CompilerServices;

namespace Lightfold.Lensing;

/// <summary>Singular isothermal ellipsoid plus external shear, in the catalog contract's parameterisation; angles in arcsec.</summary>
/// <remarks>
/// Convergence κ = θ_E / (2 √(q x′² + y′²/q)) in the lens frame (x′ along the major axis, φ_L = 90° − PA),
/// so the bare SIE's tangential critical curve is the ellipse q x′² + y′²/q = θ_E² of area π θ_E².
/// Deflection in closed form: Kormann, Schneider &amp; Bartelmann 1994 (A&amp;A 284, 285) in the form of
/// Keeton 2001 (astro-ph/0102341), rescaled to this normalisation: with q′ = √(1 − q²),
/// ψ_e = √(q² x′² + y′²) and b = θ_E √q / q′, α_x′ = b atan(q′ x′/ψ_e), α_y′ = b atanh(q′ y′/ψ_e),
/// ψ = x′ α_x′ + y′ α_y′, and ψ_x′x′ = θ_E √q y′²/(ψ_e r²), ψ_y′y′ = θ_E √q x′²/(ψ_e r²),
/// ψ_x′y′ = −θ_E √q x′y′/(ψ_e r²) (derived here; the tests check them against numerical integrals).
/// External shear as in <see cref="ExternalShear"/>. Immutable; every parameter is checked when set.
/// </remarks>
public sealed record SieShearLens : IMassModel
{
    /// <summary>Einstein radius θ_E [arcsec], &gt; 0.</summary>
    public required double ThetaEArcsec { get; init => field = Check.Positive(value); }

    /// <summary>Axis ratio q = b/a in [0.05, 1].</summary>
    public double AxisRatio { get; init => field = Check.InRange(value, 0.05, 1.0); } = 1.0;

    /// <summary>Position angle of the major axis [deg], North through East.</summary>
    public double PositionAngleDeg { get; init => field = Check.Finite(value); }

    /// <summary>External shear magnitude γ in [0, 0.9].</summary>
    public double ShearGamma { get; init => field = Check.InRange(value, 0.0, 0.9); }

    /// <summary>External shear position angle [deg], North through East (images stretch along it).</summary>
    public double ShearPositionAngleDeg { get; init => field = Check.Finite(value); }

    /// <inheritdoc/>
    /// <remarks>Recomputes the lens constants on every call; for many points use <see cref="Prepare"/>.</remarks>
    public LensPoint Evaluate(double xArcsec, double yArcsec) => new SieKernel(this).EvaluateSky(xArcsec, yArcsec);

    /// <summary>The same mass model with its constants computed once, for evaluating many points.</summary>
    public IMassModel Prepare() => new PreparedSieShear(new SieKernel(this));

    sealed class PreparedSieShear(SieKernel kernel) : IMassModel
    {
        public LensPoint Evaluate(double xArcsec, double yArcsec) => kernel.EvaluateSky(xArcsec, yArcsec);
    }
}

/// <summary>Precomputed constants of one <see cref="SieShearLens"/> for hot loops (lens frame: x′ along the major axis).</summary>
internal readonly struct SieKernel
{
    public readonly double ThetaE, Q, QPrime, SqrtQ, B, Cos, Sin, G1, G2;
    public readonly bool Round;

    public SieKernel(SieShearLens lens)
    {
        ThetaE = lens.ThetaEArcsec;
        Q = lens.AxisRatio;
        Round = Q == 1.0;
        QPrime = Math.Sqrt((1.0 - Q) * (1.0 + Q));
        SqrtQ = Math.Sqrt(Q);
        B = Round ? ThetaE : ThetaE * SqrtQ / QPrime;
        double phiL = Units.DegToRad(90.0 - lens.PositionAngleDeg);
        (Sin, Cos) = Math.SinCos(phiL);
        // Shear angle measured in the lens frame: φ_γ′ = φ_γ − φ_L.
        double phiG = Units.DegToRad(90.0 - lens.ShearPositionAngleDeg) - phiL;
        (double s2, double c2) = Math.SinCos(2.0 * phiG);
        G1 = lens.ShearGamma * c2;
        G2 = lens.ShearGamma * s2;
    }

    /// <summary>Sky → lens frame.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void ToLens(double x, double y, out double xl, out double yl)
    {
        xl = x * Cos + y * Sin;
        yl = -x * Sin + y * Cos;
    }

    /// <summary>Lens → sky frame.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void ToSky(double xl, double yl, out double x, out double y)
    {
        x = xl * Cos - yl * Sin;
        y = xl * Sin + yl * Cos;
    }

    /// <summary>SIE deflection and Hessian at the unit-radius point of direction (c, s) in the lens frame; the Hessian at radius r is this divided by r.</summary>
    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    public void UnitDirection(double c, double s, out double ax, out double ay, out double hxx, out double hyy, out double hxy)
    {
        double k;
        if (Round)
        {
            ax = ThetaE * c;
            ay = ThetaE * s;
            k = ThetaE;
        }
        else
        {
            double psiE = Math.Sqrt(Q * Q * c * c + s * s);
            ax = B * Math.Atan(QPrime * c / psiE);
            ay = B * Math.Atanh(QPrime * s / psiE);
            k = ThetaE * SqrtQ / psiE;
        }
        hxx = k * s * s;
        hyy = k * c * c;
        hxy = -k * c * s;
    }

    /// <summary>Full SIE + shear evaluation in the lens frame.</summary>
    public LensPoint EvaluateLens(double xl, double yl)
    {
        double r = Math.Sqrt(xl * xl + yl * yl);
        double ax, ay, hxx, hyy, hxy;
        if (r == 0)
        {
            ax = ay = 0;
            hxx = hyy = double.PositiveInfinity;
            hxy = 0;
        }
        else
        {
            UnitDirection(xl / r, yl / r, out ax, out ay, out hxx, out hyy, out hxy);
            hxx /= r;
            hyy /= r;
            hxy /= r;
        }
        double potential = xl * ax + yl * ay + 0.5 * G1 * (xl * xl - yl * yl) + G2 * xl * yl;
        return new LensPoint(potential, ax + G1 * xl + G2 * yl, ay + G2 * xl - G1 * yl, hxx + G1, hyy - G1, hxy + G2);
    }

    /// <summary>Full SIE + shear evaluation at a sky-frame point, returned in the sky frame.</summary>
    public LensPoint EvaluateSky(double x, double y)
    {
        ToLens(x, y, out double xl, out double yl);
        return RotateToSky(EvaluateLens(xl, yl));
    }

    /// <summary>Rotates deflection and Hessian from the lens frame to the sky frame (H_sky = R H′ Rᵀ).</summary>
    public LensPoint RotateToSky(in LensPoint p)
    {
        double c = Cos, s = Sin;
        ToSky(p.AlphaX, p.AlphaY, out double ax, out double ay);
        double hxx = c * c * p.Hxx - 2 * c * s * p.Hxy + s * s * p.Hyy;
        double hyy = s * s * p.Hxx + 2 * c * s * p.Hxy + c * c * p.Hyy;
        double hxy = c * s * (p.Hxx - p.Hyy) + (c * c - s * s) * p.Hxy;
        return new LensPoint(p.Potential, ax, ay, hxx, hyy, hxy);
    }

    /// <summary>Convergence of the SIE alone at a lens-frame point (external shear adds none).</summary>
    public double Kappa(double xl, double yl) => ThetaE / (2.0 * Math.Sqrt(Q * xl * xl + yl * yl / Q));
}
