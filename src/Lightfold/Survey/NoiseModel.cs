namespace Lightfold.Survey;

/// <summary>Photometric errors from the single-visit 5σ depth, the source's own Poisson noise and a systematic floor.</summary>
/// <remarks>
/// σ_F² = σ_bg² + s (F/F₅) (F₅/5)² + (ε F)², where F₅ is the flux at the 5σ depth, s the share of the variance at F₅ that
/// comes from the source itself, ε = floor_mag × ln(10)/2.5 the systematic floor, and σ_bg chosen so that a source at the
/// depth has S/N = 5 exactly: σ_bg² = (F₅/5)²(1 − s) − (ε F₅)². Background-limited faint sources thus have σ_F = F₅/5
/// (common practice); the form mirrors the magnitude-space model of Ivezić et al. 2019 (ApJ 873, 111, eq. 5).
/// The default 5 mmag floor follows that paper's repeatability requirement.
/// </remarks>
public sealed record NoiseModel
{
    /// <summary>Fraction of the variance at the 5σ depth due to source photons (0 = pure background).</summary>
    public double SourceFractionAtDepth { get; init => field = Check.InRange(value, 0, 0.9); } = 0.04;

    /// <summary>Systematic floor [mag].</summary>
    public double FloorMag { get; init => field = Check.InRange(value, 0, 0.1); } = 0.005;

    /// <summary>σ_F [nJy] of a source of true flux F [nJy] in a visit of 5σ depth m₅.</summary>
    public double SigmaNjy(double trueFluxNjy, double depth5SigmaMag)
    {
        double f5 = Math.Pow(10, -0.4 * (depth5SigmaMag - Units.AbZeroPointNjy));
        double eps = FloorMag * Math.Log(10) / 2.5;
        double unit = f5 / 5;
        double background = unit * unit * (1 - SourceFractionAtDepth) - eps * eps * f5 * f5;
        double f = Math.Max(trueFluxNjy, 0);
        return Math.Sqrt(Math.Max(background, 0) + SourceFractionAtDepth * (f / f5) * unit * unit + eps * eps * f * f);
    }
}

/// <summary>When a system counts as detected.</summary>
/// <remarks>At least <see cref="MinDetections"/> visits with S/N ≥ <see cref="MinSnr"/>, in at least <see cref="MinBands"/>
/// bands, within some window of <see cref="WindowDays"/> days; any image or unresolved blend counts. Optionally (SNe Ia only)
/// the lensed SN must also appear brighter than any unlensed SN Ia at the lens redshift: its peak unresolved flux in
/// some band exceeds that of a SN Ia <see cref="CandleSigmas"/> standard deviations brighter than the mean peak, at z_lens.
/// Then only SNe Ia can be detected.</remarks>
public sealed record DetectionRule
{
    /// <summary>Signal-to-noise threshold of one detection.</summary>
    public double MinSnr { get; init => field = Check.InRange(value, 0, 1000); } = 5;
    /// <summary>Detections required.</summary>
    public int MinDetections { get; init; } = 2;
    /// <summary>Distinct bands required among them.</summary>
    public int MinBands { get; init; } = 1;
    /// <summary>Window length [days].</summary>
    public double WindowDays { get; init => field = Check.Positive(value); } = 30;
    /// <summary>Require the standard-candle magnification criterion (SNe Ia).</summary>
    public bool RequireBrighterThanCandle { get; init; }
    /// <summary>How far above the mean SN Ia peak the comparison candle lies [σ].</summary>
    public double CandleSigmas { get; init => field = Check.InRange(value, 0, 10); } = 2;
}
