using Lightfold.Numerics;

namespace Lightfold.Tests.Support;

/// <summary>
/// The SIE + shear lens written from the catalog contract in DESIGN.md alone (rotation, κ, shear), with the deflection
/// obtained by numerically integrating κ (Keeton 2001 J-integrals), not the library's closed form: the independent
/// checker every catalog and command output is compared with.
/// </summary>
public sealed record ContractLens(double ThetaE, double Q, double PaDeg, double Gamma, double ShearPaDeg)
{
    double PhiL => (90 - PaDeg) * Math.PI / 180;
    double G1 => Gamma * Math.Cos(2 * (90 - ShearPaDeg) * Math.PI / 180);
    double G2 => Gamma * Math.Sin(2 * (90 - ShearPaDeg) * Math.PI / 180);

    public double Kappa(double x, double y)
    {
        double xl = x * Math.Cos(PhiL) + y * Math.Sin(PhiL), yl = -x * Math.Sin(PhiL) + y * Math.Cos(PhiL);
        return ThetaE / (2 * Math.Sqrt(Q * xl * xl + yl * yl / Q));
    }

    // Deflection from κ by 1-D integrals (Keeton 2001 eqs. 4–5 with κ(ξ) = θ_E/(2√q ξ), ξ² = x′² + y′²/q²).
    public (double Ax, double Ay) Alpha(double x, double y)
    {
        double c = Math.Cos(PhiL), s = Math.Sin(PhiL);
        double xl = x * c + y * s, yl = -x * s + y * c, e = 1 - Q * Q;
        double J(int n) => Quadrature.Integrate(t =>
        {
            double u = t * t, d = 1 - e * u;
            return 2 * t * ThetaE / (2 * Math.Sqrt(Q) * Math.Sqrt(u * (xl * xl + yl * yl / d))) / Math.Pow(d, n + 0.5);
        }, 0, 1, 1e-13);
        double axl = Q * xl * J(0), ayl = Q * yl * J(1);
        return (axl * c - ayl * s + G1 * x + G2 * y, axl * s + ayl * c + G2 * x - G1 * y);
    }

    // Isothermal potential is homogeneous of degree 1, so ψ_SIE = θ·α_SIE exactly; plus the shear potential.
    public double Potential(double x, double y)
    {
        var (ax, ay) = Alpha(x, y);
        double sx = G1 * x + G2 * y, sy = G2 * x - G1 * y;
        return x * (ax - sx) + y * (ay - sy) + 0.5 * G1 * (x * x - y * y) + G2 * x * y;
    }

    /// <summary>Hessian of ψ by central differences of the independent deflection (step 1e-5 θ_E).</summary>
    public (double Hxx, double Hyy, double Hxy, double Hyx) Hessian(double x, double y)
    {
        double h = 1e-5 * ThetaE;
        var (pxx, pxy) = Alpha(x + h, y); var (mxx, mxy) = Alpha(x - h, y);
        var (pyx, pyy) = Alpha(x, y + h); var (myx, myy) = Alpha(x, y - h);
        return ((pxx - mxx) / (2 * h), (pyy - myy) / (2 * h), (pyx - myx) / (2 * h), (pxy - mxy) / (2 * h));
    }

    /// <summary>Signed magnification from <see cref="Hessian"/>.</summary>
    public double Magnification(double x, double y)
    {
        var (hxx, hyy, hxy, hyx) = Hessian(x, y);
        return 1 / ((1 - hxx) * (1 - hyy) - hxy * hyx);
    }

    /// <summary>|β − (θ − α(θ))| [arcsec].</summary>
    public double Residual(double x, double y, double bx, double by)
    {
        var (ax, ay) = Alpha(x, y);
        return Math.Sqrt(Math.Pow(bx - (x - ax), 2) + Math.Pow(by - (y - ay), 2));
    }

    /// <summary>Days of delay per arcsec² of Fermat potential: D_Δt/c with angles in radians (written out independently).</summary>
    public static double DaysPerArcsec2(double dDtMpc) => dDtMpc * 3.0856775814913673e19 / 299792.458 / 86400 / Math.Pow(648000 / Math.PI, 2);
}
