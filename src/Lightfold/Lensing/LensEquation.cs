namespace Lightfold.Lensing;

/// <summary>All images of one source, ordered by arrival.</summary>
public sealed record ImageSolution(IReadOnlyList<LensedImage> Images, ImageSetStatus Status);

/// <summary>The convenient, throwing facade over <see cref="ImageFinder"/>; use it outside hot loops.</summary>
public static class LensEquation
{
    /// <summary>Solves the lens equation for a source at (β_x, β_y) [arcsec].</summary>
    /// <exception cref="ArgumentException">A non-finite source position.</exception>
    public static ImageSolution Solve(SieShearLens lens, double betaXArcsec, double betaYArcsec)
    {
        Span<LensedImage> buffer = stackalloc LensedImage[ImageFinder.MaxImages];
        if (!ImageFinder.TryFindImages(lens, betaXArcsec, betaYArcsec, buffer, out int count, out var status))
            throw new ArgumentException($"source position ({betaXArcsec}, {betaYArcsec}) arcsec is not finite");
        return new ImageSolution(buffer[..count].ToArray(), status);
    }
}
