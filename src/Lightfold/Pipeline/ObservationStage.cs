using System.Globalization;
using Lightfold.Catalog;
using Lightfold.Configuration;
using Lightfold.Cosmology;
using Lightfold.Transients;

namespace Lightfold.Pipeline;

/// <summary>The light-curve and survey stage of a run: resources, band tables and the per-system simulator.</summary>
public sealed class ObservationStage
{
    readonly ObservationSimulator simulator;
    readonly DistanceTable distances;

    ObservationStage(Scenario scenario, ObservingResources resources)
    {
        var o = scenario.Observing;
        Resources = resources;
        Bank = new LightCurveBank(resources.Models, resources.Bands, scenario.Sources.ZMax);
        var ia = scenario.Sources.PeakMagnitudes[Populations.TransientType.Ia];
        Maps = scenario.Microlensing.Enabled ? new Microlensing.MapBank(scenario.Microlensing.Bank, FitsMapCache.Default()) : null;
        simulator = new ObservationSimulator(scenario.Seed, Bank, resources.Schedule, o.Noise, o.Detection, o.BlendFractionOfSeeing,
            o.PreExplosionDays, o.HostEbvMean, o.MilkyWayEbv, o.RV, ia.Mean, ia.Sigma, scenario.Microlensing, Maps);
        distances = new FlrwCosmology(scenario.Cosmology).Table;
        BandNames = resources.Bands.Select(b => b.Name).ToArray();
        if (o.Detection.RequireBrighterThanCandle && !resources.Models.ContainsKey(Populations.TransientType.Ia))
            throw new InputException("config key 'detection.require_brighter_than_candle' needs SNe Ia among 'sources.types'");
    }

    /// <summary>Loads resources (files) and builds the band tables.</summary>
    public static ObservationStage Create(Scenario scenario) => new(scenario, ObservingResources.Load(scenario));

    /// <summary>Loaded bands, schedule and models.</summary>
    public ObservingResources Resources { get; }

    /// <summary>Band light-curve tables.</summary>
    public LightCurveBank Bank { get; }

    /// <summary>The microlensing map bank (null when microlensing is off).</summary>
    public Microlensing.MapBank? Maps { get; }

    /// <summary>Band names in index order.</summary>
    public string[] BandNames { get; }

    /// <summary>Observes one system.</summary>
    public void Simulate(in LensedSystem s, SystemObservations into, List<Survey.Visit> visits)
        => simulator.Simulate(in s, distances.LuminosityDistanceMpc(s.ZSource) * Units.CmPerMpc,
            s.Lensed ? distances.LuminosityDistanceMpc(s.ZLens) * Units.CmPerMpc : double.NaN, into, visits);

    /// <summary>Features of a simulated system's photometry.</summary>
    public void Features(SystemObservations o, BandFeatures[] into) => simulator.Features(o, into);

    /// <summary>Metadata for the observations file: band pivots and the models used.</summary>
    public Dictionary<string, string> Metadata(Dictionary<string, string> common)
    {
        var m = new Dictionary<string, string>(common)
        {
            ["lightfold.bands"] = string.Join(",", Resources.Bands.Select(b => $"{b.Name}:{b.PivotWavelengthAngstrom.ToString("F1", CultureInfo.InvariantCulture)}")),
        };
        foreach (var (type, model) in Resources.Models) m[$"lightfold.model.{Populations.TransientTypes.Name(type)}"] = model.Description;
        return m;
    }

    /// <summary>Copies one system's rows into the observations buffer.</summary>
    public static void Append(long systemId, SystemObservations o, TableBuffer table, string[] bandNames)
    {
        int start = table.Count, n = o.Count;
        table.EnsureCapacity(start + n);
        long[] sid = table.L(Columns.SystemId);
        int[] image = table.I(Columns.ImageIndex), group = table.I(Columns.BlendGroup);
        double[] mjd = table.D(Columns.Mjd), flux = table.D(Columns.FluxNjy), err = table.D(Columns.FluxErrNjy), truth = table.D(Columns.TrueFluxNjy),
            micro = table.D(Columns.MicroMagnification), snr = table.D(Columns.Snr), depth = table.D(Columns.Depth5SigmaMag), seeing = table.D(Columns.SeeingFwhmArcsec);
        string[] band = table.S(Columns.Band);
        bool[] det = table.B(Columns.IsDetection);
        for (int r = 0; r < n; r++)
        {
            int k = start + r;
            sid[k] = systemId; image[k] = o.ImageIndex[r]; group[k] = o.BlendGroup[r]; mjd[k] = o.Mjd[r]; band[k] = bandNames[o.Band[r]];
            flux[k] = o.Flux[r]; err[k] = o.FluxErr[r]; truth[k] = o.TrueFlux[r]; micro[k] = o.Micro[r];
            snr[k] = o.Flux[r] / o.FluxErr[r]; depth[k] = o.Depth[r]; seeing[k] = o.Seeing[r];
        }
        // Detection flag uses the rule's threshold; recorded per row so users need not recompute it.
        for (int r = 0; r < n; r++) det[start + r] = snr[start + r] >= o.MinSnr;
        table.Count = start + n;
    }
}
