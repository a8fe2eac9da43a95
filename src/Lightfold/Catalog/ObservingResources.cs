using Lightfold.Configuration;
using Lightfold.Photometry;
using Lightfold.Populations;
using Lightfold.Survey;
using Lightfold.Transients;

namespace Lightfold.Catalog;

/// <summary>Everything the observing stage reads from files or builds once: bandpasses, visit schedule, transient models and their band tables.</summary>
/// <remarks>Loaded before any output is written, so a bad table stops the run with one message and nothing half-written.</remarks>
public sealed class ObservingResources
{
    ObservingResources(IReadOnlyList<Bandpass> bands, ISchedule schedule, IReadOnlyDictionary<TransientType, ITransientModel> models)
    {
        Bands = bands;
        Schedule = schedule;
        Models = models;
    }

    /// <summary>Survey bands in table order.</summary>
    public IReadOnlyList<Bandpass> Bands { get; }
    /// <summary>The visit schedule.</summary>
    public ISchedule Schedule { get; }
    /// <summary>Light-curve model of each type.</summary>
    public IReadOnlyDictionary<TransientType, ITransientModel> Models { get; }

    /// <summary>Loads and checks every resource the scenario names.</summary>
    /// <exception cref="InputException">A missing or malformed table, naming the file and row.</exception>
    public static ObservingResources Load(Scenario scenario)
    {
        var o = scenario.Observing;
        var bands = o.Bands.Select(name => o.BandpassFiles.TryGetValue(name, out string? path) ? LoadBandpass(name, path) : BuiltIn(name)).ToList();
        ISchedule schedule = string.IsNullOrEmpty(o.VisitTablePath)
            ? new CadenceSchedule(o.Cadence, scenario.Survey.StartMjd, scenario.Survey.EndMjd, o.SeasonDays, o.WeatherLoss, o.JitterDays)
            : LoadVisitTable(o.VisitTablePath, o.Bands);
        var models = new Dictionary<TransientType, ITransientModel>();
        foreach (var type in scenario.Sources.Types)
        {
            var spec = o.Models[type];
            models[type] = string.IsNullOrEmpty(spec.TemplatePath) ? spec.Build(o.Uv) : LoadTemplate(spec.TemplatePath, spec.TemplateVelocityKms);
        }
        return new ObservingResources(bands, schedule, models);
    }

    static Bandpass BuiltIn(string name) => BuiltInBands.TryGet(name, out var b) ? b : throw new InputException($"unknown band '{name}'");

    /// <summary>Reads a throughput table (wavelength_angstrom, transmission).</summary>
    public static Bandpass LoadBandpass(string name, string path)
    {
        var t = NumericTable.Read(path, ["wavelength_angstrom", "transmission"]);
        double[] l = t["wavelength_angstrom"], tr = t["transmission"];
        for (int i = 0; i < l.Length; i++)
        {
            if (l[i] <= 0) throw new InputException($"bandpass '{path}' row {i + 1}: wavelength_angstrom = {l[i]} must be > 0");
            if (tr[i] < 0) throw new InputException($"bandpass '{path}' row {i + 1}: transmission = {tr[i]} must be ≥ 0");
            if (i > 0 && l[i] <= l[i - 1]) throw new InputException($"bandpass '{path}' row {i + 1}: wavelengths must increase ({l[i]} after {l[i - 1]})");
        }
        if (l.Length < 2 || tr.All(v => v == 0)) throw new InputException($"bandpass '{path}': needs at least two rows and some non-zero transmission");
        return new Bandpass(name, l, tr);
    }

    /// <summary>Reads a visit table (mjd, band, depth_5sigma_mag, seeing_fwhm_arcsec).</summary>
    public static TableSchedule LoadVisitTable(string path, IReadOnlyList<string> bands)
    {
        var t = NumericTable.Read(path, ["mjd", "depth_5sigma_mag", "seeing_fwhm_arcsec"], textColumns: ["band"]);
        double[] mjd = t["mjd"], depth = t["depth_5sigma_mag"], seeing = t["seeing_fwhm_arcsec"];
        string[] band = t.Text["band"];
        var visits = new List<Visit>(mjd.Length);
        for (int i = 0; i < mjd.Length; i++)
        {
            int b = bands.ToList().IndexOf(band[i]);
            if (b < 0) throw new InputException($"visit table '{path}' row {i + 1}: band '{InputException.Shown(band[i])}' is not one of photometry.bands ({string.Join(", ", bands)})");
            if (depth[i] < 10 || depth[i] > 35) throw new InputException($"visit table '{path}' row {i + 1}: depth_5sigma_mag = {depth[i]} is outside [10, 35]");
            if (seeing[i] <= 0 || seeing[i] > 20) throw new InputException($"visit table '{path}' row {i + 1}: seeing_fwhm_arcsec = {seeing[i]} is outside (0, 20]");
            if (mjd[i] < 0 || mjd[i] > 100_000) throw new InputException($"visit table '{path}' row {i + 1}: mjd = {mjd[i]} is outside [0, 100000]");
            visits.Add(new Visit(mjd[i], b, depth[i], seeing[i]));
        }
        return new TableSchedule(visits);
    }

    /// <summary>Reads a spectral time-series template (phase_days, wavelength_angstrom, flux).</summary>
    public static TemplateTransient LoadTemplate(string path, double velocityKms)
    {
        var t = NumericTable.Read(path, ["phase_days", "wavelength_angstrom", "flux"]);
        return new TemplateTransient(path, t["phase_days"], t["wavelength_angstrom"], t["flux"], velocityKms);
    }
}
