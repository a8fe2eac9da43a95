using System.CommandLine;
using Lightfold.Configuration;

namespace Lightfold.Cli;

/// <summary>The options every scenario-reading command shares: --config (repeatable) and --set (repeatable).</summary>
public sealed class ScenarioOptions
{
    /// <summary>--config FILE, applied in order after the embedded default.</summary>
    public Option<string[]> Config { get; } = new("--config", "-c")
    {
        Description = "JSON config file layered over the embedded default (repeatable; later wins)",
        Arity = ArgumentArity.ZeroOrMore,
        AllowMultipleArgumentsPerToken = false,
    };

    /// <summary>--set section.key=value, applied last.</summary>
    public Option<string[]> Set { get; } = new("--set")
    {
        Description = "override one key, e.g. --set cosmology.h0_kms_mpc=67.4 (repeatable; applied last)",
        Arity = ArgumentArity.ZeroOrMore,
        AllowMultipleArgumentsPerToken = false,
    };

    /// <summary>Adds both options to <paramref name="command"/>.</summary>
    public void AddTo(Command command)
    {
        command.Options.Add(Config);
        command.Options.Add(Set);
    }

    /// <summary>Loads the scenario these options describe.</summary>
    public Scenario Load(ParseResult parse, CliContext context, params string[] extraSets)
        => ScenarioLoader.Load(parse.GetValue(Config) ?? [], [.. parse.GetValue(Set) ?? [], .. extraSets], context.Environment);
}
