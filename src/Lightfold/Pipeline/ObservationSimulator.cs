using Lightfold.Microlensing;
using Lightfold.Photometry;
using Lightfold.Randomness;
using Lightfold.Survey;
using Lightfold.Transients;

namespace Lightfold.Pipeline;

/// <summary>What the survey records of one lensed system: visits, true and noisy fluxes per image and per blend, detection.</summary>
/// <remarks>
/// Image i at a visit at time t has true flux |μ_i| μ_micro,i(t) F(t − t₀ − Δt_i), F the unlensed observed-frame band flux
/// (time-dilated and K-corrected through <see cref="LightCurveBank"/>, scaled to the drawn peak magnitude, extincted).
/// Images closer than a fraction of the visit's seeing FWHM are merged (single linkage) into an unresolved group, which gets
/// an extra row (image index −1) with the summed true flux and its own noise; the per-image rows of a blended image are
/// what an ideal deblender would measure. Noise: <see cref="NoiseModel"/>, drawn from the system's Noise stream in row order.
/// </remarks>
public sealed class ObservationSimulator
{
    readonly LightCurveBank bank;
    readonly ISchedule schedule;
    readonly NoiseModel noise;
    readonly DetectionRule detection;
    readonly ulong seed;
    readonly double blendFraction, preExplosionDays, hostEbvMean, mwEbv, rV;
    readonly double[] pivot;
    readonly double candleMean, candleSigma;
    readonly MicrolensingSettings? micro;
    readonly MapBank? maps;
    readonly Dictionary<Populations.TransientType, double> maxRadiusCm = [];

    /// <summary>Prepares the stage; <paramref name="maps"/> null means no microlensing (factor 1).</summary>
    public ObservationSimulator(ulong seed, LightCurveBank bank, ISchedule schedule, NoiseModel noise, DetectionRule detection,
        double blendFractionOfSeeing, double preExplosionDays, double hostEbvMean, double mwEbv, double rV, double candleMeanB, double candleSigmaB,
        MicrolensingSettings? micro = null, MapBank? maps = null)
    {
        this.micro = micro;
        this.maps = micro is { Enabled: true } ? maps : null;
        foreach (var (type, model) in bank.Models)
        {
            double r = 0;
            for (double t = 0; t <= model.MaxPhaseDays; t += 0.5) r = Math.Max(r, model.PhotosphereRadiusCm(t));
            maxRadiusCm[type] = r;
        }
        this.seed = seed;
        this.bank = bank;
        this.schedule = schedule;
        this.noise = noise;
        this.detection = detection;
        blendFraction = blendFractionOfSeeing;
        this.preExplosionDays = preExplosionDays;
        this.hostEbvMean = hostEbvMean;
        this.mwEbv = mwEbv;
        this.rV = rV;
        candleMean = candleMeanB;
        candleSigma = candleSigmaB;
        pivot = bank.Bands.Select(b => b.PivotWavelengthAngstrom).ToArray();
    }

    /// <summary>The bands, in index order.</summary>
    public IReadOnlyList<Bandpass> Bands => bank.Bands;

