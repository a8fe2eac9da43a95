using System.Runtime.InteropServices;
using Lightfold.Cli;
using Lightfold.Configuration;

// SIGINT and SIGTERM cancel the run: writers delete their temporary files and the exit code is 130.
using var cancellation = new CancellationTokenSource();
void Stop(PosixSignalContext context)
{
    context.Cancel = true;
    cancellation.Cancel();
}
using var interrupt = PosixSignalRegistration.Create(PosixSignal.SIGINT, Stop);
using var terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, Stop);
return Cli.Run(args, Console.Out, Console.Error, ScenarioLoader.ProcessEnvironment(), cancellation.Token);
