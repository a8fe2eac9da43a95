using Lightfold.Randomness;

namespace Lightfold.Survey;

/// <summary>Visits generated from a cadence description, independently for each system's field (keyed by system id).</summary>
/// <remarks>
/// Each band is visited every <see cref="BandCadence.RevisitDays"/> from a random phase, with a uniform jitter of
/// ± <see cref="JitterDays"/>; a field is observable for <see cref="SeasonDays"/> of every 365.25 d, starting at a random
/// phase per field (the sky position sets the season); each visit is lost to weather with probability
/// <see cref="WeatherLoss"/>; depth is normal and seeing log-normal per visit. Survey-window limits apply.
/// </remarks>
public sealed record CadenceSchedule(IReadOnlyList<BandCadence> Bands, double StartMjd, double EndMjd, double SeasonDays, double WeatherLoss, double JitterDays) : ISchedule
{
    /// <inheritdoc/>
    public void Visits(ulong seed, long systemId, double fromMjd, double toMjd, List<Visit> into)
    {
        int first = into.Count;
        var rng = KeyedRandom.For(seed, systemId, Stage.Schedule);
        double seasonStart = 365.25 * rng.NextDouble();
        double lo = Math.Max(fromMjd, StartMjd), hi = Math.Min(toMjd, EndMjd);
        for (int b = 0; b < Bands.Count; b++)
        {
            var band = Bands[b];
            double offset = band.RevisitDays * rng.NextDouble();
            if (hi < lo) continue;
            long k0 = (long)Math.Ceiling((lo - JitterDays - StartMjd - offset) / band.RevisitDays);
            long k1 = (long)Math.Floor((hi + JitterDays - StartMjd - offset) / band.RevisitDays);
            for (long k = Math.Max(k0, 0); k <= k1; k++)
            {
                // Draw everything for every candidate visit so the sequence does not depend on which are kept.
                double jitter = JitterDays * (2 * rng.NextDouble() - 1);
                double lost = rng.NextDouble();
                double depth = rng.Normal(band.Depth5SigmaMag, band.DepthSigmaMag);
                double seeing = band.SeeingMedianArcsec * Math.Pow(10, band.SeeingSigmaDex * rng.Normal());
                double t = StartMjd + offset + k * band.RevisitDays + jitter;
                if (t < lo || t > hi || lost < WeatherLoss) continue;
                double phase = (t - StartMjd - seasonStart) % 365.25;
                if (phase < 0) phase += 365.25;
                if (phase >= SeasonDays) continue;
                into.Add(new Visit(t, b, depth, seeing));
            }
        }
        into.Sort(first, into.Count - first, Comparer<Visit>.Create((a, c) => a.Mjd != c.Mjd ? a.Mjd.CompareTo(c.Mjd) : a.Band.CompareTo(c.Band)));
    }
}

/// <summary>An explicit visit list (mjd, band, depth, seeing) shared by every system's field.</summary>
public sealed class TableSchedule : ISchedule
{
    readonly Visit[] visits;
    readonly double[] mjd;

    /// <summary>Wraps the visits (sorted here by time).</summary>
    public TableSchedule(IEnumerable<Visit> visits)
    {
        this.visits = visits.OrderBy(v => v.Mjd).ThenBy(v => v.Band).ToArray();
        mjd = this.visits.Select(v => v.Mjd).ToArray();
    }

    /// <summary>Number of visits.</summary>
    public int Count => visits.Length;

    /// <inheritdoc/>
    public void Visits(ulong seed, long systemId, double fromMjd, double toMjd, List<Visit> into)
    {
        int i = Array.BinarySearch(mjd, fromMjd);
        if (i < 0) i = ~i;
        while (i > 0 && mjd[i - 1] >= fromMjd) i--;
        for (; i < visits.Length && mjd[i] <= toMjd; i++) into.Add(visits[i]);
    }
}