    /// <summary>Simulates the observations of <paramref name="s"/> into <paramref name="o"/>.</summary>
    public void Simulate(in LensedSystem s, double luminosityDistanceCm, double lensLuminosityDistanceCm, SystemObservations o, List<Visit> visits)
    {
        o.Clear();
        o.MinSnr = detection.MinSnr;
        int nb = bank.Bands.Count, ni = s.ImageCount;
        var dust = KeyedRandom.For(seed, s.SystemId, Stage.Dust);
        o.HostEbv = hostEbvMean > 0 ? dust.Exponential(hostEbvMean) : 0.0;
        Span<double> extinction = stackalloc double[nb];
        Span<double> scale = stackalloc double[nb];
        for (int b = 0; b < nb; b++)
            extinction[b] = Extinction.Magnitudes(pivot[b] / (1 + s.ZSource), o.HostEbv, rV) + Extinction.Magnitudes(pivot[b], mwEbv, rV);
        bank.EventScales(s.Type, s.ZSource, luminosityDistanceCm, s.PeakAbsoluteBMag, extinction, scale);

        double maxDelay = ni > 0 ? s.DelaysDays[ni - 1] : 0;
        double end = s.T0Mjd + (1 + s.ZSource) * bank.Models[s.Type].MaxPhaseDays + maxDelay;
        visits.Clear();
        schedule.Visits(seed, s.SystemId, s.T0Mjd - preExplosionDays, end, visits);

        var rng = KeyedRandom.For(seed, s.SystemId, Stage.Noise);
        Span<double> truth = stackalloc double[LensedSystem.MaxImages];
        Span<int> group = stackalloc int[LensedSystem.MaxImages];
        Span<double> sx = stackalloc double[LensedSystem.MaxImages];
        Span<double> sy = stackalloc double[LensedSystem.MaxImages];
        for (int i = 0; i < ni; i++) { sx[i] = s.Images[i].XArcsec; sy[i] = s.Images[i].YArcsec; }
        // Microlensing: each image sits at a random (keyed) place on the map of its (κ, γ, κ_*) node.
        var sources = maps is null ? null : new FiniteSource?[ni];
        double pixelCm = 0;
        Span<double> restWavelength = stackalloc double[nb];
        for (int b = 0; b < nb; b++) restWavelength[b] = pivot[b] / (1 + s.ZSource);
        if (sources is not null)
        {
            double chroma = 1;
            for (int b = 0; b < nb; b++) chroma = Math.Max(chroma, micro!.ChromaticFactor(restWavelength[b], 1e9));
            for (int i = 0; i < ni; i++)
            {
                if (!MapBank.Covers(s.Images[i].Kappa, s.Images[i].Gamma, s.KappaStars[i])) continue;
                var map = maps!.Get(s.Images[i].Kappa, s.Images[i].Gamma, s.KappaStars[i]);
                pixelCm = s.MicroEinsteinRadiusCm * map.PixelEinsteinRadii;
                double rMax = Math.Min(maxRadiusCm[s.Type] * chroma / pixelCm + 2, map.Pixels / 3.0);
                var place = KeyedRandom.For(seed, s.SystemId, Stage.Microlensing, (ulong)i);
                double cx = rMax + place.NextDouble() * (map.Pixels - 2 * rMax), cy = rMax + place.NextDouble() * (map.Pixels - 2 * rMax);
                sources[i] = new FiniteSource(map, cx, cy, rMax, micro!.LimbDarkening);
            }
        }
        Span<double> microFactor = stackalloc double[LensedSystem.MaxImages];
        Span<double> candle = stackalloc double[nb];
        bool useCandle = detection.RequireBrighterThanCandle && s.Type == Populations.TransientType.Ia && s.Lensed;
        if (useCandle) CandlePeaks(s.ZLens, lensLuminosityDistanceCm, candle);
        bool candlePassed = false;

        foreach (var v in visits)
        {
            int b = v.Band;
            for (int i = 0; i < ni; i++)
            {
                double phase = (v.Mjd - s.T0Mjd - s.DelaysDays[i]) / (1 + s.ZSource);
                microFactor[i] = 1.0;
                if (sources?[i] is not null && phase > 0)
                {
                    var model = bank.Models[s.Type];
                    double radius = model.PhotosphereRadiusCm(Math.Min(phase, model.MaxPhaseDays)) * micro!.ChromaticFactor(restWavelength[b], phase);
                    microFactor[i] = sources[i]!.Factor(radius / pixelCm);
                }
                truth[i] = Math.Abs(s.Images[i].Magnification) * microFactor[i] * scale[b] * bank.Q(s.Type, b, s.ZSource, phase);
            }
            Groups(sx, sy, ni, blendFraction * v.SeeingFwhmArcsec, group);
            for (int i = 0; i < ni; i++)
            {
                int r = AddRow(o, v, i, group[i], truth[i], microFactor[i], ref rng);
                bool resolved = IsAlone(group, ni, i);
                if (resolved) Track(o, r, i, b, v.Mjd);
            }
            for (int g = 0; g < ni; g++)
            {
                if (group[g] != g || IsAlone(group, ni, g)) continue;
                double sum = 0, unmicrolensed = 0;
                for (int i = 0; i < ni; i++)
                    if (group[i] == g)
                    {
                        sum += truth[i];
                        unmicrolensed += truth[i] / microFactor[i];
                    }
                int r = AddRow(o, v, -1, g, sum, unmicrolensed > 0 ? sum / unmicrolensed : 1.0, ref rng);
                Track(o, r, -1, b, v.Mjd);
            }
            if (useCandle && !candlePassed)
            {
                double total = 0;
                for (int i = 0; i < ni; i++) total += truth[i];
                candlePassed = total > candle[b];
            }
        }
        Decide(o, useCandle ? candlePassed : !detection.RequireBrighterThanCandle);
    }

