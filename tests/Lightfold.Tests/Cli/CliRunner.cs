namespace Lightfold.Tests.Cli;

/// <summary>Runs the CLI in-process with captured output.</summary>
public static class CliRunner
{
    /// <summary>Runs <paramref name="args"/>; returns exit code, stdout and stderr.</summary>
    public static (int Code, string Out, string Err) Run(params string[] args) => RunWithEnvironment([], args);

    /// <summary>Runs with the given environment variables.</summary>
    public static (int Code, string Out, string Err) RunWithEnvironment(Dictionary<string, string?> env, params string[] args)
    {
        var stdout = new StringWriter();
        var stderr = new StringWriter();
        int code = Lightfold.Cli.Cli.Run(args, stdout, stderr, env);
        return (code, stdout.ToString(), stderr.ToString());
    }
}
