using System.CommandLine;

namespace Lightfold.Cli.Commands;

/// <summary><c>lightfold config show|check</c>: print or validate the resolved configuration.</summary>
public static class ConfigCommand
{
    /// <summary>Builds the command.</summary>
    public static Command Create(CliContext context)
    {
        var command = new Command("config", "Show or check the resolved configuration (default → --config files → LIGHTFOLD__* environment → --set)");

        var show = new Command("show", "Print the resolved configuration as JSON");
        var showOptions = new ScenarioOptions();
        showOptions.AddTo(show);
        show.SetAction(parse =>
        {
            context.Out.WriteLine(showOptions.Load(parse, context).ResolvedJson);
            return ExitCodes.Ok;
        });

        var check = new Command("check", "Validate the configuration: exit 0 if valid, 2 with one message if not");
        var checkOptions = new ScenarioOptions();
        checkOptions.AddTo(check);
        check.SetAction(parse =>
        {
            var scenario = checkOptions.Load(parse, context);
            context.Out.WriteLine($"configuration '{scenario.Name}' is valid");
            return ExitCodes.Ok;
        });

        command.Subcommands.Add(show);
        command.Subcommands.Add(check);
        return command;
    }
}
