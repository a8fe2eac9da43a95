using System.Diagnostics;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;
using Xunit.Abstractions;

namespace Lightfold.Tests.ScaleOut;

public class SlurmArrayTests(ITestOutputHelper output)
{
    static string Repository()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Simulator.sln"))) dir = dir.Parent;
        return dir?.FullName ?? throw new InvalidOperationException("repository root not found");
    }

    // A real Slurm job array (scripts/slurm/array.sbatch via submit.sh, sbatch --wait) of 4 tasks on the local
    // cluster writes 4 parts whose union equals a single-process run of the default scenario, row for row.
    [SlurmFact]
    public void Four_task_array_equals_a_single_process_run()
    {
        string repo = Repository();
        string single = Path.Combine(Path.GetTempPath(), $"lightfold-single-{Guid.NewGuid():N}");
        string array = Path.Combine(Path.GetTempPath(), $"lightfold-array-{Guid.NewGuid():N}");
        var (code, _, err) = CliRunner.Run("simulate", "--out", single, "--count", "300", "--seed", "21", "--quiet");
        Assert.True(code == 0, err);

        var info = new ProcessStartInfo(Path.Combine(repo, "scripts", "slurm", "submit.sh")) { RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (string a in new[] { "--shards", "4", "--out", array, "--wait", "--", "--count", "300", "--seed", "21" }) info.ArgumentList.Add(a);
        info.Environment["LIGHTFOLD_BIN"] = $"dotnet {Path.Combine(AppContext.BaseDirectory, "lightfold.dll")}";
        using var p = Process.Start(info)!;
        string stdout = p.StandardOutput.ReadToEnd(), stderr = p.StandardError.ReadToEnd();
        Assert.True(p.WaitForExit(600_000), "the array finished within 10 minutes");
        output.WriteLine(stdout);
        Assert.True(p.ExitCode == 0, $"{stdout}\n{stderr}\n" + string.Join("\n", Directory.GetFiles(Path.Combine(array, "logs")).Select(File.ReadAllText)));
        Assert.Equal(4, Directory.GetFiles(Path.Combine(array, "manifest.d")).Length);
        Assert.Equal(4, Directory.GetFiles(Path.Combine(array, "logs")).Length);
        CatalogCompare.AssertSameRows(single, array);
    }
}
