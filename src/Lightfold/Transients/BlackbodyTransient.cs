using Lightfold.Photometry;

namespace Lightfold.Transients;

/// <summary>Base of models whose spectrum is a blackbody photosphere with UV suppression: L_λ = 4π² R² B_λ(T) S(λ).</summary>
/// <remarks>Subclasses give L_bol(t) and either a photospheric velocity (R = v t, T from L = 4πR²σT⁴) or a temperature
/// history (R from L and T). A temperature floor models the receding photosphere: once T would fall below it, T stays at
/// the floor and R = √(L/(4πσT⁴)). The histories are tabulated every 0.05 d at construction.</remarks>
public abstract class BlackbodyTransient : ITransientModel
{
    const double Step = 0.05;
    double[] temperature = [], radius = [], luminosity = [];

    /// <summary>UV suppression applied to the spectrum.</summary>
    public UvSuppression Uv { get; init; } = new();

    /// <inheritdoc/>
    public abstract string Description { get; }

    /// <inheritdoc/>
    public abstract double MaxPhaseDays { get; }

    /// <summary>Fills the tables; call at the end of the subclass constructor.</summary>
    protected void Tabulate()
    {
        int n = (int)Math.Ceiling(MaxPhaseDays / Step) + 2;
        temperature = new double[n];
        radius = new double[n];
        luminosity = new double[n];
        var bolometric = BolometricHistory(n, Step);
        for (int i = 0; i < n; i++)
        {
            double t = i * Step, l = Math.Max(bolometric[i], 1e30);
            luminosity[i] = l;
            (temperature[i], radius[i]) = Photosphere(t, l);
        }
    }

    /// <summary>L_bol [erg/s] at t_i = i × step, i = 0 … n − 1.</summary>
    protected abstract double[] BolometricHistory(int n, double step);

    /// <summary>Temperature [K] and radius [cm] of the photosphere at phase t for luminosity L.</summary>
    protected abstract (double TemperatureK, double RadiusCm) Photosphere(double phaseDays, double luminosity);

    /// <summary>R and T for a photosphere expanding at v with a temperature floor.</summary>
    protected static (double, double) ExpandingWithFloor(double phaseDays, double luminosity, double velocityKms, double floorK)
    {
        double r = Math.Max(velocityKms * 1e5 * phaseDays * Units.SecondsPerDay, 1e10);
        double t = Math.Pow(luminosity / (4 * Math.PI * r * r * Units.StefanBoltzmannCgs), 0.25);
        if (t >= floorK) return (t, r);
        return (floorK, RadiusFor(luminosity, floorK));
    }

    /// <summary>R = √(L/(4πσT⁴)).</summary>
    protected static double RadiusFor(double luminosity, double temperatureK)
        => Math.Sqrt(luminosity / (4 * Math.PI * Units.StefanBoltzmannCgs * Math.Pow(temperatureK, 4)));

    double Interpolate(double[] table, double t)
    {
        double u = t / Step;
        int i = Math.Clamp((int)u, 0, table.Length - 2);
        double f = Math.Clamp(u - i, 0, 1);
        return table[i] + f * (table[i + 1] - table[i]);
    }

    /// <summary>Bolometric luminosity [erg/s] at phase t.</summary>
    public double BolometricLuminosity(double phaseDays) => Interpolate(luminosity, phaseDays);

    /// <inheritdoc/>
    public bool TryBlackbody(double phaseDays, out double temperatureK, out double radiusCm)
    {
        temperatureK = Interpolate(temperature, phaseDays);
        radiusCm = Interpolate(radius, phaseDays);
        return true;
    }

    /// <inheritdoc/>
    public double PhotosphereRadiusCm(double phaseDays) => Interpolate(radius, phaseDays);

    /// <inheritdoc/>
    public double SpectralLuminosity(double phaseDays, double wavelengthAngstrom)
    {
        if (phaseDays <= 0 || phaseDays > MaxPhaseDays) return 0;
        TryBlackbody(phaseDays, out double t, out double r);
        return 4 * Math.PI * Math.PI * r * r * SyntheticPhotometry.PlanckLambda(t, wavelengthAngstrom) * Uv.Factor(wavelengthAngstrom);
    }
}
