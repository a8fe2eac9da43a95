using Lightfold.Photometry;
using Lightfold.Populations;

namespace Lightfold.Transients;

/// <summary>Observed-frame band light curves of every transient type, tabulated over (z, rest phase) for fast evaluation.</summary>
/// <remarks>
/// For each type and band, Q(z, t) = ∫ L_λ(λ/(1+z), t) T(λ) λ dλ / (c ∫ T/λ dλ) [erg s⁻¹ Hz⁻¹] on a grid of redshift steps
/// of 0.01 and rest-phase steps of 0.1 d for the first 10 d and 0.5 d after; an event at z has f_ν = s Q(z, t_obs/(1+z)) / (4π D_L² (1+z)), with s the factor
/// that puts the model's rest-frame B peak at the event's drawn magnitude. Blackbody models use
/// <see cref="BlackbodyBandTable"/>; templates are integrated directly. K-corrections and time dilation are therefore
/// implicit. Bilinear interpolation; the tests hold it to direct synthetic photometry within 0.5% wherever the flux exceeds 1% of
/// the band's peak.
/// </remarks>
public sealed class LightCurveBank
{
    /// <summary>Rest-phase step of the tables after <see cref="EarlyPhaseDays"/> [days].</summary>
    public const double PhaseStep = 0.5;
    /// <summary>Rest-phase step before <see cref="EarlyPhaseDays"/>, where the early rise changes fastest [days].</summary>
    public const double EarlyPhaseStep = 0.1;
    /// <summary>End of the finely sampled early phase [days].</summary>
    public const double EarlyPhaseDays = 10;
    const int EarlyNodes = (int)(EarlyPhaseDays / EarlyPhaseStep);

    /// <summary>Phase of table node <paramref name="i"/>.</summary>
    static double PhaseOfNode(int i) => i <= EarlyNodes ? i * EarlyPhaseStep : EarlyPhaseDays + (i - EarlyNodes) * PhaseStep;

    /// <summary>Continuous node coordinate of phase t.</summary>
    static double NodeOfPhase(double t) => t <= EarlyPhaseDays ? t / EarlyPhaseStep : EarlyNodes + (t - EarlyPhaseDays) / PhaseStep;
    /// <summary>Redshift step of the tables.</summary>
    public const double RedshiftStep = 0.01;

    /// <summary>B_AB − B_Vega: the drawn peak magnitudes are Vega-based (Richardson et al. 2014); −0.09 mag
    /// (Blanton &amp; Roweis 2007, AJ 133, 734; from memory).</summary>
    public const double BVegaToAb = -0.09;

    readonly Dictionary<TransientType, TypeCurves> curves = [];
    readonly int nz;

    /// <summary>Builds the tables (about a second for six blackbody types and four bands, on all cores).</summary>
    public LightCurveBank(IReadOnlyDictionary<TransientType, ITransientModel> models, IReadOnlyList<Bandpass> bands, double zMax)
    {
        Bands = bands;
        Models = models;
        nz = (int)Math.Ceiling(zMax / RedshiftStep) + 2;
        var uvByType = models.ToDictionary(m => m.Key, m => m.Value is BlackbodyTransient b ? b.Uv : null);
        // Blackbody band tables, one per (band, UV law); all built-in models share the same law by default.
        var bbTables = new Dictionary<(int Band, UvSuppression Uv), BlackbodyBandTable>();
        var needed = uvByType.Values.Where(u => u is not null).Distinct().SelectMany(u => Enumerable.Range(0, bands.Count).Select(b => (b, u!))).ToList();
        var built = new BlackbodyBandTable[needed.Count];
        Parallel.For(0, needed.Count, i => built[i] = new BlackbodyBandTable(bands[needed[i].Item1], needed[i].Item2.Factor, zMax + 0.05));
        for (int i = 0; i < needed.Count; i++) bbTables[needed[i]] = built[i];

        foreach (var (type, model) in models)
        {
            int nt = (int)Math.Ceiling(NodeOfPhase(Math.Max(model.MaxPhaseDays, EarlyPhaseDays))) + 2;
            var tables = new float[bands.Count][];
            Parallel.For(0, bands.Count, b =>
            {
                var q = new float[nz * nt];
                for (int iz = 0; iz < nz; iz++)
                {
                    double z = iz * RedshiftStep;
                    for (int it = 0; it < nt; it++)
                    {
                        double t = PhaseOfNode(it);
                        double v;
                        if (t <= 0 || t > model.MaxPhaseDays) v = 0;
                        else if (model.TryBlackbody(t, out double temp, out double r))
                            v = 4 * Math.PI * Math.PI * r * r * bbTables[(b, uvByType[type]!)].Evaluate(temp, z);
                        else
                            v = DirectQ(model, bands[b], z, t);
                        q[iz * nt + it] = (float)v;
                    }
                }
                tables[b] = q;
            });
            curves[type] = new TypeCurves(tables, nt, PeakRestFrameB(model));
        }
    }

