namespace Lightfold.Lensing;

/// <summary>A lens mass model: potential, deflection and Hessian at any image-plane point (arcsec).</summary>
/// <remarks>
/// Implementations are immutable. New profiles (a cored or power-law ellipsoid, e.g. Tessore &amp;
/// Metcalf 2015, A&amp;A 580, A79) only implement this; the generic solvers and the CLI use nothing else.
/// The fast image finder for the population lens is specialised to <see cref="SieShearLens"/>.
/// </remarks>
public interface IMassModel
{
    /// <summary>Everything the lens equation needs at (x, y) [arcsec].</summary>
    LensPoint Evaluate(double xArcsec, double yArcsec);
}
