namespace Lightfold.Photometry;

/// <summary>A filter's photon-counting throughput T(λ) on a wavelength grid (Å, increasing).</summary>
/// <remarks>Only the shape matters for AB photometry (the normalisation cancels). Immutable.</remarks>
public sealed class Bandpass
{
    /// <summary>Creates a bandpass; the grid must increase and the throughput be finite, ≥ 0 and not all zero.</summary>
    public Bandpass(string name, double[] wavelengthAngstrom, double[] throughput)
    {
        if (wavelengthAngstrom.Length != throughput.Length || wavelengthAngstrom.Length < 2)
            throw new ArgumentException($"bandpass '{name}': need at least two (wavelength, throughput) pairs");
        Name = name;
        WavelengthAngstrom = wavelengthAngstrom;
        Throughput = throughput;
        double num = 0, den = 0;
        for (int i = 1; i < wavelengthAngstrom.Length; i++)
        {
            double dl = wavelengthAngstrom[i] - wavelengthAngstrom[i - 1];
            double la = wavelengthAngstrom[i - 1], lb = wavelengthAngstrom[i];
            num += 0.5 * dl * (throughput[i - 1] * la + throughput[i] * lb);
            den += 0.5 * dl * (throughput[i - 1] / la + throughput[i] / lb);
        }
        PivotWavelengthAngstrom = Math.Sqrt(num / den);
        MinWavelengthAngstrom = wavelengthAngstrom[0];
        MaxWavelengthAngstrom = wavelengthAngstrom[^1];
    }

    /// <summary>Band name as written in the catalog.</summary>
    public string Name { get; }
    /// <summary>Wavelength grid [Å].</summary>
    public double[] WavelengthAngstrom { get; }
    /// <summary>Throughput at each grid point.</summary>
    public double[] Throughput { get; }
    /// <summary>Pivot wavelength √(∫Tλ dλ / ∫T/λ dλ) [Å] (Tokunaga &amp; Vacca 2005, PASP 117, 421; from memory).</summary>
    public double PivotWavelengthAngstrom { get; }
    /// <summary>First grid wavelength [Å].</summary>
    public double MinWavelengthAngstrom { get; }
    /// <summary>Last grid wavelength [Å].</summary>
    public double MaxWavelengthAngstrom { get; }

    /// <summary>A smooth idealised top-hat: T = ½[tanh((λ − λ1)/w) − tanh((λ − λ2)/w)], sampled every 5 Å over λ1 − 4w … λ2 + 4w.</summary>
    public static Bandpass Idealised(string name, double blueEdgeAngstrom, double redEdgeAngstrom, double edgeWidthAngstrom)
    {
        double lo = blueEdgeAngstrom - 4 * edgeWidthAngstrom, hi = redEdgeAngstrom + 4 * edgeWidthAngstrom;
        int n = (int)Math.Ceiling((hi - lo) / 5.0) + 1;
        var l = new double[n];
        var t = new double[n];
        for (int i = 0; i < n; i++)
        {
            l[i] = lo + (hi - lo) * i / (n - 1);
            t[i] = 0.5 * (Math.Tanh((l[i] - blueEdgeAngstrom) / edgeWidthAngstrom) - Math.Tanh((l[i] - redEdgeAngstrom) / edgeWidthAngstrom));
        }
        return new Bandpass(name, l, t);
    }
}

/// <summary>Built-in idealised bandpasses (the demo survey's filters and a rest-frame B for peak magnitudes).</summary>
/// <remarks>
/// Smooth top-hats with 60 Å tanh edges, our own idealisation for the invented survey: u 3300–4000, g 4000–5500,
/// r 5500–6900, i 6900–8200, z 8200–9200, y 9200–10500 Å (edges near the conventional ugrizy filters).
/// "B" is 3900–4900 Å with 80 Å edges (pivot ≈ 4390 Å, close to Johnson B's 4400 Å), used only to normalise
/// transients to their peak absolute B magnitude. Real filters: load a throughput table instead.
/// </remarks>
public static class BuiltInBands
{
    static readonly Dictionary<string, Bandpass> All = new(StringComparer.Ordinal)
    {
        ["u"] = Bandpass.Idealised("u", 3300, 4000, 60),
        ["g"] = Bandpass.Idealised("g", 4000, 5500, 60),
        ["r"] = Bandpass.Idealised("r", 5500, 6900, 60),
        ["i"] = Bandpass.Idealised("i", 6900, 8200, 60),
        ["z"] = Bandpass.Idealised("z", 8200, 9200, 60),
        ["y"] = Bandpass.Idealised("y", 9200, 10500, 60),
    };

    /// <summary>Rest-frame B used for peak absolute magnitudes.</summary>
    public static Bandpass RestFrameB { get; } = Bandpass.Idealised("B", 3900, 4900, 80);

    /// <summary>Names of the built-in survey bands.</summary>
    public static IReadOnlyCollection<string> Names => All.Keys;

    /// <summary>The built-in band called <paramref name="name"/>, if any.</summary>
    public static bool TryGet(string name, out Bandpass band) => All.TryGetValue(name, out band!);
}
