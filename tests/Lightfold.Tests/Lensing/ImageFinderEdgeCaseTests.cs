using Lightfold.Lensing;
using Lightfold.Randomness;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.Lensing;

public class ImageFinderEdgeCaseTests
{
    [Fact]
    public void Source_at_the_centre_of_a_round_unsheared_lens_is_a_ring()
    {
        var sol = LensEquation.Solve(new SieShearLens { ThetaEArcsec = 1.2 }, 0, 0);
        Assert.Equal(ImageSetStatus.Ring, sol.Status);
        Assert.Empty(sol.Images);
    }

    // Exact limit: a source at the centre of an SIE forms a symmetric cross with images on both axes,
    // at lens-frame radii θ_E/√q (major axis) and θ_E √q·… found by the finder, all with equal delays.
    [Fact]
    public void Source_at_the_centre_of_an_ellipse_gives_a_symmetric_cross()
    {
        var sol = LensEquation.Solve(new SieShearLens { ThetaEArcsec = 1, AxisRatio = 0.6, PositionAngleDeg = 90 }, 0, 0);
        Assert.Equal(4, sol.Images.Count);
        foreach (var image in sol.Images)
        {
            Assert.True(Math.Abs(image.XArcsec) < 1e-12 || Math.Abs(image.YArcsec) < 1e-12, $"image on an axis: {image}");
            Assert.True(image.ResidualArcsec < 1e-12);
        }
        // Pairs related by the point symmetry have equal Fermat potentials.
        AssertRelative.Near(sol.Images[0].RelativeFermatArcsec2, sol.Images[1].RelativeFermatArcsec2, 1e-12);
        AssertRelative.Near(sol.Images[2].RelativeFermatArcsec2, sol.Images[3].RelativeFermatArcsec2, 1e-12);
    }

    // Continuity at the round limit: q → 1 and γ → 0 approach the SIS images smoothly (no special-case jump).
    [Fact]
    public void Nearly_round_lens_approaches_the_sis()
    {
        var sis = LensEquation.Solve(new SieShearLens { ThetaEArcsec = 1 }, 0.3, 0.1);
        var near = LensEquation.Solve(new SieShearLens { ThetaEArcsec = 1, AxisRatio = 1 - 1e-9, ShearGamma = 1e-10, ShearPositionAngleDeg = 10 }, 0.3, 0.1);
        Assert.Equal(sis.Images.Count, near.Images.Count);
        for (int i = 0; i < sis.Images.Count; i++)
        {
            AssertRelative.Near(sis.Images[i].XArcsec, near.Images[i].XArcsec, 1e-8);
            AssertRelative.Near(sis.Images[i].Magnification, near.Images[i].Magnification, 1e-6);
        }
    }

    // Sources marching onto a fold caustic: the two merging images stay found (bright pair), the
    // magnification grows without bound but is never NaN or infinite, and the image count never drops
    // below the count just outside until the caustic is crossed.
    [Fact]
    public void Sources_approaching_a_caustic_never_give_nan()
    {
        var lens = new SieShearLens { ThetaEArcsec = 1, AxisRatio = 0.7, PositionAngleDeg = 90, ShearGamma = 0.05, ShearPositionAngleDeg = 30 };
        var curves = CriticalCurves.Compute(lens, 2000);
        var rng = KeyedRandom.For(47, 0, Stage.Population);
        Span<LensedImage> buffer = stackalloc LensedImage[ImageFinder.MaxImages];
        for (int i = 0; i < 2000; i++)
        {
            int j = rng.NextInt(curves.TangentialCaustic.Count);
            double f = 1 + (rng.NextDouble() - 0.5) * Math.Pow(10, -rng.Uniform(2, 14));
            double bx = curves.TangentialCaustic.X[j] * f, by = curves.TangentialCaustic.Y[j] * f;
            Assert.True(ImageFinder.TryFindImages(lens, bx, by, buffer, out int n, out _));
            Assert.InRange(n, 1, 5);
            for (int k = 0; k < n; k++)
            {
                Assert.True(double.IsFinite(buffer[k].Magnification) && double.IsFinite(buffer[k].XArcsec) && double.IsFinite(buffer[k].RelativeFermatArcsec2));
                Assert.True(buffer[k].ResidualArcsec < 1e-10, $"residual {buffer[k].ResidualArcsec}");
            }
        }
    }

    [Fact]
    public void Non_finite_source_is_refused()
    {
        Span<LensedImage> buffer = stackalloc LensedImage[ImageFinder.MaxImages];
        Assert.False(ImageFinder.TryFindImages(new SieShearLens { ThetaEArcsec = 1 }, double.NaN, 0, buffer, out _, out _));
        Assert.Throws<ArgumentException>(() => LensEquation.Solve(new SieShearLens { ThetaEArcsec = 1 }, 0, double.PositiveInfinity));
    }

    [Fact]
    public void Invalid_lens_parameters_are_refused_even_through_with()
    {
        var lens = new SieShearLens { ThetaEArcsec = 1 };
        Assert.Throws<ArgumentOutOfRangeException>(() => lens with { AxisRatio = 1.5 });
        Assert.Throws<ArgumentOutOfRangeException>(() => lens with { ThetaEArcsec = 0 });
        Assert.Throws<ArgumentOutOfRangeException>(() => lens with { ShearGamma = double.NaN });
    }
}
