using Lightfold.Catalog;

namespace Lightfold.Analysis;

/// <summary>The truth of one image pair: Δt = t_b − t_a, the magnification ratio |μ_b/μ_a| and the microlensing
/// amplitude (rms over visits of 2.5 log10(μ_micro,b/μ_micro,a)) [mag].</summary>
public sealed record PairTruth(long SystemId, int ImageA, int ImageB, double TrueDelayDays, double MagnificationRatio, double MicroAmplitudeMag);

/// <summary>Image pairs to estimate, their truth and their observed light curves, from a catalog's tables.</summary>
/// <remarks>The target set is every pair (0, k) of the systems the survey detected: what a delay team would be handed.</remarks>
public static class DelayPairs
{
    /// <summary>Target pairs (0, k) of detected systems with their truth.</summary>
    public static List<PairTruth> Targets(TableColumns systems, TableColumns images, TableColumns? observations)
    {
        var detected = new HashSet<long>();
        var sid = systems.L(Columns.SystemId);
        var det = systems.B(Columns.Detected);
        for (int i = 0; i < systems.Rows; i++) if (det[i]) detected.Add(sid[i]);
        var byImage = new Dictionary<(long, int), (double Delay, double Mu)>();
        var iid = images.L(Columns.SystemId);
        var idx = images.I(Columns.ImageIndex);
        var delay = images.D(Columns.DelayDays);
        var mu = images.D(Columns.Magnification);
        for (int i = 0; i < images.Rows; i++)
            if (detected.Contains(iid[i])) byImage[(iid[i], idx[i])] = (delay[i], mu[i]);
        var micro = observations is null ? null : MicroAmplitudes(observations, detected);
        var targets = new List<PairTruth>();
        foreach (var ((id, k), b) in byImage.OrderBy(kv => kv.Key))
        {
            if (k == 0 || !byImage.TryGetValue((id, 0), out var a)) continue;
            double amplitude = micro is not null && micro.TryGetValue((id, k), out double v) ? v : double.NaN;
            targets.Add(new PairTruth(id, 0, k, b.Delay - a.Delay, Math.Abs(b.Mu / a.Mu), amplitude));
        }
        return targets;
    }

    // rms of 2.5 log10(μ_micro,k / μ_micro,0) over visits where both images have a row.
    static Dictionary<(long, int), double> MicroAmplitudes(TableColumns obs, HashSet<long> systems)
    {
        var sid = obs.L(Columns.SystemId);
        var idx = obs.I(Columns.ImageIndex);
        var mjd = obs.D(Columns.Mjd);
        var micro = obs.D(Columns.MicroMagnification);
        var band = obs.S(Columns.Band);
        var first = new Dictionary<(long, double, string), double>();
        for (int r = 0; r < obs.Rows; r++)
            if (idx[r] == 0 && systems.Contains(sid[r])) first[(sid[r], mjd[r], band[r])] = micro[r];
        var sums = new Dictionary<(long, int), (double Sum2, int N)>();
        for (int r = 0; r < obs.Rows; r++)
        {
            if (idx[r] <= 0 || !first.TryGetValue((sid[r], mjd[r], band[r]), out double m0)) continue;
            double d = 2.5 * Math.Log10(micro[r] / m0);
            var key = (sid[r], idx[r]);
            var (s2, n) = sums.GetValueOrDefault(key);
            sums[key] = (s2 + d * d, n + 1);
        }
        return sums.ToDictionary(kv => kv.Key, kv => Math.Sqrt(kv.Value.Sum2 / kv.Value.N));
    }

    /// <summary>Each image's light curve per band, as magnitudes from rows with S/N ≥ <paramref name="minSnr"/>
    /// (σ_m = 2.5/ln10 / S/N); only systems in <paramref name="systems"/>.</summary>
    public static Dictionary<(long System, int Image), Dictionary<string, LightCurve>> LightCurves(TableColumns obs, IReadOnlySet<long> systems, double minSnr = 3)
    {
        var sid = obs.L(Columns.SystemId);
        var idx = obs.I(Columns.ImageIndex);
        var mjd = obs.D(Columns.Mjd);
        var flux = obs.D(Columns.FluxNjy);
        var snr = obs.D(Columns.Snr);
        var band = obs.S(Columns.Band);
        var lists = new Dictionary<(long, int), Dictionary<string, List<(double T, double M, double E)>>>();
        for (int r = 0; r < obs.Rows; r++)
        {
            if (idx[r] < 0 || snr[r] < minSnr || !systems.Contains(sid[r])) continue;
            var key = (sid[r], idx[r]);
            if (!lists.TryGetValue(key, out var bands)) lists[key] = bands = [];
            if (!bands.TryGetValue(band[r], out var points)) bands[band[r]] = points = [];
            points.Add((mjd[r], Photometry.SyntheticPhotometry.MagnitudeFromNjy(flux[r]), 2.5 / Math.Log(10) / snr[r]));
        }
        return lists.ToDictionary(kv => kv.Key, kv => kv.Value.ToDictionary(b => b.Key, b =>
        {
            var p = b.Value.OrderBy(x => x.T).ToList();
            // Merge visits at identical times (keep the first) so the spline abscissae increase strictly.
            p = p.Where((x, i) => i == 0 || x.T > p[i - 1].T).ToList();
            return new LightCurve(p.Select(x => x.T).ToArray(), p.Select(x => x.M).ToArray(), p.Select(x => x.E).ToArray());
        }));
    }
}
