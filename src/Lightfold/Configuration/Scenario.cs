using Lightfold.Cosmology;

namespace Lightfold.Configuration;

/// <summary>A validated, immutable simulation scenario: everything a run depends on besides the code.</summary>
/// <remarks>Built once by <see cref="ScenarioLoader"/>; stages read from it and never change it.</remarks>
public sealed record Scenario
{
    /// <summary>Scenario name, written to the catalog metadata.</summary>
    public required string Name { get; init; }

    /// <summary>Master seed of every random stream.</summary>
    public required ulong Seed { get; init; }

    /// <summary>Cosmological parameters.</summary>
    public required CosmologyParameters Cosmology { get; init; }

    /// <summary>The resolved configuration as indented JSON (all layers applied, typed).</summary>
    public string ResolvedJson { get; init; } = "{}";
}
