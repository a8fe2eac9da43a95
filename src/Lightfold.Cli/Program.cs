using Lightfold.Cli;
using Lightfold.Configuration;

return Cli.Run(args, Console.Out, Console.Error, ScenarioLoader.ProcessEnvironment());
