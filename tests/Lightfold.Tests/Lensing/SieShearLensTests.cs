using Lightfold.Lensing;
using Lightfold.Numerics;
using Lightfold.Randomness;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Lensing;

public class SieShearLensTests
{
    // External reference: deflection of an elliptical mass distribution by one-dimensional integrals,
    // α_x = q x J0, α_y = q y J1, J_n = ∫0^1 κ(ξ(u)) / [1 − (1 − q²) u]^(n+½) du,
    // ξ(u)² = u (x² + y²/(1 − (1 − q²) u)), with κ written as a function of ξ² = x² + y²/q²
    // (Schramm 1990, A&A 231, 19; in the form of Keeton 2001, astro-ph/0102341, eqs. 4–5; from memory).
    // For the contract's SIE, κ(ξ) = θ_E / (2 √q ξ). Checked at 200 random points and axis ratios, 1e-8 relative.
    [Fact]
    public void Closed_form_deflection_matches_numerical_integral_of_the_convergence()
    {
        var rng = KeyedRandom.For(31, 0, Stage.Population);
        for (int i = 0; i < 200; i++)
        {
            double q = rng.Uniform(0.15, 0.99), thetaE = rng.Uniform(0.3, 2.0);
            double x = rng.Uniform(-2, 2), y = rng.Uniform(-2, 2);
            var lens = new SieShearLens { ThetaEArcsec = thetaE, AxisRatio = q, PositionAngleDeg = 90.0 };   // major axis along x
            var p = lens.Evaluate(x, y);
            double e = 1 - q * q;
            double J(int n) => Quadrature.Integrate(t =>
            {
                double u = t * t, d = 1 - e * u;
                double xi = Math.Sqrt(u * (x * x + y * y / d));
                return 2 * t * thetaE / (2 * Math.Sqrt(q) * xi) / Math.Pow(d, n + 0.5);
            }, 0, 1, 1e-13);
            AssertRelative.Equal(q * x * J(0), p.AlphaX, 1e-8, $"α_x at ({x}, {y}), q = {q}");
            AssertRelative.Equal(q * y * J(1), p.AlphaY, 1e-8, $"α_y at ({x}, {y}), q = {q}");
        }
    }

    // Check values derived from the closed form in REFERENCES.md §2 (q = 0.5 and 0.7, θ_E = 1, major axis along x), 1e-6 absolute.
    [Theory]
    [InlineData(0.5, 1.0, 0.0, 0.855033, 0.0, double.NaN)]
    [InlineData(0.5, 0.0, 1.0, 0.0, 1.075292, double.NaN)]
    [InlineData(0.5, 0.6, 0.8, 0.446134, 0.922321, 1.005537)]
    [InlineData(0.5, 1.2, -0.5, 0.756328, -0.510094, 1.162641)]
    [InlineData(0.7, 0.6, 0.8, 0.518785, 0.873092, 1.009745)]
    [InlineData(0.7, 1.2, -0.5, 0.843248, -0.448656, 1.236226)]
    public void Deflection_and_potential_match_reference_values(double q, double x, double y, double ax, double ay, double psi)
    {
        var p = new SieShearLens { ThetaEArcsec = 1, AxisRatio = q, PositionAngleDeg = 90 }.Evaluate(x, y);
        AssertRelative.Near(ax, p.AlphaX, 1e-6);
        AssertRelative.Near(ay, p.AlphaY, 1e-6);
        if (!double.IsNaN(psi)) AssertRelative.Near(psi, p.Potential, 1e-6);
    }

