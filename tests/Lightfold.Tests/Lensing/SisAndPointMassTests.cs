using Lightfold.Cosmology;
using Lightfold.Lensing;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Lensing;

public class SisAndPointMassTests
{
    // Exact SIS results (e.g. Schneider, Ehlers & Falco 1992, §8.1.4; common practice): images at
    // β ± θ_E along the source direction, μ± = 1 ± θ_E/β, delay (D_Δt / 2c)(θ+² − θ−²), outer image first.
    [Theory]
    [InlineData(1.0, 0.5, 0.0)]
    [InlineData(1.4, 0.3, 0.2)]
    [InlineData(0.7, -0.1, 0.25)]
    public void Sis_images_magnifications_and_delay_are_exact(double thetaE, double bx, double by)
    {
        var lens = new SieShearLens { ThetaEArcsec = thetaE };
        var sol = LensEquation.Solve(lens, bx, by);
        double beta = Math.Sqrt(bx * bx + by * by);
        Assert.Equal(2, sol.Images.Count);
        var first = sol.Images[0];
        var second = sol.Images[1];
        double r1 = Math.Sqrt(first.XArcsec * first.XArcsec + first.YArcsec * first.YArcsec);
        double r2 = Math.Sqrt(second.XArcsec * second.XArcsec + second.YArcsec * second.YArcsec);
        AssertRelative.Equal(beta + thetaE, r1, 1e-12, "outer image radius");
        AssertRelative.Equal(thetaE - beta, r2, 1e-12, "inner image radius");
        AssertRelative.Equal(1 + thetaE / beta, first.Magnification, 1e-10, "μ+");
        AssertRelative.Equal(1 - thetaE / beta, second.Magnification, 1e-10, "μ−");
        // Along the source direction: outer image on the source's side, inner on the opposite side.
        AssertRelative.Near(bx / beta * (beta + thetaE), first.XArcsec, 1e-12);
        AssertRelative.Near(-bx / beta * (thetaE - beta), second.XArcsec, 1e-12);
        double dDt = 2000.0;
        double expectedDays = dDt * Units.KmPerMpc / Units.SpeedOfLightKms / 86400.0
                              * 0.5 * (r1 * r1 - r2 * r2) / (Units.ArcsecPerRadian * Units.ArcsecPerRadian);
        AssertRelative.Equal(expectedDays, second.RelativeFermatArcsec2 * TimeDelays.DaysPerArcsec2(dDt), 1e-10, "SIS delay");
        Assert.Equal(0.0, first.RelativeFermatArcsec2);
        Assert.Equal(ImageSetStatus.Regular, sol.Status);
    }

    // Worked Einstein radius, computed independently here: σ = 250 km/s, z_l = 0.5, z_s = 2, flat ΛCDM
    // H0 = 70, Ωm = 0.3: D_s = 1726.620691469792 Mpc and D_ds = 1097.079 Mpc (astropy 5.2.1 via our table
    // for D_s; D_ds from REFERENCES.md [D]); θ_E = 4π (250/299792.458)² × D_ds/D_s rad = 1.1453″ (REFERENCES.md §2 [D]).
    // The SIS delay at β = 0.5 θ_E is 109.17 d with D_Δt = 2972.38 Mpc (same row).
    [Fact]
    public void Worked_einstein_radius_and_delay()
    {
        var c = new FlrwCosmology(new CosmologyParameters());
        double ratio = c.AngularDiameterDistanceMpc(0.5, 2.0) / c.AngularDiameterDistanceMpc(2.0);
        double byHand = 4 * Math.PI * Math.Pow(250.0 / 299792.458, 2) * (1097.079 / 1726.620691469792) * 180 / Math.PI * 3600;
        AssertRelative.Equal(byHand, EinsteinRadius.IsothermalArcsec(250, ratio), 1e-6);
        AssertRelative.Equal(1.1453, EinsteinRadius.IsothermalArcsec(250, ratio), 1e-4);
        double dDt = c.TimeDelayDistanceMpc(0.5, 2.0);
        AssertRelative.Equal(2972.38, dDt, 1e-5);
        double thetaE = EinsteinRadius.IsothermalArcsec(250, ratio);
        var sol = LensEquation.Solve(new SieShearLens { ThetaEArcsec = thetaE }, 0.5 * thetaE, 0);
        AssertRelative.Equal(109.17, sol.Images[1].RelativeFermatArcsec2 * TimeDelays.DaysPerArcsec2(dDt), 1e-4);
    }