    /// <summary>The survey bands, in table order.</summary>
    public IReadOnlyList<Bandpass> Bands { get; }

    /// <summary>The models.</summary>
    public IReadOnlyDictionary<TransientType, ITransientModel> Models { get; }

    /// <summary>Rest-frame B peak absolute AB magnitude of the unscaled model.</summary>
    public double ModelPeakAbsoluteB(TransientType type) => curves[type].PeakAbsoluteB;

    /// <summary>Q(z, t) computed directly (slow; the reference for the tables).</summary>
    public static double DirectQ(ITransientModel model, Bandpass band, double z, double phaseDays)
        => SyntheticPhotometry.FluxNu(band, l => model.SpectralLuminosity(phaseDays, l / (1 + z)));

    /// <summary>Q from the table (bilinear in z and phase).</summary>
    public double Q(TransientType type, int band, double z, double phaseDays)
    {
        var c = curves[type];
        if (phaseDays <= 0) return 0;
        double ut = NodeOfPhase(phaseDays);
        if (ut >= c.NT - 1) return 0;
        int it = (int)ut;
        double ft = ut - it;
        double uz = z / RedshiftStep;
        int iz = Math.Clamp((int)uz, 0, nz - 2);
        double fz = Math.Clamp(uz - iz, 0, 1);
        var q = c.Tables[band];
        int r0 = iz * c.NT + it, r1 = r0 + c.NT;
        return (1 - fz) * ((1 - ft) * q[r0] + ft * q[r0 + 1]) + fz * ((1 - ft) * q[r1] + ft * q[r1 + 1]);
    }

    static double PeakRestFrameB(ITransientModel model)
    {
        const double tenPcCm = 10 * Units.CmPerParsec;
        // Coarse scan every 0.5 d, then golden-section refinement around the best node (light curves are unimodal there).
        double best = 0, tBest = 0;
        for (double t = 0.5; t <= model.MaxPhaseDays; t += 0.5)
        {
            double q = DirectQ(model, BuiltInBands.RestFrameB, 0, t);
            if (q > best) { best = q; tBest = t; }
        }
        double a = Math.Max(0.01, tBest - 0.5), b = Math.Min(model.MaxPhaseDays, tBest + 0.5);
        const double ratio = 0.6180339887498949;
        for (int i = 0; i < 40; i++)
        {
            double c = b - ratio * (b - a), d = a + ratio * (b - a);
            if (DirectQ(model, BuiltInBands.RestFrameB, 0, c) > DirectQ(model, BuiltInBands.RestFrameB, 0, d)) b = d; else a = c;
        }
        best = Math.Max(best, DirectQ(model, BuiltInBands.RestFrameB, 0, 0.5 * (a + b)));
        if (!(best > 0)) throw new InputException($"transient model ({model.Description}) has no rest-frame B flux: cannot normalise its peak magnitude");
        return SyntheticPhotometry.AbMagnitude(best / (4 * Math.PI * tenPcCm * tenPcCm));
    }

    sealed record TypeCurves(float[][] Tables, int NT, double PeakAbsoluteB);

    /// <summary>The flux scale [nJy per unit Q] of one event: peak-magnitude rescaling, distance, (1+z) and extinction per band.</summary>
    public void EventScales(TransientType type, double z, double luminosityDistanceCm, double peakAbsoluteBVega, ReadOnlySpan<double> extinctionMag, Span<double> scales)
    {
        double s = Math.Pow(10, -0.4 * (peakAbsoluteBVega + BVegaToAb - curves[type].PeakAbsoluteB))
                   / (4 * Math.PI * luminosityDistanceCm * luminosityDistanceCm * (1 + z)) / Units.CgsPerNjy;
        for (int b = 0; b < scales.Length; b++) scales[b] = s * Math.Pow(10, -0.4 * extinctionMag[b]);
    }
}
