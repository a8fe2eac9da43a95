using System.CommandLine;
using Lightfold.Cli.Commands;

namespace Lightfold.Cli;

/// <summary>The <c>lightfold</c> command tree: parses, calls the library, maps failures to exit codes.</summary>
/// <remarks>Exit codes: 0 success; 2 bad input (arguments, config, tables, files); 1 a bug (stack trace printed).</remarks>
public static class Cli
{
    /// <summary>Runs one command line with the given output writers and environment.</summary>
    public static int Run(string[] args, TextWriter stdout, TextWriter stderr, IEnumerable<KeyValuePair<string, string?>> environment,
        CancellationToken cancellation = default)
    {
        var context = new CliContext(stdout, stderr, environment.ToList());
        var root = new RootCommand("Lightfold: mock catalogs of strongly lensed transients (simulated, not observed).");
        root.Subcommands.Add(ConfigCommand.Create(context));
        root.Subcommands.Add(DistancesCommand.Create(context));
        root.Subcommands.Add(LensCommand.Create(context));
        root.Subcommands.Add(SimulateCommand.Create(context));
        root.Subcommands.Add(ForecastCommand.Create(context));
        root.Subcommands.Add(LightCurveCommand.Create(context));
        root.Subcommands.Add(MicromapCommand.Create(context));
        root.Subcommands.Add(EstimateDelaysCommand.Create(context));
        root.Subcommands.Add(ScoreDelaysCommand.Create(context));
        root.Subcommands.Add(ReportCommand.Create(context));

        ParseResult parse = root.Parse(args);
        if (parse.Errors.Count > 0)
        {
            foreach (var error in parse.Errors) stderr.WriteLine($"lightfold: {error.Message}");
            stderr.WriteLine("Run 'lightfold --help' for usage.");
            return ExitCodes.BadInput;
        }
        try
        {
            // SIGINT/SIGTERM arrive through `cancellation` (Program.cs); System.CommandLine's own handler is off.
            var configuration = new InvocationConfiguration { Output = stdout, Error = stderr, EnableDefaultExceptionHandler = false, ProcessTerminationTimeout = null };
            return parse.InvokeAsync(configuration, cancellation).GetAwaiter().GetResult();
        }
        catch (InputException e)
        {
            stderr.WriteLine($"lightfold: {e.Message}");
            return ExitCodes.BadInput;
        }
        catch (AggregateException e) when (e.Flatten().InnerExceptions is [InputException inner, ..])
        {
            stderr.WriteLine($"lightfold: {inner.Message}");
            return ExitCodes.BadInput;
        }
        catch (Exception e) when (e is OperationCanceledException || (e is AggregateException a && a.Flatten().InnerExceptions.All(x => x is OperationCanceledException)))
        {
            stderr.WriteLine("lightfold: cancelled; no finished output was left behind");
            return ExitCodes.Cancelled;
        }
    }
}

/// <summary>Process exit codes.</summary>
public static class ExitCodes
{
    /// <summary>Success.</summary>
    public const int Ok = 0;
    /// <summary>An unexpected failure (a bug): stack trace on stderr.</summary>
    public const int Bug = 1;
    /// <summary>Bad input: one message on stderr naming the key, row or file.</summary>
    public const int BadInput = 2;
    /// <summary>Interrupted by SIGINT/SIGTERM (128 + SIGINT).</summary>
    public const int Cancelled = 130;
}

/// <summary>What every command needs from outside: writers and the environment.</summary>
public sealed record CliContext(TextWriter Out, TextWriter Error, IReadOnlyList<KeyValuePair<string, string?>> Environment);
