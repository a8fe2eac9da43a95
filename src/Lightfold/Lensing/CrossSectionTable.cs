namespace Lightfold.Lensing;

/// <summary>Fast lookup of <see cref="CrossSections"/> over (q, γ, shear angle relative to the lens), built once per process.</summary>
/// <remarks>
/// Grid: q ∈ [0.2, 1] in steps of 0.025, γ ∈ [0, 0.3] in steps of 0.025, Δ = shear PA − lens PA in [0°, 90°]
/// in steps of 7.5° (the areas are even in Δ and have period 180°, so Δ folds into that range). Tricubic
/// Catmull–Rom interpolation; the tests hold it within 0.5% of the direct computation (for the four-image
/// area: within 0.5% of the two-image area where the four-image area itself is tiny). Building takes about
/// three seconds on two cores; the catalog layer keeps a copy on disk (Catalog.CrossSectionTableCache). Immutable.
/// </remarks>
public sealed class CrossSectionTable
{
    /// <summary>Smallest supported axis ratio.</summary>
    public const double MinAxisRatio = 0.2;
    /// <summary>Largest supported external shear.</summary>
    public const double MaxShear = 0.3;

    const double QStep = 0.025, GStep = 0.025, AStep = 7.5;
    const int NQ = 33, NG = 13, NA = 13;

    static readonly Lazy<CrossSectionTable> shared = new(Build, LazyThreadSafetyMode.ExecutionAndPublication);

    readonly float[] two, four, radius;

    /// <summary>A process-wide table computed on first use (no files; the pipeline's disk-cached copy is
    /// <c>Catalog.CrossSectionTableCache.Shared</c>).</summary>
    public static CrossSectionTable Shared => shared.Value;

    CrossSectionTable(float[] two, float[] four, float[] radius)
    {
        this.two = two;
        this.four = four;
        this.radius = radius;
    }

    /// <summary>Computes every grid node (about three seconds on two cores).</summary>
    public static CrossSectionTable Build()
    {
        int n = NQ * NG * NA;
        var table = new CrossSectionTable(new float[n], new float[n], new float[n]);
        Parallel.For(0, n, index =>
        {
            int ia = index % NA, ig = index / NA % NG, iq = index / (NA * NG);
            var cs = CrossSections.Compute(Math.Min(1.0, MinAxisRatio + iq * QStep), ig * GStep, ia * AStep);
            table.two[index] = (float)cs.AtLeastTwo;
            table.four[index] = (float)cs.AtLeastFour;
            table.radius[index] = (float)cs.MaxRadius;
        });
        return table;
    }

    /// <summary>Name that identifies this grid and algorithm version (for caches).</summary>
    public const string VersionName = "cross-sections-v1-q33-g13-a13-c1024-r2048";

    /// <summary>The node values as one array (two, four, radius), for a cache to store.</summary>
    public float[] ToArray() => [.. two, .. four, .. radius];

    /// <summary>A table from values stored by <see cref="ToArray"/>; null if they do not fit this grid or are not finite.</summary>
    public static CrossSectionTable? FromArray(float[] values)
    {
        int n = NQ * NG * NA;
        if (values.Length != 3 * n || !values.All(float.IsFinite)) return null;
        var table = new CrossSectionTable(values[..n], values[n..(2 * n)], values[(2 * n)..]);
        return table.radius.All(r => r > 0) ? table : null;
    }

    static int Index(int iq, int ig, int ia) => (iq * NG + ig) * NA + ia;

    /// <summary>The largest ≥2-image area on the grid [θ_E²] (a bound for rejection sampling).</summary>
    public double MaxAtLeastTwo => two.Max();

    /// <summary>Whether (q, γ) lies inside the table's domain.</summary>
    public static bool Covers(double axisRatio, double shearGamma)
        => axisRatio >= MinAxisRatio && axisRatio <= 1.0 && shearGamma >= 0 && shearGamma <= MaxShear;

