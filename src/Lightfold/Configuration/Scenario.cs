using Lightfold.Cosmology;
using Lightfold.Populations;

namespace Lightfold.Configuration;

/// <summary>How many systems a run draws and what their weights mean.</summary>
public enum RunMode
{
    /// <summary>N systems, each weighted so the weights sum to the expected number of lensed events.</summary>
    Oversample,
    /// <summary>One Poisson realisation of the survey: the number of systems is drawn, every weight is 1.</summary>
    Realization,
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

    /// <summary>The resolved configuration as indented JSON (all layers applied, typed).</summary>
    public string ResolvedJson { get; init; } = "{}";
}
