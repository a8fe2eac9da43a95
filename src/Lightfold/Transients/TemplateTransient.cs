namespace Lightfold.Transients;

/// <summary>A user-supplied spectral time series (phase_days, wavelength_angstrom, flux) replacing a built-in model.</summary>
/// <remarks>Phases are rest-frame days since explosion; flux is F_λ in any unit (each event is rescaled to its peak
/// magnitude). Linear interpolation in wavelength within a phase and in phase between phases; zero outside the
/// table. The photosphere (for microlensing) expands at a configured velocity, R = v t.</remarks>
public sealed class TemplateTransient : ITransientModel
{
    readonly double[] phases;
    readonly double[][] wavelengths, fluxes;
    readonly double velocityKms;

    /// <summary>Builds the model from table columns; throws <see cref="InputException"/> naming the source and row on bad data.</summary>
    public TemplateTransient(string source, double[] phaseDays, double[] wavelengthAngstrom, double[] flux, double velocityKms)
    {
        this.velocityKms = velocityKms;
        Source = source;
        var groups = new SortedDictionary<double, List<(double L, double F, int Row)>>();
        for (int i = 0; i < phaseDays.Length; i++)
        {
            if (phaseDays[i] < 0) throw new InputException($"template '{source}' row {i + 1}: phase_days = {phaseDays[i]} is before the explosion (must be ≥ 0)");
            if (wavelengthAngstrom[i] <= 0) throw new InputException($"template '{source}' row {i + 1}: wavelength_angstrom = {wavelengthAngstrom[i]} must be > 0");
            if (flux[i] < 0) throw new InputException($"template '{source}' row {i + 1}: flux = {flux[i]} must be ≥ 0");
            if (!groups.TryGetValue(phaseDays[i], out var list)) groups[phaseDays[i]] = list = [];
            list.Add((wavelengthAngstrom[i], flux[i], i + 1));
        }
        if (groups.Count < 2) throw new InputException($"template '{source}': needs at least two distinct phases");
        phases = groups.Keys.ToArray();
        wavelengths = new double[phases.Length][];
        fluxes = new double[phases.Length][];
        int k = 0;
        foreach (var (phase, list) in groups)
        {
            list.Sort((a, b) => a.L.CompareTo(b.L));
            for (int i = 1; i < list.Count; i++)
                if (list[i].L == list[i - 1].L)
                    throw new InputException($"template '{source}' row {list[i].Row}: duplicate wavelength {list[i].L} Å at phase {phase} d (also row {list[i - 1].Row})");
            if (list.Count < 2) throw new InputException($"template '{source}' row {list[0].Row}: phase {phase} d has a single wavelength; each phase needs a spectrum");
            wavelengths[k] = list.Select(p => p.L).ToArray();
            fluxes[k] = list.Select(p => p.F).ToArray();
            k++;
        }
        if (fluxes.All(f => f.All(v => v == 0))) throw new InputException($"template '{source}': every flux is zero");
    }

    /// <summary>Where the table came from.</summary>
    public string Source { get; }

    /// <inheritdoc/>
    public string Description => $"template '{Source}': {phases.Length} phases, {phases[0]}–{phases[^1]} d";

    /// <inheritdoc/>
    public double MaxPhaseDays => phases[^1];

    /// <inheritdoc/>
    public double PhotosphereRadiusCm(double phaseDays) => velocityKms * 1e5 * Math.Max(phaseDays, 0) * Units.SecondsPerDay;

    /// <inheritdoc/>
    public bool TryBlackbody(double phaseDays, out double temperatureK, out double radiusCm)
    {
        temperatureK = radiusCm = 0;
        return false;
    }

    /// <inheritdoc/>
    public double SpectralLuminosity(double phaseDays, double wavelengthAngstrom)
    {
        if (phaseDays < phases[0] || phaseDays > phases[^1]) return 0;
        int i = Array.BinarySearch(phases, phaseDays);
        if (i >= 0) return AtPhase(i, wavelengthAngstrom);
        i = ~i;
        double f = (phaseDays - phases[i - 1]) / (phases[i] - phases[i - 1]);
        return (1 - f) * AtPhase(i - 1, wavelengthAngstrom) + f * AtPhase(i, wavelengthAngstrom);
    }

    double AtPhase(int p, double wavelength)
    {
        var l = wavelengths[p];
        if (wavelength < l[0] || wavelength > l[^1]) return 0;
        int i = Array.BinarySearch(l, wavelength);
        if (i >= 0) return fluxes[p][i];
        i = ~i;
        double f = (wavelength - l[i - 1]) / (l[i] - l[i - 1]);
        return (1 - f) * fluxes[p][i - 1] + f * fluxes[p][i];
    }
}