    // Point lens (Paczyński 1986, ApJ 304, 1): total magnification (u² + 2)/(u√(u² + 4)) with images at
    // θ±/θ_E = (u ± √(u² + 4))/2; check values A(0.1) = 10.03746, A(0.5) = 2.18282, A(1) = 3/√5, A(2) = 1.06066 (REFERENCES.md [D]).
    [Theory]
    [InlineData(0.1, 10.03746)]
    [InlineData(0.5, 2.18282)]
    [InlineData(1.0, 1.3416408)]
    [InlineData(2.0, 1.06066)]
    public void Point_mass_total_magnification_is_paczynski(double u, double expected)
    {
        var lens = new PointMass(1.0);
        double plus = (u + Math.Sqrt(u * u + 4)) / 2, minus = (u - Math.Sqrt(u * u + 4)) / 2;
        double total = Math.Abs(lens.Evaluate(plus, 0).Magnification) + Math.Abs(lens.Evaluate(minus, 0).Magnification);
        AssertRelative.Equal((u * u + 2) / (u * Math.Sqrt(u * u + 4)), total, 1e-12);
        AssertRelative.Equal(expected, total, 1e-5);
        // Both positions satisfy the lens equation.
        foreach (double t in new[] { plus, minus })
            AssertRelative.Near(u, t - lens.Evaluate(t, 0).AlphaX, 1e-12);
        // The brute-force finder sees both images too.
        Assert.Equal(2, GridImageFinder.Find(lens, u, 0, 4, 201, 1e-12).Count);
    }

    // Shapiro delay from the point-mass Fermat potential: for the Sun, D_Δt θ_E²/c = 4GM/c³ (z → 0), and the
    // logarithmic term gives a one-way excess (4GM/c³) ln(2√(r_E r_V)/b); the round trip to Venus at superior
    // conjunction is (4GM/c³) ln(4 r_E r_V / b²) = 232.6 μs for a ray grazing the Sun (REFERENCES.md §2 [D]),
    // "almost 2×10⁻⁴ s" in Shapiro 1964 (PRL 13, 789).
    [Fact]
    public void Point_mass_potential_gives_the_shapiro_delay()
    {
        const double au = 1.495978707e13, rVenus = 1.0821e13, rSun = 6.957e10;   // cm
        double ddCm = au, dsCm = au + rVenus, ddsCm = rVenus;                    // Venus behind the Sun
        double thetaE = EinsteinRadius.PointMassArcsec(1.0, ddCm, dsCm, ddsCm);
        var lens = new PointMass(thetaE);
        double secondsPerArcsec2 = ddCm * dsCm / ddsCm / Units.SpeedOfLightCms / (Units.ArcsecPerRadian * Units.ArcsecPerRadian);
        double b = rSun / ddCm * Units.ArcsecPerRadian;                          // impact parameter [arcsec]
        double reference = 2 * Math.Sqrt(au * rVenus) / ddCm * Units.ArcsecPerRadian;
        // Potential term of the Fermat potential: −ψ; its difference between the two impact parameters.
        double oneWay = (lens.Evaluate(reference, 0).Potential - lens.Evaluate(b, 0).Potential) * secondsPerArcsec2;
        double roundTrip = 2 * oneWay;
        double fourGmOverC3 = 4 * Units.GravitationalConstantCgs * Units.SolarMassG / Math.Pow(Units.SpeedOfLightCms, 3);
        AssertRelative.Equal(fourGmOverC3 * Math.Log(4 * au * rVenus / (rSun * rSun)), roundTrip, 1e-9);
        AssertRelative.Equal(232.6e-6, roundTrip, 1e-3);
    }

    // Mean magnification identity of a uniform sheet with shear: μ = 1/((1 − κ)² − γ²)
    // (Schneider, Ehlers & Falco 1992; REFERENCES.md: κ = γ = 0.4 → 5; κ = γ = 0.6 → −5; κ = 0.3, γ = 0.2 → 2.2222).
    [Theory]
    [InlineData(0.4, 0.4, 5.0)]
    [InlineData(0.6, 0.6, -5.0)]
    [InlineData(0.3, 0.2, 2.2222222222)]
    public void Mass_sheet_with_shear_has_the_macro_magnification(double kappa, double gamma, double expected)
    {
        var lens = new CompositeLens(new ConvergenceSheet(kappa), new ExternalShear(gamma, 37.0));
        foreach (var (x, y) in new[] { (0.1, 0.2), (-3.0, 1.0), (0.0, 0.0) })
            AssertRelative.Equal(expected, lens.Evaluate(x, y).Magnification, 1e-9);
    }
}
