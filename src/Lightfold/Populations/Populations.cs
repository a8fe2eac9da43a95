namespace Lightfold.Populations;

/// <summary>The survey's footprint and observing window (explosions are drawn over the window plus a lead-in).</summary>
public sealed record SurveyWindow
{
    /// <summary>Survey name (the demo's is invented).</summary>
    public string Name { get; init; } = "";
    /// <summary>Footprint [deg²], in (0, 41253].</summary>
    public double AreaDeg2 { get; init => field = Check.InRange(value, 1e-6, Units.SquareDegreesWholeSky); } = 1000;
    /// <summary>First night [MJD].</summary>
    public double StartMjd { get; init => field = Check.Finite(value); } = 60000;
    /// <summary>Last night [MJD].</summary>
    public double EndMjd { get; init => field = Check.Finite(value); } = 61000;
    /// <summary>Explosions may precede the window by this much, so events already under way at the start are included [days].</summary>
    public double LeadInDays { get; init => field = Check.NonNegative(value); } = 50;

    /// <summary>Footprint solid angle [sr].</summary>
    public double SolidAngleSr => AreaDeg2 * Units.SteradiansPerSquareDegree;

    /// <summary>Years over which explosions are drawn: (end − start + lead-in) / 365.25.</summary>
    public double ExplosionYears => (EndMjd - StartMjd + LeadInDays) / 365.25;

    /// <summary>Length of the observing window in years.</summary>
    public double WindowYears => (EndMjd - StartMjd) / 365.25;
}

/// <summary>Deflector galaxies: velocity dispersion function, redshift and σ ranges, shapes and shear.</summary>
public sealed record DeflectorPopulation
{
    /// <summary>Velocity dispersion function.</summary>
    public VelocityDispersionFunction Vdf { get; init; } = new();
    /// <summary>Smallest lens velocity dispersion [km/s].</summary>
    public double SigmaMinKms { get; init => field = Check.Positive(value); } = 100;
    /// <summary>Largest lens velocity dispersion [km/s].</summary>
    public double SigmaMaxKms { get; init => field = Check.Positive(value); } = 400;
    /// <summary>Lowest lens redshift.</summary>
    public double ZMin { get; init => field = Check.InRange(value, 1e-4, 10); } = 0.05;
    /// <summary>Highest lens redshift (lenses also stay below their source).</summary>
    public double ZMax { get; init => field = Check.InRange(value, 1e-4, 10); } = 2.0;
    /// <summary>Axis-ratio distribution.</summary>
    public AxisRatioDistribution AxisRatio { get; init; } = new();
    /// <summary>External shear distribution.</summary>
    public ShearDistribution Shear { get; init; } = new();
}

/// <summary>Peak absolute magnitude distribution of one type: normal in rest-frame B [mag].</summary>
/// <param name="Mean">Mean peak M_B.</param>
/// <param name="Sigma">Standard deviation [mag].</param>
public sealed record PeakMagnitude(double Mean, double Sigma);

/// <summary>Transient sources: types, redshift range, rates and luminosity functions.</summary>
/// <remarks>
/// Default peak magnitudes follow Richardson et al. 2014 (AJ 147, 118): Ia −19.25 and IIP −16.75 (confirmed);
/// IIL −18.0 (σ 0.9), IIn −18.5 (σ 1.4), Ib and Ic −17.4 (σ 1.1), IIP σ 1.0 (from memory). For SNe Ia a 0.15 mag
/// scatter (common practice for the intrinsic scatter; Vaughan et al. 1995, ApJ 439, 558 bound it below 0.2 mag).
/// </remarks>
public sealed record SourcePopulation
{
    /// <summary>Lowest source redshift.</summary>
    public double ZMin { get; init => field = Check.InRange(value, 1e-4, 15); } = 0.1;
    /// <summary>Highest source redshift.</summary>
    public double ZMax { get; init => field = Check.InRange(value, 1e-4, 15); } = 3.0;
    /// <summary>Types simulated.</summary>
    public IReadOnlyList<TransientType> Types { get; init; } = TransientTypes.All;
    /// <summary>Volumetric rates.</summary>
    public RateModel Rates { get; init; } = new();
    /// <summary>Peak absolute magnitude distribution per type.</summary>
    public IReadOnlyDictionary<TransientType, PeakMagnitude> PeakMagnitudes { get; init; } = new Dictionary<TransientType, PeakMagnitude>
    {
        [TransientType.Ia] = new(-19.25, 0.15), [TransientType.IIP] = new(-16.75, 1.0), [TransientType.IIL] = new(-18.0, 0.9),
        [TransientType.IIn] = new(-18.5, 1.4), [TransientType.Ib] = new(-17.4, 1.1), [TransientType.Ic] = new(-17.4, 1.1),
    };
}
