namespace Lightfold.Lensing;

/// <summary>Lensing potential, deflection and Hessian at one image-plane point (angles in arcsec).</summary>
/// <param name="Potential">ψ [arcsec²].</param>
/// <param name="AlphaX">∂ψ/∂x [arcsec].</param>
/// <param name="AlphaY">∂ψ/∂y [arcsec].</param>
/// <param name="Hxx">∂²ψ/∂x².</param>
/// <param name="Hyy">∂²ψ/∂y².</param>
/// <param name="Hxy">∂²ψ/∂x∂y.</param>
public readonly record struct LensPoint(double Potential, double AlphaX, double AlphaY, double Hxx, double Hyy, double Hxy)
{
    /// <summary>Convergence κ = ½ ∇²ψ.</summary>
    public double Kappa => 0.5 * (Hxx + Hyy);

    /// <summary>Shear component γ₁ = ½ (ψ_xx − ψ_yy).</summary>
    public double Gamma1 => 0.5 * (Hxx - Hyy);

    /// <summary>Shear component γ₂ = ψ_xy.</summary>
    public double Gamma2 => Hxy;

    /// <summary>Shear magnitude |γ|.</summary>
    public double ShearMagnitude => Math.Sqrt(Gamma1 * Gamma1 + Gamma2 * Gamma2);

    /// <summary>det(∂β/∂θ) = (1 − ψ_xx)(1 − ψ_yy) − ψ_xy².</summary>
    public double JacobianDeterminant => (1.0 - Hxx) * (1.0 - Hyy) - Hxy * Hxy;

    /// <summary>Signed magnification 1/det(∂β/∂θ).</summary>
    public double Magnification => 1.0 / JacobianDeterminant;

    /// <summary>Sum of two contributions (potentials add).</summary>
    public static LensPoint operator +(LensPoint a, LensPoint b)
        => new(a.Potential + b.Potential, a.AlphaX + b.AlphaX, a.AlphaY + b.AlphaY, a.Hxx + b.Hxx, a.Hyy + b.Hyy, a.Hxy + b.Hxy);
}