    // Exact identities: for any isothermal ellipsoid |γ| = κ (so μ = 1/(1 − 2κ)); ∇ψ = α and
    // ∂α/∂θ = Hessian (central differences, 1e-6); the contract's κ formula; external shear adds no κ.
    [Fact]
    public void Hessian_potential_and_deflection_are_consistent()
    {
        var rng = KeyedRandom.For(37, 0, Stage.Population);
        for (int i = 0; i < 200; i++)
        {
            var lens = new SieShearLens
            {
                ThetaEArcsec = rng.Uniform(0.5, 2), AxisRatio = rng.Uniform(0.2, 1), PositionAngleDeg = rng.Uniform(0, 180),
                ShearGamma = rng.Uniform(0, 0.3), ShearPositionAngleDeg = rng.Uniform(0, 180),
            };
            var bare = lens with { ShearGamma = 0 };
            double x = rng.Uniform(-2, 2), y = rng.Uniform(-2, 2);
            var p = lens.Evaluate(x, y);
            var b = bare.Evaluate(x, y);
            AssertRelative.Equal(b.Kappa, b.ShearMagnitude, 1e-10, "|γ| = κ for the bare SIE");
            AssertRelative.Equal(b.Kappa, p.Kappa, 1e-12, "external shear adds no convergence");
            double phi = Units.DegToRad(90 - lens.PositionAngleDeg);
            double xl = x * Math.Cos(phi) + y * Math.Sin(phi), yl = -x * Math.Sin(phi) + y * Math.Cos(phi);
            double q = lens.AxisRatio;
            AssertRelative.Equal(lens.ThetaEArcsec / (2 * Math.Sqrt(q * xl * xl + yl * yl / q)), p.Kappa, 1e-12, "contract κ");
            const double h = 1e-5;
            var px = lens.Evaluate(x + h, y); var mx = lens.Evaluate(x - h, y);
            var py = lens.Evaluate(x, y + h); var my = lens.Evaluate(x, y - h);
            AssertRelative.Near(p.AlphaX, (px.Potential - mx.Potential) / (2 * h), 1e-6, "∂ψ/∂x");
            AssertRelative.Near(p.AlphaY, (py.Potential - my.Potential) / (2 * h), 1e-6, "∂ψ/∂y");
            AssertRelative.Near(p.Hxx, (px.AlphaX - mx.AlphaX) / (2 * h), 1e-5, "ψ_xx");
            AssertRelative.Near(p.Hyy, (py.AlphaY - my.AlphaY) / (2 * h), 1e-5, "ψ_yy");
            AssertRelative.Near(p.Hxy, (py.AlphaX - my.AlphaX) / (2 * h), 1e-5, "ψ_xy");
        }
    }

    // The contract's normalisation: the bare SIE's tangential critical curve is the ellipse
    // q x′² + y′²/q = θ_E² (det A = 0 there exactly), of area π θ_E² for every q.
    [Theory]
    [InlineData(0.3, 20.0)]
    [InlineData(0.7, 135.0)]
    [InlineData(1.0, 0.0)]
    public void Bare_sie_critical_curve_is_the_contract_ellipse(double q, double paDeg)
    {
        var lens = new SieShearLens { ThetaEArcsec = 1.3, AxisRatio = q, PositionAngleDeg = paDeg };
        var curves = CriticalCurves.Compute(lens, 720);
        double phi = Units.DegToRad(90 - paDeg);
        for (int i = 0; i < curves.TangentialCritical.Count; i++)
        {
            double x = curves.TangentialCritical.X[i], y = curves.TangentialCritical.Y[i];
            double xl = x * Math.Cos(phi) + y * Math.Sin(phi), yl = -x * Math.Sin(phi) + y * Math.Cos(phi);
            AssertRelative.Equal(1.3 * 1.3, q * xl * xl + yl * yl / q, 1e-12, "ellipse");
            Assert.True(Math.Abs(lens.Evaluate(x, y).JacobianDeterminant) < 1e-12);
        }
        AssertRelative.Equal(Math.PI * 1.3 * 1.3, Math.Abs(curves.TangentialCritical.SignedArea()), 1e-4, "area π θ_E² (720-gon)");
    }

    // External shear direction (contract): images are stretched along shear_pa_deg. With only shear
    // (κ = 0), the eigenvector of the magnification matrix with the larger eigenvalue points along the PA.
    [Fact]
    public void Shear_stretches_along_its_position_angle()
    {
        var shear = new ExternalShear(0.2, 30.0);
        var p = shear.Evaluate(0.3, 0.4);
        // Magnification along unit vector e: 1/(e·A e) for A symmetric; larger along the stretch direction.
        double pa = Units.DegToRad(30.0);
        double ex = Math.Sin(pa), ey = Math.Cos(pa);   // North through East → x = sin PA, y = cos PA
        double along = (1 - p.Hxx) * ex * ex - 2 * p.Hxy * ex * ey + (1 - p.Hyy) * ey * ey;
        AssertRelative.Equal(0.8, along, 1e-12, "A along the PA = 1 − γ (stretch 1/(1 − γ))");
    }
}
