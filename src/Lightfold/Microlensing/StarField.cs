using Lightfold.Randomness;

namespace Lightfold.Microlensing;

/// <summary>Point-mass stars in the image plane; lengths in Einstein radii of a 1 M☉ star, masses in M☉.</summary>
/// <remarks>A star of mass m at z_i deflects by α = m (z − z_i)/|z − z_i|²; in complex form conj(α) = Σ m_i/(z − z_i).</remarks>
public sealed class StarField
{
    /// <summary>Creates a field from positions and masses.</summary>
    public StarField(double[] x, double[] y, double[] mass)
    {
        X = x;
        Y = y;
        Mass = mass;
    }

    /// <summary>Positions [θ_E(1 M☉)].</summary>
    public double[] X { get; }
    /// <summary>Positions [θ_E(1 M☉)].</summary>
    public double[] Y { get; }
    /// <summary>Masses [M☉].</summary>
    public double[] Mass { get; }
    /// <summary>Number of stars.</summary>
    public int Count => X.Length;

    /// <summary>Stars uniform in a disk of the given radius with mean convergence κ_* = Σm/(π R²).</summary>
    /// <remarks>The number is Poisson with mean κ_* R²/⟨m⟩ (a uniform random star field, e.g. Kayser, Refsdal &amp; Stabell 1986).</remarks>
    public static StarField Uniform(double kappaStar, double radius, InitialMassFunction imf, ref KeyedRandom rng)
    {
        long n = kappaStar <= 0 ? 0 : rng.Poisson(kappaStar * radius * radius / imf.MeanMassSolar);
        if (n > 50_000_000) throw new InputException($"star field would need {n:N0} stars (κ_* = {kappaStar}, radius {radius:F0} θ_E); reduce the map size or κ_*");
        var x = new double[n];
        var y = new double[n];
        var m = new double[n];
        for (long i = 0; i < n; i++)
        {
            double r = radius * Math.Sqrt(rng.NextDouble()), a = 2 * Math.PI * rng.NextDouble();
            x[i] = r * Math.Cos(a);
            y[i] = r * Math.Sin(a);
            m[i] = imf.Sample(ref rng);
        }
        return new StarField(x, y, m);
    }

    /// <summary>Deflection by direct summation over every star (the reference).</summary>
    public (double X, double Y) DirectDeflection(double x, double y)
    {
        double ax = 0, ay = 0;
        for (int i = 0; i < X.Length; i++)
        {
            double dx = x - X[i], dy = y - Y[i], f = Mass[i] / (dx * dx + dy * dy);
            ax += f * dx;
            ay += f * dy;
        }
        return (ax, ay);
    }
}
