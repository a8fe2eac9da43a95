using Lightfold.Lensing;
using Lightfold.Randomness;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Lensing;

public class CrossSectionTests
{
    // Exact limit: an SIS is multiply imaged inside its cut |β| < θ_E, area π θ_E²; no four-image region.
    [Fact]
    public void Sis_cross_section_is_pi_thetaE_squared()
    {
        var cs = CrossSections.Compute(1.0, 0.0, 0.0);
        AssertRelative.Equal(Math.PI, cs.AtLeastTwo, 1e-5);
        Assert.True(cs.AtLeastFour < 1e-9);
    }

    // Derived reference values (REFERENCES.md §2 [D]: contour integrals of the cut and astroid, in units of
    // π θ_E²), with the statement of Huterer, Keeton & Ma 2005 (ApJ 624, 34) that ellipticity lowers the
    // cross-section slightly at fixed θ_E. Tolerance: half a unit of the last printed digit (5e-6).
    [Theory]
    [InlineData(0.9, 0.99815, 0.00185)]
    [InlineData(0.8, 0.99175, 0.00825)]
    [InlineData(0.7, 0.97911, 0.02089)]
    [InlineData(0.6, 0.95780, 0.04220)]
    [InlineData(0.5, 0.92420, 0.07580)]
    [InlineData(0.4, 0.87266, 0.12734)]
    public void Bare_sie_cross_sections_match_reference(double q, double twoOverPi, double fourOverPi)
    {
        var cs = CrossSections.Compute(q, 0, 0);
        AssertRelative.Near(twoOverPi, cs.AtLeastTwo / Math.PI, 5e-6 + 1e-5, "≥2 images (plus 1e-5 for our sampling)");
        AssertRelative.Near(fourOverPi, cs.AtLeastFour / Math.PI, 5e-6 + 1e-5 * fourOverPi, "≥4 images");
    }

    // Naked cusps: the astroid's cusps leave the cut for q < 0.3942 (Kormann et al. 1994, from memory;
    // reproduced as 0.39423 in REFERENCES.md [D]). Above it the ≥2 region is the cut alone; below it grows.
    [Fact]
    public void Naked_cusps_appear_below_the_kormann_threshold()
    {
        static double Excess(double q)
        {
            var lens = new SieShearLens { ThetaEArcsec = 1, AxisRatio = q, PositionAngleDeg = 90 };
            var curves = CriticalCurves.Compute(lens, 4000);
            double cusp = curves.TangentialCaustic.X.Max(), cut = curves.Cut.X.Max();
            return cusp - cut;
        }
        Assert.True(Excess(0.396) < 0, "cusp inside the cut at q = 0.396");
        Assert.True(Excess(0.392) > 0, "cusp outside the cut at q = 0.392");
    }

    // Independent check of the geometric areas by counting images with the image finder at uniformly
    // random sources (2×10^5 per lens gives ≈0.3% standard error on the ≥2 area; 5σ allowed).
    [Theory]
    [InlineData(0.5, 0.2, 30.0)]
    [InlineData(0.3, 0.1, 80.0)]
    [InlineData(0.85, 0.25, 10.0)]
    public void Areas_agree_with_image_counting(double q, double gamma, double delta)
    {
        var cs = CrossSections.Compute(q, gamma, delta);
        var lens = new SieShearLens { ThetaEArcsec = 1, AxisRatio = q, PositionAngleDeg = 20, ShearGamma = gamma, ShearPositionAngleDeg = 20 + delta };
        var rng = KeyedRandom.For(41, 0, Stage.Population);
        const int n = 200_000;
        int c2 = 0, c4 = 0;
        double r = cs.MaxRadius * 1.01;
        Span<LensedImage> buffer = stackalloc LensedImage[ImageFinder.MaxImages];
        for (int i = 0; i < n; i++)
        {
            ImageFinder.TryFindImages(lens, rng.Uniform(-r, r), rng.Uniform(-r, r), buffer, out int k, out _);
            if (k >= 2) c2++;
            if (k >= 4) c4++;
        }
        double box = 4 * r * r;
        AssertRelative.Near(cs.AtLeastTwo, box * c2 / n, 5 * box * Math.Sqrt(c2) / n, "≥2");
        AssertRelative.Near(cs.AtLeastFour, box * c4 / n, 5 * box * Math.Sqrt(Math.Max(c4, 1)) / n, "≥4");
    }

    // The lookup must agree with the direct computation to 0.5% (the bound): ≥2 area relative;
    // ≥4 area relative to max(A₄, 0.1 A₂) (the quad region can be tiny). 300 random points, plus the
    // bounding radius used for rejection sampling must never be below the true one.
    [Fact]
    public void Lookup_matches_direct_computation_within_half_a_percent()
    {
        var table = CrossSectionTable.Shared;
        var rng = KeyedRandom.For(43, 0, Stage.Population);
        for (int i = 0; i < 300; i++)
        {
            double q = rng.Uniform(0.2, 1), g = rng.Uniform(0, 0.3), d = rng.Uniform(-180, 180);
            var exact = CrossSections.Compute(q, g, d);
            var fast = table.Lookup(q, g, d);
            AssertRelative.Equal(exact.AtLeastTwo, fast.AtLeastTwo, 5e-3, $"A2 at q={q}, γ={g}, Δ={d}");
            AssertRelative.Near(exact.AtLeastFour, fast.AtLeastFour, 5e-3 * Math.Max(exact.AtLeastFour, 0.1 * exact.AtLeastTwo), $"A4 at q={q}, γ={g}, Δ={d}");
            Assert.True(fast.MaxRadius >= exact.MaxRadius, $"radius bound at q={q}, γ={g}, Δ={d}");
        }
    }
}
