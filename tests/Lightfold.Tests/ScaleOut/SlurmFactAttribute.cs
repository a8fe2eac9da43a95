using System.Diagnostics;

namespace Lightfold.Tests.ScaleOut;

/// <summary>A fact that is skipped, with a clear message, where no Slurm cluster answers (`sinfo` missing or failing).</summary>
public sealed class SlurmFactAttribute : FactAttribute
{
    public SlurmFactAttribute()
    {
        if (!ClusterAvailable(out string why))
            Skip = $"no Slurm cluster here ({why}); .ci/run starts one with scripts/slurm/local-cluster.sh";
    }

    static bool ClusterAvailable(out string why)
    {
        try
        {
            var info = new ProcessStartInfo("sinfo", "-h -o %T") { RedirectStandardOutput = true, RedirectStandardError = true };
            using var p = Process.Start(info)!;
            string output = p.StandardOutput.ReadToEnd();
            p.WaitForExit(10_000);
            why = p.ExitCode == 0 ? "" : "sinfo failed";
            if (p.ExitCode == 0 && !output.Contains("idle") && !output.Contains("mixed") && !output.Contains("alloc")) why = $"node state '{output.Trim()}'";
            return why.Length == 0;
        }
        catch (System.ComponentModel.Win32Exception)
        {
            why = "sbatch/sinfo not installed";
            return false;
        }
    }
}
