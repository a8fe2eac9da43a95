using Lightfold.Cosmology;
using Lightfold.Populations;
using Lightfold.Survey;
using Lightfold.Transients;

namespace Lightfold.Configuration;

/// <summary>How many systems a run draws and what their weights mean.</summary>
public enum RunMode
{
    /// <summary>N systems, each weighted so the weights sum to the expected number of lensed events.</summary>
    Oversample,
    /// <summary>One Poisson realisation of the survey: the number of systems is drawn, every weight is 1.</summary>
    Realization,
    /// <summary>A labelled classifier training set: lensed and unlensed transients mixed in a set proportion, with splits.</summary>
    Training,
}

/// <summary>Class balance and splits of a training set.</summary>
public sealed record TrainingSettings
{
    /// <summary>Fraction of objects that are lensed (the rest are unlensed transients from the same rates and luminosity functions).</summary>
    public double LensedFraction { get; init; } = 0.5;
    /// <summary>Fraction assigned to "train" (by a hash of system_id).</summary>
    public double TrainFraction { get; init; } = 0.7;
    /// <summary>Fraction assigned to "validation"; the rest is "test".</summary>
    public double ValidationFraction { get; init; } = 0.15;

    /// <summary>The split of an object: a hash of its id (stable under re-runs, seeds and sharding).</summary>
    public string SplitOf(long systemId)
    {
        double u = (Randomness.KeyedRandom.Mix((ulong)systemId * 0x9E3779B97F4A7C15UL + 0x5851F42D4C957F2DUL) >> 11) * (1.0 / (1UL << 53));
        return u < TrainFraction ? "train" : u < TrainFraction + ValidationFraction ? "validation" : "test";
    }
}

/// <summary>Run settings: mode, count and streaming batch size.</summary>
public sealed record RunSettings
{
    /// <summary>Oversample or realization.</summary>
    public RunMode Mode { get; init; } = RunMode.Oversample;
    /// <summary>Systems to draw in oversample mode.</summary>
    public long Count { get; init; } = 20_000;
    /// <summary>Systems per Parquet row group (memory is flat in the total count).</summary>
    public int BatchSize { get; init; } = 65_536;
    /// <summary>Training-set settings (used in training mode).</summary>
    public TrainingSettings Training { get; init; } = new();
}

/// <summary>A validated, immutable simulation scenario: everything a run depends on besides the code.</summary>
/// <remarks>Built once by <see cref="ScenarioLoader"/>; stages read from it and never change it.</remarks>
public sealed record Scenario
{
    /// <summary>Scenario name, written to the catalog metadata.</summary>
    public required string Name { get; init; }

    /// <summary>Master seed of every random stream.</summary>
    public required ulong Seed { get; init; }

    /// <summary>Mode, count, batch size.</summary>
    public RunSettings Run { get; init; } = new();

    /// <summary>Cosmological parameters.</summary>
    public required CosmologyParameters Cosmology { get; init; }

    /// <summary>Footprint and window.</summary>
    public SurveyWindow Survey { get; init; } = new();

    /// <summary>Lens galaxies.</summary>
    public DeflectorPopulation Deflectors { get; init; } = new();

    /// <summary>Transients.</summary>
    public SourcePopulation Sources { get; init; } = new();

    /// <summary>Light curves, photometry, survey cadence, noise and detection (the `observations` table).</summary>
    public ObservingSettings Observing { get; init; } = new();

    /// <summary>Microlensing by stars.</summary>
    public Microlensing.MicrolensingSettings Microlensing { get; init; } = new();

    /// <summary>The resolved configuration as indented JSON (all layers applied, typed).</summary>
    public string ResolvedJson { get; init; } = "{}";
}

/// <summary>Everything that turns lensed systems into observations.</summary>
public sealed record ObservingSettings
{
    /// <summary>Write the observations table (false: systems and images only).</summary>
    public bool LightCurves { get; init; } = true;
    /// <summary>Visits this long before the explosion are recorded too (zero true flux) [days].</summary>
    public double PreExplosionDays { get; init; } = 30;
    /// <summary>Light-curve model of each type.</summary>
    public IReadOnlyDictionary<TransientType, TransientSpec> Models { get; init; } = new Dictionary<TransientType, TransientSpec>();
    /// <summary>UV line-blanketing suppression shared by the built-in models.</summary>
    public UvSuppression Uv { get; init; } = new();
    /// <summary>Survey band names, in table order.</summary>
    public IReadOnlyList<string> Bands { get; init; } = [];
    /// <summary>Throughput tables (band name → path) replacing or adding to the built-in bands.</summary>
    public IReadOnlyDictionary<string, string> BandpassFiles { get; init; } = new Dictionary<string, string>();
    /// <summary>Mean host-galaxy E(B−V) (exponential distribution; 0 = no host dust) [mag].</summary>
    public double HostEbvMean { get; init; }
    /// <summary>Milky Way E(B−V) [mag].</summary>
    public double MilkyWayEbv { get; init; }
    /// <summary>R_V of the Cardelli et al. 1989 law.</summary>
    public double RV { get; init; } = 3.1;
    /// <summary>Cadence per band (used unless a visit table is given).</summary>
    public IReadOnlyList<BandCadence> Cadence { get; init; } = [];
    /// <summary>Days per year a field is observable.</summary>
    public double SeasonDays { get; init; } = 200;
    /// <summary>Fraction of visits lost to weather.</summary>
    public double WeatherLoss { get; init; } = 0.2;
    /// <summary>Visit-time jitter [days].</summary>
    public double JitterDays { get; init; } = 0.15;
    /// <summary>Explicit visit table path ("" = use the cadence).</summary>
    public string VisitTablePath { get; init; } = "";
    /// <summary>Images closer than this fraction of the seeing FWHM are unresolved.</summary>
    public double BlendFractionOfSeeing { get; init; } = 0.7;
    /// <summary>Photometric noise.</summary>
    public NoiseModel Noise { get; init; } = new();
    /// <summary>Detection rule.</summary>
    public DetectionRule Detection { get; init; } = new();
}