    /// <summary>Per-band features of what the survey measured (observed fluxes only; no truth): the summed flux of every
    /// measured unit (resolved images and unresolved blends) per visit, errors in quadrature.</summary>
    /// <remarks>Per band: visits, detections (S/N ≥ the rule's threshold), peak flux and its time, rise (first detection to
    /// peak) and decline (peak to last detection) times, and the colour to the next band at this band's peak (that band's
    /// visit nearest in time within 3 d; NaN when either flux is not positive).</remarks>
    public void Features(SystemObservations o, BandFeatures[] into)
    {
        int nb = into.Length;
        for (int b = 0; b < nb; b++) into[b] = new BandFeatures { PeakFluxNjy = double.NaN, PeakMjd = double.NaN, RiseDays = double.NaN, DeclineDays = double.NaN, ColourToNextBandMag = double.NaN };
        // Per visit totals, in row order (rows of one visit are contiguous).
        var visits = new List<(double Mjd, int Band, double Flux, double Var)>();
        for (int r = 0; r < o.Count;)
        {
            double mjd = o.Mjd[r];
            int band = o.Band[r];
            double flux = 0, variance = 0;
            int k = r;
            for (; k < o.Count && o.Mjd[k] == mjd && o.Band[k] == band; k++)
            {
                bool measured = o.ImageIndex[k] < 0 || IsResolvedRow(o, k);
                if (!measured) continue;
                flux += o.Flux[k];
                variance += o.FluxErr[k] * o.FluxErr[k];
            }
            visits.Add((mjd, band, flux, variance));
            r = k;
        }
        var firstDet = new double[nb];
        var lastDet = new double[nb];
        Array.Fill(firstDet, double.NaN);
        Array.Fill(lastDet, double.NaN);
        foreach (var v in visits)
        {
            ref var f = ref into[v.Band];
            f.Visits++;
            if (v.Flux / Math.Sqrt(v.Var) >= detection.MinSnr)
            {
                f.Detections++;
                if (double.IsNaN(firstDet[v.Band])) firstDet[v.Band] = v.Mjd;
                lastDet[v.Band] = v.Mjd;
            }
            if (double.IsNaN(f.PeakFluxNjy) || v.Flux > f.PeakFluxNjy) { f.PeakFluxNjy = v.Flux; f.PeakMjd = v.Mjd; }
        }
        for (int b = 0; b < nb; b++)
        {
            ref var f = ref into[b];
            if (f.Detections > 0) { f.RiseDays = f.PeakMjd - firstDet[b]; f.DeclineDays = lastDet[b] - f.PeakMjd; }
            if (b + 1 >= nb || !(f.PeakFluxNjy > 0)) continue;
            double best = double.PositiveInfinity, other = double.NaN;
            foreach (var v in visits)
                if (v.Band == b + 1 && Math.Abs(v.Mjd - f.PeakMjd) <= 3 && Math.Abs(v.Mjd - f.PeakMjd) < best) { best = Math.Abs(v.Mjd - f.PeakMjd); other = v.Flux; }
            if (other > 0) f.ColourToNextBandMag = -2.5 * Math.Log10(f.PeakFluxNjy / other);
        }
    }

    int AddRow(SystemObservations o, in Visit v, int image, int group, double trueFlux, double micro, ref KeyedRandom rng)
    {
        int r = o.Add();
        double sigma = noise.SigmaNjy(trueFlux, v.Depth5SigmaMag);
        o.Mjd[r] = v.Mjd; o.Band[r] = v.Band; o.ImageIndex[r] = image; o.BlendGroup[r] = group;
        o.TrueFlux[r] = trueFlux; o.FluxErr[r] = sigma; o.Flux[r] = trueFlux + sigma * rng.Normal();
        o.Micro[r] = micro; o.Depth[r] = v.Depth5SigmaMag; o.Seeing[r] = v.SeeingFwhmArcsec;
        return r;
    }

