using System.Diagnostics;
using Lightfold.Pipeline;

namespace Lightfold.Cli;

/// <summary>Progress on stderr: systems done, rate and ETA; one line per update when stderr is not a terminal.</summary>
public sealed class ProgressReporter(TextWriter error, bool quiet, bool interactive) : IProgressSink
{
    readonly Stopwatch clock = Stopwatch.StartNew();
    double lastSeconds = double.NegativeInfinity;

    /// <inheritdoc/>
    public void Report(long done, long total)
    {
        if (quiet) return;
        double seconds = clock.Elapsed.TotalSeconds;
        if (done < total && seconds - lastSeconds < 1.0) return;
        lastSeconds = seconds;
        double rate = done / Math.Max(seconds, 1e-9);
        double eta = rate > 0 ? (total - done) / rate : double.NaN;
        string line = $"{done:N0}/{total:N0} systems ({100.0 * done / Math.Max(total, 1):F1}%), {rate:N0} systems/s, ETA {FormatEta(eta)}";
        if (interactive) error.Write("\r" + line.PadRight(78) + (done >= total ? "\n" : ""));
        else error.WriteLine(line);
    }

    static string FormatEta(double seconds)
        => double.IsFinite(seconds) ? TimeSpan.FromSeconds(Math.Ceiling(seconds)).ToString(@"hh\:mm\:ss") : "--:--:--";
}
