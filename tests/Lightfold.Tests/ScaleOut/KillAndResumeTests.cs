using System.Diagnostics;
using System.Runtime.InteropServices;
using Lightfold.Tests.Cli;
using Lightfold.Tests.Support;

namespace Lightfold.Tests.ScaleOut;

/// <summary>Runs the real `lightfold` process, kills it mid-run, and resumes.</summary>
public class KillAndResumeTests
{
    static string Cli => Path.Combine(AppContext.BaseDirectory, "lightfold.dll");

    static Process Start(string dir, string count)
    {
        var info = new ProcessStartInfo("dotnet") { RedirectStandardOutput = true, RedirectStandardError = true, UseShellExecute = false };
        foreach (string a in new[] { Cli, "simulate", "--out", dir, "--count", count, "--seed", "5", "--set", "run.batch_size=2000" }) info.ArgumentList.Add(a);
        return Process.Start(info)!;
    }

    static bool WaitFor(Func<bool> condition, double seconds)
    {
        var watch = Stopwatch.StartNew();
        while (watch.Elapsed.TotalSeconds < seconds)
        {
            if (condition()) return true;
            Thread.Sleep(20);
        }
        return false;
    }

    static bool WritingStarted(string dir) => Directory.Exists(Path.Combine(dir, "systems"))
        && Directory.GetFiles(Path.Combine(dir, "systems"), "*.partial-*", SearchOption.AllDirectories).Length > 0;

    // A run killed with SIGKILL while writing leaves no finished-looking file (only temporary names, no shard marker);
    // rerunning the same command completes and gives exactly the rows of an uninterrupted run.
    [Fact]
    public void Sigkill_mid_run_then_rerun_equals_an_uninterrupted_run()
    {
        string killed = Path.Combine(Path.GetTempPath(), $"lightfold-kill-{Guid.NewGuid():N}");
        string clean = Path.Combine(Path.GetTempPath(), $"lightfold-clean-{Guid.NewGuid():N}");
        using (var p = Start(killed, "30000"))
        {
            Assert.True(WaitFor(() => WritingStarted(killed) || p.HasExited, 120), "the run started writing");
            Assert.False(p.HasExited, "killed before it finished");
            p.Kill();   // SIGKILL
            p.WaitForExit();
        }
        Assert.False(File.Exists(Path.Combine(killed, "systems", "shard=0000", "part.parquet")), "no finished part after SIGKILL");
        Assert.Empty(Directory.Exists(Path.Combine(killed, "manifest.d")) ? Directory.GetFiles(Path.Combine(killed, "manifest.d")) : []);
        foreach (string dir in new[] { killed, clean })
        {
            using var p = Start(dir, "30000");
            p.WaitForExit();
            Assert.True(p.ExitCode == 0, p.StandardError.ReadToEnd());
        }
        Assert.Empty(Directory.GetFiles(killed, "*.partial-*", SearchOption.AllDirectories));
        CatalogCompare.AssertSameRows(clean, killed, "systems", "images");
    }

    [DllImport("libc", SetLastError = true)]
    static extern int kill(int pid, int sig);

    // SIGTERM stops the run cleanly: exit code 130 and no part files, markers or temporary files left behind.
    [Fact]
    public void Sigterm_stops_cleanly_without_partial_files()
    {
        if (!OperatingSystem.IsLinux()) return;
        string dir = Path.Combine(Path.GetTempPath(), $"lightfold-term-{Guid.NewGuid():N}");
        using var p = Start(dir, "300000");
        Assert.True(WaitFor(() => WritingStarted(dir) || p.HasExited, 120));
        Assert.False(p.HasExited);
        Assert.Equal(0, kill(p.Id, 15));
        Assert.True(p.WaitForExit(60_000), "stopped within a minute");
        Assert.Equal(130, p.ExitCode);
        Assert.Empty(Directory.GetFiles(dir, "*.partial-*", SearchOption.AllDirectories));
        Assert.Empty(Directory.GetFiles(dir, "part.parquet", SearchOption.AllDirectories));
    }
}