    // Per-image peak magnitude among detections (resolved rows only).
    void Track(SystemObservations o, int row, int image, int band, double mjd)
    {
        if (o.Flux[row] / o.FluxErr[row] < detection.MinSnr || image < 0) return;
        double mag = SyntheticPhotometry.MagnitudeFromNjy(o.Flux[row]);
        if (double.IsNaN(o.PeakMag[image]) || mag < o.PeakMag[image])
        {
            o.PeakMag[image] = mag;
            o.PeakBand[image] = band;
        }
    }

    static bool IsAlone(ReadOnlySpan<int> group, int n, int i)
    {
        for (int j = 0; j < n; j++) if (j != i && group[j] == group[i]) return false;
        return true;
    }

    // Single-linkage groups of images closer than `limit` [arcsec]; each labelled by its lowest image index.
    static void Groups(ReadOnlySpan<double> x, ReadOnlySpan<double> y, int n, double limit, Span<int> group)
    {
        for (int i = 0; i < n; i++) group[i] = i;
        double l2 = limit * limit;
        bool changed = true;
        while (changed)
        {
            changed = false;
            for (int i = 0; i < n; i++)
                for (int j = i + 1; j < n; j++)
                {
                    if (group[i] == group[j]) continue;
                    double dx = x[i] - x[j], dy = y[i] - y[j];
                    if (dx * dx + dy * dy >= l2) continue;
                    int keep = Math.Min(group[i], group[j]), drop = Math.Max(group[i], group[j]);
                    for (int k = 0; k < n; k++) if (group[k] == drop) group[k] = keep;
                    changed = true;
                }
        }
    }

    // Detection: rows that a survey would measure (resolved images and unresolved blends), sliding window.
    void Decide(SystemObservations o, bool candleOk)
    {
        var epochs = new List<(double Mjd, int Band)>();
        for (int r = 0; r < o.Count; r++)
        {
            bool measured = o.ImageIndex[r] < 0 || IsResolvedRow(o, r);
            if (measured && o.Flux[r] / o.FluxErr[r] >= detection.MinSnr) epochs.Add((o.Mjd[r], o.Band[r]));
        }
        epochs.Sort((a, b) => a.Mjd.CompareTo(b.Mjd));
        o.Detections = epochs.Count;
        o.FirstDetectionMjd = epochs.Count > 0 ? epochs[0].Mjd : double.NaN;
        bool ok = false;
        Span<bool> seen = stackalloc bool[64];
        for (int a = 0, b = 0; a < epochs.Count && !ok; a++)
        {
            while (b < epochs.Count && epochs[b].Mjd - epochs[a].Mjd <= detection.WindowDays) b++;
            if (b - a < detection.MinDetections) continue;
            seen.Clear();
            int bands = 0;
            for (int k = a; k < b; k++)
                if (!seen[epochs[k].Band % 64]) { seen[epochs[k].Band % 64] = true; bands++; }
            ok = bands >= detection.MinBands;
        }
        o.Detected = ok && candleOk;
    }

    static bool IsResolvedRow(SystemObservations o, int r) => o.BlendGroup[r] == o.ImageIndex[r] && !HasBlendRow(o, r);

    // A resolved image's group has no −1 row at the same visit; blended images share the group of a −1 row.
    static bool HasBlendRow(SystemObservations o, int r)
    {
        for (int k = r + 1; k < o.Count && o.Mjd[k] == o.Mjd[r] && o.Band[k] == o.Band[r]; k++)
            if (o.ImageIndex[k] < 0 && o.BlendGroup[k] == o.BlendGroup[r]) return true;
        return false;
    }

    // Peak flux per band of an unlensed SN Ia (mean − n σ peak magnitude) at the lens redshift.
    void CandlePeaks(double zLens, double dLensCm, Span<double> peaks)
    {
        int nb = peaks.Length;
        Span<double> scale = stackalloc double[nb];
        Span<double> noDust = stackalloc double[nb];
        bank.EventScales(Populations.TransientType.Ia, zLens, dLensCm, candleMean - detection.CandleSigmas * candleSigma, noDust, scale);
        for (int b = 0; b < nb; b++)
        {
            double best = 0;
            for (double t = 0.5; t < bank.Models[Populations.TransientType.Ia].MaxPhaseDays; t += 0.5)
                best = Math.Max(best, bank.Q(Populations.TransientType.Ia, b, zLens, t));
            peaks[b] = best * scale[b];
        }
    }
}