    /// <summary>Interpolated cross-sections in units of θ_E²; <see cref="CrossSection.MaxRadius"/> is an upper bound
    /// (the largest grid value around the point, plus 5%), safe for rejection sampling.</summary>
    /// <param name="axisRatio">q in [0.2, 1].</param>
    /// <param name="shearGamma">γ in [0, 0.3].</param>
    /// <param name="relativeShearAngleDeg">Shear PA minus lens PA [deg], any value.</param>
    public CrossSection Lookup(double axisRatio, double shearGamma, double relativeShearAngleDeg)
    {
        if (!Covers(axisRatio, shearGamma))
            throw new ArgumentOutOfRangeException(nameof(axisRatio), $"(q, γ) = ({axisRatio}, {shearGamma}) is outside the table ([{MinAxisRatio}, 1] × [0, {MaxShear}])");
        double delta = Math.Abs(relativeShearAngleDeg % 180.0);
        if (delta > 90.0) delta = 180.0 - delta;

        double uq = (axisRatio - MinAxisRatio) / QStep, ug = shearGamma / GStep, ua = delta / AStep;
        int bq = Math.Min((int)uq, NQ - 2), bg = Math.Min((int)ug, NG - 2), ba = Math.Min((int)ua, NA - 2);
        double tq = uq - bq, tg = ug - bg, ta = ua - ba;
        Span<double> wq = stackalloc double[4], wg = stackalloc double[4], wa = stackalloc double[4];
        CatmullRom(tq, wq);
        CatmullRom(tg, wg);
        CatmullRom(ta, wa);
        double a2 = 0, a4 = 0, rmax = 0;
        for (int i = 0; i < 4; i++)
        for (int j = 0; j < 4; j++)
        for (int l = 0; l < 4; l++)
        {
            double w = wq[i] * wg[j] * wa[l];
            a2 += w * Sample(two, bq - 1 + i, bg - 1 + j, ba - 1 + l);
            a4 += w * Sample(four, bq - 1 + i, bg - 1 + j, ba - 1 + l);
        }
        for (int i = 0; i < 2; i++)
        for (int j = 0; j < 2; j++)
        for (int l = 0; l < 2; l++)
            rmax = Math.Max(rmax, radius[Index(bq + i, bg + j, ba + l)]);
        return new CrossSection(a2, Math.Max(0.0, a4), 1.05 * rmax);
    }

    // Catmull–Rom weights for the four nodes around t ∈ [0, 1).
    static void CatmullRom(double t, Span<double> w)
    {
        double t2 = t * t, t3 = t2 * t;
        w[0] = 0.5 * (-t3 + 2 * t2 - t);
        w[1] = 0.5 * (3 * t3 - 5 * t2 + 2);
        w[2] = 0.5 * (-3 * t3 + 4 * t2 + t);
        w[3] = 0.5 * (t3 - t2);
    }

    // Grid value with ghost nodes: Δ mirrors at both ends (even, period 180°); q and γ extrapolate quadratically.
    static double Sample(float[] data, int iq, int ig, int ia)
    {
        if (ia < 0) ia = -ia;
        if (ia > NA - 1) ia = 2 * (NA - 1) - ia;
        if (iq < 0) return 3 * Sample(data, 0, ig, ia) - 3 * Sample(data, 1, ig, ia) + Sample(data, 2, ig, ia);
        if (iq > NQ - 1) return 3 * Sample(data, NQ - 1, ig, ia) - 3 * Sample(data, NQ - 2, ig, ia) + Sample(data, NQ - 3, ig, ia);
        if (ig < 0) return 3 * Sample(data, iq, 0, ia) - 3 * Sample(data, iq, 1, ia) + Sample(data, iq, 2, ia);
        if (ig > NG - 1) return 3 * Sample(data, iq, NG - 1, ia) - 3 * Sample(data, iq, NG - 2, ia) + Sample(data, iq, NG - 3, ia);
        return data[Index(iq, ig, ia)];
    }
}
